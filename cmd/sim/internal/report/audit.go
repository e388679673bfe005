package report

import (
	"fmt"
	"io"
	"strconv"
	"strings"
	"text/tabwriter"

	"steamcase/plant"
	"steamcase/plant/profile"
)

// pct formats a share as a percentage with dec decimals.
func pct(v float64, dec int) string { return fix(100*v, dec) }

// num formats a value as given, in six significant digits.
func num(v float64) string { return strconv.FormatFloat(v, 'g', 6, 64) }

// num3 formats a value in three significant digits.
func num3(v float64) string { return strconv.FormatFloat(v, 'g', 3, 64) }

// claimsOf names what an audit's days claim.
func claimsOf(r *profile.AuditResult) string {
	if r.ClaimsOf == "" {
		return "boiler fuel"
	}
	return "the fuel of " + r.ClaimsOf
}

// impliedCell is a day's implied factor as the table shows it.
func impliedCell(v profile.ImpliedValue) string {
	switch v.Status {
	case profile.ImpliedFound:
		return fix(v.Value, 4)
	case profile.ImpliedStep:
		return "step at " + fix(v.Value, 4)
	case profile.ImpliedAbove:
		return "none (model above)"
	case profile.ImpliedBelow:
		return "none (model below)"
	case profile.ImpliedNoEffect:
		return "no effect"
	}
	return "-"
}

// writeAudit writes an audit: its head, the days against the model, the
// verdicts, the implied factors, the calibration, the fuel by cause and
// by grade, the uncertain inputs, the assumptions and the warnings.
func writeAudit(w io.Writer, a Audit) {
	fmt.Fprint(w, a.head("Audit"))
	r := a.Result
	writeAuditHead(w, r)
	writeAuditDays(w, r)
	writeAuditVerdicts(w, r)
	writeAuditImplied(w, r)
	if c := r.Calibration; c != nil {
		fmt.Fprintf(w, "\n  Calibration: %s on %d reference days (%s off), claiming %s t: %s, from %s to %s for the claim ∓ %s t of measurement; the range given was %s to %s\n",
			c.Name, c.Days, strings.Join(c.Off, ", "), fix(c.ClaimedT, 3), fix(c.Value, 4), fix(c.Low, 4), fix(c.High, 4),
			fix(c.ReadingHalfWidthT, 3), num(c.PriorLow), num(c.PriorHigh))
	}
	writeAuditFuel(w, r)
	writeAuditInputs(w, r)
	writeAuditWarnings(w, r)
}

// writeAuditHead writes the audit's days, its sampling, the level of its
// flags and the claim's measurement.
func writeAuditHead(w io.Writer, r *profile.AuditResult) {
	refs := len(r.Days) - r.Period.Days
	fmt.Fprintf(w, "  %d days", len(r.Days))
	if refs > 0 {
		fmt.Fprintf(w, ": %d audited, %d reference", r.Period.Days, refs)
	}
	fmt.Fprintf(w, "; the days claim %s\n", claimsOf(r))
	fmt.Fprintf(w, "  %d samples (seed %d); bands from the %s %% to the %s %% quantile\n", r.Samples, r.Seed, pct(r.LowQ, 0), pct(r.HighQ, 0))
	fmt.Fprintf(w, "  flags at α = %s %%: the period in either tail beyond %s %%, a day beyond %s %% (Bonferroni over %d days)\n",
		num3(100*r.Alpha), num3(50*r.Alpha), num3(100*r.DayTail), r.Period.Days)
	if len(r.Claim) == 0 {
		fmt.Fprintf(w, "  the claim is taken as exact: no measurement uncertainty was given\n")
	} else {
		fmt.Fprintf(w, "  the claim's measurement:\n")
		for _, c := range r.Claim {
			fmt.Fprintf(w, "    - %s: %s\n", c.Source, c.Text)
		}
	}
	fmt.Fprintln(w)
}

