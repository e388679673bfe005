package plant

import (
	"math"

	"steamcase/plant/units"
)

// Condenser condenses its inlet steam to water SubCooling kelvin below
// saturation at its inlet pressure, rejecting the heat to sea water. A dump
// condenser takes the steam an exhaust-gas economiser makes beyond demand:
// its inlet flow is set by the plant's dispatch, not by its own equation.
// The condensate pump after a vacuum condenser is not modelled (its work is
// small against the heat flows).
//
// A turbine's condenser may set the turbine's vacuum from the sea (the
// turbine then takes no exhaust pressure): the steam condenses at the
// saturation temperature T_sea + Approach, or, with the condenser's UA and
// its sea-water flow, at T_sea + Q/(ε·ṁ_sw·c_p), ε = 1 − exp(−UA/(ṁ_sw·c_p))
// (ε-NTU with the condensing side at one temperature; sea water at a
// constant specific heat SeaCp, the simplification named, and UA
// constant with load).
type Condenser struct {
	Base
	// SubCooling is the condensate's subcooling below saturation, K; zero
	// means saturated.
	SubCooling float64
	Dump       bool
	// Approach is the condensing temperature above the case's sea
	// temperature, K; UA (W/K) with SeaFlow (kg/s) instead rates the
	// condenser; SeaCp is the sea water's specific heat, J/(kg·K), zero
	// meaning defaultSeaCp. All zero: the vacuum is the turbine's.
	Approach, UA, SeaFlow, SeaCp float64

	in, out *Line
	eqs     [4]int
	mc      memo
	pSet    float64 // the case's vacuum by the approach, Pa
	seaT    float64 // the case's sea temperature, K
}

// defaultSeaCp is sea water's specific heat, 3.99 kJ/(kg·K) near 20 °C and
// 35 g/kg salinity (from memory; common practice, no source).
const defaultSeaCp = 3990

// NewCondenser returns a condenser of saturated condensate.
func NewCondenser() *Condenser { return &Condenser{} }

// NewDumpCondenser returns a dump condenser.
func NewDumpCondenser() *Condenser { return &Condenser{Dump: true} }

func condenserKey(k Key, f func(*Condenser) *float64) Key { return num(k, self[*Condenser], f) }

var condenserKeys = []Key{
	condenserKey(Key{Name: "subcool", Label: "condensate subcooling", Dim: units.TemperatureDifference, Example: "5 K",
		Doc: "condensate leaves this far below saturation", Default: 0, HasDefault: true, Min: 0, Max: 250, Case: true, Source: SourceLeftOut},
		func(u *Condenser) *float64 { return &u.SubCooling }),
	flag(Key{Name: "dump", Label: "dump", Example: "true",
		Doc: "a dump condenser: it takes the steam the exhaust-gas economisers raise beyond demand", Default: 0, HasDefault: true, Source: SourceRule},
		self[*Condenser], func(u *Condenser) *bool { return &u.Dump }),
	condenserKey(Key{Name: "approach", Label: "approach to the sea", Dim: units.TemperatureDifference, Example: "12 K",
		Doc: "a turbine's condenser: the steam condenses this far above the case's sea temperature, which sets the vacuum", DefaultNote: "the turbine's exhaust pressure",
		Min: 0.5, Max: 60, Case: true, Source: SourceDerived},
		func(u *Condenser) *float64 { return &u.Approach }),
	condenserKey(Key{Name: "ua", Label: "condenser UA", Dim: units.ThermalConductance, Example: "250 kW/K",
		Doc: "a turbine's condenser rated by its UA and sea_flow: the vacuum follows the sea and the steam (instead of approach)", DefaultNote: "not rated",
		Min: 1, Max: 1e9, Source: SourceLeftOut},
		func(u *Condenser) *float64 { return &u.UA }),
	condenserKey(Key{Name: "sea_flow", Label: "sea-water flow", Dim: units.MassFlow, Example: "400 t/h",
		Doc: "sea water through the condenser (with ua)", Min: 1e-3, Max: 1e5, Case: true},
		func(u *Condenser) *float64 { return &u.SeaFlow }),
	condenserKey(Key{Name: "sea_cp", Label: "sea-water specific heat", Dim: units.SpecificHeat, Example: "3.99 kJ/kgK",
		Doc: "a constant specific heat of the sea water (with ua)", Default: defaultSeaCp, HasDefault: true,
		Source: "common practice, no source", Min: 3000, Max: 4300},
		func(u *Condenser) *float64 { return &u.SeaCp }),
}

