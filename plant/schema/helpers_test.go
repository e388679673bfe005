package schema

import (
	"context"
	"math"
	"testing"

	"steamcase/plant"
	"steamcase/plant/profile"
)

func must(t testing.TB, err error) {
	t.Helper()
	if err != nil {
		t.Fatal(err)
	}
}

// gauge converts bar(g) to Pa absolute at the standard atmosphere
// (101325 Pa, exact by definition).
func gauge(b float64) float64 { return b*1e5 + 101325 }

// boilerOnly is an invented plant: make-up at 60 °C and 1 bar(a) straight
// into one boiler (MCR 4 kg/s, turndown 1:4, η 0.85 flat, LCV 40.2 MJ/kg,
// C_F 3.114) that raises saturated steam at 7 bar(g) for a consumer
// taking a set flow, 10 t/h unless a case sets another. It is the plant
// of docs/reference/plant-checks.md §3.6 [C].
func boilerOnly(t testing.TB) *plant.Plant {
	t.Helper()
	p := plant.New("Invented Check Ship", plant.Options{})
	must(t, p.Add(&plant.MakeUp{Base: plant.Base{Name: "makeup"}, T: 333.15, P: 1e5}))
	must(t, p.Add(&plant.Boiler{Base: plant.Base{Name: "b1"}, MCR: 4, DrumP: gauge(7), Turndown: 4,
		Efficiency: &plant.EfficiencyTable{Load: []float64{0.2, 1.1}, Eta: []float64{0.85, 0.85}},
		Fuel:       plant.FuelSpec{Name: "HFO", LHV: 40.2e6, CO2Factor: 3.114}}))
	must(t, p.Add(&plant.Consumer{Base: plant.Base{Name: "load"}, SteamFlow: 10000.0 / 3600}))
	p.Connect("feed", plant.Pos{}, "makeup", "out", "b1", "feed")
	p.Connect("steam", plant.Pos{}, "b1", "steam", "load", "in")
	return p
}

// flow sets the consumer's steam flow, kg/h.
func flow(kgh float64) []plant.Setting {
	return []plant.Setting{{Unit: "load", Param: "steam", Value: kgh / 3600}}
}

func solve(t testing.TB, p *plant.Plant, c plant.Case) *plant.CaseResult {
	t.Helper()
	cr, err := p.Solve(context.Background(), c)
	must(t, err)
	return cr
}

// jobs runs a voyage of three rows in two phases (the second below the
// burner minimum, so that it cycles and warns), keeping its rows in full,
// a study of two variants (summaries only) and an audit of two days on
// boilerOnly.
func jobs(t testing.TB) (*profile.Result, *profile.StudyResult, *profile.AuditResult) {
	t.Helper()
	ctx := context.Background()
	p := boilerOnly(t)
	cond := plant.Conditions{SeaT: 288.15, AirT: 283.15, EngineLoad: 0.5}
	rows := []profile.Row{
		{Phase: "sea", Hours: 24, Case: plant.Case{Name: "full", Conditions: cond}},
		{Phase: "port", Hours: 12, Case: plant.Case{Name: "light", Set: flow(1000)}},
		{Phase: "sea", Hours: 6, Case: plant.Case{Name: "half", Conditions: cond, Set: flow(5000)}},
	}
	opt := profile.Options{Workers: 1}
	v, err := profile.Run(ctx, p, rows, profile.Options{Workers: 1, KeepResults: true})
	must(t, err)
	s, err := profile.Study(ctx, p, rows, []profile.Variant{
		{Name: "as built"},
		{Name: "less steam", Set: flow(4000)},
	}, profile.Economics{FuelPrice: 600, InstalledCost: 40000, Currency: "EUR"}, opt)
	must(t, err)
	a, err := profile.Audit(ctx, p, profile.AuditSpec{Days: []profile.Day{
		{Date: "2026-01-01", Phase: "sea", Hours: 24, Case: plant.Case{Name: "d1", Set: flow(5000)}, ClaimedT: 12},
		{Date: "2026-01-02", Phase: "sea", Hours: 24, Case: plant.Case{Name: "d2", Set: flow(5000)}, ClaimedT: 2},
	}, Uncertain: []profile.Uncertain{{Unit: "b1", Param: "eta_factor", Low: 0.95, High: 1.05}},
		Implied: []profile.Factor{{Targets: []profile.Target{{Unit: "b1", Param: "eta_factor"}}}}},
		profile.AuditOptions{Samples: 20, Seed: 3, Workers: 1})
	must(t, err)
	return v, s, a
}

func near(t *testing.T, what string, got, want, relTol float64) {
	t.Helper()
	if math.IsNaN(got) || math.Abs(got-want) > relTol*math.Abs(want) {
		t.Errorf("%s = %.9g, want %.9g within %.2g relative", what, got, want, relTol)
	}
}
