package heatplan

import (
	"context"
	"testing"

	"steamcase/plant/loads"
)

// hourlyProblem is the size: a 14-day hourly route (336 rows)
// with three tank groups on the 0.25 K grid, each 9000 m³ of HSFO with a
// 700 m² coil, from 45 °C to 57 °C at the end, with an invented fuel
// curve (a second boiler from 1 MW, capacity 2.5 MW). It times the
// dynamic programme alone (controls and descent).
func hourlyProblem(b *testing.B) *problem {
	n := 336
	pb := &problem{rows: n, dt: make([]float64, n), fuel: make([]FuelCurve, n)}
	for r := range n {
		pb.dt[r] = 3600
		pb.fuel[r] = testCurve
	}
	for k := range 3 {
		tank := smallTank(b, 9000, 700)
		tank.Boundaries = []loads.Boundary{{Name: "deck", Area: 1400, U: 4.5, Beyond: loads.Air}, {Name: "shell", Area: 2600, U: 3.5, Beyond: loads.Sea}}
		d := &tankDP{name: string(rune('A' + k)), start: 318.15 - float64(k), periods: make([]loads.Period, n), heat: make([]bool, n), req: make([]float64, n+1)}
		for r := range n {
			amb := loads.Ambient{Sea: 282.15 - 6*float64(r)/float64(n), Air: 276.15 - 10*float64(r)/float64(n)}
			p, err := tank.Period(3600, amb, steam7)
			must(b, err)
			d.periods[r], d.heat[r] = p, true
		}
		d.req[n] = 330.15
		must(b, d.grid(0.25, 3, false))
		pb.tanks = append(pb.tanks, d)
	}
	return pb
}

// BenchmarkPlanDP times the programme of 336 rows × 3 tanks at 0.25 K
// (the target: 2 s on one core): the controls of every grid state
// and the coordinate descent.
func BenchmarkPlanDP(b *testing.B) {
	pb := hourlyProblem(b)
	states, sweeps := 0, 0
	for _, t := range pb.tanks {
		states += t.n
	}
	for b.Loop() {
		for _, t := range pb.tanks {
			t.precompute(pb.rows, false)
		}
		_, sweeps = pb.descend(20)
	}
	b.ReportMetric(float64(states), "grid-states")
	b.ReportMetric(float64(sweeps), "sweeps/op")
}

// BenchmarkPlanTanker times a whole plan on the plant of the tests: 336
// hourly rows, three tanks, the fuel curves solved on one core, the
// programme, and the plan and the naive plans solved as voyages.
func BenchmarkPlanTanker(b *testing.B) {
	p := tanker(b, 3, 700)
	rows := route(336, 1)
	tanks := []Tank{{Unit: "COT 1", StartT: 318.15}, {Unit: "COT 2", StartT: 317.15}, {Unit: "COT 3", StartT: 316.15}}
	reqs := []Requirement{
		{Tank: "COT 1", T: 330.15, Phase: "discharge", Label: "discharge"},
		{Tank: "COT 2", T: 330.15, Phase: "discharge", Label: "discharge"},
		{Tank: "COT 3", T: 328.15, Phase: "discharge", Label: "discharge"},
	}
	var res *Result
	for b.Loop() {
		var err error
		res, err = Plan(context.Background(), p, rows, tanks, reqs, Options{Workers: 1})
		must(b, err)
	}
	b.ReportMetric(float64(res.Solves), "solves/op")
	b.ReportMetric(res.SavingT(res.Hold), "t-saved-vs-hold")
}
