package plant

import (
	"context"
	"fmt"
	"math"
	"sort"

	"steamcase/solver"
)

// Least-fuel sharing (Options.Sharing LeastFuel).
//
// The case is first solved by the firing rule with equal sharing: that is
// the reference the saving is measured against, and a candidate of its
// own. Then every set of boilers that may fire is considered (all the
// non-empty subsets: exact for the few boilers a ship has; the plant may
// have at most MaxLeastFuelBoilers), each with the split of the steam
// among its boilers bounded by
//
//   - the burner minimum (MCR/turndown) of each boiler when two or more
//     fire (a boiler that would cycle in a shared load is better off),
//     and no lower bound for a boiler firing alone (it may cycle, at its
//     cycling loss);
//   - the usable fraction of each boiler's MCR when fewer than all fire
//     (the margin the firing rule keeps before the next boiler), and each
//     boiler's limit (MCR times max load) when all fire;
//   - while cargo pumps run on a plant with inert-gas sources, a set must
//     hold a source, each source at least at the lowest load at which the
//     set's sources meet the inert-gas demand (inertgas.go), when some
//     set can; otherwise the inert gas is left to its own check.
//
// The split is an optimisation over the solved plant, because it moves
// the feed temperatures, the fuel-driven consumers and the economisers'
// duties. It is done in two layers. A surrogate gives each boiler's fuel
// at a steam flow m as m·q/(η(m/MCR)·LHV), with q the heat per kg of
// steam of the solved state (feed enthalpy, drum, blowdown) and η the
// boiler's own efficiency model (table, flue-gas table or physics) at
// that load, the solved feed and air; it is minimised over the split on a
// grid (41 points for two boilers, 21 × 21 for three, coordinate pairs
// from equal for more) refined by golden sections. The best set (and any
// other within 0.5 % of it by the surrogate) is then solved with the
// split as dispatch equations (each boiler's steam a share of the firing
// boilers' total); the surrogate is recalibrated on that solution (q and
// the total steam) and minimised again, and solved again if the split
// moved by more than 0.1 % of the total: at most two solves per set.
// Every figure reported comes from a solve; the fuel of the answer is the
// least of the solved candidates and of the equal-sharing reference (a
// candidate must save more than 1e-7 of the fuel, the solver's tolerance,
// to replace it), so least fuel never burns more than equal sharing.
//
// When is equal sharing the least fuel? For boilers of the same MCR and
// efficiency curve η(l) firing together, the equal split is the least
// fuel where each boiler's fuel f(l) ∝ l/η(l) is convex over the loads
// the split can reach, that is where
//
//	l·η·η″ + 2·η′·(η − l·η′) ≤ 0:
//
// always where η falls with load and is concave, and where η still rises
// only if it is concave enough, η″ ≤ −2·η′·(η − l·η′)/(l·η). A maker's
// table interpolated linearly has η″ = 0 between its points, so on a
// rising segment f is concave and an unequal split (one boiler nearer the
// table's best point) burns less: the saving the report shows then comes
// from the table's shape and is no better than the table.

// MaxLeastFuelBoilers is the most oil-fired boilers a plant may have for
// least-fuel sharing: it enumerates every set of them.
const MaxLeastFuelBoilers = 4

// LeastFuelResult is what least-fuel sharing chose against equal sharing.
type LeastFuelResult struct {
	// EqualFuelKgS is the fuel of the case with equal sharing by the
	// firing rule, FuelKgS that of the answer, SavedKgS their difference.
	EqualFuelKgS, FuelKgS, SavedKgS float64
	// Firing names the boilers of the answer; Shares their shares of its
	// steam.
	Firing []string
	Shares []float64
	// Solves counts the solves the search took beyond the reference.
	Solves int
	// Note says when the search did not run (the case is short).
	Note string
}

// SavedFraction is the saving as a fraction of the equal-sharing fuel.
func (r *LeastFuelResult) SavedFraction() float64 {
	if r.EqualFuelKgS <= 0 {
		return 0
	}
	return r.SavedKgS / r.EqualFuelKgS
}

