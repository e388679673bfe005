package plant

import (
	"context"
	"math"
	"strings"
	"testing"

	"steamcase/plant/combustion"
	"steamcase/plant/fuel"
	"steamcase/plant/heat"
)

// smallFireTube is an invented two-pass fire-tube boiler of about 2 t/h:
// a furnace 1.0 m across and 3 m long, then 90 smoke tubes of 50 mm bore.
func smallFireTube() *FurnaceTubes {
	area := math.Pi*1.0*3 + 2*math.Pi*0.25
	vol := math.Pi * 0.25 * 3
	lm, _ := heat.BeamLength(vol, area)
	return &FurnaceTubes{
		ExcessAir: ExcessAirTable{Load: []float64{0.3, 1}, Lambda: []float64{1.4, 1.15}},
		Furnace:   heat.Furnace{WallArea: area, BeamLength: lm, WallEmissivity: 0.8, Set: heat.WSGGRatio1, SootVolumeFraction: 2e-7},
		Passes: []heat.SmokeTubes{
			{Count: 45, Di: 0.05, Length: 3, WallThickness: 0.0035, FoulingGas: 0.002},
			{Count: 45, Di: 0.05, Length: 3, WallThickness: 0.0035, FoulingGas: 0.002},
		},
		RadiationLoss: 15e3,
	}
}

func hsfo(t testing.TB) FuelSpec {
	f, err := fuel.Grade("HSFO")
	must(t, err)
	s, err := SpecFromFuel(f)
	must(t, err)
	return s
}

func TestFurnaceTubesLimits(t *testing.T) {
	t.Parallel()
	// Limits of the physics (common practice, no source): with no heating
	// surface the gas leaves at the adiabatic flame temperature; with a
	// very large one it approaches the water's saturation temperature;
	// more soot in the tubes gives a hotter exit and a lower efficiency.
	op := BoilerOperation{Load: 1, DrumP: gauge(7), AirT: 308.15, Fuel: hsfo(t)}
	fuelFlow := 0.04
	m := smallFireTube()

	bare := *m
	bare.Furnace.WallArea = 0
	bare.Passes = nil
	_, gp, _, err := bare.path(op, fuelFlow)
	must(t, err)
	within(t, "exit with no surface", gp.FurnaceExit, gp.FlameT, 1e-12)

	big := *m
	big.Passes = []heat.SmokeTubes{{Count: 400, Di: 0.05, Length: 20, WallThickness: 0.0035}}
	_, gp, _, err = big.path(op, fuelFlow)
	must(t, err)
	ts, _ := waterTsat(op.DrumP)
	if d := gp.PassExit[0] - ts; d < 0 || d > 1 {
		t.Errorf("huge surface: exit %.2f K, %.3f K above saturation; want within 1 K", gp.PassExit[0], d)
	}

	op.FuelFlow = fuelFlow
	clean, err := m.Efficiency(op)
	must(t, err)
	dirty := *m
	dirty.Passes = append([]heat.SmokeTubes(nil), m.Passes...)
	for i := range dirty.Passes {
		dirty.Passes[i].FoulingGas = 0.01
	}
	fouled, err := dirty.Efficiency(op)
	must(t, err)
	if !(fouled.FlueT > clean.FlueT+5) || !(fouled.Eta < clean.Eta) {
		t.Errorf("fouling: exit %.1f -> %.1f K, η %.4f -> %.4f; want hotter and lower", clean.FlueT, fouled.FlueT, clean.Eta, fouled.Eta)
	}
	// A plausible auxiliary boiler: 82-92 % (LHV) with its gas leaving at
	// 200-350 °C (docs/reference/plant-checks.md §3.5 [M/CP]).
	if clean.Eta < 0.82 || clean.Eta > 0.92 || clean.FlueT < 473 || clean.FlueT > 623 {
		t.Errorf("clean boiler: η %.3f at exit %.1f °C; outside the typical range", clean.Eta, clean.FlueT-273.15)
	}
}

