package plant

import (
	"fmt"
	"math"
	"strings"

	"steamcase/plant/fuel"
	"steamcase/plant/units"
)

// FuelSpec is what a boiler needs to know of its fuel for the energy
// balance and the reports: the lower calorific value and the CO2 figures.
type FuelSpec struct {
	Name string
	LHV  float64 // lower calorific value for the energy balance, J/kg
	// CO2Factor is the kg of CO2 per kg of fuel the regulatory figure
	// (CaseResult.CO2KgS) counts: the IMO conversion factor C_F of the
	// fuel's IMO fuel type, or, for a fuel without one, its analysis
	// figure or the factor a script gives. CO2Basis says which.
	CO2Factor float64
	CO2Basis  string
	// CO2Analysis is the kg of CO2 per kg of fuel from the carbon of the
	// fuel's analysis (complete combustion): what the combustion models
	// burn. Zero when the fuel has no analysis (a fuel given only by its
	// LHV and CO2 factor).
	CO2Analysis float64
	// IMOLCV is the lower calorific value of the fuel's IMO fuel type,
	// J/kg, kept for regulatory reporting beside the IMO CO2; the energy
	// balance never uses it. Zero when the fuel has no IMO fuel type.
	IMOLCV float64
	// Fuel is the full description, which the combustion models need;
	// nil for a boiler with a plain efficiency table.
	Fuel *fuel.Fuel
	// Notes is what a reader of the fuel's figures must see (the
	// warnings of a bunker delivery note, joined by "; ": an off-spec
	// property, a stated LHV far from the ISO 8217 estimate); every case
	// the boiler burns fuel in repeats it among its warnings.
	Notes string
}

// SpecFromBDN fills a FuelSpec from a fuel made from a bunker delivery
// note (fuel.FromBDN), its warnings kept as the spec's notes.
func SpecFromBDN(b fuel.BDNFuel) (FuelSpec, error) {
	spec, err := SpecFromFuel(b.Fuel)
	if err != nil {
		return FuelSpec{}, err
	}
	spec.Notes = strings.Join(b.Warnings, "; ")
	return spec, nil
}

// SpecFromFuel fills a FuelSpec from a fuel's own figures: its net
// specific energy, the CO2 of its IMO fuel type (else of its analysis) for
// the regulatory figure, and the CO2 of its analysis beside it.
func SpecFromFuel(f fuel.Fuel) (FuelSpec, error) {
	e, err := f.Energy()
	if err != nil {
		return FuelSpec{}, err
	}
	c, err := f.CO2()
	if err != nil {
		return FuelSpec{}, err
	}
	ff := f
	basis := c.IMOSource
	if c.IMO == 0 {
		basis = "fuel analysis: " + c.AnalysisSource
	}
	return FuelSpec{Name: f.Name, LHV: e.Net, CO2Factor: c.IMOOrAnalysis(), CO2Basis: basis,
		CO2Analysis: c.Analysis, IMOLCV: e.IMOLCV, Fuel: &ff}, nil
}