// writeAuditDays writes the table of the days and the period: the claim
// against the model's nominal figure, band and median, the band of what
// the claim's measurement would read, the claim's percentile and flag.
func writeAuditDays(w io.Writer, r *profile.AuditResult) {
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "    day\tphase\t%10s\t%10s\t%10s\t%10s\t%10s\t%10s\t%10s\t%7s\tflag\n",
		"claimed t", "nominal t", "low t", "median t", "high t", "read low t", "read hi t", "pct.")
	for _, d := range r.Days {
		if d.Reference {
			fmt.Fprintf(tw, "    %s\t%s\t%10s\t%10s\t%10s\t%10s\t%10s\t%10s\t%10s\t%7s\treference day\n", d.Date, d.Phase,
				fix(d.ClaimedT, 3), fix(d.NominalT, 3), "", "", "", "", "", "")
			continue
		}
		fmt.Fprintf(tw, "    %s\t%s\t%10s\t%10s\t%10s\t%10s\t%10s\t%10s\t%10s\t%7s\t%s\n", d.Date, d.Phase,
			fix(d.ClaimedT, 3), fix(d.NominalT, 3), fix(d.LowT, 3), fix(d.MedianT, 3), fix(d.HighT, 3),
			fix(d.ReadingLowT, 3), fix(d.ReadingHighT, 3), pct(d.Percentile, 1), d.Flag)
	}
	p := r.Period
	fmt.Fprintf(tw, "    period\t%d days\t%10s\t%10s\t%10s\t%10s\t%10s\t%10s\t%10s\t%7s\t%s\n", p.Days,
		fix(p.ClaimedT, 3), fix(p.NominalT, 3), fix(p.LowT, 3), fix(p.MedianT, 3), fix(p.HighT, 3),
		fix(p.ReadingLowT, 3), fix(p.ReadingHighT, 3), pct(p.Percentile, 1), p.Flag)
	tw.Flush()
	fmt.Fprintf(w, "  (low, median, high: the model; read: the band of what the claim's measurement would read if the model were right;\n")
	fmt.Fprintf(w, "   pct.: where the claim sits among those readings; the period's total is sampled as a whole)\n\n")
}

// writeAuditVerdicts writes the period's verdict, with the probabilities
// of the model at or below and at or above the claim, and the days
// flagged.
func writeAuditVerdicts(w io.Writer, r *profile.AuditResult) {
	p := r.Period
	verdict := "the claim lies within the model's spread"
	switch p.Flag {
	case "above":
		verdict = "the claim lies ABOVE what the plant can burn (flagged)"
	case "below":
		verdict = "the claim lies BELOW what the plant burns (flagged)"
	}
	fmt.Fprintf(w, "  the period: P(model ≤ claim) = %s, P(model ≥ claim) = %s (Monte Carlo standard error %s): %s\n",
		fix(p.PAtOrBelow, 4), fix(p.PAtOrAbove, 4), fix(p.StdErr, 4), verdict)
	var flagged []string
	for _, d := range r.Days {
		if d.Flag != "" {
			flagged = append(flagged, d.Date+" "+d.Flag)
		}
	}
	if len(flagged) == 0 {
		fmt.Fprintf(w, "  days flagged: none of %d\n", p.Days)
	} else {
		fmt.Fprintf(w, "  days flagged: %d of %d (%s)\n", len(flagged), p.Days, strings.Join(flagged, ", "))
	}
}

