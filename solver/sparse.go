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
// Systems, SIAM 2006, from memory). It factorises a *Sparse directly
// (FactorizeSparse, RefactorSparse) or reads the nonzeros of a dense
// matrix (Factorize: an O(n²) scan, or, after SetPattern, only the
// pattern's entries), in O(flops in the factors), which for banded or
// plant-like Jacobians is far below the O(n³) of DenseLU. Its storage is
// O(nonzeros + fill): nothing of order n² (see minDegreeOrder).
//
// Columns are taken in their natural order unless MinDegree is set; for
// the natural order, number the unknowns so that coupled ones are near
// each other.
//
// # Pivots
//
// Factorize and FactorizeSparse choose each pivot afresh: among the rows
// eligible as pivot the diagonal entry of A (of the column taken at that
// step) is preferred while it is at least DiagTol times the largest
// (threshold pivoting, to keep the band); otherwise the largest is
// taken, the lowest row on a tie.
//
// RefactorSparse keeps the pivot order of the last factorisation: the
// pivot row of each step stays while its entry is at least DiagTol
// (default 0.1) times the largest entry among the rows eligible at that
// step; where it is not, that step and the later ones are pivoted afresh
// (a new depth-first search of the structure from that column on). The
// threshold is the one the fresh choice applies to the diagonal: every
// multiplier of L is then at most 1/DiagTol = 10 in magnitude, as in a
// fresh factorisation, so the growth bound (1 + 1/DiagTol per step) and
// with it the backward error bound of the factors are those of a fresh
// threshold-pivoted factorisation (Duff, Erisman and Reid, Direct Methods
// for Sparse Matrices, OUP 1986, §7.8 on threshold pivoting with u = 0.1,
// from memory). A solve with refactorised factors therefore agrees with
// one with fresh factors within round-off (the backward error, times the
// condition number), though not bit for bit. KeptPivots says how many
// steps kept a pivot that a fresh choice would have changed. The solver
// refactorises so only with Settings.KeepPivots, and never at the first
// iteration of a Solve, so that no Solve depends on earlier ones.
//
// # The kept structure
//
// The symbolic part of a factorisation (the reach of each column found by
// depth-first search, the structure of L and U, the pivot rows) is kept.
// The next factorisation runs column by column on it, writing the values
// into the kept storage without any search, for as long as the columns of
// A have their old structure and each pivot is the one kept (by the fresh
// rule for Factorize and FactorizeSparse, by the threshold for
// RefactorSparse); from the first column where that fails, the rest is
// found again by depth-first search. With the fresh rule the factors are
// bit for bit those of a factorisation from scratch. Entries that are
// exactly zero are dropped from the structure, so a Jacobian entry that is
// zero at one iteration and not at the next (a line without flow) changes
// the structure, unless the structure is the pattern itself:
//
// With MinDegree and a pattern (SetPattern, or the pattern of the Sparse
// matrix factorised), the columns are taken in a fill-reducing order
// found once from the pattern, and the structure of A is the pattern
// itself, zeros included: it never changes, and only a change of pivot
// row makes the symbolic part be found again. In that mode the arithmetic
// does not depend on the structure: the updates of L \ A(:,k) are applied
// in the order of the pivot steps, ties between candidate pivots go to
// the lowest row, and each column of L and U is kept in that order, so the
// explicit zeros change no nonzero value of the factors, of a solve or of
// the condition estimate and bound (for finite values). The factors are
// not those of the natural order: the results differ from it by rounding.
//
// The condition number is estimated in the 1-norm by Hager's method with
// Higham's refinement (Higham, ACM TOMS 14(4), 1988), as LAPACK's Dlacn2
// does, when Cond is first called after a factorisation; CondBound gives
// a cheaper upper bound.
//
// After the first factorisation of a given fill, SparseLU allocates
// nothing. The zero value is ready to use.
type SparseLU struct {
	// DiagTol is the pivot threshold, in (0, 1]: the fresh choice prefers
	// the diagonal entry while it is at least DiagTol times the largest
	// eligible entry, and RefactorSparse keeps a pivot while it is. Zero
	// means 0.1; 1 gives plain partial pivoting (and a refactorisation
	// then keeps a pivot only while it is the largest).
	DiagTol float64

	// MinDegree makes SetPattern (or the first factorisation of a Sparse)
	// order the columns by approximate minimum degree on the graph of the
	// pattern's AᵀA (see minDegreeOrder) and keep the pattern's zeros in the
	// structure. On Jacobians whose entries come and go (a plant's lines
	// with and without flow) that saves most of the symbolic work and
	// much of the fill. Set it before SetPattern; it has no effect without
	// a pattern.
	MinDegree bool

	// Alternates is how many symbolic factorisations SparseLU keeps
	// besides the current one, with MinDegree and a pattern (the static
	// mode): when a factorisation choosing its pivots afresh finds a kept
	// pivot changed at some step, it goes on with a kept alternate that
	// has the same pivots before that step (it has their structure) and
	// the pivot chosen at it, instead of finding the structure of the
	// remaining columns again by depth-first search; a sequence of
	// pivots not kept is found by the search and kept, the alternate
	// used least recently giving way. The factors are bit for bit those
	// of a factorisation from scratch whichever structure served (see
	// "The kept structure"): only the time differs. Each alternate holds
	// its own factors, so the storage grows by that many times the fill.
	// Zero keeps none. RefactorSparse does not use them.
	Alternates int

	// alts are the kept alternates (see Alternates); tick orders their
	// use.
	alts []luStore
	tick uint64

	n      int
	ap, ai []int // A in compressed columns
	ax     []float64
	// L: unit lower triangular, its pivot row first in each column. lrow
	// holds the rows as rows of A (for the factorisation), li the same as
	// pivot steps (for the solves). pivAt[k] is the place of the pivot
	// row among the candidates of step k in the order of its reach, which
	// the fresh rule needs to break ties as a search from scratch would.
	lp, lrow, li []int
	lx           []float64
	pivAt        []int
	up, ui       []int // U: upper triangular, diagonal last in each column
	ux           []float64
	pinv         []int // pinv[row] = pivot step of that row
	piv          []int // piv[step] = pivot row of that step
	xi           []int // 2n: reach stack and DFS stack
	mark         []bool
	x, y, z, w   []float64
	anorm        float64
	cond         float64
	condDone     bool // cond is the estimate of the current factors
	ok           bool

	pn     int   // order of the pattern; 0 without one
	pp, pr []int // the pattern in compressed columns (rows ascending), in the order q
	// q is the column order: step k factorises column q[k] of A (nil:
	// the natural order). SetPattern sets it.
	q      []int
	static bool // the structure of A is the pattern, zeros included
	// fillBound bounds the entries of L and of U below and above the
	// diagonal in the order q (George and Ng; see minDegreeOrder) when
	// fillKnown; the first factorisation sizes its storage by it (see
	// general).
	fillBound int
	fillKnown bool

	// For a Sparse matrix of pattern srcPat: src[c] is the position in its
	// values of the entry at position c of pp, pr.
	srcPat *sparsePattern
	src    []int

	// The structure of A with its zeros dropped (read from the pattern's
	// entries or by the full scan), of this factorisation and of the
	// last, for comparison. In the static mode ap, ai are pp, pr instead.
	sp, si   []int
	sp0, si0 []int

	// symOK says the structure of L and U, the pivots and the reach of
	// each column kept from the last factorisation are valid for the
	// current pattern (cleared by SetPattern and by a failure).
	symOK bool

	// kept counts the steps of the last factorisation whose pivot is not
	// the one the fresh rule would have chosen (RefactorSparse only).
	kept int

	// Counters for tests: columns whose reach was searched, columns a
	// refactorisation pivoted afresh, reallocations of the storage of L
	// or U by reserve.
	dfsCols, repivots, grows int
}