// Boiler is an oil-fired auxiliary boiler: a drum at a set pressure raising
// steam of a set dryness from its feed, with blowdown, burning fuel at the
// rate its energy balance and efficiency require:
//
//	ṁ_fuel · LHV · η = ṁ_steam·(h_steam − h_feed) + ṁ_blowdown·(h_f,drum − h_feed)
//
// Below its burner minimum (MCR / Turndown) it cycles on and off: the fuel
// is then the time average, at the efficiency of the minimum firing rate
// reduced by CyclingLoss for the purges.
type Boiler struct {
	Base
	MCR   float64 // maximum continuous rating, kg/s of steam
	DrumP float64 // drum pressure, Pa absolute
	// Dryness of the steam leaving the drum, 0..1; zero means 1 (dry
	// saturated).
	Dryness float64
	// Blowdown as a fraction of feed. If zero and TDSFeed and TDSMax are
	// given, the fraction is TDSFeed/TDSMax (the ratio of dissolved solids
	// in the feed to the limit in the boiler water).
	Blowdown        float64
	TDSFeed, TDSMax float64
	// Turndown is the burner's turndown ratio (4 means 1:4): the burner
	// cannot fire below MCR/Turndown. Zero means the minimum is not known
	// and cycling is not checked.
	Turndown float64
	// CyclingLoss is the fraction of efficiency lost to pre-purges when the
	// boiler cycles below its burner minimum; zero means none is counted.
	CyclingLoss float64
	// EtaFactor scales the efficiency model's figure (zero means 1): the
	// knob an audit turns for an uncertain efficiency.
	EtaFactor  float64
	Efficiency EfficiencyModel
	Fuel       FuelSpec

	// Burner holds the burner and forced-draught fan; its zero value is a
	// burner whose fan is not modelled.
	Burner Burner

	feed, steam *Line
	fuel        int
	eqs         [4]int
	mt, mf, mh  memo
	effOp       BoilerOperation
	effPt       EfficiencyPoint
	effSet      bool
}

// Burner is a boiler's burner and forced-draught fan.
type Burner struct {
	// AirT is the combustion air temperature at the fan inlet, K; zero
	// means the case's air temperature (or 25 °C without one).
	AirT float64
	// FanRise is the fan's total pressure rise, Pa; FanEta its efficiency
	// and MotorEta its motor's (zero: 0.9). With FanRise zero the fan's
	// power is not counted.
	FanRise, FanEta, MotorEta float64
}

// NewBoiler returns an oil-fired boiler; give it its MCR, drum pressure,
// efficiency and fuel.
func NewBoiler() *Boiler { return &Boiler{} }

func boilerKey(k Key, f func(*Boiler) *float64) Key { return num(k, self[*Boiler], f) }

