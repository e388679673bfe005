package heat

import "math"

// Water constants used by the boiling correlations (docs/reference/heat-transfer.md §6).
const (
	WaterCriticalPressure = 22.064e6 // Pa (IAPWS)
	WaterMolarMass        = 18.015   // g/mol, as in Cooper's M
)

// Pool names the fluid and surface for nucleate pool boiling.
type Pool struct {
	P         float64 // pressure, Pa
	Pc        float64 // critical pressure, Pa (WaterCriticalPressure for water)
	M         float64 // molar mass, g/mol (Cooper only)
	Roughness float64 // surface roughness R_p in μm (Cooper only); 0 means 1 μm
}

// WaterPool returns the pool description for water at pressure p (Pa) on a
// surface of unknown roughness (R_p = 1 μm).
func WaterPool(p float64) Pool {
	return Pool{P: p, Pc: WaterCriticalPressure, M: WaterMolarMass}
}

func (b *Pool) check(where string, needM bool) (pr float64, w Warning, err error) {
	if err := positive(where, "p (Pa)", b.P); err != nil {
		return 0, 0, err
	}
	if err := positive(where, "p_c (Pa)", b.Pc); err != nil {
		return 0, 0, err
	}
	pr = b.P / b.Pc
	if !(pr < 1) {
		return 0, 0, inputErr(where, "reduced pressure p/p_c", pr, "p < p_c (boiling needs a subcritical pressure)")
	}
	if needM {
		if err := positive(where, "M (g/mol)", b.M); err != nil {
			return 0, 0, err
		}
		if !(b.Roughness >= 0) || math.IsInf(b.Roughness, 1) {
			return 0, 0, inputErr(where, "R_p (μm)", b.Roughness, "a finite roughness >= 0 (0 for 1 μm)")
		}
		if pr < 0.001 || pr > 0.9 {
			w = WarnCooperPressure
		}
	}
	return pr, w, nil
}

// cooperFactor is 55·p_r^(0.12 − 0.2·log10 R_p)·(−log10 p_r)^(−0.55)·M^(−0.5).
func (b *Pool) cooperFactor(pr float64) float64 {
	rp := b.Roughness
	if rp == 0 {
		rp = 1
	}
	return 55 * math.Pow(pr, 0.12-0.2*math.Log10(rp)) * math.Pow(-math.Log10(pr), -0.55) / math.Sqrt(b.M)
}

// Cooper returns the nucleate pool boiling coefficient h (W/(m²·K)) at heat
// flux q (W/m²), M. G. Cooper, "Saturated nucleate pool boiling — a simple
// correlation", IChemE Symp. Ser. 86:785-793 (1984) (docs/reference/heat-transfer.md §6 [S✓]):
//
//	h = 55·p_r^(0.12 − 0.2·log10 R_p)·(−log10 p_r)^(−0.55)·M^(−0.5)·q^0.67
//
// Cooper's factor 1.7 for horizontal copper cylinders is not applied. The
// usual range 0.001 < p_r < 0.9 is from memory: outside it
// WarnCooperPressure is set. q = 0 gives h = 0.
func (b Pool) Cooper(q float64) (float64, Warning, error) {
	const where = "Cooper (1984) boiling"
	pr, w, err := b.check(where, true)
	if err != nil {
		return 0, 0, err
	}
	if err := nonNegative(where, "q (W/m²)", q); err != nil {
		return 0, 0, err
	}
	return b.cooperFactor(pr) * math.Pow(q, 0.67), w, nil
}

// CooperDeltaT is Cooper's correlation written with the wall superheat
// ΔT = T_w − T_sat (K) instead of q: h = [factor·ΔT^0.67]^(1/0.33).
func (b Pool) CooperDeltaT(dT float64) (float64, Warning, error) {
	const where = "Cooper (1984) boiling, ΔT form"
	pr, w, err := b.check(where, true)
	if err != nil {
		return 0, 0, err
	}
	if err := nonNegative(where, "ΔT (K)", dT); err != nil {
		return 0, 0, err
	}
	return math.Pow(b.cooperFactor(pr)*math.Pow(dT, 0.67), 1/0.33), w, nil
}

// mostinskiFactor is 0.00417·p_c^0.69·[1.8·p_r^0.17 + 4·p_r^1.2 + 10·p_r^10]
// with p_c in kPa.
func (b *Pool) mostinskiFactor(pr float64) float64 {
	return 0.00417 * math.Pow(b.Pc/1000, 0.69) * (1.8*math.Pow(pr, 0.17) + 4*math.Pow(pr, 1.2) + 10*math.Pow(pr, 10))
}

// Mostinski returns the nucleate boiling coefficient (W/(m²·K)) at heat
// flux q (W/m²) by Mostinski (1963) (docs/reference/heat-transfer.md §6 [S✓, one library
// docstring]): h = 0.00417·p_c^0.69·q^0.7·[1.8·p_r^0.17 + 4·p_r^1.2 + 10·p_r^10],
// p_c in kPa. It differs from Cooper by 10-20 % in the boiler range.
func (b Pool) Mostinski(q float64) (float64, error) {
	const where = "Mostinski (1963) boiling"
	pr, _, err := b.check(where, false)
	if err != nil {
		return 0, err
	}
	if err := nonNegative(where, "q (W/m²)", q); err != nil {
		return 0, err
	}
	return b.mostinskiFactor(pr) * math.Pow(q, 0.7), nil
}

// MostinskiDeltaT is Mostinski's correlation with the wall superheat ΔT (K):
// h = [factor·ΔT^0.7]^(1/0.3).
func (b Pool) MostinskiDeltaT(dT float64) (float64, error) {
	const where = "Mostinski (1963) boiling, ΔT form"
	pr, _, err := b.check(where, false)
	if err != nil {
		return 0, err
	}
	if err := nonNegative(where, "ΔT (K)", dT); err != nil {
		return 0, err
	}
	return math.Pow(b.mostinskiFactor(pr)*math.Pow(dT, 0.7), 1/0.3), nil
}
