package report

import (
	"bytes"
	"context"
	"encoding/csv"
	"fmt"
	"math"
	"reflect"
	"strconv"
	"strings"
	"testing"

	"steamcase/plant"
	"steamcase/plant/profile"
)

// profileRun runs a voyage of four periods in two phases, a study of two
// variants and an audit of three days on the invented two-boiler plant.
// The figures are the profile package's (checked in its own tests); these
// pin what the report shows of them.
func profileRun(t testing.TB) Run {
	ctx := context.Background()
	p := twoBoilers(t, "Invented Test Tanker")
	duty := func(w float64) []plant.Setting {
		return []plant.Setting{{Unit: "cargo heating", Param: "duty", Value: w}}
	}
	cond := plant.Conditions{SeaT: 283.15, AirT: 278.15}
	rows := []profile.Row{
		{Phase: "port", Hours: 24, Case: plant.Case{Name: "port 1", Conditions: cond, Set: duty(300e3)}},
		{Phase: "port", Hours: 12, Case: plant.Case{Name: "port 2", Conditions: cond, Set: duty(500e3)}},
		{Phase: "discharge", Hours: 20, Case: plant.Case{Name: "discharge 1", Conditions: cond, Set: duty(7e6)}},
		// Both boilers forced and short: the plant sheds, and the boilers
		// at their limit are above the usable fraction (five warnings).
		{Phase: "discharge", Hours: 4, Case: plant.Case{Name: "discharge 2", Conditions: cond, Set: duty(14e6), Fire: []string{"AB1", "AB2"}}},
	}
	opt := profile.Options{Workers: 1}
	vr, err := profile.Run(ctx, p, rows, opt)
	must(t, err)
	sr, err := profile.Study(ctx, p, rows[:3], []profile.Variant{
		{Name: "as built"},
		{Name: "better lagging", Set: []plant.Setting{{Unit: "cargo heating", Param: "factor", Value: 0.9}}},
	}, profile.Economics{FuelPrice: 600, InstalledCost: 40000, Currency: "EUR"}, opt)
	must(t, err)
	days := []profile.Day{
		{Date: "2026-01-01", Phase: "passage", Hours: 24, Case: plant.Case{Name: "d1", Conditions: cond, Set: duty(2e6)}, ClaimedT: 3.5},
		{Date: "2026-01-02", Phase: "passage", Hours: 24, Case: plant.Case{Name: "d2", Conditions: cond, Set: duty(2e6)}, ClaimedT: 9},
		{Date: "2026-01-03", Phase: "passage", Hours: 24, Case: plant.Case{Name: "d3", Conditions: cond, Set: duty(2e6)}, ClaimedT: 1},
	}
	ar, err := profile.Audit(ctx, p, profile.AuditSpec{Days: days, Uncertain: []profile.Uncertain{
		{Unit: "cargo heating", Param: "factor", Low: 0.8, High: 1.2},
	}, Claim: []profile.ClaimError{{Source: profile.FlowMeter, Accuracy: 0.01}},
		Implied: []profile.Factor{{Targets: []profile.Target{{Unit: "cargo heating", Param: "factor"}}}},
		Causes:  []profile.Cause{{Name: "cargo heating", Units: []string{"cargo heating"}}}},
		profile.AuditOptions{Samples: 50, Seed: 7, Workers: 1})
	must(t, err)
	job := func(name string, n int) Job {
		j := Job{Name: name, Plant: p.Name, Source: "plan.lua:3"}
		for i := range n {
			j.Rows = append(j.Rows, "plan.csv:"+strconv.Itoa(i+2))
		}
		return j
	}
	return Run{
		Voyages: []Voyage{{Job: job("four periods", len(rows)), Result: vr}},
		Studies: []Study{{Job: job("lagging", 3), Result: sr}},
		Audits:  []Audit{{Job: job("three days", len(days)), Result: ar}},
	}
}

