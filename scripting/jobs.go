package scripting

import (
	"bytes"
	"context"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant"
	"steamcase/plant/profile"
	"steamcase/plant/schema"
	"steamcase/plant/units"
)

// VoyageRecord is one voyage() of a run.
type VoyageRecord struct {
	Name  string
	Plant string
	Pos   Pos // where voyage() was called
	// Rows are where each row was given: the CSV file and line, or the
	// voyage() call for rows given as tables.
	Rows []Pos
	// Result holds every row's summary and the totals, and every row's
	// full case result when the voyage kept its rows in full (keep =
	// "full", Options.FullRows); nil in check mode.
	Result *profile.Result
}

// StudyRecord is one study() of a run.
type StudyRecord struct {
	Name   string
	Plant  string
	Pos    Pos
	Rows   []Pos
	Result *profile.StudyResult // nil in check mode
}

// AuditRecord is one audit() of a run.
type AuditRecord struct {
	Name   string
	Plant  string
	Pos    Pos
	Days   []Pos
	Result *profile.AuditResult // nil in check mode
}

// maxJobErrors bounds the errors one CSV file or row list reports before
// the job gives up reading it.
const maxJobErrors = 50

// jobRows are the rows of a voyage or study, or the days of an audit, as
// read from the script or a CSV file.
type jobRows struct {
	rows      []profile.Row
	pos       []Pos
	dates     []string  // audit
	claimed   []float64 // audit, tonnes
	reference []bool    // audit: a reference day
}

// rowSpec says which columns or keys a kind of job takes.
type rowSpec struct {
	job   string // "voyage", "study", "audit"
	audit bool
}

// ---------------------------------------------------------------------------
// Rows from Lua tables.

// tableRows reads rows = { {phase, hours, sea, air, engine, set, fire}, ... }
// (or days = {...} for an audit, with date and claimed).
func (r *runner) tableRows(ph *plantHandle, a *args, key string, spec rowSpec) *jobRows {
	t, ok := a.get(key).(*lua.LTable)
	if !ok {
		a.errorf(nil, "%s must be a list of tables; got %s", key, describe(a.t.RawGetString(key)))
		return nil
	}
	n := t.Len()
	if n == 0 || n > r.opt.MaxRows {
		a.errorf(nil, "%s needs 1 to %d entries; got %d", key, r.opt.MaxRows, n)
		return nil
	}
	out := &jobRows{}
	for i := 1; i <= n; i++ {
		if a.nerr >= maxJobErrors {
			a.errorf(nil, "%s: too many errors; stopped reading at entry %d", key, i)
			break
		}
		rt, ok := t.RawGetInt(i).(*lua.LTable)
		if !ok {
			a.errorf(nil, "%s[%d] must be a table such as { phase = \"sea passage\", hours = 24, sea = \"15 C\" }; got %s", key, i, describe(t.RawGetInt(i)))
			continue
		}
		r.checkSize(rt, key)
		ra := r.args(rt, fmt.Sprintf("%s %s[%d]", a.what, key, i), a.pos, ph.uopt)
		var row profile.Row
		row.Case.Pos = plant.Pos{File: a.pos.File, Line: a.pos.Line}
		var date string
		var claimed float64
		var ref bool
		if spec.audit {
			date, _ = ra.str("date", true)
			claimed = r.tonnes(ra, "claimed")
			ref = ra.boolean("reference")
			row.Phase, _ = ra.str("phase", false)
			row.Hours = 24
		} else {
			row.Phase, _ = ra.str("phase", true)
		}
		if v := ra.get("hours"); v != lua.LNil || !spec.audit {
			h, err := parseHours(v, "hours")
			if err != nil {
				ra.errorf(err, "%v", err)
			}
			row.Hours = h
		}
		if nm, ok := ra.str("name", false); ok {
			row.Case.Name = nm
		} else if spec.audit {
			row.Case.Name = date
		} else {
			row.Case.Name = fmt.Sprintf("%s %d", key, i)
		}
		row.Case.Conditions.SeaT, _ = ra.quantity("sea", units.Temperature, false)
		row.Case.Conditions.AirT, _ = ra.quantity("air", units.Temperature, false)
		row.Case.Conditions.EngineLoad = ra.engineLoad()
		if v := ra.get("set"); v != lua.LNil {
			row.Case.Set = r.caseSettings(ph, ra, v, row.Case.Pos)
		}
		if ra.has("fire") {
			row.Case.Fire = r.fireList(ph, ra)
		}
		ra.done()
		a.nerr += ra.nerr
		out.rows = append(out.rows, row)
		out.pos = append(out.pos, a.pos)
		out.dates = append(out.dates, date)
		out.claimed = append(out.claimed, claimed)
		out.reference = append(out.reference, ref)
	}
	return out
}

// fireList reads fire = { "AB1", ... } and checks the names are boilers.
func (r *runner) fireList(ph *plantHandle, a *args) []string {
	fire := a.names("fire")
	if fire == nil {
		fire = []string{}
	}
	for _, b := range fire {
		if ph.kinds[b] != "boiler" {
			msg := fmt.Sprintf("fire: %q is not a boiler of the plant", b)
			if s := suggest(b, ph.boilerNames()); s != "" {
				msg += fmt.Sprintf("; did you mean %q?", s)
			}
			a.errorf(nil, "%s", msg)
		}
	}
	return fire
}

