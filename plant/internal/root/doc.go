// Package root finds a root of a scalar function in a bracket by Brent's
// method (R. P. Brent, Algorithms for Minimization without Derivatives,
// 1973, ch. 4): inverse quadratic interpolation or the secant step where
// they stay inside the bracket and shrink it fast enough, bisection
// otherwise. It serves the heat-transfer laws (a furnace's and a tube
// pass's exit temperature, plant/heat) and the audit's implied factors
// (plant/profile).
package root
