package report

import (
	"bytes"
	"context"
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
		{Phase: "discharge", Hours: 4, Case: plant.Case{Name: "discharge 2", Conditions: cond, Set: duty(14e6)}},
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
	ar, err := profile.Audit(ctx, p, days, []profile.Uncertain{
		{Unit: "cargo heating", Param: "factor", Low: 0.8, High: 1.2},
	}, profile.AuditOptions{Samples: 50, Seed: 7, Workers: 1})
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
		"Study: lagging", "better lagging", "saved EUR", "payback years",
		"Audit: three days",
		"\n    2026-01-01  passage       3.500", "below the band\n    2026-01-02",
		"9.000", "above the band\n    2026-01-03",
		"days outside the band: " + strconv.Itoa(a.Flagged),
		"cargo heating factor from 0.8 to 1.2",
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
