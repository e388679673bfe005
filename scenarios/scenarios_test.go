package scenarios

import (
	"context"
	"io/fs"
	"testing"

	"steamcase/scripting"
)

// TestScriptsCheck checks every embedded script without solving it (the
// scripting package's check mode): syntax, units, keys, lines and the
// degrees of freedom of every plant. Solving them is "sim run"'s test.
func TestScriptsCheck(t *testing.T) {
	names, err := fs.Glob(FS, "*.lua")
	if err != nil || len(names) == 0 {
		t.Fatalf("no scripts embedded: %v", err)
	}
	found := false
	for _, name := range names {
		found = found || name == Demo
		src, err := fs.ReadFile(FS, name)
		if err != nil {
			t.Fatal(err)
		}
		if _, err := scripting.RunSource(context.Background(), name, src, FS, scripting.Options{CheckOnly: true}); err != nil {
			t.Errorf("%s: %v", name, err)
		}
	}
	if !found {
		t.Errorf("the demo script %q is not embedded", Demo)
	}
}