// parseHours reads hours: a number of hours, or a time ("6 h", "2 d").
func parseHours(v lua.LValue, key string) (float64, error) {
	switch x := v.(type) {
	case lua.LNumber:
		f := float64(x)
		if !(f > 0) || math.IsInf(f, 0) {
			return 0, fmt.Errorf("%s must be a positive number of hours; got %s", key, describe(v))
		}
		if f > maxRowHours {
			return 0, fmt.Errorf("%s must be at most %g h (a leap year) for one row; got %s", key, maxRowHours, asGiven(v))
		}
		return f, nil
	case lua.LString:
		s := strings.TrimSpace(string(x))
		if f, err := strconv.ParseFloat(s, 64); err == nil {
			return parseHours(lua.LNumber(f), key)
		}
		sec, err := units.Parse(s, units.Time, units.Options{})
		if err != nil {
			return 0, fmt.Errorf("%s: %w", key, err)
		}
		if !(sec > 0) {
			return 0, fmt.Errorf("%s must be positive; got %q", key, s)
		}
		if sec/3600 > maxRowHours {
			return 0, fmt.Errorf("%s must be at most %g h (a leap year) for one row; got %s", key, maxRowHours, cut(s))
		}
		return sec / 3600, nil
	case *lua.LNilType:
		return 0, fmt.Errorf("%s is required: a number of hours such as 24, or a time such as \"6 h\"", key)
	}
	return 0, fmt.Errorf("%s must be a number of hours or a time such as \"6 h\"; got %s", key, describe(v))
}

// tonnes reads a required mass of fuel: "12.5 t", "12500 kg", or a bare
// number of tonnes.
func (r *runner) tonnes(a *args, key string) float64 {
	v := a.get(key)
	if v == lua.LNil {
		a.errorf(nil, "%s is required: the fuel reported, such as %s = \"12.5 t\"", key, key)
		return 0
	}
	t, err := parseTonnes(v, key)
	if err != nil {
		a.errorf(err, "%v", err)
	}
	return t
}

func parseTonnes(v lua.LValue, key string) (float64, error) {
	var t float64
	switch x := v.(type) {
	case lua.LNumber:
		t = float64(x)
	case lua.LString:
		s := strings.TrimSpace(string(x))
		if f, err := strconv.ParseFloat(s, 64); err == nil {
			t = f
		} else {
			kg, err := units.Parse(s, units.Mass, units.Options{})
			if err != nil {
				return 0, fmt.Errorf("%s: %w", key, err)
			}
			t = kg / 1000
		}
	default:
		return 0, fmt.Errorf("%s must be a mass of fuel such as \"12.5 t\"; got %s", key, describe(v))
	}
	if !(t >= 0) || math.IsInf(t, 0) {
		return 0, fmt.Errorf("%s must be zero or more tonnes; got %g", key, t)
	}
	if t > maxTonnes {
		return 0, fmt.Errorf("%s must be at most %g t; got %s", key, maxTonnes, asGiven(v))
	}
	return t, nil
}

// The bounds of a row's hours and of a claimed mass of fuel: a leap year
// of hours; more fuel than the boilers of any ship burn on a voyage (from
// memory: a very large crude carrier's discharge burns 80-150 t).
const (
	maxRowHours = 8784.0
	maxTonnes   = 1e4
)

// ---------------------------------------------------------------------------
// Rows from CSV files.

// readCSVFile reads a CSV file beside the calling script: its header and
// records, each with its line in the file.
func (r *runner) readCSVFile(fn, name string) (show string, hline int, header []string, recs [][]string, lines []int) {
	fsPath, show := r.resolve(fn, name)
	b := r.readFile(fn, name, fsPath, show, r.opt.MaxCSVBytes)
	cr := csv.NewReader(bytes.NewReader(b))
	cr.Comment = '#'
	cr.TrimLeadingSpace = true
	header, err := cr.Read()
	if err == io.EOF {
		r.fail("", "%s(%q): the file is empty; it needs a header row", fn, name)
	}
	if err != nil {
		r.csvErrIn(fn, show, name, err)
	}
	hline, _ = cr.FieldPos(0)
	const maxCols = 256
	if len(header) > maxCols {
		r.raise(&Error{Pos: Pos{File: show, Line: hline}, Msg: fmt.Sprintf("%d columns; at most %d are accepted", len(header), maxCols)})
	}
	seen := map[string]bool{}
	for i, h := range header {
		h = strings.TrimSpace(h)
		header[i] = h
		if h == "" {
			r.raise(&Error{Pos: Pos{File: show, Line: hline}, Msg: fmt.Sprintf("column %d of the header is empty", i+1)})
		}
		if seen[h] {
			r.raise(&Error{Pos: Pos{File: show, Line: hline}, Msg: fmt.Sprintf("column %q appears twice in the header", h)})
		}
		seen[h] = true
	}
	for {
		rec, err := cr.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			r.csvErrIn(fn, show, name, err)
		}
		if len(recs) >= r.opt.MaxRows {
			r.fail("", "%s(%q): more than %d rows", fn, name, r.opt.MaxRows)
		}
		line, _ := cr.FieldPos(0)
		for i := range rec {
			rec[i] = strings.TrimSpace(rec[i])
		}
		recs = append(recs, rec)
		lines = append(lines, line)
	}
	if len(recs) == 0 {
		r.raise(&Error{Pos: Pos{File: show, Line: hline}, Msg: fmt.Sprintf("%s(%q): the file has a header but no rows", fn, name)})
	}
	return show, hline, header, recs, lines
}

