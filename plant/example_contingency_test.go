package plant_test

import (
	"context"
	"fmt"

	"steamcase/plant"
	"steamcase/plant/fuel"
)

// A two-boiler plant of 2 × 10 t/h whose demand goes beyond both boilers'
// MCR: the case is solved with them at their limit and the lowest
// priority (the accommodation, "hotel") is shed before the cargo heating
// ("cargo"); and a case both boilers carry, with its N-1 line: if one
// trips, the other at 100 % is short and sheds by priority. (An invented
// plant; the figures are the engine's own, not a reference.)
func Example_shortfall() {
	hfo, err := fuel.Grade("HSFO")
	if err != nil {
		panic(err)
	}
	spec, err := plant.SpecFromFuel(hfo)
	if err != nil {
		panic(err)
	}
	eta := &plant.EfficiencyTable{Load: []float64{0.25, 1}, Eta: []float64{0.82, 0.86}}
	p := plant.New("Invented Two-Boiler Ship", plant.Options{})
	add := func(c plant.Component, name string) {
		c.Ident().Name = name
		if err := p.Add(c); err != nil {
			panic(err)
		}
	}
	add(plant.NewMakeUp(), "makeup")
	add(plant.NewFeedTank(), "hotwell")
	pump := plant.NewFeedPump()
	pump.Boilers = []string{"AB1", "AB2"}
	add(pump, "feed pump")
	add(plant.NewHeader(), "feed header")
	for _, name := range []string{"AB1", "AB2"} {
		b := plant.NewBoiler()
		b.MCR, b.DrumP, b.Turndown = 10000.0/3600, 8e5, 4 // 10 t/h at 7 bar(g)
		b.Efficiency, b.Fuel = eta, spec
		add(b, name)
	}
	add(plant.NewHeader(), "main")
	for _, c := range []struct {
		name     string
		duty, pr float64
	}{{"accommodation", 1e6, 20}, {"cargo heating", 6e6, 30}} {
		u := plant.NewConsumer()
		u.Duty, u.ReturnFraction, u.Priority = c.duty, 0.95, c.pr
		add(u, c.name)
	}
	line := func(name, from, fromPort, to, toPort string) {
		p.Connect(name, plant.Pos{}, from, fromPort, to, toPort)
	}
	line("makeup", "makeup", "out", "hotwell", "in")
	line("suction", "hotwell", "out", "feed pump", "in")
	line("discharge", "feed pump", "out", "feed header", "in")
	line("feed AB1", "feed header", "out", "AB1", "feed")
	line("feed AB2", "feed header", "out", "AB2", "feed")
	line("steam AB1", "AB1", "steam", "main", "in")
	line("steam AB2", "AB2", "steam", "main", "in")
	for _, c := range []string{"accommodation", "cargo heating"} {
		line("to "+c, "main", "out", c, "in")
		line("return from "+c, c, "out", "hotwell", "in")
	}

	r, err := p.Solve(context.Background(), plant.Case{Name: "too much",
		Set: []plant.Setting{{Unit: "cargo heating", Param: "duty", Value: 12e6}}})
	if err != nil {
		panic(err)
	}
	fmt.Printf("%s: can carry %v, steam %.0f kg/h, short %.0f kg/h\n", r.Name, r.CanCarry, r.SteamProductionKgS*3600, r.ShortfallKgS*3600)
	for _, c := range r.Consumers {
		fmt.Printf("  %s: %.0f of %.0f kW delivered\n", c.Name, c.DutyW/1e3, c.RequestedW/1e3)
	}
	r, err = p.Solve(context.Background(), plant.Case{Name: "7 MW"})
	if err != nil {
		panic(err)
	}
	fmt.Printf("%s: can carry %v\n  N-1: %s\n", r.Name, r.CanCarry, plant.ContingencyLine(r.Contingencies[0]))
	// Output:
	// too much: can carry false, steam 20000 kg/h, short 2860 kg/h
	//   accommodation: 0 of 1000 kW delivered
	//   cargo heating: 11374 of 12000 kW delivered
	// 7 MW: can carry true
	//   N-1: if AB2 trips: AB1 at 100 %, short 2.3 t/h; shed: accommodation 1.00 MW, cargo heating 313 kW of 6.00 MW
}
