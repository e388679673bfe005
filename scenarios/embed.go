// Package scenarios holds the load-case scripts of an invented fleet: the
// built-in demo of the command line and the worked examples of the README.
// Every ship, name and figure in them is invented for the demo; none
// describes a real vessel, maker or product.
//
//   - tanker_plant.lua, tanker.lua: a product tanker with two oil-fired
//     boilers, an exhaust-gas economiser and turbine-driven cargo pumps: port
//     stay, discharge, loaded passage with cargo heating in winter, ballast
//     passage with tank cleaning, and which of them one boiler carries (the
//     built-in demo).
//   - container_plant.lua, container.lua: a container ship at sea and in
//     port, with and without its exhaust-gas economiser.
//   - audit_heating.lua: an auditor's check of a claimed cargo-heating
//     consumption for one loaded passage: the heating's share of each day's
//     fuel split out by with/without solves, and the heating factor the
//     claim implies.
//   - voyage.lua with voyage.csv: a voyage plan, period by period.
//   - ege_study.lua with year_profile.csv: a designer's study of
//     exhaust-gas economiser variants, each with its installed cost, over a
//     year: savings, NPV and payback, cold-end and soot-risk hours, and a
//     sweep of its UA for the size of highest NPV.
//   - audit.lua with passage_log.csv: a day-by-day audit of reported boiler
//     fuel against the model: fixed and daily uncertain inputs, the flow
//     meter's uncertainty, the boilers' efficiency calibrated on two
//     reference days, the implied factors per day, the fuel by cause and by
//     grade (MGO in an emission control area).
//   - heated_tanker_plant.lua, heating_plan.lua with heating_route.csv and
//     heating_voyage.csv: a crude tanker's cargo heating plan on a winter
//     route of 12 days (three tank groups, 57 C through the discharge): the
//     least-fuel plan against holding the temperature and heating at the
//     last moment, and the engineer's own instructions as a voyage whose
//     tanks carry their temperature from row to row.
package scenarios

import "embed"

// FS holds the scripts and their data files.
//
//go:embed *.lua *.csv
var FS embed.FS

// Demo is the script of FS that "sim" runs with no arguments.
const Demo = "tanker.lua"
