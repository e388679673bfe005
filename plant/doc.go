// Package plant describes a ship's steam plant as units joined by lines,
// assembles its mass and energy balance as one nonlinear system, hands it to
// the solver and returns a result whose balances are checked independently.
//
// Inside the package every quantity is SI: Pa, K, J/kg, kg/s, W.
package plant