// csvColumn is a column of a job's CSV file: one of the row's own fields,
// or a unit's key.
type csvColumn struct {
	field string // "phase", "hours", ...; empty for a unit's key
	unit  string
	key   plant.Key
	name  string // the header
}

// csvRows reads the rows (or audit days) of a job from a CSV file. Its
// header names the columns: phase, hours, sea, air, engine, name (and for
// an audit date and claimed), and any number of "unit.key" columns.
func (r *runner) csvRows(ph *plantHandle, fn, name string, spec rowSpec) *jobRows {
	show, hline, header, recs, lines := r.readCSVFile(fn, name)
	fields := []string{"phase", "hours", "sea", "air", "engine", "name", "fire"}
	required := []string{"phase", "hours"}
	if spec.audit {
		fields = append(fields, "date", "claimed", "reference")
		required = []string{"date", "claimed"}
	}
	nerr := len(r.errs)
	cols := make([]csvColumn, len(header))
	r.csvColumns(ph, header, fields, required, Pos{File: show, Line: hline}, cols)
	if len(r.errs) > nerr {
		r.raise(stopRun{})
	}

	out := &jobRows{}
	for n, rec := range recs {
		if len(r.errs)-nerr >= maxJobErrors {
			r.addErrf(Pos{File: show, Line: lines[n]}, "too many errors; stopped reading %s here", name)
			break
		}
		pos := Pos{File: show, Line: lines[n]}
		var d csvRecord
		d.row.Case.Pos = plant.Pos{File: show, Line: lines[n]}
		d.row.Hours = 24
		for i, c := range cols {
			cell := rec[i]
			if cell == "" {
				continue
			}
			if err := d.cell(ph, c, cell); err != nil {
				r.cellErr(pos, c, err)
			}
		}
		for _, req := range required {
			if i := indexOfString(header, req); i >= 0 && rec[i] == "" {
				r.cellErr(pos, csvColumn{name: req}, fmt.Errorf("is empty; it is required in every row"))
			}
		}
		if d.row.Case.Name == "" {
			d.row.Case.Name = fmt.Sprintf("%s:%d", show, lines[n])
			if d.date != "" {
				d.row.Case.Name = d.date
			}
		}
		out.rows = append(out.rows, d.row)
		out.pos = append(out.pos, pos)
		out.dates = append(out.dates, d.date)
		out.claimed = append(out.claimed, d.claimed)
		out.reference = append(out.reference, d.ref)
	}
	if len(r.errs) > nerr {
		r.raise(stopRun{})
	}
	return out
}

// addErrf adds an error at pos to the run's errors.
func (r *runner) addErrf(pos Pos, format string, v ...any) {
	r.errs = append(r.errs, &Error{Pos: pos, Msg: fmt.Sprintf(format, v...)})
}

// cellErr adds the error of a cell of column c in the row at pos, named
// by its column (the parsers' own prefix of the key is dropped).
func (r *runner) cellErr(pos Pos, c csvColumn, err error) {
	msg := strings.TrimPrefix(strings.TrimPrefix(err.Error(), c.field+": "), c.key.Name+": ")
	r.errs = append(r.errs, &Error{Pos: pos, Msg: fmt.Sprintf("column %q: %s", c.name, msg), Err: err})
}

// csvColumns sets cols to the columns the header names: each one of the
// row's fields, or a unit's key ("unit.key") a case may set, adding an
// error at hdr for each unknown column and each required one missing.
func (r *runner) csvColumns(ph *plantHandle, header, fields, required []string, hdr Pos, cols []csvColumn) {
	for i, h := range header {
		cols[i].name = h
		if contains(fields, h) {
			cols[i].field = h
			continue
		}
		dot := strings.LastIndexByte(h, '.')
		if dot <= 0 || dot == len(h)-1 {
			msg := fmt.Sprintf("unknown column %q", h)
			if s := suggest(h, fields); s != "" {
				msg += fmt.Sprintf("; did you mean %q?", s)
			}
			r.addErrf(hdr, "%s (columns: %s, or \"unit.key\" such as \"cargo heating.duty\")", msg, strings.Join(fields, ", "))
			continue
		}
		unit, key := h[:dot], h[dot+1:]
		if ph.p.Component(unit) == nil {
			r.addErrf(hdr, "column %q: %s", h, r.unknownUnitMsg(ph, unit))
			continue
		}
		keys := r.caseKeys(ph, unit)
		var accepted []string
		found := false
		for _, k := range keys {
			accepted = append(accepted, k.Name)
			if k.Name == key {
				cols[i].unit, cols[i].key, found = unit, k, true
			}
		}
		if !found {
			r.addErrf(hdr, "column %q: %s", h, unknownKeyMsg(key, accepted))
		}
	}
	for _, req := range required {
		if !contains(header, req) {
			r.addErrf(hdr, "missing column %q (the header has: %s)", req, strings.Join(header, ", "))
		}
	}
}

// csvRecord is a row (or audit day) of a job's CSV file as it is read.
type csvRecord struct {
	row     profile.Row
	date    string  // audit
	claimed float64 // audit, tonnes
	ref     bool    // audit: a reference day
}

