package main

import (
	"bytes"
	"context"
	"errors"
	"os"
	"path/filepath"
	"sort"
	"strings"
	"testing"
)

// listDir returns the names in dir, sorted.
func listDir(t *testing.T, dir string) []string {
	t.Helper()
	entries, err := os.ReadDir(dir)
	if err != nil {
		t.Fatal(err)
	}
	var names []string
	for _, e := range entries {
		names = append(names, e.Name())
	}
	sort.Strings(names)
	return names
}

// TestCommitAllOrNothing checks that the files of a run are replaced
// together or not at all: a write that fails (a full disk) or a rename
// that fails leaves every file as it was, with no temporary file left.
func TestCommitAllOrNothing(t *testing.T) {
	t.Parallel()
	errDiskFull := errors.New("no space left on device")
	for _, c := range []struct {
		name    string
		ops     func(real fileOps) fileOps
		wantErr string // a part of the error; "" for success
	}{
		{"all written", func(real fileOps) fileOps { return real }, ""},
		{"the second write fails", func(real fileOps) fileOps {
			n := 0
			return fileOps{write: func(f *os.File, b []byte) error {
				if n++; n == 2 {
					return errDiskFull
				}
				return real.write(f, b)
			}, rename: real.rename}
		}, "--plot {dir}/d-cases.svg: cannot write: no space left on device; nothing written, the file is as it was"},
		{"the third rename fails", func(real fileOps) fileOps {
			n := 0
			return fileOps{write: real.write, rename: func(from, to string) error {
				if n++; n == 3 {
					return &os.LinkError{Op: "rename", Old: from, New: to, Err: errors.New("input/output error")}
				}
				return real.rename(from, to)
			}}
		}, "--plot {dir}/d-voyage-1.svg: cannot write: input/output error; nothing written"},
	} {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			dir := t.TempDir()
			report, chart, chart2 := filepath.Join(dir, "r.txt"), filepath.Join(dir, "d-cases.svg"), filepath.Join(dir, "d-voyage-1.svg")
			if err := os.WriteFile(report, []byte("old report"), 0o600); err != nil {
				t.Fatal(err)
			}
			if err := os.WriteFile(chart, []byte("old chart"), 0o644); err != nil {
				t.Fatal(err)
			}
			o := &outputs{out: report, plot: filepath.Join(dir, "d.svg"), ops: c.ops(realFileOps())}
			err := o.commit([]pending{
				{"-o", report, []byte("new report")},
				{"--plot", chart, []byte("new chart")},
				{"--plot", chart2, []byte("new chart 2")},
			})
			read := func(name string) string {
				b, err := os.ReadFile(name)
				if err != nil {
					return "(none)"
				}
				return string(b)
			}
			if c.wantErr == "" {
				if err != nil {
					t.Fatal(err)
				}
				if read(report) != "new report" || read(chart) != "new chart" || read(chart2) != "new chart 2" {
					t.Errorf("files %q, %q, %q", read(report), read(chart), read(chart2))
				}
				if st, err := os.Stat(report); err != nil || st.Mode().Perm() != 0o600 {
					t.Errorf("the report's mode is not kept: %v, %v", st.Mode(), err)
				}
				if got := listDir(t, dir); strings.Join(got, " ") != "d-cases.svg d-voyage-1.svg r.txt" {
					t.Errorf("the folder holds %q", got)
				}
				return
			}
			want := strings.ReplaceAll(c.wantErr, "{dir}", dir)
			if err == nil || !strings.Contains(err.Error(), want) {
				t.Fatalf("error %v, want it to contain %q", err, want)
			}
			if read(report) != "old report" || read(chart) != "old chart" || read(chart2) != "(none)" {
				t.Errorf("after a failure the files are %q, %q, %q; want them as they were", read(report), read(chart), read(chart2))
			}
			if got := listDir(t, dir); strings.Join(got, " ") != "d-cases.svg r.txt" {
				t.Errorf("a failed commit left %q", got)
			}
		})
	}
}

// TestOutputKeptOnFailure checks that -o and --plot leave the files that
// are there alone when the run fails before its report: a script error,
// an interrupted run.
func TestOutputKeptOnFailure(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	out, svg := filepath.Join(dir, "r.txt"), filepath.Join(dir, "d.svg")
	for _, f := range []string{out, svg} {
		if err := os.WriteFile(f, []byte("old"), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	check := func(what string) {
		t.Helper()
		for _, f := range []string{out, svg} {
			if b, err := os.ReadFile(f); err != nil || string(b) != "old" {
				t.Errorf("%s: %s is %q, %v; want it as it was", what, f, b, err)
			}
		}
		if got := listDir(t, dir); strings.Join(got, " ") != "d.svg r.txt" {
			t.Errorf("%s: the folder holds %q", what, got)
		}
	}
	code, _, errOut := runSim(t, "run", "--quiet", "-o", out, "--plot", svg, errScript)
	if code != exitFail || !strings.HasPrefix(errOut, errScript+":") {
		t.Errorf("script errors: exit %d, stderr %q", code, errOut)
	}
	check("script errors")

	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	var stdout, stderr bytes.Buffer
	code = run(ctx, []string{"run", "--quiet", "-o", out, "--plot", svg, smallScript}, &stdout, &stderr)
	if code != exitFail || stderr.String() != "sim run: interrupted before the end; no report or chart was written\n" {
		t.Errorf("interrupted: exit %d, stderr %q", code, stderr.String())
	}
	check("interrupted")

	// A run that goes well replaces both.
	code, _, errOut = runSim(t, "run", "--quiet", "-o", out, "--plot", svg, smallScript)
	b1, _ := os.ReadFile(out)
	b2, _ := os.ReadFile(svg)
	if code != exitOK || !bytes.HasPrefix(b1, []byte("Load case 1 of 2")) || !bytes.Contains(b2, []byte("<svg")) {
		t.Errorf("exit %d, stderr %q, -o %q..., --plot %d bytes", code, errOut, b1[:min(20, len(b1))], len(b2))
	}
}

// TestCheckRead checks the files a run may not read: the outputs, and
// every name a chart of --plot could get.
func TestCheckRead(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	names := []string{"r.txt", "d.svg", "d-cases.svg", "d-audit-12.svg", "d-study.svg", "d-cases.png", "plan.csv"}
	for _, n := range names {
		if err := os.WriteFile(filepath.Join(dir, n), nil, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	o := &outputs{out: filepath.Join(dir, "r.txt"), plot: filepath.Join(dir, "d.svg")}
	for _, c := range []struct {
		name    string
		refused bool
	}{
		{"r.txt", true}, {"d.svg", true}, {"d-cases.svg", true}, {"d-audit-12.svg", true},
		{"d-study.svg", false}, // no number: plotFile never writes it
		{"d-cases.png", false}, // another extension
		{"plan.csv", false},
	} {
		st, err := os.Stat(filepath.Join(dir, c.name))
		if err != nil {
			t.Fatal(err)
		}
		if err := o.checkRead(st); (err != nil) != c.refused {
			t.Errorf("checkRead(%s) = %v; refused should be %v", c.name, err, c.refused)
		}
	}
}
