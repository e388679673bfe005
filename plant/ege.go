package plant

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"steamcase/plant/combustion"
	"steamcase/plant/fuel"
	"steamcase/plant/heat"
	"steamcase/plant/units"
	"steamcase/plant/water"
)

// EngineExhaust describes the main engine's exhaust against its load, as
// the engine's project guide gives it (docs/reference/plant-checks.md §7 gives indicative
// values [M]; a real engine's come from its maker), at the engine's
// reference conditions (ExhaustGasEconomiser corrects it to the site's).
// Between the tabulated loads the figures are interpolated linearly;
// outside them the end values hold, with a warning.
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

// AmbientMode says whether the engine's exhaust table is corrected from
// its reference conditions to the site's.
type AmbientMode int

const (
	// AmbientCorrect: the table holds at the reference conditions (RefAirT,
	// RefCoolantT) and is corrected to the case's intake air and coolant.
	AmbientCorrect AmbientMode = iota
	// AmbientAsGiven: the table holds at the site; no correction.
	AmbientAsGiven
)

// FoulingState says which moment of the cleaning cycle a case takes.
type FoulingState int

const (
	// FoulingMean is the mean over a cleaning interval: the steam of a
	// row whose hours fall anywhere in the cycle.
	FoulingMean FoulingState = iota
	// FoulingClean is just after soot blowing or water washing.
	FoulingClean
	// FoulingEnd is at the end of the interval, before the next cleaning.
	FoulingEnd
)

// ExhaustGasEconomiser raises steam from the main engine's exhaust. Its
// evaporator sees water at the saturation temperature of its drum, so the
// gas leaves at
//
//	T_out = T_sat + (T_in − T_sat)·exp(−NTU),  NTU = UA/(ṁ_gas·c̄p)
//
// (ε-NTU with one stream at constant temperature, docs/reference/plant-checks.md §7 [C]),
// and off design UA scales as ṁ_gas^n (n 0.6-0.8, common practice: gas-side
// h ∝ Re^0.6 in tube banks, Re^0.8 in tubes). The steam it raises is the
// duty over the enthalpy rise from its feed to the steam. Steam beyond the
// plant's demand goes to a dump condenser.
//
// The engine's table holds at its reference conditions (ISO 15550 and ISO
// 3046-1: 25 °C intake air, 25 °C charge-air coolant; from memory, and
// docs/reference/plant-checks.md §7 [M]) and is corrected linearly to the case's intake
// air and coolant: T_in = T_table + a·ΔT_air + b·ΔT_coolant and ṁ = ṁ_table
// ·(1 + c·ΔT_air + d·ΔT_coolant). The maker's coefficients replace the
// defaults (a = 1.6 K/K, c = −0.35 %/K: docs/reference/plant-checks.md §7 [M], low
// confidence; b = d = 0). The size (UA, or the design pinch) belongs to the
// table as given: it does not change with the case.
//
// Gas-side fouling (soot) grows between soot blowing or water washing,
// over CleanInterval running hours, either as a fouling resistance growing
// linearly with running hours on a clean surface of overall coefficient
// CleanU (1/UA_f = 1/UA + R_f/A, A = UA_ref/U; docs/reference/heat-transfer.md §5 [CP/M]:
// "model soot as a time-varying resistance"), or as UA falling linearly to
// FouledUA of its clean value. Cleaning restores the clean UA. A case takes
// the mean duty over the interval (Gauss–Legendre, 8 points), the clean or
// the end state (Fouling); the preheating section fouls by the same
// fraction as the evaporator (a simplification). The steam lost to fouling
// is the clean unit's steam less the fouled one's at the case's feed.
//
// The cold end: with ExhaustFuel and ExhaustO2 the exhaust's acid dew
// point follows from the fuel's sulphur (combustion.AcidDewPoint,
// Verhoff–Banchero, with SO3Conversion of the SO2 as SO3); a gas outlet
// below it plus DewMargin, a preheating section's water inlet below it, or
// an evaporator whose saturation lies below it is a warning that gives
// both figures. Soot: a case at an engine load below SootRiskLoad, or with
// the gas through the tube bank slower than SootVelocity (with FlowArea),
// is flagged and warned about: soot builds up at low load and low gas
// velocity, and soot fires in exhaust-gas economisers are a known hazard
// (common practice, no source; the maker's figures replace the defaults).
type ExhaustGasEconomiser struct {
	Base
	Engine  EngineExhaust
	DrumP   float64 // pressure of the steam raised, Pa absolute
	Dryness float64 // 0..1; zero means 1

	// The size, either UA (W/K) at a reference gas flow, or a design
	// point: the engine load DesignLoad at which the gas leaves
	// DesignPinch kelvin above the saturation temperature. UA holds at
	// DesignGasFlow (kg/s) if given, else at the gas flow of the table at
	// DesignLoad if given (so that a unit sized by UA scales with gas flow
	// as one sized by its pinch), else at every flow (constant UA).
	UA, DesignGasFlow       float64
	DesignLoad, DesignPinch float64
	// Exponent n of UA ∝ ṁ_gas^n; zero means 0.65.
	Exponent float64

	// GasCp is a constant mean specific heat of the exhaust, J/(kg K).
	// Zero means: from the NASA polynomials (plant/combustion) for the
	// exhaust of ExhaustFuel burnt to ExhaustO2 (dry), or, without those,
	// 1060 J/(kg K) (docs/reference/plant-checks.md §7: 1.04-1.07 kJ/kg·K at 180-260 °C
	// [M]). ExhaustFuel and ExhaustO2 also give the exhaust's composition
	// for the acid dew point and its molar mass.
	GasCp       float64
	ExhaustFuel *fuel.Fuel
	ExhaustO2   float64

	// MinGasOutT is the lowest acceptable gas temperature leaving the
	// economiser (acid dew point plus a margin; 165-180 °C on high-sulfur
	// fuel is common practice, docs/reference/plant-checks.md §4 [CP]). Zero: not checked.
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

	// The site correction of the engine's table (see the type's doc).
	Ambient                      AmbientMode
	RefAirT, RefCoolantT         float64 // K; zero means 298.15 K
	IntakeT                      float64 // K; zero: the case's air plus IntakeRise
	IntakeRise                   float64 // K of intake air above the outside air
	CoolantT                     float64 // K; zero: the case's sea
	TPerAirK, GasPerAirK         float64 // zero: 1.6 K/K and −0.0035 /K
	TPerCoolantK, GasPerCoolantK float64 // zero: none

	// Fouling (see the type's doc). FoulingRate is the gas-side fouling
	// resistance added per 1000 h of running, m²K/W; CleanU the clean
	// overall coefficient at the size's reference flow, W/(m²K); FouledUA
	// the UA at the end of the interval as a fraction of the clean UA;
	// CleanInterval the running time between cleanings, s.
	FoulingRate, CleanU, FouledUA, CleanInterval float64
	Fouling                                      FoulingState

	// The cold end: SO3Conversion is the share of SO2 taken as SO3 (zero:
	// combustion.DefaultSO3Conversion); DewMargin the margin asked above
	// the acid dew point (zero: combustion.DefaultDewMargin).
	SO3Conversion, DewMargin float64

	// Soot: SootRiskLoad (zero: 40 %), and FlowArea (m², the free gas
	// flow area of the tube bank) with SootVelocity (m/s).
	SootRiskLoad, FlowArea, SootVelocity float64

	feed, steam *Line
	eqs         [4]int
	mcpw        memo
	mh          memo
	op          egeOperation
}

