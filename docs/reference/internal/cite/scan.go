package cite

import (
	"fmt"
	"io/fs"
	"os"
	"path"
	"path/filepath"
	"sort"
	"strings"
)

// File is a scanned file and its citations.
type File struct {
	Path      string // slash-separated, relative to the root
	Src       []byte
	Citations []Citation
	// InSheets is set for the Markdown files of docs/reference (the sheets
	// and the README): they are scanned without implicit citations, and
	// their cross-references keep the form they were copied with.
	InSheets bool
}

// LoadSheets reads the sheets of root/docs/reference: every .md file there.
func LoadSheets(root string) (map[string]*Sheet, error) {
	dir := filepath.Join(root, filepath.FromSlash(Dir))
	ents, err := os.ReadDir(dir)
	if err != nil {
		return nil, fmt.Errorf("cite: the sheets: %w", err)
	}
	sheets := map[string]*Sheet{}
	for _, e := range ents {
		if e.Type().IsRegular() && path.Ext(e.Name()) == ".md" {
			src, err := os.ReadFile(filepath.Join(dir, e.Name()))
			if err != nil {
				return nil, fmt.Errorf("cite: %w", err)
			}
			sheets[e.Name()] = ParseSheet(e.Name(), src)
		}
	}
	if len(sheets) == 0 {
		return nil, fmt.Errorf("cite: no sheets (.md files) in %s", dir)
	}
	return sheets, nil
}

// Scan reads the sheets (LoadSheets) and every .go, .md and .lua file
// under root, and extracts each file's citations with the sheets as the
// known ones. It skips folders whose name starts with ".", symbolic links
// (nothing outside root is read), and docs/reference/internal/, the tooling
// itself, whose sources and tests quote every form of citation, right and
// wrong.
func Scan(root string) (map[string]*Sheet, []File, error) {
	sheets, err := LoadSheets(root)
	if err != nil {
		return nil, nil, err
	}
	names := make([]string, 0, len(sheets))
	for n := range sheets {
		names = append(names, n)
	}
	sort.Strings(names)
	var files []File
	err = filepath.WalkDir(root, func(p string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		if d.IsDir() {
			if p != root && strings.HasPrefix(d.Name(), ".") {
				return filepath.SkipDir
			}
			if rel, err := filepath.Rel(root, p); err == nil && filepath.ToSlash(rel)+"/" == Dir+"internal/" {
				return filepath.SkipDir // the tooling quotes every form, right and wrong
			}
			return nil
		}
		switch filepath.Ext(p) {
		case ".go", ".md", ".lua":
		default:
			return nil
		}
		if !d.Type().IsRegular() {
			return nil // a symbolic link might lead out of the repository
		}
		rel, err := filepath.Rel(root, p)
		if err != nil {
			return err
		}
		rel = filepath.ToSlash(rel)
		src, err := os.ReadFile(p)
		if err != nil {
			return err
		}
		inSheets := path.Dir(rel)+"/" == Dir && path.Ext(rel) == ".md"
		cs := Extract(rel, src, Options{Sheets: names, NoImplicit: inSheets})
		files = append(files, File{Path: rel, Src: src, Citations: cs, InSheets: inSheets})
		return nil
	})
	if err != nil {
		return nil, nil, fmt.Errorf("cite: %w", err)
	}
	sort.Slice(files, func(a, b int) bool { return files[a].Path < files[b].Path })
	return sheets, files, nil
}

// Problem is a citation that does not resolve, or is not in the form
// required.
type Problem struct {
	Citation Citation
	Msg      string
}

func (p Problem) String() string {
	return fmt.Sprintf("%s:%d: %q: %s", p.Citation.File, p.Citation.Line, p.Citation.Text, p.Msg)
}

// Resolve checks every citation of files against sheets and returns those
// whose sheet is not among them, or whose section, sub-item or quoted
// words do not exist in it.
func Resolve(sheets map[string]*Sheet, files []File) []Problem {
	var ps []Problem
	for _, f := range files {
		for _, c := range f.Citations {
			s := sheets[c.Sheet]
			if s == nil {
				ps = append(ps, Problem{c, fmt.Sprintf("no sheet %s in %s", c.Sheet, Dir)})
				continue
			}
			if err := s.Check(c); err != nil {
				ps = append(ps, Problem{c, err.Error()})
			}
		}
	}
	return ps
}

// Strict returns the citations of files, other than those of the sheets
// themselves, that are not in the target form.
func Strict(files []File) []Problem {
	var ps []Problem
	for _, f := range files {
		if f.InSheets {
			continue
		}
		for _, c := range f.Citations {
			if !c.Explicit() {
				ps = append(ps, Problem{c, fmt.Sprintf("%s form; cite it as %s%s", c.Via, Dir, c.Sheet+sectionSuffix(c))})
			}
		}
	}
	return ps
}

func sectionSuffix(c Citation) string {
	if c.Section == "" {
		return ""
	}
	return " §" + c.Section
}
