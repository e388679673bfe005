package main

import (
	"bytes"
	"crypto/sha256"
	"encoding/hex"
	"errors"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
	"sort"
	"strconv"

	"steamcase/cmd/sim/internal/report"
	"steamcase/scripting"
)

// evidenceHelp is what sim help run says of --evidence.
const evidenceHelp = `--evidence DIR writes one folder an auditor can file: report.txt (the
report for people), run.json (the JSON document), tables.csv (the CSV
tables), every chart as SVG (for an audit: its band per day with the
claims and flags, its implied factors per day, the distribution of its
period total with the claim marked), samples-audit-N.csv (each sample's
fixed inputs and period total), README.txt (which program read which
files, what each audit checked and how, what it found, and the caution)
and SHA256SUMS (the SHA-256 of every other file). DIR must not exist, or
be empty; the folder is written whole or not at all. The same scripts,
data and seeds give the same bytes on any number of cores.`

// checkEvidenceDir refuses a folder that holds anything: evidence is
// never written over or mixed with other files.
func checkEvidenceDir(dir string) error {
	entries, err := os.ReadDir(dir)
	switch {
	case errors.Is(err, fs.ErrNotExist):
		return nil
	case err != nil:
		var pe *fs.PathError
		if errors.As(err, &pe) {
			return fmt.Errorf("%s: %v", dir, pe.Err)
		}
		return err
	case len(entries) > 0:
		return fmt.Errorf("%s already holds %d entries; name a new or empty folder (evidence is never written over)", dir, len(entries))
	}
	return nil
}

// collectRecord adds to the run's record what a script read and the
// defaults in force on the plants it solved on, each once.
func collectRecord(all *report.Run, r *scripting.Run) {
	all.LuaSeed = r.Seed
	for _, f := range r.Files {
		h := hex.EncodeToString(f.SHA256[:])
		dup := false
		for _, g := range all.Files {
			dup = dup || (g.Name == f.Name && g.SHA256 == h)
		}
		if !dup {
			all.Files = append(all.Files, report.File{Name: f.Name, Bytes: f.Bytes, SHA256: h})
		}
	}
	solved := map[string]bool{}
	for _, c := range r.Cases {
		solved[c.Plant] = solved[c.Plant] || c.Result != nil
	}
	for _, v := range r.Voyages {
		solved[v.Plant] = solved[v.Plant] || v.Result != nil
	}
	for _, s := range r.Studies {
		solved[s.Plant] = solved[s.Plant] || s.Result != nil
	}
	for _, a := range r.Audits {
		solved[a.Plant] = solved[a.Plant] || a.Result != nil
	}
	have := map[string]bool{}
	for _, a := range all.Assumptions {
		have[a.Plant] = true
	}
	for _, p := range r.Plants {
		if !solved[p.Name] || have[p.Name] {
			continue
		}
		have[p.Name] = true
		for _, d := range p.Defaults() {
			all.Assumptions = append(all.Assumptions, report.Assumption{Plant: p.Name, Assumption: d})
		}
	}
}

// evidenceFile is a file of an evidence folder, rendered.
type evidenceFile struct {
	name, what string
	body       []byte
}