// lfBoiler is a boiler's surrogate in the search.
type lfBoiler struct {
	b       *Boiler
	hpk     float64 // heat to water per kg of steam, J/kg
	ev      *eval
	minLoad float64
	// memo of fuelAt by steam flow
	memoM, memoF float64
	memoSet      bool
}

// fuelAt is the surrogate fuel of the boiler raising m kg/s of steam (see
// above), with the cycling of a burner below its minimum as in the solve.
func (g *lfBoiler) fuelAt(m float64) (float64, error) {
	if m <= 0 {
		return 0, nil
	}
	if g.memoSet && g.memoM == m {
		return g.memoF, nil
	}
	u := g.b
	op, _, err := u.operation(g.ev)
	if err != nil {
		return 0, err
	}
	load := m / u.MCR
	cyc := load < u.MinLoad()-1e-12
	op.Load = load
	if cyc {
		op.Load = u.MinLoad()
	}
	q := m * g.hpk
	fuel := q / (0.85 * u.Fuel.LHV)
	_, plain := u.Efficiency.(*EfficiencyTable)
	if lo, ok := u.Efficiency.(interface{ loadOnly() bool }); ok && lo.loadOnly() {
		plain = true
	}
	for k := 0; k < 3; k++ {
		op.FuelFlow = fuel
		if cyc {
			op.FuelFlow = fuel * op.Load / load
		}
		pt, err := u.Efficiency.Efficiency(op)
		if err != nil {
			return 0, err
		}
		eta := pt.Eta
		if cyc {
			eta *= 1 - u.CyclingLoss
		}
		if u.EtaFactor != 0 {
			eta *= u.EtaFactor
		}
		if !(eta > 0 && eta <= 1) {
			return 0, fmt.Errorf("efficiency %g at load %.0f %%", eta, 100*load)
		}
		fuel = q / (eta * u.Fuel.LHV)
		if plain {
			break // the model does not read the fuel flow
		}
	}
	g.memoM, g.memoF, g.memoSet = m, fuel, true
	return fuel, nil
}

// lfSet is one set of boilers that may fire, its bounds and its
// surrogate's best split.
type lfSet struct {
	idx            []int // into the plant's boilers
	lo, hi         []float64
	shares         []float64 // of the set's steam, same order as idx
	surrogate      float64
	solvedFuel     float64
	solved         bool
	x              []float64
	res            solver.Result
	fire           []bool
	sharesByBoiler []float64
}

// leastFuel searches the firing set and split of least fuel (see above)
// after the firing rule's equal-sharing solution, leaving the answer as
// the plant's solution.
func (p *Plant) leastFuel(ctx context.Context, c Case) (*LeastFuelResult, error) {
	s := p.s
	boilers := s.asm.roles.boilers
	out := &LeastFuelResult{EqualFuelKgS: lfFuel(boilers, s.last)}
	out.FuelKgS = out.EqualFuelKgS
	p.lfRecord(out)
	if p.shedding() || s.shedFailed || p.overLimit() {
		out.Note = "the case is short: every boiler fires at its limit"
		return out, nil
	}
	if len(boilers) < 1 {
		return out, nil
	}

	// The reference, and the surrogates calibrated on it.
	ref := append([]float64(nil), s.last...)
	refFire := append([]bool(nil), s.fire...)
	refRes := s.slvRes
	demand := lfSteam(boilers, ref)
	if demand <= 0 {
		return out, nil // the economisers carry it
	}
	ev := &eval{x: ref, cond: s.ev.cond, pl: p}
	gs := make([]*lfBoiler, len(boilers))
	if err := lfSurrogates(gs, boilers, ev); err != nil {
		return nil, err
	}

	// Inert gas: the lowest load of each set's sources.
	ig := lfInertGas{boilers: boilers, gs: gs, cargo: p.cargoRate(), min: map[int]float64{}}
	for i, b := range boilers {
		if b.InertGas {
			ig.sources = append(ig.sources, i)
		}
	}
	igNeeded := ig.cargo > 0 && len(ig.sources) > 0

	// The sets, their bounds and their surrogates' best splits.
	sets, err := p.lfSets(nil, &ig, ev, demand, igNeeded)
	if err != nil {
		return nil, err
	}
	if len(sets) == 0 && igNeeded {
		if sets, err = p.lfSets(sets, &ig, ev, demand, false); err != nil {
			return nil, err
		}
	}
	if len(sets) == 0 {
		return out, nil
	}
	for _, st := range sets {
		if err := p.lfSplit(st, gs, demand); err != nil {
			return nil, err
		}
	}
	sort.SliceStable(sets, func(i, j int) bool { return sets[i].surrogate < sets[j].surrogate })

	// Solve the best sets.
	best := -1
	bestFuel := out.EqualFuelKgS
	for si, st := range sets {
		if si > 0 && st.surrogate > sets[0].surrogate*1.005 {
			break
		}
		if err := p.lfSolveSet(ctx, st, gs, ref, out); err != nil {
			return nil, err
		}
		// A saving below 1e-7 of the fuel is the solver's tolerance, not
		// a saving: the reference stands.
		if st.solved && st.solvedFuel < bestFuel*(1-1e-7) {
			best, bestFuel = si, st.solvedFuel
		}
	}

	// The answer: the best solved set, or the reference.
	if best < 0 {
		copy(s.last, ref)
		copy(s.fire, refFire)
		s.slvRes, s.shares, s.noShed = refRes, nil, true
		s.solves++
		return out, nil
	}
	st := sets[best]
	copy(s.last, st.x)
	copy(s.fire, st.fire)
	s.slvRes, s.shares, s.noShed = st.res, nil, true
	out.FuelKgS = lfFuel(boilers, s.last)
	out.SavedKgS = out.EqualFuelKgS - out.FuelKgS
	p.lfRecord(out)
	return out, nil
}

