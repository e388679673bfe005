package main

import (
	"bytes"
	"context"
	"errors"
	"flag"
	"fmt"
	"io"
	"strconv"
	"strings"
	"time"

	"github.com/rs/zerolog"

	"steamcase/cmd/sim/internal/report"
	"steamcase/plant/schema"
	"steamcase/scripting"
)

// maxTimeout bounds --timeout: a longer run is a mistake, not a plan.
const maxTimeout = 24 * time.Hour

func runCommand() *command {
	return &command{
		Name:      "run",
		UsageLine: "[--json | --csv] [--plot FILE] [--evidence DIR] [-o FILE] [--timeout DURATION] [--job-timeout DURATION] [--rows KEEP] [-v | --quiet] SCRIPT...",
		Short:     "solve the plants and load cases of Lua scripts and report them",
		Long: `Run runs each load-case script in turn, solving the plants and load cases
it describes, and prints a report of every case: the conditions (sea and
air temperatures, main engine load); the steam balance, with each boiler's
steam and heat and each consumer's steam and duty in kg/h and kW, and the
water lost to blowdown, venting, condensate not returned and header drains;
how many boilers fire, each one's load in % of MCR and whether its burner
cycles; the margin before the next boiler must fire; the fuel burnt in kg/h
and t/day; the CO2 in t/day; the electrical load; the feed tank
temperature; the closures of the mass and energy balances; and every
warning. The cases of several scripts form one report, in the order given.

A script that runs a voyage plan, a study of plant variants or an audit of
reported boiler fuel adds a section for each: the totals by phase and for
the whole voyage (fuel and CO2 in t, steam, hours with each number of
boilers firing, the peak demand on the boilers, the tightest margin and the
periods the plant cannot carry); each variant's totals, savings, payback
and rows with warnings; or, for an audit, each day's claimed fuel against
the modelled band, its percentile and flag, the period's total sampled as
a whole with the probability that the model lies at or below the claim,
the implied factors per day, the calibration, the fuel by cause and by
grade, the uncertain inputs, the assumptions and every warning by day.
Every report ends with the run's record: the program's version, the
SHA-256 of every script and data file read, the scripts' seed and the
defaults in force on the plants solved on.

Scripts are written in Lua with the functions plant, steam_plant, case,
check, voyage, study, audit, include and read_csv; quantities are strings
with their units, such as "7 bar(g)" or "18 t/h". A script reads files only
from its own folder and the folders below it.

The report is a table for people unless --json or --csv asks for a form for
programs: --json prints one JSON document (schema 3: the program's
version, the caution, the files read and the defaults in force, the plants,
the checks passed and failed, every case with its figures and every
voyage, study, audit and heating plan, each key naming its
unit; the same keys as the tables case() and the jobs return to a script),
--csv tables of comma-separated values under headers naming their units:
the load cases, one row each with the main figures, then the rows of the
voyages (each period's conditions, boilers firing, steam, fuel and CO2)
and their warnings, the variants of the studies (fuel, savings, payback)
and their warnings, and the days of the audits (claimed, nominal, bands,
percentile, flag) with their periods, implied factors, shares by cause,
fuel by grade and warnings. Each table starts with a header row whose
first field is "table"; its rows carry the table's name there ("cases",
"voyage rows", "voyage warnings", "study variants", "study warnings",
"audit days", "audit periods", "audit implied", "audit shares", "audit
grades" or "audit warnings"), and a blank line separates two tables. The
cases table always comes first; a job's table only when the run has such
a job. -o writes the report to a file instead of standard output (see
below).

--plot FILE also draws what the run solved, as an SVG or PNG image chosen
by the file name's extension: the load cases on one chart (the steam
demand of each, stacked by consumer, against the MCR of the boilers firing
and of all boilers); a voyage against the hours from its start, each
period a step (the steam demand on the boilers and their capacity above,
the fuel burnt in kg/h below, the phases shaded and named); a study as a
bar for each variant of the fuel it saves against the first, in t/yr; an
audit as each day's modelled band with its median and the band of what
the claim's measurement would read, and the fuel claimed, the days
flagged ringed in red; its implied factors per day against their
plausible ranges; and the distribution of its period total with the
claim marked. A run with one of these writes FILE. A run with several
writes one file for each, named FILE with a suffix before the extension:
"-cases" for the load cases and "-voyage-N", "-study-N", "-audit-N",
"-audit-implied-N" or "-audit-period-N" for the N-th job of that kind,
counted over all the scripts in order (demand.svg gives
demand-cases.svg, demand-voyage-1.svg, ...), and lists them on standard
error.

` + evidenceHelp + `

What the scripts print is plain text on standard output, before the
report; with --json or --csv it goes to standard error instead, so that
standard output holds the document alone. -v adds the solver's records
on standard error; --quiet leaves only errors there, and drops what the
scripts print. When standard error is a terminal, and without --quiet,
the progress of each voyage, study and audit is shown there on one line
redrawn in place a few times a second: the rows (an audit's days; a
study's rows times its variants) done of all, the share, the rate and the
time left at that rate, and the time taken when done.

An error in a script is printed as "file:line: message" and sim exits
with status 1. So does a failed check(), after the report of the cases
solved before it, so that the figures it tested can be seen; with --json
the document marks the failure under "checks". A script whose own code
and load cases run longer than --timeout is stopped: sim prints the report
of what was solved, then where the script was and a longer --timeout to
give. The time of a voyage, study, audit or heating plan does not count
against --timeout: each job has its own limit, --job-timeout, which by
default grows with the job (10s, and 20ms for each plant solve it will
take: its rows times its variants, its days times its samples), and a job
stopped at it is named with its line and a longer --job-timeout to give.

A voyage or a study keeps of each row what its report, its CSV, its
charts and its JSON rows show (the row's conditions, boilers firing,
steam, fuel, CO2, margins, N-1 answer, warnings and tanks), a small part
of the row's whole case result, so that a job of a hundred thousand rows
fits in memory. --rows full keeps each row's case result as well: the
JSON gives it under each row's "result" (and a study's variants and
sizes get their rows), as the scripts' tables do; --rows summary, the
default, leaves "result" null. A job's own keep key ("summary" or
"full") decides for it either way. The totals are the same.

Control characters in names and messages (a carriage return, a newline,
a terminal's escape) are shown escaped, as \r, \n or \x1b, in the table,
the CSV, the charts and the messages; the JSON keeps them exactly, in its
own escapes.

The report of -o and the charts of --plot are written together when the
run is done: each first to a temporary file beside it, then renamed into
place, so that a run that fails, is interrupted or finds the disk full
leaves the files as they were. sim checks before the run that their
folders can be written, and refuses to write a file the run reads (a
script, an include, a CSV) or to name one file twice.

Examples:

	sim run tanker.lua
	sim run --json -o tanker.json tanker.lua
	sim run --csv plant.lua voyage.lua > cases.csv
	sim run --plot demand.svg tanker.lua`,
		Flags: func() *flag.FlagSet { return new(runArgs).flagSet("run") },
		Run:   runRun,
	}
}

