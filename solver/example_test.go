package solver_test

import (
	"context"
	"fmt"
	"math"

	"steamcase/solver"
)

// A feed pump delivers through a control valve into a drum at 1 bar. The
// pump curve gives the discharge pressure p from the flow m; the valve
// passes m = k·√(p − p_drum). The unknowns differ by six orders of
// magnitude, so they are scaled; the flow may not be negative and the
// pressure stays above the drum's.
func ExampleSolve() {
	const (
		p0    = 10e5   // shut-off head of the pump, Pa
		a     = 2e4    // pump curve droop, Pa/(kg/s)²
		pDrum = 1e5    // drum pressure, Pa
		k     = 3.5e-3 // valve coefficient, (kg/s)/√Pa
	)
	p := solver.Problem{
		Dim: 2,
		Residual: func(r, x []float64) error {
			pd, m := x[0], x[1]
			r[0] = pd - (p0 - a*m*m)
			r[1] = m - k*math.Sqrt(pd-pDrum)
			return nil
		},
		XScale:   []float64{1e5, 1},
		FScale:   []float64{1e5, 1},
		Pattern:  [][]int{{0, 1}, {0, 1}},
		Lower:    []float64{pDrum, 0},
		Upper:    []float64{math.Inf(1), math.Inf(1)},
		VarNames: []string{"pump discharge pressure", "feed flow"},
		EqNames:  []string{"pump curve", "valve law"},
	}
	res, err := solver.Solve(context.Background(), p, []float64{5e5, 1}, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%v after %d iterations\n", res.Status, res.Stats.Iterations)
	fmt.Printf("discharge pressure %.4f bar, feed flow %.4f kg/s\n", res.X[0]/1e5, res.X[1])
	// Check by hand: 10e5 − 2e4·2.9758² = 8.2289e5 Pa and
	// 3.5e-3·√(8.2289e5 − 1e5) = 2.9758 kg/s.

	// Output:
	// converged after 4 iterations
	// discharge pressure 8.2289 bar, feed flow 2.9758 kg/s
}

// A Solver made once solves a sequence of nearby problems, each from the
// previous answer, without allocating: here the drum pressure rises hour
// by hour. The problem reads the changing input through a variable it
// closes over. New copies scales and bounds, so a bound that moves with
// the input is better expressed as an ErrDomain error from the residual,
// which makes the line search shorten the step.
func ExampleNew() {
	pDrum := 1e5
	p := solver.Problem{
		Dim: 2,
		Residual: func(r, x []float64) error {
			if x[0] < pDrum {
				return fmt.Errorf("pump discharge %g Pa below the drum: %w", x[0], solver.ErrDomain)
			}
			r[0] = x[0] - (10e5 - 2e4*x[1]*x[1])
			r[1] = x[1] - 3.5e-3*math.Sqrt(x[0]-pDrum)
			return nil
		},
		XScale: []float64{1e5, 1},
		FScale: []float64{1e5, 1},
		Lower:  []float64{0, 0},
		Upper:  []float64{math.Inf(1), math.Inf(1)},
	}
	sv, err := solver.New(p, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	x := []float64{5e5, 1}
	for hour := 0; hour < 4; hour++ {
		pDrum = 1e5 + 0.5e5*float64(hour)
		res, err := sv.Solve(context.Background(), x)
		if err != nil {
			fmt.Println(err)
			return
		}
		copy(x, res.X) // res belongs to sv and is overwritten by the next Solve
		fmt.Printf("hour %d: drum %.1f bar, feed flow %.4f kg/s, %d iterations\n", hour, pDrum/1e5, x[1], res.Stats.Iterations)
	}
	// Check by hand for hour 1: 10e5 − 2e4·2.8920² = 8.3273e5 Pa and
	// 3.5e-3·√(8.3273e5 − 1.5e5) = 2.8920 kg/s.

	// Output:
	// hour 0: drum 1.0 bar, feed flow 2.9758 kg/s, 4 iterations
	// hour 1: drum 1.5 bar, feed flow 2.8920 kg/s, 3 iterations
	// hour 2: drum 2.0 bar, feed flow 2.8056 kg/s, 3 iterations
	// hour 3: drum 2.5 bar, feed flow 2.7165 kg/s, 3 iterations
}
