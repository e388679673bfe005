package combustion

import (
	"fmt"
	"strings"

	"steamcase/plant/fuel"
)

// Siegert CO-loss constants a in q_CO = a·CO/(CO + CO2) (%), CO and CO2 in
// dry vol %: 48 for fuel oil, 32 for gas (docs/reference/plant-checks.md §3.1 [S✓ analyser
// manual]).
const (
	SiegertCOOil = 48.0
	SiegertCOGas = 32.0
)

// Radiation gives the radiation and convection loss of the boiler casing in
// one of two forms. The zero value means no radiation loss (and Efficiency
// flags it with WarnNoRadiation).
type Radiation struct {
	// PercentAtMCR is the loss in percent of the fuel heat input (LHV basis)
	// at MCR, e.g. 0.5–1.5 % for marine auxiliary boilers (docs/reference/plant-checks.md
	// §3.4 [CP]). The loss in kW being roughly constant, the percentage is
	// scaled by 1/LoadFraction.
	PercentAtMCR float64
	// LoadFraction is the present load over MCR (0.05…1.2); zero means 1.
	LoadFraction float64

	// Loss is the loss as a heat flow (W), nearly constant with load, used
	// with FuelFlow (kg/s) to give a percentage of the heat input.
	Loss, FuelFlow float64
}

// LossOptions are the inputs of the heat-loss method beyond the products
// and the two temperatures.
type LossOptions struct {
	// COppmDry is the measured CO in the dry flue gas (ppm by volume); zero
	// means no CO loss.
	COppmDry float64
	// SiegertA is the constant of the CO loss; zero means SiegertCOOil for
	// liquid fuels and SiegertCOGas for gas.
	SiegertA float64
	// UnburntSolids is the unburnt-solids (soot, coke) loss in percent of the
	// LHV input; usually below 0.2 % for a well-tuned oil burner
	// (docs/reference/plant-checks.md §3.1 [M]).
	UnburntSolids float64
	// Radiation is the radiation and convection loss.
	Radiation Radiation
}

// Warning flags conditions the caller should see in a report.
type Warning uint

const (
	// WarnFuelSensibleNotModelled: the fuel is not at the reference
	// temperature but its sensible heat could not be computed (gas fuel or
	// no density); the fuel credit is taken as zero.
	WarnFuelSensibleNotModelled Warning = 1 << iota
	// WarnNoRadiation: no radiation and convection loss was given; it is
	// taken as zero.
	WarnNoRadiation
	// WarnLowLoadRadiation: radiation scaled by 1/load below quarter load,
	// where the scaling is crude.
	WarnLowLoadRadiation
)

var warningText = [...]string{
	"fuel sensible heat not modelled (taken as zero)",
	"no radiation and convection loss given (taken as zero)",
	"radiation loss scaled by 1/load below quarter load",
}

// String lists the warnings in words.
func (w Warning) String() string {
	if w == 0 {
		return "none"
	}
	var parts []string
	for i, t := range warningText {
		if w&(1<<i) != 0 {
			parts = append(parts, t)
		}
	}
	return strings.Join(parts, "; ")
}

// LossItems is the heat-loss account on one basis. Every item is in percent
// of the fuel heat input on that basis (HeatInput per kg fuel).
type LossItems struct {
	// Basis states whether the input is the net (LHV) or gross (HHV)
	// specific energy; Source says where that figure came from.
	Basis     fuel.Basis
	Source    fuel.Source
	HeatInput float64 // J/kg fuel

	// Losses (%).
	DryGas        float64 // sensible heat of the dry flue gas above the reference
	MoistureH     float64 // water from the fuel's hydrogen (latent included on HHV basis)
	MoistureFuel  float64 // the fuel's free water (latent included on HHV basis)
	MoistureAir   float64 // vapour brought by the air (sensible only)
	MoistureSteam float64 // atomising steam (sensible only)
	CO            float64 // unburnt gas, Siegert-type form
	Solids        float64 // unburnt solids
	Radiation     float64 // radiation and convection

	// Credits (%), heat brought in above the reference temperature.
	AirCredit   float64 // dry air and its vapour
	SteamCredit float64 // atomising steam
	FuelCredit  float64 // fuel sensible heat (Cragoe)

	TotalLoss, TotalCredit float64
	// Efficiency = 100 − TotalLoss + TotalCredit (%).
	Efficiency float64
}

