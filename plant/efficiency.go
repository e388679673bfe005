package plant

import (
	"errors"
	"fmt"
	"math"

	"steamcase/plant/combustion"
	"steamcase/plant/heat"
)

// The efficiency models of an oil-fired boiler, at three levels of
// knowledge: a maker's test of efficiency against load (EfficiencyTable),
// a maker's test of flue-gas exit temperature and O2 against load turned
// into efficiency by the heat-loss method (FlueGasTable), and the
// furnace's radiation and the smoke tubes' convection from the boiler's
// geometry (FurnaceTubes).

// BoilerOperation is the state of a boiler that its efficiency may depend
// on.
type BoilerOperation struct {
	Load  float64 // steam flow as a fraction of MCR (the firing rate while firing)
	DrumP float64 // Pa
	FeedT float64 // K
	AirT  float64 // combustion air temperature, K
	// FuelFlow is the fuel flow while the burner fires, kg/s (the
	// time-averaged flow over the on fraction when it cycles).
	FuelFlow float64
	Fuel     FuelSpec
}

// EfficiencyPoint is a boiler's efficiency at one operating point, with
// what a combustion model knows besides.
type EfficiencyPoint struct {
	// Eta is heat to steam and blowdown over fuel flow times the LHV.
	Eta float64
	// Warning says where the model went outside the range it knows.
	Warning string

	// From a combustion model (zero when the model is a plain table):
	FlueT          float64 // flue-gas exit temperature, K
	Lambda         float64 // air ratio
	AirPerFuel     float64 // wet combustion air, kg/kg fuel
	FlueGasPerFuel float64 // wet flue gas, kg/kg fuel
	Losses         *combustion.LossItems
	// Products and LossOptions let a flue-gas economiser after the boiler
	// redo the loss account at its own gas outlet temperature.
	Products    *combustion.Products
	LossOptions combustion.LossOptions
}

// EfficiencyModel gives a boiler's efficiency: heat to steam and blowdown
// divided by fuel flow times the fuel's lower calorific value. A maker's
// test table is the simplest; the combustion models compute it by the
// heat-loss method.
type EfficiencyModel interface {
	Efficiency(op BoilerOperation) (EfficiencyPoint, error)
	// Basis names the calorific value the efficiency refers to ("LHV").
	Basis() string
}

// EfficiencyTable is a maker's test: efficiency (LHV basis) against load
// fraction of MCR, interpolated linearly. Outside the tested loads it holds
// the end value and says so in a warning.
type EfficiencyTable struct {
	Load []float64 // fractions of MCR, strictly increasing
	Eta  []float64 // efficiencies, 0..1
}

// Validate checks the table.
func (t *EfficiencyTable) Validate() error {
	if len(t.Load) == 0 || len(t.Load) != len(t.Eta) {
		return fmt.Errorf("efficiency table needs as many efficiencies as loads and at least one; got %d loads and %d efficiencies", len(t.Load), len(t.Eta))
	}
	for i := range t.Load {
		if !finite(t.Load[i]) || t.Load[i] < 0 || t.Load[i] > 1.5 {
			return fmt.Errorf("efficiency table load %g is not a fraction of MCR between 0 and 1.5", t.Load[i])
		}
		if i > 0 && t.Load[i] <= t.Load[i-1] {
			return fmt.Errorf("efficiency table loads must increase; %g follows %g", t.Load[i], t.Load[i-1])
		}
		if !finite(t.Eta[i]) || t.Eta[i] <= 0.3 || t.Eta[i] > 1 {
			return fmt.Errorf("efficiency %g at load %g is not between 0.3 and 1", t.Eta[i], t.Load[i])
		}
	}
	return nil
}

// Efficiency interpolates the table at op.Load.
func (t *EfficiencyTable) Efficiency(op BoilerOperation) (EfficiencyPoint, error) {
	eta, warn := interpolate(t.Load, t.Eta, op.Load, "efficiency table")
	return EfficiencyPoint{Eta: eta, Warning: warn}, nil
}

