package schema_test

import (
	"context"
	"encoding/json"
	"fmt"

	"steamcase/plant"
	"steamcase/plant/schema"
)

// A load case of an invented one-boiler plant in its schema form: the
// figures in the units their keys name, six significant digits, and null
// for the sea and air temperatures the case did not give. The fuel is
// docs/reference/plant-checks.md §3.6 [C]'s 736.4 kg/h = 17.674 t/d within its ±0.2 %.
func ExampleNewCase() {
	p := plant.New("Invented Coaster", plant.Options{})
	p.Add(&plant.MakeUp{Base: plant.Base{Name: "makeup"}, T: 333.15, P: 1e5})
	p.Add(&plant.Boiler{Base: plant.Base{Name: "AB1"}, MCR: 4, DrumP: 7e5 + 101325,
		Efficiency: &plant.EfficiencyTable{Load: []float64{0.2, 1.1}, Eta: []float64{0.85, 0.85}},
		Fuel:       plant.FuelSpec{Name: "HFO", LHV: 40.2e6, CO2Factor: 3.114}})
	p.Add(&plant.Consumer{Base: plant.Base{Name: "load"}, SteamFlow: 10000.0 / 3600})
	p.Connect("feed", plant.Pos{}, "makeup", "out", "AB1", "feed")
	p.Connect("steam", plant.Pos{}, "AB1", "steam", "load", "in")
	cr, err := p.Solve(context.Background(), plant.Case{Name: "port stay", Pos: plant.Pos{File: "coaster.lua", Line: 12}})
	if err != nil {
		fmt.Println(err)
		return
	}
	c := schema.NewCase(p.Name, cr)
	b, _ := json.Marshal(struct {
		Name   string   `json:"name"`
		Source string   `json:"source"`
		Sea    *float64 `json:"sea_T_K"`
		Steam  float64  `json:"steam_demand_kg_h"`
		Fuel   float64  `json:"fuel_kg_h"`
		PerDay float64  `json:"fuel_t_per_day"`
	}{c.Name, c.Source, c.SeaTK, c.SteamDemandKgH, c.FuelKgH, c.FuelTPerDay})
	fmt.Println(string(b))
	// Output:
	// {"name":"port stay","source":"coaster.lua:12","sea_T_K":null,"steam_demand_kg_h":10000,"fuel_kg_h":736.655,"fuel_t_per_day":17.6797}
}
