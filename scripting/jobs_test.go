package scripting

import (
	"bytes"
	"context"
	"encoding/json"
	"math"
	"path/filepath"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/rs/zerolog"

	"steamcase/plant/profile"
)

// The figures compared below are the run's own results against each other
// (a total against the sum of its parts, a saving against the difference
// of two runs): identities of the bookkeeping, common practice, no source.

func runJob(t *testing.T, file string, opt Options) *Run {
	t.Helper()
	if opt.Timeout == 0 {
		opt.Timeout = time.Minute
	}
	run, err := RunFile(context.Background(), filepath.Join("testdata", "good", file), opt)
	if err != nil {
		t.Fatalf("%s: %v", file, err)
	}
	return run
}

func TestVoyageTotals(t *testing.T) {
	t.Parallel()
	run := runJob(t, "voyage.lua", Options{})
	if len(run.Voyages) != 2 || len(run.Cases) != 5 {
		t.Fatalf("got %d voyages and %d cases; want 2 and 5", len(run.Voyages), len(run.Cases))
	}
	tables, csv := run.Voyages[0], run.Voyages[1]
	// The voyage's total is the sum of its rows' cases, each solved again
	// here on its own with case(): fuel in t = kg/s × 3.6 × h.
	var fuel, co2 float64
	for i, c := range run.Cases {
		h := tables.Result.Rows[i].Hours
		fuel += c.Result.FuelKgS * 3.6 * h
		co2 += c.Result.CO2KgS * 3.6 * h
	}
	for _, v := range []VoyageRecord{tables, csv} {
		tot := v.Result.Total
		// Warm starts differ between the voyage and the cases: equal to the
		// solver's tolerance, 1e-7 relative (common practice, no source).
		if math.Abs(tot.FuelT-fuel) > 1e-7*fuel || math.Abs(tot.CO2T-co2) > 1e-7*co2 {
			t.Errorf("voyage %q: fuel %g t, CO2 %g t; the cases give %g t and %g t", v.Name, tot.FuelT, tot.CO2T, fuel, co2)
		}
		var phases float64
		for _, p := range v.Result.Phases {
			phases += p.FuelT
		}
		if math.Abs(phases-tot.FuelT) > 1e-12*tot.FuelT {
			t.Errorf("voyage %q: phases add to %g t, total %g t", v.Name, phases, tot.FuelT)
		}
	}
	// Rows from a CSV file keep their file and line: data from line 3
	// (a comment and the header first).
	for i, p := range csv.Rows {
		if p.File != filepath.Join("testdata", "good", "voyage_rows.csv") || p.Line != i+3 {
			t.Errorf("CSV row %d at %v; want voyage_rows.csv:%d", i+1, p, i+3)
		}
	}
	if csv.Result.Total.FuelT != tables.Result.Total.FuelT {
		t.Errorf("the CSV voyage burns %g t, the same rows as tables %g t; want equal", csv.Result.Total.FuelT, tables.Result.Total.FuelT)
	}
}

func TestStudySaving(t *testing.T) {
	t.Parallel()
	run := runJob(t, "study.lua", Options{})
	if len(run.Studies) != 1 || len(run.Voyages) != 2 {
		t.Fatalf("got %d studies and %d voyages; want 1 and 2", len(run.Studies), len(run.Voyages))
	}
	s := run.Studies[0].Result
	without, with := run.Voyages[0].Result.Total.FuelT, run.Voyages[1].Result.Total.FuelT
	saved := s.Variants[1].FuelSavedT
	if saved <= 0 || math.Abs(saved-(without-with)) > 1e-9*without {
		t.Errorf("study saves %g t; the voyages without and with the EGE differ by %g t", saved, without-with)
	}
	if s.Variants[2].FuelSavedT <= saved {
		t.Errorf("the larger economiser saves %g t, no more than the smaller's %g t", s.Variants[2].FuelSavedT, saved)
	}
}

