package plant

import (
	"fmt"
	"math"

	"steamcase/plant/combustion"
	"steamcase/plant/fuel"
)

// FuelSpec is what a boiler needs to know of its fuel for the energy
// balance: the lower calorific value and the CO2 conversion factor.
type FuelSpec struct {
	Name      string
	LHV       float64 // lower calorific value, J/kg
	CO2Factor float64 // kg CO2 per kg fuel
	// Fuel is the full description, which the combustion models need;
	// nil for a boiler with a plain efficiency table.
	Fuel *fuel.Fuel
}

// SpecFromFuel fills a FuelSpec from a fuel's own figures (its net
// specific energy and CO2 factor, each from the source the fuel states).
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
	return FuelSpec{Name: f.Name, LHV: e.Net, CO2Factor: c.IMOOrAnalysis(), Fuel: &ff}, nil
}

// BoilerOperation is the state of a boiler that its efficiency may depend
// on.
type BoilerOperation struct {
	Load  float64 // steam flow as a fraction of MCR (the firing rate while firing)
	DrumP float64 // Pa
	FeedT float64 // K
	AirT  float64 // combustion air temperature, K
	// FuelFlow is the fuel flow while the burner fires, kg/s (the
	// time-averaged flow over the on fraction when it cycles).
	FuelFlow float64
	Fuel     FuelSpec
}

// EfficiencyPoint is a boiler's efficiency at one operating point, with
// what a combustion model knows besides.
type EfficiencyPoint struct {
	// Eta is heat to steam and blowdown over fuel flow times the LHV.
	Eta float64
	// Warning says where the model went outside the range it knows.
	Warning string

	// From a combustion model (zero when the model is a plain table):
	FlueT          float64 // flue-gas exit temperature, K
	Lambda         float64 // air ratio
	AirPerFuel     float64 // wet combustion air, kg/kg fuel
	FlueGasPerFuel float64 // wet flue gas, kg/kg fuel
	Losses         *combustion.LossItems
	// Products and LossOptions let a flue-gas economiser after the boiler
	// redo the loss account at its own gas outlet temperature.
	Products    *combustion.Products
	LossOptions combustion.LossOptions
}

// EfficiencyModel gives a boiler's efficiency: heat to steam and blowdown
// divided by fuel flow times the fuel's lower calorific value. A maker's
// test table is the simplest; the combustion models compute it by the
// heat-loss method.
type EfficiencyModel interface {
	Efficiency(op BoilerOperation) (EfficiencyPoint, error)
	// Basis names the calorific value the efficiency refers to ("LHV").
	Basis() string
}

// EfficiencyTable is a maker's test: efficiency (LHV basis) against load
// fraction of MCR, interpolated linearly. Outside the tested loads it holds
// the end value and says so in a warning.
type EfficiencyTable struct {
	Load []float64 // fractions of MCR, strictly increasing
	Eta  []float64 // efficiencies, 0..1
}

// Validate checks the table.
func (t *EfficiencyTable) Validate() error {
	if len(t.Load) == 0 || len(t.Load) != len(t.Eta) {
		return fmt.Errorf("efficiency table needs as many efficiencies as loads and at least one; got %d loads and %d efficiencies", len(t.Load), len(t.Eta))
	}
	for i := range t.Load {
		if !finite(t.Load[i]) || t.Load[i] < 0 || t.Load[i] > 1.5 {
			return fmt.Errorf("efficiency table load %g is not a fraction of MCR between 0 and 1.5", t.Load[i])
		}
		if i > 0 && t.Load[i] <= t.Load[i-1] {
			return fmt.Errorf("efficiency table loads must increase; %g follows %g", t.Load[i], t.Load[i-1])
		}
		if !finite(t.Eta[i]) || t.Eta[i] <= 0.3 || t.Eta[i] > 1 {
			return fmt.Errorf("efficiency %g at load %g is not between 0.3 and 1", t.Eta[i], t.Load[i])
		}
	}
	return nil
}

// Efficiency interpolates the table at op.Load.
func (t *EfficiencyTable) Efficiency(op BoilerOperation) (EfficiencyPoint, error) {
	eta, warn := interpolate(t.Load, t.Eta, op.Load, "efficiency table")
	return EfficiencyPoint{Eta: eta, Warning: warn}, nil
}

