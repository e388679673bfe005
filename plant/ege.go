package plant

import (
	"fmt"
	"math"

	"steamcase/plant/combustion"
	"steamcase/plant/fuel"
	"steamcase/plant/heat"
	"steamcase/plant/units"
	"steamcase/plant/water"
)

// EngineExhaust describes the main engine's exhaust against its load, as
// the engine's project guide gives it (plant-checks.md §7 gives indicative
// values [M]; a real engine's come from its maker). Between the tabulated
// loads the figures are interpolated linearly; outside them the end values
// hold, with a warning.
type EngineExhaust struct {
	MCR      float64   // engine power at 100 % load, W
	Load     []float64 // fractions of MCR, strictly increasing
	Specific []float64 // exhaust gas per energy, kg/J (8.5 kg/kWh = 8.5/3.6e6 kg/J)
	T        []float64 // exhaust temperature after the turbocharger, K
}

// Validate checks the table.
func (e *EngineExhaust) Validate() error {
	n := len(e.Load)
	if !finite(e.MCR) || e.MCR <= 0 {
		return fmt.Errorf("engine MCR must be positive; got %g W", e.MCR)
	}
	if n == 0 || len(e.Specific) != n || len(e.T) != n {
		return fmt.Errorf("engine exhaust table needs as many gas flows and temperatures as loads and at least one; got %d loads, %d flows, %d temperatures", n, len(e.Specific), len(e.T))
	}
	for i := range e.Load {
		if !finite(e.Load[i]) || e.Load[i] < 0 || e.Load[i] > 1.2 {
			return fmt.Errorf("engine load %g is not a fraction of MCR between 0 and 1.2", e.Load[i])
		}
		if i > 0 && e.Load[i] <= e.Load[i-1] {
			return fmt.Errorf("engine exhaust table loads must increase; %g follows %g", e.Load[i], e.Load[i-1])
		}
		if kgkwh := e.Specific[i] * 3.6e6; !finite(kgkwh) || kgkwh < 2 || kgkwh > 30 {
			return fmt.Errorf("specific exhaust gas %.2f kg/kWh at load %g is outside 2-30 kg/kWh", kgkwh, e.Load[i])
		}
		if !finite(e.T[i]) || e.T[i] < 373.15 || e.T[i] > 873.15 {
			return fmt.Errorf("exhaust temperature %.1f °C at load %g is outside 100-600 °C", e.T[i]-273.15, e.Load[i])
		}
	}
	return nil
}

// At returns the exhaust gas flow (kg/s) and temperature (K) at a load
// fraction, and a warning when the load is outside the table.
func (e *EngineExhaust) At(load float64) (m, t float64, warn string) {
	spec, w1 := interpolate(e.Load, e.Specific, load, "engine exhaust table")
	t, _ = interpolate(e.Load, e.T, load, "engine exhaust table")
	return spec * load * e.MCR, t, w1
}

