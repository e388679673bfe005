package scripting

import (
	"math"
	"strconv"
	"testing"

	"steamcase/plant/fuel"
)

// TestBDNOnABoiler declares a boiler's fuel by its bunker delivery note on
// top of a grade and checks what the case reports: the LHV of the note's
// figures, the CO2 by the IMO factor of the declared grade and by the
// carbon of the analysis the note implies, each labelled.
func TestBDNOnABoiler(t *testing.T) {
	t.Parallel()
	src := `
local ship = steam_plant { name = "BDN check",
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %",
    bdn = { grade = "RMG 380", density = "955 kg/m3", sulphur = "0.48 %", water = "0.2 %", ash = "0.03 %", viscosity = "320 cSt" } } },
  consumers = { { name = "heating", duty = "1.5 MW" } } }
local r = case(ship, { name = "c", sea = "10 C", air = "5 C" })
local b = r.boilers[1]
for _, x in ipairs { b.fuel_lhv_J_per_kg, b.fuel_kg_h, b.co2_kg_h, b.co2_analysis_kg_h } do print(string.format("%.17g", x)) end
print(b.co2_basis)
print(b.fuel)
print(string.format("%.17g", r.co2_t_per_day))
print(string.format("%.17g", r.co2_analysis_t_per_day))`
	v := printed(t, src)
	if len(v) != 8 {
		t.Fatalf("printed %q, want 8 values", v)
	}
	num := func(i int) float64 {
		f, err := strconv.ParseFloat(v[i], 64)
		if err != nil {
			t.Fatalf("value %d: %v", i+1, err)
		}
		return f
	}
	// ISO 8217 annex net specific energy by hand (docs/reference/plant-checks.md
	// §1.1 [S✓]): ρ 955, water 0.2 % V/V = 0.2·999.10/955 = 0.20924 % m/m,
	// ash 0.03 %, sulphur 0.48 %: 41.4410 MJ/kg (the report rounds to six
	// significant digits).
	if lhv := num(0); math.Abs(lhv-41.44100547561962e6) > 1e-6*41.441e6 {
		t.Errorf("LHV %.1f J/kg, want 41441005.5 by the ISO 8217 annex formula", lhv)
	}
	fuelKgH, co2, co2a := num(1), num(2), num(3)
	// The IMO factor of the declared grade RMG 380 (HFO, C_F 3.114,
	// docs/reference/plant-checks.md §1.3 [S]); the report rounds to six
	// digits.
	if math.Abs(co2/fuelKgH-3.114) > 1e-5 {
		t.Errorf("CO2 %g kg/h for %g kg/h of fuel: factor %g, want 3.114 (IMO HFO)", co2, fuelKgH, co2/fuelKgH)
	}
	// The analysis CO2 is the carbon plant/fuel derives from the same note
	// (fuel.FromBDN, whose own tests check it), times the fuel burnt.
	g, err := fuel.Grade("VLSFO")
	if err != nil {
		t.Fatal(err)
	}
	f, err := fuel.FromBDN(g, fuel.BDN{Grade: "RMG 380", Density15: 955, Sulfur: 0.0048, Water: 0.002, Ash: 0.0003, Viscosity: 320e-6})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(co2a/fuelKgH-f.CO2.Analysis) > 1e-5 {
		t.Errorf("analysis CO2 factor %g, want %g from the note's analysis", co2a/fuelKgH, f.CO2.Analysis)
	}
	if basis := v[4]; basis != "IMO MEPC.364(79) para 2.1, HFO (ISO 8217 RME-RMK)" {
		t.Errorf("co2_basis %q, want the IMO table's HFO row", basis)
	}
	if name := v[5]; name != "VLSFO (BDN)" {
		t.Errorf("fuel %q, want \"VLSFO (BDN)\"", name)
	}
	if d := num(7) - num(6); !(d > 0) {
		t.Errorf("analysis CO2 %g t/day against IMO %g: the note's carbon (%.4f) gives more than the IMO table's 0.8493", num(7), num(6), f.Fuel.Analysis.C)
	}
}
