package plant

import (
	"context"
	"fmt"
	"math"

	"steamcase/solver"
)

// The firing rule: which oil-fired boilers fire, and how they share the
// demand.
//
// Exhaust-gas economisers first: if the plant has a dump condenser and the
// economisers cover the demand, no boiler fires and the surplus is dumped.
// Otherwise the boilers fire in the order they were declared: one while
// the demand is at most Options.UsableFraction of its MCR, more above
// that, sharing by Options.Sharing. The steam flows of the boilers and
// dump condensers are tied by N+D−1 dispatch equations (N boilers, D dump
// condensers) for the configuration being solved; the mass balance of the
// steam system closes the last degree of freedom, so all boilers and dump
// condensers must serve one steam system.

// Sharing is the rule by which firing boilers share the demand.
type Sharing int

// Sharing rules.
const (
	// EqualLoad runs every firing boiler at the same fraction of its limit
	// (its MCR times its max load: the same fraction of the MCR when no
	// max load is set).
	EqualLoad Sharing = iota
	// LeadLag runs the lead boiler (the first declared that fires) at
	// Options.LeadLoad of its MCR (or its limit, if lower) and shares the
	// rest equally among the others. When the others would go above their
	// limit, the case is solved again with equal sharing.
	LeadLag
	// LeastFuel chooses which boilers fire and how they share so that the
	// plant burns the least fuel (leastfuel.go); equal sharing by the
	// firing rule is the reference the saving is measured against.
	LeastFuel
)

func (s Sharing) String() string {
	switch s {
	case EqualLoad:
		return "equal load"
	case LeadLag:
		return "lead-lag"
	case LeastFuel:
		return "least fuel"
	}
	return fmt.Sprintf("Sharing(%d)", int(s))
}

// firing reports whether boiler b fires in the configuration being solved.
func (p *Plant) firing(b *Boiler) bool {
	s := p.s
	for i, x := range s.asm.roles.boilers {
		if x == b {
			return s.fire[i]
		}
	}
	return false
}

// assembleDispatch registers the dispatch equations and the shed level
// with its equation (priority.go), and ties the consumers that may be
// reduced to it.
func (s *session) assembleDispatch(a *assembly, comps []Component) {
	r := &a.roles
	s.fire = make([]bool, len(r.boilers))
	s.firingBuf = make([]*Boiler, 0, len(r.boilers))
	s.dispEqs = s.dispEqs[:0]
	s.shedIdx, s.shedEq = -1, -1
	n := len(r.boilers) + len(r.dumps) - 1
	if n < 0 {
		return
	}
	var deps []int
	for _, b := range r.boilers {
		deps = append(deps, b.steam.mIdx())
	}
	for _, d := range r.dumps {
		deps = append(deps, d.in.mIdx())
	}
	for k := 0; k < n; k++ {
		s.dispEqs = append(s.dispEqs, a.equation(fmt.Sprintf("dispatch: steam sharing %d of %d", k+1, n), 1, deps...))
	}
	s.shedIdx = a.variable("shed level (priorities)", 1, 0, 1, 0)
	s.shedEq = a.equation("dispatch: boilers at their limit, or nothing shed", 1, append(deps, s.shedIdx)...)
	for _, c := range comps {
		if sh, ok := c.(shedder); ok {
			sh.shedLink(a, s.shedIdx)
			s.shedders = append(s.shedders, sh)
		}
	}
}

