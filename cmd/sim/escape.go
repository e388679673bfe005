package main

import (
	"fmt"
	"reflect"
	"regexp"
	"sort"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"

	"steamcase/cmd/sim/internal/report"
	"steamcase/plant/units"
	"steamcase/scripting"
)

// Text from a script (the names of plants, units, cases, jobs and phases,
// the messages of check()) reaches every output of sim. A carriage return,
// a newline or a terminal's escape sequence in such a name would forge
// lines or redraw the screen, so every output shows them escaped:
//
//	"b\r\nfake" is written b\r\nfake
//
// as Go writes them in a string: \a \b \f \n \r \t \v by name, other
// bytes below U+0080 and bytes that are not UTF-8 as \xHH, and the other
// control and format characters (C1 controls, the bidirectional controls
// that reorder what is shown, the line and paragraph separators) as
// \uHHHH. A backslash itself is left alone, so escaping twice changes
// nothing. JSON keeps the names exactly: its own escapes cover them.

// isUnsafe reports whether r must be escaped in an output.
func isUnsafe(r rune) bool {
	switch {
	case r == utf8.RuneError:
		return true // also a byte that is not UTF-8; see escapeText
	case unicode.IsControl(r):
		return true
	case r == '\u2028', r == '\u2029', // line and paragraph separators
		r == '\u061c', r == '\u200e', r == '\u200f', // bidirectional marks
		r >= '\u202a' && r <= '\u202e', // embeddings and overrides
		r >= '\u2066' && r <= '\u2069', // isolates
		r == '\ufeff':                  // zero-width no-break space
		return true
	}
	return false
}

// needsEscape reports whether s holds a character escapeText changes.
func needsEscape(s string) bool {
	for i := 0; i < len(s); i++ {
		if c := s[i]; c < 0x20 || c >= 0x7f {
			return needsEscapeSlow(s[i:])
		}
	}
	return false
}

func needsEscapeSlow(s string) bool {
	for _, r := range s {
		if isUnsafe(r) {
			return true
		}
	}
	return false
}

// escapeText returns s with its control and format characters escaped, as
// described at the top of this file.
func escapeText(s string) string {
	if !needsEscape(s) {
		return s
	}
	var b strings.Builder
	for i := 0; i < len(s); {
		r, n := utf8.DecodeRuneInString(s[i:])
		switch {
		case r == utf8.RuneError && n <= 1:
			fmt.Fprintf(&b, `\x%02x`, s[i])
		case !isUnsafe(r):
			b.WriteString(s[i : i+n])
		default:
			q := strconv.QuoteRune(r) // '\n', '\x1b', '\u202e'
			b.WriteString(q[1 : len(q)-1])
		}
		i += n
	}
	return b.String()
}

// escapeLines escapes s as escapeText does, but keeps its newlines and
// tabs: for what a script prints, where a line break is meant.
func escapeLines(s string) string {
	if !needsEscape(s) {
		return s
	}
	parts := strings.Split(s, "\n")
	for i, p := range parts {
		fields := strings.Split(p, "\t")
		for j, f := range fields {
			fields[j] = escapeText(f)
		}
		parts[i] = strings.Join(fields, "\t")
	}
	return strings.Join(parts, "\n")
}

// escapeRun escapes, in place, every exported string field, slice element
// and map key reachable from the run: the names in its results, the
// warnings, the sources. The plant names of report.Case and report.Job
// are left as they are unless plants is set: the text table quotes them
// with Go's %q, which escapes them itself.
func escapeRun(run *report.Run, plants bool) {
	w := escaper{seen: map[uintptr]bool{}, types: map[reflect.Type]bool{}}
	var keep []string
	if !plants {
		for _, c := range run.Cases {
			keep = append(keep, c.Plant)
		}
		for _, j := range jobsOf(run) {
			keep = append(keep, j.Plant)
		}
	}
	w.walk(reflect.ValueOf(run).Elem())
	if !plants {
		i := 0
		for k := range run.Cases {
			run.Cases[k].Plant = keep[i]
			i++
		}
		for _, j := range jobsOf(run) {
			j.Plant = keep[i]
			i++
		}
	}
}

