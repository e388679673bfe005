package solver

import (
	"math"

	"gonum.org/v1/gonum/mat"
)

// maxSVDOrder is the largest order whose singular Jacobian the
// diagnosis decomposes (a dense SVD, O(n³) time and O(n²) memory, made
// only on failure); above it, a SingularError names the zero rows and
// columns only and says so.
const maxSVDOrder = 1000

// singularError names the unknowns and equations of a singular scaled
// Jacobian: zero columns and rows first, then the unknowns and equations
// carrying the right and left singular vectors of the singular values
// below σ_max/MaxCondition (at least the smallest one). An entry counts
// when its magnitude is at least a tenth of the vector's largest. This
// runs only on failure and allocates (with a Pattern, a dense copy of the
// Jacobian up to order maxSVDOrder).
func (s *Solver) singularError(it int, cond float64) *SingularError {
	e := &SingularError{Iter: it, Cond: cond}
	n := s.n
	at := func(i, j int) float64 { return s.jac.At(i, j) }
	if s.sj != nil {
		at = s.sj.At
	}
	maxAbs := 0.0
	colMax := make([]float64, n)
	rowMax := make([]float64, n)
	if s.sj != nil {
		for i := 0; i < n; i++ {
			cols, vals := s.sj.Row(i)
			for k, j := range cols {
				a := math.Abs(vals[k])
				maxAbs = math.Max(maxAbs, a)
				colMax[j] = math.Max(colMax[j], a)
				rowMax[i] = math.Max(rowMax[i], a)
			}
		}
	} else {
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				a := math.Abs(at(i, j))
				maxAbs = math.Max(maxAbs, a)
				colMax[j] = math.Max(colMax[j], a)
				rowMax[i] = math.Max(rowMax[i], a)
			}
		}
	}
	tiny := maxAbs * 1e-14
	for j := 0; j < n; j++ {
		if !(colMax[j] > tiny) {
			e.ZeroUnknowns = append(e.ZeroUnknowns, s.p.varName(j))
		}
	}
	for i := 0; i < n; i++ {
		if !(rowMax[i] > tiny) {
			e.ZeroEquations = append(e.ZeroEquations, s.p.eqName(i))
		}
	}
	m := s.jac
	if s.sj != nil {
		if n > maxSVDOrder {
			e.NotDecomposed = true
			return e
		}
		m = mat.NewDense(n, n, nil)
		s.sj.DenseTo(m)
	}
	var svd mat.SVD
	if !svd.Factorize(m, mat.SVDFull) {
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
