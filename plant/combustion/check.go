package combustion

import (
	"fmt"
	"math"

	"steamcase/plant/fuel"
)

// DefaultDewMargin is the least margin (K) a flue gas should keep above its
// acid dew point before CheckFlueGas warns, when CheckSettings.DewMargin is
// zero: 20 K, common practice, no source. For comparison, docs/reference/plant-checks.md §4
// [CP] gives exhaust-gas economiser outlets of 165–180 °C on HFO against
// acid dew points taken as 130–140 °C, margins of 25–50 K; 20 K is the least
// of the margins heard of, and tube walls are colder than the gas.
const DefaultDewMargin = 20.0

// MaxDewMargin bounds CheckSettings.DewMargin (K): a larger margin is taken
// as a unit mistake (a temperature given for a difference).
const MaxDewMargin = 100.0

// AirO2Resolution is how close (as a dry mole fraction) an O2 reading may
// come to the air's O2 before CheckFlueGas takes it for air rather than flue
// gas: 0.001, one tenth of a percentage point, the resolution portable
// analysers show O2 in; they read fresh air as 20.9 % (common practice, no
// source).
const AirO2Resolution = 0.001

// Limits of a flue-gas reading that CheckFlueGas accepts, beyond those of
// Fire and Efficiency (common practice, no source, unless stated).
const (
	// MinCheckAirT and MaxCheckAirT bound the air temperature, which is the
	// reference of the account (−20…50 °C); preheated air is given as the
	// temperature before the air heater.
	MinCheckAirT = 253.15
	MaxCheckAirT = 323.15
	// MinCheckFlueT and MaxCheckFlueT bound the flue-gas temperature of the
	// account: 25 °C, where the SO2 data of NASA TM-4513 start, and
	// 1000 °C. The flue gas must also lie above its water dew point (see
	// CheckFlueGas).
	MinCheckFlueT = TRef
	MaxCheckFlueT = 1273.15
	// MinCheckLHV and MaxCheckLHV bound a set net specific energy (J/kg).
	MinCheckLHV = 5e6
	MaxCheckLHV = 130e6
	// MaxCheckCO is the largest CO reading (ppm by volume, dry): 10 %.
	MaxCheckCO = 1e5
	// MaxCheckLoss bounds the radiation loss at MCR and the unburnt-solids
	// loss (fractions of the LHV input): 10 %.
	MaxCheckLoss = 0.10
	// MinCheckLoad and MaxCheckLoad bound the boiler load over MCR.
	MinCheckLoad = 0.05
	MaxCheckLoad = 1.2
	// MaxSO3Conversion bounds the share of SO2 turned to SO3: 20 %, far
	// above the 1–5 % of oil firing (docs/reference/plant-checks.md §4 [M]).
	MaxSO3Conversion = 0.2
	// MinSteamT and MaxSteamT bound the atomising-steam temperature (K).
	MinSteamT = 273.15
	MaxSteamT = 873.15
)

// SiegertSource names where the Siegert coefficients (SiegertFuelOil,
// SiegertNaturalGas) come from.
const SiegertSource = "1. BImSchV annex on flue-gas loss (docs/reference/plant-checks.md §3.2 [S]: structure seen, coefficients from memory)"

// Caution is the sentence every report of a flue-gas check carries.
const Caution = "Caution: planning and audit estimate only; the makers' manuals, class and flag rules and licensed practice govern, and local codes come first."

// MeasuredGas says which gas an analyser reading gives.
type MeasuredGas int

const (
	// NoReading is the zero value: no reading given (an error).
	NoReading MeasuredGas = iota
	// MeasuredO2 is a reading of the dry O2.
	MeasuredO2
	// MeasuredCO2 is a reading of the dry CO2.
	MeasuredCO2
)

// String names the gas: "O2", "CO2" or "no reading".
func (g MeasuredGas) String() string {
	switch g {
	case MeasuredO2:
		return "O2"
	case MeasuredCO2:
		return "CO2"
	case NoReading:
		return "no reading"
	}
	return fmt.Sprintf("MeasuredGas(%d)", int(g))
}

