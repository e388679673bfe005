package plant

import (
	"context"
	"math"
	"testing"
)

// TestTrendStart: on a sweep of a consumer's duty in even steps, the
// cases started from the trend of the last two take fewer residual
// evaluations than the same cases started from the last solution, and
// give the same figures within the solver's tolerance (the boiler fuel
// within 1e-9 relative: the solver converges its scaled residuals to
// 1e-10; common practice, no source).
func TestTrendStart(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	run := func(useTrend bool) (evals int, fuel []float64) {
		p := scaledPlant(t, 2, 6)
		d := p.Component("c1").(*Consumer).Duty
		for k := range 12 {
			c := Case{Name: "sweep", Set: []Setting{{Unit: "c1", Param: "duty", Value: d * (1 + 0.05*float64(k))}}}
			if !useTrend && p.s != nil {
				p.s.trend.reset()
			}
			cr, err := p.Solve(ctx, c)
			must(t, err)
			if k >= 2 {
				evals += p.s.slvRes.Stats.ResidualEvals
			}
			fuel = append(fuel, cr.FuelKgS)
		}
		return evals, fuel
	}
	with, fw := run(true)
	without, fo := run(false)
	t.Logf("%d residual evaluations from the trend, %d from the last solution", with, without)
	if with >= without {
		t.Errorf("%d residual evaluations from the trend, %d from the last solution: want fewer", with, without)
	}
	for k := range fw {
		if math.Abs(fw[k]-fo[k]) > 1e-9*fo[k] {
			t.Errorf("case %d: fuel %.12g kg/s from the trend, %.12g from the last solution", k, fw[k], fo[k])
		}
	}
}

// TestTrendOnlyAlike: the trend predicts a start only after two cases
// that set the same keys, force the same firing (or none) and fired the
// same number of boilers, and only while the inputs keep moving in the
// direction of the last step (the definition; no outside source).
func TestTrendOnlyAlike(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	p := scaledPlant(t, 2, 6)
	d := p.Component("c1").(*Consumer).Duty
	duty := func(f float64) Case {
		return Case{Name: "t", Set: []Setting{{Unit: "c1", Param: "duty", Value: f * d}}}
	}
	solve := func(c Case) {
		_, err := p.Solve(ctx, c)
		must(t, err)
	}
	predicts := func(c Case) bool {
		s := p.s
		saved := s.trend
		saved.in0 = append([]float64(nil), s.trend.in0...)
		saved.in1 = append([]float64(nil), s.trend.in1...)
		saved.set0 = append([]Setting(nil), s.trend.set0...)
		saved.set1 = append([]Setting(nil), s.trend.set1...)
		saved.x1 = append([]float64(nil), s.trend.x1...)
		s.trendBegin(&c)
		used := s.trend.usePred
		s.trend = saved
		return used
	}
	solve(duty(1))
	if predicts(duty(1.1)) {
		t.Errorf("a prediction from one case")
	}
	solve(duty(1.05))
	if !predicts(duty(1.1)) {
		t.Errorf("no prediction along the trend of two alike cases")
	}
	if predicts(duty(1)) {
		t.Errorf("a prediction against the trend")
	}
	other := duty(1.1)
	other.Set = append(other.Set, Setting{Unit: "c2", Param: "duty", Value: d})
	if predicts(other) {
		t.Errorf("a prediction for a case that sets other keys")
	}
	forced := duty(1.1)
	forced.Fire = []string{"b1", "b2"}
	if predicts(forced) {
		t.Errorf("a prediction for a case that forces the firing")
	}
	p.ColdStart()
	if predicts(duty(1.1)) {
		t.Errorf("a prediction after a cold start")
	}
}
