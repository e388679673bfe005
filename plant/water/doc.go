// Package water gives the thermodynamic properties of water and steam by
// IAPWS-IF97, the IAPWS Industrial Formulation 1997 as revised in IAPWS
// R7-97(2012) (region 5 in its 2007 form).
//
// # What it implements
//
//   - Region 1 (liquid), region 2 (vapour) and region 5 (high-temperature
//     vapour) by their basic equations, the Gibbs free energy γ(π,τ)
//     (Eqs. 7, 15-17, 32-34); region 3 by its Helmholtz free energy φ(δ,τ)
//     (Eq. 28); region 4, the saturation line, by Eqs. 30 and 31; the
//     boundary B23 between regions 2 and 3 (Eqs. 5 and 6) and B2bc between
//     subregions 2b and 2c (Eqs. 20 and 21).
//   - States from (p,T) [PT, HPT], (p,h) [PH, TPH, SPH], (p,s) [PS, HPS],
//     (p,x) [PX, SatLiquid, SatVapour] and (T,x) [TX]; Tsat and Psat.
//   - The backward equations T(p,h) and T(p,s) of regions 1 and 2
//     (Eqs. 11, 13, 22-27; subregions 2a, 2b, 2c). Their result is only a
//     start value: it is refined by Newton steps on the basic equation until
//     the step is below 1e-4 K, which leaves T consistent with the forward
//     equation to better than 1e-9 relative in h (or s).
//   - Region 3 from (p,T): Newton's method on the basic equation for the
//     density, started on the proper side of the root (from above for the
//     liquid root, from the ideal-gas density for the vapour root, guarded
//     by bisection above the critical temperature). The region 3 backward
//     equations v(p,T) of IAPWS SR5-03 are not implemented. Region 3 from
//     (p,h) and (p,s): Newton steps in T on the basic equation (with the
//     density solved at each T), guarded by bisection between the region's
//     boundaries; the backward equations of IAPWS SR3-03 are not used.
//     Region 5 from (p,h) and (p,s) is iterated in the same way.
//   - Wet states from (p,h) and (p,s): the saturated liquid and vapour are
//     evaluated at T_sat(p) and the vapour fraction follows from h (or s).
//     Above 623.15 K the saturated densities come from region 3 at
//     p = p_sat(T).
//
// The metastable-vapour equation of region 2 and the transport properties
// are not implemented.
//
// # Range of validity
//
// 273.15 K <= T <= 1073.15 K for 0 < p <= 100 MPa, and 1073.15 K < T <=
// 2273.15 K for 0 < p <= 50 MPa. The saturation line runs from 273.15 K
// (611.213 Pa) to the critical point (647.096 K, 22.064 MPa). Inputs
// outside are an error of type *RangeError that names the bound crossed;
// NaN and infinite inputs are an *InputError; a (p,T) pair on the
// saturation line is a *SaturationError (a vapour fraction is needed, use
// PX or TX). No function returns NaN with a nil error and none extrapolates
// quietly, with one exception: a (p,h) or (p,s) pair that falls between the
// region 2 and region 5 values at 1073.15 K (the two equations differ there
// by a small amount within IF97's boundary consistency) is placed in region
// 2 a fraction of a kelvin above 1073.15 K.
//
// # Units
//
// All inputs and outputs are SI: Pa, K, J/kg, J/(kg K), m3/kg, kg/m3, m/s.
//
// # Accuracy
//
// The forward equations reproduce every value of the release's
// verification tables (Tables 5, 15, 33, 35, 36, 42) to 1e-8 relative, and
// the raw backward equations reproduce Tables 7, 9, 24 and 29 to the same.
// Against IAPWS-95 (the scientific formulation, IAPWS R6-95(2018)) IF97
// differs by the amounts the IF97 release allows; the tests compare with
// IAPWS-95 values within Δv/v 0.05 %, Δh 0.5 kJ/kg, Δs 0.001 kJ/(kg K),
// Δcp/cp 1 %, Δw/w 0.5 % and Δp_sat/p_sat 0.05 %.
//
// # Speed
//
// Integer powers are built by multiplication only (each power the product
// of two lower ones, filled once per call into a small array on the
// stack); math.Pow is never used. The coefficient tables are package-level
// arrays that are never written. The fast paths HPT, TPH, SPH, HPS and
// Tsat do not allocate; see the benchmarks in the package tests.
package water
