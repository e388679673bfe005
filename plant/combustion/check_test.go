package combustion

import (
	"encoding/json"
	"errors"
	"math"
	"strings"
	"testing"

	"steamcase/plant/fuel"
)

// checkTestFuel is the test fuel of docs/reference/plant-checks.md §1.2 (C 86.0, H 11.0,
// S 2.5, N 0.3, O 0.2) with its ISO 8217 data (ρ 985, S 2.5), whose LHV is
// 40 487 kJ/kg (docs/reference/plant-checks.md §3.3 [C]).
func checkTestFuel() fuel.Fuel { return testFuel() }

// worked is the worked case of docs/reference/plant-checks.md §3.3: 3 % dry O2, flue gas
// 250 °C, air 35 °C.
func worked() FlueGasReading {
	return FlueGasReading{Fuel: checkTestFuel(), Gas: MeasuredO2, Dry: 0.03, FlueT: 523.15, AirT: 308.15}
}

func mustCheck(t *testing.T, r FlueGasReading, s *CheckSettings) *FlueGasCheck {
	t.Helper()
	c, err := CheckFlueGas(r, s)
	if err != nil {
		t.Fatalf("CheckFlueGas(%+v): %v", r, err)
	}
	return c
}

// TestCheckFlueGasWorkedCase checks the figures of the worked case against
// docs/reference/plant-checks.md, each with its section and tag.
func TestCheckFlueGasWorkedCase(t *testing.T) {
	t.Parallel()
	c := mustCheck(t, worked(), nil)
	p := &c.Products
	near(t, "λ (docs/reference/plant-checks.md §2.1 [C], §11 item 4)", p.Lambda, 1.1576, 0.0005)
	near(t, "excess air (= λ − 1, docs/reference/plant-checks.md §2.1 [C])", c.ExcessAir, 0.1576, 0.0005)
	near(t, "stoichiometric air kg/kg (docs/reference/plant-checks.md §2.1 [C], §11 item 2)", p.Stoich.Air, 13.770, 0.005)
	near(t, "stoichiometric wet flue gas kg/kg (docs/reference/plant-checks.md §2.1 [C])", c.StoichFlueGas, 14.770, 0.005)
	near(t, "dry CO2 at 3 % O2 (docs/reference/plant-checks.md §3.2 [C])", c.Dry[CO2], 0.1368, 0.00005)
	near(t, "dry O2 (the reading)", c.Dry[O2], 0.03, 1e-12)
	if c.Dry[H2O] != 0 {
		t.Errorf("dry basis has H2O %g", c.Dry[H2O])
	}
	l := &c.Losses
	near(t, "LHV kJ/kg (docs/reference/plant-checks.md §3.3 [C], ISO 8217 at ρ 985, S 2.5)", l.LHV.HeatInput/1e3, 40487, 0.5)
	near(t, "HHV kJ/kg (docs/reference/plant-checks.md §3.3 [C])", l.HHV.HeatInput/1e3, 42794, 0.5)
	// docs/reference/plant-checks.md §3.3 used mean molar cp values from memory [M]: ±0.05 points.
	near(t, "dry-gas loss % LHV (docs/reference/plant-checks.md §3.3 [C])", l.LHV.DryGas, 8.60, 0.05)
	near(t, "moisture loss % LHV (docs/reference/plant-checks.md §3.3 [C])", l.LHV.Moisture(), 1.00, 0.05)
	near(t, "reference T (the air's, as in Siegert's formula)", l.RefT, 308.15, 0)

	// Siegert, O2 form, fuel-oil coefficients: 9.627 % (docs/reference/plant-checks.md §3.2 [S], §11
	// item 5, ±0.001).
	s := &c.Siegert
	if !s.Known || s.Form != "O2 form" || s.Set != "fuel-oil coefficients" || s.Coefficients != SiegertFuelOil {
		t.Fatalf("Siegert %+v", s)
	}
	near(t, "Siegert % (docs/reference/plant-checks.md §3.2 [S], §11 item 5)", s.Loss, 9.627, 0.0005)
	near(t, "Siegert's detailed counterpart (dry gas + moisture, docs/reference/plant-checks.md §3.3 [C] 9.60)", s.Detailed, 9.60, 0.05)
	if !strings.Contains(s.Source, "1. BImSchV") || !strings.Contains(s.Source, "docs/reference/plant-checks.md §3.2 [S]") {
		t.Errorf("Siegert source %q does not name the ordinance and the sheet", s.Source)
	}

	// Acid dew point near docs/reference/plant-checks.md §4's test-fuel row, 151.3 °C [C] at λ 1.15;
	// here λ 1.1576 (leaner, drier): ±0.5 K.
	d := &c.DewPoint
	if !d.Known {
		t.Fatalf("no dew point: %s", d.Note)
	}
	near(t, "acid dew point °C (docs/reference/plant-checks.md §4 [C], λ 1.15 row)", d.VerhoffBanchero-273.15, 151.3, 0.5)
	near(t, "margin = flue T − dew point (definition)", d.Margin, 523.15-d.VerhoffBanchero, 0)
	near(t, "margin asked for (DefaultDewMargin, common practice)", d.MinMargin, 20, 0)
	near(t, "SO3 conversion (DefaultSO3Conversion, docs/reference/plant-checks.md §4 [M])", d.SO3Conversion, 0.03, 0)

	// One warning: no radiation loss given.
	if len(c.Warnings) != 1 || !strings.Contains(c.Warnings[0], "no radiation and convection loss given (RadiationAtMCR)") {
		t.Errorf("warnings %q; want the one no-radiation warning naming RadiationAtMCR", c.Warnings)
	}

	// docs/reference/plant-checks.md §3.3 [C]: with radiation 0.7 % and unburnt 0.1 %, η ≈ 89.6 % (LHV).
	r := worked()
	r.RadiationAtMCR, r.Solids = 0.007, 0.001
	c = mustCheck(t, r, nil)
	near(t, "η LHV % with radiation 0.7, unburnt 0.1 (docs/reference/plant-checks.md §3.3 [C])", c.Losses.LHV.Efficiency, 89.6, 0.05)
	if len(c.Warnings) != 0 {
		t.Errorf("warnings %q, want none", c.Warnings)
	}
}

