package report

import (
	"fmt"
	"io"
	"text/tabwriter"
)

// seriesLen is how many cases from the first of cases form one series:
// consecutive cases of one plant that a script grouped under one series
// name (case{series = "..."}); 1 when the first is in none.
func seriesLen(cases []Case) int {
	s := cases[0].Result.Series
	if s == "" {
		return 1
	}
	n := 1
	for n < len(cases) && cases[n].Result.Series == s && cases[n].Plant == cases[0].Plant {
		n++
	}
	return n
}

// degrees is a temperature in °C for a table's column, "-" when not given.
func degrees(k float64) string {
	if k <= 0 {
		return "-"
	}
	return fix(k-273.15, 1)
}

// writeSeries writes a series of cases (a sweep) as one table, a row per
// case: its conditions, how many boilers fire, the steam demand and the
// margin, the fuel, and its warnings counted (each listed below the
// table, with the row it belongs to). first is the first case's number in
// the run.
func writeSeries(w io.Writer, first, total int, cases []Case) {
	r0 := cases[0].Result
	fmt.Fprintf(w, "Load cases %d to %d of %d: series %q, %d cases\n", first, first+len(cases)-1, total, r0.Series, len(cases))
	where := ""
	if s := r0.Pos.String(); s != "" {
		where = ", the first solved at " + s
	}
	fmt.Fprintf(w, "  plant %q%s\n\n", cases[0].Plant, where)
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "    \tcase\tsea °C\tair °C\tengine %\tfiring\tdemand kg/h\tmargin kg/h\tfuel kg/h\tfuel t/day\twarnings\t")
	labels := caseLabels(cases)
	var notes []string
	converged := true
	for i, c := range cases {
		r := c.Result
		converged = converged && r.Converged
		carry := fmt.Sprintf("%d", r.BoilersFiring)
		if !r.CanCarry {
			carry += " SHORT"
		}
		fmt.Fprintf(tw, "    \t%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\t%d\t\n", labels[i],
			degrees(r.Conditions.SeaT), degrees(r.Conditions.AirT), fix(100*r.Conditions.EngineLoad, 1), carry,
			fix(r.SteamDemandKgS*kgh, 1), fix(r.MarginNextKgS*kgh, 1), fix(r.FuelKgS*kgh, 1), fix(r.FuelKgS*86.4, 3), len(r.Warnings))
		for _, wn := range r.Warnings {
			notes = append(notes, fmt.Sprintf("%s: %s", labels[i], wn))
		}
	}
	tw.Flush()
	fmt.Fprintln(w, "  (\"-\": a temperature the case does not give; SHORT: the plant cannot carry the case)")
	if !converged {
		fmt.Fprintln(w, "\n  solution: not every case converged; see the JSON (converged, residual_norm)")
	}
	if len(notes) == 0 {
		fmt.Fprintln(w, "\n  warnings: none")
		return
	}
	fmt.Fprintf(w, "\n  warnings (%d):\n", len(notes))
	const most = 20
	for i, n := range notes {
		if i == most {
			fmt.Fprintf(w, "    - and %d more (every warning is in the JSON)\n", len(notes)-most)
			break
		}
		fmt.Fprintf(w, "    - %s\n", oneLine(n))
	}
}
