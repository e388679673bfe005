package scripting

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant/units"
)

// args reads the keys of one table given to a binding: each getter
// records its key as accepted, errors are collected against the table's
// position and owner, and done reports the keys nobody asked for.
type args struct {
	r     *runner
	t     *lua.LTable
	what  string // `boiler "AB1"`, for messages
	pos   Pos
	uopt  units.Options
	asked []string
	nerr  int
	// missing maps a required key that was not given to its error, so
	// that a misspelling of it is reported once.
	missing map[string]*Error
}

func (r *runner) args(t *lua.LTable, what string, pos Pos, uopt units.Options) *args {
	return &args{r: r, t: t, what: what, pos: pos, uopt: uopt}
}

// errorf records an error about the table.
func (a *args) errorf(err error, format string, v ...any) {
	a.nerr++
	a.r.errs = append(a.r.errs, &Error{Pos: a.pos, Unit: a.what, Msg: fmt.Sprintf(format, v...), Err: err})
}

func (a *args) get(key string) lua.LValue {
	a.asked = append(a.asked, key)
	return a.t.RawGetString(key)
}

// has reports whether key is given, and records it as accepted.
func (a *args) has(key string) bool { return a.get(key) != lua.LNil }

// str reads a string key; required says whether absence is an error.
func (a *args) str(key string, required bool) (string, bool) {
	switch v := a.get(key).(type) {
	case *lua.LNilType:
		if required {
			a.errorf(nil, "%s is required", key)
			a.markMissing(key)
		}
		return "", false
	case lua.LString:
		return string(v), true
	default:
		a.errorf(nil, "%s must be a string; got %s", key, describe(v))
		return "", false
	}
}

// boolean reads a true/false key.
func (a *args) boolean(key string) bool {
	switch v := a.get(key).(type) {
	case *lua.LNilType:
		return false
	case lua.LBool:
		return bool(v)
	default:
		a.errorf(nil, "%s must be true or false; got %s", key, describe(v))
		return false
	}
}

// number reads a dimensionless number (a ratio or a count).
func (a *args) number(key string) (float64, bool) {
	switch v := a.get(key).(type) {
	case *lua.LNilType:
		return 0, false
	case lua.LNumber:
		f := float64(v)
		if math.IsNaN(f) || math.IsInf(f, 0) {
			a.errorf(nil, "%s must be a finite number; got %v", key, f)
			return 0, false
		}
		return f, true
	default:
		a.errorf(nil, "%s must be a number; got %s", key, describe(v))
		return 0, false
	}
}

// quantity reads key as a quantity of dimension dim, in SI.
func (a *args) quantity(key string, dim units.Dimension, required bool) (float64, bool) {
	v := a.get(key)
	if v == lua.LNil {
		if required {
			a.errorf(nil, "%s is required, such as %s = %q", key, key, exampleFor(dim))
			a.markMissing(key)
		}
		return 0, false
	}
	f, err := parseQuantity(v, key, dim, a.uopt)
	if err != nil {
		a.errorf(err, "%s", err.Error())
		return 0, false
	}
	return f, true
}

// pressureDiff reads key as a pressure difference, in Pa ("3 bar",
// "300 kPa").
func (a *args) pressureDiff(key string, required bool) (float64, bool) {
	v := a.get(key)
	if v == lua.LNil {
		if required {
			a.errorf(nil, "%s is required, such as %s = \"3 bar\"", key, key)
		}
		return 0, false
	}
	f, err := parsePressureDiff(v, key)
	if err != nil {
		a.errorf(err, "%s", err.Error())
		return 0, false
	}
	return f, true
}

// markMissing remembers the error just recorded as the absence of key.
func (a *args) markMissing(key string) {
	if a.missing == nil {
		a.missing = map[string]*Error{}
	}
	a.missing[key] = a.r.errs[len(a.r.errs)-1]
}

