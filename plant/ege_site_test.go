package plant

import (
	"context"
	"fmt"
	"math"
	"strings"
	"testing"

	"steamcase/plant/combustion"
	"steamcase/plant/fuel"
)

// solveEGE solves the economiser-only plant of egeOnly at a load and
// conditions, with the settings given, and returns its economiser's part.
func solveEGE(t *testing.T, p *Plant, cond Conditions, set ...Setting) (*CaseResult, EGEResult) {
	t.Helper()
	cr, err := p.Solve(context.Background(), Case{Name: "c", Conditions: cond, Set: set})
	must(t, err)
	if len(cr.EGEs) != 1 {
		t.Fatalf("%d economisers reported", len(cr.EGEs))
	}
	if cr.Balance.MassRel > 1e-9 || cr.Balance.EnergyRel > 1e-6 {
		t.Errorf("balances %+v", cr.Balance)
	}
	return cr, cr.EGEs[0]
}

// byHandDuty is the evaporator's duty with a constant cp (docs/reference/plant-checks.md
// §7 [C] formula): ṁ·c̄p·(T_in − T_sat)·(1 − exp(−UA/(ṁ·c̄p))).
func byHandDuty(m, cp, tIn, tSat, ua float64) float64 {
	return m * cp * (tIn - tSat) * (1 - math.Exp(-ua/(m*cp)))
}

func hasWarning(cr *CaseResult, parts ...string) bool {
	for _, w := range cr.Warnings {
		ok := true
		for _, p := range parts {
			ok = ok && strings.Contains(w, p)
		}
		if ok {
			return true
		}
	}
	return false
}

func TestEGEAmbientCorrection(t *testing.T) {
	t.Parallel()
	// The engine's table holds at 25 °C intake air (ISO 15550 / ISO 3046-1
	// reference, from memory). At 5 °C air with a 10 K intake rise the
	// intake is 15 °C, 10 K below the reference: by hand with the default
	// coefficients of docs/reference/plant-checks.md §7 [M] (+1.6 K exhaust and −0.35 %
	// gas per K of intake air), T_in = 240 − 16 = 224 °C and the gas flow
	// is 35.4167·(1 + 0.035) kg/s. The size (a 15 K pinch at 100 % load,
	// of the table as given) stays: UA ∝ ṁ^0.65.
	p, e := egeOnly(t, 0.65)
	e.IntakeRise = 10
	ts, err := waterTsat(e.DrumP)
	must(t, err)
	m0 := 15e6 * 8.5 / 3.6e6
	ua0 := math.Log((240-(ts-273.15))/15) * m0 * 1060 // the design pinch by hand
	cond := Conditions{SeaT: 283.15, AirT: 278.15, EngineLoad: 1}
	_, r := solveEGE(t, p, cond)
	tIn, m := 273.15+240-1.6*10, m0*(1+0.0035*10)
	within(t, "gas in K", r.GasInT, tIn, 1e-12)
	within(t, "gas kg/s", r.GasKgS, m, 1e-12)
	within(t, "table gas in K", r.TableGasInT, 513.15, 1e-12)
	within(t, "intake K", r.IntakeT, 288.15, 1e-12)
	within(t, "design UA", r.DesignUA, ua0, 1e-9)
	ua := ua0 * math.Pow(m/m0, 0.65)
	within(t, "UA", r.UA, ua, 1e-9)
	within(t, "duty W", r.DutyW, byHandDuty(m, 1060, tIn, ts, ua), 1e-9)
	if !r.SiteCorrected || r.CoolantT != 0 {
		t.Errorf("corrected %v, coolant %g: want corrected for the air only (no coolant coefficients)", r.SiteCorrected, r.CoolantT)
	}

	// The maker's coefficients, with the coolant: +0.5 K and −0.1 % per K
	// of coolant above 25 °C (invented maker's figures), sea at 32 °C.
	e.TPerAirK, e.GasPerAirK, e.TPerCoolantK, e.GasPerCoolantK = 2, -0.004, 0.5, -0.001
	cond.SeaT = 305.15
	_, r = solveEGE(t, p, cond)
	within(t, "gas in K, maker's figures", r.GasInT, 513.15+2*(-10)+0.5*7, 1e-12)
	within(t, "gas kg/s, maker's figures", r.GasKgS, m0*(1+0.004*10-0.001*7), 1e-12)

	// As given: the table holds at the site.
	e.Ambient = AmbientAsGiven
	_, r = solveEGE(t, p, cond)
	if r.SiteCorrected || r.GasInT != 513.15 || r.GasKgS != m0 {
		t.Errorf("as given: corrected %v, gas %g K, %g kg/s; want the table's", r.SiteCorrected, r.GasInT, r.GasKgS)
	}

	// Without an air temperature nothing is corrected (the reference).
	e.Ambient = AmbientCorrect
	_, r = solveEGE(t, p, Conditions{EngineLoad: 1})
	if r.SiteCorrected || r.GasInT != 513.15 {
		t.Errorf("no air given: corrected %v, gas in %g K", r.SiteCorrected, r.GasInT)
	}

	// Far from the reference the linear correction is used with a warning.
	e.TPerAirK, e.GasPerAirK, e.TPerCoolantK, e.GasPerCoolantK = 0, 0, 0, 0
	cr, _ := solveEGE(t, p, Conditions{AirT: 258.15, EngineLoad: 1})
	if !hasWarning(cr, "intake air at -5.0 °C", "30 K from") {
		t.Errorf("no warning for an intake 30 K below the reference; got %q", cr.Warnings)
	}
}

