package report

import (
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"

	"steamcase/plant/profile"
)

// Run is what a run reports: its load cases and its jobs over profiles
// (voyage plans, studies of plant variants, audits of reported fuel), each
// in the order the scripts ran them.
type Run struct {
	Cases   []Case
	Voyages []Voyage
	Studies []Study
	Audits  []Audit
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
	return len(r.Cases) == 0 && len(r.Voyages) == 0 && len(r.Studies) == 0 && len(r.Audits) == 0
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
		"hours", "fuel t", "CO2 t", "steam t", "EGE t", "saved t", "dumped t", "make-up t", "el. MWh")
	for i, t := range totals {
		fmt.Fprintf(tw, "    %s\t%8s\t%9s\t%9s\t%9s\t%9s\t%9s\t%9s\t%9s\t%9s\t\n", names[i],
			fix(t.Hours, 1), fix(t.FuelT, 3), fix(t.CO2T, 3), fix(t.SteamT, 1), fix(t.EGESteamT, 1),
			fix(t.FuelSavedT, 3), fix(t.DumpedT, 1), fix(t.MakeUpT, 1), fix(t.ElectricMWh, 2))
	}
	tw.Flush()
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
	if t.Rows > 0 {
		fmt.Fprintf(w, "  peak demand on the boilers: %s kg/h in %s, against %s kg/h MCR of all boilers\n",
			fix(t.PeakBoilerKgS*kgh, 1), v.rowRef(t.PeakRow), fix(t.CapacityKgS*kgh, 1))
		fmt.Fprintf(w, "  tightest margin: %s kg/h in %s\n", fix(t.TightestMarginKgS*kgh, 1), v.rowRef(t.TightestRow))
	}
	fmt.Fprintf(w, "  periods the plant cannot carry: %s\n", rowList(v.Job, t.ShortRows))
	fmt.Fprintf(w, "  periods with warnings: %s\n", rowList(v.Job, t.WarningRows))
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
	money := r.FuelPrice > 0
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "    variant\t%12s\t%14s\t", "fuel saved t", "CO2 avoided t")
	if money {
		fmt.Fprintf(tw, "%14s\t%13s\t", "saved "+r.Currency, "payback years")
	}
	fmt.Fprintf(tw, "%18s\t\n", "h gas below min.")
	for i, v := range r.Variants {
		fmt.Fprintf(tw, "    %s\t%12s\t%14s\t", v.Name, fix(v.FuelSavedT, 3), fix(v.CO2AvoidedT, 3))
		if money {
			payback := "never"
			if !math.IsInf(v.PaybackYears, 0) && !math.IsNaN(v.PaybackYears) && v.CostSaved > 0 {
				payback = fix(v.PaybackYears, 2)
			}
			if r.InstalledCost == 0 || i == 0 {
				payback = "-" // no cost given, or the base itself
			}
			fmt.Fprintf(tw, "%14s\t%13s\t", fix(v.CostSaved, 0), payback)
		}
		fmt.Fprintf(tw, "%18s\t\n", fix(v.HoursBelowMinGasT, 1))
	}
	tw.Flush()
	if money {
		fmt.Fprintf(w, "  fuel price %s %s/t", fix(r.FuelPrice, 2), r.Currency)
		if r.InstalledCost > 0 {
			fmt.Fprintf(w, ", installed cost %s %s", fix(r.InstalledCost, 0), r.Currency)
		}
		fmt.Fprintln(w)
	}
}

func writeAudit(w io.Writer, a Audit) {
	fmt.Fprint(w, a.head("Audit"))
	r := a.Result
	fmt.Fprintf(w, "  %d days; band from the %s %% to the %s %% quantile of %d samples a day (seed %d)\n\n",
		len(r.Days), fix(r.LowQ*100, 0), fix(r.HighQ*100, 0), r.Samples, r.Seed)
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "    day\tphase\t%10s\t%10s\t%10s\t%10s\t%10s\tflag\n", "claimed t", "nominal t", "low t", "median t", "high t")
	for _, d := range r.Days {
		flag := ""
		if d.Flag != "" {
			flag = d.Flag + " the band"
		}
		fmt.Fprintf(tw, "    %s\t%s\t%10s\t%10s\t%10s\t%10s\t%10s\t%s\n", d.Date, d.Phase, fix(d.ClaimedT, 3),
			fix(d.NominalT, 3), fix(d.LowT, 3), fix(d.MedianT, 3), fix(d.HighT, 3), flag)
	}
	fmt.Fprintf(tw, "    total\t\t%10s\t%10s\t%10s\t%10s\t%10s\t\n", fix(r.ClaimedT, 3), fix(r.NominalT, 3), fix(r.LowT, 3), "", fix(r.HighT, 3))
	tw.Flush()
	fmt.Fprintf(w, "\n  days outside the band: %d; claimed above the band by %s t in all\n", r.Flagged, fix(r.ExcessT, 3))
	if len(r.Uncertainties) > 0 {
		fmt.Fprintf(w, "  uncertain inputs (drawn uniformly):\n")
		for _, u := range r.Uncertainties {
			fmt.Fprintf(w, "    - %s %s from %s to %s\n", u.Unit, u.Param,
				strconv.FormatFloat(u.Low, 'g', 6, 64), strconv.FormatFloat(u.High, 'g', 6, 64))
		}
	}
}

