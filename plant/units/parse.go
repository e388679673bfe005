package units

import (
	"math"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"
)

// StandardAtmosphere is the ambient pressure gauge readings refer to when
// Options.AmbientPressure is zero: 101325 Pa, exact by definition
// (NIST SP 811 B.8).
const StandardAtmosphere = atmPa

// Plausible bounds for Options.AmbientPressure. They catch an ambient given
// in bar or kPa instead of pascals; a plant at sea level is near 101 kPa.
const (
	minAmbient = 50e3
	maxAmbient = 150e3
)

// maxUnitLen bounds the length of a unit after compaction; longer units are
// unknown by construction.
const maxUnitLen = 32

// Options changes how quantities are read. The zero value is ready to use.
type Options struct {
	// AmbientPressure is the absolute pressure, in Pa, that gauge
	// readings (bar(g), psig, ...) are relative to. Zero means the
	// standard atmosphere, 101325 Pa. Other values must lie between
	// 50 kPa and 150 kPa; anything else is taken as a unit mistake (an
	// ambient given in bar, say) and rejected.
	AmbientPressure float64
}

// Validate reports an error if o holds an implausible value. Parse and
// the conversion functions check the same, so calling it is optional.
func (o Options) Validate() error {
	_, err := o.ambient()
	return err
}

// ambient returns the ambient pressure in Pa, or an error for an
// implausible setting.
func (o Options) ambient() (float64, error) {
	a := o.AmbientPressure
	if a == 0 {
		return StandardAtmosphere, nil
	}
	if !(a >= minAmbient && a <= maxAmbient) { // also catches NaN
		return 0, &Error{Kind: ErrOptions, msg: "ambient pressure " + fmtNum(a) +
			" Pa is not plausible: give it in pascals, between 50000 and 150000 (zero means 101325)"}
	}
	return a, nil
}

// Quantity is a parsed value in SI with its dimension and the canonical
// spelling of the unit it was written in ("" for a bare number).
type Quantity struct {
	Value float64
	Dim   Dimension
	Unit  string
}

// Parse reads a quantity such as "7 bar(g)" and returns its value in the SI
// unit of want (see Dimension). A bare number is accepted only when want is
// Fraction. Gauge pressures are converted with opt's ambient pressure. The
// error, an *Error, says what was wrong and what was expected.
//
// Parse panics if want is not a valid Dimension (a programmer mistake).
func Parse(s string, want Dimension, opt Options) (float64, error) {
	if !want.valid() {
		panic("units: Parse called with an invalid Dimension")
	}
	q, err := parse(s, want, opt)
	return q.Value, err
}

// ParseAny reads a quantity and finds its dimension from the unit. A bare
// number is a Fraction. "K" alone reads as a Temperature; use Parse with
// TemperatureDifference to read kelvin as a difference.
func ParseAny(s string, opt Options) (Quantity, error) {
	return parse(s, invalidDimension, opt)
}

