package combustion_test

import (
	"errors"
	"fmt"

	"steamcase/plant/combustion"
	"steamcase/plant/fuel"
)

// Burn the built-in HSFO at 3 % dry O2 with humid air and atomising steam.
func ExampleFire() {
	f, _ := fuel.Grade("HSFO")
	p, err := combustion.Fire(f, combustion.Conditions{
		O2Dry:            0.03,
		AirT:             308.15, // 35 °C
		FuelT:            393.15, // 120 °C
		RelativeHumidity: 0.6,
		AtomisingSteam:   0.02,
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	xd, xw := p.MoleFractions(false), p.MoleFractions(true)
	fmt.Printf("λ %.4f, air %.3f kg/kg, flue gas %.3f kg/kg\n", p.Lambda, p.Air, p.FlueGas)
	fmt.Printf("dry CO2 %.2f %%, wet H2O %.2f %%\n", 100*xd[combustion.CO2], 100*xw[combustion.H2O])
	cp, _ := p.FlueGasCp(523.15)
	fmt.Printf("flue-gas cp at 250 °C %.4f kJ/(kg·K)\n", cp/1e3)
	// Output:
	// λ 1.1577, air 16.253 kg/kg, flue gas 17.273 kg/kg
	// dry CO2 13.72 %, wet H2O 12.41 %
	// flue-gas cp at 250 °C 1.1149 kJ/(kg·K)
}

// The heat-loss efficiency on both bases, with the Siegert cross-check.
func ExampleEfficiency() {
	f, _ := fuel.Grade("HSFO")
	p, _ := combustion.Fire(f, combustion.Conditions{O2Dry: 0.03, AirT: 308.15, FuelT: 308.15})
	l, err := combustion.Efficiency(p, 523.15, 308.15, combustion.LossOptions{
		COppmDry:      30,
		UnburntSolids: 0.1,
		Radiation:     combustion.Radiation{PercentAtMCR: 0.7, LoadFraction: 0.8},
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, b := range []combustion.LossItems{l.LHV, l.HHV} {
		fmt.Printf("%v: dry gas %.2f, moisture %.2f, CO %.2f, radiation %.3f -> η %.2f %%\n",
			b.Basis, b.DryGas, b.Moisture(), b.CO, b.Radiation, b.Efficiency)
	}
	q, _ := combustion.Siegert(523.15, 308.15, 0.03, combustion.SiegertFuelOil)
	fmt.Printf("Siegert %.2f %%\n", q)
	// Output:
	// net (LHV): dry gas 8.61, moisture 0.99, CO 0.01, radiation 0.875 -> η 89.42 %
	// gross (HHV): dry gas 8.14, moisture 6.48, CO 0.01, radiation 0.828 -> η 84.44 %
	// Siegert 9.63 %
}

// No air, no fire: an error, never a NaN.
func ExampleFire_noAir() {
	f, _ := fuel.Grade("MGO")
	_, err := combustion.Fire(f, combustion.Conditions{})
	fmt.Println(errors.Is(err, combustion.ErrCannotFire))
	// Output: true
}

func ExampleAcidDewPoint() {
	f, _ := fuel.Grade("HSFO")
	p, _ := combustion.Fire(f, combustion.Conditions{Lambda: 1.15})
	vb, _ := combustion.AcidDewPoint(p, 101325, 0.03, combustion.MethodVerhoffBanchero)
	ok, _ := combustion.AcidDewPoint(p, 101325, 0.03, combustion.MethodOkkes)
	fmt.Printf("Verhoff-Banchero %.1f °C, Okkes %.1f °C\n", vb-273.15, ok-273.15)
	// Output: Verhoff-Banchero 151.2 °C, Okkes 145.0 °C
}
