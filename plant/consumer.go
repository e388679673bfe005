package plant

import (
	"fmt"

	"steamcase/plant/units"
)

// Consumer is a heat-duty consumer: it takes steam from its inlet at the
// header's pressure and delivers a duty (or takes a set steam flow); its
// condensate leaves SubCooling kelvin below saturation. ReturnFraction of
// the condensate goes back through the "out" line; the rest is lost and
// made up. Without an "out" line nothing returns. If ReturnT is set, the
// returning condensate passes a drain cooler that cools it to ReturnT (so
// that it does not flash in the feed tank); the cooler's heat goes where
// DrainCooler says: by default to the boiler feed after the feed pump (a
// feed-water heater on the return), or to the hotwell, or overboard. With
// TrapLoss, that fraction of the steam passes the trap live, with the
// condensate.
//
// The demand is, for each case, what Model computes (tank heating, a fuel
// heater, … see duty.go), or else the consumer's own Duty, SteamFlow,
// DutyPerFuel or SteamPerFuel.
type Consumer struct {
	Base
	Duty           float64 // W; used when SteamFlow is zero
	SteamFlow      float64 // kg/s; when positive it sets the flow instead of the duty
	SubCooling     float64 // K below saturation
	ReturnFraction float64 // 0..1
	ReturnT        float64 // K; zero: the condensate returns as it leaves
	// Off switches the consumer off for the case.
	Off bool

	// Model, if set, computes the demand for each case from its
	// conditions (tank heating from sea and air temperatures, say); it
	// replaces Duty and SteamFlow. The consumer owns it: Clone copies it.
	Model DutyModel
	// FuelOf names a boiler whose fuel flow drives this consumer: its duty
	// is DutyPerFuel (J per kg of fuel, a burner's fuel oil heater) or its
	// steam flow SteamPerFuel (kg per kg of fuel, atomising steam) times
	// the boiler's solved fuel flow (or what Model gives per kg of fuel).
	// The coupling is part of the solved system.
	FuelOf       string
	DutyPerFuel  float64
	SteamPerFuel float64
	// Label is the consumer's kind in reports ("tank heating"); empty
	// means the model's, or "heat consumer".
	Label string
	// Factor scales the duty or steam flow however it is given (zero
	// means 1): the knob an audit turns for an uncertain U-value.
	Factor float64
	// Priority ranks the consumer when the boilers at their limit cannot
	// carry the demand: the lowest is reduced first (priority.go). Zero
	// means not given, which ranks as PriorityEssential. A consumer that
	// follows a boiler's fuel is never reduced.
	Priority float64
	// DrainCooler says where the drain cooler's heat goes (ReturnT set):
	// to the feed by default. TrapLoss is the fraction of the steam that
	// passes the steam trap live (a blowing trap): it leaves with the
	// condensate, to the return or lost with it, and does no duty.
	DrainCooler CoolerDestination
	TrapLoss    float64

	shed     shedRole
	in, out  *Line
	eqs      [4]int
	mc, mr   memo
	mx       memo // temperature of what enters the drain cooler (reports)
	fuel     int  // index of the driving boiler's fuel flow, or -1
	caseDuty Duty
	warms    *Boiler // the boiler a warming consumer keeps warm
	// Where the drain cooler's heat goes in the compiled plant (one of the
	// coolerTo texts), the feed pump it heats the feed after, and a note
	// when the destination asked for is not in the plant.
	coolerTo   string
	feedPump   *FeedPump
	coolerNote string
}

// Where a drain cooler's heat goes, as DrainCooler chooses.
type CoolerDestination int

// The destinations of a drain cooler's heat.
const (
	// CoolerToFeed heats the boiler feed after the feed pump: a feed-water
	// heater on the return (the default).
	CoolerToFeed CoolerDestination = iota
	// CoolerToHotwell gives the heat to the feed tank.
	CoolerToHotwell
	// CoolerOverboard rejects it to the sea.
	CoolerOverboard
)

// The destinations as results name them.
const (
	coolerToFeed    = "feed"
	coolerToHotwell = "hotwell"
	coolerOverboard = "overboard"
)

// NewConsumer returns a heat consumer; give it a Duty or a SteamFlow.
func NewConsumer() *Consumer { return &Consumer{} }

