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
// two forms:
//
//   - Horner (regions 1 and 2, forward and backward): the terms are grouped
//     by the power of one variable, the outer one. Each group is a
//     polynomial in the other, inner, variable, evaluated by Horner's rule
//     with its lowest power factored out, b^-9·(c0 + b^2·(c1 + b·(...)));
//     where two exponents of a group are more than innerMaxGap (4) apart,
//     the group is split there into runs, each nested on its own and
//     added, so that a large step costs the power of its own term rather
//     than a long chain. Each group is then multiplied once by its power of
//     the outer variable and added to the sums, with its outer weight (I or
//     I(I-1) when a is outer); the inner weights are folded into the inner
//     coefficients, so each weighted sum of a group is its own nested
//     polynomial. The generator writes the function with a outer and with b
//     outer, counts the multiplications of each, powers included, and keeps
//     the one with fewer; the generated comment gives both counts.
//   - Powers (region 3): every power of a and b that a term needs is built
//     once, and the terms are summed group by group of equal I.
//
// In both forms a power is built by one multiplication from two powers
// already at hand, in chains of about log2 of the exponent; a negative
// power costs one division (1/a or 1/b) and multiplications; math.Pow is
// never called. Which form each function takes is set in Specs.
//
// Two other nested forms were measured and not kept (benchmarks of the
// single kernels, process CPU time, on the development machine): nesting
// the groups in the outer variable as well (one nested polynomial per sum)
// took longer than the Powers form on 16 of the 18 kernels of regions 1
// and 2, up to 79 % (region 2, all sums), and nesting each group across
// every step of its exponents took up to 15 % longer on some (region 1
// T(p,s)), both because of their long chains of dependent operations.
package polygen
