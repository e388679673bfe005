// Package scripting runs load-case scripts written in Lua in a sandbox and
// builds plants and load cases from them through package plant. It is the
// only package of steamcase that imports gopher-lua.
//
// # Running a script
//
//	run, err := scripting.RunFile(ctx, "scenarios/tanker.lua", scripting.Options{Logger: log})
//	run, err := scripting.RunSource(ctx, "demo/tanker.lua", src, embeddedFS, opt)
//
// Run holds the plants and the solved cases (plant name, script position,
// *plant.CaseResult), and the jobs voyage, study, audit and heating_plan
// (Run.Voyages, Run.Studies, Run.Audits, Run.HeatingPlans: name, plant,
// script position, the positions of their rows, and the result of package
// plant/profile or plant/heatplan). Options.Workers
// sets the goroutines the jobs solve on (zero: all cores; the results do
// not depend on it) and Options.Progress, if set, is called with the job,
// the rows done and the total, for a command to show on stderr. The
// script's own limit, Options.Timeout, counts the time outside its jobs;
// each job has its own, Options.JobTimeout, by default 10 s and 20 ms for
// each plant solve it announces. The error is one of:
//
//   - ErrorList: script errors, sorted by position, each an *Error printing
//     as "file:line: unit: message" ("file:line:col:" for syntax errors);
//     as many as could be found in one pass, not just the first;
//   - *AssertionError: a failed check(), printing
//     "file:line: assertion failed: message" (a command exits 1);
//   - *TimeoutError: the run exceeded Options.Timeout or Options.MaxMemory,
//     or a job its Options.JobTimeout (JobLimit set, naming the job);
//   - the context's error when the caller cancelled it;
//   - an error reading the script file.
//
// The Run is returned with what was solved before the error. With
// Options.CheckOnly nothing is solved: syntax, every key and quantity, the
// graph and the degrees of freedom of every plant are checked, and every
// error is listed.
//
// # Quantities
//
// Everything with a dimension is a string with a unit, read by package
// plant/units: "7 bar(g)", "18 t/h", "12 C", "85 %". A bare number where a
// unit is needed is an error naming an example unit ("mcr needs a unit,
// such as '18 t/h'; got 20"). Fractions accept "85 %" or 0.85. Gauge
// pressures refer to the plant's ambient pressure. "bar" alone is
// ambiguous and rejected, except in a pressure difference (margin).
// Unknown keys are errors that list the accepted keys and suggest a near
// miss ("unknown key 'mrc'; did you mean 'mcr'?").
//
// # Plant, full graph
//
//	local ship = plant { name = "Invented Tanker", ambient = "1.013 bar(a)",
//	                     usable = "85 %", sharing = "equal", lead_load = "80 %" }
//
// plant{} keys: name (required); ambient (pressure, absolute; default
// 101.325 kPa); usable (fraction of one boiler's MCR before the next fires;
// default 85 %); sharing ("equal", "lead" or "least_fuel"); lead_load
// (fraction, lead boiler's load under "lead"; default 80 %);
// feed_suction_max_T (temperature above which the feed pump's suction is
// warned about; default 90 C); ege_saving (boolean, default true: each
// case is solved a second time without its exhaust-gas economisers to
// give the fuel they save; false skips that solve, for speed, and the
// saving reads zero); n_minus_1 (boolean, default true: each case also
// answers its single failures; false skips them, for speed);
// contingencies (a list of failures besides the automatic ones, each a
// unit's name or a list of names lost together: boilers and exhaust-gas
// economisers, such as { "AB1", { "AB2", "EGE" } }); inert_gas (a table:
// O2, the highest O2 in the dry flue gas, default 5 %; capacity, the gas
// needed as a fraction of the running cargo pumps' rate, default 125 %).
// See "Capacity, N-1, inert gas and sharing" below.
//
// Components are declared with methods of the plant named by their kind
// (ship:boiler{...}, ship:tank_heating{...}); each returns a table
// { name = ..., kind = ... } and records its script line, so that every
// later error (at check or solve time) points at it. KeyReference lists
// every kind and every key it takes: how it is written, its default and
// where the default comes from, and whether a load case may set it. It is
// generated from package plant's key registry, which is also what the
// script API reads: a key is accepted exactly when it is listed there.
// Lines join components:
//
//	ship:line("name", "fromunit.port", "tounit.port")
//
// A fuel by grade takes its LHV and CO2 factors from package plant/fuel
// (plant.SpecFromFuel, which also carries the full fuel the combustion
// models need); lhv and co2_factor override the figures of the energy
// balance (the combustion models keep the grade's analysis); a fuel that
// is not a grade needs both, and cannot take a combustion model. A fuel as
// delivered is the grade with its bunker delivery note on top:
//
//	fuel = "VLSFO", bdn = { grade = "RMG 380", density = "955 kg/m3", sulphur = "0.48 %",
//	                        water = "0.2 %", ash = "0.03 %", viscosity = "320 cSt" }
//
// (water in % V/V as the note gives it; sulfur is accepted for sulphur;
// optional lhv, a stated net specific energy, and name): the LHV follows
// by the ISO 8217 annex formula, the analysis and its carbon from the same
// figures, and the IMO fuel type from the declared grade (plant/fuel's
// FromBDN, which checks every figure); the note's warnings (off-spec for
// the grade, a stated LHV far from the formula's) are repeated in every
// case the boiler burns fuel. A case reports the CO2 twice, each
// labelled: co2_t_per_day by the IMO conversion factor C_F of each fuel's
// IMO fuel type, for regulatory reporting, and co2_analysis_t_per_day by
// the carbon of the fuel's analysis, the carbon the combustion models
// burn; each boiler says which factor its co2_kg_h takes (co2_basis).
//
// A turbine's steam is given one way (a decoder checks it): eta_is;
// steam_rate, one figure ("8.5 kg/kWh") or {load, rate} pairs, with
// rated_power; or the maker's steam_table of {power, flow} pairs. A
// fuel_heater of service "engine" may take sfoc (one figure or {load,
// sfoc} pairs) with engine_mcr instead of flow: its oil then follows the
// case's engine load.
//
// # Boiler efficiency from combustion
//
// Instead of a table of efficiencies, a boiler's efficiency may come from
// the heat-loss method (plant/combustion) in one of two ways:
//
//	efficiency = { flue_gas = { {"30 %", "250 C", "5 %"}, {"100 %", "300 C", "3 %"} },
//	               radiation = "1 %", humidity = "60 %", atomising = "2 %" }
//
// flue_gas lists {load, exit temperature, dry O2} as the maker's test gives
// them (plant.FlueGasTable: interpolated linearly, the end values held
// outside with a warning); radiation is the radiation and convection loss
// at MCR as a fraction of the heat input (default 0; 0.5-1.5 % is common
// practice), taken as a constant heat flow; humidity the combustion air's
// relative humidity (default 0, dry air); atomising the atomising steam in
// kg per kg fuel as a fraction (default 0).
//
//	efficiency = { furnace = { wall_area = "10 m2", volume = "2.4 m3", soot = 2e-7 },
//	               passes = { { tubes = 90, di = "50 mm", length = "3 m", wall = "3.5 mm",
//	                            fouling_gas = "0.002 m2K/W" }, ... },
//	               excess_air = { {"30 %", 1.4}, {"100 %", 1.15} },
//	               radiation_loss = "15 kW", humidity = "60 %", atomising = "2 %" }
//
// computes the efficiency from the boiler's geometry (plant.FurnaceTubes):
// furnace keys wall_area (area, required), volume (volume; the mean beam
// length is 3.6·volume/wall_area) or beam_length (length), wall_T
// (temperature; default T_sat + 20 K), wall_emissivity (fraction; default
// 0.8), soot (number, the flame's soot volume fraction; default 0, a
// non-luminous gas); each pass tubes (count, required), di, length, wall
// (lengths: inside diameter, tube length and wall thickness, required),
// fouling_gas, fouling_water (fouling resistances; default 0),
// wall_emissivity (fraction; default 0: no gas radiation in the tubes);
// excess_air lists {load, air ratio λ} (a number such as 1.15, not O2);
// radiation_loss is the casing's loss (power, constant with load; default
// 0). The grey-gas set is fixed by the fuel: pw/pc 1 for oils, 2 for LNG.
// Both models need the boiler's fuel as a grade.
//
// # Economisers
//
// See KeyReference for the keys of exhaust_gas_economiser and economiser.
//
// The engine table gives, at each load (fraction of mcr, increasing), the
// exhaust gas as kg per kWh of engine power ("8.5 kg/kWh") or as a mass
// flow ("35 kg/s", then the load must be above zero), and its temperature
// after the turbocharger; docs/reference/plant-checks.md §7 gives indicative values only:
// use the engine's own data. The EGE's ports are feed (in) and steam (out);
// steam beyond demand goes to a condenser with dump = true on its header.
// The economiser's ports are in and out (feed water, between the feed
// header and its boiler); it needs its boiler's efficiency from a
// combustion model.
//
// Ports are named as package plant names them: makeup out; feed_tank in
// (any number), out, steam (optional); feed_pump, header, reducing_valve,
// consumer, turbine, condenser in and out (consumer out optional, header
// in and out any number); boiler feed and steam. The port may be left out
// ("hotwell") when the unit has one outlet (from) or one required inlet
// (to). Lines may name units declared later; they are resolved when a case
// is solved or the script ends, and unknown units and ports are reported
// with suggestions.
//
// # Consumers computed by plant/loads
//
// These declare a steam consumer (a turbine for cargo_pump) whose duty
// package plant/loads computes from what the engineer knows. Each also
// takes the consumer keys subcool, returns, return_T and off (cargo_pump:
// the turbine keys). Models that depend on the case read its sea and air
// temperatures; a case that leaves out one a model needs is an error naming
// the unit and the case. Input errors are found when the unit is declared
// (the model is tried at 15 C sea and air).
//
// Their keys are in KeyReference. A case, and a row of a voyage, study or
// audit, may set the keys marked "a case may set it" (a tank_heating's
// mode, T, from, to and duration; a tank_cleaning's flow and outlet_T; a
// fuel heater's flow and temperatures; ...). They hold for that case or
// row only: each consumer owns its model, and the parallel copies of a
// plant that a job solves on own theirs.
//
// # Plant, short form
//
//	local ship = steam_plant {
//	  name = "Invented Container Ship",
//	  boilers   = { {name = "AB1", mcr = "3 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "84 %"} },
//	  makeup    = { T = "15 C" },                        -- optional
//	  hotwell   = { heat_loss = "5 kW", set_T = "60 C" }, -- optional, feed_tank keys
//	  feed_pump = { margin = "3 bar", eta = "40 %" },    -- optional, feed_pump keys
//	  headers   = { {name = "main"}, {name = "LP", p = "4 bar(g)"} },
//	  consumers = { {name = "galley", header = "LP", duty = "40 kW", returns = "90 %"},
//	                {name = "COT 1", kind = "tank_heating", fuel = "HSFO", T = "60 C", ...} },
//	  turbines  = { {name = "COP1", power = "800 kW", exhaust = "0.2 bar(a)", eta_is = "65 %",
//	                 condenser = { subcool = "5 K" }} },     -- kind = "cargo_pump" also fits here
//	  exhaust_gas_economiser = { name = "EGE", drum = "7 bar(g)", engine = {...},
//	                             design_load = "85 %", pinch = "15 K" },  -- optional
//	  dump_condenser = { subcool = "80 K" },                -- optional, with an EGE
//	  observation_tank = { heat_loss = "2 kW" },  -- optional: returns pass it to the hotwell
//	  economisers = { {name = "ECO1", boiler = "AB1", ua = "4 kW/K"} }, -- optional
//	}
//
// It takes the plant{} keys and builds, with the unit types of the full
// graph: "makeup" → "hotwell" → "feed pump" → "feed header" → each boiler →
// the first header (default "main"); each further header (p required) fed
// from the main one through a reducing valve "PRV <header>"; each consumer
// on its header (key header; default the main one; key kind, default
// "consumer", or one of the plant/loads kinds but cargo_pump) returning condensate to
// the hotwell when returns is above zero; each turbine on its header
// exhausting to a condenser "<turbine> condenser" that drains to the
// hotwell; steam heating of the hotwell from the main header when set_T is
// given. An exhaust_gas_economiser (name default "EGE") is fed from the
// feed header and delivers to the main header, and brings a dump condenser
// "dump condenser" (condenser keys from dump_condenser; dump = true) on
// the main header draining to the hotwell. Each of economisers sits
// between the feed header and its boiler (one per boiler). The
// components take their own defaults (KeyReference: make-up at 15 C, a
// feed pump of 45 % with a 3 bar margin over the highest drum pressure);
// the short form adds one of its own: a dump condenser's subcooling of
// 80 K (condensate about 90 C from a 7 bar(g) header; give more at higher
// pressures, so that it does not flash in a
// vented hotwell). Lines are named "makeup", "feed suction", "feed
// discharge", "feed <boiler>", "steam <boiler>", "steam to <consumer>",
// "return from <consumer>", "to PRV <header>", "from PRV <header>",
// "hotwell heating", "steam to/exhaust of/condensate of <turbine>",
// "feed EGE", "steam EGE", "to dump condenser", "condensate of dump
// condenser", "feed <economiser>" (and "feed <boiler>" then leaves the
// economiser). The
// graph methods can add to the plant afterwards. Each unit of the short
// form takes the line of its own table in the source (the first table
// with its name = "..." at or after the steam_plant call, or for makeup,
// hotwell and feed_pump the table of that key), so errors point at the
// entry; units built from a table made elsewhere take the call's line.
//
// # Load cases
//
//	local r = case(ship, { name = "port stay", sea = "12 C", air = "5 C", engine = "0 %",
//	                       set = { galley = { duty = "60 kW" }, COP1 = { off = true } },
//	                       fire = { "AB1" } })
//
// case keys: name (default "case N"); sea and air (temperatures); engine
// (fraction of main engine MCR); set (per unit, the keys below); fire
// (list of boilers that must fire; the others stay cold; without it the
// plant's firing rule decides); series (a name shared by cases that
// sweep one quantity: consecutive cases of one series are reported as one
// table, a column per case, and carried in the JSON as "series"). The keys of set are, for each unit, the
// keys of its kind that KeyReference marks "a case may set it" (a
// consumer's duty, steam, returns, subcool, return_T, off and factor; a
// boiler's mcr, drum, dryness, blowdown and eta_factor; ...).
//
// case solves at once (warm-started from the plant's previous case),
// records the result in the Run and returns the case's object of the JSON
// schema (package plant/schema, which lists every key) as a table: the
// same keys, with their units, and the same values, rounded to six
// significant digits: r.fuel_t_per_day, r.boilers_firing, r.can_carry,
// r.boilers[1].load_fraction, r.consumers[i].steam_kg_h, r.warnings, ...
// A key that is null in the JSON is nil here: r.sea_T_K when the case
// gave no sea temperature, r.boilers[i].losses with a plain efficiency
// table. In check mode it returns a table of the same shape with zero
// figures.
//
// # Capacity, N-1, inert gas and sharing
//
// A boiler never raises more than its limit: its MCR times its max_load
// (default 100 %; a case may lower it). When the boilers firing cannot
// carry a case, it is solved with them at their limit and the demand is
// reduced by priority: every consumer and turbine takes priority, a
// number from 1 to 100 (higher kept longer) or a named level,
// "deferrable" (10), "hotel" (20), "cargo" (30) or "essential" (40, also
// the rank of a consumer that gives none). The lowest priority is reduced
// first, each consumer of one priority by the same fraction of its duty,
// steam or shaft power; without any priority every consumer is reduced in
// proportion, and the report says so. Burner heaters and atomising steam
// (they follow their boiler's fuel), the hotwell's heating and header
// drains are never reduced. r.can_carry is false, r.shortfall_kg_h the
// steam missing, r.shed_kW and r.shed_kg_h what was shed, and each
// r.consumers[i] has priority, priority_level, reducible, requested_kW,
// shed_kW, shed_kg_h and, for a tank, cooling { rate_K_per_h, min_T_K,
// hours_to_min_T } (give a tank_heating min_T, the lowest temperature its
// cargo may cool to, for the hours). A boiler forced above the plant's
// usable fraction gets a warning.
//
// N-1: each case also answers the largest firing boiler tripping, each
// exhaust-gas economiser in service being out, and each of the plant's
// contingencies: r.contingencies[i] has name ("AB2 trips"), kind, units,
// solved, can_carry, shortfall_kg_h, margin_kg_h, shed_kW, shed_kg_h,
// boilers (name, load_fraction, steam_kg_h, started: a standby boiler
// that must start), shed (the consumers reduced, with their cooling),
// note and line (the report's sentence: print(r.contingencies[1].line)).
// A failure that the remaining boilers carry with their usable capacity
// at least 125 % of the steam needed is not solved (solved false, loads
// estimated). A voyage's totals count n_minus_1_short_hours and
// n_minus_1_short_rows; each row has n_minus_1_can_carry. The figures are
// planning estimates: the boiler makers' manuals and the ship's safety
// management system govern what is done when a boiler trips.
//
// Inert gas: a boiler with inert_gas = true feeds the inert-gas system
// from its uptake; it needs a flue_gas or furnace efficiency (its O2 and
// gas volume come from it). While cargo pumps run, r.inert_gas has
// sources, firing, cargo_rate_m3_h, capacity, required_m3_h,
// delivered_Nm3_h (dry gas at 0 C and 101.325 kPa), o2_dry, o2_max, met,
// min_load_fraction (the lowest load at which the sources meet it),
// extra_steam_kg_h and extra_fuel_kg_h (what firing harder for inert gas
// than for steam costs), note and line. The 5 % and 125 % defaults are
// the figures of SOLAS II-2 reg. 4.5.5 and the FSS Code ch. 15, from
// memory; the line never replaces the O2 analyser.
//
// sharing = "least_fuel" chooses which boilers fire and how they split
// the steam for the least fuel, from each boiler's own efficiency model,
// within turndown, the usable fraction, the limits and the inert-gas
// minimum, at most 4 boilers: r.least_fuel has equal_fuel_kg_h (the
// firing rule with equal sharing), saved_kg_h, saved_pct, firing, shares
// and note. Package plant's doc of leastfuel.go says how it searches and
// when equal sharing is already the least fuel.
//
// # Voyages, studies and audits
//
//	local v = voyage(ship, { name = "ballast leg", csv = "voyage.csv" })
//	local v = voyage(ship, { name = "ballast leg", rows = {
//	    { phase = "loading", hours = 12, sea = "18 C", air = "12 C", engine = "0 %",
//	      set = { ["cargo heating"] = { off = true } }, fire = { "AB1" } },
//	    { phase = "loaded passage", hours = "3 d", sea = "15 C", air = "10 C", engine = "85 %" } } })
//
// voyage runs a plan (package plant/profile, on all cores) and returns its
// totals. Row keys: phase (required), hours (required: a number of hours
// or a time such as "3 d"), name (default "rows N"), sea, air, engine,
// set and fire as for case(). A CSV file has a header row naming its
// columns: phase and hours (required), sea, air (temperatures with their
// unit, "15 C"), engine ("85 %" or 0.85), name, fire (boiler names joined
// by '+', "AB1+AB2"), and any number of columns "unit.key" setting that
// key of that unit as in case{set = ...} ("cargo heating.duty" with cells
// such as "2.5 MW", "EGE.off" with true or false). An empty cell leaves
// the value as declared; hours in a cell are a number of hours or a time.
// At most Options.MaxRows rows (default 100000). Every error names the
// file and the line of the row (voyage.csv:7: column "sea": ...) or of
// the header for a bad column, and what was expected.
//
// The result of voyage, study and audit is the job's object of the JSON
// schema (package plant/schema lists every key), as for case(), with a few
// conveniences the JSON does not carry, all derived from the schema's
// values: by_phase, by_name, flagged_days, and in every set of totals
// hours_no_boiler, hours_one_boiler and hours_two_boilers. Every job has
// name, plant, source and row_sources.
//
// A voyage: v.total, each v.phases[i] (with .phase, in order of first
// appearance) and v.by_phase["loaded passage"] (a convenience: the same
// table as the phase's entry) hold the totals rows, hours, fuel_t, co2_t,
// steam_t, ege_steam_t, ege_fuel_saved_t (by the EGEs), dumped_t,
// makeup_t, electric_MWh, hours_firing (a list: [1] no boiler, [2] one,
// ...), peak_boiler_kg_h with peak_row, capacity_kg_h,
// tightest_margin_kg_h with tightest_row (nil if no row was summed),
// short_rows and warning_rows (lists of row numbers), and the
// conveniences hours_no_boiler, hours_one_boiler and hours_two_boilers
// (hours_firing[1], [2] and [3], 0 where the list is shorter); v.rows[i]
// has row, phase, hours, case (the row's name), sea_T_K and air_T_K (nil
// when not given), engine_load, boilers_firing, can_carry,
// steam_demand_kg_h, steam_production_kg_h, boiler_steam_kg_h,
// ege_steam_kg_h, dumped_kg_h, fuel_kg_h, fuel_t, co2_t, margin_kg_h and
// warnings (the texts; #v.rows[i].warnings counts them).
//
// A voyage or a study keeps of each row what its reports read (package
// plant/profile's RowSummary: the figures above, the totals' parts, the
// warnings, the tanks), a small part of a row's full case result, so that
// a long job fits in Options.MaxMemory. keep = "full" (or
// Options.FullRows, sim run --rows full, for every job that does not say)
// keeps each row's case result as well: v.rows[i].result is then the
// row's case as case() returns it (v.rows[3].result.boilers[1].load_fraction),
// a study's variants and sweep points get rows of the same form, and the
// Run holds the case results; keep = "summary" is the default. The totals
// are the same either way.
//
//	local s = study(ship, { name = "EGE", csv = "year.csv", variants = {
//	    { name = "without EGE", set = { EGE = { off = true } } },
//	    { name = "with EGE", installed_cost = 250000 },
//	    { name = "larger EGE", set = { EGE = { ua = "40 kW/K" } }, installed_cost = 320000 } },
//	  fuel_price = 650, carbon_price = 80, currency = "USD", life = 15, discount_rate = "8 %",
//	  sweep = { unit = "EGE", key = "ua", from = "5 kW/K", to = "60 kW/K", steps = 12,
//	    cost = { at = "20 kW/K", cost = 300000, exponent = 0.6, fixed = 50000 } } })
//
// study runs the rows (rows or csv, as for voyage) once per variant (2 to
// 100; name required, set optional, added to every row, and any key a case
// may set, an exhaust-gas economiser's drum, ua, pinch, preheat_ua,
// min_gas_T or fouling among them) and compares each with the first. Each
// variant may give its own installed_cost; a variant without one costs the
// study's installed_cost, and the first then nothing. fuel_price (per
// tonne of boiler fuel), carbon_price (per tonne of CO2), installed_cost
// (numbers, not negative) and currency (a string) are optional; life (whole
// years, 1 to 60) and discount_rate ("8 %" or 0.08, not negative) go
// together and give each variant's NPV. sweep runs the rows once more for
// each size of an exhaust-gas economiser: key "ua" or "pinch", the sizes
// as from, to and steps (2 to 100, evenly spaced) or as values = {...},
// set (optional, as a variant's) for every size, and cost = { at, cost,
// exponent (default 0.6), fixed (default 0) }: the installed cost fixed +
// cost·(UA/at)^exponent at the size's clean UA; the best size is the one of
// highest NPV, so a sweep needs fuel_price (or carbon_price), life and
// discount_rate. The result: s.hours, s.fuel_price_per_t, s.installed_cost,
// s.currency, s.carbon_price_per_t_co2, s.life_years, s.discount_rate (nil
// without a life), s.soot_fire_caution; s.variants[i] and
// s.by_name["with EGE"] (a convenience: the same table) hold the variant's
// name, totals (as a voyage's, under .totals: s.variants[2].totals.fuel_t),
// fuel_saved_t, co2_avoided_t, installed_cost, cost_saved and
// carbon_cost_saved (over the profile), annual_saving (scaled to a year
// when the rows' hours are not one), payback_years (the extra installed
// cost over the annual saving; nil for the first, without an extra cost or
// a price, or when nothing is saved), npv (nil without a life),
// hours_below_min_gas_T, hours_below_acid_dew_margin and hours_soot_risk
// (the hours at loads or gas velocities where soot builds up: soot fires
// in exhaust-gas economisers are a known hazard); s.sweep (nil without
// one) holds unit, param, the cost law (cost_ref_ua_W_K, cost_ref,
// cost_exponent, cost_fixed), best (the index of the highest NPV) and
// points[i], each with value (SI), ua_W_K, fuel_t, co2_t, ege_steam_t,
// dumped_t, ege_fouling_lost_steam_t, fuel_saved_t, co2_avoided_t and the
// money figures and hours of a variant.
//
//	local a = audit(ship, { name = "March", csv = "log.csv",
//	    uncertain = { { unit = "cargo heating", key = "factor", low = 0.85, high = 1.15 },
//	                  { unit = "AB1", key = "eta_factor", low = "97 %", high = "103 %" },
//	                  { key = "sea", low = "-1 K", high = "1 K" } },
//	    claim = { source = "flow meter", accuracy = "1 %" },
//	    implied = { { unit = "cargo heating", key = "factor" } },
//	    calibrate = { units = { "AB1", "AB2" }, key = "eta_factor", off = { "cargo heating" } },
//	    split = { { name = "cargo heating", units = { "cargo heating" } },
//	              { name = "cargo pumping", units = { "COP1", "COP2" } } },
//	    samples = 1000, seed = 1, band = { "5 %", "95 %" }, alpha = "5 %" })
//
// audit checks a log of reported daily fuel against the model of the
// plant (package plant/profile's Audit documents the method). Days come
// from days = { {date, claimed, reference, phase, hours, sea, air, engine,
// set, fire}, ... } or a CSV file with columns date and claimed
// (required), reference (true or false), phase, hours (default 24), sea,
// air, engine, name, fire and "unit.key" columns (a boiler's fuel grade
// too: "AB1.fuel" with MGO on the days in an emission control area).
// claimed is the fuel reported for the day: "12.5 t", "12500 kg", or a
// bare number of tonnes; a mass in any other unit, or a volume, is an
// error at its line.
//
// uncertain lists the inputs known only within a range, each drawn
// uniformly from low to high: { unit, key, low, high, scope } with key a
// case key of the unit that is a number (factor, eta_factor, duty,
// returns, ua, ...) and low and high in that key's unit, inside the key's
// own range; or { key = "sea" or "air", low, high } with no unit, the
// error of the day's reading, a temperature difference ("-1 K"). scope is
// "fixed" (drawn once per sample for the whole period: a property of the
// ship) or "daily" (drawn afresh each day); without it the key's default
// scope holds (profile.DefaultScope: factor, eta_factor, returns, ua and
// other properties are fixed; sea, air, duty, power, flow, T and other
// operating figures daily), and a key with no default scope needs it.
//
// claim is the claim's measurement uncertainty, one source or a list:
// { source = "flow meter", accuracy = "1 %" } (a bias fixed for the
// period; default 1 %), { source = "soundings", per_sounding = "0.5 m3",
// density = "985 kg/m3" } (a day is the difference of two soundings;
// default 0.5 m3), { source = "noon report", rob = "1 t" } (default 1 t),
// { source = "bdn density", density = "985 kg/m3", uncertainty = "1.5
// kg/m3" } (default 1.5 kg/m3). Without claim the claim is taken as
// exact, and the report says so. split lists causes, each { name, units }
// (or unit): the units switched off together to find its fuel. claims =
// "cargo heating" says the days claim that cause's fuel, not the whole
// boiler fuel. implied lists factors, each { unit, key } or { units,
// key }: for each day the value that makes the model give the claim; each
// must be one of the uncertain inputs (its plausible range) with a range
// in the key registry (the search's). calibrate = { unit or units, key,
// off } calibrates a fixed factor on the days marked reference, which must
// have every unit of off switched off (an error at the day's line
// otherwise). samples 10 to 100000 (default 1000); seed a whole number
// (default 0); band the quantiles of the bands (default 5 % and 95 %);
// alpha the level of the flags (default 5 %).
//
// The result has the keys of the AUDIT of package plant/schema: samples,
// seed, low_quantile, high_quantile, alpha, day_tail, claims_of, period
// (days, claimed_t, nominal_t, low_t, median_t, high_t, reading_low_t,
// reading_high_t, p_at_or_below, p_at_or_above, p_standard_error,
// percentile, flag), flagged, days, uncertainties, claim_uncertainty,
// implied, calibration (nil without one), causes, base_t, fuel_t, co2_t,
// fuel_by_grade, assumptions, warnings; a.days[i] and the convenience
// a.flagged_days[i] (the days flagged, in order; the same tables) have
// day, date, phase, reference, claimed_t, nominal_t, low_t, median_t,
// high_t, reading_low_t, reading_high_t, percentile (nil on a reference
// day), p_at_or_below, p_at_or_above, flag ("above", "below" or ""),
// fuel_t, co2_t, fuel_by_grade, shares, implied (each factor's value, nil
// when none gives the claim, and status), warnings and
// samples_with_warnings. An audit too large for its time limit stops
// early with an error that says to raise it (sim run --job-timeout;
// Options.JobTimeout).
//
// In check mode the jobs read and check everything but solve nothing, and
// return tables of the same shape with zero figures.
//
// # Cargo temperatures with the heating off
//
//	local T, info = cool_down { tank = cot1, from = "60 C", hours = 72, sea = "12 C", air = "5 C" }
//	local h, info = time_to_cool { tank = "COT 1", from = "60 C", to = "45 C", sea = "12 C", air = "5 C" }
//
// cool_down returns the cargo temperature in °C (a number) after hours (a
// number of hours or a time) with the heating off, by the lumped model of
// plant/loads (TankHeating.CoolDownAfter, docs/reference/plant-checks.md §6);
// time_to_cool returns the hours until the cargo reaches to (nil if it
// never does: a target at or below the surroundings). Both return a
// second table: T_C, from_C, hours, reached, tau_h, mass_t,
// cp_kJ_per_kgK, UA_kW_per_K, ambient_C, warnings. tank is a tank_heating
// unit (the table ship:tank_heating returned, or its name), a table of
// the tank keys of ship:tank_heating (fuel or density, cp, volume with
// boundaries, or dimensions), or a lumped tank { mass, cp, UA } whose
// surroundings are the call's key ambient (a temperature). sea and air
// are needed when the tank has boundaries to them. A voyage that switches
// a tank's heating off (set = { ["COT 1"] = { off = true } }) does not
// compute the cargo's temperature unless it carries the tank from row to
// row (below); the script may:
//
//	local v = voyage(ship, { csv = "ballast.csv" })  -- COT 1 off in every row
//	local arrival = cool_down { tank = cot1, from = "60 C", hours = v.total.hours, sea = "12 C" }
//	check(arrival > 45, "cargo pumpable at arrival")
//
// # Tanks carried from row to row
//
//	local v = voyage(ship, { csv = "route.csv", tanks = { ["COT 3"] = "45 C", ["COT 4"] = { T = "44 C" } } })
//
// voyage's tanks names tank_heating units whose cargo temperature the
// voyage carries from row to row, each with its temperature at the start.
// Each needs its heating coil (coil_area, with coil_U and coil, and
// circulation for a deck heater); the coil's capacity U·A·LMTD at the
// steam's saturation temperature (coil_p, or the set pressure of what
// feeds the tank's header) limits what it gives, and a duty asked above it
// is capped and warned. Each row gives each tank an instruction, as the
// columns "COT 3.instruction", "COT 3.T" and "COT 3.by" of the CSV (or
// set = { ["COT 3"] = { instruction = "heat_to", T = "57 C" } } in rows):
// "hold" (at T, or where the cargo is without T: the coil heats up to T at
// its capacity or the heating stays off while the cargo cools to it, then
// it gives the losses), "off", "heat_to" T (at the coil's capacity, then
// hold), or "reach" T by a time (by, from the voyage's start, such as
// "240 h": the constant duty that gets there, within the coil). An empty
// cell is the tank's declared instruction (default "hold" at its T), not
// the last row's. The cargo follows m·c(T)·dT/dt = Q_coil − Σ U·A·(T −
// T_beyond) with the row's sea and air temperatures, integrated exactly
// over the row (plant/loads' Advance); the row's steady steam demand is
// the coil's mean duty over it. A heat-up faster than max_rate (3 K per
// day, common practice) warns; so does a tank within 10 K of its flash
// point (a fuel grade's ISO 8217 minimum when none is given, said to be
// assumed). Such a voyage is solved in row order on one core; a study's
// variants still run in parallel. v.rows[i].tanks[k] has name,
// instruction, T_K, by_h, start_T_K, end_T_K, duty_kW, capacity_kW,
// coil_binds and short. An instruction for a tank the voyage does not
// carry, a by past the voyage's end, or an instruction in a study's or an
// audit's rows is an error at the row's line.
//
// # Cargo heating plan
//
//	local p = heating_plan(ship, { name = "winter crossing", csv = "route.csv",
//	    tanks = { ["COT 3"] = { T = "45 C", never_below = "35 C" }, ["COT 4"] = "44 C" },
//	    required = { ["COT 3"] = { T = "57 C", at = "discharge" },
//	                 ["COT 4"] = { { T = "50 C", at = "240 h" }, { T = "57 C", at = "discharge" } } },
//	    grid = "0.25 K" })
//
// heating_plan finds, for each tank (as voyage's tanks, with an optional
// never_below temperature: pumpability, or the cloud point of a waxy
// cargo), the instruction per row that meets every required temperature
// with the least boiler fuel over the rows (rows or csv, as for voyage,
// without instructions for the planned tanks), within the coils' and the
// boilers' capacity in every row (package plant/heatplan: dynamic
// programming over the rows on a grid of temperatures; grid 0.01 to 5 K,
// default 0.25 K; method "joint" or "descent", default by size). A
// required temperature's at is a phase (through the whole phase), "end",
// or a time from the start ("240 h", or a number of hours) that must be a
// row's start or end. The result: p.plan, p.hold (holding the required
// temperature from the start to the last required time) and
// p.last_moment (heating at the coil's capacity from the latest start),
// each with fuel_t, co2_t (the plant solved row by row with the plan's
// instructions), curve_fuel_t (by the rows' fuel curves), short_rows and
// missed; p.saving_vs_hold_t, p.saving_vs_last_moment_t and the CO2
// savings; p.tanks[k] with name, start_T_K, never_below_T_K, required[j]
// (T_K, at, at_h, phase, source, reached_T_K, met, latest_start_h,
// latest_start_row, verdict) and rows[i] (row, instruction, T_K, by_h,
// start_T_K, end_T_K, duty_kW, coil_binds); p.rows[i] (row, phase, hours,
// start_h, duty_kW, capacity_kW, boilers_firing, boiler_steam_kg_h,
// fuel_t); p.binding (row, tank, limit: "coil", "boilers" or "never
// below"); p.method, p.grid_K, p.solves, p.warnings and p.caution. A
// required temperature that cannot be met is not an error: the plan does
// the best it can and its verdict says so ("COT 3 reaches 54.2 °C at
// discharge; 57.0 °C needs 21 h more heating or 0.9 MW more coil"). An
// unknown tank, a required time past the voyage's end or inside a row, an
// unknown phase, or an instruction for a planned tank in the rows is an
// error at its line. The plan is an estimate: the charter party's heating
// instructions, the cargo's safety data sheet and the master's judgment
// govern.
//
// # Flue-gas check
//
//	local r = flue_gas { fuel = "HSFO", O2 = "3 %", T = "230 C", air_T = "25 C",
//	                     humidity = "60 %", CO = "50 ppm", radiation = "1 %", load = "50 %" }
//	check(r.efficiency_lhv_pct > 85, "AB1 above 85 % at half load")
//	print(r.flue_gas_T_K - r.acid_dew_point_K, "K above the acid dew point")
//
// flue_gas works out a boiler's efficiency from a flue-gas measurement by
// the heat-loss method, as sim fluegas does (plant/combustion's
// CheckFlueGas), and returns a table whose keys are those of `sim fluegas
// --json`: temperatures in K, specific energies in J/kg, flows per kg
// fuel, fractions and losses in percent (lambda, excess_air_pct,
// co2_dry_pct, h2o_wet_pct, losses and losses_hhv with dry_gas_pct,
// moisture_pct, radiation_pct, unburnt_pct, ..., efficiency_lhv_pct,
// efficiency_hhv_pct, acid_dew_point_K, siegert_loss_pct, lhv_J_per_kg,
// hhv_J_per_kg, warnings (a list of texts), caution, and the rest). A key
// that is null in the JSON is nil: acid_dew_point_K for a fuel without
// sulfur, siegert_loss_pct where the formula does not apply. It is not
// the boiler key efficiency = { flue_gas = {...} }, which turns a maker's
// table into a boiler's efficiency curve.
//
// The keys, named like the command's flags:
//
//   - fuel: a grade (MGO, VLSFO, HSFO, LNG); fuel_analysis: a table of
//     mass fractions as fired, { C, H, S, N, O, W (free water), A (ash) },
//     each "86 %" or 0.86, adding up to 100 % within 0.5 %: alone it is
//     the user's own fuel oil (LHV from the analysis by Channiwala-Parikh),
//     with fuel it replaces the grade's analysis (the grade keeps its set
//     LHV); one of the two is required. lhv (specific energy) overrides the
//     net specific energy.
//   - O2 or CO2 (fraction, dry; one is required): the analyser's reading;
//     "0 %" O2 is read as λ = 1 with a warning, an O2 within 0.1 point of
//     the air's is refused as no combustion, and so is a reading that
//     means an air ratio above 20.
//   - T (temperature, required): the flue gas where it was measured, above
//     the air, above its water dew point, and 25 to 1000 °C; air_T
//     (temperature, required): the combustion air at the burner intake,
//     −20 to 50 °C, the reference of the account (the fuel is taken at it).
//   - humidity: relative, "60 %", or a humidity ratio, "0.012 kg/kg" or
//     "12 g/kg" (default: dry air). CO: "50 ppm" or "0.005 %" of the dry
//     flue gas (default 0). radiation (fraction): the radiation and
//     convection loss at MCR (default 0, with a warning), scaled by 1/load
//     with load (fraction of MCR, 5 to 120 %, default 100 %). solids
//     (fraction): the unburnt-solids loss (default 0). atomising (fraction,
//     kg per kg fuel) and atomising_T (temperature, default air_T): the
//     atomising steam, whose moisture the losses show as
//     moisture_from_atomising_steam_pct (only when given). SO3_conversion
//     (fraction, 0 to 20 %): the share of the SO2 turned to SO3 for the acid
//     dew point (default 3 %). dew_margin (temperature difference, 0 to 100
//     K): the margin to the acid dew point below which a warning is given
//     (default 20 K, common practice).
//
// A bad key, unit or value stops the run at the line of the call, naming
// the key and the value as written (`fg.lua:3: flue_gas: T = "2000 F":
// the flue-gas temperature must be at most 1832 °F ...`). In check mode
// flue_gas computes as in a run: it solves no plant.
//
// # Other functions
//
//	check(cond, "message")   -- fails the run with an *AssertionError at this line
//	include("plant.lua")     -- runs a script of the same folder, returns what it returns
//	read_csv("profile.csv")  -- rows of the CSV beside the script, as tables of strings by header
//	to_number("18 t/h", "kg/h") -- a quantity as a number in the unit asked for (18000;
//	                         -- gauge pressures refer to the standard atmosphere)
//	print(...)               -- to the run's logger (info level, with "pos"), not stdout
//
// include and read_csv accept only relative names inside the script's
// folder ("data/profile.csv" is fine; "../x" and "/etc/passwd" are not); a
// file run by RunFile is opened through an os.Root, so links cannot lead
// out either. Includes may nest (Options.MaxIncludeDepth) but not cycle.
// In CSV files, lines starting with '#' are comments; the first row is the
// header; every row must have the header's number of fields.
//
// # Sandbox
//
// Each run has its own interpreter (lua.NewState with SkipOpenLibs and
// bounded call stack and registry) with only the base, table, string and
// math libraries. dofile, loadfile, load, loadstring, require, module,
// collectgarbage, getfenv, setfenv, newproxy and string.dump are removed;
// os, io, debug and package are never opened. print writes to the logger;
// math.random and math.randomseed use a PCG source seeded from
// Options.Seed. The run's context carries the time limit (default 10 s),
// checked by the interpreter at every instruction and by the solver at
// every iteration; a watchdog stops a run whose heap grows by more than
// Options.MaxMemory (default 1 GiB); string.rep (Options.MaxString) and
// unpack (10000 values) bound their results; the pattern functions refuse
// searches whose backtracking could run long (about n^(1+q) steps for n
// bytes and q repetitions '*', '+', '-', times the replacements for gsub,
// above 2e7), since they run inside Go where the time limit cannot stop
// them; bindings bound the tables, units, lines, plants,
// cases, CSV rows and bytes they accept. If the interpreter does not stop
// within 2 s after a limit (a library call that does not look at the
// context), the run returns a *TimeoutError with Abandoned set and leaves
// the interpreter behind.
//
// # Caution
//
// Results are planning and audit estimates, not a substitute for the
// makers' manuals, class and flag rules, or licensed practice; local codes
// come first.
package scripting
