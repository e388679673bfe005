package solver

import (
	"errors"
	"fmt"
	"math"

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

// ErrExactlySingular is returned by a Factorizer for an exactly singular matrix.
var ErrExactlySingular = errors.New("solver: matrix is exactly singular")

// DenseLU is the default Factorizer: gonum's LU with partial pivoting and
// a 1-norm condition estimate. It reuses its storage across calls of the
// same order. Its zero value is ready to use.
type DenseLU struct {
	lu   mat.LU
	n    int
	bv   *mat.VecDense
	xv   *mat.VecDense
	work []float64
	sol  []float64
}

// NewDenseLU returns a DenseLU.
func NewDenseLU() *DenseLU { return &DenseLU{} }

// Factorize implements Factorizer.
func (d *DenseLU) Factorize(j *mat.Dense) error {
	n, c := j.Dims()
	if n != c {
		panic(fmt.Sprintf("solver: DenseLU.Factorize of a %d×%d matrix, want square", n, c))
	}
	if d.n != n || d.bv == nil {
		d.n = n
		d.work = make([]float64, n)
		d.sol = make([]float64, n)
		d.bv = mat.NewVecDense(n, d.work)
		d.xv = mat.NewVecDense(n, d.sol)
	}
	d.lu.Factorize(j)
	if math.IsInf(d.lu.Cond(), 1) {
		return ErrExactlySingular
	}
	return nil
}

// Cond implements Factorizer.
func (d *DenseLU) Cond() float64 { return d.lu.Cond() }

// Solve implements Factorizer. A gonum condition warning is not an error
// here: the solver judges the condition number itself.
func (d *DenseLU) Solve(dst, b []float64) error {
	if len(dst) != d.n || len(b) != d.n {
		panic(fmt.Sprintf("solver: DenseLU.Solve with lengths %d and %d, want %d", len(dst), len(b), d.n))
	}
	copy(d.work, b)
	err := d.lu.SolveVecTo(d.xv, false, d.bv)
	var c mat.Condition
	if err != nil && !errors.As(err, &c) {
		return err
	}
	copy(dst, d.sol)
	return nil
}
