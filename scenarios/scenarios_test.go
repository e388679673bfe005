package scenarios_test

import (
	"bytes"
	"context"
	"flag"
	"fmt"
	"io/fs"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"steamcase/plant"
	"steamcase/plant/combustion"
	"steamcase/plant/fuel"
	"steamcase/plant/profile"
	"steamcase/plant/water"
	"steamcase/scenarios"
	"steamcase/scripting"
)

var update = flag.Bool("update", false, "rewrite the golden files in testdata/")

// scripts are the scenarios a user runs; *_plant.lua are included by them.
func scripts(t *testing.T) []string {
	t.Helper()
	names, err := fs.Glob(scenarios.FS, "*.lua")
	if err != nil {
		t.Fatal(err)
	}
	var out []string
	for _, n := range names {
		if !strings.HasSuffix(n, "_plant.lua") {
			out = append(out, n)
		}
	}
	return out
}

// TestScenarios runs every scenario script as a test: its own check()
// assertions must hold, every case must close its balances (mass 1e-9,
// energy 1e-6 relative, the plant's own limits), and its figures are
// compared with a golden summary (go test ./scenarios -update rewrites
// it; read the diff before committing). The figures are the engine's own:
// the golden file guards against unintended change, not against an
// outside source.
func TestScenarios(t *testing.T) {
	t.Parallel()
	for _, name := range scripts(t) {
		t.Run(name, func(t *testing.T) {
			src, err := fs.ReadFile(scenarios.FS, name)
			if err != nil {
				t.Fatal(err)
			}
			ctx := context.Background()
			run, err := scripting.RunSource(ctx, name, src, scenarios.FS, scripting.Options{Timeout: 2 * time.Minute, Workers: 2})
			if err != nil {
				t.Fatalf("%s: %v", name, err)
			}
			var b bytes.Buffer
			fmt.Fprintf(&b, "%s: %d cases, %d checks passed\n", name, len(run.Cases), run.Checks)
			for _, c := range run.Cases {
				r := c.Result
				if r.Balance.MassRel > 1e-9 || r.Balance.EnergyRel > 1e-6 {
					t.Errorf("case %q at %v: balances %+v", r.Name, c.Pos, r.Balance)
				}
				// An idle turbine reports no steam rate: its flow is
				// solver noise (plant.FlowFloor), and so is the ratio.
				for _, u := range r.Units {
					if m := u.Figures.Of("steam_kg_s"); m <= plant.FlowFloor && u.Figures.Of("steam_rate_kg_per_kWh") != 0 {
						t.Errorf("case %q: %s takes %g kg/s but reports a steam rate of %g kg/kWh", r.Name, u.Name, m, u.Figures.Of("steam_rate_kg_per_kWh"))
					}
				}
				fmt.Fprintf(&b, "case %q: boilers firing %d, fuel %.3f t/d, steam %.1f kg/h, EGE %.1f kg/h, warnings %d\n",
					r.Name, r.BoilersFiring, r.FuelKgS*86.4, r.SteamProductionKgS*3600, r.EGESteamKgS*3600, len(r.Warnings))
			}
			for _, v := range run.Voyages {
				tot := v.Result.Total
				fmt.Fprintf(&b, "voyage %q: %d rows, %.0f h, fuel %.3f t, CO2 %.3f t, hours firing %.0f\n",
					v.Name, tot.Rows, tot.Hours, tot.FuelT, tot.CO2T, tot.HoursFiring)
				for _, ph := range v.Result.Phases {
					fmt.Fprintf(&b, "  phase %q: %.0f h, fuel %.3f t\n", ph.Phase, ph.Hours, ph.FuelT)
				}
			}
			for _, s := range run.Studies {
				r := s.Result
				for _, v := range r.Variants {
					fmt.Fprintf(&b, "study %q, variant %q: fuel %.3f t, saved %.3f t, CO2 avoided %.3f t\n",
						s.Name, v.Name, v.Totals.FuelT, v.FuelSavedT, v.CO2AvoidedT)
					if r.HasNPV {
						fmt.Fprintf(&b, "  cost %.0f, saving %.0f/yr, NPV %.0f, payback %.3f yr; hours below min %.0f, near acid dew %.0f, soot risk %.0f; fouling lost %.1f t\n",
							v.InstalledCost, v.AnnualSaving, v.NPV, v.PaybackYears, v.HoursBelowMinGasT, v.HoursBelowAcidDew, v.HoursSootRisk, v.Totals.EGEFoulingLostT)
					}
				}
				if sw := r.Sweep; sw != nil {
					for k, pt := range sw.Points {
						best := ""
						if k == sw.Best {
							best = " best"
						}
						fmt.Fprintf(&b, "  sweep %s.%s %.6g: UA %.1f W/K, cost %.0f, saved %.3f t, dumped %.1f t, NPV %.0f%s\n",
							sw.Unit, sw.Param, pt.Value, pt.UA, pt.InstalledCost, pt.FuelSavedT, pt.DumpedT, pt.NPV, best)
					}
				}
			}
			for _, a := range run.Audits {
				r := a.Result
				p := r.Period
				fmt.Fprintf(&b, "audit %q: %d days, claimed %.3f t, nominal %.3f t, band %.3f to %.3f t, P(model <= claim) %.4f, flag %q, days flagged %d\n",
					a.Name, p.Days, p.ClaimedT, p.NominalT, p.LowT, p.HighT, p.PAtOrBelow, p.Flag, r.Flagged)
				for _, d := range r.Days {
					fmt.Fprintf(&b, "  %s: claimed %.3f, nominal %.3f", d.Date, d.ClaimedT, d.NominalT)
					if d.Reference {
						b.WriteString(", reference")
					} else {
						fmt.Fprintf(&b, ", band %.3f to %.3f, percentile %.1f", d.LowT, d.HighT, 100*d.Percentile)
						if d.Flag != "" {
							b.WriteString(", flagged " + d.Flag)
						}
					}
					for _, v := range d.Implied {
						if v.Status == profile.ImpliedFound || v.Status == profile.ImpliedStep {
							fmt.Fprintf(&b, ", implied %.4f %s", v.Value, v.Status)
						} else {
							fmt.Fprintf(&b, ", implied: %s", v.Status)
						}
					}
					b.WriteString("\n")
				}
				if c := r.Calibration; c != nil {
					fmt.Fprintf(&b, "  calibrated %s: %.4f (%.4f to %.4f)\n", c.Name, c.Value, c.Low, c.High)
				}
				for _, c := range r.Causes {
					fmt.Fprintf(&b, "  cause %q: %.3f t\n", c.Name, c.FuelT)
				}
				for _, g := range r.FuelByGrade {
					fmt.Fprintf(&b, "  grade %s: %.3f t, CO2 %.3f t\n", g.Grade, g.FuelT, g.CO2T)
				}
			}
			for _, h := range run.HeatingPlans {
				r := h.Result
				fmt.Fprintf(&b, "heating plan %q (%s): plan %.3f t (curves %.3f t), hold %.3f t, last moment %.3f t, CO2 %.3f t\n",
					h.Name, r.Method, r.Plan.FuelT, r.Plan.TableFuelT, r.Hold.FuelT, r.LastMoment.FuelT, r.Plan.CO2T)
				for _, t := range r.Tanks {
					for _, q := range t.Required {
						fmt.Fprintf(&b, "  %s: %.2f K at %s (required %.2f K, met %v), latest start %.0f h\n",
							t.Unit, q.Reached, q.Label, q.T, q.Met, q.LatestStartH)
					}
				}
				fmt.Fprintf(&b, "  binding rows: %d, short rows %v\n", len(r.Binding), r.Plan.ShortRows)
			}
			golden := filepath.Join("testdata", strings.TrimSuffix(name, ".lua")+".golden")
			if *update {
				if err := os.WriteFile(golden, b.Bytes(), 0o644); err != nil {
					t.Fatal(err)
				}
				return
			}
			want, err := os.ReadFile(golden)
			if err != nil {
				t.Fatalf("%v (run go test ./scenarios -update to create it)", err)
			}
			if got := b.String(); got != string(want) {
				t.Errorf("%s differs from %s:\n--- got\n%s\n--- want\n%s", name, golden, got, want)
			}
		})
	}
}

