package water

import "math"

// Constants of IAPWS R7-97(2012).
const (
	rGas    = 461.526  // specific gas constant of water, J/(kg K), Eq. 1
	tCrit   = 647.096  // critical temperature, K, Eq. 2
	pCrit   = 22.064e6 // critical pressure, Pa, Eq. 3
	rhoCrit = 322.0    // critical density, kg/m3, Eq. 4
	tMin    = 273.15   // lowest temperature of IF97, K
	tMid    = 1073.15  // upper temperature of regions 1-3, lower of region 5, K
	tMax    = 2273.15  // highest temperature of region 5, K
	pMax    = 100e6    // highest pressure of regions 1-3, Pa
	pTiny   = 1e-30    // smallest pressure handled, Pa (IF97: p > 0)
	pMax5   = 50e6     // highest pressure of region 5, Pa
	t13     = 623.15   // boundary temperature between regions 1 and 3, K
	t23max  = 863.15   // B23 temperature at 100 MPa, K
	p2abLim = 4e6      // boundary pressure between subregions 2a and 2b, Pa
	s2bcLim = 5.85e3   // boundary entropy between subregions 2b and 2c, J/(kg K)
)

// fillPow sets d[k] = x^k for k = 0 .. len(d)-1 by multiplication only.
// Each entry is the product of two earlier ones (k/2 and k-k/2), which keeps
// the dependency chains short (depth log2 k).
func fillPow(d []float64, x float64) {
	if len(d) == 0 {
		return
	}
	d[0] = 1
	if len(d) == 1 {
		return
	}
	d[1] = x
	for k := 2; k < len(d); k++ {
		d[k] = d[k>>1] * d[k-k>>1]
	}
}

// fillPowSigned sets d[neg+k] = x^k for k = -neg .. len(d)-1-neg.
func fillPowSigned(d []float64, neg int, x float64) {
	fillPow(d[neg:], x)
	if neg == 0 {
		return
	}
	xi := 1 / x
	d[neg-1] = xi
	for k := 2; k <= neg; k++ {
		d[neg-k] = d[neg-k>>1] * d[neg-(k-k>>1)]
	}
}

// gsum holds a dimensionless Gibbs free energy γ(π,τ) and its derivatives,
// each multiplied by the matching powers of π and τ so that no division is
// needed afterwards:
//
//	g = γ, gp = π·γπ, gpp = π²·γππ, gt = τ·γτ, gtt = τ²·γττ, gpt = π·τ·γπτ.
type gsum struct {
	g, gp, gpp, gt, gtt, gpt float64
}

// props fills the thermodynamic properties of a state from a Gibbs sum.
func (g *gsum) props(st *State, p, t float64) {
	rt := rGas * t
	st.P, st.T = p, t
	st.V = rt * g.gp / p
	st.Rho = p / (rt * g.gp)
	st.H = rt * g.gt
	st.U = rt * (g.gt - g.gp)
	st.S = rGas * (g.gt - g.g)
	st.Cp = -rGas * g.gtt
	b := g.gp - g.gpt
	st.Cv = rGas * (-g.gtt + b*b/g.gpp)
	w2 := rt * g.gp * g.gp * g.gtt / (b*b - g.gpp*g.gtt)
	st.W = math.Sqrt(w2)
}

// ---------------------------------------------------------------- region 1

// region 1 reduced variables, Eq. 7: π = p/16.53 MPa, τ = 1386 K/T.
const (
	p1Star = 16.53e6
	t1Star = 1386.0
)

// gibbs1 evaluates γ of region 1 (Eq. 7) and its derivatives.
func gibbs1(p, t float64) gsum {
	pi := p / p1Star
	tau := t1Star / t
	a := 7.1 - pi
	b := tau - 1.222
	s0, sI, sII, sJ, sJJ, sIJ := poly1All(a, b)
	pa := pi / a
	tb := tau / b
	return gsum{
		g:   s0,
		gp:  -pa * sI,
		gpp: pa * pa * sII,
		gt:  tb * sJ,
		gtt: tb * tb * sJJ,
		gpt: -pa * tb * sIJ,
	}
}

// h1 returns the specific enthalpy of region 1 in J/kg (Eq. 7, Table 3).
func h1(p, t float64) float64 {
	tau := t1Star / t
	b := tau - 1.222
	return rGas * t * tau / b * poly1J(7.1-p/p1Star, b)
}

// hcp1 returns h and cp of region 1, for Newton steps in T at fixed p.
func hcp1(p, t float64) (h, cp float64) {
	tau := t1Star / t
	b := tau - 1.222
	sJ, sJJ := poly1JJJ(7.1-p/p1Star, b)
	tb := tau / b
	return rGas * t * tb * sJ, -rGas * tb * tb * sJJ
}

// s1 returns the specific entropy of region 1 in J/(kg K).
func s1(p, t float64) float64 {
	tau := t1Star / t
	b := tau - 1.222
	s0, sJ := poly1S0J(7.1-p/p1Star, b)
	return rGas * (tau/b*sJ - s0)
}

// scp1 returns s and cp of region 1.
func scp1(p, t float64) (s, cp float64) {
	tau := t1Star / t
	b := tau - 1.222
	s0, sJ, sJJ := poly1S(7.1-p/p1Star, b)
	tb := tau / b
	return rGas * (tb*sJ - s0), -rGas * tb * tb * sJJ
}

// ---------------------------------------------------------------- region 2

