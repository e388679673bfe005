package combustion

import (
	"errors"
	"fmt"
	"math"

	"steamcase/plant/fuel"
)

// ErrCannotFire is wrapped by every error that means the burner cannot fire:
// no air, air without oxygen, or less air than complete combustion needs.
var ErrCannotFire = errors.New("the burner cannot fire")

// NormalMolarVolume is the ideal-gas molar volume at 0 °C and 101.325 kPa,
// R·273.15/101325 = 0.0224140 m³/mol (docs/reference/plant-checks.md §0 uses 22.414
// Nm³/kmol [CP]).
const NormalMolarVolume = 8.314462618 * 273.15 / 101325

// Limits on the firing conditions (common practice, no source).
const (
	MaxLambda      = 20.0   // air ratio
	MinAirT        = 233.15 // K, −40 °C
	MaxAirT        = 773.15 // K, 500 °C (preheated air)
	MaxHumidity    = 0.2    // kg water/kg dry air
	MaxAtomising   = 1.0    // kg steam/kg fuel
	DefaultT       = TRef   // K, used for a zero AirT or FuelT
	StandardP      = 101325.0
	airCompTol     = 1e-6
	maxMeasuredCO2 = 0.30
)

// Stoich holds the stoichiometric figures of a fuel with a given dry air,
// per kg of fuel.
type Stoich struct {
	// O2Min is the oxygen for complete combustion (mol/kg):
	// c/M_C + h/(4·M_H) + s/M_S − o/(2·M_O), with the atomic weights of
	// package fuel (docs/reference/plant-checks.md §2 writes c/12.011 + h/4.032 + s/32.06 −
	// o/31.998 in kmol/kg).
	O2Min float64
	// AirMol and Air are the stoichiometric dry air (mol/kg, kg/kg).
	AirMol, Air float64
	// DryFlueMol is the stoichiometric dry flue gas V_fd0 (mol/kg).
	DryFlueMol float64
	// CO2Max is the CO2 mole fraction of the stoichiometric dry flue gas.
	CO2Max float64
	// AirO2 is the O2 mole fraction of the dry air used.
	AirO2 float64
}

// Ratio returns V_fd0/V_a0, stoichiometric dry flue gas over stoichiometric
// air (both by volume).
func (s Stoich) Ratio() float64 { return s.DryFlueMol / s.AirMol }

func checkDryAir(air [NumSpecies]float64) ([NumSpecies]float64, error) {
	if air == ([NumSpecies]float64{}) {
		return StandardDryAir, nil
	}
	var sum float64
	for i, x := range air {
		if !(x >= 0 && x <= 1) {
			return air, fmt.Errorf("combustion: dry air mole fraction of %v is %g; want 0…1", Species(i), x)
		}
		switch Species(i) {
		case N2, O2, Ar, CO2:
		default:
			if x != 0 {
				return air, fmt.Errorf("combustion: dry air contains %v (%g); only N2, O2, Ar and CO2 are accepted (give humidity separately)", Species(i), x)
			}
		}
		sum += x
	}
	if !(math.Abs(sum-1) <= airCompTol) {
		return air, fmt.Errorf("combustion: dry air mole fractions sum to %g; want 1 ± %g", sum, airCompTol)
	}
	if !(air[O2] > 0) {
		return air, fmt.Errorf("combustion: the air contains no oxygen: %w", ErrCannotFire)
	}
	return air, nil
}

