package solver

import (
	"context"
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// TestSparseLU checks SparseLU against DenseLU on seeded random sparse
// matrices (solutions agree, A·x = b to backward-error accuracy) and its
// condition estimate against LAPACK's Dgecon through DenseLU (both are
// 1-norm estimates of the same quantity; agreement within a factor 3 is
// common practice for such estimators, no source).
func TestSparseLU(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(21, 4))
	checked := 0
	for trial := 0; trial < 200; trial++ {
		n := 1 + rng.IntN(40)
		density := 0.05 + 0.3*rng.Float64()
		a := mat.NewDense(n, n, nil)
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				if rng.Float64() < density {
					a.Set(i, j, rng.NormFloat64())
				}
			}
			// A random nonzero in each row and column keeps most trials
			// nonsingular without favouring the diagonal.
			a.Set(i, rng.IntN(n), 1+rng.Float64())
			a.Set(rng.IntN(n), i, 1+rng.Float64())
		}
		b := make([]float64, n)
		for i := range b {
			b[i] = rng.NormFloat64()
		}
		var d DenseLU
		derr := d.Factorize(a)
		var s SparseLU
		serr := s.Factorize(a)
		if derr != nil || d.Cond() > 1e12 {
			continue // singular or nearly: skip (the dense check covers naming)
		}
		if serr != nil {
			t.Fatalf("trial %d: sparse %v, dense cond %g", trial, serr, d.Cond())
		}
		checked++
		xd := make([]float64, n)
		xs := make([]float64, n)
		_ = d.Solve(xd, b)
		_ = s.Solve(xs, b)
		scale := infNorm(xd)
		for i := range xd {
			// Forward error of a backward-stable solve: about ε·cond·‖x‖.
			if math.Abs(xd[i]-xs[i]) > 1e-13*d.Cond()*scale {
				t.Fatalf("trial %d n=%d: x[%d] sparse %g dense %g (cond %g)", trial, n, i, xs[i], xd[i], d.Cond())
			}
		}
		if r := s.Cond() / d.Cond(); r < 1.0/3 || r > 3 {
			t.Errorf("trial %d n=%d: sparse cond %g, dense cond %g", trial, n, s.Cond(), d.Cond())
		}
	}
	if checked < 150 {
		t.Errorf("only %d of 200 random matrices were nonsingular enough to compare", checked)
	}
	var s SparseLU
	if err := s.Factorize(mat.NewDense(3, 3, []float64{1, 2, 0, 2, 4, 0, 0, 0, 1})); !errors.Is(err, ErrExactlySingular) {
		t.Errorf("singular: %v", err)
	}
}

// TestSparseLUSolve solves the MGH 1981 banded systems with SparseLU in
// place of DenseLU and checks the same answer and iteration count.
func TestSparseLUSolve(t *testing.T) {
	t.Parallel()
	for _, m := range []mghProblem{broydenTridiagonal(200), broydenBanded(200), discreteBVP(100)} {
		dense, err := Solve(context.Background(), m.problem(true), m.x0, nil)
		if err != nil {
			t.Fatal(err)
		}
		sparse, err := Solve(context.Background(), m.problem(true), m.x0, &Settings{Factorizer: &SparseLU{}})
		if err != nil {
			t.Fatal(err)
		}
		if dense.Stats.Iterations != sparse.Stats.Iterations {
			t.Errorf("%s: %d iterations dense, %d sparse", m.name, dense.Stats.Iterations, sparse.Stats.Iterations)
		}
		for i := range dense.X {
			if math.Abs(dense.X[i]-sparse.X[i]) > 1e-10 {
				t.Fatalf("%s: x[%d] dense %g sparse %g", m.name, i, dense.X[i], sparse.X[i])
			}
		}
	}
}

// TestSparseLUNoAllocs: a warm SparseLU allocates nothing.
func TestSparseLUNoAllocs(t *testing.T) {
	m := broydenBanded(300)
	a := mat.NewDense(300, 300, nil)
	m.jac(a, m.x0)
	b := make([]float64, 300)
	x := make([]float64, 300)
	var s SparseLU
	_ = s.Factorize(a)
	if allocs := testing.AllocsPerRun(5, func() {
		_ = s.Factorize(a)
		_ = s.Solve(x, b)
	}); allocs != 0 {
		t.Errorf("%g allocations per factorise and solve, want 0", allocs)
	}
}
