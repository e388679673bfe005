package plant

import (
	"context"
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"

	"steamcase/solver"
)

// jacFixture is a plant of the package's tests with the cases it is
// checked at.
type jacFixture struct {
	name  string
	build func(t testing.TB) *Plant
	cases []Case
}

// coupledPlant is the plant of TestCoupledConsumers: consumers driven by a
// boiler's fuel flow and one with a duty model.
func coupledPlant(t testing.TB) *Plant {
	p := twoBoilers(t, Options{})
	must(t, p.Add(&Consumer{Base: Base{Name: "b1 fo heater"}, FuelOf: "b1", DutyPerFuel: 2.0e5, ReturnFraction: 1, Label: "fuel oil heater"}))
	must(t, p.Add(&Consumer{Base: Base{Name: "b1 atomising"}, FuelOf: "b1", SteamPerFuel: 0.3, Label: "atomising steam"}))
	must(t, p.Add(&Consumer{Base: Base{Name: "accommodation"}, Model: fixedModel{w: 20e3}, ReturnFraction: 1}))
	p.Connect("to fo heater", Pos{}, "main", "out", "b1 fo heater", "in")
	p.Connect("fo heater return", Pos{}, "b1 fo heater", "out", "hotwell", "in")
	p.Connect("to atomising", Pos{}, "main", "out", "b1 atomising", "in")
	p.Connect("to accommodation", Pos{}, "main", "out", "accommodation", "in")
	p.Connect("accommodation return", Pos{}, "accommodation", "out", "hotwell", "in")
	return p
}

// egeBoilerPlant is the plant of TestEGEFuelSaved: an exhaust-gas
// economiser and an oil-fired boiler on one header, with a dump condenser.
func egeBoilerPlant(t testing.TB) *Plant {
	p := New("EGE and boiler", Options{})
	drum := gauge(7)
	must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 333.15, P: 1e5}))
	must(t, p.Add(&FeedTank{Base: Base{Name: "hotwell"}, P: 1e5}))
	must(t, p.Add(&Header{Base: Base{Name: "feed header"}}))
	must(t, p.Add(&ExhaustGasEconomiser{Base: Base{Name: "ege"}, Engine: egeEngine(), DrumP: drum,
		DesignLoad: 1, DesignPinch: 15, GasCp: 1060}))
	must(t, p.Add(&Boiler{Base: Base{Name: "b1"}, MCR: 10000.0 / 3600, DrumP: drum,
		Efficiency: flatEta(0.85), Fuel: FuelSpec{Name: "HFO", LHV: 40.2e6, CO2Factor: 3.114}}))
	must(t, p.Add(&Header{Base: Base{Name: "main"}}))
	must(t, p.Add(&Consumer{Base: Base{Name: "heating"}, SteamFlow: 5000.0 / 3600}))
	must(t, p.Add(&Condenser{Base: Base{Name: "dump"}, Dump: true}))
	p.Connect("mu", Pos{}, "makeup", "out", "hotwell", "in")
	p.Connect("feed", Pos{}, "hotwell", "out", "feed header", "in")
	p.Connect("ege feed", Pos{}, "feed header", "out", "ege", "feed")
	p.Connect("boiler feed", Pos{}, "feed header", "out", "b1", "feed")
	p.Connect("ege steam", Pos{}, "ege", "steam", "main", "in")
	p.Connect("boiler steam", Pos{}, "b1", "steam", "main", "in")
	p.Connect("to heating", Pos{}, "main", "out", "heating", "in")
	p.Connect("to dump", Pos{}, "main", "out", "dump", "in")
	p.Connect("dump return", Pos{}, "dump", "out", "hotwell", "in")
	return p
}

// flueTablePlant is the plant of TestFlueGasTableEfficiency: a boiler
// whose efficiency comes from the heat-loss method on a flue-gas table.
func flueTablePlant(t testing.TB) *Plant {
	spec, err := SpecFromFuel(testFuel())
	must(t, err)
	tab := &FlueGasTable{Load: []float64{0.5, 1}, FlueT: []float64{503.15, 523.15}, O2Dry: []float64{0.04, 0.03}, RadiationAtMCR: 0.007}
	p := New("flue-gas table", Options{})
	must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 333.15, P: 1e5}))
	must(t, p.Add(&Boiler{Base: Base{Name: "b1"}, MCR: 1, DrumP: gauge(7), Efficiency: tab, Fuel: spec,
		Burner: Burner{AirT: 308.15, FanRise: 3000, FanEta: 0.6, MotorEta: 0.9}}))
	must(t, p.Add(&Consumer{Base: Base{Name: "load"}, SteamFlow: 0.8}))
	p.Connect("feed", Pos{}, "makeup", "out", "b1", "feed")
	p.Connect("steam", Pos{}, "b1", "steam", "load", "in")
	return p
}

