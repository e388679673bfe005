package main

import (
	"encoding/json"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"steamcase/plant/combustion"
	"steamcase/plant/fuel"
)

// testFuelArgs is the test fuel of docs/reference/plant-checks.md §1.2 (C 86.0, H 11.0,
// S 2.5, N 0.3, O 0.2, no water or ash) with the LHV of docs/reference/plant-checks.md §3.3 (40 487 kJ/kg,
// ISO 8217 at ρ 985, S 2.5, docs/reference/plant-checks.md §1.1 row 3 [C]), measured at 3 % dry O2 with
// 250 °C flue gas and 35 °C air: the worked case of docs/reference/plant-checks.md §3.3.
var testFuelArgs = []string{"fluegas",
	"--fuel-analysis", "C=86,H=11,S=2.5,N=0.3,O=0.2", "--lhv", "40.487 MJ/kg",
	"--o2", "3 %", "--gas", "250 C", "--air", "35 C"}

func fgWith(base []string, more ...string) []string {
	return append(append([]string{}, base...), more...)
}

// TestFluegasGolden compares the output of sim fluegas with
// testdata/fluegas_*.golden. The numbers come from plant/combustion and
// are checked against docs/reference/plant-checks.md in TestFluegasReference below; these
// files pin the layout. Rewrite them with: go test ./cmd/sim -update
func TestFluegasGolden(t *testing.T) {
	cases := []struct {
		name string
		args []string
	}{
		{"help_fluegas", []string{"help", "fluegas"}},
		{"fluegas_test_fuel", testFuelArgs},
		{"fluegas_test_fuel_json", fgWith(testFuelArgs, "--json")},
		{"fluegas_vlsfo", []string{"fluegas", "--fuel", "VLSFO", "--o2", "3 %", "--gas", "250 C", "--air", "35 C"}},
		{"fluegas_hsfo_low_gas", []string{"fluegas", "--fuel", "HSFO", "--o2", "3.5 %", "--gas", "160 C", "--air", "30 C",
			"--co", "50 ppm", "--radiation", "1 %", "--load", "50 %", "--humidity", "60 %", "--solids", "0.1 %"}},
		{"fluegas_lng_co2_json", []string{"fluegas", "--fuel", "LNG", "--co2", "10 %", "--gas", "180 C", "--air", "20 C",
			"--humidity", "0.01 kg/kg", "--radiation", "0.8 %", "--json"}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			code, out, errOut := runSim(t, c.args...)
			if code != exitOK || errOut != "" {
				t.Fatalf("sim %q: exit %d, stderr %q", c.args, code, errOut)
			}
			path := filepath.Join("testdata", c.name+".golden")
			if *update {
				if err := os.WriteFile(path, []byte(out), 0o644); err != nil {
					t.Fatal(err)
				}
				return
			}
			want, err := os.ReadFile(path)
			if err != nil {
				t.Fatalf("%v (run with -update to create it)", err)
			}
			if strings.HasSuffix(c.name, "_json") {
				if err := sameJSON(out, string(want)); err != nil {
					t.Errorf("sim %q differs from %s: %v\n--- got\n%s\n--- want\n%s", c.args, path, err, out, want)
				}
			} else if out != string(want) {
				t.Errorf("sim %q differs from %s:\n--- got\n%s\n--- want\n%s", c.args, path, out, want)
			}
		})
	}
}

// fluegasOf runs sim fluegas with --json and decodes the object.
func fluegasOf(t *testing.T, args ...string) combustion.FlueGasJSON {
	t.Helper()
	if len(args) == 0 || args[0] != "fluegas" {
		args = append([]string{"fluegas"}, args...)
	}
	code, out, errOut := runSim(t, fgWith(args, "--json")...)
	if code != exitOK {
		t.Fatalf("sim %q: exit %d: %s", args, code, errOut)
	}
	var r struct {
		Version string `json:"version"`
		combustion.FlueGasJSON
	}
	dec := json.NewDecoder(strings.NewReader(out))
	dec.DisallowUnknownFields()
	if err := dec.Decode(&r); err != nil {
		t.Fatalf("sim %q --json: %v\n%s", args, err, out)
	}
	if r.Version == "" {
		t.Errorf("sim %q --json: the document does not carry the program's version", args)
	}
	return r.FlueGasJSON
}

// jsonRounding is the relative rounding of every figure of a JSON
// document (six significant digits, plant/schema's Round): identities of
// figures read from the JSON hold within it.
const jsonRounding = 5e-6

func fgNear(t *testing.T, name string, got, want, tol float64) {
	t.Helper()
	if !(math.Abs(got-want) <= tol) {
		t.Errorf("%s = %.6f, want %.6f ± %g", name, got, want, tol)
	}
}

