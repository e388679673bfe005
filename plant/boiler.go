package plant

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"steamcase/plant/combustion"
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
	// Notes is what a reader of the fuel's figures must see, naming the
	// fuel (the warnings of a bunker delivery note, joined by "; ": an off-spec
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
// Below its burner minimum (MCR / Turndown) it cycles on and off (see
// cycleHeat): the burner fires at its minimum rate, at the efficiency of
// that rate (reduced by CyclingLoss if one is given), for the share of the
// time that covers the steam, the standby loss of the warm boiler while the
// burner is off, and the heat each start's pre-purge blows out of the
// furnace; the fuel is the time average.
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
	// CyclingLoss is a fraction of efficiency lost while the boiler cycles
	// below its burner minimum, besides the standby and purge losses; zero
	// means none.
	CyclingLoss float64
	// StandbyLoss is the heat the warm boiler loses by radiation and
	// convection from its casing at the drum temperature, W: what the
	// burner must make up while it is off. Zero means the efficiency
	// model's casing loss (see standbyLoss).
	StandbyLoss float64
	// PurgeAir is the air volume of one pre-purge, m³ at the fan inlet;
	// zero means the purge losses are not counted. Each start blows it
	// through the warm furnace (see purgeHeat).
	PurgeAir float64
	// StartsPerHour is a given number of burner starts per hour while the
	// boiler cycles; zero means the starts follow from the cycle of the
	// burner's pressure band (CycleBand) and the boiler's water content
	// (WaterContent).
	StartsPerHour float64
	// CycleBand is the pressure difference between the burner's stop and
	// its restart, Pa, centred on the drum pressure; WaterContent is the
	// water the boiler holds, kg. The heat stored in the water between the
	// two saturation states sets the length of each on and off period.
	CycleBand, WaterContent float64
	// EtaFactor scales the efficiency model's figure (zero means 1): the
	// knob an audit turns for an uncertain efficiency.
	EtaFactor  float64
	Efficiency EfficiencyModel
	Fuel       FuelSpec

	// Burner holds the burner and forced-draught fan; its zero value is a
	// burner whose fan is not modelled.
	Burner Burner

	// MaxLoad is the most the boiler may raise, as a fraction of its MCR
	// (a case may lower it: a boiler limited by a fault); zero means 1.
	MaxLoad float64
	// InertGas declares the boiler's uptake a source of the inert-gas
	// system during cargo discharge (inertgas.go); it needs a combustion
	// model of the efficiency for the flue gas's O2 and volume.
	InertGas bool

	feed, steam *Line
	fuel        int
	eqs         [4]int
	mt, mf, mh  memo
	effOp       BoilerOperation
	effPt       EfficiencyPoint
	effSet      bool
	// effProd and effLoss hold the flue gas and losses effPt points to,
	// for a model that writes into them (pointFiller).
	effProd combustion.Products
	effLoss combustion.LossItems
	// mcrPt, mcrProd and mcrLoss are etaAtMCR's scratch.
	mcrPt   EfficiencyPoint
	mcrProd combustion.Products
	mcrLoss combustion.LossItems
	cyc     cycleParams // the case's cycling figures (prepare)
	warmed  bool        // a warming consumer keeps it warm (set by the consumer's link)
}

