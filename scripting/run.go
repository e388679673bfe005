package scripting

import (
	"bytes"
	"context"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"math/rand/v2"
	"os"
	"path"
	"path/filepath"
	"reflect"
	"regexp"
	"runtime/metrics"
	"strconv"
	"strings"
	"time"

	"github.com/rs/zerolog"
	lua "github.com/yuin/gopher-lua"
	"github.com/yuin/gopher-lua/parse"

	"steamcase/plant"
)

// Options are the settings of one run. The zero value is ready to use;
// each field's comment says what zero means.
type Options struct {
	// Timeout bounds the wall time the script spends outside its jobs
	// (its own code and its load cases): an endless loop is stopped there.
	// Zero means 10 s.
	Timeout time.Duration
	// JobTimeout bounds the wall time of each job (voyage, study, audit,
	// heating_plan), during which the script's own clock stands still.
	// Zero scales each job's limit to the work it announces: 10 s and
	// 20 ms for each plant solve it will take (rows × variants and sizes,
	// days × samples, ...), so that a job of any documented size fits and
	// a job that hangs is still stopped, naming itself and its limit.
	JobTimeout time.Duration
	// Logger receives the plants' solver records and, when Print is nil,
	// the script's print output (info level, with the script position in
	// "pos"). The zero value discards everything.
	Logger zerolog.Logger
	// Print, if not nil, receives the script's print output as plain
	// text: each call's arguments, separated by tabs, and a newline. The
	// Logger then has it at debug level only, with the script position.
	Print io.Writer
	// CheckRead, if not nil, is called with the file information of each
	// file a script reads through include, read_csv, voyage, study or
	// audit, before the file is opened. An error refuses the file: the
	// script fails at the calling line with the error's message. A
	// command uses it to refuse reading the files it will write.
	CheckRead func(info fs.FileInfo) error
	// Seed seeds the run's math.random (a PCG source). Zero is a valid
	// seed: runs are repeatable unless the script reseeds.
	Seed uint64
	// CheckOnly validates without solving: syntax, units and keys of every
	// table, the graph and the degrees of freedom of every plant. case()
	// then returns a result of the right shape with zero figures and
	// check() does not fail.
	CheckOnly bool

	// MaxRows bounds the data rows of one CSV file. Zero means 100000.
	MaxRows int
	// MaxCSVBytes bounds the size of one CSV file. Zero means 8 MiB.
	MaxCSVBytes int64
	// MaxScriptBytes bounds the size of one script file. Zero means 1 MiB.
	MaxScriptBytes int64
	// MaxTable bounds the entries of any table a binding reads (the keys
	// of a unit, the points of an efficiency table, a case's settings).
	// Zero means 1000.
	MaxTable int
	// MaxUnits bounds the units (and, separately, the lines) of one plant.
	// Zero means 1000.
	MaxUnits int
	// MaxPlants bounds the plants of one run. Zero means 64.
	MaxPlants int
	// MaxCases bounds the load cases of one run. Zero means 100000.
	MaxCases int
	// MaxIncludeDepth bounds nested include calls. Zero means 8.
	MaxIncludeDepth int
	// MaxString bounds the result of string.rep. Zero means 16 MiB.
	MaxString int
	// MaxMemory bounds the growth of the process heap during the run, in
	// bytes; a script that exceeds it is stopped with a *TimeoutError.
	// The heap is the process's, so runs in parallel share the budget.
	// Zero means 1 GiB.
	MaxMemory uint64
	// FullRows makes every voyage and study keep each row's full case
	// result, as a job's keep = "full" does: its rows' JSON objects and
	// Lua tables then carry the row's case under "result". False keeps
	// each row's summary only (package plant/profile's RowSummary), a
	// fraction of the memory; a job's own keep key decides for it either
	// way.
	FullRows bool
	// Workers is the number of goroutines voyage, study and audit solve
	// their rows on; zero means all cores (GOMAXPROCS). Their results do
	// not depend on it.
	Workers int
	// Progress, if not nil, is called as voyage, study and audit go on,
	// with the job (such as `voyage "ballast leg"`), the rows (or audit
	// days, or rows times variants) done and the total; from one goroutine
	// at a time. A command may show it on stderr. Long jobs may need a
	// longer Timeout.
	Progress func(job string, done, total int)

	// CallStackSize, RegistrySize and RegistryMaxSize bound the Lua call
	// depth and data stack (see gopher-lua's Options). Zero means 200,
	// 4096 and 262144.
	CallStackSize, RegistrySize, RegistryMaxSize int

	// Kinds are the kinds of component a script may declare, each a
	// method of a plant (ship:boiler{...}); nil means plant.Kinds().
	Kinds []plant.KindSpec
}

