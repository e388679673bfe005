package water

import "math"

// kind selects the second input of a backward solve: enthalpy or entropy.
type kind int

const (
	byH kind = iota
	byS
)

func (k kind) quantity() string {
	if k == byH {
		return "specific enthalpy"
	}
	return "specific entropy"
}

// solution is the result of a backward solve.
type solution struct {
	t   float64 // K
	x   float64 // vapour fraction, two-phase only
	rho float64 // density, region 3 only
	reg Region
	sd  side3
}

// propT returns h (or s) and its derivative with respect to T at constant
// p in the given region: (h, cp) or (s, cp/T). For region 3 it also
// returns the density.
func propT(k kind, reg Region, p, t float64) (f, df, rho float64, ok bool) {
	switch reg {
	case Region1:
		if k == byH {
			f, df = hcp1(p, t)
		} else {
			f, df = scp1(p, t)
			df /= t
		}
	case Region2:
		if k == byH {
			f, df = hcp2(p, t)
		} else {
			f, df = scp2(p, t)
			df /= t
		}
	case Region5:
		g := gibbs5(p, t)
		df = -rGas * g.gtt
		if k == byH {
			f = rGas * t * g.gt
		} else {
			f = rGas * (g.gt - g.g)
			df /= t
		}
	case Region3:
		var ok bool
		rho, ok = rho3(p, t, sideFor(p, t))
		if !ok {
			return 0, 0, 0, false
		}
		fs := helm3(rho, t)
		var st State
		fs.props(&st, rho, t)
		if k == byH {
			f, df = st.H, st.Cp
		} else {
			f, df = st.S, st.Cp/t
		}
	}
	return f, df, rho, !math.IsNaN(f) && !math.IsNaN(df)
}

// quickStepT is the largest step after which a refinement of a backward
// equation may stop. See refine.
const quickStepT = 1e-4

// startMargin is how far (K) a backward equation's start value may lie
// beyond its region's boundary before the region is ruled out without
// refinement; the backward equations are within 25 mK of the basic ones.
const startMargin = 1.0

// tMinRound is 273.15 K less a rounding allowance: a state given at
// exactly 273.15 K may come back from (p,h) a few ulp below it.
const tMinRound = tMin * (1 - 1e-13)

// tMidRound is 1073.15 K plus a rounding allowance.
const tMidRound = tMid * (1 + 1e-13)

// refine runs Newton steps on the forward equation of region 1 or 2 from
// the start value t0 of a backward equation, until a step is below
// quickStepT. The derivative (cp, or cp/T for s) is taken at t0 and kept
// (the simplified Newton method). Each step shrinks the error by the
// relative change of the derivative between t0 and the root, about
// c·|dt0|, where dt0 is the first step and c = |d ln cp/dT| is below
// 0.1 1/K in regions 1 and 2 (largest next to the saturation line at
// 16.5 MPa, 0.096 1/K). The iteration stops after a step dt with
// |dt| <= 1e-4 K and |dt|·|dt0| <= 2e-9·T, which leaves an error below
// about 2e-10·T, so the result reproduces h (or s) to 1e-9 relative. From the
// backward equations (|dt0| <= 25 mK) this takes two evaluations, the
// second of h (or s) alone. It reports false if the iteration does not
// settle within a few steps; the caller then falls back to the bracketed
// solve.
//
// The pressure and the second input have been checked by the caller, and
// the start is checked here once; the steps call the forward kernels
// (h1, s1, h2, s2) without any range or region check. A step that runs
// away, from a start that belongs to another region, does not settle
// (a NaN never passes the stopping test), and a T it settles on outside
// the region is refused by the caller's region check; inside the region the
// root is the only one, h and s rising with T.
func refine(k kind, reg Region, p, target, t0 float64) (float64, bool) {
	if !(t0 > 200 && t0 < 2500) {
		return t0, false
	}
	var f, df float64
	switch {
	case reg == Region1 && k == byH:
		f, df = hcp1(p, t0)
	case reg == Region1:
		f, df = scp1(p, t0)
		df /= t0
	case k == byH:
		f, df = hcp2(p, t0)
	default:
		f, df = scp2(p, t0)
		df /= t0
	}
	if !(df > 0) {
		return t0, false
	}
	dt := (target - f) / df
	t := t0 + dt
	dt0 := math.Max(math.Abs(dt), 1e-3)
	for range 8 {
		if math.Abs(dt) <= quickStepT && math.Abs(dt)*dt0 <= 2e-9*t {
			return t, true
		}
		switch {
		case reg == Region1 && k == byH:
			f = h1(p, t)
		case reg == Region1:
			f = s1(p, t)
		case k == byH:
			f = h2(p, t)
		default:
			f = s2(p, t)
		}
		dt = (target - f) / df
		t += dt
	}
	return t, false
}

