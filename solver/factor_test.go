package solver

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// TestDenseLU solves seeded random systems with the unblocked and the
// blocked path and checks the residual ‖A·x − b‖∞ against the backward
// error bound of LU with partial pivoting, taken loosely as
// 1e-10·‖A‖·‖x‖ (common practice, no source).
func TestDenseLU(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(3, 5))
	for _, n := range []int{1, 7, 400} {
		a := mat.NewDense(n, n, nil)
		b := make([]float64, n)
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				a.Set(i, j, rng.NormFloat64())
			}
			b[i] = rng.NormFloat64()
		}
		for _, from := range []int{-1, 0, 2} {
			lu := &DenseLU{BlockedFrom: from}
			if err := lu.Factorize(a); err != nil {
				t.Fatal(err)
			}
			x := make([]float64, n)
			if err := lu.Solve(x, b); err != nil {
				t.Fatal(err)
			}
			worst := 0.0
			for i := 0; i < n; i++ {
				s := -b[i]
				for j := 0; j < n; j++ {
					s += a.At(i, j) * x[j]
				}
				worst = math.Max(worst, math.Abs(s))
			}
			if bound := 1e-10 * mat.Norm(a, math.Inf(1)) * infNorm(x); worst > bound {
				t.Errorf("n=%d BlockedFrom=%d: residual %g > %g", n, from, worst, bound)
			}
			if c := lu.Cond(); !(c >= 1) || math.IsInf(c, 1) {
				t.Errorf("n=%d: condition estimate %g", n, c)
			}
		}
	}
	// Exactly singular.
	lu := NewDenseLU()
	if err := lu.Factorize(mat.NewDense(2, 2, []float64{1, 2, 2, 4})); !errors.Is(err, ErrExactlySingular) || !math.IsInf(lu.Cond(), 1) {
		t.Errorf("singular: error %v, cond %g", err, lu.Cond())
	}
}

// TestDenseLUNoAllocs: with BlockedFrom < 0 a warm factorisation and solve
// allocate nothing even at order 400.
func TestDenseLUNoAllocs(t *testing.T) {
	n := 400
	rng := rand.New(rand.NewPCG(9, 9))
	a := mat.NewDense(n, n, nil)
	for i := 0; i < n; i++ {
		for j := 0; j < n; j++ {
			a.Set(i, j, rng.NormFloat64())
		}
	}
	b := make([]float64, n)
	x := make([]float64, n)
	lu := &DenseLU{BlockedFrom: -1}
	_ = lu.Factorize(a)
	if allocs := testing.AllocsPerRun(3, func() {
		_ = lu.Factorize(a)
		_ = lu.Solve(x, b)
	}); allocs != 0 {
		t.Errorf("%g allocations per factorise and solve, want 0", allocs)
	}
}
