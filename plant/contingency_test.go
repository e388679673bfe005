package plant

import (
	"context"
	"strings"
	"testing"
)

func TestTripEqualsForcedCase(t *testing.T) {
	t.Parallel()
	// Both boilers of twoBoilers fire for 15 000 kg/h. If one trips the
	// other alone is short: the N-1 answer must be the case forced with
	// the remaining boiler, solved on a plant of its own (the same
	// equations, so to the solver's tolerance; no outside source).
	p := twoBoilers(t, Options{})
	c := demandCase("heavy", 15000)
	cr, err := p.Solve(context.Background(), c)
	must(t, err)
	if !cr.ContingenciesChecked || len(cr.Contingencies) != 1 {
		t.Fatalf("contingencies %+v", cr.Contingencies)
	}
	trip := cr.Contingencies[0]
	if trip.Name != "b2 trips" || trip.Kind != "boiler trip" || !trip.Solved || trip.CanCarry {
		t.Fatalf("trip %+v; want b2 (the last of equals) solved and short", trip)
	}
	forced := c
	forced.Fire = []string{"b1"}
	fr, err := twoBoilers(t, Options{}).Solve(context.Background(), forced)
	must(t, err)
	within(t, "shortfall", trip.ShortfallKgS, fr.ShortfallKgS, 1e-7)
	within(t, "b1 steam", trip.Boilers[0].SteamKgS, fr.Boilers[0].SteamKgS, 1e-9)
	within(t, "shed", trip.ShedW, fr.ShedW, 1e-7)
	if len(trip.Shed) != 1 || trip.Shed[0].Name != "sundry" {
		t.Errorf("shed %+v; want the sundry consumer alone (the heating asks for nothing)", trip.Shed)
	}
	line := ContingencyLine(trip)
	if !strings.HasPrefix(line, "if b2 trips: b1 at 100 %, short ") || !strings.Contains(line, "; shed: sundry ") {
		t.Errorf("line %q", line)
	}

	// The case itself is as it would be without its contingencies: they
	// leave the warm start and the firing state as the case left them.
	q := twoBoilers(t, Options{NoContingencies: true})
	qr, err := q.Solve(context.Background(), c)
	must(t, err)
	if qr.ContingenciesChecked || len(qr.Contingencies) != 0 {
		t.Errorf("contingencies with the option off: %+v", qr.Contingencies)
	}
	within(t, "fuel with and without N-1", cr.FuelKgS, qr.FuelKgS, 1e-12)
	next := demandCase("next", 14000)
	a, err := p.Solve(context.Background(), next)
	must(t, err)
	b, err := q.Solve(context.Background(), next)
	must(t, err)
	within(t, "the next case's fuel", a.FuelKgS, b.FuelKgS, 1e-9)
}

func TestTripStartsStandby(t *testing.T) {
	t.Parallel()
	// One boiler carries 5000 kg/h. If it trips, the standby boiler must
	// start; with 10 000 kg/h usable at 85 % against about 5000 kg/h the
	// answer is screened as carried (Screen), not solved.
	p := twoBoilers(t, Options{})
	cr, err := p.Solve(context.Background(), demandCase("light", 5000))
	must(t, err)
	trip := cr.Contingencies[0]
	if trip.Name != "b1 trips" || trip.Solved || !trip.CanCarry || len(trip.Boilers) != 1 || !trip.Boilers[0].Started {
		t.Fatalf("trip %+v", trip)
	}
	within(t, "estimated load", trip.Boilers[0].SteamKgS, cr.SteamProductionKgS, 1e-12)
	// At 7500 kg/h the standby boiler's usable 8500 kg/h is below 125 %
	// of the steam: solved, and carried.
	cr, err = p.Solve(context.Background(), demandCase("medium", 7500))
	must(t, err)
	trip = cr.Contingencies[0]
	if !trip.Solved || !trip.CanCarry || trip.Boilers[0].Name != "b2" || !trip.Boilers[0].Started {
		t.Fatalf("trip %+v", trip)
	}
}

func TestEconomiserOutAndListed(t *testing.T) {
	t.Parallel()
	// At sea the exhaust-gas economiser and the boiler share the demand:
	// with the economiser out the boiler raises its steam too (solved),
	// and a listed failure of both leaves nothing.
	p := egeBoilerPlant(t)
	p.Opt.Contingencies = []Contingency{{Units: []string{"b1", "ege"}}, {Units: []string{"ege"}}}
	cr, err := p.Solve(context.Background(), Case{Name: "sea", Conditions: Conditions{EngineLoad: 1},
		Set: []Setting{{Unit: "heating", Param: "steam", Value: 7000.0 / 3600}}})
	must(t, err)
	var names []string
	for _, c := range cr.Contingencies {
		names = append(names, c.Name)
	}
	if strings.Join(names, "; ") != "b1 trips; ege out; b1 and ege lost" {
		t.Fatalf("contingencies %q (the listed economiser alone is the automatic one)", names)
	}
	out := cr.Contingencies[1]
	if !out.Solved || !out.CanCarry {
		t.Fatalf("economiser out: %+v", out)
	}
	// The boiler raises all the heating's 7000 kg/h (by hand).
	within(t, "boiler steam without the economiser", out.Boilers[0].SteamKgS, 7000.0/3600, 1e-9)
	both := cr.Contingencies[2]
	if both.CanCarry || !strings.Contains(both.Note, "no steam source remains") {
		t.Errorf("both lost: %+v", both)
	}
	// If the boiler trips the economiser alone is short: the heating is
	// reduced to what it raises.
	trip := cr.Contingencies[0]
	if trip.CanCarry || len(trip.Shed) != 1 {
		t.Errorf("boiler trips: %+v", trip)
	}
	within(t, "the heating keeps the economiser's steam", 7000.0/3600-trip.Shed[0].ShedKgS, cr.EGESteamKgS, 1e-6)
}

func TestContingencyFaults(t *testing.T) {
	t.Parallel()
	p := twoBoilers(t, Options{})
	p.Opt.Contingencies = []Contingency{{Pos: Pos{File: "x.lua", Line: 3}}, {Units: []string{"b3"}, Pos: Pos{File: "x.lua", Line: 4}},
		{Units: []string{"heating"}, Pos: Pos{File: "x.lua", Line: 5}}}
	err := p.Check()
	if err == nil {
		t.Fatal("no error")
	}
	for _, want := range []string{`x.lua:3: contingency 1 names no unit`, `x.lua:4: unit "b3": contingency 2 names "b3", which is not a unit of the plant`,
		`x.lua:5: unit "heating": contingency 3 names the heat consumer "heating"; a contingency loses boilers or exhaust-gas economisers`} {
		if !strings.Contains(err.Error(), want) {
			t.Errorf("error %q lacks %q", err, want)
		}
	}
}
