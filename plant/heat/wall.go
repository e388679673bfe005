package heat

import "math"

// FoulingUnit converts a fouling resistance in h·ft²·°F/Btu to m²·K/W:
// 1/5.678263337 = 0.176110 (docs/reference/heat-transfer.md §5 [C]; 1 Btu_IT/(h·ft²·°F) =
// 5.678263337 W/(m²·K)).
const FoulingUnit = 1 / 5.678263337

// TEMA fouling resistances in m²·K/W, from the values in h·ft²·°F/Btu of the
// Standards of the Tubular Exchanger Manufacturers Association, table
// RGP-T-2.4 (table number from memory; values seen in two secondary
// reproductions, docs/reference/heat-transfer.md §5 [S✓]). No TEMA entry for heavy fuel oil
// flue gas was seen: for oil-fired boilers use a soot allowance
// (SootLayerResistance, or 0.001-0.005 m²·K/W [CP/M]).
const (
	FoulingEngineExhaust         = 0.010 * FoulingUnit  // engine exhaust gas
	FoulingNaturalGasFlue        = 0.005 * FoulingUnit  // natural-gas flue gas
	FoulingCoalFlue              = 0.010 * FoulingUnit  // coal flue gas
	FoulingBoilerFeedwaterSlow   = 0.001 * FoulingUnit  // treated boiler feedwater, ≤ 3 ft/s
	FoulingBoilerFeedwaterFast   = 0.0005 * FoulingUnit // treated boiler feedwater, > 3 ft/s
	FoulingBoilerBlowdown        = 0.002 * FoulingUnit  // boiler blowdown
	FoulingDistilledOrCondensate = 0.0005 * FoulingUnit // distilled or demineralised water, condensate
)

// Typical conductivities of deposits, from memory (docs/reference/heat-transfer.md §5 [M]).
const (
	SootConductivityLow  = 0.05 // W/(m·K), soot, low end
	SootConductivityHigh = 0.1  // W/(m·K), soot, high end
	ScaleConductivityLow = 0.5  // W/(m·K), CaCO3/CaSO4 scale, low end
	ScaleConductivityHi  = 2.5  // W/(m·K), scale, high end
)

// LayerResistance returns the resistance t/k (m²·K/W) of a thin deposit
// layer (soot or scale) of thickness t (m) and conductivity k (W/(m·K)),
// treated as flat (thin compared with the tube radius). Soot builds up
// between soot blowings: pass the thickness of the state being modelled.
func LayerResistance(t, k float64) (float64, error) {
	if err := nonNegative("deposit layer", "thickness (m)", t); err != nil {
		return 0, err
	}
	if err := positive("deposit layer", "conductivity (W/(m·K))", k); err != nil {
		return 0, err
	}
	return t / k, nil
}

// WallResistancePerLength returns the resistance of a cylindrical wall per
// metre of tube, R' = ln(r_o/r_i)/(2·π·k) in K·m/W (exact for steady radial
// conduction, docs/reference/heat-transfer.md §5).
func WallResistancePerLength(di, do, k float64) (float64, error) {
	if err := checkTube("cylindrical wall", di, do); err != nil {
		return 0, err
	}
	if err := positive("cylindrical wall", "k (W/(m·K))", k); err != nil {
		return 0, err
	}
	return math.Log(do/di) / (2 * math.Pi * k), nil
}

func checkTube(where string, di, do float64) error {
	if err := positive(where, "inside diameter (m)", di); err != nil {
		return err
	}
	if !(do > di) || math.IsInf(do, 1) {
		return inputErr(where, "outside diameter (m)", do, "a finite outside diameter > inside diameter")
	}
	return nil
}

// Side names the surface an overall coefficient is referred to.
type Side int

// Reference surfaces.
const (
	Inside Side = iota
	Outside
)

