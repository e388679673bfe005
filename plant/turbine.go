package plant

import (
	"fmt"

	"steamcase/plant/loads"
	"steamcase/plant/units"
	"steamcase/plant/water"
)

// Turbine is a steam turbine driving a cargo pump or a generator: it gives
// a set shaft power from steam expanding from its inlet state to its
// exhaust pressure. Its steam is given in one of three ways:
//
//   - by an isentropic and a mechanical (and gear) efficiency: the exhaust
//     enthalpy is h_in − η_is·Δh_s and the steam flow follows from the
//     power;
//   - by its steam rate, kg per kWh of shaft power (SteamRate, at the
//     fractions RateLoad of RatedPower, interpolated linearly; one figure
//     holds at every load): the steam flow is rate × power and the exhaust
//     enthalpy follows from the power, h_in − P/(ṁ·η_mech);
//   - by the maker's table of steam flow against shaft power (TablePower,
//     TableFlow, interpolated linearly, the Willans line between points).
//
// The steam rate and the maker's table are taken as they are given, at the
// case's inlet and exhaust states: they are not corrected for a header
// pressure or a vacuum that differ from the maker's rating. Outside the
// given loads the end figure's steam rate holds, with a warning; a steam
// rate below the isentropic limit at the case's states is an error.
//
// Its exhaust goes on to a condenser or a back-pressure line; with
// ExhaustP zero, its condenser sets the vacuum from the sea (Condenser
// Approach or UA). A cargo pump's turbine takes its power from the pump
// (Pump), for each case.
type Turbine struct {
	Base
	Power float64 // shaft power delivered, W (with Pump nil)
	// ExhaustP is the exhaust pressure, Pa absolute; zero means the
	// vacuum its sea-cooled condenser sets.
	ExhaustP float64
	EtaIs    float64 // isentropic efficiency, 0..1 (the isentropic form)
	EtaMech  float64 // mechanical and gear efficiency, 0..1; zero means 1
	Off      bool    // not running this case
	// RatedPower is the shaft power the steam rate refers to, W.
	RatedPower float64
	// SteamRate are steam rates, kg/J, at the fractions RateLoad of
	// RatedPower (increasing); one figure with RateLoad nil holds at every
	// load.
	SteamRate, RateLoad []float64
	// TablePower and TableFlow are the maker's table: shaft power, W
	// (increasing), and steam flow, kg/s.
	TablePower, TableFlow []float64
	// Pump, if set, is the cargo pump the turbine drives: its shaft power
	// (ρ·g·Q·H/η, plant/loads) is the turbine's power in each case.
	Pump *loads.CargoPump
	// Priority ranks the turbine when the boilers at their limit cannot
	// carry the demand (priority.go); zero means not given (essential).
	// A reduced cargo pump delivers its flow in proportion to its power
	// (ρ·g·Q·H/η at the same head and efficiency).
	Priority float64

	shed    shedRole
	in, out *Line
	eqs     [4]int
	ms, mhs memo
	power   float64 // the case's shaft power
	mSet    float64 // the case's steam flow by the steam rate or the maker's table, kg/s
	rateMsg string  // a warning of the steam rate's range for the case
	// The Jacobian's derivatives of the isentropic enthalpy, memoised by
	// (p_in, h_in, p_out): a turbine that is off keeps its state.
	jkey, jval [3]float64
	jset       bool
}

// NewTurbine returns a turbine of a set power.
func NewTurbine() *Turbine { return &Turbine{} }

// NewCargoPumpTurbine returns a turbine driving a cargo pump.
func NewCargoPumpTurbine() *Turbine { return &Turbine{Pump: &loads.CargoPump{}} }

func turbineKey(k Key, f func(*Turbine) *float64) Key { return num(k, self[*Turbine], f) }

// pumpOf is the owner function of a cargo pump's fields.
func pumpOf(c Component) (*loads.CargoPump, bool) {
	t, ok := c.(*Turbine)
	if !ok || t.Pump == nil {
		return nil, false
	}
	return t.Pump, true
}

