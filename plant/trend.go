package plant

import (
	"math"
	"slices"
)

// trend gives a case the warm start its inputs' trend predicts: when the
// last two cases differ from this one only in the values of the same
// settings and surroundings (consecutive hours of a voyage, the steps of a
// sweep), and the same number of boilers fired in both, the case starts
// from the last solution moved along the step between the last two by
// the share of that step the inputs take again: x₀ = x_k + w·(x_k −
// x_{k−1}), w = (u − u_k)·(u_k − u_{k−1}) / |u_k − u_{k−1}|², with the
// inputs u scaled (temperatures by 10 K, the engine load by 0.1, each
// setting by its own size, at least 1), used for 0 < w ≤ 2 and kept within
// the unknowns' bounds. A linear trend is then followed to second order,
// and Newton's method starts nearer its root: over the demo tanker's year
// of hourly rows with discharges (scenarios' BenchmarkDemoTankerYear) the
// residual evaluations fell from 49584 to 35189 and the factorisations
// from 10852 to 10777. A start that
// does not converge is replaced by the last solution, then by the plant's
// guess (solveConfig), so the trend changes where the solver starts,
// never what it may find: the results move within the solver's
// tolerance.
type trend struct {
	// in0 and set0 are the inputs and settings of the last case, in1 and
	// set1 of the one before (haveIn: in0 is held); x1 is the solution of
	// the one before, hint1 its number of boilers firing, and ok says that
	// x1, in1 and in0 are of the two cases before the next.
	in0, in1   []float64
	set0, set1 []Setting
	fire0      []string
	fire1      []string
	x1         []float64
	hint1      int
	ok, haveIn bool
	// The next case's inputs, and its predicted start (usePred: to be
	// used by the case's first solve).
	cur     []float64
	pred    []float64
	usePred bool
}

// reset forgets the history: the next case starts from the last solution
// or cold, as the plant has it.
func (t *trend) reset() { t.ok, t.haveIn, t.usePred = false, false, false }

// caseInputs writes the inputs of c into dst: the surroundings, then the
// settings' values (see trend).
func caseInputs(dst []float64, c *Case) []float64 {
	cd := c.Conditions
	dst = append(dst[:0], cd.SeaT, cd.AirT, cd.EngineLoad, cd.Period)
	for _, s := range c.Set {
		dst = append(dst, s.Value)
	}
	return dst
}

// inputScale is the size by which input i of a case is compared (see
// trend): 10 K for the temperatures, 0.1 for the engine load, an hour for
// the period, and a setting's value in the last case (at least 1).
func inputScale(i int, last float64) float64 {
	switch i {
	case 0, 1:
		return 10
	case 2:
		return 0.1
	case 3:
		return 3600
	}
	return math.Max(math.Abs(last), 1)
}

// sameKeys says whether a and b set the same keys of the same units in
// the same order, with the same texts.
func sameKeys(a, b []Setting) bool {
	return slices.EqualFunc(a, b, func(x, y Setting) bool {
		return x.Unit == y.Unit && x.Param == y.Param && x.Text == y.Text
	})
}

// sameFire says whether two cases force the same boilers to fire (or
// neither forces any: nil).
func sameFire(a, b []string) bool { return (a == nil) == (b == nil) && slices.Equal(a, b) }

// trendBegin is called as a case's solve begins, with the last case's
// solution in s.last: it predicts the case's warm start, and moves the
// history on by the case.
func (s *session) trendBegin(c *Case) {
	t := &s.trend
	t.usePred = false
	t.cur = caseInputs(t.cur, c)
	in := t.cur
	if s.last != nil && t.ok && t.hint1 == s.hint && sameKeys(c.Set, t.set0) && sameKeys(t.set0, t.set1) &&
		sameFire(c.Fire, t.fire0) && sameFire(t.fire0, t.fire1) {
		var num, den float64
		for i := range in {
			sc := inputScale(i, t.in0[i])
			a, b := (in[i]-t.in0[i])/sc, (t.in0[i]-t.in1[i])/sc
			num += a * b
			den += b * b
		}
		if w := num / den; den > 0 && w > 0 && w <= 2 {
			t.pred = append(t.pred[:0], s.last...)
			lo, hi := s.asm.lo, s.asm.hi
			for i, v := range t.pred {
				t.pred[i] = min(max(v+w*(v-t.x1[i]), lo[i]), hi[i])
			}
			t.usePred = true
		}
	}
	t.ok = false
	if s.last != nil {
		t.x1 = append(t.x1[:0], s.last...)
		t.hint1 = s.hint
		t.ok = t.haveIn
	}
	t.in1, t.in0 = t.in0, t.in1
	t.in0 = append(t.in0[:0], in...)
	t.set1, t.set0 = t.set0, t.set1
	t.set0 = append(t.set0[:0], c.Set...)
	t.fire1, t.fire0 = t.fire0, t.fire1
	switch {
	case c.Fire == nil:
		t.fire0 = nil
	case t.fire0 == nil:
		t.fire0 = slices.Clone(c.Fire)
	default:
		t.fire0 = append(t.fire0[:0], c.Fire...)
	}
	t.haveIn = true
}