// FlueGasReading is one flue-gas measurement at a boiler outlet, such as a
// portable analyser gives, with what is known of the fuel, the air and the
// boiler. Values are SI, and fractions are fractions (0.03 for 3 %); the
// zero value of each field is its default, as stated.
type FlueGasReading struct {
	// Fuel is the fuel fired; it needs its ultimate analysis (a built-in
	// grade has one; FuelWithAnalysis puts another on a grade). A set LHV
	// (SetLHV) must lie between 5 and 130 MJ/kg.
	Fuel fuel.Fuel

	// Gas and Dry are the reading: the dry O2 (MeasuredO2) or dry CO2
	// (MeasuredCO2) as a mole fraction. Gas is required. A dry O2 of 0 is
	// read as stoichiometric firing (λ = 1), with a warning; an O2 within
	// AirO2Resolution of the air's, or one that gives an air ratio above
	// MaxLambda, is refused. A CO2 must lie above 0, below 30 % and at most
	// the fuel's CO2 at λ = 1.
	Gas MeasuredGas
	Dry float64

	// FlueT is the flue-gas temperature where it was measured (K), above
	// AirT and at most 1000 °C; required.
	FlueT float64
	// AirT is the combustion-air temperature at the burner intake (K),
	// −20…50 °C; required. It is the reference of the account (as in
	// Siegert's formula) and the fuel is taken at it, so there is no fuel
	// or air credit.
	AirT float64

	// Humidity is the air's humidity ratio (kg water per kg dry air,
	// 0…MaxHumidity), or RelativeHumidity its relative humidity (0…1) at
	// AirT and 101.325 kPa, which needs AirT at or above 0 °C. Give one;
	// both zero mean dry air.
	Humidity, RelativeHumidity float64

	// COppmDry is the CO in the dry flue gas (ppm by volume, 0…1e5); zero
	// means no CO loss. The loss is the Siegert-type a·CO/(CO + CO2), the
	// flue gas is not corrected for it (see Efficiency).
	COppmDry float64

	// RadiationAtMCR is the radiation and convection loss at MCR as a
	// fraction of the LHV heat input (0…0.1; 0.005–0.015 is common for
	// marine auxiliary boilers, docs/reference/plant-checks.md §3.4 [CP]), scaled by
	// 1/Load. RadiationGiven says it was given, even as zero (a nonzero
	// RadiationAtMCR counts as given); without it the loss is taken as zero
	// with a warning.
	RadiationAtMCR float64
	RadiationGiven bool
	// Load is the boiler load over MCR (0.05…1.2) for the radiation loss;
	// zero means 1. A Load other than zero or one needs RadiationGiven.
	Load float64

	// Solids is the unburnt-solids (soot, coke) loss as a fraction of the
	// LHV heat input (0…0.1); zero means none.
	Solids float64

	// AtomisingSteam is the atomising steam (kg per kg fuel, 0…MaxAtomising)
	// leaving with the flue gas, AtomisingSteamT its temperature (K,
	// 273.15…873.15; zero means AirT). Zero means none.
	AtomisingSteam, AtomisingSteamT float64

	// SO3Conversion is the share of the SO2 turned to SO3 for the acid dew
	// point (0…0.2); zero means DefaultSO3Conversion (3 %).
	SO3Conversion float64
}

// ReadingField names a field of FlueGasReading (or CheckSettings), in
// errors and for CheckSettings.Name and CheckSettings.Value.
type ReadingField int

// The fields of a reading.
const (
	FieldFuel             ReadingField = iota // Fuel (its name, class and data)
	FieldAnalysis                             // Fuel.Analysis
	FieldLHV                                  // Fuel.SetLHV
	FieldGas                                  // Gas
	FieldO2                                   // Dry, for an O2 reading
	FieldCO2                                  // Dry, for a CO2 reading
	FieldFlueT                                // FlueT
	FieldAirT                                 // AirT
	FieldHumidity                             // Humidity
	FieldRelativeHumidity                     // RelativeHumidity
	FieldCO                                   // COppmDry
	FieldRadiation                            // RadiationAtMCR
	FieldLoad                                 // Load
	FieldSolids                               // Solids
	FieldAtomisingSteam                       // AtomisingSteam
	FieldAtomisingSteamT                      // AtomisingSteamT
	FieldSO3                                  // SO3Conversion
	FieldDewMargin                            // CheckSettings.DewMargin
	numFields
)

var fieldNames = [numFields]string{
	"Fuel", "Fuel.Analysis", "Fuel.SetLHV", "Gas", "Dry (O2)", "Dry (CO2)", "FlueT", "AirT",
	"Humidity", "RelativeHumidity", "COppmDry", "RadiationAtMCR", "Load", "Solids",
	"AtomisingSteam", "AtomisingSteamT", "SO3Conversion", "DewMargin",
}

// String returns the field's Go name, such as "FlueT".
func (f ReadingField) String() string {
	if f < 0 || f >= numFields {
		return fmt.Sprintf("ReadingField(%d)", int(f))
	}
	return fieldNames[f]
}

// ReadingError is a reading CheckFlueGas cannot take: the field, the value
// given (SI, as in the reading) and what was expected. Msg does not repeat
// the field or the value, so that a caller can prefix them as its user gave
// them (`--gas "30 C": ...`); Error does prefix them, in SI.
type ReadingError struct {
	Field ReadingField
	Value float64
	Msg   string
}

func (e *ReadingError) Error() string {
	return "combustion: flue-gas reading: " + e.Field.String() + " = " + defaultValue(e.Field, e.Value) + ": " + e.Msg
}