// TestProfileGolden pins the table and the JSON of the jobs. Rewrite with:
// go test ./cmd/sim/internal/report -update
func TestProfileGolden(t *testing.T) {
	t.Parallel()
	run := profileRun(t)
	var b bytes.Buffer
	must(t, Table(&b, run))
	if want := golden(t, "table_profile.golden", b.Bytes()); !bytes.Equal(b.Bytes(), want) {
		t.Errorf("table_profile.golden differs:\n--- got\n%s\n--- want\n%s", b.String(), want)
	}
	b.Reset()
	must(t, JSON(&b, run))
	if err := sameJSON(b.String(), string(golden(t, "json_profile.golden", b.Bytes()))); err != nil {
		t.Errorf("json_profile.golden differs: %v", err)
	}
}

// TestProfileTable checks what the table says of each job against the
// results it came from.
func TestProfileTable(t *testing.T) {
	t.Parallel()
	run := profileRun(t)
	var b bytes.Buffer
	must(t, Table(&b, run))
	out := b.String()
	v := run.Voyages[0].Result
	a := run.Audits[0].Result
	for _, s := range []string{
		"Voyage: four periods", `plant "Invented Test Tanker", run at plan.lua:3`, "4 periods, 60.0 h",
		"    port ", "    discharge ", "    whole voyage ",
		// The fuel of the whole voyage in tonnes, three decimals.
		fix(v.Total.FuelT, 3),
		"hours firing: " + hoursFiring(v.Total.HoursFiring),
		"periods the plant cannot carry: row 4 (plan.csv:5)",
		// Each period with warnings, its warnings under it: the fourth
		// has five, of which three are shown.
		"periods with warnings: 4 of 4\n    row 1 (plan.csv:2), \"port 1\":\n      - " + oneLine(v.Rows[0].Summary.Warnings[0]),
		"    row 4 (plan.csv:5), \"discharge 2\":\n      - " + oneLine(v.Rows[3].Summary.Warnings[0]),
		"      - and 2 more\n",
		"Study: lagging", "better lagging", "saved EUR", "payback years",
		"rows with warnings, by variant:\n    as built: 3 of 3 rows\n      row 1 (plan.csv:2):\n        - ",
		"Audit: three days",
		"\n    2026-01-01  passage       3.500", "below\n    2026-01-02",
		"9.000", "above\n    2026-01-03",
		"days flagged: " + strconv.Itoa(a.Flagged) + " of 3",
		"the period: P(model ≤ claim) = " + fix(a.Period.PAtOrBelow, 4),
		"a day beyond 0.833 % (Bonferroni over 3 days)",
		"flow meter: ± 1 % of the reading",
		"cargo heating factor from 0.8 to 1.2, nominal 1, fixed (the default scope of factor)",
		"cargo heating.factor: plausible 0.8 to 1.2, searched 0.01 to 10",
		"cargo heating (cargo heating)",
		"Fuel by grade, every day of the log", "    all    " + fmt.Sprintf("%10s", fix(a.FuelT, 3)),
		"level of the flags: 5 % (the default) (common practice, no source)",
		Caution,
	} {
		if !strings.Contains(out, s) {
			t.Errorf("the table does not say %q", s)
		}
	}
	// Hours add up: 24 + 12 + 20 + 4 = 60 h, and each phase's fuel is
	// part of the whole (the sum of the phases, to the rounding of the
	// printed figures).
	var sum float64
	for _, p := range v.Phases {
		sum += p.FuelT
	}
	if d := sum - v.Total.FuelT; d > 1e-9*v.Total.FuelT || d < -1e-9*v.Total.FuelT {
		t.Errorf("phases' fuel %g t, whole voyage %g t", sum, v.Total.FuelT)
	}
}