func TestEGEUAScalesLikePinch(t *testing.T) {
	t.Parallel()
	// A unit given by UA at the gas flow of its design load behaves as the
	// unit sized by its pinch whose design UA it takes, at every load (the
	// same law, UA ∝ ṁ^n: docs/reference/plant-checks.md §7 [S]); given by UA alone its
	// UA is constant.
	p1, _ := egeOnly(t, 0.65)
	_, r1 := solveEGE(t, p1, Conditions{EngineLoad: 1})
	p2, e2 := egeOnly(t, 0.65)
	e2.UA, e2.DesignPinch = r1.DesignUA, 0
	p3, e3 := egeOnly(t, 0.65)
	e3.UA, e3.DesignPinch, e3.DesignLoad = r1.DesignUA, 0, 0
	for _, load := range []float64{0.5, 0.7, 1} {
		_, a := solveEGE(t, p1, Conditions{EngineLoad: load})
		_, b := solveEGE(t, p2, Conditions{EngineLoad: load})
		_, c := solveEGE(t, p3, Conditions{EngineLoad: load})
		within(t, "UA by ua at design_load against by pinch", b.UA, a.UA, 1e-12)
		within(t, "steam by ua at design_load against by pinch", b.SteamKgS, a.SteamKgS, 1e-9)
		within(t, "constant UA", c.UA, r1.DesignUA, 1e-12)
	}
}

func TestEGECaseSetsSize(t *testing.T) {
	t.Parallel()
	// A case (a study's variant) may set the drum pressure and the design
	// pinch: the size is found again for the case, so at the design load
	// the pinch is the one set, at the saturation of the drum set.
	p, e := egeOnly(t, 0.65)
	drum := gauge(9)
	cond := Conditions{EngineLoad: 1}
	_, r := solveEGE(t, p, cond, Setting{Unit: "ege", Param: "drum", Value: drum}, Setting{Unit: "ege", Param: "pinch", Value: 25})
	ts, err := waterTsat(drum)
	must(t, err)
	within(t, "saturation", r.TSat, ts, 1e-12)
	within(t, "pinch", r.Pinch, 25, 1e-9)
	// Setting ua on the pinch-sized unit: ua then holds at the gas flow of
	// the design load (pinch cleared for the case).
	_, r = solveEGE(t, p, Conditions{EngineLoad: 0.5}, Setting{Unit: "ege", Param: "ua", Value: 30e3})
	within(t, "ua at half the design gas flow", r.UA, 30e3*math.Pow(0.5, 0.65), 1e-12)
	// The plant's own values come back after the case.
	if e.DrumP != gauge(7) || e.DesignPinch != 15 || e.UA != 0 {
		t.Errorf("after the cases: drum %g, pinch %g, ua %g", e.DrumP, e.DesignPinch, e.UA)
	}
}