// Moisture returns the sum of the four moisture losses (%).
func (l LossItems) Moisture() float64 {
	return l.MoistureH + l.MoistureFuel + l.MoistureAir + l.MoistureSteam
}

// Losses is the heat-loss (indirect) boiler efficiency on both bases.
type Losses struct {
	// FlueT and RefT are the flue-gas exit and reference temperatures (K).
	FlueT, RefT float64
	// CO2Dry and O2Dry are the flue gas's dry mole fractions (complete
	// combustion).
	CO2Dry, O2Dry float64
	// LHV and HHV are the accounts on the net and gross basis.
	LHV, HHV LossItems
	// Warnings flags what the caller should report.
	Warnings Warning
}

// Efficiency computes the boiler efficiency by the heat-loss method, itemised
// in the manner of ASME PTC 4 and EN 12952-15 (structure from memory,
// docs/reference/plant-checks.md §3.1 [S]): η = 100 − ΣL + ΣB, in percent of the fuel
// input, on the LHV and on the HHV basis.
//
//   - Dry flue gas: Σ n_i·[h_i(t_fg) − h_i(t_ref)] over N2, O2, CO2, SO2, Ar,
//     with NASA TM-4513 enthalpies.
//   - Moisture from hydrogen and from fuel water: vapour enthalpy rise from
//     t_ref to t_fg; on the HHV basis plus h_fg(25 °C) = 2441.7 kJ/kg. The
//     latent term is taken at 25 °C whatever t_ref (exact for t_ref = 25 °C).
//   - Moisture from air humidity and atomising steam: sensible only on both
//     bases (they enter and leave as vapour); their inlet heat is a credit.
//   - CO: Siegert-type q_CO = a·CO/(CO + CO2) on the LHV basis, scaled by
//     LHV/HHV for the HHV basis; the products are not corrected for the CO.
//   - Unburnt solids and radiation: as given (LHV basis), scaled likewise;
//     radiation as a constant heat flow is divided by each basis's input.
//   - Credits: dry air and its vapour from t_ref to AirT, atomising steam
//     from t_ref to its temperature, fuel sensible heat (Cragoe) from t_ref
//     to FuelT.
//
// For a reference temperature below 298.15 K, where the SO2 data of NASA
// TM-4513 stop, SO2 is continued with its 298.15 K heat capacity (a linear
// extrapolation of at most 45 K; SO2 is about 0.15 % of the dry gas).
//
// The specific energy is taken as valid at t_ref (the difference between its
// value at 25 °C and at another t_ref is neglected). With t_ref equal to the
// air temperature the dry-gas and moisture losses are those of Siegert's
// form. Blowdown is a plant loss outside this account.
func Efficiency(p Products, flueT, refT float64, o LossOptions) (Losses, error) {
	lf, err := checkLossInputs(p.Lambda, flueT, refT, o)
	if err != nil {
		return Losses{}, err
	}
	var out Losses
	out.FlueT, out.RefT = flueT, refT
	xd := p.MoleFractions(false)
	out.CO2Dry, out.O2Dry = xd[CO2], xd[O2]

	var t lossTerms
	if err := t.flueGas(&p, flueT, refT); err != nil {
		return Losses{}, err
	}
	if err := t.credits(&p, refT, &out.Warnings); err != nil {
		return Losses{}, err
	}
	t.qCO = coLoss(&p, &o, out.CO2Dry)
	t.radLHV = radiationLoss(&o.Radiation, lf, p.Energy.Net, &out.Warnings)
	t.items(&out.LHV, &p, o.UnburntSolids, fuel.Net)
	t.items(&out.HHV, &p, o.UnburntSolids, fuel.Gross)
	return out, nil
}