func (o *Options) defaults() {
	def := func(v *int, d int) {
		if *v <= 0 {
			*v = d
		}
	}
	if o.Timeout <= 0 {
		o.Timeout = 10 * time.Second
	}
	def(&o.MaxRows, 100000)
	if o.MaxCSVBytes <= 0 {
		o.MaxCSVBytes = 8 << 20
	}
	if o.MaxScriptBytes <= 0 {
		o.MaxScriptBytes = 1 << 20
	}
	def(&o.MaxTable, 1000)
	def(&o.MaxUnits, 1000)
	def(&o.MaxPlants, 64)
	def(&o.MaxCases, 100000)
	def(&o.MaxIncludeDepth, 8)
	def(&o.MaxString, 16<<20)
	if o.MaxMemory == 0 {
		o.MaxMemory = 1 << 30
	}
	def(&o.CallStackSize, 200)
	def(&o.RegistrySize, 4096)
	def(&o.RegistryMaxSize, 256<<10)
	if o.RegistryMaxSize < o.RegistrySize {
		o.RegistryMaxSize = o.RegistrySize
	}
	if o.Kinds == nil {
		o.Kinds = plant.Kinds()
	}
}

// Run is what a script built and solved.
type Run struct {
	// Plants are the plants the script declared, in order.
	Plants []*plant.Plant
	// Cases are the load cases in the order they were solved (or, in
	// check mode, declared).
	Cases []CaseRecord
	// Checks counts the check() calls that passed (in check mode: that
	// were reached).
	Checks int
	// Voyages, Studies and Audits are the jobs of voyage(), study() and
	// audit(), in the order they ran; their results are nil in check mode.
	Voyages []VoyageRecord
	Studies []StudyRecord
	Audits  []AuditRecord
	// HeatingPlans are the jobs of heating_plan(), in the order they ran;
	// their results are nil in check mode.
	HeatingPlans []HeatingPlanRecord
	// Files are the script and data files the run read (the script
	// itself first, then each include and CSV file as it was read, once
	// each), with their SHA-256: what an evidence record names.
	Files []FileRead
	// Seed is the seed of the scripts' math.random (Options.Seed).
	Seed uint64
}

// CaseRecord is one load case of a run.
type CaseRecord struct {
	Plant string // the plant's name
	Pos   Pos    // where case() was called
	// Result is the solved case; nil in check mode.
	Result *plant.CaseResult
}

// RunFile runs the script at path. include and read_csv reach only files in
// the script's folder and its subfolders (through an os.Root, so symbolic
// links cannot lead out). Positions in errors name files as path does.
// The script, like every file it reads, must be a regular file (not a
// folder, a pipe or a device); a UTF-8 byte-order mark at its start is
// skipped.
//
// The returned Run holds what was built and solved before any error. The
// error is an ErrorList (script errors, each with file:line and, for a
// syntax error, the column), an *AssertionError (a failed check), a
// *TimeoutError, the context's error if ctx was cancelled, or a
// *FileError if the script cannot be read.
func RunFile(ctx context.Context, file string, opt Options) (*Run, error) {
	opt.defaults()
	dir := filepath.Dir(file)
	root, err := os.OpenRoot(dir)
	if err != nil {
		return nil, fileError(file, err)
	}
	defer root.Close()
	base := filepath.Base(file)
	st, err := root.Stat(base)
	if err != nil {
		return nil, fileError(file, err)
	}
	if reason := notRegular(st); reason != "" {
		return nil, &FileError{Name: file, Reason: reason}
	}
	f, err := root.Open(base)
	if err != nil {
		return nil, fileError(file, err)
	}
	src, err := readBounded(f, opt.MaxScriptBytes)
	f.Close()
	if err != nil {
		return nil, &FileError{Name: file, Read: true, Reason: reasonOf(err), Err: err}
	}
	return run(ctx, file, skipBOM(src), root.FS(), ".", dir, opt)
}

