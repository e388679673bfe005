// Package report renders what a run of load-case scripts solved, for
// people and for programs: a text table (Table), one JSON document (JSON),
// CSV tables of the cases and the jobs (CSV), and charts (Charts): the
// cases' steam demand against boiler capacity (Plot), a voyage's demand,
// capacity and fuel against its hours (PlotVoyage), a study's fuel saved
// by variant (PlotStudy) and an audit's claimed fuel against the modelled
// band (PlotAudit), each as SVG or PNG.
//
// A Run holds the load cases in script order, each with the name of the
// plant it was solved on (the case's script position is the
// plant.CaseResult's Pos), and the voyages, studies and audits the scripts
// ran over profiles (package plant/profile), each with where it and its
// rows were given. Output is stable: a fixed order, fixed number
// formats and no timestamps, so that two runs of the same script give the
// same bytes.
//
// Every rendering carries the safety caution (Caution): the figures are
// planning and audit estimates, not a substitute for the makers' manuals,
// class and flag rules or licensed practice, and local codes come first.
//
// # JSON schema (version 1)
//
// JSON writes one object:
//
//	{
//	  "schema": 1,
//	  "caution": "Caution: planning and audit estimate only; ...",
//	  "plant": {"name": "Invented Product Tanker 1"},
//	  "cases": [ CASE, ... ],
//	  "voyages": [ VOYAGE, ... ],
//	  "studies": [ STUDY, ... ],
//	  "audits": [ AUDIT, ... ]
//	}
//
// "schema" is plant.SchemaVersion; it changes only when a key is removed
// or changes meaning, and new keys may be added without a change.
// "plant" names the plant the cases and jobs were solved on; it is null
// when the run solved nothing or used more than one plant (each case and
// job names its plant in any event). "cases" lists the load cases in the
// order the scripts solved them; "voyages", "studies" and "audits" the
// jobs over profiles that the scripts ran with voyage(), study() and
// audit(). Every list is present, empty when there is nothing in it.
//
// Each CASE is the object of plant.CaseJSON with two keys in front:
//
//	"plant"   the name of the plant the case was solved on
//	"source"  where the script solved it, "file:line" ("" when built in Go)
//
// followed by, in this order (every key names its unit; SI unless the key
// says kg_h, kW, pct or t_per_day):
//
//	name                    the case's name
//	converged               the solver brought the balance to its tolerance
//	iterations              Newton iterations of the final configuration
//	residual_norm           the final scaled residual norm
//	sea_T_K, air_T_K        sea water and outside air temperatures, K
//	engine_load             main engine load, fraction of its MCR (0..1)
//	boilers_firing          how many oil-fired boilers fire
//	firing_forced           the case chose which boilers fire
//	can_carry               the firing boilers can carry the demand
//	shortfall_kg_h          demand beyond the boilers' MCR, kg/h
//	margin_kg_h             steam the firing boilers can add before the
//	                        next boiler must fire (with all firing: before
//	                        their MCR; with none: the steam dumped), kg/h
//	steam_demand_kg_h       steam taken by the plant, kg/h
//	steam_production_kg_h   steam raised by boilers and economisers, kg/h
//	dumped_kg_h             steam sent to a dump condenser, kg/h
//	fuel_kg_h, fuel_t_per_day   fuel burnt, kg/h and t/day
//	co2_t_per_day           CO2 from the fuel, t/day
//	makeup_kg_h             fresh water made up, kg/h
//	blowdown_kg_h           boiler blowdown, kg/h
//	vented_kg_h             flash steam vented from the feed tank, kg/h
//	condensate_lost_kg_h    condensate not returned, header drains
//	                        included, kg/h
//	feed_tank_T_K           feed tank temperature, K
//	electric_kW             electrical load of pumps and fans, kW
//	balance                 {mass_rel, energy_rel}: relative closures of
//	                        the mass and energy balances
//	ege_steam_kg_h          steam raised by exhaust-gas economisers, kg/h
//	ege_fuel_saved_kg_h     boiler fuel the economisers save against the
//	                        same case without them, kg/h
//	boilers                 [{name, firing, cycling, on_fraction,
//	                        load_fraction, mcr_kg_h, steam_kg_h, fuel_kg_h,
//	                        efficiency, efficiency_basis, fuel,
//	                        fuel_lhv_J_per_kg, drum_p_Pa, feed_T_K,
//	                        steam_dryness, blowdown_kg_h, heat_kW,
//	                        flue_gas_exit_T_K, excess_air, losses,
//	                        fan_electric_kW}]: the last four from a
//	                        combustion model, null (0 for the fan) with a
//	                        plain efficiency table; losses is {basis,
//	                        dry_gas_pct, moisture_pct, radiation_pct,
//	                        unburnt_pct, credits_pct, total_pct}
//	exhaust_gas_economisers [{name, in_service, steam_kg_h, duty_kW,
//	                        gas_kg_s, gas_in_T_K, gas_out_T_K, pinch_K,
//	                        bypass_fraction, preheat_kW (a preheating
//	                        section's duty, in duty_kW),
//	                        evaporator_gas_out_T_K, below_min_gas_T,
//	                        fuel_saved_kg_h}]
//	consumers               [{name, kind, duty_kW (shaft power for a
//	                        turbine), steam_kg_h, condensate_return_kg_h,
//	                        condensate_lost_kg_h, drain_cooler_kW,
//	                        inputs (optional: the figures a computed duty
//	                        came from, keys with units)}]
//	units                   [{name, kind, figures: [{key, value}]}]: the
//	                        other units, keys with SI units, sorted
//	lines                   [{name, m_kg_s, p_Pa, T_K, h_J_per_kg, x}]:
//	                        x is null for a single phase
//	warnings                [string]: every warning of the case
//
// Each job (VOYAGE, STUDY, AUDIT) starts with
//
//	name, plant             the job's name and its plant's
//	source                  where the script ran it, "file:line"
//	row_sources             where each row (day) was given, "file:line"
//
// TOTALS, the sums over a set of rows (each row's figures times its
// hours), are
//
//	rows, hours             how many rows, and their hours
//	fuel_t, co2_t           boiler fuel burnt and its CO2, t
//	steam_t, ege_steam_t    steam raised in all and by economisers, t
//	ege_fuel_saved_t        boiler fuel the economisers saved, t
//	dumped_t, makeup_t      steam dumped and water made up, t
//	electric_MWh            electrical energy, MWh
//	hours_firing            [h]: hours with 0, 1, 2, ... boilers firing
//	peak_boiler_kg_h, peak_row   highest demand on the oil-fired boilers,
//	                        kg/h, and its row (numbered from 1)
//	capacity_kg_h           MCR of all boilers, kg/h
//	tightest_margin_kg_h, tightest_row   smallest margin, kg/h, and its row
//	short_rows              [row]: rows the plant cannot carry
//	warning_rows            [row]: rows with any warning
//
// A VOYAGE has "total" (TOTALS), "phases" ([TOTALS with "phase" in
// front], in the order the phases first appear) and "rows" ([{row, phase,
// hours, case, boilers_firing, can_carry, steam_demand_kg_h, fuel_kg_h,
// margin_kg_h, warnings (a count)}]).
//
// A STUDY has "hours" (of its profile), "fuel_price_per_t",
// "installed_cost", "currency" and "variants" ([{name, totals (TOTALS),
// fuel_saved_t, co2_avoided_t, cost_saved, payback_years (null for the
// base, without an installed cost, or when nothing is saved),
// hours_below_min_gas_T}]), each saving against the first variant.
//
// An AUDIT has "samples" (per day), "seed", "low_quantile" and
// "high_quantile" of the band; "claimed_t", "nominal_t", "low_t" and
// "high_t" summed over the days (the band's ends added day by day, a
// conservative band); "excess_t" (the claims beyond the band's top, on the
// days above it); "flagged" (days outside the band); "days" ([{date,
// phase, claimed_t, nominal_t, low_t, median_t, high_t, flag ("above",
// "below" or "")}]); and "uncertainties" ([{unit, param, low, high}]: the
// inputs drawn uniformly between low and high, in SI units or as
// fractions).
//
// Numbers are rounded to six significant digits.
//
// # CSV tables
//
// CSV writes several tables in one stream, by one rule: each table starts
// with a header row whose first field is "table" and whose other fields
// name the columns with their units; each data row carries the table's
// name in its first field ("cases", "voyage rows", "study variants",
// "audit days"); one blank line separates two tables (outside quotes:
// a quoted name may hold a blank line of its own). The cases table
// always comes first (its header alone when no case was solved); the
// others follow in that order when the run has such a job, each holding
// every job of its kind, named in its second column. The columns, units
// and decimals of each table are listed in CSV's doc comment. A program
// reads the stream with a CSV reader that accepts records of different
// lengths, or picks the lines of one table by their first field.
package report