// CheckSettings change how CheckFlueGas judges and words its results. A nil
// *CheckSettings and the zero value are ready to use.
type CheckSettings struct {
	// DewMargin is the least margin (K) the flue gas should keep above the
	// acid dew point (0…MaxDewMargin); zero means DefaultDewMargin.
	DewMargin float64
	// Name returns the name the user knows a field by, such as a flag
	// ("--radiation") or a script key ("radiation"), for warnings and for
	// messages that point at another field; nil means the Go name.
	Name func(ReadingField) string
	// Value writes a value of a field (SI, as in the reading) for a
	// message, in the unit the user gave that field in (see ValuesIn); nil
	// means temperatures in °C, temperature differences in K, fractions in
	// %, specific energies in MJ/kg.
	Value func(ReadingField, float64) string
}

func (s *CheckSettings) name(f ReadingField) string {
	if s != nil && s.Name != nil {
		return s.Name(f)
	}
	return f.String()
}

func (s *CheckSettings) value(f ReadingField, v float64) string {
	if s != nil && s.Value != nil {
		return s.Value(f, v)
	}
	return defaultValue(f, v)
}

// FlueGasCheck is the result of CheckFlueGas.
type FlueGasCheck struct {
	// Reading is the reading checked, with its defaults filled in (Load,
	// SO3Conversion, AtomisingSteamT).
	Reading FlueGasReading
	// Products is the fuel burnt completely at the reading's air ratio.
	Products Products
	// ExcessAir is λ − 1 (a fraction); the air ratio is Products.Lambda.
	ExcessAir float64
	// StoichFlueGas is the wet flue gas at λ = 1 with the same air
	// humidity (kg/kg fuel).
	StoichFlueGas float64
	// Dry and Wet are the flue gas's mole fractions on the dry and the wet
	// basis (Dry[H2O] is zero).
	Dry, Wet [NumSpecies]float64
	// Losses is the heat-loss account on the LHV and the HHV basis, with
	// the air temperature as reference.
	Losses Losses
	// DewPoint is the acid dew point and the margin to it.
	DewPoint AcidDew
	// Siegert is Siegert's flue-gas loss as a cross-check of the detailed
	// dry-gas and moisture losses.
	Siegert SiegertCheck
	// Warnings are what a report must show, in words: the dew-point margin,
	// a 0 % O2 read as λ = 1, a radiation loss taken as zero, a crude
	// radiation scaling below quarter load, a fuel credit not modelled.
	// Temperatures in them are in °C.
	Warnings []string
}

// AcidDew is the acid dew point of a checked flue gas.
type AcidDew struct {
	// Known is false for a fuel without sulfur, or when the correlation
	// could not be evaluated; Note then says why.
	Known bool
	Note  string
	// Method names the correlation of VerhoffBanchero, which the margin
	// is taken from.
	Method string
	// SO3Conversion is the share of the SO2 taken as SO3.
	SO3Conversion float64
	// VerhoffBanchero is the dew point (K) by Verhoff and Banchero (1974).
	VerhoffBanchero float64
	// Okkes is the dew point (K) by Okkes (1987) when OkkesKnown: only
	// inside that correlation's range (from memory: pH2O 0.05–0.15 atm,
	// SO3 1–100 ppm); OkkesNote says why not otherwise.
	Okkes      float64
	OkkesKnown bool
	OkkesNote  string
	// Margin is the flue-gas temperature minus the Verhoff–Banchero dew
	// point (K), negative below it; MinMargin the margin asked for (K).
	Margin, MinMargin float64
}

// SiegertCheck is Siegert's flue-gas loss for the reading.
type SiegertCheck struct {
	// Known is false when the formula does not apply; Note then says why.
	Known bool
	Note  string
	// Loss is the flue-gas loss (% of the LHV input).
	Loss float64
	// Form is "O2 form" or "CO2 form", after the reading; Set names the
	// coefficients ("fuel-oil coefficients" or "natural-gas
	// coefficients"), Coefficients gives them and Source their source.
	Form, Set    string
	Coefficients SiegertCoefficients
	Source       string
	// Detailed is the dry-gas plus moisture loss of the detailed account
	// (% of the LHV input), which Siegert's formula estimates.
	Detailed float64
}

// FuelWithAnalysis returns grade g with its ultimate analysis replaced by
// an: the grade keeps its name (with " with the given analysis" added),
// class and set LHV, and loses its ISO 8217 data and second viscosity
// point, which describe the grade's typical fuel and would disagree with
// another analysis (sulfur, water, ash).
func FuelWithAnalysis(g fuel.Fuel, an fuel.Analysis) fuel.Fuel {
	g.Name += " with the given analysis"
	g.ISO = fuel.ISO8217{}
	g.Viscosity2 = fuel.ViscosityPoint{}
	g.Analysis = an
	return g
}

