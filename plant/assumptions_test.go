package plant

import "testing"

// TestDefaults lists the defaults in force as the registry declares them:
// a key left out appears with its default and source, a key given does
// not, and the switches that say whether a unit runs are not assumptions.
func TestDefaults(t *testing.T) {
	t.Parallel()
	p := New("invented", Options{})
	must := func(err error) {
		if err != nil {
			t.Fatal(err)
		}
	}
	must(p.Add(&FeedPump{Base: Base{Name: "fp"}, Eta: 0.6}))
	must(p.Add(&FeedPump{Base: Base{Name: "fp2"}}))
	must(p.Add(&Consumer{Base: Base{Name: "load"}, Duty: 1e5, ReturnFraction: 0.9}))
	got := map[string]Assumption{}
	for _, a := range p.Defaults() {
		got[a.Unit+"."+a.Key] = a
	}
	// The pump's efficiency: 45 % from docs/reference/plant-checks.md §9 [M], the
	// registry's own default and source.
	if a, ok := got["fp2.eta"]; !ok || a.Value != "45 %" || a.Source != "docs/reference/plant-checks.md §9 [M]" || a.Kind != "feed pump" {
		t.Errorf("fp2.eta: %+v (listed %v)", a, ok)
	}
	if _, ok := got["fp.eta"]; ok {
		t.Errorf("fp.eta was given but is listed as a default")
	}
	// The duty factor's default as the registry writes it, marked as an
	// effect left out unless given.
	fk, _ := findKey(p.Component("load").Keys(), "factor")
	if a, ok := got["load.factor"]; !ok || a.Value != fk.DefaultText() || a.Value == "" || a.Source != SourceLeftOut {
		t.Errorf("load.factor: %+v (listed %v)", a, ok)
	}
	if _, ok := got["load.returns"]; ok {
		t.Errorf("load.returns was given but is listed")
	}
	if a, ok := got["load.return_T"]; !ok || a.Value != "no drain cooler" {
		t.Errorf("load.return_T: %+v", a)
	}
	if _, ok := got["load.off"]; ok {
		t.Errorf("the switch off is listed as an assumption")
	}
}
