package scripting

import (
	"bytes"
	"context"
	"encoding/json"
	"errors"
	"math"
	"sort"
	"strconv"
	"strings"
	"testing"

	"github.com/rs/zerolog"

	"steamcase/plant/combustion"
	"steamcase/plant/fuel"
)

// printed runs src and returns what it printed, one message per print.
func printed(t *testing.T, src string) []string {
	t.Helper()
	var log bytes.Buffer
	if _, err := RunSource(context.Background(), "fg.lua", []byte(src), nil, Options{Logger: zerolog.New(&log)}); err != nil {
		t.Fatal(err)
	}
	var out []string
	dec := json.NewDecoder(&log)
	for {
		var rec struct{ Message string }
		if err := dec.Decode(&rec); err != nil {
			return out
		}
		out = append(out, rec.Message)
	}
}

// The worked case of docs/reference/plant-checks.md §3.3: the test fuel (docs/reference/plant-checks.md §1.2) with the
// LHV of docs/reference/plant-checks.md §3.3, 3 % dry O2, flue gas 250 °C, air 35 °C.
const fgWorked = `fuel_analysis = { C = "86 %", H = "11 %", S = "2.5 %", N = "0.3 %", O = "0.2 %" },
  lhv = "40.487 MJ/kg", O2 = "3 %", T = "250 C", air_T = "35 C"`

func TestFlueGas(t *testing.T) {
	t.Parallel()
	src := `
local r = flue_gas { ` + fgWorked + ` }
local q = flue_gas { ` + fgWorked + `, radiation = "0.7 %", solids = "0.1 %" }
local c = flue_gas { ` + fgWorked + `, CO = "50 ppm" }
local c2 = flue_gas { ` + fgWorked + `, CO = "0.005 %" }
for _, v in ipairs { r.lambda, r.stoich_air_kg_per_kg, r.co2_dry_pct, r.siegert_loss_pct, q.efficiency_lhv_pct,
                     r.acid_dew_point_K, #r.warnings, #q.warnings, c.losses.co_pct, c2.losses.co_pct } do
  print(string.format("%.17g", v))
end
print(r.warnings[1])
print(r.caution)`
	out := printed(t, src)
	if len(out) != 12 {
		t.Fatalf("printed %q", out)
	}
	v := make([]float64, 10)
	for i := range v {
		f, err := strconv.ParseFloat(out[i], 64)
		if err != nil {
			t.Fatalf("value %d: %q", i, out[i])
		}
		v[i] = f
	}
	near := func(what string, got, want, tol float64) {
		t.Helper()
		if !(math.Abs(got-want) <= tol) {
			t.Errorf("%s = %.6g, want %.6g ± %g", what, got, want, tol)
		}
	}
	near("lambda (docs/reference/plant-checks.md §2.1 [C], §11 item 4)", v[0], 1.1576, 0.0005)
	near("stoich_air_kg_per_kg (docs/reference/plant-checks.md §2.1 [C], §11 item 2)", v[1], 13.770, 0.005)
	near("co2_dry_pct (docs/reference/plant-checks.md §3.2 [C])", v[2], 13.68, 0.005)
	near("siegert_loss_pct (docs/reference/plant-checks.md §3.2 [S], §11 item 5)", v[3], 9.627, 0.0005)
	near("efficiency_lhv_pct with radiation 0.7, unburnt 0.1 (docs/reference/plant-checks.md §3.3 [C])", v[4], 89.6, 0.05)
	// docs/reference/plant-checks.md §4's test-fuel row is at λ 1.15; here λ 1.1576: ±0.5 K.
	near("acid_dew_point_K in °C (docs/reference/plant-checks.md §4 [C], λ 1.15 row)", v[5]-273.15, 151.3, 0.5)
	near("warnings without a radiation loss (one: it is taken as zero)", v[6], 1, 0)
	near("warnings with the losses given", v[7], 0, 0)
	// CO in ppm and in percent read the same; a = 48 for oil (docs/reference/plant-checks.md §3.1 [S✓]).
	near("co_pct ppm vs %", v[8], v[9], 1e-12)
	near("co_pct (docs/reference/plant-checks.md §3.1 [S✓])", v[8], 48*0.005/(0.005+v[2]), 1e-9)
	if !strings.Contains(out[10], "no radiation and convection loss given (radiation)") {
		t.Errorf("warning %q does not name the script's key", out[10])
	}
	if !strings.Contains(out[11], "planning and audit estimate") {
		t.Errorf("caution %q", out[11])
	}
}

