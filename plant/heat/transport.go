package heat

import "math"

// Species indexes the gases this package knows: the main constituents of
// flue gas and air. Other species (SO2, CO) must be folded into one of these
// by the caller (docs/reference/heat-transfer.md §1.3 folds SO2 into N2).
type Species int

// The species, in the order used by Composition.
const (
	N2 Species = iota
	O2
	CO2
	H2O
	Ar
	NumSpecies // number of species
)

var speciesName = [NumSpecies]string{"N2", "O2", "CO2", "H2O", "Ar"}

func (s Species) String() string {
	if s < 0 || s >= NumSpecies {
		return "Species(?)"
	}
	return speciesName[s]
}

// molarMass holds the molar masses in kg/mol (CEA thermo data, as listed in
// docs/reference/heat-transfer.md §1.2 [C]: 28.0134, 31.9988, 44.0095, 18.01528, 39.948 g/mol).
var molarMass = [NumSpecies]float64{28.0134e-3, 31.9988e-3, 44.0095e-3, 18.01528e-3, 39.948e-3}

// MolarMass returns the molar mass of a species in kg/mol (CEA thermo data,
// docs/reference/heat-transfer.md §1.2). An unknown species panics.
func (s Species) MolarMass() float64 {
	if s < 0 || s >= NumSpecies {
		panic("heat: species index out of range")
	}
	return molarMass[s]
}

// Composition holds mole fractions of N2, O2, CO2, H2O and Ar, indexed by
// Species. It is a fixed-size array, so passing it costs no allocation.
type Composition [NumSpecies]float64

// DryAir returns dry air as used for the check values of docs/reference/heat-transfer.md
// §1.3: x_N2 0.7808, x_O2 0.2095, x_Ar 0.0093, x_CO2 0.0004.
func DryAir() Composition {
	return Composition{N2: 0.7808, O2: 0.2095, CO2: 0.0004, Ar: 0.0093}
}

// compositionSumTol is how far the mole fractions may add up away from one.
const compositionSumTol = 1e-3

// Validate checks that every fraction is finite and in [0, 1] and that they
// add up to 1 within 1e-3. The mixing rules are homogeneous of degree zero in
// the fractions, so a small deviation is not renormalised and changes nothing.
func (x *Composition) Validate() error {
	sum := 0.0
	for i, v := range x {
		if !(v >= 0 && v <= 1) {
			return inputErr("Composition", "x_"+speciesName[i], v, "a mole fraction in [0, 1]")
		}
		sum += v
	}
	if math.Abs(sum-1) > compositionSumTol {
		return inputErr("Composition", "sum of mole fractions", sum, "1 within 1e-3")
	}
	return nil
}

// MolarMassMix returns the mean molar mass Σ x_i·M_i in kg/mol.
func (x *Composition) MolarMassMix() float64 {
	m := 0.0
	for i, v := range x {
		m += v * molarMass[i]
	}
	return m
}

// nasaFit is one temperature range of a NASA CEA trans.inp fit:
// ln(y) = A·ln T + B/T + C/T² + D.
type nasaFit struct {
	tLow, tHigh float64
	a, b, c, d  float64
}

func (f *nasaFit) eval(t float64) float64 {
	return f.evalLn(math.Log(t), 1/t)
}

// evalLn evaluates the fit with ln T and 1/T precomputed.
func (f *nasaFit) evalLn(lnT, invT float64) float64 {
	return math.Exp(f.a*lnT + (f.b+f.c*invT)*invT + f.d)
}

