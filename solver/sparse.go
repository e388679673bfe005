package solver

import (
	"fmt"
	"math"
	"slices"

	"gonum.org/v1/gonum/mat"
)

// SparseLU is a Factorizer for sparse Jacobians: a left-looking LU with
// partial pivoting (Gilbert and Peierls, SIAM J. Sci. Stat. Comput. 9(5),
// 1988; the data layout follows Davis, Direct Methods for Sparse Linear
// Systems, SIAM 2006, from memory). It reads the nonzeros of the dense
// Jacobian the solver hands it (an O(n²) scan, or, after SetPattern, only
// the pattern's entries) and factorises them in O(flops in the factors),
// which for banded or plant-like Jacobians is far below the O(n³) of
// DenseLU.
//
// Columns are taken in their natural order unless MinDegree is set; for
// the natural order, number the unknowns so that coupled ones are near
// each other. Among the
// rows eligible as pivot the diagonal entry of A is preferred while it is
// at least DiagTol times the largest (threshold pivoting, to keep the
// band); otherwise the largest is taken. The condition number is
// estimated in the 1-norm by Hager's method with Higham's refinement
// (Higham, ACM TOMS 14(4), 1988), as LAPACK's Dlacn2 does, when Cond is
// first called after a factorisation; CondBound gives a cheaper upper
// bound.
//
// The symbolic part (the reach of each column, found by depth-first
// search) is kept and reused in the next factorisation for as long as the
// structure of A and the pivot rows stay the same, which on a sequence of
// Newton iterations they mostly do; the factors are bit for bit those of
// a fresh factorisation. Entries that are exactly zero are dropped from
// the structure, so a Jacobian entry that is zero at one iteration and
// not at the next (a line without flow) changes the structure.
//
// With MinDegree and a pattern (SetPattern), the columns are taken in a
// fill-reducing order found once from the pattern, and the structure of
// A is the pattern itself, zeros included: it never changes, and only a
// change of pivot row makes the symbolic part be found again. In that
// mode the arithmetic does not depend on the structure: the updates of
// L \ A(:,k) are applied in the order of the pivot steps, ties between
// candidate pivots go to the lowest row, and each column of L and U is
// kept in that order, so the explicit zeros change no nonzero value of
// the factors, of a solve or of the condition estimate and bound (for
// finite values). The factors are not those of the natural order: the
// results differ from it by rounding.
//
// After the first factorisation of a given fill, SparseLU allocates
// nothing. The zero value is ready to use.
type SparseLU struct {
	// DiagTol is the threshold for preferring the diagonal pivot, in
	// (0, 1]. Zero means 0.1; 1 gives plain partial pivoting.
	DiagTol float64

	// MinDegree makes SetPattern order the columns by minimum degree on
	// the graph of the pattern's AᵀA (see minDegreeOrder) and keep the
	// pattern's zeros in the structure, for patterns of order up to 4096.
	// On Jacobians whose entries come and go (a plant's lines with and
	// without flow) that saves most of the symbolic work and much of the
	// fill. Set it before SetPattern; it has no effect without a pattern.
	MinDegree bool

	n          int
	ap, ai     []int // A in compressed columns
	ax         []float64
	lp, li     []int // L: unit lower triangular, diagonal first in each column
	lx         []float64
	up, ui     []int // U: upper triangular, diagonal last in each column
	ux         []float64
	pinv       []int // pinv[row] = pivot step of that row
	xi         []int // 2n: reach stack and DFS stack
	mark       []bool
	x, y, z, w []float64
	anorm      float64
	cond       float64
	condDone   bool // cond is the estimate of the current factors
	ok         bool

	pn     int   // order of the pattern; 0 without one
	pp, pr []int // the pattern in compressed columns (rows ascending), in the order q
	// q is the column order: step k factorises column q[k] of A (nil:
	// the natural order). SetPattern sets it.
	q      []int
	static bool // the structure of A is the pattern, zeros included

	// The structure of A with its zeros dropped (read from the pattern's
	// entries or by the full scan), of this factorisation and of the
	// last, for comparison. In the static mode ap, ai are pp, pr instead.
	sp, si   []int
	sp0, si0 []int

	// The symbolic part of the last factorisation, reused while nothing
	// changes it: the reach of each column (rr[rp[k]:rp[k+1]], in
	// topological order, sorted by sortReach when there is a column order)
	// and each step's pivot row. symOK is cleared by SetPattern; unless
	// the structure is static it is compared column by column too.
	rp, rr  []int
	piv     []int
	symOK   bool
	dfsCols int // columns whose reach was searched, not reused (for tests)
}

