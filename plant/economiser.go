package plant

import (
	"fmt"
	"math"

	"steamcase/plant/combustion"
	"steamcase/plant/heat"
	"steamcase/plant/units"
	"steamcase/plant/water"
)

// Economiser heats a boiler's feed water with the boiler's own flue gas
// after it leaves the smoke tubes: a counterflow exchanger rated by ε-NTU
// (plant/heat), with UA given at a design gas flow and scaled off design
// as ṁ_gas^n (n 0.6-0.8, common practice). The gas side comes from the
// boiler's combustion model at the solved fuel flow, so the boiler needs a
// flue-gas table or a furnace model. The water's cp is taken at the
// economiser's inlet and the gas's as the mean over its temperature drop
// (two passes of the exchanger formula): a simplification within a
// fraction of a percent for feed water well below saturation.
//
// The boiler's fuel follows from its own energy balance at its own exit
// temperature; the economiser only recovers gas heat that would otherwise
// be lost, so the boiler's result reports the combined efficiency and the
// exit temperature after the economiser.
type Economiser struct {
	Base
	Boiler        string  // the boiler whose flue gas passes the economiser
	UA            float64 // W/K at DesignGasFlow
	DesignGasFlow float64 // kg/s; zero: UA is constant
	Exponent      float64 // n of UA ∝ ṁ_gas^n; zero means 0.65

	in, out  *Line
	b        *Boiler
	eqs      [3]int
	mcp      memo
	last     heat.ExchangerResult
	lastGas  gasSide
	lastProd combustion.Products
}

// NewEconomiser returns a flue-gas economiser; give it its boiler and UA.
func NewEconomiser() *Economiser { return &Economiser{} }

var economiserKeys = []Key{
	{Name: "boiler", Label: "boiler", Kind: KeyText, Example: `"AB1"`, Required: true,
		Doc: "the boiler whose flue gas passes the economiser",
		text: func(c Component, v []string) error {
			if e, ok := self[*Economiser](c); ok && len(v) == 1 {
				e.Boiler = v[0]
			}
			return nil
		}},
	num(Key{Name: "ua", Label: "UA", Dim: units.ThermalConductance, Example: "8 kW/K",
		Doc: "the exchanger's UA (at design_gas)", Required: true, Min: 0, Max: 1e8, Case: true},
		self[*Economiser], func(u *Economiser) *float64 { return &u.UA }),
	num(Key{Name: "design_gas", Label: "design gas flow", Dim: units.MassFlow, Example: "2 kg/s",
		Doc: "gas flow at which ua holds", DefaultNote: "ua is constant", Min: 1e-3, Max: 1e3, Source: SourceDerived},
		self[*Economiser], func(u *Economiser) *float64 { return &u.DesignGasFlow }),
	num(Key{Name: "exponent", Label: "UA exponent n (UA ∝ gas flow^n)", Kind: KeyNumber, Example: "0.65",
		Doc: "n of UA ∝ gas flow^n off design", Default: defaultEGEExponent, HasDefault: true,
		Source: "docs/reference/plant-checks.md §7 [S]", Min: 0.5, Max: 1},
		self[*Economiser], func(u *Economiser) *float64 { return &u.Exponent }),
}

// Keys lists the economiser's keys.
func (u *Economiser) Keys() []Key { return economiserKeys }

// ecoFlowFloor is added to the feed flow in the economiser's energy
// balance, kg/s. It biases the balance by at most ecoFlowFloor·Δh, under
// 0.1 W for any real economiser, far inside the plant's energy closure.
const ecoFlowFloor = 1e-6

// Kind returns "economiser".
func (u *Economiser) Kind() string { return "economiser" }

// Ports: feed water in and out.
func (u *Economiser) Ports() []PortSpec {
	return []PortSpec{{Name: "in", Dir: In, Medium: WaterSteam}, {Name: "out", Dir: Out, Medium: WaterSteam}}
}

func (u *Economiser) check(fs *faults) {
	checkRange(fs, u, "UA", u.UA, 0, 1e8, "W/K")
	if u.DesignGasFlow != 0 {
		checkRange(fs, u, "design gas flow", u.DesignGasFlow, 1e-3, 1e3, "kg/s")
	}
	if u.Exponent != 0 {
		checkRange(fs, u, "UA exponent n (UA ∝ gas flow^n)", u.Exponent, 0.5, 1, "")
	}
	if u.Boiler == "" {
		fs.add(u.Pos, u.Name, "", "needs the boiler whose flue gas it takes")
	}
}

func (u *Economiser) assemble(a *assembly, ports portLines) {
	u.in, u.out = ports.one("in"), ports.one("out")
	u.eqs[0] = a.equation(u.Name+": mass balance", 1, u.in.mIdx(), u.out.mIdx())
	u.eqs[1] = a.equation(u.Name+": pressure", scaleP, u.in.pIdx(), u.out.pIdx())
	u.eqs[2] = a.equation(u.Name+": heat from the flue gas", scaleQ, lineDeps(u.in, u.out)...)
}