// ExhaustGasEconomiser raises steam from the main engine's exhaust. Its
// evaporator sees water at the saturation temperature of its drum, so the
// gas leaves at
//
//	T_out = T_sat + (T_in − T_sat)·exp(−NTU),  NTU = UA/(ṁ_gas·c̄p)
//
// (ε-NTU with one stream at constant temperature, plant-checks.md §7 [C]),
// and off design UA scales as ṁ_gas^n (n 0.6-0.8, common practice: gas-side
// h ∝ Re^0.6 in tube banks, Re^0.8 in tubes). The steam it raises is the
// duty over the enthalpy rise from its feed to the steam. Steam beyond the
// plant's demand goes to a dump condenser.
type ExhaustGasEconomiser struct {
	Base
	Engine  EngineExhaust
	DrumP   float64 // pressure of the steam raised, Pa absolute
	Dryness float64 // 0..1; zero means 1

	// The size, either UA (W/K) at DesignGasFlow (kg/s), or a design point:
	// the engine load DesignLoad at which the gas leaves DesignPinch kelvin
	// above the saturation temperature.
	UA, DesignGasFlow       float64
	DesignLoad, DesignPinch float64
	// Exponent n of UA ∝ ṁ_gas^n; zero means 0.65.
	Exponent float64

	// GasCp is a constant mean specific heat of the exhaust, J/(kg K).
	// Zero means: from the NASA polynomials (plant/combustion) for the
	// exhaust of ExhaustFuel burnt to ExhaustO2 (dry), or, without those,
	// 1060 J/(kg K) (plant-checks.md §7: 1.04-1.07 kJ/kg·K at 180-260 °C
	// [M]).
	GasCp       float64
	ExhaustFuel *fuel.Fuel
	ExhaustO2   float64

	// MinGasOutT is the lowest acceptable gas temperature leaving the
	// economiser (acid dew point plus a margin; 165-180 °C on high-sulfur
	// fuel is common practice, plant-checks.md §4 [CP]). Zero: not checked.
	// With Bypass, a damper sends gas past the economiser so that the
	// mixed gas in the funnel does not fall below it; otherwise falling
	// below it is a warning.
	MinGasOutT float64
	Bypass     bool
	Off        bool // out of service this case

	// PreheatUA, if positive, adds a preheating section after the
	// evaporator: the gas leaving the evaporator heats the feed in
	// counterflow (ε-NTU, plant/heat) before it enters the drum. It is
	// given at the same gas flow as the evaporator's size and scales with
	// the same exponent. The water's cp is taken at the section's inlet.
	// The gas leaving it is the economiser's final outlet; a minimum gas
	// temperature held by the bypass applies to the evaporator, and the
	// preheater falling below it is a warning.
	PreheatUA float64

	feed, steam *Line
	eqs         [4]int
	mcpw        memo
	mh          memo
	op          egeOperation
}

// egeOperation is the economiser's gas side in a case.
type egeOperation struct {
	load, mGas, tIn, tOut, tSat, q, bypass, cp, ua, ntu float64
	ua0                                                 float64 // UA at the size's reference gas flow
	belowMin                                            bool
	warn                                                []string
}

// NewExhaustGasEconomiser returns an exhaust-gas economiser; give it its
// engine, drum pressure and size.
func NewExhaustGasEconomiser() *ExhaustGasEconomiser { return &ExhaustGasEconomiser{} }

// defaultEGEExponent is n of UA ∝ ṁ_gas^n when none is given: 0.65,
// within the 0.6-0.8 of tube banks and tubes (plant-checks.md §7 [S]).
const defaultEGEExponent = 0.65

// defaultEGEGasCp is the exhaust's mean specific heat without a fuel and
// O2 for the NASA polynomials: 1060 J/(kg K), within the 1.04-1.07 kJ/kg·K
// of lean exhaust at 180-260 °C (plant-checks.md §7 [M]).
const defaultEGEGasCp = 1060

func egeKey(k Key, f func(*ExhaustGasEconomiser) *float64) Key {
	return num(k, self[*ExhaustGasEconomiser], f)
}

