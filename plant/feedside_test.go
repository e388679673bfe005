package plant

import (
	"context"
	"strings"
	"testing"

	"steamcase/plant/fuel"
	"steamcase/plant/loads"
	"steamcase/plant/water"
)

// TestMakeUpAtTheSeaTemperature: without a temperature of its own the
// make-up comes at the case's sea temperature (its storage tanks stand
// against the shell; common practice, no source), at 15 °C when the case
// gives none, and a case's make-up T overrides both.
func TestMakeUpAtTheSeaTemperature(t *testing.T) {
	t.Parallel()
	p := twoBoilers(t, Options{})
	for _, c := range p.comps {
		if u, ok := c.(*MakeUp); ok {
			u.T = 0
		}
	}
	ctx := context.Background()
	tests := []struct {
		name string
		c    Case
		want float64
	}{
		{"sea 4 °C", Case{Name: "cold sea", Conditions: Conditions{SeaT: 277.15}}, 277.15},
		{"no sea", Case{Name: "no sea"}, 288.15},
		{"the case's own", Case{Name: "set", Conditions: Conditions{SeaT: 277.15}, Set: []Setting{{Unit: "makeup", Param: "T", Value: 303.15}}}, 303.15},
	}
	for _, tc := range tests {
		cr, err := p.Solve(ctx, tc.c)
		must(t, err)
		within(t, tc.name+": make-up T", unitFigures(t, cr, "makeup")["T_K"], tc.want, 1e-12)
		h, err := water.HPT(101325, tc.want)
		must(t, err)
		within(t, tc.name+": make-up enthalpy", lineOf(t, cr, "makeup").H, h, 1e-9)
	}
	_, err := p.Solve(ctx, Case{Name: "ice", Conditions: Conditions{SeaT: 271.5}})
	if err == nil || !strings.Contains(err.Error(), "below the freezing point") {
		t.Errorf("error %v, want one about a sea below freezing", err)
	}
}

// TestEngineFuelHeaterFollowsTheEngine: a main engine's heater given the
// engine's SFOC and MCR heats SFOC × MCR × load (by hand: 175 g/kWh × 11
// MW × 80 % = 0.427778 kg/s), interpolated in an SFOC table (180 and 170
// g/kWh at 50 and 100 %: 175 at 75 %), nothing with the engine stopped;
// its duty is that flow times the heat per kg the fixed-flow heater gives
// (plant/loads, whose tests check it).
func TestEngineFuelHeaterFollowsTheEngine(t *testing.T) {
	t.Parallel()
	f, err := fuel.Grade("VLSFO")
	must(t, err)
	h := loads.FuelHeater{Service: loads.EngineService, Fuel: f, InletT: 363.15, TargetViscosity: 12e-6}
	one := &FuelHeater{Heater: h, SFOC: []float64{175e-3 / 3.6e6}, EngineMCR: 11e6}
	must(t, one.validate())
	d, err := one.Duty(Conditions{EngineLoad: 0.8})
	must(t, err)
	within(t, "oil kg/s at 80 %", d.Inputs["oil_kg_s"], 0.175/3.6e6*11e6*0.8, 1e-12)
	within(t, "duty W", d.W, d.Inputs["oil_kg_s"]*d.Inputs["per_kg_J_per_kg"], 1e-12)
	fixed := h
	fixed.MassFlow = 0.175 / 3.6e6 * 11e6 * 0.8
	r, err := fixed.Duty()
	must(t, err)
	within(t, "duty against the fixed-flow heater", d.W, r.Duty, 1e-12)

	table := &FuelHeater{Heater: h, SFOCLoad: []float64{0.5, 1}, SFOC: []float64{180e-3 / 3.6e6, 170e-3 / 3.6e6}, EngineMCR: 11e6}
	must(t, table.validate())
	d, err = table.Duty(Conditions{EngineLoad: 0.75})
	must(t, err)
	within(t, "oil kg/s at 75 % by the table", d.Inputs["oil_kg_s"], 0.175/3.6e6*11e6*0.75, 1e-12)
	d, err = table.Duty(Conditions{EngineLoad: 0.3})
	must(t, err)
	if len(d.Warnings) == 0 || !strings.Contains(d.Warnings[0], "below the SFOC table's lowest load") {
		t.Errorf("warnings %q: want one for a load below the table", d.Warnings)
	}
	d, err = one.Duty(Conditions{EngineLoad: 0})
	must(t, err)
	if d.W != 0 {
		t.Errorf("duty %g W with the engine stopped, want 0", d.W)
	}
	bad := &FuelHeater{Heater: h, SFOC: []float64{175e-3 / 3.6e6}}
	if err := bad.validate(); err == nil || !strings.Contains(err.Error(), "engine_mcr") {
		t.Errorf("error %v, want one asking for engine_mcr", err)
	}
}

// TestHotwellOxygenWarning: a feed tank below 80 °C warns that its feed
// keeps dissolved oxygen (common practice, from memory: a vented hotwell is
// kept near 80-90 °C); held at 85 °C by steam it does not.
func TestHotwellOxygenWarning(t *testing.T) {
	t.Parallel()
	p := twoBoilers(t, Options{})
	cr, err := p.Solve(context.Background(), demandCase("cool hotwell", 5000))
	must(t, err)
	warned := strings.Contains(strings.Join(cr.Warnings, "\n"), "dissolved oxygen")
	if cr.FeedTankT < 353.15 != warned {
		t.Errorf("hotwell at %.1f °C, oxygen warning %v", cr.FeedTankT-273.15, warned)
	}
	if !warned {
		t.Errorf("hotwell at %.1f °C: want a case below 80 °C here", cr.FeedTankT-273.15)
	}
	cr, err = p.Solve(context.Background(), Case{Name: "o2 at 40 C", Set: []Setting{{Unit: "hotwell", Param: "o2_T", Value: 313.15}}})
	must(t, err)
	if strings.Contains(strings.Join(cr.Warnings, "\n"), "dissolved oxygen") {
		t.Errorf("hotwell at %.1f °C warns below a 40 °C limit", cr.FeedTankT-273.15)
	}
}