// egeOperation is the economiser's gas side in a case.
type egeOperation struct {
	load, mGas, tIn, tSat float64
	// the state of the case (clean, mean or end of the cleaning interval)
	// and the clean state at the same gas flow
	gas, clean gasState
	ua0        float64 // clean UA at the size's reference gas flow
	uaClean    float64 // clean UA at the case's gas flow
	ntu        float64
	// the table's figures at the load and the site correction
	tTable, mTable, intakeT, coolantT, dT, gasFactor float64
	corrected                                        bool
	// the acid dew point of the exhaust (0 when not known) and the soot
	// flags
	dew, velocity float64
	soot          bool
	warn          []string
}

// gasState is the evaporator's gas side at one UA: its duty, the gas
// leaving it (before any bypassed gas joins), the bypassed share, the mean
// cp between inlet and outlet, the UA, and whether the gas through it falls
// below the minimum.
type gasState struct {
	q, tOut, bypass, cp, ua float64
	belowMin                bool
}

// NewExhaustGasEconomiser returns an exhaust-gas economiser; give it its
// engine, drum pressure and size.
func NewExhaustGasEconomiser() *ExhaustGasEconomiser { return &ExhaustGasEconomiser{} }

// defaultEGEExponent is n of UA ∝ ṁ_gas^n when none is given: 0.65,
// within the 0.6-0.8 of tube banks and tubes (docs/reference/plant-checks.md §7 [S]).
const defaultEGEExponent = 0.65

// defaultEGEGasCp is the exhaust's mean specific heat without a fuel and
// O2 for the NASA polynomials: 1060 J/(kg K), within the 1.04-1.07 kJ/kg·K
// of lean exhaust at 180-260 °C (docs/reference/plant-checks.md §7 [M]).
const defaultEGEGasCp = 1060

// The site correction's defaults: the reference conditions of ISO 15550
// and ISO 3046-1 (25 °C air and charge-air coolant; from memory), and the
// exhaust temperature and gas mass per kelvin of intake air of
// docs/reference/plant-checks.md §7 [M] (about +1.6 K and −0.3 to −0.4 %; the middle).
const (
	defaultEGERefT       = 298.15
	defaultEGETPerAirK   = 1.6
	defaultEGEGasPerAirK = -0.0035
	// egeCorrectionSpan is how far (K) the intake air or coolant may lie
	// from the reference before the linear correction is warned about:
	// makers state such corrections for a limited range (common practice,
	// no source).
	egeCorrectionSpan = 25
)

// defaultEGESootRiskLoad is the engine load below which a case counts as
// one where soot builds up and soot fires are a known risk: 40 % of MCR
// (common practice, no source; low-load and slow-steaming operation).
const defaultEGESootRiskLoad = 0.4

// exhaustMolarMass is the molar mass of lean engine exhaust taken without
// its fuel and O2, kg/mol: that of air, 28.96 g/mol (docs/reference/plant-checks.md §0
// [CP]), as the exhaust at λ ≈ 3-4 is mostly air.
const exhaustMolarMass = 0.028964

// hoursS is one hour in seconds.
const hoursS = 3600.0

func egeKey(k Key, f func(*ExhaustGasEconomiser) *float64) Key {
	return num(k, self[*ExhaustGasEconomiser], f)
}

