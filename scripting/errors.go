package scripting

import (
	"errors"
	"fmt"
	"io/fs"
	"sort"
	"strconv"
	"strings"
	"syscall"
	"time"
	"unicode/utf8"

	lua "github.com/yuin/gopher-lua"
)

// Pos is a place in a script: file, line and, for syntax errors, column.
// Line and Col are 1-based; zero means unknown.
type Pos struct {
	File string
	Line int
	Col  int
}

// String formats the position as file:line or file:line:col.
func (p Pos) String() string {
	switch {
	case p.File == "":
		return ""
	case p.Line <= 0:
		return p.File
	case p.Col <= 0:
		return fmt.Sprintf("%s:%d", p.File, p.Line)
	}
	return fmt.Sprintf("%s:%d:%d", p.File, p.Line, p.Col)
}

// Error is one error in a script, at a position and, where it concerns a
// unit of a plant, naming the unit.
type Error struct {
	Pos  Pos
	Unit string // the unit's kind and name, such as `boiler "AB1"`; may be empty
	Msg  string
	Err  error // the underlying error, if any (a *units.Error, a plant error)
}

func (e *Error) Error() string {
	var b strings.Builder
	if s := e.Pos.String(); s != "" {
		b.WriteString(s)
		b.WriteString(": ")
	}
	if e.Unit != "" {
		b.WriteString(e.Unit)
		b.WriteString(": ")
	}
	b.WriteString(e.Msg)
	return b.String()
}

// Unwrap returns the underlying error.
func (e *Error) Unwrap() error { return e.Err }

// ErrorList is a list of script errors. The zero value is an empty list
// ready to use; Err returns nil for an empty list.
type ErrorList []*Error

// Add appends an error.
func (l *ErrorList) Add(pos Pos, unit, msg string, err error) {
	*l = append(*l, &Error{Pos: pos, Unit: unit, Msg: msg, Err: err})
}

// Sort orders the list by file, line and column, keeping the order of
// errors at the same place.
func (l ErrorList) Sort() {
	sort.SliceStable(l, func(i, j int) bool {
		a, b := l[i].Pos, l[j].Pos
		if a.File != b.File {
			return a.File < b.File
		}
		if a.Line != b.Line {
			return a.Line < b.Line
		}
		return a.Col < b.Col
	})
}

// Error lists every error on its own line, with a count first when there
// is more than one.
func (l ErrorList) Error() string {
	switch len(l) {
	case 0:
		return "no errors"
	case 1:
		return l[0].Error()
	}
	var b strings.Builder
	fmt.Fprintf(&b, "%d errors:", len(l))
	for _, e := range l {
		b.WriteString("\n")
		b.WriteString(e.Error())
	}
	return b.String()
}

// Err returns the list as an error, or nil if it is empty.
func (l ErrorList) Err() error {
	if len(l) == 0 {
		return nil
	}
	return l
}

// AssertionError is a failed check(cond, msg) in a script. A command should
// report it and exit with status 1.
type AssertionError struct {
	Pos Pos
	Msg string
}

func (e *AssertionError) Error() string {
	if s := e.Pos.String(); s != "" {
		return s + ": assertion failed: " + e.Msg
	}
	return "assertion failed: " + e.Msg
}

// TimeoutError is a run stopped because it took longer than its time
// limit (Options.Timeout), or because it used more memory than
// Options.MaxMemory allows.
type TimeoutError struct {
	Pos   Pos           // where the script was when it was stopped, if known
	Limit time.Duration // the time limit; zero for a memory stop
	// Memory is the heap growth limit in bytes when the run was stopped
	// for memory; zero for a time stop.
	Memory uint64
	// Abandoned is true when the interpreter did not stop within a grace
	// period after the limit (a long-running library call) and was left
	// behind: the run's plants must not be used.
	Abandoned bool
	// Job, if not empty, is the job (`audit "March"`) that was running
	// when the time ran out: the message then names the option to raise
	// rather than suggest an endless loop.
	Job string
	// JobLimit is true when the job's own limit ran out (Options.JobTimeout,
	// or the default scaled to its work); Limit is then that limit.
	JobLimit bool
	// Work is the plant solves the job announced when its limit was scaled
	// to them; zero when Options.JobTimeout set it.
	Work int
}