// TestVoyageWarningsCut: the table lists the warnings of at most ten
// periods, three of each, and says how many more there are.
func TestVoyageWarningsCut(t *testing.T) {
	t.Parallel()
	run := profileRun(t)
	v := run.Voyages[0]
	r := *v.Result
	last := r.Rows[3]
	if len(last.Summary.Warnings) != 5 {
		t.Fatalf("the fourth row has %d warnings; the test wants 5", len(last.Summary.Warnings))
	}
	r.Rows = nil
	r.Total.WarningRows = nil
	for i := range 12 {
		row := last
		row.Index = i
		r.Rows = append(r.Rows, row)
		r.Total.WarningRows = append(r.Total.WarningRows, i)
	}
	r.Total.Rows = 12
	v.Result = &r
	v.Rows = nil
	var b bytes.Buffer
	writeRowWarnings(&b, v)
	out := b.String()
	if n := strings.Count(out, "      - and 2 more\n"); n != 10 {
		t.Errorf("%d periods say \"and 2 more\", want 10:\n%s", n, out)
	}
	if n := strings.Count(out, "\n    row "); n != 10 {
		t.Errorf("%d periods listed, want 10", n)
	}
	if !strings.HasPrefix(out, "  periods with warnings: 12 of 12\n") || !strings.HasSuffix(out, "    and 2 more periods with warnings\n") {
		t.Errorf("the list:\n%s", out)
	}
	r.Total.WarningRows = nil
	b.Reset()
	writeRowWarnings(&b, v)
	if b.String() != "  periods with warnings: none\n" {
		t.Errorf("no warnings: %q", b.String())
	}
}

// readTables reads the CSV stream of a run into its tables by name, each
// a header and rows, checking the rule of the stream: a blank line between
// tables, a header whose first field is "table", data rows whose first
// field names the table.
func readTables(t *testing.T, text string) (order []string, tables map[string][][]string) {
	t.Helper()
	tables = map[string][][]string{}
	for i, block := range strings.Split(text, "\n\n") {
		r := csv.NewReader(strings.NewReader(block))
		recs, err := r.ReadAll()
		if err != nil {
			t.Fatalf("table %d: %v", i+1, err)
		}
		if len(recs) == 0 || recs[0][0] != "table" {
			t.Fatalf("table %d does not start with a header whose first field is \"table\": %q", i+1, recs)
		}
		name := TableCases
		if len(recs) > 1 {
			name = recs[1][0]
		}
		for _, rec := range recs[1:] {
			if rec[0] != name {
				t.Errorf("table %q has a row of %q", name, rec[0])
			}
		}
		order = append(order, name)
		tables[name] = recs
	}
	return order, tables
}

