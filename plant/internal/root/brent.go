package root

import (
	"errors"
	"math"
)

// ErrNoBracket and ErrNotFinite are Brent's errors about its function;
// callers wrap them with what was being solved.
var (
	ErrNoBracket = errors.New("root not bracketed")
	ErrNotFinite = errors.New("residual is not a finite number")
)

// epsilon is the float64 machine epsilon, 2⁻⁵².
const epsilon = 2.220446049250313e-16

// Brent finds x in [a, b] with f(x) = 0, given fa = f(a) and fb = f(b) of
// opposite signs (or one of them zero). It stops when the bracket is
// narrower than xtol (absolute, in x), when |f(x)| ≤ ftol (zero: only an
// exact root), or after maxIter iterations, and returns the best point
// found, its value and the iterations taken (one more than the function's
// evaluations when the bracket closes). It never returns NaN: a
// non-finite value of f is ErrNotFinite, an error of f ends the search
// and is returned with the point it was asked at. f is only called, never
// kept, so a closure passed in stays on the caller's stack and Brent
// allocates nothing.
func Brent(f func(float64) (float64, error), a, b, fa, fb, xtol, ftol float64, maxIter int) (x, fx float64, iters int, err error) {
	if !finite(fa) || !finite(fb) {
		return 0, 0, 0, ErrNotFinite
	}
	if fa == 0 {
		return a, 0, 0, nil
	}
	if fb == 0 {
		return b, 0, 0, nil
	}
	if (fa > 0) == (fb > 0) {
		return 0, 0, 0, ErrNoBracket
	}
	// b is the best estimate, a the previous one, c the other end of the
	// bracket [b, c].
	c, fc := a, fa
	d := b - a
	e := d
	for iters = 1; iters <= maxIter; iters++ {
		if (fb > 0) == (fc > 0) {
			c, fc = a, fa
			d = b - a
			e = d
		}
		if math.Abs(fc) < math.Abs(fb) {
			a, b, c = b, c, b
			fa, fb, fc = fb, fc, fb
		}
		tol := 2*epsilon*math.Abs(b) + 0.5*xtol
		m := 0.5 * (c - b)
		if math.Abs(m) <= tol || math.Abs(fb) <= ftol {
			return b, fb, iters, nil
		}
		if math.Abs(e) >= tol && math.Abs(fa) > math.Abs(fb) {
			// Interpolate: the secant through a and b, or the inverse
			// quadratic through a, b and c.
			s := fb / fa
			var p, q float64
			if a == c {
				p = 2 * m * s
				q = 1 - s
			} else {
				qa := fa / fc
				r := fb / fc
				p = s * (2*m*qa*(qa-r) - (b-a)*(r-1))
				q = (qa - 1) * (r - 1) * (s - 1)
			}
			if p > 0 {
				q = -q
			}
			p = math.Abs(p)
			// Accept the step only inside the bracket and shorter than half
			// the step before last.
			if 2*p < math.Min(3*m*q-math.Abs(tol*q), math.Abs(e*q)) {
				e = d
				d = p / q
			} else {
				d, e = m, m
			}
		} else {
			d, e = m, m
		}
		a, fa = b, fb
		if math.Abs(d) > tol {
			b += d
		} else if m > 0 {
			b += tol
		} else {
			b -= tol
		}
		if fb, err = f(b); err != nil {
			return b, fb, iters, err
		}
		if !finite(fb) {
			return 0, 0, iters, ErrNotFinite
		}
	}
	return b, fb, iters, nil
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
