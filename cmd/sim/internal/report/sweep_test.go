package report

import (
	"bytes"
	"context"
	"strings"
	"testing"

	"steamcase/plant"
	"steamcase/plant/profile"
)

// sweepRun is a study of the invented EGE ship's economiser with a sweep of
// its UA over three invented rows.
func sweepRun(t testing.TB) Run {
	p := egePlant(t)
	var rows []profile.Row
	for i, load := range []float64{0.3, 0.6, 1} {
		rows = append(rows, profile.Row{Phase: "sea", Hours: float64(1000 * (i + 1)), Case: plant.Case{Name: "sea",
			Conditions: plant.Conditions{SeaT: 288.15, AirT: 288.15, EngineLoad: load}}})
	}
	law := profile.CostLaw{RefUA: 20e3, RefCost: 200000, Fixed: 20000}
	sr, err := profile.RunStudy(context.Background(), p, rows, profile.StudySpec{
		Variants: []profile.Variant{
			{Name: "without EGE", Set: []plant.Setting{{Unit: "EGE", Param: "off", Value: 1}}},
			{Name: "as designed", InstalledCost: 260000, HasCost: true},
		},
		Economics: profile.Economics{FuelPrice: 600, CarbonPrice: 80, Currency: "USD", LifeYears: 15, DiscountRate: 0.08},
		Sweep:     &profile.Sweep{Unit: "EGE", Param: "ua", Values: []float64{5e3, 15e3, 30e3, 60e3, 120e3}, Cost: law},
	}, profile.Options{Workers: 1})
	must(t, err)
	return Run{Studies: []Study{{Job: Job{Name: "EGE size", Plant: p.Name, Source: "study.lua:3"}, Result: sr}}}
}

// TestSweepReport: the table, the CSV and the chart show the sweep, its
// best size (the highest NPV, profile.RunStudy's) marked, and the
// soot-fire caution beside the hours counted (the 30 % row is below the
// 40 % soot-risk load, common practice, no source).
func TestSweepReport(t *testing.T) {
	t.Parallel()
	run := sweepRun(t)
	r := run.Studies[0].Result
	best := r.Sweep.Points[r.Sweep.Best]
	var tb bytes.Buffer
	must(t, Table(&tb, run))
	out := tb.String()
	for _, s := range []string{"Sweep of EGE ua", "best NPV", sizeText("ua", best.Value), "NPV USD", "h soot risk",
		"soot fires in exhaust-gas economisers are a known hazard", "NPV over 15 years at 8.00 % a year"} {
		if !strings.Contains(out, s) {
			t.Errorf("the table does not say %q:\n%s", s, out)
		}
	}
	if r.Variants[1].HoursSootRisk != 1000 {
		t.Errorf("soot-risk hours %g, want the 1000 h of the 30 %% row", r.Variants[1].HoursSootRisk)
	}
	var cb bytes.Buffer
	must(t, CSV(&cb, run))
	lines := strings.Split(cb.String(), "\n")
	var sweep []string
	for _, l := range lines {
		if strings.HasPrefix(l, TableSweep+",") {
			sweep = append(sweep, l)
		}
	}
	if len(sweep) != 5 || !strings.HasSuffix(sweep[r.Sweep.Best], ",true") {
		t.Errorf("CSV sweep rows %q; want 5, the best (%d) marked true", sweep, r.Sweep.Best+1)
	}
	var svg bytes.Buffer
	must(t, PlotStudy(&svg, SVG, run.Studies[0]))
	for _, s := range []string{"Steam dumped", "best: " + sizeText("ua", best.Value), "NPV, thousand USD", "UA of EGE, kW/K"} {
		if !strings.Contains(svg.String(), s) {
			t.Errorf("the chart does not say %q", s)
		}
	}
}
