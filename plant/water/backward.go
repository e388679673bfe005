package water

import "math"

// The backward equations of IF97 give T from (p,h) or (p,s) directly, to
// within 25 mK (region 1) and 10 mK (region 2) of the forward equations.
// The exported functions refine their result with Newton steps on the
// forward equation; the raw equations are kept here and tested against the
// release's Tables 7, 9, 24 and 29.

// t1ph is the region 1 backward equation T(p,h), Eq. 11.
func t1ph(p, h float64) float64 {
	pi := p / 1e6
	eta := h/2500e3 + 1
	var pp [7]float64
	fillPow(pp[:], pi)
	var ep [33]float64
	fillPow(ep[:], eta)
	var th float64
	for k := range r1Tph {
		tm := &r1Tph[k]
		th += tm.n * pp[tm.i] * ep[tm.j]
	}
	return th
}

// t1ps is the region 1 backward equation T(p,s), Eq. 13.
func t1ps(p, s float64) float64 {
	pi := p / 1e6
	sg := s/1e3 + 2
	var pp [5]float64
	fillPow(pp[:], pi)
	var sp [33]float64
	fillPow(sp[:], sg)
	var th float64
	for k := range r1Tps {
		tm := &r1Tps[k]
		th += tm.n * pp[tm.i] * sp[tm.j]
	}
	return th
}

// t2ph is the region 2 backward equation T(p,h), Eqs. 22-24, choosing the
// subregion by p = 4 MPa and the B2bc equation.
func t2ph(p, h float64) float64 {
	pi := p / 1e6
	eta := h / 2000e3
	switch {
	case p <= p2abLim:
		var pp [8]float64
		fillPow(pp[:], pi)
		var ep [45]float64
		fillPow(ep[:], eta-2.1)
		var th float64
		for k := range r2aTph {
			tm := &r2aTph[k]
			th += tm.n * pp[tm.i] * ep[tm.j]
		}
		return th
	case h >= hB2bc(p):
		var pp [10]float64
		fillPow(pp[:], pi-2)
		var ep [41]float64
		fillPow(ep[:], eta-2.6)
		var th float64
		for k := range r2bTph {
			tm := &r2bTph[k]
			th += tm.n * pp[tm.i] * ep[tm.j]
		}
		return th
	default:
		var pp [14]float64 // (π+25)^-7 .. ^6
		fillPowSigned(pp[:], 7, pi+25)
		var ep [23]float64
		fillPow(ep[:], eta-1.8)
		var th float64
		for k := range r2cTph {
			tm := &r2cTph[k]
			th += tm.n * pp[tm.i+7] * ep[tm.j]
		}
		return th
	}
}

// t2ps is the region 2 backward equation T(p,s), Eqs. 25-27, choosing the
// subregion by p = 4 MPa and s = 5.85 kJ/(kg K).
func t2ps(p, s float64) float64 {
	pi := p / 1e6
	switch {
	case p <= p2abLim:
		q := math.Sqrt(math.Sqrt(pi)) // π^(1/4)
		var qp [13]float64            // π^(-6/4) .. π^(6/4)
		fillPowSigned(qp[:], 6, q)
		var sp [46]float64 // (σ-2)^-27 .. ^18
		fillPowSigned(sp[:], 27, s/2e3-2)
		var th float64
		for k := range r2aTps {
			tm := &r2aTps[k]
			th += tm.n * qp[tm.i+6] * sp[tm.j+27]
		}
		return th
	case s >= s2bcLim:
		var pp [12]float64 // π^-6 .. π^5
		fillPowSigned(pp[:], 6, pi)
		var sp [13]float64
		fillPow(sp[:], 10-s/0.7853e3)
		var th float64
		for k := range r2bTps {
			tm := &r2bTps[k]
			th += tm.n * pp[tm.i+6] * sp[tm.j]
		}
		return th
	default:
		var pp [10]float64 // π^-2 .. π^7
		fillPowSigned(pp[:], 2, pi)
		var sp [6]float64
		fillPow(sp[:], 2-s/2.9251e3)
		var th float64
		for k := range r2cTps {
			tm := &r2cTps[k]
			th += tm.n * pp[tm.i+2] * sp[tm.j]
		}
		return th
	}
}