// bracket solves f(p,T) = target for T in [lo, hi] of one region, where f
// (h or s) rises with T and f(lo) <= target <= f(hi), by Newton steps
// guarded by bisection.
func bracket(k kind, reg Region, p, target, lo, hi, t0 float64) (t, rho float64, ok bool) {
	t = t0
	if !(t > lo && t < hi) {
		t = 0.5 * (lo + hi)
	}
	scale := math.Max(math.Abs(target), 1e3)
	if k == byS {
		scale = math.Max(math.Abs(target), 1)
	}
	for range 300 {
		f, df, r, ok := propT(k, reg, p, t)
		if !ok {
			return t, r, false
		}
		rho = r
		res := f - target
		if math.Abs(res) <= 1e-13*scale {
			return t, rho, true
		}
		if res < 0 {
			lo = t
		} else {
			hi = t
		}
		next := t - res/df
		if df > 0 && math.Abs(next-t) <= 1e-12*t {
			_, _, rho, ok = propT(k, reg, p, next)
			return next, rho, ok
		}
		if !(df > 0) || next <= lo || next >= hi {
			next = 0.5 * (lo + hi)
		}
		if math.Abs(next-t) <= 1e-13*t {
			_, _, rho, ok = propT(k, reg, p, next)
			return next, rho, ok
		}
		t = next
	}
	return t, rho, false
}

// solve finds the region and the temperature (and for a wet state the
// vapour fraction) of (p,h) or (p,s), for PH, PS, TPH, SPH and HPS. When
// sat is not nil and the state is wet, the full saturated states are built
// and written to it.
func solve(fn string, k kind, p, f float64, sat *[2]State) (solution, error) {
	var sol solution
	if err := checkP(fn, p); err != nil {
		return sol, err
	}
	if err := finite(fn, k.quantity(), f); err != nil {
		return sol, err
	}
	// Upper and lower temperature of regions 1 and 2 at this pressure.
	var tb1, tb2 float64
	switch {
	case p < pSatMinT:
		tb1, tb2 = tMin, tMin // no liquid at or above 273.15 K
	case p <= pSat13:
		tb1 = tsat4(p)
		tb2 = tb1
	default:
		tb1, tb2 = t13, tB23(p)
	}

	// Fast path: backward equation, Newton refinement, and a check that
	// the result lies in the region the backward equation belongs to.
	lowGuess := (k == byH && f < 2.0e6) || (k == byS && f < 4.5e3)
	if lowGuess && p >= pSatMinT {
		var t0 float64
		if k == byH {
			t0 = t1ph(p, f)
		} else {
			t0 = t1ps(p, f)
		}
		if t0 > tb1+startMargin {
			// not region 1
		} else if t, ok := refine(k, Region1, p, f, t0); ok && t <= tb1 && t >= tMinRound {
			sol.t, sol.reg = t, Region1
			return sol, nil
		}
	} else if !lowGuess {
		var t0 float64
		if k == byH {
			t0 = t2ph(p, f)
		} else {
			t0 = t2ps(p, f)
		}
		if t0 < tb2-startMargin {
			// not region 2
		} else if t, ok := refine(k, Region2, p, f, t0); ok && t >= tb2 && t <= tMidRound && t >= tMinRound {
			sol.t, sol.reg = t, Region2
			return sol, nil
		}
	}
	return solveSlow(fn, k, p, f, tb1, tb2, sat)
}

// value returns h or s of a state.
func value(k kind, st *State) float64 {
	if k == byH {
		return st.H
	}
	return st.S
}

// at returns h or s at (p,T) in region 1, 2 or 5.
func at(k kind, reg Region, p, t float64) float64 {
	switch {
	case reg == Region1 && k == byH:
		return h1(p, t)
	case reg == Region1:
		return s1(p, t)
	case reg == Region2 && k == byH:
		return h2(p, t)
	case reg == Region2:
		return s2(p, t)
	}
	f, _, _, _ := propT(k, reg, p, t)
	return f
}

