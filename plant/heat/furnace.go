package heat

import "math"

// GasEnthalpy returns the specific enthalpy h (J/kg) of the flue gas and its
// specific heat c_p = dh/dT (J/(kg·K)) at temperature T (K), on any fixed
// reference. The combustion package supplies the real one (NASA polynomials
// of the mixture); ConstantCp is a stand-in for tests and first estimates.
// It must return finite values and be increasing in T.
type GasEnthalpy func(T float64) (h, cp float64)

// ConstantCp returns h = cp·(T − tRef), a constant-c_p gas (a
// simplification; replace it by the mixture's enthalpy).
func ConstantCp(cp, tRef float64) GasEnthalpy {
	return func(T float64) (float64, float64) { return cp * (T - tRef), cp }
}

// Furnace is the geometry and radiative description of a one-zone furnace.
type Furnace struct {
	WallArea        float64 // water-cooled wall area A_w, m² (0: nothing absorbed)
	BeamLength      float64 // mean beam length L_m, m (BeamLength(V, A) = 3.6·V/A)
	WallTemperature float64 // T_w, K (T_sat + 10-30 K for water-cooled walls [CP])
	WallEmissivity  float64 // ε_w, about 0.8 for oxidised or sooted steel [M]
	// FixedEmissivity, if > 0, is taken as ε_eff directly, bypassing the gas
	// model, the soot and WallEmissivity (case A of docs/reference/heat-transfer.md §8).
	FixedEmissivity float64
	// Set is the WSGG set of the gas; WSGGAuto picks by pw/pc. Fix it per
	// fuel (WSGGRatio1 for oil) to keep residuals smooth.
	Set WSGGSet
	// SootVolumeFraction f_v of a luminous flame (1e-7 to 1e-6 in heavy-oil
	// flames [M]); 0 is a non-luminous gas. The largest single uncertainty of
	// the furnace balance: calibrate it against a measured exit temperature.
	SootVolumeFraction float64
	// SootConstant K of κ_soot = K·f_v·T in 1/(m·K); 0 means
	// SootConstant(1.75, 1.03, 3.72) = 1816.9 (docs/reference/gas-radiation.md §5).
	SootConstant float64
}

// FurnaceInput is the gas side of a furnace balance.
type FurnaceInput struct {
	GasFlow     float64     // flue-gas mass flow ṁ_g, kg/s (> 0)
	Composition Composition // mole fractions, for the H2O and CO2 partial pressures
	Pressure    float64     // total pressure, Pa; 0 means 1 atm (the WSGG sets are for 1 atm)
	Enthalpy    GasEnthalpy // h(T) of the flue gas per kg
	// Energy in: either AdiabaticTemperature (the gas leaving with all the
	// heat released would be at T_ad, so ṁ_g·h(T_ad) enters), or
	// FiringRate with ReferenceTemperature: ṁ_g·h(T_ref) + FiringRate
	// enters, FiringRate being ṁ_f·LHV plus the sensible heat of fuel and
	// air above T_ref (W). Set exactly one of AdiabaticTemperature and
	// FiringRate.
	AdiabaticTemperature float64
	FiringRate           float64
	ReferenceTemperature float64
	HeatLoss             float64 // casing loss Q_loss, W (≥ 0)
}

// FurnaceResult is the solved furnace.
type FurnaceResult struct {
	ExitTemperature      float64 // T_E = T_g, K
	HeatAbsorbed         float64 // Q_rad to the walls, W
	AdiabaticTemperature float64 // K (given, or found from FiringRate)
	GasEmissivity        float64 // ε_g (WSGG) at T_E; 0 with FixedEmissivity
	SootEmissivity       float64 // ε_soot at T_E
	FlameEmissivity      float64 // ε_g + ε_s − ε_g·ε_s
	EffectiveEmissivity  float64 // ε_eff gas-wall
	Iterations           int
	Warning              Warning
}

const furnaceWhere = "well-stirred furnace energy balance"

