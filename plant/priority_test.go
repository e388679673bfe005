package plant

import (
	"context"
	"math"
	"strings"
	"testing"

	"steamcase/plant/loads"
)

// shortPlant is twoBoilers (2 × 10 000 kg/h) with three more consumers
// of set steam flows and priorities, none of them returning condensate:
// essential 8000 kg/h, cargo 8000 kg/h, deferrable 6000 kg/h.
func shortPlant(t testing.TB, opt Options) *Plant {
	p := twoBoilers(t, opt)
	for _, c := range []struct {
		name string
		kgh  float64
		pr   float64
	}{{"engine fuel", 8000, 40}, {"cargo", 8000, 30}, {"cleaning", 6000, 10}} {
		must(t, p.Add(&Consumer{Base: Base{Name: c.name}, SteamFlow: c.kgh / 3600, Priority: c.pr}))
		p.Connect("to "+c.name, Pos{}, "main", "out", c.name, "in")
	}
	return p
}

func consumerOf(t *testing.T, cr *CaseResult, name string) ConsumerResult {
	t.Helper()
	for _, c := range cr.Consumers {
		if c.Name == name {
			return c
		}
	}
	t.Fatalf("no consumer %q", name)
	return ConsumerResult{}
}

func TestShortfallByPriority(t *testing.T) {
	t.Parallel()
	// By hand (no outside source): the boilers together may raise
	// 20 000 kg/h. The demand is 22 000 kg/h of the three consumers plus
	// what the heating (2 MW), the sundry consumer (100 kg/h) and the
	// header's drains take; the heating and the sundry consumer give no
	// priority (essential). The lowest priority is reduced first: the
	// cleaning gives up the whole excess, and everything else is
	// delivered in full. The boilers raise exactly their limit.
	p := shortPlant(t, Options{})
	cr, err := p.Solve(context.Background(), Case{Name: "short"})
	must(t, err)
	if cr.CanCarry || cr.BoilersFiring != 2 {
		t.Fatalf("can carry %v with %d firing; want false with 2", cr.CanCarry, cr.BoilersFiring)
	}
	for _, b := range cr.Boilers {
		within(t, b.Name+" at its MCR", b.SteamKgS, b.MCRKgS, 1e-9)
	}
	heating := consumerOf(t, cr, "heating")
	within(t, "heating delivered", heating.DutyW, 2e6, 1e-9)
	within(t, "engine fuel delivered", consumerOf(t, cr, "engine fuel").SteamKgS, 8000.0/3600, 1e-9)
	within(t, "cargo delivered", consumerOf(t, cr, "cargo").SteamKgS, 8000.0/3600, 1e-9)
	// The steam balance by hand: what the consumers and the header's
	// drains take is what the boilers raise.
	var taken float64
	for _, c := range cr.Consumers {
		taken += c.SteamKgS
	}
	for _, u := range cr.Units {
		taken += u.Figures.Of("drained_kg_s")
	}
	within(t, "delivered steam = the boilers' MCR", taken, 20000.0/3600, 1e-9)
	cleaning := consumerOf(t, cr, "cleaning")
	want := 20000.0/3600 - (taken - cleaning.SteamKgS)
	within(t, "cleaning takes what is left", cleaning.SteamKgS, want, 1e-9)
	within(t, "cleaning shed", cleaning.ShedKgS, 6000.0/3600-want, 1e-9)
	within(t, "shortfall is what was shed", cr.ShortfallKgS, cleaning.ShedKgS, 1e-9)
	if cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
		t.Errorf("balances do not close: %+v", cr.Balance)
	}
	if !strings.Contains(strings.Join(cr.Warnings, "\n"), "shed by priority, lowest first: cleaning") {
		t.Errorf("warnings %q do not name what is shed", cr.Warnings)
	}

	// Deeper: with 14 000 kg/h more cleaning steam the cleaning goes
	// entirely and the cargo gives up the rest; the essential consumers
	// keep all theirs.
	c := Case{Name: "deeper", Set: []Setting{{Unit: "cleaning", Param: "steam", Value: 20000.0 / 3600},
		{Unit: "cargo", Param: "steam", Value: 12000.0 / 3600}}}
	cr, err = p.Solve(context.Background(), c)
	must(t, err)
	if got := consumerOf(t, cr, "cleaning").SteamKgS; got > 1e-9 {
		t.Errorf("cleaning still takes %g kg/s; the lowest priority goes first", got)
	}
	within(t, "engine fuel delivered", consumerOf(t, cr, "engine fuel").SteamKgS, 8000.0/3600, 1e-9)
	cargo := consumerOf(t, cr, "cargo")
	if !(cargo.SteamKgS > 0 && cargo.SteamKgS < 12000.0/3600) {
		t.Errorf("cargo takes %g kg/s; want part of its 3.33 kg/s", cargo.SteamKgS)
	}
	for _, b := range cr.Boilers {
		within(t, b.Name+" at its MCR", b.SteamKgS, b.MCRKgS, 1e-9)
	}
}

