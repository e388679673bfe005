package plant

import (
	"context"
	"strings"
	"testing"

	"steamcase/plant/water"
)

// cyclingPlant is make-up at 60 °C and 1 bar(a) into a boiler of 4 kg/s
// MCR at 7 bar(g), turndown 1:4 (burner minimum 1 kg/s), flat table
// efficiency 85 %, raising saturated steam for a consumer of a set steam
// flow.
func cyclingPlant(t testing.TB, b *Boiler) *Plant {
	p := New("cycling", Options{})
	must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 333.15, P: 1e5}))
	b.Name, b.MCR, b.DrumP, b.Turndown = "b1", 4, gauge(7), 4
	if b.Efficiency == nil {
		b.Efficiency = flatEta(0.85)
	}
	if b.Fuel.LHV == 0 {
		b.Fuel = FuelSpec{Name: "HFO", LHV: 40.2e6, CO2Factor: 3.114}
	}
	must(t, p.Add(b))
	must(t, p.Add(&Consumer{Base: Base{Name: "load"}, SteamFlow: 0.5}))
	p.Connect("feed", Pos{}, "makeup", "out", "b1", "feed")
	p.Connect("steam", Pos{}, "b1", "steam", "load", "in")
	return p
}

// steamHeat is the heat per kg of saturated steam at 7 bar(g) from feed at
// 60 °C and 1 bar(a), IAPWS-IF97 (plant/water, whose tests check it
// against the IF97 verification tables).
func steamHeat(t *testing.T) float64 {
	hs, err := water.HSatVapour(gauge(7))
	must(t, err)
	hfw, err := water.HPT(1e5, 333.15)
	must(t, err)
	return hs - hfw
}

func steamCase(kgs float64) Case {
	return Case{Name: "low load", Set: []Setting{{Unit: "load", Param: "steam", Value: kgs}}}
}

// TestStandbyLossOfATable: a maker's table has no casing model, so the
// standby loss is 1 % of the heat input at MCR (docs/reference/plant-checks.md
// §3.4 [CP]: 0.5-1.5 % at MCR for marine auxiliary boilers), and the
// burner, on at its minimum, covers the steam and the standby loss over
// its off time: f·q_min = u + (1 − f)·W (the on-off balance of cycleHeat,
// by hand; common practice, no source).
func TestStandbyLossOfATable(t *testing.T) {
	t.Parallel()
	p := cyclingPlant(t, &Boiler{})
	cr, err := p.Solve(context.Background(), steamCase(0.5))
	must(t, err)
	e := steamHeat(t)
	w := 0.01 * 4 * e / 0.85 // 1 % of the heat input at MCR, W
	qmin, u := 1*e, 0.5*e
	f := (u + w) / (qmin + w)
	fuel := f * qmin / (0.85 * 40.2e6)
	b := cr.Boilers[0]
	if !b.Cycling {
		t.Fatalf("boiler at 12.5 %% of MCR does not cycle")
	}
	within(t, "standby loss W", b.StandbyLossW, w, 1e-9)
	within(t, "on fraction", b.OnFraction, f, 1e-9)
	within(t, "fuel kg/s", b.FuelKgS, fuel, 1e-9)
	within(t, "standby over the off time W", b.StandbyOffW, (1-f)*w, 1e-9)
	within(t, "firing efficiency", b.FiringEfficiency, 0.85, 1e-12)
	within(t, "average efficiency", b.Efficiency, u/(fuel*40.2e6), 1e-9)
	if b.PurgeW != 0 || b.StartsPerHour != 0 {
		t.Errorf("purge %g W at %g starts/h, want none counted without purge_air", b.PurgeW, b.StartsPerHour)
	}
	if cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
		t.Errorf("balances do not close: %+v", cr.Balance)
	}
}

// TestStandbyLossOfTheCasingModel: a furnace model's standby loss is its
// own casing loss, radiation_loss (15 kW for smallFireTube); a flue-gas
// table's is its radiation at MCR times the heat input at MCR, the heat to
// steam at MCR over the model's efficiency there (docs/reference/plant-checks.md
// §3.4 [M]: the loss in kW is roughly constant with load); a given
// standby_loss replaces either.
func TestStandbyLossOfTheCasingModel(t *testing.T) {
	t.Parallel()
	e := steamHeat(t)
	spec, err := SpecFromFuel(testFuel())
	must(t, err)
	tab := &FlueGasTable{Load: []float64{0.25, 1}, FlueT: []float64{483.15, 523.15}, O2Dry: []float64{0.05, 0.03}, RadiationAtMCR: 0.007}
	etaMCR, err := tab.Efficiency(BoilerOperation{Load: 1, DrumP: gauge(7), AirT: 298.15, Fuel: spec})
	must(t, err)
	tests := []struct {
		name string
		b    *Boiler
		want float64
	}{
		{"furnace model", &Boiler{Efficiency: smallFireTube(), Fuel: hsfo(t)}, 15e3},
		{"flue-gas table", &Boiler{Efficiency: tab, Fuel: spec}, 0.007 * 4 * e / etaMCR.Eta},
		{"given", &Boiler{StandbyLoss: 22e3}, 22e3},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p := cyclingPlant(t, tc.b)
			cr, err := p.Solve(context.Background(), steamCase(0.5))
			must(t, err)
			within(t, "standby loss W", cr.Boilers[0].StandbyLossW, tc.want, 1e-9)
			if cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
				t.Errorf("balances do not close: %+v", cr.Balance)
			}
		})
	}
}

