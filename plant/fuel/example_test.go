package fuel_test

import (
	"fmt"

	"steamcase/plant/fuel"
)

// The built-in HSFO grade: its energy with sources, the IMO figure kept
// apart, the temperature for a pressure-jet burner's 13 cSt, and its CO2
// both ways.
func ExampleGrade() {
	f, err := fuel.Grade("hsfo")
	if err != nil {
		fmt.Println(err)
		return
	}
	e, _ := f.Energy()
	fmt.Printf("net %.3f MJ/kg from %v\n", e.Net/1e6, e.NetSource)
	fmt.Printf("gross %.3f MJ/kg\n", e.Gross/1e6)
	fmt.Printf("IMO LCV %.1f MJ/kg (%s)\n", e.IMOLCV/1e6, e.IMOSource)
	fmt.Printf("analysis C %.2f %%, H %.2f %%\n", 100*f.Analysis.C, 100*f.Analysis.H)
	T, _ := f.TemperatureForViscosity(13e-6)
	fmt.Printf("13 cSt at %.1f °C\n", T-273.15)
	co2, _ := f.CO2()
	fmt.Printf("CO2 %.3f kg/kg by the analysis, %.3f by the IMO factor\n", co2.Analysis, co2.IMO)
	// Output:
	// net 40.487 MJ/kg from ISO 8217 annex formula (density, water, ash, sulfur)
	// gross 42.794 MJ/kg
	// IMO LCV 40.2 MJ/kg (IMO MEPC.364(79) para 2.1, HFO (ISO 8217 RME-RMK))
	// analysis C 86.12 %, H 10.88 %
	// 13 cSt at 134.4 °C
	// CO2 3.156 kg/kg by the analysis, 3.114 by the IMO factor
}

// The annex formula for a residual fuel (docs/reference/plant-checks.md §1.1 row 2).
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

// A delivered fuel from its bunker delivery note, on top of the VLSFO
// grade (an invented delivery).
func ExampleFromBDN() {
	base, _ := fuel.Grade("VLSFO")
	d, err := fuel.FromBDN(base, fuel.BDN{
		Name:      "VLSFO, invented delivery 1",
		Grade:     "RMG 380",
		Density15: 975,
		Sulfur:    0.0048,
		Water:     0.002, // 0.2 % V/V
		Ash:       0.0004,
		Viscosity: 320e-6, // 320 mm²/s at 50 °C
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("net %.3f MJ/kg (%v), IMO LCV %.1f MJ/kg\n", d.Energy.Net/1e6, d.Energy.NetSource.Route, d.Energy.IMOLCV/1e6)
	a := d.Fuel.Analysis
	fmt.Printf("C %.2f, H %.2f, S %.2f, water %.3f %% m/m\n", 100*a.C, 100*a.H, 100*a.S, 100*a.Water)
	fmt.Printf("CO2 %.3f (analysis), %.3f (IMO) kg/kg\n", d.CO2.Analysis, d.CO2.IMO)
	fmt.Printf("Channiwala-Parikh %.2f MJ/kg against ISO gross %.2f\n", d.AnalysisGross/1e6, d.ISOGross/1e6)
	for _, w := range d.Warnings {
		fmt.Println("warning:", w)
	}
	// Output:
	// net 41.164 MJ/kg (ISO 8217 annex formula (density, water, ash, sulfur)), IMO LCV 40.2 MJ/kg
	// C 87.35, H 11.23, S 0.48, water 0.205 % m/m
	// CO2 3.201 (analysis), 3.114 (IMO) kg/kg
	// Channiwala-Parikh 43.72 MJ/kg against ISO gross 43.55
	// warning: fuel "VLSFO, invented delivery 1": one viscosity stated: the ASTM D341 line through it keeps the slope of the base fuel's line (B = 3.5025), giving 32 mm²/s at 100 °C; give a second point to replace it
}
