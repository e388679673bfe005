package plant

import (
	"context"
	"math"
	"strings"
	"testing"

	"steamcase/plant/combustion"
)

func ecoPlant(t *testing.T, withEco bool, ua float64) *Plant {
	spec := hsfo(t)
	tab := &FlueGasTable{Load: []float64{0.3, 1}, FlueT: []float64{553.15, 603.15}, O2Dry: []float64{0.05, 0.03}, RadiationAtMCR: 0.01}
	p := New("economiser", Options{})
	must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 333.15}))
	must(t, p.Add(&FeedTank{Base: Base{Name: "hotwell"}}))
	must(t, p.Add(&FeedPump{Base: Base{Name: "fp"}, Boilers: []string{"b1"}, Margin: 2e5, Eta: 0.5}))
	must(t, p.Add(&Boiler{Base: Base{Name: "b1"}, MCR: 10000.0 / 3600, DrumP: gauge(7), Efficiency: tab, Fuel: spec}))
	must(t, p.Add(&Consumer{Base: Base{Name: "load"}, SteamFlow: 6000.0 / 3600}))
	p.Connect("mu", Pos{}, "makeup", "out", "hotwell", "in")
	p.Connect("suction", Pos{}, "hotwell", "out", "fp", "in")
	if withEco {
		must(t, p.Add(&Economiser{Base: Base{Name: "eco"}, Boiler: "b1", UA: ua}))
		p.Connect("discharge", Pos{}, "fp", "out", "eco", "in")
		p.Connect("feed", Pos{}, "eco", "out", "b1", "feed")
	} else {
		p.Connect("feed", Pos{}, "fp", "out", "b1", "feed")
	}
	p.Connect("steam", Pos{}, "b1", "steam", "load", "in")
	return p
}

func TestEconomiser(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	c := Case{Name: "sea", Conditions: Conditions{AirT: 308.15}}
	plain, err := ecoPlant(t, false, 0).Solve(ctx, c)
	must(t, err)
	cr, err := ecoPlant(t, true, 2000).Solve(ctx, c)
	must(t, err)
	var eco map[string]float64
	for _, u := range cr.Units {
		if u.Name == "eco" {
			eco = u.Figures.Map()
		}
	}
	b := cr.Boilers[0]
	// The economiser cools the gas and warms the feed; the same steam then
	// needs less fuel.
	if !(eco["gas_out_T_K"] < eco["gas_in_T_K"]-10) || !(eco["water_out_T_K"] > eco["water_in_T_K"]+5) {
		t.Errorf("economiser figures %v", eco)
	}
	if !(cr.FuelKgS < plain.FuelKgS) {
		t.Errorf("fuel with economiser %g kg/s, without %g kg/s; want less", cr.FuelKgS, plain.FuelKgS)
	}
	// Energy on the gas side equals energy on the water side: the
	// combined efficiency from the plant's balance equals the heat-loss
	// method's efficiency at the economiser's gas outlet (ASME PTC 4
	// structure, plant/combustion), to the economiser's mean-cp
	// approximation (within 0.1 point).
	f := *hsfo(t).Fuel
	prod, err := combustion.Fire(f, combustion.Conditions{Lambda: b.Lambda, AirT: 308.15})
	must(t, err)
	l, err := combustion.Efficiency(prod, b.FlueT, combustion.TRef, combustion.LossOptions{
		Radiation: combustion.Radiation{PercentAtMCR: 1, LoadFraction: b.LoadFraction}})
	must(t, err)
	if math.Abs(100*b.Efficiency-l.LHV.Efficiency) > 0.1 {
		t.Errorf("combined efficiency %.3f %%, heat-loss method at %.1f °C gives %.3f %%", 100*b.Efficiency, b.FlueT-273.15, l.LHV.Efficiency)
	}
	if eco["approach_K"] <= 0 {
		t.Errorf("approach %g K, want positive (no steaming)", eco["approach_K"])
	}
	if cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
		t.Errorf("balances %+v", cr.Balance)
	}
	// Feed water near its boiling point at the economiser's pressure
	// boils in it: a warning, not a silent state.
	p := New("steaming", Options{})
	tab := &FlueGasTable{Load: []float64{1}, FlueT: []float64{603.15}, O2Dry: []float64{0.03}}
	must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 372.15, P: 1.05e5}))
	must(t, p.Add(&Economiser{Base: Base{Name: "eco"}, Boiler: "b1", UA: 2e4}))
	must(t, p.Add(&Boiler{Base: Base{Name: "b1"}, MCR: 1, DrumP: gauge(7), Efficiency: tab, Fuel: hsfo(t)}))
	must(t, p.Add(&Consumer{Base: Base{Name: "load"}, SteamFlow: 0.3}))
	p.Connect("mu", Pos{}, "makeup", "out", "eco", "in")
	p.Connect("feed", Pos{}, "eco", "out", "b1", "feed")
	p.Connect("steam", Pos{}, "b1", "steam", "load", "in")
	cr, err = p.Solve(ctx, c)
	must(t, err)
	found := false
	for _, w := range cr.Warnings {
		found = found || strings.Contains(w, "must not steam")
	}
	if !found {
		t.Errorf("no steaming warning among %q", cr.Warnings)
	}
}