// TestFluegasReference checks the command's figures for the test fuel
// against docs/reference/plant-checks.md, each with its section and tag.
func TestFluegasReference(t *testing.T) {
	r := fluegasOf(t, testFuelArgs...)
	// λ from 3 % dry O2, exact form: 1.1576 (docs/reference/plant-checks.md §2.1 [C]; §11 item 4, ±0.0005).
	fgNear(t, "λ (docs/reference/plant-checks.md §2.1 [C], §11 item 4)", r.Lambda, 1.1576, 0.0005)
	fgNear(t, "excess air % (= 100·(λ − 1), docs/reference/plant-checks.md §2.1 [C])", r.ExcessAir, 15.76, 0.05)
	// Stoichiometric air 13.770 kg/kg (docs/reference/plant-checks.md §2.1 [C]; §11 item 2, ±0.005).
	fgNear(t, "stoichiometric air kg/kg (docs/reference/plant-checks.md §2.1 [C], §11 item 2)", r.StoichAir, 13.770, 0.005)
	// Stoichiometric wet gas (λ = 1) 14.770 kg/kg (docs/reference/plant-checks.md §2.1 [C]), dry air.
	fgNear(t, "stoichiometric flue gas kg/kg (docs/reference/plant-checks.md §2.1 [C])", r.StoichFlue, 14.770, 0.005)
	// CO2 of the test fuel at 3 % O2: 13.68 % dry (docs/reference/plant-checks.md §3.2 [C]).
	fgNear(t, "CO2 dry % at 3 % O2 (docs/reference/plant-checks.md §3.2 [C])", r.CO2Dry, 13.68, 0.005)
	fgNear(t, "O2 dry % (the input, 3 %)", r.O2Dry, 3, 1e-9)
	// Dry gas + moisture ≈ 9.60 % LHV (docs/reference/plant-checks.md §3.3 [C]); docs/reference/plant-checks.md §3.3 used mean cp
	// values from memory [M], so ±0.05 points; dry gas 8.60, moisture 1.00.
	fgNear(t, "dry gas + moisture % LHV (docs/reference/plant-checks.md §3.3 [C])", r.Losses.DryGas+r.Losses.Moisture, 9.60, 0.05)
	fgNear(t, "dry-gas loss % LHV (docs/reference/plant-checks.md §3.3 [C])", r.Losses.DryGas, 8.60, 0.05)
	fgNear(t, "moisture loss % LHV (docs/reference/plant-checks.md §3.3 [C])", r.Losses.Moisture, 1.00, 0.05)
	fgNear(t, "dry_gas_plus_moisture_lhv_pct (sum of the two keys)", r.FlueLossDetailed, r.Losses.DryGas+r.Losses.Moisture, jsonRounding*10)
	// Siegert, O2 form, fuel oil: 9.627 % (docs/reference/plant-checks.md §3.2 [S]; §11 item 5, ±0.001).
	if r.Siegert == nil {
		t.Fatal("no Siegert cross-check")
	}
	fgNear(t, "Siegert % (docs/reference/plant-checks.md §3.2 [S], §11 item 5)", *r.Siegert, 9.627, 0.0005)
	// LHV as given; HHV = LHV + h_fg(25 °C)·(M(H2O)/M(H2))·H, with
	// h_fg 2441.7 kJ/kg (docs/reference/plant-checks.md §0 [C]) and 8.937 kg water per kg H (docs/reference/plant-checks.md §2 [CP],
	// which rounds it to 8.936).
	fgNear(t, "LHV J/kg (the --lhv given)", r.LHV, 40.487e6, 1e-6)
	fgNear(t, "HHV − LHV J/kg (docs/reference/plant-checks.md §0 [C] h_fg, §2 [CP])", r.HHV-r.LHV, 2441.7e3*fuel.WaterPerHydrogen*0.11, jsonRounding*2*r.HHV)
	// On the HHV basis the latent heat of the product water adds ≈ 5.6
	// points (docs/reference/plant-checks.md §3.3 [C]).
	latent := r.LossesHHV.Moisture - r.Losses.Moisture*r.LHV/r.HHV
	fgNear(t, "latent loss points % HHV (docs/reference/plant-checks.md §3.3 [C])", latent, 5.6, 0.05)
	// No radiation, CO or solids given: η_LHV = 100 − dry gas − moisture
	// (definition of the heat-loss method, docs/reference/plant-checks.md §3.1 [S]).
	fgNear(t, "η LHV = 100 − losses (docs/reference/plant-checks.md §3.1 [S])", r.EfficiencyLHV, 100-r.Losses.DryGas-r.Losses.Moisture, jsonRounding*100)
	// The useful heat is the same on both bases when the HHV is the LHV
	// plus the latent heat of the product water: η_LHV·LHV = η_HHV·HHV
	// (algebraic identity of the method; rounding only).
	fgNear(t, "η·Q LHV vs HHV (relative)", r.EfficiencyLHV*r.LHV/(r.EfficiencyHHV*r.HHV)-1, 0, 4*jsonRounding)
	// Acid dew point near docs/reference/plant-checks.md §4's test-fuel row, 151.3 °C [C]; that row is at
	// λ 1.15, this case at λ 1.1576 (slightly drier, leaner gas): ±0.5 K.
	if r.AcidDewPoint == nil {
		t.Fatal("no acid dew point for a fuel with 2.5 % S")
	}
	fgNear(t, "acid dew point °C at 3 % O2 (docs/reference/plant-checks.md §4 [C], λ 1.15 row)", *r.AcidDewPoint-273.15, 151.3, 0.5)
	if r.Caution == "" || len(r.Warnings) != 1 || !strings.Contains(r.Warnings[0], "no radiation") {
		t.Errorf("caution %q, warnings %q; want the caution and the one no-radiation warning", r.Caution, r.Warnings)
	}

	// docs/reference/plant-checks.md §3.3 [C]: with radiation 0.7 % and unburnt 0.1 %, η ≈ 89.6 % (LHV).
	r = fluegasOf(t, fgWith(testFuelArgs, "--radiation", "0.7 %", "--solids", "0.1 %")...)
	fgNear(t, "η LHV % with radiation 0.7, unburnt 0.1 (docs/reference/plant-checks.md §3.3 [C])", r.EfficiencyLHV, 89.6, 0.05)
	fgNear(t, "unburnt % LHV (the --solids given)", r.Losses.Unburnt, 0.1, 1e-12)
	if len(r.Warnings) != 0 {
		t.Errorf("warnings %q, want none", r.Warnings)
	}
}

