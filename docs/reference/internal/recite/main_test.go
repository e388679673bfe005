package main

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// tree writes a made-up repository: a sheet, a Go file, a Lua file and a
// sheet-side Markdown file that must be left as it is.
func tree(t *testing.T) string {
	t.Helper()
	dir := t.TempDir()
	files := map[string]string{
		"go.mod":                    "module steamcase\n",
		"docs/reference/a-sheet.md": "# A\n## 1. One\n### 1.1 Sub\n\nsee b-sheet.md §2. Also §1.1 here\n",
		"docs/reference/b-sheet.md": "# B\n## 2. Two\n",
		"p/p.go":                    "package p\n\n// Figures of a-sheet.md §1.1 [C], §1;\n// later (§1).\nvar x = []string{\n\t\"a-sheet.md §1\", // one\n\t\"b\",             // two\n}\n",
		"s/s.lua":                   "-- shared/reference/b-sheet.md §2\n",
	}
	for name, s := range files {
		p := filepath.Join(dir, filepath.FromSlash(name))
		if err := os.MkdirAll(filepath.Dir(p), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(p, []byte(s), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	return dir
}

func read(t *testing.T, dir, name string) string {
	t.Helper()
	b, err := os.ReadFile(filepath.Join(dir, filepath.FromSlash(name)))
	if err != nil {
		t.Fatal(err)
	}
	return string(b)
}

func TestDryRun(t *testing.T) {
	t.Parallel()
	dir := tree(t)
	var out, errs bytes.Buffer
	if code := run([]string{"-root", dir}, &out, &errs); code != 0 {
		t.Fatalf("exit %d: %s", code, errs.String())
	}
	for _, want := range []string{
		"p/p.go:3: name: a-sheet.md §1.1 [C]  =>  // Figures of docs/reference/a-sheet.md §1.1 [C], §1;",
		"p/p.go:4: implicit: §1  =>  // later (docs/reference/a-sheet.md §1).",
		`p/p.go:6: name: a-sheet.md §1  =>  "docs/reference/a-sheet.md §1", // one`,
		"s/s.lua:1: shared-path: shared/reference/b-sheet.md §2  =>  -- docs/reference/b-sheet.md §2",
		"6 citations in 4 files scanned",
	} {
		if !strings.Contains(out.String(), want) {
			t.Errorf("output lacks %q:\n%s", want, out.String())
		}
	}
	if got := read(t, dir, "p/p.go"); !strings.Contains(got, "// Figures of a-sheet.md") {
		t.Errorf("a dry run changed p/p.go:\n%s", got)
	}
}

func TestWrite(t *testing.T) {
	t.Parallel()
	dir := tree(t)
	var out, errs bytes.Buffer
	if code := run([]string{"-root", dir, "-w"}, &out, &errs); code != 0 {
		t.Fatalf("exit %d: %s", code, errs.String())
	}
	if !strings.Contains(out.String(), "rewrote 4 citations in 2 files") {
		t.Errorf("summary:\n%s", out.String())
	}
	// The Go file is formatted again: the longer string moves the column
	// of the comments after it.
	wantGo := "package p\n\n// Figures of docs/reference/a-sheet.md §1.1 [C], §1;\n// later (docs/reference/a-sheet.md §1).\nvar x = []string{\n\t\"docs/reference/a-sheet.md §1\", // one\n\t\"b\",                            // two\n}\n"
	if got := read(t, dir, "p/p.go"); got != wantGo {
		t.Errorf("p/p.go:\n%s\nwant:\n%s", got, wantGo)
	}
	if got, want := read(t, dir, "s/s.lua"), "-- docs/reference/b-sheet.md §2\n"; got != want {
		t.Errorf("s/s.lua: %q, want %q", got, want)
	}
	if got, want := read(t, dir, "docs/reference/a-sheet.md"), "# A\n## 1. One\n### 1.1 Sub\n\nsee b-sheet.md §2. Also §1.1 here\n"; got != want {
		t.Errorf("the sheet was changed: %q", got)
	}
	out.Reset()
	if code := run([]string{"-root", dir, "-w"}, &out, &errs); code != 0 {
		t.Fatalf("second run: exit %d: %s", code, errs.String())
	}
	if !strings.Contains(out.String(), "rewrote 0 citations in 0 files") {
		t.Errorf("a second rewrite changed something:\n%s", out.String())
	}
}

func TestUnresolvedReported(t *testing.T) {
	t.Parallel()
	dir := tree(t)
	if err := os.WriteFile(filepath.Join(dir, "p", "q.go"), []byte("package p // a-sheet.md §7\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	var out, errs bytes.Buffer
	if code := run([]string{"-root", dir, "-list"}, &out, &errs); code != 0 {
		t.Fatalf("exit %d: %s", code, errs.String())
	}
	want := `p/q.go:1: "a-sheet.md §7": a-sheet.md has no §7 (its sections: §1, §1.1)`
	if !strings.Contains(out.String(), want) {
		t.Errorf("output lacks %q:\n%s", want, out.String())
	}
}

func TestUsage(t *testing.T) {
	t.Parallel()
	for _, args := range [][]string{{"-nope"}, {"extra"}} {
		var out, errs bytes.Buffer
		if code := run(args, &out, &errs); code != 2 {
			t.Errorf("run(%q) = %d, want 2 (stderr %q)", args, code, errs.String())
		}
	}
	var out, errs bytes.Buffer
	if code := run([]string{"-root", t.TempDir()}, &out, &errs); code != 1 || !strings.Contains(errs.String(), "the sheets") {
		t.Errorf("a root without sheets: exit %d, stderr %q; want 1 and the reason", code, errs.String())
	}
}
