package plant

import (
	"math"

	"steamcase/plant/units"
)

// FeedTank is the hotwell or cascade tank: it mixes the condensate returns
// and the make-up, loses heat to the engine room, may be heated by steam to
// a set temperature (common practice, to drive out oxygen), and vents the
// flash steam if the mix would boil at the tank pressure. The vented steam
// is a loss the make-up replaces.
type FeedTank struct {
	Base
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
	// O2T is the temperature below which the feed holds too much dissolved
	// oxygen and a case warns; zero means defaultO2T.
	O2T float64
	// Observation makes the tank an observation (inspection) tank: the
	// vented tank that returning condensate passes so that oil from a
	// leaking heating coil can be seen before it reaches the feed water.
	// Its model is the feed tank's (mixing, heat loss, flash steam
	// vented); it is reported as such and its temperature is not the
	// feed's.
	Observation bool

	ins        []*Line
	out, steam *Line
	gets       []transfer // drains and drain-cooler heat of other units (transfer.go)
	vent       int
	eqs        [5]int
	mt, mf, mg memo
	mset       memo
}

// defaultO2T is the hotwell temperature below which a case warns of
// dissolved oxygen: 80 °C. Marine water-treatment practice keeps a vented
// hotwell at about 80-90 °C (the NPSH of the feed pump bounds it above),
// where air-saturated water holds about 3 mg/l of oxygen against about 9
// mg/l at 20 °C (common practice and solubility both from memory, not on
// the project's reference sheets).
const defaultO2T = 353.15

// NewFeedTank returns a vented feed tank (hotwell).
func NewFeedTank() *FeedTank { return &FeedTank{} }

// NewObservationTank returns a vented observation tank.
func NewObservationTank() *FeedTank { return &FeedTank{Observation: true} }

func feedTankKey(k Key, f func(*FeedTank) *float64) Key { return num(k, self[*FeedTank], f) }

var (
	tankHeatLossKey = feedTankKey(Key{Name: "heat_loss", Label: "heat loss", Dim: units.Power, Example: "8 kW",
		Doc: "fixed heat loss to the engine room (a hotwell loses kilowatts; at most 2 MW)", Default: 0, HasDefault: true, Min: 0, Max: 2e6, Case: true, Source: SourceLeftOut},
		func(u *FeedTank) *float64 { return &u.HeatLoss })
	tankUAKey = feedTankKey(Key{Name: "UA", Label: "UA", Dim: units.ThermalConductance, Example: "0.2 kW/K",
		Doc: "heat loss conductance to the engine room, with room_T", Default: 0, HasDefault: true, Min: 0, Max: 1e8, Source: SourceLeftOut},
		func(u *FeedTank) *float64 { return &u.UA })
	tankRoomTKey = feedTankKey(Key{Name: "room_T", Label: "engine room temperature", Dim: units.Temperature, Example: "35 C",
		Doc: "engine room temperature, for the UA loss", Min: 263.15, Max: 343.15, Case: true},
		func(u *FeedTank) *float64 { return &u.RoomT })
	feedTankKeys = []Key{
		feedTankKey(Key{Name: "p", Label: "tank pressure", Dim: units.Pressure, Example: "1 bar(g)",
			Doc: "tank pressure", DefaultNote: "the plant's ambient pressure (a vented tank)", Min: 1e3, Max: 5e7, Source: SourceDerived},
			func(u *FeedTank) *float64 { return &u.P }),
		tankHeatLossKey, tankUAKey, tankRoomTKey,
		feedTankKey(Key{Name: "set_T", Label: "steam heating set temperature", Dim: units.Temperature, Example: "60 C",
			Doc: "temperature held by steam heating on port \"steam\"", DefaultNote: "no steam heating",
			Min: 274.15, Max: 372.15, Case: true, Source: SourceLeftOut},
			func(u *FeedTank) *float64 { return &u.SetT }),
		feedTankKey(Key{Name: "o2_T", Label: "oxygen warning temperature", Dim: units.Temperature, Example: "85 C",
			Doc: "below this temperature a case warns that the feed holds too much dissolved oxygen", Default: defaultO2T, HasDefault: true,
			Source: "common practice, from memory", Min: 293.15, Max: 383.15, Case: true},
			func(u *FeedTank) *float64 { return &u.O2T }),
	}
	observationTankKeys = []Key{tankHeatLossKey, tankUAKey, tankRoomTKey}
)

// Keys lists the tank's keys.
func (u *FeedTank) Keys() []Key {
	if u.Observation {
		return observationTankKeys
	}
	return feedTankKeys
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
	checkKey(fs, u, "heat_loss")
	if u.UA < 0 || !finite(u.UA) {
		fs.add(u.Pos, u.Name, "", "UA must be zero or positive; got %g W/K", u.UA)
	}
	if u.UA > 0 {
		checkRange(fs, u, tankRoomTKey.Label, u.RoomT, tankRoomTKey.Min, tankRoomTKey.Max, "K")
	}
	if !u.Observation {
		checkKey(fs, u, "set_T")
		checkKey(fs, u, "o2_T")
	}
}