func TestEGEFoulingByUAFraction(t *testing.T) {
	t.Parallel()
	// UA falls linearly from clean to f·UA over the interval. With a
	// constant cp and no bypass the mean duty over the interval is, by
	// hand, with K = UA/(ṁ·c̄p) and a = 1 − f,
	//
	//	q̄ = ṁ·c̄p·(T_in − T_sat)·[1 − e^(−K)·(e^(K·a) − 1)/(K·a)]
	//
	// (the mean of exp(−K(1 − a·s)) over s in 0…1); the end state is at
	// f·UA. The steam lost to fouling equals the clean case's steam less
	// the fouled case's (the feed is the same in both).
	p, e := egeOnly(t, 0.65)
	e.FouledUA, e.CleanInterval = 0.8, 500*3600
	ts, err := waterTsat(e.DrumP)
	must(t, err)
	cond := Conditions{EngineLoad: 1}
	_, clean := solveEGE(t, p, cond, Setting{Unit: "ege", Param: "fouling_state", Value: float64(FoulingClean)})
	_, mean := solveEGE(t, p, cond)
	_, end := solveEGE(t, p, cond, Setting{Unit: "ege", Param: "fouling_state", Value: float64(FoulingEnd)})
	m, ua := clean.GasKgS, clean.UA
	K, a := ua/(m*1060), 0.2
	qMean := m * 1060 * (513.15 - ts) * (1 - math.Exp(-K)*(math.Exp(K*a)-1)/(K*a))
	within(t, "mean duty", mean.DutyW, qMean, 1e-12)
	within(t, "end duty", end.DutyW, byHandDuty(m, 1060, 513.15, ts, 0.8*ua), 1e-12)
	within(t, "clean duty", clean.DutyW, byHandDuty(m, 1060, 513.15, ts, ua), 1e-12)
	within(t, "mean UA fraction", mean.UAFraction, 0.9, 1e-12)
	within(t, "steam lost, mean", mean.FoulingLostKgS, clean.SteamKgS-mean.SteamKgS, 1e-9)
	within(t, "steam lost, end", end.FoulingLostKgS, clean.SteamKgS-end.SteamKgS, 1e-9)
	if clean.FoulingLostKgS != 0 || !(end.FoulingLostKgS > mean.FoulingLostKgS) {
		t.Errorf("steam lost: clean %g, mean %g, end %g kg/s", clean.FoulingLostKgS, mean.FoulingLostKgS, end.FoulingLostKgS)
	}
	// The mean outlet is the temperature of the mean duty (constant cp).
	within(t, "mean gas out", mean.GasOutT, 513.15-qMean/(m*1060), 1e-12)
}

func TestEGEFoulingByResistance(t *testing.T) {
	t.Parallel()
	// A soot resistance growing by 0.001 m²K/W per 1000 h over a 2000 h
	// interval on a surface of clean U 40 W/m²K (docs/reference/heat-transfer.md §5: soot
	// 0.001-0.005 m²K/W [CP/M], U ≈ 40 W/m²K in its worked example [C]):
	// at the end, at the design gas flow, 1/UA_f = 1/UA + R/A with
	// A = UA/U, so UA_f/UA = 1/(1 + U·R) = 1/1.08 (by hand). The mean
	// duty against a trapezoid sum of the by-hand duty over the interval
	// (20000 steps).
	p, e := egeOnly(t, 0.65)
	e.FoulingRate, e.CleanU, e.CleanInterval = 0.001, 40, 2000*3600
	ts, err := waterTsat(e.DrumP)
	must(t, err)
	cond := Conditions{EngineLoad: 1}
	_, end := solveEGE(t, p, cond, Setting{Unit: "ege", Param: "fouling_state", Value: float64(FoulingEnd)})
	within(t, "end UA fraction", end.UAFraction, 1/1.08, 1e-12)
	_, mean := solveEGE(t, p, cond)
	m, ua := mean.GasKgS, mean.DesignUA
	const n = 20000
	var sum float64
	for i := 0; i <= n; i++ {
		s := float64(i) / n
		w := 1.0
		if i == 0 || i == n {
			w = 0.5
		}
		sum += w * byHandDuty(m, 1060, 513.15, ts, ua/(1+40*0.002*s))
	}
	within(t, "mean duty", mean.DutyW, sum/n, 1e-8)
	// At half the gas flow the clean UA is smaller and the same soot costs
	// a smaller share: UA_f/UA = 1/(1 + UA(ṁ)·R/A).
	_, half := solveEGE(t, p, Conditions{EngineLoad: 0.5}, Setting{Unit: "ege", Param: "fouling_state", Value: float64(FoulingEnd)})
	within(t, "end UA fraction at half load", half.UAFraction, 1/(1+40*0.002*math.Pow(0.5, 0.65)), 1e-12)
}

