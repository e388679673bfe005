package plant

import (
	"context"
	"math"
	"strings"
	"testing"

	"steamcase/plant/water"
)

// turbineWith is turbinePlant with the given turbine and condenser.
func turbineWith(t testing.TB, tu *Turbine, c *Condenser) *Plant {
	p := New("turbine forms", Options{})
	must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 303.15}))
	must(t, p.Add(&FeedTank{Base: Base{Name: "hotwell"}}))
	must(t, p.Add(&FeedPump{Base: Base{Name: "fp"}, Boilers: []string{"b1"}, Margin: 2 * bar, Eta: 0.5}))
	must(t, p.Add(&Boiler{Base: Base{Name: "b1"}, MCR: 10, DrumP: gauge(16),
		Efficiency: flatEta(0.85), Fuel: FuelSpec{Name: "HFO", LHV: 40.2e6, CO2Factor: 3.114}}))
	tu.Name = "cargo pump 1"
	c.Name = "vac cond"
	must(t, p.Add(tu))
	must(t, p.Add(c))
	p.Connect("makeup", Pos{}, "makeup", "out", "hotwell", "in")
	p.Connect("suction", Pos{}, "hotwell", "out", "fp", "in")
	p.Connect("feed", Pos{}, "fp", "out", "b1", "feed")
	p.Connect("hp steam", Pos{}, "b1", "steam", "cargo pump 1", "in")
	p.Connect("exhaust", Pos{}, "cargo pump 1", "out", "vac cond", "in")
	p.Connect("condensate", Pos{}, "vac cond", "out", "hotwell", "in")
	return p
}

func unitFigures(t *testing.T, cr *CaseResult, name string) map[string]float64 {
	t.Helper()
	for _, u := range cr.Units {
		if u.Name == name {
			return u.Figures.Map()
		}
	}
	t.Fatalf("no unit %q", name)
	return nil
}

func lineOf(t *testing.T, cr *CaseResult, name string) LineResult {
	t.Helper()
	for _, l := range cr.Lines {
		if l.Name == name {
			return l
		}
	}
	t.Fatalf("no line %q", name)
	return LineResult{}
}

// TestSteamRateFormIsTheIsentropicForm: a turbine given by the steam rate
// that its isentropic form gives at one point (the steam flow over the
// shaft power) takes the same steam and leaves at the same exhaust state,
// to 1e-9: the two forms are one law, ṁ = P·rate and h_out = h_in −
// P/(ṁ·η_mech) (docs/reference/plant-checks.md §8 [C], steam rate =
// 3600/(Δh_s·η_is·η_mech)). The maker's table through the same point gives
// the same too.
func TestSteamRateFormIsTheIsentropicForm(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	iso, err := turbineWith(t, &Turbine{Power: 1e6, ExhaustP: 0.2 * bar, EtaIs: 0.65, EtaMech: 0.95}, &Condenser{}).Solve(ctx, Case{Name: "isentropic"})
	must(t, err)
	m := unitFigures(t, iso, "cargo pump 1")["steam_kg_s"]
	rate := m / 1e6 // kg/J
	forms := []struct {
		name string
		tu   *Turbine
	}{
		{"steam rate", &Turbine{Power: 1e6, ExhaustP: 0.2 * bar, EtaMech: 0.95, RatedPower: 1e6, SteamRate: []float64{rate}}},
		{"part-load curve", &Turbine{Power: 1e6, ExhaustP: 0.2 * bar, EtaMech: 0.95, RatedPower: 1.25e6,
			RateLoad: []float64{0.5, 0.8, 1}, SteamRate: []float64{1.2 * rate, rate, 0.95 * rate}}},
		{"maker's table", &Turbine{Power: 1e6, ExhaustP: 0.2 * bar, EtaMech: 0.95,
			TablePower: []float64{0.5e6, 1e6, 1.5e6}, TableFlow: []float64{0.6 * m, m, 1.45 * m}}},
	}
	for _, f := range forms {
		cr, err := turbineWith(t, f.tu, &Condenser{}).Solve(ctx, Case{Name: f.name})
		must(t, err)
		fig := unitFigures(t, cr, "cargo pump 1")
		within(t, f.name+": steam kg/s", fig["steam_kg_s"], m, 1e-9)
		within(t, f.name+": shaft W", fig["shaft_W"], 1e6, 1e-9)
		within(t, f.name+": implied η_is", fig["eta_is"], 0.65, 1e-9)
		within(t, f.name+": exhaust enthalpy", lineOf(t, cr, "exhaust").H, lineOf(t, iso, "exhaust").H, 1e-9)
		within(t, f.name+": boiler fuel", cr.FuelKgS, iso.FuelKgS, 1e-9)
		if cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
			t.Errorf("%s: balances do not close: %+v", f.name, cr.Balance)
		}
	}
}

