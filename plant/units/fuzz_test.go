package units

import (
	"errors"
	"math"
	"testing"
)

// FuzzParse checks that no input panics, that every accepted value is
// finite, and that Format then Parse gives the value back. The tolerance is
// relative 1e-12, widened by the offset a unit adds (ambient pressure,
// 273.15 K), since v*scale + offset loses digits of small results.
func FuzzParse(f *testing.F) {
	for _, c := range conversions {
		f.Add(c.in)
	}
	for _, s := range []string{"7 bar", "7", "", "-", "1e400 Pa", "7,5 bar(g)", "5 C", "(", ")(", "1 ΔΔ", "\xff bar", "1e-400 K", "-0 bar(g)"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		for _, d := range Dimensions() {
			v, err := Parse(s, d, Options{})
			if err == nil && (math.IsNaN(v) || math.IsInf(v, 0)) {
				t.Fatalf("Parse(%q, %v) = %v without error", s, d, v)
			}
			var e *Error
			if err != nil && !errors.As(err, &e) {
				t.Fatalf("Parse(%q, %v) error %T is not *Error", s, d, err)
			}
		}
		q, err := ParseAny(s, Options{})
		if err != nil {
			return
		}
		if !q.Dim.valid() || math.IsNaN(q.Value) || math.IsInf(q.Value, 0) {
			t.Fatalf("ParseAny(%q) = %+v", s, q)
		}
		text, err := Format(q.Value, q.Unit)
		if err != nil {
			// A value near the float64 limit may overflow on the way
			// back to a unit larger than SI; that is reported, not lost.
			var e *Error
			if errors.As(err, &e) && e.Kind == ErrRange && math.Abs(q.Value) > 1e300 {
				return
			}
			t.Fatalf("Format(%v, %q) from %q: %v", q.Value, q.Unit, s, err)
		}
		back, err := ParseAny(text, Options{})
		if err != nil {
			var e *Error
			if errors.As(err, &e) && e.Kind == ErrPhysical && math.Abs(q.Value) < 1e-6 {
				return // at the vacuum or absolute-zero bound, rounding may cross it
			}
			t.Fatalf("ParseAny(Format(%q) = %q): %v", s, text, err)
		}
		slack := 1e-12 * (math.Abs(q.Value) + StandardAtmosphere + 1000)
		if back.Dim != q.Dim || math.Abs(back.Value-q.Value) > slack {
			t.Fatalf("round trip %q -> %q: %v %v, want %v %v", s, text, back.Value, back.Dim, q.Value, q.Dim)
		}
	})
}
