package solver

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/blas"
	"gonum.org/v1/gonum/blas/blas64"
	"gonum.org/v1/gonum/lapack"
	lapackgonum "gonum.org/v1/gonum/lapack/gonum"
	"gonum.org/v1/gonum/lapack/lapack64"
	"gonum.org/v1/gonum/mat"
)

// Factorizer factorises a square matrix and solves with it. The solver
// calls Factorize once per iteration with its own scaled Jacobian and then
// Solve once or more; the factorisation must not keep j between calls other
// than by copying it. A sparse factorisation can replace the dense LU by
// implementing this interface.
type Factorizer interface {
	// Factorize factorises j. It returns an error only if the matrix
	// cannot be factorised at all (an exactly zero pivot, say).
	Factorize(j *mat.Dense) error
	// Cond returns a condition estimate of the last factorised matrix
	// (+Inf if singular).
	Cond() float64
	// Solve solves j·dst = b with the last factorised j. dst and b have the
	// matrix order and may be the same slice.
	Solve(dst, b []float64) error
}

// PatternFactorizer is a Factorizer that can be told once which entries
// of the matrices it will factorise may be nonzero. New calls SetPattern
// with the Problem's Dim and Pattern (pattern[i] lists the columns of row
// i) when the Problem has a Pattern; from then on the factorizer may read
// only those entries, taking the others as zero, which the solver
// guarantees for the scaled Jacobians it hands over. SparseLU implements
// it.
type PatternFactorizer interface {
	Factorizer
	SetPattern(n int, pattern [][]int)
}

// SparseFactorizer is a Factorizer that also factorises a *Sparse
// directly. With a Pattern the solver hands it its sparse Jacobian
// instead of a dense copy. SparseLU and DenseLU implement it.
type SparseFactorizer interface {
	Factorizer
	FactorizeSparse(j *Sparse) error
}

// Holder is a Factorizer that says whether it holds a factorisation that
// the next Solve may start from (Settings.ChordStart): one of the same
// Problem's scaled Jacobian at an earlier point. SparseLU implements it;
// a Factorizer that serves several configurations of a model (a cache of
// LUs) answers for the one the next solve takes.
type Holder interface {
	Factorizer
	Holds() bool
}

// Refactorizer is a SparseFactorizer that can refactorise a matrix of the
// pattern of its last factorisation keeping that factorisation's pivot
// order where the pivots stay acceptable (SparseLU.RefactorSparse). The
// solver uses it with Settings.KeepPivots.
type Refactorizer interface {
	SparseFactorizer
	RefactorSparse(j *Sparse) error
	// KeptPivots returns the number of steps of the last factorisation
	// whose pivot is not the one a fresh factorisation would choose:
	// zero when the factors are those of FactorizeSparse.
	KeptPivots() int
}

// condBounder is a Factorizer with a cheap upper bound of the condition
// number of its last factorisation (≥ the true 1-norm condition number,
// +Inf if unknown), so that the solver can skip the dearer estimate when
// the bound is within Settings.MaxCondition.
type condBounder interface {
	CondBound() float64
}

// ErrExactlySingular is returned by a Factorizer for an exactly singular matrix.
var ErrExactlySingular = errors.New("solver: matrix is exactly singular")

// DenseLU is the default Factorizer: LU with partial pivoting, the LAPACK
// 1-norm condition estimate (Dgecon) and Dgetrs, all from gonum's LAPACK.
// It owns its work space. Below order BlockedFrom it factorises with the
// unblocked Dgetf2, which allocates nothing; from BlockedFrom on it uses
// the blocked Dgetrf, whose parallel Dgemm starts goroutines and allocates
// (about 290 times per factorisation at order 500) but is faster there.
// Measured on the development machine (2 shared cores): order 200,
// Dgetf2 0.7 ms against Dgetrf 1.3 ms; order 500, Dgetf2 31–46 ms against
// Dgetrf 20–30 ms. (gonum's mat.LU also takes work space from a pool,
// which allocates on every call; hence the direct LAPACK calls.) The zero
// value is ready to use.
type DenseLU struct {
	// BlockedFrom is the order from which the blocked Dgetrf is used.
	// Zero means DefaultBlockedFrom; a negative value never uses it, so
	// the factorisation allocates nothing at any order.
	BlockedFrom int

	n     int
	a     blas64.General // the factors
	b     blas64.General // right-hand side, n×1
	ipiv  []int
	iwork []int
	work  []float64
	cond  float64
	ok    bool
}

// DefaultBlockedFrom is the default DenseLU.BlockedFrom.
const DefaultBlockedFrom = 320

// NewDenseLU returns a DenseLU.
func NewDenseLU() *DenseLU { return &DenseLU{} }

// Factorize implements Factorizer.
func (d *DenseLU) Factorize(j *mat.Dense) error {
	n, c := j.Dims()
	if n != c {
		panic(fmt.Sprintf("solver: DenseLU.Factorize of a %d×%d matrix, want square", n, c))
	}
	d.ensure(n)
	raw := j.RawMatrix()
	for i := 0; i < n; i++ {
		copy(d.a.Data[i*n:(i+1)*n], raw.Data[i*raw.Stride:i*raw.Stride+n])
	}
	return d.factorize()
}

// FactorizeSparse implements SparseFactorizer: it copies j into its
// dense storage (zeros outside the pattern) and factorises that, as
// Factorize would a dense copy of j.
func (d *DenseLU) FactorizeSparse(j *Sparse) error {
	n := j.pat.n
	d.ensure(n)
	clear(d.a.Data)
	for i := 0; i < n; i++ {
		cols, vals := j.Row(i)
		row := d.a.Data[i*n : (i+1)*n]
		for k, c := range cols {
			row[c] = vals[k]
		}
	}
	return d.factorize()
}

func (d *DenseLU) ensure(n int) {
	if d.n != n || d.a.Data == nil {
		d.n = n
		d.a = blas64.General{Rows: n, Cols: n, Stride: n, Data: make([]float64, n*n)}
		d.b = blas64.General{Rows: n, Cols: 1, Stride: 1, Data: make([]float64, n)}
		d.ipiv = make([]int, n)
		d.iwork = make([]int, n)
		d.work = make([]float64, 4*n)
	}
}

// factorize factorises d.a in place.
func (d *DenseLU) factorize() error {
	n := d.n
	anorm := lapack64.Lange(lapack.MaxColumnSum, d.a, d.work)
	from := d.BlockedFrom
	if from == 0 {
		from = DefaultBlockedFrom
	}
	if from > 0 && n >= from {
		d.ok = lapack64.Getrf(d.a, d.ipiv)
	} else {
		d.ok = lapackgonum.Implementation{}.Dgetf2(n, n, d.a.Data, n, d.ipiv)
	}
	if !d.ok {
		d.cond = math.Inf(1)
		return ErrExactlySingular
	}
	rcond := lapack64.Gecon(lapack.MaxColumnSum, d.a, anorm, d.work, d.iwork)
	d.cond = 1 / rcond
	return nil
}

// Cond implements Factorizer.
func (d *DenseLU) Cond() float64 { return d.cond }

// Solve implements Factorizer.
func (d *DenseLU) Solve(dst, b []float64) error {
	if len(dst) != d.n || len(b) != d.n {
		panic(fmt.Sprintf("solver: DenseLU.Solve with lengths %d and %d, want %d", len(dst), len(b), d.n))
	}
	if !d.ok {
		return ErrExactlySingular
	}
	copy(d.b.Data, b)
	lapack64.Getrs(blas.NoTrans, d.a, d.b, d.ipiv)
	copy(dst, d.b.Data)
	return nil
}