// Stoichiometry returns the stoichiometric figures of fuel f burnt with the
// dry air dryAir (mole fractions; zero value: StandardDryAir). Complete
// combustion: C → CO2, H → H2O, S → SO2, fuel N → N2 (textbook
// stoichiometry, docs/reference/plant-checks.md §2 [CP]).
func Stoichiometry(f fuel.Fuel, dryAir [NumSpecies]float64) (Stoich, error) {
	if err := f.Validate(); err != nil {
		return Stoich{}, fmt.Errorf("combustion: %w", err)
	}
	if !f.Analysis.Given() {
		return Stoich{}, fmt.Errorf("combustion: fuel %q has no ultimate analysis; stoichiometry needs C, H, S, N, O", f.Name)
	}
	air, err := checkDryAir(dryAir)
	if err != nil {
		return Stoich{}, err
	}
	a := f.Analysis
	nC := a.C / fuel.AtomicC
	nH2 := a.H / (2 * fuel.AtomicH)
	nS := a.S / fuel.AtomicS
	nO2 := a.O / (2 * fuel.AtomicO)
	nN2 := a.N / (2 * fuel.AtomicN)
	o2min := nC + nH2/2 + nS - nO2
	if !(o2min > 0) {
		return Stoich{}, fmt.Errorf("combustion: fuel %q needs no oxygen (O2_min %g mol/kg): not a fuel", f.Name, o2min)
	}
	airMol := o2min / air[O2]
	var airM float64
	for i, x := range air {
		airM += x * thermoTable[i].molar
	}
	dry := nC + nS + nN2 + airMol*(air[N2]+air[Ar]+air[CO2])
	return Stoich{
		O2Min:      o2min,
		AirMol:     airMol,
		Air:        airMol * airM,
		DryFlueMol: dry,
		CO2Max:     (nC + airMol*air[CO2]) / dry,
		AirO2:      air[O2],
	}, nil
}

// LambdaFromO2 returns the air ratio λ from the O2 mole fraction measured in
// the dry flue gas, exactly for complete combustion:
//
//	λ = 1 + O2/(O2_air − O2) · V_fd0/V_a0
//
// (docs/reference/plant-checks.md §2 [CP], with O2_air the air's O2 fraction in place of
// 0.2095). ratio is V_fd0/V_a0 (Stoich.Ratio).
func LambdaFromO2(o2Dry, ratio, airO2 float64) (float64, error) {
	if !(airO2 > 0 && airO2 <= 1) {
		return 0, fmt.Errorf("combustion: air O2 fraction %g: %w", airO2, ErrCannotFire)
	}
	if !(o2Dry >= 0 && o2Dry < airO2) {
		return 0, fmt.Errorf("combustion: measured dry O2 %g is not in 0…%g (the air's O2): no combustion, %w", o2Dry, airO2, ErrCannotFire)
	}
	if !(ratio > 0.5 && ratio < 1.5) {
		return 0, fmt.Errorf("combustion: V_fd0/V_a0 = %g; want 0.5…1.5", ratio)
	}
	return 1 + o2Dry/(airO2-o2Dry)*ratio, nil
}

// LambdaFromO2Approx returns the usual approximation λ ≈ 21/(21 − O2), with
// O2 the dry mole fraction (0.03 for 3 %). It takes V_fd0 = V_a0 and so
// overstates λ − 1 by about 6 % for fuel oils (docs/reference/plant-checks.md §2 [CP]).
func LambdaFromO2Approx(o2Dry float64) (float64, error) {
	if !(o2Dry >= 0 && o2Dry < 0.21) {
		return 0, fmt.Errorf("combustion: measured dry O2 %g is not in 0…0.21: no combustion, %w", o2Dry, ErrCannotFire)
	}
	return 0.21 / (0.21 - o2Dry), nil
}

// LambdaFromCO2 returns λ from the CO2 mole fraction measured in the dry
// flue gas: λ = 1 + (CO2max/CO2 − 1)·V_fd0/V_a0 (docs/reference/plant-checks.md §2 [CP]).
func LambdaFromCO2(co2Dry, co2Max, ratio float64) (float64, error) {
	if !(co2Max > 0 && co2Max < 1) {
		return 0, fmt.Errorf("combustion: CO2max %g; want 0…1", co2Max)
	}
	if !(co2Dry > 0 && co2Dry <= co2Max) {
		return 0, fmt.Errorf("combustion: measured dry CO2 %g is not in (0, CO2max %g]: with complete combustion the CO2 cannot exceed CO2max, and zero CO2 means no combustion", co2Dry, co2Max)
	}
	if !(ratio > 0.5 && ratio < 1.5) {
		return 0, fmt.Errorf("combustion: V_fd0/V_a0 = %g; want 0.5…1.5", ratio)
	}
	return 1 + (co2Max/co2Dry-1)*ratio, nil
}