var boilerKeys = []Key{
	boilerKey(Key{Name: "mcr", Label: "MCR", Dim: units.MassFlow, Example: "20 t/h",
		Doc: "maximum continuous rating, steam", Required: true, Min: 1e-3, Max: 500, Case: true, JSON: "mcr_kg_h"},
		func(u *Boiler) *float64 { return &u.MCR }),
	boilerKey(Key{Name: "drum", Label: "drum pressure", Dim: units.Pressure, Example: "16 bar(g)",
		Doc: "drum pressure", Required: true, Min: 1.1e5, Max: 2.2e7, Case: true, JSON: "drum_p_Pa"},
		func(u *Boiler) *float64 { return &u.DrumP }),
	boilerKey(Key{Name: "dryness", Label: "steam dryness", Dim: units.Fraction, Example: "99 %",
		Doc: "dryness of the steam leaving the drum", Default: 1, HasDefault: true, Min: 0.8, Max: 1, Case: true,
		JSON: "steam_dryness"},
		func(u *Boiler) *float64 { return &u.Dryness }),
	boilerKey(Key{Name: "blowdown", Label: "blowdown fraction", Dim: units.Fraction, Example: "1 %",
		Doc: "blowdown as a fraction of the feed (or tds_feed/tds_max)", Default: 0, HasDefault: true,
		Min: 0, Max: 0.2, Case: true},
		func(u *Boiler) *float64 { return &u.Blowdown }),
	boilerKey(Key{Name: "tds_feed", Label: "feed TDS", Kind: KeyNumber, Example: "20",
		Doc: "dissolved solids in the feed, in the unit of tds_max: blowdown = tds_feed/tds_max"},
		func(u *Boiler) *float64 { return &u.TDSFeed }),
	boilerKey(Key{Name: "tds_max", Label: "TDS limit", Kind: KeyNumber, Example: "2000",
		Doc: "dissolved solids allowed in the boiler water"},
		func(u *Boiler) *float64 { return &u.TDSMax }),
	boilerKey(Key{Name: "turndown", Label: "burner turndown ratio", Kind: KeyNumber, Example: "4",
		Doc: "burner turndown (4 means 1:4): below MCR/turndown the burner cycles", DefaultNote: "cycling not checked",
		Min: 1, Max: 20},
		func(u *Boiler) *float64 { return &u.Turndown }),
	boilerKey(Key{Name: "cycling_loss", Label: "cycling loss", Dim: units.Fraction, Example: "2 %",
		Doc: "fraction of efficiency lost to pre-purges while cycling", Default: 0, HasDefault: true, Min: 0, Max: 0.2},
		func(u *Boiler) *float64 { return &u.CyclingLoss }),
	boilerKey(Key{Name: "eta_factor", Label: "efficiency factor", Dim: units.Fraction, Example: "0.98",
		Doc: "scales the efficiency model's figure (an audit's knob)", Default: 1, HasDefault: true,
		Min: 0.5, Max: 1.5, Case: true},
		func(u *Boiler) *float64 { return &u.EtaFactor }),
	{Name: "fuel", Label: "fuel", Kind: KeyText, Example: `"HSFO"`, Case: true, JSON: "fuel",
		Doc:  "a built-in grade (its LHV, CO2 factor and analysis), or the name of your own fuel with lhv and co2_factor; a case may change it to a built-in grade (0.1 % S fuel in port or in an emission control area)",
		text: setBoilerGrade,
		keep: func(c Component) func() {
			b, ok := self[*Boiler](c)
			if !ok {
				return func() {}
			}
			old := b.Fuel
			return func() { b.Fuel, b.effSet = old, false }
		}},
	{Name: "lhv", Label: "lower calorific value", Kind: KeyQuantity, Dim: units.SpecificEnergy, Example: "40.2 MJ/kg",
		Doc: "the fuel's lower calorific value for the energy balance (replaces a grade's)", Min: 1e7, Max: 6e7},
	{Name: "co2_factor", Label: "CO2 factor", Kind: KeyNumber, Example: "3.114",
		Doc: "kg CO2 per kg fuel (replaces a grade's)", Min: 0, Max: 4},
	{Name: "bdn", Label: "bunker delivery note", Kind: KeyTable,
		Example: `{ grade = "RMG 380", density = "991 kg/m3", sulphur = "2.8 %", water = "0.3 %", ash = "0.05 %", viscosity = "380 cSt" }`,
		Doc:     "the delivered fuel's figures on top of the fuel grade (fuel.FromBDN): density at 15 C, sulphur, water (% V/V), ash, viscosity (50 C residual, 40 C distillate), optional grade (ISO 8217 designation), lhv and name; its LHV, analysis and CO2 follow"},
	{Name: "efficiency", Label: "efficiency", Kind: KeyTable, Required: true,
		Example: `{ {"25 %", "80 %"}, {"100 %", "85 %"} }`,
		Doc:     "one figure, a table of {load, efficiency} pairs (LHV basis), or a combustion model (flue_gas or furnace)"},
	{Name: "burner", Label: "burner", Kind: KeyTable, Example: `{ fan_rise = "3 kPa", fan_eta = "60 %" }`,
		Doc: "the burner's fan: fan_rise, fan_eta, motor_eta, air_T"},
}

// setBoilerGrade is the fuel a case sets: a built-in grade, with its LHV,
// CO2 factor and analysis. A case that gives back the fuel the boiler was
// declared with (the name of one of one's own) keeps it as it is.
func setBoilerGrade(c Component, v []string) error {
	b, ok := self[*Boiler](c)
	if !ok || len(v) != 1 {
		return nil
	}
	if v[0] == b.Fuel.Name {
		return nil
	}
	f, err := fuel.Grade(v[0])
	if err != nil {
		return fmt.Errorf("fuel %q is not a built-in grade (grades: %s); a case may change a boiler's fuel to a grade only", v[0], strings.Join(fuel.GradeNames(), ", "))
	}
	spec, err := SpecFromFuel(f)
	if err != nil {
		return err
	}
	b.Fuel = spec
	b.effSet = false
	return nil
}

