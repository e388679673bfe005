package plant

import (
	"fmt"
	"math"

	"steamcase/solver"
)

// The plant's analytic Jacobian, and the difference helpers the
// components share. Every component writes the partial derivatives of its
// own equations (its rows) with respect to the unknowns its pattern lists,
// in its own file; the dispatch equations add theirs (firing.go). The solver zeroes the matrix
// before each call, and every entry is added (+=), so a line that a unit
// sees twice (a header feeding itself) comes out right.
//
// What is exact and what is differenced:
//   - Everything linear or bilinear in the line unknowns (m, p, h), the
//     vented and drained flows and the fuel flows is differentiated by hand.
//   - The derivative of a water property (h(p,T), T(p,h), v(p,h), h at
//     saturation, condensate h(p) at a set subcooling) is a forward
//     difference of that scalar property function alone, from the value
//     the unit's memo holds, with a step of propRel relative to the
//     argument (dProp1, dProp2); a backward one where the forward step
//     leaves the property's range. (Central differences cost twice the
//     property calls for no gain a Newton step can use.)
//   - The turbine's isentropic exhaust enthalpy h_s(p_out, s(p_in, h_in))
//     is differentiated by the chain rule over differences of s(p, h) and
//     h(p, s), as any water property: the Gibbs relation dh = T·ds + v·dp
//     holds for the IF97 functions only to about 1e-6 relative (their
//     saturation line and regions agree to that order), which a check at
//     1e-6 sees at a condenser's vacuum.
//   - A boiler's efficiency from a maker's table (EfficiencyTable) is
//     differentiated along the active segment. Any other efficiency model
//     (flue-gas table, furnace model) and the flue-gas economiser's duty are
//     not cheap to differentiate: their terms are one-sided (forward, else
//     backward) differences of the unit's own function over the columns of
//     its pattern (unitFD), with the step the solver's own differences use.
//     A boiler with a flue-gas economiser has its efficiency differenced by
//     the economiser, in the same evaluations as the duty.
//   - The exhaust-gas economiser's gas side is fixed for the case, so its
//     rows are exact.
//   - At non-smooth points the derivative is that of the active branch, as
//     the residual chose it: the feed tank's mix / heating set point /
//     saturation switch, heating or venting, a boiler cycling below its
//     burner minimum (unitFD keeps the step on the side of the branch). A
//     state exactly on a phase boundary (a venting feed tank delivers
//     saturated water to the pump) takes the side a forward step reaches.
//
// After its first call the Jacobian allocates nothing, apart from what a
// combustion efficiency model allocates in its own evaluations.

// propRel is the relative step of the differences of water properties:
// 1e-7, a little above √ε. A forward difference's rounding error is the
// function's own noise over the step, and an IF97 property computed
// through a backward equation (the condensate enthalpy h(p, T_sat(p) −
// ΔT) at 0.2 bar(a)) carries noise of some tens of ulps, not one: at the
// step √ε·p its forward difference scatters by about 1e-6 relative
// (measured at 0.19-0.21 bar(a) with steps of 1e-4 to 1 Pa), at 1e-7·p by
// under 2e-7, while the truncation error stays near 1e-7 relative
// (checked by TestJacobianAgainstFiniteDifferences against central
// differences).
const propRel = 1e-7

// fdRel is the relative step of the one-sided differences of a unit's own
// function (unitFD): √ε, as the solver takes for its own differences.
const fdRel = 1.4901161193847656e-08

// jacobian is the solver's Problem.SparseJacobian: the plant's Jacobian
// is held on its pattern alone, so nothing of size unknowns² is kept.
func (p *Plant) jacobian(j *solver.Sparse, x []float64) error {
	ev := &p.s.ev
	ev.x = x
	a := p.s.jac
	a.start(j)
	for _, c := range p.comps {
		if err := c.jacobian(ev, a); err != nil {
			return domainErr{err}
		}
	}
	p.dispatchJacobian(a)
	return a.finish()
}

// jac is where the components add their partial derivatives: the
// solver's Jacobian storage. Components only call add, so the storage can
// change here alone.
//
// The entries are those of the solver's Sparse, found by their place in
// its rows. Finding one costs a binary search, so jac remembers the place
// of each add by its rank in the sequence of calls: the components add
// their entries in the same order at every call, except where a branch
// (a boiler cycling or firing, a feed tank venting) writes other entries,
// and there the remembered places are replaced as the calls differ. A
// remembered place is used only when its row and column match, so the
// entries written are always the ones named.
type jac struct{ *jacCursor }

type jacCursor struct {
	sp   *solver.Sparse
	val  []float64
	key  []uint64 // key[k]: row<<32 | col of the k-th add of the last call
	pos  []int32  // pos[k]: its place in val
	k    int
	miss error // the first entry outside the pattern
}

func newJac() jac { return jac{&jacCursor{}} }

func (c *jacCursor) start(sp *solver.Sparse) {
	if c.sp != sp {
		c.key, c.pos = c.key[:0], c.pos[:0]
	}
	c.sp, c.val, c.k, c.miss = sp, sp.Values(), 0, nil
}

