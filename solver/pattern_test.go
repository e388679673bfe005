package solver

import (
	"context"
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"gonum.org/v1/gonum/floats"
	"gonum.org/v1/gonum/mat"
)

// TestPatternSameBits solves the banded MGH 1981 systems (Broyden
// tridiagonal (30), Broyden banded (31), discrete boundary value (28))
// with their analytic Jacobians, DenseLU and SparseLU, three ways: without
// a Pattern (every entry read, the dense gradient, the full scan in
// SparseLU, the condition estimate at every iteration), with a Pattern
// (only its entries read; SparseLU told the pattern; the condition bound
// in place of the estimate where it proves the limit) and with a Pattern
// and VerifyPattern. The arithmetic on the pattern's entries is the same
// and the entries outside are zero in all three, so the iterates, counts
// and residual norms must agree bit for bit (constructed check, no
// source).
func TestPatternSameBits(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	for _, m := range []mghProblem{broydenTridiagonal(60), broydenBanded(60), discreteBVP(40)} {
		for _, sparse := range []bool{false, true} {
			type run struct {
				name string
				res  Result
				x    []float64
				path [][]float64 // the iterates, from a Recorder
			}
			var runs []run
			for _, way := range []string{"no pattern", "pattern", "pattern, verified", "pattern, recorded"} {
				p := m.problem(true)
				set := &Settings{VerifyPattern: way == "pattern, verified"}
				if way == "no pattern" {
					p.Pattern = nil
				}
				if sparse {
					set.Factorizer = &SparseLU{}
				}
				var path [][]float64
				if way == "pattern, recorded" {
					set.Recorder = recordFunc(func(it Iteration) error {
						path = append(path, append([]float64(nil), it.X...))
						return nil
					})
				}
				sv, err := New(p, set)
				if err != nil {
					t.Fatal(err)
				}
				res, err := sv.Solve(ctx, m.x0)
				if err != nil {
					t.Fatalf("%s, %s: %v", m.name, way, err)
				}
				runs = append(runs, run{way, *res, append([]float64(nil), res.X...), path})
			}
			ref := runs[0]
			for _, r := range runs[1:] {
				if r.res.Stats.Iterations != ref.res.Stats.Iterations || r.res.Stats.ResidualEvals != ref.res.Stats.ResidualEvals ||
					math.Float64bits(r.res.ResidualNorm) != math.Float64bits(ref.res.ResidualNorm) {
					t.Errorf("%s sparse=%v: %s took %d iterations, %d residuals, norm %g; %s %d, %d, %g", m.name, sparse,
						r.name, r.res.Stats.Iterations, r.res.Stats.ResidualEvals, r.res.ResidualNorm,
						ref.name, ref.res.Stats.Iterations, ref.res.Stats.ResidualEvals, ref.res.ResidualNorm)
				}
				for j := range r.x {
					if math.Float64bits(r.x[j]) != math.Float64bits(ref.x[j]) {
						t.Errorf("%s sparse=%v: %s x[%d] = %v, %s %v", m.name, sparse, r.name, j, r.x[j], ref.name, ref.x[j])
						break
					}
				}
			}
			// The Recorder sees every step: the Newton iterations and the
			// steps that reused a factorisation.
			if want := ref.res.Stats.Iterations + ref.res.Stats.Reuses; len(runs[3].path) != want {
				t.Errorf("%s: %d steps recorded, want %d", m.name, len(runs[3].path), want)
			}
		}
	}
}

type recordFunc func(Iteration) error

func (f recordFunc) Record(it Iteration) error { return f(it) }