// checkLossInputs checks the products (by their air ratio lambda, zero
// for none), temperatures and options of Efficiency against their ranges
// and returns the load fraction (one when not given).
func checkLossInputs(lambda, flueT, refT float64, o LossOptions) (float64, error) {
	if lambda == 0 {
		return 0, fmt.Errorf("combustion: efficiency: products are empty (call Fire first)")
	}
	if !(refT >= 253.15 && refT <= 323.15) {
		return 0, fmt.Errorf("combustion: efficiency: reference temperature %g K; want 253.15…323.15 K (usually 298.15)", refT)
	}
	if !(flueT > refT && flueT <= 1273.15) {
		return 0, fmt.Errorf("combustion: efficiency: flue-gas temperature %g K; want above the reference %g K and at most 1273.15 K", flueT, refT)
	}
	if !(o.COppmDry >= 0 && o.COppmDry <= 1e5) {
		return 0, fmt.Errorf("combustion: efficiency: CO %g ppm; want 0…1e5 ppm", o.COppmDry)
	}
	if !(o.SiegertA >= 0 && o.SiegertA <= 100) {
		return 0, fmt.Errorf("combustion: efficiency: Siegert CO constant %g; want 0…100 (0 = default)", o.SiegertA)
	}
	if !(o.UnburntSolids >= 0 && o.UnburntSolids <= 10) {
		return 0, fmt.Errorf("combustion: efficiency: unburnt solids %g %%; want 0…10 %%", o.UnburntSolids)
	}
	r := o.Radiation
	if !(r.PercentAtMCR >= 0 && r.PercentAtMCR <= 10 && r.Loss >= 0 && r.FuelFlow >= 0) {
		return 0, fmt.Errorf("combustion: efficiency: radiation %+v: want PercentAtMCR 0…10 %%, Loss ≥ 0 W, FuelFlow ≥ 0 kg/s", r)
	}
	if r.PercentAtMCR != 0 && r.Loss != 0 {
		return 0, fmt.Errorf("combustion: efficiency: radiation given both as %g %% at MCR and as %g W; give one", r.PercentAtMCR, r.Loss)
	}
	if r.Loss != 0 && !(r.FuelFlow > 0) {
		return 0, fmt.Errorf("combustion: efficiency: radiation loss %g W needs the fuel flow (kg/s), got %g", r.Loss, r.FuelFlow)
	}
	lf := orDefault(r.LoadFraction, 1)
	if !(lf >= 0.05 && lf <= 1.2) {
		return 0, fmt.Errorf("combustion: efficiency: load fraction %g; want 0.05…1.2", lf)
	}
	return lf, nil
}

// lossTerms are the quantities of the heat-loss account per kg fuel
// (J/kg), and the CO and radiation losses on the LHV basis (%), from
// which each basis's items follow.
type lossTerms struct {
	qDry       float64 // dry flue gas, t_ref → t_fg
	hvRef, dhv float64 // water vapour at t_ref, and its rise t_ref → t_fg, J/kg water
	// Credits: dry air and its vapour, atomising steam, fuel sensible heat.
	qAirCredit, qSteamCredit, qFuelCredit float64
	qCO, radLHV                           float64 // %
}

// flueGas sets the heat the dry flue gas carries from t_ref to t_fg and
// the water vapour's enthalpy rise.
func (t *lossTerms) flueGas(p *Products, flueT, refT float64) error {
	dry := p.Moles
	dry[H2O] = 0
	hDryFg, err := amountsH(&dry, flueT)
	if err != nil {
		return fmt.Errorf("combustion: efficiency: dry flue gas: %w", err)
	}
	// SO2's data start at 298.15 K; below it (a reference temperature under
	// 25 °C) SO2 is continued with its 298.15 K heat capacity, see the doc.
	nSO2 := dry[SO2]
	dry[SO2] = 0
	hDryRef, err := amountsH(&dry, refT)
	if err != nil {
		return fmt.Errorf("combustion: efficiency: dry flue gas: %w", err)
	}
	hDryRef += nSO2 * so2HExtended(refT)
	t.qDry = hDryFg - hDryRef
	hvFg, err := H2O.H(flueT)
	if err != nil {
		return err
	}
	hvRef, err := H2O.H(refT)
	if err != nil {
		return err
	}
	t.hvRef = hvRef
	t.dhv = hvFg - hvRef // J/kg water vapour, t_ref → t_fg
	return nil
}

