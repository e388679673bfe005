package solver

import (
	"errors"
	"math"
	"sort"

	"gonum.org/v1/gonum/mat"
)

// sqrtEps is the relative finite-difference step, √ε for double precision.
const sqrtEps = 0x1p-26

// coloring groups the columns of a sparse Jacobian so that no two columns
// in a group share a row (Curtis, Powell and Reid 1974). colRows[j] lists
// the rows whose pattern contains column j.
type coloring struct {
	groups  [][]int // groups[c] lists the columns of colour c
	colRows [][]int
}

// colorColumns colours the column intersection graph of pattern (n
// columns) greedily, taking columns in order of decreasing degree
// (largest first, Welsh and Powell 1967) and giving each the smallest colour
// none of its neighbours has.
func colorColumns(pattern [][]int, n int) *coloring {
	// Rows of each column, without duplicates.
	colRows := make([][]int, n)
	for i, row := range pattern {
		for _, j := range row {
			if k := len(colRows[j]); k > 0 && colRows[j][k-1] == i {
				continue // duplicate entry in row i
			}
			colRows[j] = append(colRows[j], i)
		}
	}
	// Degree of each column in the intersection graph.
	stamp := make([]int, n)
	for j := range stamp {
		stamp[j] = -1
	}
	degree := make([]int, n)
	for j := 0; j < n; j++ {
		stamp[j] = j
		for _, i := range colRows[j] {
			for _, k := range pattern[i] {
				if stamp[k] != j {
					stamp[k] = j
					degree[j]++
				}
			}
		}
	}
	order := make([]int, n)
	for j := range order {
		order[j] = j
	}
	sort.SliceStable(order, func(a, b int) bool { return degree[order[a]] > degree[order[b]] })

	color := make([]int, n)
	for j := range color {
		color[j] = -1
	}
	forbidden := make([]int, n+1) // forbidden[c] == j+1 when colour c is taken by a neighbour of j
	ncolors := 0
	for _, j := range order {
		for _, i := range colRows[j] {
			for _, k := range pattern[i] {
				if k != j && color[k] >= 0 {
					forbidden[color[k]] = j + 1
				}
			}
		}
		c := 0
		for forbidden[c] == j+1 {
			c++
		}
		color[j] = c
		if c+1 > ncolors {
			ncolors = c + 1
		}
	}
	groups := make([][]int, ncolors)
	for j := 0; j < n; j++ {
		groups[color[j]] = append(groups[color[j]], j)
	}
	return &coloring{groups: groups, colRows: colRows}
}

// fdStep returns the forward-difference step for unknown j at x:
// √ε·max(|x_j|, XScale_j), signed like x_j, turned round if it would leave
// the box, and rounded so that x_j+h is exactly representable.
func (s *Solver) fdStep(j int, x []float64) float64 {
	xj := x[j]
	h := sqrtEps * math.Max(math.Abs(xj), s.xs[j])
	if xj < 0 {
		h = -h
	}
	lo, hi := s.lo[j], s.hi[j]
	if t := xj + h; t > hi || t < lo {
		h = -h
		if t := xj + h; t > hi || t < lo {
			// The box is narrower than the step: use half the larger room.
			if hi-xj >= xj-lo {
				h = (hi - xj) / 2
			} else {
				h = -(xj - lo) / 2
			}
		}
	}
	t := xj + h
	return t - xj
}

// fdJacobian fills s.jac with the scaled forward-difference Jacobian at x,
// whose scaled residual is r. It uses s.xt, s.rt and s.h as work space.
func (s *Solver) fdJacobian(x, r []float64, it int) error {
	n := s.n
	raw := s.jac.RawMatrix()
	copy(s.xt, x)
	if s.color == nil {
		s.outside = true
		for j := 0; j < n; j++ {
			s.one[0] = j
			if err := s.perturb(s.one[:], x, it); err != nil {
				return err
			}
			f := s.xs[j] / s.h[j]
			for i := 0; i < n; i++ {
				raw.Data[i*raw.Stride+j] = (s.rt[i] - r[i]) * f
			}
		}
		return nil
	}
	// The groups write exactly the pattern's entries; the others stay zero.
	s.clearOutside()
	for _, group := range s.color.groups {
		if err := s.perturb(group, x, it); err != nil {
			return err
		}
		for _, j := range group {
			f := s.xs[j] / s.h[j]
			for _, i := range s.color.colRows[j] {
				raw.Data[i*raw.Stride+j] = (s.rt[i] - r[i]) * f
			}
		}
	}
	return nil
}