// Coefficients of NASA CEA data/trans.inp (public repository nasa/cea, commit
// 69f64a4), entry headers "BOUSHEHRI ET AL (1987) SVEHLA (1994)" for N2, O2
// and CO2, "SENGERS & WATSON (1986) SVEHLA (1994)" for H2O and "BICH ET AL
// (1990)" for Ar. Copied digit for digit from gas-transport.csv
// (docs/reference/heat-transfer.md §1.1 [S✓]); viscosity in micropoise, conductivity in
// μW/(cm·K). The test TestNASACoefficientsMatchCSV compares every number
// with testdata/gas-transport.csv.
var viscosityFits = [NumSpecies][3]nasaFit{
	N2: {
		{200.0, 1000.0, 0.62526577e+00, -0.31779652e+02, -0.16407983e+04, 0.17454992e+01},
		{1000.0, 5000.0, 0.87395209e+00, 0.56152222e+03, -0.17394809e+06, -0.39335958e+00},
		{5000.0, 15000.0, 0.88503551e+00, 0.90902171e+03, -0.73129061e+06, -0.53503838e+00},
	},
	O2: {
		{200.0, 1000.0, 0.60916180e+00, -0.52244847e+02, -0.59974009e+03, 0.20410801e+01},
		{1000.0, 5000.0, 0.72216486e+00, 0.17550839e+03, -0.57974816e+05, 0.10901044e+01},
		{5000.0, 15000.0, 0.73981127e+00, 0.39194906e+03, -0.37833168e+06, 0.90931780e+00},
	},
	CO2: {
		{200.0, 1000.0, 0.51137258e+00, -0.22951321e+03, 0.13710678e+05, 0.27075538e+01},
		{1000.0, 5000.0, 0.63978285e+00, -0.42637076e+02, -0.15522605e+05, 0.16628843e+01},
		{5000.0, 10000.0, 0.72150912e+00, 0.75012895e+03, -0.11825507e+07, 0.85493645e+00},
	},
	H2O: {
		{373.2, 1073.2, 0.50019557e+00, -0.69712796e+03, 0.88163892e+05, 0.30836508e+01},
		{1073.2, 5000.0, 0.58988538e+00, -0.53769814e+03, 0.54263513e+05, 0.23386375e+01},
		{5000.0, 15000.0, 0.64330087e+00, -0.95668913e+02, -0.37742283e+06, 0.18125190e+01},
	},
	Ar: {
		{200.0, 1000.0, 0.61205763e+00, -0.67714354e+02, 0.19040660e+03, 0.21588272e+01},
		{1000.0, 5000.0, 0.69357334e+00, 0.70953943e+02, -0.28386007e+05, 0.14856447e+01},
		{5000.0, 15000.0, 0.76608935e+00, 0.67867215e+03, -0.84991417e+06, 0.77935167e+00},
	},
}

var conductivityFits = [NumSpecies][3]nasaFit{
	N2: {
		{200.0, 1000.0, 0.85439436e+00, 0.10573224e+03, -0.12347848e+05, 0.47793128e+00},
		{1000.0, 5000.0, 0.88407146e+00, 0.13357293e+03, -0.11429640e+05, 0.24417019e+00},
		{5000.0, 15000.0, 0.24176185e+01, 0.80477749e+04, 0.31055802e+07, -0.14517761e+02},
	},
	O2: {
		{200.0, 1000.0, 0.77229167e+00, 0.68463210e+01, -0.58933377e+04, 0.12210365e+01},
		{1000.0, 5000.0, 0.90917351e+00, 0.29124182e+03, -0.79650171e+05, 0.64851631e-01},
		{5000.0, 15000.0, -0.11218262e+01, -0.19286378e+05, 0.23295011e+08, 0.20342043e+02},
	},
	CO2: {
		{200.0, 1000.0, 0.48056568e+00, -0.50786720e+03, 0.35088811e+05, 0.36747794e+01},
		{1000.0, 5000.0, 0.69857277e+00, -0.11830477e+03, -0.50688859e+05, 0.18650551e+01},
		{5000.0, 10000.0, 0.10518358e+01, -0.42555944e+04, 0.14288688e+08, -0.88950473e+00},
	},
	H2O: {
		{373.2, 1073.2, 0.10966389e+01, -0.55513429e+03, 0.10623408e+06, -0.24664550e+00},
		{1073.2, 5000.0, 0.39367933e+00, -0.22524226e+04, 0.61217458e+06, 0.58011317e+01},
		{5000.0, 15000.0, -0.41858737e+00, -0.14096649e+05, 0.19179190e+08, 0.14345613e+02},
	},
	Ar: {
		{200.0, 1000.0, 0.60968928e+00, -0.70892249e+02, 0.58420624e+03, 0.19337152e+01},
		{1000.0, 5000.0, 0.69075463e+00, 0.62676058e+02, -0.25667413e+05, 0.12664189e+01},
		{5000.0, 15000.0, 0.76269502e+00, 0.62341752e+03, -0.71899552e+06, 0.56927918e+00},
	},
}

const (
	extrapolationFloor = 200.0 // K, lowest temperature of any extrapolation
	microPoise         = 1e-7  // Pa·s
	microWPerCmK       = 1e-4  // W/(m·K)
	whereSpeciesV      = "NASA CEA viscosity fit"
	whereSpeciesK      = "NASA CEA conductivity fit"
)

