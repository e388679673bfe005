package plant

import (
	"context"
	"math"
	"strings"
	"testing"

	"steamcase/plant/combustion"
	"steamcase/plant/loads"
)

// igPlant is turbinePlant with its boiler an inert-gas source on a
// maker's flue-gas table and its turbine driving a cargo pump of 500 m³/h
// (invented figures): O2 6.5 % dry at 25 % load, 4.5 % at 50 %, 3 % at
// 100 %.
func igPlant(t testing.TB, eff EfficiencyModel) *Plant {
	p := turbinePlant(t)
	b := p.Component("b1").(*Boiler)
	b.Fuel, b.InertGas, b.Turndown = hsfo(t), true, 4
	b.Efficiency = eff
	tu := p.Component("cargo pump 1").(*Turbine)
	tu.Power, tu.Pump = 0, &loads.CargoPump{Flow: 500.0 / 3600, Head: 120, Density: 850, Efficiency: 0.8}
	return p
}

func igTable() *FlueGasTable {
	return &FlueGasTable{Load: []float64{0.25, 0.5, 1}, FlueT: []float64{493.15, 523.15, 573.15},
		O2Dry: []float64{0.065, 0.045, 0.03}, RadiationAtMCR: 0.01}
}

func TestInertGasFromFlueGasTable(t *testing.T) {
	t.Parallel()
	p := igPlant(t, igTable())
	p.Component("b1").(*Boiler).MCR = 1
	p.Component("cargo pump 1").(*Turbine).Pump.Flow = 700.0 / 3600 // its steam about 67 % of the MCR
	cr, err := p.Solve(context.Background(), Case{Name: "discharge", Conditions: Conditions{AirT: 298.15}})
	must(t, err)
	ig := cr.InertGas
	if ig == nil {
		t.Fatal("no inert-gas check with a cargo pump running")
	}
	b := cr.Boilers[0]
	// Defaults: 5 % O2 dry, 125 % of the cargo pumps' rate (SOLAS II-2
	// reg. 4.5.5 and the FSS Code ch. 15, from memory).
	within(t, "O2 limit", ig.O2Max, 0.05, 0)
	within(t, "required", ig.RequiredM3S, 1.25*700/3600, 1e-12)
	// The O2 at the case's load is the table's, interpolated linearly
	// (by hand), and the gas volume is the fuel times the dry flue gas of
	// complete combustion at that O2 (docs/reference/plant-checks.md §2 [CP]: computed
	// here by plant/combustion.Fire, the package's own check of docs/reference/plant-checks.md §2.1).
	o2 := 0.045 + (0.03-0.045)*(b.LoadFraction-0.5)/0.5
	if b.LoadFraction < 0.5 {
		o2 = 0.065 + (0.045-0.065)*(b.LoadFraction-0.25)/0.25
	}
	within(t, "O2", ig.O2Dry, o2, 1e-9)
	pr, err := combustion.Fire(*p.Component("b1").(*Boiler).Fuel.Fuel, combustion.Conditions{O2Dry: o2, AirT: 298.15})
	must(t, err)
	within(t, "dry flue gas", ig.DeliveredNm3S, b.FuelKgS*pr.NormalVolume(false), 1e-9)
	// The O2 limit sets the minimum load: 6.5 % falls to 5 % at 25 % +
	// 25 %·(1.5/2) = 43.75 % of MCR (by hand), where the volume is far
	// above 125 % of 700 m³/h.
	if !ig.MinLoadFound || math.Abs(ig.MinLoad-0.4375) > 1e-6 {
		t.Errorf("minimum load %v (found %v), want 0.4375", ig.MinLoad, ig.MinLoadFound)
	}
	if !ig.Met || b.LoadFraction < 0.5 {
		t.Errorf("met %v at load %.3f; want met above half load", ig.Met, b.LoadFraction)
	}
}