// KeptPivots implements Refactorizer: the number of steps of the last
// factorisation whose pivot differs from the one a fresh factorisation
// of the same matrix would choose. Zero means the factors are bit for bit
// those of FactorizeSparse.
func (s *SparseLU) KeptPivots() int { return s.kept }

// Holds implements Holder: the last factorisation succeeded and its
// structure is that of the current pattern.
func (s *SparseLU) Holds() bool { return s.ok && s.symOK }

// SetPattern implements PatternFactorizer: from now on Factorize reads
// only the entries of its matrix (of order n) listed in pattern (pattern[i]
// lists the columns of row i, in any order, duplicates ignored) and takes
// all others as zero. The work of reading the matrix is then proportional
// to the pattern's size instead of n². A nil pattern restores the full
// scan. It panics if the pattern does not have n rows or lists a column
// outside [0, n).
func (s *SparseLU) SetPattern(n int, pattern [][]int) {
	if pattern == nil {
		if s.pp != nil {
			s.symOK = false // the structure of A changes
			s.dropAlternates()
		}
		s.pn, s.pp, s.pr, s.q, s.static, s.srcPat, s.fillBound, s.fillKnown = 0, nil, nil, nil, false, nil, 0, false
		return
	}
	if len(pattern) != n {
		panic(fmt.Sprintf("solver: SparseLU.SetPattern with %d rows, want %d", len(pattern), n))
	}
	for i, row := range pattern {
		for _, j := range row {
			if j < 0 || j >= n {
				panic(fmt.Sprintf("solver: SparseLU.SetPattern: row %d lists column %d, want 0 ≤ column < %d", i, j, n))
			}
		}
	}
	ptr, col := compressPattern(pattern, n)
	s.setPattern(n, ptr, col)
}

