package plant

import "steamcase/plant/units"

// ReducingValve is a pressure-reducing valve: isenthalpic throttling to a
// set downstream pressure.
type ReducingValve struct {
	Base
	P float64 // set downstream pressure, Pa absolute

	in, out *Line
	eqs     [3]int
}

// NewReducingValve returns a reducing valve; its set pressure is required.
func NewReducingValve() *ReducingValve { return &ReducingValve{} }

var valveKeys = []Key{
	num(Key{Name: "p", Label: "set pressure", Dim: units.Pressure, Example: "7 bar(g)",
		Doc: "set downstream pressure", Required: true, Min: 1e3, Max: 5e7, Case: true},
		self[*ReducingValve], func(u *ReducingValve) *float64 { return &u.P }),
}

// Keys lists the valve's keys.
func (u *ReducingValve) Keys() []Key { return valveKeys }

// Kind returns "pressure-reducing valve".
func (u *ReducingValve) Kind() string { return "pressure-reducing valve" }

// Ports: one inlet, one outlet.
func (u *ReducingValve) Ports() []PortSpec {
	return []PortSpec{{Name: "in", Dir: In, Medium: WaterSteam}, {Name: "out", Dir: Out, Medium: WaterSteam}}
}

func (u *ReducingValve) check(fs *faults) { checkKey(fs, u, "p") }

func (u *ReducingValve) assemble(a *assembly, ports portLines) {
	u.in, u.out = ports.one("in"), ports.one("out")
	u.eqs[0] = a.equation(u.Name+": mass balance", 1, u.in.mIdx(), u.out.mIdx())
	u.eqs[1] = a.equation(u.Name+": set pressure", scaleP, u.out.pIdx())
	u.eqs[2] = a.equation(u.Name+": throttling at constant enthalpy", scaleH, u.in.hIdx(), u.out.hIdx())
}

func (u *ReducingValve) residual(ev *eval, r []float64) error {
	r[u.eqs[0]] = ev.m(u.out) - ev.m(u.in)
	r[u.eqs[1]] = ev.p(u.out) - u.P
	r[u.eqs[2]] = ev.h(u.out) - ev.h(u.in)
	return nil
}

func (u *ReducingValve) jacobian(ev *eval, j jac) error {
	j.add(u.eqs[0], u.out.mIdx(), 1)
	j.add(u.eqs[0], u.in.mIdx(), -1)
	j.add(u.eqs[1], u.out.pIdx(), 1)
	j.add(u.eqs[2], u.out.hIdx(), 1)
	j.add(u.eqs[2], u.in.hIdx(), -1)
	return nil
}

func (u *ReducingValve) guess(x []float64) {
	x[u.out.pIdx()] = u.P
	x[u.out.hIdx()] = x[u.in.hIdx()]
	x[u.in.mIdx()] = x[u.out.mIdx()]
}

func (u *ReducingValve) report(ev *eval, cr *CaseResult) error {
	if ev.p(u.in) < u.P {
		cr.warn("%s %q: inlet pressure %.2f bar(a) is below its set pressure %.2f bar(a); a reducing valve cannot raise pressure",
			u.Kind(), u.Name, ev.p(u.in)/1e5, u.P/1e5)
	}
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind(), Figures: Figures{
		{"flow_kg_s", ev.m(u.in)},
		{"p_in_Pa", ev.p(u.in)},
		{"p_out_Pa", ev.p(u.out)},
	}})
	return nil
}

func (u *ReducingValve) outline(cr *CaseResult) {
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind()})
}

func (u *ReducingValve) clone() Component { c := *u; c.in, c.out = nil, nil; return &c }