// interpolate is linear interpolation in a table of loads; outside the
// table it holds the end value and returns a warning that says so.
func interpolate(loads, vals []float64, x float64, what string) (float64, string) {
	n := len(loads)
	switch {
	case x <= loads[0]:
		if x < loads[0]-1e-9 && n > 1 {
			return vals[0], fmt.Sprintf("load %.0f %% is below the %s's lowest load %.0f %%; its value there is used", 100*x, what, 100*loads[0])
		}
		return vals[0], ""
	case x >= loads[n-1]:
		if x > loads[n-1]+1e-9 {
			return vals[n-1], fmt.Sprintf("load %.0f %% is above the %s's highest load %.0f %%; its value there is used", 100*x, what, 100*loads[n-1])
		}
		return vals[n-1], ""
	}
	i := 1
	for loads[i] < x {
		i++
	}
	f := (x - loads[i-1]) / (loads[i] - loads[i-1])
	return vals[i-1] + f*(vals[i]-vals[i-1]), ""
}

// Basis is "LHV".
func (t *EfficiencyTable) Basis() string { return "LHV" }

// tableSlope is the derivative of interpolate(loads, vals, x) with respect
// to x on the segment that interpolate takes: zero where it holds an end
// value.
func tableSlope(loads, vals []float64, x float64) float64 {
	n := len(loads)
	if x <= loads[0] || x >= loads[n-1] {
		return 0
	}
	i := 1
	for loads[i] < x {
		i++
	}
	return (vals[i] - vals[i-1]) / (loads[i] - loads[i-1])
}

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
	// docs/reference/plant-checks.md §3.4 [CP]); the loss in kW is taken as constant, so
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

// loadOnly: the table reads the load, the air temperature and the fuel of
// a BoilerOperation, not its feed or fuel flow.
func (t *FlueGasTable) loadOnly() bool { return true }

// Efficiency computes the efficiency at op by the heat-loss method.
func (t *FlueGasTable) Efficiency(op BoilerOperation) (EfficiencyPoint, error) {
	var pt EfficiencyPoint
	if err := t.efficiencyInto(op, &pt, new(combustion.Products), new(combustion.LossItems)); err != nil {
		return EfficiencyPoint{}, err
	}
	return pt, nil
}

// efficiencyInto is Efficiency writing the point into dst, its flue gas
// and losses into prod and loss (dst's pointers): a boiler's residual
// gives its own storage, so that it allocates nothing.
func (t *FlueGasTable) efficiencyInto(op BoilerOperation, dst *EfficiencyPoint, prod *combustion.Products, loss *combustion.LossItems) error {
	if op.Fuel.Fuel == nil {
		return fmt.Errorf("a flue-gas efficiency table needs the fuel's analysis; fuel %q has none", op.Fuel.Name)
	}
	ft, w1 := interpolate(t.Load, t.FlueT, op.Load, "flue-gas table")
	o2, _ := interpolate(t.Load, t.O2Dry, op.Load, "flue-gas table")
	return lossMethod(op, ft, combustion.Conditions{O2Dry: o2}, t.RadiationAtMCR, t.RelativeHumidity, t.AtomisingSteam, t.COppm, w1, dst, prod, loss)
}

// lossMethod fires the fuel under c at op's air temperature and writes
// into dst the heat-loss efficiency at exit temperature flueT, referred
// to 25 °C, with its flue gas in prod and its losses in loss.
func lossMethod(op BoilerOperation, flueT float64, c combustion.Conditions, radAtMCR, rh, atomising, co float64, warn string,
	dst *EfficiencyPoint, prod *combustion.Products, loss *combustion.LossItems) error {
	c.AirT = op.AirT
	c.RelativeHumidity = rh
	c.AtomisingSteam = atomising
	var err error
	if *prod, err = combustion.Fire(*op.Fuel.Fuel, c); err != nil {
		return err
	}
	load := math.Max(op.Load, 0.05)
	lo := combustion.LossOptions{COppmDry: co}
	if radAtMCR > 0 {
		lo.Radiation = combustion.Radiation{PercentAtMCR: 100 * radAtMCR, LoadFraction: load}
	}
	l, err := combustion.Efficiency(*prod, flueT, combustion.TRef, lo)
	if err != nil {
		return err
	}
	*loss = l.LHV
	*dst = EfficiencyPoint{
		Eta:            loss.Efficiency / 100,
		Warning:        warn,
		FlueT:          flueT,
		Lambda:         prod.Lambda,
		AirPerFuel:     prod.Air,
		FlueGasPerFuel: prod.FlueGas,
		Losses:         loss,
		Products:       prod,
		LossOptions:    lo,
	}
	return nil
}