// TestFluegasJSONKeys checks that the JSON object carries the keys the
// command promises (its help and the task that asked for it).
func TestFluegasJSONKeys(t *testing.T) {
	_, out, _ := runSim(t, fgWith(testFuelArgs, "--json")...)
	var m map[string]any
	if err := json.Unmarshal([]byte(out), &m); err != nil {
		t.Fatal(err)
	}
	for _, k := range []string{"lambda", "stoich_air_kg_per_kg", "flue_gas_kg_per_kg", "co2_dry_pct", "o2_dry_pct",
		"h2o_wet_pct", "losses", "losses_hhv", "efficiency_lhv_pct", "efficiency_hhv_pct", "acid_dew_point_K",
		"lhv_J_per_kg", "hhv_J_per_kg", "caution"} {
		if _, ok := m[k]; !ok {
			t.Errorf("JSON lacks %q", k)
		}
	}
	for _, basis := range []string{"losses", "losses_hhv"} {
		l, _ := m[basis].(map[string]any)
		for _, k := range []string{"dry_gas_pct", "moisture_pct", "radiation_pct", "unburnt_pct"} {
			if _, ok := l[k]; !ok {
				t.Errorf("JSON %s lacks %q", basis, k)
			}
		}
	}
}

// TestFluegasDewPoint checks the acid dew point against docs/reference/plant-checks.md §4
// and the margin warning.
func TestFluegasDewPoint(t *testing.T) {
	// docs/reference/plant-checks.md §4 test-fuel row [C]: H2O 9.5 %, SO2 1358 ppm wet, 3 % to SO3:
	// Verhoff-Banchero 151.3 °C, at λ 1.15, which is O2 2.88 % dry (docs/reference/plant-checks.md §2.1
	// [C]); ±0.1 K for the rounding of the O2 and the printed 151.3.
	r := fluegasOf(t, "--fuel-analysis", "C=86,H=11,S=2.5,N=0.3,O=0.2", "--lhv", "40.487 MJ/kg",
		"--o2", "2.88 %", "--gas", "250 C", "--air", "25 C")
	fgNear(t, "λ at 2.88 % O2 (docs/reference/plant-checks.md §2.1 [C])", r.Lambda, 1.15, 0.001)
	fgNear(t, "H2O wet % (docs/reference/plant-checks.md §2.1 [C], 9.50)", r.H2OWet, 9.50, 0.01)
	// The sheet's figures are at λ = 1.15; its O2 of 2.88 % (two decimals)
	// gives λ 1.1503 here, and the SO2 falls about 1.3 ppm per 0.001 of λ
	// (dilution by the extra air): ±2 ppm.
	fgNear(t, "SO2 wet ppm (docs/reference/plant-checks.md §2.1 [C], 1358)", r.SO2Wet, 1358, 2)
	fgNear(t, "SO2 dry ppm (docs/reference/plant-checks.md §2.1 [C], 1501)", r.SO2Dry, 1501, 2)
	if r.AcidDewPoint == nil {
		t.Fatal("no acid dew point")
	}
	fgNear(t, "Verhoff-Banchero °C (docs/reference/plant-checks.md §4 [C], test-fuel row)", *r.AcidDewPoint-273.15, 151.3, 0.1)

	// More SO3 raises the dew point (Verhoff-Banchero: −0.0858·ln pSO3
	// dominates, docs/reference/plant-checks.md §4 [S✓]).
	r5 := fluegasOf(t, "--fuel", "HSFO", "--o2", "3 %", "--gas", "250 C", "--air", "35 C", "--so3", "5 %")
	r1 := fluegasOf(t, "--fuel", "HSFO", "--o2", "3 %", "--gas", "250 C", "--air", "35 C", "--so3", "1 %")
	if !(*r5.AcidDewPoint > *r1.AcidDewPoint) {
		t.Errorf("dew point with 5 %% SO3 %g K not above that with 1 %% %g K", *r5.AcidDewPoint, *r1.AcidDewPoint)
	}

	// The margin warning: 20 K above the dew point, common practice, no
	// source. HSFO at 3 % O2 has its dew point near 151 °C.
	for _, c := range []struct {
		gas  string
		want string // a phrase of the warning, "" for none
	}{
		{"250 C", ""},
		{"180 C", ""},
		{"165 C", "less than 20 K above the acid dew point"},
		{"140 C", "K below the acid dew point"},
	} {
		r := fluegasOf(t, "--fuel", "HSFO", "--o2", "3 %", "--gas", c.gas, "--air", "35 C", "--radiation", "1 %")
		got := strings.Join(r.Warnings, "\n")
		if c.want == "" && strings.Contains(got, "dew point") || c.want != "" && !strings.Contains(got, c.want) {
			t.Errorf("gas %s, dew point %.1f °C: warnings %q, want %q", c.gas, *r.AcidDewPoint-273.15, r.Warnings, c.want)
		}
	}

	// A fuel without sulfur has no acid dew point: null, not an error.
	r = fluegasOf(t, "--fuel", "LNG", "--o2", "3 %", "--gas", "150 C", "--air", "35 C")
	if r.AcidDewPoint != nil {
		t.Errorf("LNG (no sulfur): acid dew point %g, want null", *r.AcidDewPoint)
	}
}

