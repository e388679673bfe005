package plant

import (
	"math"

	"steamcase/plant/units"
)

// FeedPump raises the feed water to the drum pressure plus a margin. The
// enthalpy rise is v·Δp/η, taking the water as incompressible over the
// pump (a simplification good to well under 1 % at boiler pressures).
type FeedPump struct {
	Base
	// Discharge is the set discharge pressure, Pa absolute. Zero means the
	// highest drum pressure of the boilers in Boilers plus Margin.
	Discharge float64
	Boilers   []string // boilers whose drum pressure the pump must exceed
	// Margin is the pressure above the drum, Pa; zero means 3 bar.
	Margin float64
	// Eta is the pump's efficiency, 0..1; zero means 45 %.
	Eta float64
	// MotorEta is the motor's efficiency, 0..1; zero means 0.9.
	MotorEta float64

	in, out   *Line
	eqs       [3]int
	discharge float64
	mv        memo
	mt        memo // inlet temperature (reports)
	// heat is the heat of drain coolers on condensate returns that heat
	// the feed after the pump (transfer.go): with any, the enthalpy
	// equation is written as a heat balance.
	heat []transfer
}

// pumpFlowFloor keeps the pump's outlet enthalpy defined when no feed
// passes and a drain cooler heats the feed (kg/s), as the economiser's
// ecoFlowFloor does; far below any flow of interest.
const pumpFlowFloor = 1e-6

// The feed pump's defaults.
const (
	// defaultPumpMargin is the discharge pressure above the drum: 3 bar
	// for the feed valve, the economiser and the static head (common
	// practice, no source).
	defaultPumpMargin = 3e5
	// defaultPumpEta is 45 %, within the 35-65 % of small multistage
	// boiler feed pumps (docs/reference/plant-checks.md §9 [M]).
	defaultPumpEta = 0.45
	// defaultMotorEta is 0.9, within the 0.90-0.95 of docs/reference/plant-checks.md §9
	// [M].
	defaultMotorEta = 0.9
)

// NewFeedPump returns a feed pump with its defaults.
func NewFeedPump() *FeedPump { return &FeedPump{} }

func pumpKey(k Key, f func(*FeedPump) *float64) Key { return num(k, self[*FeedPump], f) }

var feedPumpKeys = []Key{
	text(Key{Name: "boilers", Label: "boilers fed", Kind: KeyNameList, Example: `{ "AB1", "AB2" }`,
		Doc: "the boilers whose highest drum pressure the pump must exceed by the margin"},
		func(c Component, v []string) error {
			if u, ok := self[*FeedPump](c); ok {
				u.Boilers = append([]string(nil), v...)
			}
			return nil
		}),
	pumpKey(Key{Name: "margin", Label: "margin", Kind: KeyPressureDiff, Example: "3 bar",
		Doc: "discharge pressure above the highest drum pressure", Default: defaultPumpMargin, HasDefault: true,
		Source: "common practice, no source", Min: 1e3, Max: 5e6, Case: true},
		func(u *FeedPump) *float64 { return &u.Margin }),
	pumpKey(Key{Name: "discharge", Label: "discharge pressure", Dim: units.Pressure, Example: "20 bar(g)",
		Doc: "a set discharge pressure, instead of boilers and margin", Min: 1.1e5, Max: 5e7},
		func(u *FeedPump) *float64 { return &u.Discharge }),
	pumpKey(Key{Name: "eta", Label: "pump efficiency", Dim: units.Fraction, Example: "45 %",
		Doc: "pump efficiency", Default: defaultPumpEta, HasDefault: true, Source: "docs/reference/plant-checks.md §9 [M]",
		Min: 0.05, Max: 1, Case: true},
		func(u *FeedPump) *float64 { return &u.Eta }),
	pumpKey(Key{Name: "motor_eta", Label: "motor efficiency", Dim: units.Fraction, Example: "90 %",
		Doc: "efficiency of the pump's motor", Default: defaultMotorEta, HasDefault: true, Source: "docs/reference/plant-checks.md §9 [M]",
		Min: 0.05, Max: 1},
		func(u *FeedPump) *float64 { return &u.MotorEta }),
}

// Keys lists the feed pump's keys.
func (u *FeedPump) Keys() []Key { return feedPumpKeys }

