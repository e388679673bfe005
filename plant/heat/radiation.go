package heat

import "math"

// StefanBoltzmann is σ in W/(m²·K⁴) (CODATA 2018, exact in the SI since 2019;
// value as used in docs/reference/heat-transfer.md §8).
const StefanBoltzmann = 5.670374419e-8

// StandardAtmosphere is 1 atm in Pa. The WSGG sets are in atm and atm·m.
const StandardAtmosphere = 101325.0

// WSGGSet names one of the five coefficient sets of Smith, Shen & Friedman
// (1982). The zero value WSGGAuto picks a set from pw/pc (SelectWSGGSet).
type WSGGSet int

// The WSGG sets (docs/reference/gas-radiation.md §1.2 [S✓]).
const (
	WSGGAuto    WSGGSet = iota // choose by pw/pc with SelectWSGGSet
	WSGGH2OLean                // H2O only, pw → 0 atm; pa = pw
	WSGGH2OPure                // H2O only, pw = 1 atm; pa = pw
	WSGGCO2Lean                // CO2 only, pc → 0 atm; pa = pc
	WSGGRatio1                 // H2O-CO2 mixture, pw/pc = 1; pa = pw + pc (oil firing)
	WSGGRatio2                 // H2O-CO2 mixture, pw/pc = 2; pa = pw + pc (natural gas)
	numWSGGSets
)

var wsggName = [numWSGGSets]string{"auto", "H2O pw->0", "H2O pw=1atm", "CO2 pc->0", "pw/pc=1", "pw/pc=2"}

func (s WSGGSet) String() string {
	if s < 0 || s >= numWSGGSets {
		return "WSGGSet(?)"
	}
	return wsggName[s]
}

// wsggCoef is one WSGG set: κ_i in 1/(atm·m) and b_{i,j} already scaled to
// SI-consistent units (b_{i,1}, b_{i,2} in 1/K, b_{i,3} in 1/K², b_{i,4} in 1/K³).
type wsggCoef struct {
	kappa [3]float64
	b     [3][4]float64
}

// Printed scale factors of the table: b_{i,1}×10, b_{i,2}×10⁴, b_{i,3}×10⁷, b_{i,4}×10¹¹.
const (
	sb1 = 1e-1
	sb2 = 1e-4
	sb3 = 1e-7
	sb4 = 1e-11
)

// wsggSets are the coefficients of T. F. Smith, Z. F. Shen, J. N. Friedman,
// "Evaluation of Coefficients for the Weighted Sum of Gray Gases Model",
// ASME J. Heat Transfer 104(4):602-608 (1982), as printed (docs/reference/gas-radiation.md
// §1.2 and wsgg-smith-shen-friedman-1982.csv [S✓, two independent public
// copies agree digit for digit]) and scaled here by the printed factors.
var wsggSets = [numWSGGSets]wsggCoef{
	WSGGH2OLean: {
		kappa: [3]float64{0.4098, 6.325, 120.5},
		b: [3][4]float64{
			{5.977 * sb1, -5.119 * sb2, 3.042 * sb3, -5.564 * sb4},
			{0.5677 * sb1, 3.333 * sb2, -1.967 * sb3, 2.718 * sb4},
			{1.800 * sb1, -2.334 * sb2, 1.008 * sb3, -1.454 * sb4},
		},
	},
	WSGGH2OPure: {
		kappa: [3]float64{0.4496, 7.113, 119.7},
		b: [3][4]float64{
			{6.324 * sb1, -8.358 * sb2, 6.135 * sb3, -13.03 * sb4},
			{-0.2016 * sb1, 7.145 * sb2, -5.212 * sb3, 9.868 * sb4},
			{3.500 * sb1, -5.040 * sb2, 2.425 * sb3, -3.888 * sb4},
		},
	},
	WSGGCO2Lean: {
		kappa: [3]float64{0.3966, 15.64, 394.3},
		b: [3][4]float64{
			{0.4334 * sb1, 2.620 * sb2, -1.560 * sb3, 2.565 * sb4},
			{-0.4814 * sb1, 2.822 * sb2, -1.794 * sb3, 3.274 * sb4},
			{0.5492 * sb1, 0.1087 * sb2, -0.3500 * sb3, 0.9123 * sb4},
		},
	},
	WSGGRatio1: {
		kappa: [3]float64{0.4303, 7.055, 178.1},
		b: [3][4]float64{
			{5.150 * sb1, -2.303 * sb2, 0.9779 * sb3, -1.494 * sb4},
			{0.7749 * sb1, 3.399 * sb2, -2.297 * sb3, 3.770 * sb4},
			{1.907 * sb1, -1.824 * sb2, 0.5608 * sb3, -0.5122 * sb4},
		},
	},
	WSGGRatio2: {
		kappa: [3]float64{0.4201, 6.516, 131.9},
		b: [3][4]float64{
			{6.508 * sb1, -5.551 * sb2, 3.029 * sb3, -5.353 * sb4},
			{-0.2504 * sb1, 6.112 * sb2, -3.882 * sb3, 6.528 * sb4},
			{2.718 * sb1, -3.118 * sb2, 1.221 * sb3, -1.612 * sb4},
		},
	},
}