func TestShortfallInProportion(t *testing.T) {
	t.Parallel()
	// Without priorities every consumer that may be reduced gives up the
	// same fraction of its demand (by hand, no outside source): the
	// heating's 2 MW and the sundry consumer's steam are reduced alike.
	p := twoBoilers(t, Options{})
	c := demandCase("too much", 25000)
	c.Set[0].Value = 2e6 // the heating keeps its 2 MW
	cr, err := p.Solve(context.Background(), c)
	must(t, err)
	heating, sundry := consumerOf(t, cr, "heating"), consumerOf(t, cr, "sundry")
	fh := heating.DutyW / 2e6
	fs := sundry.SteamKgS / (25000.0 / 3600)
	within(t, "same fraction", fh, fs, 1e-9)
	if !(fh > 0.5 && fh < 0.9) {
		t.Errorf("delivered fraction %g; want about 0.7", fh)
	}
	if !strings.Contains(strings.Join(cr.Warnings, "\n"), "no priorities given: every consumer that may be reduced is reduced in proportion") {
		t.Errorf("warnings %q do not say the demand is reduced in proportion", cr.Warnings)
	}
	within(t, "boilers at their MCR", cr.SteamProductionKgS, 20000.0/3600, 1e-9)
}

func TestMaxLoadLimits(t *testing.T) {
	t.Parallel()
	// A case that lowers one boiler's max load: the boilers share equally
	// in fractions of their limits, and the limit holds (by hand).
	p := twoBoilers(t, Options{})
	c := demandCase("limited", 15000)
	c.Set = append(c.Set, Setting{Unit: "b1", Param: "max_load", Value: 0.5})
	cr, err := p.Solve(context.Background(), c)
	must(t, err)
	b1, b2 := cr.Boilers[0], cr.Boilers[1]
	within(t, "equal fraction of the limits", b1.SteamKgS/b1.LimitKgS, b2.SteamKgS/b2.LimitKgS, 1e-9)
	if cr.CanCarry {
		t.Errorf("15 000 kg/h with 5000 + 10 000 kg/h of limits and the drains: want short")
	}
	within(t, "b1 at its limit", b1.SteamKgS, 5000.0/3600, 1e-9)
	// Forced to one boiler above the usable fraction: a warning.
	c = demandCase("forced", 9000)
	c.Fire = []string{"b2"}
	cr, err = p.Solve(context.Background(), c)
	must(t, err)
	if !strings.Contains(strings.Join(cr.Warnings, "\n"), `"b2" is forced to 90 % of its MCR, above the plant's usable fraction 85 %`) {
		t.Errorf("warnings %q", cr.Warnings)
	}
}

func TestShedFraction(t *testing.T) {
	t.Parallel()
	// The delivered fraction of a rank (priority.go): a rank whose slice
	// of the shed level is [lo, lo + w) is reduced from all to nothing
	// while L crosses it (common practice of the allocation, no source).
	x := []float64{0}
	mid := shedRole{idx: 0, on: true, lo: 0.25, w: 0.5}
	for _, tc := range []struct {
		L         float64
		r         shedRole
		phi, dphi float64
		what      string
	}{
		{0.1, mid, 1, 0, "not reached"},
		{0.25, mid, 1, -2, "starts at its kink"},
		{0.5, mid, 0.5, -2, "half"},
		{0.75, mid, 0, 0, "gone"},
		{-0.1, shedRole{idx: 0, on: true, w: 0.5, first: true}, 1.2, -2, "the lowest continues below zero"},
		{1, shedRole{idx: 0, on: true, lo: 0.5, w: 0.5, last: true}, 0, -2, "the highest keeps its slope at the top"},
		{0.5, shedRole{idx: 0, lo: 0.25, w: 0.5}, 1, 0, "not reduced in the case"},
	} {
		x[0] = tc.L
		phi, dphi := tc.r.frac(x)
		if math.Abs(phi-tc.phi) > 1e-15 || dphi != tc.dphi {
			t.Errorf("%s: φ %g, dφ/dL %g; want %g, %g", tc.what, phi, dphi, tc.phi, tc.dphi)
		}
	}
}

