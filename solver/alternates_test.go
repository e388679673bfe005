package solver

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// sameFactors fails t unless a and b hold bit for bit the same factors,
// solution of b·x = rhs and condition estimate.
func sameFactors(t *testing.T, what string, a, b *SparseLU, rhs []float64) {
	t.Helper()
	sameInt := func(name string, x, y []int) {
		if len(x) != len(y) {
			t.Fatalf("%s: %s has %d entries, want %d", what, name, len(y), len(x))
		}
		for i := range x {
			if x[i] != y[i] {
				t.Fatalf("%s: %s[%d] %d, want %d", what, name, i, y[i], x[i])
			}
		}
	}
	same := func(name string, x, y []float64) {
		if len(x) != len(y) {
			t.Fatalf("%s: %s has %d entries, want %d", what, name, len(y), len(x))
		}
		for i := range x {
			if math.Float64bits(x[i]) != math.Float64bits(y[i]) {
				t.Fatalf("%s: %s[%d] %v, want %v", what, name, i, y[i], x[i])
			}
		}
	}
	sameInt("pinv", a.pinv, b.pinv)
	sameInt("L rows", a.li, b.li)
	sameInt("U rows", a.ui, b.ui)
	same("L", a.lx, b.lx)
	same("U", a.ux, b.ux)
	xa, xb := make([]float64, len(rhs)), make([]float64, len(rhs))
	if err := a.Solve(xa, rhs); err != nil {
		t.Fatal(err)
	}
	if err := b.Solve(xb, rhs); err != nil {
		t.Fatal(err)
	}
	same("x", xa, xb)
	same("cond", []float64{a.Cond()}, []float64{b.Cond()})
	same("cond bound", []float64{a.CondBound()}, []float64{b.CondBound()})
}

// TestSparseLUAlternates: a SparseLU keeping alternates, given matrices of
// one pattern whose fresh pivots differ in turn (three variants, each with
// other weak diagonals, drifting a little), gives factors, solutions and
// condition figures bit for bit those of a fresh SparseLU for each matrix;
// once each variant has been seen it searches no column's reach again,
// where one without alternates searches at every change; and on a
// sequence of random drifts it agrees with a fresh SparseLU throughout
// (constructed checks, no source).
func TestSparseLUAlternates(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(7, 18))
	const n = 30
	pattern, base := randomSparse(rng, n, 0.12)
	for i := range n {
		base.Set(i, i, 4+rng.Float64())
	}
	// Variant v weakens the diagonal of rows v, v+3, v+6, ...: the fresh
	// rule then takes another pivot in their columns.
	variant := func(v int, drift float64) *mat.Dense {
		a := mat.DenseCopyOf(base)
		for i, row := range pattern {
			for _, j := range row {
				a.Set(i, j, a.At(i, j)*(1+drift*rng.NormFloat64()))
			}
			if i%3 == v && len(row) > 1 {
				a.Set(i, i, 1e-3)
			}
		}
		return a
	}
	rhs := make([]float64, n)
	for i := range rhs {
		rhs[i] = rng.NormFloat64()
	}
	alt := &SparseLU{MinDegree: true, Alternates: 2}
	one := &SparseLU{MinDegree: true}
	alt.SetPattern(n, pattern)
	one.SetPattern(n, pattern)
	var altLate, oneLate int
	for step := 0; step < 30; step++ {
		a := variant(step%3, 1e-4)
		fresh := &SparseLU{MinDegree: true}
		fresh.SetPattern(n, pattern)
		d0, e0 := alt.dfsCols, one.dfsCols
		if err := fresh.Factorize(a); err != nil {
			t.Fatal(err)
		}
		if err := alt.Factorize(a); err != nil {
			t.Fatal(err)
		}
		if err := one.Factorize(a); err != nil {
			t.Fatal(err)
		}
		sameFactors(t, "with alternates", fresh, alt, rhs)
		sameFactors(t, "without", fresh, one, rhs)
		if step >= 3 {
			altLate += alt.dfsCols - d0
			oneLate += one.dfsCols - e0
		}
	}
	t.Logf("searched after the first three: %d with alternates, %d without", altLate, oneLate)
	if altLate != 0 || oneLate == 0 {
		t.Errorf("after the first three: %d columns searched with alternates (want 0), %d without (want some)", altLate, oneLate)
	}

	// Random drift, zeros and large changes, as TestSparseLUReuse.
	drift := &SparseLU{MinDegree: true, Alternates: 3, DiagTol: 0.5}
	drift.SetPattern(n, pattern)
	a := mat.DenseCopyOf(base)
	for step := 0; step < 60; step++ {
		for i, row := range pattern {
			for _, j := range row {
				switch u := rng.Float64(); {
				case u < 0.02:
					a.Set(i, j, 0)
				case u < 0.1:
					a.Set(i, j, rng.NormFloat64())
				default:
					a.Set(i, j, a.At(i, j)*(1+0.01*rng.NormFloat64()))
				}
			}
		}
		fresh := &SparseLU{MinDegree: true, DiagTol: 0.5}
		fresh.SetPattern(n, pattern)
		ef, ed := fresh.Factorize(a), drift.Factorize(a)
		if (ef == nil) != (ed == nil) {
			t.Fatalf("step %d: fresh %v, with alternates %v", step, ef, ed)
		}
		if ef == nil {
			sameFactors(t, "drift", fresh, drift, rhs)
		}
	}
}