func (e *TimeoutError) Error() string {
	pre := ""
	if s := e.Pos.String(); s != "" {
		pre = s + ": "
	}
	var msg string
	if e.Memory > 0 && e.Job != "" {
		msg = fmt.Sprintf("%sscript stopped: it used more than %d MiB of memory while running %s (a voyage or study that keeps its rows in full, keep = \"full\" or sim run --rows full, keeps every row's case result: keep the rows' summaries, the default, or split the job)", pre, e.Memory>>20, e.Job)
	} else if e.Memory > 0 {
		msg = fmt.Sprintf("%sscript stopped: it used more than %d MiB of memory (an endless loop filling a table or a string?)", pre, e.Memory>>20)
	} else if e.JobLimit {
		how := "as given"
		if e.Work > 0 {
			how = fmt.Sprintf("%v, and %v for each of its %d plant solves", jobBase, jobPerSolve, e.Work)
		}
		msg = fmt.Sprintf("%s%s stopped: it ran longer than its time limit of %v (%s); raise the job time limit (sim run --job-timeout; scripting's Options.JobTimeout)", pre, e.Job, e.Limit.Round(time.Millisecond), how)
	} else if e.Job != "" {
		msg = fmt.Sprintf("%sscript stopped: it ran longer than its time limit of %v while running %s; raise the time limit (sim run --timeout; scripting's Options.Timeout)", pre, e.Limit, e.Job)
	} else {
		msg = fmt.Sprintf("%sscript stopped: it ran longer than its time limit of %v (an endless loop?)", pre, e.Limit)
	}
	if e.Abandoned {
		msg += "; the interpreter did not stop and was abandoned"
	}
	return msg
}

// FileError is a script file that cannot be read: it does not exist, it is
// a folder or another kind of file than a regular one, it may not be read,
// or it is too large. It prints as "cannot open FILE: reason" (or "cannot
// read FILE: reason" once opened), without the names of system calls.
type FileError struct {
	Name   string // the file as given
	Read   bool   // the file was opened; reading it failed
	Reason string // in words, such as "no such file"
	Err    error  // the underlying error, if any
}

func (e *FileError) Error() string {
	verb := "open"
	if e.Read {
		verb = "read"
	}
	return "cannot " + verb + " " + e.Name + ": " + e.Reason
}

// Unwrap returns the underlying error.
func (e *FileError) Unwrap() error { return e.Err }

// fileError is the FileError of a failure to find or open name.
func fileError(name string, err error) *FileError {
	return &FileError{Name: name, Reason: reasonOf(err), Err: err}
}

// reasonOf says in words why a file could not be opened or read, without
// the system call and path that an *fs.PathError prefixes.
func reasonOf(err error) string {
	switch {
	case errors.Is(err, fs.ErrNotExist):
		return "no such file"
	case errors.Is(err, fs.ErrPermission):
		return "permission denied"
	case errors.Is(err, syscall.ENOTDIR):
		return "a part of the path is a file, not a folder"
	case errors.Is(err, syscall.EISDIR):
		return "it is a folder, not a file"
	}
	var pe *fs.PathError
	if errors.As(err, &pe) {
		return pe.Err.Error()
	}
	return err.Error()
}

// notRegular says why a file of this kind cannot be read as a script or a
// table, or returns "" for a regular file. A pipe would block the run
// until its time limit and a device may never end.
func notRegular(st fs.FileInfo) string {
	m := st.Mode()
	switch {
	case m.IsRegular():
		return ""
	case m.IsDir():
		return "it is a folder, not a file"
	case m&fs.ModeNamedPipe != 0:
		return "it is a named pipe, not a regular file; save the data to a file first"
	case m&fs.ModeSocket != 0:
		return "it is a socket, not a regular file"
	case m&fs.ModeDevice != 0:
		return "it is a device, not a regular file"
	}
	return "it is not a regular file"
}