// TestPatternBadNumbers: with a Pattern, a NaN or Inf in one of its entries
// is still reported by equation and unknown; one outside it is reported
// when VerifyPattern is set (constructed case, no source).
func TestPatternBadNumbers(t *testing.T) {
	t.Parallel()
	names := []string{"drum pressure", "steam flow"}
	eqs := []string{"drum mass balance", "steam line pressure drop"}
	for _, c := range []struct {
		name          string
		row, col      int
		v             float64
		verify        bool
		wantEq, wantX string
	}{
		{"NaN in the pattern", 1, 1, math.NaN(), false, eqs[1], names[1]},
		{"Inf in the pattern", 0, 0, math.Inf(-1), false, eqs[0], names[0]},
		{"NaN in the pattern, verified", 1, 1, math.NaN(), true, eqs[1], names[1]},
		{"NaN outside the pattern, verified", 0, 1, math.NaN(), true, eqs[0], names[1]},
	} {
		for _, fact := range []Factorizer{nil, &SparseLU{}} {
			p := Problem{Dim: 2, VarNames: names, EqNames: eqs, Pattern: [][]int{{0}, {1}},
				Residual: func(r, x []float64) error { r[0], r[1] = x[0]-3, x[1]-1; return nil },
				Jacobian: func(j *mat.Dense, x []float64) error {
					j.Set(0, 0, 1)
					j.Set(1, 1, 1)
					j.Set(c.row, c.col, c.v)
					return nil
				}}
			res, err := Solve(context.Background(), p, []float64{0, 0}, &Settings{VerifyPattern: c.verify, Factorizer: fact})
			var ne *NumberError
			if res.Status != BadNumber || !errors.As(err, &ne) || ne.Equation != c.wantEq || ne.Unknown != c.wantX {
				t.Errorf("%s, %T: status %v, error %v; want BadNumber naming %q and %q", c.name, fact, res.Status, err, c.wantEq, c.wantX)
			} else if !strings.Contains(err.Error(), "'"+c.wantEq+"'") || !strings.Contains(err.Error(), "'"+c.wantX+"'") {
				t.Errorf("%s: message %q", c.name, err)
			}
		}
	}
}

// TestPatternModelZeroed: with a Pattern, the matrix the model writes
// into has its pattern entries zeroed before each call, so a model that
// adds its terms (j.Set(i, k, j.At(i, k)+d)) gets the same answer as one
// that sets them (constructed case, no source).
func TestPatternModelZeroed(t *testing.T) {
	t.Parallel()
	m := broydenTridiagonal(20)
	set := m.problem(true)
	add := m.problem(true)
	tmp := mat.NewDense(20, 20, nil)
	add.Jacobian = func(j *mat.Dense, x []float64) error {
		m.jac(tmp, x)
		for i, row := range m.pattern {
			for _, k := range row {
				j.Set(i, k, j.At(i, k)+tmp.At(i, k))
			}
		}
		return nil
	}
	a, err := Solve(context.Background(), set, m.x0, nil)
	if err != nil {
		t.Fatal(err)
	}
	b, err := Solve(context.Background(), add, m.x0, nil)
	if err != nil {
		t.Fatal(err)
	}
	for i := range a.X {
		if a.X[i] != b.X[i] || a.Stats.Iterations != b.Stats.Iterations {
			t.Fatalf("x[%d]: %v setting, %v adding", i, a.X[i], b.X[i])
		}
	}
}

// TestSparseLUPattern: SparseLU told a pattern that covers the nonzeros
// of seeded random matrices (with extra entries that are zero, and
// duplicates) gives the same factors as the full scan in the same column
// order, bit for bit, and a solution with a backward error of a few ε
// (LU with partial pivoting is backward stable for small growth: Higham,
// Accuracy and Stability of Numerical Algorithms, 2nd ed., SIAM 2002,
// §9.3, from memory); an entry left out of the pattern is taken as zero
// (constructed check, no source).
func TestSparseLUPattern(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(8, 13))
	for trial := 0; trial < 100; trial++ {
		n := 2 + rng.IntN(30)
		a := mat.NewDense(n, n, nil)
		pattern := make([][]int, n)
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				if rng.Float64() < 0.15 {
					a.Set(i, j, rng.NormFloat64())
					pattern[i] = append(pattern[i], j)
				}
			}
			a.Set(i, i, 2+rng.Float64())
			pattern[i] = append(pattern[i], i, i) // a duplicate
			pattern[i] = append(pattern[i], rng.IntN(n))
			rng.Shuffle(len(pattern[i]), func(x, y int) { pattern[i][x], pattern[i][y] = pattern[i][y], pattern[i][x] })
		}
		b := make([]float64, n)
		for i := range b {
			b[i] = rng.NormFloat64()
		}
		var full, pat SparseLU
		pat.MinDegree = trial%2 == 1
		pat.SetPattern(n, pattern)
		full.q = pat.q // the column order SetPattern chose, if any
		ef, ep := full.Factorize(a), pat.Factorize(a)
		if (ef == nil) != (ep == nil) {
			t.Fatalf("trial %d: full %v, pattern %v", trial, ef, ep)
		}
		if ef != nil {
			continue
		}
		xf, xp := make([]float64, n), make([]float64, n)
		_ = full.Solve(xf, b)
		_ = pat.Solve(xp, b)
		for i := range xf {
			if math.Float64bits(xf[i]) != math.Float64bits(xp[i]) {
				t.Fatalf("trial %d: x[%d] %v full scan, %v with pattern", trial, i, xf[i], xp[i])
			}
		}
		r := mat.NewVecDense(n, nil)
		r.MulVec(a, mat.NewVecDense(n, xp))
		r.SubVec(r, mat.NewVecDense(n, b))
		scale := mat.Norm(a, math.Inf(1))*floats.Norm(xp, math.Inf(1)) + floats.Norm(b, math.Inf(1))
		if be := mat.Norm(r, math.Inf(1)) / scale; !(be <= 8*float64(n)*0x1p-52) {
			t.Errorf("trial %d: backward error %g of the solution with pattern", trial, be)
		}
		if math.Float64bits(full.Cond()) != math.Float64bits(pat.Cond()) {
			t.Errorf("trial %d: cond %v full scan, %v with pattern", trial, full.Cond(), pat.Cond())
		}
	}
	// Left out: A = [[1 5] [0 1]] with pattern {{0}, {1}} factorises the
	// identity.
	var s SparseLU
	s.SetPattern(2, [][]int{{0}, {1}})
	if err := s.Factorize(mat.NewDense(2, 2, []float64{1, 5, 0, 1})); err != nil {
		t.Fatal(err)
	}
	x := make([]float64, 2)
	_ = s.Solve(x, []float64{1, 1})
	if x[0] != 1 || x[1] != 1 {
		t.Errorf("x = %v, want [1 1] (the entry outside the pattern ignored)", x)
	}
}

