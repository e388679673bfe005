package plant

import (
	"fmt"
	"math"

	"steamcase/plant/water"
)

// Conditions are the surroundings of a load case.
type Conditions struct {
	SeaT       float64 // sea water temperature, K
	AirT       float64 // outside air temperature, K
	EngineLoad float64 // main engine load, fraction of its MCR
}

func paramErr(u Unit, name string, known ...string) error {
	return unitErr(u, "has no parameter %q; its parameters are %q", name, known)
}

func checkRange(fs *faults, u Unit, what string, v, lo, hi float64, unit string) {
	if !finite(v) || v < lo || v > hi {
		fs.add(u.Position(), u.UnitName(), "", "%s must lie between %g and %g %s; got %g", what, lo, hi, unit, v)
	}
}

func one(ls []*Line) *Line {
	if len(ls) == 0 {
		return nil
	}
	return ls[0]
}

// ---------------------------------------------------------------------------

// MakeUp supplies fresh water to the feed tank at a set temperature: the
// water that the plant loses (returns not recovered, blowdown, vented flash
// steam) comes back here. Its flow follows from the feed tank's balance.
type MakeUp struct {
	UnitBase
	T float64 // water temperature, K
	P float64 // supply pressure, Pa; zero: the plant's ambient pressure

	out *Line
	eqs [2]int
	mh  memo
}

// Kind returns "make-up water".
func (u *MakeUp) Kind() string { return "make-up water" }

// Ports: one outlet.
func (u *MakeUp) Ports() []PortSpec {
	return []PortSpec{{Name: "out", Dir: Out, Medium: WaterSteam}}
}

func (u *MakeUp) check(fs *faults) {
	checkRange(fs, u, "make-up temperature", u.T, 273.16, 373.15, "K")
	if u.P < 0 || !finite(u.P) {
		fs.add(u.Pos, u.Name, "", "supply pressure must be positive; got %g Pa", u.P)
	}
}

func (u *MakeUp) assemble(a *assembly, ports map[string][]*Line) {
	u.out = one(ports["out"])
	u.eqs[0] = a.equation(u.Name+": supply pressure", scaleP, u.out.pIdx())
	u.eqs[1] = a.equation(u.Name+": supply temperature", scaleH, u.out.pIdx(), u.out.hIdx())
}

func (u *MakeUp) pressure(ev *eval) float64 {
	if u.P > 0 {
		return u.P
	}
	return ev.pl.Opt.AmbientPressure
}

func (u *MakeUp) residual(ev *eval, r []float64) error {
	p := ev.p(u.out)
	h, err := u.mh.get2(p, u.T, hPT)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	r[u.eqs[0]] = p - u.pressure(ev)
	r[u.eqs[1]] = ev.h(u.out) - h
	return nil
}

func (u *MakeUp) guess(x []float64) {
	x[u.out.pIdx()] = 101325
	if u.P > 0 {
		x[u.out.pIdx()] = u.P
	}
	if h, err := hPT(x[u.out.pIdx()], u.T); err == nil {
		x[u.out.hIdx()] = h
	}
}

func (u *MakeUp) report(ev *eval, cr *CaseResult) error {
	m := ev.m(u.out)
	cr.MakeUpKgS += m
	cr.boundary.massIn += m
	cr.boundary.energyIn += m * ev.h(u.out)
	return nil
}

func (u *MakeUp) param(name string) (*float64, error) {
	switch name {
	case "T":
		return &u.T, nil
	}
	return nil, paramErr(u, name, "T")
}

// ---------------------------------------------------------------------------

// FeedTank is the hotwell or cascade tank: it mixes the condensate returns
// and the make-up, loses heat to the engine room, may be heated by steam to
// a set temperature (common practice, to drive out oxygen), and vents the
// flash steam if the mix would boil at the tank pressure. The vented steam
// is a loss the make-up replaces.
type FeedTank struct {
	UnitBase
	// P is the tank pressure, Pa absolute; zero means the plant's ambient
	// pressure (a vented tank).
	P float64
	// HeatLoss is a fixed heat loss to the engine room, W.
	HeatLoss float64
	// UA and RoomT give a heat loss UA·(T − RoomT) in addition, W/K and K.
	UA, RoomT float64
	// SetT is the temperature that steam heating holds, K; used when the
	// "steam" inlet is connected.
	SetT float64
	// Observation makes the tank an observation (inspection) tank: the
	// vented tank that returning condensate passes so that oil from a
	// leaking heating coil can be seen before it reaches the feed water.
	// Its model is the feed tank's (mixing, heat loss, flash steam
	// vented); it is reported as such and its temperature is not the
	// feed's.
	Observation bool

	ins        []*Line
	out, steam *Line
	vent       int
	eqs        [5]int
	mt, mf, mg memo
	mset       memo
}

// Kind returns "feed tank" or "observation tank".
func (u *FeedTank) Kind() string {
	if u.Observation {
		return "observation tank"
	}
	return "feed tank"
}