var egeKeys = []Key{
	egeKey(Key{Name: "drum", Label: "drum pressure", Dim: units.Pressure, Example: "7 bar(g)",
		Doc: "pressure of the steam raised", Required: true, Min: 1.1e5, Max: 5e6},
		func(u *ExhaustGasEconomiser) *float64 { return &u.DrumP }),
	egeKey(Key{Name: "dryness", Label: "steam dryness", Dim: units.Fraction, Example: "99 %",
		Doc: "dryness of the steam raised", Default: 1, HasDefault: true, Min: 0.8, Max: 1},
		func(u *ExhaustGasEconomiser) *float64 { return &u.Dryness }),
	{Name: "engine", Label: "engine", Kind: KeyTable, Required: true,
		Example: `{ mcr = "12 MW", { load = "25 %", gas = "11 kg/kWh", T = "250 C" }, { load = "100 %", gas = "8.2 kg/kWh", T = "258 C" } }`,
		Doc:     "the main engine's MCR and its exhaust (gas per kWh or a mass flow, temperature) against load"},
	egeKey(Key{Name: "ua", Label: "UA", Dim: units.ThermalConductance, Example: "60 kW/K",
		Doc: "the evaporator's size as UA (at design_gas), or design_load with pinch", Min: 1, Max: 1e8, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.UA }),
	egeKey(Key{Name: "design_gas", Label: "design gas flow", Dim: units.MassFlow, Example: "30 kg/s",
		Doc: "gas flow at which ua holds", DefaultNote: "ua is constant", Min: 0.01, Max: 1e3},
		func(u *ExhaustGasEconomiser) *float64 { return &u.DesignGasFlow }),
	egeKey(Key{Name: "design_load", Label: "design engine load", Dim: units.Fraction, Example: "85 %",
		Doc: "engine load at which the gas leaves pinch above saturation (with pinch)", Min: 0.1, Max: 1.2},
		func(u *ExhaustGasEconomiser) *float64 { return &u.DesignLoad }),
	egeKey(Key{Name: "pinch", Label: "design pinch", Dim: units.TemperatureDifference, Example: "15 K",
		Doc: "gas outlet above saturation at design_load", Min: 1, Max: 200},
		func(u *ExhaustGasEconomiser) *float64 { return &u.DesignPinch }),
	egeKey(Key{Name: "exponent", Label: "UA exponent n (UA ∝ gas flow^n)", Kind: KeyNumber, Example: "0.65",
		Doc: "n of UA ∝ gas flow^n off design", Default: defaultEGEExponent, HasDefault: true,
		Source: "plant-checks.md §7 [S]", Min: 0.5, Max: 1},
		func(u *ExhaustGasEconomiser) *float64 { return &u.Exponent }),
	egeKey(Key{Name: "gas_cp", Label: "exhaust gas cp", Dim: units.SpecificHeat, Example: "1.06 kJ/kgK",
		Doc: "a constant mean specific heat of the exhaust", Default: defaultEGEGasCp, HasDefault: true,
		Source: "plant-checks.md §7 [M]", Min: 900, Max: 1300},
		func(u *ExhaustGasEconomiser) *float64 { return &u.GasCp }),
	{Name: "exhaust_fuel", Label: "exhaust fuel", Kind: KeyText, Example: `"VLSFO"`,
		Doc: "the engine's fuel grade, with exhaust_O2, for the exhaust's enthalpy by the NASA polynomials (instead of gas_cp)"},
	egeKey(Key{Name: "exhaust_O2", Label: "exhaust O2 (dry)", Dim: units.Fraction, Example: "13 %",
		Doc: "O2 in the dry exhaust (with exhaust_fuel)", Min: 0.01, Max: 0.2},
		func(u *ExhaustGasEconomiser) *float64 { return &u.ExhaustO2 }),
	egeKey(Key{Name: "min_gas_T", Label: "minimum gas outlet temperature", Dim: units.Temperature, Example: "170 C",
		Doc: "lowest acceptable gas outlet (acid dew point plus margin)", DefaultNote: "not checked", Min: 353.15, Max: 573.15},
		func(u *ExhaustGasEconomiser) *float64 { return &u.MinGasOutT }),
	flag(Key{Name: "bypass", Label: "bypass", Example: "true",
		Doc: "a damper sends gas past the economiser to hold the funnel at min_gas_T", Default: 0, HasDefault: true},
		self[*ExhaustGasEconomiser], func(u *ExhaustGasEconomiser) *bool { return &u.Bypass }),
	egeKey(Key{Name: "preheat_ua", Label: "preheating section UA", Dim: units.ThermalConductance, Example: "10 kW/K",
		Doc: "UA of a preheating section after the evaporator, at the evaporator's reference gas flow", DefaultNote: "none",
		Min: 1, Max: 1e8, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.PreheatUA }),
	flag(Key{Name: "off", Label: "off", Example: "true", Doc: "out of service", Default: 0, HasDefault: true, Case: true},
		self[*ExhaustGasEconomiser], func(u *ExhaustGasEconomiser) *bool { return &u.Off }),
}

// Keys lists the exhaust-gas economiser's keys.
func (u *ExhaustGasEconomiser) Keys() []Key { return egeKeys }

// Kind returns "exhaust-gas economiser".
func (u *ExhaustGasEconomiser) Kind() string { return "exhaust-gas economiser" }

// Ports: feed in, steam out.
func (u *ExhaustGasEconomiser) Ports() []PortSpec {
	return []PortSpec{{Name: "feed", Dir: In, Medium: WaterSteam}, {Name: "steam", Dir: Out, Medium: WaterSteam}}
}

func (u *ExhaustGasEconomiser) dryness() float64 {
	if u.Dryness == 0 {
		return 1
	}
	return u.Dryness
}