// CheckFlueGas works out a boiler's efficiency from a flue-gas reading by
// the heat-loss method: it validates the reading, burns the fuel completely
// with the air ratio the reading implies (Fire), draws up the loss account
// on both bases with the air temperature as reference (Efficiency), finds
// the acid dew point (AcidDewPoint, Verhoff–Banchero; Okkes beside it where
// in its range) and the margin to it, and works Siegert's formula in the
// form of the reading (O2 or CO2) as a cross-check, with the fuel-oil
// coefficients for liquid fuels and the natural-gas ones for gas.
//
// A reading it cannot take gives a *ReadingError naming the field: a value
// outside its range (see FlueGasReading), and two that only the firing
// shows: a flue gas at or below its water dew point (the account lets the
// moisture leave as vapour, so it does not hold for a condensing gas), and
// losses that add up to the whole heat input or more (an efficiency at or
// below zero: no firing boiler; the reading is of air-diluted gas or the
// temperature is wrong). The simplifications are those of Fire and Efficiency: complete combustion
// (a CO reading adds its loss but does not change the flue gas), ideal
// gases, the fuel at the air temperature, air and flue gas at 101.325 kPa.
func CheckFlueGas(r FlueGasReading, s *CheckSettings) (*FlueGasCheck, error) {
	cond, note, err := r.validate(s)
	if err != nil {
		return nil, err
	}
	margin := DefaultDewMargin
	if s != nil && s.DewMargin != 0 {
		margin = s.DewMargin
	}
	c := &FlueGasCheck{Reading: r}
	if c.Products, err = Fire(r.Fuel, cond); err != nil {
		return nil, err
	}
	p := &c.Products
	c.ExcessAir = p.Lambda - 1
	st := Conditions{Lambda: 1, AirT: cond.AirT, FuelT: cond.FuelT, Humidity: p.HumidityRatio}
	ps, err := Fire(r.Fuel, st)
	if err != nil {
		return nil, err
	}
	c.StoichFlueGas = ps.FlueGas
	c.Dry, c.Wet = p.MoleFractions(false), p.MoleFractions(true)
	if td := waterDewPoint(c.Wet[H2O] * StandardP); r.FlueT <= td {
		return nil, &ReadingError{Field: FieldFlueT, Value: r.FlueT, Msg: fmt.Sprintf(
			"the flue gas (%s) is at or below its water dew point of %s (%s %% H2O): water condenses, which this account, with the moisture leaving as vapour, does not represent",
			s.value(FieldFlueT, r.FlueT), s.value(FieldFlueT, math.Round(td*10)/10), sig(100*c.Wet[H2O], 3))}
	}
	opts := LossOptions{
		COppmDry:      r.COppmDry,
		UnburntSolids: 100 * r.Solids,
		Radiation:     Radiation{PercentAtMCR: 100 * r.RadiationAtMCR, LoadFraction: r.Load},
	}
	if c.Losses, err = Efficiency(*p, r.FlueT, r.AirT, opts); err != nil {
		return nil, err
	}
	if l := &c.Losses.LHV; !(l.Efficiency > 0) {
		f := FieldO2
		if r.Gas == MeasuredCO2 {
			f = FieldCO2
		}
		return nil, &ReadingError{Field: f, Value: r.Dry, Msg: fmt.Sprintf(
			"the losses come to %s %% of the fuel's heat input (LHV) at an air ratio λ of %s and a flue gas at %s: more than the fuel gives, which no firing boiler does; the reading or the flue-gas temperature is wrong (air leaking into the flue gas before the probe?)",
			sig(l.TotalLoss-l.TotalCredit, 4), sig(p.Lambda, 4), s.value(FieldFlueT, r.FlueT))}
	}

	var w string
	c.DewPoint, w = acidDew(p, r.FlueT, r.SO3Conversion, margin)
	if w != "" {
		c.Warnings = append(c.Warnings, w)
	}
	c.Siegert = siegertFor(r, &c.Losses)

	if note != "" {
		c.Warnings = append(c.Warnings, note)
	}
	lw := c.Losses.Warnings
	if lw&WarnNoRadiation != 0 && !r.RadiationGiven {
		c.Warnings = append(c.Warnings, "no radiation and convection loss given ("+s.name(FieldRadiation)+"): taken as zero, so the efficiency is overstated by it (0.5 to 1.5 % at MCR is common for marine auxiliary boilers)")
	}
	if lw&WarnLowLoadRadiation != 0 {
		c.Warnings = append(c.Warnings, "below 25 % load the 1/load scaling of the radiation loss is crude")
	}
	if lw&WarnFuelSensibleNotModelled != 0 {
		c.Warnings = append(c.Warnings, "the fuel's sensible heat is not modelled for this fuel; the fuel credit is taken as zero")
	}
	return c, nil
}

// validate checks the reading in the order a user reads it (fuel, reading,
// temperatures, air, losses, dew point), fills its defaults in place and
// returns the firing conditions and the note for a 0 % O2.
func (r *FlueGasReading) validate(s *CheckSettings) (Conditions, string, error) {
	var cond Conditions
	if err := r.validateFuel(s); err != nil {
		return Conditions{}, "", err
	}
	note, err := r.validateGas(s, &cond)
	if err != nil {
		return Conditions{}, "", err
	}
	if err := r.validateTemperatures(s, &cond); err != nil {
		return Conditions{}, "", err
	}
	if err := r.validateHumidity(s, &cond); err != nil {
		return Conditions{}, "", err
	}
	if err := r.validateLosses(s); err != nil {
		return Conditions{}, "", err
	}
	if err := r.validateAtomising(s, &cond); err != nil {
		return Conditions{}, "", err
	}
	if err := r.validateDewPoint(s); err != nil {
		return Conditions{}, "", err
	}
	return cond, note, nil
}

