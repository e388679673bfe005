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
//     (Eqs. 11, 13, 22-27; subregions 2a, 2b, 2c chosen by p = 4 MPa, the
//     B2bc equation and s = 5.85 kJ/(kg K)). Their result is a start value
//     only: it is refined by simplified Newton steps on the basic equation
//     (derivative cp, or cp/T, from the first step) until the remaining
//     error is below about 2e-10·T, so the returned T reproduces h (or s)
//     through the forward equation to 1e-9 relative.
//   - Region 3 from (p,T): Newton's method on the basic equation for the
//     density, started on the proper side of the root (from above the
//     liquid root, where the isotherm is convex; from the ideal-gas density
//     below the vapour root, where it is concave), guarded by a bracket and
//     bisection, which also handles the flat isotherm at the critical
//     point. The region 3 backward equations v(p,T) of IAPWS SR5-03 are not
//     implemented. Region 3 from (p,h) and (p,s): Newton steps in T on the
//     basic equation (the density solved at each T), guarded by bisection
//     between the region's boundaries (623.15 K, T_sat and B23); the
//     backward equations of IAPWS SR3-03 are not used. Region 5 from (p,h)
//     and (p,s) is iterated in the same way.
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
// 2273.15 K for 0 < p <= 50 MPa (in practice p >= 1e-30 Pa: far smaller
// pressures would overflow the specific volume). The saturation line runs from 273.15 K
// (611.213 Pa) to the critical point (647.096 K, 22.064 MPa). Inputs
// outside are an error of type *RangeError that names the bound crossed;
// NaN and infinite inputs are an *InputError; a (p,T) pair on the
// saturation line is a *SaturationError (a vapour fraction is needed, use
// PX or TX). No function returns NaN with a nil error and none extrapolates
// quietly, with one exception: a (p,h) or (p,s) pair that falls between the
// region 2 and region 5 values at 1073.15 K (the two equations differ there
// by up to about 0.1 kJ/kg in h, within IF97's boundary consistency) is
// placed in region 2 at most a few hundredths of a kelvin above 1073.15 K.
//
// Property values feed the plant's planning and audit estimates; they are
// not a substitute for the makers' manuals, class and flag rules, or
// licensed engineering practice.
//
// # Units
//
// All inputs and outputs are SI: Pa, K, J/kg, J/(kg K), m3/kg, kg/m3, m/s.
//
// # Accuracy
//
// The forward equations reproduce every value of the release's
// verification tables (Tables 5, 15, 33, 35, 36, 42 and the B23 and B2bc
// check points) to 1e-8 relative, and the raw backward equations reproduce
// Tables 7, 9, 24 and 29 to the same. Over their whole range the raw
// backward equations lie within 23.5 mK (region 1) and 9.4 mK (region 2a,
// 2b) of the basic equations; in subregion 2c within 23.7 mK for T(p,h)
// and 18.9 mK for T(p,s), which python3-iapws reproduces (the refinement
// removes these differences in any case). Against IAPWS-95 (the
// scientific formulation, IAPWS R6-95(2018)) the tests allow Δv/v 0.05 %,
// Δh 0.5 kJ/kg, Δs 0.001 kJ/(kg K), Δcp/cp 1 %, Δw/w 0.5 % and
// Δp_sat/p_sat 0.05 % (up to 600 K).
//
// Two regions meet with a small step at their boundaries, as IF97 permits
// (at 1073.15 K regions 2 and 5 differ by up to about 0.1 kJ/kg in h). A
// (p,h) or (p,s) pair inside such a step has a valid answer on each side,
// a few hundredths of a kelvin apart; this package then takes region 1
// or 2 rather than 3 or 5. Within about 1e-8 of the critical
// pressure the saturated liquid and vapour of Eq. 28 merge.
//
// # Speed
//
// Every polynomial sum of regions 1 to 3 and of the backward equations is
// straight-line code generated from the coefficient tables (poly_gen.go);
// math.Pow is never used. The sums of regions 1 and 2 and of their
// backward equations are nested polynomials: the terms are grouped by the
// power of one reduced variable, each group is evaluated by Horner's rule
// in the other, and each group's value is multiplied once by its power of
// the first and added up (the generator groups by the variable that needs
// fewer multiplications, function by function, and says which in the
// function's comment). Region 3 builds each power once and sums the terms;
// region 5's twelve terms use a small power table filled by
// multiplication.
//
// The generator is gen.go (a program excluded from the build) with package
// internal/polygen, whose documentation describes the forms of the code;
// it reads the tables from coef.go. After changing a table, run
//
//	go generate ./plant/water
//
// (or go test ./plant/water -update, which does the same);
// TestGeneratedPolynomials fails while poly_gen.go is out of step.
//
// The coefficient tables are package-level arrays that are never written;
// there is no other package state. No function allocates on success.
// Process CPU time per call on the development machine (2 cores shared
// with other work, so that the wall clock is unreliable; medians of 10
// runs): h(p,T) of region 1 about 33 ns, all properties of region 1 about
// 94 ns and of region 2 about 126 ns (of which about a fifth is the
// logarithm of π, by a CPU profile), T(p,h) with refinement about 97 ns
// (region 1) and 119 ns (region 2), T_sat(p) about 13 ns, a wet state
// from (p,h) about 300 ns. Run the benchmarks with
//
//	go test -run '^$' -bench . -benchmem -cpu 1 ./plant/water/
//
// (they report cpu-ns/op beside the wall-clock ns/op).
package water

//go:generate go run gen.go
