package scripting

import (
	"context"
	"math"
	"strings"
	"testing"
)

// TestEGEFormsAgree builds one plant with an exhaust-gas economiser and
// its dump condenser in the short form and as a full graph, and compares
// the solved fuel, economiser steam and dumped steam: the short form must
// build the same plant (common practice, no source: the same equations
// give the same answer to the solver's tolerance).
func TestEGEFormsAgree(t *testing.T) {
	t.Parallel()
	const engine = `{ mcr = "12 MW", { load = "25 %", gas = "11 kg/kWh", T = "250 C" }, { load = "100 %", gas = "8.1 kg/kWh", T = "245 C" } }`
	short := `
local ship = steam_plant { name = "short",
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "HSFO", efficiency = "84 %", turndown = 4 } },
  exhaust_gas_economiser = { name = "EGE", drum = "7 bar(g)", design_load = "85 %", pinch = "15 K", engine = ` + engine + ` },
  hotwell = { heat_loss = "5 kW" },
  consumers = { { name = "heating", duty = "DUTY", returns = "90 %", return_T = "80 C" } } }
return case(ship, { name = "c", sea = "10 C", air = "5 C", engine = "85 %" })`
	full := `
local ship = plant { name = "full" }
ship:makeup { name = "makeup" }
ship:feed_tank { name = "hotwell", heat_loss = "5 kW" }
ship:feed_pump { name = "feed pump", boilers = { "AB1" }, margin = "3 bar", eta = "45 %" }
ship:header { name = "feed header" }
ship:boiler { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "HSFO", efficiency = "84 %", turndown = 4 }
ship:exhaust_gas_economiser { name = "EGE", drum = "7 bar(g)", design_load = "85 %", pinch = "15 K", engine = ` + engine + ` }
ship:header { name = "main" }
ship:consumer { name = "heating", duty = "DUTY", returns = "90 %", return_T = "80 C" }
ship:condenser { name = "dump condenser", dump = true, subcool = "80 K" }
ship:line("makeup", "makeup", "hotwell")
ship:line("suction", "hotwell", "feed pump")
ship:line("discharge", "feed pump", "feed header")
ship:line("f1", "feed header", "AB1")
ship:line("fe", "feed header", "EGE.feed")
ship:line("s1", "AB1", "main")
ship:line("se", "EGE.steam", "main")
ship:line("h", "main", "heating")
ship:line("r", "heating", "hotwell")
ship:line("d", "main", "dump condenser")
ship:line("dc", "dump condenser", "hotwell")
return case(ship, { name = "c", sea = "10 C", air = "5 C", engine = "85 %" })`
	for _, tc := range []struct {
		duty     string
		wantFuel bool // a boiler fires
		wantDump bool // the economiser's surplus is dumped
	}{
		{"2 MW", true, false},
		{"200 kW", false, true},
	} {
		var got [2][3]float64
		for i, src := range []string{short, full} {
			src = strings.ReplaceAll(src, "DUTY", tc.duty)
			run, err := RunSource(context.Background(), "ege.lua", []byte(src), nil, Options{})
			if err != nil {
				t.Fatalf("%s, form %d: %v", tc.duty, i, err)
			}
			r := run.Cases[0].Result
			got[i] = [3]float64{r.FuelKgS, r.EGESteamKgS, r.DumpedKgS}
		}
		for k, what := range []string{"fuel", "EGE steam", "dumped"} {
			a, b := got[0][k], got[1][k]
			if math.Abs(a-b) > 1e-9*math.Max(1, math.Abs(a)) {
				t.Errorf("%s: %s: short form %g kg/s, full graph %g kg/s; want equal", tc.duty, what, a, b)
			}
		}
		if (got[0][0] > 0) != tc.wantFuel || (got[0][2] > 1e-9) != tc.wantDump || got[0][1] <= 0 {
			t.Errorf("%s: fuel %g, EGE steam %g, dumped %g kg/s; want fuel %v, dump %v, steam > 0", tc.duty, got[0][0], got[0][1], got[0][2], tc.wantFuel, tc.wantDump)
		}
	}
}

// TestEGESavingSwitch: ege_saving = false skips the second solve, so the
// saving reads zero while the case itself is unchanged (the option's
// documented effect, plant.Options.NoEGESaving).
func TestEGESavingSwitch(t *testing.T) {
	t.Parallel()
	src := `
local ship = steam_plant { name = "s", ege_saving = SAVE,
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "HSFO", efficiency = "84 %" } },
  exhaust_gas_economiser = { drum = "7 bar(g)", design_load = "85 %", pinch = "15 K",
    engine = { mcr = "12 MW", { load = "25 %", gas = "11 kg/kWh", T = "250 C" }, { load = "100 %", gas = "8.1 kg/kWh", T = "245 C" } } },
  consumers = { { name = "heating", duty = "2 MW", returns = "90 %" } } }
return case(ship, { name = "c", engine = "85 %" })`
	var fuel, saved [2]float64
	for i, save := range []string{"true", "false"} {
		run, err := RunSource(context.Background(), "s.lua", []byte(strings.ReplaceAll(src, "SAVE", save)), nil, Options{})
		if err != nil {
			t.Fatal(err)
		}
		fuel[i], saved[i] = run.Cases[0].Result.FuelKgS, run.Cases[0].Result.EGEFuelSavedKgS
	}
	if saved[0] <= 0 || saved[1] != 0 || math.Abs(fuel[0]-fuel[1]) > 1e-9*fuel[0] {
		t.Errorf("saved %v kg/s, fuel %v kg/s; want a saving only with ege_saving = true and the same fuel", saved, fuel)
	}
}