// Ports: returns and make-up in, feed out, optional heating steam in.
func (u *FeedTank) Ports() []PortSpec {
	return []PortSpec{
		{Name: "in", Dir: In, Medium: WaterSteam, Multi: true},
		{Name: "out", Dir: Out, Medium: WaterSteam},
		{Name: "steam", Dir: In, Medium: WaterSteam, Optional: true},
	}
}

func (u *FeedTank) check(fs *faults) {
	if u.P < 0 || !finite(u.P) {
		fs.add(u.Pos, u.Name, "", "tank pressure must be positive; got %g Pa", u.P)
	}
	if u.HeatLoss < 0 || !finite(u.HeatLoss) {
		fs.add(u.Pos, u.Name, "", "heat loss must be zero or positive; got %g W", u.HeatLoss)
	}
	if u.UA < 0 || !finite(u.UA) {
		fs.add(u.Pos, u.Name, "", "UA must be zero or positive; got %g W/K", u.UA)
	}
	if u.UA > 0 {
		checkRange(fs, u, "engine room temperature", u.RoomT, 263.15, 343.15, "K")
	}
	if u.SetT != 0 {
		checkRange(fs, u, "steam heating set temperature", u.SetT, 274.15, 372.15, "K")
	}
}

func (u *FeedTank) assemble(a *assembly, ports map[string][]*Line) {
	u.ins = ports["in"]
	u.out = one(ports["out"])
	u.steam = one(ports["steam"])
	u.vent = a.variable(u.Name+": vented flash steam", 1, 0, math.Inf(1), 0)
	all := append([]*Line{u.out, u.steam}, u.ins...)
	deps := append(lineDeps(all...), u.vent)
	u.eqs[0] = a.equation(u.Name+": tank pressure", scaleP, u.out.pIdx())
	u.eqs[1] = a.equation(u.Name+": mass balance", 1, deps...)
	u.eqs[2] = a.equation(u.Name+": energy balance", scaleQ, deps...)
	u.eqs[3] = a.equation(u.Name+": outlet temperature (mixing, venting, heating)", scaleH, deps...)
	u.eqs[4] = -1
	if u.steam != nil {
		u.eqs[4] = a.equation(u.Name+": heating steam or venting", 1, deps...)
	}
}

func (u *FeedTank) pressure(ev *eval) float64 {
	if u.P > 0 {
		return u.P
	}
	return ev.pl.Opt.AmbientPressure
}

// loss is the tank's heat loss at outlet enthalpy h, W.
func (u *FeedTank) loss(p, h float64) (float64, error) {
	q := u.HeatLoss
	if u.UA > 0 {
		t, err := u.mt.get2(p, h, tPH)
		if err != nil {
			return 0, err
		}
		q += u.UA * (t - u.RoomT)
	}
	return q, nil
}

// tankEval is the state of a feed tank at the present unknowns, shared by
// its residual and its Jacobian.
type tankEval struct {
	pt, pOut, hOut, mOut float64 // tank pressure; outlet line
	mIn, eIn             float64 // inflow and its enthalpy flow, heating steam apart
	mSt, hSt             float64 // heating steam
	hf, hg, q            float64 // saturation at the tank pressure; heat loss
	hMix, hSet, target   float64 // the mix, the set point's enthalpy, the outlet's
	branch               int     // which of the three sets the outlet
	heating              bool    // steam heating is on
}

// The branches of the outlet enthalpy.
const (
	tankMix = iota // the mix of the inlets less the heat loss
	tankSet        // held at the steam heating's set temperature
	tankSat        // saturation at the tank pressure (the surplus vents)
)

func (u *FeedTank) evaluate(ev *eval) (tankEval, error) {
	t := tankEval{pt: u.pressure(ev), pOut: ev.p(u.out), hOut: ev.h(u.out), mOut: ev.m(u.out)}
	for _, l := range u.ins {
		t.mIn += ev.m(l)
		t.eIn += ev.m(l) * ev.h(l)
	}
	if u.steam != nil {
		t.mSt, t.hSt = ev.m(u.steam), ev.h(u.steam)
	}
	var err error
	if t.hf, err = u.mf.get1(t.pt, hLiquidSat); err != nil {
		return t, err
	}
	if t.hg, err = u.mg.get1(t.pt, hVapourSat); err != nil {
		return t, err
	}
	if t.q, err = u.loss(t.pOut, t.hOut); err != nil {
		return t, err
	}
	// The mix without heating steam and without venting.
	t.hMix = (t.eIn - t.q + epsFlow*ev.h(u.ins[0])) / (t.mIn + epsFlow)
	t.target, t.branch = t.hMix, tankMix
	if u.steam != nil && u.SetT > 0 {
		if t.hSet, err = u.mset.get2(t.pt, u.SetT, hPT); err != nil {
			return t, err
		}
		if t.hSet > t.target {
			t.target, t.branch = t.hSet, tankSet
		}
		t.heating = t.hMix < t.hSet
	}
	if t.hf < t.target {
		t.target, t.branch = t.hf, tankSat
	}
	return t, nil
}