// link ties the economiser to its boiler's unknowns once all are laid out.
func (u *Economiser) link(p *Plant, a *assembly, fs *faults) {
	b, ok := p.byName[u.Boiler].(*Boiler)
	if !ok {
		fs.add(u.Pos, u.Name, "", "takes the flue gas of %q, which is not an oil-fired boiler of this plant", u.Boiler)
		return
	}
	u.b = b
	a.roles.economisers = append(a.roles.economisers, u)
	a.depend(u.eqs[2], b.fuel, b.steam.mIdx(), b.feed.pIdx(), b.feed.hIdx())
}

// gasSide is what the economiser sees of the boiler's flue gas.
type gasSide struct {
	m, tIn float64
	prod   *combustion.Products
	pt     EfficiencyPoint
}

func (u *Economiser) gas(ev *eval) (gasSide, error) {
	pt, _, err := u.b.eta(ev)
	if err != nil {
		return gasSide{}, err
	}
	if pt.Products == nil || pt.FlueT == 0 {
		return gasSide{}, fmt.Errorf("needs the flue gas of boiler %q, whose efficiency model gives none: give that boiler a flue-gas table or a furnace model", u.b.Name)
	}
	return gasSide{m: ev.x[u.b.fuel] * pt.FlueGasPerFuel, tIn: pt.FlueT, prod: pt.Products, pt: pt}, nil
}

func (u *Economiser) ua(mGas float64) float64 {
	if u.DesignGasFlow <= 0 {
		return u.UA
	}
	n := u.Exponent
	if n == 0 {
		n = defaultEGEExponent
	}
	return u.UA * math.Pow(mGas/u.DesignGasFlow, n)
}

// duty rates the exchanger.
func (u *Economiser) duty(ev *eval) (heat.ExchangerResult, gasSide, error) {
	g, err := u.gas(ev)
	if err != nil {
		return heat.ExchangerResult{}, g, err
	}
	mw := ev.m(u.in)
	pIn, hIn := ev.p(u.in), ev.h(u.in)
	tw, err := tPH(pIn, hIn)
	if err != nil {
		return heat.ExchangerResult{}, g, err
	}
	if mw <= 0 || g.m <= 0 || g.tIn <= tw {
		return heat.ExchangerResult{HotOut: g.tIn, ColdOut: tw}, g, nil
	}
	cpw, err := u.mcp.get2(pIn, tw, func(p, t float64) (float64, error) {
		s, err := water.PT(p, t)
		return s.Cp, err
	})
	if err != nil {
		return heat.ExchangerResult{}, g, err
	}
	ua := u.ua(g.m)
	cpg, err := g.prod.FlueGasCp(g.tIn)
	if err != nil {
		return heat.ExchangerResult{}, g, err
	}
	var res heat.ExchangerResult
	for pass := 0; pass < 2; pass++ {
		res, err = heat.Counterflow(g.m*cpg, mw*cpw, ua, g.tIn, tw)
		if err != nil {
			return res, g, err
		}
		hIn, err1 := g.prod.FlueGasH(g.tIn)
		hOut, err2 := g.prod.FlueGasH(res.HotOut)
		if err1 != nil || err2 != nil || g.tIn-res.HotOut < 1e-6 {
			break
		}
		cpg = (hIn - hOut) / (g.tIn - res.HotOut)
	}
	return res, g, nil
}

func (u *Economiser) residual(ev *eval, r []float64) error {
	res, _, err := u.duty(ev)
	if err != nil {
		return wrapErr(u, err)
	}
	r[u.eqs[0]] = ev.m(u.out) - ev.m(u.in)
	r[u.eqs[1]] = ev.p(u.out) - ev.p(u.in)
	// ecoFlowFloor keeps the outlet enthalpy defined when no feed passes
	// (the boiler is not firing): the water then leaves as it came.
	r[u.eqs[2]] = (ev.m(u.in)+ecoFlowFloor)*(ev.h(u.out)-ev.h(u.in)) - res.Q
	return nil
}

func (u *Economiser) guess(x []float64) {
	x[u.out.pIdx()] = x[u.in.pIdx()]
	x[u.out.hIdx()] = x[u.in.hIdx()]
	x[u.out.mIdx()] = x[u.in.mIdx()]
}