// NewModelConsumer returns a consumer whose demand m computes.
func NewModelConsumer(m DutyModel) *Consumer { return &Consumer{Model: m} }

func consumerKey(k Key, f func(*Consumer) *float64) Key { return num(k, self[*Consumer], f) }

// The keys every steam consumer has, and those of a plain consumer.
var (
	offKey = flag(Key{Name: "off", Label: "off", Example: "true", Doc: "switched off", Default: 0, HasDefault: true, Case: true, Source: SourceLeftOut},
		self[*Consumer], func(u *Consumer) *bool { return &u.Off })
	factorKey = consumerKey(Key{Name: "factor", Label: "duty factor", Dim: units.Fraction, Example: "1.1",
		Doc:     "scales the duty or steam flow however it is given (an audit's knob for an uncertain U-value)",
		Default: 1, HasDefault: true, Min: 0.01, Max: 10, Case: true, Source: SourceLeftOut},
		func(u *Consumer) *float64 { return &u.Factor })
	returnKeys = []Key{
		consumerKey(Key{Name: "subcool", Label: "condensate subcooling", Dim: units.TemperatureDifference, Example: "10 K",
			Doc: "condensate leaves this far below saturation", Default: 0, HasDefault: true, Min: 0, Max: 250, Case: true, Source: SourceLeftOut},
			func(u *Consumer) *float64 { return &u.SubCooling }),
		consumerKey(Key{Name: "returns", Label: "return fraction", Dim: units.Fraction, Example: "95 %",
			Doc: "fraction of the condensate that returns (the rest is lost and made up)", Default: 0, HasDefault: true,
			Min: 0, Max: 1, Case: true, Source: SourceLeftOut},
			func(u *Consumer) *float64 { return &u.ReturnFraction }),
		consumerKey(Key{Name: "return_T", Label: "condensate return temperature", Dim: units.Temperature, Example: "85 C",
			Doc: "temperature after a drain cooler on the return", DefaultNote: "no drain cooler", Min: 274.15, Max: 473.15, Case: true, Source: SourceLeftOut},
			func(u *Consumer) *float64 { return &u.ReturnT }),
		choice(Key{Name: "drain_cooler", Label: "drain cooler's heat", Choices: []string{coolerToFeed, coolerToHotwell, coolerOverboard},
			Example: `"hotwell"`, Default: 0, HasDefault: true, Source: "common practice, no source",
			Doc: `where the drain cooler's heat goes: "feed" heats the boiler feed after the feed pump (a feed-water heater on the return), "hotwell" the feed tank, "overboard" the sea`},
			self[*Consumer], func(u *Consumer) *CoolerDestination { return &u.DrainCooler }),
		consumerKey(Key{Name: "trap_loss", Label: "steam-trap loss", Dim: units.Fraction, Example: "3 %",
			Doc: "fraction of the steam that passes the steam trap live, with the condensate", Default: 0, HasDefault: true,
			DefaultNote: "0 % (no trap losses counted)", Min: 0, Max: 0.5, Case: true, Source: SourceLeftOut},
			func(u *Consumer) *float64 { return &u.TrapLoss }),
	}
	consumerPriorityKey = priorityKey(self[*Consumer], func(u *Consumer) *float64 { return &u.Priority })
	// consumerModelKeys are the keys of a consumer whose demand a model
	// computes, besides the model's own.
	consumerModelKeys = append(append([]Key(nil), returnKeys...), offKey, factorKey, consumerPriorityKey)
	plainConsumerKeys = append([]Key{
		consumerKey(Key{Name: "duty", Label: "duty", Dim: units.Power, Example: "450 kW",
			Doc: "heat delivered (or steam)", Min: 0, Max: 1e9, Case: true, JSON: "duty_kW", Clears: []string{"steam"}},
			func(u *Consumer) *float64 { return &u.Duty }),
		consumerKey(Key{Name: "steam", Label: "steam flow", Dim: units.MassFlow, Example: "0.2 t/h",
			Doc: "a set steam flow (or duty)", Min: 0, Max: 1e3, Case: true, JSON: "steam_kg_h"},
			func(u *Consumer) *float64 { return &u.SteamFlow }),
	}, consumerModelKeys...)
)

// Keys lists the consumer's keys: its model's with the consumer keys the
// model takes, or a plain consumer's.
func (u *Consumer) Keys() []Key {
	if m, ok := u.Model.(keyedModel); ok {
		return m.keys()
	}
	if u.Model != nil {
		return consumerModelKeys
	}
	return plainConsumerKeys
}