// furnacePlant is the plant of TestFurnaceBoilerInPlant: a boiler whose
// efficiency comes from its furnace and smoke tubes.
func furnacePlant(t testing.TB) *Plant {
	p := New("fire-tube", Options{})
	must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 333.15, P: 1e5}))
	must(t, p.Add(&Boiler{Base: Base{Name: "b1"}, MCR: 2000.0 / 3600, DrumP: gauge(7), Efficiency: smallFireTube(), Fuel: hsfo(t)}))
	must(t, p.Add(&Consumer{Base: Base{Name: "load"}, SteamFlow: 1500.0 / 3600}))
	p.Connect("feed", Pos{}, "makeup", "out", "b1", "feed")
	p.Connect("steam", Pos{}, "b1", "steam", "load", "in")
	return p
}

// economiserPlant is ecoPlant with its economiser of UA 2000 W/K.
func economiserPlant(t testing.TB) *Plant {
	spec := hsfo(t)
	tab := &FlueGasTable{Load: []float64{0.3, 1}, FlueT: []float64{553.15, 603.15}, O2Dry: []float64{0.05, 0.03}, RadiationAtMCR: 0.01}
	p := New("economiser", Options{})
	must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 333.15}))
	must(t, p.Add(&FeedTank{Base: Base{Name: "hotwell"}}))
	must(t, p.Add(&FeedPump{Base: Base{Name: "fp"}, Boilers: []string{"b1"}, Margin: 2e5, Eta: 0.5}))
	must(t, p.Add(&Boiler{Base: Base{Name: "b1"}, MCR: 10000.0 / 3600, DrumP: gauge(7), Turndown: 4, CyclingLoss: 0.02, Efficiency: tab, Fuel: spec}))
	must(t, p.Add(&Consumer{Base: Base{Name: "load"}, SteamFlow: 6000.0 / 3600}))
	must(t, p.Add(&Economiser{Base: Base{Name: "eco"}, Boiler: "b1", UA: 2000, DesignGasFlow: 1.5}))
	p.Connect("mu", Pos{}, "makeup", "out", "hotwell", "in")
	p.Connect("suction", Pos{}, "hotwell", "out", "fp", "in")
	p.Connect("discharge", Pos{}, "fp", "out", "eco", "in")
	p.Connect("feed", Pos{}, "eco", "out", "b1", "feed")
	p.Connect("steam", Pos{}, "b1", "steam", "load", "in")
	return p
}

// everyUnit adds what the other fixtures lack: a feed tank with a heat
// loss through UA and steam heating to a set temperature, a reducing
// valve, a header with a heat loss, a turbine and a consumer with a drain
// cooler. Figures are invented, of realistic size.
func everyUnit(t testing.TB) *Plant {
	p := New("every unit", Options{})
	must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 293.15}))
	must(t, p.Add(&FeedTank{Base: Base{Name: "cascade tank"}, HeatLoss: 2e3, UA: 150, RoomT: 313.15, SetT: 353.15}))
	must(t, p.Add(&FeedPump{Base: Base{Name: "fp"}, Boilers: []string{"b1"}, Margin: 3 * bar, Eta: 0.5, MotorEta: 0.92}))
	must(t, p.Add(&Boiler{Base: Base{Name: "b1"}, MCR: 8000.0 / 3600, DrumP: gauge(14), Turndown: 4, CyclingLoss: 0.02,
		Blowdown: 0.02, Efficiency: &EfficiencyTable{Load: []float64{0.25, 0.5, 1}, Eta: []float64{0.8, 0.85, 0.84}},
		Fuel: FuelSpec{Name: "MGO", LHV: 42.7e6, CO2Factor: 3.206}}))
	must(t, p.Add(&Header{Base: Base{Name: "hp"}, HeatLoss: 8e3}))
	must(t, p.Add(&ReducingValve{Base: Base{Name: "prv"}, P: gauge(4)}))
	must(t, p.Add(&Header{Base: Base{Name: "lp"}}))
	must(t, p.Add(&Consumer{Base: Base{Name: "tank heating"}, Duty: 1.2e6, SubCooling: 5, ReturnFraction: 0.97, ReturnT: 343.15}))
	must(t, p.Add(&Turbine{Base: Base{Name: "tg"}, Power: 300e3, ExhaustP: 0.15 * bar, EtaIs: 0.6, EtaMech: 0.95}))
	must(t, p.Add(&Condenser{Base: Base{Name: "vac cond"}, SubCooling: 3}))
	c := func(name, from, fp, to, tp string) { p.Connect(name, Pos{}, from, fp, to, tp) }
	c("makeup", "makeup", "out", "cascade tank", "in")
	c("suction", "cascade tank", "out", "fp", "in")
	c("feed", "fp", "out", "b1", "feed")
	c("steam", "b1", "steam", "hp", "in")
	c("to tg", "hp", "out", "tg", "in")
	c("exhaust", "tg", "out", "vac cond", "in")
	c("condensate", "vac cond", "out", "cascade tank", "in")
	c("to prv", "hp", "out", "prv", "in")
	c("prv out", "prv", "out", "lp", "in")
	c("to heating", "lp", "out", "tank heating", "in")
	c("heating return", "tank heating", "out", "cascade tank", "in")
	c("tank steam", "lp", "out", "cascade tank", "steam")
	return p
}