func TestCalibrateSoot(t *testing.T) {
	t.Parallel()
	// One measured exit temperature at a known firing rate recovers the
	// fouling that produced it (a round trip, no outside source).
	op := BoilerOperation{Load: 0.8, DrumP: gauge(7), AirT: 308.15, Fuel: hsfo(t)}
	m := smallFireTube()
	truth := *m
	truth.Passes = append([]heat.SmokeTubes(nil), m.Passes...)
	for i := range truth.Passes {
		truth.Passes[i].FoulingGas = 0.006
	}
	_, gp, _, err := truth.path(op, 0.03)
	must(t, err)
	c, r, err := m.CalibrateSoot(op, 0.03, gp.PassExit[1])
	must(t, err)
	within(t, "calibrated soot resistance", r, 0.006, 1e-6)
	if c.Passes[0].FoulingGas != r || m.Passes[0].FoulingGas != 0.002 {
		t.Errorf("calibration must return a new model and leave the old one")
	}
	if _, _, err := m.CalibrateSoot(op, 0.03, 2000); err == nil {
		t.Errorf("an impossible exit temperature must be refused")
	}
}

func TestFurnaceBoilerInPlant(t *testing.T) {
	t.Parallel()
	// The physics model inside a plant: the efficiency follows the solved
	// fuel flow, and the balances close.
	p := New("fire-tube", Options{})
	must(t, p.Add(&MakeUp{Base: Base{Name: "makeup"}, T: 333.15, P: 1e5}))
	must(t, p.Add(&Boiler{Base: Base{Name: "b1"}, MCR: 2000.0 / 3600, DrumP: gauge(7), Efficiency: smallFireTube(), Fuel: hsfo(t)}))
	must(t, p.Add(&Consumer{Base: Base{Name: "load"}, SteamFlow: 1500.0 / 3600}))
	p.Connect("feed", Pos{}, "makeup", "out", "b1", "feed")
	p.Connect("steam", Pos{}, "b1", "steam", "load", "in")
	cr, err := p.Solve(context.Background(), Case{Name: "75 %", Conditions: Conditions{AirT: 308.15}})
	must(t, err)
	b := cr.Boilers[0]
	op := BoilerOperation{Load: b.LoadFraction, DrumP: gauge(7), AirT: 308.15, FuelFlow: b.FuelKgS, Fuel: hsfo(t)}
	pt, err := smallFireTube().Efficiency(op)
	must(t, err)
	within(t, "efficiency at the solved fuel flow", b.Efficiency, pt.Eta, 1e-12)
	within(t, "fuel from the energy balance", b.FuelKgS*b.FuelLHV*b.Efficiency, b.HeatW, 1e-9)
	if cr.Balance.EnergyRel > 1e-6 || b.FlueT == 0 {
		t.Errorf("balance %+v, exit %g", cr.Balance, b.FlueT)
	}
}

func TestBurnerCannotFire(t *testing.T) {
	t.Parallel()
	// A burner given less air than the fuel needs (λ < 1), or air without
	// oxygen, cannot fire: a clear error, never a NaN (common practice,
	// no source: combustion needs fuel, oxygen and ignition).
	m := smallFireTube()
	m.ExcessAir.Lambda = []float64{0.8, 0.9}
	if err := m.Validate(); err == nil || !strings.Contains(err.Error(), "cannot fire") {
		t.Errorf("λ below 1: error %v, want one saying the burner cannot fire", err)
	}
	op := BoilerOperation{Load: 1, DrumP: gauge(7), AirT: 308.15, FuelFlow: 0.05, Fuel: hsfo(t)}
	f := *op.Fuel.Fuel
	op.Fuel.Fuel = &f
	var pt EfficiencyPoint
	err := lossMethod(op, 523.15, combustion.Conditions{O2Dry: 0.03, DryAir: [combustion.NumSpecies]float64{combustion.N2: 1}}, 0, 0, 0, 0, "",
		&pt, new(combustion.Products), new(combustion.LossItems))
	if err == nil || !strings.Contains(err.Error(), "cannot fire") {
		t.Errorf("air without oxygen: error %v, want one saying the burner cannot fire", err)
	}
}
