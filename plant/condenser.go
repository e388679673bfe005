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
type Condenser struct {
	Base
	// SubCooling is the condensate's subcooling below saturation, K; zero
	// means saturated.
	SubCooling float64
	Dump       bool

	in, out *Line
	eqs     [3]int
	mc      memo
}

// NewCondenser returns a condenser of saturated condensate.
func NewCondenser() *Condenser { return &Condenser{} }

// NewDumpCondenser returns a dump condenser.
func NewDumpCondenser() *Condenser { return &Condenser{Dump: true} }

var condenserKeys = []Key{
	num(Key{Name: "subcool", Label: "condensate subcooling", Dim: units.TemperatureDifference, Example: "5 K",
		Doc: "condensate leaves this far below saturation", Default: 0, HasDefault: true, Min: 0, Max: 250, Case: true},
		self[*Condenser], func(u *Condenser) *float64 { return &u.SubCooling }),
	flag(Key{Name: "dump", Label: "dump", Example: "true",
		Doc: "a dump condenser: it takes the steam the exhaust-gas economisers raise beyond demand", Default: 0, HasDefault: true},
		self[*Condenser], func(u *Condenser) *bool { return &u.Dump }),
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
}

func (u *Condenser) residual(ev *eval, r []float64) error {
	hc, err := u.mc.get2(ev.p(u.in), u.subcooling(), hCondensate)
	if err != nil {
		return wrapErr(u, err)
	}
	r[u.eqs[0]] = ev.m(u.out) - ev.m(u.in)
	r[u.eqs[1]] = ev.p(u.out) - ev.p(u.in)
	r[u.eqs[2]] = ev.h(u.out) - hc
	return nil
}

func (u *Condenser) jacobian(ev *eval, j jac) error {
	p := ev.p(u.in)
	sub := u.subcooling()
	hc, err := u.mc.get2(p, sub, hCondensate)
	if err != nil {
		return wrapErr(u, err)
	}
	dhc, err := dPropA(hCondensate, p, sub, hc)
	if err != nil {
		return wrapErr(u, err)
	}
	j.add(u.eqs[0], u.out.mIdx(), 1)
	j.add(u.eqs[0], u.in.mIdx(), -1)
	j.add(u.eqs[1], u.out.pIdx(), 1)
	j.add(u.eqs[1], u.in.pIdx(), -1)
	j.add(u.eqs[2], u.out.hIdx(), 1)
	j.add(u.eqs[2], u.in.pIdx(), -dhc)
	return nil
}

func (u *Condenser) guess(x []float64) {
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
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind(), Figures: Figures{
		{"duty_W", duty},
		{"steam_kg_s", m},
	}})
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