func (u *FeedTank) assemble(a *assembly, ports portLines) {
	u.ins = ports["in"]
	u.out = ports.one("out")
	u.steam = ports.one("steam")
	u.gets = u.gets[:0]
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

// receive takes another unit's drains or heat into the tank's balance.
func (u *FeedTank) receive(a *assembly, t transfer) {
	u.gets = append(u.gets, t)
	for _, e := range u.eqs[1:4] {
		a.depend(e, t.transferDeps()...)
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
	mX, eX               float64 // inflow of other units' drains and heat (transfer.go)
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
	if t.mX, t.eX, err = sumTransfers(ev, u.gets); err != nil {
		return t, err
	}
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
	t.hMix = (t.eIn + t.eX - t.q + epsFlow*ev.h(u.ins[0])) / (t.mIn + t.mX + epsFlow)
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
		return wrapErr(u, err)
	}
	mv := ev.x[u.vent]
	r[u.eqs[0]] = t.pOut - t.pt
	r[u.eqs[1]] = t.mIn + t.mX + t.mSt - t.mOut - mv
	r[u.eqs[2]] = t.eIn + t.eX + t.mSt*t.hSt - t.q - t.mOut*t.hOut - mv*t.hg
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

func (u *FeedTank) jacobian(ev *eval, j jac) error {
	t, err := u.evaluate(ev)
	if err != nil {
		return wrapErr(u, err)
	}
	pOut, hOut, mOut := t.pOut, t.hOut, t.mOut
	mSt, hSt, hg := t.mSt, t.hSt, t.hg
	hMix, branch, heating := t.hMix, t.branch, t.heating
	var dqdp, dqdh float64
	if u.UA > 0 {
		t0, err := u.mt.get2(pOut, hOut, tPH)
		if err != nil {
			return wrapErr(u, err)
		}
		dtdp, dtdh, err := dProp2(tPH, pOut, hOut, t0)
		if err != nil {
			return wrapErr(u, err)
		}
		dqdp, dqdh = u.UA*dtdp, u.UA*dtdh
	}
	ref := u.ins[0]
	den := t.mIn + t.mX + epsFlow

	e := u.eqs
	j.add(e[0], u.out.pIdx(), 1)
	for _, l := range u.ins {
		j.add(e[1], l.mIdx(), 1)
		j.add(e[2], l.mIdx(), ev.h(l))
		j.add(e[2], l.hIdx(), ev.m(l))
	}
	if u.steam != nil {
		j.add(e[1], u.steam.mIdx(), 1)
		j.add(e[2], u.steam.mIdx(), hSt)
		j.add(e[2], u.steam.hIdx(), mSt)
	}
	j.add(e[1], u.out.mIdx(), -1)
	j.add(e[1], u.vent, -1)
	j.add(e[2], u.out.pIdx(), -dqdp)
	j.add(e[2], u.out.hIdx(), -dqdh-mOut)
	j.add(e[2], u.out.mIdx(), -hOut)
	j.add(e[2], u.vent, -hg)

	j.add(e[3], u.out.hIdx(), 1)
	if branch == tankMix {
		for _, l := range u.ins {
			j.add(e[3], l.mIdx(), -(ev.h(l)-hMix)/den)
			j.add(e[3], l.hIdx(), -ev.m(l)/den)
		}
		j.add(e[3], ref.hIdx(), -epsFlow/den)
		j.add(e[3], u.out.pIdx(), dqdp/den)
		j.add(e[3], u.out.hIdx(), dqdh/den)
	}
	for _, g := range u.gets {
		_, _, d, err := g.transferred(ev, true)
		if err != nil {
			return wrapErr(u, err)
		}
		for _, pd := range d {
			j.add(e[1], pd.col, pd.dm)
			j.add(e[2], pd.col, pd.de)
			if branch == tankMix {
				j.add(e[3], pd.col, -(pd.de-hMix*pd.dm)/den)
			}
		}
	}
	if u.steam != nil {
		if heating {
			j.add(e[4], u.vent, 1)
		} else {
			j.add(e[4], u.steam.mIdx(), 1)
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
		return wrapErr(u, err)
	}
	t, err := tPH(ev.p(u.out), ev.h(u.out))
	if err != nil {
		return wrapErr(u, err)
	}
	mv := ev.x[u.vent]
	hg, _ := hVapourSat(pt)
	ur := ComponentResult{Name: u.Name, Kind: u.Kind(), Figures: append(make(Figures, 0, 6),
		Figure{"T_K", t},
		Figure{"heat_loss_W", q},
		Figure{"vent_kg_s", mv},
	)}
	if u.steam != nil {
		ur.Figures = append(ur.Figures, Figure{"heating_steam_kg_s", ev.m(u.steam)})
	}
	if len(u.gets) > 0 {
		mx, ex, err := sumTransfers(ev, u.gets)
		if err != nil {
			return wrapErr(u, err)
		}
		ur.Figures = append(ur.Figures, Figure{"received_kg_s", mx}, Figure{"received_W", ex})
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
	if o2 := u.o2T(); t < o2 && ev.m(u.out) > FlowFloor {
		cr.warn("%s %q at %.1f °C is below %.0f °C: feed this cool keeps dissolved oxygen that corrodes the boiler (common practice, from memory: a vented hotwell is kept near 80-90 °C); heat it (set_T) or return the condensate warmer",
			u.Kind(), u.Name, t-273.15, o2-273.15)
	}
	cr.FeedTankT = t
	return nil
}

func (u *FeedTank) o2T() float64 {
	if u.O2T > 0 {
		return u.O2T
	}
	return defaultO2T
}

func (u *FeedTank) outline(cr *CaseResult) {
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind()})
}

func (u *FeedTank) clone() Component {
	c := *u
	c.ins, c.out, c.steam = nil, nil, nil
	c.gets = nil
	return &c
}
