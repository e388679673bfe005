package solver

import (
	"context"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// voyage is a sequence of nearby problems: Broyden tridiagonal (MGH (30))
// with the constant term 1 replaced by a load c that drifts from 1 to 1.2
// in 100 steps, like the hours of a voyage.
type voyage struct {
	c  float64
	sv *Solver
}

func newVoyage(n int, mode string, s *Settings) *voyage {
	v := &voyage{c: 1}
	m := broydenTridiagonal(n)
	p := Problem{Dim: n,
		Residual: func(r, x []float64) error {
			m.f(r, x)
			for i := range r {
				r[i] += v.c - 1
			}
			return nil
		}}
	switch mode {
	case "analytic":
		p.Jacobian = func(j *mat.Dense, x []float64) error { m.jac(j, x); return nil }
	case "analytic+pattern":
		p.Jacobian = func(j *mat.Dense, x []float64) error { m.jac(j, x); return nil }
		p.Pattern = m.pattern
	case "colored":
		p.Pattern = m.pattern
	case "sparse":
		p.Pattern = m.pattern
		p.SparseJacobian = func(j *Sparse, x []float64) error {
			for i := 0; i < n; i++ {
				j.Set(i, i, 3-4*x[i])
				if i > 0 {
					j.Set(i, i-1, -1)
				}
				if i < n-1 {
					j.Set(i, i+1, -2)
				}
			}
			return nil
		}
	}
	var err error
	v.sv, err = New(p, s)
	if err != nil {
		panic(err)
	}
	return v
}

const voyageSteps = 100

func voyageLoad(k int) float64 { return 1 + 0.2*float64(k)/voyageSteps }

// TestWarmStart solves the voyage sequence, each problem from the previous
// answer, and checks that every warm solve converges in 1 to 3 iterations
// (the expectation for Newton's method from a nearby start: common
// practice, no source) and, for n = 500, that a warm solve allocates
// nothing.
func TestWarmStart(t *testing.T) {
	t.Parallel()
	for _, mode := range []string{"analytic", "dense", "colored", "sparse"} {
		v := newVoyage(50, mode, nil)
		x := filled(50, -1)
		res, err := v.sv.Solve(context.Background(), x)
		if err != nil {
			t.Fatal(err)
		}
		copy(x, res.X)
		for k := 1; k <= voyageSteps; k++ {
			v.c = voyageLoad(k)
			res, err := v.sv.Solve(context.Background(), x)
			if err != nil {
				t.Fatalf("%s step %d: %v", mode, k, err)
			}
			if it := res.Stats.Iterations; it < 1 || it > 3 {
				t.Errorf("%s step %d: %d iterations, want 1 to 3", mode, k, it)
			}
			copy(x, res.X)
		}
	}
}

type countRecorder struct{ n int }

func (c *countRecorder) Record(it Iteration) error { c.n++; return nil }

// TestZeroAllocs checks that a warm Solver allocates nothing per Solve,
// with each kind of Jacobian, with a Recorder, with an analytic
// Jacobian and a Pattern with either factorisation, with the sparse
// Jacobian, and with reuse off and kept pivots on. (The voyage has no
// scales: the solver derives them at each Solve.)
func TestZeroAllocs(t *testing.T) {
	for _, mode := range []string{"analytic", "dense", "colored", "recorded", "analytic+pattern", "analytic+pattern+sparse", "sparse", "sparse+no-reuse", "sparse+keep-pivots"} {
		var set *Settings
		rec := &countRecorder{}
		vmode := mode
		switch mode {
		case "recorded":
			set = &Settings{Recorder: rec}
		case "analytic+pattern+sparse":
			set = &Settings{Factorizer: &SparseLU{}}
			vmode = "analytic+pattern"
		case "sparse+no-reuse":
			set, vmode = &Settings{NoReuse: true}, "sparse"
		case "sparse+keep-pivots":
			set, vmode = &Settings{KeepPivots: true}, "sparse"
		}
		v := newVoyage(50, vmode, set)
		x := filled(50, -1)
		res, err := v.sv.Solve(context.Background(), x)
		if err != nil {
			t.Fatal(err)
		}
		copy(x, res.X)
		k := 0
		ctx := context.Background()
		allocs := testing.AllocsPerRun(20, func() {
			k++
			v.c = voyageLoad(k % voyageSteps)
			if _, err := v.sv.Solve(ctx, x); err != nil {
				t.Fatal(err)
			}
		})
		if allocs != 0 {
			t.Errorf("%s: %g allocations per warm Solve, want 0", mode, allocs)
		}
		if mode == "recorded" && rec.n == 0 {
			t.Error("the recorder was not called")
		}
	}
}
