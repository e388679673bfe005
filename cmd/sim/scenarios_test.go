package main

import (
	"bytes"
	"context"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestScenarioReports runs every scenario script of the invented fleet
// through "sim run" and compares its whole report (the table people read)
// with a golden file in testdata/scenarios (go test ./cmd/sim -update
// rewrites them; read the diff). The figures are the engine's own: the
// golden files guard against unintended change; the checks against
// outside sources are in the packages' own tests and in the scripts'
// check() calls.
func TestScenarioReports(t *testing.T) {
	dir := filepath.Join("..", "..", "scenarios")
	scripts, err := filepath.Glob(filepath.Join(dir, "*.lua"))
	if err != nil {
		t.Fatal(err)
	}
	n := 0
	for _, s := range scripts {
		if strings.HasSuffix(s, "_plant.lua") {
			continue
		}
		n++
		name := strings.TrimSuffix(filepath.Base(s), ".lua")
		t.Run(name, func(t *testing.T) {
			var out, errOut bytes.Buffer
			code := run(context.Background(), []string{"run", "--quiet", "--timeout", "2m", s}, &out, &errOut)
			if code != 0 {
				t.Fatalf("sim run %s: exit %d: %s", s, code, errOut.String())
			}
			golden := filepath.Join("testdata", "scenarios", name+".golden")
			if *update {
				if err := os.MkdirAll(filepath.Dir(golden), 0o755); err != nil {
					t.Fatal(err)
				}
				if err := os.WriteFile(golden, out.Bytes(), 0o644); err != nil {
					t.Fatal(err)
				}
				return
			}
			want, err := os.ReadFile(golden)
			if err != nil {
				t.Fatalf("%v (go test ./cmd/sim -run ScenarioReports -update creates it)", err)
			}
			if got := out.String(); got != string(want) {
				t.Errorf("report of %s differs from %s; rerun with -update and read the diff", s, golden)
			}
		})
	}
	if n < 6 {
		t.Errorf("found %d scenario scripts, want at least 6", n)
	}
}

// TestScenarioDocumentsFinite: every scenario's JSON document and CSV
// tables are written (encoding/json refuses a NaN or an infinity), and no
// figure in them, nor in the table, is one (issue 17: no report can hold
// Inf or NaN).
func TestScenarioDocumentsFinite(t *testing.T) {
	t.Parallel()
	scripts, err := filepath.Glob(filepath.Join("..", "..", "scenarios", "*.lua"))
	if err != nil {
		t.Fatal(err)
	}
	for _, s := range scripts {
		if strings.HasSuffix(s, "_plant.lua") {
			continue
		}
		s := s
		t.Run(filepath.Base(s), func(t *testing.T) {
			t.Parallel()
			for _, form := range [][]string{{"--json"}, {"--csv"}, nil} {
				var out, errOut bytes.Buffer
				args := append(append([]string{"run", "--quiet", "--timeout", "2m"}, form...), s)
				if code := run(context.Background(), args, &out, &errOut); code != 0 {
					t.Fatalf("sim %q: exit %d: %s", args, code, errOut.String())
				}
				text := out.String()
				for _, bad := range []string{"NaN", "+Inf", "-Inf", "Infinity"} {
					if strings.Contains(text, bad) {
						t.Errorf("sim %q writes %q", args, bad)
					}
				}
				if form != nil && form[0] == "--json" {
					var doc any
					if err := json.Unmarshal(out.Bytes(), &doc); err != nil {
						t.Errorf("sim %q: not one JSON document: %v", args, err)
					}
				}
			}
		})
	}
}