func TestEGEFoulingErrors(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name string
		set  func(e *ExhaustGasEconomiser)
		want string
	}{
		{"rate without interval", func(e *ExhaustGasEconomiser) { e.FoulingRate, e.CleanU = 0.001, 40 }, "fouling_rate needs clean_interval"},
		{"fraction without interval", func(e *ExhaustGasEconomiser) { e.FouledUA = 0.8 }, "fouled_ua needs clean_interval"},
		{"rate without clean U", func(e *ExhaustGasEconomiser) { e.FoulingRate, e.CleanInterval = 0.001, 3.6e6 }, "fouling_rate needs clean_U"},
		{"both forms", func(e *ExhaustGasEconomiser) {
			e.FoulingRate, e.FouledUA, e.CleanU, e.CleanInterval = 0.001, 0.8, 40, 3.6e6
		}, "not both"},
		{"interval alone", func(e *ExhaustGasEconomiser) { e.CleanInterval = 3.6e6 }, "clean_interval needs the fouling"},
		{"area without velocity", func(e *ExhaustGasEconomiser) { e.FlowArea = 5 }, "flow_area and soot_velocity go together"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			p, e := egeOnly(t, 0.65)
			e.Pos = Pos{File: "ship.lua", Line: 12}
			tc.set(e)
			err := p.Check()
			if err == nil || !strings.Contains(err.Error(), tc.want) || !strings.Contains(err.Error(), "ship.lua:12") {
				t.Errorf("got %v; want an error at ship.lua:12 with %q", err, tc.want)
			}
		})
	}
}

func TestEGEColdEnd(t *testing.T) {
	t.Parallel()
	// The exhaust of HSFO at 13 % O2 (dry) has an acid dew point that
	// plant/combustion finds by Verhoff–Banchero (tested there against
	// docs/reference/plant-checks.md §4 [S✓]); the economiser must report the same
	// figure, and warn with both temperatures when a preheating section
	// takes feed at 60 °C (below the dew point) and when its gas outlet
	// comes within the margin.
	p, e := egeOnly(t, 0.65)
	hsfo, err := fuel.Grade("HSFO")
	must(t, err)
	e.ExhaustFuel, e.ExhaustO2, e.PreheatUA = &hsfo, 0.13, 10e3
	prod, err := combustion.Fire(hsfo, combustion.Conditions{O2Dry: 0.13})
	must(t, err)
	dew, err := combustion.AcidDewPoint(prod, 0, 0.03, combustion.MethodVerhoffBanchero)
	must(t, err)
	cr, r := solveEGE(t, p, Conditions{EngineLoad: 1})
	within(t, "acid dew point", r.AcidDewT, dew, 1e-12)
	if !r.BelowDewMargin || !(r.PreheatWaterInT < dew) {
		t.Fatalf("below dew margin %v, water in %g K, dew %g K", r.BelowDewMargin, r.PreheatWaterInT, dew)
	}
	c := strconvC
	if !hasWarning(cr, "feed enters the preheating section at "+c(r.PreheatWaterInT), "acid dew point of "+c(dew)) {
		t.Errorf("no cold-end warning with both figures: %q", cr.Warnings)
	}
	// A margin wide enough to take in the gas outlet warns about it too.
	e.DewMargin = r.GasOutT - dew + 1
	cr, r = solveEGE(t, p, Conditions{EngineLoad: 1})
	if !hasWarning(cr, "the gas leaves at "+c(r.GasOutT), "acid dew point of "+c(dew)) {
		t.Errorf("no gas-outlet warning with both figures: %q", cr.Warnings)
	}
	// Without sulphur there is no acid dew point.
	mgo, err := fuel.Grade("MGO")
	must(t, err)
	if mgo.Analysis.S == 0 {
		e.ExhaustFuel = &mgo
		_, r = solveEGE(t, p, Conditions{EngineLoad: 1})
		if r.AcidDewT != 0 || r.BelowDewMargin {
			t.Errorf("MGO without sulphur: dew %g, flagged %v", r.AcidDewT, r.BelowDewMargin)
		}
	}
}

// strconvC formats a temperature in K as the warnings do, in °C with one
// decimal.
func strconvC(k float64) string { return fmt.Sprintf("%.1f °C", k-273.15) }

