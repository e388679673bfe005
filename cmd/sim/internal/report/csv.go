package report

import (
	"encoding/csv"
	"io"
	"math"
	"strconv"

	"steamcase/plant/profile"
	"steamcase/plant/schema"
)

// The names of the CSV tables, in the order they are written; each is the
// first field of every data row of its table.
const (
	TableCases      = "cases"
	TableVoyage     = "voyage rows"
	TableVoyageWarn = "voyage warnings"
	TableStudy      = "study variants"
	TableSweep      = "study sweep"
	TableStudyWarn  = "study warnings"
	TableAudit      = "audit days"
	TableAuditPer   = "audit periods"
	TableImplied    = "audit implied"
	TableShares     = "audit shares"
	TableGrades     = "audit grades"
	TableAuditWarn  = "audit warnings"
	tableColumn     = "table"
	csvMoneyDec     = 2
	csvTonnesDec    = 3
	csvFlowDec      = 1
	csvHoursDec     = 2
	csvPaybackDec   = 2
)

// csvHeader names the columns of the cases table after "table", each with
// its unit.
var csvHeader = [...]string{
	tableColumn, "case", "plant", "sea_T_C", "air_T_C", "engine_load_pct",
	"boilers_firing", "can_carry", "shortfall_kg_h", "steam_demand_kg_h",
	"steam_production_kg_h", "fuel_kg_h", "fuel_t_per_day", "co2_t_per_day",
	"makeup_kg_h", "electric_kW", "margin_kg_h", "warnings",
}

var voyageHeader = [...]string{
	tableColumn, "voyage", "row", "source", "phase", "case", "hours",
	"sea_T_C", "air_T_C", "engine_load_pct", "boilers_firing", "can_carry",
	"steam_demand_kg_h", "boiler_steam_kg_h", "ege_steam_kg_h", "fuel_kg_h",
	"fuel_t", "co2_t", "margin_kg_h",
}

var voyageWarnHeader = [...]string{tableColumn, "voyage", "row", "source", "warning"}

var studyHeader = [...]string{
	tableColumn, "study", "variant", "hours", "fuel_t", "co2_t", "fuel_saved_t",
	"co2_avoided_t", "cost_saved", "currency", "payback_years", "hours_below_min_gas_T",
	"installed_cost", "carbon_cost_saved", "annual_saving", "npv", "hours_below_acid_dew_margin", "hours_soot_risk",
}

var sweepHeader = [...]string{
	tableColumn, "study", "unit", "param", "point", "value", "ua_W_K", "installed_cost", "currency",
	"fuel_t", "fuel_saved_t", "co2_avoided_t", "ege_steam_t", "dumped_t", "annual_saving", "npv",
	"payback_years", "hours_below_min_gas_T", "hours_soot_risk", "best",
}

var studyWarnHeader = [...]string{tableColumn, "study", "variant", "row", "source", "warning"}

var auditHeader = [...]string{
	tableColumn, "audit", "day", "source", "date", "phase", "reference", "claimed_t",
	"nominal_t", "low_t", "median_t", "high_t", "reading_low_t", "reading_high_t",
	"percentile_pct", "flag", "fuel_t", "co2_t", "samples_with_warnings",
}

var auditPeriodHeader = [...]string{
	tableColumn, "audit", "days", "claimed_t", "nominal_t", "low_t", "median_t", "high_t",
	"reading_low_t", "reading_high_t", "p_at_or_below", "p_at_or_above", "p_standard_error",
	"percentile_pct", "flag", "samples", "seed",
}

var impliedHeader = [...]string{tableColumn, "audit", "day", "source", "date", "factor", "value", "status"}

var sharesHeader = [...]string{tableColumn, "audit", "day", "source", "date", "cause", "fuel_t"}

var gradesHeader = [...]string{tableColumn, "audit", "day", "source", "date", "grade", "fuel_t", "co2_t"}

var auditWarnHeader = [...]string{tableColumn, "audit", "day", "source", "date", "warning"}

