package plant_test

import (
	"context"
	"fmt"

	"steamcase/plant"
	"steamcase/plant/fuel"
)

// A two-boiler plant built in Go: make-up into a vented hotwell, a feed
// pump to the boilers' drums, both boilers on one main header feeding a
// heating consumer that returns its condensate. The firing rule fires one
// boiler while the demand stays within 85 % of its MCR, both above. (An
// invented plant; the figures are the engine's own, not a reference.)
func Example() {
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
	heating := plant.NewConsumer()
	heating.Duty, heating.ReturnFraction = 3e6, 0.95
	add(heating, "heating")
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
	line("to heating", "main", "out", "heating", "in")
	line("return", "heating", "out", "hotwell", "in")

	for _, duty := range []float64{3e6, 6e6} {
		c := plant.Case{Name: fmt.Sprintf("%.0f MW", duty/1e6), Set: []plant.Setting{{Unit: "heating", Param: "duty", Value: duty}}}
		r, err := p.Solve(context.Background(), c)
		if err != nil {
			panic(err)
		}
		fmt.Printf("%s: %d boiler(s) firing, steam %.0f kg/h, fuel %.1f kg/h\n",
			r.Name, r.BoilersFiring, r.SteamProductionKgS*3600, r.FuelKgS*3600)
	}
	// Output:
	// 3 MW: 1 boiler(s) firing, steam 5275 kg/h, fuel 366.3 kg/h
	// 6 MW: 2 boiler(s) firing, steam 10551 kg/h, fuel 732.6 kg/h
}