// TestCheckFlueGasDewPoint checks the dew point through the check against
// docs/reference/plant-checks.md §4 and the warnings on the margin to it.
func TestCheckFlueGasDewPoint(t *testing.T) {
	t.Parallel()
	// docs/reference/plant-checks.md §4 test-fuel row [C]: at λ 1.15 (O2 2.88 % dry, docs/reference/plant-checks.md §2.1 [C]), H2O 9.5 %,
	// SO2 1358 ppm wet, 3 % to SO3: VB 151.3 °C, Okkes 145.1 °C. O2 2.88 %
	// is rounded (λ 1.1503 here): ±0.1 K.
	r := worked()
	r.Dry, r.AirT = 0.0288, 298.15
	c := mustCheck(t, r, nil)
	near(t, "H2O wet (docs/reference/plant-checks.md §2.1 [C], 9.50 %)", 100*c.Wet[H2O], 9.50, 0.01)
	near(t, "SO2 wet ppm (docs/reference/plant-checks.md §2.1 [C], 1358)", 1e6*c.Wet[SO2], 1358, 2)
	near(t, "Verhoff-Banchero °C (docs/reference/plant-checks.md §4 [C], test-fuel row)", c.DewPoint.VerhoffBanchero-273.15, 151.3, 0.1)
	if !c.DewPoint.OkkesKnown {
		t.Fatalf("Okkes not given inside its range: %s", c.DewPoint.OkkesNote)
	}
	near(t, "Okkes °C (docs/reference/plant-checks.md §4 [C], test-fuel row)", c.DewPoint.Okkes-273.15, 145.1, 0.1)

	// docs/reference/plant-checks.md §4 row 1 and §11 item 6 [S✓]: pH2O 93.44 mmHg, pSO3 0.0024917 mmHg
	// give 128.75 °C ± 0.05. The air's humidity is found that makes the
	// wet H2O 93.44/760 of 1 atm, and the SO3 share that makes the SO3
	// 0.0024917/760 (bisection; the partial pressures then agree to 1e-9).
	lo, hi := 0.0, 0.1
	wantH2O, wantSO3 := 93.44/760, 0.0024917/760
	for range 100 {
		r.Humidity = (lo + hi) / 2
		if mustCheck(t, r, nil).Wet[H2O] < wantH2O {
			lo = r.Humidity
		} else {
			hi = r.Humidity
		}
	}
	c = mustCheck(t, r, nil)
	r.SO3Conversion = wantSO3 / c.Wet[SO2]
	c = mustCheck(t, r, nil)
	near(t, "wet H2O found", c.Wet[H2O], wantH2O, 1e-9)
	near(t, "Verhoff-Banchero °C (docs/reference/plant-checks.md §4 row 1, §11 item 6 [S✓])", c.DewPoint.VerhoffBanchero-273.15, 128.75, 0.05)
	// There the SO3 is 3.28 ppm, inside Okkes's range (from memory, 1–100
	// ppm), so Okkes is given too, below VB as in every row of docs/reference/plant-checks.md §4 [C].
	if !c.DewPoint.OkkesKnown || !(c.DewPoint.Okkes < c.DewPoint.VerhoffBanchero) {
		t.Errorf("Okkes %v (%g K) at 3.28 ppm SO3; want it given and below VB %g K", c.DewPoint.OkkesKnown, c.DewPoint.Okkes, c.DewPoint.VerhoffBanchero)
	}

	// Outside Okkes's H2O range (from memory, 5–15 %): not given, with a note.
	r = worked()
	r.Humidity = 0.1 // about 23 % H2O wet
	c = mustCheck(t, r, nil)
	if c.DewPoint.OkkesKnown || !strings.Contains(c.DewPoint.OkkesNote, "outside the range of the Okkes correlation") {
		t.Errorf("Okkes at %.1f %% H2O: known %v, note %q", 100*c.Wet[H2O], c.DewPoint.OkkesKnown, c.DewPoint.OkkesNote)
	}

	// The margin warning, 20 K above the dew point (common practice, no
	// source); the dew point here is near 151 °C.
	for _, w := range []struct {
		flueC  float64
		margin float64 // CheckSettings.DewMargin
		want   string  // a phrase of the warning, "" for none
	}{
		{250, 0, ""},
		{180, 0, ""},
		{165, 0, "less than 20 K above the acid dew point"},
		{140, 0, "K below the acid dew point"},
		{180, 40, "less than 40 K above the acid dew point of 151.2 °C, the margin asked for"},
	} {
		r := worked()
		r.FlueT, r.RadiationAtMCR = w.flueC+273.15, 0.01
		c := mustCheck(t, r, &CheckSettings{DewMargin: w.margin})
		got := strings.Join(c.Warnings, "\n")
		if w.want == "" && strings.Contains(got, "dew point") || w.want != "" && !strings.Contains(got, w.want) {
			t.Errorf("flue %g °C, margin %g K: warnings %q, want %q", w.flueC, w.margin, c.Warnings, w.want)
		}
	}
	// Below the dew point the warning says by how much (issue 17).
	r = worked()
	r.FlueT = 116.3 + 273.15
	c = mustCheck(t, r, nil)
	if want := "the flue gas at 116.3 °C is 34.9 K below the acid dew point of 151.2 °C"; !strings.Contains(c.Warnings[0], want) {
		t.Errorf("warning %q, want %q", c.Warnings[0], want)
	}
	near(t, "margin below the dew point (negative)", c.DewPoint.Margin, -34.9, 0.05)

	// A fuel without sulfur has no acid dew point, with a note.
	g, _ := fuel.Grade("LNG")
	c = mustCheck(t, FlueGasReading{Fuel: g, Gas: MeasuredO2, Dry: 0.03, FlueT: 423.15, AirT: 308.15}, nil)
	if c.DewPoint.Known || !strings.Contains(c.DewPoint.Note, "no sulfur") {
		t.Errorf("LNG: dew point %+v", c.DewPoint)
	}
	// Sulfur but no water in the flue gas: not computed, with a warning.
	dry := fuel.Fuel{Name: "sulfur coke", Class: fuel.Residual, SetLHV: 33e6, Analysis: fuel.Analysis{C: 0.97, S: 0.03}}
	c = mustCheck(t, FlueGasReading{Fuel: dry, Gas: MeasuredO2, Dry: 0.03, FlueT: 523.15, AirT: 308.15, RadiationGiven: true}, nil)
	if c.DewPoint.Known || len(c.Warnings) != 1 || !strings.Contains(c.Warnings[0], "could not be computed") || strings.Contains(c.Warnings[0], "combustion:") {
		t.Errorf("dry flue gas: dew point %+v, warnings %q", c.DewPoint, c.Warnings)
	}
}

