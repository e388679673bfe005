package solver

import (
	"fmt"
	"slices"

	"gonum.org/v1/gonum/mat"
)

// Sparse is a square matrix held in compressed sparse rows on a fixed
// pattern: row i has the entries at positions ptr[i] to ptr[i+1]-1, with
// their columns ascending and each column once, and a value for each.
// Entries outside the pattern are exactly zero and cannot be written.
// The pattern never changes; the values do.
//
// Add, Set and At find an entry by binary search among the columns of
// its row: about log₂(d)+1 comparisons for a row of d entries (4 for the
// 9 of a typical plant equation) and no allocation. A caller that writes
// the same entries many times can find their positions once with Index
// and write Values()[pos] directly, which costs one store.
//
// The solver makes the Sparse that Problem.SparseJacobian writes into;
// NewSparse makes one for tests and for other uses.
type Sparse struct {
	pat *sparsePattern
	val []float64
}

// sparsePattern is the structure of a Sparse, shared by the matrices of
// one pattern (the solver's Jacobian, a factorisation's reference).
type sparsePattern struct {
	n        int
	ptr, col []int
	// Names for the panic of an entry outside the pattern (optional).
	rowNames, colNames []string
}

// NewSparse returns an n×n Sparse with the given pattern and all values
// zero. pattern[i] lists the columns of row i in any order; duplicates
// are ignored. It panics if pattern does not have n rows or lists a
// column outside [0, n).
func NewSparse(n int, pattern [][]int) *Sparse {
	if n <= 0 {
		panic(fmt.Sprintf("solver: NewSparse of order %d, want a positive order", n))
	}
	if len(pattern) != n {
		panic(fmt.Sprintf("solver: NewSparse of order %d with a pattern of %d rows", n, len(pattern)))
	}
	for i, row := range pattern {
		for _, j := range row {
			if j < 0 || j >= n {
				panic(fmt.Sprintf("solver: NewSparse: row %d lists column %d, want 0 ≤ column < %d", i, j, n))
			}
		}
	}
	ptr, col := compressPattern(pattern, n)
	return newSparse(&sparsePattern{n: n, ptr: ptr, col: col})
}

func newSparse(p *sparsePattern) *Sparse {
	return &Sparse{pat: p, val: make([]float64, len(p.col))}
}

// Dims returns the order n twice, as mat.Matrix does.
func (s *Sparse) Dims() (r, c int) { return s.pat.n, s.pat.n }

// NNZ returns the number of entries of the pattern.
func (s *Sparse) NNZ() int { return len(s.pat.col) }

// Index returns the position of entry (i, j) in Values, or -1 if the
// pattern does not have it. It panics if i or j is outside [0, n).
func (s *Sparse) Index(i, j int) int {
	n := s.pat.n
	if uint(i) >= uint(n) || uint(j) >= uint(n) {
		panic(fmt.Sprintf("solver: Sparse index (%d, %d) outside the %d×%d matrix", i, j, n, n))
	}
	lo, hi := s.pat.ptr[i], s.pat.ptr[i+1]
	col := s.pat.col
	for lo < hi {
		m := int(uint(lo+hi) >> 1)
		switch c := col[m]; {
		case c < j:
			lo = m + 1
		case c > j:
			hi = m
		default:
			return m
		}
	}
	return -1
}

// index is Index that panics, naming the entry, when it is not in the
// pattern.
func (s *Sparse) index(i, j int, op string) int {
	p := s.Index(i, j)
	if p < 0 {
		panic(s.outside(i, j, op))
	}
	return p
}

func (s *Sparse) outside(i, j int, op string) string {
	name := func(names []string, k int, kind string) string {
		if k < len(names) && names[k] != "" {
			return fmt.Sprintf("%s %d '%s'", kind, k, names[k])
		}
		return fmt.Sprintf("%s %d", kind, k)
	}
	return fmt.Sprintf("solver: Sparse.%s: entry (%s, %s) is not in the pattern",
		op, name(s.pat.rowNames, i, "row"), name(s.pat.colNames, j, "column"))
}

// Add adds v to entry (i, j). It panics if the entry is not in the
// pattern, naming the equation and unknown when the solver made s.
func (s *Sparse) Add(i, j int, v float64) { s.val[s.index(i, j, "Add")] += v }

// Set sets entry (i, j) to v. It panics if the entry is not in the
// pattern.
func (s *Sparse) Set(i, j int, v float64) { s.val[s.index(i, j, "Set")] = v }

// At returns entry (i, j), zero outside the pattern.
func (s *Sparse) At(i, j int) float64 {
	if p := s.Index(i, j); p >= 0 {
		return s.val[p]
	}
	return 0
}

// Row returns the columns of row i (ascending; read only) and its values
// (which may be written).
func (s *Sparse) Row(i int) (cols []int, vals []float64) {
	a, b := s.pat.ptr[i], s.pat.ptr[i+1]
	return s.pat.col[a:b:b], s.val[a:b:b]
}

// Values returns the values of all entries, row after row in the order of
// Index. Writing to it writes the matrix.
func (s *Sparse) Values() []float64 { return s.val }

// Zero sets every value to zero.
func (s *Sparse) Zero() { clear(s.val) }

// DenseTo writes s into dst, which must be n×n, zeros outside the
// pattern included.
func (s *Sparse) DenseTo(dst *mat.Dense) {
	n := s.pat.n
	if r, c := dst.Dims(); r != n || c != n {
		panic(fmt.Sprintf("solver: Sparse.DenseTo a %d×%d matrix, want %d×%d", r, c, n, n))
	}
	dst.Zero()
	for i := 0; i < n; i++ {
		cols, vals := s.Row(i)
		for k, j := range cols {
			dst.Set(i, j, vals[k])
		}
	}
}

// samePattern reports whether s and t have the same pattern.
func (s *Sparse) samePattern(t *Sparse) bool {
	if s.pat == t.pat {
		return true
	}
	return s.pat.n == t.pat.n && slices.Equal(s.pat.ptr, t.pat.ptr) && slices.Equal(s.pat.col, t.pat.col)
}