// jobsOf lists the jobs of a run, to reach their fields.
func jobsOf(run *report.Run) []*report.Job {
	var jobs []*report.Job
	for i := range run.Voyages {
		jobs = append(jobs, &run.Voyages[i].Job)
	}
	for i := range run.Studies {
		jobs = append(jobs, &run.Studies[i].Job)
	}
	for i := range run.Audits {
		jobs = append(jobs, &run.Audits[i].Job)
	}
	return jobs
}

// escaper walks values once each, skipping types that hold no string.
type escaper struct {
	seen    map[uintptr]bool      // pointers walked
	types   map[reflect.Type]bool // whether a type holds strings
	strings int                   // strings looked at, for the benchmark
}

func (w *escaper) walk(v reflect.Value) {
	if !w.hasStrings(v.Type()) {
		return
	}
	switch v.Kind() {
	case reflect.String:
		w.strings++
		if v.CanSet() && needsEscape(v.String()) {
			v.SetString(escapeText(v.String()))
		}
	case reflect.Pointer:
		if v.IsNil() || w.seen[v.Pointer()] {
			return
		}
		w.seen[v.Pointer()] = true
		w.walk(v.Elem())
	case reflect.Interface:
		if !v.IsNil() && v.Elem().Kind() == reflect.Pointer {
			w.walk(v.Elem())
		}
	case reflect.Struct:
		t := v.Type()
		for i := range t.NumField() {
			if t.Field(i).IsExported() {
				w.walk(v.Field(i))
			}
		}
	case reflect.Slice, reflect.Array:
		if v.Kind() == reflect.Array && !v.CanSet() {
			return
		}
		for i := range v.Len() {
			w.walk(v.Index(i))
		}
	case reflect.Map:
		w.walkMap(v)
	}
}

// walkMap escapes a map's string keys and the strings in its values,
// which are not addressable: each entry is copied, escaped and put back.
func (w *escaper) walkMap(v reflect.Value) {
	if v.IsNil() {
		return
	}
	t := v.Type()
	keys := v.MapKeys()
	for _, k := range keys {
		val := v.MapIndex(k)
		nk := k
		if k.Kind() == reflect.String && needsEscape(k.String()) {
			nk = reflect.New(t.Key()).Elem()
			nk.SetString(escapeText(k.String()))
		}
		nv := val
		if w.hasStrings(t.Elem()) {
			nv = reflect.New(t.Elem()).Elem()
			nv.Set(val)
			w.walk(nv)
		}
		if nk.Interface() != k.Interface() {
			v.SetMapIndex(k, reflect.Value{})
		}
		v.SetMapIndex(nk, nv)
	}
}

// hasStrings reports whether a value of type t can hold a string that
// walk reaches: through exported fields, elements, keys or pointers.
func (w *escaper) hasStrings(t reflect.Type) bool {
	if has, ok := w.types[t]; ok {
		return has
	}
	w.types[t] = true // a recursive type: assume so while looking
	has := false
	switch t.Kind() {
	case reflect.String, reflect.Interface:
		has = true
	case reflect.Pointer, reflect.Slice, reflect.Array:
		has = w.hasStrings(t.Elem())
	case reflect.Map:
		has = w.hasStrings(t.Key()) || w.hasStrings(t.Elem())
	case reflect.Struct:
		for i := range t.NumField() {
			if f := t.Field(i); f.IsExported() && w.hasStrings(f.Type) {
				has = true
				break
			}
		}
	}
	w.types[t] = has
	return has
}

// maxEcho is the length, in characters, to which a long value written by
// the user (a quantity, a flag's value) is cut where a message repeats it.
const maxEcho = 40

// cutEcho returns s cut to maxEcho characters with "…" when it is longer.
func cutEcho(s string) string {
	if utf8.RuneCountInString(s) <= maxEcho {
		return s
	}
	r := []rune(s)
	return string(r[:maxEcho]) + "…"
}