// cell reads a cell of column c, not empty, into the record.
func (d *csvRecord) cell(ph *plantHandle, c csvColumn, cell string) error {
	uopt := ph.uopt
	v := lua.LString(cell)
	var err error
	switch c.field {
	case "phase":
		d.row.Phase = cell
	case "name":
		d.row.Case.Name = cell
	case "fire":
		err = csvFire(ph, cell, &d.row.Case)
	case "date":
		d.date = cell
	case "hours":
		d.row.Hours, err = parseHours(v, "hours")
	case "claimed":
		d.claimed, err = parseTonnes(v, "claimed")
	case "reference":
		switch strings.ToLower(cell) {
		case "true", "yes", "1":
			d.ref = true
		case "false", "no", "0":
		default:
			err = fmt.Errorf("must be true or false (a reference day, or not); got %q", cell)
		}
	case "sea":
		d.row.Case.Conditions.SeaT, err = parseQuantity(v, "sea", units.Temperature, uopt)
	case "air":
		d.row.Case.Conditions.AirT, err = parseQuantity(v, "air", units.Temperature, uopt)
	case "engine":
		var v lua.LValue = lua.LString(cell)
		if f, perr := strconv.ParseFloat(cell, 64); perr == nil {
			v = lua.LNumber(f)
		}
		d.row.Case.Conditions.EngineLoad, err = parseEngineLoad(v, "engine", uopt)
	case "":
		err = csvSetting(c, cell, &d.row.Case, uopt)
	}
	return err
}

// csvFire adds to the case the boilers a "fire" cell lists ("AB1+AB2"),
// up to the first that is not a boiler of the plant, whose error it
// returns.
func csvFire(ph *plantHandle, cell string, c *plant.Case) error {
	for _, b := range strings.Split(cell, "+") {
		b = strings.TrimSpace(b)
		if ph.kinds[b] != "boiler" {
			msg := fmt.Sprintf("%q is not a boiler of the plant (list boilers as \"AB1+AB2\")", b)
			if s := suggest(b, ph.boilerNames()); s != "" {
				msg += fmt.Sprintf("; did you mean %q?", s)
			}
			return errors.New(msg)
		}
		c.Fire = append(c.Fire, b)
	}
	return nil
}

// csvSetting adds to the case the setting of a unit's key a cell of
// column c gives: a text as it is, a number read in the key's dimension
// and within its range.
func csvSetting(c csvColumn, cell string, cs *plant.Case, uopt units.Options) error {
	if c.key.Kind == plant.KeyText {
		cs.Set = append(cs.Set, plant.Setting{Unit: c.unit, Param: c.key.Name, Text: cell, Pos: cs.Pos})
		return nil
	}
	f, err := parseSetCell(cell, &c.key, uopt)
	if err == nil {
		err = rangeErr(&c.key, c.key.Name, f, lua.LString(cell))
	}
	if err == nil {
		cs.Set = append(cs.Set, plant.Setting{Unit: c.unit, Param: c.key.Name, Value: f, Pos: cs.Pos})
	}
	return err
}

func indexOfString(list []string, s string) int {
	for i, x := range list {
		if x == s {
			return i
		}
	}
	return -1
}

// parseCell reads a CSV cell as a quantity; a fraction may be a bare
// number (0.85).
func parseCell(cell, key string, dim units.Dimension, uopt units.Options) (float64, error) {
	if dim == units.Fraction {
		if f, err := strconv.ParseFloat(cell, 64); err == nil {
			return parseQuantity(lua.LNumber(f), key, dim, uopt)
		}
	}
	return parseQuantity(lua.LString(cell), key, dim, uopt)
}

// parseSetCell reads a CSV cell for a unit's key: true/false for a switch,
// a plain number, a choice, a pressure difference, or a quantity.
func parseSetCell(cell string, k *plant.Key, uopt units.Options) (float64, error) {
	switch k.Kind {
	case plant.KeyFlag:
		switch strings.ToLower(cell) {
		case "true", "yes", "1":
			return 1, nil
		case "false", "no", "0":
			return 0, nil
		}
		return 0, fmt.Errorf("%s must be true or false; got %q", k.Name, cell)
	case plant.KeyNumber:
		f, err := strconv.ParseFloat(cell, 64)
		if err != nil || math.IsNaN(f) || math.IsInf(f, 0) {
			return 0, fmt.Errorf("%s must be a finite number; got %q", k.Name, cell)
		}
		return f, nil
	case plant.KeyQuantity:
		return parseCell(cell, k.Name, k.Dim, uopt)
	}
	return parseSetting(lua.LString(cell), k, k.Name, uopt)
}

// ---------------------------------------------------------------------------
// The jobs.

// jobStart reads what voyage, study and audit share: the plant, the table,
// the name, and the rows (rows or csv; days for an audit).
func (r *runner) jobStart(job string, spec rowSpec, extra func(a *args)) (*plantHandle, *args, string, *jobRows) {
	ph := r.checkPlant(1)
	t := r.checkTable(2, job)
	pos := r.where()
	r.checkSize(t, job)
	a := r.args(t, job, pos, ph.uopt)
	name, ok := a.str("name", false)
	if !ok {
		name = fmt.Sprintf("%s %d", job, r.nJobs+1)
	}
	r.nJobs++
	a.what = fmt.Sprintf("%s %q", job, name)
	r.flushLines(ph)
	listKey := "rows"
	if spec.audit {
		listKey = "days"
	}
	var rows *jobRows
	hasList, hasCSV := a.has(listKey), a.has("csv")
	switch {
	case hasList && hasCSV:
		a.errorf(nil, "give %s or csv, not both", listKey)
	case hasCSV:
		file, _ := a.str("csv", true)
		if file != "" {
			rows = r.csvRows(ph, job, file, spec)
		}
	case hasList:
		rows = r.tableRows(ph, a, listKey, spec)
	default:
		a.errorf(nil, "needs its %s: %s = { {...}, ... } or csv = \"file.csv\"", listKey, listKey)
	}
	if extra != nil {
		extra(a)
	}
	a.done()
	r.checkPlantOnce(ph)
	if r.opt.CheckOnly {
		// Check mode goes on to find more errors.
		if rows == nil {
			rows = &jobRows{}
		}
		return ph, a, name, rows
	}
	if r.emptyPlant(ph) || len(r.errs) > 0 || rows == nil {
		r.raise(stopRun{})
	}
	return ph, a, name, rows
}