// setPattern sets the pattern from its compressed rows (columns ascending
// and unique within each row).
func (s *SparseLU) setPattern(n int, ptr, col []int) {
	count := make([]int, n+1)
	for _, j := range col {
		count[j+1]++
	}
	for j := 0; j < n; j++ {
		count[j+1] += count[j]
	}
	pr := make([]int, len(col))
	next := make([]int, n)
	copy(next, count[:n])
	for i := 0; i < n; i++ { // rows ascending within each column
		for p := ptr[i]; p < ptr[i+1]; p++ {
			j := col[p]
			pr[next[j]] = i
			next[j]++
		}
	}
	s.pp, s.pr = count, pr
	s.pn = n
	s.q, s.fillBound, s.fillKnown = nil, 0, false
	s.static = s.MinDegree
	if s.static {
		s.q, s.fillBound, s.fillKnown = minDegreeOrder(n, s.pp, s.pr)
		s.pp, s.pr = permuteColumns(s.q, s.pp, s.pr)
	}
	s.srcPat = nil
	s.symOK = false
	s.dropAlternates()
}

// bind makes the pattern of a agree with SparseLU's, taking a's pattern
// if it does not, and finds where each entry of the compressed columns
// is among a's values.
func (s *SparseLU) bind(a *Sparse) {
	n := a.pat.n
	if s.pn != n || len(s.pr) != len(a.pat.col) || !s.mapSource(a) {
		s.setPattern(n, a.pat.ptr, a.pat.col)
		if !s.mapSource(a) {
			panic("solver: SparseLU: internal error: the compressed columns do not match the pattern they were made from")
		}
	}
	s.srcPat = a.pat
}

// mapSource fills s.src for a, and reports whether a's pattern is
// SparseLU's.
func (s *SparseLU) mapSource(a *Sparse) bool {
	n := a.pat.n
	qinv := make([]int, n)
	for k := range qinv {
		qinv[k] = k
	}
	for k, j := range s.q {
		qinv[j] = k
	}
	next := make([]int, n)
	copy(next, s.pp[:n])
	if len(s.src) != len(s.pr) {
		s.src = make([]int, len(s.pr))
	}
	ptr, col := a.pat.ptr, a.pat.col
	for i := 0; i < n; i++ {
		for p := ptr[i]; p < ptr[i+1]; p++ {
			k := qinv[col[p]]
			c := next[k]
			if c >= s.pp[k+1] || s.pr[c] != i {
				return false
			}
			s.src[c] = p
			next[k]++
		}
	}
	return true
}

// ensure sizes the work space for order n.
func (s *SparseLU) ensure(n int) {
	if s.n == n && s.pinv != nil {
		return
	}
	s.n = n
	s.ap = make([]int, n+1)
	s.lp = make([]int, n+1)
	s.up = make([]int, n+1)
	s.pinv = make([]int, n)
	s.piv = make([]int, n)
	s.pivAt = make([]int, n)
	s.xi = make([]int, 2*n)
	s.mark = make([]bool, n)
	s.x = make([]float64, n)
	s.y = make([]float64, n)
	s.z = make([]float64, n)
	s.w = make([]float64, n)
	s.sp = make([]int, n+1)
	s.sp0 = make([]int, n+1)
	s.symOK = false
	s.alts = nil
}

