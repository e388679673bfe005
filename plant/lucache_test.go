package plant

import (
	"context"
	"reflect"
	"testing"

	"steamcase/solver"
)

// TestLUSetSameResults: a plant with its LU per firing configuration
// (luSet) gives every figure of every case bit for bit as a plant with
// one SparseLU for all its solves, on a sequence of cases that moves
// between one and two boilers firing, with the N-1 solves, the shedding
// of a case beyond both boilers and a forced firing in between. The
// source is solver.SparseLU's doc ("The kept structure"): a factorisation
// choosing its pivots afresh gives the factors of one from scratch,
// whatever structure it kept.
func TestLUSetSameResults(t *testing.T) {
	t.Parallel()
	one := scaledPlant(t, 2, 12)
	one.Opt.Solver = &solver.Settings{Factorizer: &solver.SparseLU{MinDegree: true}}
	set := scaledPlant(t, 2, 12)
	duty := set.Component("c1").(*Consumer).Duty
	ctx := context.Background()
	for k, f := range []float64{1, 0.2, 1.5, 0.1, 3, 5, 1.1, 0.3, 12, 0.9} {
		c := Case{Name: "seq", Set: []Setting{{Unit: "c1", Param: "duty", Value: f * duty}}}
		if k == 6 {
			c.Fire = []string{"b2"}
		}
		a, err := one.Solve(ctx, c)
		must(t, err)
		b, err := set.Solve(ctx, c)
		must(t, err)
		if !reflect.DeepEqual(a, b) {
			t.Errorf("case %d (duty × %g): the results differ\none LU: %+v\nluSet:  %+v", k, f, a, b)
		}
	}
	if set.s.lus == nil || len(set.s.lus.lus) < 2 {
		t.Fatalf("the plant's solves used %v, want an LU for each of two or more firing configurations", set.s.lus)
	}
	if one.s.lus != nil {
		t.Errorf("a plant given its Factorizer uses a luSet")
	}
}

// TestLUSetPick: each configuration keeps its own LU; beyond maxLUs the
// one used least recently serves the new configuration (the set's own
// bookkeeping; no outside source).
func TestLUSetPick(t *testing.T) {
	t.Parallel()
	f := newLUSet()
	lu := map[uint64]*solver.SparseLU{}
	for key := uint64(1); key <= maxLUs; key++ {
		f.use(key)
		lu[key] = f.pick()
	}
	for key := uint64(1); key <= maxLUs; key++ {
		f.use(key)
		if got := f.pick(); got != lu[key] || f.current() != got {
			t.Errorf("configuration %d: another LU than its own", key)
		}
	}
	f.use(2) // 1 is now the least recently used
	f.pick()
	f.use(maxLUs + 1)
	if got := f.pick(); got != lu[1] || len(f.lus) != maxLUs {
		t.Errorf("a new configuration beyond %d took another LU than the least recently used (%d kept)", maxLUs, len(f.lus))
	}
}