func checkCommand() *command {
	return &command{
		Name:      "check",
		UsageLine: "[--timeout DURATION] [-v | --quiet] SCRIPT...",
		Short:     "check load-case scripts without solving them",
		Long: `Check reads each load-case script and validates it without solving any
case: the Lua syntax, the units and keys of every table, the lines of every
plant and the balance of its equations against its unknowns. It lists every
error it finds, one per line as "file:line: message", and exits with
status 1 if there is any. Otherwise it prints one line per script with the
plants and load cases it declares, and exits with status 0.

As no case is solved, the conditions of check() are not tested and figures
that depend on a solution are zero while checking; "sim run" tests them.
What the scripts print goes to standard error, apart from the list.

Examples:

	sim check tanker.lua
	sim check plant.lua voyage.lua`,
		Flags: func() *flag.FlagSet { return new(runArgs).flagSet("check") },
		Run:   runCheck,
	}
}

// runArgs holds the flags of sim run and sim check, as given.
type runArgs struct {
	json, csv      bool
	plot, out      string
	evidence       string
	timeout        time.Duration
	jobTimeout     time.Duration // zero: scaled to each job's work
	rows           string        // what a voyage or study keeps of a row: "summary" or "full"
	verbose, quiet bool

	// timeoutFlag is set when the command takes --timeout, so that a run
	// stopped at its limit may name it (the built-in demo does not).
	timeoutFlag bool
}