// SetPattern implements PatternFactorizer: from now on Factorize reads
// only the entries of its matrix (of order n) listed in pattern (pattern[i]
// lists the columns of row i, in any order, duplicates ignored) and takes
// all others as zero. The work of reading the matrix is then proportional
// to the pattern's size instead of n². A nil pattern restores the full
// scan. It panics if the pattern does not have n rows or lists a column
// outside [0, n).
func (s *SparseLU) SetPattern(n int, pattern [][]int) {
	if pattern != nil || s.pp != nil {
		s.symOK = false // the structure of A changes
	}
	if pattern == nil {
		s.pn, s.pp, s.pr, s.q, s.static = 0, nil, nil, nil, false
		return
	}
	if len(pattern) != n {
		panic(fmt.Sprintf("solver: SparseLU.SetPattern with %d rows, want %d", len(pattern), n))
	}
	mark := make([]int, n)
	count := make([]int, n+1)
	for i, row := range pattern {
		for _, j := range row {
			if j < 0 || j >= n {
				panic(fmt.Sprintf("solver: SparseLU.SetPattern: row %d lists column %d, want 0 ≤ column < %d", i, j, n))
			}
			if mark[j] != i+1 {
				mark[j] = i + 1
				count[j+1]++
			}
		}
	}
	for j := 0; j < n; j++ {
		count[j+1] += count[j]
	}
	s.pp = count
	s.pr = make([]int, count[n])
	next := make([]int, n)
	copy(next, count[:n])
	for j := range mark {
		mark[j] = 0
	}
	for i, row := range pattern { // rows ascending within each column
		for _, j := range row {
			if mark[j] != i+1 {
				mark[j] = i + 1
				s.pr[next[j]] = i
				next[j]++
			}
		}
	}
	s.pn = n
	s.q = nil
	s.static = s.MinDegree && n <= maxOrderN
	if s.static {
		s.q = minDegreeOrder(n, s.pp, s.pr)
		s.pp, s.pr = permuteColumns(s.q, s.pp, s.pr)
	}
}