// credits sets the credits: the dry air and its vapour from t_ref to
// AirT, the atomising steam from t_ref to its temperature, and the fuel's
// sensible heat (Cragoe) from t_ref to FuelT where it is modelled (else
// a warning in w). It needs hvRef (flueGas).
func (t *lossTerms) credits(p *Products, refT float64, w *Warning) error {
	dryAir := p.AirAmounts
	dryAir[H2O] = 0
	hAirIn, err := amountsH(&dryAir, p.AirT)
	if err != nil {
		return fmt.Errorf("combustion: efficiency: air: %w", err)
	}
	hAirRef, err := amountsH(&dryAir, refT)
	if err != nil {
		return fmt.Errorf("combustion: efficiency: air: %w", err)
	}
	hvAir, err := H2O.H(p.AirT)
	if err != nil {
		return err
	}
	hvSteam, err := H2O.H(p.SteamT)
	if err != nil {
		return err
	}
	t.qAirCredit = hAirIn - hAirRef + p.WaterFromAir*(hvAir-t.hvRef)
	t.qSteamCredit = p.AtomisingSteam * (hvSteam - t.hvRef)
	switch {
	case p.FuelT == refT:
	case p.Fuel.Class != fuel.Gas && p.Fuel.ISO.Density15 != 0:
		if t.qFuelCredit, err = p.Fuel.SensibleHeat(refT, p.FuelT); err != nil {
			return fmt.Errorf("combustion: efficiency: fuel credit: %w", err)
		}
	default:
		*w |= WarnFuelSensibleNotModelled
	}
	return nil
}

// coLoss is the CO loss on the LHV basis (%), Siegert-type
// a·CO/(CO + CO2) with the fuel's default a unless o gives one.
func coLoss(p *Products, o *LossOptions, co2Dry float64) float64 {
	var qCO float64
	if o.COppmDry > 0 {
		a := o.SiegertA
		if a == 0 {
			a = SiegertCOOil
			if p.Fuel.Class == fuel.Gas {
				a = SiegertCOGas
			}
		}
		co := o.COppmDry * 1e-4 // vol %
		qCO = a * co / (co + 100*co2Dry)
	}
	return qCO
}

// radiationLoss is the radiation loss on the LHV basis (%): a percentage
// at MCR scaled by 1/load (lf), or a heat flow over the fuel's net heat
// input (net J/kg); none, with a warning in w, when r gives neither.
func radiationLoss(r *Radiation, lf, net float64, w *Warning) float64 {
	var radLHV float64
	switch {
	case r.PercentAtMCR != 0:
		radLHV = r.PercentAtMCR / lf
		if lf < 0.25 {
			*w |= WarnLowLoadRadiation
		}
	case r.Loss != 0:
		radLHV = 100 * r.Loss / (r.FuelFlow * net)
	default:
		*w |= WarnNoRadiation
	}
	return radLHV
}