func (u *ExhaustGasEconomiser) exponent() float64 {
	if u.Exponent == 0 {
		return defaultEGEExponent
	}
	return u.Exponent
}

func (u *ExhaustGasEconomiser) check(fs *faults) {
	if err := u.Engine.Validate(); err != nil {
		fs.add(u.Pos, u.Name, "", "%v", err)
	}
	checkRange(fs, u, "drum pressure", u.DrumP, 1.1e5, 5e6, "Pa")
	if u.Dryness != 0 {
		checkRange(fs, u, "steam dryness", u.Dryness, 0.8, 1, "")
	}
	switch {
	case u.UA > 0:
		checkRange(fs, u, "UA", u.UA, 1, 1e8, "W/K")
		if u.DesignGasFlow != 0 {
			checkRange(fs, u, "design gas flow", u.DesignGasFlow, 0.01, 1e3, "kg/s")
		}
	case u.DesignPinch > 0:
		checkRange(fs, u, "design pinch", u.DesignPinch, 1, 200, "K")
		checkRange(fs, u, "design engine load", u.DesignLoad, 0.1, 1.2, "")
	default:
		fs.add(u.Pos, u.Name, "", "needs its size: a UA, or a design engine load and pinch")
	}
	if u.Exponent != 0 {
		checkRange(fs, u, "UA exponent n (UA ∝ gas flow^n)", u.Exponent, 0.5, 1, "")
	}
	if u.GasCp != 0 {
		checkRange(fs, u, "exhaust gas cp", u.GasCp, 900, 1300, "J/(kg K)")
	}
	if u.ExhaustFuel != nil {
		checkRange(fs, u, "exhaust O2 (dry)", u.ExhaustO2, 0.01, 0.2, "")
	}
	if u.MinGasOutT != 0 {
		checkRange(fs, u, "minimum gas outlet temperature", u.MinGasOutT, 353.15, 573.15, "K")
	}
	if u.PreheatUA != 0 {
		checkRange(fs, u, "preheating section UA", u.PreheatUA, 1, 1e8, "W/K")
	}
}

func (u *ExhaustGasEconomiser) assemble(a *assembly, ports portLines) {
	u.feed, u.steam = ports.one("feed"), ports.one("steam")
	a.roles.eges = append(a.roles.eges, u)
	u.eqs[0] = a.equation(u.Name+": drum pressure", scaleP, u.steam.pIdx())
	u.eqs[1] = a.equation(u.Name+": steam dryness", scaleH, u.steam.pIdx(), u.steam.hIdx())
	u.eqs[2] = a.equation(u.Name+": mass balance", 1, u.feed.mIdx(), u.steam.mIdx())
	u.eqs[3] = a.equation(u.Name+": steam from the exhaust's heat", scaleQ,
		u.feed.mIdx(), u.feed.pIdx(), u.feed.hIdx(), u.steam.mIdx(), u.steam.hIdx())
}

// gasH returns the exhaust's enthalpy function per kg of gas.
func (u *ExhaustGasEconomiser) gasH() (heat.GasEnthalpy, error) {
	if u.GasCp > 0 || u.ExhaustFuel == nil {
		cp := u.GasCp
		if cp == 0 {
			cp = defaultEGEGasCp
		}
		return heat.ConstantCp(cp, 298.15), nil
	}
	prod, err := combustion.Fire(*u.ExhaustFuel, combustion.Conditions{O2Dry: u.ExhaustO2})
	if err != nil {
		return nil, err
	}
	// FlueGasH and FlueGasCp are per kg of flue gas.
	return func(t float64) (float64, float64) {
		h, err1 := prod.FlueGasH(t)
		cp, err2 := prod.FlueGasCp(t)
		if err1 != nil || err2 != nil {
			return math.NaN(), math.NaN()
		}
		return h, cp
	}, nil
}

// evaporate returns the outlet temperature and mean cp for gas flow m at
// tIn through an evaporator of conductance ua at tSat.
func evaporate(h heat.GasEnthalpy, m, tIn, tSat, ua float64) (tOut, cp float64, err error) {
	if tIn <= tSat || m <= 0 {
		_, cp = h(tIn)
		return tIn, cp, nil
	}
	hIn, cp := h(tIn)
	tOut = tIn
	for k := 0; k < 50; k++ {
		t := tSat + (tIn-tSat)*math.Exp(-ua/(m*cp))
		hOut, cpOut := h(t)
		if !finite(hOut) {
			return 0, 0, fmt.Errorf("exhaust enthalpy undefined at %.1f K", t)
		}
		if d := tIn - t; d > 1e-9 {
			cp = (hIn - hOut) / d
		} else {
			cp = cpOut
		}
		if math.Abs(t-tOut) < 1e-10 {
			return t, cp, nil
		}
		tOut = t
	}
	return tOut, cp, nil
}

