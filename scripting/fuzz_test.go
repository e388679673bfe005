package scripting

import (
	"bytes"
	"context"
	"errors"
	"os"
	"path/filepath"
	"testing"
	"testing/fstest"
	"time"
)

// FuzzRunSource checks that no script source makes the loader panic or
// fail inside this package (ErrInternal): every outcome is a result, a
// script error, an assertion or a limit.
func FuzzRunSource(f *testing.F) {
	for _, dir := range []string{"good", "bad"} {
		files, _ := filepath.Glob(filepath.Join("testdata", dir, "*.lua"))
		for _, file := range files {
			switch filepath.Base(file) {
			case "memory.lua", "endless.lua":
				// The memory limit is process-wide, and inputs that run to
				// their time limit make the fuzzer's minimisation crawl.
				continue
			}
			b, err := os.ReadFile(file)
			if err != nil {
				f.Fatal(err)
			}
			f.Add(b)
		}
	}
	f.Add([]byte(`case(plant{name="x"}, {})`))
	f.Add([]byte(`local p = plant{name="x"} p:line("a","b","c") p:line(1,2,3) case(p, {set={b={}}})`))
	f.Add([]byte(`steam_plant{name="s", boilers={{}}, consumers={{kind="x"}}, headers={{p="1 bar(g)"}}}`))
	plantSrc, err := os.ReadFile(filepath.Join("testdata", "good", "plant_tanker.lua"))
	if err != nil {
		f.Fatal(err)
	}
	fsys := fstest.MapFS{
		"plant_tanker.lua": {Data: plantSrc},
		"profile.csv":      {Data: []byte("phase,hours\nport,48\n")},
	}
	opt := Options{Timeout: 100 * time.Millisecond, MaxMemory: 256 << 20, MaxCases: 20}
	f.Fuzz(func(t *testing.T, src []byte) {
		_, err := RunSource(context.Background(), "fuzz.lua", src, fsys, opt)
		if errors.Is(err, ErrInternal) {
			t.Fatalf("internal error for %q: %v", src, err)
		}
		var te *TimeoutError
		if errors.As(err, &te) && te.Abandoned {
			t.Logf("interpreter abandoned for %q", src)
		}
	})
}

// FuzzTableLines checks that the token scan behind the short form's
// entry lines never panics and gives only lines that exist in the source.
func FuzzTableLines(f *testing.F) {
	files, _ := filepath.Glob(filepath.Join("testdata", "good", "*.lua"))
	for _, file := range files {
		b, err := os.ReadFile(file)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(b)
	}
	f.Add([]byte(`x = { name = "a", y = { name = "b" } } }} {{ name = [[c]]`))
	f.Fuzz(func(t *testing.T, src []byte) {
		lines := 1 + bytes.Count(src, []byte("\n")) + bytes.Count(src, []byte("\r"))
		for name, ls := range tableLines(src, "f.lua") {
			for _, l := range ls {
				if l < 1 || l > lines {
					t.Fatalf("%q: line %d of a %d-line source", name, l, lines)
				}
			}
		}
	})
}