// Conditions describe one firing condition. Zero values take the defaults
// stated per field.
type Conditions struct {
	// Excess air: exactly one of Lambda, O2Dry or CO2Dry must be set.
	//
	// Lambda is the air ratio, actual over stoichiometric dry air (≥ 1).
	Lambda float64
	// O2Dry is the measured O2 mole fraction in the dry flue gas (0.03 = 3 %).
	O2Dry float64
	// CO2Dry is the measured CO2 mole fraction in the dry flue gas.
	CO2Dry float64

	// AirT and FuelT are the air and fuel temperatures at the burner (K);
	// zero means 298.15 K.
	AirT, FuelT float64
	// Humidity is the humidity ratio (kg water vapour/kg dry air). Give
	// either Humidity or RelativeHumidity (0…1, at AirT and AirPressure),
	// not both; both zero means dry air.
	Humidity, RelativeHumidity float64
	// AirPressure is the air pressure (Pa) for RelativeHumidity; zero means
	// 101325 Pa.
	AirPressure float64
	// AtomisingSteam is the atomising steam (kg/kg fuel), leaving with the
	// flue gas; AtomisingSteamT its temperature (K), zero meaning AirT. It
	// is treated as ideal-gas water vapour.
	AtomisingSteam, AtomisingSteamT float64
	// DryAir is the dry air composition (mole fractions of N2, O2, Ar, CO2);
	// the zero value means StandardDryAir.
	DryAir [NumSpecies]float64
}

// Products is the result of burning 1 kg of fuel completely under given
// Conditions. Flows are per kg of fuel: kg/kg and mol/kg.
type Products struct {
	// Fuel is the fuel burnt; Energy its specific energies with sources.
	Fuel   fuel.Fuel
	Energy fuel.Energy
	// Stoich holds the stoichiometric figures for this fuel and air.
	Stoich Stoich
	// Lambda is the air ratio used.
	Lambda float64

	// DryAirMol and DryAir are the actual dry air (mol/kg, kg/kg).
	DryAirMol, DryAir float64
	// HumidityRatio is the humidity ratio of the air (kg/kg dry air).
	HumidityRatio float64
	// Air is the wet air, dry air plus its vapour (kg/kg fuel).
	Air float64
	// Water entering the flue gas by origin (kg/kg fuel): from the fuel's
	// hydrogen, from the fuel's free water, with the air, as atomising steam.
	WaterFromH, WaterFromFuel, WaterFromAir, AtomisingSteam float64

	// Moles and Mass are the wet flue gas by species (mol/kg, kg/kg).
	Moles, Mass [NumSpecies]float64
	// FlueGas is the wet flue gas (kg/kg fuel); DryFlueGas without H2O.
	FlueGas, DryFlueGas float64
	// Ash is the ash leaving as solid (kg/kg fuel).
	Ash float64

	// Flue, DryFlue and AirMix are the wet flue gas, the dry flue gas and the
	// wet combustion air as mixtures, for enthalpy and cp.
	Flue, DryFlue, AirMix Mixture
	// AirAmounts are the moles of each species in the wet air (mol/kg fuel).
	AirAmounts [NumSpecies]float64

	// AirT, FuelT, SteamT are the inlet temperatures used (K).
	AirT, FuelT, SteamT float64
	// FuelSensible is the fuel's sensible heat above 298.15 K (J/kg) by
	// Cragoe; FuelSensibleKnown is false when it could not be computed
	// (gas fuel, or no density) and FuelT differs from 298.15 K.
	FuelSensible      float64
	FuelSensibleKnown bool
}

// TotalMoles returns the wet flue gas (mol/kg fuel).
func (p *Products) TotalMoles() float64 {
	var n float64
	for _, v := range p.Moles {
		n += v
	}
	return n
}

// DryMoles returns the dry flue gas (mol/kg fuel).
func (p *Products) DryMoles() float64 { return p.TotalMoles() - p.Moles[H2O] }

// MoleFractions returns the flue-gas mole (volume) fractions, wet or dry.
func (p *Products) MoleFractions(wet bool) [NumSpecies]float64 {
	var x [NumSpecies]float64
	n := p.TotalMoles()
	if !wet {
		n -= p.Moles[H2O]
	}
	for i, v := range p.Moles {
		if !wet && Species(i) == H2O {
			continue
		}
		x[i] = v / n
	}
	return x
}