// progress returns the profile's progress callback for a job, or nil.
func (r *runner) progress(job string) func(done, total int) {
	if r.opt.Progress == nil {
		return nil
	}
	return func(done, total int) { r.opt.Progress(job, done, total) }
}

// raiseLimit raises, at the job's call pos, a time limit that stopped
// job what: its own limit (err is a job's TimeoutError) or the script's
// (limitErr), naming the job. Any other error it leaves to the caller.
func (r *runner) raiseLimit(pos Pos, what string, err error) {
	var jt *TimeoutError
	if errors.As(err, &jt) && jt.JobLimit {
		r.raise(&Error{Pos: pos, Msg: jt.Error(), Err: jt})
	}
	if lerr := r.limitErr(pos); lerr != nil {
		var te *TimeoutError
		if errors.As(lerr, &te) {
			te.Job = what
		}
		r.raise(&Error{Pos: pos, Msg: lerr.Error(), Err: lerr})
	}
}

// jobErr raises the error of a profile run at the row it names, when it
// names one.
func (r *runner) jobErr(pos Pos, what string, err error) {
	r.raiseLimit(pos, what, err)
	var se *plant.SolveError
	if errors.As(err, &se) && se.Pos.File != "" {
		pos = Pos{File: se.Pos.File, Line: se.Pos.Line}
	}
	msg := err.Error()
	var pe *profile.PosError
	if errors.As(err, &pe) && pe.Pos.File != "" && err == error(pe) {
		// The input's own position (a row, a setting), not the job's call.
		pos, msg = Pos{File: pe.Pos.File, Line: pe.Pos.Line}, pe.Err.Error()
	}
	r.raise(&Error{Pos: pos, Unit: what, Msg: msg, Err: err})
}

// luaVoyage is voyage(plant, { name, rows or csv, tanks }).
func (r *runner) luaVoyage(L *lua.LState) int {
	var specs []tankSpec
	var full bool
	ph, a, name, rows := r.jobStart("voyage", rowSpec{job: "voyage"}, func(a *args) {
		specs = r.stateTanks(r.checkPlant(1), a, false, false)
		full = r.keepFull(a)
	})
	rec := VoyageRecord{Name: name, Plant: ph.p.Name, Pos: a.pos, Rows: rows.pos}
	if r.opt.CheckOnly {
		r.out.Voyages = append(r.out.Voyages, rec)
		o := r.profileTable(rec.job(), placeholderResult(rows.rows, outlines(ph.p, full)))
		r.placeholderTanks(o, specs)
		L.Push(o)
		return 1
	}
	var res *profile.Result
	// A row is one solve, and one more for the economisers' saving.
	err := r.inJob(a.what, a.pos, 2*len(rows.rows), func(ctx context.Context) error {
		var err error
		res, err = profile.Run(ctx, ph.p, rows.rows, profile.Options{Workers: r.opt.Workers, Progress: r.progress(a.what),
			Tanks: tankStarts(specs, a.pos), KeepResults: full})
		return err
	})
	if err != nil {
		r.jobErr(a.pos, a.what, err)
	}
	rec.Result = res
	r.out.Voyages = append(r.out.Voyages, rec)
	L.Push(r.profileTable(rec.job(), res))
	return 1
}

// luaStudy is study(plant, { name, rows or csv, variants, fuel_price,
// installed_cost, currency, carbon_price, life, discount_rate, sweep }).
func (r *runner) luaStudy(L *lua.LState) int {
	var spec profile.StudySpec
	var full bool
	ph, a, name, rows := r.jobStart("study", rowSpec{job: "study"}, func(a *args) {
		full = r.keepFull(a)
		ph0 := r.checkPlant(1)
		spec.Variants = r.studyVariants(ph0, a)
		spec.Economics = r.studyEconomics(a)
		if v := a.get("sweep"); v != lua.LNil {
			spec.Sweep = r.studySweep(ph0, a, v, spec.Economics)
		}
	})
	variants, econ := spec.Variants, spec.Economics
	rec := StudyRecord{Name: name, Plant: ph.p.Name, Pos: a.pos, Rows: rows.pos}
	job := schema.Job{Name: name, Plant: ph.p.Name, Source: a.pos.String(), RowSources: posStrings(rows.pos)}
	if r.opt.CheckOnly {
		res := &profile.StudyResult{Economics: econ, HasNPV: econ.LifeYears > 0}
		empty := placeholderResult(rows.rows, outlines(ph.p, full))
		// The same shape as a solved study, with zero figures: every
		// variant but the base has a payback and the first size is the
		// best, so that a script's arithmetic on them runs.
		for i, v := range variants {
			res.Variants = append(res.Variants, profile.VariantResult{Name: v.Name, Totals: empty.Total,
				Money: profile.Money{HasPayback: i > 0}, Rows: keptRows(empty.Rows, full)})
		}
		if sw := spec.Sweep; sw != nil {
			res.Sweep = &profile.SweepResult{Unit: sw.Unit, Param: sw.Param, Cost: sw.Cost}
			for _, x := range sw.Values {
				res.Sweep.Points = append(res.Sweep.Points, profile.SweepPoint{Value: x, Totals: empty.Total, Money: profile.Money{HasPayback: true},
					Rows: keptRows(empty.Rows, full)})
			}
		}
		r.out.Studies = append(r.out.Studies, rec)
		L.Push(r.studyTable(job, res))
		return 1
	}
	runs := len(variants)
	if spec.Sweep != nil {
		runs += len(spec.Sweep.Values)
	}
	var res *profile.StudyResult
	err := r.inJob(a.what, a.pos, 2*runs*len(rows.rows), func(ctx context.Context) error {
		var err error
		res, err = profile.RunStudy(ctx, ph.p, rows.rows, spec, profile.Options{Workers: r.opt.Workers, Progress: r.progress(a.what),
			KeepResults: full})
		return err
	})
	if err != nil {
		r.jobErr(a.pos, a.what, err)
	}
	rec.Result = res
	r.out.Studies = append(r.out.Studies, rec)
	L.Push(r.studyTable(job, res))
	return 1
}