// TestSteamRateByHand: the steam of the part-load curve and of the
// maker's table, interpolated linearly, by hand (common practice, no
// source: a turbine's steam against power is close to a straight line, the
// Willans line, between close points).
func TestSteamRateByHand(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	// 10.2 kg/kWh at 50 % and 8.5 at 100 % of 1.2 MW; 0.9 MW is 75 %:
	// 9.35 kg/kWh, 8415 kg/h.
	cr, err := turbineWith(t, &Turbine{Power: 0.9e6, ExhaustP: 0.2 * bar, EtaMech: 0.95, RatedPower: 1.2e6,
		RateLoad: []float64{0.5, 1}, SteamRate: []float64{10.2 / 3.6e6, 8.5 / 3.6e6}}, &Condenser{}).Solve(ctx, Case{Name: "curve"})
	must(t, err)
	within(t, "steam kg/h by the curve", unitFigures(t, cr, "cargo pump 1")["steam_kg_s"]*3600, 8415, 1e-9)
	// 5 t/h at 0.5 MW and 12 t/h at 1.5 MW: 8.5 t/h at 1 MW.
	cr, err = turbineWith(t, &Turbine{Power: 1e6, ExhaustP: 0.2 * bar, EtaMech: 0.95,
		TablePower: []float64{0.5e6, 1.5e6}, TableFlow: []float64{5000.0 / 3600, 12000.0 / 3600}}, &Condenser{}).Solve(ctx, Case{Name: "table"})
	must(t, err)
	within(t, "steam kg/h by the table", unitFigures(t, cr, "cargo pump 1")["steam_kg_s"]*3600, 8500, 1e-9)
	// One steam rate used far below its rated power says so.
	cr, err = turbineWith(t, &Turbine{Power: 0.5e6, ExhaustP: 0.2 * bar, EtaMech: 0.95, RatedPower: 1.2e6,
		SteamRate: []float64{8.5 / 3.6e6}}, &Condenser{}).Solve(ctx, Case{Name: "one rate"})
	must(t, err)
	if !strings.Contains(strings.Join(cr.Warnings, "\n"), "give the part-load curve") {
		t.Errorf("warnings %q do not ask for the part-load curve", cr.Warnings)
	}
}