// perturb evaluates the scaled residual into s.rt at x with the unknowns
// of group moved by their steps (stored in s.h), and restores s.xt to x.
// If the residual reports ErrDomain, the steps are turned round (where
// that stays in the box) and the evaluation is tried once more.
func (s *Solver) perturb(group []int, x []float64, it int) error {
	for _, j := range group {
		s.h[j] = s.fdStep(j, x)
		s.xt[j] = x[j] + s.h[j]
	}
	err := s.residual(s.rt, s.xt, it, true)
	if err != nil && errors.Is(err, ErrDomain) {
		for _, j := range group {
			if t := x[j] - s.h[j]; t >= s.lo[j] && t <= s.hi[j] {
				s.h[j] = t - x[j]
				s.xt[j] = t
			}
		}
		err = s.residual(s.rt, s.xt, it, false)
	}
	for _, j := range group {
		s.xt[j] = x[j]
	}
	return err
}

// analyticJacobian calls Problem.Jacobian and scales the result:
// J̃_ij = J_ij·XScale_j/FScale_i. With full false and a Pattern (the
// default during a solve, Settings.VerifyPattern false) the model writes
// into s.model, of which only the pattern's entries are zeroed before the
// call and read after it, so the cost is proportional to the nonzeros;
// s.jac keeps zeros outside the pattern. With full true, or without a
// Pattern, the model writes into s.jac itself, every entry is checked and
// scaled, and with a Pattern the entries outside it are checked to be
// zero (checkPattern).
func (s *Solver) analyticJacobian(x []float64, it int, full bool) error {
	if full || s.p.Pattern == nil {
		return s.analyticJacobianFull(x, it)
	}
	mraw := s.model.RawMatrix()
	for i := 0; i < s.n; i++ {
		row := mraw.Data[i*mraw.Stride : i*mraw.Stride+s.n]
		for _, j := range s.prow(i) {
			row[j] = 0
		}
	}
	if err := s.p.Jacobian(s.model, x); err != nil {
		return &statusError{status: ResidualFailed, msg: "solver: Jacobian at iteration " + itoa(it), err: err}
	}
	s.clearOutside()
	raw := s.jac.RawMatrix()
	for i := 0; i < s.n; i++ {
		mrow := mraw.Data[i*mraw.Stride : i*mraw.Stride+s.n]
		row := raw.Data[i*raw.Stride : i*raw.Stride+s.n]
		fi := 1 / s.fs[i]
		for _, j := range s.prow(i) {
			v := mrow[j]
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return &NumberError{Equation: s.p.eqName(i), Unknown: s.p.varName(j), Value: v, Iter: it}
			}
			row[j] = v * s.xs[j] * fi
		}
	}
	return nil
}

// analyticJacobianFull is analyticJacobian over the whole matrix.
func (s *Solver) analyticJacobianFull(x []float64, it int) error {
	s.jac.Zero()
	s.outside = true
	if err := s.p.Jacobian(s.jac, x); err != nil {
		return &statusError{status: ResidualFailed, msg: "solver: Jacobian at iteration " + itoa(it), err: err}
	}
	raw := s.jac.RawMatrix()
	for i := 0; i < s.n; i++ {
		row := raw.Data[i*raw.Stride : i*raw.Stride+s.n]
		fi := 1 / s.fs[i]
		for j, v := range row {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return &NumberError{Equation: s.p.eqName(i), Unknown: s.p.varName(j), Value: v, Iter: it}
			}
			row[j] = v * s.xs[j] * fi
		}
	}
	if s.p.Pattern != nil {
		if err := s.checkPattern(it); err != nil {
			return err
		}
		s.outside = false // checked: zero outside the pattern
	}
	return nil
}

// prow returns the columns of row i of the Pattern, sorted, without
// duplicates.
func (s *Solver) prow(i int) []int { return s.pcol[s.pptr[i]:s.pptr[i+1]] }

// clearOutside zeroes s.jac if entries outside the Pattern may be nonzero
// (after a dense finite-difference or a full analytic Jacobian), so that
// the pattern-only paths may leave those entries alone.
func (s *Solver) clearOutside() {
	if s.outside {
		s.jac.Zero()
		s.outside = false
	}
}

// compressPattern returns the rows of pattern (n columns) in compressed
// form, each row sorted and without duplicates: row i is
// idx[ptr[i]:ptr[i+1]].
func compressPattern(pattern [][]int, n int) (ptr, idx []int) {
	ptr = make([]int, len(pattern)+1)
	mark := make([]int, n)
	for i, row := range pattern {
		start := len(idx)
		for _, j := range row {
			if mark[j] != i+1 {
				mark[j] = i + 1
				idx = append(idx, j)
			}
		}
		sort.Ints(idx[start:])
		ptr[i+1] = len(idx)
	}
	return ptr, idx
}