// Factorize implements Factorizer, choosing the pivots afresh.
func (s *SparseLU) Factorize(j *mat.Dense) error {
	n, c := j.Dims()
	if n != c {
		panic(fmt.Sprintf("solver: SparseLU.Factorize of a %d×%d matrix, want square", n, c))
	}
	if s.pp != nil && s.pn != n {
		panic(fmt.Sprintf("solver: SparseLU.Factorize of order %d with a pattern of order %d", n, s.pn))
	}
	if s.q != nil && len(s.q) != n {
		panic(fmt.Sprintf("solver: SparseLU.Factorize of order %d with a column order of %d", n, len(s.q)))
	}
	s.ensure(n)
	s.gatherDense(j)
	return s.factor(false)
}

// FactorizeSparse factorises a, choosing the pivots afresh (see the type's
// doc). If a's pattern is not the one given to SetPattern (or there was
// none), a's pattern becomes SparseLU's, as if given to SetPattern.
func (s *SparseLU) FactorizeSparse(a *Sparse) error {
	s.ensure(a.pat.n)
	s.gatherSparse(a)
	return s.factor(false)
}

// RefactorSparse factorises a keeping the pivot order of the last
// factorisation where each kept pivot passes the DiagTol threshold, and
// pivoting afresh from the first step where one does not (see the type's
// doc). After a failed factorisation, or with a new pattern, it is
// FactorizeSparse.
func (s *SparseLU) RefactorSparse(a *Sparse) error {
	s.ensure(a.pat.n)
	s.gatherSparse(a)
	return s.factor(true)
}

// gatherDense reads the columns of A from a dense matrix.
func (s *SparseLU) gatherDense(j *mat.Dense) {
	n := s.n
	raw := j.RawMatrix()
	s.anorm = 0
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
		return
	}
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

// gatherSparse reads the columns of A from a Sparse matrix: the same
// values, in the same order, as gatherDense reads from its dense copy.
func (s *SparseLU) gatherSparse(a *Sparse) {
	if s.srcPat != a.pat {
		s.bind(a)
	}
	n := s.n
	v := a.val
	s.anorm = 0
	if s.static {
		s.ap, s.ai = s.pp, s.pr
		if cap(s.ax) < len(s.pr) {
			s.ax = make([]float64, len(s.pr))
		}
		s.ax = s.ax[:len(s.pr)]
		for k := 0; k < n; k++ {
			sum := 0.0
			for c := s.pp[k]; c < s.pp[k+1]; c++ {
				x := v[s.src[c]]
				s.ax[c] = x
				sum += math.Abs(x)
			}
			s.anorm = math.Max(s.anorm, sum)
		}
		return
	}
	s.sp, s.sp0 = s.sp0, s.sp
	s.si, s.si0 = s.si0, s.si
	s.si, s.ax = s.si[:0], s.ax[:0]
	for k := 0; k < n; k++ {
		s.sp[k] = len(s.si)
		sum := 0.0
		for c := s.pp[k]; c < s.pp[k+1]; c++ {
			if x := v[s.src[c]]; x != 0 {
				s.si = append(s.si, s.pr[c])
				s.ax = append(s.ax, x)
				sum += math.Abs(x)
			}
		}
		s.anorm = math.Max(s.anorm, sum)
	}
	s.sp[n] = len(s.si)
	s.ap, s.ai = s.sp, s.si
}

func (s *SparseLU) tol() float64 {
	if t := s.DiagTol; t > 0 && t <= 1 {
		return t
	}
	return 0.1
}

// luStore is the storage of one factorisation, its structure and values:
// SparseLU's current one lives in its own fields, its alternates here.
type luStore struct {
	lp, lrow, li []int
	lx           []float64
	pivAt        []int
	up, ui       []int
	ux           []float64
	pinv, piv    []int
	ok           bool // a complete structure of the current pattern
	used         uint64
}