// WSGG validity range, from memory (docs/reference/gas-radiation.md §1.1 [M]).
const (
	wsggTMin   = 600.0
	wsggTMax   = 2400.0
	wsggPaLMin = 0.001
	wsggPaLMax = 10.0
)

// SelectWSGGSet picks a set from the partial pressures (any unit, only the
// ratio and, for pure H2O, pw in Pa matter) with the switching rule of one
// public code (docs/reference/gas-radiation.md §1.4 [CP]): the CO2 set if pw ≤ 0.5·pc, the
// pw/pc = 1 set if pw ≤ 1.5·pc, the pw/pc = 2 set if pw ≤ 2.5·pc, otherwise
// H2O pw → 0 if pw ≤ 0.5 atm, else H2O pw = 1 atm. pw and pc in Pa.
//
// The rule jumps between sets; a steady-state solver should fix the set per
// fuel instead (WSGGRatio1 for oil, WSGGRatio2 for natural gas). Sets are
// never interpolated: the sheet offers no sourced interpolation rule.
func SelectWSGGSet(pw, pc float64) WSGGSet {
	switch {
	case pw <= 0.5*pc:
		return WSGGCO2Lean
	case pw <= 1.5*pc:
		return WSGGRatio1
	case pw <= 2.5*pc:
		return WSGGRatio2
	case pw <= 0.5*StandardAtmosphere:
		return WSGGH2OLean
	default:
		return WSGGH2OPure
	}
}

// Weights returns the WSGG weights a0…a3 at temperature T (K):
// a_i = Σ_j b_{i,j}·T^(j−1) for i = 1..3 and a0 = 1 − (a1 + a2 + a3).
// It does not check the range; WSGGEmissivity does. Panics on WSGGAuto or an
// unknown set (a programmer error).
func (s WSGGSet) Weights(T float64) [4]float64 {
	c := s.coef()
	var a [4]float64
	sum := 0.0
	for i := range 3 {
		b := &c.b[i]
		a[i+1] = b[0] + T*(b[1]+T*(b[2]+T*b[3]))
		sum += a[i+1]
	}
	a[0] = 1 - sum
	return a
}

// Kappa returns κ0…κ3 in 1/(atm·m); κ0 = 0 is the clear-gas window.
func (s WSGGSet) Kappa() [4]float64 {
	c := s.coef()
	return [4]float64{0, c.kappa[0], c.kappa[1], c.kappa[2]}
}

func (s WSGGSet) coef() *wsggCoef {
	if s <= WSGGAuto || s >= numWSGGSets {
		panic("heat: WSGGSet must be a concrete set, got " + s.String())
	}
	return &wsggSets[s]
}

// absorbingPressure returns pa in atm for the set: pw for the H2O sets, pc
// for the CO2 set, pw + pc for the mixture sets. pw, pc in Pa.
func (s WSGGSet) absorbingPressure(pw, pc float64) float64 {
	switch s {
	case WSGGH2OLean, WSGGH2OPure:
		return pw / StandardAtmosphere
	case WSGGCO2Lean:
		return pc / StandardAtmosphere
	default:
		return (pw + pc) / StandardAtmosphere
	}
}

// RadiatingGas describes a non-luminous H2O-CO2 gas path for the WSGG model.
type RadiatingGas struct {
	Set        WSGGSet // WSGGAuto: chosen by SelectWSGGSet(PH2O, PCO2)
	PH2O, PCO2 float64 // partial pressures of H2O and CO2, Pa (the sets are for a total of 1 atm)
	PathLength float64 // m, the mean beam length for an enclosure
}

// GasFromComposition returns the partial pressures of H2O and CO2 of a gas
// of composition x at total pressure p (Pa).
func GasFromComposition(x *Composition, p, pathLength float64, set WSGGSet) RadiatingGas {
	return RadiatingGas{Set: set, PH2O: x[H2O] * p, PCO2: x[CO2] * p, PathLength: pathLength}
}