func (a *runArgs) flagSet(name string) *flag.FlagSet {
	fs := flag.NewFlagSet(name, flag.ContinueOnError)
	if name == "run" {
		fs.BoolVar(&a.json, "json", false, "print the report as one JSON document")
		fs.BoolVar(&a.csv, "csv", false, "print the report as CSV tables: the cases, then the rows of voyages,\nthe variants of studies and the days of audits, a blank line between")
		fs.StringVar(&a.plot, "plot", "", "also draw the cases and each voyage, study and audit in `FILE`,\nan SVG or PNG image by the name's extension (.svg, .png); with\nseveral charts, one file each, named with a suffix before the\nextension: demand-cases.svg, demand-voyage-1.svg, ...")
		fs.StringVar(&a.out, "o", "", "write the report to `FILE` instead of standard output")
		fs.Var((*durationFlag)(&a.jobTimeout), "job-timeout", "stop a voyage, study, audit or heating plan that runs longer than\n`DURATION` (default: 10s and 20ms for each plant solve of the job)")
		fs.StringVar(&a.evidence, "evidence", "", "also write an evidence folder `DIR`: the report, the JSON, the CSV,\nthe charts, the audits' samples, a README and the files' SHA-256")
		fs.StringVar(&a.rows, "rows", "summary", "what voyages and studies keep of each row: `KEEP` is summary (what\nthe reports show; the default) or full (each row's case result as\nwell, under \"result\" in the JSON); a job's keep key decides for it")
	}
	a.timeout = 10 * time.Second
	fs.Var((*durationFlag)(&a.timeout), "timeout", "stop a script that runs longer than `DURATION`, such as 10s or 2m\n(default 10s)")
	fs.BoolVar(&a.verbose, "v", false, "log more: the solver's records as well, on standard error")
	fs.BoolVar(&a.quiet, "quiet", false, "log errors only; drop what the scripts print (and, for run, show no\nprogress)")
	return fs
}

// durationFlag is a time.Duration flag whose error says what is expected.
type durationFlag time.Duration

func (d *durationFlag) String() string { return time.Duration(*d).String() }

func (d *durationFlag) Set(s string) error {
	v, err := time.ParseDuration(s)
	if err != nil {
		return fmt.Errorf("a duration with its unit is expected, such as 10s, 2m or 1h30m")
	}
	*d = durationFlag(v)
	return nil
}

// parse reads the flags and the script names, which may come before,
// between or after the flags; after "--" every argument is a script.
func (a *runArgs) parse(name string, args []string) ([]string, error) {
	fs := a.flagSet(name)
	fs.SetOutput(io.Discard)
	fs.Usage = func() {}
	var scripts []string
	for {
		if err := fs.Parse(args); err != nil {
			if errors.Is(err, flag.ErrHelp) {
				return nil, err
			}
			return nil, &usageError{msg: err.Error()}
		}
		rest := fs.Args()
		if len(rest) == 0 {
			break
		}
		if used := len(args) - len(rest); used > 0 && args[used-1] == "--" {
			scripts = append(scripts, rest...)
			break
		}
		scripts = append(scripts, rest[0])
		args = rest[1:]
	}
	switch {
	case len(scripts) == 0:
		return nil, usagef("no script given: name one or more Lua load-case scripts, such as: sim %s tanker.lua", name)
	case a.json && a.csv:
		return nil, usagef("--json and --csv given together: choose one form of the report")
	case a.verbose && a.quiet:
		return nil, usagef("-v and --quiet given together: choose one")
	case a.timeout <= 0 || a.timeout > maxTimeout:
		return nil, usagef("--timeout %v: the time limit must be above zero and at most %v, such as 10s or 2m", a.timeout, maxTimeout)
	case a.jobTimeout < 0 || a.jobTimeout > maxTimeout:
		return nil, usagef("--job-timeout %v: the time limit must be above zero and at most %v, such as 10m or 2h", a.jobTimeout, maxTimeout)
	case name == "run" && a.rows != "summary" && a.rows != "full":
		return nil, usagef("--rows %q: give summary (each row's figures, the default) or full (each row's case result as well)", cutEcho(a.rows))
	}
	if a.plot != "" {
		if _, err := report.FormatOf(a.plot); err != nil {
			return nil, usagef("--plot: %s", err)
		}
	}
	if a.evidence != "" {
		if err := checkEvidenceDir(a.evidence); err != nil {
			return nil, usagef("--evidence: %s", err)
		}
	}
	return scripts, nil
}

