package plant

import (
	"errors"
	"testing"

	"steamcase/solver"
)

// TestStallWatch feeds the watch iterations as the solver would report
// them: it stops a solve whose firing boiler sits at zero steam while the
// residual creeps down, and one whose damped steps make no progress, and
// lets a converging solve (or a boiler only passing through zero) run.
// The rule is the plant's own (common practice, no source); the year of
// hourly cases in scenarios (TestDemoYearIterations) shows what it saves.
func TestStallWatch(t *testing.T) {
	t.Parallel()
	p := egeBoilerPlant(t)
	must(t, p.Check())
	b1 := p.Component("b1").(*Boiler)
	type step struct {
		steam, norm, alpha float64
	}
	repeat := func(n int, f func(i int) step) []step {
		var s []step
		for i := range n {
			s = append(s, f(i))
		}
		return s
	}
	for _, tc := range []struct {
		name  string
		steps []step
		want  any // nil, *firedAtZeroError or *noProgressError
		at    int // iteration that stops it
	}{
		{"firing boiler held at zero", repeat(20, func(i int) step { return step{0, 1e-3 * (1 - 0.03*float64(i)), 1} }),
			&firedAtZeroError{}, stallIterations + 1},
		{"damped steps without progress", repeat(20, func(i int) step { return step{1, 0.0745, 1e-3} }),
			&noProgressError{}, stallDamped + 1},
		{"converging", repeat(6, func(i int) step { return step{1, 1e-1 / float64(int(1)<<(4*i)), 1} }), nil, 0},
		{"passing through zero", repeat(8, func(i int) step {
			m := 0.0
			if i >= 3 {
				m = 1
			}
			return step{m, 1e-1 / float64(int(1)<<(3*i)), 1}
		}), nil, 0},
		{"slow but moving", repeat(30, func(i int) step { return step{1, 1e-2 * (1 - 0.02*float64(i)), 0.5} }), nil, 0},
	} {
		w := &stallWatch{p: p}
		p.s.fire[0] = true
		x := make([]float64, p.s.prob.Dim)
		var err error
		stopped := 0
		for i, s := range tc.steps {
			x[b1.steam.mIdx()] = s.steam
			err = w.Record(solver.Iteration{Iter: i + 1, X: x, ResidualNorm: s.norm, Alpha: s.alpha})
			if err != nil {
				stopped = i + 1
				break
			}
		}
		switch tc.want.(type) {
		case nil:
			if err != nil {
				t.Errorf("%s: stopped at iteration %d: %v", tc.name, stopped, err)
			}
		case *firedAtZeroError:
			var e *firedAtZeroError
			if !errors.As(err, &e) || e.Boiler != "b1" || stopped != tc.at {
				t.Errorf("%s: stopped at iteration %d with %v, want b1 named at iteration %d", tc.name, stopped, err, tc.at)
			}
		case *noProgressError:
			var e *noProgressError
			if !errors.As(err, &e) || stopped != tc.at {
				t.Errorf("%s: stopped at iteration %d with %v, want no progress at iteration %d", tc.name, stopped, err, tc.at)
			}
		}
	}
}