// writeAuditImplied writes the implied factors, if any: each day's value
// of each, and each one's summary over the audited days.
func writeAuditImplied(w io.Writer, r *profile.AuditResult) {
	if len(r.Implied) == 0 {
		return
	}
	fmt.Fprintf(w, "\n  Implied factors: the value of each that makes the model give the day's claim, the other inputs nominal\n")
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "    day\t")
	for _, s := range r.Implied {
		fmt.Fprintf(tw, "%s\t", s.Name)
	}
	fmt.Fprintln(tw)
	for _, d := range r.Days {
		fmt.Fprintf(tw, "    %s\t", d.Date)
		for _, v := range d.Implied {
			fmt.Fprintf(tw, "%s\t", impliedCell(v))
		}
		fmt.Fprintln(tw)
	}
	tw.Flush()
	for _, s := range r.Implied {
		fmt.Fprintf(w, "    %s: plausible %s to %s, searched %s to %s; ", s.Name, num(s.Low), num(s.High), num(s.SearchLow), num(s.SearchHigh))
		if s.Found == 0 {
			fmt.Fprintf(w, "no audited day has a value")
		} else {
			fmt.Fprintf(w, "on %d audited days mean %s", s.Found, fix(s.Mean, 4))
			if s.Found > 1 {
				fmt.Fprintf(w, ", sd %s", fix(s.SD, 4))
			}
			fmt.Fprintf(w, ", from %s to %s; %d outside the plausible range", fix(s.Min, 4), fix(s.Max, 4), s.Outside)
		}
		if n := s.Steps + s.Above + s.Below; n > 0 {
			fmt.Fprintf(w, "; %d days without a value", n)
		}
		if s.NoEffect > 0 {
			fmt.Fprintf(w, "; no effect on %d days", s.NoEffect)
		}
		fmt.Fprintln(w)
	}
	fmt.Fprintf(w, "    (a steady offset points to a systematic difference, a jumpy factor to misreporting)\n")
}

// writeAuditFuel writes the log's fuel at the nominal inputs by cause,
// if the audit splits any out, and by grade.
func writeAuditFuel(w io.Writer, r *profile.AuditResult) {
	if len(r.Causes) > 0 {
		fmt.Fprintf(w, "\n  Fuel by cause, every day of the log at the nominal inputs (each cause's marginal share: the fuel less the fuel with its units off)\n")
		tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
		for _, c := range r.Causes {
			fmt.Fprintf(tw, "    %s (%s)\t%10s t\n", c.Name, strings.Join(c.Units, ", "), fix(c.FuelT, 3))
		}
		fmt.Fprintf(tw, "    base load and interaction of the causes\t%10s t\n", fix(r.BaseT, 3))
		fmt.Fprintf(tw, "    boiler fuel\t%10s t\n", fix(r.FuelT, 3))
		tw.Flush()
	}
	fmt.Fprintf(w, "\n  Fuel by grade, every day of the log at the nominal inputs (CO2 by each grade's factor)\n")
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "    grade\t%10s\t%10s\n", "fuel t", "CO2 t")
	for _, g := range r.FuelByGrade {
		fmt.Fprintf(tw, "    %s\t%10s\t%10s\n", g.Grade, fix(g.FuelT, 3), fix(g.CO2T, 3))
	}
	fmt.Fprintf(tw, "    all\t%10s\t%10s\n", fix(r.FuelT, 3), fix(r.CO2T, 3))
	tw.Flush()
}

// writeAuditInputs writes the uncertain inputs as drawn (range, nominal,
// scope and why) and the audit's assumptions.
func writeAuditInputs(w io.Writer, r *profile.AuditResult) {
	if len(r.Uncertainties) > 0 {
		fmt.Fprintf(w, "\n  Uncertain inputs (drawn uniformly; SI units or fractions):\n")
		for _, u := range r.Uncertainties {
			name := u.Unit + " " + u.Param
			if u.Unit == "" {
				name = "the " + u.Param + " reading's error, K,"
			}
			how := u.Why
			if strings.HasPrefix(how, "default for ") {
				how = "the default scope of " + u.Param
			}
			fmt.Fprintf(w, "    - %s from %s to %s, nominal %s, %s (%s)\n", name, num(u.Low), num(u.High), num(u.Nominal), u.Scope, how)
		}
	}
	fmt.Fprintf(w, "\n  Assumptions:\n")
	for _, as := range r.Assumptions {
		fmt.Fprintf(w, "    - %s: %s (%s)\n", as.Item, as.Value, as.Source)
	}
}

