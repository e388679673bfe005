package fuel_test

import (
	"fmt"

	"steamcase/plant/fuel"
)

// The built-in HSFO grade: its energy with sources, and the temperature for
// a pressure-jet burner's 13 cSt.
func ExampleGrade() {
	f, err := fuel.Grade("hsfo")
	if err != nil {
		fmt.Println(err)
		return
	}
	e, _ := f.Energy()
	fmt.Printf("net %.1f MJ/kg from %v\n", e.Net/1e6, e.NetSource)
	fmt.Printf("gross %.2f MJ/kg from %v\n", e.Gross/1e6, e.GrossSource.Route)
	T, _ := f.TemperatureForViscosity(13e-6)
	fmt.Printf("13 cSt at %.1f °C\n", T-273.15)
	co2, _ := f.CO2()
	fmt.Printf("CO2 %.3f kg/kg\n", co2.Value)
	// Output:
	// net 40.2 MJ/kg from set value (IMO MEPC.364(79) LCV, HFO (RME-RMK))
	// gross 42.60 MJ/kg from set LHV plus latent heat of product water from the analysis
	// 13 cSt at 134.4 °C
	// CO2 3.114 kg/kg
}

// A user's own fuel from a bunker delivery note.
func ExampleISO8217Energy() {
	net, gross, err := fuel.ISO8217Energy(991, 0.005, 0.0005, 0.025)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("net %.3f, gross %.3f MJ/kg\n", net/1e6, gross/1e6)
	// Output: net 40.165, gross 42.453 MJ/kg
}

func ExampleNewWalther() {
	w, err := fuel.NewWalther(
		fuel.ViscosityPoint{T: 323.15, Nu: 380e-6},
		fuel.ViscosityPoint{T: 373.15, Nu: 35e-6})
	if err != nil {
		fmt.Println(err)
		return
	}
	nu, _ := w.Viscosity(393.15)
	fmt.Printf("%.1f cSt at 120 °C\n", nu*1e6)
	_, err = w.Temperature(0.5e-6)
	fmt.Println(err != nil)
	// Output:
	// 18.9 cSt at 120 °C
	// true
}