func jacFixtures() []jacFixture {
	ege := func(load float64) Case {
		return Case{Name: fmt.Sprintf("engine %.0f %%", 100*load), Conditions: Conditions{EngineLoad: load}}
	}
	return []jacFixture{
		{"boiler only", func(t testing.TB) *Plant { return boilerOnly(t) }, []Case{{Name: "check"}}},
		{"turbine", func(t testing.TB) *Plant { return turbinePlant(t) }, []Case{{Name: "discharge"}}},
		{"two boilers", func(t testing.TB) *Plant { return twoBoilers(t, Options{}) }, []Case{
			{Name: "port"}, demandCase("one boiler", 6000), demandCase("cycling", 2300),
			demandCase("two boilers", 8600), {Name: "drain cooler", Set: []Setting{{Unit: "heating", Param: "return_T", Value: 353.15}}},
		}},
		{"two boilers lead-lag", func(t testing.TB) *Plant { return twoBoilers(t, Options{Sharing: LeadLag}) }, []Case{
			demandCase("two boilers", 12000),
		}},
		// Short: the boilers at their limit and the demand reduced, in
		// proportion and by priority (the shed level away from a kink).
		{"two boilers short", func(t testing.TB) *Plant { return twoBoilers(t, Options{}) }, []Case{
			demandCase("short", 23000),
		}},
		{"short by priority", func(t testing.TB) *Plant { return shortPlant(t, Options{}) }, []Case{
			{Name: "deeper", Set: []Setting{{Unit: "cleaning", Param: "steam", Value: 20000.0 / 3600},
				{Unit: "cargo", Param: "steam", Value: 12000.0 / 3600}}},
		}},
		{"coupled consumers", coupledPlant, []Case{{Name: "winter", Conditions: Conditions{AirT: 263.15}}}},
		{"exhaust-gas economiser", func(t testing.TB) *Plant { p, _ := egeOnly(t, 0.65); return p }, []Case{ege(1), ege(0.5)}},
		{"exhaust-gas economiser with bypass", func(t testing.TB) *Plant {
			p, e := egeOnly(t, 0.65)
			e.MinGasOutT, e.Bypass = 273.15+200, true
			return p
		}, []Case{ege(1)}},
		{"exhaust-gas economiser and boiler", egeBoilerPlant, []Case{ege(1), ege(0.3), {Name: "port"}}},
		{"flue-gas table", flueTablePlant, []Case{{Name: "80 %", Conditions: Conditions{AirT: 308.15}}}},
		{"furnace", furnacePlant, []Case{{Name: "75 %", Conditions: Conditions{AirT: 308.15}}}},
		{"economiser", economiserPlant, []Case{
			{Name: "sea", Conditions: Conditions{AirT: 308.15}},
			{Name: "cycling", Conditions: Conditions{AirT: 308.15}, Set: []Setting{{Unit: "load", Param: "steam", Value: 500.0 / 3600}}},
		}},
		{"every unit", everyUnit, []Case{
			{Name: "design"},
			{Name: "warm returns", Set: []Setting{{Unit: "tank heating", Param: "return_T", Value: 363.15}}},
			{Name: "turbine off", Set: []Setting{{Unit: "tg", Param: "off", Value: 1}}},
		}},
		{"drain cooler to the hotwell, drains lost", func(t testing.TB) *Plant {
			return twoBoilersWith(t, CoolerToHotwell, DrainsLost)
		}, []Case{cooled, {Name: "trap", Set: []Setting{{Unit: "heating", Param: "trap_loss", Value: 0.05}}}}},
		{"trap loss with a cooler to the feed", func(t testing.TB) *Plant { return twoBoilers(t, Options{}) }, []Case{
			{Name: "trap", Set: []Setting{{Unit: "heating", Param: "trap_loss", Value: 0.05}, {Unit: "heating", Param: "return_T", Value: 353.15}}},
			{Name: "trap, no cooler", Set: []Setting{{Unit: "heating", Param: "trap_loss", Value: 0.08}}},
		}},
		{"turbine by its steam rate", func(t testing.TB) *Plant {
			return turbineWith(t, &Turbine{Power: 0.9e6, ExhaustP: 0.2 * bar, EtaMech: 0.95, RatedPower: 1.2e6,
				RateLoad: []float64{0.5, 1}, SteamRate: []float64{10.2 / 3.6e6, 8.5 / 3.6e6}}, &Condenser{SubCooling: 3})
		}, []Case{{Name: "discharge"}, {Name: "below the curve", Set: []Setting{{Unit: "cargo pump 1", Param: "power", Value: 0.4e6}}}}},
		{"condenser by the approach", func(t testing.TB) *Plant {
			return turbineWith(t, &Turbine{Power: 1e6, EtaIs: 0.65, EtaMech: 0.95}, &Condenser{Approach: 40})
		}, []Case{{Name: "sea", Conditions: Conditions{SeaT: 290}}}},
		{"condenser by its UA", func(t testing.TB) *Plant {
			return turbineWith(t, &Turbine{Power: 1e6, EtaIs: 0.65, EtaMech: 0.95}, &Condenser{UA: 150e3, SeaFlow: 50, SubCooling: 2})
		}, []Case{{Name: "sea", Conditions: Conditions{SeaT: 290}}, {Name: "warmer sea", Conditions: Conditions{SeaT: 296}}}},
		{"warming steam", func(t testing.TB) *Plant {
			p := twoBoilers(t, Options{})
			must(t, p.Add(&Consumer{Base: Base{Name: "b2 warming"}, Model: &BoilerWarming{Boiler: "b2"}, ReturnFraction: 1}))
			p.Connect("to b2 warming", Pos{}, "main", "out", "b2 warming", "in")
			p.Connect("b2 warming return", Pos{}, "b2 warming", "out", "hotwell", "in")
			return p
		}, []Case{demandCase("one boiler", 5000), demandCase("two boilers", 9000)}},
		{"cycling by the band", func(t testing.TB) *Plant {
			return cyclingPlant(t, &Boiler{PurgeAir: 40, CycleBand: 1e5, WaterContent: 3000})
		}, []Case{steamCase(0.5), steamCase(0.05), {Name: "given starts", Set: []Setting{
			{Unit: "load", Param: "steam", Value: 0.3}, {Unit: "b1", Param: "starts_per_hour", Value: 6}}}}},
		{"cycling furnace", func(t testing.TB) *Plant {
			return cyclingPlant(t, &Boiler{Efficiency: smallFireTube(), Fuel: hsfo(t), PurgeAir: 10, StartsPerHour: 5})
		}, []Case{steamCase(0.5)}},
	}
}