var (
	turbineCommonKeys = []Key{
		turbineKey(Key{Name: "exhaust", Label: "exhaust pressure", Dim: units.Pressure, Example: "0.2 bar(a)",
			Doc: "exhaust pressure", DefaultNote: "the vacuum its condenser sets from the sea (condenser approach, or ua with sea_flow)",
			Min: 1e3, Max: 5e7, Source: SourceDerived},
			func(u *Turbine) *float64 { return &u.ExhaustP }),
		turbineKey(Key{Name: "eta_is", Label: "isentropic efficiency", Dim: units.Fraction, Example: "65 %",
			Doc: "isentropic efficiency of the expansion (or steam_rate, or steam_table)", DefaultNote: "give eta_is, steam_rate or steam_table",
			Min: 0.05, Max: 1, Source: SourceRule},
			func(u *Turbine) *float64 { return &u.EtaIs }),
		{Name: "steam_rate", Label: "steam rate", Kind: KeyTable, Example: `{ {"50 %", "10.2 kg/kWh"}, {"100 %", "8.5 kg/kWh"} }`,
			Doc: "steam per kWh of shaft power: one figure (\"8.5 kg/kWh\") or {load, rate} pairs, load a fraction of rated_power (with rated_power)"},
		turbineKey(Key{Name: "rated_power", Label: "rated power", Dim: units.Power, Example: "1.3 MW",
			Doc: "the shaft power the steam rate refers to", Min: 1, Max: 1e9},
			func(u *Turbine) *float64 { return &u.RatedPower }),
		{Name: "steam_table", Label: "maker's steam table", Kind: KeyTable, Example: `{ {"0.5 MW", "5.6 t/h"}, {"1.3 MW", "11 t/h"} }`,
			Doc: "the maker's {shaft power, steam flow} pairs, power increasing (instead of eta_is or steam_rate)"},
		turbineKey(Key{Name: "eta_mech", Label: "mechanical efficiency", Dim: units.Fraction, Example: "95 %",
			Doc: "mechanical and gear efficiency", Default: 1, HasDefault: true, Min: 0.05, Max: 1, Source: SourceLeftOut},
			func(u *Turbine) *float64 { return &u.EtaMech }),
		flag(Key{Name: "off", Label: "off", Example: "true", Doc: "not running", Default: 0, HasDefault: true, Case: true, Source: SourceLeftOut},
			self[*Turbine], func(u *Turbine) *bool { return &u.Off }),
		priorityKey(self[*Turbine], func(u *Turbine) *float64 { return &u.Priority }),
	}
	turbineKeys = append([]Key{
		turbineKey(Key{Name: "power", Label: "shaft power", Dim: units.Power, Example: "1.2 MW",
			Doc: "shaft power delivered", Required: true, Min: 0, Max: 1e9, Case: true},
			func(u *Turbine) *float64 { return &u.Power }),
	}, turbineCommonKeys...)
	cargoPumpKeys = append([]Key{
		num(Key{Name: "flow", Label: "cargo flow", Dim: units.VolumeFlow, Example: "2000 m3/h",
			Doc: "the pump's volume flow", Required: true, Min: 0, Max: 100, Case: true},
			pumpOf, func(p *loads.CargoPump) *float64 { return &p.Flow }),
		num(Key{Name: "head", Label: "head", Dim: units.Length, Example: "140 m",
			Doc: "the pump's total head", Required: true, Min: 0, Max: 1e4, Case: true},
			pumpOf, func(p *loads.CargoPump) *float64 { return &p.Head }),
		num(Key{Name: "density", Label: "cargo density", Dim: units.Density, Example: "800 kg/m3",
			Doc: "density of the cargo pumped", Required: true, Min: 300, Max: 2000, Case: true},
			pumpOf, func(p *loads.CargoPump) *float64 { return &p.Density }),
		num(Key{Name: "efficiency", Label: "pump efficiency", Dim: units.Fraction, Example: "78 %",
			Doc: "the pump's efficiency", Required: true, Min: 0.05, Max: 1},
			pumpOf, func(p *loads.CargoPump) *float64 { return &p.Efficiency }),
	}, turbineCommonKeys...)
)

// Keys lists the turbine's keys: a cargo pump's, or a set power's.
func (u *Turbine) Keys() []Key {
	if u.Pump != nil {
		return cargoPumpKeys
	}
	return turbineKeys
}

// Kind returns "steam turbine".
func (u *Turbine) Kind() string { return "steam turbine" }

// Ports: steam in, exhaust out.
func (u *Turbine) Ports() []PortSpec {
	return []PortSpec{{Name: "in", Dir: In, Medium: WaterSteam}, {Name: "out", Dir: Out, Medium: WaterSteam}}
}

