package combustion

import (
	"math"
	"strconv"

	"steamcase/plant/units"
)

// ValuesIn returns a CheckSettings.Value that writes each field in the
// unit unitOf names for it, the unit the user gave the field in (a
// spelling package units knows, such as "C", "°F", "kJ/kg" or "%"; "" for
// a bare fraction), to six significant digits and without float noise
// ("1200 °F", not "1199.9999999999998 °F"). Fields not in unitOf, and
// units that do not fit the field, are written as CheckSettings.Value's
// default does. "ppm" is understood for FieldCO.
func ValuesIn(unitOf map[ReadingField]string) func(ReadingField, float64) string {
	return func(f ReadingField, v float64) string {
		u, ok := unitOf[f]
		if !ok {
			return defaultValue(f, v)
		}
		if f == FieldCO {
			if u == "ppm" {
				return sig(v, 6) + " ppm"
			}
			v *= 1e-6 // ppm to a fraction, the SI of the other units
		}
		if u == "" {
			if dimOf(f) != units.Fraction {
				return defaultValue(f, v)
			}
			return sig(v, 6)
		}
		unit, err := units.Lookup(u)
		if err != nil || unit.Dim != dimOf(f) {
			return defaultValue(f, v)
		}
		x, err := units.FromSI(v, u)
		if err != nil {
			return defaultValue(f, v)
		}
		return sig(x, 6) + " " + unit.Name
	}
}

// dimOf is the dimension of a field's values as package units names it;
// units.Dimension's zero for fields it has no unit for (humidity ratio,
// atomising steam per kg fuel, CO in ppm).
func dimOf(f ReadingField) units.Dimension {
	switch f {
	case FieldFlueT, FieldAirT, FieldAtomisingSteamT:
		return units.Temperature
	case FieldDewMargin:
		return units.TemperatureDifference
	case FieldLHV:
		return units.SpecificEnergy
	case FieldAnalysis, FieldO2, FieldCO2, FieldRelativeHumidity, FieldRadiation, FieldLoad, FieldSolids, FieldSO3, FieldCO:
		return units.Fraction
	}
	var none units.Dimension
	return none
}

// defaultValue writes a value of a field in the trade's usual unit:
// temperatures in °C, differences in K, fractions in %, specific energies
// in MJ/kg, CO in ppm, humidity and atomising steam in kg/kg.
func defaultValue(f ReadingField, v float64) string {
	switch f {
	case FieldFlueT, FieldAirT, FieldAtomisingSteamT:
		return sig(v-273.15, 6) + " °C"
	case FieldDewMargin:
		return sig(v, 6) + " K"
	case FieldLHV:
		return sig(v/1e6, 6) + " MJ/kg"
	case FieldCO:
		return sig(v, 6) + " ppm"
	case FieldHumidity, FieldAtomisingSteam:
		return sig(v, 6) + " kg/kg"
	case FieldAnalysis, FieldO2, FieldCO2, FieldRelativeHumidity, FieldRadiation, FieldLoad, FieldSolids, FieldSO3:
		return sig(100*v, 6) + " %"
	}
	return sig(v, 6)
}

// sig writes v to n significant digits, without an exponent and without
// trailing zeros: sig(20.946000000000002, 6) is "20.946".
func sig(v float64, n int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return strconv.FormatFloat(v, 'g', -1, 64)
	}
	r, _ := strconv.ParseFloat(strconv.FormatFloat(v, 'g', n, 64), 64)
	if r == 0 {
		return "0"
	}
	return strconv.FormatFloat(r, 'f', -1, 64)
}

// fixed writes v with d decimals, as the reports print temperatures.
func fixed(v float64, d int) string { return strconv.FormatFloat(v, 'f', d, 64) }

// roundTo rounds v to a multiple of step, for a computed figure quoted in
// a message (a fraction to 0.01 %: step 1e-4).
func roundTo(v, step float64) float64 { return math.Round(v/step) * step }
