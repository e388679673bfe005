package main

import (
	"bytes"
	"context"
	"flag"
	"os"
	"path/filepath"
	"strings"
	"testing"
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