// prepare computes the gas side for the case: it does not depend on the
// plant's unknowns.
func (u *ExhaustGasEconomiser) prepare(_ *Plant, c Conditions) error {
	u.op = egeOperation{load: c.EngineLoad}
	ts, err := waterTsat(u.DrumP)
	if err != nil {
		return wrapErr(u, err)
	}
	u.op.tSat = ts
	if u.Off || c.EngineLoad <= 0 {
		return nil
	}
	h, err := u.gasH()
	if err != nil {
		return wrapErr(u, err)
	}
	m, tIn, warn := u.Engine.At(c.EngineLoad)
	if warn != "" {
		u.op.warn = append(u.op.warn, warn)
	}
	ua, err := u.conductance(h, m)
	if err != nil {
		return wrapErr(u, err)
	}
	u.op.ua0 = ua / u.flowScale(m)
	tOut, cp, err := evaporate(h, m, tIn, ts, ua)
	if err != nil {
		return wrapErr(u, err)
	}
	u.op.mGas, u.op.tIn, u.op.tOut, u.op.cp, u.op.ua = m, tIn, tOut, cp, ua
	if m > 0 && cp > 0 {
		u.op.ntu = ua / (m * cp)
	}
	if u.MinGasOutT > 0 && tOut < u.MinGasOutT-1e-9 {
		u.op.belowMin = true
		if u.Bypass {
			if err := u.bypass(h, m, tIn, ts, ua); err != nil {
				return wrapErr(u, err)
			}
		} else {
			u.op.warn = append(u.op.warn, fmt.Sprintf("gas leaves at %.1f °C, below its minimum of %.1f °C (acid dew point and soot margin)", tOut-273.15, u.MinGasOutT-273.15))
		}
	}
	hIn, _ := h(tIn)
	frac := 1 - u.op.bypass
	hOut, _ := h(u.op.tOut)
	u.op.q = frac * m * (hIn - hOut)
	return nil
}

// flowScale is (m/m_ref)^n, the factor by which the size's UA changes at
// gas flow m (1 when UA is given without a reference flow).
func (u *ExhaustGasEconomiser) flowScale(m float64) float64 {
	n := u.exponent()
	switch {
	case u.UA > 0 && u.DesignGasFlow > 0:
		return math.Pow(m/u.DesignGasFlow, n)
	case u.UA > 0:
		return 1
	}
	md, _, _ := u.Engine.At(u.DesignLoad)
	return math.Pow(m/md, n)
}

// conductance returns UA at gas flow m.
func (u *ExhaustGasEconomiser) conductance(h heat.GasEnthalpy, m float64) (float64, error) {
	n := u.exponent()
	if u.UA > 0 {
		if u.DesignGasFlow > 0 {
			return u.UA * math.Pow(m/u.DesignGasFlow, n), nil
		}
		return u.UA, nil
	}
	md, tInD, _ := u.Engine.At(u.DesignLoad)
	tSat := u.op.tSat
	tOutD := tSat + u.DesignPinch
	if tInD <= tOutD {
		return 0, fmt.Errorf("at the design engine load %.0f %% the exhaust (%.1f °C) is not hotter than saturation plus the pinch (%.1f °C)", 100*u.DesignLoad, tInD-273.15, tOutD-273.15)
	}
	hIn, _ := h(tInD)
	hOut, _ := h(tOutD)
	cp := (hIn - hOut) / (tInD - tOutD)
	ntu := math.Log((tInD - tSat) / (tOutD - tSat))
	uaD := ntu * md * cp
	return uaD * math.Pow(m/md, n), nil
}