// MassFractions returns the flue-gas mass fractions, wet or dry.
func (p *Products) MassFractions(wet bool) [NumSpecies]float64 {
	var y [NumSpecies]float64
	m := p.FlueGas
	if !wet {
		m = p.DryFlueGas
	}
	for i, v := range p.Mass {
		if !wet && Species(i) == H2O {
			continue
		}
		y[i] = v / m
	}
	return y
}

// NormalVolume returns the flue-gas volume at 0 °C and 101.325 kPa per kg of
// fuel (m³/kg), wet or dry, as an ideal gas.
func (p *Products) NormalVolume(wet bool) float64 {
	if wet {
		return p.TotalMoles() * NormalMolarVolume
	}
	return p.DryMoles() * NormalMolarVolume
}

// FlueGasH returns the wet flue gas's h(T) − h(298.15 K) (J/kg flue gas).
func (p *Products) FlueGasH(T float64) (float64, error) { return p.Flue.H(T) }

// FlueGasCp returns the wet flue gas's cp (J/(kg·K)) at T (K).
func (p *Products) FlueGasCp(T float64) (float64, error) { return p.Flue.Cp(T) }

// AirH returns the wet air's h(T) − h(298.15 K) (J/kg wet air).
func (p *Products) AirH(T float64) (float64, error) { return p.AirMix.H(T) }

// AirCp returns the wet air's cp (J/(kg·K)) at T (K).
func (p *Products) AirCp(T float64) (float64, error) { return p.AirMix.Cp(T) }

func orDefault(v, d float64) float64 {
	if v == 0 {
		return d
	}
	return v
}

