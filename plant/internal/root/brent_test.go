package root

import (
	"errors"
	"math"
	"testing"
)

// TestBrent: the root finder on functions with known roots, to ftol or to
// the bracket's width; a bracket that does not change sign, a non-finite
// residual and an error of the function are said.
func TestBrent(t *testing.T) {
	t.Parallel()
	plain := func(f func(float64) float64) func(float64) (float64, error) {
		return func(x float64) (float64, error) { return f(x), nil }
	}
	for _, c := range []struct {
		name       string
		f          func(float64) float64
		a, b       float64
		xtol, ftol float64
		want, tol  float64
	}{
		// Wallis' cubic x³ − 2x − 5, root 2.0945514815423265 (the classical
		// test of root finders; the value from memory).
		{"Wallis' cubic", func(x float64) float64 { return x*x*x - 2*x - 5 }, 2, 3, 1e-14, 0, 2.0945514815423265, 1e-13},
		// The cube root of 2, by definition.
		{"cube root of 2", func(x float64) float64 { return x*x*x - 2 }, 0, 2, 1e-14, 0, math.Cbrt(2), 1e-12},
		// Stopped by ftol: 2x − 7 = 0 at 3.5 (by hand), |f| ≤ 1e-6 means x within 5e-7.
		{"ftol", func(x float64) float64 { return 2*x - 7 }, 0, 10, 1e-15, 1e-6, 3.5, 5e-7},
		// A step across zero at 0.3: the bracket closes onto it.
		{"step", func(x float64) float64 {
			if x < 0.3 {
				return -1
			}
			return 1
		}, 0, 1, 1e-12, 0, 0.3, 1e-11},
	} {
		x, fx, it, err := Brent(plain(c.f), c.a, c.b, c.f(c.a), c.f(c.b), c.xtol, c.ftol, 200)
		if err != nil || math.Abs(x-c.want) > c.tol || it == 0 || it > 200 {
			t.Errorf("%s: x %.17g (want %.17g ± %g), f %g, %d iterations, %v", c.name, x, c.want, c.tol, fx, it, err)
		}
		if c.ftol > 0 && math.Abs(fx) > c.ftol {
			t.Errorf("%s: |f| %g above ftol %g", c.name, fx, c.ftol)
		}
	}
	f := plain(func(x float64) float64 { return x*x*x - 2*x - 5 })
	if _, _, _, err := Brent(f, 3, 4, 16, 51, 1e-12, 0, 100); !errors.Is(err, ErrNoBracket) {
		t.Errorf("no sign change: %v", err)
	}
	g := plain(func(x float64) float64 {
		if x > 2.5 {
			return math.NaN()
		}
		return x - 2.7
	})
	if _, _, _, err := Brent(g, 2, 3, -0.7, 1, 1e-12, 0, 100); !errors.Is(err, ErrNotFinite) {
		t.Errorf("NaN residual: %v", err)
	}
	if _, _, _, err := Brent(g, 2, 3, math.Inf(-1), 1, 1e-12, 0, 100); !errors.Is(err, ErrNotFinite) {
		t.Errorf("infinite end: %v", err)
	}
	stop := errors.New("stop")
	h := func(x float64) (float64, error) { return x - 0.4, stop }
	if x, _, _, err := Brent(h, 0, 1, -0.4, 0.6, 1e-12, 0, 100); !errors.Is(err, stop) || x <= 0 || x >= 1 {
		t.Errorf("an error of f: x %g, %v", x, err)
	}
}

// TestBrentAllocatesNothing: a closure passed in stays on the stack.
func TestBrentAllocatesNothing(t *testing.T) {
	k := 2.0
	n := testing.AllocsPerRun(100, func() {
		_, _, _, _ = Brent(func(x float64) (float64, error) { return x*x - k, nil }, 0, 2, -k, 4-k, 1e-12, 0, 100)
	})
	if n != 0 {
		t.Errorf("%g allocations per call, want 0", n)
	}
}
