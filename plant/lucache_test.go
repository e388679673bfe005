package plant

import (
	"context"
	"math"
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
	// The default settings but for the chord steps on an earlier case's
	// factorisation, which move the answer within the tolerance
	// (TestChordStartAgrees).
	set.Opt.Solver = &solver.Settings{}
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

// TestChordStartAgrees: a plant that begins each case on the
// factorisation of the last case of its firing configuration (the
// default, solver.Settings.ChordStart) gives the figures of cold solves
// (ColdStart before each case: no earlier point, no earlier
// factorisation) to within the solver's tolerance, on a sequence that
// moves between one and two boilers, sheds beyond both and forces a
// firing; and the sequence does take such steps. Tolerance: the solver's
// FTol (1e-9 of each equation's scale) moves a flow by far less than a
// part in 1e6 (common practice, no source).
func TestChordStartAgrees(t *testing.T) {
	t.Parallel()
	warm := scaledPlant(t, 2, 12)
	cold := scaledPlant(t, 2, 12)
	duty := warm.Component("c1").(*Consumer).Duty
	ctx := context.Background()
	carried := 0
	near := func(k int, what string, a, b float64) {
		t.Helper()
		if math.Abs(a-b) > 1e-6*math.Max(math.Abs(b), 1e-3) {
			t.Errorf("case %d: %s %.12g after chord steps, %.12g cold", k, what, a, b)
		}
	}
	for k, f := range []float64{1, 1.02, 1.05, 0.2, 0.21, 1.5, 1.52, 0.1, 3, 3.1, 5, 1.1, 1.12, 0.3, 12, 0.9, 0.92} {
		c := Case{Name: "seq", Set: []Setting{{Unit: "c1", Param: "duty", Value: f * duty}}}
		if k == 11 {
			c.Fire = []string{"b2"}
		}
		a, err := warm.Solve(ctx, c)
		must(t, err)
		carried += warm.s.carried
		cold.ColdStart()
		b, err := cold.Solve(ctx, c)
		must(t, err)
		if cold.s.carried != 0 {
			t.Errorf("case %d: a cold solve took %d steps on an earlier factorisation", k, cold.s.carried)
		}
		if a.BoilersFiring != b.BoilersFiring || len(a.Contingencies) != len(b.Contingencies) {
			t.Fatalf("case %d: %d boilers firing, %d contingencies after chord steps; %d, %d cold",
				k, a.BoilersFiring, len(a.Contingencies), b.BoilersFiring, len(b.Contingencies))
		}
		near(k, "steam kg/s", a.SteamProductionKgS, b.SteamProductionKgS)
		near(k, "fuel kg/s", a.FuelKgS, b.FuelKgS)
		near(k, "make-up kg/s", a.MakeUpKgS, b.MakeUpKgS)
		near(k, "shed W", a.ShedW, b.ShedW)
		near(k, "feed tank K", a.FeedTankT, b.FeedTankT)
		for i := range a.Boilers {
			near(k, a.Boilers[i].Name+" steam kg/s", a.Boilers[i].SteamKgS, b.Boilers[i].SteamKgS)
		}
		for i := range a.Contingencies {
			near(k, a.Contingencies[i].Name+" shortfall kg/s", a.Contingencies[i].ShortfallKgS, b.Contingencies[i].ShortfallKgS)
		}
	}
	if carried == 0 {
		t.Errorf("no case took a step on an earlier case's factorisation; the test needs some")
	}
	t.Logf("%d chord steps over the sequence", carried)
}
