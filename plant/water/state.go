package water

import "math"

// Region is an IAPWS-IF97 region, numbered as in the release.
type Region int

// The regions of IF97. RegionTwoPhase is region 4, the saturation line and
// the wet states under it.
const (
	Region1        Region = 1 // compressed liquid up to 623.15 K
	Region2        Region = 2 // vapour up to 1073.15 K
	Region3        Region = 3 // near-critical and supercritical states above 623.15 K
	RegionTwoPhase Region = 4 // saturation (wet states)
	Region5        Region = 5 // high-temperature vapour, 1073.15 K to 2273.15 K
)

func (r Region) String() string {
	switch r {
	case Region1:
		return "region 1"
	case Region2:
		return "region 2"
	case Region3:
		return "region 3"
	case RegionTwoPhase:
		return "region 4 (two-phase)"
	case Region5:
		return "region 5"
	}
	return "region ?"
}

// Phase is the physical phase of a state.
type Phase int

// The phases. The zero Phase is not a phase; a State returned with a nil
// error never carries it.
const (
	Liquid        Phase = iota + 1 // compressed or saturated liquid (T < 647.096 K)
	TwoPhase                       // wet steam, 0 < x < 1
	Vapour                         // superheated or saturated vapour, gas above the critical temperature below the critical pressure
	Supercritical                  // p >= 22.064 MPa and T >= 647.096 K
)

func (ph Phase) String() string {
	switch ph {
	case Liquid:
		return "liquid"
	case TwoPhase:
		return "two-phase"
	case Vapour:
		return "vapour"
	case Supercritical:
		return "supercritical"
	}
	return "unknown phase"
}

// State is a thermodynamic state of water or steam. All values are SI.
//
// For a two-phase state (Region == RegionTwoPhase, 0 < X < 1) the specific
// heats Cp and Cv and the speed of sound W are not defined and are set to 0.
// H, S, U and V are the mass-weighted mixtures of the saturated liquid and
// vapour, and Rho = 1/V. The end points of the saturation line, x = 0 and
// x = 1, are returned as the single-phase saturated liquid and vapour (see
// SatLiquid and SatVapour), so Cp, Cv and W are defined there.
type State struct {
	P, T    float64 // pressure (Pa), temperature (K)
	H, S, U float64 // specific enthalpy (J/kg), entropy (J/(kg K)), internal energy (J/kg)
	V, Rho  float64 // specific volume (m3/kg), density (kg/m3)
	Cp, Cv  float64 // specific isobaric and isochoric heat capacity, J/(kg K); 0 for two-phase
	W       float64 // speed of sound, m/s; 0 for two-phase
	X       float64 // vapour mass fraction: 0..1 in two-phase; 0 for liquid, 1 for vapour and supercritical
	Region  Region
	Phase   Phase
}

// pSat13 is p_sat(623.15 K), the pressure where regions 1, 2, 3 and 4 meet.
var pSat13 = psat4(t13)

// pSatMinT is p_sat(273.15 K) by Eq. 30, 611.212677 Pa (the release
// rounds it to 611.213 Pa), the low end of the saturation line.
var pSatMinT = psat4(tMin)

// classify sets Phase and X of a single-phase state.
func (st *State) classify(liquidSide bool) {
	switch {
	case st.Region == Region1 || (st.Region == Region3 && st.T < tCrit && liquidSide):
		st.Phase, st.X = Liquid, 0
	case st.P >= pCrit && st.T >= tCrit:
		st.Phase, st.X = Supercritical, 1
	default:
		st.Phase, st.X = Vapour, 1
	}
}

// Tsat returns the saturation temperature (K) at pressure p (Pa), IF97
// Eq. 31, for 611.213 Pa <= p <= 22.064 MPa.
func Tsat(p float64) (float64, error) {
	if err := checkSatP("Tsat", p); err != nil {
		return 0, err
	}
	return tsat4(p), nil
}

// Psat returns the saturation pressure (Pa) at temperature t (K), IF97
// Eq. 30, for 273.15 K <= t <= 647.096 K.
func Psat(t float64) (float64, error) {
	if err := checkSatT("Psat", t); err != nil {
		return 0, err
	}
	return psat4(t), nil
}