// lfFuel is the boilers' fuel in solution x, kg/s.
func lfFuel(boilers []*Boiler, x []float64) float64 {
	var f float64
	for _, b := range boilers {
		f += x[b.fuel]
	}
	return f
}

// lfSteam is the boilers' steam in solution x, kg/s.
func lfSteam(boilers []*Boiler, x []float64) float64 {
	var m float64
	for _, b := range boilers {
		m += x[b.steam.mIdx()]
	}
	return m
}

// lfRecord sets the firing boilers of the last solution and their shares
// of its steam as the answer's.
func (p *Plant) lfRecord(out *LeastFuelResult) {
	s := p.s
	boilers := s.asm.roles.boilers
	out.Firing, out.Shares = nil, nil
	var total float64
	for i, b := range boilers {
		if s.fire[i] {
			total += s.last[b.steam.mIdx()]
		}
	}
	for i, b := range boilers {
		if s.fire[i] {
			out.Firing = append(out.Firing, b.Name)
			sh := 0.0
			if total > 0 {
				sh = s.last[b.steam.mIdx()] / total
			}
			out.Shares = append(out.Shares, sh)
		}
	}
}

// lfSurrogates fills gs with each boiler's surrogate, its heat per kg of
// steam taken from the solution ev evaluates.
func lfSurrogates(gs []*lfBoiler, boilers []*Boiler, ev *eval) error {
	for i, b := range boilers {
		hpk, err := b.heatPerKg(ev)
		if err != nil {
			return wrapErr(b, err)
		}
		gs[i] = &lfBoiler{b: b, hpk: hpk, ev: ev, minLoad: b.MinLoad()}
	}
	return nil
}

// cargoRate is the running cargo pumps' rate of the case, m³/s.
func (p *Plant) cargoRate() float64 {
	var cargo float64
	for _, c := range p.comps {
		if t, ok := c.(*Turbine); ok {
			cargo += t.CargoRate()
		}
	}
	return cargo
}

// lfInertGas finds, for the inert-gas sources of a firing set, the lowest
// load at which they meet the inert-gas demand (inertgas.go), once per set
// of sources. (The solution the sources are evaluated in is a parameter of
// load, not a field: as a field it would make the escape analysis move gs,
// the memo and the sources to the heap.)
type lfInertGas struct {
	boilers []*Boiler
	gs      []*lfBoiler
	cargo   float64         // the cargo pumps' rate, m³/s
	sources []int           // the boilers that are inert-gas sources
	min     map[int]float64 // by the mask of a set's sources; -1: none
}