// Kind returns "feed pump".
func (u *FeedPump) Kind() string { return "feed pump" }

// Ports: one inlet, one outlet.
func (u *FeedPump) Ports() []PortSpec {
	return []PortSpec{{Name: "in", Dir: In, Medium: WaterSteam}, {Name: "out", Dir: Out, Medium: WaterSteam}}
}

func (u *FeedPump) eta() float64 {
	if u.Eta == 0 {
		return defaultPumpEta
	}
	return u.Eta
}

func (u *FeedPump) margin() float64 {
	if u.Margin == 0 {
		return defaultPumpMargin
	}
	return u.Margin
}

func (u *FeedPump) motorEta() float64 {
	if u.MotorEta > 0 {
		return u.MotorEta
	}
	return defaultMotorEta
}

func (u *FeedPump) check(fs *faults) {
	checkKey(fs, u, "eta")
	checkKey(fs, u, "motor_eta")
	if u.Discharge == 0 && len(u.Boilers) == 0 {
		fs.add(u.Pos, u.Name, "", "needs a discharge pressure or the boilers it feeds (drum pressure plus a margin)")
	}
	if u.Discharge < 0 || u.Margin < 0 {
		fs.add(u.Pos, u.Name, "", "discharge pressure and margin must not be negative")
	}
}

func (u *FeedPump) assemble(a *assembly, ports portLines) {
	u.in, u.out = ports.one("in"), ports.one("out")
	u.eqs[0] = a.equation(u.Name+": mass balance", 1, u.in.mIdx(), u.out.mIdx())
	u.eqs[1] = a.equation(u.Name+": discharge pressure", scaleP, u.out.pIdx())
	u.eqs[2] = a.equation(u.Name+": enthalpy rise", scaleH, u.in.pIdx(), u.in.hIdx(), u.out.pIdx(), u.out.hIdx())
	u.heat = u.heat[:0]
}

// receive takes a drain cooler's heat into the feed after the pump: the
// enthalpy equation becomes (ṁ + pumpFlowFloor)·(h_out − h_in − v·Δp/η) =
// Q, a heat balance.
func (u *FeedPump) receive(a *assembly, t transfer) {
	u.heat = append(u.heat, t)
	a.fScale[u.eqs[2]] = scaleQ
	a.depend(u.eqs[2], u.in.mIdx())
	a.depend(u.eqs[2], t.transferDeps()...)
}

// link checks that the boilers the pump feeds are boilers of the plant.
func (u *FeedPump) link(pl *Plant, _ *assembly, fs *faults) {
	if u.Discharge > 0 {
		return
	}
	for _, name := range u.Boilers {
		if _, ok := pl.byName[name].(*Boiler); !ok {
			fs.add(u.Pos, u.Name, "", "feeds %q, which is not an oil-fired boiler of this plant", name)
		}
	}
}

// prepare fixes the discharge pressure from the boilers' drums, which a
// case may change.
func (u *FeedPump) prepare(pl *Plant, _ Conditions) error {
	if u.Discharge > 0 {
		u.discharge = u.Discharge
		return nil
	}
	best := 0.0
	for _, name := range u.Boilers {
		if b, ok := pl.byName[name].(*Boiler); ok {
			best = math.Max(best, b.DrumP)
		}
	}
	u.discharge = best + u.margin()
	return nil
}

func (u *FeedPump) residual(ev *eval, r []float64) error {
	pIn, hIn, pOut := ev.p(u.in), ev.h(u.in), ev.p(u.out)
	v, err := u.mv.get2(pIn, hIn, vPH)
	if err != nil {
		return wrapErr(u, err)
	}
	r[u.eqs[0]] = ev.m(u.out) - ev.m(u.in)
	r[u.eqs[1]] = pOut - u.discharge
	r[u.eqs[2]] = ev.h(u.out) - hIn - v*(pOut-pIn)/u.eta()
	if len(u.heat) > 0 {
		_, q, err := sumTransfers(ev, u.heat)
		if err != nil {
			return wrapErr(u, err)
		}
		r[u.eqs[2]] = (ev.m(u.in)+pumpFlowFloor)*r[u.eqs[2]] - q
	}
	return nil
}

