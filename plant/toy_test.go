package plant

import (
	"context"
	"strings"
	"testing"

	"steamcase/plant/units"
)

// ventValve is a toy component, written as a new kind is written: one
// file (this one, but for the test below) and its registration. It blows
// a set flow of steam to the atmosphere, which the make-up replaces.
type ventValve struct {
	Base
	Flow float64 // kg/s

	in  *Line
	eq  int
	off bool
}

var ventKeys = []Key{
	num(Key{Name: "flow", Label: "vented flow", Dim: units.MassFlow, Example: "0.5 t/h", Doc: "steam blown off",
		Required: true, Min: 0, Max: 10, Case: true},
		self[*ventValve], func(u *ventValve) *float64 { return &u.Flow }),
	flag(Key{Name: "off", Label: "off", Example: "true", Doc: "closed", HasDefault: true, Case: true},
		self[*ventValve], func(u *ventValve) *bool { return &u.off }),
}

func (u *ventValve) Keys() []Key      { return ventKeys }
func (u *ventValve) Kind() string     { return "vent valve" }
func (u *ventValve) check(fs *faults) { checkKey(fs, u, "flow") }
func (u *ventValve) Ports() []PortSpec {
	return []PortSpec{{Name: "in", Dir: In, Medium: WaterSteam}}
}
func (u *ventValve) assemble(a *assembly, ports portLines) {
	u.in = ports.one("in")
	u.eq = a.equation(u.Name+": vented flow", 1, u.in.mIdx())
}
func (u *ventValve) flow() float64 {
	if u.off {
		return 0
	}
	return u.Flow
}
func (u *ventValve) residual(ev *eval, r []float64) error {
	r[u.eq] = ev.m(u.in) - u.flow()
	return nil
}
func (u *ventValve) jacobian(ev *eval, j jac) error { j.add(u.eq, u.in.mIdx(), 1); return nil }
func (u *ventValve) guess(x []float64)              {}
func (u *ventValve) report(ev *eval, cr *CaseResult) error {
	m := ev.m(u.in)
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind(), Figures: Figures{{"vented_kg_s", m}}})
	cr.boundary.massOut += m
	cr.boundary.energyOut += m * ev.h(u.in)
	return nil
}
func (u *ventValve) outline(cr *CaseResult) {
	cr.Units = append(cr.Units, ComponentResult{Name: u.Name, Kind: u.Kind()})
}
func (u *ventValve) clone() Component { c := *u; c.in = nil; return &c }

// toyKind is the vent valve's registration.
var toyKind = KindSpec{Name: "vent_valve", Doc: "blows steam to the atmosphere", New: func() Component { return &ventValve{} }}

// TestToyComponent: a kind added in one file and registered is built from
// its keys, solved, set by a case, copied, outlined and documented by the
// plant's generic code, and its balance closes (no outside source: the
// balances are the plant's own check).
func TestToyComponent(t *testing.T) {
	t.Parallel()
	p := New("toy", Options{})
	must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 333.15, P: 1e5}))
	must(t, p.Add(&Boiler{Base: Base{Name: "b1"}, MCR: 4, DrumP: gauge(7),
		Efficiency: flatEta(0.85), Fuel: FuelSpec{Name: "HFO", LHV: 40.2e6, CO2Factor: 3.114}}))
	v := toyKind.New()
	k, ok := findKey(v.Keys(), "flow")
	if !ok || !k.Set(v, 0.5) {
		t.Fatal("the toy's flow key does not set its flow")
	}
	v.Ident().Name = "vent"
	must(t, p.Add(v))
	p.Connect("feed", Pos{}, "makeup", "out", "b1", "feed")
	p.Connect("steam", Pos{}, "b1", "steam", "vent", "in")

	cr, err := p.Solve(context.Background(), Case{Name: "blowing"})
	must(t, err)
	within(t, "boiler steam kg/s", cr.Boilers[0].SteamKgS, 0.5, 1e-9)
	if cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
		t.Errorf("balances do not close: %+v", cr.Balance)
	}
	cr, err = p.Clone().Solve(context.Background(), Case{Name: "less", Set: []Setting{{Unit: "vent", Param: "flow", Value: 0.25}}})
	must(t, err)
	within(t, "boiler steam kg/s with flow set by the case", cr.Boilers[0].SteamKgS, 0.25, 1e-9)
	if _, err := p.Solve(context.Background(), Case{Name: "bad", Set: []Setting{{Unit: "vent", Param: "flw", Value: 1}}}); err == nil ||
		!strings.Contains(err.Error(), `has no parameter "flw"; its parameters are ["flow" "off"]`) {
		t.Errorf("a misspelt key is not refused by name: %v", err)
	}
	if o := p.Outline("check", Conditions{}); len(o.Units) != 2 || o.Units[1].Name != "vent" {
		t.Errorf("the outline does not list the toy: %+v", o.Units)
	}
	var b strings.Builder
	must(t, WriteKeyReference(&b, []KindSpec{toyKind}))
	if !strings.Contains(b.String(), `flow: mass flow, such as "0.5 t/h"; required; a case may set it`) {
		t.Errorf("the key reference does not document the toy:\n%s", b.String())
	}
}
