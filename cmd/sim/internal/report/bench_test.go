package report

import (
	"io"
	"testing"

	"steamcase/plant/profile"
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

// longVoyage repeats the four periods of profileRun's voyage 100 times:
// a plan of 400 rows, as a two-week plan in hourly steps would be.
func longVoyage(b *testing.B) Voyage {
	v := profileRun(b).Voyages[0]
	var rows []profile.RowResult
	for range 100 {
		for _, r := range v.Result.Rows {
			r.Index = len(rows)
			rows = append(rows, r)
		}
	}
	v.Result = profile.Sum(rows)
	return v
}

func BenchmarkPlotVoyageSVG(b *testing.B) {
	v := longVoyage(b)
	b.ReportAllocs()
	for b.Loop() {
		if err := PlotVoyage(io.Discard, SVG, v); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(len(v.Result.Rows)), "rows/op")
}

func BenchmarkPlotStudySVG(b *testing.B) {
	s := profileRun(b).Studies[0]
	b.ReportAllocs()
	for b.Loop() {
		if err := PlotStudy(io.Discard, SVG, s); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(len(s.Result.Variants)), "variants/op")
}

func BenchmarkPlotAuditSVG(b *testing.B) {
	a := profileRun(b).Audits[0]
	b.ReportAllocs()
	for b.Loop() {
		if err := PlotAudit(io.Discard, SVG, a); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(len(a.Result.Days)), "days/op")
}

func BenchmarkCSVJobs(b *testing.B) {
	run := profileRun(b)
	run.Voyages[0] = longVoyage(b)
	b.ReportAllocs()
	for b.Loop() {
		if err := CSV(io.Discard, run); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(len(run.Voyages[0].Result.Rows)), "voyage-rows/op")
}
