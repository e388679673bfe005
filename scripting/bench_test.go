package scripting

import (
	"context"
	"os"
	"path/filepath"
	"testing"
)

// BenchmarkStartEmpty measures the cost of one run of an empty script:
// the sandboxed interpreter's creation and the bindings' registration.
func BenchmarkStartEmpty(b *testing.B) {
	ctx := context.Background()
	for b.Loop() {
		if _, err := RunSource(ctx, "empty.lua", nil, nil, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSweep runs testdata/good/sweep.lua: a plant from an include and
// four solved cases read back into Lua.
func BenchmarkSweep(b *testing.B) {
	ctx := context.Background()
	file := filepath.Join("testdata", "good", "sweep.lua")
	if _, err := os.Stat(file); err != nil {
		b.Fatal(err)
	}
	cases := 0
	for b.Loop() {
		run, err := RunFile(ctx, file, Options{})
		if err != nil {
			b.Fatal(err)
		}
		cases += len(run.Cases)
	}
	b.ReportMetric(float64(cases)/float64(b.N), "cases/op")
}

// BenchmarkCheckOnly validates the loads script without solving.
func BenchmarkCheckOnly(b *testing.B) {
	ctx := context.Background()
	file := filepath.Join("testdata", "good", "loads.lua")
	for b.Loop() {
		if _, err := RunFile(ctx, file, Options{CheckOnly: true}); err != nil {
			b.Fatal(err)
		}
	}
}