// load returns the lowest load of the sources in mask in the solution ev
// evaluates, and false when no load of theirs meets the demand.
func (ig *lfInertGas) load(p *Plant, ev *eval, mask int) (float64, bool, error) {
	if v, ok := ig.min[mask]; ok {
		return v, v >= 0, nil
	}
	var src []igSource
	for _, i := range ig.sources {
		if mask&(1<<i) != 0 {
			src = append(src, igSource{b: ig.boilers[i], hpk: ig.gs[i].hpk, ev: ev})
		}
	}
	l, ok, err := igMinLoad(src, ig.cargo*p.Opt.InertGasCapacity, p.Opt.InertGasO2Max)
	if err != nil {
		return 0, false, err
	}
	if !ok {
		l = -1
	}
	ig.min[mask] = l
	return l, ok, nil
}

// lfSets returns, appended to sets[:0], every set of boilers that may fire
// and can raise demand kg/s within its bounds (see above); with useIG,
// only the sets with inert-gas sources that meet the inert-gas demand in
// the solution ev evaluates.
func (p *Plant) lfSets(sets []*lfSet, ig *lfInertGas, ev *eval, demand float64, useIG bool) ([]*lfSet, error) {
	boilers := ig.boilers
	n := len(boilers)
	sets = sets[:0]
	for mask := 1; mask < 1<<n; mask++ {
		st := &lfSet{}
		k := 0
		for i := range boilers {
			if mask&(1<<i) != 0 {
				st.idx = append(st.idx, i)
				k++
			}
		}
		igMask := 0
		for _, i := range ig.sources {
			if mask&(1<<i) != 0 {
				igMask |= 1 << i
			}
		}
		var igL float64
		if useIG {
			if igMask == 0 {
				continue
			}
			l, ok, err := ig.load(p, ev, igMask)
			if err != nil {
				return sets, err
			}
			if !ok {
				continue
			}
			igL = l
		}
		var sumLo, sumHi float64
		for _, i := range st.idx {
			b := boilers[i]
			lo := 0.0
			if k >= 2 {
				lo = b.MinLoad() * b.MCR
			}
			if useIG && igMask&(1<<i) != 0 {
				lo = math.Max(lo, igL*b.MCR)
			}
			hi := b.Limit()
			if k < n {
				hi = p.usable(b)
			}
			st.lo, st.hi = append(st.lo, lo), append(st.hi, hi)
			sumLo += lo
			sumHi += hi
		}
		if demand < sumLo*(1-1e-9) || demand > sumHi*(1+1e-9) {
			continue
		}
		sets = append(sets, st)
	}
	return sets, nil
}

// lfSolveSet solves the plant with set st firing at its surrogate's split,
// from the reference solution ref, recalibrates the surrogate on that
// solution and solves again if the split moved by more than 0.1 % (at
// most two solves), keeping in st the solution of least fuel. A set that
// does not solve, or solves with a boiler over its limit, is left
// unsolved; only a cancelled context or a fault of the surrogate is an
// error.
func (p *Plant) lfSolveSet(ctx context.Context, st *lfSet, gs []*lfBoiler, ref []float64, out *LeastFuelResult) error {
	s := p.s
	boilers := s.asm.roles.boilers
	n := len(boilers)
	fire := make([]bool, n)
	for _, i := range st.idx {
		fire[i] = true
	}
	var prevShares []float64
	for round := 0; round < 2; round++ {
		shares := make([]float64, n)
		for j, i := range st.idx {
			shares[i] = st.shares[j]
		}
		copy(s.last, ref)
		s.shares = shares
		s.noShed = true
		err := p.solveConfig(ctx, fire)
		out.Solves++
		if err != nil {
			if ctx.Err() != nil {
				return ctx.Err()
			}
			break // this set does not solve at this split: keep the others
		}
		if p.anyOverLimit(fire) {
			break
		}
		var fuel float64
		for _, i := range st.idx {
			fuel += s.last[boilers[i].fuel]
		}
		steam := lfSteam(boilers, s.last)
		if !st.solved || fuel < st.solvedFuel {
			st.solved, st.solvedFuel = true, fuel
			st.keep(s)
		}
		// Recalibrate the surrogate on this solution and look again.
		prevShares = append(prevShares[:0], st.shares...)
		if err := p.lfRecalibrate(st, gs); err != nil {
			return err
		}
		if err := p.lfSplit(st, gs, steam); err != nil {
			return err
		}
		moved := 0.0
		for j := range st.shares {
			moved = math.Max(moved, math.Abs(st.shares[j]-prevShares[j]))
		}
		if moved <= 1e-3 {
			break
		}
	}
	return nil
}