func (u *FeedTank) residual(ev *eval, r []float64) error {
	t, err := u.evaluate(ev)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	mv := ev.x[u.vent]
	r[u.eqs[0]] = t.pOut - t.pt
	r[u.eqs[1]] = t.mIn + t.mSt - t.mOut - mv
	r[u.eqs[2]] = t.eIn + t.mSt*t.hSt - t.q - t.mOut*t.hOut - mv*t.hg
	r[u.eqs[3]] = t.hOut - t.target
	if u.steam != nil {
		if t.heating {
			r[u.eqs[4]] = mv // heating: nothing vents
		} else {
			r[u.eqs[4]] = t.mSt // warm enough: no heating steam
		}
	}
	return nil
}

func (u *FeedTank) guess(x []float64) {
	p := 101325.0
	if u.P > 0 {
		p = u.P
	}
	x[u.out.pIdx()] = p
	if h, err := hPT(p, 333.15); err == nil {
		x[u.out.hIdx()] = h
	}
}

func (u *FeedTank) report(ev *eval, cr *CaseResult) error {
	pt := u.pressure(ev)
	q, err := u.loss(ev.p(u.out), ev.h(u.out))
	if err != nil {
		return wrapUnitErr(u, err)
	}
	t, err := tPH(ev.p(u.out), ev.h(u.out))
	if err != nil {
		return wrapUnitErr(u, err)
	}
	mv := ev.x[u.vent]
	hg, _ := hVapourSat(pt)
	ur := UnitResult{Name: u.Name, Kind: u.Kind(), Figures: Figures{
		{"T_K", t},
		{"heat_loss_W", q},
		{"vent_kg_s", mv},
	}}
	if u.steam != nil {
		ur.Figures = append(ur.Figures, Figure{"heating_steam_kg_s", ev.m(u.steam)})
	}
	cr.Units = append(cr.Units, ur)
	cr.boundary.heatOut += q
	cr.boundary.massOut += mv
	cr.boundary.energyOut += mv * hg
	cr.VentedKgS += mv
	if mv > 1e-9 {
		cr.warn("%s %q: the mix would boil at the tank pressure; %.1f kg/h of flash steam is vented and lost", u.Kind(), u.Name, mv*3600)
	}
	if u.Observation {
		return nil
	}
	if t > ev.pl.Opt.FeedSuctionMaxT {
		cr.warn("%s %q at %.1f °C is above %.0f °C: too hot for the feed pump's suction (common practice); check the pump's NPSH",
			u.Kind(), u.Name, t-273.15, ev.pl.Opt.FeedSuctionMaxT-273.15)
	}
	cr.FeedTankT = t
	return nil
}

func (u *FeedTank) param(name string) (*float64, error) {
	switch name {
	case "heat_loss":
		return &u.HeatLoss, nil
	case "set_T":
		return &u.SetT, nil
	case "room_T":
		return &u.RoomT, nil
	}
	return nil, paramErr(u, name, "heat_loss", "set_T", "room_T")
}

// ---------------------------------------------------------------------------

// FeedPump raises the feed water to the drum pressure plus a margin. The
// enthalpy rise is v·Δp/η, taking the water as incompressible over the
// pump (a simplification good to well under 1 % at boiler pressures).
type FeedPump struct {
	UnitBase
	// Discharge is the set discharge pressure, Pa absolute. Zero means the
	// highest drum pressure of the boilers in Boilers plus Margin.
	Discharge float64
	Boilers   []string // boilers whose drum pressure the pump must exceed
	Margin    float64  // Pa above the drum pressure
	Eta       float64  // pump efficiency, 0..1
	MotorEta  float64  // motor efficiency, 0..1; zero means 0.9

	in, out   *Line
	eqs       [3]int
	discharge float64
	mv        memo
}

// Kind returns "feed pump".
func (u *FeedPump) Kind() string { return "feed pump" }

// Ports: one inlet, one outlet.
func (u *FeedPump) Ports() []PortSpec {
	return []PortSpec{{Name: "in", Dir: In, Medium: WaterSteam}, {Name: "out", Dir: Out, Medium: WaterSteam}}
}

func (u *FeedPump) check(fs *faults) {
	checkRange(fs, u, "pump efficiency", u.Eta, 0.05, 1, "")
	if u.MotorEta != 0 {
		checkRange(fs, u, "motor efficiency", u.MotorEta, 0.05, 1, "")
	}
	if u.Discharge == 0 && len(u.Boilers) == 0 {
		fs.add(u.Pos, u.Name, "", "needs a discharge pressure or the boilers it feeds (drum pressure plus a margin)")
	}
	if u.Discharge < 0 || u.Margin < 0 {
		fs.add(u.Pos, u.Name, "", "discharge pressure and margin must not be negative")
	}
}

