package report

import (
	"io"
	"testing"
)

// The renderers run once per run, not in a solve's inner loop; these
// benchmarks keep their cost in view against the solves they report.

func BenchmarkTable(b *testing.B) {
	cases := demoCases(b)
	b.ReportAllocs()
	for b.Loop() {
		if err := Table(io.Discard, Run{Cases: cases}); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(len(cases)), "cases/op")
}

func BenchmarkJSON(b *testing.B) {
	cases := demoCases(b)
	b.ReportAllocs()
	for b.Loop() {
		if err := JSON(io.Discard, Run{Cases: cases}); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(len(cases)), "cases/op")
}

func BenchmarkCSV(b *testing.B) {
	cases := demoCases(b)
	b.ReportAllocs()
	for b.Loop() {
		if err := CSV(io.Discard, Run{Cases: cases}); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(len(cases)), "cases/op")
}

func BenchmarkPlotSVG(b *testing.B) {
	cases := demoCases(b)
	b.ReportAllocs()
	for b.Loop() {
		if err := Plot(io.Discard, SVG, cases); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(len(cases)), "cases/op")
}