// TestCheckFlueGasReadings checks the CO2 form, λ = 1 at 0 % O2, the gas
// coefficients of Siegert, humidity and atomising steam.
func TestCheckFlueGasReadings(t *testing.T) {
	t.Parallel()
	o2 := mustCheck(t, worked(), nil)

	// The CO2 that 3 % O2 implies gives the same λ back: both forms of
	// docs/reference/plant-checks.md §2 [CP] are exact for complete combustion.
	r := worked()
	r.Gas, r.Dry = MeasuredCO2, o2.Dry[CO2]
	c := mustCheck(t, r, nil)
	near(t, "λ from CO2 vs from O2 (docs/reference/plant-checks.md §2 [CP])", c.Products.Lambda, o2.Products.Lambda, 1e-9)
	// Siegert's CO2 form at the test fuel's 13.68 %: 9.36 % (docs/reference/plant-checks.md §3.2 [C]).
	if c.Siegert.Form != "CO2 form" {
		t.Errorf("Siegert form %q, want the CO2 form for a CO2 reading", c.Siegert.Form)
	}
	near(t, "Siegert CO2 form % (docs/reference/plant-checks.md §3.2 [C])", c.Siegert.Loss, 9.36, 0.005)

	// 0 % O2 is λ = 1, with a warning.
	r = worked()
	r.Dry = 0
	c = mustCheck(t, r, nil)
	near(t, "λ at 0 % O2", c.Products.Lambda, 1, 0)
	if !strings.Contains(strings.Join(c.Warnings, "\n"), "0 % is taken as stoichiometric") {
		t.Errorf("0 %% O2: warnings %q", c.Warnings)
	}

	// Gas fires with the natural-gas coefficients (docs/reference/plant-checks.md §3.2 [S]).
	g, _ := fuel.Grade("LNG")
	c = mustCheck(t, FlueGasReading{Fuel: g, Gas: MeasuredO2, Dry: 0.03, FlueT: 473.15, AirT: 293.15}, nil)
	if c.Siegert.Coefficients != SiegertNaturalGas || c.Siegert.Set != "natural-gas coefficients" {
		t.Errorf("LNG Siegert %+v", c.Siegert)
	}
	// q = (t_A − t_L)·(A2/(21 − O2) + B) with A2 0.66, B 0.009 (docs/reference/plant-checks.md §3.2 [S]).
	near(t, "Siegert LNG % (docs/reference/plant-checks.md §3.2 [S] formula)", c.Siegert.Loss, 180*(0.66/18+0.009), 1e-9)

	// Humid air adds moisture loss; a relative humidity and the humidity
	// ratio it gives read the same.
	r = worked()
	r.RelativeHumidity = 0.6
	h := mustCheck(t, r, nil)
	// 60 % at 35 °C: about 0.021 kg/kg (psychrometric chart, from memory).
	near(t, "humidity ratio at 60 %, 35 °C (psychrometric chart, from memory)", h.Products.HumidityRatio, 0.021, 0.001)
	r.RelativeHumidity, r.Humidity = 0, h.Products.HumidityRatio
	near(t, "η with RH vs its humidity ratio", mustCheck(t, r, nil).Losses.LHV.Efficiency, h.Losses.LHV.Efficiency, 1e-9)
	if !(h.Losses.LHV.MoistureAir > 0) {
		t.Errorf("humid air: moisture from air %g", h.Losses.LHV.MoistureAir)
	}

	// Atomising steam at the air temperature, 0.02 kg/kg: its moisture
	// loss is its sensible heat from 35 to 250 °C over the LHV. With the
	// mean molar cp of H2O 25–250 °C of docs/reference/plant-checks.md §3.3 (34.4
	// kJ/(kmol·K) [M], three figures): 0.02·34.4/18.015·215/40487 =
	// 0.2028 % ± 1 %. No credit: the steam enters at the reference.
	r = worked()
	r.AtomisingSteam = 0.02
	c = mustCheck(t, r, nil)
	near(t, "atomising-steam moisture % LHV (docs/reference/plant-checks.md §3.3 [M] cp)", c.Losses.LHV.MoistureSteam, 0.02*34.4/18.015*215/40487*100, 0.002)
	near(t, "steam credit at the reference temperature", c.Losses.LHV.SteamCredit, 0, 1e-12)
	near(t, "atomising-steam T defaults to the air's", c.Reading.AtomisingSteamT, 308.15, 0)
	j := c.JSON()
	near(t, "moisture_pct = sum of its four items", j.Losses.Moisture, j.Losses.MoistureH+j.Losses.MoistureW+j.Losses.MoistureAir+j.Losses.MoistureSteam, 1e-12)
	// Hotter steam brings heat in: a credit.
	r.AtomisingSteamT = 453.15
	if c := mustCheck(t, r, nil); !(c.Losses.LHV.SteamCredit > 0) {
		t.Errorf("steam at 180 °C: credit %g, want > 0", c.Losses.LHV.SteamCredit)
	}

	// The radiation loss scales by 1/load (docs/reference/plant-checks.md §3.4 [M]: "1 %
	// at full load → 4 % at quarter load"), with a warning below 25 %.
	r = worked()
	r.RadiationAtMCR, r.Load = 0.01, 0.25
	near(t, "radiation % at quarter load (docs/reference/plant-checks.md §3.4 [M])", mustCheck(t, r, nil).Losses.LHV.Radiation, 4, 1e-12)
	r.Load = 0.2
	if w := strings.Join(mustCheck(t, r, nil).Warnings, "\n"); !strings.Contains(w, "below 25 % load") {
		t.Errorf("20 %% load: warnings %q", w)
	}
	// Zero given on purpose: no loss and no warning.
	r = worked()
	r.RadiationGiven = true
	if c := mustCheck(t, r, nil); c.Losses.LHV.Radiation != 0 || len(c.Warnings) != 0 {
		t.Errorf("radiation given as 0: loss %g, warnings %q", c.Losses.LHV.Radiation, c.Warnings)
	}
	// CO: a·CO/(CO + CO2), a = 48 for oil (docs/reference/plant-checks.md §3.1 [S✓]).
	r = worked()
	r.COppmDry = 50
	c = mustCheck(t, r, nil)
	near(t, "CO loss % (docs/reference/plant-checks.md §3.1 [S✓])", c.Losses.LHV.CO, 48*0.005/(0.005+100*c.Dry[CO2]), 1e-12)
}

