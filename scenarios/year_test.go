package scenarios_test

import (
	"context"
	"testing"

	"steamcase/plant/profile"
)

// TestDemoYearIterations: every hour of the demo tanker's year converges,
// and no hour spends the solver's iteration limit on a firing
// configuration that has no solution (a boiler firing while the exhaust-gas
// economiser leaves steam over): the firing rule's trials stop early
// (the plant's stall watch). Across a year that keeps the Newton
// iterations of all the configurations tried below 1.35 a row (measured
// 1.20; 2.46 before the watch) and every hour below 60 (measured 38, at
// the cold start of a chunk of rows; 200 before). The plant's own
// behaviour; no outside source.
func TestDemoYearIterations(t *testing.T) {
	t.Parallel()
	if testing.Short() {
		t.Skip("a year of hourly cases")
	}
	p := demoTanker(t)
	p.Opt.NoEGESaving = true
	rows := yearRows()
	res, err := profile.Run(context.Background(), p, rows, profile.Options{})
	if err != nil {
		t.Fatal(err)
	}
	var all, worst int
	for i, r := range res.Rows {
		if !r.Summary.Converged {
			t.Errorf("hour %d did not converge", i)
		}
		n := r.Summary.NewtonIterations
		all += n
		worst = max(worst, n)
	}
	if mean := float64(all) / float64(len(rows)); mean > 1.35 {
		t.Errorf("%.3f Newton iterations a row over every configuration tried, want at most 1.35", mean)
	}
	if worst >= 60 {
		t.Errorf("an hour took %d Newton iterations, want fewer than 60: a configuration ran on without progress", worst)
	}
}