// CSV writes the run as CSV tables, one after another in one stream:
// the load cases, then, when the run has them, the rows of its voyages
// and their warnings, the variants of its studies, their sweeps of size
// and their warnings, the days of its audits with their periods, implied
// factors, shares by cause, fuel by grade and warnings, and its heating
// plans (their summary, required temperatures and rows). Each table
// starts with a header row whose first field is "table", and each of its
// data rows has the table's name in that field: "cases", "voyage rows",
// "voyage warnings", "study variants", "study sweep", "study warnings",
// "audit days", "audit periods", "audit implied", "audit shares", "audit
// grades", "audit warnings", "heating plan summary", "heating plan
// required" or "heating plan rows". One blank line separates two tables
// (a name with a blank line in it is quoted, and the line is part of it).
// The cases table always comes first (its header alone when no case was
// solved); a job table is written only when the run has such a job, and
// holds the rows of every job of its kind, each naming its job in the
// second column (the voyage warnings follow the voyage rows, the header
// alone when no row warns, and so the study warnings the variants; the
// audits' other tables follow their days, each header alone when it has
// no line). A program may read the stream with a CSV reader that
// accepts records of different lengths (and skips blank lines, as Go's
// encoding/csv does), or take the lines of one table by their first field.
//
// Units and decimals: temperatures °C with one decimal, an empty cell for
// a temperature the case did not give; engine load % of
// the main engine's MCR, one decimal; flows kg/h, one decimal; masses t,
// three decimals (t/day for the cases' fuel and CO2 rates); hours two
// decimals; electric_kW one decimal; money two decimals; payback years two
// decimals. The columns of each table:
//
//	cases           case, plant; sea_T_C, air_T_C, engine_load_pct;
//	                boilers_firing; can_carry (true or false);
//	                shortfall_kg_h, steam_demand_kg_h, steam_production_kg_h,
//	                fuel_kg_h; fuel_t_per_day, co2_t_per_day; makeup_kg_h,
//	                electric_kW, margin_kg_h; warnings (a count)
//	voyage rows     voyage (its name), row (from 1), source (where the row
//	                was given, "file:line"), phase, case (the row's name),
//	                hours, sea_T_C, air_T_C, engine_load_pct,
//	                boilers_firing, can_carry, steam_demand_kg_h (all the
//	                plant takes), boiler_steam_kg_h (raised by the
//	                oil-fired boilers), ege_steam_kg_h, fuel_kg_h, fuel_t and
//	                co2_t (over the row's hours), margin_kg_h
//	voyage warnings voyage, row, source (as in the voyage rows), warning
//	                (its text, on one line): one line for each warning
//	                of each row, in the order of the rows
//	study variants  study, variant, hours (of the profile), fuel_t, co2_t
//	                (over the profile), fuel_saved_t, co2_avoided_t and
//	                cost_saved (against the first variant, over the
//	                profile), currency, payback_years (empty for the first
//	                variant, without an extra installed cost or a price, or
//	                when nothing is saved), hours_below_min_gas_T;
//	                installed_cost, carbon_cost_saved (over the profile),
//	                annual_saving (fuel and carbon, per year), npv (empty
//	                without a life), hours_below_acid_dew_margin,
//	                hours_soot_risk
//	study sweep     study, unit, param, point (from 1), value (the size in
//	                SI: W/K for ua, K for pinch), ua_W_K, installed_cost,
//	                currency, fuel_t, fuel_saved_t, co2_avoided_t,
//	                ege_steam_t, dumped_t (over the profile),
//	                annual_saving, npv, payback_years,
//	                hours_below_min_gas_T, hours_soot_risk, best (true for
//	                the size of highest NPV); written only when a study
//	                has a sweep
//	study warnings  study, variant, row (from 1), source, warning: each
//	                warning of each row of each variant, on one line
//	audit days      audit, day (from 1), source, date, phase, reference
//	                (true or false), claimed_t, nominal_t, low_t,
//	                median_t, high_t (the model's band), reading_low_t,
//	                reading_high_t (the band of what the claim's
//	                measurement would read), percentile_pct (where the
//	                claim sits among those readings; the band and the
//	                percentile empty on a reference day), flag ("above",
//	                "below" or empty), fuel_t, co2_t (the day's boiler
//	                fuel and CO2 at the nominal inputs),
//	                samples_with_warnings
//	audit periods   audit, days (audited), claimed_t, nominal_t, low_t,
//	                median_t, high_t, reading_low_t, reading_high_t (of
//	                the period's total sampled as a whole), p_at_or_below,
//	                p_at_or_above, p_standard_error (four decimals),
//	                percentile_pct, flag, samples, seed
//	audit implied   audit, day, source, date, factor, value (six decimals;
//	                empty when no value was found), status ("found",
//	                "step", "model above claim", "model below claim")
//	audit shares    audit, day, source, date, cause, fuel_t
//	audit grades    audit, day, source, date, grade, fuel_t, co2_t
//	audit warnings  audit, day, source, date, warning: each warning of
//	                each day's nominal case, on one line
//	heating plan summary  plan (its name), variant ("least fuel", "hold",
//	                "last moment"), fuel_t, co2_t (the plan solved row by
//	                row), curve_fuel_t (by the rows' fuel curves), saving_t
//	                (of the least-fuel plan against the variant; empty for
//	                itself), short_rows and missed (counts)
//	heating plan required  plan, tank, T_C, at (as given), source,
//	                reached_T_C (two decimals), met, latest_start_h (empty
//	                when none meets it), verdict
//	heating plan rows  plan, row, source, phase, start_h, hours, tank,
//	                instruction, T_C and by_h (empty where the instruction
//	                has none), start_T_C, end_T_C (two decimals), duty_kW,
//	                coil_binds, and the plan's boilers_firing,
//	                boiler_steam_kg_h and fuel_t of the row: one line per
//	                row and tank
//
// The caution is not part of the CSV (it would break the tables); a
// program that shows these figures to people must show it.
func CSV(w io.Writer, run Run) error {
	ew := &errWriter{w: w}
	cw := csv.NewWriter(ew)
	write := func(rec []string) {
		if ew.err == nil {
			cw.Write(rec)
		}
	}
	begin := func(header []string, first bool) {
		if !first {
			cw.Flush()
			io.WriteString(ew, "\n")
		}
		write(header)
	}
	begin(csvHeader[:], true)
	for _, c := range run.Cases {
		r := c.Result
		row := [...]string{
			TableCases, r.Name, c.Plant,
			csvCelsius(r.Conditions.SeaT), csvCelsius(r.Conditions.AirT), fix(r.Conditions.EngineLoad*100, 1),
			strconv.Itoa(r.BoilersFiring), strconv.FormatBool(r.CanCarry),
			flow(r.ShortfallKgS), flow(r.SteamDemandKgS), flow(r.SteamProductionKgS),
			flow(r.FuelKgS), fix(schema.TPerDay(r.FuelKgS), 3), fix(schema.TPerDay(r.CO2KgS), 2),
			flow(r.MakeUpKgS), fix(schema.KW(r.ElectricW), 1), flow(r.MarginNextKgS),
			strconv.Itoa(len(r.Warnings)),
		}
		write(row[:])
	}
	if hasRows(run.Voyages, func(v Voyage) bool { return v.Result != nil && len(v.Result.Rows) > 0 }) {
		begin(voyageHeader[:], false)
		for _, v := range run.Voyages {
			if v.Result == nil {
				continue
			}
			for _, row := range v.Result.Rows {
				c := &row.Summary
				rec := [...]string{
					TableVoyage, v.Name, strconv.Itoa(row.Index + 1), source(v.Job, row.Index), row.Phase, c.Case,
					fix(row.Hours, csvHoursDec),
					csvCelsius(c.SeaT), csvCelsius(c.AirT), fix(c.EngineLoad*100, 1),
					strconv.Itoa(c.BoilersFiring), strconv.FormatBool(c.CanCarry),
					flow(c.SteamDemandKgS), flow(c.BoilerSteamKgS), flow(c.EGESteamKgS), flow(c.FuelKgS),
					fix(schema.Tonnes(c.FuelKgS, row.Hours), csvTonnesDec), fix(schema.Tonnes(c.CO2KgS, row.Hours), csvTonnesDec),
					flow(c.MarginNextKgS),
				}
				write(rec[:])
			}
		}
		begin(voyageWarnHeader[:], false)
		for _, v := range run.Voyages {
			if v.Result == nil {
				continue
			}
			for _, row := range v.Result.Rows {
				for _, text := range row.Summary.Warnings {
					rec := [...]string{TableVoyageWarn, v.Name, strconv.Itoa(row.Index + 1), source(v.Job, row.Index), oneLine(text)}
					write(rec[:])
				}
			}
		}
	}
	if hasRows(run.Studies, func(s Study) bool { return s.Result != nil && len(s.Result.Variants) > 0 }) {
		begin(studyHeader[:], false)
		for _, s := range run.Studies {
			if s.Result == nil {
				continue
			}
			r := s.Result
			for _, v := range r.Variants {
				rec := [...]string{
					TableStudy, s.Name, v.Name, fix(r.Hours, csvHoursDec),
					fix(v.Totals.FuelT, csvTonnesDec), fix(v.Totals.CO2T, csvTonnesDec),
					fix(v.FuelSavedT, csvTonnesDec), fix(v.CO2AvoidedT, csvTonnesDec),
					fix(v.CostSaved, csvMoneyDec), r.Currency, csvPayback(v.Money), fix(v.HoursBelowMinGasT, csvHoursDec),
					fix(v.InstalledCost, csvMoneyDec), fix(v.CarbonSaved, csvMoneyDec), fix(v.AnnualSaving, csvMoneyDec),
					csvNPV(r, v.NPV), fix(v.HoursBelowAcidDew, csvHoursDec), fix(v.HoursSootRisk, csvHoursDec),
				}
				write(rec[:])
			}
		}
		if hasRows(run.Studies, func(s Study) bool { return s.Result != nil && s.Result.Sweep != nil }) {
			begin(sweepHeader[:], false)
			for _, s := range run.Studies {
				if s.Result == nil || s.Result.Sweep == nil {
					continue
				}
				r, sw := s.Result, s.Result.Sweep
				for k, pt := range sw.Points {
					rec := [...]string{
						TableSweep, s.Name, sw.Unit, sw.Param, strconv.Itoa(k + 1), strconv.FormatFloat(pt.Value, 'g', 10, 64),
						fix(pt.UA, 1), fix(pt.InstalledCost, csvMoneyDec), r.Currency,
						fix(pt.FuelT, csvTonnesDec), fix(pt.FuelSavedT, csvTonnesDec), fix(pt.CO2AvoidedT, csvTonnesDec),
						fix(pt.EGESteamT, csvTonnesDec), fix(pt.DumpedT, csvTonnesDec), fix(pt.AnnualSaving, csvMoneyDec),
						csvNPV(r, pt.NPV), csvPayback(pt.Money), fix(pt.HoursBelowMinGasT, csvHoursDec),
						fix(pt.HoursSootRisk, csvHoursDec), strconv.FormatBool(k == sw.Best),
					}
					write(rec[:])
				}
			}
		}
		begin(studyWarnHeader[:], false)
		for _, st := range run.Studies {
			if st.Result == nil {
				continue
			}
			for _, v := range st.Result.Variants {
				for _, rw := range v.RowWarnings {
					for _, text := range rw.Texts {
						rec := [...]string{TableStudyWarn, st.Name, v.Name, strconv.Itoa(rw.Row + 1), source(st.Job, rw.Row), oneLine(text)}
						write(rec[:])
					}
				}
			}
		}
	}
	if hasRows(run.Audits, func(a Audit) bool { return a.Result != nil && len(a.Result.Days) > 0 }) {
		writeAuditCSV(run.Audits, begin, write)
	}
	writeHeatingPlanCSV(run, begin, write)
	cw.Flush()
	if ew.err != nil {
		return ew.err
	}
	return cw.Error()
}