func TestShedTankCooling(t *testing.T) {
	t.Parallel()
	// A cargo tank held at 55 °C loses its heating to a shortfall: its
	// first cooling rate is the heat shed over m·c, and the time to its
	// min_T with the heating left is the lumped model's (docs/reference/plant-checks.md
	// §6 [CP]), checked here against a fourth-order Runge-Kutta
	// integration of m·c·dT/dt = q − UA·(T − T_amb) (constant c, so the
	// closed form is exact; no outside source).
	p := twoBoilers(t, Options{})
	tank := &TankHeating{MinT: 273.15 + 45, Tank: loads.TankHeating{
		Name: "cargo", Cargo: loads.Cargo{Name: "crude", Density: 850, Cp: 2000}, CargoVolume: 10000,
		Boundaries: []loads.Boundary{{Name: "deck", Area: 3000, U: 4, Beyond: loads.Air}, {Name: "bottom", Area: 3000, U: 3, Beyond: loads.Sea}},
		To:         273.15 + 55,
	}}
	must(t, p.Add(&Consumer{Base: Base{Name: "cargo heating"}, Model: tank, Priority: 30, ReturnFraction: 1}))
	p.Connect("to cargo heating", Pos{}, "main", "out", "cargo heating", "in")
	p.Connect("cargo heating return", Pos{}, "cargo heating", "out", "hotwell", "in")
	c := demandCase("discharge", 19700) // the sundry steam, essential
	c.Conditions = Conditions{SeaT: 273.15 + 5, AirT: 273.15}
	cr, err := p.Solve(context.Background(), c)
	must(t, err)
	h := consumerOf(t, cr, "cargo heating")
	if h.Cooling == nil || !(h.ShedW > 0 && h.ShedW < h.RequestedW) {
		t.Fatalf("the tank is not partly shed: %+v", h)
	}
	m := 850.0 * 10000
	ua := 3000*4.0 + 3000*3.0
	ta := (3000*4.0*273.15 + 3000*3.0*278.15) / ua
	within(t, "requested = loss", h.RequestedW, ua*(273.15+55-ta), 1e-9)
	within(t, "cooling rate", h.Cooling.RateKS, -h.ShedW/(m*2000), 1e-9)
	q := h.DutyW
	f := func(T float64) float64 { return (q - ua*(T-ta)) / (m * 2000) }
	T, tt, dt := 273.15+55, 0.0, 60.0
	for T > 273.15+45 && tt < 1e8 {
		k1 := f(T)
		k2 := f(T + dt/2*k1)
		k3 := f(T + dt/2*k2)
		k4 := f(T + dt*k3)
		next := T + dt/6*(k1+2*k2+2*k3+k4)
		if next <= 273.15+45 {
			tt += dt * (T - (273.15 + 45)) / (T - next)
			break
		}
		T, tt = next, tt+dt
	}
	if !h.Cooling.Reaches {
		t.Fatalf("the cargo never reaches min_T: %+v", h.Cooling)
	}
	within(t, "hours to min_T", h.Cooling.SecondsToMinT, tt, 1e-4)
}

func TestShortfallBeyondShedding(t *testing.T) {
	t.Parallel()
	// Twin boilers of 1 t/h each whose main header loses 2 MW: its drains
	// alone take more steam (about 3.5 t/h) than the boilers' limit, and
	// nothing that may be reduced can make up for it. The case is solved
	// with nothing shed and the boilers above their MCR, and says so (by
	// hand, no outside source).
	p := twoBoilers(t, Options{})
	p.Component("main").(*Header).HeatLoss = 2e6
	for _, b := range []string{"b1", "b2"} {
		p.Component(b).(*Boiler).MCR = 1000.0 / 3600
	}
	cr, err := p.Solve(context.Background(), demandCase("lossy", 1000))
	must(t, err)
	if cr.CanCarry || cr.ShedW != 0 {
		t.Errorf("can carry %v, shed %g W; want short with nothing shed", cr.CanCarry, cr.ShedW)
	}
	all := strings.Join(cr.Warnings, "\n")
	for _, want := range []string{"is above its MCR", "even with every consumer that may be reduced taken to nothing"} {
		if !strings.Contains(all, want) {
			t.Errorf("warnings %q lack %q", cr.Warnings, want)
		}
	}
	if cr.ShortfallKgS < cr.SteamProductionKgS-2000.0/3600-1e-9 {
		t.Errorf("shortfall %g kg/s, want the steam above the limit", cr.ShortfallKgS)
	}
}