// StatScript checks that file is a script RunFile can open: it exists and
// is a regular file. The error is a *FileError. A command checks its
// scripts with it before running the first.
func StatScript(file string) error {
	st, err := os.Stat(file)
	if err != nil {
		return fileError(file, err)
	}
	if reason := notRegular(st); reason != "" {
		return &FileError{Name: file, Reason: reason}
	}
	return nil
}

// RunSource runs src as the script called name, a slash-separated path in
// fsys (for scripts embedded with go:embed, say). include and read_csv read
// from fsys, in the folder of name and below; a nil fsys makes them fail.
// Errors and the Run are as for RunFile.
func RunSource(ctx context.Context, name string, src []byte, fsys fs.FS, opt Options) (*Run, error) {
	opt.defaults()
	if int64(len(src)) > opt.MaxScriptBytes {
		return nil, &FileError{Name: name, Read: true, Reason: fmt.Sprintf("the script of %d bytes is larger than the limit of %d bytes", len(src), opt.MaxScriptBytes)}
	}
	dir := path.Dir(name)
	return run(ctx, name, skipBOM(src), fsys, dir, dir, opt)
}

// utf8BOM is the UTF-8 byte-order mark, which spreadsheets and some
// editors write at the start of a file; it is skipped.
const utf8BOM = "\xEF\xBB\xBF"

// skipBOM returns b without a UTF-8 byte-order mark at its start.
func skipBOM(b []byte) []byte { return bytes.TrimPrefix(b, []byte(utf8BOM)) }

func readBounded(rd io.Reader, limit int64) ([]byte, error) {
	b, err := io.ReadAll(io.LimitReader(rd, limit+1))
	if err != nil {
		return nil, err
	}
	if int64(len(b)) > limit {
		return nil, fmt.Errorf("larger than the limit of %d bytes", limit)
	}
	return b, nil
}

// chunk is a loaded script file: its folder in the file system and as
// written in positions.
type chunk struct {
	fsDir, showDir string
}

// runner is the state of one run.
type runner struct {
	L    *lua.LState
	opt  Options
	log  zerolog.Logger
	rng  *rand.Rand
	fsys fs.FS
	ctx  context.Context
	// clock is the script's time limit, standing still while a job runs
	// (inJob).
	clock *scriptClock

	main      string                      // chunk name of the main script
	chunks    map[string]chunk            // by chunk name
	sources   map[string][]byte           // source of each chunk
	tlines    map[string]map[string][]int // tableLines of each chunk, when needed
	including []string                    // chunk names of the active includes
	errs      ErrorList
	out       *Run
	plants    []*plantHandle
	nCases    int
	nJobs     int
	errMT     *lua.LTable
	// fields caches the struct fields of the schema's types as their Lua
	// tables take them (fieldsOf).
	fields map[reflect.Type][]luaField
}

// Errors used as context causes.
var (
	errTimeLimit   = errors.New("time limit")
	errMemoryLimit = errors.New("memory limit")
)

// grace is how long a run may take to stop after its limit before its
// interpreter is abandoned.
const grace = 2 * time.Second

