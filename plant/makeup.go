package plant

import "steamcase/plant/units"

// MakeUp supplies fresh water to the feed tank at a set temperature: the
// water that the plant loses (returns not recovered, blowdown, vented flash
// steam) comes back here. Its flow follows from the feed tank's balance.
type MakeUp struct {
	Base
	// T is the water temperature, K; zero means the case's sea
	// temperature (the distilled water's storage tanks stand against the
	// shell), or 15 °C when the case gives none.
	T float64
	P float64 // supply pressure, Pa; zero: the plant's ambient pressure

	out   *Line
	eqs   [2]int
	mh    memo
	caseT float64 // the case's temperature (prepare)
}

// defaultMakeUpT is the make-up water's temperature when neither the
// make-up nor the case gives one: 15 °C, distilled water from a storage
// tank in a temperate engine room (common practice, no source).
const defaultMakeUpT = 288.15

// NewMakeUp returns a make-up water supply with its defaults.
func NewMakeUp() *MakeUp { return &MakeUp{} }

var makeUpKeys = []Key{
	num(Key{Name: "T", Label: "make-up temperature", Dim: units.Temperature, Example: "15 C",
		Doc: "temperature of the make-up water", DefaultNote: "the case's sea temperature (the storage tanks stand against the shell), or 15 °C when the case gives none",
		Source: "common practice, no source", Min: 273.16, Max: 373.15, Case: true},
		self[*MakeUp], func(u *MakeUp) *float64 { return &u.T }),
	num(Key{Name: "p", Label: "supply pressure", Dim: units.Pressure, Example: "1 bar(g)",
		Doc: "supply pressure", DefaultNote: "the plant's ambient pressure", Min: 1e3, Max: 5e7, Source: SourceDerived},
		self[*MakeUp], func(u *MakeUp) *float64 { return &u.P }),
}

// Keys lists the make-up's keys.
func (u *MakeUp) Keys() []Key { return makeUpKeys }

// Kind returns "make-up water".
func (u *MakeUp) Kind() string { return "make-up water" }

// Ports: one outlet.
func (u *MakeUp) Ports() []PortSpec {
	return []PortSpec{{Name: "out", Dir: Out, Medium: WaterSteam}}
}

func (u *MakeUp) temperature() float64 {
	if u.caseT > 0 {
		return u.caseT
	}
	if u.T > 0 {
		return u.T
	}
	return defaultMakeUpT
}

// prepare takes the case's make-up temperature: the given one, else the
// sea's, else defaultMakeUpT. A sea colder than fresh water's triple point
// (sea water freezes near −1.9 °C) is an error: give the make-up's T.
func (u *MakeUp) prepare(_ *Plant, c Conditions) error {
	switch {
	case u.T > 0:
		u.caseT = u.T
	case c.SeaT > 0:
		if c.SeaT < 273.16 {
			return compErr(u, "takes the sea temperature %.2f °C, below the freezing point of its fresh water: give the make-up's T", c.SeaT-273.15)
		}
		u.caseT = c.SeaT
	default:
		u.caseT = defaultMakeUpT
	}
	return nil
}

func (u *MakeUp) check(fs *faults) {
	checkKey(fs, u, "T")
	if u.P < 0 || !finite(u.P) {
		fs.add(u.Pos, u.Name, "", "supply pressure must be positive; got %g Pa", u.P)
	}
}

func (u *MakeUp) assemble(a *assembly, ports portLines) {
	u.out = ports.one("out")
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
	h, err := u.mh.get2(p, u.temperature(), hPT)
	if err != nil {
		return wrapErr(u, err)
	}
	r[u.eqs[0]] = p - u.pressure(ev)
	r[u.eqs[1]] = ev.h(u.out) - h
	return nil
}

func (u *MakeUp) jacobian(ev *eval, j jac) error {
	p := ev.p(u.out)
	t := u.temperature()
	h0, err := u.mh.get2(p, t, hPT)
	if err != nil {
		return wrapErr(u, err)
	}
	dhdp, err := dPropA(hPT, p, t, h0)
	if err != nil {
		return wrapErr(u, err)
	}
	j.add(u.eqs[0], u.out.pIdx(), 1)
	j.add(u.eqs[1], u.out.hIdx(), 1)
	j.add(u.eqs[1], u.out.pIdx(), -dhdp)
	return nil
}

func (u *MakeUp) guess(x []float64) {
	x[u.out.pIdx()] = 101325
	if u.P > 0 {
		x[u.out.pIdx()] = u.P
	}
	if h, err := hPT(x[u.out.pIdx()], u.temperature()); err == nil {
		x[u.out.hIdx()] = h
	}
}

func (u *MakeUp) report(ev *eval, cr *CaseResult) error {
	m := ev.m(u.out)
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind(), Figures: Figures{
		{"T_K", u.temperature()},
		{"flow_kg_s", m},
	}})
	cr.MakeUpKgS += m
	cr.boundary.massIn += m
	cr.boundary.energyIn += m * ev.h(u.out)
	return nil
}

func (u *MakeUp) outline(cr *CaseResult) {
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind()})
}

func (u *MakeUp) clone() Component { c := *u; c.out = nil; return &c }