func TestAuditFlags(t *testing.T) {
	t.Parallel()
	run := runJob(t, "audit.lua", Options{})
	if len(run.Audits) != 2 {
		t.Fatalf("got %d audits; want 2", len(run.Audits))
	}
	a := run.Audits[0].Result
	// audit_log.csv: day 3 claims 9.5 t where the plant burns about 5.5 t;
	// the others claim near the model.
	want := []string{"", "", "above", ""}
	for i, d := range a.Days {
		if d.Flag != want[i] {
			t.Errorf("day %d (%s): claimed %g t, band %g-%g t, flag %q; want %q", i+1, d.Date, d.ClaimedT, d.LowT, d.HighT, d.Flag, want[i])
		}
	}
	// One day's excess of about 3 t lifts the period's claim above the
	// model's median without taking it beyond the tail of a period whose
	// heating factor is known to ±15 % (the flags' definition).
	if a.Flagged != 1 || a.Period.ClaimedT != 5.5+5.4+9.5+5 || !(a.Period.PAtOrBelow > 0.5) {
		t.Errorf("flagged %d, claimed %g t, P(model ≤ claim) %g; want 1, 25.4 t and above one half", a.Flagged, a.Period.ClaimedT, a.Period.PAtOrBelow)
	}
	if len(a.Uncertainties) != 3 || a.Uncertainties[2].Low != 0.97 || a.Uncertainties[0].Scope != profile.Fixed {
		t.Errorf("uncertainties %+v; want three, the last from 0.97, the first fixed", a.Uncertainties)
	}
}

// TestJobsWorkers runs the jobs on one worker and on several, with a
// progress callback: the results must not depend on the workers, and the
// progress must reach its total.
func TestJobsWorkers(t *testing.T) {
	t.Parallel()
	var mu sync.Mutex
	last := map[string][2]int{}
	prog := func(job string, done, total int) {
		mu.Lock()
		defer mu.Unlock()
		if p := last[job]; done < p[0] || done > total {
			t.Errorf("%s: progress %d of %d after %d", job, done, total, p[0])
		}
		last[job] = [2]int{done, total}
	}
	one := runJob(t, "study.lua", Options{Workers: 1})
	many := runJob(t, "study.lua", Options{Workers: 3, Progress: prog})
	for i := range one.Studies[0].Result.Variants {
		a, b := one.Studies[0].Result.Variants[i].Totals.FuelT, many.Studies[0].Result.Variants[i].Totals.FuelT
		if a != b {
			t.Errorf("variant %d: %g t on one worker, %g t on three", i, a, b)
		}
	}
	if p := last[`study "EGE"`]; p[0] != p[1] || p[1] != 3*4 {
		t.Errorf("study progress ended at %v; want 12 of 12 (3 variants × 4 rows)", p)
	}
	if p := last[`voyage "with EGE"`]; p[0] != 4 || p[1] != 4 {
		t.Errorf("voyage progress ended at %v; want 4 of 4", p)
	}
}