func (g *RadiatingGas) check(where string) (WSGGSet, float64, Warning, error) {
	if !(g.PH2O >= 0) || math.IsInf(g.PH2O, 0) {
		return 0, 0, 0, inputErr(where, "pw (Pa)", g.PH2O, "a finite partial pressure >= 0")
	}
	if !(g.PCO2 >= 0) || math.IsInf(g.PCO2, 0) {
		return 0, 0, 0, inputErr(where, "pc (Pa)", g.PCO2, "a finite partial pressure >= 0")
	}
	if !(g.PathLength >= 0) || math.IsInf(g.PathLength, 0) {
		return 0, 0, 0, inputErr(where, "L (m)", g.PathLength, "a finite path length >= 0")
	}
	set := g.Set
	if set == WSGGAuto {
		set = SelectWSGGSet(g.PH2O, g.PCO2)
	}
	if set < WSGGAuto || set >= numWSGGSets {
		return 0, 0, 0, inputErr(where, "WSGG set", float64(set), "one of the WSGG set constants")
	}
	paL := set.absorbingPressure(g.PH2O, g.PCO2) * g.PathLength
	var w Warning
	if paL > 0 && (paL < wsggPaLMin || paL > wsggPaLMax) {
		w |= WarnWSGGPathLength
	}
	return set, paL, w, nil
}

// wsggSum returns Σ a_i(T)·[1 − exp(−κ_i·pa·L)]. Far outside 600-2400 K
// the weight polynomials stop making sense; when the clear-gas weight a0
// turns negative or ε leaves [0, 1] it returns an ErrRange error instead of
// a number.
func wsggSum(where string, set WSGGSet, tWeights, paL float64) (float64, error) {
	a := set.Weights(tWeights)
	k := set.Kappa()
	e := 0.0
	for i := 1; i < 4; i++ {
		e += a[i] * -math.Expm1(-k[i]*paL)
	}
	if !(a[0] >= 0 && e >= 0 && e <= 1) {
		return 0, rangeErr(where, "T for the weights (K)", tWeights,
			"a temperature where the "+set.String()+" weights are usable (a0 >= 0, 0 <= ε <= 1; fitted for 600-2400 K)")
	}
	return e, nil
}

// wsggTHardMax is the temperature above which the weights are refused: the
// cubic weight polynomials turn upward beyond about 3000 K (ε of the
// pw/pc = 1 set at pa·L = 0.2 atm·m: 0.085 at 2600 K, 0.071 at 3000 K, 0.094
// at 3500 K, 0.18 at 4000 K [C]), which is not physical.
const wsggTHardMax = 3000.0

func checkTemp(where, name string, t float64) (Warning, error) {
	if !(t > 0) || math.IsInf(t, 1) {
		return 0, inputErr(where, name, t, "a finite temperature > 0 K")
	}
	if t > wsggTHardMax {
		return 0, rangeErr(where, name, t, "T <= 3000 K (WSGG fitted for 600-2400 K; the weights turn unphysical above 3000 K)")
	}
	if t < wsggTMin || t > wsggTMax {
		return WarnWSGGTemperature, nil
	}
	return 0, nil
}

// Emissivity returns the total emissivity of the gas at temperature T (K)
// by the WSGG model of Smith, Shen & Friedman (1982) (docs/reference/gas-radiation.md §1.1 [S✓]):
//
//	ε = Σ_{i=1..3} a_i(T)·[1 − exp(−κ_i·pa·L)]
//
// Outside 600-2400 K or 0.001-10 atm·m (ranges from memory [M]) the value is
// still computed and a Warning is set; above 3000 K, or where the
// extrapolated weights stop making sense (a0 < 0 or ε outside [0, 1]), it
// returns an ErrRange error.
// Allocates nothing.
func (g RadiatingGas) Emissivity(T float64) (float64, Warning, error) {
	const where = "WSGG emissivity (Smith, Shen & Friedman 1982)"
	set, paL, w, err := g.check(where)
	if err != nil {
		return 0, 0, err
	}
	wt, err := checkTemp(where, "T gas (K)", T)
	if err != nil {
		return 0, 0, err
	}
	e, err := wsggSum(where, set, T, paL)
	if err != nil {
		return 0, 0, err
	}
	return e, w | wt, nil
}

