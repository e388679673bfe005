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
// *plant.CaseResult). The error is one of:
//
//   - ErrorList: script errors, sorted by position, each an *Error printing
//     as "file:line: unit: message" ("file:line:col:" for syntax errors);
//     as many as could be found in one pass, not just the first;
//   - *AssertionError: a failed check(), printing
//     "file:line: assertion failed: message" (a command exits 1);
//   - *TimeoutError: the run exceeded Options.Timeout or Options.MaxMemory;
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
// default 85 %); sharing ("equal" or "lead"); lead_load (fraction, lead
// boiler's load under "lead"; default 80 %); feed_suction_max_T
// (temperature above which the feed pump's suction is warned about;
// default 90 C).
//
// Units are declared with methods of the plant; each returns a table
// { name = ..., kind = ... } and records its script line, so that every
// later error (at check or solve time) points at it. Keys, with their
// dimension:
//
//	ship:makeup    { name, T (temperature, required), p (pressure; default ambient) }
//	ship:feed_tank { name, p (pressure; default ambient: vented), heat_loss (power),
//	                 UA (thermal conductance, W/K), room_T (temperature),
//	                 set_T (temperature held by steam heating on port "steam") }
//	ship:feed_pump { name, boilers (list of boiler names), margin (pressure
//	                 difference, "3 bar"), discharge (pressure; instead of
//	                 boilers+margin), eta (fraction, required), motor_eta (fraction; default 0.9) }
//	ship:boiler    { name, mcr (mass flow, required), drum (pressure, required),
//	                 dryness (fraction; default 1), blowdown (fraction),
//	                 tds_feed, tds_max (numbers in one unit: blowdown = tds_feed/tds_max),
//	                 turndown (number, 4 means 1:4), cycling_loss (fraction),
//	                 fuel (grade "MGO", "VLSFO", "HSFO", "LNG", or a name for your own fuel),
//	                 lhv (specific energy, "40.2 MJ/kg"), co2_factor (number, kg CO2/kg fuel),
//	                 efficiency (required: "85 %" at every load, or a table of
//	                 {load, efficiency} pairs such as { {"25 %","80 %"}, {"100 %","85 %"} },
//	                 loads increasing, interpolated linearly, LHV basis) }
//	ship:header    { name, heat_loss (power) }
//	ship:reducing_valve { name, p (pressure, required) }
//	ship:consumer  { name, duty (power) or steam (mass flow), subcool (temperature
//	                 difference, "10 K"), returns (fraction of condensate returned),
//	                 return_T (temperature after a drain cooler), off (boolean) }
//	ship:turbine   { name, power (power, required), exhaust (pressure, required),
//	                 eta_is (fraction, required), eta_mech (fraction; default 1), off (boolean) }
//	ship:condenser { name, subcool (temperature difference), dump (boolean) }
//	ship:line("name", "fromunit.port", "tounit.port")
//
// A fuel by grade takes its LHV and CO2 factor from package plant/fuel;
// lhv and co2_factor override them; a fuel that is not a grade needs both.
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
//	ship:tank_heating { name, fuel (grade: density and Cragoe specific heat) or density
//	                    (density) with cp (specific heat; default Cragoe), cargo (a name),
//	                    flash_point (temperature),
//	                    mode ("hold", default, or "heat_up"), T (hold: temperature held),
//	                    from, to (heat_up: temperatures), duration (heat_up: time),
//	                    and either dimensions = { length, breadth, depth (lengths), fill (fraction),
//	                      double_bottom, double_side (lengths), layout ("full_breadth", "wing",
//	                      "centre"), weather_deck (boolean), deck_space_T, adjacent_T
//	                      (temperatures), side_above_water (fraction), adjacent_heated (boolean),
//	                      U = { deck_ullage, deck_wetted, shell, double_hull, bulkhead, dry }
//	                      (heat transfer coefficients; default plant/loads DefaultU) }
//	                    or volume (volume) with boundaries = { {name, area (area),
//	                      U (heat transfer coefficient), beyond ("sea", "air" or "space"),
//	                      T (temperature beyond a space)}, ... } }
//	ship:fuel_heater  { name, service ("engine", "burner", "purifier", "transfer"),
//	                    fuel (grade), density15 (density), viscosity (kinematic viscosity at the
//	                    grade's reference temperature), inlet_T, and outlet_T or
//	                    target_viscosity ("13 cSt"), outlet_limit, flash_point (temperatures),
//	                    flow (mass flow of oil; not for "burner"), boiler (for "burner": the
//	                    boiler whose fuel flow it heats; its duty follows that flow in the solve) }
//	ship:accommodation { name, UA (thermal conductance), inside_T, balance_T (temperatures;
//	                    no heating at and above balance_T, default inside_T),
//	                    or table = { {air temperature, duty}, ... } }
//	ship:tank_cleaning { name, flow (mass flow of water), inlet_T (temperature; default the
//	                    case's sea temperature), outlet_T (temperature), p (pressure),
//	                    cp (specific heat; default IAPWS-IF97 pure water) }
//	ship:cargo_pump   { name, flow (volume flow), head (length), density (density),
//	                    efficiency (fraction), exhaust (pressure), eta_is, eta_mech (fractions) }
//	                    -- a turbine of shaft power rho*g*flow*head/efficiency
//	ship:atomising_steam { name, boiler, ratio (fraction: kg steam per kg fuel) } -- nothing returns
//	ship:soot_blowing { name, flow (mass flow while blowing), duration, interval (times) }
//	ship:steam_tracing { name, per_metre ("30 W/m"), length (length) }
//	ship:fresh_water_generator { name, production (mass flow of distillate),
//	                    specific_energy (specific energy) or evaporation_T, feed_T
//	                    (temperatures) with feed_ratio (number, kg feed per kg distillate) }
//
// A case may set, besides returns, subcool and off: tank_heating T, to,
// from, duration; tank_cleaning flow, outlet_T; accommodation inside_T.
// These hold for that case only.
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
// given. Defaults of the short form (common practice, no source): make-up
// at 15 C; feed pump margin 3 bar over the highest drum pressure and
// efficiency 45 %. Lines are named "makeup", "feed suction", "feed
// discharge", "feed <boiler>", "steam <boiler>", "steam to <consumer>",
// "return from <consumer>", "to PRV <header>", "from PRV <header>",
// "hotwell heating", "steam to/exhaust of/condensate of <turbine>". The
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
// plant's firing rule decides). Keys of set, by unit kind:
// consumer duty, steam, returns, subcool, return_T, off; turbine power,
// off; boiler mcr, drum, dryness, blowdown; feed_tank heat_loss, set_T,
// room_T; feed_pump eta, margin; header heat_loss; reducing_valve p;
// makeup T; condenser subcool.
//
// case solves at once (warm-started from the plant's previous case),
// records the result in the Run and returns a table mirroring the JSON of
// plant.CaseResult.JSON() (keys carry their units): r.fuel_t_per_day,
// r.boilers_firing, r.can_carry, r.boilers[1].load_fraction,
// r.consumers[i].steam_kg_h, r.warnings, ... In check mode it returns a
// table of the same shape with zero figures.
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