// Solve finds the furnace exit temperature of the well-stirred (one-zone)
// furnace (docs/reference/heat-transfer.md §8 [S, Hottel & Sarofim 1967, structure from
// memory; exchange factor derived]):
//
//	ṁ_g·[h(T_ad) − h(T_E)] = Q_rad + Q_loss,   Q_rad = σ·A_w·ε_eff·(T_E⁴ − T_w⁴)
//	ε_eff = 1/(1/ε_f + 1/ε_w − 1),  ε_f = ε_g + ε_s − ε_g·ε_s
//
// with ε_g from WSGG at (T_E, p_a·L_m) and ε_s = 1 − exp(−K·f_v·T_E·L_m).
// The gas is uniform, so it radiates at the temperature it leaves with; its
// absorptivity for wall radiation is taken equal to ε_g (grey gas). The root
// is found by Brent's method in [T_w, T_ad], where the residual changes
// sign; no NaN is returned. Allocates nothing beyond what Enthalpy does.
func (f Furnace) Solve(in FurnaceInput) (FurnaceResult, error) {
	var res FurnaceResult
	if err := f.validate(); err != nil {
		return res, err
	}
	if err := positive(furnaceWhere, "flue-gas flow (kg/s)", in.GasFlow); err != nil {
		return res, err
	}
	if err := in.Composition.Validate(); err != nil {
		return res, err
	}
	if in.Enthalpy == nil {
		return res, inputErr(furnaceWhere, "Enthalpy", 0, "a GasEnthalpy function (nil given)")
	}
	p := in.Pressure
	if p == 0 {
		p = StandardAtmosphere
	}
	if err := positive(furnaceWhere, "pressure (Pa)", p); err != nil {
		return res, err
	}
	if err := nonNegative(furnaceWhere, "casing heat loss (W)", in.HeatLoss); err != nil {
		return res, err
	}
	tw := f.WallTemperature
	tad, err := in.adiabatic(tw)
	if err != nil {
		return res, err
	}
	res.AdiabaticTemperature = tad
	hAd, _ := in.Enthalpy(tad)
	gas := GasFromComposition(&in.Composition, p, f.BeamLength, f.Set)
	soot := f.SootConstant
	if soot == 0 {
		soot = SootConstant(SootShaddixN, SootShaddixK, 3.72)
	}
	mdot := in.GasFlow
	var innerErr error
	resid := func(t float64) float64 {
		h, _ := in.Enthalpy(t)
		q, _, _, _, _, _, err := f.radiation(&gas, soot, t)
		if err != nil {
			innerErr = err
			return math.NaN()
		}
		return mdot*(hAd-h) - in.HeatLoss - q
	}
	if hW, _ := in.Enthalpy(tw); tad > tw && !(hAd > hW) {
		return res, inputErr(furnaceWhere, "h(T_ad) − h(T_w) (J/kg)", hAd-hW, "an enthalpy that increases with temperature")
	}
	fLo := resid(tw)
	if innerErr != nil {
		return res, innerErr
	}
	if fLo < 0 {
		return res, inputErr(furnaceWhere, "casing heat loss (W)", in.HeatLoss,
			"a loss smaller than the heat the gas gives up between T_ad and the wall temperature")
	}
	fHi := resid(tad)
	if innerErr != nil {
		return res, innerErr
	}
	t, it, err := brent(resid, tw, tad, fLo, fHi, 1e-8, 200)
	if err != nil {
		if innerErr != nil {
			return res, innerErr
		}
		return res, inputErr(furnaceWhere, "residual", fHi, "a residual that changes sign in [T_w, T_ad] with finite values ("+err.Error()+")")
	}
	q, eg, es, ef, ee, w, err := f.radiation(&gas, soot, t)
	if err != nil {
		return res, err
	}
	res.ExitTemperature = t
	res.HeatAbsorbed = q
	res.GasEmissivity, res.SootEmissivity, res.FlameEmissivity, res.EffectiveEmissivity = eg, es, ef, ee
	res.Iterations = it
	res.Warning = w
	return res, nil
}

// radiation returns Q_rad and the emissivities at gas temperature t.
func (f *Furnace) radiation(gas *RadiatingGas, soot, t float64) (q, eg, es, ef, ee float64, w Warning, err error) {
	if f.WallArea == 0 {
		return 0, 0, 0, 0, 0, 0, nil
	}
	if f.FixedEmissivity > 0 {
		ee = f.FixedEmissivity
	} else {
		eg, w, err = gas.Emissivity(t)
		if err != nil {
			return
		}
		es = SootEmissivity(SootAbsorption(soot, f.SootVolumeFraction, t), f.BeamLength)
		ef = FlameEmissivity(eg, es)
		ee, err = EffectiveEmissivity(ef, f.WallEmissivity)
		if err != nil {
			return
		}
	}
	tw := f.WallTemperature
	t2, tw2 := t*t, tw*tw
	q = StefanBoltzmann * f.WallArea * ee * (t2 - tw2) * (t2 + tw2)
	return
}

