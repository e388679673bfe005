package combustion

import (
	"fmt"
	"math"

	"steamcase/plant/fuel"
)

// Species is a flue-gas or air component.
type Species int

// The species with thermodynamic data. NumSpecies sizes the arrays.
const (
	N2 Species = iota
	O2
	CO2
	H2O
	SO2
	Ar
	CO
	NumSpecies
)

var speciesNames = [NumSpecies]string{"N2", "O2", "CO2", "H2O", "SO2", "Ar", "CO"}

// String returns the chemical formula.
func (s Species) String() string {
	if s < 0 || s >= NumSpecies {
		return fmt.Sprintf("Species(%d)", int(s))
	}
	return speciesNames[s]
}

// RFit is the molar gas constant used for the NASA fits, 8.314510 J/(mol·K)
// (NASA TM-4513, as stated in the project's docs/reference/README.md §3).
const RFit = 8.314510

// TRef is the thermochemical reference temperature, 298.15 K.
const TRef = 298.15

// nasa7 holds one species' NASA 7-coefficient polynomials:
//
//	Cp°/R = a1 + a2·T + a3·T² + a4·T³ + a5·T⁴
//	H°/(R·T) = a1 + a2·T/2 + a3·T²/3 + a4·T³/4 + a5·T⁴/5 + a6/T
//
// low for tMin…tMid, high for tMid…tMax.
type nasa7 struct {
	tMin, tMid, tMax float64
	low, high        [7]float64
	molar            float64 // kg/mol
}

// thermoTable: NASA Technical Memorandum 4513 (October 1993), "Coefficients
// for Calculating Thermodynamic and Transport Properties of Individual
// Species", 7-coefficient form, reference pressure 1 bar, as copied in the
// project reference file flue-gas-species-nasa7.csv (rows with dataset
// "NASA TM-4513 (1993)"; copy of the same rows in testdata/, checked
// against this table by TestThermoTableMatchesCSV).
//
// Ranges as published: 200–1000–6000 K; SO2 300–1000–5000 K (JANAF 6/61).
// tMin of SO2 is set to TRef = 298.15 K, 1.85 K below the published 300 K, so
// that enthalpies relative to 298.15 K exist: a documented extrapolation
// of 1.85 K (the Cp change over it is about 0.03 %).
//
// Molar masses from the standard atomic weights of package fuel (the values
// of NASA/TP-2002-211556: N2 28.0134, O2 31.9988, CO2 44.0095, H2O
// 18.01528, SO2 64.0638, Ar 39.948, CO 28.0101 g/mol).
//
// The table is never mutated.
var thermoTable = [NumSpecies]nasa7{
	N2: {200, 1000, 6000, // TPIS78
		[7]float64{3.53100528, -1.23660987e-04, -5.02999437e-07, 2.43530612e-09, -1.40881235e-12, -1046.97628, 2.96747468},
		[7]float64{2.95257626, 1.39690057e-03, -4.92631691e-07, 7.86010367e-11, -4.60755321e-15, -923.948645, 5.87189252},
		2 * fuel.AtomicN},
	O2: {200, 1000, 6000, // TPIS89
		[7]float64{3.78245636, -2.99673415e-03, 9.847302e-06, -9.68129508e-09, 3.24372836e-12, -1063.94356, 3.65767573},
		[7]float64{3.66096083, 6.56365523e-04, -1.41149485e-07, 2.05797658e-11, -1.29913248e-15, -1215.97725, 3.41536184},
		2 * fuel.AtomicO},
	CO2: {200, 1000, 6000, // L 7/88
		[7]float64{2.35677352, 8.98459677e-03, -7.12356269e-06, 2.45919022e-09, -1.43699548e-13, -4.83719697e+04, 9.90105222},
		[7]float64{4.63659493, 2.74131991e-03, -9.95828531e-07, 1.60373011e-10, -9.16103468e-15, -4.90249341e+04, -1.93534855},
		fuel.AtomicC + 2*fuel.AtomicO},
	H2O: {200, 1000, 6000, // L 8/89
		[7]float64{4.19864056, -2.0364341e-03, 6.52040211e-06, -5.48797062e-09, 1.77197817e-12, -3.02937267e+04, -0.849032208},
		[7]float64{2.67703787, 2.97318329e-03, -7.7376969e-07, 9.44336689e-11, -4.26900959e-15, -2.98858938e+04, 6.88255571},
		2*fuel.AtomicH + fuel.AtomicO},
	SO2: {TRef, 1000, 5000, // J 6/61, published from 300 K
		[7]float64{3.2665338, 5.3237902e-03, 6.8437552e-07, -5.2810047e-09, 2.5590454e-12, -3.6908148e+04, 9.66465108},
		[7]float64{5.2451364, 1.9704204e-03, -8.0375769e-07, 1.5149969e-10, -1.0558004e-14, -3.7558227e+04, -1.07404892},
		fuel.AtomicS + 2*fuel.AtomicO},
	Ar: {200, 1000, 6000, // L 6/88, one polynomial 200–6000 K
		[7]float64{2.5, 0, 0, 0, 0, -745.375, 4.37967491},
		[7]float64{2.5, 0, 0, 0, 0, -745.375, 4.37967491},
		39.948e-3},
	CO: {200, 1000, 6000, // TPIS79
		[7]float64{3.57953347, -6.1035368e-04, 1.01681433e-06, 9.07005884e-10, -9.04424499e-13, -1.4344086e+04, 3.50840928},
		[7]float64{3.04848583, 1.35172818e-03, -4.85794075e-07, 7.88536486e-11, -4.69807489e-15, -1.42661171e+04, 6.0170979},
		fuel.AtomicC + fuel.AtomicO},
}

