package combustion

import (
	"fmt"
	"math"
)

// StandardDryAir is the dry combustion air used when Conditions.DryAir is
// zero, in mole fractions: O2 20.946 %, Ar 0.934 %, and N2 78.120 %, where
// the nitrogen takes the 78.084 % of N2 plus the CO2 (about 0.04 %) and the
// other traces ("atmospheric nitrogen"). O2 and Ar are the usual standard
// dry-air figures (common practice; the ISO 2533 / US Standard Atmosphere
// table, from memory). CO2 is left out of the air so that the flue-gas CO2
// is the fuel's alone, as analysers and docs/reference/plant-checks.md §2 count it; the
// molar mass is 28.960 g/mol and the O2 mass fraction 23.144 %
// (docs/reference/plant-checks.md §0 uses 20.95 % and 23.14 % m/m [CP]).
var StandardDryAir = [NumSpecies]float64{N2: 0.78120, O2: 0.20946, Ar: 0.00934}

// Coefficients n1…n10 (here sat1…sat10) of the IAPWS-IF97 saturation line,
// IAPWS R7-97(2012) Table 34.
const (
	sat1  = 0.11670521452767e4
	sat2  = -0.72421316703206e6
	sat3  = -0.17073846940092e2
	sat4  = 0.12020824702470e5
	sat5  = -0.32325550322333e7
	sat6  = 0.14915108613530e2
	sat7  = -0.48232657361591e4
	sat8  = 0.40511340542057e6
	sat9  = -0.23855557567849
	sat10 = 0.65017534844798e3
)

// psatIF97 returns the saturation pressure of water (Pa) at T (K) by the
// IAPWS-IF97 region 4 saturation-pressure equation (IAPWS R7-97(2012)
// Eq. 30), valid 273.15…647.096 K. Coefficients from IAPWS R7-97(2012)
// Table 34; checked against its Table 35 in the tests.
func psatIF97(T float64) (float64, error) {
	if !(T >= 273.15 && T <= 647.096) {
		return 0, fmt.Errorf("combustion: IAPWS-IF97 saturation pressure: temperature %g K outside 273.15…647.096 K", T)
	}
	th := T + sat9/(T-sat10)
	A := th*th + sat1*th + sat2
	B := sat3*th*th + sat4*th + sat5
	C := sat6*th*th + sat7*th + sat8
	return 1e6 * math.Pow(2*C/(-B+math.Sqrt(B*B-4*A*C)), 4), nil
}

// HumidityRatio returns the humidity ratio (kg water vapour per kg dry air)
// of moist air of relative humidity rh (0…1) at T (K) and total pressure p
// (Pa), for the dry air composition dryAir (mole fractions; zero value:
// StandardDryAir). Ideal-gas mixing; the saturation pressure is over liquid
// water by IAPWS-IF97, so T must be at least 273.15 K (below freezing give the
// humidity ratio directly).
func HumidityRatio(rh, T, p float64, dryAir [NumSpecies]float64) (float64, error) {
	if !(rh >= 0 && rh <= 1) {
		return 0, fmt.Errorf("combustion: relative humidity %g; want 0…1", rh)
	}
	if !(p >= 50e3 && p <= 200e3) {
		return 0, fmt.Errorf("combustion: air pressure %g Pa; want 50e3…200e3 Pa", p)
	}
	if T < 273.15 {
		return 0, fmt.Errorf("combustion: relative humidity at %g K: below 0 °C the saturation over ice is not modelled; give the humidity ratio (kg/kg dry air) instead", T)
	}
	ps, err := psatIF97(T)
	if err != nil {
		return 0, err
	}
	pv := rh * ps
	if pv >= p {
		return 0, fmt.Errorf("combustion: vapour pressure %g Pa at %g K is not below the air pressure %g Pa", pv, T, p)
	}
	if dryAir == ([NumSpecies]float64{}) {
		dryAir = StandardDryAir
	}
	m, err := NewMixture(dryAir)
	if err != nil {
		return 0, err
	}
	return H2O.MolarMass() / m.MolarMass() * pv / (p - pv), nil
}