func run(parent context.Context, name string, src []byte, fsys fs.FS, fsDir, showDir string, opt Options) (*Run, error) {
	r := &runner{
		opt:     opt,
		log:     opt.Logger,
		rng:     rand.New(rand.NewPCG(opt.Seed, 0x5ca1ab1e)),
		fsys:    fsys,
		main:    name,
		chunks:  map[string]chunk{name: {fsDir: fsDir, showDir: showDir}},
		sources: map[string][]byte{name: src},
		tlines:  map[string]map[string][]int{},
		out:     &Run{Seed: opt.Seed},
	}
	r.recordFile(name, src)
	ctx, cancelTime := context.WithCancelCause(parent)
	defer cancelTime(nil)
	r.clock = newScriptClock(opt.Timeout, func() { cancelTime(errTimeLimit) })
	defer r.clock.stop()
	ctx, cancel := context.WithCancelCause(ctx)
	defer cancel(nil)
	r.ctx = ctx

	L, err := r.newState()
	if err != nil {
		return nil, fmt.Errorf("scripting: opening the interpreter: %w", err)
	}
	r.L = L
	L.SetContext(ctx)
	r.register()

	stopWatch := r.watchMemory(cancel)
	done := make(chan error, 1)
	go func() {
		done <- r.exec(name, src)
	}()
	var runErr error
	abandoned := false
	select {
	case runErr = <-done:
	case <-ctx.Done():
		select {
		case runErr = <-done:
		case <-time.After(grace):
			abandoned = true
		}
	}
	stopWatch()
	if abandoned {
		te := &TimeoutError{Limit: opt.Timeout, Abandoned: true}
		if errors.Is(context.Cause(ctx), errMemoryLimit) {
			te.Limit, te.Memory = 0, opt.MaxMemory
		}
		return nil, te
	}
	L.Close()
	return r.out, runErr
}

// watchMemory cancels the run when the heap has grown by more than
// MaxMemory since the start. It returns a function that stops watching.
func (r *runner) watchMemory(cancel context.CancelCauseFunc) func() {
	sample := []metrics.Sample{{Name: "/memory/classes/heap/objects:bytes"}}
	read := func() uint64 {
		metrics.Read(sample)
		if sample[0].Value.Kind() != metrics.KindUint64 {
			return 0
		}
		return sample[0].Value.Uint64()
	}
	base := read()
	stop := make(chan struct{})
	finished := make(chan struct{})
	go func() {
		defer close(finished)
		t := time.NewTicker(2 * time.Millisecond)
		defer t.Stop()
		for {
			select {
			case <-stop:
				return
			case <-r.ctx.Done():
				return
			case <-t.C:
				if now := read(); now > base && now-base > r.opt.MaxMemory {
					cancel(errMemoryLimit)
					return
				}
			}
		}
	}()
	return func() { close(stop); <-finished }
}

// exec loads and runs the main chunk, then finishes the plants.
func (r *runner) exec(name string, src []byte) (err error) {
	defer func() {
		if p := recover(); p != nil {
			err = fmt.Errorf("%w: %v", ErrInternal, p)
		}
	}()
	fn, lerr := r.L.Load(bytes.NewReader(src), name)
	if lerr != nil {
		r.errs = append(r.errs, syntaxError(lerr, name))
		return r.errs
	}
	r.L.Push(fn)
	if perr := r.L.PCall(0, 0, nil); perr != nil {
		if e := r.convert(perr); e != nil {
			return e
		}
	}
	if r.ctx.Err() == nil {
		if err := r.finish(); err != nil {
			return err
		}
	}
	if err := r.limitErr(r.where()); err != nil {
		return err
	}
	r.errs.Sort()
	return r.errs.Err()
}

// limitErr returns the error of a cancelled run, or nil.
func (r *runner) limitErr(pos Pos) error {
	if r.ctx.Err() == nil {
		return nil
	}
	switch cause := context.Cause(r.ctx); {
	case errors.Is(cause, errTimeLimit):
		return &TimeoutError{Pos: pos, Limit: r.opt.Timeout}
	case errors.Is(cause, errMemoryLimit):
		return &TimeoutError{Pos: pos, Memory: r.opt.MaxMemory}
	default:
		return cause
	}
}