// TestCheckFlueGasErrors checks that every field is validated, with the
// field and the value in the error and nothing computed.
func TestCheckFlueGasErrors(t *testing.T) {
	t.Parallel()
	noAnalysis := checkTestFuel()
	noAnalysis.Analysis = fuel.Analysis{}
	short := checkTestFuel()
	short.Analysis.C = 0.80
	negative := checkTestFuel()
	negative.Analysis.H, negative.Analysis.C = -0.01, 0.98
	lowLHV := checkTestFuel()
	lowLHV.SetLHV = 2e6
	badClass := checkTestFuel()
	badClass.Class = 9
	cases := []struct {
		name  string
		edit  func(*FlueGasReading)
		s     *CheckSettings
		field ReadingField
		msg   string // a phrase of Msg
	}{
		{"no analysis", func(r *FlueGasReading) { r.Fuel = noAnalysis }, nil, FieldAnalysis, "has no ultimate analysis"},
		{"analysis sum", func(r *FlueGasReading) { r.Fuel = short }, nil, FieldAnalysis, "the values add up to 94 %; they must add up to 100 % within 0.5 %"},
		{"analysis value", func(r *FlueGasReading) { r.Fuel = negative }, nil, FieldAnalysis, "H = -1 %; each value must lie between 0 % and 100 %"},
		{"LHV", func(r *FlueGasReading) { r.Fuel = lowLHV }, nil, FieldLHV, "between 5 MJ/kg and 130 MJ/kg; got 2 MJ/kg"},
		{"fuel class", func(r *FlueGasReading) { r.Fuel = badClass }, nil, FieldFuel, `fuel "test fuel": `},
		{"no reading", func(r *FlueGasReading) { r.Gas = NoReading }, nil, FieldGas, "no flue-gas reading"},
		{"O2 negative", func(r *FlueGasReading) { r.Dry = -0.01 }, nil, FieldO2, "cannot be negative"},
		{"O2 of air", func(r *FlueGasReading) { r.Dry = 0.209 }, nil, FieldO2, "no combustion: an O2 at or near that of air (20.946 % dry"},
		{"O2 above air", func(r *FlueGasReading) { r.Dry = 0.25 }, nil, FieldO2, "no combustion"},
		{"O2 nearly air", func(r *FlueGasReading) { r.Dry = 0.205 }, nil, FieldO2, "nearly air: it means an air ratio λ of 44.34, more than the 20"},
		{"CO2 range", func(r *FlueGasReading) { r.Gas, r.Dry = MeasuredCO2, 0.35 }, nil, FieldCO2, "above 0 % and below 30 %"},
		{"CO2 above max", func(r *FlueGasReading) { r.Gas, r.Dry = MeasuredCO2, 0.17 }, nil, FieldCO2, "above the fuel's maximum CO2 of 15.97 %"},
		{"CO2 nearly air", func(r *FlueGasReading) { r.Gas, r.Dry = MeasuredCO2, 0.005 }, nil, FieldCO2, "nearly air"},
		{"losses above input", func(r *FlueGasReading) { r.Dry, r.FlueT = 0.19, 1273.15 }, nil, FieldO2, "the losses come to"},
		{"no air T", func(r *FlueGasReading) { r.AirT = 0 }, nil, FieldAirT, "required"},
		{"air T range", func(r *FlueGasReading) { r.AirT = 373.15 }, nil, FieldAirT, "between -20 °C and 50 °C; got 100 °C"},
		{"no flue T", func(r *FlueGasReading) { r.FlueT = 0 }, nil, FieldFlueT, "required"},
		{"flue below air", func(r *FlueGasReading) { r.FlueT = 300 }, nil, FieldFlueT, "the flue gas (26.85 °C) is not hotter than the combustion air (35 °C)"},
		{"flue T max", func(r *FlueGasReading) { r.FlueT = 1373.15 }, nil, FieldFlueT, "at most 1000 °C"},
		{"both humidities", func(r *FlueGasReading) { r.Humidity, r.RelativeHumidity = 0.01, 0.5 }, nil, FieldHumidity, "not both"},
		{"humidity ratio", func(r *FlueGasReading) { r.Humidity = 0.5 }, nil, FieldHumidity, "between 0 and 0.2 kg/kg"},
		{"relative humidity", func(r *FlueGasReading) { r.RelativeHumidity = 1.2 }, nil, FieldRelativeHumidity, "between 0 % and 100 %"},
		{"RH below freezing", func(r *FlueGasReading) { r.RelativeHumidity, r.AirT = 0.5, 263.15 }, nil, FieldRelativeHumidity, "saturation over ice"},
		{"CO", func(r *FlueGasReading) { r.COppmDry = -1 }, nil, FieldCO, "between 0 and 100000 ppm"},
		{"radiation", func(r *FlueGasReading) { r.RadiationAtMCR = 0.2 }, nil, FieldRadiation, "between 0 % and 10 %"},
		{"load without radiation", func(r *FlueGasReading) { r.Load = 0.5 }, nil, FieldLoad, "give RadiationAtMCR with it"},
		{"load range", func(r *FlueGasReading) { r.RadiationAtMCR, r.Load = 0.01, 2 }, nil, FieldLoad, "between 5 % and 120 % of MCR"},
		{"solids", func(r *FlueGasReading) { r.Solids = 0.5 }, nil, FieldSolids, "between 0 % and 10 %"},
		{"atomising", func(r *FlueGasReading) { r.AtomisingSteam = 2 }, nil, FieldAtomisingSteam, "between 0 and 1 kg per kg fuel"},
		{"steam T without steam", func(r *FlueGasReading) { r.AtomisingSteamT = 453.15 }, nil, FieldAtomisingSteamT, "needs the atomising steam (AtomisingSteam)"},
		{"steam T range", func(r *FlueGasReading) { r.AtomisingSteam, r.AtomisingSteamT = 0.02, 1000 }, nil, FieldAtomisingSteamT, "between 0 °C and 600 °C"},
		{"SO3", func(r *FlueGasReading) { r.SO3Conversion = 0.5 }, nil, FieldSO3, "above 0 % and at most 20 %"},
		{"dew margin", func(r *FlueGasReading) {}, &CheckSettings{DewMargin: 150}, FieldDewMargin, "at most 100 K"},
		{"names and units of the caller", func(r *FlueGasReading) { r.Load = 0.5 },
			&CheckSettings{Name: func(f ReadingField) string { return "--" + strings.ToLower(f.String()) }}, FieldLoad, "give --radiationatmcr with it"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			r := worked()
			c.edit(&r)
			res, err := CheckFlueGas(r, c.s)
			var re *ReadingError
			if !errors.As(err, &re) || res != nil {
				t.Fatalf("got %v, %v; want a *ReadingError and no result", res, err)
			}
			if re.Field != c.field || !strings.Contains(re.Msg, c.msg) {
				t.Errorf("field %v, msg %q; want field %v and %q", re.Field, re.Msg, c.field, c.msg)
			}
			if e := err.Error(); !strings.HasPrefix(e, "combustion: flue-gas reading: "+c.field.String()+" = ") || strings.Contains(e, "e+") || strings.Contains(e, "99999") || strings.Contains(e, "00000001") {
				t.Errorf("error %q: want the field and its value, without float noise", e)
			}
		})
	}
}

