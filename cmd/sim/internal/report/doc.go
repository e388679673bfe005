// Package report renders the results of load cases for people and for
// programs: a text table (Table), one JSON document (JSON), one CSV row per
// case (CSV) and a chart of steam demand against boiler capacity (Plot).
//
// The renderers take the cases of one run in script order, each with the
// name of the plant it was solved on; the case's script position is the
// plant.CaseResult's Pos. Output is stable: a fixed order, fixed number
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
//	  "cases": [ CASE, ... ]
//	}
//
// "schema" is plant.SchemaVersion; it changes only when a key is removed
// or changes meaning, and new keys may be added without a change.
// "plant" names the plant the cases were solved on; it is null when the
// run has no case or its cases were solved on more than one plant (each
// case names its plant in any event). "cases" lists the load cases in the
// order the script solved them.
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
//	                        bypass_fraction, below_min_gas_T,
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
// Numbers are rounded to six significant digits by plant.CaseResult.JSON.
package report