// TestSparseLUCondBound: the bound is never below the 1-norm condition
// number ‖A‖₁‖A⁻¹‖₁ computed from gonum's inverse, nor below the Hager–
// Higham estimate, on seeded random sparse matrices and on the upper
// triangular matrix with 1 on the diagonal and −1 above it, whose
// condition number grows like n·2ⁿ⁻¹ and which pivoting leaves alone
// (Higham, Accuracy and Stability of Numerical Algorithms, 2002, §8.2,
// from memory); +Inf for a singular matrix.
func TestSparseLUCondBound(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(5, 21))
	var mats []*mat.Dense
	for trial := 0; trial < 150; trial++ {
		n := 1 + rng.IntN(30)
		a := mat.NewDense(n, n, nil)
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				if rng.Float64() < 0.2 {
					a.Set(i, j, rng.NormFloat64())
				}
			}
			a.Set(i, rng.IntN(n), 1+rng.Float64())
			a.Set(rng.IntN(n), i, 1+rng.Float64())
		}
		mats = append(mats, a)
	}
	for _, n := range []int{5, 20, 40} {
		a := mat.NewDense(n, n, nil)
		for i := 0; i < n; i++ {
			a.Set(i, i, 1)
			for j := i + 1; j < n; j++ {
				a.Set(i, j, -1)
			}
		}
		mats = append(mats, a)
	}
	checked := 0
	for k, a := range mats {
		var s SparseLU
		if err := s.Factorize(a); err != nil {
			if !math.IsInf(s.CondBound(), 1) {
				t.Errorf("matrix %d: singular, bound %g", k, s.CondBound())
			}
			continue
		}
		var inv mat.Dense
		if err := inv.Inverse(a); err != nil {
			continue // too close to singular for a reliable reference
		}
		kappa := mat.Norm(a, 1) * mat.Norm(&inv, 1)
		if kappa > 1e12 {
			continue
		}
		checked++
		if b := s.CondBound(); !(b >= kappa*(1-1e-12)) || !(b >= s.Cond()) {
			t.Errorf("matrix %d: bound %g, condition %g, estimate %g", k, b, kappa, s.Cond())
		}
	}
	if checked < 100 {
		t.Errorf("only %d matrices checked", checked)
	}
	var s SparseLU
	_ = s.Factorize(mat.NewDense(2, 2, []float64{1, 2, 2, 4}))
	if !math.IsInf(s.CondBound(), 1) {
		t.Errorf("singular: bound %g", s.CondBound())
	}
}

