package plant

import (
	"fmt"
	"math"

	"steamcase/plant/combustion"
)

// FlueGasTable is a maker's test given as flue-gas exit temperature and
// dry O2 against load: the heat-loss method (plant/combustion, in the
// manner of ASME PTC 4 and EN 12952-15) turns each point into an
// efficiency on the LHV basis. It needs the boiler's full fuel
// (FuelSpec.Fuel). Between the tested loads temperature and O2 are
// interpolated linearly; outside them the end values hold, with a warning.
type FlueGasTable struct {
	Load  []float64 // fractions of MCR, strictly increasing
	FlueT []float64 // flue-gas exit temperature, K
	O2Dry []float64 // O2 in the dry flue gas, mole fraction (0.03 = 3 %)

	// RadiationAtMCR is the radiation and convection loss at MCR as a
	// fraction of the heat input (0.5-1.5 % for marine auxiliary boilers,
	// plant-checks.md §3.4 [CP]); the loss in kW is taken as constant, so
	// the fraction grows as 1/load.
	RadiationAtMCR float64
	// RelativeHumidity of the combustion air, 0..1 (zero: dry air).
	RelativeHumidity float64
	// AtomisingSteam is the burner's atomising steam, kg per kg fuel, which
	// leaves with the flue gas (it is taken from the plant by a consumer).
	AtomisingSteam float64
	// COppm is the CO in the dry flue gas, ppm by volume.
	COppm float64
}

// Validate checks the table.
func (t *FlueGasTable) Validate() error {
	n := len(t.Load)
	if n == 0 || len(t.FlueT) != n || len(t.O2Dry) != n {
		return fmt.Errorf("flue-gas table needs as many exit temperatures and O2 readings as loads and at least one; got %d loads, %d temperatures, %d O2", n, len(t.FlueT), len(t.O2Dry))
	}
	for i := range t.Load {
		if !finite(t.Load[i]) || t.Load[i] < 0 || t.Load[i] > 1.5 {
			return fmt.Errorf("flue-gas table load %g is not a fraction of MCR between 0 and 1.5", t.Load[i])
		}
		if i > 0 && t.Load[i] <= t.Load[i-1] {
			return fmt.Errorf("flue-gas table loads must increase; %g follows %g", t.Load[i], t.Load[i-1])
		}
		if !finite(t.FlueT[i]) || t.FlueT[i] < 323.15 || t.FlueT[i] > 873.15 {
			return fmt.Errorf("flue-gas exit temperature %.1f °C at load %g is outside 50-600 °C", t.FlueT[i]-273.15, t.Load[i])
		}
		if !finite(t.O2Dry[i]) || t.O2Dry[i] < 0 || t.O2Dry[i] >= 0.2 {
			return fmt.Errorf("flue-gas O2 %.1f %% at load %g is outside 0-20 %%", 100*t.O2Dry[i], t.Load[i])
		}
	}
	if t.RadiationAtMCR < 0 || t.RadiationAtMCR > 0.1 {
		return fmt.Errorf("radiation loss at MCR %.2f %% is outside 0-10 %%", 100*t.RadiationAtMCR)
	}
	if t.RelativeHumidity < 0 || t.RelativeHumidity > 1 {
		return fmt.Errorf("relative humidity %g is not a fraction between 0 and 1", t.RelativeHumidity)
	}
	if t.AtomisingSteam < 0 || t.AtomisingSteam > 1 || t.COppm < 0 || t.COppm > 1e5 {
		return fmt.Errorf("atomising steam (%g kg/kg) or CO (%g ppm) out of range", t.AtomisingSteam, t.COppm)
	}
	return nil
}

// Basis is "LHV".
func (t *FlueGasTable) Basis() string { return "LHV" }

// Efficiency computes the efficiency at op by the heat-loss method.
func (t *FlueGasTable) Efficiency(op BoilerOperation) (EfficiencyPoint, error) {
	if op.Fuel.Fuel == nil {
		return EfficiencyPoint{}, fmt.Errorf("a flue-gas efficiency table needs the fuel's analysis; fuel %q has none", op.Fuel.Name)
	}
	ft, w1 := interpolate(t.Load, t.FlueT, op.Load, "flue-gas table")
	o2, _ := interpolate(t.Load, t.O2Dry, op.Load, "flue-gas table")
	return lossMethod(op, ft, combustion.Conditions{O2Dry: o2}, t.RadiationAtMCR, t.RelativeHumidity, t.AtomisingSteam, t.COppm, w1)
}

// lossMethod fires the fuel under c at op's air temperature and returns the
// heat-loss efficiency at exit temperature flueT, referred to 25 °C.
func lossMethod(op BoilerOperation, flueT float64, c combustion.Conditions, radAtMCR, rh, atomising, co float64, warn string) (EfficiencyPoint, error) {
	c.AirT = op.AirT
	c.RelativeHumidity = rh
	c.AtomisingSteam = atomising
	prod, err := combustion.Fire(*op.Fuel.Fuel, c)
	if err != nil {
		return EfficiencyPoint{}, err
	}
	load := math.Max(op.Load, 0.05)
	lo := combustion.LossOptions{COppmDry: co}
	if radAtMCR > 0 {
		lo.Radiation = combustion.Radiation{PercentAtMCR: 100 * radAtMCR, LoadFraction: load}
	}
	l, err := combustion.Efficiency(prod, flueT, combustion.TRef, lo)
	if err != nil {
		return EfficiencyPoint{}, err
	}
	items := l.LHV
	return EfficiencyPoint{
		Eta:            items.Efficiency / 100,
		Warning:        warn,
		FlueT:          flueT,
		Lambda:         prod.Lambda,
		AirPerFuel:     prod.Air,
		FlueGasPerFuel: prod.FlueGas,
		Losses:         &items,
		Products:       &prod,
		LossOptions:    lo,
	}, nil
}
