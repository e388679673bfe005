package units

import (
	"math"
	"strconv"
	"strings"
)

// lookup finds the unit written as unit, for conversions of numbers (not
// strings). A unit known in several dimensions ("K") resolves to the first
// in table order, which has the same scale in each.
func lookup(unit string) (*unitDef, error) {
	u := strings.TrimSpace(unit)
	var buf [maxUnitLen]byte
	n, ok := compact(u, &buf)
	var positions []uint8
	if ok {
		positions = index[string(buf[:n])]
	}
	if len(positions) == 0 {
		msg := "unknown unit '" + unit + "'"
		if sug := suggest(u, invalidDimension); sug != "" {
			msg += "; did you mean '" + sug + "'?"
		}
		return nil, newError(ErrUnknownUnit, "", 0, 0, unit, msg)
	}
	def := &table[positions[0]]
	if def.kind == ambiguous {
		return nil, newError(ErrAmbiguous, "", 0, def.dim, unit,
			"pressure unit '"+unit+"' is ambiguous: use '"+def.gaugeHint+"' for gauge or '"+def.absHint+"' for absolute")
	}
	return def, nil
}

// FromSI converts v, in the SI unit of the dimension of unit, to unit, with
// gauge pressures relative to the standard atmosphere. An empty unit means a
// bare fraction and returns v unchanged.
func FromSI(v float64, unit string) (float64, error) { return Options{}.FromSI(v, unit) }

// ToSI converts v, given in unit, to SI, with gauge pressures relative to
// the standard atmosphere. It applies the same checks as Parse (finite
// result, no temperature below 0 K, no absolute pressure at or below zero).
func ToSI(v float64, unit string) (float64, error) { return Options{}.ToSI(v, unit) }

// Format returns v, in SI, written in unit with the fewest digits that read
// back to the same number, such as "7 bar(g)". The unit is written in its
// canonical spelling.
func Format(v float64, unit string) (string, error) { return Options{}.Format(v, unit) }

// FormatPrec is Format with a fixed number of decimals, for reports:
// FormatPrec(443.15, "°C", 1) is "170.0 °C".
func FormatPrec(v float64, unit string, decimals int) (string, error) {
	return Options{}.FormatPrec(v, unit, decimals)
}

// FromSI converts v from SI to unit with o's ambient pressure.
func (o Options) FromSI(v float64, unit string) (float64, error) {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, newError(ErrRange, "", 0, 0, unit, "cannot convert "+fmtNum(v)+" to '"+unit+"': the value is not finite")
	}
	if strings.TrimSpace(unit) == "" {
		return v, nil
	}
	amb, err := o.ambient()
	if err != nil {
		return 0, err
	}
	def, err := lookup(unit)
	if err != nil {
		return 0, err
	}
	var x float64
	if def.kind == gauge {
		x = (v - amb) / def.scale
	} else {
		x = (v - def.offset) / def.scale
	}
	if math.IsInf(x, 0) {
		return 0, newError(ErrRange, "", 0, def.dim, unit, "cannot convert "+fmtNum(v)+" "+def.dim.SIUnit()+" to '"+unit+"': the result is not finite")
	}
	return x, nil
}

// ToSI converts v from unit to SI with o's ambient pressure.
func (o Options) ToSI(v float64, unit string) (float64, error) {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, newError(ErrRange, "", 0, 0, unit, "cannot convert "+fmtNum(v)+" '"+unit+"' to SI: the value is not finite")
	}
	if strings.TrimSpace(unit) == "" {
		return v, nil
	}
	amb, err := o.ambient()
	if err != nil {
		return 0, err
	}
	def, err := lookup(unit)
	if err != nil {
		return 0, err
	}
	var si float64
	if def.kind == gauge {
		si = v*def.scale + amb
	} else {
		si = v*def.scale + def.offset
	}
	if err := check(fmtNum(v)+" "+def.spellings[0], si, def, amb); err != nil {
		return 0, err
	}
	return si, nil
}

// Format writes v, in SI, in unit with o's ambient pressure.
func (o Options) Format(v float64, unit string) (string, error) {
	return o.format(v, unit, 'g', -1)
}

// FormatPrec writes v, in SI, in unit with the given number of decimals.
func (o Options) FormatPrec(v float64, unit string, decimals int) (string, error) {
	if decimals < 0 {
		decimals = 0
	}
	return o.format(v, unit, 'f', decimals)
}

func (o Options) format(v float64, unit string, fmtc byte, prec int) (string, error) {
	x, err := o.FromSI(v, unit)
	if err != nil {
		return "", err
	}
	num := strconv.FormatFloat(x, fmtc, prec, 64)
	if strings.TrimSpace(unit) == "" {
		return num, nil
	}
	def, _ := lookup(unit) // known to succeed: FromSI succeeded
	return num + " " + def.spellings[0], nil
}

// Unit describes one accepted unit.
type Unit struct {
	Name      string    // canonical spelling, as Format writes it
	Spellings []string  // every accepted spelling, Name first
	Dim       Dimension // its dimension
	Gauge     bool      // a gauge pressure: SI = value*Scale + ambient
	// Scale and Offset convert to SI: SI = value*Scale + Offset (for gauge
	// units the offset is the ambient pressure, and Offset is zero).
	Scale, Offset float64
}

// Units returns the units accepted for d, in a fixed order. Spellings
// rejected as ambiguous ("bar") are not listed; see AmbiguousSpellings.
func Units(d Dimension) []Unit {
	var out []Unit
	for i := range table {
		u := &table[i]
		if u.dim != d || u.kind == ambiguous {
			continue
		}
		out = append(out, Unit{
			Name:      u.spellings[0],
			Spellings: append([]string(nil), u.spellings...),
			Dim:       u.dim,
			Gauge:     u.kind == gauge,
			Scale:     u.scale,
			Offset:    u.offset,
		})
	}
	return out
}

// AmbiguousSpellings returns the pressure spellings that Parse rejects
// because they do not say gauge or absolute ("bar", "psi", ...).
func AmbiguousSpellings() []string {
	var out []string
	for i := range table {
		if table[i].kind == ambiguous {
			out = append(out, table[i].spellings...)
		}
	}
	return out
}

// Lookup returns the unit written as unit, in any of its spellings. A
// spelling known in several dimensions ("K") gives the first: Temperature.
// Spellings rejected as ambiguous ("bar") return an error of kind
// ErrAmbiguous.
func Lookup(unit string) (Unit, error) {
	def, err := lookup(unit)
	if err != nil {
		return Unit{}, err
	}
	return Unit{
		Name:      def.spellings[0],
		Spellings: append([]string(nil), def.spellings...),
		Dim:       def.dim,
		Gauge:     def.kind == gauge,
		Scale:     def.scale,
		Offset:    def.offset,
	}, nil
}
