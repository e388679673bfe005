package report

import (
	"encoding/csv"
	"io"
	"math"
	"strconv"
)

// The names of the CSV tables, in the order they are written; each is the
// first field of every data row of its table.
const (
	TableCases    = "cases"
	TableVoyage   = "voyage rows"
	TableStudy    = "study variants"
	TableAudit    = "audit days"
	tableColumn   = "table"
	csvMoneyDec   = 2
	csvTonnesDec  = 3
	csvFlowDec    = 1
	csvHoursDec   = 2
	csvPaybackDec = 2
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
	"fuel_t", "co2_t", "margin_kg_h", "warnings",
}

var studyHeader = [...]string{
	tableColumn, "study", "variant", "hours", "fuel_t", "co2_t", "fuel_saved_t",
	"co2_avoided_t", "cost_saved", "currency", "payback_years", "hours_below_min_gas_T",
}

var auditHeader = [...]string{
	tableColumn, "audit", "day", "source", "date", "phase", "claimed_t",
	"nominal_t", "low_t", "median_t", "high_t", "flag",
}

// CSV writes the run as CSV tables, one after another in one stream:
// the load cases, then, when the run has them, the rows of its voyages,
// the variants of its studies and the days of its audits. Each table
// starts with a header row whose first field is "table", and each of its
// data rows has the table's name in that field: "cases", "voyage rows",
// "study variants" or "audit days". One blank line separates two tables
// (a name with a blank line in it is quoted, and the line is part of it).
// The cases table always comes first (its header alone when no case was
// solved); a job table is written only when the run has such a job, and
// holds the rows of every job of its kind, each naming its job in the
// second column. A program may read the stream with a CSV reader that
// accepts records of different lengths (and skips blank lines, as Go's
// encoding/csv does), or take the lines of one table by their first field.
//
// Units and decimals: temperatures °C with one decimal; engine load % of
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
//	                co2_t (over the row's hours), margin_kg_h, warnings
//	study variants  study, variant, hours (of the profile), fuel_t, co2_t
//	                (over the profile), fuel_saved_t, co2_avoided_t and
//	                cost_saved (against the first variant, over the
//	                profile), currency, payback_years (empty for the first
//	                variant, without an installed cost and fuel price, or
//	                when nothing is saved), hours_below_min_gas_T
//	audit days      audit, day (from 1), source, date, phase, claimed_t,
//	                nominal_t, low_t, median_t, high_t, flag ("above",
//	                "below" or empty)
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
			fix(r.Conditions.SeaT-273.15, 1), fix(r.Conditions.AirT-273.15, 1), fix(r.Conditions.EngineLoad*100, 1),
			strconv.Itoa(r.BoilersFiring), strconv.FormatBool(r.CanCarry),
			fix(r.ShortfallKgS*kgh, csvFlowDec), fix(r.SteamDemandKgS*kgh, csvFlowDec), fix(r.SteamProductionKgS*kgh, csvFlowDec),
			fix(r.FuelKgS*kgh, csvFlowDec), fix(r.FuelKgS*86.4, 3), fix(r.CO2KgS*86.4, 2),
			fix(r.MakeUpKgS*kgh, csvFlowDec), fix(r.ElectricW/1e3, 1), fix(r.MarginNextKgS*kgh, csvFlowDec),
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
				c := row.Result
				var boilers float64
				for _, b := range c.Boilers {
					boilers += b.SteamKgS
				}
				tonnes := row.Hours * 3.6 // kg/s over the row's hours → t
				rec := [...]string{
					TableVoyage, v.Name, strconv.Itoa(row.Index + 1), source(v.Job, row.Index), row.Phase, c.Name,
					fix(row.Hours, csvHoursDec),
					fix(c.Conditions.SeaT-273.15, 1), fix(c.Conditions.AirT-273.15, 1), fix(c.Conditions.EngineLoad*100, 1),
					strconv.Itoa(c.BoilersFiring), strconv.FormatBool(c.CanCarry),
					fix(c.SteamDemandKgS*kgh, csvFlowDec), fix(boilers*kgh, csvFlowDec), fix(c.EGESteamKgS*kgh, csvFlowDec),
					fix(c.FuelKgS*kgh, csvFlowDec), fix(c.FuelKgS*tonnes, csvTonnesDec), fix(c.CO2KgS*tonnes, csvTonnesDec),
					fix(c.MarginNextKgS*kgh, csvFlowDec), strconv.Itoa(len(c.Warnings)),
				}
				write(rec[:])
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
			for i, v := range r.Variants {
				payback := ""
				if i > 0 && r.InstalledCost > 0 && r.FuelPrice > 0 && v.CostSaved > 0 &&
					!math.IsInf(v.PaybackYears, 0) && !math.IsNaN(v.PaybackYears) {
					payback = fix(v.PaybackYears, csvPaybackDec)
				}
				rec := [...]string{
					TableStudy, s.Name, v.Name, fix(r.Hours, csvHoursDec),
					fix(v.Totals.FuelT, csvTonnesDec), fix(v.Totals.CO2T, csvTonnesDec),
					fix(v.FuelSavedT, csvTonnesDec), fix(v.CO2AvoidedT, csvTonnesDec),
					fix(v.CostSaved, csvMoneyDec), r.Currency, payback, fix(v.HoursBelowMinGasT, csvHoursDec),
				}
				write(rec[:])
			}
		}
	}
	if hasRows(run.Audits, func(a Audit) bool { return a.Result != nil && len(a.Result.Days) > 0 }) {
		begin(auditHeader[:], false)
		for _, a := range run.Audits {
			if a.Result == nil {
				continue
			}
			for i, d := range a.Result.Days {
				rec := [...]string{
					TableAudit, a.Name, strconv.Itoa(i + 1), source(a.Job, i), d.Date, d.Phase,
					fix(d.ClaimedT, csvTonnesDec), fix(d.NominalT, csvTonnesDec), fix(d.LowT, csvTonnesDec),
					fix(d.MedianT, csvTonnesDec), fix(d.HighT, csvTonnesDec), d.Flag,
				}
				write(rec[:])
			}
		}
	}
	cw.Flush()
	if ew.err != nil {
		return ew.err
	}
	return cw.Error()
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
