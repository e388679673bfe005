package plant

import (
	"gonum.org/v1/gonum/mat"

	"steamcase/solver"
)

// maxLUs is the most sparse LU factorisations a plant keeps, one per
// firing configuration (see luSet): a plant of two boilers has four, the
// firing rule and the N-1 answers of a case use two or three of them.
const maxLUs = 4

// luAlternates is how many other symbolic factorisations each LU keeps
// (solver.SparseLU.Alternates): within one firing configuration the
// pivots the fresh rule picks still change with the case's values (a
// line's flow against another's), mostly among a few sequences seen
// before: over the demo tanker's year, of 1516 factorisations whose
// pivots changed, 1464 came back to a sequence seen before in the same
// configuration.
const luAlternates = 2

// luSet is the plant's default Factorizer: one solver.SparseLU per
// firing configuration, so that each keeps the symbolic part of the
// factorisation (the reach of each column, the structure of L and U, the
// pivot rows) of the configuration it serves.
//
// Why: the dispatch equations of one firing set differ from those of
// another (a boiler that does not fire has the equation "its steam is
// zero", one that does a share of the demand), and with them the pivot
// that the fresh rule chooses in the boilers' columns. One SparseLU
// serving the firing rule's trials, a case and its N-1 contingency in
// turn found its kept pivot changed at every factorisation and redid the
// rest of the factorisation by depth-first search, most of the work on a
// large plant. Each SparseLU chooses its pivots afresh (the solver's
// default) and its factors are bit for bit those of a factorisation from
// scratch (solver.SparseLU's doc, "The kept structure"), whichever of them
// factorises a matrix: the choice of LU changes the time a factorisation
// takes, never a figure. With Settings.KeepPivots the solver refactorises
// on the pivots of the last factorisation of the same Solve, which is one
// configuration, so that stays as it was too. What does depend on the
// history is the chord start (solver.Settings.ChordStart, Holds): a case
// begins on the factorisation its configuration's LU holds from an
// earlier case, which moves its figures within the solver's tolerance;
// forget (ColdStart, UseStart) makes every LU hold none.
//
// The plant names the configuration (use) before each solve; a
// configuration not seen takes a new SparseLU while fewer than maxLUs
// exist, else the one used least recently (whose kept structure is then
// found again on its first factorisation).
type luSet struct {
	minDegree bool
	n         int
	pattern   [][]int // as given to SetPattern; only read
	hasPat    bool

	lus  []keyedLU
	want uint64           // the configuration of the next factorisation
	cur  *solver.SparseLU // the last factorised
	tick uint64
}

type keyedLU struct {
	key  uint64
	used uint64
	lu   *solver.SparseLU
	// held: lu holds a factorisation made since the last forget, which a
	// solve of its configuration may start from (Holds).
	held bool
}

func newLUSet() *luSet {
	return &luSet{minDegree: true}
}

// use names the configuration whose matrices the next factorisations
// take.
func (f *luSet) use(key uint64) { f.want = key }

// pick returns the SparseLU of the wanted configuration, making or
// reassigning one if needed, and makes it the current one.
func (f *luSet) pick() *solver.SparseLU {
	f.tick++
	var lru *keyedLU
	for i := range f.lus {
		k := &f.lus[i]
		if k.key == f.want {
			k.used, k.held = f.tick, true
			f.cur = k.lu
			return k.lu
		}
		if lru == nil || k.used < lru.used {
			lru = k
		}
	}
	if len(f.lus) < maxLUs {
		lu := &solver.SparseLU{MinDegree: f.minDegree, Alternates: luAlternates}
		if f.hasPat {
			lu.SetPattern(f.n, f.pattern)
		}
		f.lus = append(f.lus, keyedLU{key: f.want, used: f.tick, lu: lu, held: true})
		f.cur = lu
		return lu
	}
	lru.key, lru.used, lru.held = f.want, f.tick, true
	f.cur = lru.lu
	return lru.lu
}

// current is the SparseLU of the last factorisation (a new one before
// any).
func (f *luSet) current() *solver.SparseLU {
	if f.cur == nil {
		return f.pick()
	}
	return f.cur
}

// SetPattern implements solver.PatternFactorizer for every SparseLU, made
// and to be made.
func (f *luSet) SetPattern(n int, pattern [][]int) {
	f.n, f.pattern, f.hasPat = n, pattern, pattern != nil
	for _, k := range f.lus {
		k.lu.SetPattern(n, pattern)
	}
}

// Factorize implements solver.Factorizer.
func (f *luSet) Factorize(j *mat.Dense) error { return f.pick().Factorize(j) }

// FactorizeSparse implements solver.SparseFactorizer.
func (f *luSet) FactorizeSparse(j *solver.Sparse) error { return f.pick().FactorizeSparse(j) }

// RefactorSparse implements solver.Refactorizer.
func (f *luSet) RefactorSparse(j *solver.Sparse) error { return f.pick().RefactorSparse(j) }

// Holds implements solver.Holder for the wanted configuration: its LU
// holds a factorisation made since the last forget. It makes that LU the
// current one, which Solve then takes.
func (f *luSet) Holds() bool {
	for i := range f.lus {
		k := &f.lus[i]
		if k.key == f.want {
			if !k.lu.Holds() {
				return false
			}
			f.tick++
			k.used, f.cur = f.tick, k.lu
			return k.held
		}
	}
	return false
}

// forget makes every LU's factorisation one that no solve starts from
// (Plant.ColdStart), so that what is solved next does not depend on what
// was solved before.
func (f *luSet) forget() {
	for i := range f.lus {
		f.lus[i].held = false
	}
}

// KeptPivots implements solver.Refactorizer.
func (f *luSet) KeptPivots() int { return f.current().KeptPivots() }

// Cond implements solver.Factorizer.
func (f *luSet) Cond() float64 { return f.current().Cond() }

// CondBound gives the solver the cheap condition bound of the last
// factorisation (solver.SparseLU.CondBound).
func (f *luSet) CondBound() float64 { return f.current().CondBound() }

// Solve implements solver.Factorizer.
func (f *luSet) Solve(dst, b []float64) error { return f.current().Solve(dst, b) }

// configKey names the configuration being solved for luSet: the firing
// boilers and what else changes the dispatch equations (the shed level
// held at zero, given shares, lead-lag sharing). Two configurations that
// share a key only share an LU, which costs time, not accuracy.
func (s *session) configKey(leadLag bool) uint64 {
	var k uint64 = 14695981039346656037 // FNV-1a
	mix := func(v uint64) {
		k ^= v
		k *= 1099511628211
	}
	for i, f := range s.fire {
		if f {
			mix(uint64(i) + 1)
		}
	}
	var flags uint64
	if s.noShed {
		flags |= 1
	}
	if s.shares != nil {
		flags |= 2
	}
	if leadLag && !s.equalShare {
		flags |= 4
	}
	mix(flags << 32)
	return k
}