func TestEconomiserOfColdBoiler(t *testing.T) {
	t.Parallel()
	// With the exhaust-gas economiser covering the demand, the oil-fired
	// boiler and its economiser carry no flow: the solve must still find
	// the balance (the economiser's water leaves as it came).
	p := New("cold boiler", Options{})
	drum := gauge(7)
	tab := &FlueGasTable{Load: []float64{1}, FlueT: []float64{603.15}, O2Dry: []float64{0.03}}
	must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 333.15, P: 1e5}))
	must(t, p.Add(&FeedTank{Base: Base{Name: "hotwell"}, P: 1e5}))
	must(t, p.Add(&FeedPump{Base: Base{Name: "fp"}, Boilers: []string{"b1"}, Margin: 2e5, Eta: 0.5}))
	must(t, p.Add(&Header{Base: Base{Name: "feed header"}}))
	must(t, p.Add(&ExhaustGasEconomiser{Base: Base{Name: "ege"}, Engine: egeEngine(), DrumP: drum,
		DesignLoad: 1, DesignPinch: 15, GasCp: 1060}))
	must(t, p.Add(&Economiser{Base: Base{Name: "eco"}, Boiler: "b1", UA: 2000}))
	must(t, p.Add(&Boiler{Base: Base{Name: "b1"}, MCR: 10000.0 / 3600, DrumP: drum, Efficiency: tab, Fuel: hsfo(t)}))
	must(t, p.Add(&Header{Base: Base{Name: "main"}}))
	must(t, p.Add(&Consumer{Base: Base{Name: "heating"}, SteamFlow: 1000.0 / 3600}))
	must(t, p.Add(&Condenser{Base: Base{Name: "dump"}, Dump: true, SubCooling: 80}))
	for _, c := range [][4]string{
		{"makeup", "out", "hotwell", "in"}, {"hotwell", "out", "fp", "in"}, {"fp", "out", "feed header", "in"},
		{"feed header", "out", "ege", "feed"}, {"feed header", "out", "eco", "in"}, {"eco", "out", "b1", "feed"},
		{"ege", "steam", "main", "in"}, {"b1", "steam", "main", "in"}, {"main", "out", "heating", "in"},
		{"main", "out", "dump", "in"}, {"dump", "out", "hotwell", "in"},
	} {
		p.Connect(c[0]+" to "+c[2], Pos{}, c[0], c[1], c[2], c[3])
	}
	cr, err := p.Solve(context.Background(), Case{Name: "sea", Conditions: Conditions{EngineLoad: 1}})
	must(t, err)
	if cr.BoilersFiring != 0 || !(cr.DumpedKgS > 0) {
		t.Errorf("firing %d, dumped %g; want the economiser alone and steam dumped", cr.BoilersFiring, cr.DumpedKgS)
	}
	if cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
		t.Errorf("balances %+v", cr.Balance)
	}
}
