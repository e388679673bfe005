package main

import (
	"bytes"
	"context"
	"encoding/csv"
	"encoding/json"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"steamcase/cmd/sim/internal/report"
)

const (
	smallScript = "testdata/run/small.lua"
	failScript  = "testdata/run/fail_check.lua"
	errScript   = "testdata/run/errors.lua"
	endless     = "testdata/run/endless.lua"
)

// TestRunGolden runs a small script end to end and compares the table with
// testdata/run_small.golden. The figures come from the plant package,
// whose balances are checked in its own tests; the file pins what reaches
// the user. Rewrite with: go test ./cmd/sim -update
func TestRunGolden(t *testing.T) {
	t.Parallel()
	code, out, errOut := runSim(t, "run", "--quiet", smallScript)
	if code != exitOK || errOut != "" {
		t.Fatalf("exit %d, stderr %q", code, errOut)
	}
	path := filepath.Join("testdata", "run_small.golden")
	if *update {
		if err := os.WriteFile(path, []byte(out), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run with -update to create it)", err)
	}
	if out != string(want) {
		t.Errorf("sim run %s differs from %s:\n--- got\n%s\n--- want\n%s", smallScript, path, out, want)
	}
	for _, s := range []string{"Load case 1 of 2: port stay", "Load case 2 of 2: cold discharge",
		`plant "Invented Test Coaster", solved at testdata/run/small.lua:20`, report.Caution} {
		if !strings.Contains(out, s) {
			t.Errorf("the report does not say %q", s)
		}
	}
}

// TestRunForms checks that --json and --csv give the same cases as the
// table, in the forms for programs, and that the script's print goes to
// stderr as plain text with them, so that stdout holds the document only.
func TestRunForms(t *testing.T) {
	t.Parallel()
	code, out, errOut := runSim(t, "run", "--json", smallScript)
	if code != exitOK {
		t.Fatalf("--json: exit %d, stderr %q", code, errOut)
	}
	var doc struct {
		Schema  int    `json:"schema"`
		Caution string `json:"caution"`
		Version string `json:"version"`
		Plant   []struct {
			Name string `json:"name"`
		} `json:"plant"`
		Checks struct {
			Passed int   `json:"passed"`
			Failed []any `json:"failed"`
		} `json:"checks"`
		Cases []struct {
			Name          string `json:"name"`
			Source        string `json:"source"`
			BoilersFiring int    `json:"boilers_firing"`
		} `json:"cases"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatalf("--json: %v\n%s", err, out)
	}
	if doc.Schema != 3 || doc.Version != version() || doc.Caution != cautionLine || len(doc.Plant) != 1 ||
		doc.Plant[0].Name != "Invented Test Coaster" || len(doc.Cases) != 2 || doc.Checks.Failed == nil ||
		doc.Cases[0].Source != "testdata/run/small.lua:20" || doc.Cases[1].BoilersFiring != 2 {
		t.Errorf("--json: %+v", doc)
	}
	// The print: plain text on stderr, not a log record.
	if !strings.HasPrefix(errOut, "port stay fuel\t") || !strings.HasSuffix(errOut, "\tt/day\n") || strings.Count(errOut, "\n") != 1 {
		t.Errorf("the script's print is not plain text on stderr: %q", errOut)
	}

	code, out, errOut = runSim(t, "run", "--csv", "--quiet", smallScript, smallScript)
	if code != exitOK {
		t.Fatalf("--csv: exit %d, stderr %q", code, errOut)
	}
	rows, err := csv.NewReader(strings.NewReader(out)).ReadAll()
	if err != nil || len(rows) != 5 || rows[0][0] != "table" || rows[0][1] != "case" || rows[1][0] != "cases" ||
		rows[1][1] != "port stay" || rows[4][1] != "cold discharge" {
		t.Errorf("--csv of two scripts: %v rows %q", err, rows)
	}
	if errOut != cautionLine+"\n" {
		t.Errorf("--csv must put the caution on stderr; got %q", errOut)
	}
}

// TestRunFailedCheckJSON: with --json, a failed check() still writes the
// document, with what was solved before it and the failure under
// "checks", and sim exits with status 1 after printing the failure.
func TestRunFailedCheckJSON(t *testing.T) {
	t.Parallel()
	code, out, errOut := runSim(t, "run", "--quiet", "--json", failScript)
	if code != exitFail || errOut != "testdata/run/fail_check.lua:9: assertion failed: harbour fuel above 1 t/h\n" {
		t.Errorf("exit %d, stderr %q", code, errOut)
	}
	var doc struct {
		Checks struct {
			Passed int `json:"passed"`
			Failed []struct {
				Pos     string `json:"pos"`
				Message string `json:"message"`
			} `json:"failed"`
		} `json:"checks"`
		Cases []struct {
			Name string `json:"name"`
		} `json:"cases"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatalf("%v\n%s", err, out)
	}
	if len(doc.Cases) != 1 || doc.Cases[0].Name != "harbour" || doc.Checks.Passed != 1 || len(doc.Checks.Failed) != 1 ||
		doc.Checks.Failed[0].Pos != "testdata/run/fail_check.lua:9" || doc.Checks.Failed[0].Message != "harbour fuel above 1 t/h" {
		t.Errorf("document: %+v", doc)
	}
	// Two scripts, the first passing its two checks: counted with the
	// second's one, and the failure of the second marked.
	code, out, _ = runSim(t, "run", "--quiet", "--json", smallScript, failScript)
	doc.Checks.Failed, doc.Cases = nil, nil
	if err := json.Unmarshal([]byte(out), &doc); err != nil || code != exitFail || len(doc.Cases) != 3 ||
		len(doc.Checks.Failed) != 1 || doc.Checks.Passed != 3 {
		t.Errorf("two scripts: exit %d, %v, %+v", code, err, doc)
	}
}