// TestFluegasOptions checks that each optional flag reaches the account.
func TestFluegasOptions(t *testing.T) {
	base := []string{"--fuel", "HSFO", "--o2", "3 %", "--gas", "250 C", "--air", "35 C"}
	r0 := fluegasOf(t, base...)

	// Radiation scales with 1/load (docs/reference/plant-checks.md §3.4 [M]: "1 % at full
	// load → 4 % at quarter load"); on the HHV basis by LHV/HHV.
	r := fluegasOf(t, fgWith(base, "--radiation", "1 %", "--load", "25 %")...)
	fgNear(t, "radiation % LHV at quarter load (docs/reference/plant-checks.md §3.4 [M])", r.Losses.Radiation, 4, 1e-12)
	fgNear(t, "radiation % HHV", r.LossesHHV.Radiation, 4*r.LHV/r.HHV, 3*jsonRounding*4)
	r = fluegasOf(t, fgWith(base, "--radiation", "1 %")...)
	fgNear(t, "radiation % LHV at MCR (the --radiation given)", r.Losses.Radiation, 1, 1e-12)
	fgNear(t, "η drops by the radiation loss", r0.EfficiencyLHV-r.EfficiencyLHV, 1, 2*jsonRounding*100)
	// "0 %" given on purpose: no loss and no warning.
	r = fluegasOf(t, fgWith(base, "--radiation", "0 %")...)
	if r.Losses.Radiation != 0 || len(r.Warnings) != 0 {
		t.Errorf("--radiation 0 %%: loss %g, warnings %q; want 0 and none", r.Losses.Radiation, r.Warnings)
	}

	// CO: ppm and percent agree; the loss is a·CO/(CO + CO2) with a = 48
	// for oil (docs/reference/plant-checks.md §3.1 [S✓ analyser manual]).
	a := fluegasOf(t, fgWith(base, "--co", "50 ppm")...)
	b := fluegasOf(t, fgWith(base, "--co", "0.005 %")...)
	fgNear(t, "CO loss ppm vs %", a.Losses.Unburnt, b.Losses.Unburnt, 1e-12)
	fgNear(t, "CO loss % LHV (docs/reference/plant-checks.md §3.1 [S✓])", a.Losses.Unburnt, 48*0.005/(0.005+a.CO2Dry), 2*jsonRounding*a.Losses.Unburnt)

	// The CO2 reading that 3 % O2 implies gives the same λ back: both
	// forms of docs/reference/plant-checks.md §2 [CP] are exact for complete combustion.
	// The test fuel (docs/reference/plant-checks.md §1.2), for the Siegert value below.
	rt := fluegasOf(t, testFuelArgs...)
	c := fluegasOf(t, "--fuel-analysis", "C=86,H=11,S=2.5,N=0.3,O=0.2", "--lhv", "40.487 MJ/kg",
		"--co2", jsonNum(rt.CO2Dry)+" %", "--gas", "250 C", "--air", "35 C")
	fgNear(t, "λ from CO2 vs from O2 (docs/reference/plant-checks.md §2 [CP])", c.Lambda, rt.Lambda, 2*jsonRounding*c.Lambda)
	// Siegert's CO2 form with the test fuel's CO2 at 3 % O2 (13.68 %):
	// 9.36 % (docs/reference/plant-checks.md §3.2 [C]).
	fgNear(t, "Siegert CO2 form % (docs/reference/plant-checks.md §3.2 [C])", *c.Siegert, 9.36, 0.005)

	// Humidity: a relative humidity and the humidity ratio it gives read
	// the same; humid air adds moisture loss.
	h := fluegasOf(t, fgWith(base, "--humidity", "60 %")...)
	if !(h.HumidityRatio > 0.01 && h.HumidityRatio < 0.03) {
		// 60 % at 35 °C: about 0.021 kg/kg (psychrometric chart, from memory).
		t.Errorf("humidity ratio at 60 %%, 35 °C = %g kg/kg, want about 0.021", h.HumidityRatio)
	}
	g := fluegasOf(t, fgWith(base, "--humidity", jsonNum(h.HumidityRatio)+" kg/kg")...)
	fgNear(t, "η with RH vs with its humidity ratio", g.EfficiencyLHV, h.EfficiencyLHV, 2*jsonRounding*100)
	g = fluegasOf(t, fgWith(base, "--humidity", jsonNum(1000*h.HumidityRatio)+" g/kg")...)
	fgNear(t, "η with kg/kg vs g/kg", g.EfficiencyLHV, h.EfficiencyLHV, 2*jsonRounding*100)
	if !(h.Losses.Moisture > r0.Losses.Moisture) {
		t.Errorf("humid air: moisture loss %g not above dry air's %g", h.Losses.Moisture, r0.Losses.Moisture)
	}

	// Without --lhv, an own fuel's LHV comes from the analysis.
	n, _, err := fuel.AnalysisEnergy(fuel.Analysis{C: 0.86, H: 0.11, S: 0.025, N: 0.003, O: 0.002})
	if err != nil {
		t.Fatal(err)
	}
	// An analysis on top of a liquid grade replaces the grade's analysis
	// and ISO 8217 data, so the LHV comes from the analysis too (the IMO
	// LCV is never the energy balance's figure).
	o := fluegasOf(t, "--fuel", "VLSFO", "--fuel-analysis", "C=86,H=11,S=2.5,N=0.3,O=0.2",
		"--o2", "3 %", "--gas", "250 C", "--air", "35 C")
	fgNear(t, "LHV of VLSFO with an analysis on top = package fuel's analysis route", o.LHV, n, jsonRounding*n)
	fgNear(t, "stoichiometric air of the analysis given (docs/reference/plant-checks.md §2.1 [C])", o.StoichAir, 13.770, 0.005)
	o = fluegasOf(t, "--fuel-analysis", "C=86,H=11,S=2.5,N=0.3,O=0.2", "--o2", "3 %", "--gas", "250 C", "--air", "35 C")
	fgNear(t, "LHV of an own fuel = package fuel's analysis route", o.LHV, n, jsonRounding*n)
	if !strings.Contains(o.LHVSource, "Channiwala-Parikh") {
		t.Errorf("LHV source %q does not name the correlation", o.LHVSource)
	}

	// O2 0 % is read as λ = 1 with a warning.
	z := fluegasOf(t, "--fuel", "HSFO", "--o2", "0 %", "--gas", "250 C", "--air", "35 C")
	fgNear(t, "λ at 0 % O2", z.Lambda, 1, 0)
	if !strings.Contains(strings.Join(z.Warnings, "\n"), "0 % is taken as stoichiometric") {
		t.Errorf("0 %% O2: warnings %q", z.Warnings)
	}
}