// centralJacobian is the plant's Jacobian by central differences of its
// whole residual, one unknown at a time, with the step 1e-6·max(|x_j|,
// XScale_j): the reference the analytic Jacobian is checked against
// (checked against central finite differences, no outside source).
func centralJacobian(t *testing.T, p *Plant, x []float64) *mat.Dense {
	n := p.s.prob.Dim
	j := mat.NewDense(n, n, nil)
	rp, rm := make([]float64, n), make([]float64, n)
	xt := append([]float64(nil), x...)
	for c := 0; c < n; c++ {
		h := 1e-6 * math.Max(math.Abs(x[c]), p.s.asm.xScale[c])
		xt[c] = x[c] + h
		errP := p.residual(rp, xt)
		xt[c] = x[c] - h
		errM := p.residual(rm, xt)
		xt[c] = x[c]
		if errP != nil || errM != nil {
			t.Fatalf("residual fails beside the state (unknown %q): %v %v", p.s.asm.varNames[c], errP, errM)
		}
		for i := 0; i < n; i++ {
			j.Set(i, c, (rp[i]-rm[i])/(2*h))
		}
	}
	return j
}

// nearState returns the solved unknowns moved by a seeded random relative
// amount (spread rel of max(|x|, XScale)), kept inside the bounds.
func nearState(p *Plant, x []float64, rng *rand.Rand, rel float64) []float64 {
	y := make([]float64, len(x))
	for i := range x {
		y[i] = x[i] + rel*rng.NormFloat64()*math.Max(math.Abs(x[i]), p.s.asm.xScale[i])
		y[i] = math.Min(math.Max(y[i], p.s.asm.lo[i]), p.s.asm.hi[i])
	}
	return y
}

