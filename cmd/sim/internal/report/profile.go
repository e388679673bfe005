package report

import (
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"

	"steamcase/plant"
	"steamcase/plant/profile"
	"steamcase/plant/schema"
)

// Run is what a run reports: its load cases and its jobs over profiles
// (voyage plans, studies of plant variants, audits of reported fuel), each
// in the order the scripts ran them.
type Run struct {
	Cases   []Case
	Voyages []Voyage
	Studies []Study
	Audits  []Audit
	// HeatingPlans are the cargo heating plans (heating_plan()).
	HeatingPlans []HeatingPlan
	// Version is the version of the program that ran the scripts; the
	// JSON document carries it.
	Version string
	// Checks is the outcome of the scripts' check() calls; the JSON
	// document carries it (the other forms leave a failure to the
	// command's error output).
	Checks schema.Checks
	// Files are the script and data files the run read, in the order
	// first read, with their SHA-256; LuaSeed is the seed of the
	// scripts' math.random; Assumptions are the defaults in force on
	// the plants the run solved on. The JSON and the table carry them
	// (the run's record).
	Files       []File
	LuaSeed     uint64
	Assumptions []Assumption
}

// File is a file a run read: its name as the run gave it, its size and
// the SHA-256 of its bytes in hexadecimal.
type File struct {
	Name   string
	Bytes  int
	SHA256 string
}

// Assumption is a default in force on a plant the run solved on.
type Assumption struct {
	Plant string
	plant.Assumption
}

// Job says which job of a run a profile result belongs to: its name, the
// plant it ran on, where the script started it ("file:line") and where
// each of its rows (or audited days) was given, in order.
type Job struct {
	Name, Plant, Source string
	Rows                []string
}

// Voyage is a solved voyage plan.
type Voyage struct {
	Job
	Result *profile.Result
}

// Study is a comparison of plant variants over a profile.
type Study struct {
	Job
	Result *profile.StudyResult
}

// Audit is a check of reported daily boiler fuel against a modelled band.
type Audit struct {
	Job
	Result *profile.AuditResult
}

// empty reports whether the run has nothing to show.
func (r Run) empty() bool {
	return len(r.Cases) == 0 && len(r.Voyages) == 0 && len(r.Studies) == 0 && len(r.Audits) == 0 && len(r.HeatingPlans) == 0
}

// rowRef names a row (0-based index) by its number and, if known, where
// it was given: "row 5 (voyage.csv:6)".
func (j Job) rowRef(i int) string {
	s := "row " + strconv.Itoa(i+1)
	if i >= 0 && i < len(j.Rows) && j.Rows[i] != "" {
		s += " (" + j.Rows[i] + ")"
	}
	return s
}

// schemaJob is the job's part of its schema form.
func (j Job) schemaJob() schema.Job {
	return schema.Job{Name: j.Name, Plant: j.Plant, Source: j.Source, RowSources: j.Rows}
}

func (j Job) head(kind string) string {
	s := fmt.Sprintf("%s: %s\n  plant %q", kind, j.Name, j.Plant)
	if j.Source != "" {
		s += ", run at " + j.Source
	}
	return s + "\n"
}

// writeTotalsTable writes one line per set of totals under a header.
func writeTotalsTable(w io.Writer, names []string, totals []profile.Totals, firstCol string) {
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "    %s\t%8s\t%9s\t%9s\t%9s\t%9s\t%9s\t%9s\t%9s\t%9s\t\n", firstCol,
		"hours", "fuel t", "CO2 IMO t", "steam t", "EGE t", "saved t", "dumped t", "make-up t", "el. MWh")
	for i, t := range totals {
		fmt.Fprintf(tw, "    %s\t%8s\t%9s\t%9s\t%9s\t%9s\t%9s\t%9s\t%9s\t%9s\t\n", names[i],
			fix(t.Hours, 1), fix(t.FuelT, 3), fix(t.CO2T, 3), fix(t.SteamT, 1), fix(t.EGESteamT, 1),
			fix(t.FuelSavedT, 3), fix(t.DumpedT, 1), fix(t.MakeUpT, 1), fix(t.ElectricMWh, 2))
	}
	tw.Flush()
}