// TestRunOutputFiles checks -o and --plot.
func TestRunOutputFiles(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	_, table, _ := runSim(t, "run", "--quiet", smallScript)
	outFile := filepath.Join(dir, "report.txt")
	svg := filepath.Join(dir, "demand.svg")
	png := filepath.Join(dir, "demand.png")
	// Flags after the script are read too.
	code, out, errOut := runSim(t, "run", "--quiet", smallScript, "-o", outFile, "--plot", svg)
	if code != exitOK || out != "" || errOut != "" {
		t.Fatalf("-o: exit %d, stdout %q, stderr %q", code, out, errOut)
	}
	got, err := os.ReadFile(outFile)
	if err != nil || string(got) != table {
		t.Errorf("-o wrote %q (%v); want the table printed without -o", got, err)
	}
	b, err := os.ReadFile(svg)
	if err != nil || !bytes.Contains(b, []byte("<svg")) {
		t.Fatalf("--plot %s: %v, %d bytes", svg, err, len(b))
	}
	for _, s := range []string{"port stay", "cold discharge", "fuel heating", "galley", "steam, kg/h"} {
		if !bytes.Contains(b, []byte(s)) {
			t.Errorf("the SVG does not contain %q", s)
		}
	}
	code, _, errOut = runSim(t, "run", "--quiet", "--json", "--plot", png, smallScript)
	b, err = os.ReadFile(png)
	if code != exitOK || err != nil || !bytes.HasPrefix(b, []byte("\x89PNG")) {
		t.Errorf("--plot %s: exit %d, %q, %v, %d bytes", png, code, errOut, err, len(b))
	}
	// A folder that does not exist: a failure, one line.
	code, _, errOut = runSim(t, "run", "--quiet", "-o", filepath.Join(dir, "no", "such", "r.txt"), smallScript)
	if code != exitFail || strings.Count(errOut, "\n") != 1 || !strings.HasPrefix(errOut, "sim run: -o "+filepath.Join(dir, "no", "such", "r.txt")+": ") {
		t.Errorf("-o into a missing folder: exit %d, stderr %q", code, errOut)
	}
}