func (c *jacCursor) finish() error {
	if c.miss != nil {
		return c.miss
	}
	return nil
}

// add adds v to entry (row, col); a negative row or column (an equation or
// unknown that the unit does not have) is skipped. An entry outside the
// plant's pattern (a unit's jacobian writing where its pattern says
// nothing) is not written: the call returns an error naming it.
func (a jac) add(row, col int, v float64) {
	if row < 0 || col < 0 {
		return
	}
	c := a.jacCursor
	key := uint64(row)<<32 | uint64(col)
	k := c.k
	c.k++
	if k < len(c.key) && c.key[k] == key {
		c.val[c.pos[k]] += v
		return
	}
	at := c.sp.Index(row, col)
	if at < 0 {
		if c.miss == nil {
			c.miss = fmt.Errorf("internal error: the Jacobian entry (%d, %d) is outside the plant's pattern", row, col)
		}
		return
	}
	if k < len(c.key) {
		c.key[k], c.pos[k] = key, int32(at)
	} else {
		c.key = append(c.key, key)
		c.pos = append(c.pos, int32(at))
	}
	c.val[at] += v
}

func propStep(a float64) float64 {
	if h := propRel * math.Abs(a); h > 0 {
		return h
	}
	return propRel
}

// dProp1 is df/da by a forward difference of f alone from its value f0 at
// a (which the unit's memo holds from the residual), or a backward one
// where the forward step leaves the property's range.
func dProp1(f func(float64) (float64, error), a, f0 float64) (float64, error) {
	h := propStep(a)
	ap := a + h
	fp, err := f(ap)
	if err == nil {
		return (fp - f0) / (ap - a), nil
	}
	am := a - h
	fm, err2 := f(am)
	if err2 == nil {
		return (f0 - fm) / (a - am), nil
	}
	return 0, err
}

// dPropA is ∂f(a, b)/∂a by a one-sided difference of f alone, as dProp1.
func dPropA(f func(a, b float64) (float64, error), a, b, f0 float64) (float64, error) {
	return dProp1(func(x float64) (float64, error) { return f(x, b) }, a, f0)
}

// centralRel is the relative step of dPropCentralA: ε^(1/3), the step of
// a central difference whose rounding and truncation errors balance (near
// 1e-10 relative).
const centralRel = 6.0554544523933395e-06

// dPropCentralA is ∂f(a, b)/∂a by a central difference of f alone, for a
// property whose forward difference is not accurate enough; it costs two
// evaluations.
func dPropCentralA(f func(a, b float64) (float64, error), a, b float64) (float64, error) {
	h := centralRel * math.Abs(a)
	if h == 0 {
		h = centralRel
	}
	fp, err := f(a+h, b)
	if err != nil {
		return 0, err
	}
	fm, err := f(a-h, b)
	if err != nil {
		return 0, err
	}
	return (fp - fm) / (2 * h), nil
}

// dPropB is ∂f(a, b)/∂b by a one-sided difference of f alone, as dProp1.
func dPropB(f func(a, b float64) (float64, error), a, b, f0 float64) (float64, error) {
	return dProp1(func(x float64) (float64, error) { return f(a, x) }, b, f0)
}

// dProp2 returns both partial derivatives of f(a, b), as dProp1.
func dProp2(f func(a, b float64) (float64, error), a, b, f0 float64) (da, db float64, err error) {
	if da, err = dPropA(f, a, b, f0); err != nil {
		return 0, 0, err
	}
	db, err = dPropB(f, a, b, f0)
	return da, db, err
}

// unitFD is the derivative of a component's own function f (up to two values)
// with respect to the unknown col, by a forward difference (a backward one
// where the forward step leaves the bounds, the domain, or the branch the
// base point is on). f returns its values and a branch key; f0 and
// branch0 are those at the base point. ev.x is changed during the call and
// restored exactly.
func unitFD(ev *eval, col int, f0 [2]float64, branch0 int, f func() ([2]float64, int, error)) ([2]float64, error) {
	a := ev.pl.s.asm
	x := ev.x
	x0 := x[col]
	h := fdRel * math.Max(math.Abs(x0), a.xScale[col])
	var firstErr error
	for _, s := range [2]float64{h, -h} {
		xt := x0 + s
		if xt < a.lo[col] || xt > a.hi[col] {
			continue
		}
		x[col] = xt
		v, br, err := f()
		x[col] = x0
		if err != nil {
			if firstErr == nil {
				firstErr = err
			}
			continue
		}
		if br != branch0 {
			continue
		}
		d := xt - x0
		return [2]float64{(v[0] - f0[0]) / d, (v[1] - f0[1]) / d}, nil
	}
	if firstErr != nil {
		return [2]float64{}, firstErr
	}
	// Both sides change branch (a point exactly on a switch, or a step
	// across a narrow branch): the active branch is constant there.
	return [2]float64{}, nil
}