// Absorptivity returns the total absorptivity of the gas (at any gas
// temperature) for black-body radiation from a surface at Ts (K), by the
// usual WSGG practice of evaluating the weights at the source temperature:
//
//	α = Σ_{i=1..3} a_i(Ts)·[1 − exp(−κ_i·pa·L)]
//
// This practice is from memory (Modest, Radiative Heat Transfer [M]); the
// paper's own absorptivity coefficients, which depend on both temperatures,
// were not transcribed (docs/reference/gas-radiation.md §1.3). The furnace and tube models
// of this package do not use it: they take α = ε_g (grey gas,
// docs/reference/heat-transfer.md §8). Walls below 600 K get WarnWSGGTemperature.
func (g RadiatingGas) Absorptivity(Ts float64) (float64, Warning, error) {
	const where = "WSGG absorptivity (weights at source temperature)"
	set, paL, w, err := g.check(where)
	if err != nil {
		return 0, 0, err
	}
	wt, err := checkTemp(where, "T source (K)", Ts)
	if err != nil {
		return 0, 0, err
	}
	a, err := wsggSum(where, set, Ts, paL)
	if err != nil {
		return 0, 0, err
	}
	return a, w | wt, nil
}

// EffectiveEmissivity returns the exchange factor of one grey gas zone and
// one grey wall zone, ε_eff = 1/(1/ε_g + 1/ε_w − 1) (docs/reference/heat-transfer.md §8,
// derived from the radiosity network [C]; grey gas, α = ε_g). It returns 0
// when either emissivity is 0. Inputs outside [0, 1] give an error.
func EffectiveEmissivity(epsGas, epsWall float64) (float64, error) {
	const where = "effective emissivity gas-wall"
	if !(epsGas >= 0 && epsGas <= 1) {
		return 0, inputErr(where, "gas emissivity", epsGas, "0 <= ε <= 1")
	}
	if !(epsWall >= 0 && epsWall <= 1) {
		return 0, inputErr(where, "wall emissivity", epsWall, "0 <= ε <= 1")
	}
	if epsGas == 0 || epsWall == 0 {
		return 0, nil
	}
	return 1 / (1/epsGas + 1/epsWall - 1), nil
}

// RadiationCoefficient returns the linearised radiative coefficient
// h_rad = σ·ε_eff·(Tg⁴ − Tw⁴)/(Tg − Tw) in W/(m²·K) (docs/reference/gas-radiation.md §4),
// written as σ·ε_eff·(Tg² + Tw²)(Tg + Tw) so that Tg = Tw is exact.
func RadiationCoefficient(epsEff, Tg, Tw float64) float64 {
	return StefanBoltzmann * epsEff * (Tg*Tg + Tw*Tw) * (Tg + Tw)
}

// Mean beam lengths (docs/reference/gas-radiation.md §4).

// BeamLengthThin returns the optically thin limit L0 = 4V/A (exact [C]).
func BeamLengthThin(volume, area float64) (float64, error) {
	if err := positive("mean beam length", "V (m³)", volume); err != nil {
		return 0, err
	}
	if err := positive("mean beam length", "A (m²)", area); err != nil {
		return 0, err
	}
	return 4 * volume / area, nil
}

// BeamLength returns L_m = 3.6·V/A for any shape radiating to its whole
// surface (Hottel, in McAdams, Heat Transmission, 3rd ed. 1954, chapter 4;
// docs/reference/gas-radiation.md §4 [S, from memory]). Use it for the furnace.
func BeamLength(volume, area float64) (float64, error) {
	l0, err := BeamLengthThin(volume, area)
	return 0.9 * l0, err
}

// BeamShape names a geometry of Hottel's mean-beam-length table.
type BeamShape int

// Shapes of Hottel's table (docs/reference/gas-radiation.md §4 [S, from memory]; the three
// tube-bank rows are of lower confidence [M]). The dimension passed to
// BeamLengthShape is given beside each.
const (
	LongCylinder   BeamShape = iota // infinitely long cylinder to its curved surface; D → 0.95·D (smoke tube)
	Sphere                          // sphere to its surface; D → 0.65·D
	CylinderHD                      // cylinder, height = D, to the whole surface; D → 0.60·D
	Slab                            // between infinite parallel planes, to one plane; spacing s → 1.8·s
	CubeFace                        // cube to one face; side a → 0.60·a
	BankTriangle2D                  // tubes, equilateral triangle pitch p = 2D; dim = p − D → 3.0·(p − D) [M]
	BankTriangle3D                  // tubes, equilateral triangle pitch p = 3D; dim = p − D → 3.8·(p − D) [M]
	BankSquare2D                    // tubes, square pitch p = 2D; dim = p − D → 3.5·(p − D) [M]
	numBeamShapes
)

