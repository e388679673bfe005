package solver

import (
	"context"
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"runtime"
	"strings"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// TestSparse: Index finds every entry of a seeded random pattern (given
// unsorted, with duplicates) and nothing else, Add, Set and At agree with
// a dense copy, Row and Values are views, Zero clears and DenseTo writes
// the matrix (constructed check, no source).
func TestSparse(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(4, 40))
	for trial := 0; trial < 50; trial++ {
		n := 1 + rng.IntN(30)
		pattern := make([][]int, n)
		in := make([][]bool, n)
		for i := range pattern {
			in[i] = make([]bool, n)
			for range rng.IntN(2 * n) {
				j := rng.IntN(n)
				pattern[i] = append(pattern[i], j)
				in[i][j] = true
			}
		}
		s := NewSparse(n, pattern)
		want := mat.NewDense(n, n, nil)
		nnz := 0
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				p := s.Index(i, j)
				if (p >= 0) != in[i][j] {
					t.Fatalf("trial %d: Index(%d, %d) = %d, in pattern %v", trial, i, j, p, in[i][j])
				}
				if p < 0 {
					continue
				}
				nnz++
				v := rng.NormFloat64()
				if rng.IntN(2) == 0 {
					s.Set(i, j, v)
				} else {
					s.Add(i, j, v)
				}
				s.Add(i, j, 1)
				want.Set(i, j, v+1)
			}
		}
		if s.NNZ() != nnz {
			t.Fatalf("trial %d: NNZ %d, want %d", trial, s.NNZ(), nnz)
		}
		got := mat.NewDense(n, n, nil)
		s.DenseTo(got)
		if !mat.Equal(got, want) {
			t.Fatalf("trial %d: DenseTo differs from the entries written", trial)
		}
		for i := 0; i < n; i++ {
			cols, vals := s.Row(i)
			for k, j := range cols {
				if k > 0 && cols[k-1] >= j {
					t.Fatalf("trial %d: row %d columns %v not ascending", trial, i, cols)
				}
				if vals[k] != s.At(i, j) || s.Values()[s.Index(i, j)] != vals[k] {
					t.Fatalf("trial %d: Row, At and Values disagree at (%d, %d)", trial, i, j)
				}
			}
		}
		s.Zero()
		for _, v := range s.Values() {
			if v != 0 {
				t.Fatalf("trial %d: Zero left %g", trial, v)
			}
		}
	}
}

// TestSparsePanics: writing an entry outside the pattern, or an index
// outside the matrix, panics with a "solver:" message; the Sparse that the
// solver hands to Problem.SparseJacobian names the equation and the
// unknown. A Problem with a SparseJacobian and no Pattern, or with both
// Jacobians, is a programmer's mistake and panics too.
func TestSparsePanics(t *testing.T) {
	t.Parallel()
	catch := func(f func()) (msg string) {
		defer func() {
			if r := recover(); r != nil {
				msg = fmt.Sprint(r)
			}
		}()
		f()
		return ""
	}
	s := NewSparse(2, [][]int{{0}, {0, 1}})
	for _, c := range []struct {
		f    func()
		want string
	}{
		{func() { s.Add(0, 1, 1) }, "solver: Sparse.Add: entry (row 0, column 1) is not in the pattern"},
		{func() { s.Set(0, 1, 1) }, "solver: Sparse.Set: entry (row 0, column 1) is not in the pattern"},
		{func() { s.At(2, 0) }, "solver: Sparse index (2, 0) outside the 2×2 matrix"},
		{func() { NewSparse(2, [][]int{{0}}) }, "solver: NewSparse of order 2 with a pattern of 1 rows"},
		{func() { NewSparse(2, [][]int{{0}, {2}}) }, "solver: NewSparse: row 1 lists column 2"},
	} {
		if got := catch(c.f); !strings.HasPrefix(got, c.want) {
			t.Errorf("panic %q, want %q", got, c.want)
		}
	}
	res := func(r, x []float64) error { r[0], r[1] = x[0]-1, x[1]-2; return nil }
	p := Problem{Dim: 2, Residual: res, Pattern: [][]int{{0}, {1}},
		EqNames:  []string{"drum level", "steam line pressure drop"},
		VarNames: []string{"drum pressure", "steam flow"},
		SparseJacobian: func(j *Sparse, x []float64) error {
			j.Set(0, 0, 1)
			j.Set(1, 0, 1) // not in the pattern
			return nil
		}}
	got := catch(func() { _, _ = Solve(context.Background(), p, []float64{0, 0}, nil) })
	if want := "solver: Sparse.Set: entry (row 1 'steam line pressure drop', column 0 'drum pressure') is not in the pattern"; got != want {
		t.Errorf("panic %q, want %q", got, want)
	}
	if got := catch(func() { _, _ = New(Problem{Dim: 2, Residual: res, SparseJacobian: p.SparseJacobian}, nil) }); got != "solver: Problem.SparseJacobian needs a Pattern" {
		t.Errorf("panic %q", got)
	}
	both := p
	both.Jacobian = func(*mat.Dense, []float64) error { return nil }
	if got := catch(func() { _, _ = New(both, nil) }); got != "solver: Problem has both Jacobian and SparseJacobian, want at most one" {
		t.Errorf("panic %q", got)
	}
}