// writeGrades writes the boiler fuel by grade with its CO2 by the IMO
// factor (regulatory) and by the fuel's analysis.
func writeGrades(w io.Writer, t profile.Totals) {
	if len(t.FuelByGrade) == 0 {
		return
	}
	fmt.Fprintf(w, "  fuel by grade (CO2 by the IMO factor C_F for regulatory reporting; by the fuel's analysis beside):\n")
	for _, g := range t.FuelByGrade {
		an := "not known (no analysis)"
		if g.HasCO2Analysis {
			an = fix(g.CO2AnalysisT, 3) + " t"
		}
		fmt.Fprintf(w, "    %s: fuel %s t, CO2 %s t by the IMO factor, %s by the analysis\n", g.Grade, fix(g.FuelT, 3), fix(g.CO2T, 3), an)
	}
}

// hoursFiring writes "0 boilers 0.0 h, 1 boiler 306.0 h, 2 boilers 30.0 h".
func hoursFiring(h []float64) string {
	var parts []string
	for k, v := range h {
		unit := "boilers"
		if k == 1 {
			unit = "boiler"
		}
		parts = append(parts, fmt.Sprintf("%d %s %s h", k, unit, fix(v, 1)))
	}
	if len(parts) == 0 {
		return "-"
	}
	return strings.Join(parts, ", ")
}

func rowList(j Job, rows []int) string {
	if len(rows) == 0 {
		return "none"
	}
	var parts []string
	for i, r := range rows {
		if i == 10 {
			parts = append(parts, fmt.Sprintf("and %d more", len(rows)-10))
			break
		}
		parts = append(parts, j.rowRef(r))
	}
	return strings.Join(parts, ", ")
}

func writeVoyage(w io.Writer, v Voyage) {
	fmt.Fprint(w, v.head("Voyage"))
	r := v.Result
	t := r.Total
	fmt.Fprintf(w, "  %d periods, %s h\n\n", t.Rows, fix(t.Hours, 1))
	names := []string{}
	totals := []profile.Totals{}
	for _, p := range r.Phases {
		names = append(names, p.Phase)
		totals = append(totals, p.Totals)
	}
	names = append(names, "whole voyage")
	totals = append(totals, t)
	writeTotalsTable(w, names, totals, "phase")
	fmt.Fprintf(w, "\n  hours firing: %s\n", hoursFiring(t.HoursFiring))
	writeGrades(w, t)
	if t.Rows > 0 {
		fmt.Fprintf(w, "  peak demand on the boilers: %s kg/h in %s, against %s kg/h MCR of all boilers\n",
			fix(t.PeakBoilerKgS*kgh, 1), v.rowRef(t.PeakRow), fix(t.CapacityKgS*kgh, 1))
		fmt.Fprintf(w, "  tightest margin: %s kg/h in %s\n", fix(t.TightestMarginKgS*kgh, 1), v.rowRef(t.TightestRow))
	}
	fmt.Fprintf(w, "  periods the plant cannot carry: %s\n", rowList(v.Job, t.ShortRows))
	if t.N1CheckedRows == 0 {
		fmt.Fprintf(w, "  N-1: not checked (the plant's n_minus_1 = false)\n")
	} else {
		fmt.Fprintf(w, "  N-1 (a boiler trips, an economiser is out, a listed failure): %s h cannot be carried, in %s\n",
			fix(t.N1ShortHours, 1), rowList(v.Job, t.N1ShortRows))
	}
	if t.InertGasShortHours > 0 {
		fmt.Fprintf(w, "  inert gas from the boilers not met: %s h\n", fix(t.InertGasShortHours, 1))
	}
	writeVoyageTanks(w, v)
	writeRowWarnings(w, v)
}

// The voyage table lists the warnings of at most maxWarnRows periods, and
// at most maxWarnTexts of each; "and N more" says what it leaves out.
const (
	maxWarnRows  = 10
	maxWarnTexts = 3
)