// TestPurgeLossByHand: one pre-purge of 40 m³ of air at 25 °C and 1 atm
// heated to the drum's 170.4 °C takes ρ·V·c̄p·ΔT: ρ = p·M/(R·T) = 1.1839
// kg/m³ for dry air (M 28.960 g/mol, plant/combustion's standard air),
// c̄p ≈ 1.011 kJ/kgK between 25 and 170 °C (1.005 at 300 K, 1.021 at
// 450 K, Incropera's air table, from memory): about 6.96 MJ, within 0.5 %.
func TestPurgeLossByHand(t *testing.T) {
	t.Parallel()
	tSat, err := water.Tsat(gauge(7))
	must(t, err)
	got, err := purgeHeat(40, 298.15, gauge(7), 101325)
	must(t, err)
	rho := 101325 * 28.960e-3 / (8.314462618 * 298.15)
	want := rho * 40 * 1011 * (tSat - 298.15)
	within(t, "purge heat J", got, want, 0.005)
}

// TestCyclingByTheBand: with the burner's pressure band and the boiler's
// water content the starts follow from the heat stored in the band, ΔE =
// M·(h_f(p + Δp/2) − h_f(p − Δp/2)) (IAPWS-IF97, plant/water): on for
// (ΔE + Ep)/(q_min − u), off for ΔE/(u + W) (the on-off cycle of a
// pressure-switched burner, common practice, no source). The fuel then
// covers the steam, the standby loss over the off time and the purges,
// exactly.
func TestCyclingByTheBand(t *testing.T) {
	t.Parallel()
	p := cyclingPlant(t, &Boiler{StandbyLoss: 20e3, PurgeAir: 40, CycleBand: 1e5, WaterContent: 3000})
	cr, err := p.Solve(context.Background(), steamCase(0.5))
	must(t, err)
	e := steamHeat(t)
	hLo, err := water.HSatLiquid(gauge(7) - 0.5e5)
	must(t, err)
	hHi, err := water.HSatLiquid(gauge(7) + 0.5e5)
	must(t, err)
	dE := 3000 * (hHi - hLo)
	ep, err := purgeHeat(40, 298.15, gauge(7), 101325)
	must(t, err)
	w, qmin, u := 20e3, 1*e, 0.5*e
	ton, toff := (dE+ep)/(qmin-u), dE/(u+w)
	f, n := ton/(ton+toff), 1/(ton+toff)
	b := cr.Boilers[0]
	within(t, "on fraction", b.OnFraction, f, 1e-9)
	within(t, "starts per hour", b.StartsPerHour, 3600*n, 1e-9)
	within(t, "purge W", b.PurgeW, n*ep, 1e-9)
	// The balance of the cycle: f·q_min = u + (1 − f)·W + n·Ep.
	within(t, "heat raised", b.FuelKgS*40.2e6*0.85, u+(1-f)*w+n*ep, 1e-9)
	within(t, "heat raised while on", f*qmin, u+(1-f)*w+n*ep, 1e-12)

	// A given start rate takes precedence over the band.
	cr, err = p.Solve(context.Background(), Case{Name: "given starts", Set: []Setting{
		{Unit: "load", Param: "steam", Value: 0.5}, {Unit: "b1", Param: "starts_per_hour", Value: 4}}})
	must(t, err)
	b = cr.Boilers[0]
	within(t, "given starts per hour", b.StartsPerHour, 4, 1e-12)
	within(t, "heat raised at 4 starts/h", b.FuelKgS*40.2e6*0.85, u+(1-b.OnFraction)*w+4.0/3600*ep, 1e-9)
}