// TestHandCheckTankerPort checks one demo case by hand: the fuel of the
// tanker's port stay from its boiler's steam, blowdown and feed, the steam
// and feed enthalpies from IAPWS-IF97 (package water, itself checked
// against the IF97 verification tables), the efficiency interpolated by
// hand in the script's maker's table, and the net specific energy of the
// HSFO grade, 40 487 kJ/kg (ISO 8217 annex formula at ρ 985 kg/m³, 2.5 % S:
// docs/reference/plant-checks.md §1.1 row 3 [C]):
//
//	ṁ_fuel = [ṁ_s·(h_s − h_fw) + ṁ_bd·(h_f,drum − h_fw)] / (η·LHV)
//
// (docs/reference/plant-checks.md §3.6 [C]).
func TestHandCheckTankerPort(t *testing.T) {
	t.Parallel()
	src, err := fs.ReadFile(scenarios.FS, "tanker.lua")
	if err != nil {
		t.Fatal(err)
	}
	run, err := scripting.RunSource(context.Background(), "tanker.lua", src, scenarios.FS, scripting.Options{Timeout: time.Minute})
	if err != nil {
		t.Fatal(err)
	}
	r := run.Cases[0].Result
	b := r.Boilers[0]
	if !b.Firing || b.Name != "AB1" {
		t.Fatalf("port stay: boiler %q firing %v", b.Name, b.Firing)
	}
	drum := 16e5 + 101325 // 16 bar(g), the script's drum pressure
	steam, err := water.PX(drum, 0.99)
	if err != nil {
		t.Fatal(err)
	}
	sat, err := water.SatLiquid(drum)
	if err != nil {
		t.Fatal(err)
	}
	var hfw float64
	for _, l := range r.Lines {
		if l.Name == "feed AB1" {
			hfw = l.H
		}
	}
	if hfw == 0 {
		t.Fatal("no line \"feed AB1\" in the result")
	}
	// The maker's flue-gas table of the script: 260 C and 6.5 % O2 at
	// 25 % load, 295 C and 4.5 % at 50 %, interpolated by hand, and the
	// heat-loss method of plant/combustion at that point with the case's
	// 5 C air and 1 % radiation at MCR (that package's own checks are
	// against docs/reference/plant-checks.md §2-§3).
	if b.LoadFraction < 0.25 || b.LoadFraction > 0.5 {
		t.Fatalf("load %.3f outside the table segment the hand check uses", b.LoadFraction)
	}
	f := (b.LoadFraction - 0.25) / 0.25
	flueT, o2 := 273.15+260+f*35, 0.065-f*0.02
	hsfo, err := fuel.Grade("HSFO")
	if err != nil {
		t.Fatal(err)
	}
	prod, err := combustion.Fire(hsfo, combustion.Conditions{O2Dry: o2, AirT: 278.15})
	if err != nil {
		t.Fatal(err)
	}
	loss, err := combustion.Efficiency(prod, flueT, combustion.TRef, combustion.LossOptions{
		Radiation: combustion.Radiation{PercentAtMCR: 1, LoadFraction: b.LoadFraction}})
	if err != nil {
		t.Fatal(err)
	}
	eta := loss.LHV.Efficiency / 100
	if math.Abs(eta-b.Efficiency) > 1e-12 {
		t.Errorf("efficiency by hand %.6f, engine %.6f", eta, b.Efficiency)
	}
	// J/kg, by hand: (46.704 − 8.802e-6·985² + 3.167e-3·985)·0.975 +
	// 0.0942·2.5 = 41.28357455·0.975 + 0.2355 MJ/kg (docs/reference/plant-checks.md §1.1
	// row 3 [C]: 40.487).
	const lhv = 40.48698518625e6
	fuel := (b.SteamKgS*(steam.H-hfw) + b.BlowdownKgS*(sat.H-hfw)) / (eta * lhv)
	if d := math.Abs(fuel-b.FuelKgS) / fuel; d > 1e-9 {
		t.Errorf("fuel by hand %.6f kg/s, engine %.6f kg/s (%.1e relative)", fuel, b.FuelKgS, d)
	}
	// Blowdown is 1 % of the feed (the script's figure).
	if d := math.Abs(b.BlowdownKgS/(b.SteamKgS+b.BlowdownKgS) - 0.01); d > 1e-12 {
		t.Errorf("blowdown fraction off by %g", d)
	}
}

