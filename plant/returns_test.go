package plant

import (
	"context"
	"strings"
	"testing"

	"steamcase/plant/water"
)

// twoBoilersWith is twoBoilers with the heating consumer's drain cooler
// destination and the main header's drains set.
func twoBoilersWith(t testing.TB, cooler CoolerDestination, drains DrainDestination) *Plant {
	p := twoBoilers(t, Options{})
	for _, c := range p.comps {
		switch u := c.(type) {
		case *Consumer:
			if u.Name == "heating" {
				u.DrainCooler = cooler
			}
		case *Header:
			if u.Name == "main" {
				u.Drains = drains
			}
		}
	}
	return p
}

// cooled is the case of the drain-cooler tests: the heating condensate
// cooled to 80 °C before the hotwell.
var cooled = Case{Name: "cooled", Set: []Setting{{Unit: "heating", Param: "return_T", Value: 353.15}}}

// TestDrainCoolerToTheFeed: by default the drain cooler heats the boiler
// feed after the feed pump, so the boilers raise the same steam from a
// feed warmer by Q/ṁ_feed and burn Q/(η·LHV) less than with the heat
// thrown overboard, the efficiency being the table's at the same load (the
// energy balance of docs/reference/plant-checks.md §3.6, by hand). To the
// hotwell, the tank takes the heat.
func TestDrainCoolerToTheFeed(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	over, err := twoBoilersWith(t, CoolerOverboard, DrainsToHotwell).Solve(ctx, cooled)
	must(t, err)
	feed, err := twoBoilersWith(t, CoolerToFeed, DrainsToHotwell).Solve(ctx, cooled)
	must(t, err)
	q := consumerOf(t, feed, "heating").DrainCoolerW
	if !(q > 0) || consumerOf(t, feed, "heating").DrainCoolerTo != "feed" || consumerOf(t, over, "heating").DrainCoolerTo != "overboard" {
		t.Fatalf("drain cooler %g W to %q / %q", q, consumerOf(t, feed, "heating").DrainCoolerTo, consumerOf(t, over, "heating").DrainCoolerTo)
	}
	within(t, "cooler heat the same either way", consumerOf(t, over, "heating").DrainCoolerW, q, 1e-9)
	within(t, "steam the same either way", feed.SteamProductionKgS, over.SteamProductionKgS, 1e-9)
	eta := feed.Boilers[0].Efficiency
	within(t, "efficiency at the same load", over.Boilers[0].Efficiency, eta, 1e-9)
	within(t, "fuel saved kg/s", over.FuelKgS-feed.FuelKgS, q/(eta*40.2e6), 1e-6)
	within(t, "feed pump's share of the heat", unitFigures(t, feed, "fp")["drain_cooler_heat_W"], q, 1e-9)
	for _, cr := range []*CaseResult{over, feed} {
		if cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
			t.Errorf("balances do not close: %+v", cr.Balance)
		}
	}

	hot, err := twoBoilersWith(t, CoolerToHotwell, DrainsToHotwell).Solve(ctx, cooled)
	must(t, err)
	within(t, "hotwell's share of the heat", unitFigures(t, hot, "hotwell")["received_W"]-unitFigures(t, over, "hotwell")["received_W"],
		consumerOf(t, hot, "heating").DrainCoolerW, 1e-9)
	if !(hot.FeedTankT > over.FeedTankT) {
		t.Errorf("hotwell at %.2f K with the cooler's heat, %.2f K without", hot.FeedTankT, over.FeedTankT)
	}
	if hot.Balance.MassRel > 1e-9 || hot.Balance.EnergyRel > 1e-6 {
		t.Errorf("balances do not close: %+v", hot.Balance)
	}
}