func TestJobErrors(t *testing.T) {
	t.Parallel()
	bad := filepath.Join("testdata", "bad")
	tests := []struct {
		file string
		want []string // each must appear in the error, in order
	}{
		{"csv_missing_column.lua", []string{filepath.Join(bad, "missing_column.csv") + `:1: missing column "hours"`}},
		{"csv_bad_unit.lua", []string{
			filepath.Join(bad, "bad_unit.csv") + `:4: column "sea": temperature needs a unit`,
			filepath.Join(bad, "bad_unit.csv") + `:5: column "cargo heating.duty": power expected`}},
		{"csv_unknown_key.lua", []string{
			`unknown_key.csv:1: column "cargo heating.dutty": unknown key 'dutty'; did you mean 'duty'?`,
			`unknown_key.csv:1: column "boiler 1.off": plant "Invented Small Tanker" has no unit "boiler 1"`,
			`unknown_key.csv:1: column "COT 1.To": unknown key 'To'; did you mean 'to'?`,
			`unknown_key.csv:1: unknown column "speed"`}},
		{"job_errors.lua", []string{"rows[1]: hours must be a positive", `rows[2]: set.COT 1.mode must be "hold" or "heat_up"; got "heat"`, "rows[3]: phase is required", `"AB2" is not a boiler`}},
		{"study_errors.lua", []string{`study_errors.lua:7: study "money" variants[2]: installed_cost must lie between 0 and 1e+13 (in any currency); got -5`,
			`study_errors.lua:7: study "money": discount_rate must not be negative; got -5 %`, `sweep: key must be "ua" or "pinch"`}},
		{"ege_fouling.lua", []string{`ege_fouling.lua:5: exhaust gas economiser "EGE": fouling_rate needs clean_interval`}},
		{"audit_errors.lua", []string{"claimed: mass expected", "cargo heating.off cannot be sampled", "did you mean 'eta_factor'?", "low must not exceed high", "samples must be a whole number", "band must satisfy"}},
	}
	for _, tc := range tests {
		t.Run(tc.file, func(t *testing.T) {
			_, err := RunFile(context.Background(), filepath.Join(bad, tc.file), Options{})
			if err == nil {
				t.Fatal("no error")
			}
			msg, at := err.Error(), 0
			for _, w := range tc.want {
				i := strings.Index(msg[at:], w)
				if i < 0 {
					t.Errorf("error lacks %q (in order):\n%s", w, msg)
					continue
				}
				at += i + len(w)
			}
		})
	}
}

func TestCoolDown(t *testing.T) {
	t.Parallel()
	// docs/reference/plant-checks.md §6 [C]: m 10 000 t, c 2.0 kJ/kgK, ΣUA 50 kW/K give
	// τ = 111.1 h; from 60 °C with 20 °C surroundings, 3 days give
	// 40.92 °C.
	src := `
local T, d = cool_down { tank = { mass = "10000 t", cp = "2.0 kJ/kgK", UA = "50 kW/K" }, ambient = "20 C", from = "60 C", hours = 72 }
local h = time_to_cool { tank = { mass = "10000 t", cp = "2.0 kJ/kgK", UA = "50 kW/K" }, ambient = "20 C", from = "60 C", to = string.format("%.12f C", T) }
local never = time_to_cool { tank = { mass = "10000 t", cp = "2.0 kJ/kgK", UA = "50 kW/K" }, ambient = "20 C", from = "60 C", to = "15 C" }
return T, d.tau_h, h, never`
	L := runValues(t, src, 4)
	if math.Abs(L[0]-40.92) > 0.005 || math.Abs(L[1]-111.1) > 0.05 {
		t.Errorf("cool_down gives %.4f °C with τ %.3f h; want 40.92 °C and 111.1 h", L[0], L[1])
	}
	// time_to_cool is the inverse of cool_down (same model, docs/reference/plant-checks.md §6 [C]).
	if math.Abs(L[2]-72) > 1e-6 {
		t.Errorf("time_to_cool back to %.4f °C takes %g h; want 72 h", L[0], L[2])
	}
	if !math.IsNaN(L[3]) {
		t.Errorf("time_to_cool below the surroundings gives %g; want nil", L[3])
	}
}

// runValues runs src and returns its first n return values as numbers
// (NaN for nil), printed by the script to the run's logger.
func runValues(t *testing.T, src string, n int) []float64 {
	t.Helper()
	wrapped := "local function body() " + src + " end\nlocal v = { body() }\n" +
		"for i = 1, " + strconv.Itoa(n) + " do print(v[i] == nil and 'nil' or string.format('%.17g', v[i])) end"
	var log bytes.Buffer
	if _, err := RunSource(context.Background(), "values.lua", []byte(wrapped), nil, Options{Logger: zerolog.New(&log)}); err != nil {
		t.Fatal(err)
	}
	var out []float64
	dec := json.NewDecoder(&log)
	for {
		var rec struct{ Message string }
		if err := dec.Decode(&rec); err != nil {
			break
		}
		f, err := strconv.ParseFloat(rec.Message, 64)
		if err != nil {
			f = math.NaN()
		}
		out = append(out, f)
	}
	if len(out) != n {
		t.Fatalf("script printed %d values; want %d", len(out), n)
	}
	return out
}

