package plant

import (
	"strings"
	"testing"
)

// TestImpossibleSetUps: a plant that cannot work is refused when it is
// checked, naming the component and saying what to change (issue 17; the
// physics is that of a reducing valve, a turbine and a header, no outside
// source), and a case that moves a set pressure past it is refused too.
func TestImpossibleSetUps(t *testing.T) {
	t.Parallel()
	base := func(t *testing.T) *Plant {
		p := New("set-ups", Options{})
		must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 333.15}))
		must(t, p.Add(&FeedTank{Base: Base{Name: "hotwell"}}))
		must(t, p.Add(&FeedPump{Base: Base{Name: "fp"}, Boilers: []string{"b1"}, Margin: 3e5, Eta: 0.5}))
		must(t, p.Add(&Boiler{Base: Base{Name: "b1"}, MCR: 4, DrumP: 8e5, Efficiency: flatEta(0.85),
			Fuel: FuelSpec{Name: "HFO", LHV: 40.2e6, CO2Factor: 3.114}}))
		must(t, p.Add(&Header{Base: Base{Name: "main"}}))
		p.Connect("mu", Pos{}, "makeup", "out", "hotwell", "in")
		p.Connect("suction", Pos{}, "hotwell", "out", "fp", "in")
		p.Connect("feed", Pos{}, "fp", "out", "b1", "feed")
		p.Connect("steam", Pos{}, "b1", "steam", "main", "in")
		return p
	}
	tests := []struct {
		name  string
		build func(t *testing.T, p *Plant)
		want  string
	}{
		{"a reducing valve that raises the pressure", func(t *testing.T, p *Plant) {
			must(t, p.Add(&ReducingValve{Base: Base{Name: "prv"}, P: 16e5}))
			must(t, p.Add(&Consumer{Base: Base{Name: "load"}, Duty: 1e6, ReturnFraction: 1}))
			p.Connect("to prv", Pos{}, "main", "out", "prv", "in")
			p.Connect("lp", Pos{}, "prv", "out", "load", "in")
			p.Connect("ret", Pos{}, "load", "out", "hotwell", "in")
		}, `unit "prv": its set pressure 16 bar(a) is above its inlet's 8 bar(a) (line "to prv"): a reducing valve cannot raise the pressure`},
		{"a turbine exhausting above its inlet", func(t *testing.T, p *Plant) {
			must(t, p.Add(&Turbine{Base: Base{Name: "tg"}, Power: 1e5, ExhaustP: 9e5, EtaIs: 0.6}))
			must(t, p.Add(&Condenser{Base: Base{Name: "cond"}}))
			p.Connect("to tg", Pos{}, "main", "out", "tg", "in")
			p.Connect("ex", Pos{}, "tg", "out", "cond", "in")
			p.Connect("cd", Pos{}, "cond", "out", "hotwell", "in")
		}, `unit "tg": its exhaust at 9 bar(a) is not below its inlet's 8 bar(a) (line "to tg"): steam cannot expand`},
		{"a header joining two pressures", func(t *testing.T, p *Plant) {
			must(t, p.Add(&ReducingValve{Base: Base{Name: "prv"}, P: 4e5}))
			must(t, p.Add(&Header{Base: Base{Name: "mixed"}}))
			must(t, p.Add(&Consumer{Base: Base{Name: "load"}, Duty: 1e6, ReturnFraction: 1}))
			p.Connect("to prv", Pos{}, "main", "out", "prv", "in")
			p.Connect("low", Pos{}, "prv", "out", "mixed", "in")
			p.Connect("high", Pos{}, "main", "out", "mixed", "in")
			p.Connect("use", Pos{}, "mixed", "out", "load", "in")
			p.Connect("ret", Pos{}, "load", "out", "hotwell", "in")
		}, `unit "mixed": its inlets "low" at 4 bar(a) and "high" at 8 bar(a) come at different pressures`},
		{"returns without a return line", func(t *testing.T, p *Plant) {
			must(t, p.Add(&Consumer{Base: Base{Name: "load"}, Duty: 1e6, ReturnFraction: 0.95}))
			p.Connect("use", Pos{}, "main", "out", "load", "in")
		}, `unit "load": returns 95 % of its condensate, but has no return line`},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p := base(t)
			tc.build(t, p)
			err := p.Check()
			if err == nil || !strings.Contains(err.Error(), tc.want) {
				t.Errorf("Check: %v\nwant a fault containing %q", err, tc.want)
			}
		})
	}
}