// TestTurbineInputErrors: a steam rate without the rated power it is
// given at, two forms at once, and a steam rate below the isentropic limit
// are refused, naming the turbine.
func TestTurbineInputErrors(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name string
		tu   *Turbine
		want string
	}{
		{"no rated power", &Turbine{Power: 1e6, ExhaustP: 0.2 * bar, SteamRate: []float64{8.5 / 3.6e6}}, "a steam rate needs the rated power"},
		{"two forms", &Turbine{Power: 1e6, ExhaustP: 0.2 * bar, EtaIs: 0.6, RatedPower: 1e6, SteamRate: []float64{8.5 / 3.6e6}}, "give its steam one way"},
		{"no form", &Turbine{Power: 1e6, ExhaustP: 0.2 * bar}, "give its steam one way"},
		// 16 bar(g) dry to 0.2 bar(a): Δh_s 688.5 kJ/kg, so at η_mech 0.95
		// no turbine takes less than 3600/(688.5·0.95) = 5.50 kg/kWh
		// (docs/reference/plant-checks.md §8 [C]).
		{"below the isentropic limit", &Turbine{Power: 1e6, ExhaustP: 0.2 * bar, EtaMech: 0.95, RatedPower: 1e6, SteamRate: []float64{5.0 / 3.6e6}}, "below the isentropic limit 5.50 kg/kWh"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			_, err := turbineWith(t, tc.tu, &Condenser{}).Solve(context.Background(), Case{Name: tc.name})
			if err == nil || !strings.Contains(err.Error(), tc.want) || !strings.Contains(err.Error(), `"cargo pump 1"`) {
				t.Errorf("error %v, want one naming the turbine and saying %q", err, tc.want)
			}
		})
	}
}

// TestCondenserVacuumFromTheSea: with a given approach the steam condenses
// at T_sea + approach, and the turbine exhausts at its saturation pressure:
// 290 K + 10 K = 300 K, 3536.58941 Pa (IAPWS R7-97(2012) Table 35). Rated
// by its UA and sea-water flow, the condensing temperature is T_sea +
// Q/(ε·ṁ·c_p), ε = 1 − exp(−UA/(ṁ·c_p)) (ε-NTU with one side at one
// temperature, Incropera, from memory), and the vacuum its saturation
// pressure (IAPWS-IF97, plant/water).
func TestCondenserVacuumFromTheSea(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	sea := Case{Name: "sea 290 K", Conditions: Conditions{SeaT: 290}}
	cr, err := turbineWith(t, &Turbine{Power: 1e6, EtaIs: 0.65, EtaMech: 0.95}, &Condenser{Approach: 10}).Solve(ctx, sea)
	must(t, err)
	fig := unitFigures(t, cr, "vac cond")
	within(t, "exhaust pressure Pa", lineOf(t, cr, "exhaust").P, 3536.58941, 1e-8)
	within(t, "condensing temperature K", fig["sat_T_K"], 300, 1e-9)
	if cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
		t.Errorf("balances do not close: %+v", cr.Balance)
	}

	const ua, msw, cp = 400e3, 100.0, 3990.0
	cr, err = turbineWith(t, &Turbine{Power: 1e6, EtaIs: 0.65, EtaMech: 0.95}, &Condenser{UA: ua, SeaFlow: msw}).Solve(ctx, sea)
	must(t, err)
	fig = unitFigures(t, cr, "vac cond")
	eps := 1 - math.Exp(-ua/(msw*cp))
	tc := 290 + fig["duty_W"]/(eps*msw*cp)
	within(t, "rated condensing temperature K", fig["sat_T_K"], tc, 1e-9)
	ps, err := water.Psat(tc)
	must(t, err)
	within(t, "rated vacuum Pa", lineOf(t, cr, "exhaust").P, ps, 1e-9)
	within(t, "sea-water outlet K", fig["sea_out_T_K"], 290+fig["duty_W"]/(msw*cp), 1e-12)

	// Without the case's sea temperature the vacuum is not known.
	_, err = turbineWith(t, &Turbine{Power: 1e6, EtaIs: 0.65}, &Condenser{Approach: 10}).Solve(ctx, Case{Name: "no sea"})
	if err == nil || !strings.Contains(err.Error(), "sea temperature") {
		t.Errorf("error %v, want one asking for the sea temperature", err)
	}
	// A turbine without an exhaust pressure needs a sea-cooled condenser.
	err = turbineWith(t, &Turbine{Power: 1e6, EtaIs: 0.65}, &Condenser{}).Check()
	if err == nil || !strings.Contains(err.Error(), "has no exhaust pressure") {
		t.Errorf("error %v, want one saying the turbine has no exhaust pressure", err)
	}
}