// Factorize implements Factorizer.
func (s *SparseLU) Factorize(j *mat.Dense) error {
	n, c := j.Dims()
	if n != c {
		panic(fmt.Sprintf("solver: SparseLU.Factorize of a %d×%d matrix, want square", n, c))
	}
	if s.n != n || s.pinv == nil {
		s.n = n
		s.ap = make([]int, n+1)
		s.lp = make([]int, n+1)
		s.up = make([]int, n+1)
		s.pinv = make([]int, n)
		s.xi = make([]int, 2*n)
		s.mark = make([]bool, n)
		s.x = make([]float64, n)
		s.y = make([]float64, n)
		s.z = make([]float64, n)
		s.w = make([]float64, n)
		s.sp = make([]int, n+1)
		s.sp0 = make([]int, n+1)
		s.rp = make([]int, n+1)
		s.piv = make([]int, n)
		s.symOK = false
	}
	s.ok = false
	s.cond = math.Inf(1)
	s.condDone = true
	// Compressed columns of A, and its 1-norm.
	raw := j.RawMatrix()
	s.anorm = 0
	if s.pp != nil && s.pn != n {
		panic(fmt.Sprintf("solver: SparseLU.Factorize of order %d with a pattern of order %d", n, s.pn))
	}
	if s.q != nil && len(s.q) != n {
		panic(fmt.Sprintf("solver: SparseLU.Factorize of order %d with a column order of %d", n, len(s.q)))
	}
	if s.static {
		// The pattern is the structure, zeros included: it never changes.
		s.ap, s.ai = s.pp, s.pr
		if cap(s.ax) < len(s.pr) {
			s.ax = make([]float64, len(s.pr))
		}
		s.ax = s.ax[:len(s.pr)]
		for k := 0; k < n; k++ {
			col := k
			if s.q != nil {
				col = s.q[k]
			}
			sum := 0.0
			for p := s.pp[k]; p < s.pp[k+1]; p++ {
				v := raw.Data[s.pr[p]*raw.Stride+col]
				s.ax[p] = v
				sum += math.Abs(v)
			}
			s.anorm = math.Max(s.anorm, sum)
		}
	} else {
		s.sp, s.sp0 = s.sp0, s.sp // keep the last structure for comparison
		s.si, s.si0 = s.si0, s.si
		s.si, s.ax = s.si[:0], s.ax[:0]
		for k := 0; k < n; k++ {
			s.sp[k] = len(s.si)
			col := k
			if s.q != nil {
				col = s.q[k]
			}
			sum := 0.0
			if s.pp != nil {
				for p := s.pp[k]; p < s.pp[k+1]; p++ {
					row := s.pr[p]
					if v := raw.Data[row*raw.Stride+col]; v != 0 {
						s.si = append(s.si, row)
						s.ax = append(s.ax, v)
						sum += math.Abs(v)
					}
				}
			} else {
				for row := 0; row < n; row++ {
					if v := raw.Data[row*raw.Stride+col]; v != 0 {
						s.si = append(s.si, row)
						s.ax = append(s.ax, v)
						sum += math.Abs(v)
					}
				}
			}
			s.anorm = math.Max(s.anorm, sum)
		}
		s.sp[n] = len(s.si)
		s.ap, s.ai = s.sp, s.si
	}

	tol := s.DiagTol
	if tol <= 0 || tol > 1 {
		tol = 0.1
	}
	for i := range s.pinv {
		s.pinv[i] = -1
	}
	s.li, s.lx, s.ui, s.ux = s.li[:0], s.lx[:0], s.ui[:0], s.ux[:0]
	x := s.x
	// The reach of column k depends only on the structure of A(:,k) and
	// on the structure of L and the pivots of the steps before k, so it
	// is taken from the last factorisation as long as those are the same;
	// from the first difference on it is found again by depth-first
	// search (Gilbert and Peierls 1988). In the static mode (MinDegree
	// with a pattern) the structure of A is always the same.
	same := s.symOK
	scan := !s.static
	s.symOK = false
	s.rp[0] = 0
	for k := 0; k < n; k++ {
		s.lp[k] = len(s.li)
		s.up[k] = len(s.ui)
		if same && scan && !s.sameColumn(k) {
			same = false
		}
		var top int
		if same {
			r := s.rr[s.rp[k]:s.rp[k+1]]
			top = n - len(r)
			copy(s.xi[top:n], r)
		} else {
			top = s.reach(k)
			if s.q != nil {
				s.sortReach(top)
			}
			s.dfsCols++
			s.rr = append(s.rr[:s.rp[k]], s.xi[top:n]...)
			s.rp[k+1] = len(s.rr)
		}
		s.numeric(k, top)
		ipiv, amax := -1, -1.0
		for p := top; p < n; p++ {
			i := s.xi[p]
			if s.pinv[i] < 0 {
				if t := math.Abs(x[i]); t > amax {
					amax, ipiv = t, i
				}
			} else {
				s.ui = append(s.ui, s.pinv[i])
				s.ux = append(s.ux, x[i])
			}
		}
		if ipiv < 0 || amax <= 0 {
			for p := top; p < n; p++ {
				x[s.xi[p]] = 0
			}
			return ErrExactlySingular
		}
		diag := k // the diagonal entry of the column of A taken at step k
		if s.q != nil {
			diag = s.q[k]
		}
		if s.pinv[diag] < 0 && math.Abs(x[diag]) >= tol*amax {
			ipiv = diag
		}
		if ipiv != s.piv[k] {
			same = false // the later columns' reaches may differ
		}
		s.piv[k] = ipiv
		pivot := x[ipiv]
		s.ui = append(s.ui, k)
		s.ux = append(s.ux, pivot)
		s.pinv[ipiv] = k
		s.li = append(s.li, ipiv)
		s.lx = append(s.lx, 1)
		for p := top; p < n; p++ {
			i := s.xi[p]
			if s.pinv[i] < 0 {
				s.li = append(s.li, i)
				s.lx = append(s.lx, x[i]/pivot)
			}
			x[i] = 0
		}
	}
	s.lp[n] = len(s.li)
	s.up[n] = len(s.ui)
	for p := range s.li {
		s.li[p] = s.pinv[s.li[p]]
	}
	s.ok = true
	s.symOK = true
	s.condDone = false // estimated by the first Cond
	return nil
}

