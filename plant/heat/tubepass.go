package heat

import "math"

// SmokeTubes is a convective pass of straight plain tubes with the flue gas
// inside and boiling water outside (a fire-tube boiler's smoke tubes).
type SmokeTubes struct {
	Count         int     // number of tubes in parallel (≥ 1)
	Di            float64 // inside diameter, m
	Length        float64 // tube length, m (0: no surface, the gas leaves as it came)
	WallThickness float64 // m
	// WallConductivity k_w in W/(m·K); 0 means SteelConductivity at the
	// water temperature (the wall runs a few K above T_sat).
	WallConductivity float64
	FoulingGas       float64 // soot on the inside surface, m²·K/W
	FoulingWater     float64 // scale on the outside surface, m²·K/W
	// WallEmissivity of the inside surface for gas radiation in the tubes
	// (about 0.8 [M]); 0 leaves gas radiation out. With radiation the
	// mean beam length is 0.95·d_i (long cylinder, docs/reference/gas-radiation.md §4 [S,
	// memory]) and the radiating wall is taken at the water temperature.
	WallEmissivity float64
	Set            WSGGSet  // WSGG set for tube radiation (WSGGAuto: by pw/pc)
	Flow           TubeFlow // gas-side convection; zero value: Gnielinski 1976 with Petukhov f
}

// TubePassInput is the operating state of a tube pass.
type TubePassInput struct {
	GasFlow          float64     // total flue-gas flow, kg/s (> 0)
	InletTemperature float64     // gas inlet, K
	Composition      Composition // mole fractions of the flue gas
	Pressure         float64     // gas pressure, Pa; 0 means 1 atm
	Enthalpy         GasEnthalpy // h(T), c_p(T) of the flue gas
	WaterTemperature float64     // saturation temperature of the water, K
	// WaterHTC is the boiling coefficient on the outside, W/(m²·K). If 0,
	// Cooper's correlation (R_p = 1 μm, water) is used at the mean outside
	// heat flux, which needs WaterPressure.
	WaterHTC float64
	// WaterPressure (Pa) is used by Cooper when WaterHTC is 0. It should be
	// the saturation pressure at WaterTemperature; the pair is not checked
	// (this package has no steam tables).
	WaterPressure float64
	Transport     TransportOptions
}

// TubePassResult is the solved tube pass.
type TubePassResult struct {
	OutletTemperature float64 // gas outlet, K
	Duty              float64 // heat to the water, W
	MeanTemperature   float64 // arithmetic mean gas temperature, K (property temperature)
	AreaInside        float64 // n·π·d_i·L, m²
	U                 float64 // overall coefficient on the inside area, W/(m²·K)
	HConvection       float64 // gas-side convective coefficient, W/(m²·K)
	HRadiation        float64 // gas radiation, linearised, W/(m²·K)
	HWater            float64 // water-side boiling coefficient, W/(m²·K)
	Re, Pr, Nu        float64 // gas side at the mean temperature
	NTU               float64 // U·A_i/(ṁ·c̄_p)
	Effectiveness     float64 // 1 − exp(−NTU)
	Iterations        int
	Warning           Warning
}

const tubeWhere = "smoke-tube pass"

func (s *SmokeTubes) validate() error {
	if s.Count < 1 {
		return inputErr(tubeWhere, "tube count", float64(s.Count), "at least 1 tube")
	}
	if err := positive(tubeWhere, "inside diameter (m)", s.Di); err != nil {
		return err
	}
	if err := nonNegative(tubeWhere, "length (m)", s.Length); err != nil {
		return err
	}
	if err := positive(tubeWhere, "wall thickness (m)", s.WallThickness); err != nil {
		return err
	}
	if err := nonNegative(tubeWhere, "wall conductivity (W/(m·K))", s.WallConductivity); err != nil {
		return err
	}
	if err := nonNegative(tubeWhere, "gas-side fouling (m²·K/W)", s.FoulingGas); err != nil {
		return err
	}
	if err := nonNegative(tubeWhere, "water-side fouling (m²·K/W)", s.FoulingWater); err != nil {
		return err
	}
	if !(s.WallEmissivity >= 0 && s.WallEmissivity <= 1) {
		return inputErr(tubeWhere, "wall emissivity", s.WallEmissivity, "0 (no gas radiation) or a value in (0, 1]")
	}
	if s.Set < WSGGAuto || s.Set >= numWSGGSets {
		return inputErr(tubeWhere, "WSGG set", float64(s.Set), "one of the WSGG set constants")
	}
	return nil
}

