package scripting

import (
	"bytes"
	"context"
	"errors"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"testing/fstest"
	"time"

	"github.com/rs/zerolog"
)

// The checks below test the loader's behaviour (positions, messages,
// bounds), not computed plant figures; the only figures compared are
// orderings and the script's own inputs read back (common practice, no
// source).

func TestGoodScripts(t *testing.T) {
	t.Parallel()
	tests := []struct {
		file   string
		cases  int
		plants int
		checks int
	}{
		{"two_boilers.lua", 2, 1, 5},
		{"short_form.lua", 1, 1, 5},
		{"sweep.lua", 5, 1, 9},
		{"profile.lua", 3, 1, 3},
		{"loads.lua", 5, 1, 14},
		{"ege_short.lua", 3, 1, 5},
		{"ege_full.lua", 2, 1, 4},
		{"voyage.lua", 5, 1, 6},
		{"study.lua", 0, 1, 6},
		{"audit.lua", 0, 1, 5},
		{"observation_tank.lua", 1, 1, 1},
		{"contingency.lua", 2, 1, 7},
		{"realism.lua", 2, 1, 3},
	}
	for _, tc := range tests {
		for _, checkOnly := range []bool{false, true} {
			name := tc.file
			if checkOnly {
				name += "/check"
			}
			t.Run(name, func(t *testing.T) {
				t.Parallel()
				var log bytes.Buffer
				opt := Options{Logger: zerolog.New(&log), CheckOnly: checkOnly}
				run, err := RunFile(context.Background(), filepath.Join("testdata", "good", tc.file), opt)
				if err != nil {
					t.Fatalf("unexpected error: %v", err)
				}
				if len(run.Cases) != tc.cases || len(run.Plants) != tc.plants {
					t.Errorf("got %d cases and %d plants; want %d and %d", len(run.Cases), len(run.Plants), tc.cases, tc.plants)
				}
				if run.Checks != tc.checks {
					t.Errorf("got %d checks; want %d", run.Checks, tc.checks)
				}
				for _, c := range run.Cases {
					if !strings.HasPrefix(c.Pos.String(), filepath.Join("testdata", "good")) || c.Pos.Line == 0 {
						t.Errorf("case position %q does not name the script line", c.Pos)
					}
					if checkOnly != (c.Result == nil) {
						t.Errorf("check mode %v but result %v", checkOnly, c.Result)
					}
					if c.Result != nil && !c.Result.Converged {
						t.Errorf("case %q did not converge", c.Result.Name)
					}
				}
			})
		}
	}
}

// TestFormsAgree builds one plant in the full-graph and the short form and
// compares the solved fuel: the two forms must give the same plant.
func TestFormsAgree(t *testing.T) {
	t.Parallel()
	short := `
local ship = steam_plant { name = "short",
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "84 %", turndown = 4 },
              { name = "AB2", mcr = "4 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "84 %", turndown = 4 } },
  hotwell = { heat_loss = "5 kW" },
  consumers = { { name = "heating", duty = "1.5 MW", subcool = "10 K", returns = "90 %", return_T = "80 C" } } }
return case(ship, { name = "c", sea = "10 C", air = "5 C" })`
	full := `
local ship = plant { name = "full" }
ship:makeup { name = "makeup" }
ship:feed_tank { name = "hotwell", heat_loss = "5 kW" }
ship:feed_pump { name = "feed pump", boilers = { "AB1", "AB2" }, margin = "3 bar", eta = "45 %" }
ship:header { name = "feed header" }
ship:boiler { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "84 %", turndown = 4 }
ship:boiler { name = "AB2", mcr = "4 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "84 %", turndown = 4 }
ship:header { name = "main" }
ship:consumer { name = "heating", duty = "1.5 MW", subcool = "10 K", returns = "90 %", return_T = "80 C" }
ship:line("makeup", "makeup", "hotwell")
ship:line("suction", "hotwell", "feed pump")
ship:line("discharge", "feed pump", "feed header")
ship:line("f1", "feed header", "AB1")
ship:line("f2", "feed header", "AB2")
ship:line("s1", "AB1", "main")
ship:line("s2", "AB2", "main")
ship:line("h", "main", "heating")
ship:line("r", "heating", "hotwell")
return case(ship, { name = "c", sea = "10 C", air = "5 C" })`
	var fuel [2]float64
	for i, src := range []string{short, full} {
		run, err := RunSource(context.Background(), "forms.lua", []byte(src), nil, Options{})
		if err != nil {
			t.Fatalf("form %d: %v", i, err)
		}
		fuel[i] = run.Cases[0].Result.FuelKgS
	}
	// The equations are the same but ordered differently: equal to the
	// solver's tolerance, 1e-9 relative (common practice, no source).
	if fuel[0] <= 0 || math.Abs(fuel[0]-fuel[1]) > 1e-9*fuel[0] {
		t.Errorf("short form burns %g kg/s, full graph %g kg/s; want equal and positive", fuel[0], fuel[1])
	}
}

