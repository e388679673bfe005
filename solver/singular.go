package solver

import (
	"math"

	"gonum.org/v1/gonum/mat"
)

// singularError names the unknowns and equations of a singular scaled
// Jacobian (in s.jac): zero columns and rows first, then the unknowns and
// equations carrying the right and left singular vectors of the singular
// values below σ_max/MaxCondition (at least the smallest one). An entry
// counts when its magnitude is at least a tenth of the vector's largest.
// This runs only on failure and allocates.
func (s *Solver) singularError(it int, cond float64) *SingularError {
	e := &SingularError{Iter: it, Cond: cond}
	n := s.n
	maxAbs := 0.0
	for i := 0; i < n; i++ {
		for j := 0; j < n; j++ {
			maxAbs = math.Max(maxAbs, math.Abs(s.jac.At(i, j)))
		}
	}
	tiny := maxAbs * 1e-14
	for j := 0; j < n; j++ {
		zero := true
		for i := 0; i < n; i++ {
			if math.Abs(s.jac.At(i, j)) > tiny {
				zero = false
				break
			}
		}
		if zero {
			e.ZeroUnknowns = append(e.ZeroUnknowns, s.p.varName(j))
		}
	}
	for i := 0; i < n; i++ {
		zero := true
		for j := 0; j < n; j++ {
			if math.Abs(s.jac.At(i, j)) > tiny {
				zero = false
				break
			}
		}
		if zero {
			e.ZeroEquations = append(e.ZeroEquations, s.p.eqName(i))
		}
	}
	var svd mat.SVD
	if !svd.Factorize(s.jac, mat.SVDFull) {
		return e
	}
	sv := svd.Values(nil)
	var u, v mat.Dense
	svd.UTo(&u)
	svd.VTo(&v)
	limit := sv[0] / s.set.MaxCondition
	inU := make([]bool, n)
	inV := make([]bool, n)
	for k := n - 1; k >= 0; k-- {
		if k < n-1 && sv[k] > limit {
			break
		}
		mark(inV, v.ColView(k))
		mark(inU, u.ColView(k))
	}
	for j, in := range inV {
		if in {
			e.Unknowns = append(e.Unknowns, s.p.varName(j))
		}
	}
	for i, in := range inU {
		if in {
			e.Equations = append(e.Equations, s.p.eqName(i))
		}
	}
	return e
}

// mark sets in[i] for the entries of vec at least a tenth of its largest.
func mark(in []bool, vec mat.Vector) {
	m := 0.0
	for i := 0; i < vec.Len(); i++ {
		m = math.Max(m, math.Abs(vec.AtVec(i)))
	}
	for i := 0; i < vec.Len(); i++ {
		if math.Abs(vec.AtVec(i)) >= 0.1*m {
			in[i] = true
		}
	}
}