// The forms of a turbine's steam.
const (
	turbineIsentropic = iota
	turbineSteamRate
	turbineTable
)

func (u *Turbine) form() int {
	switch {
	case len(u.SteamRate) > 0:
		return turbineSteamRate
	case len(u.TablePower) > 0:
		return turbineTable
	}
	return turbineIsentropic
}

// Steam rates accepted: 0.5 to 200 kg/kWh, beyond the 5-25 kg/kWh of
// cargo-pump and generator turbines either way (common practice, no
// source).
const (
	minSteamRate = 0.5 / 3.6e6
	maxSteamRate = 200 / 3.6e6
)

func (u *Turbine) check(fs *faults) {
	if u.Power < 0 || !finite(u.Power) {
		fs.add(u.Pos, u.Name, "", "shaft power must be zero or positive; got %g W", u.Power)
	}
	checkKey(fs, u, "exhaust")
	checkKey(fs, u, "eta_mech")
	if u.Priority != 0 {
		checkKey(fs, u, "priority")
	}
	n := 0
	for _, given := range [...]bool{u.EtaIs != 0, len(u.SteamRate) > 0, len(u.TablePower) > 0} {
		if given {
			n++
		}
	}
	if n != 1 {
		fs.add(u.Pos, u.Name, "", "give its steam one way: eta_is, steam_rate (with rated_power) or steam_table; got %d", n)
	}
	switch u.form() {
	case turbineIsentropic:
		if u.EtaIs != 0 {
			checkKey(fs, u, "eta_is")
		}
	case turbineSteamRate:
		if !(u.RatedPower > 0) {
			fs.add(u.Pos, u.Name, "", "a steam rate needs the rated power it is given at: give rated_power, such as rated_power = \"1.3 MW\"")
		} else {
			checkKey(fs, u, "rated_power")
		}
		if len(u.RateLoad) != 0 && len(u.RateLoad) != len(u.SteamRate) {
			fs.add(u.Pos, u.Name, "", "steam rate table has %d loads and %d rates", len(u.RateLoad), len(u.SteamRate))
		}
		for i, r := range u.SteamRate {
			checkRange(fs, u, "steam rate", r*3.6e6, minSteamRate*3.6e6, maxSteamRate*3.6e6, "kg/kWh")
			if i < len(u.RateLoad) {
				checkRange(fs, u, "steam rate load", u.RateLoad[i], 1e-3, 1.5, "(fraction of rated power)")
				if i > 0 && u.RateLoad[i] <= u.RateLoad[i-1] {
					fs.add(u.Pos, u.Name, "", "steam rate loads must increase; %g follows %g", u.RateLoad[i], u.RateLoad[i-1])
				}
			}
		}
	case turbineTable:
		if len(u.TableFlow) != len(u.TablePower) {
			fs.add(u.Pos, u.Name, "", "steam table has %d powers and %d flows", len(u.TablePower), len(u.TableFlow))
		}
		for i, pw := range u.TablePower {
			checkRange(fs, u, "steam table power", pw, 1, 1e9, "W")
			if i > 0 && pw <= u.TablePower[i-1] {
				fs.add(u.Pos, u.Name, "", "steam table powers must increase; %g W follows %g W", pw, u.TablePower[i-1])
			}
			if i < len(u.TableFlow) {
				checkRange(fs, u, "steam table flow", u.TableFlow[i], 1e-6, 1e3, "kg/s")
				if u.TableFlow[i] > 0 && pw > 0 {
					checkRange(fs, u, "steam table steam rate", u.TableFlow[i]/pw*3.6e6, minSteamRate*3.6e6, maxSteamRate*3.6e6, "kg/kWh")
				}
			}
		}
	}
}