// tubeState is what the pass looks like for one guess of the outlet temperature.
type tubeState struct {
	tm, cp, ntu, u, hc, hr, hw, re, pr, nu float64
	w                                      Warning
}

// Solve rates the pass by ε-NTU with the water at constant saturation
// temperature: T_out = T_sat + (T_in − T_sat)·exp(−NTU), ε = 1 − exp(−NTU),
// NTU = U_i·A_i/(ṁ·c̄_p), c̄_p the mean specific heat between inlet and
// outlet. U_i follows from the series of TubeWall resistances with the gas
// side h_g = h_conv + h_rad evaluated at the arithmetic mean gas temperature,
// which depends on T_out: the outer iteration is a Brent root find on T_out
// in [T_sat, T_in], where the residual changes sign. Gas properties come
// from MixTransport (NASA fits, Wilke and Wassiljewa) and Enthalpy; the
// Reynolds number is 4·ṁ_tube/(π·d_i·η), so no density is needed.
//
// Simplifications, each replaceable: properties at the arithmetic mean gas
// temperature; U constant along the tube (ε-NTU); no entrance or
// property-ratio correction unless Flow.DOverL is set; the radiating wall
// is at the water temperature; grey gas (α = ε_g); Cooper's h at the mean
// heat flux.
func (s SmokeTubes) Solve(in TubePassInput) (TubePassResult, error) {
	var res TubePassResult
	if err := s.validate(); err != nil {
		return res, err
	}
	if err := positive(tubeWhere, "flue-gas flow (kg/s)", in.GasFlow); err != nil {
		return res, err
	}
	if err := in.Composition.Validate(); err != nil {
		return res, err
	}
	if in.Enthalpy == nil {
		return res, inputErr(tubeWhere, "Enthalpy", 0, "a GasEnthalpy function (nil given)")
	}
	p := in.Pressure
	if p == 0 {
		p = StandardAtmosphere
	}
	if err := positive(tubeWhere, "pressure (Pa)", p); err != nil {
		return res, err
	}
	tsat, tin := in.WaterTemperature, in.InletTemperature
	if err := positive(tubeWhere, "water temperature (K)", tsat); err != nil {
		return res, err
	}
	if !(tin >= tsat) || math.IsInf(tin, 1) {
		return res, inputErr(tubeWhere, "gas inlet temperature (K)", tin, "a finite temperature >= the water temperature")
	}
	if in.WaterHTC == 0 {
		if err := positive(tubeWhere, "water pressure (Pa)", in.WaterPressure); err != nil {
			return res, err
		}
	} else if !(in.WaterHTC > 0) {
		return res, inputErr(tubeWhere, "water-side coefficient (W/(m²·K))", in.WaterHTC, "a value > 0 (+Inf allowed), or 0 for Cooper")
	}
	kw := s.WallConductivity
	if kw == 0 {
		var err error
		if kw, err = SteelConductivity(tsat); err != nil {
			return res, err
		}
	}
	do := s.Di + 2*s.WallThickness
	area := float64(s.Count) * math.Pi * s.Di * s.Length
	if math.IsInf(area, 1) || math.IsInf(do, 1) {
		return res, inputErr(tubeWhere, "inside area n·π·d_i·L (m²)", area, "a finite area and outside diameter")
	}
	res.AreaInside = area
	hin, _ := in.Enthalpy(tin)
	gas := GasFromComposition(&in.Composition, p, 0.95*s.Di, s.Set)
	mTube := in.GasFlow / float64(s.Count)

	var st tubeState
	var innerErr error
	eval := func(tout float64) float64 {
		st, innerErr = s.state(&in, &gas, kw, do, area, mTube, hin, tin, tout)
		if innerErr != nil {
			return math.NaN()
		}
		return tout - tsat - (tin-tsat)*math.Exp(-st.ntu)
	}
	gHi := eval(tin)
	if innerErr != nil {
		return res, innerErr
	}
	gLo := eval(tsat)
	if innerErr != nil {
		return res, innerErr
	}
	tout, it, err := brent(eval, tsat, tin, gLo, gHi, 1e-8, 200)
	if err != nil {
		if innerErr != nil {
			return res, innerErr
		}
		return res, inputErr(tubeWhere, "residual", gHi, "a residual that changes sign in [T_sat, T_in] ("+err.Error()+")")
	}
	// Re-evaluate at the root so the reported state matches it.
	eval(tout)
	if innerErr != nil {
		return res, innerErr
	}
	hout, _ := in.Enthalpy(tout)
	res.OutletTemperature = tout
	res.Duty = in.GasFlow * (hin - hout)
	res.MeanTemperature = st.tm
	res.U = st.u
	res.HConvection, res.HRadiation, res.HWater = st.hc, st.hr, st.hw
	res.Re, res.Pr, res.Nu = st.re, st.pr, st.nu
	res.NTU = st.ntu
	res.Effectiveness = -math.Expm1(-st.ntu)
	res.Iterations = it
	res.Warning = st.w
	return res, nil
}

