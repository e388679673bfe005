// Command recite lists the citations of the reference sheets in the
// repository and rewrites them to the form docs/reference/<sheet>
// §<section>.
//
// Usage:
//
//	go run ./docs/reference/internal/recite [-root DIR] [-list] [-w]
//
// Without -w it changes nothing: it prints each citation it would rewrite,
// as file:line, its form, the text as written and the text it would
// become, then a summary (citations by form, by sheet and section, and the
// mentions of the shared folder that are not citations and stay as they
// are). -list prints every citation instead of the planned rewrites. -w
// rewrites the files (Go files are then formatted with go/format) and
// prints the same summary.
//
// What it rewrites (see package cite for what a citation is): the sheet's
// file name alone and the paths into the shared set become
// docs/reference/<sheet>; "reference README" becomes
// docs/reference/README.md; in "<name> reference sheet" the name becomes
// docs/reference/<name>.md; an implicit bare section sign gets
// docs/reference/<sheet> before it. Chained sections follow their first
// citation. The Markdown files of docs/reference are left as copied.
//
// Implicit citations rest on the sheet named last before them in the file:
// read the list of them before writing. Exit status 2 for a usage error, 1
// for a failure.
package main

import (
	"bytes"
	"errors"
	"flag"
	"fmt"
	"go/format"
	"io"
	"os"
	"path/filepath"
	"regexp"
	"sort"
	"strings"

	"steamcase/docs/reference/internal/cite"
)

func main() {
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

func run(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("recite", flag.ContinueOnError)
	fs.SetOutput(stderr)
	root := fs.String("root", "", "the repository's `DIR` (default: the folder above the working directory that holds the go.mod of module steamcase)")
	list := fs.Bool("list", false, "print every citation, not only those to rewrite")
	write := fs.Bool("w", false, "rewrite the files")
	fs.Usage = func() {
		fmt.Fprintln(stderr, "usage: recite [-root DIR] [-list] [-w]")
		fs.PrintDefaults()
	}
	if err := fs.Parse(args); err != nil {
		return 2
	}
	if fs.NArg() > 0 {
		fmt.Fprintf(stderr, "recite: unexpected argument %q\n", fs.Arg(0))
		fs.Usage()
		return 2
	}
	if *root == "" {
		r, err := findRoot()
		if err != nil {
			fmt.Fprintln(stderr, "recite:", err)
			return 1
		}
		*root = r
	}
	if err := recite(*root, *list, *write, stdout); err != nil {
		fmt.Fprintln(stderr, "recite:", err)
		return 1
	}
	return 0
}

// findRoot walks up from the working directory to the go.mod of module
// steamcase.
func findRoot() (string, error) {
	dir, err := os.Getwd()
	if err != nil {
		return "", err
	}
	for {
		b, err := os.ReadFile(filepath.Join(dir, "go.mod"))
		if err == nil && bytes.HasPrefix(b, []byte("module steamcase\n")) {
			return dir, nil
		}
		up := filepath.Dir(dir)
		if up == dir {
			return "", errors.New("no go.mod of module steamcase above the working directory; give -root")
		}
		dir = up
	}
}

// sharedFolder finds mentions of the shared folder that name no file.
var sharedFolder = regexp.MustCompile(`(?:\.\./)?(?:shared/)?\breference/(?:[^A-Za-z0-9_.-]|$)`)

func recite(root string, list, write bool, w io.Writer) error {
	sheets, files, err := cite.Scan(root)
	if err != nil {
		return err
	}
	var (
		byForm    = map[string]int{}
		bySection = map[string]int{}
		tagged    int
		titled    int
		items     int
		rewritten int
		changed   int
		notes     []string
	)
	for _, f := range files {
		for _, c := range f.Citations {
			form := c.Form.String()
			if c.Form == cite.Chained {
				form += " (after " + c.Via.String() + ")"
			}
			byForm[form]++
			key := c.Sheet
			if c.Section != "" {
				key += " §" + c.Section
			}
			bySection[key]++
			if c.Tag != "" {
				tagged++
			}
			if c.Title != "" {
				titled++
				key += " \"" + c.Title + "\""
			}
			if c.Item.Kind != "" {
				items++
			}
			switch {
			case list:
				fmt.Fprintf(w, "%s:%d: %s %s %s\t%s\n", f.Path, c.Line, form, key, c.Item, c.Text)
			case !f.InSheets && !c.Explicit() && c.Form != cite.Chained:
				fmt.Fprintf(w, "%s:%d: %s: %s  =>  %s\n", f.Path, c.Line, form, c.Text, preview(f.Src, c))
			}
		}
		if !f.InSheets {
			for _, loc := range sharedFolder.FindAllIndex(f.Src, -1) {
				if bytes.HasSuffix(f.Src[:loc[0]], []byte("docs/")) {
					continue
				}
				line := bytes.Count(f.Src[:loc[0]], []byte("\n")) + 1
				notes = append(notes, fmt.Sprintf("%s:%d", f.Path, line))
			}
		}
		if !write || f.InSheets {
			continue
		}
		out, n := cite.Rewrite(f.Src, f.Citations)
		if n == 0 {
			continue
		}
		if filepath.Ext(f.Path) == ".go" {
			if out, err = format.Source(out); err != nil {
				return fmt.Errorf("%s: after the rewrite: %v", f.Path, err)
			}
		}
		p := filepath.Join(root, filepath.FromSlash(f.Path))
		st, err := os.Stat(p)
		if err != nil {
			return err
		}
		if err := os.WriteFile(p, out, st.Mode().Perm()); err != nil {
			return err
		}
		rewritten += n
		changed++
	}

	total := 0
	for _, n := range byForm {
		total += n
	}
	fmt.Fprintf(w, "\n%d citations in %d files scanned: %d with a tag after the section, %d with a sub-item, %d with quoted words naming an item\n",
		total, len(files), tagged, items, titled)
	printCounts(w, "by form", byForm)
	printCounts(w, "by sheet and section", bySection)
	if ps := cite.Resolve(sheets, files); len(ps) > 0 {
		fmt.Fprintf(w, "\n%d citations do not resolve:\n", len(ps))
		for _, p := range ps {
			fmt.Fprintln(w, "  "+p.String())
		}
	}
	if len(notes) > 0 {
		fmt.Fprintf(w, "\nmentions of the shared folder without a file (not citations, left as written): %s\n", strings.Join(notes, ", "))
	}
	if write {
		fmt.Fprintf(w, "\nrewrote %d citations in %d files\n", rewritten, changed)
	}
	return nil
}

// preview returns the line of c after the rewrite of c alone.
func preview(src []byte, c cite.Citation) string {
	out, _ := cite.Rewrite(src, []cite.Citation{c})
	start := bytes.LastIndexByte(out[:c.Start], '\n') + 1
	end := bytes.IndexByte(out[c.Start:], '\n')
	if end < 0 {
		end = len(out) - c.Start
	}
	return strings.TrimSpace(string(out[start : c.Start+end]))
}

func printCounts(w io.Writer, title string, m map[string]int) {
	keys := make([]string, 0, len(m))
	for k := range m {
		keys = append(keys, k)
	}
	sort.Slice(keys, func(a, b int) bool {
		if m[keys[a]] != m[keys[b]] {
			return m[keys[a]] > m[keys[b]]
		}
		return keys[a] < keys[b]
	})
	fmt.Fprintf(w, "%s:\n", title)
	for _, k := range keys {
		fmt.Fprintf(w, "  %5d  %s\n", m[k], k)
	}
}
