package report

import (
	"bytes"
	"fmt"
	"strings"
	"testing"
)

// TestPlotJobs draws each job of a run in both formats. As with TestPlot,
// the bytes are not compared (they depend on the plotting library's
// version), only that a real file comes out with the job's name and the
// figures' labels in it.
func TestPlotJobs(t *testing.T) {
	run := profileRun(t)
	charts := Charts(run)
	if len(charts) != 5 {
		t.Fatalf("%d charts of a run with a voyage, a study and an audit, want 5", len(charts))
	}
	wants := [][]string{
		{"Voyage: four periods", "Invented Test Tanker", "steam, kg/h", "fuel, kg/h", "time from the start of the voyage, h",
			"MCR of all boilers", "MCR of the boilers firing", "steam demand on the oil-fired boilers",
			"period the plant cannot carry", "port", "discharge"},
		{"Study: lagging", "as built", "better lagging", "t/yr", "base", "payback"},
		{"Audit: three days", "2026-01-01", "2026-01-03", "modelled band, 5 % to 95 %", "median of the samples",
			"band of the readings, 5 % to 95 %", "fuel claimed, day flagged", "boiler fuel of the day, t"},
		{"Implied factors: three days", "cargo heating.factor", "2026-01-02", "plausible range (shaded)"},
		{"Period total: three days, 3 days, 50 samples", "fuel over the period, t", "P(model ≤ claim) =", "claimed, 13.500 t",
			"samples of the total as measured, if the model is right", "median of the modelled total"},
	}
	for i, c := range charts {
		if want := []string{"voyage", "study", "audit", "audit-implied", "audit-period"}[i]; c.Kind != want || c.N != 1 {
			t.Errorf("chart %d: %s %d, want %s 1", i, c.Kind, c.N, want)
		}
		var svg bytes.Buffer
		must(t, c.Draw(&svg, SVG))
		s := svg.String()
		if !strings.HasPrefix(strings.TrimSpace(s), "<?xml") || !strings.Contains(s, "<svg") {
			t.Fatalf("%s: not an SVG: %.80q", c.Kind, s)
		}
		for _, w := range wants[i] {
			if !strings.Contains(s, w) {
				t.Errorf("the %s chart does not contain %q", c.Kind, w)
			}
		}
		if strings.Contains(s, "NaN") {
			t.Errorf("the %s chart has NaN in it", c.Kind)
		}
		var png bytes.Buffer
		must(t, c.Draw(&png, PNG))
		if !bytes.HasPrefix(png.Bytes(), []byte("\x89PNG\r\n\x1a\n")) || png.Len() < 1000 {
			t.Errorf("%s: not a PNG of any size: %d bytes", c.Kind, png.Len())
		}
		if err := c.Draw(&png, "pdf"); err == nil {
			t.Errorf("%s: format pdf accepted", c.Kind)
		}
	}
	// The cases come first, then the jobs, numbered by kind.
	run.Cases = demoCases(t)
	run.Voyages = append(run.Voyages, run.Voyages[0])
	var got []string
	for _, c := range Charts(run) {
		got = append(got, c.Kind+" "+string(rune('0'+c.N)))
	}
	if strings.Join(got, ", ") != "cases 0, voyage 1, voyage 2, study 1, audit 1, audit-implied 1, audit-period 1" {
		t.Errorf("charts %v", got)
	}
	if len(Charts(Run{})) != 0 {
		t.Error("an empty run has charts")
	}
}

// TestPlotJobsEmpty checks that a job without rows is refused with an
// error naming it, not drawn as an empty frame or a panic.
func TestPlotJobsEmpty(t *testing.T) {
	var b bytes.Buffer
	for _, err := range []error{
		PlotVoyage(&b, SVG, Voyage{Job: Job{Name: "v"}}),
		PlotStudy(&b, SVG, Study{Job: Job{Name: "s"}}),
		PlotAudit(&b, SVG, Audit{Job: Job{Name: "a"}}),
		PlotAuditImplied(&b, SVG, Audit{Job: Job{Name: "a"}}),
		PlotAuditPeriod(&b, SVG, Audit{Job: Job{Name: "a"}}),
	} {
		if err == nil || !strings.Contains(err.Error(), "to draw") {
			t.Errorf("an empty job: %v", err)
		}
	}
}

// TestHourTicks checks the steps of the hours axis: a day for two weeks,
// whole hours for a short plan, and a month for a year.
func TestHourTicks(t *testing.T) {
	for _, c := range []struct {
		hi   float64
		step float64
	}{{336, 24}, {10, 1}, {36, 3}, {8760, 720}} {
		ticks := hourTicks{}.Ticks(0, c.hi)
		if len(ticks) < 2 || ticks[1].Value-ticks[0].Value != c.step || len(ticks) > 15 {
			t.Errorf("0 to %g h: %d ticks, step %g; want step %g", c.hi, len(ticks), ticks[1].Value-ticks[0].Value, c.step)
		}
	}
}

// TestDecimalTicks checks the labels of the audit's axis of tonnes: round
// steps, with the decimals the step needs and no more.
func TestDecimalTicks(t *testing.T) {
	for _, c := range []struct {
		lo, hi float64
		want   string
	}{
		{0, 14, "0 2 4 6 8 10 12 14"},
		{0, 0.7, "0.0 0.1 0.2 0.3 0.4 0.5 0.6 0.7"},
		{0, 0.03, "0.000 0.005 0.010 0.015 0.020 0.025 0.030"},
		{0, 120, "0 20 40 60 80 100 120"},
	} {
		var labels []string
		for _, tk := range (decimalTicks{}).Ticks(c.lo, c.hi) {
			labels = append(labels, tk.Label)
		}
		if got := strings.Join(labels, " "); got != c.want {
			t.Errorf("%g to %g: %q, want %q", c.lo, c.hi, got, c.want)
		}
	}
}

// TestChartsOpaque: every chart of a run paints its whole canvas, legend
// included, before it draws (an SVG on a dark page stays readable), and
// the cases chart labels repeated case names apart (issue 16).
func TestChartsOpaque(t *testing.T) {
	t.Parallel()
	run := profileRun(t)
	run.Cases = demoCases(t)
	run.Cases = append(run.Cases, run.Cases...)
	run.HeatingPlans = heatingRun(t).HeatingPlans
	kinds := map[string]bool{}
	for _, c := range Charts(run) {
		kinds[c.Kind] = true
		var svg bytes.Buffer
		must(t, c.Draw(&svg, SVG))
		s := svg.String()
		i := strings.Index(s, `viewBox="0 0 `)
		if i < 0 {
			t.Fatalf("%s: no viewBox", c.Kind)
		}
		dims := strings.Fields(s[i+len(`viewBox="0 0 `) : i+len(`viewBox="0 0 `)+strings.Index(s[i+len(`viewBox="0 0 `):], `"`)])
		first := fmt.Sprintf(`<path d="M0,0L%s,0L%s,%s,L0,%sZ" style="fill:#FFFFFF" />`, dims[0], dims[0], dims[1], dims[1])
		first = strings.Replace(first, ",L0", "L0", 1)
		if !strings.Contains(s, first) {
			t.Errorf("%s chart: no white rectangle over the whole canvas (%s)", c.Kind, first)
		}
	}
	if !kinds["heating-plan"] || !kinds["voyage"] {
		t.Errorf("charts of kinds %v; the test wants a voyage's and a heating plan's among them", kinds)
	}
	names := caseLabels(run.Cases)
	seen := map[string]bool{}
	for _, n := range names {
		if seen[n] {
			t.Errorf("case label %q appears twice on the axis", n)
		}
		seen[n] = true
	}
}