// checkPattern reports the entries of the scaled Jacobian that are nonzero
// outside the Pattern.
func (s *Solver) checkPattern(it int) error {
	raw := s.jac.RawMatrix()
	var e *PatternError
	for i := 0; i < s.n; i++ {
		for _, j := range s.p.Pattern[i] {
			s.mark[j] = i + 1
		}
		row := raw.Data[i*raw.Stride : i*raw.Stride+s.n]
		for j, v := range row {
			if v != 0 && s.mark[j] != i+1 {
				if e == nil {
					e = &PatternError{Iter: it}
				}
				e.Entries = append(e.Entries, [2]string{s.p.eqName(i), s.p.varName(j)})
			}
		}
	}
	if e != nil {
		return e
	}
	return nil
}

// CheckPattern forms a dense forward-difference Jacobian at x (one
// residual evaluation per unknown, whatever the Pattern) and returns a
// *PatternError listing every entry that is nonzero but missing from the
// Pattern, or nil. An incomplete pattern makes coloured finite
// differences wrong without any other sign, so a model's tests should call
// this at a few representative points. It panics if the problem has no
// Pattern.
func (s *Solver) CheckPattern(x []float64) error {
	if s.p.Pattern == nil {
		panic("solver: Solver.CheckPattern: the problem has no Pattern")
	}
	if len(x) != s.n {
		panic("solver: Solver.CheckPattern: len(x) = " + itoa(len(x)) + ", want Dim = " + itoa(s.n))
	}
	color := s.color
	s.color = nil
	defer func() { s.color = color }()
	if err := s.residual(s.r, x, 0, false); err != nil {
		return err
	}
	if err := s.fdJacobian(x, s.r, 0); err != nil {
		return err
	}
	return s.checkPattern(0)
}

// checkJacobian reports the first non-finite entry of the scaled Jacobian
// (only the pattern's entries when the rest are known to be zero).
func (s *Solver) checkJacobian(it int) error {
	raw := s.jac.RawMatrix()
	if s.pptr != nil && !s.outside {
		for i := 0; i < s.n; i++ {
			row := raw.Data[i*raw.Stride : i*raw.Stride+s.n]
			for _, j := range s.prow(i) {
				if v := row[j]; math.IsNaN(v) || math.IsInf(v, 0) {
					return &NumberError{Equation: s.p.eqName(i), Unknown: s.p.varName(j), Value: v, Iter: it}
				}
			}
		}
		return nil
	}
	for i := 0; i < s.n; i++ {
		row := raw.Data[i*raw.Stride : i*raw.Stride+s.n]
		for j, v := range row {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return &NumberError{Equation: s.p.eqName(i), Unknown: s.p.varName(j), Value: v, Iter: it}
			}
		}
	}
	return nil
}

// jacobian fills s.jac with the scaled Jacobian at s.x.
func (s *Solver) jacobian(it int) error {
	s.res.Stats.JacobianEvals++
	if s.p.Jacobian != nil {
		return s.analyticJacobian(s.x, it, s.set.VerifyPattern)
	}
	if err := s.fdJacobian(s.x, s.r, it); err != nil {
		return err
	}
	return s.checkJacobian(it)
}

// Jacobian writes into dst (Dim×Dim) the unscaled Jacobian dF/dx at x:
// with analytic true, Problem.Jacobian's (it panics if there is none);
// otherwise the solver's forward differences, coloured when the Problem
// has a Pattern. It is meant for checking a hand-written Jacobian against
// finite differences. It shares the Solver's work space, so it must not
// run during a Solve.
func (s *Solver) Jacobian(dst *mat.Dense, x []float64, analytic bool) error {
	if len(x) != s.n {
		panic("solver: Solver.Jacobian: len(x) = " + itoa(len(x)) + ", want Dim = " + itoa(s.n))
	}
	if r, c := dst.Dims(); r != s.n || c != s.n {
		panic("solver: Solver.Jacobian: dst is not Dim×Dim")
	}
	var err error
	if analytic {
		if s.p.Jacobian == nil {
			panic("solver: Solver.Jacobian: the problem has no analytic Jacobian")
		}
		err = s.analyticJacobian(x, 0, true)
	} else {
		if err = s.residual(s.r, x, 0, false); err == nil {
			err = s.fdJacobian(x, s.r, 0)
		}
	}
	if err != nil {
		return err
	}
	for i := 0; i < s.n; i++ {
		for j := 0; j < s.n; j++ {
			dst.Set(i, j, s.jac.At(i, j)*s.fs[i]/s.xs[j])
		}
	}
	return nil
}
