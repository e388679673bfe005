package fuel

import (
	"errors"
	"math"
	"strings"
	"testing"
)

func near(t *testing.T, what string, got, want, tol float64) {
	t.Helper()
	if !(math.Abs(got-want) <= tol) {
		t.Errorf("%s = %.6g, want %.6g ± %g (diff %.3g)", what, got, want, tol, got-want)
	}
}

// testFuel is the docs/reference/plant-checks.md §1.2 test fuel [M]: C 86.0, H 11.0, S 2.5,
// N 0.3, O 0.2, water 0, ash 0.
var testFuel = Analysis{C: 0.860, H: 0.110, S: 0.025, N: 0.003, O: 0.002}

func TestISO8217Energy(t *testing.T) {
	t.Parallel()
	// docs/reference/plant-checks.md §1.1 table, values [C] from the ISO 8217 annex formula
	// [S✓]; tolerance ±0.001 MJ/kg from docs/reference/plant-checks.md §11 item 1.
	cases := []struct {
		rho, w, a, s float64 // kg/m³, % m/m
		net, gross   float64 // MJ/kg
		source       string
	}{
		{987, 0.02, 0, 2.5, 40.451, 42.752, "docs/reference/plant-checks.md §1.1 row 1 [C]"},
		{991, 0.50, 0.05, 2.5, 40.165, 42.453, "docs/reference/plant-checks.md §1.1 row 2, §11 item 1 [C]"},
		{985, 0, 0, 2.5, 40.487, 42.794, "docs/reference/plant-checks.md §1.1 row 3 [C]"},
		{950, 0.10, 0.03, 0.5, 41.550, 44.015, "docs/reference/plant-checks.md §1.1 row 4 [C]"},
	}
	for _, c := range cases {
		n, g, err := ISO8217Energy(c.rho, c.w/100, c.a/100, c.s/100)
		if err != nil {
			t.Fatalf("%s: %v", c.source, err)
		}
		near(t, c.source+" Q_net MJ/kg", n/1e6, c.net, 0.0005)
		near(t, c.source+" Q_gross MJ/kg", g/1e6, c.gross, 0.0005)
	}
	// docs/reference/plant-checks.md §1.1 consistency check [C]: gross − net at ρ 985 is
	// 2.307 MJ/kg.
	n, g, _ := ISO8217Energy(985, 0, 0, 0.025)
	near(t, "ISO gross−net at ρ 985 (docs/reference/plant-checks.md §1.1 [C])", (g-n)/1e6, 2.307, 0.0005)
}

// A fuel consistent with the ISO 8217 formula at ρ 985 kg/m³: docs/reference/plant-checks.md
// §1.1 says gross − net there equals 9·H·h_fg(25 °C) with H = 10.5 % [C]; the
// analysis takes C 86.5, H 10.5, S 2.5, N 0.3, O 0.2 (carbon by difference).
// The two routes must agree within 1.5 %, the Channiwala-Parikh paper's
// average absolute error of 1.45 % (from memory).
func TestEnergyRoutesAgree(t *testing.T) {
	t.Parallel()
	a := Analysis{C: 0.865, H: 0.105, S: 0.025, N: 0.003, O: 0.002}
	fa := Fuel{Name: "consistent (analysis)", Analysis: a}
	fi := Fuel{Name: "consistent (ISO)", ISO: ISO8217{Density15: 985, Sulfur: 0.025}}
	ea, err := fa.Energy()
	if err != nil {
		t.Fatal(err)
	}
	ei, err := fi.Energy()
	if err != nil {
		t.Fatal(err)
	}
	if ea.NetSource.Route != RouteAnalysis || ei.NetSource.Route != RouteISO8217 {
		t.Fatalf("routes: analysis fuel %v, ISO fuel %v", ea.NetSource, ei.NetSource)
	}
	near(t, "gross, analysis/ISO − 1", ea.Gross/ei.Gross-1, 0, 0.015)
	near(t, "net, analysis/ISO − 1", ea.Net/ei.Net-1, 0, 0.015)
	// The latent-heat link: gross − net = h_fg(25 °C)·8.937·H; the ISO
	// formula's difference for ρ 985 is 2.307 MJ/kg (docs/reference/plant-checks.md §1.1 [C]), which the
	// sheet reads as 9·H·h_fg; with 8.937 the two differ by 0.7 %.
	near(t, "analysis gross−net MJ/kg vs ISO 2.307 (docs/reference/plant-checks.md §1.1 [C])", (ea.Gross-ea.Net)/1e6, 2.307, 0.02)
	// Both ISO data and analysis given, no set LHV: ISO takes precedence.
	fb := Fuel{Name: "both", ISO: ISO8217{Density15: 985, Sulfur: 0.025}, Analysis: a}
	eb, err := fb.Energy()
	if err != nil {
		t.Fatal(err)
	}
	if eb.NetSource.Route != RouteISO8217 || eb.Net != ei.Net {
		t.Errorf("ISO should take precedence over analysis: got %v %g", eb.NetSource, eb.Net)
	}
}