// newLogger logs to w: readable lines when w is a terminal, JSON lines
// otherwise; at debug level with -v, errors only with --quiet.
func newLogger(w io.Writer, a *runArgs) zerolog.Logger {
	_, tty := terminalFd(w)
	return loggerOn(w, tty, a)
}

// loggerOn logs to w, as readable lines if console is set.
func loggerOn(w io.Writer, console bool, a *runArgs) zerolog.Logger {
	out := w
	if console {
		// The console shows messages and values as they are: escape the
		// control characters a name may hold (the JSON lines escape them).
		esc := func(i any) string {
			if i == nil {
				return ""
			}
			return escapeText(fmt.Sprint(i))
		}
		out = zerolog.ConsoleWriter{Out: w, TimeFormat: "15:04:05", FormatMessage: esc, FormatFieldValue: esc}
	}
	level := zerolog.InfoLevel
	switch {
	case a.verbose:
		level = zerolog.DebugLevel
	case a.quiet:
		level = zerolog.ErrorLevel
	}
	return zerolog.New(out).Level(level).With().Timestamp().Logger()
}

// reportedError is a failure whose messages the command has already
// written to standard error; sim exits with status 1 and adds nothing.
type reportedError struct{ n int }

func (e *reportedError) Error() string { return fmt.Sprintf("%d errors reported", e.n) }

// writeScriptError writes a script's error to w, one line per error as
// "file:line: message", and returns a reportedError. A run stopped at its
// time limit also names the flag that gives more time, when a is not nil.
// Errors that are not the script's (a file that cannot be read, a
// cancelled run) are returned as they are, for sim to print as one line.
func writeScriptError(w io.Writer, err error, a *runArgs) error {
	var list scripting.ErrorList
	var se *scripting.Error
	var ae *scripting.AssertionError
	var te *scripting.TimeoutError
	switch {
	case errors.As(err, &list):
		for _, e := range list {
			fmt.Fprintln(w, message(e))
		}
		return &reportedError{n: len(list)}
	case errors.As(err, &te):
		fmt.Fprintln(w, message(err)+timeoutHint(te, a))
		return &reportedError{n: 1}
	case errors.As(err, &se), errors.As(err, &ae):
		fmt.Fprintln(w, message(err))
		return &reportedError{n: 1}
	}
	return err
}

// timeoutHint is what follows the message of a run stopped at its time
// limit: the flag and a longer limit to give, and, if the interpreter had
// to be abandoned, that the script's cases are not reported.
func timeoutHint(te *scripting.TimeoutError, a *runArgs) string {
	hint := ""
	flag := "--timeout"
	if te.JobLimit {
		flag = "--job-timeout"
	}
	if te.Limit > 0 && a != nil && a.timeoutFlag {
		if next := longerTimeout(te.Limit); next > 0 {
			hint = "; to give it longer, run again with " + flag + " " + durationWord(next)
		} else {
			hint = "; this is the longest limit " + flag + " allows"
		}
	}
	if te.Abandoned {
		hint += "; the cases of this script are not in the report"
	}
	return hint
}