func TestBadScripts(t *testing.T) {
	t.Parallel()
	bad := filepath.Join("testdata", "bad")
	at := func(name string, line int) string {
		return filepath.Join(bad, name) + ":" + itoa(line) + ":"
	}
	tests := []struct {
		file string
		want []string // substrings of the error, in order of appearance
		kind string   // "list", "assert", "timeout", "memory"
		opt  Options
	}{
		{file: "syntax.lua", kind: "list", want: []string{at("syntax.lua", 3) + "13: syntax error near '='"}},
		{file: "bare_number.lua", kind: "list", want: []string{at("bare_number.lua", 2) + ` boiler "AB1": mcr needs a unit, such as '18 t/h'; got 20`}},
		{file: "unknown_unit.lua", kind: "list", want: []string{at("unknown_unit.lua", 2) + ` consumer "galley": duty: unknown unit 'kWatt'`}},
		{file: "misspelt_key.lua", kind: "list", want: []string{at("misspelt_key.lua", 2) + ` boiler "AB1": unknown key 'mrc'; did you mean 'mcr'? (accepted: name, mcr, drum,`}},
		{file: "misspelt_line.lua", kind: "list", want: []string{
			at("misspelt_line.lua", 11) + ` line "steam": to "mian.in": plant "lines" has no unit "mian"; did you mean "main"?`,
			at("misspelt_line.lua", 12) + ` line "to galley": to "galley.inn": the heat consumer "galley" has no port "inn"; did you mean "galley.in"?`}},
		{file: "case_errors.lua", kind: "list", want: []string{
			at("case_errors.lua", 2) + ` case "port": sea needs a unit, such as '170 C'; got 12`,
			`has no unit "galey"; did you mean "galley"?`,
			`set.galley: unknown key 'dutty'; did you mean 'duty'?`,
			`fire: "AB3" is not a boiler of the plant; did you mean "AB1"?`}},
		{file: "many_errors.lua", kind: "list", want: []string{
			"5 errors:",
			at("many_errors.lua", 3) + ` makeup "makeup": T needs a unit`,
			at("many_errors.lua", 4) + ` feed tank "hotwell": unknown key 'heat_los'; did you mean 'heat_loss'?`,
			at("many_errors.lua", 5) + ` boiler "AB1": drum: pressure '7 bar' is ambiguous`,
			`fuel "HSF0" is not a built-in grade; did you mean "HSFO"?`,
			at("many_errors.lua", 8) + ` line "bad": from "AB1.stem"`}},
		{file: "graph_fault.lua", kind: "list", want: []string{at("graph_fault.lua", 3) + ` unit "hotwell": outlet "out" is not connected`}},
		{file: "loads_errors.lua", kind: "list", want: []string{
			"3 errors:",
			// each entry of the short form at the line of its own table
			at("loads_errors.lua", 5) + ` tank heating "COT 1": boundaries[1].beyond must be "sea", "air" or "space"; got "see"`,
			at("loads_errors.lua", 7) + ` consumer "acc": unknown consumer kind "acommodation"; did you mean "accommodation"?`,
			at("loads_errors.lua", 8) + ` fuel heater "FO heater": flow needs a unit, such as '18 t/h'; got 2.5`}},
		{file: "loads_no_sea.lua", kind: "list", want: []string{
			at("loads_no_sea.lua", 5) + ` unit "COT 1": needs the case's sea temperature: give sea = "12 C" in the case (solving case "no sea" at ` + filepath.Join(bad, "loads_no_sea.lua") + ":9)"}},
		{file: "huge_table.lua", kind: "list", want: []string{at("huge_table.lua", 6) + " boiler: table has more than 1000 entries"}},
		{file: "include_parent.lua", kind: "list", want: []string{at("include_parent.lua", 1) + ` include("../good/plant_tanker.lua"): '..' is not allowed`}},
		{file: "read_abs.lua", kind: "list", want: []string{at("read_abs.lua", 1) + ` read_csv("/etc/passwd"): absolute paths are not allowed`}},
		{file: "sandbox.lua", kind: "list", want: []string{at("sandbox.lua", 8) + " attempt to call a non-function object"}},
		{file: "assertion.lua", kind: "assert", want: []string{at("assertion.lua", 4) + " assertion failed: one boiler must carry port stay"}},
		{file: "endless.lua", kind: "timeout", opt: Options{Timeout: 200 * time.Millisecond},
			want: []string{filepath.Join(bad, "endless.lua") + ":", "script stopped: it ran longer than its time limit of 200ms"}},
		{file: "memory.lua", kind: "memory", opt: Options{Timeout: 20 * time.Second, MaxMemory: 64 << 20},
			want: []string{"script stopped: it used more than 64 MiB of memory"}},
	}
	for _, tc := range tests {
		t.Run(tc.file, func(t *testing.T) {
			if tc.kind != "memory" {
				t.Parallel() // the memory limit is on the process heap
			}
			start := time.Now()
			_, err := RunFile(context.Background(), filepath.Join(bad, tc.file), tc.opt)
			if err == nil {
				t.Fatalf("no error; want %q", tc.want)
			}
			msg := err.Error()
			rest := msg
			for _, w := range tc.want {
				i := strings.Index(rest, w)
				if i < 0 {
					t.Fatalf("error\n%s\ndoes not contain (in order)\n%s", msg, w)
				}
				rest = rest[i+len(w):]
			}
			var (
				list ErrorList
				ae   *AssertionError
				te   *TimeoutError
			)
			switch tc.kind {
			case "list":
				if !errors.As(err, &list) {
					t.Errorf("error is a %T; want an ErrorList", err)
				}
			case "assert":
				if !errors.As(err, &ae) || ae.Pos.Line != 4 {
					t.Errorf("error is %T %+v; want an *AssertionError at line 4", err, ae)
				}
			case "timeout", "memory":
				if !errors.As(err, &te) || te.Abandoned {
					t.Fatalf("error is %T %+v; want a *TimeoutError that stopped the interpreter", err, te)
				}
				if tc.kind == "memory" && te.Memory == 0 || tc.kind == "timeout" && te.Memory != 0 {
					t.Errorf("timeout %+v is of the wrong kind", te)
				}
				if d := time.Since(start); d > tc.opt.Timeout+grace {
					t.Errorf("stopping took %v", d)
				}
			}
		})
	}
}