// dispatchResidual writes the dispatch equations for the current firing
// set, and the shed equation.
func (p *Plant) dispatchResidual(x, r []float64) {
	s := p.s
	if s.shedEq < 0 {
		return
	}
	k := 0
	put := func(v float64) {
		r[s.dispEqs[k]] = v
		k++
	}
	roles := &s.asm.roles
	firing := s.firingBuf[:0]
	for i, b := range roles.boilers {
		if s.fire[i] {
			firing = append(firing, b)
		} else {
			put(x[b.steam.mIdx()])
		}
	}
	L := x[s.shedIdx]
	if len(firing) == 0 {
		// The first dump condenser takes what the steam system has over;
		// without one the shed level has nothing to answer to.
		for _, d := range roles.dumps[1:] {
			put(x[d.in.mIdx()])
		}
		if len(roles.dumps) == 0 || s.noShed || s.nRanks == 0 {
			r[s.shedEq] = L
			return
		}
		r[s.shedEq] = math.Min(L, x[roles.dumps[0].in.mIdx()])
		return
	}
	for _, d := range roles.dumps {
		put(x[d.in.mIdx()])
	}
	load := func(b *Boiler) float64 { return x[b.steam.mIdx()] / b.Limit() }
	switch {
	case s.shares != nil:
		var total float64
		for _, b := range firing {
			total += x[b.steam.mIdx()]
		}
		for _, b := range firing[1:] {
			put(x[b.steam.mIdx()] - s.shares[s.boilerIndex(b)]*total)
		}
	case p.Opt.Sharing == LeadLag && !s.equalShare && len(firing) >= 2:
		lead := firing[0]
		put(x[lead.steam.mIdx()] - math.Min(p.Opt.LeadLoad*lead.MCR, lead.Limit()))
		for _, b := range firing[2:] {
			put((load(b) - load(firing[1])) * firing[1].Limit())
		}
	default:
		for _, b := range firing[1:] {
			put((load(b) - load(firing[0])) * firing[0].Limit())
		}
	}
	if s.noShed || s.nRanks == 0 {
		r[s.shedEq] = L
		return
	}
	var lim, steam float64
	for _, b := range firing {
		lim += b.Limit()
		steam += x[b.steam.mIdx()]
	}
	r[s.shedEq] = math.Min(L, (lim-steam)/lim)
}

// boilerIndex is b's index among the plant's boilers.
func (s *session) boilerIndex(b *Boiler) int {
	for i, x := range s.asm.roles.boilers {
		if x == b {
			return i
		}
	}
	panic("plant: boilerIndex: not a boiler of the plant")
}

// dispatchJacobian writes the derivatives of the dispatch equations (see
// dispatchResidual), all linear in the steam flows but the shed equation,
// whose derivative is that of the smaller side.
func (p *Plant) dispatchJacobian(j jac) {
	s := p.s
	if s.shedEq < 0 {
		return
	}
	x := s.ev.x
	k := 0
	next := func() int { k++; return s.dispEqs[k-1] }
	roles := &s.asm.roles
	firing := s.firingBuf[:0]
	for i, b := range roles.boilers {
		if s.fire[i] {
			firing = append(firing, b)
		} else {
			j.add(next(), b.steam.mIdx(), 1)
		}
	}
	L := x[s.shedIdx]
	if len(firing) == 0 {
		for _, d := range roles.dumps[1:] {
			j.add(next(), d.in.mIdx(), 1)
		}
		if len(roles.dumps) == 0 || s.noShed || s.nRanks == 0 || L <= x[roles.dumps[0].in.mIdx()] {
			j.add(s.shedEq, s.shedIdx, 1)
			return
		}
		j.add(s.shedEq, roles.dumps[0].in.mIdx(), 1)
		return
	}
	for _, d := range roles.dumps {
		j.add(next(), d.in.mIdx(), 1)
	}
	// (load(b) − load(ref))·ref.Limit
	share := func(b, ref *Boiler) {
		row := next()
		j.add(row, b.steam.mIdx(), ref.Limit()/b.Limit())
		j.add(row, ref.steam.mIdx(), -1)
	}
	switch {
	case s.shares != nil:
		for _, b := range firing[1:] {
			row := next()
			sh := s.shares[s.boilerIndex(b)]
			for _, c := range firing {
				d := -sh
				if c == b {
					d += 1
				}
				j.add(row, c.steam.mIdx(), d)
			}
		}
	case p.Opt.Sharing == LeadLag && !s.equalShare && len(firing) >= 2:
		j.add(next(), firing[0].steam.mIdx(), 1)
		for _, b := range firing[2:] {
			share(b, firing[1])
		}
	default:
		for _, b := range firing[1:] {
			share(b, firing[0])
		}
	}
	if s.noShed || s.nRanks == 0 {
		j.add(s.shedEq, s.shedIdx, 1)
		return
	}
	var lim, steam float64
	for _, b := range firing {
		lim += b.Limit()
		steam += x[b.steam.mIdx()]
	}
	if L <= (lim-steam)/lim {
		j.add(s.shedEq, s.shedIdx, 1)
		return
	}
	for _, b := range firing {
		j.add(s.shedEq, b.steam.mIdx(), -1/lim)
	}
}