// TestPatternSingular: with a Pattern and an analytic Jacobian, an exactly
// singular and a nearly singular Jacobian (condition about 4e15, above the
// default MaxCondition 1e14) still stop the solve with SingularJacobian
// naming the dependent equations, with either factorisation: the cheap
// condition bound is at least the condition number, so it never passes a
// Jacobian the estimate would stop (constructed case, no source).
func TestPatternSingular(t *testing.T) {
	t.Parallel()
	names := []string{"drum pressure", "steam flow", "feed temperature"}
	eqs := []string{"boiler energy balance", "drum mass balance", "feed heater duty"}
	for _, eps := range []float64{0, 1e-15} {
		for _, fact := range []Factorizer{nil, &SparseLU{}} {
			p := Problem{Dim: 3, VarNames: names, EqNames: eqs,
				Pattern: [][]int{{0, 1}, {0, 1}, {2}},
				Residual: func(r, x []float64) error {
					r[0] = x[0] + x[1] - 2
					r[1] = x[0] + (1+eps)*x[1] - 2
					r[2] = x[2] - 3
					return nil
				},
				Jacobian: func(j *mat.Dense, x []float64) error {
					j.Set(0, 0, 1)
					j.Set(0, 1, 1)
					j.Set(1, 0, 1)
					j.Set(1, 1, 1+eps)
					j.Set(2, 2, 1)
					return nil
				}}
			res, err := Solve(context.Background(), p, []float64{0.5, 0.5, 0.5}, &Settings{Factorizer: fact})
			var se *SingularError
			if res.Status != SingularJacobian || !errors.As(err, &se) {
				t.Fatalf("eps %g, %T: status %v, error %v; want SingularJacobian", eps, fact, res.Status, err)
			}
			if len(se.Equations) != 2 || se.Equations[0] != eqs[0] || se.Equations[1] != eqs[1] {
				t.Errorf("eps %g, %T: equations %q, want the first two", eps, fact, se.Equations)
			}
			if !(se.Cond > 1e14) {
				t.Errorf("eps %g, %T: reported condition %g, want above 1e14", eps, fact, se.Cond)
			}
		}
	}
}

// TestInfNorm: infNorm agrees with gonum's floats.Norm(v, +Inf), NaN
// included (constructed values, no source).
func TestInfNorm(t *testing.T) {
	t.Parallel()
	nan, inf := math.NaN(), math.Inf(1)
	for _, v := range [][]float64{nil, {0}, {math.Copysign(0, -1)}, {-3, 2}, {1, -inf, 2}, {1, nan, 2}, {nan}, {inf, nan}, {nan, -inf}, {nan, 1}, {-1e308, 5}} {
		got, want := infNorm(v), floats.Norm(v, math.Inf(1))
		if math.Float64bits(got) != math.Float64bits(want) && !(math.IsNaN(got) && math.IsNaN(want)) {
			t.Errorf("infNorm(%v) = %v, floats.Norm %v", v, got, want)
		}
	}
}