func parse(s string, want Dimension, opt Options) (Quantity, error) {
	amb, err := opt.ambient()
	if err != nil {
		return Quantity{}, err
	}
	in := strings.TrimSpace(s)
	if in == "" {
		return Quantity{}, newError(ErrSyntax, s, want, 0, "",
			"empty quantity: expected a number and a unit, such as '"+exampleFor(want)+"'")
	}
	numText, neg, rest, ok := scanNumber(in)
	if !ok {
		msg := "no number in " + quoted(s) + ": expected a number and a unit, such as '" + exampleFor(want) + "'"
		return Quantity{}, newError(ErrSyntax, s, want, 0, "", msg)
	}
	if strings.HasPrefix(rest, ",") && len(rest) > 1 && rest[1] >= '0' && rest[1] <= '9' {
		return Quantity{}, newError(ErrSyntax, s, want, 0, "",
			"bad number in "+quoted(s)+": use '.' as the decimal point")
	}
	v, perr := strconv.ParseFloat(numText, 64)
	if perr != nil || math.IsInf(v, 0) {
		return Quantity{}, newError(ErrRange, s, want, 0, "",
			"number in "+quoted(s)+" is out of range for a float64")
	}
	if neg {
		v = -v
	}
	unit := strings.TrimSpace(rest)
	if unit == "" {
		if want == invalidDimension || want == Fraction {
			return Quantity{Value: v, Dim: Fraction}, nil
		}
		return Quantity{}, newError(ErrMissingUnit, s, want, 0, "",
			want.String()+" needs a unit, such as '"+want.Example()+"'; got "+quoted(s))
	}

	var buf [maxUnitLen]byte
	n, ok := compact(unit, &buf)
	if !ok {
		return Quantity{}, unknownUnit(s, unit, want)
	}
	positions := index[string(buf[:n])]
	if len(positions) == 0 {
		return Quantity{}, unknownUnit(s, unit, want)
	}
	pos := int(positions[0])
	if want != invalidDimension {
		pos = -1
		for _, p := range positions {
			if table[p].dim == want {
				pos = int(p)
				break
			}
		}
		if pos < 0 {
			got := &table[positions[0]]
			if want == TemperatureDifference && got.dim == Temperature && got.offset != 0 {
				return Quantity{}, ambiguousDifference(s, in[:len(in)-len(rest)], got)
			}
			return Quantity{}, newError(ErrWrongDimension, s, want, got.dim, unit,
				expected(want)+"; got "+quoted(s)+" ("+got.dim.withArticle()+")")
		}
	}
	def := &table[pos]
	var si float64
	switch def.kind {
	case ambiguous:
		num := strings.TrimSpace(in[:len(in)-len(rest)])
		return Quantity{}, newError(ErrAmbiguous, s, want, def.dim, unit,
			"pressure "+quoted(s)+" is ambiguous: write '"+num+" "+def.gaugeHint+
				"' for gauge or '"+num+" "+def.absHint+"' for absolute")
	case gauge:
		si = v*def.scale + amb
	default:
		si = v*def.scale + def.offset
	}
	if err := check(s, si, def, amb); err != nil {
		return Quantity{}, err
	}
	return Quantity{Value: si, Dim: def.dim, Unit: def.spellings[0]}, nil
}

// check rejects values that are not finite, absolute temperatures below
// 0 K and absolute pressures at or below zero.
func check(s string, si float64, def *unitDef, amb float64) error {
	if math.IsNaN(si) || math.IsInf(si, 0) {
		return newError(ErrRange, s, def.dim, def.dim, def.spellings[0],
			quoted(s)+" is out of range: its value in "+def.dim.SIUnit()+" is not finite")
	}
	switch def.dim {
	case Pressure:
		if si <= 0 {
			msg := "pressure " + quoted(s) + " is at or below vacuum: it is " + fmtNum(si/barPa) +
				" bar(a)"
			if def.kind == gauge {
				msg += " with an ambient of " + fmtNum(amb/barPa) + " bar(a)"
			}
			msg += "; an absolute pressure must be above zero"
			return newError(ErrPhysical, s, def.dim, def.dim, def.spellings[0], msg)
		}
	case Temperature:
		if si < 0 {
			return newError(ErrPhysical, s, def.dim, def.dim, def.spellings[0],
				"temperature "+quoted(s)+" is below absolute zero (0 K, -273.15 °C)")
		}
	}
	return nil
}

// scanNumber splits a leading decimal number (optional sign, digits with an
// optional '.', optional exponent) from the rest. The returned text has no
// sign; neg reports a leading minus (ASCII '-' or U+2212).
func scanNumber(s string) (num string, neg bool, rest string, ok bool) {
	i := 0
	switch {
	case strings.HasPrefix(s, "+"):
		i = 1
	case strings.HasPrefix(s, "-"):
		i, neg = 1, true
	case strings.HasPrefix(s, "\u2212"):
		i, neg = len("\u2212"), true
	}
	start := i
	digits := 0
	for i < len(s) && s[i] >= '0' && s[i] <= '9' {
		i++
		digits++
	}
	if i < len(s) && s[i] == '.' {
		i++
		for i < len(s) && s[i] >= '0' && s[i] <= '9' {
			i++
			digits++
		}
	}
	if digits == 0 {
		return "", false, s, false
	}
	if i < len(s) && (s[i] == 'e' || s[i] == 'E') {
		j := i + 1
		if j < len(s) && (s[j] == '+' || s[j] == '-') {
			j++
		}
		if j < len(s) && s[j] >= '0' && s[j] <= '9' {
			for j < len(s) && s[j] >= '0' && s[j] <= '9' {
				j++
			}
			i = j
		}
	}
	return s[start:i], neg, s[i:], true
}

