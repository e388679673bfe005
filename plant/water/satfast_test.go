package water

import (
	"math"
	"testing"
)

// TestHSatFast checks the fast saturated enthalpies against the full
// saturated states they shorten, on a fine pressure grid up to the
// critical point (the full states are checked against IAPWS R7-97(2012)
// Tables 35-36 and IAPWS-95 elsewhere; this is a consistency check).
func TestHSatFast(t *testing.T) {
	for p := 700.0; p < 22.06e6; p *= 1.01 {
		l, err := SatLiquid(p)
		if err != nil {
			t.Fatal(err)
		}
		v, err := SatVapour(p)
		if err != nil {
			t.Fatal(err)
		}
		hl, err := HSatLiquid(p)
		if err != nil {
			t.Fatal(err)
		}
		hv, err := HSatVapour(p)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(hl-l.H) > 1e-12*math.Abs(l.H) || math.Abs(hv-v.H) > 1e-12*v.H {
			t.Fatalf("p %g Pa: h' %g vs %g, h'' %g vs %g", p, hl, l.H, hv, v.H)
		}
	}
	if _, err := HSatLiquid(30e6); err == nil {
		t.Error("HSatLiquid above the critical pressure must fail")
	}
	if _, err := HSatVapour(math.NaN()); err == nil {
		t.Error("HSatVapour(NaN) must fail")
	}
}

func BenchmarkHSatLiquid(b *testing.B) {
	var s float64
	for b.Loop() {
		h, _ := HSatLiquid(8.01325e5)
		s += h
	}
	_ = s
}