func (u *FeedPump) assemble(a *assembly, ports map[string][]*Line) {
	u.in, u.out = one(ports["in"]), one(ports["out"])
	u.eqs[0] = a.equation(u.Name+": mass balance", 1, u.in.mIdx(), u.out.mIdx())
	u.eqs[1] = a.equation(u.Name+": discharge pressure", scaleP, u.out.pIdx())
	u.eqs[2] = a.equation(u.Name+": enthalpy rise", scaleH, u.in.pIdx(), u.in.hIdx(), u.out.pIdx(), u.out.hIdx())
}

// resolve fixes the discharge pressure from the boilers' drums.
func (u *FeedPump) resolve(pl *Plant) error {
	if u.Discharge > 0 {
		u.discharge = u.Discharge
		return nil
	}
	best := 0.0
	for _, name := range u.Boilers {
		b, ok := pl.byName[name].(*Boiler)
		if !ok {
			return unitErr(u, "feeds %q, which is not an oil-fired boiler of this plant", name)
		}
		best = math.Max(best, b.DrumP)
	}
	u.discharge = best + u.Margin
	return nil
}

func (u *FeedPump) residual(ev *eval, r []float64) error {
	pIn, hIn, pOut := ev.p(u.in), ev.h(u.in), ev.p(u.out)
	v, err := u.mv.get2(pIn, hIn, vPH)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	r[u.eqs[0]] = ev.m(u.out) - ev.m(u.in)
	r[u.eqs[1]] = pOut - u.discharge
	r[u.eqs[2]] = ev.h(u.out) - hIn - v*(pOut-pIn)/u.Eta
	return nil
}

func (u *FeedPump) guess(x []float64) {
	x[u.out.pIdx()] = u.discharge
	x[u.out.hIdx()] = x[u.in.hIdx()]
	x[u.in.mIdx()] = x[u.out.mIdx()]
}

func (u *FeedPump) motorEta() float64 {
	if u.MotorEta > 0 {
		return u.MotorEta
	}
	return 0.9
}

func (u *FeedPump) report(ev *eval, cr *CaseResult) error {
	m := ev.m(u.in)
	shaft := m * (ev.h(u.out) - ev.h(u.in))
	el := shaft / u.motorEta()
	cr.Units = append(cr.Units, UnitResult{Name: u.Name, Kind: u.Kind(), Figures: Figures{
		{"head_Pa", ev.p(u.out) - ev.p(u.in)},
		{"shaft_W", shaft},
		{"electric_W", el},
		{"discharge_Pa", ev.p(u.out)},
	}})
	cr.ElectricW += el
	cr.boundary.workIn += shaft
	return nil
}

func (u *FeedPump) param(name string) (*float64, error) {
	switch name {
	case "eta":
		return &u.Eta, nil
	case "margin":
		return &u.Margin, nil
	}
	return nil, paramErr(u, name, "eta", "margin")
}

// ---------------------------------------------------------------------------

// Header is a steam header (or any junction): it mixes its inlets
// adiabatically and distributes the mix to its outlets at the pressure of
// its first inlet. A heat loss from the header and its piping condenses
// steam, which the traps drain and which is lost from the plant.
type Header struct {
	UnitBase
	HeatLoss float64 // W

	ins, outs []*Line
	drain     int
	eqMass    int
	eqDrain   int
	eqP, eqH  []int
	mf        memo
}

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
	if u.HeatLoss < 0 || !finite(u.HeatLoss) {
		fs.add(u.Pos, u.Name, "", "heat loss must be zero or positive; got %g W", u.HeatLoss)
	}
}

func (u *Header) assemble(a *assembly, ports map[string][]*Line) {
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
			return wrapUnitErr(u, err)
		}
		r[u.eqDrain] = md*(hMix-hf) - u.HeatLoss
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
	cr.Units = append(cr.Units, UnitResult{Name: u.Name, Kind: u.Kind(), Figures: Figures{
		{"p_Pa", p0},
		{"flow_kg_s", mIn},
		{"h_J_per_kg", hMix},
		{"heat_loss_W", u.HeatLoss},
		{"drained_kg_s", md},
	}})
	return nil
}

func (u *Header) param(name string) (*float64, error) {
	switch name {
	case "heat_loss":
		return &u.HeatLoss, nil
	}
	return nil, paramErr(u, name, "heat_loss")
}

// ---------------------------------------------------------------------------

// ReducingValve is a pressure-reducing valve: isenthalpic throttling to a
// set downstream pressure.
type ReducingValve struct {
	UnitBase
	P float64 // set downstream pressure, Pa absolute

	in, out *Line
	eqs     [3]int
}

// Kind returns "pressure-reducing valve".
func (u *ReducingValve) Kind() string { return "pressure-reducing valve" }

// Ports: one inlet, one outlet.
func (u *ReducingValve) Ports() []PortSpec {
	return []PortSpec{{Name: "in", Dir: In, Medium: WaterSteam}, {Name: "out", Dir: Out, Medium: WaterSteam}}
}