func TestInertGasFiresHarder(t *testing.T) {
	t.Parallel()
	// The pump's steam is about 30 % of the MCR, where the gas holds
	// about 6.1 % O2, so the boiler must fire at 43.75 % for inert gas;
	// the steam beyond the case's is dumped and its fuel counted (by
	// hand: the difference of the boiler's own fuel at the two loads).
	p := igPlant(t, igTable())
	b := p.Component("b1").(*Boiler)
	b.MCR = 1.6
	cr, err := p.Solve(context.Background(), Case{Name: "stripping", Conditions: Conditions{AirT: 298.15}})
	must(t, err)
	ig := cr.InertGas
	if ig.Met || !ig.MinLoadFound {
		t.Fatalf("inert gas %+v at load %.3f; want not met, with a minimum", ig, cr.Boilers[0].LoadFraction)
	}
	load := cr.Boilers[0].LoadFraction
	within(t, "extra steam", ig.ExtraSteamKgS, (ig.MinLoad-load)*1.6, 1e-9)
	// Its fuel: about 2.7 MJ per kg of steam at 80-90 % on 40 MJ/kg.
	if !(ig.ExtraFuelKgS > ig.ExtraSteamKgS*2.5e6/40e6 && ig.ExtraFuelKgS < ig.ExtraSteamKgS*3.5e6/40e6) {
		t.Errorf("extra fuel %g kg/s for %g kg/s of steam", ig.ExtraFuelKgS, ig.ExtraSteamKgS)
	}
	if len(cr.Warnings) == 0 || !strings.Contains(cr.Warnings[len(cr.Warnings)-1], "NOT MET") {
		t.Errorf("warnings %q do not say the inert gas is not met", cr.Warnings)
	}
	if ig.Note != "the plant has no dump condenser to take the steam raised for inert gas" {
		t.Errorf("note %q: this plant has no dump condenser", ig.Note)
	}
}

func TestInertGasStoichiometry(t *testing.T) {
	t.Parallel()
	// A furnace model at an air ratio of 1.15 throughout: the test fuel's
	// O2 is 2.88 % dry (docs/reference/plant-checks.md §2.1 [C], ±0.02 % by §11 item 3)
	// and its dry flue gas 11.65 Nm³ per kg (docs/reference/plant-checks.md §2.1 [C], printed to four
	// figures: half a unit of the last).
	spec, err := SpecFromFuel(testFuel())
	must(t, err)
	m := smallFireTube()
	m.ExcessAir = ExcessAirTable{Load: []float64{0.1, 1.2}, Lambda: []float64{1.15, 1.15}}
	p := igPlant(t, m)
	b := p.Component("b1").(*Boiler)
	b.Fuel, b.MCR = spec, 2000.0/3600
	tu := p.Component("cargo pump 1").(*Turbine)
	tu.Pump.Flow = 50.0 / 3600
	cr, err := p.Solve(context.Background(), Case{Name: "discharge", Conditions: Conditions{AirT: 298.15}})
	must(t, err)
	ig := cr.InertGas
	if math.Abs(100*ig.O2Dry-2.88) > 0.02 {
		t.Errorf("O2 %.4f %% dry, want 2.88 %% (docs/reference/plant-checks.md §2.1 [C])", 100*ig.O2Dry)
	}
	if v := ig.DeliveredNm3S / cr.Boilers[0].FuelKgS; math.Abs(v-11.65) > 0.005 {
		t.Errorf("dry flue gas %.3f Nm³/kg, want 11.65 (docs/reference/plant-checks.md §2.1 [C])", v)
	}
}

func TestInertGasNeedsCombustionModel(t *testing.T) {
	t.Parallel()
	p := igPlant(t, flatEta(0.85))
	p.Component("b1").Ident().Pos = Pos{File: "ship.lua", Line: 7}
	err := p.Check()
	if err == nil || !strings.Contains(err.Error(), `ship.lua:7: unit "b1": is an inert-gas source (inert_gas = true), but its efficiency is a plain table`) {
		t.Errorf("error %v", err)
	}
}