// Keys lists the boiler's keys.
func (u *Boiler) Keys() []Key { return boilerKeys }

// Kind returns "oil-fired boiler".
func (u *Boiler) Kind() string { return "oil-fired boiler" }

// Ports: feed in, steam out.
func (u *Boiler) Ports() []PortSpec {
	return []PortSpec{{Name: "feed", Dir: In, Medium: WaterSteam}, {Name: "steam", Dir: Out, Medium: WaterSteam}}
}

func (u *Boiler) dryness() float64 {
	if u.Dryness == 0 {
		return 1
	}
	return u.Dryness
}

func (u *Boiler) blowdown() float64 {
	if u.Blowdown == 0 && u.TDSMax > 0 {
		return u.TDSFeed / u.TDSMax
	}
	return u.Blowdown
}

// MinLoad is the burner minimum as a fraction of MCR, zero when the
// turndown is not known.
func (u *Boiler) MinLoad() float64 {
	if u.Turndown == 0 {
		return 0
	}
	return 1 / u.Turndown
}

func (u *Boiler) check(fs *faults) {
	checkKey(fs, u, "mcr")
	checkKey(fs, u, "drum")
	checkKey(fs, u, "dryness")
	checkRange(fs, u, "blowdown fraction", u.Blowdown, 0, 0.2, "")
	if u.Blowdown == 0 && u.TDSMax > 0 {
		checkRange(fs, u, "feed TDS", u.TDSFeed, 0, u.TDSMax*0.2, "(same unit as the TDS limit; blowdown fraction is TDS feed / TDS limit, at most 0.2)")
	}
	checkKey(fs, u, "turndown")
	checkRange(fs, u, "cycling loss", u.CyclingLoss, 0, 0.2, "")
	checkKey(fs, u, "eta_factor")
	if u.Burner.AirT != 0 {
		checkRange(fs, u, "combustion air temperature", u.Burner.AirT, 243.15, 343.15, "K")
	}
	if u.Burner.FanRise != 0 {
		checkRange(fs, u, "fan pressure rise", u.Burner.FanRise, 1, 5e4, "Pa")
		checkRange(fs, u, "fan efficiency", u.Burner.FanEta, 0.1, 1, "")
		if u.Burner.MotorEta != 0 {
			checkRange(fs, u, "fan motor efficiency", u.Burner.MotorEta, 0.1, 1, "")
		}
	}
	if u.Efficiency == nil {
		fs.add(u.Pos, u.Name, "", "needs an efficiency (a maker's test table or a combustion model)")
	} else if v, ok := u.Efficiency.(interface{ Validate() error }); ok {
		if err := v.Validate(); err != nil {
			fs.add(u.Pos, u.Name, "", "%v", err)
		}
	}
	checkRange(fs, u, "fuel lower calorific value", u.Fuel.LHV, 1e7, 6e7, "J/kg")
	checkRange(fs, u, "fuel CO2 factor", u.Fuel.CO2Factor, 0, 4, "kg/kg")
}

func (u *Boiler) assemble(a *assembly, ports portLines) {
	u.feed, u.steam = ports.one("feed"), ports.one("steam")
	u.fuel = a.variable(u.Name+": fuel flow", 0.1, 0, math.Inf(1), 0.05)
	u.eqs[0] = a.equation(u.Name+": drum pressure", scaleP, u.steam.pIdx())
	u.eqs[1] = a.equation(u.Name+": steam dryness", scaleH, u.steam.pIdx(), u.steam.hIdx())
	u.eqs[2] = a.equation(u.Name+": feed and blowdown", 1, u.feed.mIdx(), u.steam.mIdx())
	u.eqs[3] = a.equation(u.Name+": fuel from the energy balance", scaleQ,
		u.fuel, u.feed.mIdx(), u.feed.pIdx(), u.feed.hIdx(), u.steam.mIdx(), u.steam.pIdx(), u.steam.hIdx())
	a.roles.boilers = append(a.roles.boilers, u)
}