// sameColumn reports whether column k of A, as found by the full scan,
// has the same rows as in the last factorisation.
func (s *SparseLU) sameColumn(k int) bool {
	a := s.si[s.sp[k]:s.sp[k+1]]
	b := s.si0[s.sp0[k]:s.sp0[k+1]]
	if len(a) != len(b) {
		return false
	}
	for i, r := range a {
		if b[i] != r {
			return false
		}
	}
	return true
}

// reach finds the rows that x = L \ A(:,k) can make nonzero and returns
// top: they are s.xi[top:n] in topological order. L's row indices are
// still original rows here.
func (s *SparseLU) reach(k int) int {
	n := s.n
	top := n
	for p := s.ap[k]; p < s.ap[k+1]; p++ {
		if !s.mark[s.ai[p]] {
			top = s.dfs(s.ai[p], top)
		}
	}
	for p := top; p < n; p++ {
		s.mark[s.xi[p]] = false
	}
	return top
}

// sortReach puts the reach s.xi[top:n] of the current step in an order
// that does not depend on which other rows are in it: first the rows
// already pivoted, by ascending pivot step (a topological order of L's
// graph, as L is lower triangular in step order), then the others by
// ascending row. The numeric update, the choice among equal pivot
// candidates and the order of each column of L and U follow it, so a
// reach with more rows (explicit zeros) gives the same nonzero values.
func (s *SparseLU) sortReach(top int) {
	n := s.n
	r := s.xi[top:n]
	for p, i := range r {
		if c := s.pinv[i]; c >= 0 {
			r[p] = c
		} else {
			r[p] = n + i
		}
	}
	slices.Sort(r)
	for p, key := range r {
		if key < n {
			r[p] = s.piv[key] // this factorisation's pivot row of step key
		} else {
			r[p] = key - n
		}
	}
}

// numeric sets x = L \ A(:,k) on the reach s.xi[top:n].
func (s *SparseLU) numeric(k, top int) {
	n := s.n
	x := s.x
	for p := s.ap[k]; p < s.ap[k+1]; p++ {
		x[s.ai[p]] = s.ax[p]
	}
	for px := top; px < n; px++ {
		j := s.xi[px]
		col := s.pinv[j]
		if col < 0 {
			continue
		}
		xj := x[j] // L(j, col) = 1
		if xj == 0 {
			// Nothing to subtract (as long as L is finite): x[j] is zero
			// where the structure has an entry but the values do not.
			continue
		}
		// Columns before the current step are complete: lp[col+1] is set.
		for p := s.lp[col] + 1; p < s.lp[col+1]; p++ {
			x[s.li[p]] -= s.lx[p] * xj
		}
	}
}