// badReading is the error of a reading's field f given as v.
func badReading(f ReadingField, v float64, format string, a ...any) error {
	return &ReadingError{Field: f, Value: v, Msg: fmt.Sprintf(format, a...)}
}

// validateFuel checks the fuel: its ultimate analysis (each value a mass
// fraction, adding up to one), a set LHV, and the rest of the fuel's
// data.
func (r *FlueGasReading) validateFuel(s *CheckSettings) error {
	val := s.value
	f := &r.Fuel
	an := f.Analysis
	if !an.Given() {
		return badReading(FieldAnalysis, 0, "fuel %q has no ultimate analysis, which the combustion needs; give %s", f.Name, s.name(FieldAnalysis))
	}
	for _, e := range [...]struct {
		key string
		v   float64
	}{{"C", an.C}, {"H", an.H}, {"S", an.S}, {"N", an.N}, {"O", an.O}, {"W", an.Water}, {"A", an.Ash}} {
		if !(e.v >= 0 && e.v <= 1) {
			return badReading(FieldAnalysis, e.v, "%s = %s; each value must lie between %s and %s by mass", e.key, val(FieldAnalysis, e.v), val(FieldAnalysis, 0), val(FieldAnalysis, 1))
		}
	}
	if sum := an.Sum(); !(math.Abs(sum-1) <= fuel.SumTolerance) {
		return badReading(FieldAnalysis, sum, "the values add up to %s; they must add up to %s within %s (as fired, with W and A)",
			val(FieldAnalysis, sum), val(FieldAnalysis, 1), val(FieldAnalysis, fuel.SumTolerance))
	}
	if f.SetLHV != 0 && !(f.SetLHV >= MinCheckLHV && f.SetLHV <= MaxCheckLHV) {
		return badReading(FieldLHV, f.SetLHV, "a net specific energy must lie between %s and %s; got %s",
			val(FieldLHV, MinCheckLHV), val(FieldLHV, MaxCheckLHV), val(FieldLHV, f.SetLHV))
	}
	if err := f.Validate(); err != nil {
		return badReading(FieldFuel, 0, "fuel %q: %v", f.Name, err)
	}
	return nil
}

// validateGas checks the analyser's reading (a dry O2 below the air's, or
// a dry CO2 the fuel can give, neither meaning nearly air), sets it in
// cond and returns the note for a 0 % O2, read as λ = 1.
func (r *FlueGasReading) validateGas(s *CheckSettings, cond *Conditions) (string, error) {
	val := s.value
	f := &r.Fuel
	var note string
	airO2 := StandardDryAir[O2]
	switch r.Gas {
	case MeasuredO2:
		o2 := r.Dry
		switch {
		case !(o2 >= 0):
			return "", badReading(FieldO2, o2, "a measured O2 cannot be negative")
		case o2 >= airO2-AirO2Resolution:
			return "", badReading(FieldO2, o2, "no combustion: an O2 at or near that of air (%s dry, which analysers show as %s): the burner is not firing, or the probe is not in the flue gas",
				val(FieldO2, airO2), val(FieldO2, 0.209))
		case o2 == 0:
			cond.Lambda = 1
			note = "an O2 reading of 0 % is taken as stoichiometric firing (λ = 1); in practice it means incomplete combustion (CO, soot), which this complete-combustion account does not represent"
		default:
			st, err := Stoichiometry(*f, StandardDryAir)
			if err != nil {
				return "", badReading(FieldFuel, 0, "fuel %q: %v", f.Name, err)
			}
			if l, err := LambdaFromO2(o2, st.Ratio(), st.AirO2); err == nil && l > MaxLambda {
				o2max := airO2 * (MaxLambda - 1) / (MaxLambda - 1 + st.Ratio())
				return "", badReading(FieldO2, o2, "nearly air: it means an air ratio λ of %s, more than the %g the account takes (λ = %g at an O2 of %s); the burner is hardly firing or air leaks into the flue gas before the probe",
					sig(l, 4), MaxLambda, MaxLambda, val(FieldO2, roundTo(o2max, 1e-4)))
			}
			cond.O2Dry = o2
		}
	case MeasuredCO2:
		co2 := r.Dry
		if !(co2 > 0 && co2 < maxMeasuredCO2) {
			return "", badReading(FieldCO2, co2, "a measured dry CO2 must be above %s and below %s", val(FieldCO2, 0), val(FieldCO2, maxMeasuredCO2))
		}
		st, err := Stoichiometry(*f, StandardDryAir)
		if err != nil {
			return "", badReading(FieldFuel, 0, "fuel %q: %v", f.Name, err)
		}
		if co2 > st.CO2Max {
			return "", badReading(FieldCO2, co2, "above the fuel's maximum CO2 of %s (dry, at λ = 1): complete combustion cannot give it; the reading or the fuel is wrong, or the burner fires with too little air",
				val(FieldCO2, roundTo(st.CO2Max, 1e-4)))
		}
		if l, err := LambdaFromCO2(co2, st.CO2Max, st.Ratio()); err == nil && l > MaxLambda {
			co2min := st.CO2Max / (1 + (MaxLambda-1)/st.Ratio())
			return "", badReading(FieldCO2, co2, "nearly air: it means an air ratio λ of %s, more than the %g the account takes (λ = %g at a CO2 of %s); the burner is hardly firing or air leaks into the flue gas before the probe",
				sig(l, 4), MaxLambda, MaxLambda, val(FieldCO2, roundTo(co2min, 1e-4)))
		}
		cond.CO2Dry = co2
	default:
		return "", badReading(FieldGas, float64(r.Gas), "no flue-gas reading: give the dry O2 or the dry CO2 the analyser measured")
	}
	return note, nil
}

