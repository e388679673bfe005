package schema

import (
	"math"
	"testing"
)

// TestRound checks the rule on values chosen for its edges. The expected
// values follow from the rule's definition (six significant digits,
// halves away from zero, |v| < 1e-9 is 0), by hand.
func TestRound(t *testing.T) {
	t.Parallel()
	for _, c := range []struct{ in, want float64 }{
		{0, 0},
		{736.41234, 736.412},
		{-736.41254, -736.413},
		{123456.5, 123457},
		{1234567, 1234570},
		{0.000123456789, 0.000123457},
		{17.6739999, 17.674},
		{999999.5, 1e6},
		{9.9999951e-3, 0.01},
		{9.9999949e-3, 0.00999999},
		{1e-9, 1e-9},
		{9.99e-10, 0},
		{-5e-10, 0},
		{288.15, 288.15},
		{4.02e7, 4.02e7},
		{40199995.1, 4.02e7},
		{1.23456789e12, 1.23457e12},
	} {
		if got := Round(c.in); got != c.want {
			t.Errorf("Round(%.17g) = %.17g, want %g", c.in, got, c.want)
		}
	}
	for _, v := range []float64{math.NaN(), math.Inf(1), math.Inf(-1)} {
		if got := Round(v); !(math.IsNaN(v) && math.IsNaN(got)) && got != v {
			t.Errorf("Round(%g) = %g, want it back", v, got)
		}
	}
}

// FuzzRound: rounding again changes nothing, the error is at most half a
// unit in the sixth digit, and the sign is kept.
func FuzzRound(f *testing.F) {
	for _, v := range []float64{0, 1, -1, 736.412, 1e-9, 123456.5, 1e300, -2.5e-7} {
		f.Add(v)
	}
	f.Fuzz(func(t *testing.T, v float64) {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return
		}
		r := Round(v)
		if rr := Round(r); rr != r {
			t.Fatalf("Round(Round(%g)) = %.17g, Round = %.17g", v, rr, r)
		}
		if math.Abs(v) < 1e-9 {
			if r != 0 {
				t.Fatalf("Round(%g) = %g, want 0", v, r)
			}
			return
		}
		if d := math.Abs(r - v); d > 5.000001e-6*math.Abs(v) {
			t.Fatalf("Round(%.17g) = %.17g: off by %g relative", v, r, d/math.Abs(v))
		}
		if r != 0 && math.Signbit(r) != math.Signbit(v) {
			t.Fatalf("Round(%g) = %g changed the sign", v, r)
		}
	})
}
