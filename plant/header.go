package plant

import (
	"math"

	"steamcase/plant/units"
)

// Header is a steam header (or any junction): it mixes its inlets
// adiabatically and distributes the mix to its outlets at the pressure of
// its first inlet. A heat loss from the header and its piping condenses
// steam, which the traps drain and which is lost from the plant.
type Header struct {
	Base
	HeatLoss float64 // W

	ins, outs []*Line
	drain     int
	eqMass    int
	eqDrain   int
	eqP, eqH  []int
	mf        memo
}

// NewHeader returns a header without heat loss.
func NewHeader() *Header { return &Header{} }

var headerKeys = []Key{
	num(Key{Name: "heat_loss", Label: "heat loss", Dim: units.Power, Example: "20 kW",
		Doc:     "heat lost by the header and its piping; it condenses steam that the traps drain",
		Default: 0, HasDefault: true, Min: 0, Max: 2e6, Case: true},
		self[*Header], func(u *Header) *float64 { return &u.HeatLoss }),
}

// Keys lists the header's keys.
func (u *Header) Keys() []Key { return headerKeys }

// Kind returns "steam header".
func (u *Header) Kind() string { return "steam header" }

// Ports: any number of inlets and outlets.
func (u *Header) Ports() []PortSpec {
	return []PortSpec{
		{Name: "in", Dir: In, Medium: WaterSteam, Multi: true},
		{Name: "out", Dir: Out, Medium: WaterSteam, Multi: true, Optional: true},
	}
}

func (u *Header) check(fs *faults) {
	checkKey(fs, u, "heat_loss")
}

func (u *Header) assemble(a *assembly, ports portLines) {
	u.ins, u.outs = ports["in"], ports["out"]
	u.drain = -1
	if u.HeatLoss > 0 {
		u.drain = a.variable(u.Name+": drained condensate", 1, 0, math.Inf(1), 0.01)
	}
	var mdeps []int
	for _, l := range u.ins {
		mdeps = append(mdeps, l.mIdx())
	}
	for _, l := range u.outs {
		mdeps = append(mdeps, l.mIdx())
	}
	u.eqMass = a.equation(u.Name+": mass balance", 1, append(mdeps, u.drain)...)
	u.eqP = u.eqP[:0]
	u.eqH = u.eqH[:0]
	inDeps := lineDeps(u.ins...)
	for _, l := range u.outs {
		u.eqP = append(u.eqP, a.equation(u.Name+": pressure of "+l.Name, scaleP, l.pIdx(), u.ins[0].pIdx()))
		u.eqH = append(u.eqH, a.equation(u.Name+": mixing into "+l.Name, scaleH, append(inDeps, l.hIdx())...))
	}
	u.eqDrain = -1
	if u.drain >= 0 {
		deps := append(lineDeps(u.ins...), u.drain)
		u.eqDrain = a.equation(u.Name+": heat loss condenses steam", scaleQ, deps...)
	}
}

func (u *Header) mix(ev *eval) (m, h float64) {
	var e float64
	for _, l := range u.ins {
		m += ev.m(l)
		e += ev.m(l) * ev.h(l)
	}
	return m, (e + epsFlow*ev.h(u.ins[0])) / (m + epsFlow)
}

func (u *Header) residual(ev *eval, r []float64) error {
	mIn, hMix := u.mix(ev)
	var mOut float64
	for _, l := range u.outs {
		mOut += ev.m(l)
	}
	md := 0.0
	if u.drain >= 0 {
		md = ev.x[u.drain]
	}
	r[u.eqMass] = mIn - mOut - md
	p0 := ev.p(u.ins[0])
	for k, l := range u.outs {
		r[u.eqP[k]] = ev.p(l) - p0
		r[u.eqH[k]] = ev.h(l) - hMix
	}
	if u.drain >= 0 {
		hf, err := u.mf.get1(p0, hLiquidSat)
		if err != nil {
			return wrapErr(u, err)
		}
		r[u.eqDrain] = md*(hMix-hf) - u.HeatLoss
	}
	return nil
}

func (u *Header) jacobian(ev *eval, j jac) error {
	mIn, hMix := u.mix(ev)
	den := mIn + epsFlow
	ref := u.ins[0]
	// addMix adds c·∂hMix/∂x to row.
	addMix := func(row int, c float64) {
		for _, l := range u.ins {
			j.add(row, l.mIdx(), c*(ev.h(l)-hMix)/den)
			j.add(row, l.hIdx(), c*ev.m(l)/den)
		}
		j.add(row, ref.hIdx(), c*epsFlow/den)
	}
	for _, l := range u.ins {
		j.add(u.eqMass, l.mIdx(), 1)
	}
	for _, l := range u.outs {
		j.add(u.eqMass, l.mIdx(), -1)
	}
	j.add(u.eqMass, u.drain, -1)
	for k, l := range u.outs {
		j.add(u.eqP[k], l.pIdx(), 1)
		j.add(u.eqP[k], ref.pIdx(), -1)
		j.add(u.eqH[k], l.hIdx(), 1)
		addMix(u.eqH[k], -1)
	}
	if u.drain >= 0 {
		p0 := ev.p(ref)
		hf, err := u.mf.get1(p0, hLiquidSat)
		if err != nil {
			return wrapErr(u, err)
		}
		dhf, err := dProp1(hLiquidSat, p0, hf)
		if err != nil {
			return wrapErr(u, err)
		}
		md := ev.x[u.drain]
		j.add(u.eqDrain, u.drain, hMix-hf)
		addMix(u.eqDrain, md)
		j.add(u.eqDrain, ref.pIdx(), -md*dhf)
	}
	return nil
}

func (u *Header) guess(x []float64) {
	for _, l := range u.outs {
		x[l.pIdx()] = x[u.ins[0].pIdx()]
		x[l.hIdx()] = x[u.ins[0].hIdx()]
	}
}

func (u *Header) report(ev *eval, cr *CaseResult) error {
	mIn, hMix := u.mix(ev)
	p0 := ev.p(u.ins[0])
	md := 0.0
	if u.drain >= 0 {
		md = ev.x[u.drain]
		hf, _ := u.mf.get1(p0, hLiquidSat)
		cr.boundary.massOut += md
		cr.boundary.energyOut += md * hf
		cr.boundary.heatOut += u.HeatLoss
		cr.CondensateLostKgS += md
	}
	for _, l := range u.ins[1:] {
		if math.Abs(ev.p(l)-p0) > 0.01*p0 {
			cr.warn("%s %q: inlet %q at %.2f bar(a) differs from inlet %q at %.2f bar(a); the header takes the first",
				u.Kind(), u.Name, l.Name, ev.p(l)/1e5, u.ins[0].Name, p0/1e5)
		}
	}
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind(), Figures: Figures{
		{"p_Pa", p0},
		{"flow_kg_s", mIn},
		{"h_J_per_kg", hMix},
		{"heat_loss_W", u.HeatLoss},
		{"drained_kg_s", md},
	}})
	return nil
}

func (u *Header) outline(cr *CaseResult) {
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind()})
}

func (u *Header) clone() Component {
	c := *u
	c.ins, c.outs, c.eqP, c.eqH = nil, nil, nil, nil
	return &c
}
