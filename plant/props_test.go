package plant

import (
	"context"
	"math"
	"reflect"
	"testing"

	"steamcase/plant/water"
)

// TestLineStateAtSaturation: a line within a part in 1e9 of h_f or h_g is
// saturated liquid or vapour at the saturation temperature, on either
// side of the saturation enthalpy; beyond that band its temperature is
// IF97's from (p, h), a little below or above T_sat. Expected values from
// the water package's IAPWS-IF97 (Tsat, HSatLiquid, HSatVapour, TPH),
// which plant/water's tests check against IAPWS R7-97(2012); the band is
// the report's own definition.
func TestLineStateAtSaturation(t *testing.T) {
	t.Parallel()
	const p = 8e5
	ts, err := water.Tsat(p)
	must(t, err)
	hf, err := water.HSatLiquid(p)
	must(t, err)
	hg, err := water.HSatVapour(p)
	must(t, err)
	tol := 1e-9 * hg
	for _, tc := range []struct {
		name  string
		h     float64
		phase string
		x     float64
		exact bool // T is T_sat exactly
		below bool // T below T_sat (else above), when not exact
	}{
		{"h_f", hf, "liquid", 0, true, false},
		{"just above h_f", hf + 0.5*tol, "liquid", 0, true, false},
		{"just below h_f", hf - 0.5*tol, "liquid", 0, true, false},
		{"subcooled", hf - 1000, "liquid", 0, false, true},
		{"h_g", hg, "vapour", 1, true, false},
		{"just below h_g", hg - 0.5*tol, "vapour", 1, true, false},
		{"just above h_g", hg + 0.5*tol, "vapour", 1, true, false},
		{"superheated", hg + 1000, "vapour", 1, false, false},
		{"wet", 0.5 * (hf + hg), "two-phase", 0.5, true, false},
	} {
		var l Line
		for pass := 0; pass < 2; pass++ { // the second from the memos
			r, err := l.state(p, tc.h)
			must(t, err)
			if r.Phase != tc.phase || math.Abs(r.X-tc.x) > 1e-12 {
				t.Errorf("%s: phase %q x %g, want %q x %g", tc.name, r.Phase, r.X, tc.phase, tc.x)
			}
			switch {
			case tc.exact && r.T != ts:
				t.Errorf("%s: T %.17g, want T_sat %.17g", tc.name, r.T, ts)
			case !tc.exact:
				want, err := water.TPH(p, tc.h)
				must(t, err)
				if r.T != want || (r.T < ts) != tc.below {
					t.Errorf("%s: T %.17g, want %.17g (T_sat %.17g)", tc.name, r.T, want, ts)
				}
			}
		}
	}
}

// TestNoLineStates: a case solved with Options.NoLineStates has every
// figure of the same case solved without it, and no lines (the option's
// definition; no outside source).
func TestNoLineStates(t *testing.T) {
	t.Parallel()
	full := scaledPlant(t, 2, 6)
	bare := scaledPlant(t, 2, 6)
	bare.Opt.NoLineStates = true
	duty := full.Component("c1").(*Consumer).Duty
	for _, f := range []float64{1, 4, 0.5} {
		c := Case{Name: "lines", Set: []Setting{{Unit: "c1", Param: "duty", Value: f * duty}}}
		a, err := full.Solve(context.Background(), c)
		must(t, err)
		b, err := bare.Solve(context.Background(), c)
		must(t, err)
		if len(a.Lines) != len(full.Lines()) || len(b.Lines) != 0 {
			t.Fatalf("duty × %g: %d and %d lines reported, want %d and none", f, len(a.Lines), len(b.Lines), len(full.Lines()))
		}
		a.Lines = nil
		b.Lines = nil
		if !reflect.DeepEqual(a, b) {
			t.Errorf("duty × %g: the results differ beyond the lines\nwith:    %+v\nwithout: %+v", f, a, b)
		}
	}
}
