package main

import (
	"encoding/csv"
	"encoding/json"
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"steamcase/plant/units"
)

func TestEscapeText(t *testing.T) {
	t.Parallel()
	for _, c := range []struct{ in, want string }{
		{"plain name", "plain name"},
		{"b\r\nfake", `b\r\nfake`},
		{"tab\there", `tab\there`},
		{"esc\x1b[2J", `esc\x1b[2J`},
		{"nul\x00", `nul\x00`},
		{"del\x7f", `del\x7f`},
		{"c1\u0085", `c1\u0085`},
		{"bidi\u202egnp.exe", `bidi\u202egnp.exe`},
		{"line\u2028sep", `line\u2028sep`},
		{"bad\xffutf8", `bad\xffutf8`},
		{"°C, ΔT, naïve", "°C, ΔT, naïve"},
		{`already\r\nescaped`, `already\r\nescaped`}, // a backslash is left alone
	} {
		got := escapeText(c.in)
		if got != c.want {
			t.Errorf("escapeText(%q) = %q, want %q", c.in, got, c.want)
		}
		if again := escapeText(got); again != got {
			t.Errorf("escapeText twice changes %q to %q", got, again)
		}
	}
	if got := escapeLines("a\tb\nc\rd"); got != "a\tb\nc\\rd" {
		t.Errorf("escapeLines: %q", got)
	}
}

func TestShortenEchoes(t *testing.T) {
	t.Parallel()
	long := strings.Repeat("7", 400) + " bar(g)" // above the largest float64
	_, err := units.Parse(long, units.Pressure, units.Options{})
	if err == nil {
		t.Fatal("no error")
	}
	got := message(errors.Join(err))
	want := "number in '" + strings.Repeat("7", 40) + "…' (407 characters) is out of range for a float64"
	if got != want {
		t.Errorf("message = %q, want %q", got, want)
	}
	short := "number in '7 bar(g)' is fine"
	if got := shortenEchoes(short, nil, "7 bar(g)"); got != short {
		t.Errorf("a short echo was cut: %q", got)
	}
	name := `case "` + strings.Repeat("n", 300) + `": sea needs a unit`
	if got := message(errors.New(name)); got != `case "`+strings.Repeat("n", 40)+`…" (300 characters): sea needs a unit` {
		t.Errorf("a long quoted name: %q", got)
	}
}

func TestDropInternal(t *testing.T) {
	t.Parallel()
	for _, c := range []struct{ in, want string }{
		{`s.lua:3: unit "eco": line "feed": water.PH: specific enthalpy 9999 kJ/kg above the IF97 limit`,
			`s.lua:3: unit "eco": line "feed": specific enthalpy 9999 kJ/kg above the IF97 limit`},
		{"water.PX: pressure above the critical pressure", "pressure above the critical pressure"},
		{"scripting: internal error: runtime error: index out of range", "internal error of sim (please report it): runtime error: index out of range"},
		{"the water.PX function is named in prose", "the water.PX function is named in prose"},
	} {
		if got := dropInternal(c.in); got != c.want {
			t.Errorf("dropInternal(%q) = %q, want %q", c.in, got, c.want)
		}
	}
}

// TestControlCharacters runs a script whose names and messages hold
// control characters and checks every output: the table, the CSV and the
// charts show them escaped and no line is forged; the JSON keeps them
// exactly; stderr shows the check() message escaped on one line.
func TestControlCharacters(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	script := filepath.Join(dir, "c.lua")
	src := `local ship = steam_plant {
  name = "Invented\r\nfake plant",
  boilers = { { name = "AB\27[2J1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" } },
  consumers = { { name = "b\r\nfake", steam = "60 kg/h" } },
}
local r = case(ship, { name = "case\r\nfake", sea = "14 C", air = "9 C" })
voyage(ship, { name = "v\r\nfake", rows = { { phase = "p\r\nfake", hours = 2, sea = "14 C", air = "9 C" } } })
check(false, "msg\r\nfake line")
`
	if err := os.WriteFile(script, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	raw := func(what, s string) {
		t.Helper()
		for _, line := range strings.Split(s, "\n") {
			if strings.HasPrefix(line, "fake") {
				t.Errorf("%s: a forged line %q", what, line)
			}
		}
		if i := strings.IndexAny(s, "\r\x1b"); i >= 0 {
			t.Errorf("%s: a raw control character at %d: %q", what, i, s[max(0, i-20):min(len(s), i+20)])
		}
	}
	const failed = `assertion failed: msg\r\nfake line`
	stderrOK := func(what, errOut string) {
		t.Helper()
		raw(what+" stderr", errOut)
		if !strings.HasSuffix(errOut, script+":8: "+failed+"\n") {
			t.Errorf("%s: stderr %q", what, errOut)
		}
	}

	code, out, errOut := runSim(t, "run", "--quiet", script)
	raw("table", out)
	stderrOK("table", errOut)
	for _, s := range []string{"Load case 1 of 1: case\\r\\nfake", `plant "Invented\r\nfake plant"`, `AB\x1b[2J1`, `b\r\nfake`,
		`Voyage: v\r\nfake`, `p\r\nfake`} {
		if !strings.Contains(out, s) {
			t.Errorf("the table does not show %q", s)
		}
	}
	if code != exitFail || strings.Contains(out, `\\r`) {
		t.Errorf("exit %d; escaped twice: %v", code, strings.Contains(out, `\\r`))
	}

	_, out, errOut = runSim(t, "run", "--quiet", "--csv", script)
	raw("csv", out)
	stderrOK("csv", strings.TrimPrefix(errOut, cautionLine+"\n"))
	recs, err := csv.NewReader(strings.NewReader(strings.Split(out, "\n\n")[0])).ReadAll()
	if err != nil || len(recs) != 2 || recs[1][1] != `case\r\nfake` || recs[1][2] != `Invented\r\nfake plant` {
		t.Errorf("csv: %v %q", err, recs)
	}

	_, out, _ = runSim(t, "run", "--quiet", "--json", script)
	var doc struct {
		Cases []struct {
			Name  string `json:"name"`
			Plant string `json:"plant"`
		} `json:"cases"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil || len(doc.Cases) != 1 ||
		doc.Cases[0].Name != "case\r\nfake" || doc.Cases[0].Plant != "Invented\r\nfake plant" {
		t.Errorf("json: %v %+v", err, doc)
	}

	svg := filepath.Join(dir, "c.svg")
	_, _, errOut = runSim(t, "run", "--plot", svg, script)
	for _, f := range []string{"c-cases.svg", "c-voyage-1.svg"} {
		b, err := os.ReadFile(filepath.Join(dir, f))
		if err != nil {
			t.Fatalf("%v (stderr %q)", err, errOut)
		}
		raw(f, string(b))
		if !strings.Contains(string(b), `Invented\r\nfake plant`) {
			t.Errorf("%s does not name the plant escaped", f)
		}
	}
}
