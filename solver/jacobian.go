package solver

import (
	"errors"
	"math"
	"math/bits"
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
// columns) greedily: columns in order of decreasing score (largest first,
// Welsh and Powell 1967), each given the smallest colour none of its
// neighbours has. The score of a column is Σ (|row| − 1) over its rows,
// an upper bound of its degree in the graph that costs O(nonzeros),
// where the degree itself costs Σ |row|² (a row of r entries is a clique
// of r columns); ties go to the lower column.
//
// The colours a column must avoid are those of the columns it shares a
// row with. For a row of at most max(16, 3·√n) entries they are read
// from its columns; a longer row keeps the set of colours its columns
// have taken as a bit set, with the first word not yet full, so that a
// column in such rows looks at words, and starts at the first word that
// none of its long rows has full. Time O(Σ over short rows of |row|² +
// Σ over columns of the words looked at), which for bounded short rows
// is linear in the nonzeros; memory O(nonzeros + long rows · colours/64).
func colorColumns(pattern [][]int, n int) *coloring {
	// Rows of each column, without duplicates, in one array; and the
	// columns of each row, the same.
	count := make([]int, n+1)
	rcount := make([]int, len(pattern)+1)
	last := make([]int, n) // last[j] = 1 + the last row counted for column j
	for i, row := range pattern {
		for _, j := range row {
			if last[j] != i+1 {
				last[j] = i + 1
				count[j+1]++
				rcount[i+1]++
			}
		}
	}
	for j := 0; j < n; j++ {
		count[j+1] += count[j]
	}
	for i := range pattern {
		rcount[i+1] += rcount[i]
	}
	rows := make([]int, count[n])
	cols := make([]int, count[n])
	next := make([]int, n)
	copy(next, count[:n])
	clear(last)
	for i, row := range pattern {
		k := rcount[i]
		for _, j := range row {
			if last[j] != i+1 {
				last[j] = i + 1
				rows[next[j]] = i
				next[j]++
				cols[k] = j
				k++
			}
		}
	}
	colRows := make([][]int, n)
	for j := range colRows {
		colRows[j] = rows[count[j]:count[j+1]:count[j+1]]
	}
	rowCols := func(i int) []int { return cols[rcount[i]:rcount[i+1]] }
	// Largest first by score.
	score := next // reused
	for j := 0; j < n; j++ {
		s := 0
		for _, i := range colRows[j] {
			s += rcount[i+1] - rcount[i] - 1
		}
		score[j] = s
	}
	order := make([]int, n)
	for j := range order {
		order[j] = j
	}
	sort.SliceStable(order, func(a, b int) bool { return score[order[a]] > score[order[b]] })

	limit := sqrtLimit(n, 3)
	long := make([]int, len(pattern)) // 1 + the index of row i's bit set, 0 for a short row
	var used [][]uint64               // colours taken in each long row
	var full []int                    // the first word of each long row's set that is not full
	for i := range pattern {
		if rcount[i+1]-rcount[i] > limit {
			used = append(used, nil)
			full = append(full, 0)
			long[i] = len(used)
		}
	}
	color := score // reused: the scores are no longer needed once sorted
	for j := range color {
		color[j] = -1
	}
	forbidden := make([]int, n+1) // forbidden[c] == j+1 when colour c is taken by a neighbour of j in a short row
	ncolors := 0
	for _, j := range order {
		w0 := 0
		for _, i := range colRows[j] {
			if b := long[i]; b > 0 {
				w0 = max(w0, full[b-1])
				continue
			}
			for _, k := range rowCols(i) {
				if k != j && color[k] >= 0 {
					forbidden[color[k]] = j + 1
				}
			}
		}
		c := -1
		for w := w0; c < 0; w++ {
			var taken uint64
			for _, i := range colRows[j] {
				if b := long[i]; b > 0 && w < len(used[b-1]) {
					taken |= used[b-1][w]
				}
			}
			for free := ^taken; free != 0; free &= free - 1 {
				if t := w*64 + bits.TrailingZeros64(free); t >= n || forbidden[t] != j+1 {
					c = t
					break
				}
			}
		}
		color[j] = c
		if c+1 > ncolors {
			ncolors = c + 1
		}
		for _, i := range colRows[j] {
			b := long[i]
			if b == 0 {
				continue
			}
			u := used[b-1]
			for len(u) <= c/64 {
				u = append(u, 0)
			}
			u[c/64] |= 1 << (c % 64)
			for full[b-1] < len(u) && u[full[b-1]] == ^uint64(0) {
				full[b-1]++
			}
			used[b-1] = u
		}
	}
	size := make([]int, ncolors+1)
	for _, c := range color {
		size[c+1]++
	}
	for c := 0; c < ncolors; c++ {
		size[c+1] += size[c]
	}
	groups := make([][]int, ncolors)
	at := forbidden[:ncolors] // reused
	copy(at, size[:ncolors])
	members := cols[:0] // reused where long enough: the rows' columns are no longer needed
	if cap(members) < n {
		members = make([]int, n)
	}
	members = members[:n]
	for j, c := range color {
		members[at[c]] = j
		at[c]++
	}
	for c := range groups {
		groups[c] = members[size[c]:size[c+1]:size[c+1]]
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

// fdJacobian fills the scaled Jacobian (s.jac, or s.sj with a Pattern)
// with forward differences at x, whose scaled residual is r. It uses
// s.xt, s.rt and s.h as work space.
func (s *Solver) fdJacobian(x, r []float64, it int) error {
	n := s.n
	copy(s.xt, x)
	if s.sj != nil && s.colPos == nil {
		s.colorPositions() // an analytic problem's first differences
	}
	if s.color == nil {
		raw := s.jac.RawMatrix()
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
	// The groups write exactly the pattern's entries.
	v := s.sj.val
	for _, group := range s.color.groups {
		if err := s.perturb(group, x, it); err != nil {
			return err
		}
		for _, j := range group {
			f := s.xs[j] / s.h[j]
			pos := s.colPos[j]
			for k, i := range s.color.colRows[j] {
				v[pos[k]] = (s.rt[i] - r[i]) * f
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

// analyticJacobian calls the Problem's analytic Jacobian and scales the
// result: J̃_ij = J_ij·XScale_j/FScale_i.
//
// Without a Pattern, Problem.Jacobian writes into s.jac itself and every
// entry is checked and scaled. With a Pattern and SparseJacobian, the
// model writes into s.sj (zeroed first), which is then checked and
// scaled in place. With a Pattern and a dense Jacobian, the model writes
// into s.model: with full false (the default during a solve,
// Settings.VerifyPattern false) only the pattern's entries are zeroed
// before the call and read after it, so the cost is proportional to the
// nonzeros; with full true every entry is zeroed and checked, and those
// outside the pattern must be zero (a *PatternError names them).
func (s *Solver) analyticJacobian(x []float64, it int, full bool) error {
	if s.sj == nil {
		return s.analyticJacobianDense(x, it)
	}
	if s.p.SparseJacobian != nil {
		s.sj.Zero()
		if err := s.p.SparseJacobian(s.sj, x); err != nil {
			return &statusError{status: ResidualFailed, msg: "solver: Jacobian at iteration " + itoa(it), err: err}
		}
		v := s.sj.val
		for i := 0; i < s.n; i++ {
			fi := 1 / s.fs[i]
			for p := s.sj.pat.ptr[i]; p < s.sj.pat.ptr[i+1]; p++ {
				j := s.sj.pat.col[p]
				if e := v[p]; math.IsNaN(e) || math.IsInf(e, 0) {
					return &NumberError{Equation: s.p.eqName(i), Unknown: s.p.varName(j), Value: e, Iter: it}
				}
				v[p] = v[p] * s.xs[j] * fi
			}
		}
		return nil
	}
	mraw := s.model.RawMatrix()
	if full {
		s.model.Zero()
	} else {
		for i := 0; i < s.n; i++ {
			row := mraw.Data[i*mraw.Stride : i*mraw.Stride+s.n]
			cols, _ := s.sj.Row(i)
			for _, j := range cols {
				row[j] = 0
			}
		}
	}
	if err := s.p.Jacobian(s.model, x); err != nil {
		return &statusError{status: ResidualFailed, msg: "solver: Jacobian at iteration " + itoa(it), err: err}
	}
	if full {
		// Every entry checked and scaled, then those outside the
		// pattern checked to be zero.
		for i := 0; i < s.n; i++ {
			row := mraw.Data[i*mraw.Stride : i*mraw.Stride+s.n]
			fi := 1 / s.fs[i]
			for j, v := range row {
				if math.IsNaN(v) || math.IsInf(v, 0) {
					return &NumberError{Equation: s.p.eqName(i), Unknown: s.p.varName(j), Value: v, Iter: it}
				}
				row[j] = v * s.xs[j] * fi
			}
		}
		if err := s.checkPattern(s.model, it); err != nil {
			return err
		}
		for i := 0; i < s.n; i++ {
			row := mraw.Data[i*mraw.Stride : i*mraw.Stride+s.n]
			cols, vals := s.sj.Row(i)
			for k, j := range cols {
				vals[k] = row[j]
			}
		}
		return nil
	}
	for i := 0; i < s.n; i++ {
		mrow := mraw.Data[i*mraw.Stride : i*mraw.Stride+s.n]
		fi := 1 / s.fs[i]
		cols, vals := s.sj.Row(i)
		for k, j := range cols {
			v := mrow[j]
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return &NumberError{Equation: s.p.eqName(i), Unknown: s.p.varName(j), Value: v, Iter: it}
			}
			vals[k] = v * s.xs[j] * fi
		}
	}
	return nil
}

// analyticJacobianDense is analyticJacobian without a Pattern.
func (s *Solver) analyticJacobianDense(x []float64, it int) error {
	s.jac.Zero()
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
	return nil
}

// compressPattern returns the rows of pattern (n columns) in compressed
// form, each row sorted and without duplicates: row i is
// idx[ptr[i]:ptr[i+1]].
func compressPattern(pattern [][]int, n int) (ptr, idx []int) {
	ptr = make([]int, len(pattern)+1)
	mark := make([]int, n)
	size := 0
	for _, row := range pattern {
		size += len(row)
	}
	idx = make([]int, 0, size)
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

// checkPattern reports the entries of the dense scaled Jacobian m that
// are nonzero outside the Pattern.
func (s *Solver) checkPattern(m *mat.Dense, it int) error {
	raw := m.RawMatrix()
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
	for j := range s.mark {
		s.mark[j] = 0
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
// this at a few representative points. It works column by column and
// holds nothing of size Dim². It panics if the problem has no Pattern.
func (s *Solver) CheckPattern(x []float64) error {
	if s.p.Pattern == nil {
		panic("solver: Solver.CheckPattern: the problem has no Pattern")
	}
	if len(x) != s.n {
		panic("solver: Solver.CheckPattern: len(x) = " + itoa(len(x)) + ", want Dim = " + itoa(s.n))
	}
	if err := s.residual(s.r, x, 0, false); err != nil {
		return err
	}
	copy(s.xt, x)
	var found [][2]int // {equation, unknown}
	for j := 0; j < s.n; j++ {
		s.one[0] = j
		if err := s.perturb(s.one[:], x, 0); err != nil {
			return err
		}
		f := s.xs[j] / s.h[j]
		for i := 0; i < s.n; i++ {
			if (s.rt[i]-s.r[i])*f != 0 && s.sj.Index(i, j) < 0 {
				found = append(found, [2]int{i, j})
			}
		}
	}
	if len(found) == 0 {
		return nil
	}
	sort.Slice(found, func(a, b int) bool {
		if found[a][0] != found[b][0] {
			return found[a][0] < found[b][0]
		}
		return found[a][1] < found[b][1]
	})
	e := &PatternError{}
	for _, f := range found {
		e.Entries = append(e.Entries, [2]string{s.p.eqName(f[0]), s.p.varName(f[1])})
	}
	return e
}

// checkJacobian reports the first non-finite entry of the scaled Jacobian
// (only the pattern's entries with a Pattern).
func (s *Solver) checkJacobian(it int) error {
	if s.sj != nil {
		for i := 0; i < s.n; i++ {
			cols, vals := s.sj.Row(i)
			for k, v := range vals {
				if math.IsNaN(v) || math.IsInf(v, 0) {
					return &NumberError{Equation: s.p.eqName(i), Unknown: s.p.varName(cols[k]), Value: v, Iter: it}
				}
			}
		}
		return nil
	}
	raw := s.jac.RawMatrix()
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

// jacobian fills the scaled Jacobian at s.x.
func (s *Solver) jacobian(it int) error {
	s.res.Stats.JacobianEvals++
	if s.p.Jacobian != nil || s.p.SparseJacobian != nil {
		return s.analyticJacobian(s.x, it, s.set.VerifyPattern)
	}
	if err := s.fdJacobian(s.x, s.r, it); err != nil {
		return err
	}
	return s.checkJacobian(it)
}

// unscaledJacobian forms the Jacobian at x (analytic, or the solver's
// forward differences) in the solver's scaled storage, for Jacobian and
// JacobianSparse. It shares the Solver's work space.
func (s *Solver) unscaledJacobian(x []float64, analytic bool, who string) error {
	if len(x) != s.n {
		panic("solver: Solver." + who + ": len(x) = " + itoa(len(x)) + ", want Dim = " + itoa(s.n))
	}
	if analytic {
		if s.p.Jacobian == nil && s.p.SparseJacobian == nil {
			panic("solver: Solver." + who + ": the problem has no analytic Jacobian")
		}
		return s.analyticJacobian(x, 0, true)
	}
	if err := s.residual(s.r, x, 0, false); err != nil {
		return err
	}
	return s.fdJacobian(x, s.r, 0)
}

// Jacobian writes into dst (Dim×Dim) the unscaled Jacobian dF/dx at x:
// with analytic true, the Problem's analytic Jacobian (it panics if there
// is none), checked against the Pattern when it is a dense one;
// otherwise the solver's forward differences, coloured when the Problem
// has a Pattern. It is meant for checking a hand-written Jacobian against
// finite differences. It shares the Solver's work space, so it must not
// run during a Solve. With the Solver's derived scales (Problem.XScale
// nil) the steps of the differences follow the scales of the last Solve,
// or 1 before the first.
func (s *Solver) Jacobian(dst *mat.Dense, x []float64, analytic bool) error {
	if r, c := dst.Dims(); r != s.n || c != s.n {
		panic("solver: Solver.Jacobian: dst is not Dim×Dim")
	}
	if err := s.unscaledJacobian(x, analytic, "Jacobian"); err != nil {
		return err
	}
	if s.sj == nil {
		for i := 0; i < s.n; i++ {
			for j := 0; j < s.n; j++ {
				dst.Set(i, j, s.jac.At(i, j)*s.fs[i]/s.xs[j])
			}
		}
		return nil
	}
	dst.Zero()
	for i := 0; i < s.n; i++ {
		cols, vals := s.sj.Row(i)
		for k, j := range cols {
			dst.Set(i, j, vals[k]*s.fs[i]/s.xs[j])
		}
	}
	return nil
}

// JacobianSparse is Jacobian into a Sparse, for a problem with a Pattern:
// dst must have the Problem's pattern (NewSparse(Dim, Pattern) gives one)
// and nothing of size Dim² is used unless the problem's analytic Jacobian
// is a dense one. It panics without a Pattern or if dst's pattern differs.
func (s *Solver) JacobianSparse(dst *Sparse, x []float64, analytic bool) error {
	if s.sj == nil {
		panic("solver: Solver.JacobianSparse: the problem has no Pattern")
	}
	if !dst.samePattern(s.sj) {
		panic("solver: Solver.JacobianSparse: dst does not have the Problem's pattern")
	}
	if err := s.unscaledJacobian(x, analytic, "JacobianSparse"); err != nil {
		return err
	}
	for i := 0; i < s.n; i++ {
		cols, vals := s.sj.Row(i)
		_, out := dst.Row(i)
		for k, j := range cols {
			out[k] = vals[k] * s.fs[i] / s.xs[j]
		}
	}
	return nil
}

// Scales returns the scales of the unknowns and of the residuals the last
// Solve used (the Problem's, or those the solver derived); read only,
// valid until the next Solve.
func (s *Solver) Scales() (x, f []float64) { return s.xs, s.fs }
