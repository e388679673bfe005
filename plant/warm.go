package plant

// Start is a solved point of a plant kept to start later cases from: the
// unknowns of its last solution and the number of boilers that fired (where
// the firing rule's next decision starts). The zero value holds none.
//
// A plant starts each case from its last solution, and with the
// factorisation of the last case solved in the same firing configuration
// (solver.Settings.ChordStart); ColdStart forgets both. A job that solves
// many cases near one (an audit's samples about a day's nominal case)
// keeps that one's solution with SaveStart and gives it to each case with
// UseStart, which forgets the factorisations, so that every case starts
// from the same point, whatever was solved before it: its result then
// depends on its own inputs alone, not on the order of the cases.
type Start struct {
	x       []float64
	hint    int
	hintSet bool
}

// Held says whether st holds a solution.
func (st *Start) Held() bool { return st.x != nil }

// SaveStart keeps the plant's last solution in st (none if the plant has
// none: a cold start). st's storage is reused.
func (p *Plant) SaveStart(st *Start) {
	s := p.s
	if s == nil || s.last == nil {
		st.x, st.hintSet = nil, false
		return
	}
	st.x = append(st.x[:0], s.last...)
	st.hint, st.hintSet = s.hint, s.hintSet
}

// UseStart makes the plant's next case start from st, as if st's case had
// been the last one solved (but without its factorisation); a Start that holds none, or one of another
// layout of the plant (its description changed since), makes it start cold.
func (p *Plant) UseStart(st *Start) {
	s := p.s
	if s == nil {
		return
	}
	if st.x == nil || len(st.x) != s.prob.Dim {
		p.ColdStart()
		return
	}
	if s.last == nil {
		s.last = make([]float64, s.prob.Dim)
	}
	copy(s.last, st.x)
	s.hint, s.hintSet = st.hint, st.hintSet
	s.trend.reset()
	if s.lus != nil {
		s.lus.forget()
	}
}

// Predict sets st to base moved along the differences of dirs from base,
// dirs[j] weighted by w[j] (a linear prediction from solutions at nearby
// inputs: x = base + Σ w_j·(dirs_j − base)), each unknown kept within its
// bounds. The hint is base's. A direction that holds none, or whose hint
// differs from base's (another number of boilers fired), is left out.
func (p *Plant) Predict(st, base *Start, dirs []Start, w []float64) {
	s := p.s
	if base.x == nil || s == nil || len(base.x) != s.prob.Dim {
		st.x, st.hintSet = nil, false
		return
	}
	st.x = append(st.x[:0], base.x...)
	st.hint, st.hintSet = base.hint, base.hintSet
	for j := range dirs {
		d := &dirs[j]
		if d.x == nil || len(d.x) != len(base.x) || d.hint != base.hint || w[j] == 0 {
			continue
		}
		for i, v := range d.x {
			st.x[i] += w[j] * (v - base.x[i])
		}
	}
	lo, hi := s.asm.lo, s.asm.hi
	for i, v := range st.x {
		st.x[i] = min(max(v, lo[i]), hi[i])
	}
}