// bypass finds the fraction of gas that must pass the economiser so that
// the mixed gas leaves at MinGasOutT, by bisection (the mixed temperature
// falls monotonically as more gas goes through).
func (u *ExhaustGasEconomiser) bypass(h heat.GasEnthalpy, m, tIn, tSat, ua0 float64) error {
	hIn, _ := h(tIn)
	hMin, _ := h(u.MinGasOutT)
	mixed := func(f float64) (float64, float64, error) { // f = fraction through the economiser
		if f <= 0 {
			return hIn, tIn, nil
		}
		ua := ua0 * math.Pow(f, u.exponent())
		tOut, _, err := evaporate(h, f*m, tIn, tSat, ua)
		if err != nil {
			return 0, 0, err
		}
		hOut, _ := h(tOut)
		return f*hOut + (1-f)*hIn, tOut, nil
	}
	lo, hi := 0.0, 1.0
	for k := 0; k < 60; k++ {
		mid := 0.5 * (lo + hi)
		hm, _, err := mixed(mid)
		if err != nil {
			return err
		}
		if hm > hMin {
			lo = mid
		} else {
			hi = mid
		}
	}
	_, tOut, err := mixed(lo)
	if err != nil {
		return err
	}
	u.op.bypass = 1 - lo
	u.op.tOut = tOut
	return nil
}

func (u *ExhaustGasEconomiser) residual(ev *eval, r []float64) error {
	hs, err := u.mh.get2(u.DrumP, u.dryness(), hPX)
	if err != nil {
		return wrapErr(u, err)
	}
	r[u.eqs[0]] = ev.p(u.steam) - u.DrumP
	r[u.eqs[1]] = ev.h(u.steam) - hs
	r[u.eqs[2]] = ev.m(u.feed) - ev.m(u.steam)
	pre, err := u.preheat(ev)
	if err != nil {
		return wrapErr(u, err)
	}
	r[u.eqs[3]] = ev.m(u.steam)*(ev.h(u.steam)-ev.h(u.feed)) - u.op.q - pre.Q
	return nil
}

// preheat rates the preheating section at the present feed.
func (u *ExhaustGasEconomiser) preheat(ev *eval) (heat.ExchangerResult, error) {
	if u.PreheatUA <= 0 || u.Off || u.op.mGas <= 0 {
		return heat.ExchangerResult{}, nil
	}
	mw, pw, hw := ev.m(u.feed), ev.p(u.feed), ev.h(u.feed)
	tw, err := tPH(pw, hw)
	if err != nil {
		return heat.ExchangerResult{}, err
	}
	gasT := u.op.tOut
	if mw <= 0 || gasT <= tw {
		return heat.ExchangerResult{HotOut: gasT, ColdOut: tw}, nil
	}
	cpw, err := u.mcpw.get2(pw, tw, func(p, t float64) (float64, error) {
		st, err := water.PT(p, t)
		return st.Cp, err
	})
	if err != nil {
		return heat.ExchangerResult{}, err
	}
	mg := (1 - u.op.bypass) * u.op.mGas
	ua := u.PreheatUA
	if u.op.ua0 > 0 {
		ua *= u.op.ua / u.op.ua0
	}
	return heat.Counterflow(mg*u.op.cp, mw*cpw, ua, gasT, tw)
}

func (u *ExhaustGasEconomiser) guess(x []float64) {
	x[u.steam.pIdx()] = u.DrumP
	if h, err := hPX(u.DrumP, u.dryness()); err == nil {
		x[u.steam.hIdx()] = h
		if dh := h - x[u.feed.hIdx()]; dh > 1e5 {
			x[u.steam.mIdx()] = u.op.q / dh
		}
	}
	x[u.feed.mIdx()] = x[u.steam.mIdx()]
}