// seaCooled reports whether the condenser sets its inlet's vacuum from the
// sea.
func (u *Condenser) seaCooled() bool { return u.Approach > 0 || u.UA > 0 }

func (u *Condenser) seaCp() float64 {
	if u.SeaCp > 0 {
		return u.SeaCp
	}
	return defaultSeaCp
}

// effectiveness is ε·ṁ_sw·c_p of a rated condenser, W/K.
func (u *Condenser) effectiveness() float64 {
	c := u.SeaFlow * u.seaCp()
	return c * (1 - math.Exp(-u.UA/c))
}

// Keys lists the condenser's keys.
func (u *Condenser) Keys() []Key { return condenserKeys }

// Kind returns "condenser" or "dump condenser".
func (u *Condenser) Kind() string {
	if u.Dump {
		return "dump condenser"
	}
	return "condenser"
}

// Ports: steam in, condensate out.
func (u *Condenser) Ports() []PortSpec {
	return []PortSpec{{Name: "in", Dir: In, Medium: WaterSteam}, {Name: "out", Dir: Out, Medium: WaterSteam}}
}

func (u *Condenser) subcooling() float64 { return u.SubCooling }

func (u *Condenser) check(fs *faults) {
	checkRange(fs, u, "condensate subcooling", u.SubCooling, 0, 250, "K")
	for _, k := range [...]string{"approach", "ua", "sea_cp"} {
		checkKey(fs, u, k)
	}
	if u.SeaFlow != 0 {
		checkKey(fs, u, "sea_flow")
	}
	switch {
	case u.Approach > 0 && u.UA > 0:
		fs.add(u.Pos, u.Name, "", "give approach or ua with sea_flow, not both")
	case u.UA > 0 && !(u.SeaFlow > 0):
		fs.add(u.Pos, u.Name, "", "a condenser rated by its ua needs its sea_flow, such as sea_flow = \"400 t/h\"")
	case u.SeaFlow > 0 && u.UA == 0:
		fs.add(u.Pos, u.Name, "", "sea_flow goes with ua")
	}
	if u.Dump && u.seaCooled() {
		fs.add(u.Pos, u.Name, "", "a dump condenser takes the header's steam at the header's pressure; its vacuum cannot follow the sea")
	}
}

// link checks that a sea-cooled condenser takes the exhaust of a turbine
// that leaves its vacuum to it.
func (u *Condenser) link(p *Plant, _ *assembly, fs *faults) {
	if !u.seaCooled() {
		return
	}
	if t, ok := p.byName[u.in.From].(*Turbine); !ok || t.ExhaustP > 0 {
		fs.add(u.Pos, u.Name, u.in.Name, "sets its vacuum from the sea, so it must take the exhaust of a turbine without an exhaust pressure")
	}
}

// prepare fixes the case's sea temperature and, by the approach, the
// vacuum.
func (u *Condenser) prepare(_ *Plant, c Conditions) error {
	u.seaT, u.pSet = c.SeaT, 0
	if !u.seaCooled() {
		return nil
	}
	if c.SeaT <= 0 {
		return compErr(u, "sets its vacuum from the sea: give the case's sea temperature, sea = \"12 C\"")
	}
	if u.Approach > 0 {
		p, err := u.psat(c.SeaT + u.Approach)
		if err != nil {
			return compErr(u, "condensing at sea %.1f °C + approach %.1f K: %v", c.SeaT-273.15, u.Approach, err)
		}
		u.pSet = p
	}
	return nil
}

func (u *Condenser) psat(t float64) (float64, error) { return waterPsat(t) }

// condensingT is the condensing temperature of a rated condenser at the
// present unknowns, and its derivative by the heat rejected.
func (u *Condenser) condensingT(ev *eval) (t, dtdq float64) {
	q := ev.m(u.in) * (ev.h(u.in) - ev.h(u.out))
	k := u.effectiveness()
	return u.seaT + q/k, 1 / k
}

func (u *Condenser) assemble(a *assembly, ports portLines) {
	u.in, u.out = ports.one("in"), ports.one("out")
	if u.Dump {
		// The dispatch first tries a case with no boiler firing, in which
		// the dump condenser takes what the steam system has over. Letting
		// that flow go negative in the trial makes a shortfall a solved
		// answer (fire a boiler) rather than a failed solve; the dispatch
		// never accepts a negative dump flow.
		a.lo[u.in.mIdx()] = math.Inf(-1)
		a.lo[u.out.mIdx()] = math.Inf(-1)
		a.roles.dumps = append(a.roles.dumps, u)
	}
	u.eqs[0] = a.equation(u.Name+": mass balance", 1, u.in.mIdx(), u.out.mIdx())
	u.eqs[1] = a.equation(u.Name+": condensate pressure", scaleP, u.in.pIdx(), u.out.pIdx())
	u.eqs[2] = a.equation(u.Name+": condensate temperature", scaleH, u.in.pIdx(), u.out.hIdx())
	u.eqs[3] = -1
	if u.seaCooled() {
		u.eqs[3] = a.equation(u.Name+": vacuum from the sea", scaleP, u.in.pIdx(), u.in.mIdx(), u.in.hIdx(), u.out.hIdx())
	}
}