// pickFit returns the fit range containing t (a boundary belongs to the
// lower range). Outside the fitted span it returns the nearest range and
// out = true.
func pickFit(fits *[3]nasaFit, t float64) (f *nasaFit, out bool) {
	if t < fits[0].tLow {
		return &fits[0], true
	}
	for i := range fits {
		if t <= fits[i].tHigh {
			return &fits[i], false
		}
	}
	return &fits[2], true
}

// TransportOptions tunes the gas transport properties. The zero value gives
// the defaults.
type TransportOptions struct {
	// AllowExtrapolation: below a fit's lowest temperature but not below
	// 200 K (in practice: H2O between 200 and 373.2 K, humid air and
	// cold flue gas) evaluate the lowest range anyway and set
	// WarnTransportExtrapolated, instead of returning an ErrRange error.
	// Above the top of the fits there is never extrapolation.
	AllowExtrapolation bool
	// Epsilon is the factor of the Mason-Saxena A_ij = ε·Φ_ij in the
	// Wassiljewa conductivity rule. 0 means 1.0 (Poling's recommendation,
	// docs/reference/heat-transfer.md §1.2 [S, memory]); Mason & Saxena used 1.065.
	Epsilon float64
}

func speciesFit(fits *[NumSpecies][3]nasaFit, where string, s Species, t float64, allowExtrap bool) (float64, Warning, error) {
	if s < 0 || s >= NumSpecies {
		panic("heat: species index out of range")
	}
	if !(t > 0) || math.IsInf(t, 1) {
		return 0, 0, inputErr(where, "T of "+speciesName[s]+" (K)", t, "a finite temperature > 0 K")
	}
	f, out := pickFit(&fits[s], t)
	var w Warning
	if out {
		if !allowExtrap || t < extrapolationFloor || t > fits[s][2].tHigh {
			return 0, 0, rangeErr(where, "T of "+speciesName[s]+" (K)", t,
				rangeText(fits[s][0].tLow, fits[s][2].tHigh))
		}
		w = WarnTransportExtrapolated
	}
	return f.eval(t), w, nil
}

func rangeText(lo, hi float64) string {
	switch {
	case lo == 373.2 && hi == 15000:
		return "373.2 K <= T <= 15000 K"
	case lo == 200 && hi == 10000:
		return "200 K <= T <= 10000 K"
	default:
		return "200 K <= T <= 15000 K"
	}
}

// SpeciesViscosity returns the dynamic viscosity of a pure species in Pa·s
// from the NASA CEA trans.inp fit (docs/reference/heat-transfer.md §1.1 [S✓]). Valid over
// 200-15000 K (CO2 to 10000 K, H2O from 373.2 K); outside, it returns an
// ErrRange error unless opt.AllowExtrapolation is set.
func SpeciesViscosity(s Species, T float64, opt TransportOptions) (float64, Warning, error) {
	v, w, err := speciesFit(&viscosityFits, whereSpeciesV, s, T, opt.AllowExtrapolation)
	return v * microPoise, w, err
}

// SpeciesConductivity returns the thermal conductivity of a pure species in
// W/(m·K) from the NASA CEA trans.inp fit (docs/reference/heat-transfer.md §1.1 [S✓]).
// Ranges and errors as SpeciesViscosity.
func SpeciesConductivity(s Species, T float64, opt TransportOptions) (float64, Warning, error) {
	v, w, err := speciesFit(&conductivityFits, whereSpeciesK, s, T, opt.AllowExtrapolation)
	return v * microWPerCmK, w, err
}

// GasTransport holds the transport properties of a gas mixture.
type GasTransport struct {
	Viscosity    float64 // Pa·s
	Conductivity float64 // W/(m·K)
	Warning      Warning
}