// region 2 reduced variables, Eq. 15: π = p/1 MPa, τ = 540 K/T.
const (
	p2Star = 1e6
	t2Star = 540.0
)

// ideal2 returns the ideal-gas part γ° of region 2 (Eq. 16) at τ = 540 K/t
// as τ·γ°τ and τ²·γ°ττ, and γ° without its ln π when full is set.
func ideal2(tau, t float64, full bool) (g0, g0t, g0tt float64) {
	t2 := tau * tau
	t3 := t2 * tau
	tm1 := t * (1 / t2Star) // 1/τ without a division
	tm2 := tm1 * tm1
	tm3 := tm2 * tm1
	tm4 := tm2 * tm2
	tm5 := tm4 * tm1
	n := &r2Ideal
	// J = 0, 1, -5, -4, -3, -2, -1, 2, 3
	if full {
		g0 = n[0].n + n[1].n*tau + n[2].n*tm5 + n[3].n*tm4 + n[4].n*tm3 + n[5].n*tm2 + n[6].n*tm1 + n[7].n*t2 + n[8].n*t3
	}
	g0t = n[1].n*tau - 5*n[2].n*tm5 - 4*n[3].n*tm4 - 3*n[4].n*tm3 - 2*n[5].n*tm2 - n[6].n*tm1 + 2*n[7].n*t2 + 3*n[8].n*t3
	g0tt = 30*n[2].n*tm5 + 20*n[3].n*tm4 + 12*n[4].n*tm3 + 6*n[5].n*tm2 + 2*n[6].n*tm1 + 2*n[7].n*t2 + 6*n[8].n*t3
	return
}

// gibbs2 evaluates γ = γ° + γʳ of region 2 (Eqs. 15-17).
func gibbs2(p, t float64) gsum {
	pi := p / p2Star
	tau := t2Star / t
	g0, g0t, g0tt := ideal2(tau, t, true)
	b := tau - 0.5
	s0, sI, sII, sJ, sJJ, sIJ := poly2All(pi, b)
	tb := tau / b
	return gsum{
		g:   math.Log(pi) + g0 + s0,
		gp:  1 + sI,
		gpp: -1 + sII,
		gt:  g0t + tb*sJ,
		gtt: g0tt + tb*tb*sJJ,
		gpt: tb * sIJ,
	}
}

// hcp2 returns h and cp of region 2.
func hcp2(p, t float64) (h, cp float64) {
	tau := t2Star / t
	_, g0t, g0tt := ideal2(tau, t, false)
	b := tau - 0.5
	sJ, sJJ := poly2JJJ(p/p2Star, b)
	tb := tau / b
	return rGas * t * (g0t + tb*sJ), -rGas * (g0tt + tb*tb*sJJ)
}

// h2 returns the specific enthalpy of region 2 in J/kg.
func h2(p, t float64) float64 {
	tau := t2Star / t
	_, g0t, _ := ideal2(tau, t, false)
	b := tau - 0.5
	return rGas * t * (g0t + tau/b*poly2J(p/p2Star, b))
}

// s2 returns the specific entropy of region 2 in J/(kg K).
func s2(p, t float64) float64 {
	pi := p / p2Star
	tau := t2Star / t
	g0, g0t, _ := ideal2(tau, t, true)
	b := tau - 0.5
	s0, sJ := poly2S0J(pi, b)
	return rGas * (g0t + tau/b*sJ - math.Log(pi) - g0 - s0)
}

// scp2 returns s and cp of region 2.
func scp2(p, t float64) (s, cp float64) {
	pi := p / p2Star
	tau := t2Star / t
	g0, g0t, g0tt := ideal2(tau, t, true)
	b := tau - 0.5
	s0, sJ, sJJ := poly2S(pi, b)
	tb := tau / b
	gt := g0t + tb*sJ
	return rGas * (gt - math.Log(pi) - g0 - s0), -rGas * (g0tt + tb*tb*sJJ)
}

// ---------------------------------------------------------------- region 5

// gibbs5 evaluates γ = γ° + γʳ of region 5 (Eqs. 32-34), with π = p/1 MPa
// and τ = 1000 K/T.
func gibbs5(p, t float64) gsum {
	pi := p / 1e6
	tau := 1000 / t
	var tp [6]float64 // τ^-3 .. τ^2
	fillPowSigned(tp[:], 3, tau)
	var g0, g0t, g0tt float64
	for k := range r5Ideal {
		c := &r5Ideal[k]
		fj := float64(c.j)
		x := c.n * tp[c.j+3]
		g0 += x
		g0t += fj * x
		g0tt += fj * (fj - 1) * x
	}
	var pp [4]float64
	fillPow(pp[:], pi)
	var bp [10]float64
	fillPow(bp[:], tau)
	var s0, sI, sII, sJ, sJJ, sIJ float64
	for k := range r5Res {
		tm := &r5Res[k]
		x := tm.n * pp[tm.i] * bp[tm.j]
		fi, fj := float64(tm.i), float64(tm.j)
		s0 += x
		sI += fi * x
		sII += fi * (fi - 1) * x
		sJ += fj * x
		sJJ += fj * (fj - 1) * x
		sIJ += fi * fj * x
	}
	return gsum{
		g:   math.Log(pi) + g0 + s0,
		gp:  1 + sI,
		gpp: -1 + sII,
		gt:  g0t + sJ,
		gtt: g0tt + sJJ,
		gpt: sIJ,
	}
}
