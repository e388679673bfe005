package main

import (
	"bytes"
	"context"
	"encoding/json"
	"flag"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"steamcase/plant/schema"
	"steamcase/plant/water"
)

var update = flag.Bool("update", false, "rewrite the golden files in testdata/")

// runSim runs the command in-process.
func runSim(t *testing.T, args ...string) (code int, stdout, stderr string) {
	t.Helper()
	var out, errw bytes.Buffer
	code = run(context.Background(), args, &out, &errw)
	return code, out.String(), errw.String()
}

// TestGolden compares the output of a few commands with testdata/*.golden.
// The steam states come from plant/water, which is checked against the
// IAPWS-IF97 verification tables in its own tests; these files pin the
// layout and formatting. Rewrite them with: go test ./cmd/sim -update
func TestGolden(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name string
		args []string
	}{
		{"help", []string{"help"}},
		{"help_steam", []string{"help", "steam"}},
		{"steam_7barg_x1", []string{"steam", "--p", "7 bar(g)", "--x", "1"}},
		{"steam_7barg_x1_json", []string{"steam", "--p", "7 bar(g)", "--x", "1", "--json"}},
		{"steam_12MPa_250C", []string{"steam", "--p", "1.2 MPa", "--t", "250 C"}},
		{"steam_12MPa_250C_json", []string{"steam", "--p", "1.2 MPa", "--t", "250 C", "--json"}},
		{"steam_16barg_h2900_json", []string{"steam", "--p", "16 bar(g)", "--h", "2900 kJ/kg", "--json"}},
		{"steam_1bara_60C", []string{"steam", "--p", "1 bar(a)", "--t", "60 C"}},
		{"steam_170C_x0", []string{"steam", "--t", "170 C", "--x", "0"}},
		{"steam_7barg_s_ambient", []string{"steam", "--p", "7 bar(g)", "--s", "6.6 kJ/kgK", "--ambient", "1000 mbar(a)"}},
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

// sameJSON compares two JSON texts token by token: the same keys in the
// same order, the same strings and nulls, and numbers equal to a relative
// 1e-12. The numbers are plant/water's full float64 results; the tolerance
// lets the last bits move when that package is reworked, while
// TestSteamJSONMatchesWater checks they are passed through exactly.
func sameJSON(got, want string) error {
	dg := json.NewDecoder(strings.NewReader(got))
	dw := json.NewDecoder(strings.NewReader(want))
	dg.UseNumber()
	dw.UseNumber()
	for {
		tg, eg := dg.Token()
		tw, ew := dw.Token()
		if eg == io.EOF && ew == io.EOF {
			return nil
		}
		if eg != nil || ew != nil {
			return fmt.Errorf("reading tokens: %v / %v", eg, ew)
		}
		ng, okg := tg.(json.Number)
		nw, okw := tw.(json.Number)
		if okg && okw {
			a, _ := ng.Float64()
			b, _ := nw.Float64()
			if math.Abs(a-b) > 1e-12*math.Max(math.Abs(a), math.Abs(b)) {
				return fmt.Errorf("number %s, want %s", ng, nw)
			}
			continue
		}
		if tg != tw {
			return fmt.Errorf("token %v, want %v", tg, tw)
		}
	}
}

// TestHelpForms checks that the spellings of help agree.
func TestHelpForms(t *testing.T) {
	t.Parallel()
	_, main, _ := runSim(t, "help")
	for _, args := range [][]string{{"--help"}, {"-h"}} {
		code, out, errOut := runSim(t, args...)
		if code != exitOK || out != main || errOut != "" {
			t.Errorf("sim %q: exit %d, stderr %q, same as 'sim help': %v", args, code, errOut, out == main)
		}
	}
	_, steam, _ := runSim(t, "help", "steam")
	// "sim steam -h" is not help: -h is the enthalpy flag.
	for _, args := range [][]string{{"steam", "--help"}, {"steam", "-help"}} {
		code, out, _ := runSim(t, args...)
		if code != exitOK || out != steam {
			t.Errorf("sim %q: exit %d, same as 'sim help steam': %v", args, code, out == steam)
		}
	}
	for _, s := range []string{"steam", "help", "run", "check", "sim run", "Caution: boilers can kill"} {
		if !strings.Contains(main, s) {
			t.Errorf("'sim' help does not mention %q", s)
		}
	}
	for _, s := range []string{"--p PRESSURE", "--t TEMPERATURE", "--h ENTHALPY", "--s ENTROPY", "--x QUALITY",
		"--ambient PRESSURE", "--json", `sim steam --p "7 bar(g)" --x 1`, "Caution: boilers can kill"} {
		if !strings.Contains(steam, s) {
			t.Errorf("'sim help steam' does not mention %q", s)
		}
	}
}

// TestExitCodes checks usage errors (exit 2) and failures (exit 1), and
// that the first line on stderr names what was wrong.
func TestExitCodes(t *testing.T) {
	t.Parallel()
	cases := []struct {
		args []string
		code int
		msg  string // the first line of stderr
	}{
		// Usage errors.
		{[]string{"steam", "--t", "250 C"}, exitUsage,
			"sim steam: --t alone does not fix a state: add --p (or, for --t, --x on the saturation line)"},
		{[]string{"steam"}, exitUsage,
			"sim steam: no state given: give --p with one of --t, --h, --s or --x, or --t with --x"},
		{[]string{"steam", "--p", "7 bar(g)"}, exitUsage,
			"sim steam: --p alone does not fix a state: add one of --t, --h, --s or --x"},
		{[]string{"steam", "--p", "7 bar(g)", "--h", "2768 kJ/kg", "--t", "250 C"}, exitUsage,
			"sim steam: --p, --t, --h given together: give --p with exactly one of --t, --h, --s or --x, or --t with --x"},
		{[]string{"steam", "--q", "1"}, exitUsage, "sim steam: flag provided but not defined: -q"},
		{[]string{"steam", "--p"}, exitUsage, "sim steam: flag needs an argument: -p"},
		{[]string{"steam", "--p", "7 bra(g)", "--x", "1"}, exitUsage,
			"sim steam: --p: unknown unit 'bra(g)' in '7 bra(g)'; pressure units are: Pa, kPa, MPa, bar(a), mbar(a), psia, kg/cm2a, atm, mmHg, bar(g), mbar(g), kPa(g), MPa(g), psig, kg/cm2g"},
		{[]string{"steam", "--p", "7 bar", "--x", "1"}, exitUsage,
			"sim steam: --p: pressure '7 bar' is ambiguous: write '7 bar(g)' for gauge or '7 bar(a)' for absolute"},
		{[]string{"steam", "--p", "7", "--x", "1"}, exitUsage,
			"sim steam: --p: pressure needs a unit, such as '7 bar(g)'; got '7'"},
		{[]string{"steam", "--p", "7 bar(g)", "--t", "2768 kJ/kg"}, exitUsage,
			"sim steam: --t: temperature expected, such as '170 C'; got '2768 kJ/kg' (a specific energy)"},
		{[]string{"steam", "--p", "7 bar(g)", "--x", "1", "extra"}, exitUsage,
			`sim steam: unexpected argument "extra" (values go after flags, such as --p "7 bar(g)"; quote values that contain spaces)`},
		{[]string{"steam", "--p", "7 bar(g)", "--x", "1", "--ambient", "0 bar(g)"}, exitUsage,
			`sim steam: --ambient "0 bar(g)": the ambient pressure must be absolute, such as "1.013 bar(a)"`},
		{[]string{"stem"}, exitUsage, `sim: unknown command "stem"`},
		{[]string{"--p", "7 bar(g)"}, exitUsage, "sim: flag --p given before a command; the flags belong to a command, such as: sim steam --p ..."},
		{[]string{"help", "stem"}, exitUsage, `sim help: unknown help topic "stem"; the commands are: run, check, steam, fluegas, help`},
		// Failures: well-formed values that give no state.
		{[]string{"steam", "--p", "7 bar(g)", "--x", "1", "--ambient", "1.013 kPa"}, exitFail,
			`sim steam: --ambient "1.013 kPa" is 0.01013 bar(a); an ambient pressure must lie between 0.5 and 1.5 bar(a)`},
		{[]string{"steam", "--p", "7 bar(g)", "--x", "1.5"}, exitFail,
			`sim steam: --x "1.5": the quality must be from 0 to 1 (as a percentage, 0 % to 100 %); got 1.5`},
		{[]string{"steam", "--p", "7 bar(g)", "--x", "85"}, exitFail,
			`sim steam: --x "85": the quality must be from 0 to 1 (as a percentage, 0 % to 100 %); got 85`},
		{[]string{"steam", "--p", "-2 bar(g)", "--x", "1"}, exitFail,
			"sim steam: --p: pressure '-2 bar(g)' is at or below vacuum: it is -0.98675 bar(a) with an ambient of 1.01325 bar(a); an absolute pressure must be above zero"},
		{[]string{"steam", "--p", "7 bar(g)", "--t", "-300 C"}, exitFail,
			"sim steam: --t: temperature '-300 C' is below absolute zero (0 K, -273.15 °C)"},
	}
	for _, c := range cases {
		code, out, errOut := runSim(t, c.args...)
		first, _, _ := strings.Cut(errOut, "\n")
		if code != c.code || first != c.msg || out != "" {
			t.Errorf("sim %q: exit %d, stdout %q, stderr:\n%s\nwant exit %d and first line:\n%s", c.args, code, out, errOut, c.code, c.msg)
		}
		if c.code == exitUsage && c.args[0] == "steam" && !strings.Contains(errOut, "\nusage: sim steam --p PRESSURE") {
			t.Errorf("sim %q: a usage error must show the usage; got %q", c.args, errOut)
		}
		if c.code == exitFail && strings.Count(errOut, "\n") != 1 {
			t.Errorf("sim %q: a failure must print one line on stderr; got %q", c.args, errOut)
		}
	}
}

// TestOutOfRange checks that states outside IAPWS-IF97 (above 100 MPa, or
// above 2273.15 K; IAPWS R7-97(2012) Sec. 1, Fig. 1) fail with exit 1 and
// one line on stderr, whatever the wording of plant/water's error.
func TestOutOfRange(t *testing.T) {
	t.Parallel()
	for _, args := range [][]string{
		{"steam", "--p", "7 bar(g)", "--t", "2500 C"},
		{"steam", "--p", "200 MPa", "--t", "300 C"},
		{"steam", "--p", "30 MPa", "--x", "0.5"}, // above the critical pressure 22.064 MPa: no two-phase state
	} {
		code, out, errOut := runSim(t, args...)
		if code != exitFail || out != "" || strings.Count(errOut, "\n") != 1 || !strings.HasPrefix(errOut, "sim steam: ") {
			t.Errorf("sim %q: exit %d, stdout %q, stderr %q; want exit 1 and one line", args, code, out, errOut)
		}
	}
}

type steamOut struct {
	Version string   `json:"version"`
	P       float64  `json:"p_Pa"`
	T       float64  `json:"T_K"`
	H       float64  `json:"h_J_per_kg"`
	S       float64  `json:"s_J_per_kgK"`
	V       float64  `json:"v_m3_per_kg"`
	Rho     float64  `json:"rho_kg_per_m3"`
	Cp      *float64 `json:"cp_J_per_kgK"`
	X       *float64 `json:"x"`
	Region  int      `json:"region"`
	Phase   string   `json:"phase"`
	Caution string   `json:"caution"`
}

func steamJSONOf(t *testing.T, args ...string) steamOut {
	t.Helper()
	code, out, errOut := runSim(t, append(append([]string{"steam"}, args...), "--json")...)
	if code != exitOK {
		t.Fatalf("sim steam %q: exit %d: %s", args, code, errOut)
	}
	var s steamOut
	dec := json.NewDecoder(strings.NewReader(out))
	dec.DisallowUnknownFields()
	if err := dec.Decode(&s); err != nil {
		t.Fatalf("sim steam %q --json: %v\n%s", args, err, out)
	}
	return s
}

// TestSteamJSONMatchesWater checks that the command passes the water
// package's state through, rounded by the one rule of every JSON document
// (plant/schema's Round), that the inputs were read in the right units, and
// that the document carries the program's version.
func TestSteamJSONMatchesWater(t *testing.T) {
	t.Parallel()
	same := func(name string, got, want float64) {
		t.Helper()
		if got != schema.Round(want) {
			t.Errorf("%s = %.17g, water package gives %.17g (rounded %.17g)", name, got, want, schema.Round(want))
		}
	}
	// 7 bar(g) = 801325 Pa: 1 bar = 1e5 Pa plus the standard atmosphere
	// 101325 Pa, both exact by definition (NIST SP 811 B.8).
	st, err := water.PX(801325, 1)
	if err != nil {
		t.Fatal(err)
	}
	s := steamJSONOf(t, "--p", "7 bar(g)", "--x", "1")
	same("p_Pa", s.P, st.P)
	same("T_K", s.T, st.T)
	same("h_J_per_kg", s.H, st.H)
	same("s_J_per_kgK", s.S, st.S)
	same("v_m3_per_kg", s.V, st.V)
	same("rho_kg_per_m3", s.Rho, st.Rho)
	if s.X == nil || *s.X != 1 {
		t.Errorf("x = %v, want 1 for a saturated state", s.X)
	}
	if s.Phase != st.Phase.String() || s.Region != int(st.Region) {
		t.Errorf("phase %q region %d, water gives %q %d", s.Phase, s.Region, st.Phase, int(st.Region))
	}
	if s.Caution == "" {
		t.Error("JSON carries no caution")
	}
	if s.Version == "" {
		t.Error("JSON carries no version")
	}

	// 1.2 MPa, 250 °C = 523.15 K (exact by the Celsius definition):
	// superheated, single phase, so x is null.
	st, err = water.PT(1.2e6, 523.15)
	if err != nil {
		t.Fatal(err)
	}
	s = steamJSONOf(t, "--p", "1.2 MPa", "--t", "250 C")
	same("p_Pa", s.P, st.P)
	same("T_K", s.T, st.T)
	same("h_J_per_kg", s.H, st.H)
	if s.Cp == nil {
		t.Error("cp is null for a single-phase state")
	} else {
		same("cp_J_per_kgK", *s.Cp, st.Cp)
	}
	if s.X != nil {
		t.Errorf("x = %v for a single-phase state, want null", *s.X)
	}

	// The ambient moves gauge readings: 7 bar(g) with 1 bar(a) ambient is
	// 800000 Pa (exact, NIST SP 811 B.8).
	s = steamJSONOf(t, "--p", "7 bar(g)", "--x", "1", "--ambient", "1 bar(a)")
	same("p_Pa with ambient 1 bar(a)", s.P, 800000)
}

// TestSteamAgainstReference checks the command's numbers against the
// project's reference sheet, docs/reference/plant-checks.md §0 [C] (IAPWS-IF97 values
// computed when the sheet was compiled), to the digits printed there.
func TestSteamAgainstReference(t *testing.T) {
	t.Parallel()
	near := func(name string, got, want, tol float64) {
		t.Helper()
		if math.Abs(got-want) > tol {
			t.Errorf("%s = %.6f, want %.6f ± %g (docs/reference/plant-checks.md §0 [C])", name, got, want, tol)
		}
	}
	// Saturation at 7 bar(g): T_sat 170.48 °C, h_f 721.3, h_g 2768.4 kJ/kg.
	g := steamJSONOf(t, "--p", "7 bar(g)", "--x", "1")
	near("T_sat at 7 bar(g), °C", g.T-273.15, 170.48, 0.005)
	near("h_g at 7 bar(g), kJ/kg", g.H/1e3, 2768.4, 0.05)
	f := steamJSONOf(t, "--p", "7 bar(g)", "--x", "0")
	near("h_f at 7 bar(g), kJ/kg", f.H/1e3, 721.3, 0.05)
	near("h_fg at 7 bar(g), kJ/kg", (g.H-f.H)/1e3, 2047.1, 0.05)
	// The same state from the temperature side: T_sat and x = 1.
	// T_sat comes back rounded to six digits (0.5 mK), and dp_sat/dT is
	// about 16 kPa/K there: within 10 Pa.
	tx := steamJSONOf(t, "--t", strings.TrimSpace(formatK(g.T)), "--x", "100 %")
	near("p_sat(T_sat(7 bar(g))), Pa", tx.P, 801325, 10)
	// Saturation at 16 bar(g): h_g 2794.6 kJ/kg, s_g 6.3980 kJ/kgK.
	s16 := steamJSONOf(t, "--p", "16 bar(g)", "--x", "1")
	near("h_g at 16 bar(g), kJ/kg", s16.H/1e3, 2794.6, 0.05)
	near("s_g at 16 bar(g), kJ/kgK", s16.S/1e3, 6.3980, 0.00005)
	// And back: p and s_g give the saturated vapour again.
	ps := steamJSONOf(t, "--p", "16 bar(g)", "--s", formatJkgK(s16.S))
	near("T from (p, s_g) at 16 bar(g), K", ps.T, s16.T, 1e-6)
}

func formatK(v float64) string    { return strings.TrimSpace(jsonNum(v)) + " K" }
func formatJkgK(v float64) string { return strings.TrimSpace(jsonNum(v)) + " J/kgK" }
func jsonNum(v float64) string    { b, _ := json.Marshal(v); return string(b) }

// TestCancelled checks that a cancelled context stops the command with
// exit 1 and no output.
func TestCancelled(t *testing.T) {
	t.Parallel()
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	var out, errw bytes.Buffer
	code := run(ctx, []string{"steam", "--p", "7 bar(g)", "--x", "1"}, &out, &errw)
	if code != exitFail || out.Len() != 0 || errw.String() != "sim steam: context canceled\n" {
		t.Errorf("cancelled: exit %d, stdout %q, stderr %q", code, out.String(), errw.String())
	}
}
