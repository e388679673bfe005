package plant

import (
	"context"
	"fmt"
	"testing"
)

// scaledPlant is twoBoilers grown: nb boilers on one feed header and one
// steam header, and nc heat consumers each returning 95 % of its
// condensate to the hotwell. Its duties are invented, sized so that the
// boilers carry them at about 60 % of MCR.
func scaledPlant(t testing.TB, nb, nc int) *Plant {
	p := New(fmt.Sprintf("%d boilers, %d consumers", nb, nc), Options{})
	fuel := FuelSpec{Name: "HFO", LHV: 40.2e6, CO2Factor: 3.114}
	eta := &EfficiencyTable{Load: []float64{0.25, 0.5, 0.75, 1.0}, Eta: []float64{0.80, 0.84, 0.85, 0.845}}
	var boilers []string
	for i := range nb {
		boilers = append(boilers, fmt.Sprintf("b%d", i+1))
	}
	must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 288.15}))
	must(t, p.Add(&FeedTank{Base: Base{Name: "hotwell"}, HeatLoss: 5e3}))
	must(t, p.Add(&FeedPump{Base: Base{Name: "fp"}, Boilers: boilers, Margin: 3 * bar, Eta: 0.45}))
	must(t, p.Add(&Header{Base: Base{Name: "feed header"}}))
	must(t, p.Add(&Header{Base: Base{Name: "main"}, HeatLoss: 10e3}))
	p.Connect("makeup", Pos{}, "makeup", "out", "hotwell", "in")
	p.Connect("suction", Pos{}, "hotwell", "out", "fp", "in")
	p.Connect("discharge", Pos{}, "fp", "out", "feed header", "in")
	for _, b := range boilers {
		must(t, p.Add(&Boiler{Base: Base{Name: b}, MCR: 10000.0 / 3600, DrumP: gauge(7), Turndown: 4,
			Blowdown: 0.01, Dryness: 0.98, Efficiency: eta, Fuel: fuel}))
		p.Connect("feed "+b, Pos{}, "feed header", "out", b, "feed")
		p.Connect("steam "+b, Pos{}, b, "steam", "main", "in")
	}
	duty := 0.6 * float64(nb) * 6e6 / float64(nc)
	for i := range nc {
		c := fmt.Sprintf("c%d", i+1)
		must(t, p.Add(&Consumer{Base: Base{Name: c}, Duty: duty, SubCooling: 10, ReturnFraction: 0.95}))
		p.Connect("to "+c, Pos{}, "main", "out", c, "in")
		p.Connect("return "+c, Pos{}, c, "out", "hotwell", "in")
	}
	return p
}

// TestScaledPlantSolves: the benchmarks' grown plant converges with its
// balances closed (mass ≤ 1e-9, energy ≤ 1e-6 relative, as
// TestClosedPlantBalances; common practice, no source) and fires the
// boilers its demand needs.
func TestScaledPlantSolves(t *testing.T) {
	t.Parallel()
	for _, sz := range []struct{ nb, nc int }{{1, 3}, {2, 40}, {4, 320}} {
		p := scaledPlant(t, sz.nb, sz.nc)
		cr, err := p.Solve(context.Background(), Case{Name: "scaled"})
		must(t, err)
		if !cr.Converged || cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
			t.Errorf("%s: converged %v, balances %+v", p.Name, cr.Converged, cr.Balance)
		}
		if len(cr.Consumers) != sz.nc {
			t.Errorf("%s: %d consumers reported, want %d", p.Name, len(cr.Consumers), sz.nc)
		}
	}
}

// BenchmarkCompile times building and compiling a plant (its check, the
// layout of unknowns and equations, the structural diagnosis and the
// solver's symbolic analysis) as the number of consumers grows: the
// unknowns are reported per size.
func BenchmarkCompile(b *testing.B) {
	for _, nc := range []int{40, 160, 320, 640} {
		b.Run(fmt.Sprintf("consumers=%d", nc), func(b *testing.B) {
			var dim int
			for b.Loop() {
				p := scaledPlant(b, 2, nc)
				if err := p.Check(); err != nil {
					b.Fatal(err)
				}
				dim = p.s.prob.Dim
			}
			b.ReportMetric(float64(dim), "unknowns")
		})
	}
}

// BenchmarkCaseScaled times one warm case (a consumer's duty changed by a
// little each time, as consecutive hours of a profile) for plants of a
// few boilers and a growing number of consumers: the cost per case should
// grow about linearly with the unknowns, and an extra boiler should cost
// about what its few unknowns do.
func BenchmarkCaseScaled(b *testing.B) {
	for _, sz := range []struct{ nb, nc int }{{2, 40}, {2, 320}, {4, 40}, {8, 40}} {
		b.Run(fmt.Sprintf("boilers=%d/consumers=%d", sz.nb, sz.nc), func(b *testing.B) {
			p := scaledPlant(b, sz.nb, sz.nc)
			ctx := context.Background()
			c := Case{Name: "bench", Set: []Setting{{Unit: "c1", Param: "duty"}}}
			duty := p.Component("c1").(*Consumer).Duty
			c.Set[0].Value = duty
			if _, err := p.Solve(ctx, c); err != nil {
				b.Fatal(err)
			}
			var iters int
			k := 0
			for b.Loop() {
				c.Set[0].Value = duty * (1 + 0.001*float64(k%10))
				k++
				cr, err := p.Solve(ctx, c)
				if err != nil {
					b.Fatal(err)
				}
				iters += cr.Iterations
			}
			b.ReportMetric(float64(iters)/float64(b.N), "newton-iters/op")
			b.ReportMetric(float64(p.s.prob.Dim), "unknowns")
		})
	}
}