// TestFuelPerTonneRisesBelowTurndown: the cycling boiler's fuel per tonne
// of steam rises as the load falls below the burner minimum, as it does on
// board (issue 14 docs/reference/plant-checks.md §2; docs/reference/plant-checks.md §3.6 [CP]: below
// MCR/turndown the burner cycles, and every restart carries pre-purge
// losses); above the minimum, with a flat table efficiency, it is
// constant.
func TestFuelPerTonneRisesBelowTurndown(t *testing.T) {
	t.Parallel()
	p := cyclingPlant(t, &Boiler{PurgeAir: 40, CycleBand: 1e5, WaterContent: 3000})
	ctx := context.Background()
	per := func(kgs float64) float64 {
		cr, err := p.Solve(ctx, steamCase(kgs))
		must(t, err)
		if cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
			t.Errorf("%g kg/s: balances do not close: %+v", kgs, cr.Balance)
		}
		return cr.FuelKgS / kgs
	}
	above, atMin := per(2), per(1)
	within(t, "fuel per steam at the burner minimum against at half load", atMin, above, 1e-9)
	prev := atMin
	for _, kgs := range []float64{0.8, 0.6, 0.4, 0.2, 0.1, 0.05} {
		got := per(kgs)
		if !(got > prev) {
			t.Errorf("at %.0f %% of MCR the fuel per kg of steam %.6g does not rise above %.6g", 100*kgs/4, got, prev)
		}
		prev = got
	}
	if prev < 1.2*atMin {
		t.Errorf("at 1.25 %% of MCR the fuel per kg of steam %.4g is less than 20 %% above the %.4g at the burner minimum", prev, atMin)
	}
}

// TestCyclingInputErrors: the cycling figures that go together are
// refused apart, naming the boiler.
func TestCyclingInputErrors(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name string
		b    *Boiler
		want string
	}{
		{"purge without starts", &Boiler{PurgeAir: 40}, "purge_air needs the starts"},
		{"band without water", &Boiler{CycleBand: 1e5}, "cycle_band and water_content go together"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p := cyclingPlant(t, tc.b)
			_, err := p.Solve(context.Background(), steamCase(0.5))
			if err == nil || !strings.Contains(err.Error(), tc.want) || !strings.Contains(err.Error(), `"b1"`) {
				t.Errorf("error %v, want one naming b1 and saying %q", err, tc.want)
			}
		})
	}
	b := &Boiler{PurgeAir: 40}
	p := cyclingPlant(t, b)
	b.Turndown = 0
	if _, err := p.Solve(context.Background(), steamCase(0.5)); err == nil || !strings.Contains(err.Error(), "need the burner's turndown") {
		t.Errorf("error %v, want one asking for the turndown", err)
	}
}

// TestWarmingSteam: an idle boiler kept warm by steam from the header
// takes its standby loss as steam, W/(h_steam − h_condensate), while the
// firing rule leaves it off, and nothing while it fires. Its standby loss
// here is the default 1 % of the heat input at MCR
// (docs/reference/plant-checks.md §3.4 [CP]) at its own feed; the
// enthalpies are IAPWS-IF97 (plant/water).
func TestWarmingSteam(t *testing.T) {
	t.Parallel()
	p := twoBoilers(t, Options{})
	must(t, p.Add(&Consumer{Base: Base{Name: "b2 warming"}, Model: &BoilerWarming{Boiler: "b2"}}))
	p.Connect("to b2 warming", Pos{}, "main", "out", "b2 warming", "in")
	ctx := context.Background()
	find := func(cr *CaseResult, name string) ConsumerResult {
		for _, c := range cr.Consumers {
			if c.Name == name {
				return c
			}
		}
		t.Fatalf("no consumer %q", name)
		return ConsumerResult{}
	}
	line := func(cr *CaseResult, name string) LineResult {
		for _, l := range cr.Lines {
			if l.Name == name {
				return l
			}
		}
		t.Fatalf("no line %q", name)
		return LineResult{}
	}
	cr, err := p.Solve(ctx, demandCase("one boiler", 5000))
	must(t, err)
	if cr.BoilersFiring != 1 {
		t.Fatalf("%d boilers fire, want 1", cr.BoilersFiring)
	}
	hs, err := water.PX(gauge(7), 0.98)
	must(t, err)
	hf, err := water.HSatLiquid(gauge(7))
	must(t, err)
	hfw := line(cr, "feed2").H
	beta := 0.01 / 0.99
	e := (hs.H - hfw) + beta*(hf-hfw)
	w := 0.01 * (10000.0 / 3600) * e / 0.845 // the table's 84.5 % at MCR
	in := line(cr, "to b2 warming")
	hc, err := water.HSatLiquid(in.P)
	must(t, err)
	got := find(cr, "b2 warming")
	within(t, "warming steam kg/s", got.SteamKgS, w/(in.H-hc), 1e-9)
	within(t, "warming duty W", got.DutyW, w, 1e-9)
	if cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
		t.Errorf("balances do not close: %+v", cr.Balance)
	}
	cr, err = p.Solve(ctx, demandCase("both boilers", 9000))
	must(t, err)
	if cr.BoilersFiring != 2 || find(cr, "b2 warming").SteamKgS != 0 {
		t.Errorf("%d boilers fire and the warming takes %g kg/s; want 2 and none", cr.BoilersFiring, find(cr, "b2 warming").SteamKgS)
	}
}