// longerTimeout suggests a time limit about ten times as long as d, from a
// list of round ones, or zero when d is already the longest allowed.
func longerTimeout(d time.Duration) time.Duration {
	for _, t := range []time.Duration{
		time.Second, 2 * time.Second, 5 * time.Second, 10 * time.Second, 30 * time.Second,
		time.Minute, 2 * time.Minute, 5 * time.Minute, 10 * time.Minute, 30 * time.Minute,
		time.Hour, 2 * time.Hour, 6 * time.Hour, 12 * time.Hour, maxTimeout,
	} {
		if t >= 10*d {
			return t
		}
	}
	if d < maxTimeout {
		return maxTimeout
	}
	return 0
}

// durationWord writes a round duration as it is typed: 2s, 2m, 1h, 24h.
func durationWord(d time.Duration) string {
	switch {
	case d%time.Hour == 0:
		return fmt.Sprintf("%dh", d/time.Hour)
	case d%time.Minute == 0:
		return fmt.Sprintf("%dm", d/time.Minute)
	}
	return d.String()
}

// scriptRunner runs one script; the demo swaps in RunSource.
type scriptRunner func(ctx context.Context, opt scripting.Options) (*scripting.Run, error)

func runRun(ctx context.Context, e env, args []string) error {
	var a runArgs
	scripts, err := a.parse("run", args)
	if err != nil {
		return err
	}
	a.timeoutFlag = true
	for _, s := range scripts {
		if err := scripting.StatScript(s); err != nil {
			return err
		}
	}
	o := &outputs{out: a.out, plot: a.plot}
	if err := o.prepare(scripts); err != nil {
		return err
	}
	runners := make([]scriptRunner, len(scripts))
	for i, s := range scripts {
		runners[i] = func(ctx context.Context, opt scripting.Options) (*scripting.Run, error) {
			return scripting.RunFile(ctx, s, opt)
		}
	}
	return runScripts(ctx, e, &a, o, runners, "")
}

// runScripts runs the scripts in turn and writes one report of their
// cases, preceded by the line first if it is not empty, to the outputs o.
func runScripts(ctx context.Context, e env, a *runArgs, o *outputs, runners []scriptRunner, first string) error {
	// On a terminal, unless --quiet, the jobs' progress is one line
	// redrawn in place, which the log records share.
	var meter *progressMeter
	log := newLogger(e.stderr, a)
	if fd, tty := terminalFd(e.stderr); tty && !a.quiet {
		meter = newProgressMeter(e.stderr, fd)
		log = loggerOn(meter, true, a)
	}
	opt := scripting.Options{Timeout: a.timeout, JobTimeout: a.jobTimeout, Logger: log, CheckRead: o.checkRead, Print: printTo(e, a, meter),
		FullRows: a.rows == "full"}
	switch {
	case meter != nil:
		opt.Progress = meter.update
	case a.verbose:
		opt.Progress = func(job string, done, total int) {
			log.Debug().Str("job", job).Int("done", done).Int("total", total).Msg("progress")
		}
	}
	all := report.Run{Version: version()}
	var failed error
	for _, run := range runners {
		r, err := run(ctx, opt)
		if r != nil && err == nil {
			log.Debug().Int("cases", len(r.Cases)).Int("voyages", len(r.Voyages)).Int("studies", len(r.Studies)).
				Int("audits", len(r.Audits)).Int("checks", r.Checks).Msg("script done")
		}
		if r != nil {
			collect(&all, r)
		}
		if err != nil {
			var ae *scripting.AssertionError
			var te *scripting.TimeoutError
			if !errors.As(err, &ae) && !errors.As(err, &te) {
				if meter != nil {
					meter.finish()
				}
				return writeScriptError(e.stderr, err, a)
			}
			// A failed check or a run stopped at its limit: report what
			// was solved (the JSON document marks a failed check), then
			// the failure.
			if ae != nil {
				all.Checks.Failed = append(all.Checks.Failed, schema.CheckFailure{Pos: ae.Pos.String(), Message: ae.Msg})
			}
			failed = err
			break
		}
	}
	if meter != nil {
		meter.finish()
	}
	if err := writeReport(e, a, o, all, first, failed != nil); err != nil {
		return err
	}
	if failed != nil {
		return writeScriptError(e.stderr, failed, a)
	}
	return nil
}