// solveSlow decides the region from boundary values computed exactly.
// The range of validity is checked only on the side where the value lies
// (below 273.15 K from region 1, or 2 below the triple-point pressure;
// above 1073.15 K from region 2), so a wet state costs no range checks.
func solveSlow(fn string, k kind, p, f, tb1, tb2 float64, sat *[2]State) (solution, error) {
	var sol solution
	q := k.quantity()
	if p < pSatMinT { // vapour only
		if err := checkBelow(fn, k, Region2, p, f); err != nil {
			return sol, err
		}
		return solveUpper(fn, k, p, f, tMin)
	}
	if p <= pSat13 {
		// The saturated states come from regions 1 and 2 here; the full
		// states are built only when the caller wants them.
		var l, v State
		var fl, fv float64
		if sat != nil {
			l, v, _ = satStates(fn, p, tb1) // no iteration, no error below 623.15 K
			fl, fv = value(k, &l), value(k, &v)
		} else {
			fl, fv = at(k, Region1, p, tb1), at(k, Region2, p, tb1)
		}
		switch {
		case f <= fl:
			return solveRegion1(fn, k, p, f, tb1)
		case f >= fv:
			return solveUpper(fn, k, p, f, tb2)
		}
		sol.t, sol.reg, sol.x = tb1, RegionTwoPhase, (f-fl)/(fv-fl)
		if sat != nil {
			sat[0], sat[1] = l, v
		}
		return sol, nil
	}
	// p above p_sat(623.15 K): regions 1, 3 and 2 in turn.
	if f <= at(k, Region1, p, t13) {
		return solveRegion1(fn, k, p, f, t13)
	}
	if f >= at(k, Region2, p, tb2) {
		return solveUpper(fn, k, p, f, tb2)
	}
	lo, hi := t13, tb2
	if p < pCrit {
		ts := tsat4(p)
		l, v, err := satStates(fn, p, ts)
		if err != nil {
			return sol, err
		}
		fl, fv := value(k, &l), value(k, &v)
		switch {
		case f < fl:
			hi = ts
		case f > fv:
			lo = ts
		default:
			sol.t, sol.reg = ts, RegionTwoPhase
			// Within about 1e-8 of the critical pressure the saturated
			// states of Eq. 28 merge; f then equals both.
			if fv > fl {
				sol.x = (f - fl) / (fv - fl)
			}
			if sat != nil {
				sat[0], sat[1] = l, v
			}
			return sol, nil
		}
	}
	t, rho, ok := bracket(k, Region3, p, f, lo, hi, 0)
	if !ok {
		return sol, &ConvergenceError{Func: fn, What: "region 3 temperature from " + q, P: p, Arg: f}
	}
	sol.t, sol.rho, sol.reg, sol.sd = t, rho, Region3, sideFor(p, t)
	return sol, nil
}

// checkBelow returns a RangeError if f lies below its value at 273.15 K.
func checkBelow(fn string, k kind, reg Region, p, f float64) error {
	if fmin := at(k, reg, p, tMin); f < fmin-1e-11*math.Max(math.Abs(fmin), 1e3) {
		q := k.quantity()
		return &RangeError{Func: fn, Quantity: q, Value: f, Bound: "below", LimitSI: fmin,
			Limit: "the IF97 limit of " + fmtQuantity(q, fmin) + " at " + fmtPressure(p) + " (its value at 273.15 K)"}
	}
	return nil
}

// solveRegion1 solves region 1 between 273.15 K and hi.
func solveRegion1(fn string, k kind, p, f, hi float64) (solution, error) {
	if err := checkBelow(fn, k, Region1, p, f); err != nil {
		return solution{}, err
	}
	t, _, ok := bracket(k, Region1, p, f, tMin, hi, 0)
	if !ok {
		return solution{}, &ConvergenceError{Func: fn, What: "region 1 temperature from " + k.quantity(), P: p, Arg: f}
	}
	return solution{t: t, reg: Region1}, nil
}

// solveUpper solves region 2 from lo to 1073.15 K, or region 5 above.
func solveUpper(fn string, k kind, p, f, lo float64) (solution, error) {
	var sol solution
	q := k.quantity()
	fmid := at(k, Region2, p, tMid)
	if f <= fmid+1e-11*math.Abs(fmid) {
		t, _, ok := bracket(k, Region2, p, f, lo, tMid, 0)
		if !ok {
			return sol, &ConvergenceError{Func: fn, What: "region 2 temperature from " + q, P: p, Arg: f}
		}
		sol.t, sol.reg = t, Region2
		return sol, nil
	}
	// Above 1073.15 K: region 5 up to 50 MPa, else out of range.
	if p > pMax5 {
		return sol, &RangeError{Func: fn, Quantity: q, Value: f, Bound: "above", LimitSI: fmid,
			Limit: "the IF97 limit of " + fmtQuantity(q, fmid) + " at " + fmtPressure(p) +
				" (its value at 1073.15 K; above 50 MPa IF97 ends at 1073.15 K)"}
	}
	fmax := at(k, Region5, p, tMax)
	if f > fmax+1e-11*math.Abs(fmax) {
		return sol, &RangeError{Func: fn, Quantity: q, Value: f, Bound: "above", LimitSI: fmax,
			Limit: "the IF97 limit of " + fmtQuantity(q, fmax) + " at " + fmtPressure(p) + " (its value at 2273.15 K)"}
	}
	if f5 := at(k, Region5, p, tMid); f >= f5 {
		t, _, ok := bracket(k, Region5, p, f, tMid, tMax, tMid+(tMax-tMid)*(f-f5)/(fmax-f5))
		if !ok {
			return sol, &ConvergenceError{Func: fn, What: "region 5 temperature from " + q, P: p, Arg: f}
		}
		sol.t, sol.reg = t, Region5
		return sol, nil
	}
	// Between the region 2 and region 5 values at 1073.15 K (the two
	// equations differ there within IF97's boundary consistency): region
	// 2, extended by at most a few hundredths of a kelvin.
	t, ok := refine(k, Region2, p, f, tMid)
	if !ok {
		return sol, &ConvergenceError{Func: fn, What: "region 2 temperature from " + q, P: p, Arg: f}
	}
	sol.t, sol.reg = t, Region2
	return sol, nil
}