// TestHeaderDrainsToTheHotwell: a header's drains return to the hotwell
// by default; lost, the make-up replaces them, ṁ_d more (the mass balance,
// by hand).
func TestHeaderDrainsToTheHotwell(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	ret, err := twoBoilersWith(t, CoolerToFeed, DrainsToHotwell).Solve(ctx, demandCase("drains", 5000))
	must(t, err)
	lost, err := twoBoilersWith(t, CoolerToFeed, DrainsLost).Solve(ctx, demandCase("drains", 5000))
	must(t, err)
	md := unitFigures(t, lost, "main")["drained_kg_s"]
	within(t, "drains returned", unitFigures(t, ret, "main")["drains_returned_kg_s"], unitFigures(t, ret, "main")["drained_kg_s"], 1e-12)
	if unitFigures(t, lost, "main")["drains_returned_kg_s"] != 0 {
		t.Errorf("lost drains reported as returned")
	}
	within(t, "make-up of the lost drains", lost.MakeUpKgS-ret.MakeUpKgS, md, 1e-6)
	within(t, "drains returned in the totals", ret.DrainsReturnedKgS, md, 1e-6)
	for _, cr := range []*CaseResult{ret, lost} {
		if cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
			t.Errorf("balances do not close: %+v", cr.Balance)
		}
	}
}

// TestTrapLoss: a consumer whose trap passes a fraction τ of its steam
// live takes D/((1 − τ)·(h_in − h_c)) for its duty D, and its return
// leaves at (1 − τ)·h_c + τ·h_in (mass and energy balance by hand;
// IAPWS-IF97 enthalpies from the solved lines).
func TestTrapLoss(t *testing.T) {
	t.Parallel()
	p := twoBoilers(t, Options{})
	cr, err := p.Solve(context.Background(), Case{Name: "trap", Set: []Setting{{Unit: "heating", Param: "trap_loss", Value: 0.05}}})
	must(t, err)
	in := lineOf(t, cr, "to heating")
	hc, err := water.HPT(in.P, mustTsat(t, in.P)-10)
	must(t, err)
	c := consumerOf(t, cr, "heating")
	m := 2e6 / (0.95 * (in.H - hc))
	within(t, "steam kg/s", c.SteamKgS, m, 1e-9)
	within(t, "trap loss kg/s", c.TrapLossKgS, 0.05*m, 1e-9)
	within(t, "duty W", c.DutyW, 2e6, 1e-9)
	within(t, "return enthalpy", lineOf(t, cr, "heating return").H, 0.95*hc+0.05*in.H, 1e-9)
	within(t, "trap loss in the totals", cr.TrapLossKgS, 0.05*m, 1e-9)
	if cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
		t.Errorf("balances do not close: %+v", cr.Balance)
	}
}

func mustTsat(t *testing.T, p float64) float64 {
	ts, err := water.Tsat(p)
	must(t, err)
	return ts
}

// TestReturnInputErrors: a drain cooler sent to a hotwell the plant does
// not have, and a heat loss a case gives to a header declared without one,
// are refused, naming the unit.
func TestReturnInputErrors(t *testing.T) {
	t.Parallel()
	p := New("no hotwell", Options{})
	must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 333.15, P: 1e5}))
	must(t, p.Add(&Header{Base: Base{Name: "mix"}}))
	must(t, p.Add(&Boiler{Base: Base{Name: "b1"}, MCR: 4, DrumP: gauge(7), Efficiency: flatEta(0.85), Fuel: FuelSpec{Name: "HFO", LHV: 40.2e6, CO2Factor: 3.114}}))
	must(t, p.Add(&Consumer{Base: Base{Name: "heater"}, Duty: 1e5, ReturnFraction: 1, ReturnT: 353.15, DrainCooler: CoolerToHotwell}))
	p.Connect("mu", Pos{}, "makeup", "out", "mix", "in")
	p.Connect("feed", Pos{}, "mix", "out", "b1", "feed")
	p.Connect("steam", Pos{}, "b1", "steam", "heater", "in")
	p.Connect("return", Pos{}, "heater", "out", "mix", "in")
	err := p.Check()
	if err == nil || !strings.Contains(err.Error(), "no feed tank") {
		t.Errorf("error %v, want one saying the plant has no feed tank", err)
	}
	q := twoBoilers(t, Options{})
	_, err = q.Solve(context.Background(), Case{Name: "loss", Set: []Setting{{Unit: "feed header", Param: "heat_loss", Value: 5e3}}})
	if err == nil || !strings.Contains(err.Error(), `"feed header"`) || !strings.Contains(err.Error(), "declared without one") {
		t.Errorf("error %v, want one naming the feed header", err)
	}
}