// satTol is the relative distance |p - p_sat(T)|/p_sat below which a (p,T)
// pair is taken to lie on the saturation line. It corresponds to about
// 1e-7 K in temperature.
const satTol = 1e-9

// regionPT returns the region of a checked (p,T) pair, and for region 3
// the side of the density root.
func regionPT(fn string, p, t float64) (Region, side3, error) {
	switch {
	case t > tMid:
		return Region5, 0, nil
	case t <= t13:
		ps := psat4(t)
		if math.Abs(p-ps) <= satTol*ps {
			return 0, 0, &SaturationError{Func: fn, P: p, T: t, PSat: ps}
		}
		if p > ps {
			return Region1, 0, nil
		}
		return Region2, 0, nil
	case t > t23max || p <= pB23(t):
		return Region2, 0, nil
	}
	if t < tCrit {
		ps := psat4(t)
		if math.Abs(p-ps) <= satTol*ps {
			return 0, 0, &SaturationError{Func: fn, P: p, T: t, PSat: ps}
		}
		if p > ps {
			return Region3, sideLiquid, nil
		}
		return Region3, sideVapour, nil
	}
	return Region3, sideSuper, nil
}

// PT returns the state at pressure p (Pa) and temperature t (K).
//
// A pair on the saturation line (within a relative 1e-9 in pressure) is
// an error of type *SaturationError: use PX or TX there.
func PT(p, t float64) (State, error) {
	var st State
	if err := checkPT("PT", p, t); err != nil {
		return st, err
	}
	reg, sd, err := regionPT("PT", p, t)
	if err != nil {
		return st, err
	}
	err = statePT(&st, "PT", p, t, reg, sd)
	return st, err
}

// statePT evaluates the state of a (p,T) pair whose region is known.
func statePT(st *State, fn string, p, t float64, reg Region, sd side3) error {
	switch reg {
	case Region1:
		g := gibbs1(p, t)
		g.props(st, p, t)
	case Region2:
		g := gibbs2(p, t)
		g.props(st, p, t)
	case Region5:
		g := gibbs5(p, t)
		g.props(st, p, t)
	case Region3:
		rho, ok := rho3(p, t, sd)
		if !ok {
			*st = State{}
			return &ConvergenceError{Func: fn, What: "region 3 density from (p,T)", P: p, Arg: t}
		}
		f := helm3(rho, t)
		f.props(st, rho, t)
		st.P = p
	}
	st.Region = reg
	st.classify(sd == sideLiquid)
	return nil
}

// HPT returns the specific enthalpy (J/kg) at pressure p (Pa) and
// temperature t (K). It is the fast path of PT(p, t).H and does not
// allocate.
func HPT(p, t float64) (float64, error) {
	if err := checkPT("HPT", p, t); err != nil {
		return 0, err
	}
	reg, sd, err := regionPT("HPT", p, t)
	if err != nil {
		return 0, err
	}
	switch reg {
	case Region1:
		return h1(p, t), nil
	case Region2:
		return h2(p, t), nil
	case Region5:
		g := gibbs5(p, t)
		return rGas * t * g.gt, nil
	}
	rho, ok := rho3(p, t, sd)
	if !ok {
		return 0, &ConvergenceError{Func: "HPT", What: "region 3 density from (p,T)", P: p, Arg: t}
	}
	f := helm3(rho, t)
	return rGas * t * (f.ft + f.fd), nil
}

// satStates returns the saturated liquid and vapour states at pressure p
// and saturation temperature t (from region 1 and 2 below 623.15 K and
// from region 3 above).
func satStates(fn string, p, t float64) (l, v State, err error) {
	if t <= t13 {
		g := gibbs1(p, t)
		g.props(&l, p, t)
		l.Region = Region1
		g = gibbs2(p, t)
		g.props(&v, p, t)
		v.Region = Region2
	} else {
		rl, ok1 := rho3(p, t, sideLiquid)
		rv, ok2 := rho3(p, t, sideVapour)
		if !ok1 || !ok2 {
			return l, v, &ConvergenceError{Func: fn, What: "region 3 saturated densities", P: p, Arg: t}
		}
		f := helm3(rl, t)
		f.props(&l, rl, t)
		f = helm3(rv, t)
		f.props(&v, rv, t)
		l.P, v.P = p, p
		l.Region, v.Region = Region3, Region3
	}
	l.Phase, l.X = Liquid, 0
	v.Phase, v.X = Vapour, 1
	return l, v, nil
}

