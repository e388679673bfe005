package solver

import (
	"context"
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/floats"
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

// randomSparse returns a seeded random n×n pattern (each row its diagonal
// and about density·n other entries) and a matrix on it.
func randomSparse(rng *rand.Rand, n int, density float64) ([][]int, *mat.Dense) {
	pattern := make([][]int, n)
	a := mat.NewDense(n, n, nil)
	for i := 0; i < n; i++ {
		pattern[i] = append(pattern[i], i)
		for j := 0; j < n; j++ {
			if j != i && rng.Float64() < density {
				pattern[i] = append(pattern[i], j)
			}
		}
		for _, j := range pattern[i] {
			a.Set(i, j, rng.NormFloat64())
		}
	}
	return pattern, a
}

// sparseOf returns the entries of a on pattern as a Sparse.
func sparseOf(pattern [][]int, a *mat.Dense) *Sparse {
	n, _ := a.Dims()
	s := NewSparse(n, pattern)
	for i, row := range pattern {
		for _, j := range row {
			s.Set(i, j, a.At(i, j))
		}
	}
	return s
}

// backwardError returns ‖A·x − b‖∞/(‖A‖∞‖x‖∞ + ‖b‖∞).
func backwardError(a *mat.Dense, x, b []float64) float64 {
	n, _ := a.Dims()
	r := mat.NewVecDense(n, nil)
	r.MulVec(a, mat.NewVecDense(n, x))
	r.SubVec(r, mat.NewVecDense(n, b))
	return mat.Norm(r, math.Inf(1)) / (mat.Norm(a, math.Inf(1))*floats.Norm(x, math.Inf(1)) + floats.Norm(b, math.Inf(1)))
}

// TestFactorizeSparseSameBits: FactorizeSparse of a Sparse gives the
// factors, solutions and condition estimate of Factorize of its dense
// copy after SetPattern, bit for bit, in each mode (natural order and
// minimum degree), also along a drifting sequence where the symbolic part
// is reused (constructed check, no source).
func TestFactorizeSparseSameBits(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(12, 21))
	for trial := 0; trial < 40; trial++ {
		n := 2 + rng.IntN(40)
		pattern, a := randomSparse(rng, n, 0.12)
		md := trial%2 == 0
		dense, sparse := &SparseLU{MinDegree: md}, &SparseLU{MinDegree: md}
		dense.SetPattern(n, pattern)
		b := make([]float64, n)
		for i := range b {
			b[i] = rng.NormFloat64()
		}
		for step := 0; step < 5; step++ {
			for i, row := range pattern {
				for _, j := range row {
					a.Set(i, j, a.At(i, j)*(1+0.3*rng.NormFloat64()))
				}
			}
			ed, es := dense.Factorize(a), sparse.FactorizeSparse(sparseOf(pattern, a))
			if (ed == nil) != (es == nil) {
				t.Fatalf("trial %d step %d: dense %v, sparse %v", trial, step, ed, es)
			}
			if ed != nil {
				continue
			}
			xd, xs := make([]float64, n), make([]float64, n)
			_ = dense.Solve(xd, b)
			_ = sparse.Solve(xs, b)
			for i := range xd {
				if math.Float64bits(xd[i]) != math.Float64bits(xs[i]) {
					t.Fatalf("trial %d step %d: x[%d] %v dense, %v sparse", trial, step, i, xd[i], xs[i])
				}
			}
			if math.Float64bits(dense.Cond()) != math.Float64bits(sparse.Cond()) {
				t.Fatalf("trial %d step %d: cond %v dense, %v sparse", trial, step, dense.Cond(), sparse.Cond())
			}
		}
	}
}