func itoa(n int) string { return strconv.Itoa(n) }

// TestSymlinkOut checks that a link inside the script's folder cannot
// lead read_csv or include outside it (os.Root).
func TestSymlinkOut(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	outside := filepath.Join(t.TempDir(), "secret.csv")
	if err := os.WriteFile(outside, []byte("a,b\n1,2\n"), 0o600); err != nil {
		t.Fatal(err)
	}
	if err := os.Symlink(outside, filepath.Join(dir, "link.csv")); err != nil {
		t.Skipf("no symbolic links here: %v", err)
	}
	script := filepath.Join(dir, "s.lua")
	if err := os.WriteFile(script, []byte(`local rows = read_csv("link.csv")`+"\n"), 0o600); err != nil {
		t.Fatal(err)
	}
	_, err := RunFile(context.Background(), script, Options{})
	if err == nil || !strings.Contains(err.Error(), `s.lua:1: read_csv("link.csv")`) {
		t.Errorf("got %v; want an error at s.lua:1 refusing the link", err)
	}
}

// TestRunSourceFS runs an embedded-style script whose include and read_csv
// go through an fs.FS, with positions naming the files in it.
func TestRunSourceFS(t *testing.T) {
	t.Parallel()
	fsys := fstest.MapFS{
		"demo/plant.lua": {Data: []byte(`return steam_plant { name = "demo",
  boilers = { { name = "AB1", mcr = "2 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "85 %" } },
  consumers = { { name = "galley", duty = "40 kW" } } }`)},
		"demo/data/p.csv": {Data: []byte("duty\n40 kW\n80 kW\n")},
		"secret.csv":      {Data: []byte("x\n1\n")},
	}
	src := []byte(`local ship = include("plant.lua")
for _, row in ipairs(read_csv("data/p.csv")) do
  local r = case(ship, { name = row.duty, sea = "10 C", air = "10 C", set = { galley = { duty = row.duty } } })
  check(r.converged, "converged")
end
check(false, "stop here")`)
	run, err := RunSource(context.Background(), "demo/main.lua", src, fsys, Options{})
	var ae *AssertionError
	if !errors.As(err, &ae) || ae.Pos.String() != "demo/main.lua:6" {
		t.Fatalf("got %v; want the assertion at demo/main.lua:6", err)
	}
	if len(run.Cases) != 2 {
		t.Errorf("got %d cases; want 2", len(run.Cases))
	}
	_, err = RunSource(context.Background(), "demo/main.lua", []byte(`read_csv("../secret.csv")`), fsys, Options{})
	if err == nil || !strings.Contains(err.Error(), "demo/main.lua:1:") {
		t.Errorf("got %v; want the escape refused at demo/main.lua:1", err)
	}
	_, err = RunSource(context.Background(), "demo/main.lua", []byte(`include("plant.lua")
include("nothere.lua")`), fsys, Options{})
	if err == nil || !strings.Contains(err.Error(), `demo/main.lua:2: include("nothere.lua"): no such file beside the script`) {
		t.Errorf("got %v", err)
	}
}

