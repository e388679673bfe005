package scripting

import (
	"math"
	"strconv"
	"testing"

	"steamcase/plant/water"
)

// TestTurbineFormsInScripts: a cargo pump given by its steam rate at a
// rated power, exhausting into a condenser whose vacuum follows the sea
// (approach), through the short form: the exhaust pressure is the
// saturation pressure at sea + approach (IAPWS-IF97, plant/water: 12 °C +
// 15 K = 300.15 K) and the steam is rate × shaft power (by hand).
func TestTurbineFormsInScripts(t *testing.T) {
	t.Parallel()
	src := `
local ship = steam_plant { name = "turbine forms",
  boilers = { { name = "AB1", mcr = "20 t/h", drum = "16 bar(g)", fuel = "HSFO", efficiency = "85 %" } },
  turbines = { { name = "COP1", kind = "cargo_pump", flow = "2000 m3/h", head = "140 m", density = "800 kg/m3",
    efficiency = "78 %", steam_rate = "9.2 kg/kWh", rated_power = "1.3 MW", eta_mech = "95 %",
    condenser = { approach = "15 K", subcool = "2 K" } } } }
local r = case(ship, { name = "discharge", sea = "12 C", air = "5 C" })
for _, u in ipairs(r.units) do
  if u.name == "COP1" then
    for _, f in ipairs(u.figures) do
      if f.key == "exhaust_p_Pa" or f.key == "shaft_W" or f.key == "steam_kg_s" then print(f.key, string.format("%.17g", f.value)) end
    end
  end
end`
	out := printed(t, src)
	got := map[string]float64{}
	for _, line := range out {
		var key string
		var v float64
		for i := range line {
			if line[i] == '\t' {
				key = line[:i]
				v, _ = strconv.ParseFloat(line[i+1:], 64)
				break
			}
		}
		got[key] = v
	}
	if len(got) != 3 {
		t.Fatalf("printed %q", out)
	}
	ps, err := water.Psat(300.15)
	if err != nil {
		t.Fatal(err)
	}
	// The report rounds to six significant digits.
	if d := math.Abs(got["exhaust_p_Pa"]/ps - 1); d > 1e-6 {
		t.Errorf("exhaust %.6g Pa, want %.6g (saturation at 300.15 K)", got["exhaust_p_Pa"], ps)
	}
	if want := 9.2 / 3.6e6 * got["shaft_W"]; math.Abs(got["steam_kg_s"]/want-1) > 2e-6 {
		t.Errorf("steam %.6g kg/s, want 9.2 kg/kWh × %.6g W = %.6g", got["steam_kg_s"], got["shaft_W"], want)
	}
}