// printTo is where the scripts' print goes: standard output with the
// table, standard error with --json or --csv (standard output carries one
// document then), nowhere with --quiet. Control characters other than
// newline and tab are escaped.
func printTo(e env, a *runArgs, meter *progressMeter) io.Writer {
	if a.quiet {
		return io.Discard
	}
	w := e.stdout
	if a.json || a.csv {
		w = e.stderr
	}
	return &printWriter{w: w, meter: meter}
}

// printWriter writes a script's print, escaped, keeping the progress line
// of a terminal below it.
type printWriter struct {
	w     io.Writer
	meter *progressMeter
}

func (p *printWriter) Write(b []byte) (int, error) {
	s := escapeLines(string(b))
	if p.meter != nil {
		p.meter.writeAbove(p.w, []byte(s))
		return len(b), nil
	}
	if _, err := io.WriteString(p.w, s); err != nil {
		return 0, err
	}
	return len(b), nil
}

// collect adds what a script solved, and the checks it passed, to the
// run's report.
func collect(all *report.Run, r *scripting.Run) {
	collectRecord(all, r)
	all.Checks.Passed += r.Checks
	for _, c := range r.Cases {
		if c.Result != nil {
			all.Cases = append(all.Cases, report.Case{Plant: c.Plant, Result: c.Result})
		}
	}
	job := func(name, plant string, pos scripting.Pos, rows []scripting.Pos) report.Job {
		j := report.Job{Name: name, Plant: plant, Source: pos.String()}
		for _, p := range rows {
			j.Rows = append(j.Rows, p.String())
		}
		return j
	}
	for _, v := range r.Voyages {
		if v.Result != nil {
			all.Voyages = append(all.Voyages, report.Voyage{Job: job(v.Name, v.Plant, v.Pos, v.Rows), Result: v.Result})
		}
	}
	for _, s := range r.Studies {
		if s.Result != nil {
			all.Studies = append(all.Studies, report.Study{Job: job(s.Name, s.Plant, s.Pos, s.Rows), Result: s.Result})
		}
	}
	for _, a := range r.Audits {
		if a.Result != nil {
			all.Audits = append(all.Audits, report.Audit{Job: job(a.Name, a.Plant, a.Pos, a.Days), Result: a.Result})
		}
	}
	for _, h := range r.HeatingPlans {
		if h.Result != nil {
			all.HeatingPlans = append(all.HeatingPlans, report.HeatingPlan{Job: job(h.Name, h.Plant, h.Pos, h.Rows), Result: h.Result})
		}
	}
}

// errNothingToDraw is the error of --plot when the run solved nothing.
var errNothingToDraw = errors.New("nothing to draw: the scripts solved no load case, voyage, study or audit")

// writeReport renders the run in the form asked for and its charts, and
// writes them together (outputs.commit): the report to -o or standard
// output, the charts to --plot. Names are escaped (escapeRun) in the
// table, the CSV and the charts; the JSON carries them exactly. When the
// run failed (a check, a time limit), a chart of nothing is left out
// rather than an error: the failure says why.
func writeReport(e env, a *runArgs, o *outputs, all report.Run, first string, failed bool) error {
	var b bytes.Buffer
	if first != "" && !a.json && !a.csv {
		fmt.Fprintln(&b, first)
		fmt.Fprintln(&b)
	}
	var err error
	// The evidence folder renders its JSON before any name is escaped:
	// after the document's own JSON, or before the table or the CSV.
	var evidence []evidenceFile
	if a.evidence != "" && !a.json {
		if evidence, err = renderEvidence(all); err != nil {
			return err
		}
	}
	switch {
	case a.json:
		err = report.JSON(&b, all)
		if a.evidence != "" && err == nil {
			evidence, err = renderEvidence(all)
		}
		escapeRun(&all, true)
	case a.csv:
		escapeRun(&all, true)
		err = report.CSV(&b, all)
		// The CSV has no room for the caution; it goes to standard error.
		fmt.Fprintln(e.stderr, report.Caution)
	default:
		escapeRun(&all, false) // the table quotes the plants' names with %q
		err = report.Table(&b, all)
		escapePlants(&all)
	}
	if err != nil {
		return err
	}
	var files []pending
	if a.plot != "" {
		charts, err := chartFiles(a, all)
		switch {
		case errors.Is(err, errNothingToDraw) && failed:
		case err != nil:
			return err
		}
		files = charts
	}
	if a.out != "" {
		files = append([]pending{{flag: "-o", file: a.out, data: b.Bytes()}}, files...)
	}
	if err := o.commit(files); err != nil {
		return err
	}
	if n := len(files); a.plot != "" && n > 1 && !a.quiet {
		var names []string
		for _, f := range files {
			if f.flag == "--plot" {
				names = append(names, f.file)
			}
		}
		if len(names) > 1 {
			fmt.Fprintf(e.stderr, "sim run: %d charts written: %s\n", len(names), escapeText(strings.Join(names, ", ")))
		}
	}
	if a.evidence != "" {
		if err := commitEvidence(a.evidence, evidence); err != nil {
			return err
		}
	}
	if a.out != "" {
		return nil
	}
	_, err = e.stdout.Write(b.Bytes())
	return err
}