// TestCheckFlueGasBounds checks that values typed at a bound in °C read as
// the bound (the float rounding of -20 °C to kelvin).
func TestCheckFlueGasBounds(t *testing.T) {
	t.Parallel()
	r := worked()
	r.AirT = -20 + 273.15 // 253.14999999999998
	r.FlueT = 1000 + 273.15
	c := mustCheck(t, r, nil)
	if c.Reading.AirT != MinCheckAirT || c.Reading.FlueT != MaxCheckFlueT {
		t.Errorf("bounds read as %v K, %v K", c.Reading.AirT, c.Reading.FlueT)
	}
	r.AirT = MinCheckAirT - 1e-6
	if _, err := CheckFlueGas(r, nil); err == nil {
		t.Errorf("air 1 µK below the bound accepted")
	}
}

// TestValuesIn checks that messages give values in the caller's units,
// without float noise.
func TestValuesIn(t *testing.T) {
	t.Parallel()
	v := ValuesIn(map[ReadingField]string{FieldFlueT: "F", FieldAirT: "K", FieldLHV: "kJ/kg", FieldO2: "", FieldCO: "ppm", FieldSO3: "%", FieldDewMargin: "ΔF"})
	for _, c := range []struct {
		f    ReadingField
		v    float64
		want string
	}{
		{FieldFlueT, (2000-32)/1.8 + 273.15, "2000 °F"}, // °F to K and back
		{FieldAirT, 308.15, "308.15 K"},
		{FieldLHV, 40.2e6, "40200 kJ/kg"},
		{FieldO2, 0.20946000000000002, "0.20946"}, // a bare fraction
		{FieldCO, 50, "50 ppm"},
		{FieldSO3, 0.03, "3 %"},
		{FieldDewMargin, 20, "36 Δ°F"},
		{FieldCO2, 0.1597, "15.97 %"}, // not in the map: the default
		{FieldRadiation, 0.01, "1 %"}, // likewise
		{FieldAtomisingSteamT, 453.15, "180 °C"},
	} {
		if got := v(c.f, c.v); got != c.want {
			t.Errorf("%v %v: %q, want %q", c.f, c.v, got, c.want)
		}
	}
	// A unit of another dimension falls back to the default.
	if got := ValuesIn(map[ReadingField]string{FieldFlueT: "MJ/kg"})(FieldFlueT, 523.15); got != "250 °C" {
		t.Errorf("wrong-dimension unit: %q", got)
	}
}