// TestFluegasExitCodes checks usage errors (exit 2) and failures (exit 1)
// and the first line on stderr.
func TestFluegasExitCodes(t *testing.T) {
	ok := []string{"--o2", "3 %", "--gas", "250 C", "--air", "35 C"}
	fg := func(args ...string) []string { return append([]string{"fluegas"}, args...) }
	cases := []struct {
		args []string
		code int
		msg  string // the first line of stderr, or its start when it ends in "…"
	}{
		// Usage errors.
		{fg(ok...), exitUsage,
			"sim fluegas: no fuel given: give --fuel with a grade (MGO, VLSFO, HSFO, LNG) or --fuel-analysis with the fuel's analysis"},
		{fg(fgWith([]string{"--fuel", "HFO"}, ok...)...), exitUsage,
			`sim fluegas: --fuel "HFO": unknown fuel grade; the known grades are MGO, VLSFO, HSFO, LNG (or give --fuel-analysis for your own fuel)`},
		{fg("--fuel", "HSFO", "--o2", "3 %", "--co2", "13 %", "--gas", "250 C", "--air", "35 C"), exitUsage,
			"sim fluegas: --o2 and --co2 given together: give the one the analyser measured"},
		{fg("--fuel", "HSFO", "--gas", "250 C", "--air", "35 C"), exitUsage,
			`sim fluegas: no flue-gas measurement given: give --o2 (or --co2) in percent of the dry flue gas, such as --o2 "3 %"`},
		{fg("--fuel", "HSFO", "--o2", "3 %", "--air", "35 C"), exitUsage,
			`sim fluegas: no flue-gas temperature given: give --gas, such as --gas "250 C"`},
		{fg("--fuel", "HSFO", "--o2", "3 %", "--gas", "250 C"), exitUsage,
			`sim fluegas: no air temperature given: give --air, such as --air "35 C"`},
		{fg(fgWith([]string{"--fuel", "HSFO", "--excess", "15 %"}, ok...)...), exitUsage,
			"sim fluegas: flag provided but not defined: -excess"},
		{fg("--fuel", "HSFO", "--o2", "3 %", "--gas", "250 K/s", "--air", "35 C"), exitUsage,
			"sim fluegas: --gas: unknown unit 'K/s' in '250 K/s'…"},
		{fg("--fuel", "HSFO", "--o2", "3 %", "--gas", "250", "--air", "35 C"), exitUsage,
			"sim fluegas: --gas: temperature needs a unit…"},
		{fg("--fuel", "HSFO", "--o2", "3", "--gas", "250 C", "--air", "35 C"), exitUsage,
			`sim fluegas: --o2 "3": want a percentage with its sign, such as "3 %"`},
		{fg("--fuel", "HSFO", "--o2", "3 C", "--gas", "250 C", "--air", "35 C"), exitUsage,
			`sim fluegas: --o2 "3 C": want a percentage with its sign, such as "3 %"`},
		{fg(fgWith([]string{"--fuel", "HSFO", "--co", "50"}, ok...)...), exitUsage,
			`sim fluegas: --co "50": want ppm or a percentage, such as "50 ppm" or "0.005 %"`},
		{fg(fgWith([]string{"--fuel", "HSFO", "--humidity", "0.6"}, ok...)...), exitUsage,
			`sim fluegas: --humidity "0.6": want a relative humidity such as "60 %" or a humidity ratio such as "0.012 kg/kg"`},
		{fg(fgWith([]string{"--fuel", "HSFO", "--lhv", "40.2 MJ"}, ok...)...), exitUsage,
			"sim fluegas: --lhv: specific energy expected…"},
		{fg(fgWith([]string{"--fuel", "HSFO", "--load", "50 %"}, ok...)...), exitUsage,
			`sim fluegas: --load scales the radiation and convection loss: give --radiation with it, such as --radiation "1 %"`},
		{fg(fgWith([]string{"--fuel-analysis", "C=86;H=11"}, ok...)...), exitUsage,
			`sim fluegas: --fuel-analysis "C=86;H=11": the value of C is "86;H=11"; want a finite number in percent by mass, such as C=86`},
		{fg(fgWith([]string{"--fuel-analysis", "C=86,H=11,Q=3"}, ok...)...), exitUsage,
			`sim fluegas: --fuel-analysis "C=86,H=11,Q=3": unknown key "Q"; the keys are C, H, S, N, O, W (free water) and A (ash)`},
		{fg(fgWith([]string{"--fuel-analysis", "C=86,C=11,S=3"}, ok...)...), exitUsage,
			`sim fluegas: --fuel-analysis "C=86,C=11,S=3": C given twice`},
		{fg(fgWith([]string{"--fuel-analysis", "C86,H=14"}, ok...)...), exitUsage,
			`sim fluegas: --fuel-analysis "C86,H=14": "C86" is not KEY=VALUE; write pairs such as "C=86,H=11,S=2.5,N=0.3,O=0.2"`},
		{fg(fgWith([]string{"--fuel", "HSFO"}, append(ok, "stray")...)...), exitUsage,
			`sim fluegas: unexpected argument "stray"…`},
		// Failures: well-formed values that give no result.
		{fg("--fuel", "HSFO", "--o2", "21 %", "--gas", "250 C", "--air", "35 C"), exitFail,
			`sim fluegas: --o2 "21 %": no combustion: an O2 at or near that of air (20.946 % dry, which analysers show as 20.9 %): the burner is not firing, or the probe is not in the flue gas`},
		{fg("--fuel", "HSFO", "--o2", "20.946 %", "--gas", "250 C", "--air", "35 C"), exitFail,
			`sim fluegas: --o2 "20.946 %": no combustion: an O2 at or near that of air (20.946 % dry, which analysers show as 20.9 %): the burner is not firing, or the probe is not in the flue gas`},
		{fg("--fuel", "HSFO", "--o2", "-1 %", "--gas", "250 C", "--air", "35 C"), exitFail,
			`sim fluegas: --o2 "-1 %": a measured O2 cannot be negative`},
		{fg("--fuel-analysis", "C=86,H=11,S=2.5,N=0.3,O=0.2", "--co2", "17 %", "--gas", "250 C", "--air", "35 C"), exitFail,
			`sim fluegas: --co2 "17 %": above the fuel's maximum CO2 of 15.97 % (dry, at λ = 1)…`},
		{fg("--fuel", "HSFO", "--o2", "3 %", "--gas", "30 C", "--air", "35 C"), exitFail,
			`sim fluegas: --gas "30 C": the flue gas (30 °C) is not hotter than the combustion air (35 °C); a firing boiler's flue gas leaves hotter than the air comes in`},
		{fg("--fuel", "HSFO", "--o2", "3 %", "--gas", "1200 C", "--air", "35 C"), exitFail,
			`sim fluegas: --gas "1200 C": the flue-gas temperature must be at most 1000 °C for the heat-loss account; got 1200 °C`},
		{fg("--fuel", "HSFO", "--o2", "3 %", "--gas", "250 C", "--air", "150 C"), exitFail,
			`sim fluegas: --air "150 C": the air temperature is the reference of the loss account, which must lie between -20 °C and 50 °C; got 150 °C…`},
		{fg("--fuel", "HSFO", "--o2", "3 %", "--gas", "250 C", "--air", "-300 C"), exitFail,
			"sim fluegas: --air: temperature '-300 C' is below absolute zero (0 K, -273.15 °C)"},
		{fg(fgWith([]string{"--fuel-analysis", "C=86,H=11"}, ok...)...), exitFail,
			`sim fluegas: --fuel-analysis "C=86,H=11": the values add up to 97 %; they must add up to 100 % within 0.5 % (as fired, with W and A)`},
		{fg(fgWith([]string{"--fuel-analysis", "C=186,H=-86"}, ok...)...), exitFail,
			`sim fluegas: --fuel-analysis "C=186,H=-86": C = 186 %; each value must lie between 0 % and 100 % by mass`},
		{fg(fgWith([]string{"--fuel", "HSFO", "--lhv", "2 MJ/kg"}, ok...)...), exitFail,
			`sim fluegas: --lhv "2 MJ/kg": a net specific energy must lie between 5 MJ/kg and 130 MJ/kg; got 2 MJ/kg`},
		{fg(fgWith([]string{"--fuel", "HSFO", "--radiation", "12 %"}, ok...)...), exitFail,
			`sim fluegas: --radiation "12 %": the radiation and convection loss at MCR must lie between 0 % and 10 %`},
		{fg(fgWith([]string{"--fuel", "HSFO", "--radiation", "1 %", "--load", "2 %"}, ok...)...), exitFail,
			`sim fluegas: --load "2 %": the load must lie between 5 % and 120 % of MCR`},
		{fg(fgWith([]string{"--fuel", "HSFO", "--so3", "0 %"}, ok...)...), exitFail,
			`sim fluegas: --so3 "0 %": the SO2 to SO3 conversion must be above 0 % and at most 20 % (1 % to 5 % is usual in oil firing)`},
		{fg(fgWith([]string{"--fuel", "HSFO", "--humidity", "120 %"}, ok...)...), exitFail,
			`sim fluegas: --humidity "120 %": a relative humidity must lie between 0 % and 100 %`},
		{fg(fgWith([]string{"--fuel", "HSFO", "--co", "-5 ppm"}, ok...)...), exitFail,
			`sim fluegas: --co "-5 ppm": the CO must lie between 0 and 100000 ppm (10 %)`},
	}
	for _, c := range cases {
		code, out, errOut := runSim(t, c.args...)
		first, _, _ := strings.Cut(errOut, "\n")
		match := first == c.msg
		if prefix, ok := strings.CutSuffix(c.msg, "…"); ok {
			match = strings.HasPrefix(first, prefix)
		}
		if code != c.code || !match || out != "" {
			t.Errorf("sim %q: exit %d, stdout %q, stderr:\n%s\nwant exit %d and first line:\n%s", c.args, code, out, errOut, c.code, c.msg)
		}
		if c.code == exitUsage && strings.HasPrefix(c.msg, "sim fluegas:") && !strings.Contains(errOut, "\nusage: sim fluegas --fuel GRADE") {
			t.Errorf("sim %q: a usage error must show the usage; got %q", c.args, errOut)
		}
		if c.code == exitFail && strings.Count(errOut, "\n") != 1 {
			t.Errorf("sim %q: a failure must print one line on stderr; got %q", c.args, errOut)
		}
	}
}