// TestSparseJacobianSameBits: the sparse analytic Jacobian gives the same
// iterates, counts and residual norms bit for bit as the dense one with a
// Pattern (the same entries, scaled by the same arithmetic, factorised by
// the same SparseLU), with SparseLU, with DenseLU and with a Factorizer
// that takes only dense matrices; a NaN in an entry is named by equation
// and unknown either way (constructed check, no source).
func TestSparseJacobianSameBits(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	nt := newNetwork(6, 5, 2)
	for _, mk := range []func() Factorizer{
		func() Factorizer { return &SparseLU{MinDegree: true} },
		func() Factorizer { return &SparseLU{} },
		func() Factorizer { return NewDenseLU() },
		func() Factorizer { return denseOnly{NewDenseLU()} },
	} {
		for _, scaled := range []bool{true, false} {
			var runs [2]*Result
			for k, sparse := range []bool{false, true} {
				sv, err := New(nt.problem(scaled, sparse), &Settings{Factorizer: mk()})
				if err != nil {
					t.Fatal(err)
				}
				x := append([]float64(nil), nt.x0...)
				var last Result
				for step := 0; step < 5; step++ {
					nt.setLoad(step)
					res, err := sv.Solve(ctx, x)
					if err != nil {
						t.Fatalf("%T sparse=%v step %d: %v", mk(), sparse, step, err)
					}
					copy(x, res.X)
					last = *res
					last.X = append([]float64(nil), res.X...)
				}
				runs[k] = &last
			}
			a, b := runs[0], runs[1]
			if a.Stats.Iterations != b.Stats.Iterations || a.Stats.ResidualEvals != b.Stats.ResidualEvals || a.Stats.Reuses != b.Stats.Reuses ||
				math.Float64bits(a.ResidualNorm) != math.Float64bits(b.ResidualNorm) {
				t.Errorf("%T scaled=%v: dense %+v, sparse %+v", mk(), scaled, a.Stats, b.Stats)
			}
			for j := range a.X {
				if math.Float64bits(a.X[j]) != math.Float64bits(b.X[j]) {
					t.Fatalf("%T scaled=%v: x[%d] %v dense, %v sparse", mk(), scaled, j, a.X[j], b.X[j])
				}
			}
		}
	}
	// A NaN: named the same way.
	p := nt.problem(true, true)
	inner := p.SparseJacobian
	p.SparseJacobian = func(j *Sparse, x []float64) error {
		if err := inner(j, x); err != nil {
			return err
		}
		j.Set(nt.eqOf[3], nt.unkOf[nt.nodes+3], math.NaN())
		return nil
	}
	p.EqNames, p.VarNames = make([]string, nt.n), make([]string, nt.n)
	p.EqNames[nt.eqOf[3]], p.VarNames[nt.unkOf[nt.nodes+3]] = "pipe 3 pressure drop", "pipe 3 flow"
	res, err := Solve(ctx, p, nt.x0, nil)
	var ne *NumberError
	if res.Status != BadNumber || !errors.As(err, &ne) || ne.Equation != "pipe 3 pressure drop" || ne.Unknown != "pipe 3 flow" {
		t.Errorf("NaN: status %v, error %v; want BadNumber naming the pipe's equation and flow", res.Status, err)
	}
}

