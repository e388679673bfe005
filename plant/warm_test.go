package plant

import (
	"context"
	"reflect"
	"testing"
)

// TestUseStart: a case solved after UseStart of a kept solution gives
// every figure bit for bit as the same case solved right after the case
// that solution came from, whatever was solved in between; a Start that
// holds none starts the case cold, as ColdStart does (the definitions; no
// outside source).
func TestUseStart(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	duty := func(p *Plant, f float64) Case {
		d := p.Component("c1").(*Consumer).Duty
		return Case{Name: "warm", Set: []Setting{{Unit: "c1", Param: "duty", Value: f * d}}}
	}
	ref := scaledPlant(t, 2, 6)
	_, err := ref.Solve(ctx, duty(ref, 1.2))
	must(t, err)
	var own Start
	ref.SaveStart(&own)
	ref.UseStart(&own) // the factorisation of the case at 1.2 forgotten, as UseStart does
	want, err := ref.Solve(ctx, duty(ref, 1.3))
	must(t, err)

	p := scaledPlant(t, 2, 6)
	var st Start
	if p.SaveStart(&st); st.Held() {
		t.Fatalf("a plant that has solved nothing gave a start")
	}
	_, err = p.Solve(ctx, duty(p, 1.2))
	must(t, err)
	p.SaveStart(&st)
	_, err = p.Solve(ctx, duty(p, 6)) // both boilers, far from the start kept
	must(t, err)
	p.UseStart(&st)
	got, err := p.Solve(ctx, duty(p, 1.3))
	must(t, err)
	if !reflect.DeepEqual(got, want) {
		t.Errorf("from the kept start: %+v\nwant %+v", got, want)
	}

	cold := scaledPlant(t, 2, 6)
	wantCold, err := cold.Solve(ctx, duty(cold, 1.3))
	must(t, err)
	p.UseStart(&Start{})
	got, err = p.Solve(ctx, duty(p, 1.3))
	must(t, err)
	if !reflect.DeepEqual(got, wantCold) {
		t.Errorf("from no start: %+v\nwant the cold solve %+v", got, wantCold)
	}
}

// TestPredict: the prediction is the base moved along each direction by
// its weight, within the unknowns' bounds, and leaves out a direction of
// another firing (the definition; no outside source).
func TestPredict(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	p := scaledPlant(t, 2, 6)
	d := p.Component("c1").(*Consumer).Duty
	solve := func(f float64, st *Start) { // every consumer's duty × f
		c := Case{Name: "dir"}
		for _, n := range []string{"c1", "c2", "c3", "c4", "c5", "c6"} {
			c.Set = append(c.Set, Setting{Unit: n, Param: "duty", Value: f * d})
		}
		_, err := p.Solve(ctx, c)
		must(t, err)
		p.SaveStart(st)
	}
	var base Start
	dirs := make([]Start, 2)
	solve(0.3, &base) // one boiler fires
	solve(0.33, &dirs[0])
	solve(1, &dirs[1]) // both boilers fire: another hint
	if dirs[1].hint == base.hint {
		t.Fatalf("the second direction fires %d boilers as the base does; the test needs another number", base.hint)
	}
	var x Start
	p.Predict(&x, &base, dirs, []float64{2.5, 1})
	lo, hi := p.s.asm.lo, p.s.asm.hi
	for i := range x.x {
		want := min(max(base.x[i]+2.5*(dirs[0].x[i]-base.x[i]), lo[i]), hi[i])
		if x.x[i] != want {
			t.Fatalf("unknown %s: %g, want %g", p.s.asm.varNames[i], x.x[i], want)
		}
	}
	if x.hint != base.hint || !x.hintSet {
		t.Errorf("hint %d (%v), want the base's %d", x.hint, x.hintSet, base.hint)
	}
	p.Predict(&x, &Start{}, dirs, []float64{1, 1})
	if x.Held() {
		t.Errorf("a prediction from no base holds a start")
	}
}