// Kind returns the consumer's label, its model's, or "heat consumer".
func (u *Consumer) Kind() string {
	if u.Label != "" {
		return u.Label
	}
	if m, ok := u.Model.(labelled); ok {
		return m.label()
	}
	return "heat consumer"
}

// validate checks the model's inputs at declaration.
func (u *Consumer) validate() error {
	if m, ok := u.Model.(validated); ok {
		return m.validate()
	}
	return nil
}

// link ties the consumer to the boiler whose fuel drives it, after every
// component has laid out its unknowns.
func (u *Consumer) link(p *Plant, a *assembly, fs *faults) {
	u.fuel = -1
	if u.out == nil && u.ReturnFraction > 0 {
		fs.add(u.Pos, u.Name, "", "returns %.4g %% of its condensate, but has no return line (its port \"out\" is not connected): connect it to the hotwell, or give returns = \"0 %%\" if all its condensate is lost",
			100*u.ReturnFraction)
	}
	u.warms = nil
	u.linkCooler(p, a, fs)
	if m, ok := u.Model.(*BoilerWarming); ok {
		b, ok := p.byName[m.Boiler].(*Boiler)
		if !ok {
			fs.add(u.Pos, u.Name, "", "keeps %q warm, which is not an oil-fired boiler of this plant", m.Boiler)
			return
		}
		u.warms = b
		b.warmed = true
		a.depend(u.eqs[0], b.feed.hIdx())
	}
	if u.FuelOf == "" {
		return
	}
	b, ok := p.byName[u.FuelOf].(*Boiler)
	if !ok {
		fs.add(u.Pos, u.Name, "", "is driven by the fuel flow of %q, which is not an oil-fired boiler of this plant", u.FuelOf)
		return
	}
	u.fuel = b.fuel
	a.depend(u.eqs[0], b.fuel)
	a.roles.fuelDriven = append(a.roles.fuelDriven, u.in.mIdx())
}

// linkCooler gives the drain cooler's heat to its destination: the
// plant's first feed pump (the feed after it), or its feed tank. With no
// feed pump, the default destination falls back to the feed tank, else
// overboard, and every case that cools says so; a destination named but
// absent is a fault.
func (u *Consumer) linkCooler(p *Plant, a *assembly, fs *faults) {
	u.coolerTo, u.feedPump, u.coolerNote = coolerOverboard, nil, ""
	if u.out == nil {
		return // nothing returns: no drain cooler (a case may give return_T to a returning consumer only)
	}
	fp, tank := p.firstFeedPump(), p.firstFeedTank()
	switch u.DrainCooler {
	case CoolerToFeed:
		switch {
		case fp != nil:
			u.coolerTo, u.feedPump = coolerToFeed, fp
			fp.receive(a, u)
		case tank != nil:
			u.coolerTo = coolerToHotwell
			u.coolerNote = "its drain cooler's heat goes to the hotwell: the plant has no feed pump whose feed it could heat"
			tank.receive(a, u)
		default:
			u.coolerNote = "its drain cooler's heat goes overboard: the plant has no feed pump and no feed tank to take it"
		}
	case CoolerToHotwell:
		if tank == nil {
			fs.add(u.Pos, u.Name, "", "sends its drain cooler's heat to the hotwell, but the plant has no feed tank")
			return
		}
		u.coolerTo = coolerToHotwell
		tank.receive(a, u)
	}
}