// mix returns the wet state of vapour fraction x between saturated liquid
// l and vapour v. Cp, Cv and W are not defined and are left 0.
func mix(l, v *State, x float64) State {
	st := State{
		P: l.P, T: l.T,
		H: l.H + x*(v.H-l.H),
		S: l.S + x*(v.S-l.S),
		U: l.U + x*(v.U-l.U),
		V: l.V + x*(v.V-l.V),
		X: x, Region: RegionTwoPhase, Phase: TwoPhase,
	}
	st.Rho = 1 / st.V
	return st
}

// SatLiquid returns the saturated liquid at pressure p (Pa), 611.213 Pa <=
// p <= 22.064 MPa. It is a single-phase state with X = 0, Phase Liquid,
// Cp, Cv and W of the liquid side, and Region 1 (or 3 above 623.15 K,
// where the density comes from Eq. 28 at p = p_sat).
func SatLiquid(p float64) (State, error) {
	if err := checkSatP("SatLiquid", p); err != nil {
		return State{}, err
	}
	l, _, err := satStates("SatLiquid", p, tsat4(p))
	return l, err
}

// SatVapour returns the saturated vapour at pressure p (Pa), 611.213 Pa <=
// p <= 22.064 MPa. It is a single-phase state with X = 1, Phase Vapour,
// Cp, Cv and W of the vapour side, and Region 2 (or 3 above 623.15 K).
func SatVapour(p float64) (State, error) {
	if err := checkSatP("SatVapour", p); err != nil {
		return State{}, err
	}
	_, v, err := satStates("SatVapour", p, tsat4(p))
	return v, err
}

// PX returns the saturated state at pressure p (Pa) with vapour mass
// fraction x, 611.213 Pa <= p <= 22.064 MPa, 0 <= x <= 1. For x = 0 and
// x = 1 it returns SatLiquid(p) and SatVapour(p), single-phase states with
// Cp, Cv and W defined; for 0 < x < 1 a two-phase state.
func PX(p, x float64) (State, error) {
	if err := checkSatP("PX", p); err != nil {
		return State{}, err
	}
	if err := checkX("PX", x); err != nil {
		return State{}, err
	}
	return wet("PX", p, tsat4(p), x)
}

// TX returns the saturated state at temperature t (K) with vapour mass
// fraction x, 273.15 K <= t <= 647.096 K, 0 <= x <= 1, as PX does.
func TX(t, x float64) (State, error) {
	if err := checkSatT("TX", t); err != nil {
		return State{}, err
	}
	if err := checkX("TX", x); err != nil {
		return State{}, err
	}
	return wet("TX", psat4(t), t, x)
}

func wet(fn string, p, t, x float64) (State, error) {
	l, v, err := satStates(fn, p, t)
	if err != nil {
		return State{}, err
	}
	switch x {
	case 0:
		return l, nil
	case 1:
		return v, nil
	}
	return mix(&l, &v, x), nil
}

// HSatLiquid returns the specific enthalpy (J/kg) of the saturated liquid
// at pressure p (Pa): SatLiquid(p).H without the other properties, the
// fast path the plant's units call in their residuals. It does not
// allocate.
func HSatLiquid(p float64) (float64, error) {
	if err := checkSatP("HSatLiquid", p); err != nil {
		return 0, err
	}
	t := tsat4(p)
	if t <= t13 {
		return h1(p, t), nil
	}
	l, err := SatLiquid(p)
	return l.H, err
}

// HSatVapour returns the specific enthalpy (J/kg) of the saturated vapour
// at pressure p (Pa): SatVapour(p).H without the other properties. It does
// not allocate.
func HSatVapour(p float64) (float64, error) {
	if err := checkSatP("HSatVapour", p); err != nil {
		return 0, err
	}
	t := tsat4(p)
	if t <= t13 {
		return h2(p, t), nil
	}
	v, err := SatVapour(p)
	return v.H, err
}
