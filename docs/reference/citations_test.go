package reference

import (
	"bytes"
	"io/fs"
	"os"
	"path"
	"path/filepath"
	"strings"
	"testing"

	"steamcase/docs/reference/internal/cite"
)

// root returns the repository's root, two folders up from this package,
// after checking that it holds the go.mod of module steamcase.
func root(t *testing.T) string {
	t.Helper()
	r := filepath.Join("..", "..")
	b, err := os.ReadFile(filepath.Join(r, "go.mod"))
	if err != nil || !bytes.HasPrefix(b, []byte("module steamcase\n")) {
		t.Fatalf("%s is not the root of module steamcase (go.mod: %v)", r, err)
	}
	return r
}

func scan(t *testing.T) (map[string]*cite.Sheet, []cite.File) {
	t.Helper()
	sheets, files, err := cite.Scan(root(t))
	if err != nil {
		t.Fatal(err)
	}
	n := 0
	for _, f := range files {
		n += len(f.Citations)
	}
	// A scanner that finds nothing passes everything: the sheets cite each
	// other, so there is always something to find.
	if n == 0 {
		t.Fatalf("no citations found in %d files: the scan is broken", len(files))
	}
	t.Logf("%d citations in %d files", n, len(files))
	return sheets, files
}

// TestCitationsResolve: every citation's sheet is in docs/reference and
// its section, sub-item and quoted words exist there.
func TestCitationsResolve(t *testing.T) {
	t.Parallel()
	sheets, files := scan(t)
	for _, p := range cite.Resolve(sheets, files) {
		t.Error(p)
	}
}

// TestCitationsStrict: every citation outside this folder's Markdown files
// is in the docs/reference/ form, so that a reader finds the sheet from the
// line alone (go run ./docs/reference/internal/recite -w rewrites the older
// forms).
func TestCitationsStrict(t *testing.T) {
	t.Parallel()
	_, files := scan(t)
	for _, p := range cite.Strict(files) {
		t.Error(p)
	}
}