// TestFluegasHelp checks that the help names every flag, the examples and
// the caution, and that --help gives the same text.
func TestFluegasHelp(t *testing.T) {
	_, help, _ := runSim(t, "help", "fluegas")
	code, h2, _ := runSim(t, "fluegas", "--help")
	if code != exitOK || h2 != help {
		t.Errorf("sim fluegas --help: exit %d, same as 'sim help fluegas': %v", code, h2 == help)
	}
	for _, s := range []string{"--fuel GRADE", "--fuel-analysis ANALYSIS", "--lhv ENERGY", "--o2 PERCENT", "--co2 PERCENT",
		"--co AMOUNT", "--gas TEMPERATURE", "--air TEMPERATURE", "--humidity HUMIDITY", "--radiation PERCENT",
		"--load PERCENT", "--solids PERCENT", "--so3 PERCENT", "--json", "MGO, VLSFO, HSFO, LNG",
		`sim fluegas --fuel VLSFO --o2 "3 %" --gas "250 C" --air "35 C"`, "Verhoff", "Siegert",
		"LHV", "HHV", "Caution: boilers can kill"} {
		if !strings.Contains(help, s) {
			t.Errorf("'sim help fluegas' does not mention %q", s)
		}
	}
	// Every example in the help runs.
	_, examples, _ := strings.Cut(help, "\nExamples:\n")
	examples, _, _ = strings.Cut(examples, "\nFlags:\n")
	n := 0
	for _, l := range strings.Split(examples, "\n") {
		l = strings.TrimSpace(l)
		if !strings.HasPrefix(l, "sim fluegas --") {
			continue
		}
		n++
		args := fgSplitQuoted(t, strings.TrimPrefix(l, "sim "))
		if code, _, errOut := runSim(t, args...); code != exitOK {
			t.Errorf("help example %q: exit %d: %s", l, code, errOut)
		}
	}
	if n != 4 {
		t.Errorf("found %d examples in the help, want 4", n)
	}
	_, main, _ := runSim(t, "help")
	if !strings.Contains(main, "fluegas") {
		t.Error("'sim help' does not list fluegas")
	}
}