// pointFiller is an efficiency model that can write its point, flue gas
// and losses into the caller's storage (efficiencyInto), which a boiler's
// residual uses so as to allocate nothing.
type pointFiller interface {
	efficiencyInto(op BoilerOperation, dst *EfficiencyPoint, prod *combustion.Products, loss *combustion.LossItems) error
}

// FurnaceTubes computes a fire-tube boiler's efficiency from its geometry:
// the fuel burns at the excess air its burner sets for the load; the flue
// gas radiates to the furnace walls (a well-stirred furnace, gas emissivity
// by the weighted sum of grey gases of Smith, Shen and Friedman (1982),
// with a soot allowance for the luminous oil flame); it then passes the
// smoke tubes, where it gives heat by convection (Gnielinski) and gas
// radiation through the wall and its soot and scale to water boiling at
// the drum's saturation temperature; and it leaves at the exit temperature
// whose losses (plant/combustion, the heat-loss method) give the
// efficiency. See plant/heat for each law, its source and its range.
//
// The efficiency follows at every firing rate from the fuel flow, so it is
// part of the solved system. Simplifications: one zone in the furnace;
// each tube pass at a mean gas cp; the radiation and convection loss of
// the casing a constant heat flow.
type FurnaceTubes struct {
	// ExcessAir is the burner's air ratio λ against load (fraction of
	// MCR), interpolated linearly; outside the table the end values hold,
	// with a warning.
	ExcessAir ExcessAirTable
	Furnace   heat.Furnace
	// Passes are the smoke-tube passes in the order the gas meets them.
	Passes []heat.SmokeTubes
	// RadiationLoss is the casing's radiation and convection loss, W,
	// taken as constant with load (docs/reference/plant-checks.md §3.4 [M]).
	RadiationLoss    float64
	RelativeHumidity float64 // of the combustion air, 0..1
	AtomisingSteam   float64 // kg per kg fuel, leaving with the flue gas
}

// ExcessAirTable is λ against load fraction.
type ExcessAirTable struct {
	Load   []float64
	Lambda []float64
}

// Validate checks the geometry and tables.
func (m *FurnaceTubes) Validate() error {
	t := m.ExcessAir
	n := len(t.Load)
	if n == 0 || len(t.Lambda) != n {
		return fmt.Errorf("excess-air table needs as many air ratios as loads and at least one; got %d loads and %d air ratios", n, len(t.Lambda))
	}
	for i := range t.Load {
		if !finite(t.Load[i]) || t.Load[i] < 0 || t.Load[i] > 1.5 || (i > 0 && t.Load[i] <= t.Load[i-1]) {
			return fmt.Errorf("excess-air table loads must increase within 0-1.5; got %g", t.Load)
		}
		if !finite(t.Lambda[i]) || t.Lambda[i] < 1 || t.Lambda[i] > 5 {
			return fmt.Errorf("air ratio λ %g at load %g is outside 1-5: a burner without enough air cannot fire", t.Lambda[i], t.Load[i])
		}
	}
	if m.Furnace.WallArea < 0 || !finite(m.Furnace.WallArea) {
		return fmt.Errorf("furnace wall area %g m² must be zero or positive", m.Furnace.WallArea)
	}
	if m.Furnace.WallArea > 0 && !(m.Furnace.BeamLength > 0) {
		return fmt.Errorf("furnace mean beam length %g m must be positive (3.6·volume/area)", m.Furnace.BeamLength)
	}
	for i, p := range m.Passes {
		if p.Count < 1 || !(p.Di > 0) || p.Length < 0 || p.WallThickness < 0 || p.FoulingGas < 0 || p.FoulingWater < 0 {
			return fmt.Errorf("smoke-tube pass %d: needs at least one tube, a positive inside diameter and non-negative length, wall and fouling", i+1)
		}
	}
	if m.RadiationLoss < 0 || m.RelativeHumidity < 0 || m.RelativeHumidity > 1 || m.AtomisingSteam < 0 {
		return fmt.Errorf("radiation loss, humidity (0..1) and atomising steam must not be negative")
	}
	return nil
}