var egeKeys = []Key{
	egeKey(Key{Name: "drum", Label: "drum pressure", Dim: units.Pressure, Example: "7 bar(g)",
		Doc: "pressure of the steam raised", Required: true, Min: 1.1e5, Max: 5e6, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.DrumP }),
	egeKey(Key{Name: "dryness", Label: "steam dryness", Dim: units.Fraction, Example: "99 %",
		Doc: "dryness of the steam raised", Default: 1, HasDefault: true, Min: 0.8, Max: 1, Case: true, Source: SourceLeftOut},
		func(u *ExhaustGasEconomiser) *float64 { return &u.Dryness }),
	{Name: "engine", Label: "engine", Kind: KeyTable, Required: true,
		Example: `{ mcr = "12 MW", { load = "25 %", gas = "11 kg/kWh", T = "250 C" }, { load = "100 %", gas = "8.2 kg/kWh", T = "258 C" } }`,
		Doc:     "the main engine's MCR and its exhaust (gas per kWh or a mass flow, temperature) against load, at the engine's reference conditions"},
	egeKey(Key{Name: "ua", Label: "UA", Dim: units.ThermalConductance, Example: "60 kW/K",
		Doc: "the evaporator's size as UA at design_gas, or at the gas flow of design_load, or constant without either; or give design_load with pinch",
		Min: 1, Max: 1e8, Case: true, Clears: []string{"pinch"}},
		func(u *ExhaustGasEconomiser) *float64 { return &u.UA }),
	egeKey(Key{Name: "design_gas", Label: "design gas flow", Dim: units.MassFlow, Example: "30 kg/s",
		Doc: "gas flow at which ua holds", DefaultNote: "the gas flow at design_load, or ua is constant", Min: 0.01, Max: 1e3, Case: true, Source: SourceDerived},
		func(u *ExhaustGasEconomiser) *float64 { return &u.DesignGasFlow }),
	egeKey(Key{Name: "design_load", Label: "design engine load", Dim: units.Fraction, Example: "85 %",
		Doc: "engine load at which the gas leaves pinch above saturation (with pinch), or at whose gas flow ua holds", Min: 0.1, Max: 1.2, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.DesignLoad }),
	egeKey(Key{Name: "pinch", Label: "design pinch", Dim: units.TemperatureDifference, Example: "15 K",
		Doc: "gas outlet above saturation at design_load (the table as given)", Min: 1, Max: 200, Case: true,
		Clears: []string{"ua", "design_gas"}},
		func(u *ExhaustGasEconomiser) *float64 { return &u.DesignPinch }),
	egeKey(Key{Name: "exponent", Label: "UA exponent n (UA ∝ gas flow^n)", Kind: KeyNumber, Example: "0.65",
		Doc: "n of UA ∝ gas flow^n off design", Default: defaultEGEExponent, HasDefault: true,
		Source: "docs/reference/plant-checks.md §7 [S]", Min: 0.5, Max: 1, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.Exponent }),
	egeKey(Key{Name: "gas_cp", Label: "exhaust gas cp", Dim: units.SpecificHeat, Example: "1.06 kJ/kgK",
		Doc: "a constant mean specific heat of the exhaust", Default: defaultEGEGasCp, HasDefault: true,
		Source: "docs/reference/plant-checks.md §7 [M]", Min: 900, Max: 1300, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.GasCp }),
	{Name: "exhaust_fuel", Label: "exhaust fuel", Kind: KeyText, Example: `"VLSFO"`, Case: true,
		Doc:  "the engine's fuel grade, with exhaust_O2: the exhaust's enthalpy by the NASA polynomials (unless gas_cp is given), its acid dew point and its molar mass",
		text: setExhaustFuel,
		keep: func(c Component) func() {
			u, ok := self[*ExhaustGasEconomiser](c)
			if !ok {
				return func() {}
			}
			old := u.ExhaustFuel
			return func() { u.ExhaustFuel = old }
		}},
	egeKey(Key{Name: "exhaust_O2", Label: "exhaust O2 (dry)", Dim: units.Fraction, Example: "13 %",
		Doc: "O2 in the dry exhaust (with exhaust_fuel)", Min: 0.01, Max: 0.2, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.ExhaustO2 }),
	egeKey(Key{Name: "min_gas_T", Label: "minimum gas outlet temperature", Dim: units.Temperature, Example: "170 C",
		Doc: "lowest acceptable gas outlet (acid dew point plus margin, as the maker states it)", DefaultNote: "not checked",
		Min: 353.15, Max: 573.15, Case: true, Source: SourceLeftOut},
		func(u *ExhaustGasEconomiser) *float64 { return &u.MinGasOutT }),
	flag(Key{Name: "bypass", Label: "bypass", Example: "true",
		Doc: "a damper sends gas past the economiser to hold the funnel at min_gas_T", Default: 0, HasDefault: true, Case: true, Source: SourceLeftOut},
		self[*ExhaustGasEconomiser], func(u *ExhaustGasEconomiser) *bool { return &u.Bypass }),
	egeKey(Key{Name: "preheat_ua", Label: "preheating section UA", Dim: units.ThermalConductance, Example: "10 kW/K",
		Doc: "UA of a preheating section after the evaporator, at the evaporator's reference gas flow", DefaultNote: "none",
		Min: 1, Max: 1e8, Case: true, Source: SourceLeftOut},
		func(u *ExhaustGasEconomiser) *float64 { return &u.PreheatUA }),
	flag(Key{Name: "off", Label: "off", Example: "true", Doc: "out of service", Default: 0, HasDefault: true, Case: true, Source: SourceLeftOut},
		self[*ExhaustGasEconomiser], func(u *ExhaustGasEconomiser) *bool { return &u.Off }),

	// The site correction of the engine's table.
	choice(Key{Name: "ambient", Label: "exhaust table conditions", Choices: []string{"correct", "as_given"}, Example: `"correct"`,
		Doc:     "\"correct\": the engine table holds at ref_air_T and ref_coolant_T and is corrected to the case's intake air and coolant; \"as_given\": it holds at the site",
		Default: 0, HasDefault: true, Case: true, Source: SourceRule},
		self[*ExhaustGasEconomiser], func(u *ExhaustGasEconomiser) *AmbientMode { return &u.Ambient }),
	egeKey(Key{Name: "ref_air_T", Label: "reference intake air temperature", Dim: units.Temperature, Example: "25 C",
		Doc: "intake air temperature at which the engine table holds", Default: defaultEGERefT, HasDefault: true,
		Source: "ISO 15550 / ISO 3046-1 reference conditions, from memory; docs/reference/plant-checks.md §7 [M]", Min: 243.15, Max: 333.15, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.RefAirT }),
	egeKey(Key{Name: "ref_coolant_T", Label: "reference charge-air coolant temperature", Dim: units.Temperature, Example: "25 C",
		Doc: "charge-air coolant temperature at which the engine table holds", Default: defaultEGERefT, HasDefault: true,
		Source: "ISO 15550 / ISO 3046-1 reference conditions, from memory", Min: 243.15, Max: 333.15, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.RefCoolantT }),
	egeKey(Key{Name: "intake_T", Label: "engine intake air temperature", Dim: units.Temperature, Example: "35 C",
		Doc: "the engine's intake air temperature in the case", DefaultNote: "the case's air plus intake_rise (no correction without an air temperature)",
		Min: 233.15, Max: 343.15, Case: true, Source: SourceDerived},
		func(u *ExhaustGasEconomiser) *float64 { return &u.IntakeT }),
	egeKey(Key{Name: "intake_rise", Label: "intake air above outside air", Dim: units.TemperatureDifference, Example: "10 K",
		Doc:     "how much warmer than the outside air the engine's intake air is (an engine drawing from the engine room)",
		Default: 0, HasDefault: true, Min: 0, Max: 40, Case: true, Source: SourceLeftOut},
		func(u *ExhaustGasEconomiser) *float64 { return &u.IntakeRise }),
	egeKey(Key{Name: "coolant_T", Label: "charge-air coolant temperature", Dim: units.Temperature, Example: "32 C",
		Doc: "the charge-air coolant's temperature in the case", DefaultNote: "the case's sea temperature",
		Min: 268.15, Max: 343.15, Case: true, Source: SourceDerived},
		func(u *ExhaustGasEconomiser) *float64 { return &u.CoolantT }),
	egeKey(Key{Name: "exhaust_T_per_K_air", Label: "exhaust temperature per K of intake air", Kind: KeyNumber, Example: "1.6",
		Doc: "K of exhaust temperature per K of intake air above ref_air_T (the maker's figure)", Default: defaultEGETPerAirK, HasDefault: true,
		Source: "docs/reference/plant-checks.md §7 [M], low confidence", Min: 0.1, Max: 5, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.TPerAirK }),
	egeKey(Key{Name: "gas_per_K_air", Label: "exhaust gas flow per K of intake air", Dim: units.Fraction, Example: "-0.35 %",
		Doc:     "change of the exhaust gas flow per K of intake air above ref_air_T, a fraction per kelvin (the maker's figure)",
		Default: defaultEGEGasPerAirK, HasDefault: true, Source: "docs/reference/plant-checks.md §7 [M], low confidence: -0.3 to -0.4 %",
		Min: -0.02, Max: -1e-5, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.GasPerAirK }),
	egeKey(Key{Name: "exhaust_T_per_K_coolant", Label: "exhaust temperature per K of charge-air coolant", Kind: KeyNumber, Example: "0.5",
		Doc: "K of exhaust temperature per K of coolant above ref_coolant_T (the maker's figure)", DefaultNote: "none",
		Min: -5, Max: 5, Case: true, Source: SourceLeftOut},
		func(u *ExhaustGasEconomiser) *float64 { return &u.TPerCoolantK }),
	egeKey(Key{Name: "gas_per_K_coolant", Label: "exhaust gas flow per K of charge-air coolant", Dim: units.Fraction, Example: "-0.1 %",
		Doc: "change of the exhaust gas flow per K of coolant above ref_coolant_T, a fraction per kelvin (the maker's figure)", DefaultNote: "none",
		Min: -0.02, Max: 0.02, Case: true, Source: SourceLeftOut},
		func(u *ExhaustGasEconomiser) *float64 { return &u.GasPerCoolantK }),

	// Fouling.
	egeKey(Key{Name: "fouling_rate", Label: "gas-side fouling per 1000 h of running", Dim: units.FoulingResistance, Example: "0.001 m2K/W",
		Doc: "gas-side fouling resistance (soot) added per 1000 h of running since cleaning; needs clean_U and clean_interval", DefaultNote: "no fouling",
		Min: 1e-6, Max: 0.1, Case: true, Clears: []string{"fouled_ua"}, Source: SourceLeftOut},
		func(u *ExhaustGasEconomiser) *float64 { return &u.FoulingRate }),
	egeKey(Key{Name: "clean_U", Label: "clean overall coefficient", Dim: units.HeatTransferCoefficient, Example: "40 W/m2K",
		Doc: "the clean evaporator's overall coefficient at the size's reference gas flow (its surface is UA/U), for fouling_rate",
		Min: 1, Max: 1000, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.CleanU }),
	egeKey(Key{Name: "fouled_ua", Label: "UA before cleaning", Dim: units.Fraction, Example: "85 %",
		Doc: "UA at the end of clean_interval as a fraction of the clean UA (falling linearly with running hours)", DefaultNote: "no fouling",
		Min: 0.2, Max: 1, Case: true, Clears: []string{"fouling_rate"}, Source: SourceLeftOut},
		func(u *ExhaustGasEconomiser) *float64 { return &u.FouledUA }),
	egeKey(Key{Name: "clean_interval", Label: "running time between cleanings", Dim: units.Time, Example: "500 h",
		Doc: "running time between soot blowing or water washing, which restores the clean UA", Min: 3600, Max: 1e5 * 3600, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.CleanInterval }),
	choice(Key{Name: "fouling_state", Label: "fouling state", Choices: []string{"mean", "clean", "end"}, Example: `"end"`,
		Doc:     "the moment of the cleaning cycle a case takes: the mean over the interval, just after cleaning, or just before the next",
		Default: 0, HasDefault: true, Case: true, Source: SourceRule},
		self[*ExhaustGasEconomiser], func(u *ExhaustGasEconomiser) *FoulingState { return &u.Fouling }),

	// The cold end.
	egeKey(Key{Name: "so3_conversion", Label: "SO2 converted to SO3", Dim: units.Fraction, Example: "3 %",
		Doc: "share of the exhaust's SO2 taken as SO3 for the acid dew point", Default: combustion.DefaultSO3Conversion, HasDefault: true,
		Source: "docs/reference/plant-checks.md §4 [M]", Min: 1e-4, Max: combustion.MaxSO3Conversion, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.SO3Conversion }),
	egeKey(Key{Name: "dew_margin", Label: "margin above the acid dew point", Dim: units.TemperatureDifference, Example: "20 K",
		Doc: "least margin of the gas outlet above the exhaust's acid dew point", Default: combustion.DefaultDewMargin, HasDefault: true,
		Source: "common practice, no source", Min: 0.1, Max: 100, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.DewMargin }),

	// Soot.
	egeKey(Key{Name: "soot_risk_load", Label: "soot-risk engine load", Dim: units.Fraction, Example: "40 %",
		Doc: "engine load below which a case counts as one where soot builds up and soot fires are a known risk", Default: defaultEGESootRiskLoad, HasDefault: true,
		Source: "common practice, no source", Min: 0.01, Max: 1, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.SootRiskLoad }),
	egeKey(Key{Name: "flow_area", Label: "free gas flow area", Dim: units.Area, Example: "6 m2",
		Doc: "free flow area of the gas through the tube bank, with soot_velocity", Min: 0.01, Max: 1000, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.FlowArea }),
	egeKey(Key{Name: "soot_velocity", Label: "soot-risk gas velocity", Dim: units.Velocity, Example: "8 m/s",
		Doc: "gas velocity through the tube bank below which soot builds up (the maker's figure), with flow_area", Min: 0.1, Max: 100, Case: true},
		func(u *ExhaustGasEconomiser) *float64 { return &u.SootVelocity }),
}