// TestFlueGasJSON checks the JSON form: the keys, null for what is not
// known, the key of the atomising steam only with steam, and the caution.
func TestFlueGasJSON(t *testing.T) {
	t.Parallel()
	keys := func(c *FlueGasCheck) (map[string]any, map[string]any) {
		b, err := json.Marshal(c.JSON())
		if err != nil {
			t.Fatal(err)
		}
		var m map[string]any
		if err := json.Unmarshal(b, &m); err != nil {
			t.Fatal(err)
		}
		l, _ := m["losses"].(map[string]any)
		return m, l
	}
	m, l := keys(mustCheck(t, worked(), nil))
	for _, k := range []string{"fuel", "lambda", "excess_air_pct", "stoich_air_kg_per_kg", "co2_dry_pct", "h2o_wet_pct",
		"losses", "losses_hhv", "efficiency_lhv_pct", "efficiency_hhv_pct", "acid_dew_point_K", "siegert_loss_pct",
		"siegert_form", "lhv_J_per_kg", "hhv_J_per_kg", "warnings", "caution"} {
		if _, ok := m[k]; !ok {
			t.Errorf("JSON lacks %q", k)
		}
	}
	if _, ok := l["moisture_from_atomising_steam_pct"]; ok {
		t.Errorf("JSON has the atomising-steam item without atomising steam")
	}
	if m["caution"] != Caution || !strings.Contains(Caution, "planning and audit estimate") {
		t.Errorf("caution %q", m["caution"])
	}
	if m["siegert_form"] != "1. BImSchV, O2 form, fuel-oil coefficients" {
		t.Errorf("siegert_form %q", m["siegert_form"])
	}
	r := worked()
	r.AtomisingSteam = 0.02
	_, l = keys(mustCheck(t, r, nil))
	if _, ok := l["moisture_from_atomising_steam_pct"]; !ok {
		t.Errorf("JSON lacks the atomising-steam item with atomising steam")
	}
	g, _ := fuel.Grade("LNG")
	m, _ = keys(mustCheck(t, FlueGasReading{Fuel: g, Gas: MeasuredCO2, Dry: 0.009, FlueT: 423.15, AirT: 308.15}, nil))
	if m["acid_dew_point_K"] != nil || m["siegert_loss_pct"] != nil {
		t.Errorf("LNG at 0.9 %% CO2: dew point %v, Siegert %v; want both null", m["acid_dew_point_K"], m["siegert_loss_pct"])
	}
}