// Bounds of valueText.
const (
	maxValueText  = 200 // bytes of the text
	maxValueDepth = 3   // nested tables shown
	maxValueItems = 16  // entries shown of one table
)

// valueText renders a Lua value given to error() for a message: a string
// quoted, a number, boolean or nil as Lua writes them, and a table as a
// constructor such as {code = 1, "text"}, entries in order (the array
// part, then the other keys sorted), at most maxValueDepth deep,
// maxValueItems entries each and maxValueText bytes in all. Strings are
// quoted with their control characters escaped. Metamethods are not
// called: the text is the value's content.
func valueText(v lua.LValue) string {
	var b strings.Builder
	writeValue(&b, v, 0)
	s := b.String()
	if len(s) > maxValueText {
		cut := maxValueText
		for cut > 0 && !utf8.RuneStart(s[cut]) {
			cut--
		}
		s = s[:cut] + "…"
	}
	return s
}

func writeValue(b *strings.Builder, v lua.LValue, depth int) {
	if b.Len() > maxValueText {
		return
	}
	switch x := v.(type) {
	case lua.LString:
		b.WriteString(strconv.Quote(string(x)))
	case lua.LNumber:
		b.WriteString(x.String())
	case *lua.LTable:
		if depth >= maxValueDepth {
			b.WriteString("{…}")
			return
		}
		writeTable(b, x, depth)
	case *lua.LNilType, lua.LBool:
		b.WriteString(v.String())
	default:
		b.WriteString("a " + v.Type().String()) // a function, a userdata
	}
}

func writeTable(b *strings.Builder, t *lua.LTable, depth int) {
	n := 0 // the sequence 1..n, without holes
	for t.RawGetInt(n+1) != lua.LNil {
		n++
	}
	type entry struct {
		key  string
		sort string
		v    lua.LValue
	}
	var rest []entry
	t.ForEach(func(k, v lua.LValue) {
		if kn, ok := k.(lua.LNumber); ok && float64(kn) == float64(int(kn)) && int(kn) >= 1 && int(kn) <= n {
			return // the array part, written in order below
		}
		e := entry{v: v}
		switch kk := k.(type) {
		case lua.LString:
			if isIdentifier(string(kk)) {
				e.key = string(kk)
			} else {
				e.key = "[" + strconv.Quote(string(kk)) + "]"
			}
			e.sort = "1" + string(kk)
		case lua.LNumber:
			e.key = "[" + kk.String() + "]"
			e.sort = "0" + fmt.Sprintf("%024.6f", float64(kk))
		default:
			e.key = "[" + k.Type().String() + "]"
			e.sort = "2" + e.key
		}
		rest = append(rest, e)
	})
	sort.Slice(rest, func(i, j int) bool { return rest[i].sort < rest[j].sort })
	b.WriteByte('{')
	items := 0
	sep := func() bool {
		if items > 0 {
			b.WriteString(", ")
		}
		items++
		if items > maxValueItems {
			b.WriteString("…")
			return false
		}
		return true
	}
	for i := 1; i <= n; i++ {
		if !sep() {
			b.WriteByte('}')
			return
		}
		writeValue(b, t.RawGetInt(i), depth+1)
	}
	for _, e := range rest {
		if !sep() {
			break
		}
		b.WriteString(e.key)
		b.WriteString(" = ")
		writeValue(b, e.v, depth+1)
	}
	b.WriteByte('}')
}

// isIdentifier reports whether s is a Lua name, written as a table key
// without brackets.
func isIdentifier(s string) bool {
	if s == "" {
		return false
	}
	for i, c := range s {
		switch {
		case c == '_', c >= 'a' && c <= 'z', c >= 'A' && c <= 'Z':
		case i > 0 && c >= '0' && c <= '9':
		default:
			return false
		}
	}
	return true
}
