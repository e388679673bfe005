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
	fmt.Printf("%v after %d Newton iterations and %d steps reusing a factorisation\n", res.Status, res.Stats.Iterations, res.Stats.Reuses)
	fmt.Printf("discharge pressure %.4f bar, feed flow %.4f kg/s\n", res.X[0]/1e5, res.X[1])
	// Check by hand: 10e5 − 2e4·2.9758² = 8.2289e5 Pa and
	// 3.5e-3·√(8.2289e5 − 1e5) = 2.9758 kg/s.

	// Output:
	// converged after 2 Newton iterations and 6 steps reusing a factorisation
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
		fmt.Printf("hour %d: drum %.1f bar, feed flow %.4f kg/s, %d+%d steps\n", hour, pDrum/1e5, x[1], res.Stats.Iterations, res.Stats.Reuses)
	}
	// (Steps: Newton iterations + steps that reused the last
	// factorisation; see Settings.NoReuse.)
	// Check by hand for hour 1: 10e5 − 2e4·2.8920² = 8.3273e5 Pa and
	// 3.5e-3·√(8.3273e5 − 1.5e5) = 2.8920 kg/s.

	// Output:
	// hour 0: drum 1.0 bar, feed flow 2.9758 kg/s, 2+6 steps
	// hour 1: drum 1.5 bar, feed flow 2.8920 kg/s, 1+4 steps
	// hour 2: drum 2.0 bar, feed flow 2.8056 kg/s, 1+4 steps
	// hour 3: drum 2.5 bar, feed flow 2.7165 kg/s, 1+4 steps
}

// A model of many unknowns writes its analytic Jacobian into the sparse
// storage that follows the Pattern (Problem.SparseJacobian): nothing of
// size Dim² is made. Here a steam main at 16 bar(a) feeds two consumers
// through pipes with a square-law pressure drop; each consumer draws a
// set flow. Positions found once with Index make the writes a single
// store each; Add and Set look the entry up by binary search instead.
func ExampleProblem_sparseJacobian() {
	const k1, k2 = 2e4, 3e4 // Pa/(kg/s)²
	// Unknowns: main pressure, two pipe flows, two consumer pressures.
	pattern := [][]int{
		{0},       // main pressure set point
		{0, 1, 3}, // pipe 1: p0 − p3 = k1·m1·|m1|
		{0, 2, 4}, // pipe 2: p0 − p4 = k2·m2·|m2|
		{1},       // consumer 1 draws 1.2 kg/s
		{2},       // consumer 2 draws 0.8 kg/s
	}
	var pos []int // positions of the flows' entries in the pipe rows
	p := solver.Problem{
		Dim:     5,
		Pattern: pattern,
		Residual: func(r, x []float64) error {
			r[0] = x[0] - 16e5
			r[1] = x[0] - x[3] - k1*x[1]*math.Abs(x[1])
			r[2] = x[0] - x[4] - k2*x[2]*math.Abs(x[2])
			r[3] = x[1] - 1.2
			r[4] = x[2] - 0.8
			return nil
		},
		SparseJacobian: func(j *solver.Sparse, x []float64) error {
			if pos == nil {
				pos = []int{j.Index(1, 1), j.Index(2, 2)}
			}
			j.Set(0, 0, 1)
			j.Set(1, 0, 1)
			j.Set(1, 3, -1)
			j.Set(2, 0, 1)
			j.Set(2, 4, -1)
			j.Set(3, 1, 1)
			j.Set(4, 2, 1)
			v := j.Values()
			v[pos[0]] = -2 * k1 * math.Abs(x[1])
			v[pos[1]] = -2 * k2 * math.Abs(x[2])
			return nil
		},
	}
	res, err := solver.Solve(context.Background(), p, []float64{15e5, 1, 1, 15e5, 15e5}, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%v: consumer 1 at %.4f bar(a), consumer 2 at %.4f bar(a)\n", res.Status, res.X[3]/1e5, res.X[4]/1e5)
	// By hand: 16e5 − 2e4·1.2² = 15.712e5 Pa, 16e5 − 3e4·0.8² = 15.808e5 Pa.

	// Output:
	// converged: consumer 1 at 15.7120 bar(a), consumer 2 at 15.8080 bar(a)
}