// TestCSVJobs reads the CSV of a run with cases and jobs back and checks
// each job's figures against the results they came from, in the units the
// headers name (1 kg/s = 3600 kg/h, 1 t = 1000 kg, °C = K − 273.15, exact
// by definition), to the decimals written.
func TestCSVJobs(t *testing.T) {
	t.Parallel()
	run := profileRun(t)
	run.Cases = demoCases(t)
	var b bytes.Buffer
	must(t, CSV(&b, run))
	order, tables := readTables(t, b.String())
	if strings.Join(order, "|") != "cases|voyage rows|voyage warnings|study variants|study warnings|audit days|audit periods|audit implied|audit shares|audit grades|audit warnings" {
		t.Fatalf("tables %q", order)
	}
	get := func(table string, i int, key string) string {
		t.Helper()
		recs := tables[table]
		for k, h := range recs[0] {
			if h == key {
				return recs[i+1][k]
			}
		}
		t.Fatalf("table %q has no column %q", table, key)
		return ""
	}
	num := func(table string, i int, key string, want, tol float64) {
		t.Helper()
		s := get(table, i, key)
		got, err := strconv.ParseFloat(s, 64)
		if err != nil || math.Abs(got-want) > tol {
			t.Errorf("%s row %d: %s = %q, want %.6g ± %g", table, i+1, key, s, want, tol)
		}
	}
	if n := len(tables[TableCases]) - 1; n != len(run.Cases) {
		t.Errorf("%d case rows, want %d", n, len(run.Cases))
	}

	v := run.Voyages[0]
	if n := len(tables[TableVoyage]) - 1; n != len(v.Result.Rows) {
		t.Fatalf("%d voyage rows, want %d", n, len(v.Result.Rows))
	}
	var fuel float64
	for i, row := range v.Result.Rows {
		c := row.Summary
		if get(TableVoyage, i, "voyage") != v.Name || get(TableVoyage, i, "phase") != row.Phase ||
			get(TableVoyage, i, "case") != c.Case || get(TableVoyage, i, "source") != v.Rows[i] ||
			get(TableVoyage, i, "can_carry") != strconv.FormatBool(c.CanCarry) {
			t.Errorf("voyage row %d: %q", i+1, tables[TableVoyage][i+1])
		}
		num(TableVoyage, i, "row", float64(i+1), 0)
		num(TableVoyage, i, "hours", row.Hours, 0.005)
		num(TableVoyage, i, "sea_T_C", c.SeaT-273.15, 0.05)
		num(TableVoyage, i, "air_T_C", c.AirT-273.15, 0.05)
		num(TableVoyage, i, "engine_load_pct", c.EngineLoad*100, 0.05)
		num(TableVoyage, i, "boilers_firing", float64(c.BoilersFiring), 0)
		num(TableVoyage, i, "steam_demand_kg_h", c.SteamDemandKgS*3600, 0.05)
		num(TableVoyage, i, "fuel_kg_h", c.FuelKgS*3600, 0.05)
		num(TableVoyage, i, "fuel_t", c.FuelKgS*row.Hours*3600/1000, 0.0005)
		num(TableVoyage, i, "co2_t", c.CO2KgS*row.Hours*3600/1000, 0.0005)
		fuel += c.FuelKgS * row.Hours * 3.6
	}
	// The voyage warnings: each row's warnings, in order, by row number
	// and source.
	var want [][]string
	for i, row := range v.Result.Rows {
		for _, s := range row.Summary.Warnings {
			want = append(want, []string{TableVoyageWarn, v.Name, strconv.Itoa(i + 1), v.Rows[i], oneLine(s)})
		}
	}
	if got := tables[TableVoyageWarn][1:]; len(want) == 0 || !reflect.DeepEqual(got, want) {
		t.Errorf("voyage warnings:\n%q\nwant\n%q", got, want)
	}
	// The rows' fuel adds up to the voyage's total (profile.Totals).
	if math.Abs(fuel-v.Result.Total.FuelT) > 1e-9*v.Result.Total.FuelT {
		t.Errorf("rows' fuel %g t, total %g t", fuel, v.Result.Total.FuelT)
	}

	s := run.Studies[0].Result
	for i, x := range s.Variants {
		if get(TableStudy, i, "study") != "lagging" || get(TableStudy, i, "variant") != x.Name || get(TableStudy, i, "currency") != "EUR" {
			t.Errorf("study row %d: %q", i+1, tables[TableStudy][i+1])
		}
		num(TableStudy, i, "hours", s.Hours, 0.005)
		num(TableStudy, i, "fuel_t", x.Totals.FuelT, 0.0005)
		num(TableStudy, i, "fuel_saved_t", x.FuelSavedT, 0.0005)
		num(TableStudy, i, "co2_avoided_t", x.CO2AvoidedT, 0.0005)
		num(TableStudy, i, "cost_saved", x.CostSaved, 0.005)
		num(TableStudy, i, "hours_below_min_gas_T", x.HoursBelowMinGasT, 0.005)
	}
	if p := get(TableStudy, 0, "payback_years"); p != "" {
		t.Errorf("the base variant has a payback %q", p)
	}
	if x := s.Variants[1]; x.CostSaved > 0 {
		num(TableStudy, 1, "payback_years", x.PaybackYears, 0.005)
	} else if p := get(TableStudy, 1, "payback_years"); p != "" {
		t.Errorf("a variant that saves nothing has a payback %q", p)
	}

	// The study warnings: every text of every row of every variant.
	var texts int
	for _, x := range s.Variants {
		for _, rw := range x.RowWarnings {
			texts += len(rw.Texts)
		}
	}
	if n := len(tables[TableStudyWarn]) - 1; n != texts || texts == 0 {
		t.Errorf("%d study warning lines; the variants have %d texts", n, texts)
	}
	a := run.Audits[0]
	for i, d := range a.Result.Days {
		if get(TableAudit, i, "audit") != a.Name || get(TableAudit, i, "date") != d.Date || get(TableAudit, i, "flag") != d.Flag ||
			get(TableAudit, i, "source") != a.Rows[i] {
			t.Errorf("audit row %d: %q", i+1, tables[TableAudit][i+1])
		}
		num(TableAudit, i, "claimed_t", d.ClaimedT, 0.0005)
		num(TableAudit, i, "nominal_t", d.NominalT, 0.0005)
		num(TableAudit, i, "low_t", d.LowT, 0.0005)
		num(TableAudit, i, "median_t", d.MedianT, 0.0005)
		num(TableAudit, i, "high_t", d.HighT, 0.0005)
		num(TableAudit, i, "reading_high_t", d.ReadingHighT, 0.0005)
		num(TableAudit, i, "percentile_pct", 100*d.Percentile, 0.05)
		num(TableAudit, i, "fuel_t", d.FuelT, 0.0005)
		num(TableImplied, i, "value", d.Implied[0].Value, 5e-7)
		num(TableShares, i, "fuel_t", d.Shares[0], 0.0005)
		num(TableGrades, i, "fuel_t", d.FuelByGrade[0].FuelT, 0.0005)
	}
	num(TableAuditPer, 0, "claimed_t", a.Result.Period.ClaimedT, 0.0005)
	num(TableAuditPer, 0, "p_at_or_below", a.Result.Period.PAtOrBelow, 0.00005)
	if got := get(TableAuditPer, 0, "flag"); got != a.Result.Period.Flag {
		t.Errorf("period flag %q, want %q", got, a.Result.Period.Flag)
	}

	// Only the cases: one table. Only a voyage: the cases' header alone,
	// then the voyage's rows.
	b.Reset()
	must(t, CSV(&b, Run{Cases: run.Cases}))
	if order, _ := readTables(t, b.String()); len(order) != 1 {
		t.Errorf("a run of cases: tables %q", order)
	}
	b.Reset()
	must(t, CSV(&b, Run{Voyages: run.Voyages}))
	if !strings.HasPrefix(b.String(), strings.Join(csvHeader[:], ",")+"\n\ntable,voyage,") {
		t.Errorf("a run of a voyage: %.200q", b.String())
	}
	// Go's reader takes the whole stream when told records vary in length.
	r := csv.NewReader(strings.NewReader(b.String()))
	r.FieldsPerRecord = -1
	if recs, err := r.ReadAll(); err != nil || len(recs) != 3+len(v.Result.Rows)+len(want) {
		t.Errorf("the stream read whole: %d records, %v", len(recs), err)
	}
}

// TestCSVGolden pins the CSV stream of a run with cases and jobs. Rewrite
// with: go test ./cmd/sim/internal/report -update
func TestCSVGolden(t *testing.T) {
	t.Parallel()
	run := profileRun(t)
	run.Cases = demoCases(t)[:2]
	var b bytes.Buffer
	must(t, CSV(&b, run))
	if want := golden(t, "csv_profile.golden", b.Bytes()); !bytes.Equal(b.Bytes(), want) {
		t.Errorf("csv_profile.golden differs:\n--- got\n%s\n--- want\n%s", b.String(), want)
	}
}
