package plant

import (
	"steamcase/plant/loads"
	"steamcase/plant/units"
	"steamcase/plant/water"
)

// Turbine is a steam turbine driving a cargo pump or a generator: it gives
// a set shaft power from steam expanding from its inlet state to its
// exhaust pressure, with an isentropic and a mechanical (and gear)
// efficiency. Its exhaust goes on to a condenser or a back-pressure line.
// A cargo pump's turbine takes its power from the pump (Pump), for each
// case.
type Turbine struct {
	Base
	Power    float64 // shaft power delivered, W (with Pump nil)
	ExhaustP float64 // exhaust pressure, Pa absolute
	EtaIs    float64 // isentropic efficiency, 0..1
	EtaMech  float64 // mechanical and gear efficiency, 0..1; zero means 1
	Off      bool    // not running this case
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
			Doc: "exhaust pressure", Required: true, Min: 1e3, Max: 5e7},
			func(u *Turbine) *float64 { return &u.ExhaustP }),
		turbineKey(Key{Name: "eta_is", Label: "isentropic efficiency", Dim: units.Fraction, Example: "65 %",
			Doc: "isentropic efficiency of the expansion", Required: true, Min: 0.05, Max: 1},
			func(u *Turbine) *float64 { return &u.EtaIs }),
		turbineKey(Key{Name: "eta_mech", Label: "mechanical efficiency", Dim: units.Fraction, Example: "95 %",
			Doc: "mechanical and gear efficiency", Default: 1, HasDefault: true, Min: 0.05, Max: 1},
			func(u *Turbine) *float64 { return &u.EtaMech }),
		flag(Key{Name: "off", Label: "off", Example: "true", Doc: "not running", Default: 0, HasDefault: true, Case: true},
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

func (u *Turbine) check(fs *faults) {
	if u.Power < 0 || !finite(u.Power) {
		fs.add(u.Pos, u.Name, "", "shaft power must be zero or positive; got %g W", u.Power)
	}
	checkKey(fs, u, "exhaust")
	checkKey(fs, u, "eta_is")
	checkKey(fs, u, "eta_mech")
	if u.Priority != 0 {
		checkKey(fs, u, "priority")
	}
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
	u.eqs[0] = a.equation(u.Name+": exhaust pressure", scaleP, u.out.pIdx())
	u.eqs[1] = a.equation(u.Name+": expansion", scaleH, u.in.pIdx(), u.in.hIdx(), u.out.pIdx(), u.out.hIdx())
	u.eqs[2] = a.equation(u.Name+": shaft power", scaleQ, u.in.mIdx(), u.in.hIdx(), u.out.hIdx())
	u.eqs[3] = a.equation(u.Name+": mass balance", 1, u.in.mIdx(), u.out.mIdx())
}

// shedLink ties the turbine's power to the shed level (priority.go).
func (u *Turbine) shedLink(a *assembly, idx int) {
	u.shed.idx = idx
	a.depend(u.eqs[2], idx)
}

func (u *Turbine) shedPriority(x []float64) (float64, bool, bool, float64) {
	w := roughWorkPerKg
	if x != nil {
		if d := (x[u.in.hIdx()] - x[u.out.hIdx()]) * u.etaMech(); d > 1e4 {
			w = d
		}
	}
	return priorityOf(u.Priority), u.Priority != 0, !u.Off && u.power > 0, u.power / w
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
		return wrapErr(u, err)
	}
	r[u.eqs[0]] = ev.p(u.out) - u.ExhaustP
	r[u.eqs[1]] = ev.h(u.out) - hOut
	phi, _ := u.shed.frac(ev.x)
	r[u.eqs[2]] = ev.m(u.in)*(ev.h(u.in)-ev.h(u.out))*u.etaMech() - u.power*phi
	r[u.eqs[3]] = ev.m(u.out) - ev.m(u.in)
	return nil
}

func (u *Turbine) jacobian(ev *eval, j jac) error {
	pIn, hIn, pOut := ev.p(u.in), ev.h(u.in), ev.p(u.out)
	key := [3]float64{pIn, hIn, pOut}
	if !u.jset || u.jkey != key {
		s, err := u.ms.get2(pIn, hIn, water.SPH)
		if err != nil {
			return wrapErr(u, err)
		}
		in, err := water.PH(pIn, hIn)
		if err != nil {
			return wrapErr(u, err)
		}
		out, err := water.PS(pOut, s)
		if err != nil {
			return wrapErr(u, err)
		}
		// h_s = h(p_out, s(p_in, h_in)) by dh = T·ds + v·dp at both ends.
		u.jval = [3]float64{out.T / in.T, -out.T * in.V / in.T, out.V}
		u.jkey, u.jset = key, true
	}
	dhsdh, dhsdp, dhsdpo := u.jval[0], u.jval[1], u.jval[2]
	em := u.etaMech()
	m := ev.m(u.in)
	j.add(u.eqs[0], u.out.pIdx(), 1)
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

func (u *Turbine) guess(x []float64) {
	x[u.out.pIdx()] = u.ExhaustP
	if h, _, err := u.expansion(x[u.in.pIdx()], x[u.in.hIdx()], u.ExhaustP); err == nil {
		x[u.out.hIdx()] = h
	}
}

func (u *Turbine) report(ev *eval, cr *CaseResult) error {
	_, dhs, err := u.expansion(ev.p(u.in), ev.h(u.in), ev.p(u.out))
	if err != nil {
		return wrapErr(u, err)
	}
	m := ev.m(u.in)
	shaft := m * (ev.h(u.in) - ev.h(u.out)) * u.etaMech()
	rate := 0.0
	if shaft > 0 {
		rate = m / shaft * 3.6e6 // kg/kWh
	}
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind(), Figures: Figures{
		{"shaft_W", shaft},
		{"steam_kg_s", m},
		{"isentropic_drop_J_kg", dhs},
		{"steam_rate_kg_per_kWh", rate},
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
	if u.Pump != nil {
		p := *u.Pump
		c.Pump = &p
	}
	c.in, c.out = nil, nil
	return &c
}