// TestIncludedErrorsNameTheirFile checks that errors in an included file
// (syntax, unit, runtime) name that file and line.
func TestIncludedErrorsNameTheirFile(t *testing.T) {
	t.Parallel()
	tests := []struct {
		inc, want string
	}{
		{"local x = \n\n)", "lib/inc.lua:3:1: syntax error"},
		{"local p = plant { name = 'x' }\np:header { name = 'h', heat_loss = 5 }", `lib/inc.lua:2: header "h": heat_loss needs a unit`},
		{"\nlocal y = nil + 1", "lib/inc.lua:2: "},
		{"return include('inc.lua')", "lib/inc.lua:1: include(\"inc.lua\"): lib/inc.lua is already being included (a cycle)"},
	}
	for _, tc := range tests {
		fsys := fstest.MapFS{"lib/inc.lua": {Data: []byte(tc.inc)}}
		_, err := RunSource(context.Background(), "main.lua", []byte(`include("lib/inc.lua")`), fsys, Options{})
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("include of %q: got %v; want %q", tc.inc, err, tc.want)
		}
	}
}

func TestSandboxLimits(t *testing.T) {
	t.Parallel()
	tests := []struct {
		src, want string
	}{
		{`local s = string.rep("x", 1e9)`, "main.lua:1: string.rep: the result would exceed"},
		{`local s = ("x"):rep(1e9)`, "main.lua:1: string.rep: the result would exceed"},
		{`local function f() return f() + 1 end f()`, "main.lua:1: stack overflow"},
		{`print(os.time())`, "main.lua:1: attempt to index a non-table object(nil)"},
		{`local f = io.open("/etc/passwd")`, "main.lua:1: attempt to index a non-table object(nil)"},
		{`local d = debug.getinfo(1)`, "main.lua:1: attempt to index a non-table object(nil)"},
		{`string.dump(print)`, "main.lua:1: attempt to call a non-function object"},
		{`loadstring("x=1")()`, "main.lua:1: attempt to call a non-function object"},
		{`local t = {} for i = 1, 300 do t[i] = { tostring(i), "85 %" } end
		  local p = plant { name = "x" }
		  p:boiler { name = "b", mcr = "1 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = t }`, "main.lua:3: boiler \"b\": efficiency table needs 1 to 200"},
		{`while true do pcall(function() while true do end end) end`, "time limit"},
		{`local x = unpack({}, 1, 1e8)`, "main.lua:1: unpack: 100000000 values are more than 10000"},
		{`string.find(string.rep("a", 1e5), ".-.-b")`, "main.lua:1: string.find: a pattern with 2 repetitions on 100000 bytes may take too long"},
		{`string.gsub(string.rep("a", 1e5), "a", "b")`, "main.lua:1: string.gsub: 100000 bytes with a pattern of 0 repetitions may take too long"},
		{`local p = plant { name = "x" } p:boilr { name = "b" }`, "main.lua:1: plant \"x\": no unit kind or method 'boilr'; did you mean 'boiler'?"},
	}
	for _, tc := range tests {
		_, err := RunSource(context.Background(), "main.lua", []byte(tc.src), nil, Options{Timeout: 300 * time.Millisecond})
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s\ngot %v\nwant %q", tc.src, err, tc.want)
		}
	}
}