// steamFlow is the case's steam flow of the steam-rate and maker's-table
// forms at shaft power pw, with a warning when pw lies outside the given
// loads (the end point's steam rate then holds) or when one steam rate is
// used far below the power it is given at.
func (u *Turbine) steamFlow(pw float64) (float64, string) {
	if pw <= 0 {
		return 0, ""
	}
	switch u.form() {
	case turbineSteamRate:
		load := pw / u.RatedPower
		if len(u.RateLoad) == 0 {
			msg := ""
			switch {
			case load > 1+1e-9:
				msg = fmt.Sprintf("shaft power %.0f kW is above the rated %.0f kW its steam rate is given at", pw/1e3, u.RatedPower/1e3)
			case load < 0.9:
				msg = fmt.Sprintf("its one steam rate, given at the rated %.0f kW, is used at %.0f %% of it; a turbine's steam rate rises at part load: give the part-load curve (steam_rate pairs)", u.RatedPower/1e3, 100*load)
			}
			return u.SteamRate[0] * pw, msg
		}
		rate, msg := interpolate(u.RateLoad, u.SteamRate, load, "steam rate table")
		return rate * pw, msg
	case turbineTable:
		n := len(u.TablePower)
		switch {
		case pw < u.TablePower[0]:
			return u.TableFlow[0] / u.TablePower[0] * pw, fmt.Sprintf("shaft power %.0f kW is below the steam table's lowest %.0f kW; its steam rate there is used", pw/1e3, u.TablePower[0]/1e3)
		case pw > u.TablePower[n-1]:
			return u.TableFlow[n-1] / u.TablePower[n-1] * pw, fmt.Sprintf("shaft power %.0f kW is above the steam table's highest %.0f kW; its steam rate there is used", pw/1e3, u.TablePower[n-1]/1e3)
		}
		m, _ := interpolate(u.TablePower, u.TableFlow, pw, "steam table")
		return m, ""
	}
	return 0, ""
}

// validate computes a cargo pump's power at declaration.
func (u *Turbine) validate() error {
	if u.Pump == nil {
		return nil
	}
	_, err := u.Pump.Power()
	return err
}

// prepare takes the case's shaft power: the cargo pump's, or the set one.
func (u *Turbine) prepare(_ *Plant, _ Conditions) error {
	u.power = u.Power
	if u.Pump != nil {
		res, err := u.Pump.Power()
		if err != nil {
			return wrapErr(u, err)
		}
		u.power = res.Shaft
	}
	if u.Off {
		u.power = 0
	}
	u.mSet, u.rateMsg = u.steamFlow(u.power)
	return nil
}

func (u *Turbine) etaMech() float64 {
	if u.EtaMech > 0 {
		return u.EtaMech
	}
	return 1
}

func (u *Turbine) assemble(a *assembly, ports portLines) {
	u.in, u.out = ports.one("in"), ports.one("out")
	u.shed = offRole()
	u.eqs[0] = -1
	if u.ExhaustP > 0 {
		u.eqs[0] = a.equation(u.Name+": exhaust pressure", scaleP, u.out.pIdx())
	}
	if u.form() == turbineIsentropic {
		u.eqs[1] = a.equation(u.Name+": expansion", scaleH, u.in.pIdx(), u.in.hIdx(), u.out.pIdx(), u.out.hIdx())
		u.eqs[2] = a.equation(u.Name+": shaft power", scaleQ, u.in.mIdx(), u.in.hIdx(), u.out.hIdx())
	} else {
		u.eqs[1] = a.equation(u.Name+": steam flow by its steam rate", 1, u.in.mIdx())
		u.eqs[2] = a.equation(u.Name+": exhaust enthalpy from the shaft power", scaleH, u.in.hIdx(), u.out.hIdx())
	}
	u.eqs[3] = a.equation(u.Name+": mass balance", 1, u.in.mIdx(), u.out.mIdx())
}

// shedLink ties the turbine's power to the shed level (priority.go).
// A steam-rate or table turbine that is shed takes its steam in
// proportion (its steam rate at the full power held: a simplification,
// the part-load rate would be a little higher).
func (u *Turbine) shedLink(a *assembly, idx int) {
	u.shed.idx = idx
	if u.form() == turbineIsentropic {
		a.depend(u.eqs[2], idx)
	} else {
		a.depend(u.eqs[1], idx)
	}
}

func (u *Turbine) shedPriority(x []float64) (float64, bool, bool, float64) {
	w := roughWorkPerKg
	if x != nil {
		if d := (x[u.in.hIdx()] - x[u.out.hIdx()]) * u.etaMech(); d > 1e4 {
			w = d
		}
	}
	est := u.power / w
	if u.form() != turbineIsentropic {
		est = u.mSet
	}
	return priorityOf(u.Priority), u.Priority != 0, !u.Off && u.power > 0, est
}

func (u *Turbine) setShed(r shedRole) { u.shed = r }

// CargoRate is the volume flow of cargo the turbine's pump is asked for in
// the case, m³/s (zero for a turbine that drives no cargo pump or is off).
func (u *Turbine) CargoRate() float64 {
	if u.Pump == nil || u.Off {
		return 0
	}
	return u.Pump.Flow
}