// setExhaustFuel sets the engine's fuel to a built-in grade.
func setExhaustFuel(c Component, v []string) error {
	u, ok := self[*ExhaustGasEconomiser](c)
	if !ok {
		return nil
	}
	f, _, err := gradeText(v)
	if err != nil {
		return err
	}
	u.ExhaustFuel = &f
	return nil
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

func orElse(v, d float64) float64 {
	if v == 0 {
		return d
	}
	return v
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
		if u.DesignLoad != 0 {
			checkRange(fs, u, "design engine load", u.DesignLoad, 0.1, 1.2, "")
		}
		if u.DesignGasFlow != 0 && u.DesignLoad != 0 && u.DesignPinch == 0 {
			fs.add(u.Pos, u.Name, "", "ua holds at one reference gas flow: give design_gas or design_load, not both")
		}
	case u.DesignPinch > 0:
		checkRange(fs, u, "design pinch", u.DesignPinch, 1, 200, "K")
		if u.DesignLoad == 0 {
			fs.add(u.Pos, u.Name, "", "a design pinch needs its design engine load (design_load), the load at which the gas leaves pinch above saturation")
		} else {
			checkRange(fs, u, "design engine load", u.DesignLoad, 0.1, 1.2, "")
		}
	default:
		fs.add(u.Pos, u.Name, "", "needs its size: a UA, or a design engine load and pinch")
	}
	for _, name := range []string{"exponent", "gas_cp", "min_gas_T", "preheat_ua", "ref_air_T", "ref_coolant_T",
		"intake_T", "intake_rise", "coolant_T", "exhaust_T_per_K_air", "gas_per_K_air", "exhaust_T_per_K_coolant",
		"gas_per_K_coolant", "so3_conversion", "dew_margin", "soot_risk_load"} {
		checkKey(fs, u, name)
	}
	if u.Ambient != AmbientCorrect && u.Ambient != AmbientAsGiven {
		fs.add(u.Pos, u.Name, "", "exhaust table conditions must be \"correct\" or \"as_given\"; got %d", u.Ambient)
	}
	if u.Fouling < FoulingMean || u.Fouling > FoulingEnd {
		fs.add(u.Pos, u.Name, "", "fouling state must be \"mean\", \"clean\" or \"end\"; got %d", u.Fouling)
	}
	if u.ExhaustFuel != nil {
		checkRange(fs, u, "exhaust O2 (dry)", u.ExhaustO2, 0.01, 0.2, "")
	} else if u.ExhaustO2 != 0 {
		fs.add(u.Pos, u.Name, "", "exhaust_O2 needs exhaust_fuel (the engine's fuel grade, such as \"VLSFO\")")
	}
	u.checkFouling(fs)
	switch {
	case u.FlowArea > 0 && u.SootVelocity > 0:
		checkKey(fs, u, "flow_area")
		checkKey(fs, u, "soot_velocity")
	case u.FlowArea != 0 || u.SootVelocity != 0:
		fs.add(u.Pos, u.Name, "", "flow_area and soot_velocity go together (the gas velocity through the tube bank against the one below which soot builds up); got flow_area %g m², soot_velocity %g m/s", u.FlowArea, u.SootVelocity)
	}
}