// TestRunExitCodes checks usage errors (2), failures (1, with the script
// position on one line) and success (0) of run and check.
func TestRunExitCodes(t *testing.T) {
	t.Parallel()
	cases := []struct {
		args   []string
		code   int
		stderr string // the whole of stderr, or its first line for usage errors
		stdout string // a part of stdout; "" means stdout must be empty
	}{
		{[]string{"run"}, exitUsage, "sim run: no script given: name one or more Lua load-case scripts, such as: sim run tanker.lua", ""},
		{[]string{"check"}, exitUsage, "sim check: no script given: name one or more Lua load-case scripts, such as: sim check tanker.lua", ""},
		{[]string{"run", "--json", "--csv", smallScript}, exitUsage, "sim run: --json and --csv given together: choose one form of the report", ""},
		{[]string{"run", "-v", "--quiet", smallScript}, exitUsage, "sim run: -v and --quiet given together: choose one", ""},
		{[]string{"run", "--plot", "x.pdf", smallScript}, exitUsage, `sim run: --plot: plot file "x.pdf": the name must end in .svg or .png, which sets the format`, ""},
		{[]string{"run", "--timeout", "0s", smallScript}, exitUsage, "sim run: --timeout 0s: the time limit must be above zero and at most 24h0m0s, such as 10s or 2m", ""},
		{[]string{"run", "--timeout", "10", smallScript}, exitUsage, `sim run: invalid value "10" for flag -timeout: a duration with its unit is expected, such as 10s, 2m or 1h30m`, ""},
		{[]string{"check", "--json", smallScript}, exitUsage, "sim check: flag provided but not defined: -json", ""},
		{[]string{"run", "--quiet", failScript}, exitFail, "testdata/run/fail_check.lua:9: assertion failed: harbour fuel above 1 t/h\n", "Load case 1 of 1: harbour"},
		{[]string{"run", "--quiet", endless, "--timeout", "200ms"}, exitFail, "testdata/run/endless.lua:2: script stopped: it ran longer than its time limit of 200ms (an endless loop?); to give it longer, run again with --timeout 2s\n",
			"Nothing was solved"},
		{[]string{"check", "--quiet", smallScript, failScript}, exitOK, "",
			"testdata/run/small.lua: ok: 1 plant, 2 load cases\ntestdata/run/fail_check.lua: ok: 1 plant, 1 load case\n"},
	}
	for _, c := range cases {
		code, out, errOut := runSim(t, c.args...)
		gotErr := errOut
		if c.code == exitUsage {
			gotErr, _, _ = strings.Cut(errOut, "\n")
		}
		if code != c.code || gotErr != c.stderr {
			t.Errorf("sim %q: exit %d, stderr:\n%s\nwant exit %d and stderr:\n%s", c.args, code, errOut, c.code, c.stderr)
		}
		if (c.stdout == "" && out != "") || !strings.Contains(out, c.stdout) {
			t.Errorf("sim %q: stdout %q, want it to contain %q", c.args, out, c.stdout)
		}
		if c.code == exitUsage && !strings.Contains(errOut, "\nusage: sim "+c.args[0]+" ") {
			t.Errorf("sim %q: a usage error must show the usage; got %q", c.args, errOut)
		}
	}
}

// TestMissingScript checks that a script that cannot be read fails with
// one line naming it, in words and without the system call.
func TestMissingScript(t *testing.T) {
	t.Parallel()
	code, out, errOut := runSim(t, "run", "--quiet", "testdata/run/nope.lua")
	if code != exitFail || out != "" || errOut != "sim: cannot open testdata/run/nope.lua: no such file\n" {
		t.Errorf("exit %d, stdout %q, stderr %q", code, out, errOut)
	}
}