// decide finds how many boilers must fire: none if the steam system has a
// dump condenser and the exhaust-gas economisers leave steam over without
// them; else the fewest, in declaration order, whose demand stays within
// UsableFraction of their MCR; else all.
//
// It starts from the number that fired in the plant's previous case (a
// voyage's hours rarely change it) and moves up while the demand does not
// fit, then down while fewer boilers would do. A step down is only tried
// when it could succeed: one boiler fewer only if the demand is within 5 %
// of what the fewer could carry (the demand hardly depends on how many
// boilers share it: only consumers driven by the boilers' fuel flow change
// with it), and no boiler at all only if the boilers raise no more than
// those fuel-driven consumers take. Without a previous case it starts from
// none (or one) and moves up, as the rule reads.
func (p *Plant) decide(ctx context.Context, fire []bool) error {
	s := p.s
	n := len(s.asm.roles.boilers)
	try0 := len(s.asm.roles.dumps) > 0 && p.egeHeat() > 0
	if n == 0 {
		return p.solveConfig(ctx, fire)
	}
	lowest := 1
	if try0 {
		lowest = 0
	}
	k := lowest
	hinted := s.hintSet && s.hint > lowest && s.hint <= n
	if hinted {
		k = s.hint
	}
	// Up: the first k from the start that fits.
	for {
		ok, err := p.fits(ctx, fire, k)
		if err != nil && hinted && ctx.Err() == nil {
			// The last case's number does not solve here (the economisers
			// now leave steam over, say): scan from the bottom instead.
			k, hinted = lowest, false
			continue
		}
		// A trial with fewer boilers than the demand needs may fail where
		// it takes a boiler beyond its model's range (a flue-gas table's
		// loss account ends at 120 % of MCR): it does not fit. With every
		// boiler firing, the error is the case's.
		if err != nil && (k == n || ctx.Err() != nil) {
			return err
		}
		if ok {
			break
		}
		k++
	}
	// Down: while one boiler fewer would do.
	for k > lowest && p.mayFit(k-1) {
		s.keep()
		ok, err := p.fits(ctx, fire, k-1)
		if ctx.Err() != nil {
			return ctx.Err()
		}
		if err == nil && ok {
			k--
			continue
		}
		s.restore(fire, k)
		break
	}
	s.hint, s.hintSet = k, true
	return nil
}

// fits solves the plant with the first k boilers firing and says whether
// the firing rule accepts it.
func (p *Plant) fits(ctx context.Context, fire []bool, k int) (bool, error) {
	for i := range fire {
		fire[i] = i < k
	}
	if err := p.solveConfig(ctx, fire); err != nil {
		return false, err
	}
	if k == 0 {
		return p.dumpFlow() >= 0 && !p.shedding(), nil
	}
	if k == len(p.s.asm.roles.boilers) {
		return true, nil
	}
	if p.shedding() {
		return false, nil
	}
	demand, usable := p.firedDemand(k)
	return demand <= usable*(1+1e-12), nil
}

// usable is the steam boiler b may raise before the next must fire:
// Options.UsableFraction of its MCR, or its limit if that is lower.
func (p *Plant) usable(b *Boiler) float64 {
	return math.Min(p.Opt.UsableFraction*b.MCR, b.Limit())
}

// firedDemand is the steam of the first k boilers at the last solution
// and what they may raise before the next must fire (usable).
func (p *Plant) firedDemand(k int) (demand, usable float64) {
	s := p.s
	for _, b := range s.asm.roles.boilers[:k] {
		demand += s.last[b.steam.mIdx()]
		usable += p.usable(b)
	}
	return demand, usable
}

// mayFit says whether j boilers could carry the demand of the present
// solution (see decide).
func (p *Plant) mayFit(j int) bool {
	s := p.s
	k := j + 1
	demand, _ := p.firedDemand(k)
	if j == 0 {
		var coupled float64
		for _, idx := range s.asm.roles.fuelDriven {
			coupled += s.last[idx]
		}
		return demand <= 1.1*coupled+1e-6
	}
	_, usable := p.firedDemand(j)
	return demand <= 1.05*usable
}

// keep saves the last solution before a trial that may be refused.
func (s *session) keep() {
	if len(s.keepX) != len(s.last) {
		s.keepX = make([]float64, len(s.last))
	}
	copy(s.keepX, s.last)
	s.keepRes = s.slvRes
	s.keepSolves = s.solves
	s.keepNoShed = s.noShed
}