// splitQuoted splits a command line with double-quoted words.
func fgSplitQuoted(t *testing.T, s string) []string {
	var out []string
	for {
		s = strings.TrimLeft(s, " ")
		if s == "" {
			return out
		}
		if s[0] == '"' {
			end := strings.IndexByte(s[1:], '"')
			if end < 0 {
				t.Fatalf("unbalanced quote in %q", s)
			}
			out = append(out, s[1:1+end])
			s = s[2+end:]
			continue
		}
		end := strings.IndexByte(s, ' ')
		if end < 0 {
			end = len(s)
		}
		out = append(out, s[:end])
		s = s[end:]
	}
}

// BenchmarkFluegas runs the whole command for the test fuel, table output
// to io.Discard: parsing, two firings, the loss account, the dew point,
// Siegert and the report.
func BenchmarkFluegas(b *testing.B) {
	for _, c := range []struct {
		name string
		args []string
	}{{"table", testFuelArgs}, {"json", fgWith(testFuelArgs, "--json")}} {
		b.Run(c.name, func(b *testing.B) {
			for b.Loop() {
				if code := run(b.Context(), c.args, io.Discard, io.Discard); code != exitOK {
					b.Fatalf("exit %d", code)
				}
			}
		})
	}
}

// FuzzFluegas runs 'sim fluegas' with arbitrary flag values: it must not
// panic, must exit 0, 1 or 2, must write one line on stderr for a failure,
// and must never print NaN or Inf.
func FuzzFluegas(f *testing.F) {
	f.Add("HSFO", "", "3 %", "250 C", "35 C", "", "", uint8(0), false)
	f.Add("", "C=86,H=11,S=2.5,N=0.3,O=0.2", "3 %", "250 C", "35 C", "40.487 MJ/kg", "60 %", uint8(1), true)
	f.Add("LNG", "", "10 %", "180 C", "20 C", "", "0.01 kg/kg", uint8(2), false)
	f.Add("MGO", "C=86.6,H=13.2,S=0.1,O=0.1", "0 %", "1000 C", "-20 C", "1e-300 MJ/kg", "100 %", uint8(3), true)
	f.Add("VLSFO", "W=100", "20.9 %", "35.0001 C", "35 C", "130 MJ/kg", "200 g/kg", uint8(4), false)
	f.Fuzz(func(t *testing.T, grade, analysis, reading, gas, air, lhv, humidity string, which uint8, asJSON bool) {
		args := []string{"fluegas"}
		if grade != "" {
			args = append(args, "--fuel", grade)
		}
		if analysis != "" {
			args = append(args, "--fuel-analysis", analysis)
		}
		if which%2 == 0 {
			args = append(args, "--o2", reading)
		} else {
			args = append(args, "--co2", reading)
		}
		args = append(args, "--gas", gas, "--air", air)
		if lhv != "" {
			args = append(args, "--lhv", lhv)
		}
		if humidity != "" {
			args = append(args, "--humidity", humidity)
		}
		// The remaining flags take the reading's value, so that the fuzzer
		// reaches them too.
		switch which % 8 / 2 {
		case 1:
			args = append(args, "--co", reading)
		case 2:
			args = append(args, "--radiation", reading, "--load", humidity)
		case 3:
			args = append(args, "--so3", reading, "--solids", humidity)
		}
		if asJSON {
			args = append(args, "--json")
		}
		code, out, errOut := runSim(t, args...)
		switch code {
		case exitOK:
			if errOut != "" {
				t.Fatalf("sim %q: exit 0 with stderr %q", args, errOut)
			}
			if strings.Contains(out, "NaN") || strings.Contains(out, "Inf") {
				t.Fatalf("sim %q printed a non-finite number:\n%s", args, out)
			}
		case exitFail:
			if strings.Count(errOut, "\n") != 1 || out != "" {
				t.Fatalf("sim %q: failure must be one line on stderr and nothing on stdout; got %q, %q", args, errOut, out)
			}
		case exitUsage:
			if out != "" {
				t.Fatalf("sim %q: usage error wrote to stdout: %q", args, out)
			}
		default:
			t.Fatalf("sim %q: exit %d", args, code)
		}
	})
}