// operation returns the state the efficiency is evaluated at and whether
// the boiler cycles below its burner minimum.
func (u *Boiler) operation(ev *eval) (BoilerOperation, bool, error) {
	load := ev.m(u.steam) / u.MCR
	cycling := load < u.MinLoad()-1e-12
	fire := load
	if cycling {
		fire = u.MinLoad()
	}
	ft, err := u.mt.get2(ev.p(u.feed), ev.h(u.feed), tPH)
	if err != nil {
		return BoilerOperation{}, false, err
	}
	fuel := ev.x[u.fuel]
	if cycling && load > 0 {
		fuel *= fire / load
	}
	return BoilerOperation{Load: fire, DrumP: u.DrumP, FeedT: ft, AirT: u.airT(ev), FuelFlow: fuel, Fuel: u.Fuel}, cycling, nil
}

// airT is the combustion air temperature: the burner's own, else the
// case's air temperature, else 25 °C.
func (u *Boiler) airT(ev *eval) float64 {
	switch {
	case u.Burner.AirT > 0:
		return u.Burner.AirT
	case ev.cond.AirT > 0:
		return ev.cond.AirT
	}
	return 298.15
}

func (u *Boiler) eta(ev *eval) (pt EfficiencyPoint, cycling bool, err error) {
	op, cycling, err := u.operation(ev)
	if err != nil {
		return EfficiencyPoint{}, false, err
	}
	if u.effSet && op == u.effOp {
		pt = u.effPt
	} else {
		pt, err = u.Efficiency.Efficiency(op)
		if err != nil {
			u.effSet = false
			return EfficiencyPoint{}, false, err
		}
		if !finite(pt.Eta) || pt.Eta <= 0 || pt.Eta > 1 {
			return EfficiencyPoint{}, false, fmt.Errorf("efficiency %g at load %.0f %% is not between 0 and 1", pt.Eta, 100*op.Load)
		}
		u.effOp, u.effPt, u.effSet = op, pt, true
	}
	if cycling {
		pt.Eta *= 1 - u.CyclingLoss
	}
	if u.EtaFactor != 0 {
		pt.Eta *= u.EtaFactor
		if pt.Eta > 1 {
			return EfficiencyPoint{}, false, fmt.Errorf("efficiency %.4f times factor %g exceeds 1", pt.Eta/u.EtaFactor, u.EtaFactor)
		}
	}
	return pt, cycling, nil
}

// heat is the heat the boiler puts into steam and blowdown, W.
func (u *Boiler) heat(ev *eval) (float64, error) {
	hf, err := u.mf.get1(u.DrumP, hLiquidSat)
	if err != nil {
		return 0, err
	}
	hfw := ev.h(u.feed)
	mf, ms := ev.m(u.feed), ev.m(u.steam)
	return ms*(ev.h(u.steam)-hfw) + (mf-ms)*(hf-hfw), nil
}

func (u *Boiler) residual(ev *eval, r []float64) error {
	hs, err := u.mh.get2(u.DrumP, u.dryness(), hPX)
	if err != nil {
		return wrapErr(u, err)
	}
	q, err := u.heat(ev)
	if err != nil {
		return wrapErr(u, err)
	}
	pt, _, err := u.eta(ev)
	if err != nil {
		return wrapErr(u, err)
	}
	eta := pt.Eta
	r[u.eqs[0]] = ev.p(u.steam) - u.DrumP
	r[u.eqs[1]] = ev.h(u.steam) - hs
	r[u.eqs[2]] = ev.m(u.feed)*(1-u.blowdown()) - ev.m(u.steam)
	r[u.eqs[3]] = ev.x[u.fuel]*u.Fuel.LHV*eta - q
	return nil
}

