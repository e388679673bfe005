package scripting

import (
	"fmt"
	"sort"
	"strings"
	"time"
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
}

func (e *TimeoutError) Error() string {
	pre := ""
	if s := e.Pos.String(); s != "" {
		pre = s + ": "
	}
	var msg string
	if e.Memory > 0 {
		msg = fmt.Sprintf("%sscript stopped: it used more than %d MiB of memory (an endless loop filling a table or a string?)", pre, e.Memory>>20)
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
