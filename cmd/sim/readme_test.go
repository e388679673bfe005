package main

import (
	"bytes"
	"context"
	"flag"
	"fmt"
	"os"
	"path"
	"path/filepath"
	"strings"
	"testing"

	"steamcase/plant/schema"
)

// TestReadmeExample runs the script of the README's "A script and its
// answer" and checks that every line of the report excerpt shown there is
// in what sim run prints, so that the README stays true.
func TestReadmeExample(t *testing.T) {
	readme, err := os.ReadFile(filepath.Join("..", "..", "README.md"))
	if err != nil {
		t.Fatal(err)
	}
	s := string(readme)
	i := strings.Index(s, "```lua\n-- mini.lua")
	if i < 0 {
		t.Fatal("README.md has no mini.lua example")
	}
	i += len("```lua\n")
	j := strings.Index(s[i:], "```")
	script := s[i : i+j]
	rest := s[i+j+3:]
	k := strings.Index(rest, "```\n")
	l := strings.Index(rest[k+4:], "```")
	excerpt := rest[k+4 : k+4+l]

	dir := t.TempDir()
	file := filepath.Join(dir, "mini.lua")
	if err := os.WriteFile(file, []byte(script), 0o644); err != nil {
		t.Fatal(err)
	}
	var out, errOut bytes.Buffer
	code := run(context.Background(), []string{"run", "--quiet", file}, &out, &errOut)
	if code != 0 {
		t.Fatalf("sim run mini.lua: exit %d: %s", code, errOut.String())
	}
	for _, line := range strings.Split(strings.TrimSpace(excerpt), "\n") {
		if strings.TrimSpace(line) == "" {
			continue
		}
		if !strings.Contains(out.String(), line) {
			t.Errorf("README line not in the report:\n%s\nreport:\n%s", line, out.String())
		}
	}
}

// TestReadmeCommands keeps the README's command section in step with the
// command table: every command is listed there, and every flag of each
// command appears in its row or in the README's text.
func TestReadmeCommands(t *testing.T) {
	readme, err := os.ReadFile(filepath.Join("..", "..", "README.md"))
	if err != nil {
		t.Fatal(err)
	}
	s := string(readme)
	i := strings.Index(s, "## Commands")
	j := strings.Index(s[i+1:], "\n## ")
	section := s[i : i+1+j]
	for _, c := range commands() {
		if !strings.Contains(section, "`sim "+c.Name) {
			t.Errorf("README's command section does not list sim %s", c.Name)
		}
		if c.Flags == nil {
			continue
		}
		c.Flags().VisitAll(func(f *flag.Flag) {
			if !strings.Contains(s, "--"+f.Name) && !strings.Contains(s, "-"+f.Name+" ") && !strings.Contains(s, "`-"+f.Name) {
				t.Errorf("README does not mention flag %s of sim %s", f.Name, c.Name)
			}
		})
	}
}

// TestReadmeGoVersion checks that the README's set-up names the Go
// version of go.mod.
func TestReadmeGoVersion(t *testing.T) {
	readme, err := os.ReadFile(filepath.Join("..", "..", "README.md"))
	if err != nil {
		t.Fatal(err)
	}
	mod, err := os.ReadFile(filepath.Join("..", "..", "go.mod"))
	if err != nil {
		t.Fatal(err)
	}
	var goVersion string
	for _, l := range strings.Split(string(mod), "\n") {
		if v, ok := strings.CutPrefix(l, "go "); ok {
			goVersion = strings.TrimSpace(v)
		}
	}
	if goVersion == "" {
		t.Fatal("go.mod has no go line")
	}
	if want := "with Go " + goVersion + " or newer"; !strings.Contains(string(readme), want) {
		t.Errorf("README.md does not say %q (go.mod has go %s)", want, goVersion)
	}
}

