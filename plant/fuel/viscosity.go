package fuel

import (
	"fmt"
	"math"
)

// ViscosityPoint is one kinematic viscosity Nu (m²/s) at temperature T (K).
type ViscosityPoint struct {
	T, Nu float64
}

// Range of the ASTM D341 line as used here.
//
// Temperatures: −20…250 °C. The D341 chart itself spans a wider range; this
// window is chosen for fuel-oil service (storage, purifiers, heaters),
// common practice, no source. Viscosities: 0.3…2e7 mm²/s; the upper end is
// the D341 chart's, the lower end is a cautious limit for the single
// exponential low-viscosity term of docs/reference/plant-checks.md §5.1 (from memory).
const (
	MinWaltherT = 253.15
	MaxWaltherT = 523.15
	minNu       = 0.3e-6
	maxNu       = 2e-2
)

// Walther is the ASTM D341 viscosity-temperature line
//
//	log10 log10 Z = A − B·log10 T,   T in K,
//	Z = ν + 0.7 + exp(−1.47 − 1.84ν − 0.51ν²),   ν in mm²/s,
//
// (docs/reference/plant-checks.md §5.1 [S✓]). Z(ν) with its low-viscosity term is the
// definition used in both directions: ν(T) inverts it by Newton iteration,
// started from the D341 inverse ν = (Z − 0.7) − exp(−0.7487 − 3.295x +
// 0.6119x² − 0.3193x³), x = Z − 0.7, so a round trip ν(T(ν)) = ν holds to
// rounding. Above 2 mm²/s the exponential terms are below 1e-3 mm²/s.
//
// The line is valid for TMin ≤ T ≤ TMax and minNu ≤ ν ≤ maxNu; outside it the
// methods return an error, never an extrapolated value.
type Walther struct {
	A, B       float64
	TMin, TMax float64 // K
}

// waltherZ returns Z(ν) for ν in mm²/s.
func waltherZ(nu float64) float64 {
	return nu + 0.7 + math.Exp(-1.47-1.84*nu-0.51*nu*nu)
}

// waltherNu returns ν (mm²/s) with waltherZ(ν) = z.
func waltherNu(z float64) float64 {
	x := z - 0.7
	nu := x - math.Exp(-0.7487-3.295*x+0.6119*x*x-0.3193*x*x*x)
	for range 8 {
		e := math.Exp(-1.47 - 1.84*nu - 0.51*nu*nu)
		f := nu + 0.7 + e - z
		d := 1 - (1.84+1.02*nu)*e
		step := f / d
		nu -= step
		if math.Abs(step) < 1e-14*(1+nu) {
			break
		}
	}
	return nu
}

func loglog(nu float64) float64 { return math.Log10(math.Log10(waltherZ(nu))) }

// NewWalther fixes the ASTM D341 line through two points (T in K, ν in
// m²/s). It returns an error when a point is outside the valid range, the
// temperatures are equal, or viscosity does not fall with temperature.
func NewWalther(p1, p2 ViscosityPoint) (Walther, error) {
	for i, p := range [2]ViscosityPoint{p1, p2} {
		if !inRange(p.T, MinWaltherT, MaxWaltherT) {
			return Walther{}, fmt.Errorf("fuel: ASTM D341: point %d temperature %g K outside %g…%g K", i+1, p.T, MinWaltherT, MaxWaltherT)
		}
		if !inRange(p.Nu, minNu, maxNu) {
			return Walther{}, fmt.Errorf("fuel: ASTM D341: point %d viscosity %g m²/s outside %g…%g m²/s", i+1, p.Nu, minNu, maxNu)
		}
	}
	if p1.T == p2.T {
		return Walther{}, fmt.Errorf("fuel: ASTM D341: both points at %g K; want two different temperatures", p1.T)
	}
	l1, l2 := loglog(p1.Nu*1e6), loglog(p2.Nu*1e6)
	b := (l1 - l2) / (math.Log10(p2.T) - math.Log10(p1.T))
	if !(b > 0) {
		return Walther{}, fmt.Errorf("fuel: ASTM D341: viscosity %g m²/s at %g K and %g m²/s at %g K does not fall with temperature (B = %g)",
			p1.Nu, p1.T, p2.Nu, p2.T, b)
	}
	return Walther{A: l1 + b*math.Log10(p1.T), B: b, TMin: MinWaltherT, TMax: MaxWaltherT}, nil
}

// Viscosity returns the kinematic viscosity (m²/s) at T (K).
func (w Walther) Viscosity(T float64) (float64, error) {
	if !inRange(T, w.TMin, w.TMax) {
		return 0, fmt.Errorf("fuel: ASTM D341: temperature %g K outside the line's valid range %g…%g K", T, w.TMin, w.TMax)
	}
	z := math.Pow(10, math.Pow(10, w.A-w.B*math.Log10(T)))
	if math.IsInf(z, 0) || math.IsNaN(z) {
		return 0, fmt.Errorf("fuel: ASTM D341: viscosity at %g K overflows (A %g, B %g)", T, w.A, w.B)
	}
	nu := waltherNu(z) * 1e-6
	// The bounds are checked with a relative slack of 1e-12 so that the
	// round trip of a target at a bound is not refused for rounding.
	if !inRange(nu, minNu*(1-1e-12), maxNu*(1+1e-12)) {
		return 0, fmt.Errorf("fuel: ASTM D341: viscosity %g m²/s at %g K outside the valid %g…%g m²/s", nu, T, minNu, maxNu)
	}
	return nu, nil
}

