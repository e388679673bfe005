package main

import (
	"bytes"
	"crypto/sha256"
	"encoding/hex"
	"encoding/json"
	"os"
	"path/filepath"
	"runtime"
	"sort"
	"strings"
	"testing"
)

// evidenceScript writes a short audit of the invented tanker (the
// scenarios' plant) into a new folder and returns the script's path.
func evidenceScript(t *testing.T) string {
	t.Helper()
	dir := t.TempDir()
	plant, err := os.ReadFile(filepath.Join("..", "..", "scenarios", "tanker_plant.lua"))
	if err != nil {
		t.Fatal(err)
	}
	files := map[string]string{
		"tanker_plant.lua": string(plant),
		"log.csv": `date,phase,sea,air,engine,claimed,reference,cargo heating.off,AB1.fuel
2026-02-01,at anchor,12 C,5 C,0 %,1.52 t,true,true,
2026-02-02,loaded passage,11 C,3 C,78 %,9.0 t,,,
2026-02-03,loaded passage,10 C,1 C,78 %,12.5 t,,,
2026-02-04,loaded passage ECA,10 C,2 C,78 %,8.9 t,,,MGO
`,
		"audit.lua": `local ship = include("tanker_plant.lua")
audit(ship, { name = "February", csv = "log.csv",
  uncertain = {
    { unit = "cargo heating", key = "factor", low = 0.85, high = 1.15 },
    { unit = "AB1", key = "eta_factor", low = 0.96, high = 1.02 },
    { unit = "AB2", key = "eta_factor", low = 0.96, high = 1.02 },
    { key = "sea", low = "-1 K", high = "1 K" } },
  claim = { source = "flow meter" },
  calibrate = { units = { "AB1", "AB2" }, key = "eta_factor", off = { "cargo heating" } },
  implied = { { unit = "cargo heating", key = "factor" } },
  split = { { name = "cargo heating", units = { "cargo heating" } } },
  samples = 200, seed = 3 })
`,
	}
	for name, body := range files {
		if err := os.WriteFile(filepath.Join(dir, name), []byte(body), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	return filepath.Join(dir, "audit.lua")
}

// readDir reads every file of a folder.
func readDir(t *testing.T, dir string) map[string][]byte {
	t.Helper()
	entries, err := os.ReadDir(dir)
	if err != nil {
		t.Fatal(err)
	}
	out := map[string][]byte{}
	for _, e := range entries {
		b, err := os.ReadFile(filepath.Join(dir, e.Name()))
		if err != nil {
			t.Fatal(err)
		}
		out[e.Name()] = b
	}
	return out
}

// TestEvidence writes an evidence folder and checks what it holds: every
// file named, SHA256SUMS and the files read recomputed with
// crypto/sha256, the README's account and caution; and the same bytes on
// one core and on four. Not parallel: it sets GOMAXPROCS.
func TestEvidence(t *testing.T) {
	script := evidenceScript(t)
	var folders [2]map[string][]byte
	for i, procs := range []int{1, 4} {
		old := runtime.GOMAXPROCS(procs)
		dir := filepath.Join(t.TempDir(), "evidence")
		code, _, errOut := runSim(t, "run", "--quiet", "--timeout", "2m", "--evidence", dir, script)
		runtime.GOMAXPROCS(old)
		if code != exitOK {
			t.Fatalf("sim run --evidence: exit %d: %s", code, errOut)
		}
		folders[i] = readDir(t, dir)
	}
	got := folders[0]
	var names []string
	for n := range got {
		names = append(names, n)
	}
	sort.Strings(names)
	want := []string{"README.txt", "SHA256SUMS", "audit-1.svg", "audit-implied-1.svg", "audit-period-1.svg",
		"report.txt", "run.json", "samples-audit-1.csv", "tables.csv"}
	if strings.Join(names, " ") != strings.Join(want, " ") {
		t.Fatalf("the folder holds %q; want %q", names, want)
	}
	for _, n := range names {
		if !bytes.Equal(got[n], folders[1][n]) {
			t.Errorf("%s differs between one core and four", n)
		}
	}
	// SHA256SUMS: one line per other file, "hex  name", sorted.
	lines := strings.Split(strings.TrimSpace(string(got["SHA256SUMS"])), "\n")
	if len(lines) != len(names)-1 {
		t.Errorf("SHA256SUMS has %d lines for %d files", len(lines), len(names)-1)
	}
	for _, l := range lines {
		sum, name, ok := strings.Cut(l, "  ")
		b, found := got[name]
		s := sha256.Sum256(b)
		if !ok || !found || sum != hex.EncodeToString(s[:]) {
			t.Errorf("SHA256SUMS line %q: the file's SHA-256 is %x", l, s)
		}
	}
	// The files read, in run.json, are the script, its include and its CSV.
	var doc struct {
		Version   string `json:"version"`
		FilesRead []struct {
			File   string `json:"file"`
			Bytes  int    `json:"bytes"`
			SHA256 string `json:"sha256"`
		} `json:"files_read"`
		Assumptions []struct {
			Unit, Key, Source string
		} `json:"assumptions"`
	}
	if err := json.Unmarshal(got["run.json"], &doc); err != nil {
		t.Fatal(err)
	}
	if len(doc.FilesRead) != 3 || doc.Version != version() || len(doc.Assumptions) == 0 {
		t.Fatalf("run.json: version %q, files read %+v, %d assumptions", doc.Version, doc.FilesRead, len(doc.Assumptions))
	}
	for _, f := range doc.FilesRead {
		b, err := os.ReadFile(f.File)
		if err != nil {
			t.Fatal(err)
		}
		s := sha256.Sum256(b)
		if f.SHA256 != hex.EncodeToString(s[:]) || f.Bytes != len(b) {
			t.Errorf("%s: recorded %s; its SHA-256 is %x", f.File, f.SHA256, s)
		}
	}
	readme := string(got["README.txt"])
	for _, s := range []string{"Program: steamcase " + version(), `Audit "February"`, "What was checked and how:",
		"Fixed inputs, drawn once per sample for the whole period: cargo heating.factor", "Daily inputs, drawn afresh for each day: the sea reading",
		"Bonferroni", "Brent's method", "What it found:", "samples-audit-1.csv", cautionLine} {
		if !strings.Contains(readme, s) {
			t.Errorf("README.txt does not say %q", s)
		}
	}
	if !strings.Contains(string(got["report.txt"]), "Run record") || !strings.Contains(string(got["samples-audit-1.csv"]), "sample,cargo heating.factor,AB1.eta_factor,AB2.eta_factor,model_total_t,reading_total_t") {
		t.Errorf("report.txt or samples-audit-1.csv lacks its record or header")
	}
}

// TestEvidenceRefusesFullFolder: evidence is never written over.
func TestEvidenceRefusesFullFolder(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	if err := os.WriteFile(filepath.Join(dir, "old.txt"), []byte("x"), 0o644); err != nil {
		t.Fatal(err)
	}
	code, _, errOut := runSim(t, "run", "--evidence", dir, filepath.Join("testdata", "run", "small.lua"))
	if code != exitUsage || !strings.Contains(errOut, "--evidence: "+dir+" already holds 1 entries") {
		t.Errorf("exit %d: %s", code, errOut)
	}
	// An empty folder is taken.
	empty := t.TempDir()
	code, _, errOut = runSim(t, "run", "--quiet", "--evidence", empty, filepath.Join("testdata", "run", "small.lua"))
	if code != exitOK {
		t.Fatalf("an empty folder: exit %d: %s", code, errOut)
	}
	if _, err := os.Stat(filepath.Join(empty, "SHA256SUMS")); err != nil {
		t.Errorf("nothing written to the empty folder: %v", err)
	}
}

// TestEvidenceEscapes: a name with control characters is escaped in the
// folder's text files, and kept exactly in its JSON (as the command's own
// outputs do).
func TestEvidenceEscapes(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	script := filepath.Join(dir, "c.lua")
	src := `local ship = steam_plant { name = "Invented\r\nfake plant",
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" } },
  consumers = { { name = "load", steam = "600 kg/h" } } }
audit(ship, { name = "a\r\nfake", samples = 10, days = { { date = "d\r\n1", claimed = "1 t", sea = "10 C", air = "5 C" } } })
`
	if err := os.WriteFile(script, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	out := filepath.Join(dir, "ev")
	if code, _, errOut := runSim(t, "run", "--quiet", "--evidence", out, script); code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	files := readDir(t, out)
	for name, b := range files {
		if name == "run.json" {
			continue
		}
		if i := bytes.IndexAny(b, "\r\x1b"); i >= 0 {
			t.Errorf("%s: a raw control character at %d", name, i)
		}
		if bytes.Contains(b, []byte(`\\r`)) {
			t.Errorf("%s: a name escaped twice", name)
		}
	}
	if !bytes.Contains(files["run.json"], []byte(`"name": "a\r\nfake"`)) || !bytes.Contains(files["report.txt"], []byte(`Audit: a\r\nfake`)) {
		t.Errorf("the JSON does not keep the name exactly, or the table does not escape it")
	}
}