// TestScriptErrors checks that every error of a script is listed on its
// own line as "file:line: message", by run and by check, and that check
// goes on to the other scripts. The wording is the scripting package's and
// is tested there; here only the lines and positions are.
func TestScriptErrors(t *testing.T) {
	t.Parallel()
	for _, args := range [][]string{
		{"run", "--quiet", errScript},
		{"check", "--quiet", smallScript, errScript, "testdata/run/nope.lua"},
	} {
		code, out, errOut := runSim(t, args...)
		if code != exitFail {
			t.Errorf("sim %q: exit %d, want 1", args, code)
		}
		lines := strings.Split(strings.TrimSuffix(errOut, "\n"), "\n")
		for _, l := range lines {
			if !strings.HasPrefix(l, errScript+":") && !strings.HasPrefix(l, "sim: cannot open ") {
				t.Errorf("sim %q: line %q is not \"file:line: message\"", args, l)
			}
		}
		for _, want := range []string{
			errScript + `:3: makeup "makeup": T needs a unit`,
			errScript + `:4: feed tank "hotwell": unknown key 'heat_los'`,
			errScript + `:5: boiler "AB1": drum: pressure '7 bar' is ambiguous`,
		} {
			if !strings.Contains(errOut, "\n"+want) && !strings.HasPrefix(errOut, want) {
				t.Errorf("sim %q: stderr lacks a line starting %q:\n%s", args, want, errOut)
			}
		}
		if args[0] == "check" {
			if out != "testdata/run/small.lua: ok: 1 plant, 2 load cases\n" {
				t.Errorf("sim check: stdout %q", out)
			}
			if last := lines[len(lines)-1]; last != "sim: cannot open testdata/run/nope.lua: no such file" {
				t.Errorf("sim check: the missing file is not reported last: %q", errOut)
			}
		} else if out != "" {
			t.Errorf("sim run with errors printed a report: %q", out)
		}
	}
}

// TestRunHelp checks that the help of run and check names every flag and
// carries the caution.
func TestRunHelp(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		name  string
		wants []string
	}{
		{"run", []string{"usage: sim run [--json | --csv]", "\n  --json\n", "\n  --csv\n", "\n  --plot FILE\n", "\n  -o FILE\n",
			"\n  --timeout DURATION\n", "\n  -v\n", "\n  --quiet\n", "sim run --plot demand.svg tanker.lua", "Caution: boilers can kill"}},
		{"check", []string{"usage: sim check [--timeout DURATION]", "\n  --timeout DURATION\n", "\n  -v\n", "\n  --quiet\n",
			"sim check tanker.lua", "Caution: boilers can kill"}},
	} {
		code, out, _ := runSim(t, "help", c.name)
		if code != exitOK {
			t.Errorf("sim help %s: exit %d", c.name, code)
		}
		for _, s := range c.wants {
			if !strings.Contains(out, s) {
				t.Errorf("'sim help %s' does not mention %q", c.name, s)
			}
		}
		if _, out2, _ := runSim(t, c.name, "--help"); out2 != out {
			t.Errorf("'sim %s --help' differs from 'sim help %s'", c.name, c.name)
		}
	}
	if cautionLine != report.Caution {
		t.Errorf("the report's caution differs from the command's:\n%s\n%s", report.Caution, cautionLine)
	}
}

// TestRunCancelled checks that a cancelled run stops with exit 1, one
// line on stderr and no report.
func TestRunCancelled(t *testing.T) {
	t.Parallel()
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	var out, errw bytes.Buffer
	code := run(ctx, []string{"run", "--quiet", smallScript}, &out, &errw)
	if code != exitFail || out.Len() != 0 || strings.Count(errw.String(), "\n") != 1 || !strings.HasPrefix(errw.String(), "sim run: ") {
		t.Errorf("cancelled: exit %d, stdout %q, stderr %q", code, out.String(), errw.String())
	}
}