// keepFull reads a voyage's or a study's keep: "summary" keeps each row's
// summary (what the reports read), "full" each row's case result as well;
// without the key, Options.FullRows decides.
func (r *runner) keepFull(a *args) bool {
	switch v := a.get("keep"); v {
	case lua.LNil:
		return r.opt.FullRows
	case lua.LString("summary"):
		return false
	case lua.LString("full"):
		return true
	default:
		a.errorf(nil, "keep must be \"summary\" (each row's figures, the default) or \"full\" (each row's case result as well, under result); got %s", describe(v))
		return r.opt.FullRows
	}
}

// studyVariants reads variants = { { name, set, installed_cost }, ... }.
func (r *runner) studyVariants(ph *plantHandle, a *args) []profile.Variant {
	vt, ok := a.get("variants").(*lua.LTable)
	if !ok {
		a.errorf(nil, "variants is required: a list of at least two { name = \"...\", set = { unit = { key = value } }, installed_cost = 250000 }, the first the base")
		return nil
	}
	n := vt.Len()
	if n < 2 || n > 100 {
		a.errorf(nil, "variants needs 2 to 100 entries (the first is the base); got %d", n)
		return nil
	}
	var variants []profile.Variant
	names := map[string]bool{}
	for i := 1; i <= n; i++ {
		v, ok := vt.RawGetInt(i).(*lua.LTable)
		if !ok {
			a.errorf(nil, "variants[%d] must be a table { name = \"...\", set = {...}, installed_cost = ... }", i)
			continue
		}
		va := r.args(v, fmt.Sprintf("%s variants[%d]", a.what, i), a.pos, ph.uopt)
		vn, _ := va.str("name", true)
		if names[vn] && vn != "" {
			va.errorf(nil, "name %q is given to two variants", vn)
		}
		names[vn] = true
		var set []plant.Setting
		if s := va.get("set"); s != lua.LNil {
			set = r.caseSettings(ph, va, s, plant.Pos{File: a.pos.File, Line: a.pos.Line})
		}
		x := profile.Variant{Name: vn, Set: set}
		if c, ok := va.number("installed_cost"); ok {
			if !moneyIn(c, maxCost) {
				va.errorf(nil, "installed_cost must lie between 0 and %g (in any currency); got %g", maxCost, c)
				c = 0
			}
			x.InstalledCost, x.HasCost = c, true
		}
		va.done()
		a.nerr += va.nerr
		variants = append(variants, x)
	}
	return variants
}

// maxPrice and maxCost bound a study's prices (a tonne of fuel or of CO2)
// and costs, in any currency: far above any real one (a tonne of fuel
// costs under 10^8 in the currency with the most units to a dollar), so
// that a study's money figures stay finite.
const (
	maxPrice = 1e9
	maxCost  = 1e13
)

// moneyIn reports whether v is a sum of money from 0 to most.
func moneyIn(v, most float64) bool { return v >= 0 && v <= most }

// studyEconomics reads fuel_price, installed_cost, currency, carbon_price,
// life and discount_rate.
func (r *runner) studyEconomics(a *args) profile.Economics {
	var econ profile.Economics
	money := func(key string, most float64, per string) float64 {
		v, ok := a.number(key)
		if ok && !moneyIn(v, most) {
			a.errorf(nil, "%s must lie between 0 and %g%s (in any currency); got %g", key, most, per, v)
			return 0
		}
		return v
	}
	econ.FuelPrice = money("fuel_price", maxPrice, " a tonne")
	econ.InstalledCost = money("installed_cost", maxCost, "")
	econ.CarbonPrice = money("carbon_price", maxPrice, " a tonne")
	econ.Currency, _ = a.str("currency", false)
	life, hasLife := a.number("life")
	if hasLife {
		if life != math.Trunc(life) || life < 1 || life > 60 {
			a.errorf(nil, "life must be a whole number of years from 1 to 60; got %g", life)
		} else {
			econ.LifeYears = int(life)
		}
	}
	rate, hasRate := a.quantity("discount_rate", units.Fraction, false)
	switch {
	case hasRate && rate < 0:
		a.errorf(nil, "discount_rate must not be negative; got %g %% (a rate such as \"8 %%\" or 0.08)", 100*rate)
	case hasRate && rate > 1:
		a.errorf(nil, "discount_rate must be at most 100 %% a year; got %g %%", 100*rate)
	case hasRate:
		econ.DiscountRate = rate
	}
	if hasLife != hasRate {
		a.errorf(nil, "life and discount_rate go together (the NPV over the life at that rate), such as life = 15, discount_rate = \"8 %%\"")
	}
	return econ
}