// writeRowWarnings lists the periods with warnings, each with its
// warnings under it.
func writeRowWarnings(w io.Writer, v Voyage) {
	rows := v.Result.Total.WarningRows
	if len(rows) == 0 {
		fmt.Fprintf(w, "  periods with warnings: none\n")
		return
	}
	fmt.Fprintf(w, "  periods with warnings: %d of %d\n", len(rows), v.Result.Total.Rows)
	for n, i := range rows {
		if n == maxWarnRows {
			fmt.Fprintf(w, "    and %d more periods with warnings\n", len(rows)-maxWarnRows)
			break
		}
		if i < 0 || i >= len(v.Result.Rows) || !v.Result.Rows[i].Summary.Solved {
			continue
		}
		c := &v.Result.Rows[i].Summary
		fmt.Fprintf(w, "    %s, %q:\n", v.rowRef(i), c.Case)
		for k, s := range c.Warnings {
			if k == maxWarnTexts {
				fmt.Fprintf(w, "      - and %d more\n", len(c.Warnings)-maxWarnTexts)
				break
			}
			fmt.Fprintf(w, "      - %s\n", oneLine(s))
		}
	}
}

func writeStudy(w io.Writer, s Study) {
	fmt.Fprint(w, s.head("Study"))
	r := s.Result
	fmt.Fprintf(w, "  %d variants over a profile of %s h; savings against the first\n\n", len(r.Variants), fix(r.Hours, 1))
	names := make([]string, len(r.Variants))
	totals := make([]profile.Totals, len(r.Variants))
	for i, v := range r.Variants {
		names[i], totals[i] = v.Name, v.Totals
	}
	writeTotalsTable(w, names, totals, "variant")
	fmt.Fprintln(w)
	money := r.FuelPrice > 0 || r.CarbonPrice > 0
	cur := r.Currency
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "    variant\t%12s\t%14s\t", "fuel saved t", "CO2 avoided t")
	if money {
		fmt.Fprintf(tw, "%14s\t%14s\t%16s\t", "installed "+cur, "saved "+cur, "saved "+cur+"/yr")
		if r.HasNPV {
			fmt.Fprintf(tw, "%14s\t", "NPV "+cur)
		}
		fmt.Fprintf(tw, "%13s\t", "payback years")
	}
	fmt.Fprintf(tw, "%18s\t%17s\t%12s\t\n", "h gas below min.", "h near acid dew", "h soot risk")
	for i, v := range r.Variants {
		fmt.Fprintf(tw, "    %s\t%12s\t%14s\t", v.Name, fix(v.FuelSavedT, 3), fix(v.CO2AvoidedT, 3))
		if money {
			fmt.Fprintf(tw, "%14s\t%14s\t%16s\t", fix(v.InstalledCost, 0), fix(v.CostSaved+v.CarbonSaved, 0), fix(v.AnnualSaving, 0))
			if r.HasNPV {
				npv := fix(v.NPV, 0)
				if i == 0 {
					npv = "-"
				}
				fmt.Fprintf(tw, "%14s\t", npv)
			}
			fmt.Fprintf(tw, "%13s\t", paybackText(v.Money))
		}
		fmt.Fprintf(tw, "%18s\t%17s\t%12s\t\n", fix(v.HoursBelowMinGasT, 1), fix(v.HoursBelowAcidDew, 1), fix(v.HoursSootRisk, 1))
	}
	tw.Flush()
	if money {
		var parts []string
		if r.FuelPrice > 0 {
			parts = append(parts, fmt.Sprintf("fuel %s %s/t", fix(r.FuelPrice, 2), cur))
		}
		if r.CarbonPrice > 0 {
			parts = append(parts, fmt.Sprintf("carbon %s %s/t CO2", fix(r.CarbonPrice, 2), cur))
		}
		if r.InstalledCost > 0 {
			parts = append(parts, fmt.Sprintf("installed cost %s %s where a variant gives none", fix(r.InstalledCost, 0), cur))
		}
		if r.HasNPV {
			parts = append(parts, fmt.Sprintf("NPV over %d years at %s %% a year", r.LifeYears, fix(100*r.DiscountRate, 2)))
		}
		fmt.Fprintf(w, "  %s; savings scaled to a year of %d h; payback and NPV on the installed cost above the first variant's\n",
			strings.Join(parts, ", "), profile.HoursPerYear)
	}
	if sootHours(r) {
		fmt.Fprintf(w, "  %s\n", wrapText(schema.SootFireCaution, 96, "  "))
	}
	if r.Sweep != nil {
		writeSweep(w, r)
	}
	writeVariantWarnings(w, s)
}

// sootHours reports whether a study counts any hours at soot-risk loads.
func sootHours(r *profile.StudyResult) bool {
	for _, v := range r.Variants {
		if v.HoursSootRisk > 0 {
			return true
		}
	}
	if r.Sweep != nil {
		for _, p := range r.Sweep.Points {
			if p.HoursSootRisk > 0 {
				return true
			}
		}
	}
	return false
}