// validateTemperatures snaps the temperatures to a bound they lie within
// boundSlack of ("-20 C" reads as 253.14999999999998 K), checks the air
// and flue-gas temperatures (the flue gas hotter than the air) and sets
// them in cond, the fuel at the air temperature.
func (r *FlueGasReading) validateTemperatures(s *CheckSettings, cond *Conditions) error {
	val := s.value
	r.AirT = snap(r.AirT, MinCheckAirT, MaxCheckAirT)
	r.FlueT = snap(r.FlueT, MinCheckFlueT, MaxCheckFlueT)
	if r.AtomisingSteamT != 0 {
		r.AtomisingSteamT = snap(r.AtomisingSteamT, MinSteamT, MaxSteamT)
	}
	switch {
	case r.AirT == 0:
		return badReading(FieldAirT, 0, "the combustion-air temperature is required: it is the reference of the loss account")
	case !(r.AirT >= MinCheckAirT && r.AirT <= MaxCheckAirT):
		return badReading(FieldAirT, r.AirT, "the air temperature is the reference of the loss account, which must lie between %s and %s; got %s (for preheated air, give the temperature before the air heater)",
			val(FieldAirT, MinCheckAirT), val(FieldAirT, MaxCheckAirT), val(FieldAirT, r.AirT))
	}
	switch {
	case r.FlueT == 0:
		return badReading(FieldFlueT, 0, "the flue-gas temperature is required")
	case !(r.FlueT > r.AirT):
		return badReading(FieldFlueT, r.FlueT, "the flue gas (%s) is not hotter than the combustion air (%s); a firing boiler's flue gas leaves hotter than the air comes in",
			val(FieldFlueT, r.FlueT), val(FieldAirT, r.AirT))
	case !(r.FlueT <= MaxCheckFlueT):
		return badReading(FieldFlueT, r.FlueT, "the flue-gas temperature must be at most %s for the heat-loss account; got %s",
			val(FieldFlueT, MaxCheckFlueT), val(FieldFlueT, r.FlueT))
	case !(r.FlueT >= MinCheckFlueT):
		return badReading(FieldFlueT, r.FlueT, "the flue-gas temperature must be at least %s for the heat-loss account (where its SO2 data start); got %s",
			val(FieldFlueT, MinCheckFlueT), val(FieldFlueT, r.FlueT))
	}
	cond.AirT, cond.FuelT = r.AirT, r.AirT
	return nil
}

// validateHumidity checks the air's humidity (a ratio or a relative
// humidity above 0 °C, not both) and sets it in cond.
func (r *FlueGasReading) validateHumidity(s *CheckSettings, cond *Conditions) error {
	val := s.value
	switch {
	case r.Humidity != 0 && r.RelativeHumidity != 0:
		return badReading(FieldHumidity, r.Humidity, "give the humidity ratio or the relative humidity (%s), not both", s.name(FieldRelativeHumidity))
	case !(r.Humidity >= 0 && r.Humidity <= MaxHumidity):
		return badReading(FieldHumidity, r.Humidity, "a humidity ratio must lie between 0 and %g kg/kg dry air", MaxHumidity)
	case !(r.RelativeHumidity >= 0 && r.RelativeHumidity <= 1):
		return badReading(FieldRelativeHumidity, r.RelativeHumidity, "a relative humidity must lie between %s and %s",
			val(FieldRelativeHumidity, 0), val(FieldRelativeHumidity, 1))
	case r.RelativeHumidity > 0 && r.AirT < 273.15:
		return badReading(FieldRelativeHumidity, r.RelativeHumidity, "a relative humidity below 0 °C air is not modelled (saturation over ice); give the humidity ratio in kg/kg")
	}
	cond.Humidity, cond.RelativeHumidity = r.Humidity, r.RelativeHumidity
	return nil
}

