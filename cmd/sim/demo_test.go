package main

import (
	"bytes"
	"context"
	"os"
	"strings"
	"testing"
	"testing/fstest"
)

// TestDemoRunner runs a script from an in-memory file system the way the
// built-in demo runs its embedded one: the report, headed by the demo's
// line, with the script's path in the positions.
func TestDemoRunner(t *testing.T) {
	t.Parallel()
	src, err := os.ReadFile(smallScript)
	if err != nil {
		t.Fatal(err)
	}
	fsys := fstest.MapFS{"demo/coaster.lua": {Data: src}}
	var out, errw bytes.Buffer
	if err := runDemo(context.Background(), env{stdout: &out, stderr: &errw}, fsys, "demo/coaster.lua"); err != nil {
		t.Fatalf("demo: %v\n%s", err, errw.String())
	}
	got := out.String()
	if !strings.HasPrefix(got, demoFirstLine+"\n\nLoad case 1 of 2: port stay\n") ||
		!strings.Contains(got, "solved at demo/coaster.lua:20") || !strings.HasSuffix(got, cautionLine+"\n") {
		t.Errorf("demo report:\n%s", got)
	}
	if errw.Len() != 0 {
		t.Errorf("the demo logged on stderr: %q", errw.String())
	}
	// A missing script is a failure.
	if err := runDemo(context.Background(), env{stdout: &out, stderr: &errw}, fsys, "demo/none.lua"); err == nil {
		t.Error("a missing demo script ran")
	}
}

// TestDemo runs "sim" without arguments: the built-in demo's report of the
// embedded scenario, headed by the demo's line and closed by the caution.
// The figures are the plant's; the scenario's own checks must pass.
func TestDemo(t *testing.T) {
	t.Parallel()
	code, out, errOut := runSim(t)
	if code != exitOK || errOut != "" {
		t.Fatalf("sim: exit %d, stderr %q", code, errOut)
	}
	if !strings.HasPrefix(out, demoFirstLine+"\n\nLoad case 1 of ") || !strings.HasSuffix(out, cautionLine+"\n") {
		t.Errorf("sim:\n%s", out)
	}
	if !strings.Contains(out, "invented") || !strings.Contains(out, `plant "Invented `) {
		t.Errorf("the demo does not say its ship is invented:\n%.300s", out)
	}
}