// studySweep reads sweep = { unit, key, from, to, steps (or values), set,
// cost = { at, cost, exponent, fixed } }.
func (r *runner) studySweep(ph *plantHandle, a *args, v lua.LValue, econ profile.Economics) *profile.Sweep {
	t, ok := v.(*lua.LTable)
	if !ok {
		a.errorf(nil, "sweep must be a table such as { unit = \"EGE\", key = \"ua\", from = \"5 kW/K\", to = \"60 kW/K\", steps = 12, cost = { at = \"20 kW/K\", cost = 300000 } }; got %s", describe(v))
		return nil
	}
	r.checkSize(t, "sweep")
	sa := r.args(t, a.what+" sweep", a.pos, ph.uopt)
	defer func() { sa.done(); a.nerr += sa.nerr }()
	for _, k := range []string{"values", "from", "to", "steps", "set", "cost"} {
		sa.get(k) // accepted, whether or not they are read below
	}
	sw := &profile.Sweep{}
	sw.Unit, _ = sa.str("unit", true)
	sw.Param, _ = sa.str("key", true)
	if sw.Unit == "" || sw.Param == "" {
		return nil
	}
	u := ph.p.Component(sw.Unit)
	if u == nil {
		sa.errorf(nil, "%s", r.unknownUnitMsg(ph, sw.Unit))
		return nil
	}
	if _, ok := u.(*plant.ExhaustGasEconomiser); !ok {
		sa.errorf(nil, "%q is a %s; a sweep of size is of an exhaust-gas economiser", sw.Unit, u.Kind())
		return nil
	}
	if sw.Param != "ua" && sw.Param != "pinch" {
		sa.errorf(nil, "key must be \"ua\" or \"pinch\" (the economiser's size); got %q", sw.Param)
		return nil
	}
	k := key(u, sw.Param)
	if sa.has("values") {
		if sa.has("from") || sa.has("to") || sa.has("steps") {
			sa.errorf(nil, "give values or from, to and steps, not both")
		}
		vt, ok := sa.get("values").(*lua.LTable)
		if !ok || vt.Len() < 2 || vt.Len() > 100 {
			sa.errorf(nil, "values must be a list of 2 to 100 sizes such as { \"10 kW/K\", \"20 kW/K\" }")
		} else {
			for i := 1; i <= vt.Len(); i++ {
				x, err := parseSetting(vt.RawGetInt(i), k, fmt.Sprintf("values[%d]", i), ph.uopt)
				if err != nil {
					sa.errorf(err, "%v", err)
					continue
				}
				sw.Values = append(sw.Values, x)
			}
		}
	} else {
		from, ok1 := sa.quantity("from", k.Dim, true)
		to, ok2 := sa.quantity("to", k.Dim, true)
		steps, ok3 := sa.number("steps")
		switch {
		case !ok3:
			sa.errorf(nil, "steps is required: the number of sizes from from to to, 2 to 100")
		case steps != math.Trunc(steps) || steps < 2 || steps > 100:
			sa.errorf(nil, "steps must be a whole number from 2 to 100; got %g", steps)
		case ok1 && ok2 && !(from < to):
			sa.errorf(nil, "from must be below to; got %s and %s", describe(sa.t.RawGetString("from")), describe(sa.t.RawGetString("to")))
		case ok1 && ok2:
			n := int(steps)
			for i := 0; i < n; i++ {
				sw.Values = append(sw.Values, from+(to-from)*float64(i)/float64(n-1))
			}
		}
	}
	for _, x := range sw.Values {
		if !k.InRange(x) {
			sa.errorf(nil, "a size of %g %s is outside the key's range %g to %g %s", x, k.Dim.SIUnit(), k.Min, k.Max, k.Dim.SIUnit())
			break
		}
	}
	if s := sa.get("set"); s != lua.LNil {
		sw.Set = r.caseSettings(ph, sa, s, plant.Pos{File: a.pos.File, Line: a.pos.Line})
	}
	ct, ok := sa.get("cost").(*lua.LTable)
	if !ok {
		sa.errorf(nil, "cost is required: the installed cost against the size's UA, such as cost = { at = \"20 kW/K\", cost = 300000, exponent = 0.6, fixed = 50000 } (cost = fixed + cost·(UA/at)^exponent)")
	} else {
		ca := r.args(ct, a.what+" sweep cost", a.pos, ph.uopt)
		sw.Cost.RefUA, _ = ca.quantity("at", units.ThermalConductance, true)
		c, ok := ca.number("cost")
		if !ok {
			ca.errorf(nil, "cost is required: the installed cost of a unit of UA at, such as cost = 300000")
		} else if !(c > 0) || !moneyIn(c, maxCost) {
			ca.errorf(nil, "cost must be above 0 and at most %g (in any currency); got %g", maxCost, c)
		}
		sw.Cost.RefCost = c
		if e, ok := ca.number("exponent"); ok {
			if !(e >= 0.1 && e <= 1.5) {
				ca.errorf(nil, "exponent must lie between 0.1 and 1.5; got %g", e)
			}
			sw.Cost.Exponent = e
		}
		if f, ok := ca.number("fixed"); ok {
			if !moneyIn(f, maxCost) {
				ca.errorf(nil, "fixed must lie between 0 and %g (in any currency); got %g", maxCost, f)
			}
			sw.Cost.Fixed = f
		}
		ca.done()
		sa.nerr += ca.nerr
	}
	if econ.LifeYears <= 0 || !(econ.FuelPrice > 0 || econ.CarbonPrice > 0) {
		sa.errorf(nil, "the best size is the one of highest NPV: the study needs fuel_price (or carbon_price), life and discount_rate")
	}
	return sw
}