// TestTankerDischargeTrip: the N-1 line of the demo tanker's discharge
// ("if AB2 trips") is the case forced with AB1 alone, solved here on a
// plant of its own built from tanker_plant.lua (the same equations, so to
// the solver's tolerance; no outside source).
func TestTankerDischargeTrip(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	src, err := fs.ReadFile(scenarios.FS, "tanker.lua")
	if err != nil {
		t.Fatal(err)
	}
	run, err := scripting.RunSource(ctx, "tanker.lua", src, scenarios.FS, scripting.Options{Timeout: time.Minute})
	if err != nil {
		t.Fatal(err)
	}
	d := run.Cases[1].Result
	if d.Name != "discharge, three cargo pumps" || len(d.Contingencies) == 0 {
		t.Fatalf("case %q, contingencies %d", d.Name, len(d.Contingencies))
	}
	trip := d.Contingencies[0]
	if trip.Name != "AB2 trips" || !trip.Solved || trip.CanCarry {
		t.Fatalf("trip %+v", trip)
	}

	p := tankerPlant(t)
	forced := plant.Case{Name: "AB1 alone", Conditions: d.Conditions, Fire: []string{"AB1"}}
	for _, u := range []string{"COP1", "COP2", "COP3"} {
		forced.Set = append(forced.Set, plant.Setting{Unit: u, Param: "off", Value: 0})
	}
	f, err := p.Solve(ctx, forced)
	if err != nil {
		t.Fatal(err)
	}
	near := func(what string, got, want, tol float64) {
		t.Helper()
		if math.Abs(got-want) > tol*math.Max(math.Abs(want), 1e-3) {
			t.Errorf("%s: N-1 line %.9g, forced case %.9g", what, got, want)
		}
	}
	near("shortfall", trip.ShortfallKgS, f.ShortfallKgS, 1e-7)
	near("AB1 steam", trip.Boilers[0].SteamKgS, f.Boilers[0].SteamKgS, 1e-9)
	var shed []plant.ConsumerResult
	for _, c := range f.Consumers {
		if c.ShedW > 0 {
			shed = append(shed, c)
		}
	}
	if len(shed) != len(trip.Shed) {
		t.Fatalf("shed %d consumers in the line, %d in the forced case", len(trip.Shed), len(shed))
	}
	for _, c := range shed {
		found := false
		for _, s := range trip.Shed {
			if s.Name != c.Name {
				continue
			}
			found = true
			near(c.Name+" shed", s.ShedW, c.ShedW, 1e-7)
			if (s.Cooling == nil) != (c.Cooling == nil) {
				t.Errorf("%s: cooling %v against %v", c.Name, s.Cooling, c.Cooling)
			} else if c.Cooling != nil {
				near(c.Name+" hours to min_T", s.Cooling.SecondsToMinT, c.Cooling.SecondsToMinT, 1e-7)
			}
		}
		if !found {
			t.Errorf("%s is shed in the forced case, not in the line", c.Name)
		}
	}
}

