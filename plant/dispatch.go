package plant

import "fmt"

// dispatchState says which oil-fired boilers fire in the configuration
// being solved. The steam flows of the boilers and dump condensers are
// tied by N+D−1 dispatch equations (N boilers, D dump condensers); the
// mass balance of the steam system closes the last degree of freedom.
// All boilers and dump condensers must therefore serve one steam system.
type dispatchState struct {
	fire []bool // per boiler of Plant.boilers
	pl   *Plant
	buf  []*Boiler // scratch for the firing list
}

func (d *dispatchState) firing(b *Boiler) bool {
	for i, x := range d.pl.boilers {
		if x == b {
			return d.fire[i]
		}
	}
	return false
}

func (d *dispatchState) count() int {
	n := 0
	for _, f := range d.fire {
		if f {
			n++
		}
	}
	return n
}

// assembleDispatch registers the dispatch equations.
func (p *Plant) assembleDispatch(a *assembly) {
	p.disp = dispatchState{fire: make([]bool, len(p.boilers)), pl: p, buf: make([]*Boiler, 0, len(p.boilers))}
	p.dispEqs = p.dispEqs[:0]
	n := len(p.boilers) + len(p.dumps) - 1
	if n <= 0 {
		return
	}
	var deps []int
	for _, b := range p.boilers {
		deps = append(deps, b.steam.mIdx())
	}
	for _, d := range p.dumps {
		deps = append(deps, d.in.mIdx())
	}
	for k := 0; k < n; k++ {
		p.dispEqs = append(p.dispEqs, a.equation(fmt.Sprintf("dispatch: steam sharing %d of %d", k+1, n), 1, deps...))
	}
}

// dispatchResidual writes the dispatch equations for the current firing
// set.
func (p *Plant) dispatchResidual(x, r []float64) {
	if len(p.dispEqs) == 0 {
		return
	}
	k := 0
	put := func(v float64) {
		r[p.dispEqs[k]] = v
		k++
	}
	firing := p.disp.buf[:0]
	for i, b := range p.boilers {
		if p.disp.fire[i] {
			firing = append(firing, b)
		} else {
			put(x[b.steam.mIdx()])
		}
	}
	if len(firing) == 0 {
		// The first dump condenser takes what the steam system has over.
		for _, d := range p.dumps[1:] {
			put(x[d.in.mIdx()])
		}
		return
	}
	for _, d := range p.dumps {
		put(x[d.in.mIdx()])
	}
	load := func(b *Boiler) float64 { return x[b.steam.mIdx()] / b.MCR }
	switch {
	case p.Opt.Sharing == LeadLag && len(firing) >= 2:
		lead := firing[0]
		put(x[lead.steam.mIdx()] - p.Opt.LeadLoad*lead.MCR)
		for _, b := range firing[2:] {
			put((load(b) - load(firing[1])) * firing[1].MCR)
		}
	default:
		for _, b := range firing[1:] {
			put((load(b) - load(firing[0])) * firing[0].MCR)
		}
	}
}
