package heat

import (
	"errors"
	"math"
)

// errNoBracket and errRootNaN are internal; callers wrap them with context.
var (
	errNoBracket = errors.New("root not bracketed")
	errRootNaN   = errors.New("residual is not a finite number")
)

// brent finds x in [a, b] with f(x) = 0 by Brent's method (bisection, secant
// and inverse quadratic interpolation), given f(a) and f(b) of opposite sign
// or zero. It stops when the bracket is narrower than tol (absolute, in x)
// or f is exactly zero, after at most maxIter evaluations. It never returns
// NaN: a non-finite residual is an error. f must not retain itself; the
// closure passed in stays on the stack, so brent allocates nothing.
func brent(f func(float64) float64, a, b, fa, fb, tol float64, maxIter int) (x float64, iters int, err error) {
	if math.IsNaN(fa) || math.IsNaN(fb) || math.IsInf(fa, 0) || math.IsInf(fb, 0) {
		return 0, 0, errRootNaN
	}
	if fa == 0 {
		return a, 0, nil
	}
	if fb == 0 {
		return b, 0, nil
	}
	if (fa > 0) == (fb > 0) {
		return 0, 0, errNoBracket
	}
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
		tol1 := 2*2.220446049250313e-16*math.Abs(b) + 0.5*tol
		xm := 0.5 * (c - b)
		if math.Abs(xm) <= tol1 || fb == 0 {
			return b, iters, nil
		}
		if math.Abs(e) >= tol1 && math.Abs(fa) > math.Abs(fb) {
			s := fb / fa
			var p, q float64
			if a == c {
				p = 2 * xm * s
				q = 1 - s
			} else {
				q0 := fa / fc
				r := fb / fc
				p = s * (2*xm*q0*(q0-r) - (b-a)*(r-1))
				q = (q0 - 1) * (r - 1) * (s - 1)
			}
			if p > 0 {
				q = -q
			}
			p = math.Abs(p)
			if 2*p < math.Min(3*xm*q-math.Abs(tol1*q), math.Abs(e*q)) {
				e = d
				d = p / q
			} else {
				d = xm
				e = d
			}
		} else {
			d = xm
			e = d
		}
		a, fa = b, fb
		if math.Abs(d) > tol1 {
			b += d
		} else if xm > 0 {
			b += tol1
		} else {
			b -= tol1
		}
		fb = f(b)
		if math.IsNaN(fb) || math.IsInf(fb, 0) {
			return 0, iters, errRootNaN
		}
	}
	return b, iters, nil
}
