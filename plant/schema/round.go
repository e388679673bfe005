package schema

import (
	"math"
	"reflect"
)

// Round is the one rounding rule of every figure the schema carries: six
// significant digits, and a value within 1e-9 of zero (|v| < 1e-9) is 0, so
// that a report does not show solver noise (-0.000000001 kg/h) and its
// bytes are the same on every platform. A value that is not finite is
// returned as it is; the constructors of this package never pass one on
// (they give null or 0 instead, as each key's documentation says).
//
// Six significant digits are more than any figure here is worth (a fuel
// flow known to 0.1 % has three), and few enough that the last bits of a
// solve do not show.
func Round(v float64) float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return v
	}
	if math.Abs(v) < 1e-9 {
		return 0
	}
	// v to an integer of six digits and back, by a power of ten that is
	// exact in binary for every figure of a plant (10^k, |k| ≤ 22).
	e := math.Floor(math.Log10(math.Abs(v)))
	if e > 5 {
		g := math.Pow(10, e-5)
		return math.Round(v/g) * g
	}
	f := math.Pow(10, 5-e)
	return math.Round(v*f) / f
}

// roundPtr is Round of v as a pointer (a JSON number), or nil (null) when
// ok is false or v is not finite.
func roundPtr(v float64, ok bool) *float64 {
	if !ok || math.IsNaN(v) || math.IsInf(v, 0) {
		return nil
	}
	r := Round(v)
	return &r
}

// finite0 is Round of v, or 0 when v is not finite.
func finite0(v float64) float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0
	}
	return Round(v)
}

// The conversions from the plant's SI figures to the report units the
// keys name. They are exact by the definitions of the units (1 h = 3600 s,
// 1 d = 86 400 s, 1 t = 1000 kg, 1 kW = 1000 W, 1 MWh = 3.6e9 J).

// KgPerH converts kg/s to kg/h.
func KgPerH(kgPerS float64) float64 { return kgPerS * 3600 }

// TPerDay converts kg/s to t/day.
func TPerDay(kgPerS float64) float64 { return kgPerS * 86.4 }

// KW converts W to kW.
func KW(w float64) float64 { return w / 1e3 }

// Tonnes is the mass in t of a flow of kgPerS kept up for hours.
func Tonnes(kgPerS, hours float64) float64 { return kgPerS * 3.6 * hours }

// RoundFigures rounds, by Round, every float64 that v points to: the
// fields of structs (exported or not), the elements of slices and arrays,
// the values of maps, through pointers and interfaces. The commands use it
// so that every JSON document they print follows the one rule of this
// package, whatever type holds it.
func RoundFigures(v any) {
	roundValue(reflect.ValueOf(v))
}

func roundValue(v reflect.Value) {
	switch v.Kind() {
	case reflect.Pointer, reflect.Interface:
		if !v.IsNil() {
			roundValue(v.Elem())
		}
	case reflect.Struct:
		for i := 0; i < v.NumField(); i++ {
			if f := v.Field(i); f.CanSet() || f.Kind() == reflect.Pointer || f.Kind() == reflect.Slice || f.Kind() == reflect.Map {
				roundValue(f)
			}
		}
	case reflect.Slice, reflect.Array:
		for i := 0; i < v.Len(); i++ {
			roundValue(v.Index(i))
		}
	case reflect.Map:
		for _, k := range v.MapKeys() {
			e := v.MapIndex(k)
			if e.Kind() == reflect.Float64 {
				v.SetMapIndex(k, reflect.ValueOf(Round(e.Float())).Convert(e.Type()))
				continue
			}
			roundValue(e)
		}
	case reflect.Float64:
		if v.CanSet() {
			v.SetFloat(Round(v.Float()))
		}
	}
}