func (u *Economiser) report(ev *eval, cr *CaseResult) error {
	res, g, err := u.duty(ev)
	if err != nil {
		return wrapErr(u, err)
	}
	pOut := ev.p(u.out)
	tIn, err := tPH(ev.p(u.in), ev.h(u.in))
	if err != nil {
		return wrapErr(u, err)
	}
	tOut, err := tPH(pOut, ev.h(u.out))
	if err != nil {
		return wrapErr(u, err)
	}
	ts, err := waterTsat(pOut)
	if err != nil {
		return wrapErr(u, err)
	}
	if hf, err := hLiquidSat(pOut); err == nil && ev.h(u.out) > hf {
		cr.warn("%s %q: the feed water boils in the economiser (%.1f °C at %.2f bar(a)); an economiser must not steam", u.Kind(), u.Name, tOut-273.15, pOut/1e5)
	}
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind(), Figures: Figures{
		{"duty_W", res.Q},
		{"gas_kg_s", g.m},
		{"gas_in_T_K", g.tIn},
		{"gas_out_T_K", res.HotOut},
		{"water_in_T_K", tIn},
		{"water_out_T_K", tOut},
		{"approach_K", ts - tOut},
		{"effectiveness", res.Eff},
		{"NTU", res.NTU},
		{"UA_W_per_K", u.ua(g.m)},
	}})
	cr.boundary.heatIn += res.Q
	// The boiler's flue gas, kept for finish in the economiser's own
	// copy: the boiler's point refers to storage its next evaluation
	// writes.
	if g.prod != nil {
		u.lastProd = *g.prod
		g.prod, g.pt.Products = &u.lastProd, &u.lastProd
	}
	g.pt.Losses = nil
	u.last, u.lastGas = res, g
	return nil
}

// finish makes the boiler's reported figures those of boiler and
// economiser together: heat, efficiency, exit temperature and losses. It
// runs after every component has reported.
func (u *Economiser) finish(cr *CaseResult) {
	res, g := u.last, u.lastGas
	for i := range cr.Boilers {
		b := &cr.Boilers[i]
		if b.Name != u.b.Name || b.FuelKgS <= 0 {
			continue
		}
		b.HeatW += res.Q
		b.Efficiency = b.HeatW / (b.FuelKgS * b.FuelLHV)
		b.FlueT = res.HotOut
		if l, err := combustion.Efficiency(*g.prod, res.HotOut, combustion.TRef, g.pt.LossOptions); err == nil {
			items := l.LHV
			b.Losses = &items
		}
	}
}

func (u *Economiser) jacobian(ev *eval, j jac) error {
	m := ev.m(u.in) + ecoFlowFloor
	j.add(u.eqs[0], u.out.mIdx(), 1)
	j.add(u.eqs[0], u.in.mIdx(), -1)
	j.add(u.eqs[1], u.out.pIdx(), 1)
	j.add(u.eqs[1], u.in.pIdx(), -1)
	e := u.eqs[2]
	j.add(e, u.in.mIdx(), ev.h(u.out)-ev.h(u.in))
	j.add(e, u.out.hIdx(), m)
	j.add(e, u.in.hIdx(), -m)
	// The duty: a rating of the exchanger on the boiler's flue gas, by
	// differences of the economiser's own duty. The boiler's efficiency
	// (its row) is differenced in the same evaluations: the duty evaluates
	// it at the same point.
	res, g, err := u.duty(ev)
	if err != nil {
		return wrapErr(u, err)
	}
	b := u.b
	f0 := [2]float64{res.Q, g.pt.Eta}
	// The branch is whether the boiler cycles below its burner minimum;
	// eta answers from its cache, just filled by duty.
	_, cycling, err := b.eta(ev)
	if err != nil {
		return wrapErr(u, err)
	}
	q := func() ([2]float64, int, error) {
		r, g, err := u.duty(ev)
		if err != nil {
			return [2]float64{}, 0, err
		}
		_, c, err := b.eta(ev)
		return [2]float64{r.Q, g.pt.Eta}, b2i(c), err
	}
	// The water inlet first: it leaves the boiler's operating point, and
	// so its cached efficiency, as it is.
	cols := [7]int{u.in.mIdx(), u.in.pIdx(), u.in.hIdx(), b.fuel, b.steam.mIdx(), b.feed.pIdx(), b.feed.hIdx()}
	fuelLHV := ev.x[b.fuel] * b.Fuel.LHV
	for i, col := range cols {
		if containsInt(cols[:i], col) {
			continue // the same unknown reached twice
		}
		d, err := unitFD(ev, col, f0, b2i(cycling), q)
		if err != nil {
			return wrapErr(u, err)
		}
		j.add(e, col, -d[0])
		if i >= 3 {
			j.add(b.eqs[3], col, fuelLHV*d[1])
		}
	}
	return nil
}

func (u *Economiser) outline(cr *CaseResult) {
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind()})
}

func (u *Economiser) clone() Component {
	c := *u
	c.b, c.in, c.out = nil, nil, nil
	return &c
}
