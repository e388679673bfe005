package water

import "math"

// The backward equations of IF97 give T from (p,h) or (p,s) directly, to
// within 25 mK (region 1) and 10 mK (region 2) of the forward equations.
// The exported functions refine their result with Newton steps on the
// forward equation; the raw equations are kept here and tested against the
// release's Tables 7, 9, 24 and 29.

// t1ph is the region 1 backward equation T(p,h), Eq. 11.
func t1ph(p, h float64) float64 {
	return poly1Tph(p/1e6, h/2500e3+1)
}

// t1ps is the region 1 backward equation T(p,s), Eq. 13.
func t1ps(p, s float64) float64 {
	return poly1Tps(p/1e6, s/1e3+2)
}

// t2ph is the region 2 backward equation T(p,h), Eqs. 22-24, choosing the
// subregion by p = 4 MPa and the B2bc equation.
func t2ph(p, h float64) float64 {
	pi := p / 1e6
	eta := h / 2000e3
	switch {
	case p <= p2abLim:
		return poly2aTph(pi, eta-2.1)
	case p <= b2bc[4]*1e6 || h >= hB2bc(p):
		// Below 4.5257 MPa the B2bc equation has no real value: subregion
		// 2b reaches down to the saturation line there.
		return poly2bTph(pi-2, eta-2.6)
	}
	return poly2cTph(pi+25, eta-1.8)
}

// t2ps is the region 2 backward equation T(p,s), Eqs. 25-27, choosing the
// subregion by p = 4 MPa and s = 5.85 kJ/(kg K). The exponents of π in
// subregion 2a are quarters; its table holds 4·I, and the generated sum
// takes π^(1/4).
func t2ps(p, s float64) float64 {
	pi := p / 1e6
	switch {
	case p <= p2abLim:
		return poly2aTps(math.Sqrt(math.Sqrt(pi)), s/2e3-2)
	case s >= s2bcLim:
		return poly2bTps(pi, 10-s/0.7853e3)
	}
	return poly2cTps(pi, 2-s/2.9251e3)
}