// interpolate is linear interpolation in a table of loads; outside the
// table it holds the end value and returns a warning that says so.
func interpolate(loads, vals []float64, x float64, what string) (float64, string) {
	n := len(loads)
	switch {
	case x <= loads[0]:
		if x < loads[0]-1e-9 && n > 1 {
			return vals[0], fmt.Sprintf("load %.0f %% is below the %s's lowest load %.0f %%; its value there is used", 100*x, what, 100*loads[0])
		}
		return vals[0], ""
	case x >= loads[n-1]:
		if x > loads[n-1]+1e-9 {
			return vals[n-1], fmt.Sprintf("load %.0f %% is above the %s's highest load %.0f %%; its value there is used", 100*x, what, 100*loads[n-1])
		}
		return vals[n-1], ""
	}
	i := 1
	for loads[i] < x {
		i++
	}
	f := (x - loads[i-1]) / (loads[i] - loads[i-1])
	return vals[i-1] + f*(vals[i]-vals[i-1]), ""
}

// Basis is "LHV".
func (t *EfficiencyTable) Basis() string { return "LHV" }

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
	UnitBase
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
	checkRange(fs, u, "MCR", u.MCR, 1e-3, 500, "kg/s")
	checkRange(fs, u, "drum pressure", u.DrumP, 1.1e5, 2.2e7, "Pa")
	if u.Dryness != 0 {
		checkRange(fs, u, "steam dryness", u.Dryness, 0.8, 1, "")
	}
	checkRange(fs, u, "blowdown fraction", u.Blowdown, 0, 0.2, "")
	if u.Blowdown == 0 && u.TDSMax > 0 {
		checkRange(fs, u, "feed TDS", u.TDSFeed, 0, u.TDSMax*0.2, "(same unit as the TDS limit; blowdown fraction is TDS feed / TDS limit, at most 0.2)")
	}
	if u.Turndown != 0 {
		checkRange(fs, u, "burner turndown ratio", u.Turndown, 1, 20, "")
	}
	checkRange(fs, u, "cycling loss", u.CyclingLoss, 0, 0.2, "")
	if u.EtaFactor != 0 {
		checkRange(fs, u, "efficiency factor", u.EtaFactor, 0.5, 1.5, "")
	}
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

func (u *Boiler) assemble(a *assembly, ports map[string][]*Line) {
	u.feed, u.steam = one(ports["feed"]), one(ports["steam"])
	u.fuel = a.variable(u.Name+": fuel flow", 0.1, 0, math.Inf(1), 0.05)
	u.eqs[0] = a.equation(u.Name+": drum pressure", scaleP, u.steam.pIdx())
	u.eqs[1] = a.equation(u.Name+": steam dryness", scaleH, u.steam.pIdx(), u.steam.hIdx())
	u.eqs[2] = a.equation(u.Name+": feed and blowdown", 1, u.feed.mIdx(), u.steam.mIdx())
	u.eqs[3] = a.equation(u.Name+": fuel from the energy balance", scaleQ,
		u.fuel, u.feed.mIdx(), u.feed.pIdx(), u.feed.hIdx(), u.steam.mIdx(), u.steam.pIdx(), u.steam.hIdx())
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
		return wrapUnitErr(u, err)
	}
	q, err := u.heat(ev)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	pt, _, err := u.eta(ev)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	eta := pt.Eta
	r[u.eqs[0]] = ev.p(u.steam) - u.DrumP
	r[u.eqs[1]] = ev.h(u.steam) - hs
	r[u.eqs[2]] = ev.m(u.feed)*(1-u.blowdown()) - ev.m(u.steam)
	r[u.eqs[3]] = ev.x[u.fuel]*u.Fuel.LHV*eta - q
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
		return wrapUnitErr(u, err)
	}
	eta, warn := pt.Eta, pt.Warning
	ms, mf := ev.m(u.steam), ev.m(u.feed)
	mbd := mf - ms
	hf, err := u.mf.get1(u.DrumP, hLiquidSat)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	ft, err := tPH(ev.p(u.feed), ev.h(u.feed))
	if err != nil {
		return wrapUnitErr(u, err)
	}
	q, err := u.heat(ev)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	firing := ev.disp.firing(u)
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
	cr.Boilers = append(cr.Boilers, br)
	cr.boundary.heatIn += q
	cr.boundary.massOut += mbd
	cr.boundary.energyOut += mbd * hf
	cr.BlowdownKgS += mbd
	return nil
}

func (u *Boiler) param(name string) (*float64, error) {
	switch name {
	case "dryness":
		return &u.Dryness, nil
	case "blowdown":
		return &u.Blowdown, nil
	case "mcr":
		return &u.MCR, nil
	case "drum_p":
		return &u.DrumP, nil
	case "eta_factor":
		return &u.EtaFactor, nil
	}
	return nil, paramErr(u, name, "dryness", "blowdown", "mcr", "drum_p", "eta_factor")
}