// TestCitationsCanFail runs the same checks on a made-up repository with
// broken citations, and wants each one reported with its file and line.
// The sources are written with $ for the section sign and @ for
// docs/reference/, so that this file holds no citation itself.
func TestCitationsCanFail(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	fix := strings.NewReplacer("$", "\u00a7", "@", cite.Dir)
	write := func(name, s string) {
		p := filepath.Join(dir, filepath.FromSlash(fix.Replace(name)))
		if err := os.MkdirAll(filepath.Dir(p), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(p, []byte(fix.Replace(s)), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	write("go.mod", "module steamcase\n")
	write("@a-sheet.md", "# A\n## 1. One\n| # | x |\n|---|---|\n| 1 | y |\n### 1.1 Sub\n")
	write("p/p.go", "package p\n\n// a-sheet.md $1.1 [C], $1 item 2\n// @a-sheet.md $2\n")
	write("p/x.lua", "-- other-sheet.md $1\n")
	write("@internal/cite/x_test.go", "package cite // a-sheet.md $9: the tooling is not scanned\n")
	sheets, files, err := cite.Scan(dir)
	if err != nil {
		t.Fatal(err)
	}
	var got []string
	for _, p := range cite.Resolve(sheets, files) {
		got = append(got, p.String())
	}
	want := fix.Replace(strings.Join([]string{
		`p/p.go:3: "$1 item 2": a-sheet.md $1 has no table row numbered 2 (cited as "item 2")`,
		`p/p.go:4: "@a-sheet.md $2": a-sheet.md has no $2 (its sections: $1, $1.1)`,
		`p/x.lua:1: "other-sheet.md $1": no sheet other-sheet.md in @`,
	}, "\n"))
	if g := strings.Join(got, "\n"); g != want {
		t.Errorf("problems:\n%s\nwant:\n%s", g, want)
	}
	var strict []string
	for _, p := range cite.Strict(files) {
		strict = append(strict, p.String())
	}
	wantStrict := fix.Replace(strings.Join([]string{
		`p/p.go:3: "a-sheet.md $1.1 [C]": name form; cite it as @a-sheet.md $1.1`,
		`p/p.go:3: "$1 item 2": name form; cite it as @a-sheet.md $1`,
		`p/x.lua:1: "other-sheet.md $1": name form; cite it as @other-sheet.md $1`,
	}, "\n"))
	if g := strings.Join(strict, "\n"); g != wantStrict {
		t.Errorf("strict problems:\n%s\nwant:\n%s", g, wantStrict)
	}
}

// TestTestdataCopies: the packages' copies of the data files agree with
// the files here. A file under a testdata folder with the name of a data
// file here must be the same, byte for byte; the two subsets of
// plant/combustion (named in its testdata/README.md) must be the header and
// rows of the file they were cut from.
func TestTestdataCopies(t *testing.T) {
	t.Parallel()
	r := root(t)
	data := map[string][]byte{}
	ents, err := os.ReadDir(".")
	if err != nil {
		t.Fatal(err)
	}
	for _, e := range ents {
		if path.Ext(e.Name()) == ".csv" {
			b, err := os.ReadFile(e.Name())
			if err != nil {
				t.Fatal(err)
			}
			data[e.Name()] = b
		}
	}
	whole := 0
	err = filepath.WalkDir(r, func(p string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		if d.IsDir() && p != r && strings.HasPrefix(d.Name(), ".") {
			return filepath.SkipDir
		}
		ref, ok := data[d.Name()]
		if !ok || !d.Type().IsRegular() || filepath.Base(filepath.Dir(p)) != "testdata" {
			return nil
		}
		b, err := os.ReadFile(p)
		if err != nil {
			return err
		}
		if !bytes.Equal(b, ref) {
			t.Errorf("%s differs from docs/reference/%s; copy it again, or record the change in both", p, d.Name())
		}
		whole++
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	if whole == 0 {
		t.Error("no testdata copies of the data files found: the walk is broken")
	}

	subsets := []struct{ copy, of string }{
		{"plant/combustion/testdata/nasa7-tm4513.csv", "flue-gas-species-nasa7.csv"},
		{"plant/combustion/testdata/if97-psat.csv", "if97-verification.csv"},
	}
	for _, s := range subsets {
		b, err := os.ReadFile(filepath.Join(r, filepath.FromSlash(s.copy)))
		if err != nil {
			t.Errorf("%v (if the copy moved, update this table)", err)
			continue
		}
		ref := strings.Split(strings.TrimSuffix(string(data[s.of]), "\n"), "\n")
		rows := map[string]bool{}
		for _, l := range ref[1:] {
			rows[l] = true
		}
		lines := strings.Split(strings.TrimSuffix(string(b), "\n"), "\n")
		if lines[0] != ref[0] {
			t.Errorf("%s: header %q, want the header of docs/reference/%s, %q", s.copy, lines[0], s.of, ref[0])
		}
		for i, l := range lines[1:] {
			if !rows[l] {
				t.Errorf("%s:%d: %q is not a row of docs/reference/%s", s.copy, i+2, l, s.of)
			}
		}
	}
}

// TestSheetSections: the sections the parser finds in each sheet are its
// numbered headings, as read off the files by hand (grep '^#' on each).
// The table is keyed by the file names without ".md", so that this file
// cites no sheet and a rewrite leaves it alone.
func TestSheetSections(t *testing.T) {
	t.Parallel()
	want := map[string]string{
		"README":        "1 2 3 4 5 6 7",
		"gas-radiation": "1 1.1 1.2 1.3 1.4 2 3 4 5 6",
		"heat-transfer": "1 1.1 1.2 1.3 2 3 4 5 6 7 8 9",
		"plant-checks":  "0 1 1.1 1.2 1.3 1.4 2 2.1 3 3.1 3.2 3.3 3.4 3.5 3.6 4 5 5.1 5.2 5.3 6 7 8 9 10 11 12",
	}
	sheets, err := cite.LoadSheets(root(t))
	if err != nil {
		t.Fatal(err)
	}
	for name, s := range sheets {
		w, ok := want[strings.TrimSuffix(name, ".md")]
		if !ok {
			t.Errorf("sheet %s is not in this test's table: add its sections", name)
			continue
		}
		if got := strings.Join(s.Sections(), " "); got != w {
			t.Errorf("%s: sections %q, want %q", name, got, w)
		}
	}
	for name := range want {
		if sheets[name+".md"] == nil {
			t.Errorf("sheet %s.md is missing from docs/reference", name)
		}
	}
}
