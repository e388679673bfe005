package water

import "math"

// psat4 is the saturation-pressure equation, Eq. 30, in Pa. It assumes
// tMin <= t <= tCrit.
func psat4(t float64) float64 {
	n := &r4
	th := t + n[8]/(t-n[9])
	a := th*th + n[0]*th + n[1]
	b := n[2]*th*th + n[3]*th + n[4]
	c := n[5]*th*th + n[6]*th + n[7]
	x := 2 * c / (-b + math.Sqrt(b*b-4*a*c))
	x *= x
	return x * x * 1e6
}

// tsat4 is the saturation-temperature equation, Eq. 31, in K. It assumes
// pSatMinT <= p <= pCrit.
func tsat4(p float64) float64 {
	n := &r4
	beta := math.Sqrt(math.Sqrt(p / 1e6))
	e := beta*beta + n[2]*beta + n[5]
	f := n[0]*beta*beta + n[3]*beta + n[6]
	g := n[1]*beta*beta + n[4]*beta + n[7]
	d := 2 * g / (-f - math.Sqrt(f*f-4*e*g))
	nd := n[9] + d
	return (nd - math.Sqrt(nd*nd-4*(n[8]+n[9]*d))) / 2
}

// pB23 is the B23 boundary pressure, Eq. 5, in Pa, for t in K.
func pB23(t float64) float64 {
	return (b23[0] + b23[1]*t + b23[2]*t*t) * 1e6
}

// tB23 is the B23 boundary temperature, Eq. 6, in K, for p in Pa.
func tB23(p float64) float64 {
	return b23[3] + math.Sqrt((p/1e6-b23[4])/b23[2])
}

// pB2bc is the B2bc boundary pressure, Eq. 20, in Pa, for h in J/kg.
func pB2bc(h float64) float64 {
	eta := h / 1e3
	return (b2bc[0] + b2bc[1]*eta + b2bc[2]*eta*eta) * 1e6
}

// hB2bc is the B2bc boundary enthalpy, Eq. 21, in J/kg, for p in Pa.
func hB2bc(p float64) float64 {
	return (b2bc[3] + math.Sqrt((p/1e6-b2bc[4])/b2bc[2])) * 1e3
}