// prepare computes the case's demand from the model or the consumer's own
// figures.
func (u *Consumer) prepare(p *Plant, c Conditions) error {
	u.caseDuty = Duty{W: u.Duty, SteamKgS: u.SteamFlow, PerFuelJ: u.DutyPerFuel, SteamPerFuel: u.SteamPerFuel}
	if m, ok := u.Model.(*TankHeating); ok && !m.state.on && m.Tank.Coil.Given() && m.CoilP == 0 {
		// The coil's steam is at the set pressure of what feeds the header.
		m.state.steamP, _ = p.SupplyPressure(u.Name)
	}
	if m, ok := u.Model.(*TankHeating); ok && m.state.on {
		if err := m.statePrepare(u, c); err != nil {
			return wrapErr(u, err)
		}
		if u.Off {
			return nil
		}
	}
	if u.Model == nil || u.Off {
		return nil
	}
	d, err := u.Model.Duty(c)
	if err != nil {
		return wrapErr(u, err)
	}
	for _, v := range [...]float64{d.W, d.SteamKgS, d.PerFuelJ, d.SteamPerFuel} {
		if !finite(v) || v < 0 {
			return compErr(u, "its model gives a duty of %g W; a duty must be zero or positive", d.W)
		}
	}
	if (d.PerFuelJ > 0 || d.SteamPerFuel > 0) && u.FuelOf == "" {
		return compErr(u, "its model gives a demand per kg of fuel, but no boiler drives it: give the boiler whose fuel it follows")
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
		checkRange(fs, u, "duty factor", u.Factor, factorKey.Min, factorKey.Max, "")
	}
	if u.ReturnT != 0 {
		checkRange(fs, u, "condensate return temperature", u.ReturnT, 274.15, 473.15, "K")
	}
	if u.Priority != 0 {
		checkKey(fs, u, "priority")
	}
	checkRange(fs, u, "steam-trap loss", u.TrapLoss, 0, 0.5, "")
	if u.DrainCooler < CoolerToFeed || u.DrainCooler > CoolerOverboard {
		fs.add(u.Pos, u.Name, "", "drain cooler destination %d is not feed, hotwell or overboard", u.DrainCooler)
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

func (u *Consumer) assemble(a *assembly, ports portLines) {
	u.in, u.out = ports.one("in"), ports.one("out")
	u.shed = offRole()
	u.eqs[0] = a.equation(u.Name+": duty", scaleQ, u.in.mIdx(), u.in.pIdx(), u.in.hIdx())
	u.eqs[1], u.eqs[2], u.eqs[3] = -1, -1, -1
	if u.out != nil {
		u.eqs[1] = a.equation(u.Name+": condensate return", 1, u.in.mIdx(), u.out.mIdx())
		u.eqs[2] = a.equation(u.Name+": condensate pressure", scaleP, u.in.pIdx(), u.out.pIdx())
		u.eqs[3] = a.equation(u.Name+": condensate temperature", scaleH, u.in.pIdx(), u.in.hIdx(), u.out.hIdx())
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

// The ways a consumer's demand is given in a case, in the order they take
// precedence.
const (
	demandOff          = iota // no steam
	demandWarming             // a boiler's standby loss while it does not fire
	demandSteamPerFuel        // steam per kg of the boiler's fuel
	demandSteam               // a steam flow
	demandDutyPerFuel         // heat per kg of the boiler's fuel
	demandDuty                // a heat duty
)

func (u *Consumer) demand() int {
	d := &u.caseDuty
	switch {
	case u.Off:
		return demandOff
	case u.warms != nil:
		return demandWarming
	case d.SteamPerFuel > 0 && u.fuel >= 0:
		return demandSteamPerFuel
	case d.SteamKgS > 0:
		return demandSteam
	case d.PerFuelJ > 0 && u.fuel >= 0:
		return demandDutyPerFuel
	}
	return demandDuty
}

// shedLink ties the consumer's demand to the shed level (priority.go).
func (u *Consumer) shedLink(a *assembly, idx int) {
	u.shed.idx = idx
	a.depend(u.eqs[0], idx)
}

// requested is the demand the case asks of the consumer, before any
// shedding: a duty (W) or, with steam true, a steam flow (kg/s); zero for
// a consumer that is off or follows a boiler's fuel.
func (u *Consumer) requested() (v float64, steam bool) {
	switch u.demand() {
	case demandSteam:
		return u.factor() * u.caseDuty.SteamKgS, true
	case demandDuty:
		return u.factor() * u.caseDuty.W, false
	}
	return 0, false
}

func (u *Consumer) shedPriority(x []float64) (float64, bool, bool, float64) {
	v, steam := u.requested()
	est := v
	if !steam {
		perKg := roughHeatPerKg
		if x != nil {
			if hc, err := hCondensate(x[u.in.pIdx()], u.SubCooling); err == nil && x[u.in.hIdx()]-hc > 1e4 {
				perKg = x[u.in.hIdx()] - hc
			}
		}
		est = v / perKg
	}
	est /= 1 - u.TrapLoss // the steam taken: a blowing trap passes some live
	return priorityOf(u.Priority), u.Priority != 0, v > 0, est
}

func (u *Consumer) setShed(r shedRole) { u.shed = r }

func (u *Consumer) residual(ev *eval, r []float64) error {
	p := ev.p(u.in)
	hc, err := u.mc.get2(p, u.SubCooling, hCondensate)
	if err != nil {
		return wrapErr(u, err)
	}
	m := ev.m(u.in)
	mc := (1 - u.TrapLoss) * m // the steam that condenses; the rest passes the trap
	f := u.factor()
	d := &u.caseDuty
	switch u.demand() {
	case demandOff:
		r[u.eqs[0]] = m * scaleQ
	case demandWarming:
		if ev.pl.firing(u.warms) {
			r[u.eqs[0]] = m * scaleQ
		} else {
			w, _ := u.warms.standbyW(ev)
			r[u.eqs[0]] = mc*(ev.h(u.in)-hc) - f*w
		}
	case demandSteamPerFuel:
		r[u.eqs[0]] = (mc - f*d.SteamPerFuel*ev.x[u.fuel]) * scaleQ
	case demandSteam:
		phi, _ := u.shed.frac(ev.x)
		r[u.eqs[0]] = (mc - f*d.SteamKgS*phi) * scaleQ
	case demandDutyPerFuel:
		r[u.eqs[0]] = mc*(ev.h(u.in)-hc) - f*d.PerFuelJ*ev.x[u.fuel]
	default:
		phi, _ := u.shed.frac(ev.x)
		r[u.eqs[0]] = mc*(ev.h(u.in)-hc) - f*d.W*phi
	}
	if u.out != nil {
		hx := u.hLeaving(ev.h(u.in), hc)
		hr, err := u.hReturn(p, hx)
		if err != nil {
			return wrapErr(u, err)
		}
		r[u.eqs[1]] = ev.m(u.out) - u.ReturnFraction*m
		r[u.eqs[2]] = ev.p(u.out) - p
		r[u.eqs[3]] = ev.h(u.out) - hr
	}
	return nil
}

// hLeaving is the enthalpy of what leaves the consumer towards its trap's
// outlet: the condensate at hc with the live steam that passes the trap,
// at the inlet's hIn, mixed.
func (u *Consumer) hLeaving(hIn, hc float64) float64 {
	return (1-u.TrapLoss)*hc + u.TrapLoss*hIn
}

func (u *Consumer) jacobian(ev *eval, j jac) error {
	p := ev.p(u.in)
	hc, err := u.mc.get2(p, u.SubCooling, hCondensate)
	if err != nil {
		return wrapErr(u, err)
	}
	dhc, err := dPropA(hCondensate, p, u.SubCooling, hc)
	if err != nil {
		return wrapErr(u, err)
	}
	m := ev.m(u.in)
	k := 1 - u.TrapLoss
	f := u.factor()
	d := &u.caseDuty
	e0 := u.eqs[0]
	_, dphi := u.shed.frac(ev.x)
	switch dm := u.demand(); {
	case dm == demandOff || (dm == demandWarming && ev.pl.firing(u.warms)):
		j.add(e0, u.in.mIdx(), scaleQ)
	case dm == demandSteam:
		j.add(e0, u.in.mIdx(), k*scaleQ)
		if dphi != 0 {
			j.add(e0, u.shed.idx, -f*d.SteamKgS*dphi*scaleQ)
		}
	case dm == demandWarming:
		_, dw := u.warms.standbyW(ev)
		j.add(e0, u.in.mIdx(), k*(ev.h(u.in)-hc))
		j.add(e0, u.in.hIdx(), k*m)
		j.add(e0, u.in.pIdx(), -k*m*dhc)
		j.add(e0, u.warms.feed.hIdx(), -f*dw)
	case dm == demandSteamPerFuel:
		j.add(e0, u.in.mIdx(), k*scaleQ)
		j.add(e0, u.fuel, -f*d.SteamPerFuel*scaleQ)
	default:
		j.add(e0, u.in.mIdx(), k*(ev.h(u.in)-hc))
		j.add(e0, u.in.hIdx(), k*m)
		j.add(e0, u.in.pIdx(), -k*m*dhc)
		if dm == demandDutyPerFuel {
			j.add(e0, u.fuel, -f*d.PerFuelJ)
		} else if dphi != 0 {
			j.add(e0, u.shed.idx, -f*d.W*dphi)
		}
	}
	if u.out != nil {
		j.add(u.eqs[1], u.out.mIdx(), 1)
		j.add(u.eqs[1], u.in.mIdx(), -u.ReturnFraction)
		j.add(u.eqs[2], u.out.pIdx(), 1)
		j.add(u.eqs[2], u.in.pIdx(), -1)
		j.add(u.eqs[3], u.out.hIdx(), 1)
		if u.ReturnT == 0 {
			j.add(u.eqs[3], u.in.pIdx(), -k*dhc)
			j.add(u.eqs[3], u.in.hIdx(), -u.TrapLoss)
			return nil
		}
		hr, err := u.mr.get2(p, u.ReturnT, hPT)
		if err != nil {
			return wrapErr(u, err)
		}
		dhr, err := dPropA(hPT, p, u.ReturnT, hr)
		if err != nil {
			return wrapErr(u, err)
		}
		j.add(u.eqs[3], u.in.pIdx(), -dhr)
	}
	return nil
}

func (u *Consumer) guess(x []float64) {
	if u.out != nil {
		p := x[u.in.pIdx()]
		x[u.out.pIdx()] = p
		if h, err := hCondensate(p, u.SubCooling); err == nil {
			if hr, err := u.hReturn(p, u.hLeaving(x[u.in.hIdx()], h)); err == nil {
				x[u.out.hIdx()] = hr
			}
		}
	}
}

// transferred is the heat the drain cooler gives to the feed or the
// hotwell: Q = RF·ṁ·(h_leaving − h_r), with its derivatives by the inlet's
// flow, pressure and enthalpy (a transfer, transfer.go).
func (u *Consumer) transferred(ev *eval, partials bool) (m, e float64, d [3]partial, err error) {
	d = [3]partial{{col: -1}, {col: -1}, {col: -1}}
	if u.ReturnT == 0 {
		return 0, 0, d, nil // no drain cooler in this case
	}
	p := ev.p(u.in)
	hc, err := u.mc.get2(p, u.SubCooling, hCondensate)
	if err != nil {
		return 0, 0, d, wrapErr(u, err)
	}
	hr, err := u.mr.get2(p, u.ReturnT, hPT)
	if err != nil {
		return 0, 0, d, wrapErr(u, err)
	}
	mi, hIn := ev.m(u.in), ev.h(u.in)
	rf, k := u.ReturnFraction, 1-u.TrapLoss
	hx := u.hLeaving(hIn, hc)
	e = rf * mi * (hx - hr)
	if !partials {
		return 0, e, d, nil
	}
	dhc, err := dPropA(hCondensate, p, u.SubCooling, hc)
	if err != nil {
		return 0, 0, d, wrapErr(u, err)
	}
	dhr, err := dPropA(hPT, p, u.ReturnT, hr)
	if err != nil {
		return 0, 0, d, wrapErr(u, err)
	}
	d[0] = partial{col: u.in.mIdx(), de: rf * (hx - hr)}
	d[1] = partial{col: u.in.pIdx(), de: rf * mi * (k*dhc - dhr)}
	d[2] = partial{col: u.in.hIdx(), de: rf * mi * u.TrapLoss}
	return 0, e, d, nil
}

// coolerInletT is the temperature of the condensate entering the drain
// cooler, and whether it cools in this case.
func (u *Consumer) coolerInletT(ev *eval) (float64, bool) {
	if u.out == nil || u.ReturnT == 0 || ev.m(u.in) <= FlowFloor {
		return 0, false
	}
	p := ev.p(u.in)
	hc, err := u.mc.get2(p, u.SubCooling, hCondensate)
	if err != nil {
		return 0, false
	}
	t, err := u.mx.get2(p, u.hLeaving(ev.h(u.in), hc), tPH)
	return t, err == nil
}

func (u *Consumer) transferDeps() []int { return []int{u.in.mIdx(), u.in.pIdx(), u.in.hIdx()} }

func (u *Consumer) report(ev *eval, cr *CaseResult) error {
	p := ev.p(u.in)
	hc, err := u.mc.get2(p, u.SubCooling, hCondensate)
	if err != nil {
		return wrapErr(u, err)
	}
	m := ev.m(u.in)
	hIn := ev.h(u.in)
	duty := (1 - u.TrapLoss) * m * (hIn - hc)
	hx := u.hLeaving(hIn, hc)
	ret := u.returnFraction() * m
	lost := m - ret
	cooler := 0.0
	if u.out != nil {
		cooler = ret * (hx - ev.h(u.out))
	}
	inputs := u.caseDuty.Inputs
	if u.warms != nil && !u.Off {
		w, _ := u.warms.standbyW(ev)
		fire := 0.0
		if ev.pl.firing(u.warms) {
			fire = 1
		}
		inputs = map[string]float64{"standby_loss_W": w, "boiler_firing": fire}
	}
	to := ""
	if u.out != nil && u.ReturnT != 0 {
		to = u.coolerTo
	}
	res := ConsumerResult{
		Name: u.Name, Kind: u.Kind(), DutyW: duty, SteamKgS: m, ReturnKgS: ret, LostKgS: lost, DrainCoolerW: cooler,
		DrainCoolerTo: to, TrapLossKgS: u.TrapLoss * m, Inputs: inputs,
		Priority: priorityOf(u.Priority), RequestedW: duty,
	}
	if req, steam := u.requested(); req > 0 {
		// req is the steam that condenses, or its heat; a blowing trap
		// passes TrapLoss of the steam taken besides.
		res.Reducible = true
		phi, _ := u.shed.frac(ev.x)
		perKg := hIn - hc // heat of a kg of steam that condenses
		if steam {
			res.RequestedW = req * perKg
			res.ShedW = req * (1 - phi) * perKg
			res.ShedKgS = req * (1 - phi) / (1 - u.TrapLoss)
		} else {
			res.RequestedW = req
			res.ShedW = req * (1 - phi)
			if perKg > 0 {
				res.ShedKgS = res.ShedW / perKg / (1 - u.TrapLoss)
			}
		}
	}
	if tm, ok := u.Model.(*TankHeating); ok && res.ShedW > 0 {
		cool, err := tm.shedCooling(ev.cond, duty)
		if err != nil {
			cr.warn("%s %q: the cargo's cooling with its heating reduced is not known: %v", u.Kind(), u.Name, err)
		} else {
			res.Cooling = cool
		}
	}
	cr.Consumers = append(cr.Consumers, res)
	for _, w := range u.caseDuty.Warnings {
		cr.warn("%s %q: %s", u.Kind(), u.Name, w)
	}
	// The drain cooler's warnings need condensate through it: a consumer
	// without flow (a standby boiler's burner heater) has a cooler duty
	// of the solver's noise, of either sign.
	cools := cooler > 0 && m > FlowFloor
	if cools && u.coolerNote != "" {
		cr.warn("%s %q: %s", u.Kind(), u.Name, u.coolerNote)
	}
	if cools && u.coolerTo == coolerToFeed && u.feedPump != nil {
		// A feed-water heater on the return cannot cool the condensate
		// below the feed it heats.
		tf, err := u.feedPump.inletT(ev)
		if err == nil && u.ReturnT < tf+1e-9 {
			cr.warn("%s %q: its drain cooler is to cool the condensate to %.1f °C, but the feed it heats comes at %.1f °C; give a higher return_T, or send the heat to the hotwell or overboard",
				u.Kind(), u.Name, u.ReturnT-273.15, tf-273.15)
		}
	}
	if m, ok := u.Model.(*TankHeating); ok {
		if tr, ok := m.row(u.Name); ok {
			cr.Tanks = append(cr.Tanks, tr)
		}
	}
	if u.coolerTo == coolerOverboard || u.out == nil || u.ReturnT == 0 {
		cr.boundary.heatOut += cooler
	}
	cr.boundary.heatOut += duty
	cr.boundary.massOut += lost
	cr.boundary.energyOut += lost * hx
	cr.CondensateLostKgS += lost
	cr.TrapLossKgS += u.TrapLoss * m
	return nil
}

func (u *Consumer) outline(cr *CaseResult) {
	cr.Consumers = append(cr.Consumers, ConsumerResult{Name: u.Name, Kind: u.Kind()})
}

func (u *Consumer) clone() Component {
	c := *u
	if u.Model != nil {
		c.Model = u.Model.Clone()
	}
	c.in, c.out = nil, nil
	c.caseDuty = Duty{}
	c.warms = nil
	c.feedPump = nil
	return &c
}