// Methane: LHV 50.01 MJ/kg and HHV 55.50 MJ/kg from standard enthalpies of
// formation (docs/reference/plant-checks.md §1.3 [C]). The analysis route (Channiwala-
// Parikh) must be within its 1.45 % average error (from memory), taken as
// 1.5 %.
func TestMethaneAnalysisRoute(t *testing.T) {
	t.Parallel()
	f, err := Grade("lng")
	if err != nil {
		t.Fatal(err)
	}
	n, g, err := AnalysisEnergy(f.Analysis)
	if err != nil {
		t.Fatal(err)
	}
	near(t, "methane HHV, Channiwala-Parikh / 55.50 − 1 (docs/reference/plant-checks.md §1.3 [C])", g/55.50e6-1, 0, 0.015)
	near(t, "methane LHV, Channiwala-Parikh / 50.01 − 1 (docs/reference/plant-checks.md §1.3 [C])", n/50.01e6-1, 0, 0.015)
	// LNG taken as CH4: C 74.87, H 25.13 % (docs/reference/plant-checks.md §1.2 [C]).
	near(t, "CH4 carbon % (docs/reference/plant-checks.md §1.2 [C])", 100*f.Analysis.C, 74.87, 0.005)
	near(t, "CH4 hydrogen % (docs/reference/plant-checks.md §1.2 [C])", 100*f.Analysis.H, 25.13, 0.005)
}

func TestSetLHVPrecedence(t *testing.T) {
	t.Parallel()
	f, err := Grade("HSFO")
	if err != nil {
		t.Fatal(err)
	}
	// A stated LHV (here a laboratory's, invented) takes precedence over
	// the ISO 8217 formula.
	f.SetLHV, f.SetLHVSource = 40.2e6, "laboratory report (invented)"
	e, err := f.Energy()
	if err != nil {
		t.Fatal(err)
	}
	near(t, "HSFO net J/kg (the stated value)", e.Net, 40.2e6, 0)
	if e.NetSource.Route != RouteSet || !strings.Contains(e.NetSource.String(), "laboratory") {
		t.Errorf("net source %q, want the stated value", e.NetSource)
	}
	// Gross = set LHV + h_fg(25 °C)·8.937·H, with the grade's derived H:
	// arithmetic of docs/reference/plant-checks.md §0 and §2 [C].
	near(t, "HSFO gross − net MJ/kg", (e.Gross-e.Net)/1e6, 2.4417*8.9367*f.Analysis.H, 0.0005)
	if e.GrossSource.Route != RouteSetPlusLatent {
		t.Errorf("gross source %v", e.GrossSource)
	}
	// Without the stated value the ISO 8217 formula applies: ρ 985, S 2.5 →
	// 40.487 MJ/kg (docs/reference/plant-checks.md §1.1 row 3 [C]).
	f.SetLHV = 0
	e, err = f.Energy()
	if err != nil {
		t.Fatal(err)
	}
	near(t, "HSFO net without set LHV, MJ/kg (docs/reference/plant-checks.md §1.1 row 3 [C])", e.Net/1e6, 40.487, 0.0005)
	// Set LHV with ISO data only: gross = set + ISO gross−net difference.
	g := Fuel{Name: "iso-set", ISO: ISO8217{Density15: 985, Sulfur: 0.025}, SetLHV: 40.2e6}
	e, err = g.Energy()
	if err != nil {
		t.Fatal(err)
	}
	near(t, "set + ISO difference, MJ/kg (docs/reference/plant-checks.md §1.1 [C] 2.307)", (e.Gross-e.Net)/1e6, 2.307, 0.0005)
	if e.GrossSource.Route != RouteSetPlusISODifference {
		t.Errorf("gross source %v", e.GrossSource)
	}
}