// TestJacobianAgainstFiniteDifferences checks the analytic Jacobian of
// every unit type and of the dispatch equations, entry by entry, against
// central finite differences of the residual (no outside source) at
// seeded random states near each solved fixture. An entry passes when it
// is within 1e-6 of its row's scale: the largest entry of the scaled row
// (D_F⁻¹·J·D_X, the matrix the solver factorises).
func TestJacobianAgainstFiniteDifferences(t *testing.T) {
	t.Parallel()
	const tol = 1e-6
	rng := rand.New(rand.NewPCG(20261201, 7))
	covered := map[string]int{}
	for _, fx := range jacFixtures() {
		p := fx.build(t)
		for _, c := range fx.cases {
			ctx := context.Background()
			if _, err := p.Solve(ctx, c); err != nil {
				t.Fatalf("%s, %s: %v", fx.name, c.Name, err)
			}
			// Keep the case's settings in force for the check.
			restore, err := p.applySettings(&c)
			must(t, err)
			n := p.s.prob.Dim
			ja := mat.NewDense(n, n, nil)
			for k := 1; k <= 3; k++ {
				// Not the solved point itself: there a state can sit
				// exactly on a kink (a venting feed tank delivers
				// saturated water, and v(p,h) changes phase there), where
				// any difference straddles the two sides.
				x := nearState(p, p.s.last, rng, 2e-3)
				r := make([]float64, n)
				if err := p.residual(r, x); err != nil {
					t.Fatalf("%s, %s, state %d: %v", fx.name, c.Name, k, err)
				}
				must(t, p.s.slv.Jacobian(ja, x, true))
				jf := centralJacobian(t, p, x)
				inPattern := make([]bool, n)
				for i := 0; i < n; i++ {
					for col := range inPattern {
						inPattern[col] = false
					}
					for _, col := range p.s.asm.pattern[i] {
						inPattern[col] = true
					}
					scale := 0.0
					for col := 0; col < n; col++ {
						s := p.s.asm.xScale[col] / p.s.asm.fScale[i]
						scale = math.Max(scale, math.Max(math.Abs(ja.At(i, col)), math.Abs(jf.At(i, col)))*s)
					}
					for col := 0; col < n; col++ {
						s := p.s.asm.xScale[col] / p.s.asm.fScale[i]
						a, f := ja.At(i, col), jf.At(i, col)
						if !inPattern[col] && a != 0 {
							t.Errorf("%s, %s: analytic entry (%q, %q) = %g outside the pattern", fx.name, c.Name, p.s.asm.eqNames[i], p.s.asm.varNames[col], a)
						}
						if d := math.Abs(a-f) * s; !(d <= tol*scale) {
							t.Errorf("%s, %s, state %d: d(%s)/d(%s): analytic %.9g, central differences %.9g (scaled difference %.2g, row scale %.2g)",
								fx.name, c.Name, k, p.s.asm.eqNames[i], p.s.asm.varNames[col], a, f, d, scale)
						}
					}
				}
			}
			restore()
			for _, u := range p.comps {
				covered[u.Kind()]++
			}
			covered["dispatch"] += len(p.s.dispEqs)
		}
	}
	// Every unit type and the dispatch equations took part.
	want := []Component{&MakeUp{}, &FeedTank{}, &FeedPump{}, &Header{}, &ReducingValve{}, &Consumer{}, &Turbine{},
		&Condenser{}, &Condenser{Dump: true}, &Boiler{}, &Economiser{}, &ExhaustGasEconomiser{}}
	for _, u := range want {
		if covered[u.Kind()] == 0 {
			t.Errorf("no fixture checks a %s", u.Kind())
		}
	}
	if covered["dispatch"] == 0 {
		t.Errorf("no fixture checks the dispatch equations")
	}
}

