package solver

import (
	"math"
	"math/rand/v2"
	"strconv"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// fillSystem is a matrix for the fill comparisons: a pattern and its
// values as a Sparse.
type fillSystem struct {
	name string
	a    *Sparse
}

// fillSystems returns the solver's large test systems, with their
// Jacobians at the start point: the plant-like star (orders 500 and
// 2000, and 8000 unless short), the Bratu grids of 1024 and 2025
// unknowns, the pipe network of 1976, the banded Moré–Garbow–Hillstrom
// systems at their benchmark sizes, and seeded random patterns.
func fillSystems(short bool) []fillSystem {
	var out []fillSystem
	orders := []int{500, 2000}
	if !short {
		orders = append(orders, 8000)
	}
	for _, n := range orders {
		st := starOfOrder(n)
		a := NewSparse(st.n, st.pattern)
		_ = st.sparseJacobian(a, nil)
		out = append(out, fillSystem{"star n=" + strconv.Itoa(st.n), a})
	}
	for _, m := range []int{32, 45} {
		b := newBratu(m, 1)
		a := NewSparse(b.n, b.pattern)
		_ = b.sparseJacobian(a, b.x0)
		out = append(out, fillSystem{"bratu n=" + strconv.Itoa(b.n), a})
	}
	nt := newNetwork(26, 26, 3)
	a := NewSparse(nt.n, nt.pattern)
	nt.jacobian(nt.x0, a.Set)
	out = append(out, fillSystem{"network n=" + strconv.Itoa(nt.n), a})
	for _, m := range []mghProblem{broydenTridiagonal(500), broydenBanded(500), discreteBVP(50), extendedRosenbrock(50), extendedPowellSingular(48)} {
		d := mat.NewDense(m.n, m.n, nil)
		m.jac(d, m.x0)
		out = append(out, fillSystem{m.name + " n=" + strconv.Itoa(m.n), sparseOf(m.pattern, d)})
	}
	rng := rand.New(rand.NewPCG(41, 2))
	for _, n := range []int{100, 400, 1000} {
		p, d := randomSparse(rng, n, 3/float64(n))
		out = append(out, fillSystem{"random n=" + strconv.Itoa(n), sparseOf(p, d)})
	}
	return out
}

// sparseBackwardError returns ‖A·x − b‖∞/(‖A‖∞‖x‖∞ + ‖b‖∞) for a Sparse A.
func sparseBackwardError(a *Sparse, x, b []float64) float64 {
	n, _ := a.Dims()
	rmax, anorm := 0.0, 0.0
	for i := 0; i < n; i++ {
		cols, vals := a.Row(i)
		r, s := -b[i], 0.0
		for k, j := range cols {
			r += vals[k] * x[j]
			s += math.Abs(vals[k])
		}
		rmax = math.Max(rmax, math.Abs(r))
		anorm = math.Max(anorm, s)
	}
	return rmax / (anorm*infNorm(x) + infNorm(b))
}

// TestOrderFill factorises each of fillSystems with SparseLU in the
// minimum degree order and logs the entries of L and U (diagonals
// included) against those of A, the fill the order leaves; each solve
// must be backward stable, ‖A·x − b‖ ≤ 1e-12·(‖A‖‖x‖ + ‖b‖) (threshold
// partial pivoting with a threshold of 0.1 bounds the growth; common
// practice, no source). go test -run OrderFill -v prints the table.
func TestOrderFill(t *testing.T) {
	t.Parallel()
	for _, sys := range fillSystems(testing.Short()) {
		n, _ := sys.a.Dims()
		lu := &SparseLU{MinDegree: true}
		if err := lu.FactorizeSparse(sys.a); err != nil {
			t.Errorf("%s: %v", sys.name, err)
			continue
		}
		b := make([]float64, n)
		for i := range b {
			b[i] = 1 + float64(i%5)
		}
		x := make([]float64, n)
		if err := lu.Solve(x, b); err != nil {
			t.Fatal(err)
		}
		if e := sparseBackwardError(sys.a, x, b); !(e <= 1e-12) {
			t.Errorf("%s: backward error %.3g, want ≤ 1e-12", sys.name, e)
		}
		t.Logf("%-32s nnz(A) %7d  entries of L and U %8d", sys.name, sys.a.NNZ(), len(lu.lrow)+len(lu.ui))
	}
}