// validateLosses checks the losses beyond the flue gas (CO, radiation at
// MCR with its load, unburnt solids), marking a nonzero radiation as
// given and a zero load as full load.
func (r *FlueGasReading) validateLosses(s *CheckSettings) error {
	val := s.value
	if !(r.COppmDry >= 0 && r.COppmDry <= MaxCheckCO) {
		return badReading(FieldCO, r.COppmDry, "the CO must lie between 0 and %g ppm (10 %%)", MaxCheckCO)
	}
	if !(r.RadiationAtMCR >= 0 && r.RadiationAtMCR <= MaxCheckLoss) {
		return badReading(FieldRadiation, r.RadiationAtMCR, "the radiation and convection loss at MCR must lie between %s and %s",
			val(FieldRadiation, 0), val(FieldRadiation, MaxCheckLoss))
	}
	if r.RadiationAtMCR != 0 && !r.RadiationGiven {
		r.RadiationGiven = true
	}
	if r.Load != 0 && r.Load != 1 && !r.RadiationGiven {
		return badReading(FieldLoad, r.Load, "the load scales the radiation and convection loss: give %s with it", s.name(FieldRadiation))
	}
	if r.Load == 0 {
		r.Load = 1
	}
	if !(r.Load >= MinCheckLoad && r.Load <= MaxCheckLoad) {
		return badReading(FieldLoad, r.Load, "the load must lie between %s and %s of MCR", val(FieldLoad, MinCheckLoad), val(FieldLoad, MaxCheckLoad))
	}
	if !(r.Solids >= 0 && r.Solids <= MaxCheckLoss) {
		return badReading(FieldSolids, r.Solids, "the unburnt-solids loss must lie between %s and %s", val(FieldSolids, 0), val(FieldSolids, MaxCheckLoss))
	}
	return nil
}

// validateAtomising checks the atomising steam and its temperature (the
// air's when not given) and sets them in cond.
func (r *FlueGasReading) validateAtomising(s *CheckSettings, cond *Conditions) error {
	val := s.value
	switch {
	case !(r.AtomisingSteam >= 0 && r.AtomisingSteam <= MaxAtomising):
		return badReading(FieldAtomisingSteam, r.AtomisingSteam, "the atomising steam must lie between 0 and %g kg per kg fuel", MaxAtomising)
	case r.AtomisingSteam == 0 && r.AtomisingSteamT != 0:
		return badReading(FieldAtomisingSteamT, r.AtomisingSteamT, "a temperature of the atomising steam needs the atomising steam (%s)", s.name(FieldAtomisingSteam))
	case r.AtomisingSteam != 0 && r.AtomisingSteamT == 0:
		r.AtomisingSteamT = r.AirT
	}
	if r.AtomisingSteam != 0 && !(r.AtomisingSteamT >= MinSteamT && r.AtomisingSteamT <= MaxSteamT) {
		return badReading(FieldAtomisingSteamT, r.AtomisingSteamT, "the atomising steam's temperature must lie between %s and %s",
			val(FieldAtomisingSteamT, MinSteamT), val(FieldAtomisingSteamT, MaxSteamT))
	}
	cond.AtomisingSteam, cond.AtomisingSteamT = r.AtomisingSteam, r.AtomisingSteamT
	return nil
}

// validateDewPoint checks what the acid dew point is found with: the
// SO2 to SO3 conversion (DefaultSO3Conversion when zero) and the margin
// asked for.
func (r *FlueGasReading) validateDewPoint(s *CheckSettings) error {
	val := s.value
	if r.SO3Conversion == 0 {
		r.SO3Conversion = DefaultSO3Conversion
	}
	if !(r.SO3Conversion > 0 && r.SO3Conversion <= MaxSO3Conversion) {
		return badReading(FieldSO3, r.SO3Conversion, "the SO2 to SO3 conversion must be above %s and at most %s (%s to %s is usual in oil firing)",
			val(FieldSO3, 0), val(FieldSO3, MaxSO3Conversion), val(FieldSO3, 0.01), val(FieldSO3, 0.05))
	}
	if s != nil && s.DewMargin != 0 && !(s.DewMargin > 0 && s.DewMargin <= MaxDewMargin) {
		return badReading(FieldDewMargin, s.DewMargin, "the margin to the acid dew point must be above %s and at most %s",
			val(FieldDewMargin, 0), val(FieldDewMargin, MaxDewMargin))
	}
	return nil
}

// waterDewPoint returns the temperature (K) at which water vapour of
// partial pressure pv (Pa) saturates, by the IAPWS-IF97 saturation-
// temperature equation (IAPWS R7-97(2012) Eq. 31, the exact inverse of the
// saturation-pressure equation psatIF97 uses), valid 611.213 Pa…22.064 MPa;
// 0 for a vapour that would not condense above 0 °C (including none).
func waterDewPoint(pv float64) float64 {
	const pmin, pmax = 611.213, 22.064e6
	if !(pv > pmin) {
		return 0
	}
	if pv >= pmax {
		return 647.096
	}
	b := math.Sqrt(math.Sqrt(pv / 1e6))
	e := b*b + sat3*b + sat6
	f := sat1*b*b + sat4*b + sat7
	g := sat2*b*b + sat5*b + sat8
	d := 2 * g / (-f - math.Sqrt(f*f-4*e*g))
	return (sat10 + d - math.Sqrt((sat10+d)*(sat10+d)-4*(sat9+sat10*d))) / 2
}