// TestFuelWithAnalysis checks that a grade given another analysis keeps its
// class, drops its ISO 8217 data and takes the analysis's specific energy.
func TestFuelWithAnalysis(t *testing.T) {
	t.Parallel()
	g, _ := fuel.Grade("VLSFO")
	f := FuelWithAnalysis(g, checkTestFuel().Analysis)
	if f.Name != "VLSFO with the given analysis" || f.SetLHV != g.SetLHV || f.Class != g.Class || f.ISO.Given() || f.Analysis != checkTestFuel().Analysis {
		t.Errorf("FuelWithAnalysis: %+v", f)
	}
	// The grade's ISO 8217 data are dropped, so its net specific energy is
	// the analysis's own: Channiwala–Parikh (2002), as plant/fuel computes
	// and tests it.
	e, err := f.Energy()
	if err != nil {
		t.Fatal(err)
	}
	c := mustCheck(t, FlueGasReading{Fuel: f, Gas: MeasuredO2, Dry: 0.03, FlueT: 523.15, AirT: 308.15}, nil)
	near(t, "LHV of VLSFO with an analysis on top (the analysis's own, Channiwala–Parikh)", c.Losses.LHV.HeatInput, e.Net, 1e-9)
	near(t, "stoichiometric air of the analysis given (docs/reference/plant-checks.md §2.1 [C])", c.Products.Stoich.Air, 13.770, 0.005)
}