// TestSparseLUReuse: a SparseLU that factorises a sequence of matrices
// (one structure with drifting values, so that pivots change now and
// then, entries that become zero, a change of order) gives factors,
// solutions and condition estimates bit for bit equal to a fresh SparseLU
// for each matrix, without a pattern, with one, and with one and
// MinDegree: reusing the symbolic part
// of the last factorisation changes nothing (constructed check, no
// source).
func TestSparseLUReuse(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(34, 55))
	for _, mode := range []string{"full scan", "pattern", "pattern, minimum degree"} {
		usePattern := mode != "full scan"
		var reused SparseLU
		reused.DiagTol = 0.5 // pivots change more often
		reused.MinDegree = mode == "pattern, minimum degree"
		reuses := 0
		for _, n := range []int{25, 25, 12} {
			pattern := make([][]int, n)
			for i := 0; i < n; i++ {
				pattern[i] = append(pattern[i], i)
				for j := 0; j < n; j++ {
					if j != i && rng.Float64() < 0.15 {
						pattern[i] = append(pattern[i], j)
					}
				}
			}
			if usePattern {
				reused.SetPattern(n, pattern)
			} else {
				reused.SetPattern(n, nil)
			}
			a := mat.NewDense(n, n, nil)
			for i, row := range pattern {
				for _, j := range row {
					a.Set(i, j, rng.NormFloat64())
				}
			}
			b := make([]float64, n)
			for i := range b {
				b[i] = rng.NormFloat64()
			}
			for step := 0; step < 40; step++ {
				// Drift: small changes mostly, a large one or a zero now and then.
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
				searched := reused.dfsCols
				var fresh SparseLU
				fresh.DiagTol = reused.DiagTol
				fresh.MinDegree = reused.MinDegree
				if usePattern {
					fresh.SetPattern(n, pattern)
				}
				ef, er := fresh.Factorize(a), reused.Factorize(a)
				if (ef == nil) != (er == nil) {
					t.Fatalf("n=%d step %d: fresh %v, reused %v", n, step, ef, er)
				}
				if ef != nil {
					continue
				}
				if reused.dfsCols-searched < n {
					reuses++ // some column's reach was reused
				}
				same := func(what string, x, y []float64) {
					if len(x) != len(y) {
						t.Fatalf("n=%d step %d: %s has %d entries fresh, %d reused", n, step, what, len(x), len(y))
					}
					for i := range x {
						if math.Float64bits(x[i]) != math.Float64bits(y[i]) {
							t.Fatalf("n=%d step %d: %s[%d] %v fresh, %v reused", n, step, what, i, x[i], y[i])
						}
					}
				}
				sameInt := func(what string, x, y []int) {
					if len(x) != len(y) {
						t.Fatalf("n=%d step %d: %s has %d entries fresh, %d reused", n, step, what, len(x), len(y))
					}
					for i := range x {
						if x[i] != y[i] {
							t.Fatalf("n=%d step %d: %s[%d] %d fresh, %d reused", n, step, what, i, x[i], y[i])
						}
					}
				}
				sameInt("pinv", fresh.pinv, reused.pinv)
				sameInt("L rows", fresh.li, reused.li)
				sameInt("U rows", fresh.ui, reused.ui)
				same("L", fresh.lx, reused.lx)
				same("U", fresh.ux, reused.ux)
				xf, xr := make([]float64, n), make([]float64, n)
				_ = fresh.Solve(xf, b)
				_ = reused.Solve(xr, b)
				same("x", xf, xr)
				same("cond", []float64{fresh.Cond()}, []float64{reused.Cond()})
			}
		}
		// With this seed, of the 120 factorisations: 34 full scan, 80
		// pattern, 67 minimum degree (where the first column is more often
		// one whose pivot changes). The bounds make sure each path is
		// exercised.
		want := map[string]int{"full scan": 25, "pattern": 60, "pattern, minimum degree": 50}[mode]
		if reuses < want {
			t.Errorf("%s: the symbolic part was reusable in only %d factorisations, want at least %d", mode, reuses, want)
		}
	}
}

// TestSparseLUPatternZeros: with a pattern, entries of the pattern that
// are zero in some matrices of a sequence and not in others (a line
// without flow) keep the structure: the reach of each column is searched
// once, in the first factorisation, and reused in all later ones while
// the pivots stay on the diagonal (A's diagonal, whatever the column
// order). The factors, solutions, condition
// estimates and bounds are those of the full scan in the same column
// order, which drops the zeros and searches again, bit for bit except for
// the explicit zeros stored (constructed check, no source).
func TestSparseLUPatternZeros(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(21, 8))
	const n = 40
	pattern := make([][]int, n)
	for i := range pattern {
		pattern[i] = append(pattern[i], i)
		for j := 0; j < n; j++ {
			if j != i && rng.Float64() < 0.1 {
				pattern[i] = append(pattern[i], j)
			}
		}
	}
	base := mat.NewDense(n, n, nil)
	for i, row := range pattern {
		for _, j := range row {
			base.Set(i, j, rng.NormFloat64())
		}
		base.Set(i, i, 2+math.Abs(base.At(i, i)))
	}
	var pat, scan SparseLU
	pat.MinDegree = true
	pat.SetPattern(n, pattern)
	a := mat.NewDense(n, n, nil)
	b := make([]float64, n)
	for i := range b {
		b[i] = rng.NormFloat64()
	}
	zeros := 0
	const steps = 30
	for step := 0; step < steps; step++ {
		a.Copy(base)
		for i, row := range pattern {
			for _, j := range row {
				if j != i && rng.Float64() < 0.2 {
					a.Set(i, j, 0)
					zeros++
				} else {
					a.Set(i, j, a.At(i, j)*(1+1e-3*rng.NormFloat64()))
				}
			}
		}
		scan.q = pat.q // the same column order
		if err := pat.Factorize(a); err != nil {
			t.Fatalf("step %d: pattern: %v", step, err)
		}
		if err := scan.Factorize(a); err != nil {
			t.Fatalf("step %d: full scan: %v", step, err)
		}
		for k := 0; k < n; k++ {
			if pat.piv[k] != pat.q[k] || scan.piv[k] != pat.q[k] {
				t.Fatalf("step %d: pivot of step %d is row %d with the pattern, %d without; the matrix was built for diagonal pivots", step, k, pat.piv[k], scan.piv[k])
			}
		}
		dense := func(s *SparseLU) (l, u *mat.Dense) {
			l, u = mat.NewDense(n, n, nil), mat.NewDense(n, n, nil)
			for j := 0; j < n; j++ {
				for p := s.lp[j]; p < s.lp[j+1]; p++ {
					l.Set(s.li[p], j, s.lx[p])
				}
				for p := s.up[j]; p < s.up[j+1]; p++ {
					u.Set(s.ui[p], j, s.ux[p])
				}
			}
			return l, u
		}
		lp, up := dense(&pat)
		ls, us := dense(&scan)
		for _, c := range []struct {
			name string
			x, y *mat.Dense
		}{{"L", lp, ls}, {"U", up, us}} {
			for i := 0; i < n; i++ {
				for j := 0; j < n; j++ {
					if x, y := c.x.At(i, j), c.y.At(i, j); math.Float64bits(x) != math.Float64bits(y) && !(x == 0 && y == 0) {
						t.Fatalf("step %d: %s(%d,%d) = %v with the pattern, %v without", step, c.name, i, j, x, y)
					}
				}
			}
		}
		xp, xs := make([]float64, n), make([]float64, n)
		_ = pat.Solve(xp, b)
		_ = scan.Solve(xs, b)
		for i := range xp {
			if math.Float64bits(xp[i]) != math.Float64bits(xs[i]) {
				t.Fatalf("step %d: x[%d] = %v with the pattern, %v without", step, i, xp[i], xs[i])
			}
		}
		if cp, cs := pat.Cond(), scan.Cond(); math.Float64bits(cp) != math.Float64bits(cs) {
			t.Fatalf("step %d: Cond %v with the pattern, %v without", step, cp, cs)
		}
		if cp, cs := pat.CondBound(), scan.CondBound(); math.Float64bits(cp) != math.Float64bits(cs) {
			t.Fatalf("step %d: CondBound %v with the pattern, %v without", step, cp, cs)
		}
	}
	if zeros < steps*n/10 {
		t.Fatalf("only %d entries set to zero in %d steps; the check needs many", zeros, steps)
	}
	if pat.dfsCols != n {
		t.Errorf("with the pattern the reach was searched for %d columns in %d factorisations, want %d (the first only)", pat.dfsCols, steps, n)
	}
	if scan.dfsCols <= 2*n {
		t.Errorf("without the pattern the reach was searched for only %d columns in %d factorisations; the zeros should change the structure", scan.dfsCols, steps)
	}
}