// totalsJSON is profile.Totals in the JSON form.
type totalsJSON struct {
	Rows              int       `json:"rows"`
	Hours             float64   `json:"hours"`
	FuelT             float64   `json:"fuel_t"`
	CO2T              float64   `json:"co2_t"`
	SteamT            float64   `json:"steam_t"`
	EGESteamT         float64   `json:"ege_steam_t"`
	FuelSavedT        float64   `json:"ege_fuel_saved_t"`
	DumpedT           float64   `json:"dumped_t"`
	MakeUpT           float64   `json:"makeup_t"`
	ElectricMWh       float64   `json:"electric_MWh"`
	HoursFiring       []float64 `json:"hours_firing"`
	PeakBoilerKgH     float64   `json:"peak_boiler_kg_h"`
	PeakRow           int       `json:"peak_row"`
	CapacityKgH       float64   `json:"capacity_kg_h"`
	TightestMarginKgH float64   `json:"tightest_margin_kg_h"`
	TightestRow       int       `json:"tightest_row"`
	ShortRows         []int     `json:"short_rows"`
	WarningRows       []int     `json:"warning_rows"`
}

// rows1 turns 0-based row indexes into the 1-based numbers the report
// shows.
func rows1(rows []int) []int {
	out := make([]int, len(rows))
	for i, r := range rows {
		out[i] = r + 1
	}
	return out
}

func totalsOf(t profile.Totals) totalsJSON {
	hf := append([]float64{}, t.HoursFiring...)
	for i := range hf {
		hf[i] = r6(hf[i])
	}
	return totalsJSON{
		Rows: t.Rows, Hours: r6(t.Hours), FuelT: r6(t.FuelT), CO2T: r6(t.CO2T), SteamT: r6(t.SteamT),
		EGESteamT: r6(t.EGESteamT), FuelSavedT: r6(t.FuelSavedT), DumpedT: r6(t.DumpedT), MakeUpT: r6(t.MakeUpT),
		ElectricMWh: r6(t.ElectricMWh), HoursFiring: hf,
		PeakBoilerKgH: r6(t.PeakBoilerKgS * kgh), PeakRow: t.PeakRow + 1, CapacityKgH: r6(t.CapacityKgS * kgh),
		TightestMarginKgH: r6(t.TightestMarginKgS * kgh), TightestRow: t.TightestRow + 1,
		ShortRows: rows1(t.ShortRows), WarningRows: rows1(t.WarningRows),
	}
}

type jobJSON struct {
	Name   string   `json:"name"`
	Plant  string   `json:"plant"`
	Source string   `json:"source"`
	Rows   []string `json:"row_sources"`
}

func jobOf(j Job) jobJSON {
	rows := append([]string{}, j.Rows...)
	return jobJSON{Name: j.Name, Plant: j.Plant, Source: j.Source, Rows: rows}
}

type phaseJSON struct {
	Phase string `json:"phase"`
	totalsJSON
}

type voyageRowJSON struct {
	Row           int     `json:"row"`
	Phase         string  `json:"phase"`
	Hours         float64 `json:"hours"`
	Case          string  `json:"case"`
	BoilersFiring int     `json:"boilers_firing"`
	CanCarry      bool    `json:"can_carry"`
	DemandKgH     float64 `json:"steam_demand_kg_h"`
	FuelKgH       float64 `json:"fuel_kg_h"`
	MarginKgH     float64 `json:"margin_kg_h"`
	Warnings      int     `json:"warnings"`
}

type voyageJSON struct {
	jobJSON
	Total  totalsJSON      `json:"total"`
	Phases []phaseJSON     `json:"phases"`
	Rows   []voyageRowJSON `json:"rows"`
}

type variantJSON struct {
	Name              string     `json:"name"`
	Totals            totalsJSON `json:"totals"`
	FuelSavedT        float64    `json:"fuel_saved_t"`
	CO2AvoidedT       float64    `json:"co2_avoided_t"`
	CostSaved         float64    `json:"cost_saved"`
	PaybackYears      *float64   `json:"payback_years"`
	HoursBelowMinGasT float64    `json:"hours_below_min_gas_T"`
}

type studyJSON struct {
	jobJSON
	Hours         float64       `json:"hours"`
	FuelPrice     float64       `json:"fuel_price_per_t"`
	InstalledCost float64       `json:"installed_cost"`
	Currency      string        `json:"currency"`
	Variants      []variantJSON `json:"variants"`
}

