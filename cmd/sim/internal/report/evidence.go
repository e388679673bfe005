package report

import (
	"encoding/csv"
	"fmt"
	"io"
	"strconv"
	"strings"

	"steamcase/plant/profile"
)

// EvidenceFile is a file of an evidence folder and what it holds.
type EvidenceFile struct {
	Name, What string
}

// Readme writes the short text of an evidence folder: which program read
// which files, what the folder holds (files), what each audit checked and
// how, what it found, and the caution.
func Readme(w io.Writer, run Run, files []EvidenceFile) error {
	ew := &errWriter{w: w}
	v := run.Version
	if v == "" {
		v = "(version not given)"
	}
	fmt.Fprintf(ew, "Evidence record of a steamcase run\n\n")
	fmt.Fprintf(ew, "Program: steamcase %s\n", v)
	if len(run.Files) > 0 {
		fmt.Fprintf(ew, "Files read, with the SHA-256 of their bytes:\n")
		for _, f := range run.Files {
			fmt.Fprintf(ew, "  %s  %s (%d bytes)\n", f.SHA256, f.Name, f.Bytes)
		}
	}
	fmt.Fprintf(ew, "The scripts' math.random seed: %d. The same files, seeds and program give the same figures, byte for byte, on any number of cores.\n\n", run.LuaSeed)
	fmt.Fprintf(ew, "This folder holds:\n")
	width := 0
	for _, f := range files {
		width = max(width, len(f.Name))
	}
	for _, f := range files {
		fmt.Fprintf(ew, "  %-*s  %s\n", width, f.Name, f.What)
	}
	fmt.Fprintf(ew, "\nThe plants' defaults in force (keys their descriptions leave at the default, %d in all) are listed with their sources at the end of report.txt and under \"assumptions\" in run.json.\n",
		len(run.Assumptions))
	for _, a := range run.Audits {
		if a.Result != nil {
			writeAuditMethod(ew, a)
		}
	}
	if len(run.Audits) == 0 {
		fmt.Fprintf(ew, "\nThe run holds no audit: the figures are the model's, with nothing claimed to check them against.\n")
	}
	fmt.Fprintf(ew, "\n%s\n", Caution)
	return ew.err
}

// names lists the uncertain inputs of a scope.
func names(r *profile.AuditResult, s profile.Scope) string {
	var out []string
	for _, u := range r.Uncertainties {
		if u.Scope == s {
			n := u.Unit + "." + u.Param
			if u.Unit == "" {
				n = "the " + u.Param + " reading"
			}
			out = append(out, fmt.Sprintf("%s %s to %s", n, num(u.Low), num(u.High)))
		}
	}
	if len(out) == 0 {
		return "none"
	}
	return strings.Join(out, "; ")
}