// denseOnly is a Factorizer that takes only dense matrices (not a
// SparseFactorizer), so the solver hands it a dense copy.
type denseOnly struct{ lu *DenseLU }

func (d denseOnly) Factorize(j *mat.Dense) error { return d.lu.Factorize(j) }
func (d denseOnly) Cond() float64                { return d.lu.Cond() }
func (d denseOnly) Solve(dst, b []float64) error { return d.lu.Solve(dst, b) }

// TestJacobianSparse: Solver.JacobianSparse gives the entries of
// Solver.Jacobian on the pattern, analytic and by differences, for the
// sparse and the dense analytic Jacobian; the differences agree with the
// analytic entries to 1e-6 of the row's largest (the tolerance of
// TestFiniteDifferenceJacobian: common practice, no source).
func TestJacobianSparse(t *testing.T) {
	t.Parallel()
	nt := newNetwork(4, 3, 5)
	rng := rand.New(rand.NewPCG(6, 6))
	x := append([]float64(nil), nt.x0...)
	for v := 0; v < nt.nodes; v++ {
		x[nt.unkOf[v]] -= 1e4 * rng.Float64()
	}
	for e := 0; e < nt.pipes; e++ {
		x[nt.unkOf[nt.nodes+e]] = 2*rng.Float64() - 1
	}
	for _, sparse := range []bool{true, false} {
		sv, err := New(nt.problem(true, sparse), nil)
		if err != nil {
			t.Fatal(err)
		}
		for _, analytic := range []bool{true, false} {
			d := mat.NewDense(nt.n, nt.n, nil)
			if err := sv.Jacobian(d, x, analytic); err != nil {
				t.Fatal(err)
			}
			s := NewSparse(nt.n, nt.pattern)
			if err := sv.JacobianSparse(s, x, analytic); err != nil {
				t.Fatal(err)
			}
			check := mat.NewDense(nt.n, nt.n, nil)
			s.DenseTo(check)
			if !mat.Equal(check, d) {
				t.Errorf("sparse=%v analytic=%v: JacobianSparse differs from Jacobian", sparse, analytic)
			}
		}
		a, f := NewSparse(nt.n, nt.pattern), NewSparse(nt.n, nt.pattern)
		if err := sv.JacobianSparse(a, x, true); err != nil {
			t.Fatal(err)
		}
		if err := sv.JacobianSparse(f, x, false); err != nil {
			t.Fatal(err)
		}
		for i := 0; i < nt.n; i++ {
			_, av := a.Row(i)
			_, fv := f.Row(i)
			big := 0.0
			for _, v := range av {
				big = math.Max(big, math.Abs(v))
			}
			for k := range av {
				if math.Abs(av[k]-fv[k]) > 1e-6*big {
					t.Errorf("sparse=%v: row %d entry %d analytic %g, differences %g", sparse, i, k, av[k], fv[k])
				}
			}
		}
	}
}