// paybackText is a payback for the table: "-" where there is none to
// give, "never" where nothing is saved.
func paybackText(m profile.Money) string {
	switch {
	case !m.HasPayback:
		return "-"
	case math.IsInf(m.PaybackYears, 0) || math.IsNaN(m.PaybackYears):
		return "never"
	}
	return fix(m.PaybackYears, 2)
}

// sizeText is a sweep's size in the unit scripts give it: kW/K for ua, K
// for a pinch.
func sizeText(param string, v float64) string {
	if param == "ua" {
		return fix(v/1e3, 2) + " kW/K"
	}
	return fix(v, 1) + " K"
}

// writeSweep writes a study's sweep of size: a line per size, the best
// marked.
func writeSweep(w io.Writer, r *profile.StudyResult) {
	sw := r.Sweep
	cur := r.Currency
	perYear := float64(profile.HoursPerYear) / r.Hours
	exp := sw.Cost.Exponent
	if exp == 0 {
		exp = profile.DefaultCostExponent
	}
	fmt.Fprintf(w, "\n  Sweep of %s %s: installed cost %s + %s·(UA/%s)^%s %s\n", sw.Unit, sw.Param,
		fix(sw.Cost.Fixed, 0), fix(sw.Cost.RefCost, 0), sizeText("ua", sw.Cost.RefUA), strconv.FormatFloat(exp, 'g', 4, 64), cur)
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "    %s\t%11s\t%14s\t%17s\t%17s\t%17s\t%14s\t%13s\t%12s\t\n", sw.Param, "UA kW/K", "installed "+cur,
		"fuel saved t/yr", "EGE steam t/yr", "dumped t/yr", "NPV "+cur, "payback years", "h soot risk")
	for k, pt := range sw.Points {
		mark := ""
		if k == sw.Best {
			mark = "best NPV"
		}
		fmt.Fprintf(tw, "    %s\t%11s\t%14s\t%17s\t%17s\t%17s\t%14s\t%13s\t%12s\t%s\n", sizeText(sw.Param, pt.Value), fix(pt.UA/1e3, 2),
			fix(pt.InstalledCost, 0), fix(pt.FuelSavedT*perYear, 1), fix(pt.EGESteamT*perYear, 1), fix(pt.DumpedT*perYear, 1),
			fix(pt.NPV, 0), paybackText(pt.Money), fix(pt.HoursSootRisk, 1), mark)
	}
	tw.Flush()
}

// wrapText breaks s into lines of at most width runes, each line after the
// first starting with indent.
func wrapText(s string, width int, indent string) string {
	var b strings.Builder
	n := 0
	for i, word := range strings.Fields(s) {
		l := len([]rune(word))
		if i > 0 && n+1+l > width {
			b.WriteString("\n" + indent)
			n = 0
		} else if i > 0 {
			b.WriteByte(' ')
			n++
		}
		b.WriteString(word)
		n += l
	}
	return b.String()
}

// writeVariantWarnings lists, for each variant, its rows with warnings,
// each with its warnings under it (as many as a voyage's table shows;
// the JSON and the CSV have them all).
func writeVariantWarnings(w io.Writer, s Study) {
	any := false
	for _, v := range s.Result.Variants {
		any = any || len(v.RowWarnings) > 0
	}
	if !any {
		fmt.Fprintf(w, "  rows with warnings: none\n")
		return
	}
	fmt.Fprintf(w, "  rows with warnings, by variant:\n")
	for _, v := range s.Result.Variants {
		fmt.Fprintf(w, "    %s: %d of %d rows\n", v.Name, len(v.RowWarnings), v.Totals.Rows)
		for n, rw := range v.RowWarnings {
			if n == maxWarnRows {
				fmt.Fprintf(w, "      and %d more rows with warnings\n", len(v.RowWarnings)-maxWarnRows)
				break
			}
			fmt.Fprintf(w, "      %s:\n", s.rowRef(rw.Row))
			for k, text := range rw.Texts {
				if k == maxWarnTexts {
					fmt.Fprintf(w, "        - and %d more\n", len(rw.Texts)-maxWarnTexts)
					break
				}
				fmt.Fprintf(w, "        - %s\n", oneLine(text))
			}
		}
	}
}