func (u *Condenser) residual(ev *eval, r []float64) error {
	hc, err := u.mc.get2(ev.p(u.in), u.subcooling(), hCondensate)
	if err != nil {
		return wrapErr(u, err)
	}
	r[u.eqs[0]] = ev.m(u.out) - ev.m(u.in)
	r[u.eqs[1]] = ev.p(u.out) - ev.p(u.in)
	r[u.eqs[2]] = ev.h(u.out) - hc
	switch {
	case u.Approach > 0:
		r[u.eqs[3]] = ev.p(u.in) - u.pSet
	case u.UA > 0:
		t, _ := u.condensingT(ev)
		p, err := u.psat(t)
		if err != nil {
			return wrapErr(u, err)
		}
		r[u.eqs[3]] = ev.p(u.in) - p
	}
	return nil
}

func (u *Condenser) jacobian(ev *eval, j jac) error {
	p := ev.p(u.in)
	sub := u.subcooling()
	// A central difference with a cube-root step: at a vacuum the
	// subcooled condensate's h(p) is steep, and a forward difference's
	// rounding (about 3e-7 relative) shows in the Jacobian check.
	dhc, err := dPropCentralA(hCondensate, p, sub)
	if err != nil {
		return wrapErr(u, err)
	}
	j.add(u.eqs[0], u.out.mIdx(), 1)
	j.add(u.eqs[0], u.in.mIdx(), -1)
	j.add(u.eqs[1], u.out.pIdx(), 1)
	j.add(u.eqs[1], u.in.pIdx(), -1)
	j.add(u.eqs[2], u.out.hIdx(), 1)
	j.add(u.eqs[2], u.in.pIdx(), -dhc)
	switch {
	case u.Approach > 0:
		j.add(u.eqs[3], u.in.pIdx(), 1)
	case u.UA > 0:
		t, dtdq := u.condensingT(ev)
		p0, err := u.psat(t)
		if err != nil {
			return wrapErr(u, err)
		}
		dp, err := dProp1(u.psat, t, p0)
		if err != nil {
			return wrapErr(u, err)
		}
		k := -dp * dtdq
		m, dh := ev.m(u.in), ev.h(u.in)-ev.h(u.out)
		j.add(u.eqs[3], u.in.pIdx(), 1)
		j.add(u.eqs[3], u.in.mIdx(), k*dh)
		j.add(u.eqs[3], u.in.hIdx(), k*m)
		j.add(u.eqs[3], u.out.hIdx(), -k*m)
	}
	return nil
}

func (u *Condenser) guess(x []float64) {
	if u.pSet > 0 {
		x[u.in.pIdx()] = u.pSet
	}
	p := x[u.in.pIdx()]
	x[u.out.pIdx()] = p
	if h, err := hCondensate(p, u.subcooling()); err == nil {
		x[u.out.hIdx()] = h
	}
	if u.Dump {
		x[u.in.mIdx()] = 0
	}
	x[u.out.mIdx()] = x[u.in.mIdx()]
}

func (u *Condenser) report(ev *eval, cr *CaseResult) error {
	m := ev.m(u.in)
	duty := m * (ev.h(u.in) - ev.h(u.out))
	fig := Figures{
		{"duty_W", duty},
		{"steam_kg_s", m},
	}
	if u.seaCooled() {
		p := ev.p(u.in)
		ts, err := waterTsat(p)
		if err != nil {
			return wrapErr(u, err)
		}
		fig = append(fig, Figure{"p_Pa", p}, Figure{"sat_T_K", ts}, Figure{"sea_T_K", u.seaT})
		if u.UA > 0 {
			fig = append(fig, Figure{"sea_out_T_K", u.seaT + duty/(u.SeaFlow*u.seaCp())})
		}
	}
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind(), Figures: fig})
	cr.boundary.heatOut += duty
	if u.Dump {
		cr.DumpedKgS += m
	}
	return nil
}

func (u *Condenser) outline(cr *CaseResult) {
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind()})
}

func (u *Condenser) clone() Component { c := *u; c.in, c.out = nil, nil; return &c }