// cycleParams are a boiler's figures of its on-off cycling below its
// burner minimum, fixed for a case by prepare: the standby loss W = S +
// C·e (e the heat per kg of steam, so that a loss given as a fraction of
// the heat input at MCR follows the feed), the heat each purge takes, the
// heat stored in the pressure band and a given start rate.
type cycleParams struct {
	S, C     float64 // W, and kg/s times e
	Ep       float64 // J per start
	DE       float64 // J stored between restart and stop; zero: not known
	N        float64 // given starts per second; zero: from DE
	Min      float64 // steam at the burner minimum, kg/s
	HS, HF   float64 // drum steam and saturated water, J/kg
	Beta     float64 // blowdown over steam, bd/(1 − bd)
	Fraction float64 // the standby loss as a fraction of the heat input at MCR, when so given
	EtaMCR   float64 // the efficiency at MCR behind it
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
	// ExcessAir is the burner's excess air (λ − 1, 0.15 for 15 %), from
	// which the fan's air follows with the fuel's stoichiometric air when
	// the efficiency is a plain table; a combustion model gives its own
	// air. It is needed only for the fan of a boiler with a plain table.
	ExcessAir float64
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
		JSON: "steam_dryness", Source: SourceLeftOut},
		func(u *Boiler) *float64 { return &u.Dryness }),
	boilerKey(Key{Name: "blowdown", Label: "blowdown fraction", Dim: units.Fraction, Example: "1 %",
		Doc: "blowdown as a fraction of the feed (or tds_feed/tds_max)", Default: 0, HasDefault: true,
		Min: 0, Max: 0.2, Case: true, Source: SourceLeftOut},
		func(u *Boiler) *float64 { return &u.Blowdown }),
	boilerKey(Key{Name: "tds_feed", Label: "feed TDS", Kind: KeyNumber, Example: "20",
		Doc: "dissolved solids in the feed, in the unit of tds_max: blowdown = tds_feed/tds_max"},
		func(u *Boiler) *float64 { return &u.TDSFeed }),
	boilerKey(Key{Name: "tds_max", Label: "TDS limit", Kind: KeyNumber, Example: "2000",
		Doc: "dissolved solids allowed in the boiler water"},
		func(u *Boiler) *float64 { return &u.TDSMax }),
	boilerKey(Key{Name: "turndown", Label: "burner turndown ratio", Kind: KeyNumber, Example: "4",
		Doc: "burner turndown (4 means 1:4): below MCR/turndown the burner cycles", DefaultNote: "cycling not checked",
		Min: 1, Max: 20, Source: SourceLeftOut},
		func(u *Boiler) *float64 { return &u.Turndown }),
	boilerKey(Key{Name: "cycling_loss", Label: "cycling loss", Dim: units.Fraction, Example: "2 %",
		Doc: "a fraction of efficiency lost while cycling, besides the standby and purge losses", Default: 0, HasDefault: true, Min: 0, Max: 0.2, Source: SourceLeftOut},
		func(u *Boiler) *float64 { return &u.CyclingLoss }),
	boilerKey(Key{Name: "standby_loss", Label: "standby loss", Dim: units.Power, Example: "25 kW",
		Doc:         "heat the warm boiler loses from its casing at the drum temperature, made up while it cycles (or by warming steam)",
		DefaultNote: "the efficiency model's casing loss (a furnace model's radiation_loss; a flue-gas table's radiation times the heat input at MCR); else 1 % of the heat input at MCR",
		Source:      "docs/reference/plant-checks.md §3.4 [CP]", Min: 0, Max: 1e8, Case: true, JSON: "standby_loss_kW"},
		func(u *Boiler) *float64 { return &u.StandbyLoss }),
	boilerKey(Key{Name: "purge_air", Label: "purge air volume", Dim: units.Volume, Example: "40 m3",
		Doc: "air blown through the furnace by one pre-purge, at the fan inlet (with starts_per_hour, or cycle_band and water_content)", DefaultNote: "purge losses not counted",
		Min: 0, Max: 1e5, Source: SourceLeftOut},
		func(u *Boiler) *float64 { return &u.PurgeAir }),
	boilerKey(Key{Name: "starts_per_hour", Label: "burner starts per hour", Kind: KeyNumber, Example: "6",
		Doc: "burner starts per hour while cycling", DefaultNote: "from cycle_band and water_content", Min: 0, Max: 120, Case: true,
		JSON: "starts_per_hour", Source: SourceDerived},
		func(u *Boiler) *float64 { return &u.StartsPerHour }),
	boilerKey(Key{Name: "cycle_band", Label: "burner pressure band", Kind: KeyPressureDiff, Example: "1 bar",
		Doc: "pressure difference between the burner's stop and restart, about the drum pressure (with water_content)", DefaultNote: "the starts are not known",
		Min: 1e3, Max: 2e6, Source: SourceLeftOut},
		func(u *Boiler) *float64 { return &u.CycleBand }),
	boilerKey(Key{Name: "water_content", Label: "water content", Dim: units.Mass, Example: "6 t",
		Doc: "water the boiler holds at its working level (with cycle_band)", DefaultNote: "not known", Min: 1, Max: 1e7, Source: SourceLeftOut},
		func(u *Boiler) *float64 { return &u.WaterContent }),
	boilerKey(Key{Name: "eta_factor", Label: "efficiency factor", Dim: units.Fraction, Example: "0.98",
		Doc: "scales the efficiency model's figure (an audit's knob)", Default: 1, HasDefault: true,
		Min: 0.5, Max: 1.5, Case: true, Source: SourceLeftOut},
		func(u *Boiler) *float64 { return &u.EtaFactor }),
	boilerKey(Key{Name: "max_load", Label: "max load", Dim: units.Fraction, Example: "90 %",
		Doc: "the most the boiler may raise, as a fraction of its MCR (a case may lower it)", Default: 1, HasDefault: true,
		Source: "the MCR is the continuous limit", Min: 0.05, Max: 1, Case: true, JSON: "limit_kg_h"},
		func(u *Boiler) *float64 { return &u.MaxLoad }),
	flag(Key{Name: "inert_gas", Label: "inert-gas source", Example: "true", Default: 0, HasDefault: true, Case: true,
		Doc:  "the boiler's uptake feeds the inert-gas system during cargo discharge (needs a flue_gas or furnace efficiency)",
		JSON: "inert_gas_source", Source: SourceLeftOut},
		self[*Boiler], func(u *Boiler) *bool { return &u.InertGas }),
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
	{Name: "burner", Label: "burner", Kind: KeyTable, Example: `{ fan_rise = "3 kPa", fan_eta = "60 %", excess_air = "15 %" }`,
		Doc: "the burner's fan: fan_rise, fan_eta, motor_eta, air_T, and excess_air (needed for the fan with a plain efficiency table)"},
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