// Basis is "LHV".
func (m *FurnaceTubes) Basis() string { return "LHV" }

// GasPath is the flue gas's way through the boiler at one firing rate.
type GasPath struct {
	FlameT      float64   // adiabatic flame temperature, K
	FurnaceExit float64   // K
	PassExit    []float64 // K, after each pass
	FurnaceQ    float64   // W to the furnace walls
	PassQ       []float64 // W in each pass
}

// path fires fuelFlow and follows the gas to the exit.
func (m *FurnaceTubes) path(op BoilerOperation, fuelFlow float64) (combustion.Products, GasPath, string, error) {
	var gp GasPath
	if op.Fuel.Fuel == nil {
		return combustion.Products{}, gp, "", fmt.Errorf("a furnace model needs the fuel's analysis; fuel %q has none", op.Fuel.Name)
	}
	lambda, warn := interpolate(m.ExcessAir.Load, m.ExcessAir.Lambda, op.Load, "excess-air table")
	prod, err := combustion.Fire(*op.Fuel.Fuel, combustion.Conditions{Lambda: lambda, AirT: op.AirT,
		RelativeHumidity: m.RelativeHumidity, AtomisingSteam: m.AtomisingSteam})
	if err != nil {
		return prod, gp, "", err
	}
	tad, _, err := combustion.AdiabaticFlameTemperature(prod)
	if err != nil {
		return prod, gp, "", err
	}
	gp.FlameT = tad
	tSat, err := waterTsat(op.DrumP)
	if err != nil {
		return prod, gp, "", err
	}
	fg := prod.FlueGas
	var hErr error
	h := func(t float64) (float64, float64) {
		hh, err1 := prod.FlueGasH(t)
		cp, err2 := prod.FlueGasCp(t)
		if err := errors.Join(err1, err2); err != nil {
			hErr = err
			return math.NaN(), math.NaN()
		}
		return hh, cp
	}
	x := prod.MoleFractions(true)
	var comp heat.Composition
	comp[heat.N2] = x[combustion.N2] + x[combustion.SO2] + x[combustion.CO] // SO2 folded into N2, docs/reference/heat-transfer.md §1.3
	comp[heat.O2] = x[combustion.O2]
	comp[heat.CO2] = x[combustion.CO2]
	comp[heat.H2O] = x[combustion.H2O]
	comp[heat.Ar] = x[combustion.Ar]
	mGas := math.Max(fuelFlow, 1e-6) * fg

	t := tad
	if m.Furnace.WallArea > 0 {
		f := m.Furnace
		if f.WallTemperature == 0 {
			f.WallTemperature = tSat + 20 // water-cooled wall a little above T_sat, docs/reference/heat-transfer.md §8 [CP]
		}
		res, err := f.Solve(heat.FurnaceInput{GasFlow: mGas, Composition: comp, Enthalpy: h, AdiabaticTemperature: tad})
		if err := errors.Join(err, hErr); err != nil {
			return prod, gp, "", fmt.Errorf("furnace: %w", err)
		}
		t = res.ExitTemperature
		gp.FurnaceQ = res.HeatAbsorbed
	}
	gp.FurnaceExit = t
	for i, pass := range m.Passes {
		if pass.Length == 0 {
			gp.PassExit = append(gp.PassExit, t)
			gp.PassQ = append(gp.PassQ, 0)
			continue
		}
		res, err := pass.Solve(heat.TubePassInput{GasFlow: mGas, InletTemperature: t, Composition: comp, Enthalpy: h,
			WaterTemperature: tSat, WaterPressure: op.DrumP})
		if err := errors.Join(err, hErr); err != nil {
			return prod, gp, "", fmt.Errorf("smoke-tube pass %d: %w", i+1, err)
		}
		t = res.OutletTemperature
		gp.PassExit = append(gp.PassExit, t)
		gp.PassQ = append(gp.PassQ, res.Duty)
	}
	return prod, gp, warn, nil
}