// checkFouling checks the fouling keys: one form, with its interval.
func (u *ExhaustGasEconomiser) checkFouling(fs *faults) {
	rate, frac := u.FoulingRate != 0, u.FouledUA != 0
	switch {
	case rate && frac:
		fs.add(u.Pos, u.Name, "", "give fouling as fouling_rate (with clean_U) or as fouled_ua, not both")
	case (rate || frac) && u.CleanInterval == 0:
		what := "fouling_rate"
		if frac {
			what = "fouled_ua"
		}
		fs.add(u.Pos, u.Name, "", "%s needs clean_interval, the running time between soot blowing or water washing (such as clean_interval = \"500 h\"); without it the fouling would grow without end", what)
	case !rate && !frac && u.CleanInterval != 0:
		fs.add(u.Pos, u.Name, "", "clean_interval needs the fouling that cleaning removes: fouling_rate (with clean_U) or fouled_ua")
	case rate && u.CleanU == 0:
		fs.add(u.Pos, u.Name, "", "fouling_rate needs clean_U, the clean overall coefficient (such as clean_U = \"40 W/m2K\"), to turn a fouling resistance into UA")
	}
	if !rate && u.CleanU != 0 {
		fs.add(u.Pos, u.Name, "", "clean_U is used only with fouling_rate")
	}
	for _, name := range []string{"fouling_rate", "clean_U", "fouled_ua", "clean_interval"} {
		if k, _ := findKey(egeKeys, name); k != nil {
			if v, _ := k.Get(u); v != 0 {
				checkKey(fs, u, name)
			}
		}
	}
}

// validate checks, when the economiser is declared, the keys that go
// together (fouling and its interval, the flow area and its velocity), so
// that a script's mistake is reported at its declaration rather than at
// its first case.
func (u *ExhaustGasEconomiser) validate() error {
	var fs faults
	u.checkFouling(&fs)
	if (u.FlowArea != 0) != (u.SootVelocity != 0) {
		fs.add(u.Pos, u.Name, "", "flow_area and soot_velocity go together (the gas velocity through the tube bank against the one below which soot builds up)")
	}
	if len(fs) == 0 {
		return nil
	}
	msgs := make([]string, len(fs))
	for i, f := range fs {
		msgs[i] = f.Msg
	}
	return errors.New(strings.Join(msgs, "; "))
}

