package water

import (
	"math"
	"math/rand/v2"
	"testing"
)

// randPT draws a (p,T) pair over the whole IF97 range: p log-uniform from
// 1 Pa to 100 MPa, T uniform from 273.15 K to 1073.15 K, and one draw in
// five from region 5's range (up to 2273.15 K at p <= 50 MPa).
func randPT(r *rand.Rand) (p, t float64) {
	p = math.Exp(math.Log(1) + r.Float64()*(math.Log(pMax)-math.Log(1)))
	if r.IntN(5) == 0 {
		p = math.Min(p, pMax5)
		return p, tMid + r.Float64()*(tMax-tMid)
	}
	return p, tMin + r.Float64()*(tMid-tMin)
}

// nearBoundary reports whether T lies within dt of a region boundary that
// IF97 draws in temperature at this pressure (623.15 K between regions 1
// and 3, B23 between regions 2 and 3, 1073.15 K between regions 2 and 5).
// There the two adjoining equations overlap by their permitted boundary
// inconsistency, so (p,h) and (p,s) have two valid answers a few
// hundredths of a kelvin apart.
func nearBoundary(p, t, dt float64) bool {
	if math.Abs(t-tMid) < dt {
		return true
	}
	if p > pSat13 && (math.Abs(t-t13) < dt || math.Abs(t-tB23(p)) < dt) {
		return true
	}
	return false
}

// checkRoundTrip checks that T(p, h(p,T)) = T and T(p, s(p,T)) = T, and
// that the refined T reproduces h and s. Source: consistency of the
// implementation with its own forward equations (the IF97 backward
// equations are refined on the basic equation, so this must hold to
// rounding); no external reference.
func checkRoundTrip(t *testing.T, p, tk float64) {
	st, err := PT(p, tk)
	if err != nil {
		if _, ok := err.(*SaturationError); ok {
			return
		}
		t.Fatalf("PT(%g, %g): %v", p, tk, err)
	}
	tol := 1e-9 * tk
	if nearBoundary(p, tk, 0.2) {
		tol = 0.1 // K: the overlap of two regions' equations at their boundary
	}
	th, err := TPH(p, st.H)
	if err != nil || !(math.Abs(th-tk) <= tol) {
		t.Errorf("TPH(%g Pa, h(p,%.12g K) = %.12g): got %.12g K, %v", p, tk, st.H, th, err)
	}
	ts, err := PS(p, st.S)
	if err != nil || !(math.Abs(ts.T-tk) <= tol) {
		t.Errorf("PS(%g Pa, s(p,%.12g K) = %.12g): got %.12g K, %v", p, tk, st.S, ts.T, err)
	}
	// The refined temperature reproduces h to 1e-9 relative (absolute
	// 1e-4 J/kg where |h| < 100 kJ/kg, near 0.01 °C where h passes zero).
	if err == nil && !nearBoundary(p, tk, 0.2) {
		h2, err := HPT(p, th)
		if err == nil && !(math.Abs(h2-st.H) <= 1e-9*math.Max(math.Abs(st.H), 1e5)) {
			t.Errorf("h(p, T(p,h)) at p=%g Pa h=%.12g: %.12g, rel. dev. %.3g", p, st.H, h2, math.Abs(h2-st.H)/st.H)
		}
	}
	hs, err := HPS(p, st.S)
	if err != nil || !(math.Abs(hs-st.H) <= 1e-9*math.Max(math.Abs(st.H), 1e5)) && !nearBoundary(p, tk, 0.2) {
		t.Errorf("HPS(%g Pa, %.12g) = %.12g, want %.12g (%v)", p, st.S, hs, st.H, err)
	}
	sh, err := SPH(p, st.H)
	if err != nil || !(math.Abs(sh-st.S) <= 1e-9*math.Max(math.Abs(st.S), 100)) && !nearBoundary(p, tk, 0.2) {
		t.Errorf("SPH(%g Pa, %.12g) = %.12g, want %.12g (%v)", p, st.H, sh, st.S, err)
	}
}

// TestRoundTripRandom runs the round trip over 20000 seeded random states
// covering all five regions.
func TestRoundTripRandom(t *testing.T) {
	t.Parallel()
	r := rand.New(rand.NewPCG(1997, 7))
	n := 20000
	if testing.Short() {
		n = 2000
	}
	for range n {
		p, tk := randPT(r)
		checkRoundTrip(t, p, tk)
		if t.Failed() {
			return
		}
	}
}

// TestRoundTripCritical runs the round trip on a fine grid around the
// critical point and the region 3 boundaries, where the density solve
// and the backward iteration are hardest.
func TestRoundTripCritical(t *testing.T) {
	t.Parallel()
	for p := 16.0e6; p <= 30e6; p += 0.25e6 {
		for tk := 620.0; tk <= 700; tk += 0.37 {
			checkRoundTrip(t, p, tk)
		}
	}
	for _, d := range []float64{-1e-3, -1e-5, 1e-5, 1e-3} {
		checkRoundTrip(t, pCrit*(1+d), tCrit+0.01)
		checkRoundTrip(t, pCrit, tCrit*(1+d))
	}
}