// stopRun is raised (as a userdata) to end a run whose errors are already
// collected.
type stopRun struct{}

// convert turns an error from the interpreter into the run's error: the
// collected list with the new error added, an assertion, or a limit.
func (r *runner) convert(err error) error {
	var ae *lua.ApiError
	if !errors.As(err, &ae) {
		r.errs.Add(Pos{}, "", err.Error(), err)
		r.errs.Sort()
		return r.errs
	}
	if ud, ok := ae.Object.(*lua.LUserData); ok {
		switch v := ud.Value.(type) {
		case *AssertionError:
			return v
		case *Error:
			var te *TimeoutError
			if errors.As(v, &te) {
				return te // the limit, with what it stopped
			}
			r.errs = append(r.errs, v)
		case stopRun:
		}
		pos := r.tracePos(ae.StackTrace) // the stack is gone: where() knows nothing now
		if v, ok := ud.Value.(*Error); ok && v.Pos.File != "" {
			pos = v.Pos
		}
		if lerr := r.limitErr(pos); lerr != nil {
			return lerr
		}
		r.errs.Sort()
		return r.errs.Err()
	}
	var pos Pos
	var rest string
	if s, ok := ae.Object.(lua.LString); ok {
		pos, rest = r.splitPos(string(s))
	} else {
		// error() with a table, a number, nil...: Lua adds no position.
		rest = raisedValue(ae.Object, r.metaText(ae.Object))
	}
	if pos.File == "" {
		pos = r.tracePos(ae.StackTrace)
	}
	if lerr := r.limitErr(pos); lerr != nil {
		return lerr
	}
	if ae.Type == lua.ApiErrorSyntax {
		r.errs = append(r.errs, syntaxError(ae, ""))
	} else if ae.Type == lua.ApiErrorPanic {
		r.errs.Add(pos, "", "internal error: "+rest, ErrInternal)
	} else {
		r.errs.Add(pos, "", rest, nil)
	}
	r.errs.Sort()
	return r.errs
}

// ErrInternal marks an error that is a fault of this package, not of the
// script (a Go panic inside a binding). Please report it.
var ErrInternal = errors.New("scripting: internal error")

// syntaxError turns a load error into an Error at the parse error's line
// and column.
func syntaxError(err error, name string) *Error {
	var pe *parse.Error
	var ae *lua.ApiError
	if errors.As(err, &ae) && ae.Cause != nil {
		err = ae.Cause
	}
	if errors.As(err, &pe) {
		p := Pos{File: pe.Pos.Source, Line: pe.Pos.Line, Col: pe.Pos.Column}
		if p.File == "" {
			p.File = name
		}
		if p.Line < 0 { // end of file
			p.Line, p.Col = 0, 0
			return &Error{Pos: p, Msg: "syntax error at end of file: " + pe.Message, Err: err}
		}
		msg := pe.Message
		if !strings.HasPrefix(msg, "syntax error") {
			msg = "syntax error: " + msg
		}
		if pe.Token != "" {
			msg += fmt.Sprintf(" near '%s'", pe.Token)
		}
		return &Error{Pos: p, Msg: msg, Err: err}
	}
	return &Error{Pos: Pos{File: name}, Msg: strings.TrimSpace(err.Error()), Err: err}
}

var posPrefix = regexp.MustCompile(`^(.*?):([0-9]+): ?(.*)$`)

// splitPos takes the "file:line:" prefix off a Lua error message, if the
// file is one of the run's chunks.
func (r *runner) splitPos(msg string) (Pos, string) {
	msg = strings.TrimSpace(msg)
	if i := strings.Index(msg, "\nstack traceback:"); i >= 0 {
		msg = msg[:i]
	}
	m := posPrefix.FindStringSubmatch(msg)
	if m == nil {
		return Pos{}, msg
	}
	if _, ok := r.chunks[m[1]]; !ok {
		return Pos{}, msg
	}
	line, err := strconv.Atoi(m[2])
	if err != nil {
		return Pos{}, msg
	}
	return Pos{File: m[1], Line: line}, m[3]
}