// TestRunVoyage runs a voyage plan end to end: the table shows its
// phases and totals, the JSON carries it under "voyages", and a chart,
// which draws load cases, is refused.
func TestRunVoyage(t *testing.T) {
	t.Parallel()
	const script = "testdata/run/voyage.lua"
	code, out, errOut := runSim(t, "run", "--quiet", script)
	if code != exitOK || errOut != "" {
		t.Fatalf("exit %d, stderr %q", code, errOut)
	}
	for _, s := range []string{"Voyage: short trip", "run at testdata/run/voyage.lua:4", "2 periods, 36.0 h",
		"    port ", "    passage ", "    whole voyage ", "row 2 (testdata/run/voyage.lua:4)", cautionLine} {
		if !strings.Contains(out, s) {
			t.Errorf("the report does not say %q:\n%s", s, out)
		}
	}
	if code, out, _ := runSim(t, "check", "--quiet", script); code != exitOK || out != script+": ok: 1 plant, 0 load cases, 1 voyage\n" {
		t.Errorf("sim check %s: exit %d, %q", script, code, out)
	}
	code, out, _ = runSim(t, "run", "--quiet", "--json", script)
	var doc struct {
		Voyages []struct {
			Name  string `json:"name"`
			Total struct {
				Hours float64 `json:"hours"`
			} `json:"total"`
			Phases []struct {
				Phase string `json:"phase"`
			} `json:"phases"`
		} `json:"voyages"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil || code != exitOK || len(doc.Voyages) != 1 ||
		doc.Voyages[0].Total.Hours != 36 || len(doc.Voyages[0].Phases) != 2 || doc.Voyages[0].Phases[1].Phase != "passage" {
		t.Errorf("--json: exit %d, %v, %+v", code, err, doc)
	}
	// The rows' cases: null by default, the row's CASE with --rows full,
	// and the totals the same.
	var rowsOf = func(args ...string) (rows []map[string]any, total any) {
		t.Helper()
		code, out, errOut := runSim(t, append(append([]string{"run", "--quiet", "--json"}, args...), script)...)
		var d struct {
			Voyages []struct {
				Total any              `json:"total"`
				Rows  []map[string]any `json:"rows"`
			} `json:"voyages"`
		}
		if err := json.Unmarshal([]byte(out), &d); err != nil || code != exitOK || len(d.Voyages) != 1 {
			t.Fatalf("--json %q: exit %d, %v, stderr %q", args, code, err, errOut)
		}
		return d.Voyages[0].Rows, d.Voyages[0].Total
	}
	lean, leanTotal := rowsOf()
	full, fullTotal := rowsOf("--rows", "full")
	for i := range lean {
		if r, ok := lean[i]["result"]; !ok || r != nil {
			t.Errorf("row %d: result %v by default, want null", i+1, r)
		}
		c, _ := full[i]["result"].(map[string]any)
		if c == nil || c["name"] != full[i]["case"] || c["fuel_kg_h"] != full[i]["fuel_kg_h"] {
			t.Errorf("row %d with --rows full: result %v, want the row's case", i+1, full[i]["result"])
		}
	}
	if !reflect.DeepEqual(leanTotal, fullTotal) {
		t.Errorf("totals %v by default, %v with --rows full", leanTotal, fullTotal)
	}
	// The CSV: the cases' header alone (no case), a blank line, then the
	// voyage's rows and their warnings.
	code, out, _ = runSim(t, "run", "--quiet", "--csv", script)
	tables := strings.Split(out, "\n\n")
	if code != exitOK || len(tables) != 3 || !strings.HasPrefix(tables[0], "table,case,plant,") ||
		!strings.HasPrefix(tables[1], "table,voyage,row,source,phase,") ||
		!strings.HasPrefix(tables[2], "table,voyage,row,source,warning\n") ||
		!strings.Contains(tables[1], "\nvoyage rows,short trip,2,testdata/run/voyage.lua:4,passage,") {
		t.Errorf("--csv of a voyage: exit %d:\n%s", code, out)
	}
	// The chart of the voyage: one job, so the file named.
	svg := filepath.Join(t.TempDir(), "v.svg")
	code, _, errOut = runSim(t, "run", "--quiet", "--plot", svg, script)
	b, err := os.ReadFile(svg)
	if code != exitOK || errOut != "" || err != nil || len(b) == 0 {
		t.Fatalf("--plot of a voyage: exit %d, stderr %q, %v, %d bytes", code, errOut, err, len(b))
	}
	for _, s := range []string{"<svg", "Voyage: short trip", "Invented Test Coaster", "port", "passage", "time from the start of the voyage, h"} {
		if !bytes.Contains(b, []byte(s)) {
			t.Errorf("the voyage's SVG does not contain %q", s)
		}
	}
}

// TestRunPlotSeveral runs a script with load cases and two scripts with a
// voyage each: one chart per case set and job, each in its own file named
// with a suffix, listed on stderr unless --quiet.
func TestRunPlotSeveral(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	base := filepath.Join(dir, "demand.svg")
	code, _, errOut := runSim(t, "run", "--plot", base, smallScript, "testdata/run/voyage.lua", "testdata/run/voyage.lua")
	if code != exitOK {
		t.Fatalf("exit %d, stderr %q", code, errOut)
	}
	files := []string{"demand-cases.svg", "demand-voyage-1.svg", "demand-voyage-2.svg"}
	for i, f := range files {
		b, err := os.ReadFile(filepath.Join(dir, f))
		if err != nil || len(b) == 0 {
			t.Errorf("%s: %v, %d bytes", f, err, len(b))
			continue
		}
		want := "Voyage: short trip"
		if i == 0 {
			want = "cold discharge"
		}
		if !bytes.Contains(b, []byte(want)) {
			t.Errorf("%s does not contain %q", f, want)
		}
		files[i] = filepath.Join(dir, f)
	}
	if _, err := os.Stat(base); err == nil {
		t.Errorf("%s written as well as the suffixed files", base)
	}
	if !strings.Contains(errOut, "sim run: 3 charts written: "+strings.Join(files, ", ")+"\n") {
		t.Errorf("stderr does not list the charts: %q", errOut)
	}
	// Nothing solved: nothing to draw, an error naming the flag.
	empty := filepath.Join(dir, "empty.lua")
	if err := os.WriteFile(empty, []byte("-- nothing\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	code, _, errOut = runSim(t, "run", "--quiet", "--plot", base, empty)
	if code != exitFail || !strings.HasPrefix(errOut, "sim run: --plot "+base+": nothing to draw") {
		t.Errorf("--plot of nothing: exit %d, stderr %q", code, errOut)
	}
}

func TestPlotFile(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		name    string
		chart   report.Chart
		several bool
		want    string
	}{
		{"demand.svg", report.Chart{Kind: "voyage", N: 1}, false, "demand.svg"},
		{"demand.svg", report.Chart{Kind: "voyage", N: 1}, true, "demand-voyage-1.svg"},
		{"out/run.2.PNG", report.Chart{Kind: "cases"}, true, "out/run.2-cases.PNG"},
		{"a.b/plot.svg", report.Chart{Kind: "audit", N: 12}, true, "a.b/plot-audit-12.svg"},
		{"plots/study", report.Chart{Kind: "study", N: 2}, true, "plots/study-study-2"},
	} {
		if got := plotFile(c.name, c.chart, c.several); got != c.want {
			t.Errorf("plotFile(%q, %s %d, %v) = %q, want %q", c.name, c.chart.Kind, c.chart.N, c.several, got, c.want)
		}
	}
}

func TestCount(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		n    int
		what string
		want string
	}{{1, "plant", "1 plant"}, {2, "plant", "2 plants"}, {0, "load case", "0 load cases"},
		{3, "study", "3 studies"}, {2, "voyage", "2 voyages"}, {1, "audit", "1 audit"}, {2, "day", "2 days"}} {
		if got := count(c.n, c.what); got != c.want {
			t.Errorf("count(%d, %q) = %q, want %q", c.n, c.what, got, c.want)
		}
	}
}
