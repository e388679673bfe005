package solver

import (
	"context"
	"math"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// TestRosenbrockSmoke solves the Rosenbrock system with an analytic and a
// finite-difference Jacobian. Root (1, 1): Moré, Garbow and Hillstrom,
// ACM TOMS 7(1), 1981, problem (1).
func TestRosenbrockSmoke(t *testing.T) {
	p := Problem{Dim: 2,
		Residual: func(r, x []float64) error {
			r[0] = 10 * (x[1] - x[0]*x[0])
			r[1] = 1 - x[0]
			return nil
		},
		Jacobian: func(j *mat.Dense, x []float64) error {
			j.Set(0, 0, -20*x[0])
			j.Set(0, 1, 10)
			j.Set(1, 0, -1)
			return nil
		},
	}
	for _, analytic := range []bool{true, false} {
		q := p
		if !analytic {
			q.Jacobian = nil
		}
		res, err := Solve(context.Background(), q, []float64{-1.2, 1}, nil)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(res.X[0]-1) > 1e-9 || math.Abs(res.X[1]-1) > 1e-9 { // MGH 1981 (1): root (1, 1)
			t.Errorf("analytic=%v: root %v, want (1, 1)", analytic, res.X)
		}
	}
}