var beamFactor = [numBeamShapes]float64{0.95, 0.65, 0.60, 1.8, 0.60, 3.0, 3.8, 3.5}

// BeamLengthShape returns Hottel's mean beam length for a shape and its
// characteristic dimension (m), from memory [S]. An unknown shape panics.
func BeamLengthShape(shape BeamShape, dim float64) (float64, error) {
	if shape < 0 || shape >= numBeamShapes {
		panic("heat: unknown BeamShape")
	}
	if err := positive("mean beam length", "characteristic dimension (m)", dim); err != nil {
		return 0, err
	}
	return beamFactor[shape] * dim, nil
}

// Soot (docs/reference/gas-radiation.md §5).

// Complex refractive indices n − i·k of soot: n = 1.75, k = 1.03 of
// Williams, Shaddix et al., IJHMT 50:1616 (2007) (used by public code
// BYUignite/radlib [S✓]) and the older Dalzell-Sarofim n = 1.57, k = 0.56
// (docs/reference/gas-radiation.md §5).
const (
	SootShaddixN        = 1.75
	SootShaddixK        = 1.03
	SootDalzellSarofimN = 1.57
	SootDalzellSarofimK = 0.56
)

// secondRadiationConstant is c2 = h·c/k_B in m·K, as rounded on the sheet.
const secondRadiationConstant = 1.4388e-2

// SootConstant returns K in κ_soot = K·f_v·T (1/(m·K)) for a refractive
// index n − i·k and a mean-absorption constant (3.72 for the form of
// radlib [S✓ form]; 3.83 for the Planck mean of Modest [S, memory]):
//
//	K = c·C0/C2,  C0 = 36·π·n·k / [(n² − k² + 2)² + 4·n²·k²],  C2 = 1.4388e-2 m·K
//
// With Shaddix's index and c = 3.72, K = 1816.9 (docs/reference/gas-radiation.md §5 [C]).
func SootConstant(n, k, c float64) float64 {
	a := n*n - k*k + 2
	c0 := 36 * math.Pi * n * k / (a*a + 4*n*n*k*k)
	return c * c0 / secondRadiationConstant
}

// SootAbsorption returns the grey soot absorption coefficient
// κ_soot = K·f_v·T in 1/m for soot volume fraction fv, temperature T (K)
// and constant K from SootConstant.
func SootAbsorption(K, fv, T float64) float64 { return K * fv * T }

// SootEmissivity returns ε_soot = 1 − exp(−κ_soot·L) (grey soot).
func SootEmissivity(kappa, L float64) float64 { return -math.Expm1(-kappa * L) }

// FlameEmissivity combines gas and grey soot, ignoring the spectral overlap:
// ε_flame = ε_g + ε_s − ε_g·ε_s (docs/reference/gas-radiation.md §5 [CP]).
func FlameEmissivity(epsGas, epsSoot float64) float64 {
	return epsGas + epsSoot - epsGas*epsSoot
}

// BlendedFlameEmissivity is the normative approach that mixes luminous and
// non-luminous emissivities with a filling fraction m (about 0.55 for liquid
// fuels): ε = m·ε_lum + (1 − m)·ε_non. Both the formula and m are from
// memory (docs/reference/gas-radiation.md §5 [M]); calibrate against a measured furnace
// exit temperature before relying on it.
func BlendedFlameEmissivity(m, epsLuminous, epsNonLuminous float64) (float64, error) {
	const where = "blended flame emissivity"
	for _, v := range [...]struct {
		name string
		v    float64
	}{{"m", m}, {"ε luminous", epsLuminous}, {"ε non-luminous", epsNonLuminous}} {
		if !(v.v >= 0 && v.v <= 1) {
			return 0, inputErr(where, v.name, v.v, "a value in [0, 1]")
		}
	}
	return m*epsLuminous + (1-m)*epsNonLuminous, nil
}

func positive(where, name string, v float64) error {
	if !(v > 0) || math.IsInf(v, 1) {
		return inputErr(where, name, v, "a finite value > 0")
	}
	return nil
}

func nonNegative(where, name string, v float64) error {
	if !(v >= 0) || math.IsInf(v, 1) {
		return inputErr(where, name, v, "a finite value >= 0")
	}
	return nil
}