// writeAuditWarnings writes the audit's own warnings and, day by day,
// the warnings of the day's nominal case and how many samples warned.
func writeAuditWarnings(w io.Writer, r *profile.AuditResult) {
	if len(r.Warnings) > 0 {
		fmt.Fprintf(w, "\n  Warnings of the audit:\n")
		for _, s := range r.Warnings {
			fmt.Fprintf(w, "    - %s\n", oneLine(s))
		}
	}
	any := false
	for _, d := range r.Days {
		if len(d.Warnings) == 0 && d.SampleWarnings == 0 {
			continue
		}
		if !any {
			fmt.Fprintf(w, "\n  Warnings by day (of the day's nominal case; and how many samples warned):\n")
			any = true
		}
		if d.Reference {
			fmt.Fprintf(w, "    %s (reference day, not sampled):\n", d.Date)
		} else {
			fmt.Fprintf(w, "    %s: %d of %d samples warned\n", d.Date, d.SampleWarnings, r.Samples)
		}
		for _, s := range d.Warnings {
			fmt.Fprintf(w, "      - %s\n", oneLine(s))
		}
	}
	if !any {
		fmt.Fprintf(w, "\n  Warnings by day: none\n")
	}
}

// writeRecord writes the run's record: the program's version, the files
// read with their SHA-256, the scripts' seed, and the defaults in force
// on each plant solved on.
func writeRecord(w io.Writer, run Run) {
	fmt.Fprintf(w, "Run record\n")
	v := run.Version
	if v == "" {
		v = "not given"
	}
	fmt.Fprintf(w, "  program: steamcase %s\n", v)
	if len(run.Files) > 0 {
		fmt.Fprintf(w, "  files read (SHA-256):\n")
		tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
		for _, f := range run.Files {
			fmt.Fprintf(tw, "    %s\t%d bytes\t%s\n", f.Name, f.Bytes, f.SHA256)
		}
		tw.Flush()
	}
	fmt.Fprintf(w, "  scripts' math.random seed: %d\n", run.LuaSeed)
	if len(run.Assumptions) == 0 {
		return
	}
	fmt.Fprintf(w, "  defaults in force (keys the plant's description leaves at the registry's default; a case may change some):\n")
	for i := 0; i < len(run.Assumptions); {
		j := i
		for j < len(run.Assumptions) && run.Assumptions[j].Plant == run.Assumptions[i].Plant {
			j++
		}
		writeAssumptions(w, run.Assumptions[i].Plant, run.Assumptions[i:j])
		i = j
	}
}

// writeAssumptions writes one plant's defaults in force: each figure
// assumed with its value and source on a line of its own, then the keys
// whose default leaves an effect out, is taken from elsewhere, or is the
// model's rule, by name on a few wrapped lines (their values are in the
// JSON's assumptions and in plant's key reference).
func writeAssumptions(w io.Writer, plantName string, as []Assumption) {
	fmt.Fprintf(w, "    plant \"%s\":\n", plantName) // escaped by the caller, as every name but the jobs' plants
	groups := []struct {
		source, head string
		keys         []string
	}{
		{source: plant.SourceLeftOut, head: "left out unless given"},
		{source: plant.SourceDerived, head: "taken from the description or the case"},
		{source: plant.SourceRule, head: "the model's rule"},
	}
	for _, a := range as {
		grouped := false
		for g := range groups {
			if a.Source == groups[g].source {
				groups[g].keys = append(groups[g].keys, a.Unit+"."+a.Key)
				grouped = true
			}
		}
		if grouped {
			continue
		}
		src := a.Source
		if src == "" {
			src = "no source recorded in the key registry"
		}
		fmt.Fprintf(w, "      %s.%s (%s) %s: %s\n", a.Unit, a.Key, a.Kind, a.Label, a.Value+"; "+src)
	}
	for _, g := range groups {
		if len(g.keys) == 0 {
			continue
		}
		writeWrapped(w, "      "+g.head+" ("+strconv.Itoa(len(g.keys))+"): ", "        ", strings.Join(g.keys, ", "), 92)
	}
}

// writeWrapped writes first+text, breaking text at spaces so that no line
// passes width; continuation lines start with indent.
func writeWrapped(w io.Writer, first, indent, text string, width int) {
	line := first
	start := true
	for _, word := range strings.Fields(text) {
		if !start && len(line)+1+len(word) > width {
			fmt.Fprintln(w, line)
			line, start = indent, true
		}
		if !start {
			line += " "
		}
		line += word
		start = false
	}
	fmt.Fprintln(w, line)
}