// state evaluates the pass for an outlet temperature guess.
func (s *SmokeTubes) state(in *TubePassInput, gas *RadiatingGas, kw, do, area, mTube, hin, tin, tout float64) (tubeState, error) {
	var st tubeState
	tsat := in.WaterTemperature
	st.tm = 0.5 * (tin + tout)
	_, cpm := in.Enthalpy(st.tm)
	if tin-tout > 1e-9*tin {
		hout, _ := in.Enthalpy(tout)
		st.cp = (hin - hout) / (tin - tout)
	} else {
		st.cp = cpm
	}
	if !(st.cp > 0) || math.IsInf(st.cp, 0) || !(cpm > 0) || math.IsInf(cpm, 0) {
		return st, inputErr(tubeWhere, "gas c_p (J/(kg·K))", st.cp, "a finite c_p > 0 from the Enthalpy function")
	}
	tr, err := MixTransport(&in.Composition, st.tm, in.Transport)
	if err != nil {
		return st, err
	}
	st.w |= tr.Warning
	st.re = 4 * mTube / (math.Pi * s.Di * tr.Viscosity)
	st.pr = cpm * tr.Viscosity / tr.Conductivity
	nu, w, err := s.Flow.Nusselt(st.re, st.pr)
	if err != nil {
		return st, err
	}
	st.w |= w
	st.nu = nu
	st.hc = nu * tr.Conductivity / s.Di
	if s.WallEmissivity > 0 {
		eg, w, err := gas.Emissivity(st.tm)
		if err != nil {
			return st, err
		}
		st.w |= w
		ee, err := EffectiveEmissivity(eg, s.WallEmissivity)
		if err != nil {
			return st, err
		}
		st.hr = RadiationCoefficient(ee, st.tm, tsat)
	}
	wall := TubeWall{Di: s.Di, Do: do, K: kw, HInside: st.hc + st.hr,
		FoulingInside: s.FoulingGas, FoulingOutside: s.FoulingWater, HOutside: in.WaterHTC}
	if in.WaterHTC > 0 {
		st.hw = in.WaterHTC
		st.u, err = wall.U(Inside)
		if err != nil {
			return st, err
		}
	} else {
		// Cooper at the mean outside flux q_o = U_o·LMTD; a short fixed
		// point, since the boiling resistance is a small part of the total.
		lmtd := logMeanDiff(tin-tsat, tout-tsat)
		pool := WaterPool(in.WaterPressure)
		wall.HOutside = math.Inf(1)
		uo, err := wall.U(Outside)
		if err != nil {
			return st, err
		}
		for range 30 {
			q := uo * lmtd
			if q == 0 {
				uo = 0
				st.hw = 0
				break
			}
			hw, w, err := pool.Cooper(q)
			if err != nil {
				return st, err
			}
			st.w |= w
			wall.HOutside = hw
			next, err := wall.U(Outside)
			if err != nil {
				return st, err
			}
			st.hw = hw
			done := math.Abs(next-uo) <= 1e-12*next
			uo = next
			if done {
				break
			}
		}
		st.u = uo * do / s.Di
	}
	st.ntu = st.u * area / (in.GasFlow * st.cp)
	return st, nil
}

// logMeanDiff returns (a − b)/ln(a/b) for a, b ≥ 0, with the limits a = b
// and b = 0 handled.
func logMeanDiff(a, b float64) float64 {
	if a <= 0 || b <= 0 {
		return 0
	}
	if math.Abs(a-b) <= 1e-9*a {
		return 0.5 * (a + b)
	}
	return (a - b) / math.Log(a/b)
}