// link checks that a turbine without an exhaust pressure exhausts into a
// condenser that sets its vacuum from the sea.
func (u *Turbine) link(p *Plant, _ *assembly, fs *faults) {
	if u.ExhaustP > 0 {
		return
	}
	if c, ok := p.byName[u.out.To].(*Condenser); !ok || !c.seaCooled() {
		fs.add(u.Pos, u.Name, u.out.Name, "has no exhaust pressure: give exhaust, or exhaust into a condenser whose vacuum follows the sea (approach, or ua with sea_flow)")
	}
}

// dhOut is the enthalpy drop of the steam-rate forms, P/(ṁ·η_mech), zero
// with no steam.
func (u *Turbine) dhOut() float64 {
	if u.mSet <= 0 {
		return 0
	}
	return u.power / (u.mSet * u.etaMech())
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
	if u.eqs[0] >= 0 {
		r[u.eqs[0]] = ev.p(u.out) - u.ExhaustP
	}
	r[u.eqs[3]] = ev.m(u.out) - ev.m(u.in)
	if u.form() != turbineIsentropic {
		phi, _ := u.shed.frac(ev.x)
		r[u.eqs[1]] = ev.m(u.in) - u.mSet*phi
		r[u.eqs[2]] = ev.h(u.out) - (ev.h(u.in) - u.dhOut())
		return nil
	}
	hOut, _, err := u.expansion(ev.p(u.in), ev.h(u.in), ev.p(u.out))
	if err != nil {
		return wrapErr(u, err)
	}
	r[u.eqs[1]] = ev.h(u.out) - hOut
	phi, _ := u.shed.frac(ev.x)
	r[u.eqs[2]] = ev.m(u.in)*(ev.h(u.in)-ev.h(u.out))*u.etaMech() - u.power*phi
	return nil
}

func (u *Turbine) jacobian(ev *eval, j jac) error {
	j.add(u.eqs[0], u.out.pIdx(), 1)
	if u.form() != turbineIsentropic {
		j.add(u.eqs[1], u.in.mIdx(), 1)
		if _, dphi := u.shed.frac(ev.x); dphi != 0 {
			j.add(u.eqs[1], u.shed.idx, -u.mSet*dphi)
		}
		j.add(u.eqs[2], u.out.hIdx(), 1)
		j.add(u.eqs[2], u.in.hIdx(), -1)
		j.add(u.eqs[3], u.out.mIdx(), 1)
		j.add(u.eqs[3], u.in.mIdx(), -1)
		return nil
	}
	pIn, hIn, pOut := ev.p(u.in), ev.h(u.in), ev.p(u.out)
	key := [3]float64{pIn, hIn, pOut}
	if !u.jset || u.jkey != key {
		s, err := u.ms.get2(pIn, hIn, water.SPH)
		if err != nil {
			return wrapErr(u, err)
		}
		hs, err := u.mhs.get2(pOut, s, water.HPS)
		if err != nil {
			return wrapErr(u, err)
		}
		// h_s = h(p_out, s(p_in, h_in)), by differences of the two
		// property functions the residual evaluates: the Gibbs relation
		// dh = T·ds + v·dp holds for them only to about 1e-6, IAPWS-IF97's
		// saturation line being consistent with its regions to that order.
		dsdp, dsdh, err := dProp2(water.SPH, pIn, hIn, s)
		if err != nil {
			return wrapErr(u, err)
		}
		dhdpo, dhds, err := dProp2(water.HPS, pOut, s, hs)
		if err != nil {
			return wrapErr(u, err)
		}
		u.jval = [3]float64{dhds * dsdh, dhds * dsdp, dhdpo}
		u.jkey, u.jset = key, true
	}
	dhsdh, dhsdp, dhsdpo := u.jval[0], u.jval[1], u.jval[2]
	em := u.etaMech()
	m := ev.m(u.in)
	j.add(u.eqs[1], u.out.hIdx(), 1)
	j.add(u.eqs[1], u.in.hIdx(), -1+u.EtaIs*(1-dhsdh))
	j.add(u.eqs[1], u.in.pIdx(), -u.EtaIs*dhsdp)
	j.add(u.eqs[1], u.out.pIdx(), -u.EtaIs*dhsdpo)
	j.add(u.eqs[2], u.in.mIdx(), (hIn-ev.h(u.out))*em)
	j.add(u.eqs[2], u.in.hIdx(), m*em)
	j.add(u.eqs[2], u.out.hIdx(), -m*em)
	if _, dphi := u.shed.frac(ev.x); dphi != 0 {
		j.add(u.eqs[2], u.shed.idx, -u.power*dphi)
	}
	j.add(u.eqs[3], u.out.mIdx(), 1)
	j.add(u.eqs[3], u.in.mIdx(), -1)
	return nil
}

