package fuel

import "fmt"

// gasConstant is the molar gas constant, 8.314462618 J/(mol·K) (CODATA
// 2018, exact in the 2019 SI).
const gasConstant = 8.314462618

// HydrogenGrossNet is the difference between the gross specific energy at
// constant volume (a bomb calorimeter's, the one ISO 8217 gives) and the net
// specific energy at constant pressure, per kg of hydrogen in a liquid fuel
// (J/kg H), 21.206 MJ/kg. It is the latent heat at 25 °C of the 8.937 kg of
// water one kg of hydrogen forms (LatentHeat25, docs/reference/plant-checks.md §0 [C])
// less the work done at constant pressure by the gas volume the combustion
// removes: the fuel's hydrogen takes ½ mol of O2 from the air per mol of
// liquid water formed, so the heat released at constant pressure exceeds
// that at constant volume by ½·R·T per mol of H2 (0.615 MJ/kg H at 298.15
// K). Computed here; ASTM D240 and ISO 1928 write the same relation as
// 0.2122 MJ/kg per % m/m of hydrogen (from memory), 0.07 % apart. The
// corresponding terms for the fuel's oxygen and nitrogen (0.8 J/g per %
// m/m in ISO 1928, from memory) are below 0.01 MJ/kg for fuel oils and are
// neglected.
const HydrogenGrossNet = WaterPerHydrogen*LatentHeat25 - 0.5*gasConstant*298.15/(2*AtomicH)

// Nitrogen and oxygen accepted by AnalysisFromISO: up to 1 % and 2 % m/m,
// twice the top of the typical residual-fuel ranges of docs/reference/plant-checks.md §1.2
// (N 0.2–0.6, O 0.2–1.0 % [M]) (common practice, no source).
const (
	maxISONitrogen = 0.01
	maxISOOxygen   = 0.02
)

// AnalysisFromISO returns the ultimate analysis (as fired, kg/kg) that a
// liquid fuel's ISO 8217 properties imply, with the nitrogen n and oxygen o
// that those properties do not give (kg/kg; typical values are in
// docs/reference/plant-checks.md §1.2 [M]):
//
//   - sulfur, water and ash are the ISO 8217 figures;
//   - hydrogen is what the annex formula of the fuel's class implies: its
//     gross (constant volume) minus net (constant pressure), less the
//     formula's own water term (0.02449 MJ/kg per % m/m), is the
//     hydrogen's HydrogenGrossNet, so
//     H = (Q_gross − Q_net − 2.449 MJ/kg·w)/21.206 MJ/kg;
//   - carbon is the balance, C = 1 − H − S − N − O − water − ash (carbon by
//     difference, common practice, no source).
//
// The analysis is consistent with the ISO 8217 energies by construction:
// the latent heat of the water its hydrogen forms is the formula's own
// gross − net. Its carbon is not fitted to anything; the Channiwala-Parikh
// correlation on the analysis (AnalysisEnergy) is an independent check of
// the ISO gross value, within 1 % for the built-in grades. Check of the
// hydrogen: Cragoe's (1929) H = 26 − 15·d % m/m of the combustible part (d
// the specific gravity 60/60 °F; from memory) gives the same within 0.1 %
// m/m for the three built-in liquid grades (a test holds it). Simplification:
// n and o are assumed, and an error in them goes one for one into the
// carbon.
func AnalysisFromISO(c Class, p ISO8217, n, o float64) (Analysis, error) {
	if c != Residual && c != Distillate {
		return Analysis{}, fmt.Errorf("fuel: analysis from ISO 8217 properties: class %v; want Residual or Distillate", c)
	}
	if !inRange(n, 0, maxISONitrogen) || !inRange(o, 0, maxISOOxygen) {
		return Analysis{}, fmt.Errorf("fuel: analysis from ISO 8217 properties: nitrogen %g, oxygen %g kg/kg; want 0…%g and 0…%g",
			n, o, maxISONitrogen, maxISOOxygen)
	}
	net, gross, err := isoFormula(c, p.Density15, p.Water, p.Ash, p.Sulfur)
	if err != nil {
		return Analysis{}, err
	}
	h := (gross - net - isoWaterTerm*p.Water) / HydrogenGrossNet
	a := Analysis{H: h, S: p.Sulfur, N: n, O: o, Water: p.Water, Ash: p.Ash}
	a.C = 1 - a.H - a.S - a.N - a.O - a.Water - a.Ash
	if !(a.H > 0) || !(a.C > 0.5) {
		return Analysis{}, fmt.Errorf("fuel: analysis from ISO 8217 properties: density %g kg/m³ gives hydrogen %g and carbon %g kg/kg, not a fuel oil",
			p.Density15, a.H, a.C)
	}
	return a, nil
}