// keep copies the last solution into the set: its unknowns, the solver's
// result, the firing boilers and their shares.
func (st *lfSet) keep(s *session) {
	st.x = append(st.x[:0], s.last...)
	st.res = s.slvRes
	st.fire = append([]bool(nil), s.fire...)
	st.sharesByBoiler = append([]float64(nil), s.shares...)
}

// lfRecalibrate gives the surrogates of set st's boilers the heat per kg
// of steam of the last solution.
func (p *Plant) lfRecalibrate(st *lfSet, gs []*lfBoiler) error {
	s := p.s
	boilers := s.asm.roles.boilers
	evs := &eval{x: s.last, cond: s.ev.cond, pl: p}
	for _, i := range st.idx {
		hpk, err := boilers[i].heatPerKg(evs)
		if err != nil {
			return wrapErr(boilers[i], err)
		}
		gs[i] = &lfBoiler{b: boilers[i], hpk: hpk, ev: evs, minLoad: boilers[i].MinLoad()}
	}
	return nil
}

// anyOverLimit says whether a firing boiler of the last solution raises
// more than its limit.
func (p *Plant) anyOverLimit(fire []bool) bool {
	s := p.s
	for i, b := range s.asm.roles.boilers {
		if fire[i] && s.last[b.steam.mIdx()] > b.Limit()*(1+1e-9) {
			return true
		}
	}
	return false
}

// lfSplit minimises the surrogate fuel of set st raising demand kg/s over
// its split within its bounds (see above), setting st.shares and
// st.surrogate.
func (p *Plant) lfSplit(st *lfSet, gs []*lfBoiler, demand float64) error {
	k := len(st.idx)
	m := make([]float64, k)
	st.start(m, demand)
	switch {
	case k == 1:
		m[0] = demand
	case k == 2:
		if err := st.splitPair(gs, m, demand); err != nil {
			return err
		}
	case k == 3:
		if err := st.splitGrid3(gs, m, demand); err != nil {
			return err
		}
		fallthrough
	default:
		if err := st.splitPairs(gs, m, demand); err != nil {
			return err
		}
	}
	f, err := st.fuel(gs, m)
	if err != nil {
		return err
	}
	st.surrogate = f
	st.shares = st.shares[:0]
	for j := range m {
		st.shares = append(st.shares, m[j]/demand)
	}
	return nil
}

// fuel is the surrogate fuel of the set's boilers raising m[j] kg/s each.
func (st *lfSet) fuel(gs []*lfBoiler, m []float64) (float64, error) {
	var f float64
	for j, i := range st.idx {
		v, err := gs[i].fuelAt(m[j])
		if err != nil {
			return 0, err
		}
		f += v
	}
	return f, nil
}

// pairRange is the range of the steam boiler a may take of the pair
// steam it shares with boiler b, within both bounds.
func (st *lfSet) pairRange(a, b int, pair float64) (lo, hi float64) {
	lo = math.Max(st.lo[a], pair-st.hi[b])
	hi = math.Min(st.hi[a], pair-st.lo[b])
	return lo, hi
}

// start sets m to a feasible split of demand: each boiler at its lower
// bound and a share of the rest in proportion to its room above it.
func (st *lfSet) start(m []float64, demand float64) {
	var sumLo, room float64
	for j := range m {
		sumLo += st.lo[j]
		room += st.hi[j] - st.lo[j]
	}
	for j := range m {
		m[j] = st.lo[j]
		if room > 0 {
			m[j] += (demand - sumLo) * (st.hi[j] - st.lo[j]) / room
		}
	}
}

