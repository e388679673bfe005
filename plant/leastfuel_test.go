package plant

import (
	"context"
	"fmt"
	"math"
	"strings"
	"testing"
)

// quadEta is a smooth efficiency curve for the tests: η(l) = top −
// k·(l − best)², on the LHV basis.
type quadEta struct{ top, k, best float64 }

func (q quadEta) Efficiency(op BoilerOperation) (EfficiencyPoint, error) {
	d := op.Load - q.best
	return EfficiencyPoint{Eta: q.top - q.k*d*d}, nil
}

func (q quadEta) Basis() string { return "LHV" }

// linEta is a straight rising curve: η(l) = a + b·l.
type linEta struct{ a, b float64 }

func (m linEta) Efficiency(op BoilerOperation) (EfficiencyPoint, error) {
	return EfficiencyPoint{Eta: m.a + m.b*op.Load}, nil
}

func (m linEta) Basis() string { return "LHV" }

// threeBoilers is twoBoilers with a third boiler of 6 t/h on its own
// curve, flatter and lower.
func threeBoilers(t testing.TB, opt Options) *Plant {
	p := twoBoilers(t, opt)
	fp := p.Component("fp").(*FeedPump)
	fp.Boilers = append(fp.Boilers, "b3")
	must(t, p.Add(&Boiler{Base: Base{Name: "b3"}, MCR: 6000.0 / 3600, DrumP: gauge(7), Turndown: 3,
		Blowdown: 0.01, Dryness: 0.98, Fuel: p.Component("b1").(*Boiler).Fuel,
		Efficiency: &EfficiencyTable{Load: []float64{0.3, 0.6, 1}, Eta: []float64{0.82, 0.835, 0.83}}}))
	p.Connect("feed3", Pos{}, "feed header", "out", "b3", "feed")
	p.Connect("steam3", Pos{}, "b3", "steam", "main", "in")
	return p
}

// bruteForce solves the case with every firing set and, for each, every
// split on a grid of step 1/grid of the steam (each share a multiple of
// it), within the bounds least-fuel sharing respects (leastfuel.go: the
// burner minimum when two or more fire, the usable fraction when fewer
// than all fire, the limit), and returns the least fuel solved.
func bruteForce(t *testing.T, p *Plant, c Case, grid int) float64 {
	t.Helper()
	ctx := context.Background()
	// The demand from the case itself, then the grid on its plant.
	cr, err := p.Solve(ctx, c)
	must(t, err)
	restore, err := p.applySettings(&c)
	must(t, err)
	defer restore()
	p.rankShedding()
	s := p.s
	s.ev = eval{cond: c.Conditions, pl: p}
	boilers := s.asm.roles.boilers
	n := len(boilers)
	demand := cr.SteamProductionKgS - cr.EGESteamKgS
	best := math.Inf(1)
	var shares func(k int, left int, sh []float64)
	for mask := 1; mask < 1<<n; mask++ {
		fire := make([]bool, n)
		var idx []int
		for i := range boilers {
			if mask&(1<<i) != 0 {
				fire[i] = true
				idx = append(idx, i)
			}
		}
		k := len(idx)
		shares = func(j int, left int, sh []float64) {
			if j == k-1 {
				sh[idx[j]] = float64(left) / float64(grid)
				for _, i := range idx {
					b := boilers[i]
					m := sh[i] * demand
					lo, hi := 0.0, b.Limit()
					if k >= 2 {
						lo = b.MinLoad() * b.MCR
					}
					if k < n {
						hi = p.usable(b)
					}
					if m < lo*(1-1e-6) || m > hi*(1+1e-6) {
						return
					}
				}
				s.shares, s.noShed = append([]float64(nil), sh...), true
				if err := p.solveConfig(ctx, fire); err != nil {
					return
				}
				var fuel float64
				for _, b := range boilers {
					fuel += s.last[b.fuel]
				}
				if p.anyOverLimit(fire) {
					return
				}
				best = math.Min(best, fuel)
				return
			}
			for q := 0; q <= left; q++ {
				sh[idx[j]] = float64(q) / float64(grid)
				shares(j+1, left-q, sh)
			}
		}
		shares(0, grid, make([]float64, n))
	}
	s.shares = nil
	return best
}

