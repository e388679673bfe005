package plant

import (
	"math"

	"steamcase/plant/units"
)

// Header is a steam header (or any junction): it mixes its inlets
// adiabatically and distributes the mix to its outlets at the pressure of
// its first inlet. A heat loss from the header and its piping condenses
// steam, which the traps drain: by default to the hotwell (the plant's
// first feed tank, traps to the cascade tank), saturated at the header's
// pressure, or lost from the plant where Drains says so.
type Header struct {
	Base
	HeatLoss float64 // W
	// Drains says where the traps drain the condensed steam.
	Drains DrainDestination

	ins, outs []*Line
	drainTo   *FeedTank // the feed tank the drains go to, or nil: lost
	drainNote string    // why drains meant for the hotwell are lost
	drain     int
	eqMass    int
	eqDrain   int
	eqP, eqH  []int
	mf        memo
}

// DrainDestination is where a header's traps drain.
type DrainDestination int

// The destinations of a header's drains.
const (
	// DrainsToHotwell returns them to the plant's first feed tank.
	DrainsToHotwell DrainDestination = iota
	// DrainsLost loses them (to the bilge, or to a drain tank not
	// returned).
	DrainsLost
)

// NewHeader returns a header without heat loss.
func NewHeader() *Header { return &Header{} }

var headerKeys = []Key{
	num(Key{Name: "heat_loss", Label: "heat loss", Dim: units.Power, Example: "20 kW",
		Doc:     "heat lost by the header and its piping; it condenses steam that the traps drain",
		Default: 0, HasDefault: true, Min: 0, Max: 2e6, Case: true, Source: SourceLeftOut},
		self[*Header], func(u *Header) *float64 { return &u.HeatLoss }),
	choice(Key{Name: "drains", Label: "drains", Choices: []string{"hotwell", "lost"}, Example: `"lost"`,
		Doc:     `where the traps drain the steam the heat loss condenses: "hotwell" (the plant's feed tank, traps to the cascade tank) or "lost"`,
		Default: 0, HasDefault: true, Source: "common practice, no source"},
		self[*Header], func(u *Header) *DrainDestination { return &u.Drains }),
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

// prepare refuses a heat loss that a case gives a header declared without
// one: its drained condensate has no unknown in the compiled plant.
func (u *Header) prepare(_ *Plant, _ Conditions) error {
	if u.HeatLoss > 0 && u.drain < 0 {
		return compErr(u, "a case gives it a heat loss of %.1f kW, but it was declared without one, so its drains are not laid out: give the header a heat loss in the plant (a case may then change it)", u.HeatLoss/1e3)
	}
	return nil
}

// link sends the drains to the hotwell: the plant's first feed tank. A
// plant without one loses them, and every case with drains says so.
func (u *Header) link(p *Plant, a *assembly, _ *faults) {
	u.drainTo, u.drainNote = nil, ""
	if u.drain < 0 || u.Drains == DrainsLost {
		return
	}
	if t := p.firstFeedTank(); t != nil {
		u.drainTo = t
		t.receive(a, u)
		return
	}
	u.drainNote = "its drains are lost: the plant has no feed tank to return them to"
}

// transferred is the drained condensate the hotwell takes: ṁ_d saturated
// at the header's pressure (a transfer, transfer.go).
func (u *Header) transferred(ev *eval, partials bool) (m, e float64, d [3]partial, err error) {
	d = [3]partial{{col: -1}, {col: -1}, {col: -1}}
	p0 := ev.p(u.ins[0])
	hf, err := u.mf.get1(p0, hLiquidSat)
	if err != nil {
		return 0, 0, d, wrapErr(u, err)
	}
	md := ev.x[u.drain]
	if !partials {
		return md, md * hf, d, nil
	}
	dhf, err := dProp1(hLiquidSat, p0, hf)
	if err != nil {
		return 0, 0, d, wrapErr(u, err)
	}
	d[0] = partial{col: u.drain, dm: 1, de: hf}
	d[1] = partial{col: u.ins[0].pIdx(), de: md * dhf}
	return md, md * hf, d, nil
}

func (u *Header) transferDeps() []int { return []int{u.drain, u.ins[0].pIdx()} }

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
	returned := 0.0
	if u.drain >= 0 {
		md = ev.x[u.drain]
		cr.boundary.heatOut += u.HeatLoss
		if u.drainTo != nil {
			returned = md
			cr.DrainsReturnedKgS += md
		} else {
			hf, _ := u.mf.get1(p0, hLiquidSat)
			cr.boundary.massOut += md
			cr.boundary.energyOut += md * hf
			cr.CondensateLostKgS += md
			if u.drainNote != "" && md > FlowFloor {
				cr.warn("%s %q: %s", u.Kind(), u.Name, u.drainNote)
			}
		}
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
		{"drains_returned_kg_s", returned},
	}})
	return nil
}

func (u *Header) outline(cr *CaseResult) {
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind()})
}

func (u *Header) clone() Component {
	c := *u
	c.ins, c.outs, c.eqP, c.eqH = nil, nil, nil, nil
	c.drainTo = nil
	return &c
}
