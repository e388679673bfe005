// Package schema is the one description of what a run of load-case
// scripts reports to programs: the JSON document of `sim run --json`
// (Document) and, object for object, the tables that case(), voyage(),
// study() and audit() return to a Lua script. It owns every key, the
// schema's version (Version), the conversion of the plant's SI figures to
// the report units the keys name (kg/h, kW, t/day, t, MWh) and the one
// rounding rule (Round).
//
// The constructors take the plant's results and give the schema's types:
// NewCase for a solved load case (plant.CaseResult), NewVoyage, NewStudy
// and NewAudit for the jobs over a profile (package plant/profile), and
// Document.Finish for the run document around them. Package plant knows
// nothing of this package; its results stay in SI.
//
// # The rules
//
// Keys carry their units: SI unless the key names another (kg_h, kW,
// t_per_day, t, MWh, pct, per_t); a fraction has no unit (0.85, not 85 %).
// Every figure is rounded by Round: six significant digits, and a value
// within 1e-9 of zero is 0. Three solver diagnostics are given as
// computed: a case's residual_norm and its balance closures (mass_rel,
// energy_rel); and the inputs a study or an audit echoes (fuel_price_per_t,
// installed_cost, the quantiles, the uncertain inputs' low and high) are
// given as the script set them. No figure is NaN or infinite: where a
// figure does not exist the key is null, as each key below says. Every
// list is present, empty when there is nothing in it, never null, with
// one exception: the rows a study keeps only on request (a VARIANT's and
// a SWEEP_POINT's rows) are null when it does not keep them. Rows and
// days are numbered from 1.
//
// A Lua table that a script gets from case(), voyage(), study() or audit()
// is the JSON object of this schema decoded into Lua: the same keys, the
// same rounded values, arrays as sequences from 1. A key that is null in
// the JSON is nil in Lua (the key is absent). The Lua tables add a few
// conveniences derived from these values (by_phase, by_name,
// flagged_days, hours_no_boiler, ...), which the scripting package
// documents; they are not part of this schema.
//
// # Versions
//
// Version 1 was the first. Version 2 changed the meaning of two keys and
// added others:
//
//   - "plant" at the top is a list of {name} (the plants the cases and
//     jobs were solved on, in the order they first appear; empty when
//     nothing was solved), no longer one object or null;
//   - a voyage row's "warnings" are the texts of its case's warnings, no
//     longer their count;
//   - a case's (and a voyage row's) sea_T_K and air_T_K are null when the
//     case did not give them, no longer 0;
//   - peak_row, tightest_row and tightest_margin_kg_h of TOTALS are null
//     when no row was summed, no longer 0;
//   - added since: "heating_plans" (HEATING_PLAN) and a voyage row's
//     "tanks";
//   - added: "version", "checks", a voyage row's case conditions and
//     steam_production_kg_h, boiler_steam_kg_h, ege_steam_kg_h,
//     dumped_kg_h, fuel_t and co2_t, and an audit day's "day".
//
// Added within version 2 (keys may be added without a new number): a
// study's carbon_price_per_t_co2, life_years, discount_rate,
// soot_fire_caution and sweep; a variant's installed_cost,
// carbon_cost_saved, annual_saving, npv, hours_below_acid_dew_margin and
// hours_soot_risk (its payback_years now takes the variant's own installed
// cost over the base's and the carbon saved, the same figure as before
// when neither is given); TOTALS' ege_fouling_lost_steam_t; an EGE's site
// correction, size, fouling, cold-end and soot keys.
//
// The Lua tables changed with version 2 to take the JSON's keys: a
// total's fuel_saved_t is ege_fuel_saved_t, a study variant's
// saved_fuel_t is fuel_saved_t and its totals are under "totals", a
// voyage row's steam_kg_h is steam_production_kg_h and its name is
// "case", a study's fuel_price is fuel_price_per_t.
//
// Version 3 (this one) rebuilt the AUDIT and added the run's record:
//
//   - an audit's claimed_t, nominal_t, low_t and high_t moved into
//     "period", where low_t and high_t are quantiles of the period's total
//     sampled as a whole, no longer the days' band ends added up;
//     excess_t is gone (period.p_at_or_above and the days' percentiles
//     say how far a claim lies out);
//   - an audit day's flag now marks a claim beyond the day's tail level
//     (day_tail, Bonferroni), no longer outside the band; its low_t,
//     median_t and high_t are null on a reference day;
//   - added: an audit's alpha, day_tail, claims_of, period,
//     claim_uncertainty, implied, calibration, causes, base_t, fuel_t,
//     co2_t, fuel_by_grade, assumptions and warnings; a day's reference,
//     reading band, percentile, shares of the readings, fuel and CO2 (in
//     all and by grade), causes' shares, implied factors, warnings and
//     samples_with_warnings; an uncertain input's nominal, scope,
//     scope_source and calibrated;
//   - added at the top: files_read, lua_seed and assumptions; and a study
//     variant's row_warnings.
//
// Added within version 3 (keys may be added without a new number): a
// ROW's "result" and a VARIANT's and a SWEEP_POINT's "rows", null unless
// the job kept its rows in full.
//
// # The document
//
// The document (type Document) is one object:
//
//	schema      the schema's version, 3
//	version     the version of the program that wrote it
//	caution     the safety caution: the figures are planning and audit
//	            estimates, not a substitute for the makers' manuals, class
//	            and flag rules or licensed practice; local codes govern
//	files_read  [FILE]: every script and data file the run read, in the
//	            order first read
//	lua_seed    the seed of the scripts' math.random
//	assumptions  [ASSUMPTION]: the defaults in force on the plants solved
//	             on
//	plant       [PLANT]: the plants the cases and jobs were solved on, in
//	            the order they first appear (cases first, then voyages,
//	            studies and audits); empty when nothing was solved
//	checks      CHECKS: the outcome of the scripts' check() calls
//	cases       [CASE]: the load cases, in the order solved
//	voyages     [VOYAGE]: the jobs of voyage(), in the order run
//	studies     [STUDY]: the jobs of study()
//	audits      [AUDIT]: the jobs of audit()
//	heating_plans  [HEATING_PLAN]: the jobs of heating_plan()
//
// A FILE (type FileRead) is
//
//	file        its name as the run gave it (the script as named on the
//	            command line, an include or a CSV file beside it)
//	bytes       its size
//	sha256      the SHA-256 of its bytes, 64 hexadecimal digits
//
// An ASSUMPTION (type Assumption) is a key of a unit that the plant's
// description leaves at its default (not given, or given as a default
// of zero), as the key registry declares it:
//
//	plant       the plant's name
//	unit, kind  the unit's name and kind
//	key, label  the key as scripts write it, and its label
//	value       the default, in words or in the key's unit
//	source      where the default comes from, as the registry records it;
//	            "" when it records none
//
// A PLANT (type Plant) is
//
//	name        the plant's name
//
// CHECKS (type Checks) are
//
//	passed      how many check() calls passed
//	failed      [FAILURE]: the check() that failed and ended its run, if
//	            any; the document still holds what was solved before it
//
// A FAILURE (type CheckFailure) is
//
//	pos         where the check was, "file:line"
//	message     its message
//
// # A load case
//
// A CASE (type Case) has
//
//	plant                   the name of the plant the case was solved on
//	source                  where the script solved it, "file:line" (""
//	                        when built in Go)
//	name                    the case's name
//	series                  the sweep the script grouped it in ("" when
//	                        none: case{series = "..."})
//	converged               the solver brought the balance to its tolerance
//	iterations              Newton iterations of the final configuration
//	residual_norm           the final scaled residual norm (as computed)
//	sea_T_K, air_T_K        sea water and outside air temperatures, K;
//	                        null when the case did not give them
//	engine_load             main engine load, fraction of its MCR (0..1)
//	boilers_firing          how many oil-fired boilers fire
//	firing_forced           the case chose which boilers fire
//	can_carry               the firing boilers can carry the demand within
//	                        their limits (MCR times max_load)
//	shortfall_kg_h          demand beyond the firing boilers' limit, kg/h:
//	                        the steam shed (shed_kg_h), and any steam the
//	                        boilers still raise above their limit when
//	                        nothing more may be shed
//	margin_kg_h             steam the firing boilers can add before the
//	                        next boiler must fire (with all firing: before
//	                        their MCR; with none: the steam dumped), kg/h
//	steam_demand_kg_h       steam taken by the plant, kg/h
//	steam_production_kg_h   steam raised by boilers and economisers, kg/h
//	dumped_kg_h             steam sent to a dump condenser, kg/h
//	fuel_kg_h, fuel_t_per_day   fuel burnt, kg/h and t/day
//	co2_t_per_day           CO2 from the fuel by each fuel's regulatory
//	                        factor: the IMO conversion factor C_F of its
//	                        IMO fuel type (MEPC.364(79)), the figure for
//	                        regulatory reporting (a fuel without an IMO
//	                        fuel type: its analysis, or the co2_factor the
//	                        script gave), t/day
//	co2_analysis_t_per_day  CO2 from the carbon of each fuel's analysis
//	                        (complete combustion), the carbon the
//	                        combustion models burn, t/day; null when a
//	                        boiler burns a fuel without an analysis
//	makeup_kg_h             fresh water made up, kg/h
//	blowdown_kg_h           boiler blowdown, kg/h
//	vented_kg_h             flash steam vented from the feed tank, kg/h
//	condensate_lost_kg_h    condensate not returned, the header drains
//	                        that are lost and the steam passing traps that
//	                        is not returned included, kg/h
//	trap_loss_kg_h          live steam passing the consumers' steam traps,
//	                        kg/h
//	drains_returned_kg_h    header drains returned to the hotwell, kg/h
//	feed_tank_T_K           feed tank temperature, K
//	electric_kW             electrical load of pumps and fans, kW
//	balance                 BALANCE: the closures of the balances
//	ege_steam_kg_h          steam raised by exhaust-gas economisers, kg/h
//	ege_fuel_saved_kg_h     boiler fuel the economisers save against the
//	                        same case without them, kg/h
//	shed_kW, shed_kg_h      the heat (and shaft power) and the steam shed
//	                        from the consumers because the boilers at
//	                        their limit cannot carry the case; 0 when it
//	                        is carried
//	priorities_given        a consumer gave a priority; false: a
//	                        shortfall reduces every consumer in proportion
//	n_minus_1_checked       the case's N-1 contingencies were answered
//	                        (false when the plant's n_minus_1 = false)
//	contingencies           [CONTINGENCY]: the N-1 answers, in order: the
//	                        largest firing boiler trips, each exhaust-gas
//	                        economiser in service is out, each failure the
//	                        plant lists; empty when not checked
//	inert_gas               INERT_GAS: the inert-gas check while cargo
//	                        pumps run on a plant with an inert-gas source;
//	                        null otherwise
//	least_fuel              LEAST_FUEL: what least-fuel sharing chose; null
//	                        under another sharing rule or a forced firing
//	boilers                 [BOILER]: the oil-fired boilers
//	exhaust_gas_economisers  [EGE]: the exhaust-gas economisers
//	consumers               [CONSUMER]: the steam consumers and turbines
//	units                   [UNIT]: the other units
//	lines                   [LINE]: every line's solved state
//	warnings                [string]: every warning of the case
//
// A CONTINGENCY (type Contingency) is one single failure:
//
//	name                    what fails, "AB2 trips", "EGE out", "AB1 and
//	                        EGE lost"
//	kind                    "boiler trip", "economiser out" or "listed"
//	units                   [string]: the units lost
//	solved                  the failure was solved; false when the
//	                        remaining boilers' usable capacity is at least
//	                        125 % of the steam they must raise (carried,
//	                        their loads estimated) or nothing was left to
//	                        solve (note says so)
//	can_carry               the rest of the plant carries the case
//	shortfall_kg_h          steam the remaining boilers at their limit
//	                        cannot raise, kg/h
//	margin_kg_h             steam they could still add up to their
//	                        limits, kg/h
//	shed_kW, shed_kg_h      what the shortfall sheds, kW and kg/h
//	boilers                 [CONTINGENCY_BOILER]: the boilers firing after
//	                        the failure
//	shed                    [SHED]: the consumers reduced, lowest priority
//	                        first
//	note                    what the figures do not say ("" if nothing)
//	line                    the report's line for it, in words
//
// A CONTINGENCY_BOILER (type ContingencyBoiler) is
//
//	name                    the boiler's name
//	load_fraction           its steam over its MCR
//	steam_kg_h              its steam, kg/h
//	started                 it was on standby and must start
//
// A SHED (type Shed) is a consumer a contingency reduces:
//
//	name, kind              its name and kind
//	priority, priority_level   as in a CONSUMER
//	requested_kW            its duty (shaft power) before the failure, kW
//	shed_kW, shed_kg_h      what is taken from it, kW and kg/h
//	cooling                 COOLING of a tank's cargo, or null
//
// LEAST_FUEL (type LeastFuel) is least-fuel sharing's answer against
// equal sharing by the firing rule:
//
//	equal_fuel_kg_h         the fuel with equal sharing, kg/h
//	saved_kg_h, saved_pct   the fuel saved against it, kg/h and % (never
//	                        negative)
//	firing                  [string]: the boilers that fire
//	shares                  [fraction]: each one's share of their steam
//	note                    why the search did not run ("" if it did)
//
// INERT_GAS (type InertGas) is the check of the inert gas from the
// boilers' uptakes during cargo discharge:
//
//	sources, firing         [string]: the boilers declared as sources, and
//	                        those firing
//	cargo_rate_m3_h         the running cargo pumps' rate, m³/h
//	capacity                the inert gas needed as a fraction of it (1.25:
//	                        the FSS Code ch. 15 figure, from memory)
//	required_m3_h           capacity times the cargo rate, m³/h
//	delivered_Nm3_h         the firing sources' dry flue gas at 0 °C and
//	                        101.325 kPa, m³/h
//	o2_dry, o2_max          the highest O2 of the firing sources in the dry
//	                        gas, and the limit (0.05: SOLAS II-2 reg. 4.5.5
//	                        and the FSS Code, from memory), fractions
//	met                     the sources deliver enough gas within the limit
//	min_load_fraction       the lowest load (fraction of MCR, the sources
//	                        alike) at which they would meet it; null when
//	                        they cannot
//	extra_steam_kg_h        steam they raise beyond the case's when they
//	                        fire there, to be dumped, kg/h
//	extra_fuel_kg_h         the fuel that costs, kg/h
//	note                    what the figures do not say ("" if nothing)
//	line                    the report's line for it, in words
//
// The BALANCE (type Balance) is, as computed,
//
//	mass_rel                |mass in − mass out| / mass throughput
//	energy_rel              |energy in − energy out| / energy throughput
//
// A BOILER (type Boiler) is
//
//	name, fuel              the boiler's name and its fuel's
//	firing, cycling         it fires; its burner cycles below its minimum
//	on_fraction             share of the time the burner is on when it
//	                        cycles; 0 when it does not
//	load_fraction           steam over MCR
//	mcr_kg_h, steam_kg_h    its MCR and the steam it raises, kg/h
//	fuel_kg_h               fuel it burns, kg/h
//	co2_kg_h                its CO2 by the fuel's regulatory factor, kg/h
//	co2_basis               which factor: the IMO table and fuel type,
//	                        "fuel analysis: ..." for a fuel without an IMO
//	                        fuel type, or "given co2_factor"
//	co2_analysis_kg_h       its CO2 by the carbon of the fuel's analysis,
//	                        kg/h; null for a fuel without an analysis
//	imo_lcv_J_per_kg        the LCV of the fuel's IMO fuel type, J/kg, for
//	                        regulatory reports only (the energy balance
//	                        takes fuel_lhv_J_per_kg); null without one
//	efficiency              its efficiency, a fraction, on the basis of
//	efficiency_basis        "LHV" or "HHV": heat to water and steam over
//	                        the fuel's heat; for a cycling boiler the time
//	                        average, with the standby and purge losses
//	firing_efficiency       the efficiency model's figure at the firing
//	                        rate (the burner minimum while it cycles)
//	standby_loss_kW         a cycling boiler's standby loss: the heat the
//	                        warm boiler loses from its casing, kW (0 when
//	                        it does not cycle)
//	standby_off_kW          the part of it the burner's off time takes,
//	                        averaged, kW
//	purge_kW                the heat the pre-purges blow out, averaged, kW
//	purge_per_start_J       the heat of one pre-purge, J
//	starts_per_hour         burner starts per hour while it cycles (0 when
//	                        it does not); null when the starts are not
//	                        known
//	fuel_lhv_J_per_kg       the fuel's lower heating value, J/kg
//	drum_p_Pa, feed_T_K     drum pressure, Pa, and feed temperature, K
//	steam_dryness           dryness fraction of the steam
//	blowdown_kg_h           its blowdown, kg/h
//	heat_kW                 heat to the water and steam, kW
//	flue_gas_exit_T_K       flue-gas exit temperature, K
//	excess_air              λ − 1
//	losses                  LOSSES: its heat-loss account
//	fan_electric_kW         its fan's electrical power, kW
//	limit_kg_h              the most it may raise in the case (its MCR
//	                        times its max_load), kg/h
//	inert_gas_source        its uptake feeds the inert-gas system
//	o2_dry                  O2 in its dry flue gas, a fraction; null
//	                        without a combustion model or not firing
//	dry_flue_gas_Nm3_h      its dry flue gas at 0 °C and 101.325 kPa,
//	                        m³/h; null as o2_dry
//
// flue_gas_exit_T_K, excess_air and losses come from a combustion model:
// null with a plain efficiency table (fan_electric_kW then 0).
//
// LOSSES (type Losses) are, in percent of the heat input,
//
//	basis                   the basis, "LHV"
//	dry_gas_pct             dry flue gas
//	moisture_pct            water from the fuel's hydrogen and its own
//	                        water, vapour from the air and atomising steam
//	radiation_pct           radiation and convection from the casing
//	unburnt_pct             CO and solids
//	credits_pct             heat brought in above the reference by the
//	                        air, atomising steam and the fuel
//	total_pct               losses less credits
//
// An EGE (type EGE), an exhaust-gas economiser, is
//
//	name                    its name
//	in_service              it is in service
//	steam_kg_h, duty_kW     the steam it raises, kg/h, and its duty, kW
//	                        (the preheating section's included)
//	gas_kg_s                exhaust gas through it, kg/s
//	gas_in_T_K, gas_out_T_K  exhaust gas in and out, K
//	pinch_K                 evaporator pinch, K
//	bypass_fraction         share of the gas bypassed
//	preheat_kW              the preheating section's duty, kW
//	evaporator_gas_out_T_K  gas leaving the evaporator, K
//	below_min_gas_T         the gas leaves below its minimum temperature
//	                        (with fouling, just after cleaning)
//	fuel_saved_kg_h         boiler fuel it saves, kg/h
//	table_gas_kg_s, table_gas_in_T_K  the engine table's gas flow, kg/s,
//	                        and temperature, K, at the load (its reference
//	                        conditions)
//	intake_air_T_K, coolant_T_K  the intake air and charge-air coolant the
//	                        table was corrected to, K; null when not
//	                        corrected for
//	exhaust_T_correction_K  the exhaust temperature added by the site
//	                        correction, K
//	gas_flow_factor         the site correction's factor on the gas flow
//	design_ua_W_K           the clean UA at the size's reference gas flow,
//	                        W/K
//	ua_W_K                  the evaporator's UA in the case (at its gas
//	                        flow, fouled), W/K
//	ua_fraction             that UA over the clean UA at the same flow
//	fouling_lost_steam_kg_h  steam the fouling costs (clean less fouled, at
//	                        the case's feed), kg/h
//	acid_dew_point_T_K      the exhaust's acid dew point (Verhoff-Banchero),
//	                        K; null without an exhaust fuel or sulphur
//	preheat_water_in_T_K    the feed entering a preheating section, K; null
//	                        without one or without an acid dew point
//	below_acid_dew_margin   the gas outlet is within the margin of the acid
//	                        dew point, or the preheater's feed or the drum's
//	                        saturation lies below it
//	soot_risk               the case runs at a load or gas velocity where
//	                        soot builds up and soot fires are a known risk
//	gas_velocity_m_s        gas velocity through the tube bank, m/s; null
//	                        without a flow area
//
// A CONSUMER (type Consumer) is
//
//	name, kind              its name and kind
//	duty_kW                 heat it takes (shaft power for a turbine), kW
//	steam_kg_h              steam it takes, kg/h
//	condensate_return_kg_h  condensate returned, kg/h
//	condensate_lost_kg_h    condensate lost, kg/h
//	drain_cooler_kW         heat its drain cooler gives up, kW
//	drain_cooler_to         where that heat goes: "feed" (the boiler feed
//	                        after the feed pump), "hotwell" or "overboard";
//	                        "" without a drain cooler
//	trap_loss_kg_h          live steam passing its steam trap, kg/h
//	inputs                  {key: value}: the figures a computed duty came
//	                        from, keys with units; absent when the duty
//	                        was given
//	priority                its priority (40, essential, when none was
//	                        given); the lowest is reduced first
//	priority_level          the name of a named level ("deferrable",
//	                        "hotel", "cargo", "essential"), or null
//	reducible               a shortfall may reduce it in this case (it
//	                        runs, and its demand is a duty, a steam flow
//	                        or a shaft power, not one that follows a
//	                        boiler's fuel)
//	requested_kW            the duty (shaft power) the case asks for, kW
//	shed_kW, shed_kg_h      what a shortfall took from it, kW and the
//	                        steam at the solved state, kg/h
//	cargo_m3_h              the cargo a turbine's pump delivers (its flow
//	                        in proportion to the power delivered), m³/h
//	cooling                 COOLING: what the shortfall does to a tank's
//	                        cargo; null when nothing is shed from a tank
//
// COOLING (type Cooling) is
//
//	rate_K_per_h            the cargo's temperature change at the start,
//	                        K/h (negative: it cools)
//	min_T_K                 the tank's min_T, K; null when not given
//	hours_to_min_T          hours until the cargo cools to min_T with the
//	                        heating left on; null without min_T or when
//	                        it never gets there
//
// A UNIT (type Unit) is any other unit:
//
//	name, kind              its name and kind
//	figures                 [FIGURE]: its figures, sorted by key
//
// A FIGURE (type Figure) is
//
//	key                     the figure's name with its SI unit
//	value                   its value
//
// A LINE (type Line) is
//
//	name                    the line's name
//	m_kg_s, p_Pa, T_K       mass flow, pressure and temperature
//	h_J_per_kg              specific enthalpy
//	x                       steam quality; null for a single phase
//
// # Jobs over a profile
//
// Each job (VOYAGE, STUDY, AUDIT) starts with the keys of a JOB
// (type Job):
//
//	name, plant             the job's name and its plant's
//	source                  where the script ran it, "file:line"
//	row_sources             [string]: where each row (an audit's day) was
//	                        given, "file:line", in order
//
// TOTALS (type Totals) are the sums over a set of rows (each row's figures
// times its hours):
//
//	rows, hours             how many rows, and their hours
//	fuel_t, co2_t           boiler fuel burnt and its CO2 by the
//	                        regulatory factors (as co2_t_per_day of a
//	                        CASE), t
//	co2_analysis_t          its CO2 by the fuels' analyses (as
//	                        co2_analysis_t_per_day), t; null when a row
//	                        burnt a fuel without an analysis
//	steam_t, ege_steam_t    steam raised in all and by economisers, t
//	ege_fuel_saved_t        boiler fuel the economisers saved, t
//	ege_fouling_lost_steam_t  steam the economisers' fouling cost them
//	                        (clean against fouled, at each row's feed), t
//	dumped_t, makeup_t      steam dumped and water made up, t
//	electric_MWh            electrical energy, MWh
//	hours_firing            [h]: hours with 0, 1, 2, ... boilers firing
//	peak_boiler_kg_h, peak_row   highest demand on the oil-fired boilers,
//	                        kg/h, and its row; the row null when no row
//	                        was summed
//	capacity_kg_h           MCR of all boilers, kg/h
//	tightest_margin_kg_h, tightest_row   smallest margin (margin_kg_h of
//	                        a case), kg/h, and its row; null when no row
//	                        was summed
//	short_rows              [row]: rows the plant cannot carry
//	warning_rows            [row]: rows with any warning
//	fuel_by_grade           [GRADE]: the boiler fuel by grade, in the
//	                        order the grades first fire
//	n_minus_1_rows          rows whose N-1 contingencies were answered (0
//	                        when the plant's n_minus_1 = false)
//	n_minus_1_short_hours   hours of the rows in which at least one N-1
//	                        contingency cannot be carried
//	n_minus_1_short_rows    [row]: those rows
//	inert_gas_short_hours   hours of the rows whose inert-gas check is not
//	                        met
//
// A GRADE (type GradeTotal) is
//
//	grade                   the fuel's grade (or name)
//	fuel_t, co2_t           its boiler fuel burnt and CO2 by its
//	                        regulatory factor, t
//	co2_analysis_t          its CO2 by its analysis, t; null for a fuel
//	                        without an analysis
//
// A VOYAGE (type Voyage) has, after the keys of JOB,
//
//	total                   TOTALS of the whole voyage
//	phases                  [PHASE]: the totals of each phase, in the
//	                        order the phases first appear
//	rows                    [ROW]: every period
//
// A PHASE (type Phase) is
//
//	phase                   the phase's name
//
// followed by the keys of TOTALS. A ROW (type VoyageRow) is one period
// and its solved case:
//
//	row                     its number, from 1
//	phase, hours            its phase and hours
//	case                    the name of its case
//	sea_T_K, air_T_K        sea and air temperatures, K; null when not
//	                        given
//	engine_load             main engine load, fraction of its MCR
//	boilers_firing, can_carry   as in a CASE
//	steam_demand_kg_h       steam taken by the plant, kg/h
//	steam_production_kg_h   steam raised by boilers and economisers, kg/h
//	boiler_steam_kg_h       steam raised by the oil-fired boilers, kg/h
//	ege_steam_kg_h          steam raised by economisers, kg/h
//	dumped_kg_h             steam dumped, kg/h
//	fuel_kg_h               boiler fuel, kg/h
//	fuel_t, co2_t           boiler fuel and CO2 (regulatory factor) over
//	                        the row's hours, t
//	co2_analysis_t          CO2 by the fuels' analyses over the row's
//	                        hours, t; null as in a CASE
//	margin_kg_h             as in a CASE, kg/h
//	n_minus_1_can_carry     every N-1 contingency of its case is carried;
//	                        null when not checked
//	warnings                [string]: the texts of its case's warnings
//	tanks                   [VOYAGE_TANK]: the tanks the voyage carries
//	                        from row to row, over the row; empty when it
//	                        carries none
//	result                  CASE: the row's case in full, when the job
//	                        kept its rows in full (voyage()'s or study()'s
//	                        keep = "full", sim run --rows full); null
//	                        otherwise, the default, which keeps of each
//	                        row only the figures above
//
// A VOYAGE_TANK (type VoyageTank) is a tank a voyage carries from row to
// row (voyage()'s tanks), over one row:
//
//	name                    the tank_heating unit
//	instruction             "off", "hold", "heat_to" or "reach"
//	T_K                     the instruction's temperature, K; null for off
//	by_h                    for reach, the time it is wanted by, hours
//	                        from the voyage's start; else null
//	start_T_K, end_T_K      the cargo at the row's start and end, K
//	duty_kW                 the coil's mean duty over the row, kW
//	capacity_kW             the coil's capacity at the row's start, kW
//	coil_binds              the coil gave its capacity for part of the row
//	short                   the instruction's temperature was not reached
//
// A STUDY (type Study) has, after the keys of JOB,
//
//	hours                   the hours of its profile
//	fuel_price_per_t        the fuel price per tonne of boiler fuel, as
//	                        given (0 when not given)
//	installed_cost          the installed cost of each variant but the first
//	                        that gives no cost of its own, as given
//	currency                the currency of the money figures, as given
//	carbon_price_per_t_co2  the price of a tonne of CO2, as given (0 when
//	                        not given)
//	life_years, discount_rate  the life (years) and the discount rate (a
//	                        fraction a year) of the NPV, as given; null
//	                        without a life
//	soot_fire_caution       what the hours at soot-risk loads mean, and the
//	                        caution that soot fires in exhaust-gas
//	                        economisers are a known hazard
//	variants                [VARIANT]: the variants, the first the base
//	sweep                   SWEEP: the sweep of an economiser's size; null
//	                        without one
//
// A VARIANT (type Variant) is, with the keys of MONEY and EGEHOURS,
//
//	name                    its name
//	totals                  TOTALS over the profile
//	fuel_saved_t            boiler fuel saved against the first variant, t
//	co2_avoided_t           CO2 avoided against the first variant, t
//	row_warnings            [ROWWARNING]: the rows whose case warned
//	rows                    [ROW]: the variant's rows, each with its
//	                        result, when the study kept its rows in full
//	                        (study()'s keep = "full", sim run --rows full);
//	                        null otherwise (a study keeps no rows by
//	                        default: its totals are summed as it goes)
//
// A ROWWARNING (type RowWarning) is
//
//	row                     the row's number, from 1
//	warnings                [string]: the texts of its case's warnings
//
// MONEY (type Money) is what a variant or a size earns against the first
// variant; the savings are scaled to a year of 8760 h:
//
//	installed_cost          its installed cost (a variant's as given, a
//	                        size's from the sweep's cost law)
//	cost_saved              fuel_saved_t times the fuel price, over the
//	                        profile
//	carbon_cost_saved       co2_avoided_t times the carbon price, over the
//	                        profile
//	annual_saving           cost_saved plus carbon_cost_saved, per year
//	payback_years           its installed cost less the first variant's,
//	                        over annual_saving; null for the first, without
//	                        an extra cost or a price, or when nothing is
//	                        saved
//	npv                     the net present value: annual_saving over the
//	                        life at the discount rate, less the extra
//	                        installed cost; null without a life
//
// EGEHOURS (type EGEHours) are the hours of the profile in which
//
//	hours_below_min_gas_T   an economiser's gas would leave below its
//	                        minimum temperature
//	hours_below_acid_dew_margin  an economiser's gas outlet is within the
//	                        margin of the acid dew point, or its preheater's
//	                        feed or its saturation below it
//	hours_soot_risk         an economiser runs at a load or gas velocity
//	                        where soot builds up and soot fires are a known
//	                        hazard (see soot_fire_caution)
//
// A SWEEP (type Sweep) is
//
//	unit, param             the economiser and the size swept ("ua" or
//	                        "pinch")
//	cost_ref_ua_W_K, cost_ref, cost_exponent, cost_fixed  the cost law:
//	                        cost_fixed + cost_ref·(UA/cost_ref_ua_W_K)^
//	                        cost_exponent, as given (the exponent 0.6 when
//	                        not given)
//	best                    the point of highest NPV, from 1
//	points                  [SWEEP_POINT]: the sizes, in the order given
//
// A SWEEP_POINT (type SweepPoint) is, with the keys of MONEY and EGEHOURS,
//
//	value                   the size, in SI units (W/K for ua, K for pinch),
//	                        as given
//	ua_W_K                  its clean UA at the reference gas flow, W/K
//	fuel_t, co2_t           boiler fuel and CO2 over the profile, t
//	ege_steam_t, dumped_t   steam the economisers raise, and steam dumped,
//	                        over the profile, t
//	ege_fouling_lost_steam_t  steam lost to fouling, t
//	fuel_saved_t, co2_avoided_t  against the first variant, t
//	rows                    [ROW]: the size's rows, each with its result,
//	                        when the study kept its rows in full; null
//	                        otherwise
//
// An AUDIT (type Audit) has, after the keys of JOB,
//
//	samples                 Monte Carlo samples
//	seed                    the seed of the sampling
//	low_quantile, high_quantile   the bands' quantiles, fractions
//	alpha                   the level of the flags, a fraction
//	day_tail                a day's flag level, alpha/(2N) over the N days
//	                        audited (Bonferroni)
//	claims_of               what the days claim: "boiler fuel", or the
//	                        name of a cause
//	period                  PERIOD: the audited days as a whole
//	flagged                 how many days are flagged
//	days                    [DAY]: every day of the log, reference days
//	                        included
//	uncertainties           [UNCERTAIN]: the inputs drawn
//	claim_uncertainty       [CLAIMTERM]: the sources of the claim's
//	                        measurement uncertainty; empty when the claim
//	                        is taken as exact
//	implied                 [IMPLIED]: the implied factors over the days
//	calibration             CALIBRATION, or null without one
//	causes                  [CAUSE]: the fuel split out by cause
//	base_t                  the fuel the causes do not account for: the
//	                        base load and the causes' interaction (negative
//	                        when their marginal shares overlap), t; null
//	                        without causes
//	fuel_t, co2_t           the modelled boiler fuel and its CO2 over every
//	                        day of the log at the nominal inputs, t
//	fuel_by_grade           [GRADE]: the same by fuel grade, CO2 by each
//	                        grade's factor
//	assumptions             [AUDITASSUMPTION]: what the audit assumed
//	warnings                [string]: the audit's warnings
//
// The PERIOD (type AuditPeriod) is the audited days (reference days
// excepted) as a whole; its total is sampled as a whole, the sum over the
// days within each sample:
//
//	days                    how many days
//	claimed_t, nominal_t    fuel claimed, and modelled at the nominal
//	                        inputs, t
//	low_t, median_t, high_t  the quantiles of the sampled total, t
//	reading_low_t, reading_high_t  the band of what the claim's
//	                        measurement would read if the model were right
//	                        (the model with the measurement error drawn), t
//	p_at_or_below           the share of those readings at or below the
//	                        claim
//	p_at_or_above           the share at or above it
//	p_standard_error        the Monte Carlo standard error of
//	                        p_at_or_below, √(p(1−p)/n)
//	percentile              where the claim sits among the readings (the
//	                        mid-rank share)
//	flag                    "above" when p_at_or_above < alpha/2, "below"
//	                        when p_at_or_below < alpha/2, else ""
//
// A DAY (type Day) is
//
//	day                     its number, from 1
//	date, phase             its date and phase, as given
//	reference               a reference day (calibrates, is not audited)
//	claimed_t               fuel claimed, t
//	nominal_t               modelled with every uncertain input at its
//	                        nominal value, t
//	low_t, median_t, high_t  the model's band and median, t; null on a
//	                        reference day
//	reading_low_t, reading_high_t  the band of the readings, t; null on a
//	                        reference day
//	percentile              where the claim sits among the readings (the
//	                        mid-rank share); null on a reference day
//	p_at_or_below, p_at_or_above  the shares of the readings at or below,
//	                        and at or above, the claim; null on a
//	                        reference day
//	flag                    "above" or "below" when the claim lies beyond
//	                        day_tail in that tail, else ""
//	fuel_t, co2_t           the day's modelled boiler fuel and CO2 at the
//	                        nominal inputs, t
//	fuel_by_grade           [GRADE]: the same by grade
//	shares                  [SHARE]: each cause's fuel on the day
//	implied                 [IMPLIEDDAY]: each implied factor on the day
//	warnings                [string]: the warnings of the day's nominal
//	                        case
//	samples_with_warnings   how many samples' cases warned
//
// A SHARE (type Share) is
//
//	cause                   the cause's name
//	fuel_t                  the day's fuel less its fuel with the cause's
//	                        units off, at the nominal inputs, t
//
// An IMPLIEDDAY (type ImpliedDay) is
//
//	factor                  the factor's name ("AB1+AB2.eta_factor")
//	value                   the value that makes the model give the claim,
//	                        or where the model jumps across it (status
//	                        "step"); null otherwise
//	status                  "found", "step", "model above claim" or "model
//	                        below claim" (over the whole range searched), or
//	                        "no effect" (the model does not depend on the
//	                        factor that day)
//
// An UNCERTAIN (type Uncertain) input is
//
//	unit, param             the unit and the parameter drawn; unit "" with
//	                        param "sea" or "air" is that reading's error
//	low, high               the range it is drawn from uniformly, in SI
//	                        units or as a fraction, as given (or as
//	                        calibrated)
//	nominal                 its nominal value: the middle of the range, or
//	                        the calibrated value
//	scope                   "fixed" (drawn once for the period) or "daily"
//	scope_source            "given", or why the key's default scope is
//	                        what it is
//	calibrated              its range and nominal come from a calibration
//
// A CLAIMTERM (type ClaimTerm) is
//
//	source                  "flow meter", "soundings", "noon report" or
//	                        "bdn density"
//	half_width_fraction     ± a fraction of the reading (flow meter, bdn
//	                        density); null for the others
//	half_width_t            ± tonnes a reading (soundings, noon report);
//	                        null for the others
//	text                    the term in words
//
// An IMPLIED (type Implied) factor is
//
//	factor                  its name
//	targets                 [string]: the unit.key it sets
//	plausible_low, plausible_high  its plausible range (its uncertain
//	                        input's)
//	search_low, search_high  the range searched (the keys' own)
//	days_found              audited days where a value gives the claim
//	days_outside            of those, days outside the plausible range
//	mean, sd, min, max      over those days (sd with n − 1); null when
//	                        there is none (sd: fewer than two)
//	days_step               days where the model jumps across the claim
//	days_model_above, days_model_below  days where the model stays above,
//	                        or below, the claim over the range searched
//	days_no_effect          days where the model does not depend on the
//	                        factor (a heating factor with the heating off)
//
// A CALIBRATION (type Calibration) is
//
//	factor                  the factor's name
//	targets                 [string]: the unit.key it sets
//	off                     [string]: the units a reference day has off
//	value                   the value that makes the reference days' model
//	                        give their claim
//	low, high               the values for the claim less and plus its
//	                        measurement uncertainty: the range drawn from
//	reference_days          how many reference days
//	claimed_t               their claim, t
//	reading_half_width_t    its measurement uncertainty, t
//	prior_low, prior_high   the range the script gave
//
// A CAUSE (type Cause) is
//
//	name                    its name
//	units                   [string]: the units switched off to find it
//	fuel_t                  its fuel over every day of the log, t
//
// An AUDITASSUMPTION (type AuditAssumption) is
//
//	item                    what was assumed
//	value                   its value
//	source                  where it comes from ("common practice, no
//	                        source", "from memory: ...", a method's name)
//
// # Heating plans
//
// A HEATING_PLAN (type HeatingPlan) has, after the keys of JOB (its rows
// are the voyage's),
//
//	caution                 the plan's caution: an estimate; the charter
//	                        party's heating instructions, the cargo's
//	                        safety data sheet and the master's judgment
//	                        govern
//	method                  "joint" (one programme over the joint state)
//	                        or "descent" (coordinate descent)
//	grid_K                  the step of the temperature grid, K
//	solves                  plant solves of the rows' fuel curves
//	plan                    OUTCOME of the least-fuel plan
//	hold                    OUTCOME of holding each tank at its highest
//	                        required temperature from the first row to
//	                        its last required time
//	last_moment             OUTCOME of heating each tank at the coil's
//	                        capacity from the latest start that meets
//	                        each required temperature
//	saving_vs_hold_t, saving_vs_last_moment_t   boiler fuel the plan
//	                        saves against each, t
//	co2_saving_vs_hold_t, co2_saving_vs_last_moment_t   CO2 it avoids, t
//	tanks                   [PLAN_TANK]: each tank's plan
//	rows                    [PLAN_ROW]: the voyage's rows under the plan
//	binding                 [BINDING]: every row where a limit binds
//	warnings                [string]: the plan's cautions
//
// An OUTCOME (type PlanOutcome) is a plan solved as a voyage, row by row,
// with its instructions:
//
//	fuel_t, co2_t           the voyage's boiler fuel and CO2, t
//	curve_fuel_t            the fuel by the rows' fuel curves the plan was
//	                        chosen by, t
//	short_rows              [row]: rows the boilers cannot carry
//	missed                  [string]: the required temperatures it misses
//
// A PLAN_TANK (type PlanTank) is
//
//	name                    the tank_heating unit
//	start_T_K               its cargo at the voyage's start, K
//	never_below_T_K         the temperature it must not fall below, K;
//	                        null when none was given
//	required                [REQUIRED]: its required temperatures
//	rows                    [PLAN_TANK_ROW]: its instruction per row
//
// A REQUIRED (type PlanRequired) is
//
//	T_K                     the temperature required, K
//	at                      when, as given ("discharge", "240 h", "end")
//	at_h                    that time, hours from the start; null for a
//	                        phase
//	phase                   the phase it holds through, or ""
//	source                  where it was given, "file:line"
//	reached_T_K             the lowest temperature the plan has where it
//	                        holds, K
//	met                     the plan meets it (within 0.01 K)
//	latest_start_h, latest_start_row   the latest start of a heat-up at
//	                        the coil's capacity that still meets it, hours
//	                        and row; null when heating from the first row
//	                        does not
//	verdict                 when missed, by how much and what it would
//	                        take; else ""
//
// A PLAN_TANK_ROW (type PlanTankRow) is
//
//	row                     the row's number, from 1
//	instruction             "off", "hold", "heat_to" or "reach", as a
//	                        voyage row takes it
//	T_K                     its temperature, K; null for off
//	by_h                    for reach, the row's end, hours from the
//	                        start; else null
//	start_T_K, end_T_K      the cargo at the row's start and end, K
//	duty_kW                 the coil's mean duty, kW
//	coil_binds              the coil gives its capacity
//
// A PLAN_ROW (type PlanRow) is
//
//	row, phase, hours       as in a voyage's ROW
//	start_h                 its start, hours from the voyage's start
//	duty_kW                 the planned tanks' total duty, kW
//	capacity_kW             the most the row's boilers carry for them, kW
//	boilers_firing          boilers firing under the plan
//	boiler_steam_kg_h       steam raised by the oil-fired boilers, kg/h
//	fuel_t                  boiler fuel over the row, t
//
// A BINDING (type PlanBinding) is
//
//	row                     the row, from 1
//	tank                    the tank, or "" for the boilers
//	limit                   "coil", "boilers" or "never below"
package schema