// TestNoSquareStorage: New and the first Solve of the 2025-unknown Bratu
// system (nine nonzeros a row) with a SparseJacobian allocate far less
// than one dense matrix of its order: the Jacobian, its factors and the
// column order are O(nonzeros + fill) (constructed check, no source;
// BenchmarkFirstSolve reports the bytes).
func TestNoSquareStorage(t *testing.T) {
	b := newBratu(45, 1)
	dense := uint64(b.n * b.n * 8)
	var before, after runtime.MemStats
	runtime.GC()
	runtime.ReadMemStats(&before)
	sv, err := New(b.problem(true), nil)
	if err != nil {
		t.Fatal(err)
	}
	res, err := sv.Solve(context.Background(), b.x0)
	runtime.ReadMemStats(&after)
	if err != nil {
		t.Fatal(err)
	}
	got := after.TotalAlloc - before.TotalAlloc
	t.Logf("order %d: %d iterations, %.1f MB allocated; one dense matrix is %.1f MB", b.n, res.Stats.Iterations, float64(got)/1e6, float64(dense)/1e6)
	if got > dense/2 {
		t.Errorf("New and the first Solve allocated %d bytes, want well below one dense matrix (%d bytes)", got, dense)
	}
}

// TestRegularizePattern: the Levenberg–Marquardt step on the pattern of
// J̃ᵀJ̃ (a Problem with a Pattern) carries the square law through zero
// flow as the dense one does (TestSquareLawThroughZero, forward
// differences, whose step gives the flow a slope at zero): m = 2 kg/s
// after one regularised step (root by inspection), the same answer with
// and without the Pattern to 1e-12.
func TestRegularizePattern(t *testing.T) {
	t.Parallel()
	var xs [2][]float64
	for k, pattern := range [][][]int{nil, {{0, 1}, {1}}} {
		p := Problem{Dim: 2, XScale: []float64{1, 1e5}, FScale: []float64{1e5, 1e5}, Pattern: pattern,
			Residual: func(r, x []float64) error {
				m, p1 := x[0], x[1]
				r[0] = p1 - 1e5 - 5e4*m*math.Abs(m)
				r[1] = p1 - 3e5
				return nil
			}}
		res, err := Solve(context.Background(), p, []float64{0, 3e5}, &Settings{Regularize: true})
		if err != nil || math.Abs(res.X[0]-2) > 1e-9 || res.RegularizedSteps != 1 {
			t.Errorf("pattern %v: status %v, error %v, x = %v, %d regularised steps; want m = 2 kg/s after 1", pattern, res.Status, err, res.X, res.RegularizedSteps)
		}
		xs[k] = append([]float64(nil), res.X...)
	}
	if math.Abs(xs[0][0]-xs[1][0]) > 1e-12 {
		t.Errorf("flow %v without the pattern, %v with it", xs[0][0], xs[1][0])
	}
}

// TestSingularLarge: above order 1000 a singular Jacobian with a Pattern
// is not decomposed (a dense SVD would be Dim² in memory and Dim³ in
// time); the error still names the unknown that appears in no equation,
// and says that it named no more (constructed case, no source).
func TestSingularLarge(t *testing.T) {
	t.Parallel()
	const n = 1200
	pattern := make([][]int, n)
	for i := range pattern {
		pattern[i] = []int{i}
	}
	names := make([]string, n)
	names[700] = "idle pump flow"
	p := Problem{Dim: n, Pattern: pattern, VarNames: names,
		Residual: func(r, x []float64) error {
			for i := range r {
				r[i] = x[i] - 1
			}
			r[700] = 1 // depends on nothing here
			return nil
		},
		SparseJacobian: func(j *Sparse, x []float64) error {
			for i := 0; i < n; i++ {
				if i != 700 {
					j.Set(i, i, 1)
				}
			}
			return nil
		}}
	res, err := Solve(context.Background(), p, make([]float64, n), nil)
	var se *SingularError
	if res.Status != SingularJacobian || !errors.As(err, &se) || !se.NotDecomposed ||
		len(se.ZeroUnknowns) != 1 || se.ZeroUnknowns[0] != "idle pump flow" ||
		!strings.Contains(err.Error(), "too large for the decomposition") {
		t.Errorf("status %v, error %v; want SingularJacobian naming 'idle pump flow', not decomposed", res.Status, err)
	}
}
