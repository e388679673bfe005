package profile

import "math"

// zero finds x in [a, b] with f(x) = 0, given fa = f(a) and fb = f(b) of
// opposite signs (or one of them zero), by Brent's method: inverse
// quadratic interpolation or the secant step where they stay inside the
// bracket and shrink it fast enough, bisection otherwise (R. P. Brent,
// Algorithms for Minimization without Derivatives, 1973, ch. 4). It stops
// when |f(x)| ≤ ftol or the bracket is narrower than xtol, and returns
// the best point found, its value, the bracket's width and the number of
// evaluations. An error of f ends the search and is returned.
func zero(f func(float64) (float64, error), a, b, fa, fb, xtol, ftol float64, maxEval int) (x, fx, width float64, evals int, err error) {
	if fa == 0 {
		return a, 0, 0, 0, nil
	}
	if fb == 0 {
		return b, 0, 0, 0, nil
	}
	// b is the best estimate, a the previous one, c the other end of the
	// bracket [b, c].
	c, fc := a, fa
	d := b - a
	e := d
	for evals < maxEval {
		if (fb > 0) == (fc > 0) {
			c, fc = a, fa
			d = b - a
			e = d
		}
		if math.Abs(fc) < math.Abs(fb) {
			a, b, c = b, c, b
			fa, fb, fc = fb, fc, fb
		}
		tol := 2*2.2e-16*math.Abs(b) + 0.5*xtol
		m := 0.5 * (c - b)
		if math.Abs(fb) <= ftol || math.Abs(m) <= tol {
			return b, fb, math.Abs(c - b), evals, nil
		}
		if math.Abs(e) >= tol && math.Abs(fa) > math.Abs(fb) {
			// Interpolate: the secant through a and b, or the inverse
			// quadratic through a, b and c.
			var p, q float64
			s := fb / fa
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
			} else {
				p = -p
			}
			// Accept the step only inside the bracket and shorter than half
			// the step before last.
			if 2*p < 3*m*q-math.Abs(tol*q) && p < math.Abs(0.5*e*q) {
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
		fb, err = f(b)
		evals++
		if err != nil {
			return b, fb, math.Abs(c - b), evals, err
		}
	}
	return b, fb, math.Abs(c - b), evals, nil
}