// shortenEchoes cuts, in msg, each repetition of a long value the user
// wrote: the inputs given, and the input of every units error in err's
// chain. A quoted repetition ('…' or "…") becomes the cut value in its
// quotes followed by its full length, such as '1111…' (100005 characters).
func shortenEchoes(msg string, err error, inputs ...string) string {
	for _, ue := range unitsErrors(err) {
		inputs = append(inputs, ue.Input, ue.Unit)
	}
	// the longest first: a unit is a part of its input
	sort.Slice(inputs, func(i, j int) bool { return len(inputs[i]) > len(inputs[j]) })
	for _, in := range inputs {
		n := utf8.RuneCountInString(in)
		if n <= maxEcho {
			continue
		}
		cut := cutEcho(in)
		tail := fmt.Sprintf(" (%d characters)", n)
		for _, q := range []string{"'", `"`} {
			msg = strings.ReplaceAll(msg, q+in+q, q+cut+q+tail)
		}
		if quoted := strconv.Quote(in); strings.Contains(msg, quoted) {
			msg = strings.ReplaceAll(msg, quoted, strconv.Quote(cut)+tail)
		}
		msg = strings.ReplaceAll(msg, in, cut)
	}
	return msg
}

// maxQuoted is the length above which any double-quoted text in a
// message (a name as Go's %q writes it) is cut, as a 100 kB name would
// otherwise fill the screen; far above any file path or name in use.
const maxQuoted = 200

// quotedText matches a double-quoted Go string.
var quotedText = regexp.MustCompile(`"(?:[^"\\]|\\.)*"`)

// shortenQuoted cuts the double-quoted texts of msg longer than maxQuoted
// characters to maxEcho, with their length after them.
func shortenQuoted(msg string) string {
	if len(msg) <= maxQuoted {
		return msg
	}
	return quotedText.ReplaceAllStringFunc(msg, func(q string) string {
		n := utf8.RuneCountInString(q) - 2
		if n <= maxQuoted {
			return q
		}
		return `"` + cutEcho(q[1:len(q)-1]) + `"` + fmt.Sprintf(" (%d characters)", n)
	})
}

// unitsErrors lists the *units.Error values in err's chain.
func unitsErrors(err error) []*units.Error {
	var out []*units.Error
	var visit func(error)
	visit = func(e error) {
		for e != nil {
			if ue, ok := e.(*units.Error); ok {
				out = append(out, ue)
			}
			switch x := e.(type) {
			case interface{ Unwrap() []error }:
				for _, c := range x.Unwrap() {
					visit(c)
				}
				return
			case interface{ Unwrap() error }:
				e = x.Unwrap()
			default:
				return
			}
		}
	}
	visit(err)
	return out
}

// internalPrefix matches the name of a Go function that a package puts
// before its messages ("water.PX: "), which tells a user nothing.
var internalPrefix = regexp.MustCompile(`(^|[\s(:;])(water|units|plant|solver|combustion|fuel|heat|loads|profile|scripting)\.[A-Z][A-Za-z0-9]*: `)

// dropInternal takes the packages' function names out of a message, and
// words an internal error of the scripting package for a user.
func dropInternal(msg string) string {
	msg = internalPrefix.ReplaceAllString(msg, "$1")
	return strings.Replace(msg, scripting.ErrInternal.Error(), "internal error of sim (please report it)", 1)
}

// message is the text sim prints for an error: long echoes of the user's
// values cut, the packages' function names dropped, and control
// characters escaped, so that it stays on one line and shows exactly what
// was written (a newline in a name or a check() message as \n).
func message(err error) string {
	return escapeText(dropInternal(shortenQuoted(shortenEchoes(err.Error(), err))))
}

// escapePlants escapes the plant names of the run's cases and jobs, which
// escapeRun(run, false) leaves.
func escapePlants(run *report.Run) {
	for i := range run.Cases {
		run.Cases[i].Plant = escapeText(run.Cases[i].Plant)
	}
	for _, j := range jobsOf(run) {
		j.Plant = escapeText(j.Plant)
	}
}