// TestFlueGasKeys checks that flue_gas returns the keys of the JSON of
// the same check, which is what sim fluegas --json prints.
func TestFlueGasKeys(t *testing.T) {
	t.Parallel()
	src := `
local r = flue_gas { fuel = "HSFO", O2 = "3 %", T = "250 C", air_T = "35 C", radiation = "1 %", humidity = "60 %" }
local function walk(prefix, tbl)
  for k, v in pairs(tbl) do
    if type(k) == "string" then
      print(prefix .. k)
      if type(v) == "table" and k ~= "warnings" then walk(prefix .. k .. ".", v) end
    end
  end
end
walk("", r)`
	got := printed(t, src)
	sort.Strings(got)

	f, _ := fuel.Grade("HSFO")
	c, err := combustion.CheckFlueGas(combustion.FlueGasReading{Fuel: f, Gas: combustion.MeasuredO2, Dry: 0.03,
		FlueT: 523.15, AirT: 308.15, RadiationAtMCR: 0.01, RelativeHumidity: 0.6}, nil)
	if err != nil {
		t.Fatal(err)
	}
	b, _ := json.Marshal(c.JSON())
	var m map[string]any
	if err := json.Unmarshal(b, &m); err != nil {
		t.Fatal(err)
	}
	var want []string
	for k, v := range m {
		want = append(want, k)
		if sub, ok := v.(map[string]any); ok {
			for k2 := range sub {
				want = append(want, k+"."+k2)
			}
		}
	}
	sort.Strings(want)
	if strings.Join(got, "\n") != strings.Join(want, "\n") {
		t.Errorf("flue_gas keys:\n%s\nwant the JSON's:\n%s", strings.Join(got, " "), strings.Join(want, " "))
	}
}

// TestFlueGasForms checks that the forms of a key read alike: a humidity
// as relative or as a ratio, a fraction with % or bare, a fuel by grade or
// by its analysis on top of the grade.
func TestFlueGasForms(t *testing.T) {
	t.Parallel()
	src := `
local base = { fuel = "HSFO", O2 = "3 %", T = "250 C", air_T = "35 C", radiation = "1 %" }
local function with(extra)
  local t = {}
  for k, v in pairs(base) do t[k] = v end
  for k, v in pairs(extra) do t[k] = v end
  return flue_gas(t)
end
local rh = with { humidity = "60 %" }
local ratio = with { humidity = string.format("%.17g kg/kg", rh.humidity_kg_per_kg_dry_air) }
local gkg = with { humidity = string.format("%.17g g/kg", 1000 * rh.humidity_kg_per_kg_dry_air) }
local bare = with { O2 = 0.03, radiation = 0.01 }
local an = with { fuel_analysis = { C = "86 %", H = "11 %", S = "2.5 %", N = "0.3 %", O = "0.2 %" } }
for _, v in ipairs { rh.efficiency_lhv_pct, ratio.efficiency_lhv_pct, gkg.efficiency_lhv_pct,
                     with({}).efficiency_lhv_pct, bare.efficiency_lhv_pct, an.stoich_air_kg_per_kg, an.lhv_J_per_kg } do
  print(string.format("%.17g", v))
end
print(an.fuel)`
	out := printed(t, src)
	v := make([]float64, 7)
	for i := range v {
		v[i], _ = strconv.ParseFloat(out[i], 64)
	}
	if math.Abs(v[0]-v[1]) > 1e-9 || math.Abs(v[0]-v[2]) > 1e-9 {
		t.Errorf("η with RH %g, its ratio in kg/kg %g, in g/kg %g; want the same", v[0], v[1], v[2])
	}
	if v[3] != v[4] {
		t.Errorf("η with %% %g, with bare fractions %g; want the same", v[3], v[4])
	}
	// The test fuel's analysis on HSFO: 13.770 kg/kg (docs/reference/plant-checks.md
	// §2.1 [C]), with the analysis's own net specific energy
	// (Channiwala–Parikh, as plant/fuel computes and tests it).
	g, _ := fuel.Grade("HSFO")
	e, err := combustion.FuelWithAnalysis(g, fuel.Analysis{C: 0.86, H: 0.11, S: 0.025, N: 0.003, O: 0.002}).Energy()
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(v[5]-13.770) > 0.005 || math.Abs(v[6]-e.Net) > 1e-9*e.Net {
		t.Errorf("analysis on a grade: stoichiometric air %g, LHV %g (want %g)", v[5], v[6], e.Net)
	}
	if out[7] != "HSFO with the given analysis" {
		t.Errorf("fuel %q", out[7])
	}
}

