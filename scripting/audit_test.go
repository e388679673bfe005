package scripting

import (
	"bytes"
	"context"
	"crypto/sha256"
	"encoding/json"
	"errors"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"testing/fstest"
	"time"

	"steamcase/plant/profile"
	"steamcase/plant/schema"
)

// auditDir writes the invented tanker of testdata/good and the given files
// into a new folder and returns it.
func auditDir(t *testing.T, files map[string]string) string {
	t.Helper()
	dir := t.TempDir()
	src, err := os.ReadFile(filepath.Join("testdata", "good", "jobs_plant.lua"))
	if err != nil {
		t.Fatal(err)
	}
	files["jobs_plant.lua"] = string(src)
	for name, body := range files {
		if err := os.WriteFile(filepath.Join(dir, name), []byte(body), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	return dir
}

// The log of an invented passage: two reference days at anchor with the
// heating off, metered, then four days at sea, one on MGO in an emission
// control area.
const refLog = `date,phase,sea,air,engine,claimed,reference,cargo heating.off,AB1.fuel
2026-04-01,at anchor,14 C,10 C,0 %,0.59 t,true,true,
2026-04-02,at anchor,14 C,9 C,0 %,0.63 t,yes,true,
2026-04-03,loaded passage,13 C,8 C,80 %,5.6 t,,,
2026-04-04,loaded passage,12 C,7 C,80 %,5.5 t,,,MGO
2026-04-05,loaded passage,12 C,6 C,80 %,8.2 t,,,
2026-04-06,discharging,12 C,7 C,0 %,7.2 t,,,
`

const fullAudit = `local ship = include("jobs_plant.lua")
local a = audit(ship, {
  name = "April", csv = "log.csv",
  uncertain = {
    { unit = "cargo heating", key = "factor", low = 0.9, high = 1.1 },
    { unit = "AB1", key = "eta_factor", low = 0.95, high = 1.03 },
    { unit = "AB2", key = "eta_factor", low = 0.95, high = 1.03 },
    { key = "sea", low = "-1 K", high = "1 K" },
    { unit = "galley", key = "duty", low = "30 kW", high = "50 kW", scope = "daily" },
  },
  claim = { { source = "flow meter", accuracy = "0.5 %" }, { source = "bdn density", density = "990 kg/m3" } },
  split = { { name = "cargo heating", units = { "cargo heating" } } },
  implied = { { unit = "cargo heating", key = "factor" } },
  calibrate = { units = { "AB1", "AB2" }, key = "eta_factor", off = { "cargo heating" } },
  samples = 200, seed = 7, alpha = "5 %",
})
check(a.calibration.reference_days == 2 and a.period.days == 4, "two reference days, four audited")
check(a.days[1].reference and a.days[1].low_t == nil, "a reference day has no band")
check(a.days[5].implied[1].factor == "cargo heating.factor", "the implied factor is named")
check(#a.fuel_by_grade == 2 and a.fuel_by_grade[2].grade == "MGO", "the MGO day adds a grade")
check(a.uncertainties[4].scope == "daily" and a.uncertainties[1].scope == "fixed", "scopes by default")
check(a.causes[1].name == "cargo heating" and a.base_t ~= nil, "the split")
return a
`

func TestAuditScript(t *testing.T) {
	t.Parallel()
	dir := auditDir(t, map[string]string{"a.lua": fullAudit, "log.csv": refLog})
	run, err := RunFile(context.Background(), filepath.Join(dir, "a.lua"), Options{Timeout: time.Minute})
	if err != nil {
		t.Fatal(err)
	}
	a := run.Audits[0].Result
	c := a.Calibration
	// The calibrated factor lies inside its range, which is that of the
	// claim ∓ its measurement uncertainty on the reference days: ± 0.5 %
	// of the meter and ± 1.5/990 of the density, of 1.22 t (the
	// calibration's definition).
	if c == nil || !(c.Low < c.Value && c.Value < c.High) {
		t.Fatalf("calibration %+v", c)
	}
	if want := (0.005 + 1.5/990) * (0.59 + 0.63); abs(c.ReadingHalfWidthT-want) > 1e-12 {
		t.Errorf("reading half-width %g t; want %g t", c.ReadingHalfWidthT, want)
	}
	// Day 5 claims 8.2 t where the plant burns about 5.7 t: the heating
	// factor implied lies far above its plausible range.
	if v := a.Days[4].Implied[0]; v.Status != profile.ImpliedFound || !(v.Value > 1.1) {
		t.Errorf("day 5 implied %+v", v)
	}
	if a.Days[4].Flag != "above" {
		t.Errorf("day 5: flag %q, percentile %g", a.Days[4].Flag, a.Days[4].Percentile)
	}
	for _, name := range []string{"a.lua", "jobs_plant.lua", "log.csv"} {
		found := false
		for _, f := range run.Files {
			if filepath.Base(f.Name) == name {
				found = true
			}
		}
		if !found {
			t.Errorf("%s is not among the files read %v", name, run.Files)
		}
	}
}

// TestFilesRead: the run records every script and data file it read with
// the SHA-256 of its bytes, recomputed here with crypto/sha256.
func TestFilesRead(t *testing.T) {
	t.Parallel()
	dir := auditDir(t, map[string]string{"a.lua": fullAudit, "log.csv": refLog})
	run, err := RunFile(context.Background(), filepath.Join(dir, "a.lua"), Options{Timeout: time.Minute, CheckOnly: true})
	if err != nil {
		t.Fatal(err)
	}
	if len(run.Files) != 3 || run.Files[0].Name != filepath.Join(dir, "a.lua") {
		t.Fatalf("files read %+v; want the script first, then its include and its CSV", run.Files)
	}
	for _, f := range run.Files {
		b, err := os.ReadFile(f.Name)
		if err != nil {
			t.Fatal(err)
		}
		if sha256.Sum256(b) != f.SHA256 || f.Bytes != len(b) {
			t.Errorf("%s: recorded %x (%d bytes); the file's SHA-256 is %x (%d bytes)", f.Name, f.SHA256, f.Bytes, sha256.Sum256(b), len(b))
		}
	}
}

// TestAuditWorkersSameJSON: the audit's JSON is byte for byte the same on
// one worker and on four.
func TestAuditWorkersSameJSON(t *testing.T) {
	t.Parallel()
	dir := auditDir(t, map[string]string{"a.lua": fullAudit, "log.csv": refLog})
	var out [2][]byte
	for i, w := range []int{1, 4} {
		run, err := RunFile(context.Background(), filepath.Join(dir, "a.lua"), Options{Timeout: time.Minute, Workers: w})
		if err != nil {
			t.Fatal(err)
		}
		a := run.Audits[0]
		out[i], err = json.Marshal(schema.NewAudit(schema.Job{Name: a.Name}, a.Result))
		if err != nil {
			t.Fatal(err)
		}
	}
	if !bytes.Equal(out[0], out[1]) {
		t.Errorf("the audit's JSON differs between one worker and four")
	}
}

// TestAuditBadInput: each mistake is reported at its file and line, with
// what was expected and what was given.
func TestAuditBadInput(t *testing.T) {
	t.Parallel()
	call := func(days, extra string) string {
		return "local ship = include(\"jobs_plant.lua\")\n\naudit(ship, { name = \"x\", samples = 10, " + days + extra + " })\n"
	}
	for _, tc := range []struct {
		name, script, csv string
		want              []string
	}{
		{"claim in an unknown unit", call(`csv = "log.csv"`, ""),
			"date,claimed\n2026-01-01,3 t\n2026-01-02,12 bbl\n",
			[]string{`log.csv:3: column "claimed": `, "bbl"}},
		{"claim as a volume", call(`days = { { date = "d1", claimed = "3 m3" } }`, ""), "",
			[]string{`a.lua:3: audit "x" days[1]: claimed: mass expected`}},
		{"day without a date in a file", call(`csv = "log.csv"`, ""),
			"date,claimed\n2026-01-01,3 t\n,4 t\n",
			[]string{`log.csv:3: column "date": is empty; it is required in every row`}},
		{"day without a date in a table", call(`days = { { claimed = "3 t" } }`, ""), "",
			[]string{`a.lua:3: audit "x" days[1]: date is required`}},
		{"uncertain key not a number of its unit", call(`days = { { date = "d1", claimed = "3 t" } }`,
			`, uncertain = { { unit = "cargo heating", key = "factor", low = "5 kW", high = 1.1 } }`), "",
			[]string{`a.lua:3: audit "x" uncertain[1]: low: fraction expected`, "5 kW"}},
		{"uncertain reading without a unit", call(`days = { { date = "d1", claimed = "3 t", sea = "10 C" } }`,
			`, uncertain = { { key = "sea", low = -1, high = 1 } }`), "",
			[]string{`a.lua:3: audit "x" uncertain[1]: low needs a unit, such as '10 K'`}},
		{"reference day with the heating on", call(`csv = "log.csv"`,
			`, uncertain = { { unit = "AB1", key = "eta_factor", low = 0.9, high = 1 } }, calibrate = { unit = "AB1", key = "eta_factor", off = "cargo heating" }`),
			"date,engine,claimed,reference,cargo heating.off\n2026-01-01,0 %,3 t,true,true\n2026-01-02,0 %,3 t,true,\n2026-01-03,80 %,3 t,,\n",
			[]string{`log.csv:3: audit "x": audit day 2 (2026-01-02): a reference day for calibrating AB1.eta_factor must have "cargo heating" off, but the day has it on`}},
		{"unknown claim source", call(`days = { { date = "d1", claimed = "3 t" } }`, `, claim = { source = "flowmeter" }`), "",
			[]string{`a.lua:3: audit "x" claim[1]: source "flowmeter" is not a source this audit knows`, `did you mean "flow meter"?`}},
		{"claims of no cause", call(`days = { { date = "d1", claimed = "3 t" } }`, `, claims = "heating"`), "",
			[]string{`a.lua:3: audit "x": claims = "heating": the days claim the fuel of a cause split out, but split names no such cause`}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			files := map[string]string{"a.lua": tc.script}
			if tc.csv != "" {
				files["log.csv"] = tc.csv
			}
			dir := auditDir(t, files)
			_, err := RunFile(context.Background(), filepath.Join(dir, "a.lua"), Options{Timeout: time.Minute})
			if err == nil {
				t.Fatal("no error")
			}
			msg := strings.ReplaceAll(err.Error(), dir+string(filepath.Separator), "")
			at := 0
			for _, w := range tc.want {
				i := strings.Index(msg[at:], w)
				if i < 0 {
					t.Errorf("error lacks %q (in order):\n%s", w, msg)
					continue
				}
				at += i + len(w)
			}
		})
	}
}

// TestAuditTimeLimit: an audit too large for its time limit stops with an
// error that says which option to raise.
func TestAuditTimeLimit(t *testing.T) {
	t.Parallel()
	var days strings.Builder
	for i := 0; i < 40; i++ {
		days.WriteString(`{ date = "d` + string(rune('a'+i%26)) + `", claimed = "3 t", sea = "10 C", air = "5 C", engine = "80 %" }, `)
	}
	script := "local ship = include(\"jobs_plant.lua\")\naudit(ship, { name = \"big\", samples = 100000, days = { " + days.String() +
		" }, uncertain = { { unit = \"AB1\", key = \"eta_factor\", low = 0.9, high = 1 } } })\n"
	dir := auditDir(t, map[string]string{"a.lua": script})
	_, err := RunFile(context.Background(), filepath.Join(dir, "a.lua"), Options{JobTimeout: 3 * time.Second, Workers: 1})
	var te *TimeoutError
	var e *Error
	if err == nil || !(errors.As(err, &te) || errors.As(err, &e)) || !strings.Contains(err.Error(), "--job-timeout") {
		t.Fatalf("error %v; want one that names --job-timeout", err)
	}
	t.Log(err)
	if !strings.Contains(err.Error(), `audit "big"`) {
		t.Errorf("error %v does not name the audit", err)
	}
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}

// FuzzAuditArgs gives audit() arbitrary texts for its claims, sources,
// scopes, bounds and reference cells, in check mode (which reads and
// checks everything an audit takes): every outcome is a result or a
// script error, never a failure of this package.
func FuzzAuditArgs(f *testing.F) {
	plantSrc, err := os.ReadFile(filepath.Join("testdata", "good", "jobs_plant.lua"))
	if err != nil {
		f.Fatal(err)
	}
	f.Add("3 t", "flow meter", "1 %", "fixed", "0.9", "true")
	f.Add("12 bbl", "soundings", "-1 m3", "weekly", "5 kW", "maybe")
	f.Add("", "bdn density", "1e400 kg/m3", "daily", "-1 K", "")
	f.Fuzz(func(t *testing.T, claimed, source, width, scope, low, ref string) {
		q := func(s string) string { return strconv.Quote(s) }
		src := `local ship = include("jobs_plant.lua")
audit(ship, { name = "f", csv = "log.csv", samples = 10,
  uncertain = { { unit = "cargo heating", key = "factor", low = ` + q(low) + `, high = 1.1, scope = ` + q(scope) + ` },
                { key = "sea", low = ` + q(low) + `, high = "1 K" } },
  claim = { source = ` + q(source) + `, accuracy = ` + q(width) + `, per_sounding = ` + q(width) + `, density = ` + q(width) + ` },
  calibrate = { unit = "cargo heating", key = "factor", off = { "galley" } } })
`
		csvSrc := "date,claimed,reference,sea,air\n2026-01-01," + csvCell(claimed) + "," + csvCell(ref) + ",10 C,5 C\n2026-01-02,3 t,,10 C,5 C\n"
		fsys := fstest.MapFS{"jobs_plant.lua": {Data: plantSrc}, "log.csv": {Data: []byte(csvSrc)}}
		_, err := RunSource(context.Background(), "f.lua", []byte(src), fsys, Options{Timeout: 5 * time.Second, CheckOnly: true})
		if errors.Is(err, ErrInternal) {
			t.Fatalf("internal error: %v", err)
		}
	})
}

// csvCell quotes a CSV cell.
func csvCell(s string) string {
	return `"` + strings.ReplaceAll(s, `"`, `""`) + `"`
}
