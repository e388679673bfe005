package fuel

import (
	"fmt"
	"math"
)

// Temperature range accepted by the Cragoe correlation: −20…250 °C. The
// original publication's stated range was not confirmed; this window is
// chosen for fuel and cargo oil service (common practice, no source).
const (
	MinCragoeT = 253.15
	MaxCragoeT = 523.15
)

// WaterDensity60F is the density of water at 60 °F (15.56 °C), 999.016 kg/m³
// (from memory), used to turn a density at 15 °C into the specific gravity
// 60/60 °F of the Cragoe formula. The 0.56 K between 15 °C and 60 °F is
// neglected (about 0.04 % in s, 0.02 % in c).
const WaterDensity60F = 999.016

func checkCragoe(sg, T float64) error {
	if !inRange(sg, 0.6, 1.1) {
		return fmt.Errorf("fuel: Cragoe specific heat: specific gravity %g outside 0.6…1.1", sg)
	}
	if !inRange(T, MinCragoeT, MaxCragoeT) {
		return fmt.Errorf("fuel: Cragoe specific heat: temperature %g K outside %g…%g K", T, MinCragoeT, MaxCragoeT)
	}
	return nil
}

// CragoeCp returns the specific heat (J/(kg·K)) of a liquid petroleum product
// of specific gravity sg (60/60 °F) at T (K), by C. S. Cragoe, Thermal
// Properties of Petroleum Products, US Bureau of Standards Misc. Publ. 97
// (1929) (docs/reference/plant-checks.md §5.3 [S✓ publication, formula from memory]):
//
//	c = (1.685 + 0.00339·t)/√s   kJ/(kg·K),  t in °C
func CragoeCp(sg, T float64) (float64, error) {
	if err := checkCragoe(sg, T); err != nil {
		return 0, err
	}
	t := T - 273.15
	return (1.685 + 0.00339*t) / math.Sqrt(sg) * 1e3, nil
}

// CragoeHeat returns ∫c dT from T1 to T2 (J/kg) for the Cragoe specific heat
// in closed form: [1.685·(t2−t1) + 0.00339/2·(t2²−t1²)]/√s kJ/kg.
func CragoeHeat(sg, T1, T2 float64) (float64, error) {
	if err := checkCragoe(sg, T1); err != nil {
		return 0, err
	}
	if err := checkCragoe(sg, T2); err != nil {
		return 0, err
	}
	t1, t2 := T1-273.15, T2-273.15
	return (1.685*(t2-t1) + 0.00339/2*(t2*t2-t1*t1)) / math.Sqrt(sg) * 1e3, nil
}

// SpecificGravity returns the fuel's specific gravity 60/60 °F, taken as
// ρ15/999.016 (see WaterDensity60F).
func (f Fuel) SpecificGravity() (float64, error) {
	if f.Class == Gas || f.ISO.Density15 == 0 {
		return 0, fmt.Errorf("fuel %q: specific gravity needs a liquid fuel with ISO 8217 density at 15 °C", f.label())
	}
	return f.ISO.Density15 / WaterDensity60F, nil
}

// Cp returns the fuel's specific heat (J/(kg·K)) at T (K) by Cragoe.
func (f Fuel) Cp(T float64) (float64, error) {
	if err := f.Validate(); err != nil {
		return 0, err
	}
	sg, err := f.SpecificGravity()
	if err != nil {
		return 0, err
	}
	c, err := CragoeCp(sg, T)
	if err != nil {
		return 0, fmt.Errorf("fuel %q: %w", f.label(), err)
	}
	return c, nil
}

// SensibleHeat returns the heat (J/kg) to take the liquid fuel from T1 to T2
// (K) by the Cragoe integral; negative when T2 < T1.
func (f Fuel) SensibleHeat(T1, T2 float64) (float64, error) {
	if err := f.Validate(); err != nil {
		return 0, err
	}
	sg, err := f.SpecificGravity()
	if err != nil {
		return 0, err
	}
	q, err := CragoeHeat(sg, T1, T2)
	if err != nil {
		return 0, fmt.Errorf("fuel %q: %w", f.label(), err)
	}
	return q, nil
}