// TestWetQuality checks that wet states from (p,x) come back with the
// same vapour fraction from (p,h) and from (p,s). Source: consistency of
// the implementation (no external reference).
func TestWetQuality(t *testing.T) {
	t.Parallel()
	r := rand.New(rand.NewPCG(31, 30))
	for range 5000 {
		p := math.Max(pSatMinT, math.Exp(math.Log(pSatMinT)+r.Float64()*(math.Log(pCrit*0.999)-math.Log(pSatMinT))))
		x := r.Float64()
		st, err := PX(p, x)
		if err != nil {
			t.Fatalf("PX(%g, %g): %v", p, x, err)
		}
		a, err := PH(p, st.H)
		if err != nil {
			t.Fatalf("PH(%g, %g): %v", p, st.H, err)
		}
		b, err := PS(p, st.S)
		if err != nil {
			t.Fatalf("PS(%g, %g): %v", p, st.S, err)
		}
		if x > 0 && x < 1 {
			if a.Region != RegionTwoPhase || b.Region != RegionTwoPhase {
				t.Errorf("p=%g x=%g: regions %v and %v, want two-phase", p, x, a.Region, b.Region)
			}
		}
		if !(math.Abs(a.X-x) <= 1e-9) || !(math.Abs(b.X-x) <= 1e-9) || !(math.Abs(a.X-b.X) <= 1e-9) {
			t.Errorf("p=%g x=%g: x from (p,h) %.12g, from (p,s) %.12g", p, x, a.X, b.X)
		}
		if !(math.Abs(a.T-st.T) <= 1e-9*st.T) {
			t.Errorf("p=%g x=%g: T from (p,h) %.12g, want %.12g", p, x, a.T, st.T)
		}
	}
}

// allFinite reports whether every number of a state is finite.
func allFinite(st State) bool {
	for _, v := range []float64{st.P, st.T, st.H, st.S, st.U, st.V, st.Rho, st.Cp, st.Cv, st.W, st.X} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}

// FuzzNoNaN feeds arbitrary pairs to every constructor: each returns an
// error or a state of finite numbers, never NaN, and never panics.
func FuzzNoNaN(f *testing.F) {
	f.Add(1e5, 300.0)
	f.Add(22.064e6, 647.096)
	f.Add(math.NaN(), 1.0)
	f.Add(1e6, 2.8e6)
	f.Add(611.0, 8000.0)
	f.Add(100e6, 0.5)
	f.Add(-1.0, math.Inf(1))
	f.Add(1e-320, 300.0)
	f.Add(1e-30, 2.6e6)
	f.Fuzz(func(t *testing.T, a, b float64) {
		check := func(name string, st State, err error) {
			if err == nil && !allFinite(st) {
				t.Errorf("%s(%g, %g) = %+v with nil error", name, a, b, st)
			}
		}
		st, err := PT(a, b)
		check("PT", st, err)
		st, err = PH(a, b)
		check("PH", st, err)
		st, err = PS(a, b)
		check("PS", st, err)
		st, err = PX(a, b)
		check("PX", st, err)
		st, err = TX(a, b)
		check("TX", st, err)
		for name, fn := range map[string]func(float64, float64) (float64, error){
			"HPT": HPT, "TPH": TPH, "SPH": SPH, "HPS": HPS,
		} {
			v, err := fn(a, b)
			if err == nil && (math.IsNaN(v) || math.IsInf(v, 0)) {
				t.Errorf("%s(%g, %g) = %g with nil error", name, a, b, v)
			}
		}
		for name, fn := range map[string]func(float64) (float64, error){"Tsat": Tsat, "Psat": Psat} {
			v, err := fn(a)
			if err == nil && (math.IsNaN(v) || math.IsInf(v, 0)) {
				t.Errorf("%s(%g) = %g with nil error", name, a, v)
			}
		}
	})
}

// FuzzRoundTrip maps two arbitrary numbers into the IF97 range and checks
// the (p,T) -> h, s -> T round trip there.
func FuzzRoundTrip(f *testing.F) {
	f.Add(0.5, 0.5)
	f.Add(0.0, 0.0)
	f.Add(1.0, 1.0)
	f.Add(0.93, 0.45)
	f.Fuzz(func(t *testing.T, u, v float64) {
		if math.IsNaN(u) || math.IsNaN(v) || math.IsInf(u, 0) || math.IsInf(v, 0) {
			return
		}
		u, v = math.Abs(math.Mod(u, 1)), math.Abs(math.Mod(v, 1))
		p := math.Exp(u * math.Log(pMax))
		tk := tMin + v*(tMax-tMin)
		if tk > tMid && p > pMax5 {
			p = pMax5 * u
		}
		if p <= 0 {
			return
		}
		checkRoundTrip(t, p, tk)
	})
}