// fouls reports whether the economiser fouls between cleanings.
func (u *ExhaustGasEconomiser) fouls() bool {
	return u.CleanInterval > 0 && (u.FouledUA > 0 || (u.FoulingRate > 0 && u.CleanU > 0))
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

// exhaust returns the products of the engine's fuel burnt to its exhaust
// O2, if the economiser has them.
func (u *ExhaustGasEconomiser) exhaust() (*combustion.Products, error) {
	if u.ExhaustFuel == nil {
		return nil, nil
	}
	prod, err := combustion.Fire(*u.ExhaustFuel, combustion.Conditions{O2Dry: u.ExhaustO2})
	if err != nil {
		return nil, err
	}
	return &prod, nil
}

// gasH returns the exhaust's enthalpy function per kg of gas: a constant
// cp when one is given or there are no products, else the products' own.
func (u *ExhaustGasEconomiser) gasH(prod *combustion.Products) heat.GasEnthalpy {
	if u.GasCp > 0 || prod == nil {
		return heat.ConstantCp(orElse(u.GasCp, defaultEGEGasCp), 298.15)
	}
	// FlueGasH and FlueGasCp are per kg of flue gas.
	return func(t float64) (float64, float64) {
		h, err1 := prod.FlueGasH(t)
		cp, err2 := prod.FlueGasCp(t)
		if err1 != nil || err2 != nil {
			return math.NaN(), math.NaN()
		}
		return h, cp
	}
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

// gauss8 are the nodes (on 0…1) and weights of 8-point Gauss–Legendre
// quadrature (Abramowitz and Stegun, Table 25.4, from memory; checked in
// the tests against a polynomial of degree 15).
var gauss8 = [8][2]float64{
	{0.5 * (1 - 0.9602898564975363), 0.5 * 0.1012285362903763},
	{0.5 * (1 - 0.7966664774136267), 0.5 * 0.2223810344533745},
	{0.5 * (1 - 0.5255324099163290), 0.5 * 0.3137066458778873},
	{0.5 * (1 - 0.1834346424956498), 0.5 * 0.3626837833783620},
	{0.5 * (1 + 0.1834346424956498), 0.5 * 0.3626837833783620},
	{0.5 * (1 + 0.5255324099163290), 0.5 * 0.3137066458778873},
	{0.5 * (1 + 0.7966664774136267), 0.5 * 0.2223810344533745},
	{0.5 * (1 + 0.9602898564975363), 0.5 * 0.1012285362903763},
}

// uaFraction is the fouled UA as a fraction of the clean one at the share
// s (0…1) of the cleaning interval run, for clean UA ua at the case's gas
// flow: linear in running hours for FouledUA; for FoulingRate, a
// resistance R = rate·t on the surface A = UA_ref/U (1/UA_f = 1/UA + R/A).
func (u *ExhaustGasEconomiser) uaFraction(s, ua float64) float64 {
	if !u.fouls() {
		return 1
	}
	if u.FouledUA > 0 {
		return 1 - (1-u.FouledUA)*s
	}
	area := u.op.ua0 / u.CleanU
	r := u.FoulingRate * s * u.CleanInterval / (1000 * hoursS)
	return 1 / (1 + ua*r/area)
}

// prepare computes the gas side for the case: it does not depend on the
// plant's unknowns.
func (u *ExhaustGasEconomiser) prepare(p *Plant, c Conditions) error {
	u.op = egeOperation{load: c.EngineLoad}
	ts, err := waterTsat(u.DrumP)
	if err != nil {
		return wrapErr(u, err)
	}
	u.op.tSat = ts
	if u.Off {
		return nil
	}
	prod, err := u.exhaust()
	if err != nil {
		return wrapErr(u, err)
	}
	h := u.gasH(prod)
	ua0, err := u.designUA(h)
	if err != nil {
		return wrapErr(u, err)
	}
	u.op.ua0 = ua0
	if prod != nil {
		if err := u.dewPoint(prod); err != nil {
			return wrapErr(u, err)
		}
	}
	if c.EngineLoad <= 0 {
		return nil
	}
	m, tIn, warn := u.Engine.At(c.EngineLoad)
	if warn != "" {
		u.op.warn = append(u.op.warn, warn)
	}
	u.op.mTable, u.op.tTable = m, tIn
	m, tIn, err = u.atSite(c, m, tIn)
	if err != nil {
		return wrapErr(u, err)
	}
	u.op.mGas, u.op.tIn = m, tIn
	ua := ua0 * u.flowScale(m)
	u.op.uaClean = ua
	clean, err := u.gasSide(h, m, tIn, ts, ua)
	if err != nil {
		return wrapErr(u, err)
	}
	u.op.clean, u.op.gas = clean, clean
	if u.fouls() && u.Fouling != FoulingClean {
		if u.op.gas, err = u.fouledSide(h, m, tIn, ts, ua); err != nil {
			return wrapErr(u, err)
		}
	}
	g := &u.op.gas
	if m > 0 && g.cp > 0 {
		u.op.ntu = g.ua / (m * g.cp)
	}
	// The cold end of the cycle is its cleanest moment: the minimum gas
	// temperature is checked there.
	if clean.belowMin && !u.Bypass {
		when := ""
		if u.fouls() && u.Fouling != FoulingClean {
			when = " just after cleaning"
		}
		u.op.warn = append(u.op.warn, fmt.Sprintf("gas leaves%s at %.1f °C, below its minimum of %.1f °C (acid dew point and soot margin)", when, clean.tOut-273.15, u.MinGasOutT-273.15))
	}
	u.sootRisk(p, prod, c.EngineLoad)
	return nil
}

// designUA returns the clean UA at the size's reference gas flow: UA as
// given, or the UA that gives the design pinch at the design load from
// the table as given.
func (u *ExhaustGasEconomiser) designUA(h heat.GasEnthalpy) (float64, error) {
	if u.UA > 0 {
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
	return ntu * md * cp, nil
}

// refFlow is the gas flow at which the size's UA holds: DesignGasFlow, or
// the table's gas flow at DesignLoad; 0 for a constant UA.
func (u *ExhaustGasEconomiser) refFlow() float64 {
	switch {
	case u.UA > 0 && u.DesignGasFlow > 0:
		return u.DesignGasFlow
	case u.DesignLoad > 0:
		md, _, _ := u.Engine.At(u.DesignLoad)
		return md
	}
	return 0
}

// flowScale is (m/m_ref)^n, the factor by which the size's UA changes at
// gas flow m (1 when UA is given without a reference flow).
func (u *ExhaustGasEconomiser) flowScale(m float64) float64 {
	mr := u.refFlow()
	if mr <= 0 {
		return 1
	}
	return math.Pow(m/mr, u.exponent())
}

// atSite corrects the table's gas flow m and temperature tIn to the
// case's intake air and charge-air coolant (see the type's doc).
func (u *ExhaustGasEconomiser) atSite(c Conditions, m, tIn float64) (float64, float64, error) {
	u.op.gasFactor = 1
	if u.Ambient == AmbientAsGiven {
		return m, tIn, nil
	}
	var dT, factor float64
	intake := u.IntakeT
	if intake == 0 && c.AirT > 0 {
		intake = c.AirT + u.IntakeRise
	}
	if intake > 0 {
		if intake < 233.15 || intake > 343.15 {
			return 0, 0, fmt.Errorf("intake air at %.1f °C (the case's air plus intake_rise) is outside -40 to 70 °C", intake-273.15)
		}
		d := intake - orElse(u.RefAirT, defaultEGERefT)
		dT += orElse(u.TPerAirK, defaultEGETPerAirK) * d
		factor += orElse(u.GasPerAirK, defaultEGEGasPerAirK) * d
		u.op.intakeT = intake
		if math.Abs(d) > egeCorrectionSpan {
			u.op.warn = append(u.op.warn, fmt.Sprintf("the engine's intake air at %.1f °C is %.0f K from the exhaust table's reference of %.1f °C: the linear correction is used beyond the ±%d K for which makers usually state it (common practice, no source)",
				intake-273.15, math.Abs(d), orElse(u.RefAirT, defaultEGERefT)-273.15, egeCorrectionSpan))
		}
	}
	coolant := u.CoolantT
	if coolant == 0 {
		coolant = c.SeaT
	}
	if coolant > 0 && (u.TPerCoolantK != 0 || u.GasPerCoolantK != 0) {
		d := coolant - orElse(u.RefCoolantT, defaultEGERefT)
		dT += u.TPerCoolantK * d
		factor += u.GasPerCoolantK * d
		u.op.coolantT = coolant
		if math.Abs(d) > egeCorrectionSpan {
			u.op.warn = append(u.op.warn, fmt.Sprintf("the charge-air coolant at %.1f °C is %.0f K from the exhaust table's reference of %.1f °C: the linear correction is used beyond the ±%d K for which makers usually state it (common practice, no source)",
				coolant-273.15, math.Abs(d), orElse(u.RefCoolantT, defaultEGERefT)-273.15, egeCorrectionSpan))
		}
	}
	if u.op.intakeT == 0 && u.op.coolantT == 0 {
		return m, tIn, nil
	}
	if !(1+factor > 0.2) {
		return 0, 0, fmt.Errorf("the site correction would scale the exhaust gas flow by %.3f; check the gas_per_K coefficients", 1+factor)
	}
	u.op.corrected = true
	u.op.dT, u.op.gasFactor = dT, 1+factor
	t := tIn + dT
	if t < 373.15 {
		return 0, 0, fmt.Errorf("the exhaust corrected to the site (%.1f °C from the table's %.1f °C) is below 100 °C; check the correction coefficients", t-273.15, tIn-273.15)
	}
	return m * (1 + factor), t, nil
}

// gasSide rates the evaporator at conductance ua: its duty and outlet,
// with the bypass holding the funnel at the minimum when it has one.
func (u *ExhaustGasEconomiser) gasSide(h heat.GasEnthalpy, m, tIn, tSat, ua float64) (gasState, error) {
	tOut, cp, err := evaporate(h, m, tIn, tSat, ua)
	if err != nil {
		return gasState{}, err
	}
	g := gasState{tOut: tOut, cp: cp, ua: ua}
	if u.MinGasOutT > 0 && tOut < u.MinGasOutT-1e-9 {
		g.belowMin = true
		if u.Bypass {
			if g.bypass, g.tOut, err = u.bypass(h, m, tIn, tSat, ua); err != nil {
				return gasState{}, err
			}
			if d := tIn - g.tOut; d > 1e-9 {
				hI, _ := h(tIn)
				hO, _ := h(g.tOut)
				g.cp = (hI - hO) / d
			}
		}
	}
	hIn, _ := h(tIn)
	hOut, _ := h(g.tOut)
	g.q = (1 - g.bypass) * m * (hIn - hOut)
	return g, nil
}

// fouledSide rates the evaporator in the case's fouling state: at the end
// of the interval, or the mean over it, whose outlet is the temperature
// of the mean duty through the mean share of gas not bypassed.
func (u *ExhaustGasEconomiser) fouledSide(h heat.GasEnthalpy, m, tIn, tSat, ua float64) (gasState, error) {
	if u.Fouling == FoulingEnd {
		return u.gasSide(h, m, tIn, tSat, ua*u.uaFraction(1, ua))
	}
	var mean gasState
	for _, nw := range gauss8 {
		g, err := u.gasSide(h, m, tIn, tSat, ua*u.uaFraction(nw[0], ua))
		if err != nil {
			return gasState{}, err
		}
		mean.q += nw[1] * g.q
		mean.bypass += nw[1] * g.bypass
		mean.ua += nw[1] * g.ua
		mean.belowMin = mean.belowMin || g.belowMin
	}
	through := (1 - mean.bypass) * m
	hIn, cpIn := h(tIn)
	if through <= 0 || mean.q <= 0 {
		mean.tOut, mean.cp = tIn, cpIn
		return mean, nil
	}
	// Newton on h(T) = h_in − q/ṁ_through from the clean outlet.
	target := hIn - mean.q/through
	t := u.op.clean.tOut
	for k := 0; k < 50; k++ {
		hv, cp := h(t)
		if !finite(hv) || !(cp > 0) {
			return gasState{}, fmt.Errorf("exhaust enthalpy undefined at %.1f K", t)
		}
		dt := (hv - target) / cp
		t -= dt
		if math.Abs(dt) < 1e-10 {
			break
		}
	}
	mean.tOut = t
	if d := tIn - t; d > 1e-9 {
		mean.cp = (mean.q / through) / d
	} else {
		mean.cp = cpIn
	}
	return mean, nil
}

// bypass finds the fraction of gas that must pass the economiser so that
// the mixed gas leaves at MinGasOutT. The mixed enthalpy falls
// monotonically as more gas goes through, so the root is bracketed by all
// gas bypassed and none; it is found by regula falsi with the Illinois
// modification (Dowell and Jarratt, BIT 11 (1971), from memory), which
// keeps the bracket and converges superlinearly, to a share of 1e-12. It
// returns the bypassed fraction and the outlet of the gas that goes
// through.
func (u *ExhaustGasEconomiser) bypass(h heat.GasEnthalpy, m, tIn, tSat, ua0 float64) (float64, float64, error) {
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
	glo := hIn - hMin
	hm1, tOut, err := mixed(1)
	if err != nil {
		return 0, 0, err
	}
	ghi := hm1 - hMin
	if !(glo > 0) || !(ghi < 0) {
		// Nothing to bypass, or the minimum is the inlet itself.
		if ghi >= 0 {
			return 0, tOut, nil
		}
		return 1, tIn, nil
	}
	f, side := 1.0, 0
	for k := 0; k < 100 && hi-lo > 1e-12; k++ {
		f = (lo*ghi - hi*glo) / (ghi - glo)
		if !(f > lo && f < hi) {
			f = 0.5 * (lo + hi)
		}
		hm, t, err := mixed(f)
		if err != nil {
			return 0, 0, err
		}
		g := hm - hMin
		tOut = t
		switch {
		case g == 0:
			return 1 - f, tOut, nil
		case g > 0:
			lo, glo = f, g
			if side == +1 {
				ghi /= 2
			}
			side = +1
		default:
			hi, ghi = f, g
			if side == -1 {
				glo /= 2
			}
			side = -1
		}
		if math.Abs(g) <= 1e-12*math.Abs(hIn) {
			break
		}
	}
	return 1 - f, tOut, nil
}

// dewPoint finds the exhaust's acid dew point (Verhoff–Banchero) from the
// products of the engine's fuel; a fuel without sulphur has none.
func (u *ExhaustGasEconomiser) dewPoint(prod *combustion.Products) error {
	if prod.Fuel.Analysis.S == 0 {
		return nil
	}
	t, err := combustion.AcidDewPoint(*prod, 0, orElse(u.SO3Conversion, combustion.DefaultSO3Conversion), combustion.MethodVerhoffBanchero)
	if err != nil {
		return fmt.Errorf("the acid dew point of the exhaust: %w", err)
	}
	u.op.dew = t
	return nil
}

// sootRisk flags a case at low load or with slow gas through the tube
// bank (see the type's doc).
func (u *ExhaustGasEconomiser) sootRisk(p *Plant, prod *combustion.Products, load float64) {
	g := &u.op.gas
	through := (1 - g.bypass) * u.op.mGas
	if through <= 0 {
		return
	}
	var why []string
	if lim := orElse(u.SootRiskLoad, defaultEGESootRiskLoad); load < lim-1e-12 {
		why = append(why, fmt.Sprintf("the engine at %.0f %% of MCR is below %.0f %%", 100*load, 100*lim))
	}
	if u.FlowArea > 0 && u.SootVelocity > 0 {
		mm := exhaustMolarMass
		if prod != nil {
			mm = prod.FlueGas / prod.TotalMoles()
		}
		pa := p.Opt.AmbientPressure
		if pa <= 0 {
			pa = 101325
		}
		tMean := 0.5 * (u.op.tIn + g.tOut)
		rho := pa * mm / (8.314462618 * tMean) // ideal gas
		u.op.velocity = through / (rho * u.FlowArea)
		if u.op.velocity < u.SootVelocity {
			why = append(why, fmt.Sprintf("the gas crosses the tube bank at %.1f m/s, below %.1f m/s", u.op.velocity, u.SootVelocity))
		}
	}
	if len(why) == 0 {
		return
	}
	u.op.soot = true
	reason := why[0]
	if len(why) == 2 {
		reason += " and " + why[1]
	}
	u.op.warn = append(u.op.warn, reason+": soot builds up at low load and low gas velocity, and soot fires in exhaust-gas economisers are a known hazard (thresholds common practice, no source); soot-blow and inspect as the maker prescribes")
}

func (u *ExhaustGasEconomiser) residual(ev *eval, r []float64) error {
	hs, err := u.mh.get2(u.DrumP, u.dryness(), hPX)
	if err != nil {
		return wrapErr(u, err)
	}
	r[u.eqs[0]] = ev.p(u.steam) - u.DrumP
	r[u.eqs[1]] = ev.h(u.steam) - hs
	r[u.eqs[2]] = ev.m(u.feed) - ev.m(u.steam)
	pre, err := u.preheat(ev, &u.op.gas)
	if err != nil {
		return wrapErr(u, err)
	}
	r[u.eqs[3]] = ev.m(u.steam)*(ev.h(u.steam)-ev.h(u.feed)) - u.op.gas.q - pre.Q
	return nil
}

// preheat rates the preheating section at the present feed, behind the
// evaporator in state g; its UA scales with the evaporator's (gas flow
// and fouling).
func (u *ExhaustGasEconomiser) preheat(ev *eval, g *gasState) (heat.ExchangerResult, error) {
	if u.PreheatUA <= 0 || u.Off || u.op.mGas <= 0 {
		return heat.ExchangerResult{}, nil
	}
	mw, pw, hw := ev.m(u.feed), ev.p(u.feed), ev.h(u.feed)
	tw, err := tPH(pw, hw)
	if err != nil {
		return heat.ExchangerResult{}, err
	}
	gasT := g.tOut
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
	mg := (1 - g.bypass) * u.op.mGas
	ua := u.PreheatUA
	if u.op.ua0 > 0 {
		ua *= g.ua / u.op.ua0
	}
	return heat.Counterflow(mg*g.cp, mw*cpw, ua, gasT, tw)
}

func (u *ExhaustGasEconomiser) guess(x []float64) {
	x[u.steam.pIdx()] = u.DrumP
	if h, err := hPX(u.DrumP, u.dryness()); err == nil {
		x[u.steam.hIdx()] = h
		if dh := h - x[u.feed.hIdx()]; dh > 1e5 {
			x[u.steam.mIdx()] = u.op.gas.q / dh
		}
	}
	x[u.feed.mIdx()] = x[u.steam.mIdx()]
}

func (u *ExhaustGasEconomiser) report(ev *eval, cr *CaseResult) error {
	m := ev.m(u.steam)
	g := &u.op.gas
	pre, err := u.preheat(ev, g)
	if err != nil {
		return wrapErr(u, err)
	}
	er := EGEResult{
		Name: u.Name, SteamKgS: m, DutyW: g.q + pre.Q, PreheatW: pre.Q, EngineLoad: u.op.load,
		GasKgS: u.op.mGas, GasInT: u.op.tIn, GasOutT: g.tOut, TSat: u.op.tSat,
		BypassFraction: g.bypass, UA: g.ua, NTU: u.op.ntu, DesignUA: u.op.ua0, UAFraction: 1,
		InService: !u.Off && g.q > 0, BelowMin: g.belowMin || u.op.clean.belowMin, MinGasOutT: u.MinGasOutT,
		TableGasKgS: u.op.mTable, TableGasInT: u.op.tTable, IntakeT: u.op.intakeT, CoolantT: u.op.coolantT,
		SiteCorrected: u.op.corrected, ExhaustTCorrection: u.op.dT, GasFlowFactor: u.op.gasFactor,
		AcidDewT: u.op.dew, SootRisk: u.op.soot, GasVelocity: u.op.velocity,
	}
	if er.InService {
		er.Pinch = g.tOut - u.op.tSat
	}
	if u.op.uaClean > 0 {
		er.UAFraction = g.ua / u.op.uaClean
	}
	// The steam the fouling costs, at this feed: the clean unit's duty
	// less this one's over the rise from the feed to the steam.
	coldOut := u.op.clean.tOut // the gas leaving the economiser at its cleanest
	if u.fouls() && u.op.mGas > 0 && !u.Off {
		cleanPre, err := u.preheat(ev, &u.op.clean)
		if err != nil {
			return wrapErr(u, err)
		}
		if dh := ev.h(u.steam) - ev.h(u.feed); dh > 0 {
			er.FoulingLostKgS = math.Max(0, (u.op.clean.q+cleanPre.Q)-(g.q+pre.Q)) / dh
		}
		if cleanPre.Q > 0 {
			coldOut = cleanPre.HotOut
		}
	} else if pre.Q > 0 {
		coldOut = pre.HotOut
	}
	if pre.Q > 0 {
		er.EvaporatorOutT = g.tOut
		er.GasOutT = pre.HotOut
		er.PreheatWaterOutT = pre.ColdOut
		if pre.ColdOut >= u.op.tSat-1 {
			cr.warn("%s %q: the preheating section brings the feed to %.1f °C, within 1 K of saturation (%.1f °C): it would steam",
				u.Kind(), u.Name, pre.ColdOut-273.15, u.op.tSat-273.15)
		}
		if u.MinGasOutT > 0 && coldOut < u.MinGasOutT-1e-9 {
			er.BelowMin = true
			cr.warn("%s %q: gas leaves the preheating section at %.1f °C, below its minimum of %.1f °C",
				u.Kind(), u.Name, coldOut-273.15, u.MinGasOutT-273.15)
		}
	}
	for _, w := range u.op.warn {
		cr.warn("%s %q: %s", u.Kind(), u.Name, w)
	}
	if er.InService && u.op.dew > 0 {
		u.coldEnd(ev, cr, &er, coldOut, pre.Q > 0)
	}
	cr.EGEs = append(cr.EGEs, er)
	cr.SteamProductionKgS += m
	cr.EGESteamKgS += m
	cr.boundary.heatIn += g.q + pre.Q
	return nil
}

// coldEnd warns when the gas leaving the economiser at its cleanest
// (coldest) comes within the margin of the exhaust's acid dew point, when
// the feed enters a preheating section below it, or when the evaporator's
// saturation lies below it.
func (u *ExhaustGasEconomiser) coldEnd(ev *eval, cr *CaseResult, er *EGEResult, gasOut float64, preheat bool) {
	dew, margin := u.op.dew, orElse(u.DewMargin, combustion.DefaultDewMargin)
	c := func(t float64) float64 { return t - 273.15 }
	so3 := 100 * orElse(u.SO3Conversion, combustion.DefaultSO3Conversion)
	if gasOut < dew+margin {
		er.BelowDewMargin = true
		where := fmt.Sprintf("only %.1f K above the exhaust's acid dew point of %.1f °C (Verhoff-Banchero, %s, %.1f %% of the SO2 as SO3), less than the %.0f K margin",
			gasOut-dew, c(dew), u.ExhaustFuel.Name, so3, margin)
		if gasOut <= dew {
			where = fmt.Sprintf("below the exhaust's acid dew point of %.1f °C (Verhoff-Banchero, %s, %.1f %% of the SO2 as SO3): sulfuric acid condenses on the tubes",
				c(dew), u.ExhaustFuel.Name, so3)
		}
		cr.warn("%s %q: the gas leaves at %.1f °C, %s; keep the gas outlet above the acid-dew and soot margins the maker states",
			u.Kind(), u.Name, c(gasOut), where)
	}
	if preheat {
		tw, err := tPH(ev.p(u.feed), ev.h(u.feed))
		if err == nil {
			er.PreheatWaterInT = tw
			if tw < dew {
				er.BelowDewMargin = true
				cr.warn("%s %q: the feed enters the preheating section at %.1f °C, below the exhaust's acid dew point of %.1f °C: its tubes at the cold end run near the water's temperature and sulfuric acid condenses on them",
					u.Kind(), u.Name, c(tw), c(dew))
			}
		}
	}
	if u.op.tSat < dew {
		er.BelowDewMargin = true
		cr.warn("%s %q: the drum's saturation temperature %.1f °C is below the exhaust's acid dew point of %.1f °C: sulfuric acid condenses on the evaporator tubes",
			u.Kind(), u.Name, c(u.op.tSat), c(dew))
	}
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
	pre, err := u.preheat(ev, &u.op.gas)
	if err != nil {
		return wrapErr(u, err)
	}
	f0 := [2]float64{pre.Q}
	q := func() ([2]float64, int, error) {
		r, err := u.preheat(ev, &u.op.gas)
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
	// leaving the evaporator (GasOutT is then after the preheater), the
	// feed leaving the preheater and, when the acid dew point is known,
	// entering it.
	PreheatW, EvaporatorOutT, PreheatWaterOutT, PreheatWaterInT float64
	// BelowMin is true when the gas through the economiser would leave
	// below MinGasOutT (the bypass, if any, then holds the funnel at it);
	// with fouling, at the cleanest moment of the cycle.
	BelowMin   bool
	MinGasOutT float64
	// UA is the evaporator's UA in the case (fouled, at the case's gas
	// flow), NTU its number of transfer units; DesignUA the clean UA at
	// the size's reference gas flow; UAFraction the case's UA over the
	// clean UA at the same flow (1 without fouling).
	UA, NTU, DesignUA, UAFraction float64
	// FoulingLostKgS is the steam the fouling costs: the clean unit's
	// steam less this one's, at the case's feed.
	FoulingLostKgS float64
	// The engine's exhaust as the table gives it at the load, and its
	// correction to the site: the intake air and coolant temperatures
	// used (0 when not corrected for), the exhaust temperature added, K,
	// and the factor on the gas flow.
	TableGasKgS, TableGasInT, IntakeT, CoolantT float64
	SiteCorrected                               bool
	ExhaustTCorrection, GasFlowFactor           float64
	// AcidDewT is the exhaust's acid dew point (0 when not known: no
	// exhaust fuel, or no sulphur); BelowDewMargin is true when the gas
	// outlet comes within the margin of it, or a preheating section's
	// water inlet or the drum's saturation lies below it.
	AcidDewT       float64
	BelowDewMargin bool
	// SootRisk is true when the case runs at a load or gas velocity where
	// soot builds up and soot fires are a known risk; GasVelocity is the
	// gas velocity through the tube bank (0 without a flow area).
	SootRisk    bool
	GasVelocity float64
	// FuelSavedKgS is the oil-fired boilers' fuel that the economisers save
	// against the same case without them (all economisers together).
	FuelSavedKgS float64
}