// ---------------------------------------------------------------------------
// Results as Lua tables.

// The Lua tables of the jobs are their schema objects (package
// plant/schema) with a few conveniences derived from them, which the
// JSON does not carry (by_phase, by_name, flagged_days, hours_no_boiler,
// hours_one_boiler, hours_two_boilers; the package doc lists them). A
// test keeps the rest of every table's keys equal to the JSON's.

// job is the record's part of its schema form.
func (v VoyageRecord) job() schema.Job {
	return schema.Job{Name: v.Name, Plant: v.Plant, Source: v.Pos.String(), RowSources: posStrings(v.Rows)}
}

func posStrings(ps []Pos) []string {
	out := make([]string, len(ps))
	for i, p := range ps {
		out[i] = p.String()
	}
	return out
}

// totalsTable adds to a totals table its hours with no, one and two
// boilers firing (hours_firing[1], [2] and [3], 0 where the list is
// shorter).
func totalsTable(t *lua.LTable) {
	hf, _ := t.RawGetString("hours_firing").(*lua.LTable)
	for k, key := range []string{"hours_no_boiler", "hours_one_boiler", "hours_two_boilers"} {
		h := lua.LNumber(0)
		if hf != nil {
			if v, ok := hf.RawGetInt(k + 1).(lua.LNumber); ok {
				h = v
			}
		}
		t.RawSetString(key, h)
	}
}

// list is the sequence under key of t (empty when there is none).
func list(t *lua.LTable, key string) []*lua.LTable {
	l, _ := t.RawGetString(key).(*lua.LTable)
	if l == nil {
		return nil
	}
	out := make([]*lua.LTable, 0, l.Len())
	for i := 1; i <= l.Len(); i++ {
		if e, ok := l.RawGetInt(i).(*lua.LTable); ok {
			out = append(out, e)
		}
	}
	return out
}

// profileTable is what voyage() returns: the voyage's schema object, its
// totals with hours_no_boiler, hours_one_boiler and hours_two_boilers,
// and by_phase, the phases' totals by name.
func (r *runner) profileTable(job schema.Job, res *profile.Result) lua.LValue {
	o := r.schemaTable(fmt.Sprintf("voyage %q", job.Name), schema.NewVoyage(job, res))
	if t, ok := o.RawGetString("total").(*lua.LTable); ok {
		totalsTable(t)
	}
	phases := list(o, "phases")
	byPhase := r.L.CreateTable(0, len(phases))
	for _, p := range phases {
		totalsTable(p)
		byPhase.RawSet(p.RawGetString("phase"), p)
	}
	o.RawSetString("by_phase", byPhase)
	return o
}

// studyTable is what study() returns: the study's schema object, its
// variants' totals with the hours by boilers firing, and by_name, the
// variants by name.
func (r *runner) studyTable(job schema.Job, res *profile.StudyResult) lua.LValue {
	o := r.schemaTable(fmt.Sprintf("study %q", job.Name), schema.NewStudy(job, res))
	variants := list(o, "variants")
	byName := r.L.CreateTable(0, len(variants))
	for _, v := range variants {
		if t, ok := v.RawGetString("totals").(*lua.LTable); ok {
			totalsTable(t)
		}
		byName.RawSet(v.RawGetString("name"), v)
	}
	o.RawSetString("by_name", byName)
	return o
}

// outlines returns, for a job that keeps its rows in full, the outline of
// a row's case on p (check mode's stand-in for its case result); nil
// otherwise.
func outlines(p *plant.Plant, full bool) func(profile.Row) *plant.CaseResult {
	if !full {
		return nil
	}
	return func(row profile.Row) *plant.CaseResult {
		cr := p.Outline(row.Case.Name, row.Case.Conditions)
		cr.Pos, cr.Series = row.Case.Pos, row.Case.Series
		return cr
	}
}

// keptRows is rows if full, else nil.
func keptRows(rows []profile.RowResult, full bool) []profile.RowResult {
	if full {
		return rows
	}
	return nil
}

// placeholderResult is a voyage's result in check mode: the rows, phases
// and hours, zero figures; each row with its case's outline as its result
// when outline is not nil (a job that keeps its rows in full), so that
// the result has the shape of a solved one.
func placeholderResult(rows []profile.Row, outline func(profile.Row) *plant.CaseResult) *profile.Result {
	zero := func() profile.Totals { return profile.Totals{PeakRow: -1, TightestRow: -1} }
	out := &profile.Result{Total: zero(), Rows: make([]profile.RowResult, 0, len(rows))}
	byPhase := map[string]int{}
	for i, row := range rows {
		rr := profile.RowResult{Index: i, Phase: row.Phase, Hours: row.Hours}
		if outline != nil {
			rr.Result = outline(row)
		}
		out.Rows = append(out.Rows, rr)
		k, ok := byPhase[row.Phase]
		if !ok {
			k = len(out.Phases)
			byPhase[row.Phase] = k
			out.Phases = append(out.Phases, profile.PhaseTotals{Phase: row.Phase, Totals: zero()})
		}
		for _, t := range []*profile.Totals{&out.Total, &out.Phases[k].Totals} {
			t.Rows++
			t.Hours += row.Hours
		}
	}
	return out
}