// FuzzWetQuality maps two arbitrary numbers to (p, x) on the saturation
// line and checks that (p,h) and (p,s) give the same quality back.
func FuzzWetQuality(f *testing.F) {
	f.Add(0.5, 0.5)
	f.Add(0.99, 0.01)
	f.Fuzz(func(t *testing.T, u, x float64) {
		if math.IsNaN(u) || math.IsNaN(x) || math.IsInf(u, 0) || math.IsInf(x, 0) {
			return
		}
		u, x = math.Abs(math.Mod(u, 1)), math.Abs(math.Mod(x, 1))
		p := math.Max(pSatMinT, math.Exp(math.Log(pSatMinT)+u*(math.Log(pCrit*0.999)-math.Log(pSatMinT))))
		st, err := PX(p, x)
		if err != nil {
			t.Fatal(err)
		}
		a, errA := PH(p, st.H)
		b, errB := PS(p, st.S)
		if errA != nil || errB != nil || !(math.Abs(a.X-x) <= 1e-9) || !(math.Abs(b.X-x) <= 1e-9) {
			t.Errorf("p=%g x=%g: (p,h) gives %g (%v), (p,s) gives %g (%v)", p, x, a.X, errA, b.X, errB)
		}
	})
}

// TestNearCritical: at and next to the critical point every constructor
// returns finite numbers, and the saturated liquid is not lighter than the
// vapour by more than the flatness of the isotherm allows. Source:
// IAPWS R7-97(2012) Eqs. 2-4 (critical constants); common practice.
func TestNearCritical(t *testing.T) {
	t.Parallel()
	for _, d := range []float64{0, 1e-12, 1e-10, 1e-8, 1e-6, 1e-4, 1e-3} {
		p := pCrit * (1 - d)
		for _, x := range []float64{0, 0.3, 1} {
			st, err := PX(p, x)
			if err != nil || !allFinite(st) {
				t.Errorf("PX(%.12g, %g) = %+v, %v", p, x, st, err)
			}
			for name, f := range map[string]func(float64, float64) (State, error){"PH": PH, "PS": PS} {
				v := st.H
				if name == "PS" {
					v = st.S
				}
				b, err := f(p, v)
				if err != nil || !allFinite(b) {
					t.Errorf("%s(%.12g, %.12g) from x=%g: %+v, %v", name, p, v, x, b, err)
				}
			}
		}
		l, err1 := SatLiquid(p)
		v, err2 := SatVapour(p)
		if err1 != nil || err2 != nil || !(l.Rho >= v.Rho*(1-1e-6)) {
			t.Errorf("p = %.12g: rho' = %.9g, rho'' = %.9g (%v, %v)", p, l.Rho, v.Rho, err1, err2)
		}
	}
	st, err := PT(pCrit, tCrit)
	if err != nil || !allFinite(st) || math.Abs(st.Rho-rhoCrit) > 1 {
		t.Errorf("PT at the critical point: %+v, %v (want ρ near 322 kg/m3, IAPWS R7-97(2012) Eq. 4)", st, err)
	}
}

// TestNoNaNSweep sweeps every constructor over a wide grid, far beyond the
// range of validity on each side: each result is an error or finite.
// Source: the package's contract (rule: no NaN without an error).
func TestNoNaNSweep(t *testing.T) {
	t.Parallel()
	var ps []float64
	for e := -35.0; e <= 9; e += 0.25 {
		ps = append(ps, math.Pow(10, e))
	}
	ps = append(ps, 0, -1, pSatMinT, pSat13, pCrit, pMax, pMax5, math.MaxFloat64, math.SmallestNonzeroFloat64)
	var ts, hs, ss, xs []float64
	for v := 0.0; v <= 2500; v += 7.3 {
		ts = append(ts, v)
	}
	ts = append(ts, tMin, tTripleK, t13, tCrit, tMid, tMax)
	for v := -1e5; v <= 8e6; v += 3.7e4 {
		hs = append(hs, v)
	}
	for v := -500.0; v <= 14e3; v += 61 {
		ss = append(ss, v)
	}
	for v := -0.5; v <= 1.5; v += 0.125 {
		xs = append(xs, v)
	}
	check := func(name string, a, b float64, st State, err error) {
		if err == nil && !allFinite(st) {
			t.Errorf("%s(%g, %g) = %+v with nil error", name, a, b, st)
		}
	}
	for _, p := range ps {
		for _, tk := range ts {
			st, err := PT(p, tk)
			check("PT", p, tk, st, err)
			st, err = TX(tk, 0.5)
			check("TX", tk, 0.5, st, err)
		}
		for _, h := range hs {
			st, err := PH(p, h)
			check("PH", p, h, st, err)
		}
		for _, s := range ss {
			st, err := PS(p, s)
			check("PS", p, s, st, err)
		}
		for _, x := range xs {
			st, err := PX(p, x)
			check("PX", p, x, st, err)
		}
	}
}

// tTripleK is the triple-point temperature, 273.16 K (IAPWS R7-97(2012)
// Sec. 1), a point the sweep should include.
const tTripleK = 273.16