func runCheck(ctx context.Context, e env, args []string) error {
	var a runArgs
	scripts, err := a.parse("check", args)
	if err != nil {
		return err
	}
	a.timeoutFlag = true
	opt := scripting.Options{Timeout: a.timeout, Logger: newLogger(e.stderr, &a), CheckOnly: true,
		Print: printTo(env{stdout: e.stderr, stderr: e.stderr}, &a, nil)}
	errs := 0
	for _, s := range scripts {
		r, err := scripting.RunFile(ctx, s, opt)
		if err == nil {
			line := fmt.Sprintf("%s: ok: %s, %s", s, count(len(r.Plants), "plant"), count(len(r.Cases), "load case"))
			for _, j := range []struct {
				n    int
				what string
			}{{len(r.Voyages), "voyage"}, {len(r.Studies), "study"}, {len(r.Audits), "audit"}} {
				if j.n > 0 {
					line += ", " + count(j.n, j.what)
				}
			}
			fmt.Fprintln(e.stdout, line)
			continue
		}
		if ctx.Err() != nil {
			return ctx.Err()
		}
		var re *reportedError
		var fe *scripting.FileError
		switch werr := writeScriptError(e.stderr, err, &a); {
		case errors.As(werr, &re):
			errs += re.n
		case errors.As(werr, &fe):
			// A script that cannot be read: one line, and on with the
			// others.
			fmt.Fprintf(e.stderr, "sim: %s\n", message(fe))
			errs++
		default:
			fmt.Fprintf(e.stderr, "sim check: %s\n", message(werr))
			errs++
		}
	}
	if errs > 0 {
		return &reportedError{n: errs}
	}
	return nil
}

// count writes "1 plant", "2 plants", "2 studies".
func count(n int, what string) string {
	if n == 1 {
		return "1 " + what
	}
	if strings.HasSuffix(what, "y") && !strings.HasSuffix(what, "ay") && !strings.HasSuffix(what, "ey") {
		return fmt.Sprintf("%d %sies", n, what[:len(what)-1])
	}
	return fmt.Sprintf("%d %ss", n, what)
}

// plotFile is the file of a chart: name itself when the run draws one
// chart; with several, name with a suffix before its extension: "-cases"
// for the load cases, "-voyage-N", "-study-N" or "-audit-N" for the N-th
// job of that kind (demand.svg: demand-cases.svg, demand-voyage-1.svg).
func plotFile(name string, c report.Chart, several bool) string {
	if !several {
		return name
	}
	suffix := "-" + c.Kind
	if c.N > 0 {
		suffix += "-" + strconv.Itoa(c.N)
	}
	dot := strings.LastIndexByte(name, '.')
	if dot < 0 || strings.ContainsAny(name[dot:], `/\`) {
		return name + suffix
	}
	return name[:dot] + suffix + name[dot:]
}