// TestRefactorSparse: along seeded sequences of drifting sparse matrices,
// RefactorSparse keeps pivots that a fresh factorisation would change
// (KeptPivots > 0 somewhere), never a multiplier of L above 1/DiagTol in
// magnitude, and its solutions have the backward error of the fresh ones
// (a few ε times the order: LU with threshold pivoting is backward stable
// for bounded growth, Higham 2002 §9.3, from memory; 8nε as in
// TestSparseLUPattern).
func TestRefactorSparse(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(31, 13))
	kept := 0
	for trial := 0; trial < 30; trial++ {
		n := 5 + rng.IntN(40)
		pattern, a := randomSparse(rng, n, 0.15)
		lu := &SparseLU{MinDegree: trial%3 != 0}
		b := make([]float64, n)
		for i := range b {
			b[i] = rng.NormFloat64()
		}
		for step := 0; step < 20; step++ {
			for i, row := range pattern {
				for _, j := range row {
					a.Set(i, j, a.At(i, j)*(1+0.05*rng.NormFloat64()))
				}
			}
			sa := sparseOf(pattern, a)
			var fresh SparseLU
			fresh.MinDegree = lu.MinDegree
			ef := fresh.FactorizeSparse(sa)
			er := lu.RefactorSparse(sa)
			if (ef == nil) != (er == nil) {
				t.Fatalf("trial %d step %d: fresh %v, refactorised %v", trial, step, ef, er)
			}
			if ef != nil {
				continue
			}
			kept += lu.KeptPivots()
			for _, v := range lu.lx {
				if math.Abs(v) > 1/lu.tol()*(1+1e-15) {
					t.Fatalf("trial %d step %d: multiplier %g above 1/DiagTol", trial, step, v)
				}
			}
			xf, xr := make([]float64, n), make([]float64, n)
			_ = fresh.Solve(xf, b)
			_ = lu.Solve(xr, b)
			bound := 8 * float64(n) * 0x1p-52
			if be := backwardError(a, xr, b); !(be <= bound) {
				t.Fatalf("trial %d step %d: backward error %g refactorised (fresh %g), want ≤ %g", trial, step, be, backwardError(a, xf, b), bound)
			}
		}
	}
	if kept == 0 {
		t.Error("no refactorisation kept a pivot that a fresh one would change; the test needs some")
	}
}

// TestRefactorTinyPivot: a kept pivot that falls below DiagTol times the
// largest entry of its column makes RefactorSparse pivot that column
// afresh, and the solution is as accurate as a fresh factorisation's;
// a kept pivot above the threshold stays (constructed matrices: the
// exact solution of [[ε, 1], [1, 1]]·x = [1, 2] is x = [1/(1−ε),
// (1−2ε)/(1−ε)], by hand).
func TestRefactorTinyPivot(t *testing.T) {
	t.Parallel()
	pattern := [][]int{{0, 1}, {0, 1}}
	lu := &SparseLU{}
	// First [[2, 1], [1, 1]]: the diagonal 2 is the pivot of column 0.
	if err := lu.FactorizeSparse(sparseOf(pattern, mat.NewDense(2, 2, []float64{2, 1, 1, 1}))); err != nil {
		t.Fatal(err)
	}
	if lu.piv[0] != 0 {
		t.Fatalf("pivot of step 0 is row %d, want 0", lu.piv[0])
	}
	// 0.5 against 1: a fresh choice prefers the diagonal (0.5 ≥ 0.1·1),
	// and the kept pivot passes too.
	if err := lu.RefactorSparse(sparseOf(pattern, mat.NewDense(2, 2, []float64{0.5, 1, 1, 1}))); err != nil {
		t.Fatal(err)
	}
	if lu.piv[0] != 0 || lu.repivots != 0 {
		t.Errorf("0.5 against 1: pivot row %d, %d re-pivots; want row 0 kept", lu.piv[0], lu.repivots)
	}
	for _, eps := range []float64{1e-3, 1e-12} {
		a := mat.NewDense(2, 2, []float64{eps, 1, 1, 1})
		before := lu.repivots
		if err := lu.RefactorSparse(sparseOf(pattern, a)); err != nil {
			t.Fatal(err)
		}
		// Step 0 takes row 1, so step 1 must take row 0: both re-pivot.
		if lu.piv[0] != 1 || lu.piv[1] != 0 || lu.repivots != before+2 {
			t.Errorf("ε = %g: pivot rows %v after %d re-pivots; want [1 0] after 2", eps, lu.piv, lu.repivots-before)
		}
		x := make([]float64, 2)
		_ = lu.Solve(x, []float64{1, 2})
		want := []float64{1 / (1 - eps), (1 - 2*eps) / (1 - eps)}
		for i := range x {
			if math.Abs(x[i]-want[i]) > 4*0x1p-52*math.Abs(want[i]) {
				t.Errorf("ε = %g: x[%d] = %.17g, want %.17g", eps, i, x[i], want[i])
			}
		}
		// Back to the first matrix for the next ε, by a fresh factorisation.
		if err := lu.FactorizeSparse(sparseOf(pattern, mat.NewDense(2, 2, []float64{2, 1, 1, 1}))); err != nil {
			t.Fatal(err)
		}
	}
}