// swap exchanges the current factorisation's storage with a's.
func (s *SparseLU) swap(a *luStore) {
	s.lp, a.lp = a.lp, s.lp
	s.lrow, a.lrow = a.lrow, s.lrow
	s.li, a.li = a.li, s.li
	s.lx, a.lx = a.lx, s.lx
	s.pivAt, a.pivAt = a.pivAt, s.pivAt
	s.up, a.up = a.up, s.up
	s.ui, a.ui = a.ui, s.ui
	s.ux, a.ux = a.ux, s.ux
	s.pinv, a.pinv = a.pinv, s.pinv
	s.piv, a.piv = a.piv, s.piv
}

// alternate returns the index of the kept alternate used last whose
// pivots before step k are the current ones, and at step k not the
// current one's (which has just failed there), among those not tried
// (bits of tried); −1 if none.
func (s *SparseLU) alternate(k int, tried uint64) int {
	best := -1
	for i := range s.alts {
		a := &s.alts[i]
		if tried&(1<<i) != 0 || !a.ok || a.piv[k] == s.piv[k] || !slices.Equal(a.piv[:k], s.piv[:k]) {
			continue
		}
		if best < 0 || a.used > s.alts[best].used {
			best = i
		}
	}
	return best
}

// switchTo makes alternate a current, with the values of the columns
// before step k from the factorisation in hand (the same structure: the
// same pivots before k), and keeps the one in hand as the alternate.
func (s *SparseLU) switchTo(a *luStore, k int) {
	s.swap(a)
	copy(s.lx[:s.lp[k]], a.lx[:a.lp[k]])
	copy(s.ux[:s.up[k]], a.ux[:a.up[k]])
	s.tick++
	a.used, a.ok = s.tick, true
}

// keepForSearch keeps the factorisation in hand, whose kept pivot failed
// at step k, as an alternate, and makes current the storage of the
// alternate used least recently (or a new one) with the structure and
// values of the columns before k copied in, for general to complete.
func (s *SparseLU) keepForSearch(k int) {
	if len(s.alts) < min(s.Alternates, maxAlternates) {
		s.alts = append(s.alts, luStore{lp: make([]int, s.n+1), up: make([]int, s.n+1),
			pinv: make([]int, s.n), piv: make([]int, s.n), pivAt: make([]int, s.n)})
	}
	a := &s.alts[0]
	for i := range s.alts {
		if s.alts[i].used < a.used || !s.alts[i].ok && a.ok {
			a = &s.alts[i]
		}
	}
	s.swap(a) // a holds the factorisation in hand now
	s.tick++
	a.used, a.ok = s.tick, true
	copy(s.lp[:k+1], a.lp[:k+1])
	copy(s.up[:k+1], a.up[:k+1])
	s.lrow = append(s.lrow[:0], a.lrow[:a.lp[k]]...)
	s.lx = append(s.lx[:0], a.lx[:a.lp[k]]...)
	s.ui = append(s.ui[:0], a.ui[:a.up[k]]...)
	s.ux = append(s.ux[:0], a.ux[:a.up[k]]...)
	copy(s.pivAt[:k], a.pivAt[:k])
	copy(s.piv[:k], a.piv[:k])
	copy(s.pinv, a.pinv) // general frees the rows of steps k on
}

// maxAlternates bounds Alternates (a bit each in factor's record of the
// alternates tried).
const maxAlternates = 64

// dropAlternates forgets the alternates (a new pattern or order).
func (s *SparseLU) dropAlternates() {
	for i := range s.alts {
		s.alts[i].ok = false
	}
}

// factor factorises the A of ap, ai, ax (its 1-norm in anorm). With keep,
// the kept pivots stay where they pass the threshold.
func (s *SparseLU) factor(keep bool) error {
	s.ok = false
	s.cond = math.Inf(1)
	s.condDone = true
	kept := s.symOK
	s.symOK = false
	keep = keep && kept
	s.kept = 0
	tol := s.tol()
	k0 := 0
	alts := kept && !keep && s.static && min(s.Alternates, maxAlternates) > 0
	if kept {
		var err error
		if k0, err = s.fast(0, keep, tol); err != nil {
			return err
		}
		// Each alternate is tried once: the one switched to takes the
		// place of the factorisation that failed, which is not tried
		// again.
		var tried uint64
		for alts && k0 < s.n {
			i := s.alternate(k0, tried)
			if i < 0 {
				break
			}
			tried |= 1 << i
			s.switchTo(&s.alts[i], k0)
			if k0, err = s.fast(k0, keep, tol); err != nil {
				return err
			}
		}
	}
	if k0 < s.n {
		if alts {
			s.keepForSearch(k0)
		}
		if err := s.general(k0, keep, tol); err != nil {
			return err
		}
	}
	s.ok = true
	s.symOK = true
	s.condDone = false // estimated by the first Cond
	return nil
}