func b2i(b bool) int {
	if b {
		return 1
	}
	return 0
}

func (u *Boiler) jacobian(ev *eval, j jac) error {
	hf, err := u.mf.get1(u.DrumP, hLiquidSat)
	if err != nil {
		return wrapErr(u, err)
	}
	pt, cycling, err := u.eta(ev)
	if err != nil {
		return wrapErr(u, err)
	}
	eta := pt.Eta
	fuel := ev.x[u.fuel]
	mf, ms := ev.m(u.feed), ev.m(u.steam)
	hfw, hs := ev.h(u.feed), ev.h(u.steam)
	e := u.eqs
	j.add(e[0], u.steam.pIdx(), 1)
	j.add(e[1], u.steam.hIdx(), 1)
	j.add(e[2], u.feed.mIdx(), 1-u.blowdown())
	j.add(e[2], u.steam.mIdx(), -1)

	// r = fuel·LHV·η − q, q = ms·(hs − hfw) + (mf − ms)·(hf − hfw).
	lhv := u.Fuel.LHV
	j.add(e[3], u.fuel, lhv*eta)
	j.add(e[3], u.steam.mIdx(), -(hs - hf))
	j.add(e[3], u.steam.hIdx(), -ms)
	j.add(e[3], u.feed.hIdx(), mf)
	j.add(e[3], u.feed.mIdx(), -(hf - hfw))

	// The efficiency's own dependence on the unknowns.
	if t, ok := u.Efficiency.(*EfficiencyTable); ok {
		// A maker's table depends on the load alone, held at the burner
		// minimum while the boiler cycles.
		if !cycling {
			k := 1.0
			if u.EtaFactor != 0 {
				k = u.EtaFactor
			}
			slope := tableSlope(t.Load, t.Eta, ms/u.MCR)
			j.add(e[3], u.steam.mIdx(), fuel*lhv*k*slope/u.MCR)
		}
		return nil
	}
	if ev.pl.economiserOf(u) != nil {
		// The economiser on this boiler's gas differences the efficiency
		// together with its own duty (one model evaluation per unknown).
		return nil
	}
	etaOf := func() ([2]float64, int, error) {
		pt, c, err := u.eta(ev)
		return [2]float64{pt.Eta}, b2i(c), err
	}
	for _, col := range [4]int{u.steam.mIdx(), u.feed.pIdx(), u.feed.hIdx(), u.fuel} {
		d, err := unitFD(ev, col, [2]float64{eta}, b2i(cycling), etaOf)
		if err != nil {
			return wrapErr(u, err)
		}
		j.add(e[3], col, fuel*lhv*d[0])
	}
	return nil
}

func (u *Boiler) guess(x []float64) {
	x[u.steam.pIdx()] = u.DrumP
	if h, err := hPX(u.DrumP, u.dryness()); err == nil {
		x[u.steam.hIdx()] = h
	}
	x[u.feed.mIdx()] = x[u.steam.mIdx()] / (1 - u.blowdown())
}

