package combustion

import (
	"fmt"
	"math"
)

// AdiabaticFlameTemperature returns the adiabatic flame temperature (K) of
// the products: complete combustion, NO dissociation (CO2, H2O stay whole;
// real flames above about 2000 K are cooler), no heat loss, ash and its
// heat ignored. The energy balance is
//
//	Σ n_i·[h_i(T_ad) − h_i(298.15)] = LHV + H_air(AirT) + H_steam(SteamT) + q_fuel(FuelT)
//
// with the fuel's net specific energy (as chosen by fuel.Fuel.Energy), the wet
// air and atomising steam enthalpies above 298.15 K from the NASA
// polynomials and the fuel's Cragoe sensible heat. When the fuel's sensible
// heat is not modelled (gas fuel away from 298.15 K) it is taken as zero and
// WarnFuelSensibleNotModelled is returned.
func AdiabaticFlameTemperature(p Products) (float64, Warning, error) {
	if p.Lambda == 0 {
		return 0, 0, fmt.Errorf("combustion: flame temperature: products are empty (call Fire first)")
	}
	var w Warning
	hAir, err := amountsH(&p.AirAmounts, p.AirT)
	if err != nil {
		return 0, 0, fmt.Errorf("combustion: flame temperature: air: %w", err)
	}
	hSteam, err := H2O.H(p.SteamT)
	if err != nil {
		return 0, 0, err
	}
	if !p.FuelSensibleKnown {
		w |= WarnFuelSensibleNotModelled
	}
	avail := p.Energy.Net + hAir + p.AtomisingSteam*hSteam + p.FuelSensible
	const tMax = 5000.0 // the SO2 polynomial's upper end
	hMax, err := amountsH(&p.Moles, tMax)
	if err != nil {
		return 0, 0, err
	}
	if avail >= hMax {
		return 0, w, fmt.Errorf("combustion: flame temperature: above %g K, outside the NASA polynomials' range", tMax)
	}
	T := 2000.0
	for range 50 {
		h, err := amountsH(&p.Moles, T)
		if err != nil {
			return 0, w, err
		}
		c, err := amountsCp(&p.Moles, T)
		if err != nil {
			return 0, w, err
		}
		step := (h - avail) / c
		T = math.Min(math.Max(T-step, TRef), tMax)
		if math.Abs(step) < 1e-9 {
			return T, w, nil
		}
	}
	return 0, w, fmt.Errorf("combustion: flame temperature: Newton iteration did not converge")
}
