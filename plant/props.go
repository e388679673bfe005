package plant

import (
	"steamcase/plant/water"
)

// Thin wrappers over the IF97 properties that units call in their
// residuals. Each returns the water package's error, which names the bound
// crossed; the caller wraps it with its unit.

func hLiquidSat(p float64) (float64, error) { return water.HSatLiquid(p) }

func hVapourSat(p float64) (float64, error) { return water.HSatVapour(p) }

// hPX is the enthalpy of wet steam of dryness x at pressure p.
func hPX(p, x float64) (float64, error) {
	s, err := water.PX(p, x)
	return s.H, err
}

// hCondensate is the enthalpy of condensate at pressure p leaving sub
// kelvin below saturation (sub = 0: saturated liquid).
func hCondensate(p, sub float64) (float64, error) {
	if sub <= 0 {
		return hLiquidSat(p)
	}
	ts, err := water.Tsat(p)
	if err != nil {
		return 0, err
	}
	return water.HPT(p, ts-sub)
}

// hPT is the enthalpy of single-phase water or steam.
func hPT(p, t float64) (float64, error) { return water.HPT(p, t) }

// tPH is the temperature at (p, h), wet or single-phase.
func tPH(p, h float64) (float64, error) { return water.TPH(p, h) }

// memo remembers the last value of a property function of one or two
// arguments. Within one Newton iteration most residual evaluations (the
// finite-difference columns) repeat the arguments of the last call, and
// set points (drum and tank pressures) repeat across iterations, so a unit
// keeps one memo per property call site. Errors are not remembered.
type memo struct {
	a, b, v float64
	set     bool
}

func (m *memo) get1(a float64, f func(float64) (float64, error)) (float64, error) {
	if m.set && m.a == a {
		return m.v, nil
	}
	v, err := f(a)
	if err != nil {
		m.set = false
		return 0, err
	}
	m.a, m.v, m.set = a, v, true
	return v, nil
}

func (m *memo) get2(a, b float64, f func(float64, float64) (float64, error)) (float64, error) {
	if m.set && m.a == a && m.b == b {
		return m.v, nil
	}
	v, err := f(a, b)
	if err != nil {
		m.set = false
		return 0, err
	}
	m.a, m.b, m.v, m.set = a, b, v, true
	return v, nil
}

// vPH is the specific volume at (p, h).
func vPH(p, h float64) (float64, error) {
	s, err := water.PH(p, h)
	return s.V, err
}

// waterTsat is the saturation temperature at p.
func waterTsat(p float64) (float64, error) { return water.Tsat(p) }

// waterPsat is the saturation pressure at t.
func waterPsat(t float64) (float64, error) { return water.Psat(t) }

// The critical point of water, IAPWS-IF97 Eqs. 2 and 3.
const (
	tCrit = 647.096  // K
	pCrit = 22.064e6 // Pa
)

// satMemo keeps a line's saturation state at its last pressure: a line's
// pressure is nearly always a set point, so across the cases of a profile
// the report finds it here.
type satMemo struct {
	p, tSat, hf, hg float64
	set             bool
}

// state is the reported state of a line at (p, h): temperature, quality
// and phase, with the saturation figures memoised by pressure.
func (l *Line) state(p, h float64) (LineResult, error) {
	r := LineResult{P: p, H: h}
	if p >= pCrit {
		t, err := tPH(p, h)
		if err != nil {
			return r, err
		}
		r.T, r.Phase, r.X = t, water.Supercritical.String(), 1
		if t < tCrit {
			r.Phase, r.X = water.Liquid.String(), 0
		}
		return r, nil
	}
	m := &l.sat
	if !m.set || m.p != p {
		ts, err := water.Tsat(p)
		if err != nil {
			return r, err
		}
		hf, err := hLiquidSat(p)
		if err != nil {
			return r, err
		}
		hg, err := hVapourSat(p)
		if err != nil {
			return r, err
		}
		*m = satMemo{p: p, tSat: ts, hf: hf, hg: hg, set: true}
	}
	// A line within a part in 1e9 of a saturation enthalpy is reported as
	// saturated liquid or vapour, so that the last bit of a solve does not
	// flip its phase (dry saturated steam sits exactly on h_g).
	tol := 1e-9 * m.hg
	switch {
	case h > m.hf+tol && h < m.hg-tol:
		r.T, r.X, r.Phase, r.TwoPhase = m.tSat, (h-m.hf)/(m.hg-m.hf), water.TwoPhase.String(), true
		return r, nil
	case h <= m.hf:
		r.Phase, r.X = water.Liquid.String(), 0
	default:
		r.Phase, r.X = water.Vapour.String(), 1
	}
	t, err := tPH(p, h)
	if err != nil {
		return r, err
	}
	r.T = t
	return r, nil
}
