// Package polygen writes poly_gen.go of package water: the polynomial sums
// of IAPWS-IF97 (regions 1, 2 and 3 and the backward equations of regions 1
// and 2) as straight-line Go code, generated from the coefficient tables in
// water's coef.go. It reads those tables from the source text (go/parser),
// so that coef.go stays the one place where a coefficient is written.
//
// Run it through go generate (the directive is in water's doc.go, the
// program in water's gen.go):
//
//	go generate ./plant/water
//
// Water's TestGeneratedPolynomials fails when poly_gen.go is not what
// Generate makes of coef.go; go test ./plant/water -update rewrites it as go
// generate does.
//
// # The forms of a generated sum
//
// A sum Σ n·a^I·b^J (and the weighted sums ΣI, ΣI(I-1), ΣJ, ΣJ(J-1) and
// ΣIJ that the derivatives of the free energies need) is written in one of
// three forms:
//
//   - Horner: the terms are grouped by the power of one variable (the outer
//     one); each group is a polynomial in the other variable (the inner
//     one), nested by Horner's rule with its lowest power factored out
//     (b^-9·(c0 + b^2·(c1 + b^6·(...)))), and the groups are nested in the
//     outer variable in the same way. Each weighted sum is its own nested
//     polynomial: the inner weights (J or J(J-1) when b is inner) are folded
//     into the inner coefficients, and the outer weights multiply a group's
//     value once.
//   - Groups: the groups are nested in the inner variable as in Horner;
//     each group is then multiplied once by its power of the outer variable
//     and added to the sums (with its outer weight), group by group. This
//     keeps the dependent chains short, where the nesting in the outer
//     variable makes one long chain per sum.
//   - Powers: every power of a and b that a term needs is built once, and
//     the terms are summed group by group of equal I.
//
// For Horner and Groups the generator writes the function both ways (a
// outer, b outer), counts the multiplications of each, powers included,
// and keeps the one with fewer; the generated comment gives both counts.
// In every form a power is built by one multiplication from two powers
// already at hand, in chains of about log2 of the exponent; a negative
// power costs one division (1/a or 1/b) and multiplications; math.Pow is
// never called. Which form each function takes is set in Specs, from the
// benchmarks of package water.
package polygen