// tankerPlant builds the demo tanker's plant from its script.
func tankerPlant(t *testing.T) *plant.Plant {
	t.Helper()
	src, err := fs.ReadFile(scenarios.FS, "tanker_plant.lua")
	if err != nil {
		t.Fatal(err)
	}
	run, err := scripting.RunSource(context.Background(), "tanker_plant.lua", src, scenarios.FS, scripting.Options{Timeout: time.Minute})
	if err != nil {
		t.Fatal(err)
	}
	return run.Plants[0]
}

// TestScenariosCheckMode runs every scenario in check mode, where nothing
// is solved and the jobs return their shape with zero figures: a script's
// own arithmetic on those tables must still run (common practice, no
// source: check mode is how a user tries a script before solving it).
func TestScenariosCheckMode(t *testing.T) {
	t.Parallel()
	for _, name := range scripts(t) {
		t.Run(name, func(t *testing.T) {
			t.Parallel()
			src, err := fs.ReadFile(scenarios.FS, name)
			if err != nil {
				t.Fatal(err)
			}
			if _, err := scripting.RunSource(context.Background(), name, src, scenarios.FS, scripting.Options{CheckOnly: true, Timeout: time.Minute}); err != nil {
				t.Errorf("%s in check mode: %v", name, err)
			}
		})
	}
}