func TestLeastFuelAgainstBruteForce(t *testing.T) {
	t.Parallel()
	// Least-fuel sharing burns no more than equal sharing, and no more
	// than the best of a brute-force grid over every firing set and split
	// (1 % of the steam for two boilers, 2.5 % for three), to the grid's
	// own resolution of the search it did not make: its answer is at most
	// the grid's best plus 1e-6 relative (no outside source; the grid is
	// the check).
	for _, tc := range []struct {
		name  string
		build func(testing.TB, Options) *Plant
		grid  int
		kgh   []float64
	}{
		{"two boilers", twoBoilers, 100, []float64{3000, 7000, 9000, 14000, 18000}},
		{"three boilers", threeBoilers, 40, []float64{5000, 12000, 20000}},
	} {
		for _, kgh := range tc.kgh {
			c := demandCase("case", kgh)
			lf, err := tc.build(t, Options{Sharing: LeastFuel}).Solve(context.Background(), c)
			must(t, err)
			eq, err := tc.build(t, Options{}).Solve(context.Background(), c)
			must(t, err)
			if lf.LeastFuel == nil {
				t.Fatalf("%s, %.0f kg/h: no least-fuel result", tc.name, kgh)
			}
			within(t, tc.name+": the reference is equal sharing", lf.LeastFuel.EqualFuelKgS, eq.FuelKgS, 1e-9)
			if lf.FuelKgS > eq.FuelKgS*(1+1e-12) {
				t.Errorf("%s, %.0f kg/h: least fuel %.6f kg/s > equal sharing %.6f", tc.name, kgh, lf.FuelKgS, eq.FuelKgS)
			}
			within(t, tc.name+": saving", lf.LeastFuel.SavedKgS, eq.FuelKgS-lf.FuelKgS, 1e-9)
			bf := bruteForce(t, tc.build(t, Options{}), c, tc.grid)
			if lf.FuelKgS > bf*(1+1e-6) {
				t.Errorf("%s, %.0f kg/h: least fuel %.7f kg/s, the brute-force grid %.7f (%v, shares %v)", tc.name, kgh,
					lf.FuelKgS, bf, lf.LeastFuel.Firing, lf.LeastFuel.Shares)
			}
			if lf.Balance.MassRel > 1e-9 || lf.Balance.EnergyRel > 1e-6 {
				t.Errorf("%s, %.0f kg/h: balances %+v", tc.name, kgh, lf.Balance)
			}
		}
	}
}

func TestLeastFuelEqualWhenConvex(t *testing.T) {
	t.Parallel()
	// Two identical boilers of 10 t/h on η(l) = 0.86 − 0.3·(l − 0.4)²,
	// firing together for about 14 000 kg/h: each may take 40 % to 100 %
	// of its MCR (the other at least at its 25 % burner minimum, neither
	// above its MCR), and over those loads the condition of leastfuel.go,
	// l·η·η″ + 2·η′·(η − l·η′) ≤ 0, holds (checked below), so the equal
	// split is the least fuel and least-fuel sharing saves nothing (by the
	// convexity argument, no outside source).
	q := quadEta{top: 0.86, k: 0.3, best: 0.4}
	for l := 0.4; l <= 1+1e-9; l += 0.01 {
		eta, d1, d2 := q.top-q.k*(l-q.best)*(l-q.best), -2*q.k*(l-q.best), -2*q.k
		if v := l*eta*d2 + 2*d1*(eta-l*d1); v > 0 {
			t.Fatalf("the test's curve is not convex enough at load %.2f: %g", l, v)
		}
	}
	build := func(opt Options) *Plant {
		p := twoBoilers(t, opt)
		for _, n := range []string{"b1", "b2"} {
			p.Component(n).(*Boiler).Efficiency = q
		}
		return p
	}
	c := demandCase("both", 14000)
	cr, err := build(Options{Sharing: LeastFuel}).Solve(context.Background(), c)
	must(t, err)
	lf := cr.LeastFuel
	if len(lf.Firing) != 2 || math.Abs(lf.Shares[0]-0.5) > 1e-4 {
		t.Errorf("firing %v, shares %v; want both at half", lf.Firing, lf.Shares)
	}
	if lf.SavedKgS > 1e-9*lf.EqualFuelKgS {
		t.Errorf("saves %g kg/s on a convex curve", lf.SavedKgS)
	}

	// A straight rising curve makes each boiler's fuel concave: the split
	// goes unequal and saves fuel.
	build2 := func(opt Options) *Plant {
		p := twoBoilers(t, opt)
		for _, n := range []string{"b1", "b2"} {
			p.Component(n).(*Boiler).Efficiency = linEta{a: 0.75, b: 0.12}
		}
		return p
	}
	cr, err = build2(Options{Sharing: LeastFuel}).Solve(context.Background(), c)
	must(t, err)
	lf = cr.LeastFuel
	if !(lf.SavedKgS > 1e-4*lf.EqualFuelKgS) || math.Abs(lf.Shares[0]-0.5) < 0.05 {
		t.Errorf("saves %g kg/s with shares %v on a straight rising curve; want an unequal split that saves", lf.SavedKgS, lf.Shares)
	}
}

// BenchmarkSharing solves warm cases of the two-boiler plant with equal
// and with least-fuel sharing, at a demand one boiler carries (6000 kg/h)
// and one both must (12 000 kg/h), without the contingencies, so that the
// figures compare the dispatch alone; solves/op counts the plant's
// configurations solved per case.
func BenchmarkSharing(b *testing.B) {
	for _, kgh := range []float64{6000, 12000} {
		for _, sh := range []Sharing{EqualLoad, LeastFuel} {
			b.Run(fmt.Sprintf("%s/%.0fkgh", strings.ReplaceAll(sh.String(), " ", "_"), kgh), func(b *testing.B) {
				p := twoBoilers(b, Options{Sharing: sh, NoContingencies: true})
				ctx := context.Background()
				c := demandCase("bench", kgh)
				if _, err := p.Solve(ctx, c); err != nil {
					b.Fatal(err)
				}
				var solves, lfSolves int
				k := 0
				for b.Loop() {
					c.Set[1].Value = (kgh + float64(k%10)) / 3600
					k++
					cr, err := p.Solve(ctx, c)
					if err != nil {
						b.Fatal(err)
					}
					solves += cr.Solves
					if cr.LeastFuel != nil {
						lfSolves += cr.LeastFuel.Solves
					}
				}
				b.ReportMetric(float64(solves+lfSolves)/float64(b.N), "solves/op")
			})
		}
	}
}