// csvPayback is a payback in years, or an empty cell where there is none
// (or nothing is saved).
func csvPayback(m profile.Money) string {
	if !m.HasPayback || math.IsInf(m.PaybackYears, 0) || math.IsNaN(m.PaybackYears) {
		return ""
	}
	return fix(m.PaybackYears, csvPaybackDec)
}

// csvNPV is an NPV, or an empty cell when the study has no life.
func csvNPV(r *profile.StudyResult, npv float64) string {
	if !r.HasNPV {
		return ""
	}
	return fix(npv, csvMoneyDec)
}

// flow formats a mass flow in kg/s as kg/h with the CSV's decimals.
func flow(kgPerS float64) string { return fix(schema.KgPerH(kgPerS), csvFlowDec) }

// csvCelsius formats a condition's temperature in K as °C with one
// decimal, or an empty cell for the zero that plant.Conditions holds when
// the case did not give it.
func csvCelsius(k float64) string {
	if k <= 0 {
		return ""
	}
	return fix(k-273.15, 1)
}

// hasRows reports whether any job has something for its table.
func hasRows[J any](jobs []J, some func(J) bool) bool {
	for _, j := range jobs {
		if some(j) {
			return true
		}
	}
	return false
}

// source is where the i-th row of a job was given, or "".
func source(j Job, i int) string {
	if i >= 0 && i < len(j.Rows) {
		return j.Rows[i]
	}
	return ""
}