// restore brings back the solution kept before a refused trial, with k
// boilers firing.
func (s *session) restore(fire []bool, k int) {
	copy(s.last, s.keepX)
	s.slvRes = s.keepRes
	s.noShed = s.keepNoShed
	s.solves++
	for i := range fire {
		fire[i] = i < k
	}
	copy(s.fire, fire)
}

// egeHeat is the heat the exhaust-gas economisers take from the exhaust in
// the present case, W.
func (p *Plant) egeHeat() float64 {
	var q float64
	for _, e := range p.s.asm.roles.eges {
		q += e.op.gas.q
	}
	return q
}

func (p *Plant) dumpFlow() float64 {
	var m float64
	for _, d := range p.s.asm.roles.dumps {
		m += p.s.last[d.in.mIdx()]
	}
	return m
}

// stallWatch stops a solve early when the configuration it solves has no
// solution, so that the firing rule moves on to the next instead of
// spending the solver's iteration limit. Two signs are taken:
//
//   - A firing boiler would have to make less than no steam (the
//     economisers, or the boilers before it, leave steam over): the
//     solver holds that boiler's steam flow on its bound of zero, every
//     step is cut there, and the residual falls by a few per cent an
//     iteration. The watch stops once a firing boiler's steam has sat at
//     zero for stallIterations iterations in a row while the residual fell
//     by less than half each time.
//   - No progress: stallDamped damped steps in a row (line-search length
//     below 1) that together lowered the residual norm by less than
//     stallProgress. The line search is then shrinking its steps towards a
//     point where the balance cannot close (a local minimum of the
//     residual), and would go on until the step met the solver's XTol.
//
// A solve that only passes through zero, or is slow but moving, is not
// stopped: its residual falls faster, or it leaves the bound. Where no
// configuration solves, the case fails as it would have at the limit.
type stallWatch struct {
	p    *Plant
	next solver.Recorder // the caller's own recorder, if any
	run  int             // iterations in a row at zero
	last float64         // the residual norm of the last iteration

	damped int     // damped steps in a row without progress
	ref    float64 // the residual norm before them
}

// stallIterations, stallDamped and stallProgress are the watch's limits
// (common practice, no source: a Newton solve that converges moves the
// residual by orders of magnitude in that many iterations).
const (
	stallIterations = 5
	stallDamped     = 8
	stallProgress   = 0.01
)

func (w *stallWatch) Record(it solver.Iteration) error {
	if it.Iter == 0 || it.Iter == 1 && !it.Reused {
		w.run, w.last = 0, math.Inf(1)
		w.damped, w.ref = 0, math.Inf(1)
	}
	if s := w.p.s; s != nil {
		var stuck *Boiler
		for i, b := range s.asm.roles.boilers {
			if s.fire[i] && it.X[b.steam.mIdx()] <= 0 {
				stuck = b
				break
			}
		}
		if stuck != nil && it.ResidualNorm > 0.5*w.last {
			w.run++
		} else {
			w.run = 0
		}
		w.last = it.ResidualNorm
		if w.run >= stallIterations {
			return &firedAtZeroError{Boiler: stuck.Name, Firing: countTrue(s.fire)}
		}
		if it.Alpha < 1 && it.ResidualNorm > (1-stallProgress)*w.ref {
			w.damped++
		} else {
			w.damped, w.ref = 0, it.ResidualNorm
		}
		if w.damped >= stallDamped {
			return &noProgressError{Firing: countTrue(s.fire), Norm: it.ResidualNorm}
		}
	}
	if w.next != nil {
		return w.next.Record(it)
	}
	return nil
}

// noProgressError says that a configuration's solve stopped making
// progress: its balance does not close from where the solve went.
type noProgressError struct {
	Firing int
	Norm   float64
}

func (e *noProgressError) Error() string {
	return fmt.Sprintf("with %d boiler(s) firing, the balance stopped closing: %d damped steps in a row lowered the scaled residual (%.3g) by less than %g %%",
		e.Firing, stallDamped, e.Norm, 100*stallProgress)
}

func countTrue(b []bool) int {
	n := 0
	for _, v := range b {
		if v {
			n++
		}
	}
	return n
}

// firedAtZeroError says that a configuration has no solution because a
// firing boiler would have to make less than no steam.
type firedAtZeroError struct {
	Boiler string
	Firing int
}

func (e *firedAtZeroError) Error() string {
	return fmt.Sprintf("with %d boiler(s) firing, boiler %q would have to make less than no steam: the rest of the plant leaves steam over", e.Firing, e.Boiler)
}