// compact writes the key form of a unit into buf: white space, parentheses,
// '·', '⋅', '*', '.' and '^' are dropped; '²' and '³' become '2' and '3'.
// It reports false if the result does not fit in buf, or if parentheses do
// not balance.
func compact(unit string, buf *[maxUnitLen]byte) (int, bool) {
	n, depth := 0, 0
	for _, r := range unit {
		switch {
		case unicode.IsSpace(r), r == '·', r == '⋅', r == '*', r == '.', r == '^':
			continue
		case r == '(':
			depth++
			continue
		case r == ')':
			depth--
			if depth < 0 {
				return 0, false
			}
			continue
		case r == '²':
			r = '2'
		case r == '³':
			r = '3'
		}
		if n+utf8.RuneLen(r) > len(buf) || r == utf8.RuneError {
			return 0, false
		}
		n += utf8.EncodeRune(buf[n:], r)
	}
	return n, depth == 0
}

func exampleFor(want Dimension) string {
	if want == invalidDimension {
		return Pressure.Example()
	}
	return want.Example()
}

// expected returns "pressure expected, such as '7 bar(g)'".
func expected(want Dimension) string {
	if want == Fraction {
		return "fraction expected, such as '0.85' or '85 %'"
	}
	return want.String() + " expected, such as '" + want.Example() + "'"
}

func ambiguousDifference(s, num string, got *unitDef) error {
	num = strings.TrimSpace(num)
	d := "ΔC"
	if got.scale != 1 {
		d = "ΔF"
	}
	return newError(ErrAmbiguous, s, TemperatureDifference, Temperature, got.spellings[0],
		"temperature difference "+quoted(s)+" is ambiguous ('"+got.spellings[0]+
			"' names a temperature): write '"+num+" "+d+"' for a difference, or give it in K")
}

func unknownUnit(s, unit string, want Dimension) error {
	msg := "unknown unit " + quoted(unit) + " in " + quoted(s)
	if sug := suggest(unit, want); sug != "" {
		msg += "; did you mean '" + sug + "'?"
	}
	if want != invalidDimension {
		msg += "; " + want.String() + " units are: " + strings.Join(canonicalUnits(want), ", ")
	}
	return newError(ErrUnknownUnit, s, want, 0, unit, msg)
}

// suggest returns the canonical spelling of the one unit whose spelling
// matches unit apart from letter case, preferring units of dimension want,
// or "" if there is no single match.
func suggest(unit string, want Dimension) string {
	var buf [maxUnitLen]byte
	n, ok := compact(unit, &buf)
	if !ok {
		return ""
	}
	key := string(buf[:n])
	found, foundWant := -1, -1
	nFound, nWant := 0, 0
	for i := range table {
		for _, sp := range table[i].spellings {
			var b2 [maxUnitLen]byte
			m, _ := compact(sp, &b2)
			if !strings.EqualFold(string(b2[:m]), key) {
				continue
			}
			if found != i {
				found = i
				nFound++
			}
			if table[i].dim == want && foundWant != i {
				foundWant = i
				nWant++
			}
		}
	}
	switch {
	case nWant == 1:
		return table[foundWant].spellings[0]
	case nFound == 1:
		return table[found].spellings[0]
	}
	return ""
}

// canonicalUnits returns the canonical spelling of every accepted unit of d.
func canonicalUnits(d Dimension) []string {
	var out []string
	for i := range table {
		if table[i].dim == d && table[i].kind != ambiguous {
			out = append(out, table[i].spellings[0])
		}
	}
	return out
}

func fmtNum(v float64) string { return strconv.FormatFloat(v, 'g', 6, 64) }

// maxShown is the most of an input a message echoes, in characters.
const maxShown = 40

// quoted is an input as a message echoes it, in quotes: cut to maxShown
// characters with its length said, so that a 100 kB string does not fill
// the screen.
func quoted(s string) string {
	if r := []rune(s); len(r) > maxShown {
		return "'" + string(r[:maxShown]) + "…' (" + strconv.Itoa(len(r)) + " characters)"
	}
	return "'" + s + "'"
}