// writeAuditMethod says what an audit checked and how, and what it found.
func writeAuditMethod(w io.Writer, a Audit) {
	r := a.Result
	p := r.Period
	fmt.Fprintf(w, "\nAudit \"%s\" of plant \"%s\"", a.Name, a.Plant)
	if a.Source != "" {
		fmt.Fprintf(w, " (run at %s)", a.Source)
	}
	fmt.Fprintf(w, ": %d days in the log, %d audited", len(r.Days), p.Days)
	if refs := len(r.Days) - p.Days; refs > 0 {
		fmt.Fprintf(w, ", %d reference days", refs)
	}
	fmt.Fprintf(w, "; the days claim %s.\n\n", claimsOf(r))
	fmt.Fprintf(w, "What was checked and how:\n")
	item := func(format string, v ...any) { fmt.Fprintf(w, "  - "+format+"\n", v...) }
	item("Each day's load case was solved for the plant's steady mass and energy balance: water and steam by IAPWS-IF97, each boiler's fuel from its energy balance with its efficiency model, the firing rule deciding which boilers fire.")
	what := "its boiler fuel"
	if r.ClaimsOf != "" {
		what = fmt.Sprintf("the fuel of %s: the day's fuel less its fuel with that cause's units off", r.ClaimsOf)
	}
	item("The quantity modelled for each day is %s.", what)
	item("Monte Carlo, %d samples, seed %d. Fixed inputs, drawn once per sample for the whole period: %s. Daily inputs, drawn afresh for each day: %s. Each uniform between its bounds.",
		r.Samples, r.Seed, names(r, profile.Fixed), names(r, profile.Daily))
	if len(r.Claim) == 0 {
		item("The claim was taken as exact: no measurement uncertainty was given.")
	} else {
		var terms []string
		for _, c := range r.Claim {
			terms = append(terms, c.Source.String()+" "+c.Text)
		}
		item("The claim's measurement uncertainty (%s) was drawn with each sample, so that the model is compared with what the measurement would read if the model were right.", strings.Join(terms, "; "))
	}
	item("The period's total was sampled as a whole (for each sample, the sum over the audited days); its band is the %s %% to %s %% quantile of those sums; the period is flagged when the claim lies beyond %s %% in either tail.",
		pct(r.LowQ, 0), pct(r.HighQ, 0), num3(50*r.Alpha))
	item("Each day: where the claim sits among that day's readings (its percentile); a day is flagged beyond %s %% in either tail (α/(2N), Bonferroni over %d days), so that an honest log is flagged anywhere with a chance of at most %s %%.",
		num3(100*r.DayTail), p.Days, num3(100*r.Alpha))
	for _, s := range r.Implied {
		item("Implied factor %s: for each day, the value that makes the model give the claim, the other inputs nominal, found by a bracketed search and Brent's method over the solved plant within %s to %s; its plausible range is %s to %s.",
			s.Name, num(s.SearchLow), num(s.SearchHigh), num(s.Low), num(s.High))
	}
	if c := r.Calibration; c != nil {
		item("Calibration: %s set on the %d reference days (%s off) so that their model gives their claim of %s t: %s, drawn from %s to %s (the claim ∓ its measurement uncertainty of %s t) for the audited days.",
			c.Name, c.Days, strings.Join(c.Off, ", "), fix(c.ClaimedT, 3), fix(c.Value, 4), fix(c.Low, 4), fix(c.High, 4), fix(c.ReadingHalfWidthT, 3))
	}
	for _, c := range r.Causes {
		item("Split: the fuel of %s (%s) is each day's fuel less its fuel with those units off, at the nominal inputs; what the causes do not account for is reported apart, not shared out.", c.Name, strings.Join(c.Units, ", "))
	}
	fmt.Fprintf(w, "\nWhat it found:\n")
	verdict := "within the model's spread: not flagged"
	switch p.Flag {
	case "above":
		verdict = "ABOVE what the plant can burn: flagged"
	case "below":
		verdict = "BELOW what the plant burns: flagged"
	}
	item("The period: claimed %s t against a modelled %s t (median %s t, band %s to %s t; as measured %s to %s t); P(model ≤ claim) = %s, P(model ≥ claim) = %s, Monte Carlo standard error %s. The claim lies %s.",
		fix(p.ClaimedT, 3), fix(p.NominalT, 3), fix(p.MedianT, 3), fix(p.LowT, 3), fix(p.HighT, 3), fix(p.ReadingLowT, 3), fix(p.ReadingHighT, 3),
		fix(p.PAtOrBelow, 4), fix(p.PAtOrAbove, 4), fix(p.StdErr, 4), verdict)
	var flagged []string
	for _, d := range r.Days {
		if d.Flag != "" {
			flagged = append(flagged, fmt.Sprintf("%s %s (percentile %s %%)", d.Date, d.Flag, pct(d.Percentile, 1)))
		}
	}
	if len(flagged) == 0 {
		item("No day is flagged.")
	} else {
		item("Days flagged: %s.", strings.Join(flagged, ", "))
	}
	for _, s := range r.Implied {
		if s.Found > 0 {
			item("%s implied on %d days: mean %s, from %s to %s, %d days outside its plausible range (a steady offset points to a systematic difference, a jumpy factor to misreporting).",
				s.Name, s.Found, fix(s.Mean, 4), fix(s.Min, 4), fix(s.Max, 4), s.Outside)
		}
		if n := s.Steps + s.Above + s.Below; n > 0 {
			item("%s: on %d days no value in the range searched gives the claim.", s.Name, n)
		}
	}
	for _, s := range r.Warnings {
		item("Warning: %s", oneLine(s))
	}
	warned := 0
	for _, d := range r.Days {
		if len(d.Warnings) > 0 {
			warned++
		}
	}
	if warned > 0 {
		item("%d days' cases warned; every warning is in report.txt and run.json, by day.", warned)
	}
}

// AuditSamplesCSV writes an audit's samples as CSV: for each sample, its
// number, the fixed inputs drawn for it (one column each, "unit.key"),
// and the period's modelled total and its reading, t. With the seed, the
// fixed draws let an auditor solve any sample again.
func AuditSamplesCSV(w io.Writer, a Audit) error {
	r := a.Result
	ew := &errWriter{w: w}
	cw := csv.NewWriter(ew)
	head := []string{"sample"}
	for _, j := range r.FixedIndex {
		u := r.Uncertainties[j]
		head = append(head, u.Unit+"."+u.Param)
	}
	head = append(head, "model_total_t", "reading_total_t")
	cw.Write(head)
	for k := range r.Period.ModelT {
		rec := []string{strconv.Itoa(k + 1)}
		if k < len(r.FixedDraws) {
			for _, v := range r.FixedDraws[k] {
				rec = append(rec, strconv.FormatFloat(v, 'g', -1, 64))
			}
		}
		rec = append(rec, fix(r.Period.ModelT[k], 6), fix(r.Period.ReadingT[k], 6))
		cw.Write(rec)
	}
	cw.Flush()
	if ew.err != nil {
		return ew.err
	}
	return cw.Error()
}
