package combustion

import (
	"fmt"
	"math"
)

// Pressure units used by the dew-point correlations.
const (
	mmHg = 133.322368 // Pa
	atm  = 101325.0   // Pa
)

// VerhoffBanchero returns the sulfuric-acid dew point (K) by F. H. Verhoff
// and J. T. Banchero, Chem. Eng. Progress 70(8) (1974) (docs/reference/plant-checks.md §4
// [S✓]):
//
//	1000/T_dp = 2.276 − 0.02943·ln pH2O − 0.0858·ln pSO3 + 0.0062·ln pH2O·ln pSO3
//
// with partial pressures in mmHg (given here in Pa). The paper's range of
// validity is not known here; only positive pressures with pSO3 < pH2O < 1
// atm are accepted.
func VerhoffBanchero(pH2O, pSO3 float64) (float64, error) {
	if err := checkDewInputs(pH2O, pSO3); err != nil {
		return 0, fmt.Errorf("combustion: Verhoff-Banchero: %w", err)
	}
	lw, ls := math.Log(pH2O/mmHg), math.Log(pSO3/mmHg)
	return 1000 / (2.276 - 0.02943*lw - 0.0858*ls + 0.0062*lw*ls), nil
}

// Okkes range (from memory, docs/reference/plant-checks.md §4): pH2O 0.05–0.15 atm, SO3
// about 1–100 ppm (1e-6…1e-4 atm).
const (
	okkesMinH2O = 0.05 * atm
	okkesMaxH2O = 0.15 * atm
	okkesMinSO3 = 1e-6 * atm
	okkesMaxSO3 = 100e-6 * atm
)

// Okkes returns the sulfuric-acid dew point (K) by A. G. Okkes, Hydrocarbon
// Processing 66(7) (1987) (docs/reference/plant-checks.md §4 [S✓ formula]):
//
//	T_dp [°C] = 203.25 + 27.6·log10 pH2O + 10.83·log10 pSO3 + 1.06·(log10 pSO3 + 8)^2.19
//
// with partial pressures in atm (given here in Pa). Outside the validity
// range (from memory: pH2O 0.05–0.15 atm, SO3 1–100 ppm at 1 atm) it returns
// an error.
func Okkes(pH2O, pSO3 float64) (float64, error) {
	if err := checkDewInputs(pH2O, pSO3); err != nil {
		return 0, fmt.Errorf("combustion: Okkes: %w", err)
	}
	const slack = 1e-9 // relative, so the range ends themselves are accepted
	if !(pH2O >= okkesMinH2O*(1-slack) && pH2O <= okkesMaxH2O*(1+slack)) ||
		!(pSO3 >= okkesMinSO3*(1-slack) && pSO3 <= okkesMaxSO3*(1+slack)) {
		return 0, fmt.Errorf("combustion: Okkes: pH2O %g Pa, pSO3 %g Pa outside the correlation's range (pH2O %g…%g Pa, pSO3 %g…%g Pa; from memory)",
			pH2O, pSO3, okkesMinH2O, okkesMaxH2O, okkesMinSO3, okkesMaxSO3)
	}
	lw, ls := math.Log10(pH2O/atm), math.Log10(pSO3/atm)
	return 273.15 + 203.25 + 27.6*lw + 10.83*ls + 1.06*math.Pow(ls+8, 2.19), nil
}

func checkDewInputs(pH2O, pSO3 float64) error {
	if !(pH2O > 0 && pH2O < atm) || !(pSO3 > 0 && pSO3 < pH2O) {
		return fmt.Errorf("partial pressures H2O %g Pa, SO3 %g Pa: want 0 < pSO3 < pH2O < 101325 Pa", pH2O, pSO3)
	}
	return nil
}

// DefaultSO3Conversion is the fraction of SO2 taken to form SO3 when none
// is given: 3 %, inside the 1–5 % usual in oil firing (docs/reference/plant-checks.md §4
// [M]; common practice).
const DefaultSO3Conversion = 0.03

// DewMethod selects the acid dew-point correlation.
type DewMethod int

const (
	// MethodVerhoffBanchero selects VerhoffBanchero.
	MethodVerhoffBanchero DewMethod = iota
	// MethodOkkes selects Okkes.
	MethodOkkes
)

// AcidDewPoint returns the acid dew point (K) of the wet flue gas of p at
// total pressure (Pa; zero means 101325 Pa), with so3Fraction of the SO2
// converted to SO3 (zero means DefaultSO3Conversion). The SO3 is taken from
// the SO2 without changing the other fractions. A fuel without sulfur has no
// acid dew point: an error says so.
func AcidDewPoint(p Products, pressure, so3Fraction float64, m DewMethod) (float64, error) {
	if p.Lambda == 0 {
		return 0, fmt.Errorf("combustion: acid dew point: products are empty (call Fire first)")
	}
	pressure = orDefault(pressure, atm)
	so3Fraction = orDefault(so3Fraction, DefaultSO3Conversion)
	if !(pressure >= 50e3 && pressure <= 200e3) {
		return 0, fmt.Errorf("combustion: acid dew point: pressure %g Pa; want 50e3…200e3 Pa", pressure)
	}
	if !(so3Fraction > 0 && so3Fraction <= 0.2) {
		return 0, fmt.Errorf("combustion: acid dew point: SO3 fraction of SO2 %g; want 0…0.2", so3Fraction)
	}
	x := p.MoleFractions(true)
	if x[SO2] == 0 {
		return 0, fmt.Errorf("combustion: acid dew point: fuel %q has no sulfur, so there is no acid dew point (only the water dew point)", p.Fuel.Name)
	}
	pw, ps := x[H2O]*pressure, so3Fraction*x[SO2]*pressure
	switch m {
	case MethodVerhoffBanchero:
		return VerhoffBanchero(pw, ps)
	case MethodOkkes:
		return Okkes(pw, ps)
	}
	return 0, fmt.Errorf("combustion: acid dew point: unknown method %d", int(m))
}