// fast refactorises the columns from step from on the kept structure
// (the earlier ones being done), writing the values into the kept storage,
// and returns the first column it cannot do: one
// whose structure in A changed (without the static mode) or whose pivot
// is not the kept one (by the fresh rule, or with keep by the threshold).
// The arithmetic is that of general, operation for operation.
func (s *SparseLU) fast(from int, keep bool, tol float64) (int, error) {
	n := s.n
	x := s.x
	for k := from; k < n; k++ {
		if !s.static && !s.sameColumn(k) {
			return k, nil
		}
		for p := s.ap[k]; p < s.ap[k+1]; p++ {
			x[s.ai[p]] = s.ax[p]
		}
		// x = L \ A(:,k): the updates by the earlier steps in U(:,k), in
		// the order of the reach.
		d := s.up[k+1] - 1
		for p := s.up[k]; p < d; p++ {
			xj := x[s.piv[s.ui[p]]] // L(piv, ui[p]) = 1
			s.ux[p] = xj
			if xj == 0 {
				continue
			}
			j := s.ui[p]
			for q := s.lp[j] + 1; q < s.lp[j+1]; q++ {
				x[s.lrow[q]] -= s.lx[q] * xj
			}
		}
		// The candidates are L(:,k)'s rows, the kept pivot first; in the
		// order of the reach the pivot is at pivAt[k].
		l0, l1 := s.lp[k], s.lp[k+1]
		r := s.lrow[l0]
		at := s.pivAt[k]
		best, amax := -1, -1.0
		for t := 0; t < l1-l0; t++ {
			var i int
			switch {
			case t < at:
				i = s.lrow[l0+1+t]
			case t == at:
				i = r
			default:
				i = s.lrow[l0+t]
			}
			if a := math.Abs(x[i]); a > amax {
				amax, best = a, i
			}
		}
		if amax <= 0 {
			s.clearColumn(k)
			return 0, ErrExactlySingular
		}
		diag := k
		if s.q != nil {
			diag = s.q[k]
		}
		if s.pinv[diag] >= k && math.Abs(x[diag]) >= tol*amax {
			best = diag // the fresh choice
		}
		same := best == r
		if keep && !same && math.Abs(x[r]) >= tol*amax {
			same = true
			s.kept++
		}
		if !same {
			s.clearColumn(k)
			return k, nil
		}
		pivot := x[r]
		s.ux[d] = pivot
		x[r] = 0
		for q := l0 + 1; q < l1; q++ {
			i := s.lrow[q]
			s.lx[q] = x[i] / pivot
			x[i] = 0
		}
		for p := s.up[k]; p < d; p++ {
			x[s.piv[s.ui[p]]] = 0
		}
	}
	return n, nil
}

// clearColumn zeroes x on the kept reach of column k.
func (s *SparseLU) clearColumn(k int) {
	for q := s.lp[k]; q < s.lp[k+1]; q++ {
		s.x[s.lrow[q]] = 0
	}
	for p := s.up[k]; p < s.up[k+1]-1; p++ {
		s.x[s.piv[s.ui[p]]] = 0
	}
}