// TestMinDegreeOrder: the order is a permutation, and on a tridiagonal
// matrix with its unknowns and equations numbered at random (a seeded
// symmetric permutation), where the natural order fills in, the factors
// in the minimum degree order have almost no fill, as for the
// unpermuted band (constructed check, no source; minimum degree
// finds orders without fill for such path graphs: George and Liu,
// Computer Solution of Large Sparse Positive Definite Systems, 1981, from
// memory).
func TestMinDegreeOrder(t *testing.T) {
	t.Parallel()
	const n = 80
	rng := rand.New(rand.NewPCG(5, 17))
	perm := rng.Perm(n)
	pattern := make([][]int, n)
	a := mat.NewDense(n, n, nil)
	for i := 0; i < n; i++ {
		for j := i - 1; j <= i+1; j++ {
			if j < 0 || j >= n {
				continue
			}
			v := -1.0
			if j == i {
				v = 4
			}
			pattern[perm[i]] = append(pattern[perm[i]], perm[j])
			a.Set(perm[i], perm[j], v)
		}
	}
	s := SparseLU{MinDegree: true}
	s.SetPattern(n, pattern)
	seen := make([]bool, n)
	for _, j := range s.q {
		if j < 0 || j >= n || seen[j] {
			t.Fatalf("order %v is not a permutation of 0..%d", s.q, n-1)
		}
		seen[j] = true
	}
	if err := s.Factorize(a); err != nil {
		t.Fatal(err)
	}
	var natural SparseLU
	if err := natural.Factorize(a); err != nil {
		t.Fatal(err)
	}
	got, nat := len(s.li)+len(s.ui), len(natural.li)+len(natural.ui)
	t.Logf("entries in L and U: %d in the minimum degree order, %d in the natural order", got, nat)
	// Without fill: n−1 entries below and n−1 above the diagonal, and the
	// two diagonals (L's ones are stored), 4n−2; allow n/8 of fill.
	if want := 4*n - 2 + n/8; got > want || got >= nat {
		t.Errorf("%d entries in L and U in the minimum degree order, want at most %d and fewer than the natural order's %d", got, want, nat)
	}
}