func (f *Furnace) validate() error {
	if err := nonNegative(furnaceWhere, "wall area (m²)", f.WallArea); err != nil {
		return err
	}
	if err := positive(furnaceWhere, "wall temperature (K)", f.WallTemperature); err != nil {
		return err
	}
	if !(f.FixedEmissivity >= 0 && f.FixedEmissivity <= 1) {
		return inputErr(furnaceWhere, "fixed effective emissivity", f.FixedEmissivity, "0 (use the gas model) or a value in (0, 1]")
	}
	if f.FixedEmissivity > 0 {
		return nil
	}
	if err := positive(furnaceWhere, "mean beam length (m)", f.BeamLength); err != nil {
		return err
	}
	if !(f.WallEmissivity > 0 && f.WallEmissivity <= 1) {
		return inputErr(furnaceWhere, "wall emissivity", f.WallEmissivity, "0 < ε_w <= 1")
	}
	if !(f.SootVolumeFraction >= 0 && f.SootVolumeFraction < 1e-3) {
		return inputErr(furnaceWhere, "soot volume fraction", f.SootVolumeFraction, "0 <= f_v < 1e-3 (typically 1e-7 to 1e-6)")
	}
	if err := nonNegative(furnaceWhere, "soot constant (1/(m·K))", f.SootConstant); err != nil {
		return err
	}
	if f.Set < WSGGAuto || f.Set >= numWSGGSets {
		return inputErr(furnaceWhere, "WSGG set", float64(f.Set), "one of the WSGG set constants")
	}
	return nil
}

// maxGasTemperature bounds the search for an adiabatic temperature (K); the
// NASA and WSGG data used here do not reach further in any useful way.
const maxGasTemperature = 5000.0

// adiabatic returns T_ad, given or found from the firing rate.
func (in *FurnaceInput) adiabatic(tw float64) (float64, error) {
	switch {
	case in.AdiabaticTemperature != 0 && in.FiringRate != 0:
		return 0, inputErr(furnaceWhere, "firing rate (W)", in.FiringRate, "0 when AdiabaticTemperature is given (set one of them)")
	case in.AdiabaticTemperature != 0:
		t := in.AdiabaticTemperature
		if !(t >= tw && t <= maxGasTemperature) {
			return 0, inputErr(furnaceWhere, "adiabatic temperature (K)", t, "a temperature between the wall temperature and 5000 K")
		}
		return t, nil
	}
	if err := nonNegative(furnaceWhere, "firing rate (W)", in.FiringRate); err != nil {
		return 0, err
	}
	tr := in.ReferenceTemperature
	if err := positive(furnaceWhere, "reference temperature (K)", tr); err != nil {
		return 0, err
	}
	return AdiabaticTemperature(in.Enthalpy, tr, in.FiringRate/in.GasFlow, math.Max(tw, tr))
}

// AdiabaticTemperature returns the temperature T ≥ tLow at which
// h(T) = h(tRef) + dh, by Brent's method in [tLow, 5000 K]: the adiabatic
// flame temperature when dh is the heat released (plus sensible heat of fuel
// and air above tRef) per kg of flue gas. The result is never below tLow;
// if h(tLow) already exceeds the target it returns an error.
func AdiabaticTemperature(h GasEnthalpy, tRef, dh, tLow float64) (float64, error) {
	const where = "adiabatic temperature"
	if h == nil {
		return 0, inputErr(where, "Enthalpy", 0, "a GasEnthalpy function (nil given)")
	}
	if err := positive(where, "reference temperature (K)", tRef); err != nil {
		return 0, err
	}
	if err := nonNegative(where, "heat per kg of gas (J/kg)", dh); err != nil {
		return 0, err
	}
	if !(tLow > 0 && tLow < maxGasTemperature) {
		return 0, inputErr(where, "lower temperature bound (K)", tLow, "0 < T < 5000 K")
	}
	h0, _ := h(tRef)
	target := h0 + dh
	g := func(t float64) float64 { v, _ := h(t); return v - target }
	gLo, gHi := g(tLow), g(maxGasTemperature)
	if gLo > 0 {
		return 0, inputErr(where, "heat per kg of gas (J/kg)", dh, "enough heat to bring the gas to the wall temperature")
	}
	t, _, err := brent(g, tLow, maxGasTemperature, gLo, gHi, 1e-10*maxGasTemperature, 200)
	if err != nil {
		return 0, inputErr(where, "heat per kg of gas (J/kg)", dh, "a value that brings the gas below 5000 K with a finite, increasing enthalpy ("+err.Error()+")")
	}
	return t, nil
}