// general factorises columns k0 to n−1 by depth-first search, the earlier
// ones being done. With keep, the pivot row of the last factorisation is
// kept where it is eligible and passes the threshold.
func (s *SparseLU) general(k0 int, keep bool, tol float64) error {
	n := s.n
	x := s.x
	for i, k := range s.pinv {
		if k >= k0 || k0 == 0 {
			s.pinv[i] = -1
		}
	}
	if b := s.firstSize(); k0 == 0 && cap(s.lrow) < b && cap(s.ui) < b {
		s.lrow, s.lx = make([]int, 0, b), make([]float64, 0, b)
		s.ui, s.ux = make([]int, 0, b), make([]float64, 0, b)
	}
	s.lrow, s.lx = s.lrow[:s.lp[k0]], s.lx[:s.lp[k0]]
	s.ui, s.ux = s.ui[:s.up[k0]], s.ux[:s.up[k0]]
	for k := k0; k < n; k++ {
		s.lp[k] = len(s.lrow)
		s.up[k] = len(s.ui)
		top := s.reach(k)
		if s.q != nil {
			s.sortReach(top)
		}
		s.dfsCols++
		// The column adds its rows not yet pivoted to L and the others,
		// with the pivot, to U.
		free := 0
		for _, i := range s.xi[top:n] {
			if s.pinv[i] < 0 {
				free++
			}
		}
		s.reserve(free, n-top-free+1)
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
			ipiv = diag // the fresh choice
		}
		if old := s.piv[k]; keep && ipiv != old {
			if s.pinv[old] < 0 && math.Abs(x[old]) >= tol*amax {
				ipiv = old
				s.kept++
			} else {
				s.repivots++
			}
		}
		s.piv[k] = ipiv
		pivot := x[ipiv]
		s.ui = append(s.ui, k)
		s.ux = append(s.ux, pivot)
		s.pinv[ipiv] = k
		s.lrow = append(s.lrow, ipiv)
		s.lx = append(s.lx, 1)
		c := 0
		for p := top; p < n; p++ {
			i := s.xi[p]
			if i == ipiv {
				s.pivAt[k] = c
				c++
			} else if s.pinv[i] < 0 {
				s.lrow = append(s.lrow, i)
				s.lx = append(s.lx, x[i]/pivot)
				c++
			}
			x[i] = 0
		}
	}
	s.lp[n] = len(s.lrow)
	s.up[n] = len(s.ui)
	// All of L, since the rows of the earlier columns are pivoted at
	// later steps, which may have changed.
	if cap(s.li) < len(s.lrow) {
		// As large as L's storage, so that a later factorisation with
		// more entries in L does not reallocate it.
		s.li = make([]int, len(s.lrow), cap(s.lrow))
	}
	s.li = s.li[:len(s.lrow)]
	for p, i := range s.lrow {
		s.li[p] = s.pinv[i]
	}
	return nil
}

// firstSize is the room the first factorisation makes for each of L and
// U (entries, diagonals included): n plus the bound of the entries off
// the diagonal when the order gives one (fillKnown) and it is at most
// 16 times the entries of A, so that the factors of any pivot sequence
// fit without growing; otherwise, where there is no bound or the bound
// is far above what partial pivoting makes (a dense row makes AᵀA
// dense), n plus the entries of A, which reserve grows by doubling when
// the factors need more.
func (s *SparseLU) firstSize() int {
	if s.fillKnown && s.fillBound <= 16*len(s.ax) {
		return s.n + s.fillBound
	}
	return s.n + len(s.ax)
}

// reserve makes room for kl more entries in L and ku in U, growing the
// storage by doubling (append's growth of about 1.25 for large slices
// would leave four times the final size as garbage on a first
// factorisation).
func (s *SparseLU) reserve(kl, ku int) {
	if need := len(s.lrow) + kl; need > cap(s.lrow) {
		c := 2 * need
		s.lrow = append(make([]int, 0, c), s.lrow...)
		s.lx = append(make([]float64, 0, c), s.lx...)
		s.grows++
	}
	if need := len(s.ui) + ku; need > cap(s.ui) {
		c := 2 * need
		s.ui = append(make([]int, 0, c), s.ui...)
		s.ux = append(make([]float64, 0, c), s.ux...)
		s.grows++
	}
}

// sameColumn reports whether column k of A, as found by the full scan,
// has the same rows as in the last factorisation.
func (s *SparseLU) sameColumn(k int) bool {
	a := s.si[s.sp[k]:s.sp[k+1]]
	b := s.si0[s.sp0[k]:s.sp0[k+1]]
	return slices.Equal(a, b)
}

// reach finds the rows that x = L \ A(:,k) can make nonzero and returns
// top: they are s.xi[top:n] in topological order.
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
			x[s.lrow[p]] -= s.lx[p] * xj
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
				i := s.lrow[p]
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