// MixTransport returns viscosity and conductivity of a mixture at T (K):
// viscosity by Wilke's rule, conductivity by the Wassiljewa equation with
// the Mason-Saxena A_ij = ε·Φ_ij (docs/reference/heat-transfer.md §1.2 [S, Poling et al.
// 5th ed. §9-5 and §10-6, from memory]):
//
//	η_mix = Σ_i x_i·η_i / Σ_j x_j·Φ_ij
//	Φ_ij  = [1 + (η_i/η_j)^½·(M_j/M_i)^¼]² / [8·(1 + M_i/M_j)]^½
//	λ_mix = Σ_i x_i·λ_i / Σ_j x_j·A_ij,  A_ij = ε·Φ_ij (i≠j), A_ii = 1
//
// Species with x_i = 0 are skipped, so dry air below 373.2 K needs no H2O
// fit. The pressure dependence is neglected (dilute gas). Allocates nothing.
func MixTransport(x *Composition, T float64, opt TransportOptions) (GasTransport, error) {
	if err := x.Validate(); err != nil {
		return GasTransport{}, err
	}
	eps := opt.Epsilon
	if eps == 0 {
		eps = 1
	}
	if !(eps > 0) || math.IsInf(eps, 0) {
		return GasTransport{}, inputErr("Wassiljewa rule", "epsilon", eps, "a finite factor > 0 (0 for the default 1.0)")
	}
	if !(T > 0) || math.IsInf(T, 1) {
		return GasTransport{}, inputErr("gas mixture transport", "T (K)", T, "a finite temperature > 0 K")
	}
	var eta, lam [NumSpecies]float64
	var w Warning
	lnT, invT := math.Log(T), 1/T
	for i := range NumSpecies {
		if x[i] == 0 {
			continue
		}
		fv, out := pickFit(&viscosityFits[i], T)
		fk, _ := pickFit(&conductivityFits[i], T) // same ranges as the viscosity fits
		if out {
			if _, _, err := speciesFit(&viscosityFits, whereSpeciesV, i, T, opt.AllowExtrapolation); err != nil {
				return GasTransport{}, err
			}
			w |= WarnTransportExtrapolated
		}
		eta[i] = fv.evalLn(lnT, invT) * microPoise
		lam[i] = fk.evalLn(lnT, invT) * microWPerCmK
	}
	var mu, cond float64
	for i := range NumSpecies {
		if x[i] == 0 {
			continue
		}
		var sumPhi, sumA float64
		for j := range NumSpecies {
			if x[j] == 0 {
				continue
			}
			if i == j {
				sumPhi += x[j]
				sumA += x[j]
				continue
			}
			r := 1 + math.Sqrt(eta[i]/eta[j])*wilkeM[i][j].quarter
			phi := r * r * wilkeM[i][j].invDen
			sumPhi += x[j] * phi
			sumA += x[j] * eps * phi
		}
		mu += x[i] * eta[i] / sumPhi
		cond += x[i] * lam[i] / sumA
	}
	return GasTransport{Viscosity: mu, Conductivity: cond, Warning: w}, nil
}

// wilkeMass holds the molar-mass factors of Φ_ij: (M_j/M_i)^¼ and
// 1/[8·(1 + M_i/M_j)]^½. Computed once; never mutated.
type wilkeMass struct{ quarter, invDen float64 }

var wilkeM = func() (m [NumSpecies][NumSpecies]wilkeMass) {
	for i := range NumSpecies {
		for j := range NumSpecies {
			m[i][j].quarter = math.Sqrt(math.Sqrt(molarMass[j] / molarMass[i]))
			m[i][j].invDen = 1 / math.Sqrt(8*(1+molarMass[i]/molarMass[j]))
		}
	}
	return m
}()

// SutherlandViscosity returns η = η0·(T/T0)^(3/2)·(T0+S)/(T+S) in Pa·s with
// the constants of White, Viscous Fluid Flow (2006), Tables 1-2 and 1-3, for
// air: η0 = 1.716e-5 Pa·s, T0 = 273 K, S = 111 K (docs/reference/heat-transfer.md §1.3
// [S✓ constants]). For air only, and only for a cross-check: it is within
// about 2 % of the reference correlation below 600 K, so T above 600 K
// returns an ErrRange error, as does T below 200 K.
func SutherlandViscosity(T float64) (float64, error) {
	return sutherland(T, 1.716e-5, 273, 111, "Sutherland viscosity (White 2006)")
}

// SutherlandConductivity is the same law for the conductivity of air with
// White's λ0 = 0.0241 W/(m·K), T0 = 273 K, S = 194 K, in W/(m·K). Range as
// SutherlandViscosity.
func SutherlandConductivity(T float64) (float64, error) {
	return sutherland(T, 0.0241, 273, 194, "Sutherland conductivity (White 2006)")
}

func sutherland(t, y0, t0, s float64, where string) (float64, error) {
	if !(t >= 200 && t <= 600) {
		if !(t > 0) || math.IsInf(t, 1) {
			return 0, inputErr(where, "T (K)", t, "a finite temperature > 0 K")
		}
		return 0, rangeErr(where, "T (K)", t, "200 K <= T <= 600 K (about 2 % there)")
	}
	return y0 * math.Pow(t/t0, 1.5) * (t0 + s) / (t + s), nil
}