// Efficiency follows the gas at op's fuel flow and applies the heat-loss
// method at its exit temperature.
func (m *FurnaceTubes) Efficiency(op BoilerOperation) (EfficiencyPoint, error) {
	var pt EfficiencyPoint
	if err := m.efficiencyInto(op, &pt, new(combustion.Products), new(combustion.LossItems)); err != nil {
		return EfficiencyPoint{}, err
	}
	return pt, nil
}

// efficiencyInto is Efficiency writing into the caller's storage (see
// pointFiller).
func (m *FurnaceTubes) efficiencyInto(op BoilerOperation, dst *EfficiencyPoint, prod *combustion.Products, loss *combustion.LossItems) error {
	fuelFlow := math.Max(op.FuelFlow, 1e-6)
	pr, gp, warn, err := m.path(op, fuelFlow)
	if err != nil {
		return err
	}
	*prod = pr
	exit := gp.FurnaceExit
	if n := len(gp.PassExit); n > 0 {
		exit = gp.PassExit[n-1]
	}
	lo := combustion.LossOptions{}
	if m.RadiationLoss > 0 {
		lo.Radiation = combustion.Radiation{Loss: m.RadiationLoss, FuelFlow: fuelFlow}
	}
	l, err := combustion.Efficiency(*prod, exit, combustion.TRef, lo)
	if err != nil {
		return err
	}
	*loss = l.LHV
	*dst = EfficiencyPoint{Eta: loss.Efficiency / 100, Warning: warn, FlueT: exit, Lambda: prod.Lambda,
		AirPerFuel: prod.Air, FlueGasPerFuel: prod.FlueGas, Losses: loss, Products: prod, LossOptions: lo}
	return nil
}

// CalibrateSoot finds the soot fouling resistance on the gas side of every
// smoke-tube pass (the same in each) for which the model's exit gas
// temperature at op and fuelFlow is the measured one, by bisection on
// 0..0.05 m²K/W. It returns the calibrated model; m is unchanged.
func (m *FurnaceTubes) CalibrateSoot(op BoilerOperation, fuelFlow, measuredExitT float64) (*FurnaceTubes, float64, error) {
	if len(m.Passes) == 0 {
		return nil, 0, fmt.Errorf("calibration needs at least one smoke-tube pass")
	}
	c := *m
	c.Passes = append([]heat.SmokeTubes(nil), m.Passes...)
	exit := func(r float64) (float64, error) {
		for i := range c.Passes {
			c.Passes[i].FoulingGas = r
		}
		_, gp, _, err := c.path(op, fuelFlow)
		if err != nil {
			return 0, err
		}
		return gp.PassExit[len(gp.PassExit)-1], nil
	}
	lo, hi := 0.0, 0.05
	tLo, err := exit(lo)
	if err != nil {
		return nil, 0, err
	}
	tHi, err := exit(hi)
	if err != nil {
		return nil, 0, err
	}
	if measuredExitT < tLo || measuredExitT > tHi {
		return nil, 0, fmt.Errorf("measured exit temperature %.1f °C lies outside what clean to heavily fouled tubes give at this load (%.1f to %.1f °C)",
			measuredExitT-273.15, tLo-273.15, tHi-273.15)
	}
	for k := 0; k < 60; k++ {
		mid := 0.5 * (lo + hi)
		t, err := exit(mid)
		if err != nil {
			return nil, 0, err
		}
		if t < measuredExitT {
			lo = mid
		} else {
			hi = mid
		}
	}
	r := 0.5 * (lo + hi)
	for i := range c.Passes {
		c.Passes[i].FoulingGas = r
	}
	return &c, r, nil
}