func (u *ReducingValve) check(fs *faults) {
	checkRange(fs, u, "set pressure", u.P, 1e3, 5e7, "Pa")
}

func (u *ReducingValve) assemble(a *assembly, ports map[string][]*Line) {
	u.in, u.out = one(ports["in"]), one(ports["out"])
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
	cr.Units = append(cr.Units, UnitResult{Name: u.Name, Kind: u.Kind(), Figures: Figures{
		{"flow_kg_s", ev.m(u.in)},
		{"p_in_Pa", ev.p(u.in)},
		{"p_out_Pa", ev.p(u.out)},
	}})
	return nil
}

func (u *ReducingValve) param(name string) (*float64, error) {
	switch name {
	case "p":
		return &u.P, nil
	}
	return nil, paramErr(u, name, "p")
}

// ---------------------------------------------------------------------------

// Consumer is a heat-duty consumer: it takes steam from its inlet at the
// header's pressure and delivers a duty (or takes a set steam flow); its
// condensate leaves SubCooling kelvin below saturation. ReturnFraction of
// the condensate goes back through the "out" line; the rest is lost and
// made up. Without an "out" line nothing returns. If ReturnT is set, the
// returning condensate passes a drain cooler that cools it to ReturnT (so
// that it does not flash in the feed tank); the cooler's heat goes to the
// cooling water and is reported.
type Consumer struct {
	UnitBase
	Duty           float64 // W; used when SteamFlow is zero
	SteamFlow      float64 // kg/s; when positive it sets the flow instead of the duty
	SubCooling     float64 // K below saturation
	ReturnFraction float64 // 0..1
	ReturnT        float64 // K; zero: the condensate returns as it leaves
	// Off, when non-zero, switches the consumer off for the case.
	Off float64

	// Model, if set, computes the duty for each case from its conditions
	// (tank heating from sea and air temperatures, say); it replaces Duty.
	Model DutyModel
	// FuelOf names a boiler whose fuel flow drives this consumer: its duty
	// is DutyPerFuel (J per kg of fuel, a burner's fuel oil heater) or its
	// steam flow SteamPerFuel (kg per kg of fuel, atomising steam) times
	// the boiler's solved fuel flow. The coupling is part of the solved
	// system.
	FuelOf       string
	DutyPerFuel  float64
	SteamPerFuel float64
	// Label is the consumer's kind in reports ("tank heating"); empty
	// means "heat consumer".
	Label string
	// Factor scales the duty or steam flow however it is given (zero
	// means 1): the knob an audit turns for an uncertain U-value.
	Factor float64

	in, out  *Line
	eqs      [4]int
	mc, mr   memo
	fuel     int // index of the driving boiler's fuel flow, or -1
	caseDuty Duty
}

// DutyModel computes a consumer's duty from the conditions of a case.
type DutyModel interface {
	Duty(c Conditions) (Duty, error)
}

// Duty is a duty computed by a DutyModel, with the inputs that drove it
// (keys carry their SI unit, such as "cargo_T_K") and any warnings.
type Duty struct {
	W        float64
	Inputs   map[string]float64
	Warnings []string
}

// Kind returns the consumer's label, or "heat consumer".
func (u *Consumer) Kind() string {
	if u.Label != "" {
		return u.Label
	}
	return "heat consumer"
}

// link ties the consumer to the boiler whose fuel drives it, after every
// unit has laid out its unknowns.
func (u *Consumer) link(p *Plant, a *assembly, fs *faults) {
	u.fuel = -1
	if u.FuelOf == "" {
		return
	}
	b, ok := p.byName[u.FuelOf].(*Boiler)
	if !ok {
		fs.add(u.Pos, u.Name, "", "is driven by the fuel flow of %q, which is not an oil-fired boiler of this plant", u.FuelOf)
		return
	}
	u.fuel = b.fuel
	a.pattern[u.eqs[0]] = append(a.pattern[u.eqs[0]], b.fuel)
}

// prepare computes the case's duty from the model.
func (u *Consumer) prepare(c Conditions) error {
	u.caseDuty = Duty{W: u.Duty}
	if u.Model == nil || u.Off != 0 {
		return nil
	}
	d, err := u.Model.Duty(c)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	if !finite(d.W) || d.W < 0 {
		return unitErr(u, "its model gives a duty of %g W; a duty must be zero or positive", d.W)
	}
	u.caseDuty = d
	return nil
}

// Ports: steam in, optional condensate out.
func (u *Consumer) Ports() []PortSpec {
	return []PortSpec{
		{Name: "in", Dir: In, Medium: WaterSteam},
		{Name: "out", Dir: Out, Medium: WaterSteam, Optional: true},
	}
}