// TestCoolDownOfUnit takes the tank of a ship:tank_heating: the same
// figures as docs/reference/plant-checks.md §6 [C] (10 000 t at a constant 2.0 kJ/kgK,
// ΣUA 50 kW/K to a 20 °C sea: 60 °C → 40.92 °C in 3 days), reached by
// its handle and by its name, while a voyage keeps its heating off.
func TestCoolDownOfUnit(t *testing.T) {
	t.Parallel()
	src := `
local ship = steam_plant { name = "tank",
  boilers = { { name = "AB1", mcr = "3 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "84 %" } } }
local cot = ship:tank_heating { name = "COT 1", density = "1000 kg/m3", cp = "2.0 kJ/kgK", volume = "10000 m3",
  boundaries = { { area = "10000 m2", U = "5 W/m2K", beyond = "sea" } }, T = "60 C" }
ship:line("steam to COT 1", "main", "COT 1")
local v = voyage(ship, { rows = { { phase = "passage", hours = 72, sea = "20 C", air = "20 C", set = { ["COT 1"] = { off = true } } } } })
local T = cool_down { tank = cot, from = "60 C", hours = v.total.hours, sea = "20 C" }
local T2 = cool_down { tank = "COT 1", from = "60 C", hours = "3 d", sea = "20 C" }
return T, T2, v.rows[1].steam_production_kg_h`
	got := runValues(t, src, 3)
	if math.Abs(got[0]-40.92) > 0.005 || got[1] != got[0] {
		t.Errorf("cool_down of the unit gives %.4f °C by handle and %.4f °C by name; want 40.92 °C", got[0], got[1])
	}
	if got[2] != 0 {
		t.Errorf("the voyage raises %g kg/h of steam with the only consumer off; want 0", got[2])
	}
}

// TestModelKeysByRow: a voyage's rows set a tank's mode and temperatures
// (the duty models are the consumers' own, copied with each clone of the
// plant), and the totals do not depend on the number of workers. The
// duties are checked against the lumped balance of docs/reference/plant-checks.md §6
// [CP]: holding, Q = ΣUA·(T − T_beyond); heating up, Q = m·c̄·ΔT/t + ΣUA·(T̄
// − T_beyond), with c̄ by Cragoe (plant/loads' own tested formula).
func TestModelKeysByRow(t *testing.T) {
	t.Parallel()
	file := filepath.Join("testdata", "good", "model_rows.lua")
	var totals [2]float64
	for i, workers := range []int{1, 3} {
		run, err := RunFile(context.Background(), file, Options{Workers: workers})
		if err != nil {
			t.Fatal(err)
		}
		res := run.Voyages[0].Result
		duty := func(row int) float64 { return res.Rows[row].Result.Consumers[0].DutyW }
		ua := 1000*5.0 + 600*4.0 // W/K
		loss := func(tC float64) float64 { return 1000*5*(tC-10) + 600*4*(tC-5) }
		if d, want := duty(0), loss(45); math.Abs(d-want) > 1e-6*want {
			t.Errorf("row 1 (held at 45 C): duty %.1f W, want ΣUA·ΔT = %.1f W", d, want)
		}
		if d, want := duty(2), loss(55); math.Abs(d-want) > 1e-6*want {
			t.Errorf("row 3 (held at 55 C): duty %.1f W, want %.1f W", d, want)
		}
		in := res.Rows[1].Result.Consumers[0].Inputs
		mass, sensible := in["mass_kg"], in["sensible_W"]
		if d, want := duty(1), sensible+loss(50); math.Abs(d-want) > 1e-6*want || sensible < 0.5*mass*1800*10/(48*3600) {
			t.Errorf("row 2 (heat-up): duty %.1f W, want sensible %.1f + loss %.1f W (UA %.0f W/K)", d, sensible, loss(50), ua)
		}
		totals[i] = res.Total.FuelT
	}
	if totals[0] != totals[1] {
		t.Errorf("fuel %.9g t on one worker, %.9g t on three", totals[0], totals[1])
	}
}
