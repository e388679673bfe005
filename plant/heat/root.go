package heat

import "steamcase/plant/internal/root"

// brent is Brent's method (plant/internal/root) on a residual that cannot
// fail but by a non-finite value, to a bracket narrower than tol (absolute,
// in x) or an exact zero, in at most maxIter iterations.
func brent(f func(float64) float64, a, b, fa, fb, tol float64, maxIter int) (x float64, iters int, err error) {
	x, _, iters, err = root.Brent(func(t float64) (float64, error) { return f(t), nil }, a, b, fa, fb, tol, 0, maxIter)
	return x, iters, err
}