// TestFluegasMessages checks the flue-gas messages of issue 17: a flue gas
// below its dew point is said to be so many kelvin below it (not "-34.9 K
// above"); an O2 reading of air, or one so near it that the air ratio is
// beyond the account, is a failure that says so (not an air ratio with
// twelve digits); values in messages are in the unit the user gave them in,
// without float noise; a temperature at a bound of its range is accepted.
// It uses only the command's text, so that it runs against the command as
// it was before these fixes (where every row failed).
func TestFluegasMessages(t *testing.T) {
	t.Parallel()
	hsfo := func(more ...string) []string {
		return fgWith([]string{"fluegas", "--fuel", "HSFO", "--o2", "3 %", "--gas", "250 C", "--air", "35 C"}, more...)
	}
	cases := []struct {
		name string
		args []string
		code int
		// want are phrases of stdout (exit 0) or of stderr's first line;
		// not are phrases that must not appear.
		want, not []string
	}{
		// HSFO at 3 % O2 has its acid dew point at 151.1 °C (the
		// table's own line; checked against docs/reference/plant-checks.md §4 in
		// TestFluegasDewPoint): 116.3 °C is 34.8 K below it.
		{"below the dew point", fgWith([]string{"fluegas", "--fuel", "HSFO", "--o2", "3 %", "--gas", "116.3 C", "--air", "35 C"}), exitOK,
			[]string{"151.1 °C; the flue gas at 116.3 °C is 34.8 K below it.",
				"the flue gas at 116.3 °C is 34.8 K below the acid dew point of 151.1 °C"},
			[]string{"-34.9", "K above it"}},
		{"O2 of air", fgWith([]string{"fluegas", "--fuel", "HSFO", "--o2", "20.9 %", "--gas", "250 C", "--air", "35 C"}), exitFail,
			[]string{`sim fluegas: --o2 "20.9 %": no combustion: an O2 at or near that of air (20.946 % dry`},
			[]string{"λ"}},
		{"O2 nearly air", fgWith([]string{"fluegas", "--fuel", "HSFO", "--o2", "20.5 %", "--gas", "250 C", "--air", "35 C"}), exitFail,
			[]string{`sim fluegas: --o2 "20.5 %": nearly air: it means an air ratio λ of 44.37, more than the 20 the account takes`},
			[]string{"44.34000", "combustion:"}},
		{"CO2 nearly air", fgWith([]string{"fluegas", "--fuel", "MGO", "--co2", "0.5 %", "--gas", "250 C", "--air", "35 C"}), exitFail,
			[]string{`sim fluegas: --co2 "0.5 %": nearly air: it means an air ratio λ of 29.01,`},
			[]string{"combustion:"}},
		// λ 14.6 at 250 °C: the losses exceed the fuel's heat; this used
		// to print an efficiency of -8.51 %.
		{"losses above the input", fgWith([]string{"fluegas", "--fuel", "MGO", "--co2", "1 %", "--gas", "250 C", "--air", "35 C"}), exitFail,
			[]string{`sim fluegas: --co2 "1 %": the losses come to 108.9 % of the fuel's heat input (LHV)`}, nil},
		{"flue gas in °F", hsfo("--gas", "2000 F"), exitFail,
			[]string{`--gas "2000 F": the flue-gas temperature must be at most 1832 °F for the heat-loss account; got 2000 °F`}, nil},
		{"each temperature in its unit", hsfo("--gas", "80 F"), exitFail,
			[]string{`--gas "80 F": the flue gas (80 °F) is not hotter than the combustion air (35 °C)`}, nil},
		{"LHV in kcal/kg", hsfo("--lhv", "1000 kcal/kg"), exitFail,
			[]string{`--lhv "1000 kcal/kg": a net specific energy must lie between 1194.23 kcal/kg and 31050 kcal/kg; got 1000 kcal/kg`}, nil},
		{"air at the bound", hsfo("--air", "-20 C"), exitOK,
			[]string{"Reference temperature: the air temperature, -20.0 °C"}, nil},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			code, out, errOut := runSim(t, c.args...)
			text := out
			if c.code != exitOK {
				text, _, _ = strings.Cut(errOut, "\n")
			}
			if code != c.code {
				t.Fatalf("sim %q: exit %d, want %d; stderr %q", c.args, code, c.code, errOut)
			}
			for _, w := range c.want {
				if !strings.Contains(text, w) {
					t.Errorf("sim %q lacks %q:\n%s", c.args, w, text)
				}
			}
			for _, w := range c.not {
				if strings.Contains(text, w) {
					t.Errorf("sim %q has %q:\n%s", c.args, w, text)
				}
			}
		})
	}
}

// TestFluegasCaution keeps the caution of plant/combustion's JSON, which
// the command prints, the same as the table's.
func TestFluegasCaution(t *testing.T) {
	if combustion.Caution != cautionLine {
		t.Errorf("combustion.Caution %q differs from the command's %q", combustion.Caution, cautionLine)
	}
}