// TestFlueGasErrors checks that a bad call stops the run at its line,
// naming the key.
func TestFlueGasErrors(t *testing.T) {
	t.Parallel()
	good := `fuel = "HSFO", O2 = "3 %", T = "250 C", air_T = "35 C"`
	cases := []struct {
		name, call string
		want       []string
	}{
		{"unknown key", `fuel = "HSFO", O2 = "3 %", T = "250 C", air_t = "35 C"`,
			[]string{"fg.lua:3: flue_gas: unknown key 'air_t'; did you mean 'air_T'?"}},
		{"bad unit", `fuel = "HSFO", O2 = "3 %", T = "250 bar", air_T = "35 C"`,
			[]string{"fg.lua:3: flue_gas: T: temperature expected", "(a pressure)"}},
		{"no unit", `fuel = "HSFO", O2 = "3 %", T = 250, air_T = "35 C"`,
			[]string{"fg.lua:3: flue_gas: T needs a unit, such as '170 C'; got 250"}},
		{"missing fuel", `O2 = "3 %", T = "250 C", air_T = "35 C"`,
			[]string{`fg.lua:3: flue_gas: fuel is required: fuel = "HSFO" (grades: MGO, VLSFO, HSFO, LNG)`}},
		{"unknown grade", `fuel = "HFO", O2 = "3 %", T = "250 C", air_T = "35 C"`,
			[]string{`fg.lua:3: flue_gas: fuel "HFO" is not a built-in grade`}},
		{"missing T", `fuel = "HSFO", O2 = "3 %", air_T = "35 C"`,
			[]string{`fg.lua:3: flue_gas: T is required, such as T = "170 C"`}},
		{"missing reading", `fuel = "HSFO", T = "250 C", air_T = "35 C"`,
			[]string{`fg.lua:3: flue_gas: O2 (or CO2) is required`}},
		{"both readings", good + `, CO2 = "13 %"`,
			[]string{`fg.lua:3: flue_gas: give O2 or CO2, the one the analyser measured, not both`}},
		{"O2 of air", `fuel = "HSFO", O2 = "20.9 %", T = "250 C", air_T = "35 C"`,
			[]string{`fg.lua:3: flue_gas: O2 = "20.9 %": no combustion: an O2 at or near that of air (20.946 % dry`}},
		{"in the user's units", `fuel = "HSFO", O2 = "3 %", T = "2000 F", air_T = "35 C"`,
			[]string{`fg.lua:3: flue_gas: T = "2000 F": the flue-gas temperature must be at most 1832 °F for the heat-loss account; got 2000 °F`}},
		{"bare fraction", `fuel = "HSFO", O2 = 0.25, T = "250 C", air_T = "35 C"`,
			[]string{`fg.lua:3: flue_gas: O2 = 0.25: no combustion: an O2 at or near that of air (0.20946 dry, which analysers show as 0.209)`}},
		{"humidity", good + `, humidity = 0.6`,
			[]string{`fg.lua:3: flue_gas: humidity must be a relative humidity such as "60 %" or a humidity ratio`}},
		{"CO", good + `, CO = "50"`,
			[]string{`fg.lua:3: flue_gas: CO = "50": want ppm or a percentage of the dry flue gas`}},
		{"analysis key", `fuel_analysis = { C = "86 %", H = "11 %", Q = "3 %" }, O2 = "3 %", T = "250 C", air_T = "35 C"`,
			[]string{`fg.lua:3: flue_gas fuel_analysis: unknown key 'Q'`}},
		{"analysis sum", `fuel_analysis = { C = "86 %", H = "11 %" }, O2 = "3 %", T = "250 C", air_T = "35 C"`,
			[]string{`fg.lua:3: flue_gas: fuel_analysis = {...}: the values add up to 97 %; they must add up to 100 % within 0.5 %`}},
		{"load without radiation", good + `, load = "50 %"`,
			[]string{`fg.lua:3: flue_gas: load = "50 %": the load scales the radiation and convection loss: give radiation with it`}},
		{"load zero", good + `, radiation = "1 %", load = "0 %"`,
			[]string{`fg.lua:3: flue_gas: load = "0 %": the load must lie between 5 % and 120 % of MCR`}},
		{"SO3 zero", good + `, SO3_conversion = "0 %"`,
			[]string{`fg.lua:3: flue_gas: SO3_conversion = "0 %": the SO2 to SO3 conversion must be above 0 %`}},
		{"dew margin", good + `, dew_margin = "200 K"`,
			[]string{`fg.lua:3: flue_gas: dew_margin = "200 K": the margin to the acid dew point must be above 0 K and at most 100 K`}},
		{"not a table", ``, []string{"fg.lua:3: flue_gas takes a table"}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			call := "flue_gas { " + c.call + " }"
			if c.call == "" {
				call = `flue_gas "HSFO"`
			}
			src := "-- a bad call\nlocal x = 1\nlocal r = " + call + "\nprint('not reached')\n"
			_, err := RunSource(context.Background(), "fg.lua", []byte(src), nil, Options{})
			if err == nil {
				t.Fatal("no error")
			}
			for _, w := range c.want {
				if !strings.Contains(err.Error(), w) {
					t.Errorf("error lacks %q:\n%v", w, err)
				}
			}
		})
	}
}