func (u *ExhaustGasEconomiser) report(ev *eval, cr *CaseResult) error {
	m := ev.m(u.steam)
	pre, err := u.preheat(ev)
	if err != nil {
		return wrapErr(u, err)
	}
	er := EGEResult{
		Name: u.Name, SteamKgS: m, DutyW: u.op.q + pre.Q, PreheatW: pre.Q, EngineLoad: u.op.load,
		GasKgS: u.op.mGas, GasInT: u.op.tIn, GasOutT: u.op.tOut, TSat: u.op.tSat,
		BypassFraction: u.op.bypass, UA: u.op.ua, NTU: u.op.ntu,
		InService: !u.Off && u.op.q > 0, BelowMin: u.op.belowMin, MinGasOutT: u.MinGasOutT,
	}
	if er.InService {
		er.Pinch = u.op.tOut - u.op.tSat
	}
	if pre.Q > 0 {
		er.EvaporatorOutT = u.op.tOut
		er.GasOutT = pre.HotOut
		er.PreheatWaterOutT = pre.ColdOut
		if pre.ColdOut >= u.op.tSat-1 {
			cr.warn("%s %q: the preheating section brings the feed to %.1f °C, within 1 K of saturation (%.1f °C): it would steam",
				u.Kind(), u.Name, pre.ColdOut-273.15, u.op.tSat-273.15)
		}
		if u.MinGasOutT > 0 && pre.HotOut < u.MinGasOutT-1e-9 {
			er.BelowMin = true
			cr.warn("%s %q: gas leaves the preheating section at %.1f °C, below its minimum of %.1f °C",
				u.Kind(), u.Name, pre.HotOut-273.15, u.MinGasOutT-273.15)
		}
	}
	for _, w := range u.op.warn {
		cr.warn("%s %q: %s", u.Kind(), u.Name, w)
	}
	cr.EGEs = append(cr.EGEs, er)
	cr.SteamProductionKgS += m
	cr.EGESteamKgS += m
	cr.boundary.heatIn += u.op.q + pre.Q
	return nil
}

func (u *ExhaustGasEconomiser) jacobian(ev *eval, j jac) error {
	// The gas side is fixed for the case (prepare); only the water side
	// depends on the unknowns.
	ms := ev.m(u.steam)
	j.add(u.eqs[0], u.steam.pIdx(), 1)
	j.add(u.eqs[1], u.steam.hIdx(), 1)
	j.add(u.eqs[2], u.feed.mIdx(), 1)
	j.add(u.eqs[2], u.steam.mIdx(), -1)
	j.add(u.eqs[3], u.steam.mIdx(), ev.h(u.steam)-ev.h(u.feed))
	j.add(u.eqs[3], u.steam.hIdx(), ms)
	j.add(u.eqs[3], u.feed.hIdx(), -ms)
	if u.PreheatUA <= 0 {
		return nil
	}
	// The preheating section's duty depends on the feed's flow and state:
	// its derivatives by differences of that duty alone.
	pre, err := u.preheat(ev)
	if err != nil {
		return wrapErr(u, err)
	}
	f0 := [2]float64{pre.Q}
	q := func() ([2]float64, int, error) {
		r, err := u.preheat(ev)
		return [2]float64{r.Q}, 0, err
	}
	for _, col := range [3]int{u.feed.mIdx(), u.feed.pIdx(), u.feed.hIdx()} {
		d, err := unitFD(ev, col, f0, 0, q)
		if err != nil {
			return wrapErr(u, err)
		}
		j.add(u.eqs[3], col, -d[0])
	}
	return nil
}

func (u *ExhaustGasEconomiser) outline(cr *CaseResult) {
	cr.EGEs = append(cr.EGEs, EGEResult{Name: u.Name})
}

func (u *ExhaustGasEconomiser) clone() Component {
	c := *u
	c.op = egeOperation{}
	c.feed, c.steam = nil, nil
	return &c
}

// EGEResult is an exhaust-gas economiser's part in a case.
type EGEResult struct {
	Name           string
	InService      bool
	EngineLoad     float64
	SteamKgS       float64
	DutyW          float64
	GasKgS         float64
	GasInT         float64
	GasOutT        float64 // leaving the economiser (before mixing with bypassed gas)
	TSat           float64
	Pinch          float64 // gas outlet above saturation, K
	BypassFraction float64 // of the exhaust sent past the economiser
	// With a preheating section: its duty (included in DutyW), the gas
	// leaving the evaporator (GasOutT is then after the preheater) and the
	// feed leaving the preheater.
	PreheatW, EvaporatorOutT, PreheatWaterOutT float64
	// BelowMin is true when the gas through the economiser would leave
	// below MinGasOutT (the bypass, if any, then holds the funnel at it).
	BelowMin   bool
	MinGasOutT float64
	UA, NTU    float64
	// FuelSavedKgS is the oil-fired boilers' fuel that the economisers save
	// against the same case without them (all economisers together).
	FuelSavedKgS float64
}