type dayJSON struct {
	Date     string  `json:"date"`
	Phase    string  `json:"phase"`
	ClaimedT float64 `json:"claimed_t"`
	NominalT float64 `json:"nominal_t"`
	LowT     float64 `json:"low_t"`
	MedianT  float64 `json:"median_t"`
	HighT    float64 `json:"high_t"`
	Flag     string  `json:"flag"`
}

type uncertainJSON struct {
	Unit  string  `json:"unit"`
	Param string  `json:"param"`
	Low   float64 `json:"low"`
	High  float64 `json:"high"`
}

type auditJSON struct {
	jobJSON
	Samples       int             `json:"samples"`
	Seed          uint64          `json:"seed"`
	LowQ          float64         `json:"low_quantile"`
	HighQ         float64         `json:"high_quantile"`
	ClaimedT      float64         `json:"claimed_t"`
	NominalT      float64         `json:"nominal_t"`
	LowT          float64         `json:"low_t"`
	HighT         float64         `json:"high_t"`
	ExcessT       float64         `json:"excess_t"`
	Flagged       int             `json:"flagged"`
	Days          []dayJSON       `json:"days"`
	Uncertainties []uncertainJSON `json:"uncertainties"`
}

func voyageOf(v Voyage) voyageJSON {
	r := v.Result
	out := voyageJSON{jobJSON: jobOf(v.Job), Total: totalsOf(r.Total), Phases: []phaseJSON{}, Rows: []voyageRowJSON{}}
	for _, p := range r.Phases {
		out.Phases = append(out.Phases, phaseJSON{Phase: p.Phase, totalsJSON: totalsOf(p.Totals)})
	}
	for _, row := range r.Rows {
		c := row.Result
		out.Rows = append(out.Rows, voyageRowJSON{
			Row: row.Index + 1, Phase: row.Phase, Hours: r6(row.Hours), Case: c.Name,
			BoilersFiring: c.BoilersFiring, CanCarry: c.CanCarry, DemandKgH: r6(c.SteamDemandKgS * kgh),
			FuelKgH: r6(c.FuelKgS * kgh), MarginKgH: r6(c.MarginNextKgS * kgh), Warnings: len(c.Warnings),
		})
	}
	return out
}

func studyOf(s Study) studyJSON {
	r := s.Result
	out := studyJSON{jobJSON: jobOf(s.Job), Hours: r6(r.Hours), FuelPrice: r.FuelPrice, InstalledCost: r.InstalledCost,
		Currency: r.Currency, Variants: []variantJSON{}}
	for _, v := range r.Variants {
		vj := variantJSON{Name: v.Name, Totals: totalsOf(v.Totals), FuelSavedT: r6(v.FuelSavedT),
			CO2AvoidedT: r6(v.CO2AvoidedT), CostSaved: r6(v.CostSaved), HoursBelowMinGasT: r6(v.HoursBelowMinGasT)}
		if r.InstalledCost > 0 && v.CostSaved > 0 && !math.IsInf(v.PaybackYears, 0) && !math.IsNaN(v.PaybackYears) {
			y := r6(v.PaybackYears)
			vj.PaybackYears = &y
		}
		out.Variants = append(out.Variants, vj)
	}
	return out
}

func auditOf(a Audit) auditJSON {
	r := a.Result
	out := auditJSON{jobJSON: jobOf(a.Job), Samples: r.Samples, Seed: r.Seed, LowQ: r.LowQ, HighQ: r.HighQ,
		ClaimedT: r6(r.ClaimedT), NominalT: r6(r.NominalT), LowT: r6(r.LowT), HighT: r6(r.HighT),
		ExcessT: r6(r.ExcessT), Flagged: r.Flagged, Days: []dayJSON{}, Uncertainties: []uncertainJSON{}}
	for _, d := range r.Days {
		out.Days = append(out.Days, dayJSON{Date: d.Date, Phase: d.Phase, ClaimedT: r6(d.ClaimedT), NominalT: r6(d.NominalT),
			LowT: r6(d.LowT), MedianT: r6(d.MedianT), HighT: r6(d.HighT), Flag: d.Flag})
	}
	for _, u := range r.Uncertainties {
		out.Uncertainties = append(out.Uncertainties, uncertainJSON{Unit: u.Unit, Param: u.Param, Low: u.Low, High: u.High})
	}
	return out
}

// r6 rounds to six significant digits (as plant.CaseResult.JSON does),
// and a value within 1e-9 of zero to zero.
func r6(v float64) float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) || math.Abs(v) < 1e-9 {
		if math.Abs(v) < 1e-9 {
			return 0
		}
		return v
	}
	e := math.Floor(math.Log10(math.Abs(v)))
	f := math.Pow(10, 5-e)
	return math.Round(v*f) / f
}