// TestGitignoreCharts checks that .gitignore covers the charts and
// reports the README's examples write in the repository's root, with the
// suffixed names of several charts, and the temporary files of sim run,
// but not the charts kept in scenarios/plots.
func TestGitignoreCharts(t *testing.T) {
	readme, err := os.ReadFile(filepath.Join("..", "..", "README.md"))
	if err != nil {
		t.Fatal(err)
	}
	ignore, err := os.ReadFile(filepath.Join("..", "..", ".gitignore"))
	if err != nil {
		t.Fatal(err)
	}
	var written []string
	fields := strings.Fields(string(readme))
	for i, f := range fields {
		if (f == "--plot" || f == "-o") && i+1 < len(fields) {
			name := strings.Trim(fields[i+1], "`()")
			if strings.HasSuffix(name, ".svg") || strings.HasSuffix(name, ".png") || strings.HasSuffix(name, ".json") {
				written = append(written, name)
				if f == "--plot" {
					dot := strings.LastIndexByte(name, '.')
					written = append(written, name[:dot]+"-cases"+name[dot:], name[:dot]+"-voyage-2"+name[dot:])
				}
			}
		}
	}
	if len(written) < 5 {
		t.Fatalf("found only %q in the README's examples", written)
	}
	written = append(written, ".report.txt.sim-123456.tmp", "out/.demand.svg.sim-99.old")
	for _, f := range written {
		if !gitignored(string(ignore), f) {
			t.Errorf(".gitignore does not cover %s", f)
		}
	}
	kept, err := filepath.Glob(filepath.Join("..", "..", "scenarios", "plots", "*"))
	if err != nil || len(kept) == 0 {
		t.Fatalf("scenarios/plots: %v %q", err, kept)
	}
	for _, f := range kept {
		rel := filepath.ToSlash(strings.TrimPrefix(f, filepath.Join("..", "..")+string(filepath.Separator)))
		if gitignored(string(ignore), rel) {
			t.Errorf(".gitignore covers %s, which the repository keeps", rel)
		}
	}
}

// gitignored reports whether a .gitignore's patterns cover file, a
// slash-separated path from the repository's root. It reads the patterns
// this repository uses: "/x" matches from the root, other patterns match
// the last element; '*' and '?' as in path.Match; no negation.
func gitignored(patterns, file string) bool {
	for _, p := range strings.Split(patterns, "\n") {
		p = strings.TrimSpace(p)
		if p == "" || strings.HasPrefix(p, "#") {
			continue
		}
		if rooted, ok := strings.CutPrefix(p, "/"); ok {
			rooted = strings.TrimSuffix(rooted, "/")
			if m, _ := path.Match(rooted, file); m {
				return true
			}
			if first, _, _ := strings.Cut(file, "/"); first == rooted {
				return true
			}
			continue
		}
		if m, _ := path.Match(p, path.Base(file)); m {
			return true
		}
	}
	return false
}

// TestUpdatePackagesListed keeps DEVELOPERS.md's -update line naming
// exactly the packages whose tests take -update.
func TestUpdatePackagesListed(t *testing.T) {
	t.Parallel()
	root := filepath.Join("..", "..")
	doc, err := os.ReadFile(filepath.Join(root, "DEVELOPERS.md"))
	if err != nil {
		t.Fatal(err)
	}
	var line string
	for _, l := range strings.Split(string(doc), "\n") {
		if strings.HasPrefix(l, "go test ") && strings.HasSuffix(strings.TrimSpace(l), "-update") {
			line = l
		}
	}
	if line == "" {
		t.Fatal("DEVELOPERS.md has no line `go test ... -update`")
	}
	listed := map[string]bool{}
	for _, f := range strings.Fields(line) {
		if strings.HasPrefix(f, "./") {
			listed[strings.TrimSuffix(strings.TrimPrefix(f, "./"), "/...")] = true
		}
	}
	have := map[string]bool{}
	err = filepath.WalkDir(root, func(path string, d os.DirEntry, err error) error {
		if err != nil {
			return err
		}
		if d.IsDir() && (d.Name() == ".git" || d.Name() == "testdata") {
			return filepath.SkipDir
		}
		if !strings.HasSuffix(path, "_test.go") {
			return nil
		}
		b, err := os.ReadFile(path)
		if err != nil {
			return err
		}
		if strings.Contains(string(b), `flag.Bool("update"`) {
			rel, _ := filepath.Rel(root, filepath.Dir(path))
			have[filepath.ToSlash(rel)] = true
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	for pkg := range have {
		covered := listed[pkg]
		for l := range listed {
			if strings.HasPrefix(pkg, l+"/") && strings.Contains(line, "./"+l+"/...") {
				covered = true
			}
		}
		if !covered {
			t.Errorf("package %s takes -update but DEVELOPERS.md's line does not name it: %s", pkg, line)
		}
	}
	for l := range listed {
		if !have[l] {
			t.Errorf("DEVELOPERS.md names ./%s for -update, but its tests do not take the flag", l)
		}
	}
}

// TestHelpSchemaVersion: sim help run names the schema version the JSON
// carries.
func TestHelpSchemaVersion(t *testing.T) {
	t.Parallel()
	_, out, _ := runSim(t, "help", "run")
	if want := fmt.Sprintf("schema %d", schema.Version); !strings.Contains(strings.Join(strings.Fields(out), " "), want) {
		t.Errorf("sim help run does not say %q", want)
	}
}