// dfs runs a depth-first search in the graph of L from row j, pushing
// the rows it finishes onto s.xi[..top] (so s.xi[top:] is in topological
// order), and returns the new top. s.xi[n:] is the recursion stack of
// edge positions.
func (s *SparseLU) dfs(j, top int) int {
	n := s.n
	stack := s.xi[:n] // rows on the DFS path; shares xi below top
	pstack := s.xi[n:]
	head := 0
	stack[0] = j
	for head >= 0 {
		j = stack[head]
		col := s.pinv[j]
		if !s.mark[j] {
			s.mark[j] = true
			if col >= 0 {
				pstack[head] = s.lp[col] + 1
			}
		}
		done := true
		if col >= 0 {
			end := s.lp[col+1]
			for p := pstack[head]; p < end; p++ {
				i := s.li[p]
				if s.mark[i] {
					continue
				}
				pstack[head] = p + 1
				head++
				stack[head] = i
				done = false
				break
			}
		}
		if done {
			head--
			top--
			s.xi[top] = j
		}
	}
	return top
}

// Cond implements Factorizer. The estimate is made on the first call after
// a factorisation (a few solves with the factors) and kept.
func (s *SparseLU) Cond() float64 {
	if !s.condDone {
		s.condDone = true
		s.cond = s.anorm * s.invNorm1()
	}
	return s.cond
}

// CondBound returns an upper bound of the 1-norm condition number of the
// last factorised matrix A = Pᵀ·L·U, +Inf if it is singular. It uses
// |T⁻¹| ≤ M(T)⁻¹ for a triangular T and its comparison matrix M(T) (|t_ii|
// on the diagonal, −|t_ij| off it; Higham, Accuracy and Stability of
// Numerical Algorithms, 2nd ed., SIAM 2002, §8.3, from memory), so
// ‖A⁻¹‖₁ ≤ ‖M(U)⁻¹·M(L)⁻¹‖₁ = max(eᵀ·M(U)⁻¹·M(L)⁻¹): one pass over each
// factor, about a quarter of the work of Cond's estimate, and never below
// the true condition number (a small allowance covers rounding). It can
// exceed Cond by orders of magnitude, so it serves to show that a matrix
// is well enough conditioned, not to report the condition.
func (s *SparseLU) CondBound() float64 {
	if !s.ok {
		return math.Inf(1)
	}
	z := s.z
	for j := 0; j < s.n; j++ { // M(U)ᵀ·z = e
		d := s.up[j+1] - 1
		v := 1.0
		for p := s.up[j]; p < d; p++ {
			v += math.Abs(s.ux[p]) * z[s.ui[p]]
		}
		z[j] = v / math.Abs(s.ux[d])
	}
	for j := s.n - 1; j >= 0; j-- { // M(L)ᵀ·z' = z
		v := z[j]
		for p := s.lp[j] + 1; p < s.lp[j+1]; p++ {
			v += math.Abs(s.lx[p]) * z[s.li[p]]
		}
		z[j] = v
	}
	m := 0.0
	for _, v := range z {
		if v > m {
			m = v
		} else if v != v { // NaN: Inf·0 after an overflow
			return math.Inf(1)
		}
	}
	// Every operation above adds positive terms, so its relative rounding
	// error is below about (number of operations)·ε; 4n²ε is generous.
	nn := float64(s.n)
	return s.anorm * m * (1 + 4*nn*nn*0x1p-52)
}

// Solve implements Factorizer.
func (s *SparseLU) Solve(dst, b []float64) error {
	if len(dst) != s.n || len(b) != s.n {
		panic(fmt.Sprintf("solver: SparseLU.Solve with lengths %d and %d, want %d", len(dst), len(b), s.n))
	}
	if !s.ok {
		return ErrExactlySingular
	}
	s.solve(dst, b)
	return nil
}

