package fuel

import (
	"fmt"
	"math"
)

// Temperature range accepted by the volume correction: −18…150 °C, the span
// of the printed ASTM D1250-80 Table 54B (from memory).
const (
	minVCFT = 255.15
	maxVCFT = 423.15
)

// Density range of ASTM D1250-80 Table 54B (generalised products): 653…1075
// kg/m³ at 15 °C (from memory).
const (
	minVCFRho = 653.0
	maxVCFRho = 1075.0
)

// VCF54B returns the volume correction factor VCF = ρ(T)/ρ15 = V15/V(T) for
// a refined product of density rho15 (kg/m³ at 15 °C) at temperature T (K),
// by the form of ASTM D1250-80 / API MPMS 11.1 Table 54B (generalised
// products), FROM MEMORY, not confirmed against the printed standard:
//
//	α15 = K0/ρ15² + K1/ρ15,   VCF = exp(−α15·Δt·(1 + 0.8·α15·Δt)),   Δt = t − 15 °C
//
// with the product groups by density
//
//	fuel oils   838.5…1075   K0 186.9696, K1 0.4862
//	jet fuels   787.5…838.5  K0 594.5418, K1 0
//	transition  770.5…787.5  α15 = −0.00336312 + 2680.3206/ρ15²
//	gasolines   653…770.5    K0 346.4228, K1 0.4388
//
// For ρ15 991 kg/m³ at 50 °C it gives VCF 0.9760, against 0.9776 from the
// linear rule of thumb (DensityLinear, α 0.00064 /K).
func VCF54B(rho15, T float64) (float64, error) {
	if !inRange(rho15, minVCFRho, maxVCFRho) {
		return 0, fmt.Errorf("fuel: ASTM D1250 Table 54B: density at 15 °C %g kg/m³ outside %g…%g", rho15, minVCFRho, maxVCFRho)
	}
	if !inRange(T, minVCFT, maxVCFT) {
		return 0, fmt.Errorf("fuel: ASTM D1250 Table 54B: temperature %g K outside %g…%g K", T, minVCFT, maxVCFT)
	}
	var alpha float64
	switch {
	case rho15 >= 838.5:
		alpha = 186.9696/(rho15*rho15) + 0.4862/rho15
	case rho15 >= 787.5:
		alpha = 594.5418 / (rho15 * rho15)
	case rho15 >= 770.5:
		alpha = -0.00336312 + 2680.3206/(rho15*rho15)
	default:
		alpha = 346.4228/(rho15*rho15) + 0.4388/rho15
	}
	dt := T - 288.15
	return math.Exp(-alpha * dt * (1 + 0.8*alpha*dt)), nil
}

// LinearExpansionResidual is the volumetric expansion coefficient 0.00064 /K
// commonly used for residual fuel oils (common practice, no source).
const LinearExpansionResidual = 0.00064

// DensityLinear returns ρ(T) = ρ15·[1 − α·(T − 288.15 K)], the linear rule of
// thumb, for α in 1/K (e.g. LinearExpansionResidual). The same temperature
// range as VCF54B applies.
func DensityLinear(rho15, T, alpha float64) (float64, error) {
	if !inRange(rho15, MinDensity15, MaxDensity15) || !inRange(T, minVCFT, maxVCFT) || !inRange(alpha, 0, 0.002) {
		return 0, fmt.Errorf("fuel: linear volume correction: density %g kg/m³, temperature %g K, α %g /K: want %g…%g, %g…%g, 0…0.002",
			rho15, T, alpha, MinDensity15, MaxDensity15, minVCFT, maxVCFT)
	}
	return rho15 * (1 - alpha*(T-288.15)), nil
}

// Density returns the fuel's density (kg/m³) at T (K) by the Table 54B
// volume correction (VCF54B).
func (f Fuel) Density(T float64) (float64, error) {
	if err := f.Validate(); err != nil {
		return 0, err
	}
	if f.Class == Gas || f.ISO.Density15 == 0 {
		return 0, fmt.Errorf("fuel %q: density at temperature needs a liquid fuel with ISO 8217 density at 15 °C", f.label())
	}
	vcf, err := VCF54B(f.ISO.Density15, T)
	if err != nil {
		return 0, fmt.Errorf("fuel %q: %w", f.label(), err)
	}
	return f.ISO.Density15 * vcf, nil
}