// state builds the full state of a solution.
func (sol *solution) state(fn string, p float64, sat *[2]State) (State, error) {
	switch sol.reg {
	case RegionTwoPhase:
		if sat[0].T == 0 {
			l, v, err := satStates(fn, p, sol.t)
			if err != nil {
				return State{}, err
			}
			sat[0], sat[1] = l, v
		}
		return mix(&sat[0], &sat[1], sol.x), nil
	case Region3:
		var st State
		f := helm3(sol.rho, sol.t)
		f.props(&st, sol.rho, sol.t)
		st.P = p
		st.Region = Region3
		st.classify(sol.sd == sideLiquid)
		return st, nil
	}
	var st State
	err := statePT(&st, fn, p, sol.t, sol.reg, 0)
	return st, err
}

// PH returns the state at pressure p (Pa) and specific enthalpy h (J/kg).
// Regions 1 and 2 start from the IF97 backward equations T(p,h) and refine
// T by Newton steps on the basic equation; regions 3 and 5 iterate on the
// basic equation; wet states get their vapour fraction from h. An h below
// its value at 273.15 K, or above its value at 2273.15 K (1073.15 K above
// 50 MPa), is a *RangeError.
func PH(p, h float64) (State, error) {
	var sat [2]State
	sol, err := solve("PH", byH, p, h, &sat)
	if err != nil {
		return State{}, err
	}
	return sol.state("PH", p, &sat)
}

// PS returns the state at pressure p (Pa) and specific entropy s
// (J/(kg K)), as PH does for enthalpy.
func PS(p, s float64) (State, error) {
	var sat [2]State
	sol, err := solve("PS", byS, p, s, &sat)
	if err != nil {
		return State{}, err
	}
	return sol.state("PS", p, &sat)
}

// TPH returns the temperature (K) at pressure p (Pa) and specific enthalpy
// h (J/kg), the fast path of PH(p, h).T (T_sat(p) for a wet state). It
// does not allocate.
func TPH(p, h float64) (float64, error) {
	sol, err := solve("TPH", byH, p, h, nil)
	return sol.t, err
}

// SPH returns the specific entropy (J/(kg K)) at pressure p (Pa) and
// specific enthalpy h (J/kg), the fast path of PH(p, h).S. It does not
// allocate.
func SPH(p, h float64) (float64, error) {
	sol, err := solve("SPH", byH, p, h, nil)
	if err != nil {
		return 0, err
	}
	return sol.other("SPH", byS, p)
}

// HPS returns the specific enthalpy (J/kg) at pressure p (Pa) and specific
// entropy s (J/(kg K)), the fast path of PS(p, s).H. It does not allocate.
func HPS(p, s float64) (float64, error) {
	sol, err := solve("HPS", byS, p, s, nil)
	if err != nil {
		return 0, err
	}
	return sol.other("HPS", byH, p)
}

// other returns h or s of a solved state.
func (sol *solution) other(fn string, k kind, p float64) (float64, error) {
	switch sol.reg {
	case RegionTwoPhase:
		var fl, fv float64
		if sol.t <= t13 {
			fl, fv = at(k, Region1, p, sol.t), at(k, Region2, p, sol.t)
		} else {
			l, v, err := satStates(fn, p, sol.t)
			if err != nil {
				return 0, err
			}
			fl, fv = value(k, &l), value(k, &v)
		}
		return fl + sol.x*(fv-fl), nil
	case Region3:
		f := helm3(sol.rho, sol.t)
		if k == byH {
			return rGas * sol.t * (f.ft + f.fd), nil
		}
		return rGas * (f.ft - f.f), nil
	}
	return at(k, sol.reg, p, sol.t), nil
}