func TestPrintAndRandom(t *testing.T) {
	t.Parallel()
	src := []byte(`print("a", 1, true) ; x = math.random() ; y = math.random(6) ; z = math.random(10, 20)
check(x >= 0 and x < 1 and y >= 1 and y <= 6 and z >= 10 and z <= 20, "ranges")
print(x, y, z)`)
	var first string
	for i := 0; i < 2; i++ {
		var log bytes.Buffer
		if _, err := RunSource(context.Background(), "p.lua", src, nil, Options{Logger: zerolog.New(&log), Seed: 7}); err != nil {
			t.Fatal(err)
		}
		if !strings.Contains(log.String(), `"pos":"p.lua:1","message":"a\t1\ttrue"`) {
			t.Errorf("print record missing: %s", log.String())
		}
		if i == 0 {
			first = log.String()
		} else if log.String() != first {
			t.Errorf("same seed, different numbers:\n%s\n%s", first, log.String())
		}
	}
}

func TestCancelledContext(t *testing.T) {
	t.Parallel()
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	_, err := RunSource(ctx, "c.lua", []byte("while true do end"), nil, Options{})
	if !errors.Is(err, context.Canceled) {
		t.Errorf("got %v; want context.Canceled", err)
	}
}

// TestCheckModeListsAll checks that check mode reports errors of keys,
// units, lines and the graph of a script together, in line order.
func TestCheckModeListsAll(t *testing.T) {
	t.Parallel()
	src := []byte(`local ship = plant { name = "check" }
ship:makeup    { name = "makeup", T = "15 C" }
ship:feed_tank { name = "hotwell", heat_loss = 5 }
ship:boiler    { name = "AB1", mcr = "5 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "85 %" }
ship:header    { name = "main" }
ship:line("makeup", "makeup", "hotwell")
ship:line("steam", "AB1", "mian")
local r = case(ship, { name = "port", sea = "12 C", air = "5 C" })
check(r.fuel_kg_h == 1, "not evaluated in check mode")
`)
	run, err := RunSource(context.Background(), "c.lua", src, nil, Options{CheckOnly: true})
	var list ErrorList
	if !errors.As(err, &list) {
		t.Fatalf("got %v; want an ErrorList", err)
	}
	want := []string{
		`c.lua:3: feed tank "hotwell": heat_loss needs a unit`,
		`c.lua:4: unit "AB1": inlet "feed" is not connected`,
		`c.lua:7: line "steam": to: plant "check" has no unit "mian"; did you mean "main"?`,
	}
	if len(list) != len(want) {
		t.Fatalf("got %d errors; want %d:\n%v", len(list), len(want), err)
	}
	for i, w := range want {
		if !strings.HasPrefix(list[i].Error(), w) {
			t.Errorf("error %d is\n%s\nwant prefix\n%s", i, list[i], w)
		}
	}
	if len(run.Cases) != 1 || run.Cases[0].Result != nil || run.Checks != 1 {
		t.Errorf("check mode run: %+v", run)
	}
}