// TestAnalyticJacobianSameResults solves every fixture with the analytic
// Jacobian and with the solver's coloured finite differences: both
// converge, and every line's flow, pressure and enthalpy and every
// boiler's fuel agree within 1e-9 relative (of the value, or of the
// unknown's scale for values near zero). The finite-difference plant's
// pattern is checked by the solver's dense differences (CheckPattern) at
// its solution.
func TestAnalyticJacobianSameResults(t *testing.T) {
	t.Parallel()
	const tol = 1e-9
	ctx := context.Background()
	for _, fx := range jacFixtures() {
		pa := fx.build(t)
		pf := fx.build(t)
		pf.Opt.FiniteDifferences = true
		for _, c := range fx.cases {
			ca, err := pa.Solve(ctx, c)
			if err != nil {
				t.Fatalf("%s, %s, analytic: %v", fx.name, c.Name, err)
			}
			cf, err := pf.Solve(ctx, c)
			if err != nil {
				t.Fatalf("%s, %s, finite differences: %v", fx.name, c.Name, err)
			}
			if !ca.Converged || !cf.Converged {
				t.Errorf("%s, %s: converged %v (analytic), %v (finite differences)", fx.name, c.Name, ca.Converged, cf.Converged)
			}
			if pa.s.slvRes.Colors != 0 || pf.s.slvRes.Colors == 0 {
				t.Errorf("%s, %s: %d colours with the analytic Jacobian, %d without; want 0 and some",
					fx.name, c.Name, pa.s.slvRes.Colors, pf.s.slvRes.Colors)
			}
			if err := pf.s.slv.CheckPattern(pf.s.last); err != nil {
				t.Errorf("%s, %s: %v", fx.name, c.Name, err)
			}
			same := func(what string, a, f, scale float64) {
				if d := math.Abs(a - f); !(d <= tol*math.Max(math.Max(math.Abs(a), math.Abs(f)), scale)) {
					t.Errorf("%s, %s: %s = %.12g (analytic), %.12g (finite differences)", fx.name, c.Name, what, a, f)
				}
			}
			if len(ca.Lines) != len(cf.Lines) || len(ca.Boilers) != len(cf.Boilers) {
				t.Fatalf("%s, %s: results differ in shape", fx.name, c.Name)
			}
			for i, l := range ca.Lines {
				lf := cf.Lines[i]
				same("line "+l.Name+" flow", l.M, lf.M, 1e-6)
				same("line "+l.Name+" pressure", l.P, lf.P, 1)
				same("line "+l.Name+" enthalpy", l.H, lf.H, 1)
			}
			for i, b := range ca.Boilers {
				same("boiler "+b.Name+" fuel", b.FuelKgS, cf.Boilers[i].FuelKgS, 1e-8)
			}
			same("fuel saved by the exhaust-gas economisers", ca.EGEFuelSavedKgS, cf.EGEFuelSavedKgS, 1e-8)
			if ca.BoilersFiring != cf.BoilersFiring {
				t.Errorf("%s, %s: %d boilers fire (analytic), %d (finite differences)", fx.name, c.Name, ca.BoilersFiring, cf.BoilersFiring)
			}
		}
	}
}

// TestJacobianAllocatesNothing: after its first call the analytic
// Jacobian allocates nothing (the project's rule for hot paths).
func TestJacobianAllocatesNothing(t *testing.T) {
	for _, fx := range jacFixtures() {
		if fx.name == "furnace" || fx.name == "cycling furnace" || fx.name == "economiser" || fx.name == "flue-gas table" {
			continue // the combustion models' own allocations are theirs
		}
		p := fx.build(t)
		_, err := p.Solve(context.Background(), fx.cases[0])
		must(t, err)
		j := solver.NewSparse(p.s.prob.Dim, p.s.prob.Pattern)
		x := append([]float64(nil), p.s.last...)
		must(t, p.jacobian(j, x))
		if a := testing.AllocsPerRun(20, func() {
			j.Zero()
			if err := p.jacobian(j, x); err != nil {
				t.Fatal(err)
			}
		}); a != 0 {
			t.Errorf("%s: %g allocations per Jacobian, want 0", fx.name, a)
		}
	}
}

