package heatplan

import (
	"math"
	"testing"

	"steamcase/plant/fuel"
	"steamcase/plant/loads"
)

// smallTank is a tank of HSFO small enough to move several kelvin in a
// day (invented figures).
func smallTank(t testing.TB, volume, coil float64) *loads.TankHeating {
	f, err := fuel.Grade("HSFO")
	must(t, err)
	cg, err := loads.CargoFromFuel(f)
	must(t, err)
	return &loads.TankHeating{Name: "small", Cargo: cg, CargoVolume: volume,
		Boundaries: []loads.Boundary{{Name: "deck", Area: 400, U: 4.5, Beyond: loads.Air}, {Name: "shell", Area: 700, U: 3.5, Beyond: loads.Sea}},
		Coil:       loads.Coil{Area: coil}}
}

// testCurve is an invented fuel curve: a second boiler starting at 1 MW
// (the jump), the boilers' capacity at 2.5 MW.
var testCurve = FuelCurve{Q: []float64{0, 1e6, 1e6, 2.5e6}, F: []float64{0.05, 0.078, 0.095, 0.14}, Boilers: []int{1, 1, 2, 2}, Cap: 2.5e6}

const steam7 = 170.48 + 273.15 // 7 bar(g), docs/reference/plant-checks.md §0 [C]

// smallProblem is 3 rows of 24 h and two tanks on a coarse grid (1 K):
// A from 45 °C must reach 48 °C at the end; B from 46 °C must reach
// 47 °C at the end and never fall below 42 °C.
func smallProblem(t testing.TB, snap bool) *problem {
	amb := []loads.Ambient{{Sea: 281.15, Air: 275.15}, {Sea: 279.15, Air: 271.15}, {Sea: 278.15, Air: 270.15}}
	mk := func(name string, tank *loads.TankHeating, start, req, floor float64) *tankDP {
		d := &tankDP{name: name, start: start, floor: floor, periods: make([]loads.Period, 3), heat: []bool{true, true, true},
			req: make([]float64, 4)}
		for r := range 3 {
			p, err := tank.Period(24*3600, amb[r], steam7)
			must(t, err)
			d.periods[r] = p
		}
		d.req[3] = req
		must(t, d.grid(1, 3, snap))
		d.precompute(3, snap)
		return d
	}
	a := mk("A", smallTank(t, 1500, 70), 318.15, 321.15, 0)
	b := mk("B", smallTank(t, 1200, 50), 319.15, 320.15, 315.15)
	return &problem{rows: 3, dt: []float64{86400, 86400, 86400}, fuel: []FuelCurve{testCurve, testCurve, testCurve},
		tanks: []*tankDP{a, b}, snap: snap}
}

// brute returns the least cost (fuel and penalties) over every sequence
// of the two tanks' controls from their exact starts, by enumeration.
func brute(pb *problem) float64 {
	var rec func(r int, Ta, Tb float64) float64
	rec = func(r int, Ta, Tb float64) float64 {
		a, b := pb.tanks[0], pb.tanks[1]
		pen := a.penalty(r, Ta) + b.penalty(r, Tb)
		if r == pb.rows {
			return pen
		}
		best := math.Inf(1)
		for _, x := range a.controls(nil, r, Ta, pb.snap) {
			for _, y := range b.controls(nil, r, Tb, pb.snap) {
				f := pb.fuel[r].At(x.Q + y.Q)
				if math.IsInf(f, 1) {
					continue
				}
				if v := pb.dt[r]*f + rec(r+1, x.T1, y.T1); v < best {
					best = v
				}
			}
		}
		return best + pen
	}
	return rec(0, pb.tanks[0].start, pb.tanks[1].start)
}

// total is the cost of plans as brute counts it.
func total(pb *problem, plans []plan) float64 {
	f, pen, short := pb.cost(plans)
	if len(short) > 0 {
		return math.Inf(1)
	}
	return f + pen
}

// TestJointAgainstBruteForce checks the joint programme against brute
// force on 3 rows × 2 tanks on a coarse grid, where every control ends on
// a grid temperature (snap), so that the programme is exact: the same
// optimum, to 1e-9 relative (a check of the method, no outside source).
// The coordinate descent, started from the tanks alone, is checked not
// to beat it and its gap is logged.
func TestJointAgainstBruteForce(t *testing.T) {
	t.Parallel()
	pb := smallProblem(t, true)
	want := brute(pb)
	if math.IsInf(want, 1) || want > penaltyPerK {
		t.Fatalf("brute force finds no plan that meets the requirements: %g", want)
	}
	plans := pb.joint()
	got := total(pb, plans)
	if e := math.Abs(got-want) / want; e > 1e-9 {
		t.Errorf("joint %.9g kg, brute force %.9g kg (%.1e)", got, want, e)
	}
	d, _ := pb.descend(20)
	dc := total(pb, d)
	if dc < want*(1-1e-9) {
		t.Errorf("descent %.9g kg beats the brute-force optimum %.9g kg", dc, want)
	}
	t.Logf("brute force %.3f kg, joint %.3f kg, descent %.3f kg (+%.3f %%)", want, got, dc, 100*(dc-want)/want)
}

// TestInterpolatedAgainstBruteForce checks the production scheme (every
// control, ends between grid points interpolated) on the same small case
// against brute force over the same controls from the exact states: the
// plan costs no less than the optimum and no more than 1 % above it (the
// interpolation's error on a 1 K grid).
func TestInterpolatedAgainstBruteForce(t *testing.T) {
	t.Parallel()
	pb := smallProblem(t, false)
	want := brute(pb)
	got := total(pb, pb.joint())
	if got < want*(1-1e-9) || got > want*1.01 {
		t.Errorf("interpolated joint plan %.6g kg, brute force %.6g kg", got, want)
	}
	t.Logf("brute force %.3f kg, interpolated joint %.3f kg (+%.4f %%)", want, got, 100*(got-want)/want)
}

// TestFuelCurve checks the curve's interpolation, its jump and its cap.
func TestFuelCurve(t *testing.T) {
	t.Parallel()
	c := testCurve
	for _, tc := range []struct{ q, want float64 }{
		{0, 0.05}, {0.5e6, 0.064}, {1e6, 0.095}, {1.75e6, 0.1175}, {2.5e6, 0.14},
	} {
		if got := c.At(tc.q); math.Abs(got-tc.want) > 1e-12 {
			t.Errorf("At(%g) %.12g, want %.12g", tc.q, got, tc.want)
		}
	}
	if !math.IsInf(c.At(2.6e6), 1) || !math.IsInf(c.At(math.NaN()), 1) {
		t.Error("above the cap, or NaN, is not +Inf")
	}
}