// renderEvidence renders every file of the run's evidence folder. The
// JSON is rendered first, with the names exactly as the scripts gave
// them; then the names are escaped in place (escapeRun, as the table, the
// CSV and the charts of the command show them) for the other files.
func renderEvidence(all report.Run) ([]evidenceFile, error) {
	var files []evidenceFile
	add := func(name, what string, render func(b *bytes.Buffer) error) error {
		var b bytes.Buffer
		if err := render(&b); err != nil {
			return fmt.Errorf("--evidence: %s: %w", name, err)
		}
		files = append(files, evidenceFile{name, what, b.Bytes()})
		return nil
	}
	if err := add("run.json", "the report as one JSON document (its keys: go doc steamcase/plant/schema)", func(b *bytes.Buffer) error {
		return report.JSON(b, all)
	}); err != nil {
		return nil, err
	}
	escapeRun(&all, false) // the table quotes the plants' names with %q
	if err := add("report.txt", "the report for people: every case and job, and the run's record", func(b *bytes.Buffer) error {
		return report.Table(b, all)
	}); err != nil {
		return nil, err
	}
	escapePlants(&all)
	if err := add("tables.csv", "the report's tables as CSV (their columns: go doc steamcase/cmd/sim/internal/report CSV)", func(b *bytes.Buffer) error {
		return report.CSV(b, all)
	}); err != nil {
		return nil, err
	}
	whats := map[string]string{
		"cases":         "the load cases' steam demand against the boilers' capacity",
		"voyage":        "a voyage's demand, capacity and fuel against its hours",
		"study":         "a study's fuel saved by variant",
		"audit":         "an audit's band per day, with the claims and the days flagged",
		"audit-implied": "an audit's implied factors per day against their plausible range",
		"audit-period":  "the distribution of an audit's period total, with the claim marked",
	}
	for _, c := range report.Charts(all) {
		name := c.Kind
		if c.N > 0 {
			name += "-" + strconv.Itoa(c.N)
		}
		if err := add(name+".svg", whats[c.Kind], func(b *bytes.Buffer) error { return c.Draw(b, report.SVG) }); err != nil {
			return nil, err
		}
	}
	for i, a := range all.Audits {
		if a.Result == nil {
			continue
		}
		name := fmt.Sprintf("samples-audit-%d.csv", i+1)
		if err := add(name, "each sample of audit \""+a.Name+"\": its fixed inputs and its period total, modelled and as measured", func(b *bytes.Buffer) error {
			return report.AuditSamplesCSV(b, a)
		}); err != nil {
			return nil, err
		}
	}
	// The README lists the files in the order an auditor reads them.
	order := map[string]int{"report.txt": 0, "run.json": 1, "tables.csv": 2}
	listed := make([]report.EvidenceFile, 0, len(files)+2)
	for _, f := range files {
		listed = append(listed, report.EvidenceFile{Name: f.name, What: f.what})
	}
	sort.SliceStable(listed, func(i, j int) bool {
		oi, iok := order[listed[i].Name]
		oj, jok := order[listed[j].Name]
		return iok && (!jok || oi < oj)
	})
	listed = append(listed, report.EvidenceFile{Name: "README.txt", What: "this text"},
		report.EvidenceFile{Name: "SHA256SUMS", What: "the SHA-256 of every other file here"})
	if err := add("README.txt", "", func(b *bytes.Buffer) error { return report.Readme(b, all, listed) }); err != nil {
		return nil, err
	}
	sort.Slice(files, func(i, j int) bool { return files[i].name < files[j].name })
	var sums bytes.Buffer
	for _, f := range files {
		s := sha256.Sum256(f.body)
		fmt.Fprintf(&sums, "%s  %s\n", hex.EncodeToString(s[:]), f.name)
	}
	return append(files, evidenceFile{name: "SHA256SUMS", body: sums.Bytes()}), nil
}

// commitEvidence writes the rendered files into a new folder beside dir,
// which is renamed to dir when whole: the folder is there whole or not at
// all.
func commitEvidence(dir string, files []evidenceFile) error {
	if err := checkEvidenceDir(dir); err != nil {
		return fmt.Errorf("--evidence: %w", err)
	}
	parent := filepath.Dir(filepath.Clean(dir))
	tmp, err := os.MkdirTemp(parent, "."+filepath.Base(dir)+".partial-")
	if err != nil {
		return fmt.Errorf("--evidence: %w", err)
	}
	done := false
	defer func() {
		if !done {
			os.RemoveAll(tmp)
		}
	}()
	for _, f := range files {
		if err := os.WriteFile(filepath.Join(tmp, f.name), f.body, 0o644); err != nil {
			return fmt.Errorf("--evidence: %w", err)
		}
	}
	if err := os.Chmod(tmp, 0o755); err != nil {
		return fmt.Errorf("--evidence: %w", err)
	}
	// An empty folder of that name (checked above) gives way.
	if err := os.Remove(dir); err != nil && !errors.Is(err, fs.ErrNotExist) {
		return fmt.Errorf("--evidence: %w", err)
	}
	if err := os.Rename(tmp, dir); err != nil {
		return fmt.Errorf("--evidence: %w", err)
	}
	done = true
	return nil
}