func TestGrades(t *testing.T) {
	t.Parallel()
	for _, name := range []string{"MGO", "vlsfo", "Hsfo", "LNG"} {
		f, err := Grade(name)
		if err != nil {
			t.Fatalf("Grade(%q): %v", name, err)
		}
		if err := f.Validate(); err != nil {
			t.Errorf("built-in %s invalid: %v", name, err)
		}
		if _, err := f.Energy(); err != nil {
			t.Errorf("%s energy: %v", name, err)
		}
		// IMO C_F = C·44/12 to ±0.001 (docs/reference/plant-checks.md §1.3 [C], identity
		// of the MEPC.364(79) table [S]). The table uses the round ratio
		// 44/12; with 44.0095/12.0107 the products would be 0.002 lower.
		near(t, name+" C_F vs IMO carbon·44/12", f.IMO.CF, f.IMO.Carbon*44/12, 0.001)
		if f.Class != Gas && f.SetLHV != 0 {
			t.Errorf("%s: a liquid grade must take its LHV from its ISO 8217 properties, not a set %g", name, f.SetLHV)
		}
	}
	_, err := Grade("bunker C")
	if !errors.Is(err, ErrUnknownGrade) || !strings.Contains(err.Error(), "MGO, VLSFO, HSFO, LNG") {
		t.Errorf("unknown grade error %v", err)
	}
}

// The energy balance's figure and the IMO figure are two fields, each with
// its source.
func TestIMOLCVIsSeparate(t *testing.T) {
	t.Parallel()
	cases := []struct {
		grade       string
		net, imoLCV float64 // MJ/kg
		netRoute    Route
		source      string
	}{
		// VLSFO: ρ 950, w 0.10, a 0.03, s 0.5 → 41.550 (docs/reference/plant-checks.md
		// §1.1 row 4 [C]); IMO HFO LCV 40 200 kJ/kg (docs/reference/plant-checks.md §1.3 [S]).
		{"VLSFO", 41.550, 40.2, RouteISO8217, "docs/reference/plant-checks.md §1.1 row 4 [C], §1.3 [S]"},
		// HSFO: ρ 985, s 2.5 → 40.487 (docs/reference/plant-checks.md §1.1 row 3 [C]); IMO HFO.
		{"HSFO", 40.487, 40.2, RouteISO8217, "docs/reference/plant-checks.md §1.1 row 3 [C], §1.3 [S]"},
		// MGO: the distillate formula, 42.613 by hand (TestISO8217Grades);
		// IMO Diesel/Gas oil 42 700 kJ/kg (docs/reference/plant-checks.md §1.3 [S]).
		{"MGO", 42.613, 42.7, RouteISO8217Distillate, "by hand from the distillate formula (from memory), docs/reference/plant-checks.md §1.3 [S]"},
		// LNG as methane: 50.01 (docs/reference/plant-checks.md §1.3 [C]); IMO LNG 48 000 kJ/kg (docs/reference/plant-checks.md §1.3 [S]).
		{"LNG", 50.01, 48.0, RouteSet, "docs/reference/plant-checks.md §1.3 [C] and [S]"},
	}
	for _, c := range cases {
		f, _ := Grade(c.grade)
		e, err := f.Energy()
		if err != nil {
			t.Fatal(err)
		}
		near(t, c.grade+" Net MJ/kg ("+c.source+")", e.Net/1e6, c.net, 0.0005)
		near(t, c.grade+" IMOLCV MJ/kg ("+c.source+")", e.IMOLCV/1e6, c.imoLCV, 0)
		if e.NetSource.Route != c.netRoute {
			t.Errorf("%s: net from %v, want %v", c.grade, e.NetSource.Route, c.netRoute)
		}
		if !strings.Contains(e.IMOSource, "MEPC.364(79)") {
			t.Errorf("%s: IMO source %q", c.grade, e.IMOSource)
		}
	}
	// LNG's gross value: its set LHV plus the latent heat of methane's
	// product water, against HHV 55.50 MJ/kg from the enthalpies of
	// formation (docs/reference/plant-checks.md §1.3 [C]); the latent heat at 25 °C of
	// docs/reference/plant-checks.md §0 and IUPAC weights put it 0.006 lower.
	l, _ := Grade("LNG")
	el, _ := l.Energy()
	near(t, "LNG gross MJ/kg (docs/reference/plant-checks.md §1.3 [C])", el.Gross/1e6, 55.50, 0.01)
	// A fuel without an IMO fuel type has no IMO LCV.
	e, err := Fuel{Name: "own", Analysis: testFuel}.Energy()
	if err != nil || e.IMOLCV != 0 || e.IMOSource != "" {
		t.Errorf("own fuel: IMO LCV %g %q, err %v; want none", e.IMOLCV, e.IMOSource, err)
	}
}