// splitPair sets m to the best split of demand between the two boilers of
// the set: the best of 41 points across their range, refined by golden
// sections around it.
func (st *lfSet) splitPair(gs []*lfBoiler, m []float64, demand float64) error {
	lo, hi := st.pairRange(0, 1, demand)
	g := func(t float64) (float64, error) { return st.fuel(gs, []float64{t, demand - t}) }
	bestT, bestF := lo, math.Inf(1)
	const grid = 40
	for q := 0; q <= grid; q++ {
		t := lo + (hi-lo)*float64(q)/grid
		f, err := g(t)
		if err != nil {
			return err
		}
		if f < bestF {
			bestT, bestF = t, f
		}
	}
	step := (hi - lo) / grid
	t, f, err := lfGolden(g, math.Max(lo, bestT-step), math.Min(hi, bestT+step), demand)
	if err != nil {
		return err
	}
	if f > bestF {
		t = bestT
	}
	m[0], m[1] = t, demand-t
	return nil
}

// splitGrid3 sets m to the best split of demand among the three boilers
// of the set on a grid of 21 × 21 points, for the pairs to refine.
func (st *lfSet) splitGrid3(gs []*lfBoiler, m []float64, demand float64) error {
	const grid = 20
	bestF := math.Inf(1)
	best := append([]float64(nil), m...)
	lo0, hi0 := st.lo[0], math.Min(st.hi[0], demand-st.lo[1]-st.lo[2])
	for q := 0; q <= grid; q++ {
		a := lo0 + (hi0-lo0)*float64(q)/grid
		lo1, hi1 := st.pairRange(1, 2, demand-a)
		for r := 0; r <= grid; r++ {
			b := lo1 + (hi1-lo1)*float64(r)/grid
			try := []float64{a, b, demand - a - b}
			if try[2] < st.lo[2]-1e-12 || try[2] > st.hi[2]+1e-12 || hi1 < lo1 {
				continue
			}
			f, err := st.fuel(gs, try)
			if err != nil {
				return err
			}
			if f < bestF {
				bestF = f
				copy(best, try)
			}
		}
	}
	copy(m, best)
	return nil
}

// splitPairs improves the split m of demand by pairs in turn: it moves
// steam between two boilers to the pair's best (golden sections near the
// present split), until nothing moves.
func (st *lfSet) splitPairs(gs []*lfBoiler, m []float64, demand float64) error {
	k := len(m)
	for sweep := 0; sweep < 8; sweep++ {
		moved := 0.0
		for a := 0; a < k; a++ {
			for b := a + 1; b < k; b++ {
				pair := m[a] + m[b]
				lo, hi := st.pairRange(a, b, pair)
				if hi-lo <= 0 {
					continue
				}
				g := func(t float64) (float64, error) {
					old0, old1 := m[a], m[b]
					m[a], m[b] = t, pair-t
					f, err := st.fuel(gs, m)
					m[a], m[b] = old0, old1
					return f, err
				}
				f0, err := g(m[a])
				if err != nil {
					return err
				}
				t, f, err := lfGolden(g, math.Max(lo, m[a]-0.05*(hi-lo)), math.Min(hi, m[a]+0.05*(hi-lo)), demand)
				if err != nil {
					return err
				}
				if f < f0 {
					moved = math.Max(moved, math.Abs(t-m[a]))
					m[a], m[b] = t, pair-t
				}
			}
		}
		if moved <= 1e-6*demand {
			break
		}
	}
	return nil
}

// lfGolden minimises g over [lo, hi] by golden sections, to a bracket of
// 1e-7 of demand (kg/s, at least 1e-3), and returns the middle of the
// last bracket and g there.
func lfGolden(g func(float64) (float64, error), lo, hi, demand float64) (float64, float64, error) {
	const r = 0.6180339887498949
	a, b := lo, hi
	c, d := b-r*(b-a), a+r*(b-a)
	fc, err := g(c)
	if err != nil {
		return 0, 0, err
	}
	fd, err := g(d)
	if err != nil {
		return 0, 0, err
	}
	for b-a > 1e-7*math.Max(demand, 1e-3) {
		if fc < fd {
			b, d, fd = d, c, fc
			c = b - r*(b-a)
			if fc, err = g(c); err != nil {
				return 0, 0, err
			}
		} else {
			a, c, fc = c, d, fd
			d = a + r*(b-a)
			if fd, err = g(d); err != nil {
				return 0, 0, err
			}
		}
	}
	x := 0.5 * (a + b)
	fx, err := g(x)
	return x, fx, err
}
