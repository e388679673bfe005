package main

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestScriptPrint checks where a script's print goes: plain text on
// stdout before the table; on stderr with --json and --csv, so that
// stdout is one document; nowhere with --quiet. Control characters other
// than newline and tab are escaped.
func TestScriptPrint(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	script := filepath.Join(dir, "p.lua")
	src := "local ship = include(\"plant.lua\")\n" +
		"print(\"fuel\", 1.5, \"t/day\")\n" +
		"local r = case(ship, { name = \"port\", sea = \"14 C\", air = \"9 C\" })\n" +
		"print(\"two\\nlines\\r\\27[2J\")\n"
	for name, content := range map[string]string{"plant.lua": badPlant, "p.lua": src} {
		if err := os.WriteFile(filepath.Join(dir, name), []byte(content), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	const printed = "fuel\t1.5\tt/day\ntwo\nlines\\r\\x1b[2J\n"
	for _, c := range []struct {
		args           []string
		stdout, stderr string // prefixes
	}{
		{[]string{"run", script}, printed + "Load case 1 of 1: port\n", ""},
		{[]string{"run", "--json", script}, "{", printed},
		{[]string{"run", "--csv", script}, "table,case,", printed},
		{[]string{"run", "--quiet", script}, "Load case 1 of 1: port\n", ""},
		{[]string{"check", script}, script + ": ok: 1 plant, 1 load case\n", printed},
	} {
		code, out, errOut := runSim(t, c.args...)
		if code != exitOK || !strings.HasPrefix(out, c.stdout) || !strings.HasPrefix(errOut, c.stderr) {
			t.Errorf("sim %q: exit %d\nstdout %q\nstderr %q\nwant them to start %q and %q", c.args, code, out, errOut, c.stdout, c.stderr)
		}
		if strings.Contains(c.args[1], "quiet") && strings.Contains(out+errOut, "fuel\t") {
			t.Errorf("sim %q printed what the script printed", c.args)
		}
		if c.args[1] == "--json" && !json.Valid([]byte(out)) {
			t.Errorf("sim %q: stdout is not one JSON document: %q", c.args, out)
		}
		if strings.Contains(errOut, `"level"`) {
			t.Errorf("sim %q: the print is a log record: %q", c.args, errOut)
		}
	}
}