func (u *FeedPump) jacobian(ev *eval, j jac) error {
	pIn, hIn, pOut := ev.p(u.in), ev.h(u.in), ev.p(u.out)
	v, err := u.mv.get2(pIn, hIn, vPH)
	if err != nil {
		return wrapErr(u, err)
	}
	dvdp, dvdh, err := dProp2(vPH, pIn, hIn, v)
	if err != nil {
		return wrapErr(u, err)
	}
	dp := pOut - pIn
	eta := u.eta()
	j.add(u.eqs[0], u.out.mIdx(), 1)
	j.add(u.eqs[0], u.in.mIdx(), -1)
	j.add(u.eqs[1], u.out.pIdx(), 1)
	k := 1.0
	if len(u.heat) > 0 {
		// r = (ṁ + floor)·g − Q, g = h_out − h_in − v·Δp/η.
		k = ev.m(u.in) + pumpFlowFloor
		j.add(u.eqs[2], u.in.mIdx(), ev.h(u.out)-hIn-v*dp/eta)
		for _, t := range u.heat {
			_, _, d, err := t.transferred(ev, true)
			if err != nil {
				return wrapErr(u, err)
			}
			for _, pd := range d {
				j.add(u.eqs[2], pd.col, -pd.de)
			}
		}
	}
	j.add(u.eqs[2], u.out.hIdx(), k)
	j.add(u.eqs[2], u.in.hIdx(), k*(-1-dvdh*dp/eta))
	j.add(u.eqs[2], u.in.pIdx(), k*(v-dvdp*dp)/eta)
	j.add(u.eqs[2], u.out.pIdx(), -k*v/eta)
	return nil
}

func (u *FeedPump) guess(x []float64) {
	x[u.out.pIdx()] = u.discharge
	x[u.out.hIdx()] = x[u.in.hIdx()]
	x[u.in.mIdx()] = x[u.out.mIdx()]
}

func (u *FeedPump) report(ev *eval, cr *CaseResult) error {
	m := ev.m(u.in)
	_, q, err := sumTransfers(ev, u.heat)
	if err != nil {
		return wrapErr(u, err)
	}
	// The drain coolers' heat raises the feed's enthalpy too; the pump's
	// work is the rest (v·Δp/η per kg, but for the flow floor's share).
	shaft := m*(ev.h(u.out)-ev.h(u.in)) - q
	el := shaft / u.motorEta()
	fig := append(make(Figures, 0, 5),
		Figure{"head_Pa", ev.p(u.out) - ev.p(u.in)},
		Figure{"shaft_W", shaft},
		Figure{"electric_W", el},
		Figure{"discharge_Pa", ev.p(u.out)},
	)
	if len(u.heat) > 0 {
		fig = append(fig, Figure{"drain_cooler_heat_W", q})
		u.checkHotEnd(ev, cr, q)
	}
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind(), Figures: fig})
	cr.ElectricW += el
	cr.boundary.workIn += shaft
	return nil
}

func (u *FeedPump) outline(cr *CaseResult) {
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind()})
}

func (u *FeedPump) clone() Component {
	c := *u
	c.Boilers = append([]string(nil), u.Boilers...)
	c.in, c.out = nil, nil
	c.heat = nil
	return &c
}

// inletT is the temperature of the feed the pump takes.
func (u *FeedPump) inletT(ev *eval) (float64, error) {
	return u.mt.get2(ev.p(u.in), ev.h(u.in), tPH)
}

// checkHotEnd warns when the drain coolers would heat the feed above the
// hottest condensate they take: no exchanger does that (the second law).
func (u *FeedPump) checkHotEnd(ev *eval, cr *CaseResult, q float64) {
	if q <= 0 {
		return
	}
	tOut, err := tPH(ev.p(u.out), ev.h(u.out))
	if err != nil {
		return
	}
	hottest := 0.0
	for _, t := range u.heat {
		if c, ok := t.(*Consumer); ok {
			if th, ok := c.coolerInletT(ev); ok {
				hottest = math.Max(hottest, th)
			}
		}
	}
	if hottest > 0 && tOut > hottest {
		cr.warn("%s %q: the drain coolers' %.1f kW would heat the feed to %.1f °C, above the hottest condensate they take (%.1f °C), which no exchanger does: send some of it to the hotwell or overboard (drain_cooler)",
			u.Kind(), u.Name, q/1e3, tOut-273.15, hottest-273.15)
	}
}