func TestEGESootRisk(t *testing.T) {
	t.Parallel()
	// Below 40 % of MCR (common practice, no source) a case is flagged;
	// with a free flow area the gas velocity by hand is ṁ/(ρ·A) with
	// ρ = p·M/(R·T̄), M of air 28.964 g/mol (docs/reference/plant-checks.md §0 [CP]),
	// T̄ the mean of the gas in and out of the tube bank.
	p, e := egeOnly(t, 0.65)
	cr, r := solveEGE(t, p, Conditions{EngineLoad: 0.35})
	if !r.SootRisk || !hasWarning(cr, "35 % of MCR is below 40 %", "soot fires") {
		t.Errorf("load 35 %%: soot risk %v, warnings %q", r.SootRisk, cr.Warnings)
	}
	_, r = solveEGE(t, p, Conditions{EngineLoad: 0.5})
	if r.SootRisk {
		t.Errorf("load 50 %%: soot risk flagged")
	}
	e.FlowArea, e.SootVelocity = 4, 10
	cr, r = solveEGE(t, p, Conditions{EngineLoad: 0.5})
	rho := 101325 * 0.028964 / (8.314462618 * 0.5 * (r.GasInT + r.GasOutT))
	v := r.GasKgS / (rho * 4)
	within(t, "gas velocity", r.GasVelocity, v, 1e-12)
	if (v < 10) != r.SootRisk {
		t.Errorf("velocity %.2f m/s against 10 m/s: soot risk %v", v, r.SootRisk)
	}
	if r.SootRisk && !hasWarning(cr, "m/s, below 10.0 m/s") {
		t.Errorf("no velocity warning: %q", cr.Warnings)
	}
}

func TestGauss8(t *testing.T) {
	t.Parallel()
	// An 8-point Gauss–Legendre rule integrates polynomials up to degree
	// 15 exactly (Abramowitz and Stegun, formula 25.4.29, from memory): ∫₀¹ s^k ds
	// = 1/(k+1) by hand.
	for k := 0; k <= 15; k++ {
		var sum float64
		for _, nw := range gauss8 {
			sum += nw[1] * math.Pow(nw[0], float64(k))
		}
		if math.Abs(sum-1/float64(k+1)) > 1e-14 {
			t.Errorf("∫ s^%d = %.17g, want %.17g", k, sum, 1/float64(k+1))
		}
	}
}

// BenchmarkEGEPrepare times the economiser's gas side for one case (what
// prepare does once per case, outside the Newton iterations): a constant
// cp; the exhaust of VLSFO by the NASA polynomials; with soot fouling
// averaged over the cleaning interval (eight ratings); and with a bypass
// holding the minimum gas temperature (a bisection per rating).
func BenchmarkEGEPrepare(b *testing.B) {
	vlsfo, err := fuel.Grade("VLSFO")
	if err != nil {
		b.Fatal(err)
	}
	cases := []struct {
		name string
		set  func(e *ExhaustGasEconomiser)
	}{
		{"constant-cp", func(e *ExhaustGasEconomiser) {}},
		{"nasa", func(e *ExhaustGasEconomiser) { e.GasCp, e.ExhaustFuel, e.ExhaustO2 = 0, &vlsfo, 0.13 }},
		{"nasa-fouling", func(e *ExhaustGasEconomiser) {
			e.GasCp, e.ExhaustFuel, e.ExhaustO2 = 0, &vlsfo, 0.13
			e.FoulingRate, e.CleanU, e.CleanInterval = 0.001, 40, 2000*3600
		}},
		{"nasa-fouling-bypass", func(e *ExhaustGasEconomiser) {
			e.GasCp, e.ExhaustFuel, e.ExhaustO2 = 0, &vlsfo, 0.13
			e.FoulingRate, e.CleanU, e.CleanInterval = 0.001, 40, 2000*3600
			e.MinGasOutT, e.Bypass = 273.15+200, true
		}},
	}
	for _, tc := range cases {
		b.Run(tc.name, func(b *testing.B) {
			p, e := egeOnly(b, 0.65)
			tc.set(e)
			cond := Conditions{SeaT: 288.15, AirT: 283.15, EngineLoad: 0.8}
			for b.Loop() {
				if err := e.prepare(p, cond); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(e.op.gas.q/1e3, "duty-kW")
		})
	}
}