// maxLoad is the most the boiler may raise as a fraction of its MCR.
func (u *Boiler) maxLoad() float64 {
	if u.MaxLoad == 0 {
		return 1
	}
	return u.MaxLoad
}

// Limit is the most steam the boiler may raise in the case, kg/s: its MCR
// times its max load.
func (u *Boiler) Limit() float64 { return u.MCR * u.maxLoad() }

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
	for _, k := range [...]string{"standby_loss", "purge_air", "starts_per_hour", "cycle_band", "water_content"} {
		checkKey(fs, u, k)
	}
	if (u.CycleBand > 0) != (u.WaterContent > 0) {
		fs.add(u.Pos, u.Name, "", "cycle_band and water_content go together: the heat stored between the burner's stop and restart needs both")
	}
	if u.PurgeAir > 0 && u.StartsPerHour == 0 && u.CycleBand == 0 {
		fs.add(u.Pos, u.Name, "", "purge_air needs the starts it is blown at: give starts_per_hour, or cycle_band with water_content")
	}
	if u.Turndown == 0 && (u.PurgeAir > 0 || u.StartsPerHour > 0 || u.CycleBand > 0) {
		fs.add(u.Pos, u.Name, "", "purge and cycling figures need the burner's turndown, below which it cycles")
	}
	checkKey(fs, u, "eta_factor")
	checkKey(fs, u, "max_load")
	if u.InertGas {
		if _, plain := u.Efficiency.(*EfficiencyTable); plain {
			fs.add(u.Pos, u.Name, "", "is an inert-gas source (inert_gas = true), but its efficiency is a plain table: the inert gas's O2 and volume need a combustion model (efficiency = { flue_gas = ... } or { furnace = ... })")
		}
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
		if _, plain := u.Efficiency.(*EfficiencyTable); plain {
			switch {
			case u.Burner.ExcessAir == 0:
				fs.add(u.Pos, u.Name, "", "its burner's fan (fan_rise) moves the combustion air, which a plain efficiency table does not give: give the burner's excess air (burner = { excess_air = \"15 %%\", ... }), or an efficiency from a flue-gas table or the furnace")
			case u.Fuel.Fuel == nil:
				fs.add(u.Pos, u.Name, "", "its burner's fan needs the fuel's stoichiometric air: give the fuel as a built-in grade (its analysis), not by its lhv alone")
			default:
				checkRange(fs, u, "burner excess air", u.Burner.ExcessAir, 0, 2, "")
			}
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
	if cycling && ev.pl.firing(u) {
		// The burner fires at its minimum while it is on: the time average
		// over the on fraction.
		if c := u.cycle(ev); c.f > 0 {
			fuel /= c.f
		}
	}
	return BoilerOperation{Load: fire, DrumP: u.DrumP, FeedT: ft, AirT: u.airT(ev), FuelFlow: fuel, Fuel: u.Fuel}, cycling, nil
}

// defaultStandbyFraction is the standby loss of a boiler whose efficiency
// model has no casing loss: 1 % of the heat input at MCR, the middle of
// the 0.5-1.5 % at MCR of marine auxiliary boilers (docs/reference/plant-checks.md §3.4
// [CP]).
const defaultStandbyFraction = 0.01

// nominalFeedT is the feed temperature at which prepare evaluates a
// combustion model at MCR for the heat input behind a standby loss given
// as a fraction of it (60 °C, a hotwell's usual figure, docs/reference/plant-checks.md
// §3.5 [M/CP]); the loss itself follows the case's feed (cycleParams).
const nominalFeedT = 333.15

// prepare fixes the case's cycling figures: the standby loss, the heat of
// one purge, the heat stored in the burner's pressure band and a given
// start rate.
func (u *Boiler) prepare(pl *Plant, c Conditions) error {
	var cp cycleParams
	var err error
	if cp.HS, err = hPX(u.DrumP, u.dryness()); err != nil {
		return wrapErr(u, err)
	}
	if cp.HF, err = hLiquidSat(u.DrumP); err != nil {
		return wrapErr(u, err)
	}
	bd := u.blowdown()
	cp.Beta = bd / (1 - bd)
	cp.Min = u.MinLoad() * u.MCR
	if err := u.prepareStandby(&cp, c); err != nil {
		return wrapErr(u, err)
	}
	if u.PurgeAir > 0 {
		if cp.Ep, err = purgeHeat(u.PurgeAir, u.airTOf(c), u.DrumP, pl.Opt.AmbientPressure); err != nil {
			return wrapErr(u, err)
		}
	}
	if u.CycleBand > 0 && u.WaterContent > 0 {
		lo, hi := u.DrumP-u.CycleBand/2, u.DrumP+u.CycleBand/2
		hLo, err1 := hLiquidSat(lo)
		hHi, err2 := hLiquidSat(hi)
		if err := errors.Join(err1, err2); err != nil {
			return compErr(u, "cycle_band %.2f bar about the drum pressure: %v", u.CycleBand/1e5, err)
		}
		cp.DE = u.WaterContent * (hHi - hLo)
	}
	cp.N = u.StartsPerHour / 3600
	u.cyc = cp
	return nil
}

// prepareStandby fixes the standby loss: the given one; else the casing
// loss of the efficiency model, in W for a furnace model and as a
// fraction of the heat input at MCR for a flue-gas table; else
// defaultStandbyFraction of the heat input at MCR. The heat input at MCR
// is the heat to steam at MCR over the efficiency at MCR, so that the loss
// follows the case's feed: W = fraction·MCR·e/η_MCR with e the heat per kg
// of steam (cycleHeat). Simplification: the casing loss, in W, is taken
// as the same whether the burner is on or off (docs/reference/plant-checks.md §3.4 [M]:
// the loss in kW is roughly constant with load).
func (u *Boiler) prepareStandby(cp *cycleParams, c Conditions) error {
	if u.StandbyLoss > 0 {
		cp.S = u.StandbyLoss
		return nil
	}
	frac := defaultStandbyFraction
	switch m := u.Efficiency.(type) {
	case *FurnaceTubes:
		if m.RadiationLoss > 0 {
			cp.S = m.RadiationLoss
			return nil
		}
	case *FlueGasTable:
		if m.RadiationAtMCR > 0 {
			frac = m.RadiationAtMCR
		}
	}
	if u.Efficiency == nil || (u.Turndown == 0 && !u.warmed) {
		return nil // neither cycling nor kept warm: no standby loss is taken
	}
	eta, err := u.etaAtMCR(c, cp)
	if err != nil {
		return fmt.Errorf("the efficiency at MCR behind the standby loss: %w", err)
	}
	cp.Fraction, cp.EtaMCR = frac, eta
	cp.C = frac * u.MCR / eta
	return nil
}

// etaAtMCR is the efficiency model's figure at MCR, with the feed at
// nominalFeedT; a model that depends on the firing rate is evaluated at
// the fuel flow that gives MCR, found by two steps from 85 %, and one that
// reads only the load (a flue-gas table) once, the second step giving the
// same figure. EtaFactor is left out: it is an audit's knob on the
// combustion, and the casing's loss in kW does not follow it.
func (u *Boiler) etaAtMCR(c Conditions, cp *cycleParams) (float64, error) {
	hfw, err := hPT(u.DrumP+3e5, nominalFeedT)
	if err != nil {
		return 0, err
	}
	q := u.MCR * ((cp.HS - hfw) + cp.Beta*(cp.HF-hfw))
	eta := 0.85
	steps := 2
	if lo, ok := u.Efficiency.(interface{ loadOnly() bool }); ok && lo.loadOnly() {
		steps = 1
	}
	for i := 0; i < steps; i++ {
		op := BoilerOperation{Load: 1, DrumP: u.DrumP, FeedT: nominalFeedT, AirT: u.airTOf(c),
			FuelFlow: q / (u.Fuel.LHV * eta), Fuel: u.Fuel}
		var pt EfficiencyPoint
		if f, ok := u.Efficiency.(pointFiller); ok {
			// Into the boiler's scratch, apart from its memo's.
			if err := f.efficiencyInto(op, &u.mcrPt, &u.mcrProd, &u.mcrLoss); err != nil {
				return 0, err
			}
			pt = u.mcrPt
		} else if pt, err = u.Efficiency.Efficiency(op); err != nil {
			return 0, err
		}
		if !finite(pt.Eta) || pt.Eta <= 0 || pt.Eta > 1 {
			return 0, fmt.Errorf("efficiency %g at MCR is not between 0 and 1", pt.Eta)
		}
		eta = pt.Eta
	}
	return eta, nil
}

// purgeHeat is the heat one pre-purge takes from the warm boiler, J: the
// purge air, vol m³ at the fan inlet (dry air by the ideal gas law at
// airT and the ambient pressure pAmb), heated from airT to the drum's
// saturation temperature, with the enthalpy of dry air from the NASA
// polynomials of plant/combustion. Simplification: the air leaves at the
// water's temperature, which the furnace and tubes of a warm boiler are
// at; air that leaves cooler takes less.
func purgeHeat(vol, airT, drumP, pAmb float64) (float64, error) {
	tSat, err := waterTsat(drumP)
	if err != nil {
		return 0, err
	}
	air, err := combustion.NewMixture(combustion.StandardDryAir)
	if err != nil {
		return 0, err
	}
	h1, err1 := air.H(airT)
	h2, err2 := air.H(tSat)
	if err := errors.Join(err1, err2); err != nil {
		return 0, err
	}
	rho := pAmb * air.MolarMass() / (gasConstant * airT)
	return rho * vol * (h2 - h1), nil
}

// gasConstant is the molar gas constant, J/(mol·K) (CODATA 2018, exact).
const gasConstant = 8.314462618

// cycleState is a cycling boiler's heat account at the present unknowns.
type cycleState struct {
	q          float64 // heat the burner must raise per second, averaged, W
	dqdu, dqdv float64 // its derivatives by u = ms·e and v = e
	f          float64 // the burner's on fraction
	n          float64 // starts per second; zero when not known
	standby    float64 // the standby loss, W
	e, de      float64 // heat per kg of steam, and its derivative by the feed enthalpy
}

// cycle evaluates the cycling account at the present unknowns (see
// cycleHeat): e = (h_s − h_fw) + β·(h_f − h_fw) per kg of steam, from the
// drum's own steam and water, so that the account depends on the steam
// flow and the feed enthalpy alone.
func (u *Boiler) cycle(ev *eval) cycleState {
	cp := &u.cyc
	hfw := ev.h(u.feed)
	e := (cp.HS - hfw) + cp.Beta*(cp.HF-hfw)
	st := cycleHeat(cp, ev.m(u.steam)*e, e)
	st.e, st.de = e, -(1 + cp.Beta)
	return st
}

// cycleHeat is the heat a boiler's burner must raise, time-averaged, when
// the boiler cycles below its burner minimum, for steam heat u = ms·e (W)
// and heat per kg of steam v = e (J/kg). While on, the burner fires at its
// minimum and raises q_min = M·v (M the steam at the minimum); while off,
// the warm boiler loses its standby loss W = S + C·v; each start's purge
// takes Ep from the boiler's stored heat. Over a cycle the heat raised
// while on covers the steam, the standby loss over the off time and the
// purges: f·q_min = u + (1 − f)·W + n·Ep, with f the on fraction and n the
// starts per second.
//
// With the heat stored between the burner's restart and stop, ΔE (the
// water's sensible heat between the two saturation states, the steel's
// neglected), the on time is (ΔE + Ep)/(q_min − u) and the off time
// ΔE/(u + W), which give f and n: the on-off cycle of a pressure-switched
// burner (common practice, no source). With a given n instead, f follows
// from the balance; with neither, the purges are not counted (Ep = 0).
// The average heat is f·q_min.
func cycleHeat(cp *cycleParams, u, v float64) cycleState {
	m, c, s := cp.Min, cp.C, cp.S
	qmin := m * v
	w := s + c*v
	g := u + w
	var st cycleState
	st.standby = w
	if cp.N == 0 && cp.DE > 0 {
		a, b := cp.DE+cp.Ep, cp.DE
		d := a*g + b*(qmin-u)
		if !(d > 0) {
			return st
		}
		st.f = a * g / d
		st.n = (qmin - u) * g / d
		dfdu := a * b * (qmin + w) / (d * d)
		dfdv := a * b * (c*(qmin-u) - g*m) / (d * d)
		st.q = st.f * qmin
		st.dqdu = qmin * dfdu
		st.dqdv = m*st.f + qmin*dfdv
		return st
	}
	p := cp.N * cp.Ep
	den := qmin + w
	if !(den > 0) {
		return st
	}
	st.f = (g + p) / den
	st.n = cp.N
	dfdu := 1 / den
	dfdv := (c*den - (g+p)*(m+c)) / (den * den)
	st.q = st.f * qmin
	st.dqdu = qmin * dfdu
	st.dqdv = m*st.f + qmin*dfdv
	return st
}

// standbyW is the boiler's standby loss at the present feed, W, and its
// derivative by the feed enthalpy: what warming steam must bring a boiler
// that does not fire.
func (u *Boiler) standbyW(ev *eval) (w, dw float64) {
	cp := &u.cyc
	hfw := ev.h(u.feed)
	e := (cp.HS - hfw) + cp.Beta*(cp.HF-hfw)
	return cp.S + cp.C*e, -cp.C * (1 + cp.Beta)
}

// airT is the combustion air temperature: the burner's own, else the
// case's air temperature, else 25 °C.
func (u *Boiler) airT(ev *eval) float64 { return u.airTOf(ev.cond) }

func (u *Boiler) airTOf(c Conditions) float64 {
	switch {
	case u.Burner.AirT > 0:
		return u.Burner.AirT
	case c.AirT > 0:
		return c.AirT
	}
	return 298.15
}

func (u *Boiler) eta(ev *eval) (pt EfficiencyPoint, cycling bool, err error) {
	op, cycling, err := u.operation(ev)
	if err != nil {
		return EfficiencyPoint{}, false, err
	}
	if lo, ok := u.Efficiency.(interface{ loadOnly() bool }); ok && lo.loadOnly() {
		// The model reads the load, the air and the fuel alone: the
		// memo (and the Jacobian's differences in the feed and the fuel
		// flow, exactly zero) need not evaluate it again.
		op.FeedT, op.FuelFlow = 0, 0
	}
	if u.effSet && op == u.effOp {
		pt = u.effPt
	} else {
		if f, ok := u.Efficiency.(pointFiller); ok {
			// Into the boiler's own storage (the memo's point, its flue
			// gas and losses) until the next evaluation at another
			// operation.
			u.effSet = false
			err = f.efficiencyInto(op, &u.effPt, &u.effProd, &u.effLoss)
			pt = u.effPt
		} else {
			pt, err = u.Efficiency.Efficiency(op)
		}
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
	pt, cycling, err := u.eta(ev)
	if err != nil {
		return wrapErr(u, err)
	}
	if cycling && ev.pl.firing(u) {
		// Below the burner minimum the burner raises the steam, the
		// standby loss over its off time and the purges (cycleHeat).
		q = u.cycle(ev).q
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

	lhv := u.Fuel.LHV
	j.add(e[3], u.fuel, lhv*eta)
	if cycling && ev.pl.firing(u) {
		// r = fuel·LHV·η − Q(u, v), u = ms·e(hfw), v = e(hfw).
		c := u.cycle(ev)
		j.add(e[3], u.steam.mIdx(), -c.dqdu*c.e)
		j.add(e[3], u.feed.hIdx(), -(c.dqdu*ms+c.dqdv)*c.de)
	} else {
		// r = fuel·LHV·η − q, q = ms·(hs − hfw) + (mf − ms)·(hf − hfw).
		j.add(e[3], u.steam.mIdx(), -(hs - hf))
		j.add(e[3], u.steam.hIdx(), -ms)
		j.add(e[3], u.feed.hIdx(), mf)
		j.add(e[3], u.feed.mIdx(), -(hf - hfw))
	}

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
		Name:             u.Name,
		Firing:           firing,
		LoadFraction:     ms / u.MCR,
		SteamKgS:         ms,
		FuelKgS:          fuel,
		Efficiency:       eta,
		FiringEfficiency: eta,
		EfficiencyBasis:  u.Efficiency.Basis(),
		FuelName:         u.Fuel.Name,
		FuelLHV:          u.Fuel.LHV,
		DrumP:            u.DrumP,
		FeedT:            ft,
		SteamDryness:     u.dryness(),
		BlowdownKgS:      mbd,
		HeatW:            q,
		MCRKgS:           u.MCR,
		Cycling:          firing && cycling && fuel > FlowFloor,
		CO2KgS:           fuel * u.Fuel.CO2Factor,
		CO2Basis:         u.Fuel.CO2Basis,
		CO2AnalysisKgS:   fuel * u.Fuel.CO2Analysis,
		HasCO2Analysis:   u.Fuel.CO2Analysis > 0,
		IMOLCV:           u.Fuel.IMOLCV,
		FlueT:            pt.FlueT,
		Lambda:           pt.Lambda,
		AirKgS:           fuel * pt.AirPerFuel,
		FlueGasKgS:       fuel * pt.FlueGasPerFuel,
		LimitKgS:         u.Limit(),
		InertGasSource:   u.InertGas,
	}
	if pr := pt.Products; pr != nil && firing && fuel > FlowFloor {
		br.O2Dry = pr.MoleFractions(false)[combustion.O2]
		br.DryFlueNm3S = fuel * pr.NormalVolume(false)
	}
	if pt.Losses != nil && fuel > FlowFloor {
		l := *pt.Losses
		br.Losses = &l
	}
	if u.Burner.FanRise > 0 && br.AirKgS == 0 && fuel > 0 && u.Fuel.Fuel != nil && u.Burner.ExcessAir > 0 {
		// A plain table: the air from the fuel's stoichiometric air at
		// the burner's excess air (plant/combustion).
		prod, err := combustion.Fire(*u.Fuel.Fuel, combustion.Conditions{Lambda: 1 + u.Burner.ExcessAir, AirT: u.airT(ev)})
		if err != nil {
			return wrapErr(u, err)
		}
		br.AirKgS = fuel * prod.Air
		br.Lambda = prod.Lambda
	}
	if u.Burner.FanRise > 0 && br.AirKgS > 0 {
		// Air density from the ideal gas law at the fan inlet, dry air
		// (M 28.964 kg/kmol, docs/reference/plant-checks.md §0 [CP]); humidity changes
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
		c := u.cycle(ev)
		br.OnFraction = c.f
		br.StandbyLossW = c.standby
		br.StandbyOffW = (1 - c.f) * c.standby
		br.StartsPerHour = 3600 * c.n
		br.PurgePerStartJ = u.cyc.Ep
		br.PurgeW = c.n * u.cyc.Ep
		if fuel*u.Fuel.LHV > 0 {
			// The time average: heat to water and steam over the fuel's.
			br.Efficiency = q / (fuel * u.Fuel.LHV)
		}
		if c.f > 1+1e-9 {
			return compErr(u, "at %.1f starts per hour the purges (%.0f kJ each) and the standby loss need the burner on more than all the time (%.0f %%): the starts given do not fit this demand",
				br.StartsPerHour, u.cyc.Ep/1e3, 100*c.f)
		}
		counted := fmt.Sprintf("standby loss %.1f kW over the off time", br.StandbyOffW/1e3)
		switch {
		case u.cyc.Ep > 0 && c.n > 0:
			counted += fmt.Sprintf(", purges %.1f kW (%.1f starts per hour, %.0f kJ each)", br.PurgeW/1e3, br.StartsPerHour, u.cyc.Ep/1e3)
		case u.cyc.Ep == 0 && c.n > 0:
			counted += fmt.Sprintf("; %.1f starts per hour, whose purges are not counted (give purge_air)", br.StartsPerHour)
		default:
			counted += "; the purges are not counted (give purge_air, with starts_per_hour or cycle_band and water_content)"
		}
		cr.warn("%s %q: demand %.0f %% of MCR is below the burner minimum %.0f %% (turndown 1:%g); it cycles on and off, firing %.0f %% of the time; each restart needs a full pre-purge; counted: %s",
			u.Kind(), u.Name, 100*br.LoadFraction, 100*u.MinLoad(), u.Turndown, 100*br.OnFraction, counted)
	}
	if firing && ms > u.MCR*(1+1e-9) {
		cr.warn("%s %q: steam %.0f kg/h is above its MCR of %.0f kg/h (%.0f %%)", u.Kind(), u.Name, ms*3600, u.MCR*3600, 100*ms/u.MCR)
	} else if firing && ms > u.Limit()*(1+1e-9) {
		cr.warn("%s %q: steam %.0f kg/h is above its limit of %.0f kg/h (max load %.0f %% of MCR)", u.Kind(), u.Name, ms*3600, u.Limit()*3600, 100*u.maxLoad())
	}
	if warn != "" && firing && ms > 0 {
		cr.warn("%s %q: %s", u.Kind(), u.Name, warn)
	}
	if fuel > FlowFloor && u.Fuel.Notes != "" {
		cr.warn("%s %q: %s", u.Kind(), u.Name, u.Fuel.Notes)
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
	c.warmed = false
	c.feed, c.steam = nil, nil
	return &c
}