func (u *Boiler) report(ev *eval, cr *CaseResult) error {
	pt, cycling, err := u.eta(ev)
	if err != nil {
		return wrapErr(u, err)
	}
	eta, warn := pt.Eta, pt.Warning
	ms, mf := ev.m(u.steam), ev.m(u.feed)
	mbd := mf - ms
	hf, err := u.mf.get1(u.DrumP, hLiquidSat)
	if err != nil {
		return wrapErr(u, err)
	}
	ft, err := tPH(ev.p(u.feed), ev.h(u.feed))
	if err != nil {
		return wrapErr(u, err)
	}
	q, err := u.heat(ev)
	if err != nil {
		return wrapErr(u, err)
	}
	firing := ev.pl.firing(u)
	fuel := ev.x[u.fuel]
	br := BoilerResult{
		Name:            u.Name,
		Firing:          firing,
		LoadFraction:    ms / u.MCR,
		SteamKgS:        ms,
		FuelKgS:         fuel,
		Efficiency:      eta,
		EfficiencyBasis: u.Efficiency.Basis(),
		FuelName:        u.Fuel.Name,
		FuelLHV:         u.Fuel.LHV,
		DrumP:           u.DrumP,
		FeedT:           ft,
		SteamDryness:    u.dryness(),
		BlowdownKgS:     mbd,
		HeatW:           q,
		MCRKgS:          u.MCR,
		Cycling:         firing && cycling && ms > 0,
		CO2KgS:          fuel * u.Fuel.CO2Factor,
		CO2Basis:        u.Fuel.CO2Basis,
		CO2AnalysisKgS:  fuel * u.Fuel.CO2Analysis,
		HasCO2Analysis:  u.Fuel.CO2Analysis > 0,
		IMOLCV:          u.Fuel.IMOLCV,
		FlueT:           pt.FlueT,
		Lambda:          pt.Lambda,
		AirKgS:          fuel * pt.AirPerFuel,
		FlueGasKgS:      fuel * pt.FlueGasPerFuel,
	}
	if pt.Losses != nil && ms > 0 {
		l := *pt.Losses
		br.Losses = &l
	}
	if u.Burner.FanRise > 0 && br.AirKgS > 0 {
		// Air density from the ideal gas law at the fan inlet, dry air
		// (M 28.964 kg/kmol, plant-checks.md §0 [CP]); humidity changes
		// it by under 1 %.
		rho := ev.pl.Opt.AmbientPressure * 28.964e-3 / (8.314462618 * u.airT(ev))
		motor := u.Burner.MotorEta
		if motor == 0 {
			motor = 0.9
		}
		br.FanShaftW = br.AirKgS / rho * u.Burner.FanRise / u.Burner.FanEta
		br.FanElectricW = br.FanShaftW / motor
		cr.ElectricW += br.FanElectricW
	}
	if br.Cycling {
		br.OnFraction = br.LoadFraction / u.MinLoad()
		cr.warn("%s %q: demand %.0f %% of MCR is below the burner minimum %.0f %% (turndown 1:%g); it cycles on and off, firing %.0f %% of the time; each restart needs a full pre-purge",
			u.Kind(), u.Name, 100*br.LoadFraction, 100*u.MinLoad(), u.Turndown, 100*br.OnFraction)
	}
	if firing && ms > u.MCR*(1+1e-9) {
		cr.warn("%s %q: steam %.0f kg/h is above its MCR of %.0f kg/h (%.0f %%)", u.Kind(), u.Name, ms*3600, u.MCR*3600, 100*ms/u.MCR)
	}
	if warn != "" && firing && ms > 0 {
		cr.warn("%s %q: %s", u.Kind(), u.Name, warn)
	}
	if fuel > FlowFloor && u.Fuel.Notes != "" {
		cr.warn("%s %q: fuel %q: %s", u.Kind(), u.Name, u.Fuel.Name, u.Fuel.Notes)
	}
	cr.Boilers = append(cr.Boilers, br)
	cr.CO2AnalysisKgS += br.CO2AnalysisKgS
	if fuel > FlowFloor && !br.HasCO2Analysis {
		cr.CO2AnalysisUnknown = true
	}
	cr.boundary.heatIn += q
	cr.boundary.massOut += mbd
	cr.boundary.energyOut += mbd * hf
	cr.BlowdownKgS += mbd
	return nil
}

func (u *Boiler) outline(cr *CaseResult) {
	cr.Boilers = append(cr.Boilers, BoilerResult{Name: u.Name, FuelName: u.Fuel.Name})
}

func (u *Boiler) clone() Component {
	c := *u
	c.effSet = false
	c.feed, c.steam = nil, nil
	return &c
}