// RangeError reports a temperature outside a species' polynomial range.
type RangeError struct {
	Species  Species
	T        float64
	Min, Max float64
}

func (e *RangeError) Error() string {
	return fmt.Sprintf("combustion: NASA TM-4513 polynomial for %v: temperature %g K outside %g…%g K", e.Species, e.T, e.Min, e.Max)
}

func (s Species) coeffs(T float64) (*[7]float64, error) {
	if s < 0 || s >= NumSpecies {
		panic(fmt.Sprintf("combustion: species %d out of range", int(s)))
	}
	d := &thermoTable[s]
	if !(T >= d.tMin && T <= d.tMax) {
		return nil, &RangeError{Species: s, T: T, Min: d.tMin, Max: d.tMax}
	}
	if T <= d.tMid {
		return &d.low, nil
	}
	return &d.high, nil
}

func cpR(a *[7]float64, T float64) float64 {
	return a[0] + T*(a[1]+T*(a[2]+T*(a[3]+T*a[4])))
}

// hRT returns H°/R (K), including the formation term a6.
func hR(a *[7]float64, T float64) float64 {
	return T*(a[0]+T*(a[1]/2+T*(a[2]/3+T*(a[3]/4+T*a[4]/5)))) + a[5]
}

// hRef returns H°(298.15)/R of species s (low range).
func hRef(s Species) float64 { return hR(&thermoTable[s].low, TRef) }

// MolarMass returns the molar mass (kg/mol).
func (s Species) MolarMass() float64 { return thermoTable[s].molar }

// Range returns the temperature range (K) of the species' data.
func (s Species) Range() (min, max float64) { return thermoTable[s].tMin, thermoTable[s].tMax }

// CpMolar returns the ideal-gas isobaric heat capacity Cp° (J/(mol·K)) at T (K).
func (s Species) CpMolar(T float64) (float64, error) {
	a, err := s.coeffs(T)
	if err != nil {
		return 0, err
	}
	return RFit * cpR(a, T), nil
}

// HMolar returns the sensible enthalpy H°(T) − H°(298.15 K) (J/mol).
func (s Species) HMolar(T float64) (float64, error) {
	a, err := s.coeffs(T)
	if err != nil {
		return 0, err
	}
	return RFit * (hR(a, T) - hRef(s)), nil
}

// FormationEnthalpy returns H°(298.15 K) of the fit (J/mol), which for these
// species is the standard enthalpy of formation (zero for the elements).
func (s Species) FormationEnthalpy() float64 { return RFit * hRef(s) }

// Cp returns the specific isobaric heat capacity (J/(kg·K)) at T (K).
func (s Species) Cp(T float64) (float64, error) {
	c, err := s.CpMolar(T)
	return c / s.MolarMass(), err
}