// FuzzCheckFlueGas: no reading makes CheckFlueGas panic; an error is a
// *ReadingError (or names the fuel), and a result has finite numbers in its
// JSON and a positive efficiency.
func FuzzCheckFlueGas(f *testing.F) {
	f.Add(uint8(1), 0.03, 523.15, 308.15, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0)
	f.Add(uint8(2), 0.13, 473.15, 298.15, 0.01, 0.0, 50.0, 0.01, 0.5, 0.02)
	f.Add(uint8(1), 0.0, 1273.15, 253.15, 0.0, 0.6, 0.0, 0.1, 0.05, 0.2)
	f.Add(uint8(1), 0.199, 1273.15, 323.15, 0.2, 0.0, 1e5, 0.0, 1.2, 0.0)
	f.Add(uint8(0), math.NaN(), math.Inf(1), -1.0, -0.0, 2.0, -5.0, 0.3, 0.01, 5.0)
	fu := checkTestFuel()
	f.Fuzz(func(t *testing.T, gas uint8, dry, flueT, airT, hum, rh, co, rad, load, steam float64) {
		r := FlueGasReading{Fuel: fu, Gas: MeasuredGas(gas % 4), Dry: dry, FlueT: flueT, AirT: airT,
			Humidity: hum, RelativeHumidity: rh, COppmDry: co, RadiationAtMCR: rad, Load: load, AtomisingSteam: steam}
		c, err := CheckFlueGas(r, nil)
		if err != nil {
			var re *ReadingError
			if !errors.As(err, &re) {
				t.Fatalf("%+v: error %v is not a *ReadingError", r, err)
			}
			return
		}
		b, err := json.Marshal(c.JSON())
		if err != nil {
			t.Fatalf("%+v: %v", r, err)
		}
		if !(c.Losses.LHV.Efficiency > 0 && c.Losses.LHV.Efficiency <= 100+c.Losses.LHV.TotalCredit) {
			t.Fatalf("%+v: efficiency %g\n%s", r, c.Losses.LHV.Efficiency, b)
		}
	})
}

func BenchmarkCheckFlueGas(b *testing.B) {
	r := worked()
	r.RelativeHumidity, r.COppmDry, r.RadiationAtMCR = 0.6, 50, 0.01
	b.ReportAllocs()
	for b.Loop() {
		if _, err := CheckFlueGas(r, nil); err != nil {
			b.Fatal(err)
		}
	}
}

// TestWaterDewPoint inverts the IF97 saturation pressure: the temperatures
// of IAPWS R7-97(2012) Table 35 from its pressures (printed to 9 figures,
// so 1e-6 K), and no dew point for no vapour.
func TestWaterDewPoint(t *testing.T) {
	t.Parallel()
	for _, r := range readCSV(t, "if97-psat.csv") {
		T := num(t, r["value_in_1"])
		near(t, "T_sat(p_sat) K (IAPWS R7-97(2012) Table 35)", waterDewPoint(num(t, r["value"])*1e6), T, 1e-6)
	}
	if td := waterDewPoint(0); td != 0 {
		t.Errorf("dew point of no vapour %g K, want 0", td)
	}
	// A flue gas at or below its water dew point is refused: the test
	// fuel's flue gas at 3 % O2 has 9.4 % H2O, which condenses near 45 °C
	// (T_sat at 9.5 kPa, IF97 as above).
	r := worked()
	r.FlueT, r.AirT = 40+273.15, 20+273.15
	_, err := CheckFlueGas(r, nil)
	var re *ReadingError
	if !errors.As(err, &re) || re.Field != FieldFlueT || !strings.Contains(re.Msg, "below its water dew point of 44.") {
		t.Errorf("flue gas at 40 °C: %v", err)
	}
	r.FlueT = 50 + 273.15
	mustCheck(t, r, nil)
}