// Temperature returns the temperature (K) at which the kinematic viscosity
// is nu (m²/s). It returns an error when nu is outside the valid viscosity
// range or the temperature found lies outside TMin…TMax (the target cannot
// be reached in the valid range).
func (w Walther) Temperature(nu float64) (float64, error) {
	if !inRange(nu, minNu, maxNu) {
		return 0, fmt.Errorf("fuel: ASTM D341: target viscosity %g m²/s outside %g…%g m²/s", nu, minNu, maxNu)
	}
	T := math.Pow(10, (w.A-loglog(nu*1e6))/w.B)
	if !inRange(T, w.TMin, w.TMax) {
		return 0, fmt.Errorf("fuel: ASTM D341: viscosity %g m²/s would need %.2f K (%.1f °C), outside the valid %g…%g K: target not reachable",
			nu, T, T-273.15, w.TMin, w.TMax)
	}
	return T, nil
}

// ViscosityLine returns the fuel's ASTM D341 line through its ISO 8217
// viscosity and Viscosity2.
func (f Fuel) ViscosityLine() (Walther, error) {
	if err := f.Validate(); err != nil {
		return Walther{}, err
	}
	if f.Class == Gas {
		return Walther{}, fmt.Errorf("fuel %q: ASTM D341 applies to liquid fuels, not to Class Gas", f.label())
	}
	if f.ISO.Viscosity == 0 || f.Viscosity2 == (ViscosityPoint{}) {
		return Walther{}, fmt.Errorf("fuel %q: ASTM D341 needs two viscosity points: ISO.Viscosity %g and Viscosity2 %+v", f.label(), f.ISO.Viscosity, f.Viscosity2)
	}
	w, err := NewWalther(ViscosityPoint{T: f.isoViscosityT(), Nu: f.ISO.Viscosity}, f.Viscosity2)
	if err != nil {
		return Walther{}, fmt.Errorf("fuel %q: %w", f.label(), err)
	}
	return w, nil
}

func (f Fuel) isoViscosityT() float64 {
	switch {
	case f.ISO.ViscosityT != 0:
		return f.ISO.ViscosityT
	case f.Class == Distillate:
		return 313.15
	}
	return 323.15
}

// Viscosity returns the fuel's kinematic viscosity (m²/s) at T (K) on its
// ASTM D341 line.
func (f Fuel) Viscosity(T float64) (float64, error) {
	w, err := f.ViscosityLine()
	if err != nil {
		return 0, err
	}
	nu, err := w.Viscosity(T)
	if err != nil {
		return 0, fmt.Errorf("fuel %q: %w", f.label(), err)
	}
	return nu, nil
}

// TemperatureForViscosity returns the temperature (K) at which the fuel has
// the kinematic viscosity nu (m²/s), e.g. a burner's or an engine's
// injection viscosity.
func (f Fuel) TemperatureForViscosity(nu float64) (float64, error) {
	w, err := f.ViscosityLine()
	if err != nil {
		return 0, err
	}
	T, err := w.Temperature(nu)
	if err != nil {
		return 0, fmt.Errorf("fuel %q: %w", f.label(), err)
	}
	return T, nil
}

// CCAI returns the Calculated Carbon Aromaticity Index of a residual fuel
// from its ISO 8217 density and viscosity (docs/reference/plant-checks.md §1.4 [S], ISO
// 8217 annex, formula from memory):
//
//	CCAI = ρ15 − 81 − 141·log10 log10(ν + 0.85) − 483·log10((t + 273)/323)
//
// with ν in mm²/s at t °C.
func (f Fuel) CCAI() (float64, error) {
	if err := f.Validate(); err != nil {
		return 0, err
	}
	if f.Class == Gas || f.ISO.Density15 == 0 || f.ISO.Viscosity == 0 {
		return 0, fmt.Errorf("fuel %q: CCAI needs a liquid fuel with ISO 8217 density and viscosity", f.label())
	}
	return CCAI(f.ISO.Density15, f.ISO.Viscosity, f.isoViscosityT())
}

// CCAI computes the index from density at 15 °C (kg/m³), kinematic viscosity
// (m²/s) and its temperature (K); see Fuel.CCAI.
func CCAI(rho15, nu, T float64) (float64, error) {
	if !inRange(rho15, MinDensity15, MaxDensity15) || !inRange(nu, minNu, maxNu) || !inRange(T, MinWaltherT, MaxWaltherT) {
		return 0, fmt.Errorf("fuel: CCAI: density %g kg/m³, viscosity %g m²/s, temperature %g K outside the accepted ranges", rho15, nu, T)
	}
	t := T - 273.15
	return rho15 - 81 - 141*math.Log10(math.Log10(nu*1e6+0.85)) - 483*math.Log10((t+273)/323), nil
}