// tracePos returns the innermost position in a Lua stack traceback that
// is in one of the run's chunks, or the zero Pos. The interpreter writes
// the traceback while the stack is still there, so it keeps the place of
// an error whose value carries none (error({code = 1}), error("x", 0)).
func (r *runner) tracePos(trace string) Pos {
	for _, l := range strings.Split(trace, "\n") {
		m := posPrefix.FindStringSubmatch(strings.TrimSpace(l))
		if m == nil {
			continue
		}
		if _, ok := r.chunks[m[1]]; !ok {
			continue
		}
		if line, err := strconv.Atoi(m[2]); err == nil {
			return Pos{File: m[1], Line: line}
		}
	}
	return Pos{}
}

// raisedValue is the message of an error raised with a value that is not
// a string: what the value was, rendered readably.
// A table with a __tostring metamethod is shown by its text (meta) when
// that is not empty.
func raisedValue(v lua.LValue, meta string) string {
	switch v.(type) {
	case *lua.LNilType:
		return "the script raised an error with no message (error(nil) or error())"
	case *lua.LTable, lua.LNumber, lua.LBool:
		text := valueText(v)
		if meta != "" {
			text = meta
		}
		return fmt.Sprintf("the script raised an error with a %s instead of a message: %s", v.Type(), text)
	}
	return fmt.Sprintf("the script raised an error with a %s instead of a message", v.Type())
}

// metaText is the text of v's __tostring metamethod, called protected and
// cut to maxValueText bytes, or "" when v has none or it fails.
func (r *runner) metaText(v lua.LValue) string {
	L := r.L
	fn, ok := L.GetMetaField(v, "__tostring").(*lua.LFunction)
	if !ok || r.ctx.Err() != nil {
		return ""
	}
	if err := L.CallByParam(lua.P{Fn: fn, NRet: 1, Protect: true}, v); err != nil {
		return ""
	}
	s, ok := L.Get(-1).(lua.LString)
	L.Pop(1)
	if !ok {
		return ""
	}
	return valueText(lua.LString(s))
}

// where returns the position of the innermost Lua function on the stack:
// the script line that called the running binding.
func (r *runner) where() Pos {
	L := r.L
	for level := 0; level < 64; level++ {
		dbg, ok := L.GetStack(level)
		if !ok {
			break
		}
		if _, err := L.GetInfo("Sl", dbg, lua.LNil); err != nil {
			continue
		}
		if dbg.What != "G" && dbg.CurrentLine > 0 {
			return Pos{File: dbg.Source, Line: dbg.CurrentLine}
		}
	}
	return Pos{}
}

// raise stops the script with a structured error. A pcall in the script
// may catch it; its message is the error's text.
func (r *runner) raise(v any) {
	ud := r.L.NewUserData()
	ud.Value = v
	r.L.SetMetatable(ud, r.errMT)
	r.L.Error(ud, 0)
}

// fail raises an Error at the calling line.
func (r *runner) fail(unit, format string, args ...any) {
	r.raise(&Error{Pos: r.where(), Unit: unit, Msg: fmt.Sprintf(format, args...)})
}

// failErr raises an Error at the calling line wrapping err.
func (r *runner) failErr(unit string, err error, format string, args ...any) {
	r.raise(&Error{Pos: r.where(), Unit: unit, Msg: fmt.Sprintf(format, args...), Err: err})
}

// errString is the __tostring of raised errors.
func errString(L *lua.LState) int {
	ud := L.CheckUserData(1)
	switch v := ud.Value.(type) {
	case error:
		L.Push(lua.LString(v.Error()))
	case stopRun:
		L.Push(lua.LString("run stopped: the plant has errors"))
	default:
		L.Push(lua.LString("error"))
	}
	return 1
}