// items draws up in l the loss account on one basis: each loss and credit in
// percent of the basis's heat input, the latent heat of the moisture
// from hydrogen and fuel water on the HHV basis only, the CO, solids
// (solids, % of the LHV input) and radiation losses scaled from the LHV
// basis.
func (t *lossTerms) items(l *LossItems, p *Products, solids float64, basis fuel.Basis) {
	*l = LossItems{Basis: basis}
	var latent float64
	if basis == fuel.Net {
		l.HeatInput, l.Source = p.Energy.Net, p.Energy.NetSource
	} else {
		l.HeatInput, l.Source = p.Energy.Gross, p.Energy.GrossSource
		latent = fuel.LatentHeat25
	}
	pct := 100 / l.HeatInput
	scale := p.Energy.Net / l.HeatInput // LHV-basis percentages to this basis
	l.DryGas = t.qDry * pct
	l.MoistureH = p.WaterFromH * (t.dhv + latent) * pct
	l.MoistureFuel = p.WaterFromFuel * (t.dhv + latent) * pct
	l.MoistureAir = p.WaterFromAir * t.dhv * pct
	l.MoistureSteam = p.AtomisingSteam * t.dhv * pct
	l.CO = t.qCO * scale
	l.Solids = solids * scale
	l.Radiation = t.radLHV * scale
	l.AirCredit = t.qAirCredit * pct
	l.SteamCredit = t.qSteamCredit * pct
	l.FuelCredit = t.qFuelCredit * pct
	l.TotalLoss = l.DryGas + l.Moisture() + l.CO + l.Solids + l.Radiation
	l.TotalCredit = l.AirCredit + l.SteamCredit + l.FuelCredit
	l.Efficiency = 100 - l.TotalLoss + l.TotalCredit
}

// SiegertCoefficients are the constants of Siegert's flue-gas loss formula.
type SiegertCoefficients struct {
	A1, A2, B float64
}

// Siegert coefficient sets, German 1. BImSchV annex on flue-gas loss
// (docs/reference/plant-checks.md §3.2 [S]: structure seen, coefficients from memory).
var (
	SiegertFuelOil    = SiegertCoefficients{A1: 0.50, A2: 0.68, B: 0.007}
	SiegertNaturalGas = SiegertCoefficients{A1: 0.37, A2: 0.66, B: 0.009}
)

// Siegert returns the flue-gas loss (% of net input) by Siegert's formula in
// its O2 form, q_A = (t_A − t_L)·(A2/(21 − O2) + B), for flue-gas and air
// temperatures in K and the dry O2 mole fraction (0.03 for 3 %). A cross-check
// of the detailed dry-gas plus moisture loss on the LHV basis.
func Siegert(flueT, airT, o2Dry float64, c SiegertCoefficients) (float64, error) {
	if !(flueT >= airT && airT > 200 && flueT < 1300) {
		return 0, fmt.Errorf("combustion: Siegert: flue %g K and air %g K; want 200 K < air ≤ flue < 1300 K", flueT, airT)
	}
	if !(o2Dry >= 0 && o2Dry < 0.21) {
		return 0, fmt.Errorf("combustion: Siegert: dry O2 %g; want 0…0.21", o2Dry)
	}
	return (flueT - airT) * (c.A2/(21-100*o2Dry) + c.B), nil
}

// SiegertCO2 is Siegert's formula in its CO2 form, q_A = (t_A − t_L)·(A1/CO2
// + B), CO2 as the dry mole fraction.
func SiegertCO2(flueT, airT, co2Dry float64, c SiegertCoefficients) (float64, error) {
	if !(flueT >= airT && airT > 200 && flueT < 1300) {
		return 0, fmt.Errorf("combustion: Siegert: flue %g K and air %g K; want 200 K < air ≤ flue < 1300 K", flueT, airT)
	}
	if !(co2Dry > 0.01 && co2Dry < 0.3) {
		return 0, fmt.Errorf("combustion: Siegert: dry CO2 %g; want 0.01…0.3", co2Dry)
	}
	return (flueT - airT) * (c.A1/(100*co2Dry) + c.B), nil
}

// so2HExtended returns SO2's H(T) − H(298.15 K) (J/mol), continued below
// 298.15 K with the 298.15 K heat capacity.
func so2HExtended(T float64) float64 {
	if T >= TRef {
		h, _ := SO2.HMolar(T) // T ≤ 323.15 K here: inside the range
		return h
	}
	cp, _ := SO2.CpMolar(TRef)
	return cp * (T - TRef)
}