// TestFlueGasCheckOnly: in check mode flue_gas still checks its keys.
func TestFlueGasCheckOnly(t *testing.T) {
	t.Parallel()
	_, err := RunSource(context.Background(), "fg.lua", []byte(`local r = flue_gas { fuel = "HSFO", O2 = "3 %", T = "250 C", air_t = "35 C" }`), nil, Options{CheckOnly: true})
	if err == nil || !strings.Contains(err.Error(), "unknown key 'air_t'") {
		t.Errorf("check mode: %v", err)
	}
}

// FuzzFlueGas: no value of flue_gas's keys makes the run panic or print a
// non-finite number; an error is a list of script errors at the call's
// line.
func FuzzFlueGas(f *testing.F) {
	f.Add("HSFO", "3 %", "250 C", "35 C", "60 %", "50 ppm", "1 %")
	f.Add("LNG", "0 %", "1000 C", "-20 C", "0.2 kg/kg", "0.005 %", "10 %")
	f.Add("MGO", "20.9 %", "2000 F", "300 K", "12 g/kg", "-5 ppm", "0 %")
	f.Add("hsfo", "1e-300", "NaN C", "Inf C", "e kg/kg", "ppm", "%")
	f.Fuzz(func(t *testing.T, grade, o2, gas, air, hum, co, rad string) {
		q := strconv.Quote
		src := "local r = flue_gas { fuel = " + q(grade) + ", O2 = " + q(o2) + ", T = " + q(gas) + ", air_T = " + q(air) +
			", humidity = " + q(hum) + ", CO = " + q(co) + ", radiation = " + q(rad) + " }\n" +
			"for k, v in pairs(r) do if type(v) == 'number' and (v ~= v or v == math.huge or v == -math.huge) then error('non-finite ' .. k) end end\n"
		_, err := RunSource(context.Background(), "fuzz.lua", []byte(src), nil, Options{})
		if err == nil {
			return
		}
		var list ErrorList
		if !errors.As(err, &list) || len(list) == 0 {
			t.Fatalf("%s: error %T %v", src, err, err)
		}
		for _, e := range list {
			if e.Pos.Line != 1 || strings.Contains(e.Msg, "internal error") || strings.Contains(e.Msg, "non-finite") {
				t.Fatalf("%s: %v", src, err)
			}
		}
	})
}
