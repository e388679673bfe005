package water

import "math"

// fsum holds the dimensionless Helmholtz free energy φ(δ,τ) of region 3
// (Eq. 28) and its derivatives, each multiplied by the matching powers of δ
// and τ: f = φ, fd = δ·φδ, fdd = δ²·φδδ, ft = τ·φτ, ftt = τ²·φττ,
// fdt = δ·τ·φδτ.
type fsum struct {
	f, fd, fdd, ft, ftt, fdt float64
}

// helm3 evaluates φ of region 3 at density rho (kg/m3) and temperature t (K).
func helm3(rho, t float64) fsum {
	delta := rho / rhoCrit
	s0, sI, sII, sJ, sJJ, sIJ := poly3All(delta, tCrit/t)
	return fsum{
		f:   r3Log*math.Log(delta) + s0,
		fd:  r3Log + sI,
		fdd: -r3Log + sII,
		ft:  sJ,
		ftt: sJJ,
		fdt: sIJ,
	}
}

// p3 returns the pressure (Pa) and its derivative dp/dρ at constant T of
// region 3.
func p3(rho, t float64) (p, dpdrho float64) {
	sI, sII := poly3I(rho/rhoCrit, tCrit/t)
	fd := r3Log + sI
	fdd := -r3Log + sII
	rt := rGas * t
	return rho * rt * fd, rt * (2*fd + fdd)
}

// props fills a state from the Helmholtz sum of region 3 (Table 32).
func (f *fsum) props(st *State, rho, t float64) {
	rt := rGas * t
	st.Rho, st.T = rho, t
	st.V = 1 / rho
	st.P = rho * rt * f.fd
	st.U = rt * f.ft
	st.H = rt * (f.ft + f.fd)
	st.S = rGas * (f.ft - f.f)
	st.Cv = -rGas * f.ftt
	b := f.fd - f.fdt
	c := 2*f.fd + f.fdd
	st.Cp = rGas * (-f.ftt + b*b/c)
	st.W = math.Sqrt(rt * (c - b*b/f.ftt))
}

// side3 selects the density root of region 3 at given (p,T).
type side3 int

const (
	sideSuper  side3 = iota // T >= T_c: the single root
	sideLiquid              // the largest root (liquid, or the only root above p_c)
	sideVapour              // the smallest root (vapour)
)

// sideFor returns the root side of region 3 for a (p,T) pair off the
// saturation line.
func sideFor(p, t float64) side3 {
	switch {
	case t >= tCrit:
		return sideSuper
	case p >= psat4(t):
		return sideLiquid
	}
	return sideVapour
}

// rho3 solves p(ρ,T) = p of region 3 for the density, by Newton's method
// on the basic equation (Eq. 28).
//
// Below the critical temperature an isotherm of Eq. 28 has three roots
// near the saturation pressure. The liquid root is reached by starting
// above it: the isotherm is convex (p” > 0) on the liquid branch, so the
// Newton iterates fall monotonically onto the largest root. The vapour root
// is reached from below (ideal-gas density; the isotherm is concave there).
// Above the critical temperature the root is unique and Newton is guarded
// by bisection. Any overshoot also falls back to bisection in the bracket.
func rho3(p, t float64, sd side3) (float64, bool) {
	lo, hi := 0.0, math.Inf(1) // p(lo) < p < p(hi)
	var rho float64
	switch sd {
	case sideVapour:
		rho = p / (rGas * t)
		// An upper bound for the guard, used only if Newton misbehaves
		// (near the critical point, where the isotherm is flat).
		if pr, _ := p3(1.25*rhoCrit, t); pr > p {
			hi = 1.25 * rhoCrit
		}
	case sideLiquid, sideSuper:
		// The region 1 density at (p, 623.15 K) lies above every region 3
		// density at pressure p; 2 % more makes sure of it.
		g := gibbs1(p, t13)
		rho = 1.02 * p / (rGas * t13 * g.gp)
		if pr, _ := p3(0.75*rhoCrit, t); sd == sideLiquid && pr < p {
			lo = 0.75 * rhoCrit
		}
	}
	for range 200 {
		pr, dp := p3(rho, t)
		r := pr - p
		if r == 0 {
			return rho, true
		}
		if r < 0 {
			lo = rho
		} else {
			hi = rho
		}
		next := rho - r/dp
		if dp > 0 && math.Abs(next-rho) <= 1e-13*rho {
			rho = next
			break
		}
		if !(dp > 0) || next <= lo || next >= hi {
			if math.IsInf(hi, 1) {
				if rho > 4*rhoCrit {
					return rho, false
				}
				next = 2 * rho
			} else {
				next = 0.5 * (lo + hi)
			}
		}
		if math.Abs(next-rho) <= 1e-13*rho || math.Abs(r) <= 1e-14*p {
			rho = next
			break
		}
		rho = next
	}
	pr, _ := p3(rho, t)
	if math.IsNaN(rho) || math.Abs(pr-p) > 1e-9*p {
		return rho, false
	}
	switch sd {
	case sideLiquid:
		return rho, rho >= rhoCrit*0.9
	case sideVapour:
		return rho, rho <= rhoCrit*1.1
	}
	return rho, true
}