// solve sets dst = A⁻¹·b (dst and b may alias; s.y is work space).
func (s *SparseLU) solve(dst, b []float64) {
	y := s.y
	for i, v := range b {
		y[s.pinv[i]] = v
	}
	for j := 0; j < s.n; j++ { // L·y' = y, unit diagonal first
		yj := y[j]
		for p := s.lp[j] + 1; p < s.lp[j+1]; p++ {
			y[s.li[p]] -= s.lx[p] * yj
		}
	}
	for j := s.n - 1; j >= 0; j-- { // U·x = y', diagonal last
		d := s.up[j+1] - 1
		y[j] /= s.ux[d]
		yj := y[j]
		for p := s.up[j]; p < d; p++ {
			y[s.ui[p]] -= s.ux[p] * yj
		}
	}
	if s.q == nil {
		copy(dst, y)
		return
	}
	for k, j := range s.q {
		dst[j] = y[k]
	}
}

// solveT sets dst = A⁻ᵀ·b, with A = Pᵀ·L·U so Aᵀ = Uᵀ·Lᵀ·P.
func (s *SparseLU) solveT(dst, b []float64) {
	z := s.y
	if s.q == nil {
		copy(z, b)
	} else {
		for k, j := range s.q {
			z[k] = b[j]
		}
	}
	for j := 0; j < s.n; j++ { // Uᵀ·z' = z
		d := s.up[j+1] - 1
		v := z[j]
		for p := s.up[j]; p < d; p++ {
			v -= s.ux[p] * z[s.ui[p]]
		}
		z[j] = v / s.ux[d]
	}
	for j := s.n - 1; j >= 0; j-- { // Lᵀ·w = z'
		v := z[j]
		for p := s.lp[j] + 1; p < s.lp[j+1]; p++ {
			v -= s.lx[p] * z[s.li[p]]
		}
		z[j] = v
	}
	for i := range dst {
		dst[i] = z[s.pinv[i]]
	}
}

// invNorm1 estimates ‖A⁻¹‖₁ (Hager 1984, Higham 1988).
func (s *SparseLU) invNorm1() float64 {
	n := s.n
	x, v := s.z, s.w
	for i := range x {
		x[i] = 1 / float64(n)
	}
	est := 0.0
	jlast := -1 // x = e_jlast after the first pass, e/n before
	for iter := 0; iter < 5; iter++ {
		s.solve(v, x)
		nv := 0.0
		for _, a := range v {
			nv += math.Abs(a)
		}
		if iter > 0 && nv <= est {
			break
		}
		est = nv
		for i, a := range v {
			if a >= 0 {
				x[i] = 1
			} else {
				x[i] = -1
			}
		}
		s.solveT(v, x) // v = A⁻ᵀ·sign(A⁻¹·x)
		ztx := 0.0     // vᵀ·x for the x of this pass
		if jlast < 0 {
			for _, a := range v {
				ztx += a
			}
			ztx /= float64(n)
		} else {
			ztx = v[jlast]
		}
		jmax, zmax := 0, -1.0
		for i, a := range v {
			if math.Abs(a) > zmax {
				jmax, zmax = i, math.Abs(a)
			}
		}
		if zmax <= ztx || jmax == jlast {
			break
		}
		jlast = jmax
		for i := range x {
			x[i] = 0
		}
		x[jmax] = 1
	}
	// Higham's alternative vector guards against Hager's worst cases.
	for i := range x {
		sign := 1.0
		if i%2 == 1 {
			sign = -1
		}
		if n > 1 {
			x[i] = sign * (1 + float64(i)/float64(n-1))
		} else {
			x[i] = 1
		}
	}
	s.solve(v, x)
	alt := 0.0
	for _, a := range v {
		alt += math.Abs(a)
	}
	alt = 2 * alt / float64(3*n)
	if alt > est {
		est = alt
	}
	if math.IsNaN(est) {
		return math.Inf(1)
	}
	return est
}
