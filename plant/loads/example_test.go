package loads_test

import (
	"fmt"

	"steamcase/plant/fuel"
	"steamcase/plant/loads"
)

// A wing cargo tank from its dimensions, holding 60 °C in a cold sea, then
// left unheated: how long until the cargo reaches its cloud point?
func ExampleTankFromDimensions() {
	// A waxy crude: pour point 12 °C; HM 40 gives the cloud point.
	cloud, err := loads.CloudPointHM40(273.15 + 12)
	if err != nil {
		fmt.Println(err)
		return
	}
	crude := loads.Cargo{Name: "waxy crude", Density: 870} // Cragoe at s = 870/999.016
	tank, err := loads.TankFromDimensions("COT 3P", crude, loads.Dimensions{
		Length: 40, Breadth: 12, Depth: 24, Fill: 0.98,
		DoubleBottom: 2.2, DoubleSide: 2.4, Layout: loads.Wing,
		WeatherDeck: true, SideAboveWater: 0.35,
		AdjacentT: 273.15 + 30, // unheated centre tank and neighbours
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	amb := loads.Ambient{Sea: 273.15 + 8, Air: 273.15 + 2}
	tank.To = 273.15 + 60
	r, err := tank.Duty(amb)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("cargo %.0f m³, ΣUA %.2f kW/K, hold 60 °C: %.0f kW\n", tank.CargoVolume, r.UA/1e3, r.Duty/1e3)
	cd, err := tank.TimeToCool(273.15+60, cloud+5, amb)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("cloud point %.1f °C; heating off, the cargo is at cloud point + 5 K after %.0f h\n",
		cloud-273.15, cd.Elapsed/3600)
	// The figures were checked by hand (areas, ΣUA and the loss, face by
	// face) and the 235 h by an independent RK4 integration with Cragoe's c.
	//
	// Output:
	// cargo 8204 m³, ΣUA 25.21 kW/K, hold 60 °C: 908 kW
	// cloud point 26.8 °C; heating off, the cargo is at cloud point + 5 K after 235 h
}

// The engine's fuel heater brings HSFO (380 cSt at 50 °C) to 13 cSt.
func ExampleFuelHeater_Duty() {
	hsfo, err := fuel.Grade("HSFO")
	if err != nil {
		fmt.Println(err)
		return
	}
	h := loads.FuelHeater{
		Name: "ME FO heater", Service: loads.EngineService, Fuel: hsfo,
		MassFlow: 3000.0 / 3600, InletT: 273.15 + 95, // 3 t/h from the service tank
		TargetViscosity: 13e-6, OutletLimit: 273.15 + 150,
	}
	r, err := h.Duty()
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("outlet %.1f °C, %.1f kJ/kg, duty %.1f kW, warnings %d\n",
		r.OutletT-273.15, r.PerKg/1e3, r.Duty/1e3, len(r.Warnings))
	// 134.4 °C is docs/reference/plant-checks.md §5.1 check B [C]; the heat by hand:
	// [1.685·39.4 + 0.001695·(134.4² − 95²)]/√0.98597 ≈ 82.3 kJ/kg.
	//
	// Output:
	// outlet 134.4 °C, 82.4 kJ/kg, duty 68.7 kW, warnings 0
}

// A turbine-driven cargo pump's shaft power.
func ExampleCargoPump_Power() {
	r, err := loads.CargoPump{Name: "COP 1", Flow: 5000.0 / 3600, Head: 140, Density: 870, Efficiency: 0.85}.Power()
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("hydraulic %.2f MW, shaft %.2f MW\n", r.Hydraulic/1e6, r.Shaft/1e6)
	// Output:
	// hydraulic 1.66 MW, shaft 1.95 MW
}

// Two tanks: one held, one heated up before discharge.
func ExampleCargoHeating() {
	hfo := loads.Cargo{Name: "fuel oil cargo", Density: 980, SG: 0.98}
	shell := []loads.Boundary{
		{Name: "deck", Area: 600, U: 4.5, Beyond: loads.Air},
		{Name: "double hull", Area: 2400, U: 3.5, Beyond: loads.Sea},
	}
	tanks := []loads.TankHeating{
		{Name: "COT 1C", Cargo: hfo, CargoVolume: 9000, Boundaries: shell, Mode: loads.Hold, To: 273.15 + 50},
		{Name: "COT 2C", Cargo: hfo, CargoVolume: 9000, Boundaries: shell,
			Mode: loads.HeatUp, From: 273.15 + 50, To: 273.15 + 60, Duration: 96 * 3600},
	}
	r, err := loads.CargoHeating(tanks, loads.Ambient{Sea: 273.15 + 10, Air: 273.15 + 5})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, t := range r.Tanks {
		fmt.Printf("%s %-7s %6.1f kW\n", t.Name, t.Mode, t.Duty/1e3)
	}
	fmt.Printf("total          %6.1f kW\n", r.Duty/1e3)
	// By hand: hold 2700·45 + 8400·40 W = 457.5 kW; heat-up 8.82e6 kg ×
	// 1890.45 J/(kg·K) (Cragoe at 55 °C, s 0.98) × 10 K / 345 600 s = 482.5 kW
	// plus losses at 55 °C 2700·50 + 8400·45 W = 513 kW.
	//
	// Output:
	// COT 1C hold     457.5 kW
	// COT 2C heat-up  995.5 kW
	// total          1453.0 kW
}