// guessVacuum is the exhaust pressure a turbine's starting point takes
// when its condenser sets the vacuum: 7 kPa(a), saturation at 39 °C.
const guessVacuum = 7e3

func (u *Turbine) guess(x []float64) {
	pOut := u.ExhaustP
	if pOut == 0 {
		pOut = guessVacuum
	}
	x[u.out.pIdx()] = pOut
	if u.form() != turbineIsentropic {
		x[u.out.hIdx()] = x[u.in.hIdx()] - u.dhOut()
		return
	}
	if h, _, err := u.expansion(x[u.in.pIdx()], x[u.in.hIdx()], pOut); err == nil {
		x[u.out.hIdx()] = h
	}
}

func (u *Turbine) report(ev *eval, cr *CaseResult) error {
	_, dhs, err := u.expansion(ev.p(u.in), ev.h(u.in), ev.p(u.out))
	if err != nil {
		return wrapErr(u, err)
	}
	m := ev.m(u.in)
	drop := ev.h(u.in) - ev.h(u.out)
	shaft := m * drop * u.etaMech()
	rate, etaIs := 0.0, 0.0
	// An idle turbine's flow is solver noise (below FlowFloor): its steam
	// rate and efficiency, ratios of two noise figures, are not reported.
	if shaft > 0 && m > FlowFloor {
		rate = m / shaft * 3.6e6 // kg/kWh
	}
	if dhs > 0 && m > FlowFloor {
		etaIs = drop / dhs
	}
	if u.form() != turbineIsentropic && etaIs > 1+1e-9 {
		return compErr(u, "its steam rate %.2f kg/kWh at %.0f kW is below the isentropic limit %.2f kg/kWh from %.2f bar(a) to %.3f bar(a) (η_mech %.2f): no turbine uses that little steam",
			rate, shaft/1e3, 3.6e6/(dhs*u.etaMech()), ev.p(u.in)/1e5, ev.p(u.out)/1e5, u.etaMech())
	}
	if u.rateMsg != "" {
		cr.warn("%s %q: %s", u.Kind(), u.Name, u.rateMsg)
	}
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind(), Figures: Figures{
		{"shaft_W", shaft},
		{"steam_kg_s", m},
		{"isentropic_drop_J_kg", dhs},
		{"steam_rate_kg_per_kWh", rate},
		{"eta_is", etaIs},
		{"exhaust_p_Pa", ev.p(u.out)},
	}})
	res := ConsumerResult{Name: u.Name, Kind: u.Kind(), DutyW: shaft, SteamKgS: m, ReturnKgS: m,
		Priority: priorityOf(u.Priority), RequestedW: shaft}
	if !u.Off && u.power > 0 {
		phi, _ := u.shed.frac(ev.x)
		res.Reducible, res.RequestedW = true, u.power
		res.ShedW = u.power * (1 - phi)
		if w := (ev.h(u.in) - ev.h(u.out)) * u.etaMech(); w > 0 {
			res.ShedKgS = res.ShedW / w
		}
		res.CargoRate = u.CargoRate() * phi
	}
	cr.Consumers = append(cr.Consumers, res)
	cr.boundary.workOut += m * (ev.h(u.in) - ev.h(u.out))
	return nil
}

func (u *Turbine) outline(cr *CaseResult) {
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind()})
	cr.Consumers = append(cr.Consumers, ConsumerResult{Name: u.Name, Kind: u.Kind()})
}

func (u *Turbine) clone() Component {
	c := *u
	c.SteamRate = append([]float64(nil), u.SteamRate...)
	c.RateLoad = append([]float64(nil), u.RateLoad...)
	c.TablePower = append([]float64(nil), u.TablePower...)
	c.TableFlow = append([]float64(nil), u.TableFlow...)
	if u.Pump != nil {
		p := *u.Pump
		c.Pump = &p
	}
	c.in, c.out = nil, nil
	return &c
}
