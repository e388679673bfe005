// Package report renders what a run of load-case scripts solved, for
// people and for programs: a text table (Table), one JSON document (JSON),
// CSV tables of the cases and the jobs (CSV), and charts (Charts): the
// cases' steam demand against boiler capacity (Plot), a voyage's demand,
// capacity and fuel against its hours (PlotVoyage), a study's fuel saved
// by variant (PlotStudy), an audit's claimed fuel against the modelled
// band (PlotAudit), its implied factors per day (PlotAuditImplied) and the
// distribution of its period total (PlotAuditPeriod), each as SVG or PNG.
//
// Every table and JSON document carries the run's record (Run.Version,
// Run.Files with their SHA-256, Run.LuaSeed, Run.Assumptions): what an
// auditor needs to say which program read which inputs under which
// defaults.
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
// # JSON
//
// JSON writes one object, the schema.Document that Document returns: the
// schema's version, the program's version (Run.Version), the caution, the
// plants, the outcome of the scripts' check() calls (Run.Checks), and
// every case, voyage, study and audit in the form of package plant/schema,
// which documents every key, the rounding and the versions (go doc
// steamcase/plant/schema). The scripts' Lua tables have the same keys.
//
// # CSV tables
//
// CSV writes several tables in one stream, by one rule: each table starts
// with a header row whose first field is "table" and whose other fields
// name the columns with their units; each data row carries the table's
// name in its first field ("cases", "voyage rows", "voyage warnings",
// "study variants", "study warnings", "audit days", "audit periods",
// "audit implied",
// "audit shares", "audit grades", "audit warnings"); one blank line
// separates two tables
// (outside quotes: a quoted name may hold a blank line of its own). The
// cases table always comes first (its header alone when no case was
// solved); the others follow in that order when the run has such a job,
// each holding every job of its kind, named in its second column (the
// voyage warnings, one line per warning of a voyage row, come with the
// voyage rows, their header alone when no row warns). A temperature a
// case did not give is an empty cell. The columns, units
// and decimals of each table are listed in CSV's doc comment. A program
// reads the stream with a CSV reader that accepts records of different
// lengths, or picks the lines of one table by their first field.
package report