// Fire burns 1 kg of fuel f completely under conditions c: complete
// combustion (no CO, no soot, no dissociation, no NOx), sulfur to SO2, ash
// inert. It returns the air and flue-gas flows and compositions. An error
// wraps ErrCannotFire when there is no air, no oxygen in the air, or less
// air than complete combustion needs.
func Fire(f fuel.Fuel, c Conditions) (Products, error) {
	st, err := Stoichiometry(f, c.DryAir)
	if err != nil {
		return Products{}, err
	}
	air, _ := checkDryAir(c.DryAir) // already checked by Stoichiometry
	energy, err := f.Energy()
	if err != nil {
		return Products{}, fmt.Errorf("combustion: %w", err)
	}

	// Excess air.
	set := 0
	for _, v := range [3]float64{c.Lambda, c.O2Dry, c.CO2Dry} {
		if v != 0 {
			set++
		}
	}
	if set == 0 {
		return Products{}, fmt.Errorf("combustion: fuel %q: no air given (Lambda, O2Dry and CO2Dry all zero): %w without air", f.Name, ErrCannotFire)
	}
	if set > 1 {
		return Products{}, fmt.Errorf("combustion: fuel %q: give one of Lambda (%g), O2Dry (%g), CO2Dry (%g), not several", f.Name, c.Lambda, c.O2Dry, c.CO2Dry)
	}
	lambda := c.Lambda
	switch {
	case c.O2Dry != 0:
		if lambda, err = LambdaFromO2(c.O2Dry, st.Ratio(), st.AirO2); err != nil {
			return Products{}, fmt.Errorf("combustion: fuel %q: %w", f.Name, err)
		}
	case c.CO2Dry != 0:
		if !(c.CO2Dry <= maxMeasuredCO2) {
			return Products{}, fmt.Errorf("combustion: fuel %q: measured dry CO2 %g; want 0…%g", f.Name, c.CO2Dry, maxMeasuredCO2)
		}
		if lambda, err = LambdaFromCO2(c.CO2Dry, st.CO2Max, st.Ratio()); err != nil {
			return Products{}, fmt.Errorf("combustion: fuel %q: %w", f.Name, err)
		}
	}
	if !(lambda >= 1) {
		return Products{}, fmt.Errorf("combustion: fuel %q: air ratio λ = %g is below 1: less air than complete combustion needs (this model burns completely only), %w", f.Name, lambda, ErrCannotFire)
	}
	if !(lambda <= MaxLambda) {
		return Products{}, fmt.Errorf("combustion: fuel %q: air ratio λ = %g; want 1…%g", f.Name, lambda, MaxLambda)
	}

	// Temperatures.
	airT := orDefault(c.AirT, DefaultT)
	fuelT := orDefault(c.FuelT, DefaultT)
	steamT := orDefault(c.AtomisingSteamT, airT)
	if !(airT >= MinAirT && airT <= MaxAirT) {
		return Products{}, fmt.Errorf("combustion: air temperature %g K; want %g…%g K", airT, MinAirT, MaxAirT)
	}
	if c.AtomisingSteam != 0 && !(steamT >= 273.15 && steamT <= 873.15) {
		return Products{}, fmt.Errorf("combustion: atomising steam temperature %g K; want 273.15…873.15 K", steamT)
	}
	if !(fuelT >= MinAirT && fuelT <= 573.15) {
		return Products{}, fmt.Errorf("combustion: fuel temperature %g K; want %g…573.15 K", fuelT, MinAirT)
	}

	// Humidity.
	hum := c.Humidity
	switch {
	case c.Humidity != 0 && c.RelativeHumidity != 0:
		return Products{}, fmt.Errorf("combustion: give Humidity (%g) or RelativeHumidity (%g), not both", c.Humidity, c.RelativeHumidity)
	case c.RelativeHumidity != 0:
		if hum, err = HumidityRatio(c.RelativeHumidity, airT, orDefault(c.AirPressure, StandardP), air); err != nil {
			return Products{}, err
		}
	}
	if !(hum >= 0 && hum <= MaxHumidity) {
		return Products{}, fmt.Errorf("combustion: humidity ratio %g kg/kg dry air; want 0…%g", hum, MaxHumidity)
	}
	if !(c.AtomisingSteam >= 0 && c.AtomisingSteam <= MaxAtomising) {
		return Products{}, fmt.Errorf("combustion: atomising steam %g kg/kg fuel; want 0…%g", c.AtomisingSteam, MaxAtomising)
	}

	a := f.Analysis
	p := Products{
		Fuel: f, Energy: energy, Stoich: st, Lambda: lambda,
		DryAirMol: lambda * st.AirMol, DryAir: lambda * st.Air,
		HumidityRatio: hum, AirT: airT, FuelT: fuelT, SteamT: steamT,
		Ash: a.Ash, AtomisingSteam: c.AtomisingSteam,
	}
	mH2O := H2O.MolarMass()
	p.WaterFromH = a.H / (2 * fuel.AtomicH) * mH2O
	p.WaterFromFuel = a.Water
	p.WaterFromAir = hum * p.DryAir
	p.Air = p.DryAir + p.WaterFromAir

	for i, x := range air {
		p.AirAmounts[i] = x * p.DryAirMol
	}
	p.AirAmounts[H2O] = p.WaterFromAir / mH2O

	n := &p.Moles
	n[CO2] = a.C/fuel.AtomicC + p.AirAmounts[CO2]
	n[H2O] = (p.WaterFromH + p.WaterFromFuel + p.WaterFromAir + p.AtomisingSteam) / mH2O
	n[SO2] = a.S / fuel.AtomicS
	n[N2] = a.N/(2*fuel.AtomicN) + p.AirAmounts[N2]
	n[O2] = p.AirAmounts[O2] - st.O2Min
	n[Ar] = p.AirAmounts[Ar]
	if n[O2] < 0 { // rounding at λ = 1
		n[O2] = 0
	}
	for i := range n {
		p.Mass[i] = n[i] * thermoTable[i].molar
		p.FlueGas += p.Mass[i]
	}
	p.DryFlueGas = p.FlueGas - p.Mass[H2O]
	if p.Flue, err = NewMixture(p.Moles); err != nil {
		return Products{}, err
	}
	dry := p.Moles
	dry[H2O] = 0
	if p.DryFlue, err = NewMixture(dry); err != nil {
		return Products{}, err
	}
	if p.AirMix, err = NewMixture(p.AirAmounts); err != nil {
		return Products{}, err
	}

	// Fuel sensible heat above 298.15 K (Cragoe, liquid fuels only).
	switch {
	case fuelT == TRef:
		p.FuelSensibleKnown = true
	case f.Class != fuel.Gas && f.ISO.Density15 != 0:
		q, err := f.SensibleHeat(TRef, fuelT)
		if err != nil {
			return Products{}, fmt.Errorf("combustion: fuel sensible heat: %w", err)
		}
		p.FuelSensible, p.FuelSensibleKnown = q, true
	}
	return p, nil
}