// H returns the specific sensible enthalpy h(T) − h(298.15 K) (J/kg).
func (s Species) H(T float64) (float64, error) {
	h, err := s.HMolar(T)
	return h / s.MolarMass(), err
}

// Mixture is an ideal-gas mixture given by its mole fractions (indexed by
// Species). Build it with NewMixture; the zero value has no species.
type Mixture struct {
	x     [NumSpecies]float64
	molar float64
}

// NewMixture makes a mixture from amounts (any unit: mol, mol/kg fuel, or
// fractions) by normalising them. It returns an error for negative or
// non-finite amounts or an empty mixture.
func NewMixture(amounts [NumSpecies]float64) (Mixture, error) {
	var sum float64
	for i, n := range amounts {
		if !(n >= 0) || math.IsInf(n, 0) {
			return Mixture{}, fmt.Errorf("combustion: mixture amount of %v is %g; want a finite non-negative number", Species(i), n)
		}
		sum += n
	}
	if !(sum > 0) {
		return Mixture{}, fmt.Errorf("combustion: mixture is empty (all amounts zero)")
	}
	var m Mixture
	for i, n := range amounts {
		m.x[i] = n / sum
		m.molar += m.x[i] * thermoTable[i].molar
	}
	return m, nil
}

// MoleFractions returns the mole fractions.
func (m Mixture) MoleFractions() [NumSpecies]float64 { return m.x }

// MassFractions returns the mass fractions.
func (m Mixture) MassFractions() [NumSpecies]float64 {
	var y [NumSpecies]float64
	if m.molar == 0 {
		return y
	}
	for i := range m.x {
		y[i] = m.x[i] * thermoTable[i].molar / m.molar
	}
	return y
}

// MolarMass returns the mean molar mass (kg/mol).
func (m Mixture) MolarMass() float64 { return m.molar }

// CpMolar returns the mixture Cp° (J/(mol·K)) at T (K). Species with zero
// fraction are skipped, so an air mixture may be evaluated below SO2's range.
func (m Mixture) CpMolar(T float64) (float64, error) {
	var c float64
	for i, x := range m.x {
		if x == 0 {
			continue
		}
		a, err := Species(i).coeffs(T)
		if err != nil {
			return 0, err
		}
		c += x * cpR(a, T)
	}
	return RFit * c, nil
}

// HMolar returns the mixture's H(T) − H(298.15 K) (J/mol).
func (m Mixture) HMolar(T float64) (float64, error) {
	var h float64
	for i, x := range m.x {
		if x == 0 {
			continue
		}
		a, err := Species(i).coeffs(T)
		if err != nil {
			return 0, err
		}
		h += x * (hR(a, T) - hRef(Species(i)))
	}
	return RFit * h, nil
}

// Cp returns the mixture's specific heat (J/(kg·K)) at T (K).
func (m Mixture) Cp(T float64) (float64, error) {
	if m.molar == 0 {
		return 0, fmt.Errorf("combustion: Cp of an empty mixture")
	}
	c, err := m.CpMolar(T)
	return c / m.molar, err
}

// H returns the mixture's specific enthalpy h(T) − h(298.15 K) (J/kg).
func (m Mixture) H(T float64) (float64, error) {
	if m.molar == 0 {
		return 0, fmt.Errorf("combustion: enthalpy of an empty mixture")
	}
	h, err := m.HMolar(T)
	return h / m.molar, err
}

// amountsH returns Σ n_i·[H_i(T) − H_i(298.15)] (J) for amounts n (mol).
func amountsH(n *[NumSpecies]float64, T float64) (float64, error) {
	var h float64
	for i, ni := range n {
		if ni == 0 {
			continue
		}
		a, err := Species(i).coeffs(T)
		if err != nil {
			return 0, err
		}
		h += ni * (hR(a, T) - hRef(Species(i)))
	}
	return RFit * h, nil
}

// amountsCp returns Σ n_i·Cp_i(T) (J/K) for amounts n (mol).
func amountsCp(n *[NumSpecies]float64, T float64) (float64, error) {
	var c float64
	for i, ni := range n {
		if ni == 0 {
			continue
		}
		a, err := Species(i).coeffs(T)
		if err != nil {
			return 0, err
		}
		c += ni * cpR(a, T)
	}
	return RFit * c, nil
}