// TestJacobianKeepsUnknowns: the differences a unit takes of its own
// function move the unknowns and must put them back bit for bit.
func TestJacobianKeepsUnknowns(t *testing.T) {
	t.Parallel()
	for _, fx := range jacFixtures() {
		p := fx.build(t)
		_, err := p.Solve(context.Background(), fx.cases[0])
		must(t, err)
		x := append([]float64(nil), p.s.last...)
		must(t, p.jacobian(solver.NewSparse(p.s.prob.Dim, p.s.prob.Pattern), x))
		for i := range x {
			if math.Float64bits(x[i]) != math.Float64bits(p.s.last[i]) {
				t.Errorf("%s: the Jacobian changed %q from %v to %v", fx.name, p.s.asm.varNames[i], p.s.last[i], x[i])
			}
		}
	}
}

// BenchmarkJacobian times one analytic Jacobian against one coloured
// finite-difference Jacobian of the solver at a solved point, through
// Solver.Jacobian (which also unscales into the caller's matrix).
func BenchmarkJacobian(b *testing.B) {
	for _, fx := range benchFixtures() {
		for _, fd := range []bool{false, true} {
			b.Run(fx.name+"/"+jacName(fd), func(b *testing.B) {
				p := fx.build(b)
				p.Opt.FiniteDifferences = fd
				if _, err := p.Solve(context.Background(), fx.cases[0]); err != nil {
					b.Fatal(err)
				}
				n := p.s.prob.Dim
				j := mat.NewDense(n, n, nil)
				x := append([]float64(nil), p.s.last...)
				for b.Loop() {
					if err := p.s.slv.Jacobian(j, x, !fd); err != nil {
						b.Fatal(err)
					}
				}
				b.ReportMetric(float64(p.s.slv.Colors()), "colours")
			})
		}
		// The plant's own part of the analytic Jacobian, without the
		// solver's scaling, checks and copy.
		b.Run(fx.name+"/plant-only", func(b *testing.B) {
			p := fx.build(b)
			if _, err := p.Solve(context.Background(), fx.cases[0]); err != nil {
				b.Fatal(err)
			}
			j := solver.NewSparse(p.s.prob.Dim, p.s.prob.Pattern)
			x := append([]float64(nil), p.s.last...)
			for b.Loop() {
				j.Zero()
				if err := p.jacobian(j, x); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// BenchmarkCaseJacobian solves a case from the plant's own guess with
// each Jacobian; residual-evals counts the calls of the residual in the
// last solve of the case (the one whose firing set the plant keeps).
func BenchmarkCaseJacobian(b *testing.B) {
	for _, fx := range benchFixtures() {
		for _, fd := range []bool{false, true} {
			b.Run(fx.name+"/"+jacName(fd), func(b *testing.B) {
				p := fx.build(b)
				p.Opt.FiniteDifferences = fd
				ctx := context.Background()
				var iters, evals int
				for b.Loop() {
					p.ColdStart()
					cr, err := p.Solve(ctx, fx.cases[0])
					if err != nil {
						b.Fatal(err)
					}
					iters += cr.Iterations
					evals += p.s.slvRes.Stats.ResidualEvals
				}
				b.ReportMetric(float64(iters)/float64(b.N), "newton-iters/op")
				b.ReportMetric(float64(evals)/float64(b.N), "residual-evals/op")
			})
		}
	}
}

func jacName(fd bool) string {
	if fd {
		return "finite-differences"
	}
	return "analytic"
}

// benchFixtures are the fixtures the benchmarks run: one per kind of
// efficiency model and the plant with every unit.
func benchFixtures() []jacFixture {
	var fs []jacFixture
	for _, fx := range jacFixtures() {
		switch fx.name {
		case "two boilers", "every unit", "economiser", "furnace", "exhaust-gas economiser and boiler":
			fs = append(fs, fx)
		}
	}
	return fs
}

// TestAnalyticJacobianSweep solves a sweep of demands and engine loads
// from the plants' own guesses with each Jacobian: every case that
// converges with finite differences converges with the analytic Jacobian
// in no more iterations plus one, to the same fuel within 1e-9 relative.
func TestAnalyticJacobianSweep(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	type sweep struct {
		name  string
		build func(t testing.TB) *Plant
		cases []Case
	}
	var demand, engine []Case
	for kgh := 300.0; kgh <= 24000; kgh *= 1.25 {
		demand = append(demand, demandCase(fmt.Sprintf("%.0f kg/h", kgh), kgh))
	}
	for load := 0.1; load <= 1.05; load += 0.1 {
		engine = append(engine, Case{Name: fmt.Sprintf("engine %.0f %%", 100*load), Conditions: Conditions{EngineLoad: load}})
	}
	sweeps := []sweep{
		{"two boilers", func(t testing.TB) *Plant { return twoBoilers(t, Options{}) }, demand},
		{"exhaust-gas economiser and boiler", egeBoilerPlant, engine},
	}
	for _, sw := range sweeps {
		pa, pf := sw.build(t), sw.build(t)
		pf.Opt.FiniteDifferences = true
		var itA, itF, evA, evF int
		for _, c := range sw.cases {
			pa.ColdStart()
			pf.ColdStart()
			cf, errF := pf.Solve(ctx, c)
			ca, errA := pa.Solve(ctx, c)
			if errF != nil {
				if errA == nil {
					t.Logf("%s, %s: converges with the analytic Jacobian only (finite differences: %v)", sw.name, c.Name, errF)
				}
				continue
			}
			if errA != nil {
				t.Errorf("%s, %s: fails with the analytic Jacobian: %v", sw.name, c.Name, errA)
				continue
			}
			itA, itF = itA+ca.Iterations, itF+cf.Iterations
			evA, evF = evA+pa.s.slvRes.Stats.ResidualEvals, evF+pf.s.slvRes.Stats.ResidualEvals
			if ca.Iterations > cf.Iterations+1 {
				t.Errorf("%s, %s: %d iterations with the analytic Jacobian, %d with finite differences", sw.name, c.Name, ca.Iterations, cf.Iterations)
			}
			if math.Abs(ca.FuelKgS-cf.FuelKgS) > 1e-9*math.Max(cf.FuelKgS, 1e-6) || ca.BoilersFiring != cf.BoilersFiring {
				t.Errorf("%s, %s: fuel %.12g kg/s with %d firing (analytic), %.12g kg/s with %d (finite differences)",
					sw.name, c.Name, ca.FuelKgS, ca.BoilersFiring, cf.FuelKgS, cf.BoilersFiring)
			}
		}
		t.Logf("%s, %d cases: Newton iterations %d (analytic) and %d (finite differences), residual evaluations %d and %d (last solve of each case)",
			sw.name, len(sw.cases), itA, itF, evA, evF)
	}
}

// TestJacobianAtBurnerMinimum: a boiler at its burner minimum switches
// between firing continuously and cycling (with the cycling loss), a jump
// in its fuel equation. On either side of the switch, within a difference
// step of it, the Jacobian is the derivative of the side the residual is
// on: it matches central differences of the residual taken a little
// further inside that side (within 1 %, which the jump would exceed by
// orders of magnitude; checked against central finite differences, no
// outside source).
func TestJacobianAtBurnerMinimum(t *testing.T) {
	t.Parallel()
	p := economiserPlant(t)
	_, err := p.Solve(context.Background(), Case{Name: "sea", Conditions: Conditions{AirT: 308.15}})
	must(t, err)
	b := p.Component("b1").(*Boiler)
	n := p.s.prob.Dim
	ms := b.steam.mIdx()
	row, col := b.eqs[3], ms
	edge := b.MinLoad() * b.MCR
	r := make([]float64, n)
	for _, side := range []struct {
		name       string
		at, inside float64
	}{
		{"just cycling", edge * (1 - 1e-10), edge * (1 - 1e-3)},
		{"just firing", edge, edge * (1 + 1e-3)},
	} {
		x := append([]float64(nil), p.s.last...)
		x[ms] = side.at
		must(t, p.residual(r, x))
		j := mat.NewDense(n, n, nil)
		must(t, p.s.slv.Jacobian(j, x, true))
		got := j.At(row, col)
		x[ms] = side.inside
		want := centralJacobian(t, p, x).At(row, col)
		if math.Abs(got-want) > 0.01*math.Abs(want) {
			t.Errorf("%s: d(%s)/d(%s) = %g, want %g (the derivative of that side)", side.name, p.s.asm.eqNames[row], p.s.asm.varNames[col], got, want)
		}
	}
}
