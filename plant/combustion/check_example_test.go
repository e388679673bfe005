package combustion_test

import (
	"fmt"

	"steamcase/plant/combustion"
	"steamcase/plant/fuel"
)

// A flue-gas reading of a boiler firing HSFO: 3.5 % O2 at 280 °C with 30 °C
// air, 50 ppm CO, 1 % radiation loss at MCR, at half load.
func ExampleCheckFlueGas() {
	f, _ := fuel.Grade("HSFO")
	c, err := combustion.CheckFlueGas(combustion.FlueGasReading{
		Fuel: f, Gas: combustion.MeasuredO2, Dry: 0.035,
		FlueT: 553.15, AirT: 303.15, // 280 °C, 30 °C
		COppmDry: 50, RadiationAtMCR: 0.01, Load: 0.5,
	}, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	l := &c.Losses
	fmt.Printf("λ %.4f, dry CO2 %.2f %%\n", c.Products.Lambda, 100*c.Dry[combustion.CO2])
	fmt.Printf("efficiency %.2f %% (LHV), %.2f %% (HHV)\n", l.LHV.Efficiency, l.HHV.Efficiency)
	fmt.Printf("Siegert %.2f %% against %.2f %% in detail\n", c.Siegert.Loss, c.Siegert.Detailed)
	d := &c.DewPoint
	fmt.Printf("acid dew point %.1f °C (Okkes %.1f °C), the gas %.1f K above it\n", d.VerhoffBanchero-273.15, d.Okkes-273.15, d.Margin)
	fmt.Println(len(c.Warnings), "warnings")

	// A reading of the O2 of air is refused, naming the field.
	_, err = combustion.CheckFlueGas(combustion.FlueGasReading{Fuel: f, Gas: combustion.MeasuredO2, Dry: 0.209, FlueT: 553.15, AirT: 303.15}, nil)
	fmt.Println(err)
	// Output:
	// λ 1.1893, dry CO2 13.34 %
	// efficiency 86.52 % (LHV), 81.70 % (HHV)
	// Siegert 11.46 % against 11.46 % in detail
	// acid dew point 150.6 °C (Okkes 144.4 °C), the gas 129.4 K above it
	// 0 warnings
	// combustion: flue-gas reading: Dry (O2) = 20.9 %: no combustion: an O2 at or near that of air (20.946 % dry, which analysers show as 20.9 %): the burner is not firing, or the probe is not in the flue gas
}