// writeAuditCSV writes the tables of the audits: their days, periods,
// implied factors, shares by cause, fuel by grade and warnings, each a
// line per day and item.
func writeAuditCSV(audits []Audit, begin func([]string, bool), write func([]string)) {
	t := func(v float64) string { return fix(v, csvTonnesDec) }
	each := func(f func(a Audit, i int, d profile.DayResult)) {
		for _, a := range audits {
			if a.Result == nil {
				continue
			}
			for i, d := range a.Result.Days {
				f(a, i, d)
			}
		}
	}
	begin(auditHeader[:], false)
	each(func(a Audit, i int, d profile.DayResult) {
		band := [...]string{t(d.LowT), t(d.MedianT), t(d.HighT), t(d.ReadingLowT), t(d.ReadingHighT), fix(100*d.Percentile, 1)}
		if d.Reference {
			band = [6]string{}
		}
		rec := [...]string{
			TableAudit, a.Name, strconv.Itoa(i + 1), source(a.Job, i), d.Date, d.Phase, strconv.FormatBool(d.Reference),
			t(d.ClaimedT), t(d.NominalT), band[0], band[1], band[2], band[3], band[4], band[5], d.Flag,
			t(d.FuelT), t(d.CO2T), strconv.Itoa(d.SampleWarnings),
		}
		write(rec[:])
	})
	begin(auditPeriodHeader[:], false)
	for _, a := range audits {
		if a.Result == nil {
			continue
		}
		p := a.Result.Period
		rec := [...]string{
			TableAuditPer, a.Name, strconv.Itoa(p.Days), t(p.ClaimedT), t(p.NominalT), t(p.LowT), t(p.MedianT), t(p.HighT),
			t(p.ReadingLowT), t(p.ReadingHighT), fix(p.PAtOrBelow, 4), fix(p.PAtOrAbove, 4), fix(p.StdErr, 4),
			fix(100*p.Percentile, 1), p.Flag, strconv.Itoa(a.Result.Samples), strconv.FormatUint(a.Result.Seed, 10),
		}
		write(rec[:])
	}
	begin(impliedHeader[:], false)
	each(func(a Audit, i int, d profile.DayResult) {
		for k, v := range d.Implied {
			value := ""
			if v.Status == profile.ImpliedFound || v.Status == profile.ImpliedStep {
				value = fix(v.Value, 6)
			}
			rec := [...]string{TableImplied, a.Name, strconv.Itoa(i + 1), source(a.Job, i), d.Date, a.Result.Implied[k].Name, value, v.Status.String()}
			write(rec[:])
		}
	})
	begin(sharesHeader[:], false)
	each(func(a Audit, i int, d profile.DayResult) {
		for k, v := range d.Shares {
			rec := [...]string{TableShares, a.Name, strconv.Itoa(i + 1), source(a.Job, i), d.Date, a.Result.Causes[k].Name, t(v)}
			write(rec[:])
		}
	})
	begin(gradesHeader[:], false)
	each(func(a Audit, i int, d profile.DayResult) {
		for _, g := range d.FuelByGrade {
			rec := [...]string{TableGrades, a.Name, strconv.Itoa(i + 1), source(a.Job, i), d.Date, g.Grade, t(g.FuelT), t(g.CO2T)}
			write(rec[:])
		}
	})
	begin(auditWarnHeader[:], false)
	each(func(a Audit, i int, d profile.DayResult) {
		for _, text := range d.Warnings {
			rec := [...]string{TableAuditWarn, a.Name, strconv.Itoa(i + 1), source(a.Job, i), d.Date, oneLine(text)}
			write(rec[:])
		}
	})
}
