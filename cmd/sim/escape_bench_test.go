package main

import (
	"context"
	"path/filepath"
	"reflect"
	"testing"

	"steamcase/cmd/sim/internal/report"
	"steamcase/scripting"
)

// BenchmarkEscapeRun measures escapeRun's walk over what the scenarios'
// voyage, study and audit solve (a year's profile among them): the cost
// the escaping adds to a report, once per run. strings/op counts the
// strings looked at.
func BenchmarkEscapeRun(b *testing.B) {
	var all report.Run
	for _, s := range []string{"voyage.lua", "ege_study.lua", "audit.lua"} {
		r, err := scripting.RunFile(context.Background(), filepath.Join("..", "..", "scenarios", s), scripting.Options{Timeout: 0})
		if err != nil {
			b.Fatal(err)
		}
		collect(&all, r)
	}
	n := 0
	for b.Loop() {
		w := escaper{seen: map[uintptr]bool{}, types: map[reflect.Type]bool{}}
		w.walk(reflect.ValueOf(&all).Elem())
		n = w.strings
	}
	b.ReportMetric(float64(n), "strings/op")
}