// boundSlack is how near (K) a temperature may come to a bound of the
// check and be taken as the bound: the rounding of a value in °C or °F to
// kelvin, far below any reading's resolution.
const boundSlack = 1e-9

// snap returns the bound v lies within boundSlack of, or v.
func snap(v float64, bounds ...float64) float64 {
	for _, b := range bounds {
		if math.Abs(v-b) <= boundSlack {
			return b
		}
	}
	return v
}

// acidDew finds the acid dew point of p by Verhoff–Banchero, and by Okkes
// where in its range, and the warning on the margin to it, if any.
func acidDew(p *Products, flueT, so3 float64, margin float64) (AcidDew, string) {
	d := AcidDew{Method: "Verhoff-Banchero (1974)", SO3Conversion: so3, MinMargin: margin}
	if p.Fuel.Analysis.S == 0 {
		d.Note = "the fuel has no sulfur, so there is no acid dew point (only the water dew point)"
		return d, ""
	}
	t, err := AcidDewPoint(*p, 0, so3, MethodVerhoffBanchero)
	if err != nil {
		x := p.MoleFractions(true)
		d.Note = fmt.Sprintf("not computed: the Verhoff-Banchero correlation needs water vapour and SO3 with 0 < pSO3 < pH2O, and this flue gas has %s %% H2O and %s ppm SO3 (wet)",
			sig(100*x[H2O], 4), sig(1e6*so3*x[SO2], 4))
		return d, "the acid dew point could not be computed (" + d.Note + "); check the margin to it by other means"
	}
	d.Known, d.VerhoffBanchero, d.Margin = true, t, flueT-t
	if o, err := AcidDewPoint(*p, 0, so3, MethodOkkes); err == nil {
		d.Okkes, d.OkkesKnown = o, true
	} else {
		d.OkkesNote = "outside the range of the Okkes correlation (pH2O 0.05 to 0.15 atm, SO3 1 to 100 ppm; from memory)"
	}
	return d, dewWarning(&d, flueT)
}

// dewWarning words a short margin to a known acid dew point ("" if none).
func dewWarning(d *AcidDew, flueT float64) string {
	c := func(T float64) string { return fixed(T-273.15, 1) }
	t := d.VerhoffBanchero
	switch {
	case flueT <= t && fixed(t-flueT, 1) == fixed(0, 1):
		return fmt.Sprintf("the flue gas at %s °C is at the acid dew point of %s °C: sulfuric acid condenses on the surfaces it touches", c(flueT), c(t))
	case flueT <= t:
		return fmt.Sprintf("the flue gas at %s °C is %s K below the acid dew point of %s °C: sulfuric acid condenses on the surfaces it touches",
			c(flueT), fixed(t-flueT, 1), c(t))
	case flueT < t+d.MinMargin && d.MinMargin == DefaultDewMargin:
		return fmt.Sprintf("the flue gas at %s °C is less than %s K above the acid dew point of %s °C; a margin of at least %s K is common practice (no source), and tube walls are colder than the gas",
			c(flueT), sig(d.MinMargin, 6), c(t), sig(d.MinMargin, 6))
	case flueT < t+d.MinMargin:
		return fmt.Sprintf("the flue gas at %s °C is less than %s K above the acid dew point of %s °C, the margin asked for; tube walls are colder than the gas",
			c(flueT), sig(d.MinMargin, 6), c(t))
	}
	return ""
}

// siegertFor works Siegert's formula in the form of the reading.
func siegertFor(r FlueGasReading, l *Losses) SiegertCheck {
	sc := SiegertCheck{Coefficients: SiegertFuelOil, Set: "fuel-oil coefficients", Source: SiegertSource,
		Detailed: l.LHV.DryGas + l.LHV.Moisture()}
	if r.Fuel.Class == fuel.Gas {
		sc.Coefficients, sc.Set = SiegertNaturalGas, "natural-gas coefficients"
	}
	var err error
	if r.Gas == MeasuredCO2 {
		sc.Form = "CO2 form"
		sc.Loss, err = SiegertCO2(r.FlueT, r.AirT, r.Dry, sc.Coefficients)
		if err != nil {
			sc.Note = fmt.Sprintf("not available: Siegert's CO2 form is used for a dry CO2 above 1 %% and below 30 %%; the reading is %s %%", sig(100*r.Dry, 6))
		}
	} else {
		sc.Form = "O2 form"
		sc.Loss, err = Siegert(r.FlueT, r.AirT, r.Dry, sc.Coefficients)
		if err != nil {
			sc.Note = fmt.Sprintf("not available: Siegert's O2 form is used for a dry O2 below 21 %%; the reading is %s %%", sig(100*r.Dry, 6))
		}
	}
	sc.Known = err == nil
	if !sc.Known {
		sc.Loss = 0
	}
	return sc
}