func (u *Consumer) check(fs *faults) {
	if u.Duty < 0 || !finite(u.Duty) {
		fs.add(u.Pos, u.Name, "", "duty must be zero or positive; got %g W", u.Duty)
	}
	if u.SteamFlow < 0 || !finite(u.SteamFlow) {
		fs.add(u.Pos, u.Name, "", "steam flow must be zero or positive; got %g kg/s", u.SteamFlow)
	}
	checkRange(fs, u, "condensate subcooling", u.SubCooling, 0, 250, "K")
	checkRange(fs, u, "return fraction", u.ReturnFraction, 0, 1, "")
	if u.Factor != 0 {
		checkRange(fs, u, "duty factor", u.Factor, 0.01, 10, "")
	}
	if u.ReturnT != 0 {
		checkRange(fs, u, "condensate return temperature", u.ReturnT, 274.15, 473.15, "K")
	}
	if u.DutyPerFuel < 0 || u.SteamPerFuel < 0 || !finite(u.DutyPerFuel) || !finite(u.SteamPerFuel) {
		fs.add(u.Pos, u.Name, "", "duty and steam per kg of fuel must be zero or positive")
	}
	if (u.DutyPerFuel > 0 || u.SteamPerFuel > 0) && u.FuelOf == "" {
		fs.add(u.Pos, u.Name, "", "a duty or steam flow per kg of fuel needs the boiler whose fuel it follows")
	}
}

// hReturn is the enthalpy of the returning condensate, given hc as it
// leaves the consumer.
func (u *Consumer) hReturn(p, hc float64) (float64, error) {
	if u.ReturnT == 0 {
		return hc, nil
	}
	h, err := u.mr.get2(p, u.ReturnT, hPT)
	if err != nil {
		return 0, err
	}
	if h > hc {
		t, _ := tPH(p, hc)
		return 0, fmt.Errorf("condensate return temperature %.1f °C is above the condensate leaving the consumer at %.1f °C; a drain cooler cannot heat", u.ReturnT-273.15, t-273.15)
	}
	return h, nil
}

func (u *Consumer) assemble(a *assembly, ports map[string][]*Line) {
	u.in, u.out = one(ports["in"]), one(ports["out"])
	u.eqs[0] = a.equation(u.Name+": duty", scaleQ, u.in.mIdx(), u.in.pIdx(), u.in.hIdx())
	u.eqs[1], u.eqs[2], u.eqs[3] = -1, -1, -1
	if u.out != nil {
		u.eqs[1] = a.equation(u.Name+": condensate return", 1, u.in.mIdx(), u.out.mIdx())
		u.eqs[2] = a.equation(u.Name+": condensate pressure", scaleP, u.in.pIdx(), u.out.pIdx())
		u.eqs[3] = a.equation(u.Name+": condensate temperature", scaleH, u.in.pIdx(), u.out.hIdx())
	}
}

func (u *Consumer) factor() float64 {
	if u.Factor == 0 {
		return 1
	}
	return u.Factor
}

func (u *Consumer) returnFraction() float64 {
	if u.out == nil {
		return 0
	}
	return u.ReturnFraction
}

func (u *Consumer) residual(ev *eval, r []float64) error {
	p := ev.p(u.in)
	hc, err := u.mc.get2(p, u.SubCooling, hCondensate)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	m := ev.m(u.in)
	f := u.factor()
	switch {
	case u.Off != 0:
		r[u.eqs[0]] = m * scaleQ
	case u.SteamPerFuel > 0 && u.fuel >= 0:
		r[u.eqs[0]] = (m - f*u.SteamPerFuel*ev.x[u.fuel]) * scaleQ
	case u.SteamFlow > 0:
		r[u.eqs[0]] = (m - f*u.SteamFlow) * scaleQ
	case u.DutyPerFuel > 0 && u.fuel >= 0:
		r[u.eqs[0]] = m*(ev.h(u.in)-hc) - f*u.DutyPerFuel*ev.x[u.fuel]
	default:
		r[u.eqs[0]] = m*(ev.h(u.in)-hc) - f*u.caseDuty.W
	}
	if u.out != nil {
		hr, err := u.hReturn(p, hc)
		if err != nil {
			return wrapUnitErr(u, err)
		}
		r[u.eqs[1]] = ev.m(u.out) - u.ReturnFraction*m
		r[u.eqs[2]] = ev.p(u.out) - p
		r[u.eqs[3]] = ev.h(u.out) - hr
	}
	return nil
}

func (u *Consumer) guess(x []float64) {
	if u.out != nil {
		p := x[u.in.pIdx()]
		x[u.out.pIdx()] = p
		if h, err := hCondensate(p, u.SubCooling); err == nil {
			if hr, err := u.hReturn(p, h); err == nil {
				x[u.out.hIdx()] = hr
			}
		}
	}
}

