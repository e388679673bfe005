package scripting

import (
	"context"
	"flag"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite the golden files of testdata/bad")

// TestBadGolden keeps the full text of every bad script's error in
// testdata/bad/<name>.golden, so that a change of wording shows in review.
// Run with -update to rewrite them.
func TestBadGolden(t *testing.T) {
	t.Parallel()
	files, err := filepath.Glob(filepath.Join("testdata", "bad", "*.lua"))
	if err != nil {
		t.Fatal(err)
	}
	for _, file := range files {
		base := strings.TrimSuffix(filepath.Base(file), ".lua")
		switch base {
		case "endless", "memory", "plant_small", "voyage_plant":
			continue // timing-dependent, or included by others
		}
		t.Run(base, func(t *testing.T) {
			_, err := RunFile(context.Background(), file, Options{})
			got := "no error\n"
			if err != nil {
				got = filepath.ToSlash(err.Error()) + "\n"
			}
			golden := strings.TrimSuffix(file, ".lua") + ".golden"
			if *update {
				if err := os.WriteFile(golden, []byte(got), 0o644); err != nil {
					t.Fatal(err)
				}
				return
			}
			want, err := os.ReadFile(golden)
			if err != nil {
				t.Fatalf("%v (run with -update to create it)", err)
			}
			if got != string(want) {
				t.Errorf("error text of %s changed:\n--- got\n%s--- want\n%s", file, got, want)
			}
		})
	}
}