// done reports every key of the table that no getter asked for. A key
// that is a near miss of a missing required key replaces the report of
// the missing key.
func (a *args) done() {
	unknown := a.r.unknownKeys(a.t, a.asked)
	for _, k := range unknown {
		if s := suggest(k, dedup(a.asked)); s != "" {
			if e, ok := a.missing[s]; ok {
				a.r.dropError(e)
				a.nerr--
			}
		}
		a.errorf(nil, "%s", unknownKeyMsg(k, a.asked))
	}
}

// dropError removes e from the collected errors.
func (r *runner) dropError(e *Error) {
	for i, x := range r.errs {
		if x == e {
			r.errs = append(r.errs[:i], r.errs[i+1:]...)
			return
		}
	}
}

// unknownKeys returns the keys of t not in accepted, sorted; non-string
// keys are given as their text.
func (r *runner) unknownKeys(t *lua.LTable, accepted []string) []string {
	var out []string
	k, _ := t.Next(lua.LNil)
	for n := 0; k != lua.LNil; n++ {
		if n >= r.opt.MaxTable {
			break
		}
		ks, isStr := k.(lua.LString)
		if !isStr {
			out = append(out, fmt.Sprintf("[%s]", k.String()))
		} else if !contains(accepted, string(ks)) {
			out = append(out, string(ks))
		}
		k, _ = t.Next(k)
	}
	sort.Strings(out)
	return out
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

// unknownKeyMsg says a key is not known, suggests a near miss and lists the
// accepted keys.
func unknownKeyMsg(key string, accepted []string) string {
	acc := dedup(accepted)
	if strings.HasPrefix(key, "[") {
		return fmt.Sprintf("unexpected list entry %s; give keys by name (accepted: %s)", key, strings.Join(acc, ", "))
	}
	msg := fmt.Sprintf("unknown key '%s'", key)
	if s := suggest(key, acc); s != "" {
		msg += fmt.Sprintf("; did you mean '%s'?", s)
	}
	return msg + " (accepted: " + strings.Join(acc, ", ") + ")"
}

func dedup(list []string) []string {
	var out []string
	for _, s := range list {
		if !contains(out, s) {
			out = append(out, s)
		}
	}
	return out
}

// suggest returns the candidate nearest to s, if it is near enough to be
// a likely misspelling: equal ignoring case, or within an edit distance of
// one for short names and a third of the length for longer ones.
func suggest(s string, candidates []string) string {
	best, bestD := "", math.MaxInt
	for _, c := range candidates {
		if strings.EqualFold(c, s) {
			return c
		}
		d := editDistance(strings.ToLower(s), strings.ToLower(c))
		if d < bestD {
			best, bestD = c, d
		}
	}
	limit := max(1, len([]rune(s))/3)
	if bestD <= limit {
		return best
	}
	return ""
}

// editDistance is the Damerau-Levenshtein distance (with adjacent
// transpositions) between a and b, by runes.
func editDistance(a, b string) int {
	ra, rb := []rune(a), []rune(b)
	if len(ra) > 64 || len(rb) > 64 {
		if a == b {
			return 0
		}
		return math.MaxInt / 2
	}
	d := make([][]int, len(ra)+1)
	for i := range d {
		d[i] = make([]int, len(rb)+1)
		d[i][0] = i
	}
	for j := range d[0] {
		d[0][j] = j
	}
	for i := 1; i <= len(ra); i++ {
		for j := 1; j <= len(rb); j++ {
			cost := 1
			if ra[i-1] == rb[j-1] {
				cost = 0
			}
			d[i][j] = min(d[i-1][j]+1, d[i][j-1]+1, d[i-1][j-1]+cost)
			if i > 1 && j > 1 && ra[i-1] == rb[j-2] && ra[i-2] == rb[j-1] {
				d[i][j] = min(d[i][j], d[i-2][j-2]+1)
			}
		}
	}
	return d[len(ra)][len(rb)]
}

// describe names a Lua value for messages: "a table", "the number 450".
func describe(v lua.LValue) string {
	switch x := v.(type) {
	case lua.LNumber:
		return "the number " + strconv.FormatFloat(float64(x), 'g', -1, 64)
	case lua.LString:
		return strconv.Quote(string(x))
	case lua.LBool:
		return fmt.Sprintf("%v", bool(x))
	case *lua.LNilType:
		return "nil"
	}
	return "a " + v.Type().String()
}

// exampleFor gives an example quantity for messages.
func exampleFor(dim units.Dimension) string {
	if dim == units.Fraction {
		return "85 %"
	}
	return dim.Example()
}

// parseQuantity reads a Lua value as a quantity of dimension dim, in SI. A
// number is accepted only for a fraction.
func parseQuantity(v lua.LValue, key string, dim units.Dimension, uopt units.Options) (float64, error) {
	switch x := v.(type) {
	case lua.LNumber:
		f := float64(x)
		if dim == units.Fraction {
			if math.IsNaN(f) || math.IsInf(f, 0) {
				return 0, fmt.Errorf("%s must be a finite number; got %v", key, f)
			}
			return f, nil
		}
		return 0, fmt.Errorf("%s needs a unit, such as '%s'; got %s", key, exampleFor(dim), strconv.FormatFloat(f, 'g', -1, 64))
	case lua.LString:
		f, err := units.Parse(string(x), dim, uopt)
		if err != nil {
			return 0, fmt.Errorf("%s: %w", key, err)
		}
		return f, nil
	}
	return 0, fmt.Errorf("%s must be a %s in a string, such as '%s'; got %s", key, dim, exampleFor(dim), describe(v))
}

// ambiguousAsAbsolute maps the pressure spellings that do not say gauge or
// absolute to an absolute spelling of the same unit: for a difference of
// pressures, the reference does not matter.
var ambiguousAsAbsolute = map[string]string{
	"bar": "bar(a)", "mbar": "mbar(a)", "psi": "psia", "kg/cm2": "kg/cm2a", "kgf/cm2": "kgf/cm2a",
}

// parsePressureDiff reads a pressure difference ("3 bar", "250 kPa"): the
// number times the unit's scale, whatever the unit says of gauge or
// absolute.
func parsePressureDiff(v lua.LValue, key string) (float64, error) {
	s, ok := v.(lua.LString)
	if !ok {
		if n, isNum := v.(lua.LNumber); isNum {
			return 0, fmt.Errorf("%s needs a unit, such as '3 bar'; got %s", key, strconv.FormatFloat(float64(n), 'g', -1, 64))
		}
		return 0, fmt.Errorf("%s must be a pressure difference in a string, such as '3 bar'; got %s", key, describe(v))
	}
	text := strings.TrimSpace(string(s))
	i := 0
	for i < len(text) && strings.IndexByte("+-0123456789.eE", text[i]) >= 0 {
		// stop at an 'e' that starts a unit rather than an exponent
		if (text[i] == 'e' || text[i] == 'E') && (i+1 >= len(text) || strings.IndexByte("+-0123456789", text[i+1]) < 0) {
			break
		}
		i++
	}
	num, err := strconv.ParseFloat(text[:i], 64)
	if err != nil || math.IsNaN(num) || math.IsInf(num, 0) {
		return 0, fmt.Errorf("%s: %q is not a pressure difference such as '3 bar'", key, text)
	}
	unit := strings.TrimSpace(text[i:])
	if unit == "" {
		return 0, fmt.Errorf("%s needs a unit, such as '3 bar'; got %q", key, text)
	}
	if abs, ok := ambiguousAsAbsolute[unit]; ok {
		unit = abs
	}
	u, err := units.Lookup(unit)
	if err != nil {
		var ue *units.Error
		if errors.As(err, &ue) {
			return 0, fmt.Errorf("%s: %w", key, err)
		}
		return 0, fmt.Errorf("%s: unknown unit %q", key, unit)
	}
	if u.Dim != units.Pressure {
		return 0, fmt.Errorf("%s: %q is a unit of %s; want a pressure difference such as '3 bar'", key, unit, u.Dim)
	}
	return num * u.Scale, nil
}