func (u *Consumer) report(ev *eval, cr *CaseResult) error {
	p := ev.p(u.in)
	hc, err := u.mc.get2(p, u.SubCooling, hCondensate)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	m := ev.m(u.in)
	duty := m * (ev.h(u.in) - hc)
	ret := u.returnFraction() * m
	lost := m - ret
	cooler := 0.0
	if u.out != nil {
		cooler = ret * (hc - ev.h(u.out))
	}
	cr.Consumers = append(cr.Consumers, ConsumerResult{
		Name: u.Name, Kind: u.Kind(), DutyW: duty, SteamKgS: m, ReturnKgS: ret, LostKgS: lost, DrainCoolerW: cooler,
		Inputs: u.caseDuty.Inputs,
	})
	for _, w := range u.caseDuty.Warnings {
		cr.warn("%s %q: %s", u.Kind(), u.Name, w)
	}
	cr.boundary.heatOut += duty + cooler
	cr.boundary.massOut += lost
	cr.boundary.energyOut += lost * hc
	cr.CondensateLostKgS += lost
	return nil
}

func (u *Consumer) param(name string) (*float64, error) {
	switch name {
	case "duty":
		return &u.Duty, nil
	case "steam_flow":
		return &u.SteamFlow, nil
	case "return_fraction":
		return &u.ReturnFraction, nil
	case "subcooling":
		return &u.SubCooling, nil
	case "return_T":
		return &u.ReturnT, nil
	case "off":
		return &u.Off, nil
	case "factor":
		return &u.Factor, nil
	}
	return nil, paramErr(u, name, "duty", "steam_flow", "return_fraction", "subcooling", "return_T", "off", "factor")
}

// ---------------------------------------------------------------------------

// Turbine is a steam turbine driving a cargo pump or a generator: it gives
// a set shaft power from steam expanding from its inlet state to its
// exhaust pressure, with an isentropic and a mechanical (and gear)
// efficiency. Its exhaust goes on to a condenser or a back-pressure line.
type Turbine struct {
	UnitBase
	Power    float64 // shaft power delivered, W
	ExhaustP float64 // exhaust pressure, Pa absolute
	EtaIs    float64 // isentropic efficiency, 0..1
	EtaMech  float64 // mechanical and gear efficiency, 0..1; zero means 1
	Off      float64 // non-zero: not running this case

	in, out *Line
	eqs     [4]int
	ms, mhs memo
	// The Jacobian's derivatives of the isentropic enthalpy, memoised by
	// (p_in, h_in, p_out): a turbine that is off keeps its state.
	jkey, jval [3]float64
	jset       bool
}

// Kind returns "steam turbine".
func (u *Turbine) Kind() string { return "steam turbine" }

// Ports: steam in, exhaust out.
func (u *Turbine) Ports() []PortSpec {
	return []PortSpec{{Name: "in", Dir: In, Medium: WaterSteam}, {Name: "out", Dir: Out, Medium: WaterSteam}}
}

func (u *Turbine) check(fs *faults) {
	if u.Power < 0 || !finite(u.Power) {
		fs.add(u.Pos, u.Name, "", "shaft power must be zero or positive; got %g W", u.Power)
	}
	checkRange(fs, u, "exhaust pressure", u.ExhaustP, 1e3, 5e7, "Pa")
	checkRange(fs, u, "isentropic efficiency", u.EtaIs, 0.05, 1, "")
	if u.EtaMech != 0 {
		checkRange(fs, u, "mechanical efficiency", u.EtaMech, 0.05, 1, "")
	}
}

func (u *Turbine) etaMech() float64 {
	if u.EtaMech > 0 {
		return u.EtaMech
	}
	return 1
}

func (u *Turbine) assemble(a *assembly, ports map[string][]*Line) {
	u.in, u.out = one(ports["in"]), one(ports["out"])
	u.eqs[0] = a.equation(u.Name+": exhaust pressure", scaleP, u.out.pIdx())
	u.eqs[1] = a.equation(u.Name+": expansion", scaleH, u.in.pIdx(), u.in.hIdx(), u.out.pIdx(), u.out.hIdx())
	u.eqs[2] = a.equation(u.Name+": shaft power", scaleQ, u.in.mIdx(), u.in.hIdx(), u.out.hIdx())
	u.eqs[3] = a.equation(u.Name+": mass balance", 1, u.in.mIdx(), u.out.mIdx())
}

// expansion returns the exhaust enthalpy and the isentropic drop.
func (u *Turbine) expansion(pIn, hIn, pOut float64) (hOut, dhs float64, err error) {
	s, err := u.ms.get2(pIn, hIn, water.SPH)
	if err != nil {
		return 0, 0, err
	}
	hs, err := u.mhs.get2(pOut, s, water.HPS)
	if err != nil {
		return 0, 0, err
	}
	dhs = hIn - hs
	return hIn - u.EtaIs*dhs, dhs, nil
}

func (u *Turbine) residual(ev *eval, r []float64) error {
	hOut, _, err := u.expansion(ev.p(u.in), ev.h(u.in), ev.p(u.out))
	if err != nil {
		return wrapUnitErr(u, err)
	}
	r[u.eqs[0]] = ev.p(u.out) - u.ExhaustP
	r[u.eqs[1]] = ev.h(u.out) - hOut
	power := u.Power
	if u.Off != 0 {
		power = 0
	}
	r[u.eqs[2]] = ev.m(u.in)*(ev.h(u.in)-ev.h(u.out))*u.etaMech() - power
	r[u.eqs[3]] = ev.m(u.out) - ev.m(u.in)
	return nil
}