func TestCO2(t *testing.T) {
	t.Parallel()
	f, _ := Grade("HSFO")
	c, err := f.CO2()
	if err != nil {
		t.Fatal(err)
	}
	// MEPC.364(79) HFO C_F 3.114 (docs/reference/plant-checks.md §1.3 [S]).
	near(t, "HSFO IMO CO2 kg/kg (docs/reference/plant-checks.md §1.3 [S])", c.IMO, 3.114, 0)
	if !strings.Contains(c.IMOSource, "MEPC.364(79)") || !strings.Contains(c.AnalysisSource, "analysis") {
		t.Errorf("sources %q, %q", c.IMOSource, c.AnalysisSource)
	}
	near(t, "HSFO IMOOrAnalysis", c.IMOOrAnalysis(), 3.114, 0)
	// From the analysis: methane 2.743 kg CO2/kg (docs/reference/plant-checks.md §1.3 [C]).
	m, _ := Grade("LNG")
	m.IMO = IMOFuelType{}
	c, err = m.CO2()
	if err != nil {
		t.Fatal(err)
	}
	near(t, "CH4 CO2 from analysis (docs/reference/plant-checks.md §1.3 [C])", c.Analysis, 2.743, 0.0005)
	near(t, "CH4 IMOOrAnalysis without IMO type", c.IMOOrAnalysis(), c.Analysis, 0)
	if c.IMO != 0 || c.IMOSource != "" {
		t.Errorf("no IMO type, yet IMO %g %q", c.IMO, c.IMOSource)
	}
	if _, err := (Fuel{Name: "bare", ISO: ISO8217{Density15: 985}}).CO2(); err == nil {
		t.Errorf("a fuel with neither analysis nor IMO type gave a CO2 factor")
	}
}

func TestValidateErrors(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name  string
		f     Fuel
		field string // must appear in the error
	}{
		{"nothing", Fuel{Name: "x"}, "give ISO 8217 properties"},
		{"negative C", Fuel{Name: "neg", Analysis: Analysis{C: -0.1, H: 0.6, S: 0.5}}, "Analysis.C"},
		{"sum far from 1", Fuel{Name: "sum", Analysis: Analysis{C: 0.80, H: 0.10}}, "Analysis sum"},
		{"density low", Fuel{Name: "light", ISO: ISO8217{Density15: 500}}, "ISO.Density15"},
		{"density NaN", Fuel{Name: "nan", ISO: ISO8217{Density15: math.NaN()}}, "ISO.Density15"},
		{"sulfur high", Fuel{Name: "sour", ISO: ISO8217{Density15: 990, Sulfur: 0.2}}, "ISO.Sulfur"},
		{"ISO vs analysis", Fuel{Name: "mismatch", ISO: ISO8217{Density15: 985, Sulfur: 0.035}, Analysis: testFuel}, "Analysis vs ISO Sulfur"},
		{"gas with ISO", Fuel{Name: "gas", Class: Gas, ISO: ISO8217{Density15: 985}}, "Class Gas"},
		{"bad class", Fuel{Name: "cls", Class: 7, Analysis: testFuel}, "Class"},
		{"viscosity2 alone", Fuel{Name: "v2", Analysis: testFuel, Viscosity2: ViscosityPoint{T: 373.15, Nu: 35e-6}}, "second viscosity point"},
		{"IMO CF", Fuel{Name: "imo", Analysis: testFuel, IMO: IMOFuelType{Name: "x", LCV: 40e6, CF: 31.14, Carbon: 0.85}}, "IMO.CF"},
	}
	for _, c := range cases {
		err := c.f.Validate()
		if err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		if !strings.Contains(err.Error(), c.field) || !strings.Contains(err.Error(), `"`+c.f.Name+`"`) {
			t.Errorf("%s: error %q should name fuel %q and %q", c.name, err, c.f.Name, c.field)
		}
		var fe *FieldError
		if !errors.As(err, &fe) {
			t.Errorf("%s: error is not a *FieldError", c.name)
		}
	}
	// Within the stated sum tolerance (0.005): accepted.
	ok := Fuel{Name: "ok", Analysis: Analysis{C: 0.858, H: 0.110, S: 0.025, N: 0.003, O: 0.002}} // sum 0.998
	if err := ok.Validate(); err != nil {
		t.Errorf("sum 0.998 within tolerance: %v", err)
	}
	bad := ok
	bad.Analysis.C = 0.85 // sum 0.990
	if bad.Validate() == nil {
		t.Errorf("sum 0.990 outside tolerance accepted")
	}
}

func TestValidateNoAlloc(t *testing.T) {
	f, _ := Grade("HSFO")
	if n := testing.AllocsPerRun(100, func() { _ = f.Validate() }); n != 0 {
		t.Errorf("Validate of a valid fuel allocates %v times", n)
	}
	if n := testing.AllocsPerRun(100, func() { _, _ = f.Energy() }); n != 0 {
		t.Errorf("Energy allocates %v times", n)
	}
}