// TubeWall is the series of resistances across a tube wall: an inside film,
// inside fouling, the cylindrical wall, outside fouling and an outside film
// (docs/reference/heat-transfer.md §5). Smoke tubes have the gas inside, economiser tubes
// the water inside. Fouling resistances are each per unit of their own
// surface; a film coefficient of +Inf (perfect) is allowed, 0 is not.
type TubeWall struct {
	Di, Do         float64 // inside and outside diameter, m
	K              float64 // wall conductivity, W/(m·K)
	HInside        float64 // inside film coefficient, W/(m²·K)
	FoulingInside  float64 // m²·K/W on the inside surface
	FoulingOutside float64 // m²·K/W on the outside surface
	HOutside       float64 // outside film coefficient, W/(m²·K)
}

// Resistances returns the five resistances in m²·K/W, each referred to the
// surface side: inside film, inside fouling, wall, outside fouling, outside
// film. Their sum is 1/U on that surface.
func (t TubeWall) Resistances(side Side) ([5]float64, error) {
	const where = "tube wall resistances"
	var r [5]float64
	if err := checkTube(where, t.Di, t.Do); err != nil {
		return r, err
	}
	if err := positive(where, "k (W/(m·K))", t.K); err != nil {
		return r, err
	}
	if !(t.HInside > 0) {
		return r, inputErr(where, "inside film coefficient (W/(m²·K))", t.HInside, "a value > 0 (+Inf allowed)")
	}
	if !(t.HOutside > 0) {
		return r, inputErr(where, "outside film coefficient (W/(m²·K))", t.HOutside, "a value > 0 (+Inf allowed)")
	}
	if err := nonNegative(where, "inside fouling (m²·K/W)", t.FoulingInside); err != nil {
		return r, err
	}
	if err := nonNegative(where, "outside fouling (m²·K/W)", t.FoulingOutside); err != nil {
		return r, err
	}
	// Per unit of inside area first.
	ratio := t.Di / t.Do
	r[0] = 1 / t.HInside
	r[1] = t.FoulingInside
	r[2] = t.Di / 2 * math.Log(t.Do/t.Di) / t.K
	r[3] = t.FoulingOutside * ratio
	r[4] = ratio / t.HOutside
	if side == Outside {
		for i := range r {
			r[i] /= ratio
		}
	} else if side != Inside {
		panic("heat: unknown Side")
	}
	return r, nil
}

// U returns the overall coefficient in W/(m²·K) referred to the inside or
// outside surface of the tube: 1/U_i = 1/h_i + R_f,i + (d_i/2)·ln(d_o/d_i)/k
// + R_f,o·(d_i/d_o) + (d_i/d_o)/h_o, and U_o = U_i·d_i/d_o.
func (t TubeWall) U(side Side) (float64, error) {
	r, err := t.Resistances(side)
	if err != nil {
		return 0, err
	}
	return 1 / (r[0] + r[1] + r[2] + r[3] + r[4]), nil
}

// SteelConductivity returns the thermal conductivity of carbon and non-alloy
// steel at temperature T (K) by EN 1993-1-2 (Eurocode 3, fire design),
// §3.4.1.3 (clause number from memory) (docs/reference/heat-transfer.md §7 [S✓ form]):
// λ = 54 − 3.33e-2·θ W/(m·K) for 20 ≤ θ < 800 °C and 27.3 W/(m·K) for
// 800-1200 °C, θ = T − 273.15. The slope 3.33e-2 is the one that meets 27.3
// at 800 °C (a secondary copy prints 3.3e-2). Outside 20-1200 °C it returns
// an ErrRange error. Boiler steels (P235GH, P265GH) have no conductivity in
// their material standard; this generic curve gives 45-48 W/(m·K) at
// 200-300 °C, the usual handbook values.
func SteelConductivity(T float64) (float64, error) {
	const where = "steel conductivity EN 1993-1-2"
	th := T - 273.15
	if !(th >= 20 && th <= 1200) {
		if !(T > 0) || math.IsInf(T, 1) {
			return 0, inputErr(where, "T (K)", T, "a finite temperature > 0 K")
		}
		return 0, rangeErr(where, "T (K)", T, "293.15 K <= T <= 1473.15 K (20-1200 °C)")
	}
	if th < 800 {
		return 54 - 3.33e-2*th, nil
	}
	return 27.3, nil
}