func (u *Turbine) guess(x []float64) {
	x[u.out.pIdx()] = u.ExhaustP
	if h, _, err := u.expansion(x[u.in.pIdx()], x[u.in.hIdx()], u.ExhaustP); err == nil {
		x[u.out.hIdx()] = h
	}
}

func (u *Turbine) report(ev *eval, cr *CaseResult) error {
	_, dhs, err := u.expansion(ev.p(u.in), ev.h(u.in), ev.p(u.out))
	if err != nil {
		return wrapUnitErr(u, err)
	}
	m := ev.m(u.in)
	shaft := m * (ev.h(u.in) - ev.h(u.out)) * u.etaMech()
	rate := 0.0
	if shaft > 0 {
		rate = m / shaft * 3.6e6 // kg/kWh
	}
	cr.Units = append(cr.Units, UnitResult{Name: u.Name, Kind: u.Kind(), Figures: Figures{
		{"shaft_W", shaft},
		{"steam_kg_s", m},
		{"isentropic_drop_J_kg", dhs},
		{"steam_rate_kg_per_kWh", rate},
	}})
	cr.Consumers = append(cr.Consumers, ConsumerResult{Name: u.Name, Kind: u.Kind(), DutyW: shaft, SteamKgS: m, ReturnKgS: m})
	cr.boundary.workOut += m * (ev.h(u.in) - ev.h(u.out))
	return nil
}

func (u *Turbine) param(name string) (*float64, error) {
	switch name {
	case "power":
		return &u.Power, nil
	case "off":
		return &u.Off, nil
	}
	return nil, paramErr(u, name, "power", "off")
}

// ---------------------------------------------------------------------------

// Condenser condenses its inlet steam to water SubCooling kelvin below
// saturation at its inlet pressure, rejecting the heat to sea water. A dump
// condenser takes the steam an exhaust-gas economiser makes beyond demand:
// its inlet flow is set by the plant's dispatch, not by its own equation.
// The condensate pump after a vacuum condenser is not modelled (its work is
// small against the heat flows).
type Condenser struct {
	UnitBase
	SubCooling float64 // K
	Dump       bool

	in, out *Line
	eqs     [3]int
	mc      memo
}

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

func (u *Condenser) check(fs *faults) {
	checkRange(fs, u, "condensate subcooling", u.SubCooling, 0, 250, "K")
}

func (u *Condenser) assemble(a *assembly, ports map[string][]*Line) {
	u.in, u.out = one(ports["in"]), one(ports["out"])
	if u.Dump {
		// The dispatch first tries a case with no boiler firing, in which
		// the dump condenser takes what the steam system has over. Letting
		// that flow go negative in the trial makes a shortfall a solved
		// answer (fire a boiler) rather than a failed solve; the dispatch
		// never accepts a negative dump flow.
		a.lo[u.in.mIdx()] = math.Inf(-1)
		a.lo[u.out.mIdx()] = math.Inf(-1)
	}
	u.eqs[0] = a.equation(u.Name+": mass balance", 1, u.in.mIdx(), u.out.mIdx())
	u.eqs[1] = a.equation(u.Name+": condensate pressure", scaleP, u.in.pIdx(), u.out.pIdx())
	u.eqs[2] = a.equation(u.Name+": condensate temperature", scaleH, u.in.pIdx(), u.out.hIdx())
}

func (u *Condenser) residual(ev *eval, r []float64) error {
	hc, err := u.mc.get2(ev.p(u.in), u.SubCooling, hCondensate)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	r[u.eqs[0]] = ev.m(u.out) - ev.m(u.in)
	r[u.eqs[1]] = ev.p(u.out) - ev.p(u.in)
	r[u.eqs[2]] = ev.h(u.out) - hc
	return nil
}

func (u *Condenser) guess(x []float64) {
	p := x[u.in.pIdx()]
	x[u.out.pIdx()] = p
	if h, err := hCondensate(p, u.SubCooling); err == nil {
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
	cr.Units = append(cr.Units, UnitResult{Name: u.Name, Kind: u.Kind(), Figures: Figures{
		{"duty_W", duty},
		{"steam_kg_s", m},
	}})
	cr.boundary.heatOut += duty
	if u.Dump {
		cr.DumpedKgS += m
	}
	return nil
}

func (u *Condenser) param(name string) (*float64, error) {
	switch name {
	case "subcooling":
		return &u.SubCooling, nil
	}
	return nil, paramErr(u, name, "subcooling")
}

// String helps debugging output.
func (l *Line) String() string {
	return fmt.Sprintf("line %q (%s.%s -> %s.%s)", l.Name, l.From, l.FromPort, l.To, l.ToPort)
}
