package scripting

import (
	"errors"
	"math"
	"strconv"
	"strings"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant/combustion"
	"steamcase/plant/fuel"
	"steamcase/plant/units"
)

// The keys of flue_gas{}, by the field of the reading each gives.
const (
	fgFuel      = "fuel"
	fgAnalysis  = "fuel_analysis"
	fgLHV       = "lhv"
	fgO2        = "O2"
	fgCO2       = "CO2"
	fgT         = "T"
	fgAirT      = "air_T"
	fgHumidity  = "humidity"
	fgCO        = "CO"
	fgRadiation = "radiation"
	fgLoad      = "load"
	fgSolids    = "solids"
	fgSteam     = "atomising"
	fgSteamT    = "atomising_T"
	fgSO3       = "SO3_conversion"
	fgDewMargin = "dew_margin"
)

// fgKey is the key of flue_gas{} that gives a field of the reading.
func fgKey(f combustion.ReadingField) string {
	switch f {
	case combustion.FieldFuel:
		return fgFuel
	case combustion.FieldAnalysis:
		return fgAnalysis
	case combustion.FieldLHV:
		return fgLHV
	case combustion.FieldGas, combustion.FieldO2:
		return fgO2
	case combustion.FieldCO2:
		return fgCO2
	case combustion.FieldFlueT:
		return fgT
	case combustion.FieldAirT:
		return fgAirT
	case combustion.FieldHumidity, combustion.FieldRelativeHumidity:
		return fgHumidity
	case combustion.FieldCO:
		return fgCO
	case combustion.FieldRadiation:
		return fgRadiation
	case combustion.FieldLoad:
		return fgLoad
	case combustion.FieldSolids:
		return fgSolids
	case combustion.FieldAtomisingSteam:
		return fgSteam
	case combustion.FieldAtomisingSteamT:
		return fgSteamT
	case combustion.FieldSO3:
		return fgSO3
	case combustion.FieldDewMargin:
		return fgDewMargin
	}
	return f.String()
}

// fgRead is what flue_gas{} read from its table: the reading, the
// settings, and for messages the text and unit each key was given in.
type fgRead struct {
	reading  combustion.FlueGasReading
	settings combustion.CheckSettings
	raw      map[string]string
	unitOf   map[combustion.ReadingField]string
}

// luaFlueGas is flue_gas{ fuel, fuel_analysis, lhv, O2 | CO2, T, air_T,
// humidity, CO, radiation, load, solids, atomising, atomising_T,
// SO3_conversion, dew_margin }: a boiler's efficiency from a flue-gas
// reading by plant/combustion's CheckFlueGas, returned as a table with
// the keys of `sim fluegas --json`.
func (r *runner) luaFlueGas(L *lua.LState) int {
	t := r.checkTable(1, "flue_gas")
	pos := r.where()
	r.checkSize(t, "flue_gas")
	a := r.args(t, "flue_gas", pos, units.Options{})
	in := fgRead{raw: map[string]string{}, unitOf: map[combustion.ReadingField]string{}}
	in.reading.Fuel = r.fgFuel(a, &in)
	r.fgMeasurement(a, &in)
	a.done()
	if a.nerr > 0 {
		r.raise(stopRun{})
	}
	in.settings.Name = fgKey
	in.settings.Value = combustion.ValuesIn(in.unitOf)
	c, err := combustion.CheckFlueGas(in.reading, &in.settings)
	if err != nil {
		var re *combustion.ReadingError
		switch {
		case errors.As(err, &re) && re.Field == combustion.FieldFuel:
			a.errorf(err, "%s", re.Msg)
		case errors.As(err, &re) && in.raw[fgKey(re.Field)] != "":
			a.errorf(err, "%s = %s: %s", fgKey(re.Field), in.raw[fgKey(re.Field)], re.Msg)
		case errors.As(err, &re):
			a.errorf(err, "%s", re.Msg)
		default:
			a.errorf(err, "%v", err)
		}
		r.raise(stopRun{})
	}
	L.Push(r.schemaTable("flue_gas", c.JSON()))
	return 1
}

// fgText is a value as the script gave it, for messages: a string quoted,
// a number as written.
func fgText(v lua.LValue) string {
	if n, ok := v.(lua.LNumber); ok {
		return strconv.FormatFloat(float64(n), 'g', -1, 64)
	}
	return describe(v)
}

// fgQuantity reads key as a quantity of dimension dim and records its
// text and unit for messages about field f.
func (r *runner) fgQuantity(a *args, in *fgRead, key string, f combustion.ReadingField, dim units.Dimension, required bool) (float64, bool) {
	v := a.t.RawGetString(key)
	x, ok := a.quantity(key, dim, required)
	if ok {
		in.raw[key] = fgText(v)
		in.unitOf[f] = unitOfValue(v)
	}
	return x, ok
}

// unitOfValue is the canonical unit a quantity was written in ("" for a
// bare number).
func unitOfValue(v lua.LValue) string {
	s, ok := v.(lua.LString)
	if !ok {
		return ""
	}
	q, err := units.ParseAny(string(s), units.Options{})
	if err != nil {
		return ""
	}
	return q.Unit
}

// fgFuel reads fuel, fuel_analysis and lhv.
func (r *runner) fgFuel(a *args, in *fgRead) fuel.Fuel {
	var f fuel.Fuel
	name, hasGrade := a.str(fgFuel, false)
	if hasGrade {
		in.raw[fgFuel] = strconv.Quote(name)
		g, err := fuel.Grade(name)
		if err != nil {
			a.errorf(err, "fuel %q is not a built-in grade (grades: %s); give fuel_analysis for your own fuel", name, strings.Join(fuel.GradeNames(), ", "))
		}
		f = g
	} else {
		f = fuel.Fuel{Name: "own fuel (fuel_analysis)", Class: fuel.Residual}
	}
	switch v := a.get(fgAnalysis).(type) {
	case *lua.LTable:
		an, ok := r.fgAnalysis(a, v)
		in.unitOf[combustion.FieldAnalysis] = "%"
		in.raw[fgAnalysis] = "{...}"
		if ok && hasGrade {
			f = combustion.FuelWithAnalysis(f, an)
		} else if ok {
			f.Analysis = an
		}
	case *lua.LNilType:
		if !hasGrade && !a.has(fgFuel) {
			a.errorf(nil, "fuel is required: fuel = \"HSFO\" (grades: %s), or your own fuel by its analysis, fuel_analysis = { C = \"86 %%\", H = \"11 %%\", S = \"2.5 %%\", N = \"0.3 %%\", O = \"0.2 %%\" }",
				strings.Join(fuel.GradeNames(), ", "))
			a.markMissing(fgFuel)
		}
	default:
		a.errorf(nil, "fuel_analysis must be a table of mass fractions as fired, such as { C = \"86 %%\", H = \"11 %%\", S = \"2.5 %%\", N = \"0.3 %%\", O = \"0.2 %%\" }; got %s", describe(v))
	}
	if lhv, ok := r.fgQuantity(a, in, fgLHV, combustion.FieldLHV, units.SpecificEnergy, false); ok {
		f.SetLHV, f.SetLHVSource = lhv, "given with lhv"
	}
	return f
}

// fgAnalysisKeys are the keys of fuel_analysis: the ultimate analysis as
// fired, W the free water and A the ash.
var fgAnalysisKeys = [...]string{"C", "H", "S", "N", "O", "W", "A"}

// fgAnalysis reads fuel_analysis = { C = "86 %", ... }; a key left out
// counts as zero.
func (r *runner) fgAnalysis(a *args, t *lua.LTable) (fuel.Analysis, bool) {
	r.checkSize(t, "fuel_analysis")
	fa := r.args(t, "flue_gas fuel_analysis", a.pos, units.Options{})
	defer func() { a.nerr += fa.nerr }()
	var an fuel.Analysis
	to := [len(fgAnalysisKeys)]*float64{&an.C, &an.H, &an.S, &an.N, &an.O, &an.Water, &an.Ash}
	for i, k := range fgAnalysisKeys {
		if v, ok := fa.quantity(k, units.Fraction, false); ok {
			*to[i] = v
		}
	}
	fa.done()
	return an, fa.nerr == 0
}

// fgMeasurement reads the reading, the temperatures, the air and the
// losses.
func (r *runner) fgMeasurement(a *args, in *fgRead) {
	rd := &in.reading
	o2, hasO2 := r.fgQuantity(a, in, fgO2, combustion.FieldO2, units.Fraction, false)
	co2, hasCO2 := r.fgQuantity(a, in, fgCO2, combustion.FieldCO2, units.Fraction, false)
	switch {
	case hasO2 && hasCO2:
		a.errorf(nil, "give O2 or CO2, the one the analyser measured, not both")
	case hasO2:
		rd.Gas, rd.Dry = combustion.MeasuredO2, o2
	case hasCO2:
		rd.Gas, rd.Dry = combustion.MeasuredCO2, co2
	case !a.has(fgO2) && !a.has(fgCO2):
		a.errorf(nil, "O2 (or CO2) is required: the analyser's reading in the dry flue gas, such as O2 = \"3 %%\"")
		a.markMissing(fgO2)
	}
	rd.FlueT, _ = r.fgQuantity(a, in, fgT, combustion.FieldFlueT, units.Temperature, true)
	rd.AirT, _ = r.fgQuantity(a, in, fgAirT, combustion.FieldAirT, units.Temperature, true)
	r.fgHumidity(a, in)
	r.fgCO(a, in)
	var hasRad, hasLoad bool
	rd.RadiationAtMCR, hasRad = r.fgQuantity(a, in, fgRadiation, combustion.FieldRadiation, units.Fraction, false)
	rd.RadiationGiven = hasRad
	rd.Load, hasLoad = r.fgQuantity(a, in, fgLoad, combustion.FieldLoad, units.Fraction, false)
	if hasLoad && rd.Load == 0 {
		a.errorf(nil, "load = %s: the load must lie between 5 %% and 120 %% of MCR", in.raw[fgLoad])
	}
	rd.Solids, _ = r.fgQuantity(a, in, fgSolids, combustion.FieldSolids, units.Fraction, false)
	rd.AtomisingSteam, _ = r.fgQuantity(a, in, fgSteam, combustion.FieldAtomisingSteam, units.Fraction, false)
	rd.AtomisingSteamT, _ = r.fgQuantity(a, in, fgSteamT, combustion.FieldAtomisingSteamT, units.Temperature, false)
	var hasSO3 bool
	rd.SO3Conversion, hasSO3 = r.fgQuantity(a, in, fgSO3, combustion.FieldSO3, units.Fraction, false)
	if hasSO3 && rd.SO3Conversion == 0 {
		a.errorf(nil, "SO3_conversion = %s: the SO2 to SO3 conversion must be above 0 %% and at most 20 %% (1 %% to 5 %% is usual in oil firing)", in.raw[fgSO3])
	}
	var hasMargin bool
	in.settings.DewMargin, hasMargin = r.fgQuantity(a, in, fgDewMargin, combustion.FieldDewMargin, units.TemperatureDifference, false)
	if hasMargin && !(in.settings.DewMargin > 0) {
		a.errorf(nil, "dew_margin = %s: the margin to the acid dew point must be above 0 K and at most %g K", in.raw[fgDewMargin], combustion.MaxDewMargin)
	}
}

// fgHumidity reads humidity: a relative humidity ("60 %") or a humidity
// ratio in water per dry air ("0.012 kg/kg", "12 g/kg").
func (r *runner) fgHumidity(a *args, in *fgRead) {
	v := a.get(fgHumidity)
	if v == lua.LNil {
		return
	}
	in.raw[fgHumidity] = fgText(v)
	s, ok := v.(lua.LString)
	if !ok {
		a.errorf(nil, "humidity must be a relative humidity such as \"60 %%\" or a humidity ratio such as \"0.012 kg/kg\"; got %s", describe(v))
		return
	}
	text := strings.TrimSpace(string(s))
	for _, u := range [...]struct {
		suffix string
		scale  float64
	}{{"kg/kg", 1}, {"g/kg", 1e-3}} {
		if num, ok := strings.CutSuffix(text, u.suffix); ok {
			x, err := strconv.ParseFloat(strings.TrimSpace(num), 64)
			if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
				a.errorf(nil, "humidity = %s: want a number before %s, such as \"0.012 kg/kg\"", in.raw[fgHumidity], u.suffix)
				return
			}
			in.reading.Humidity = x * u.scale
			return
		}
	}
	q, err := units.ParseAny(text, units.Options{})
	if err != nil || q.Dim != units.Fraction || q.Unit != "%" {
		a.errorf(nil, "humidity = %s: want a relative humidity such as \"60 %%\" or a humidity ratio such as \"0.012 kg/kg\"", in.raw[fgHumidity])
		return
	}
	in.reading.RelativeHumidity = q.Value
	in.unitOf[combustion.FieldRelativeHumidity] = "%"
}

// fgCO reads CO in ppm ("50 ppm") or percent ("0.005 %") of the dry flue
// gas.
func (r *runner) fgCO(a *args, in *fgRead) {
	v := a.get(fgCO)
	if v == lua.LNil {
		return
	}
	in.raw[fgCO] = fgText(v)
	if s, ok := v.(lua.LString); ok {
		text := strings.TrimSpace(string(s))
		if num, ok := strings.CutSuffix(text, "ppm"); ok {
			x, err := strconv.ParseFloat(strings.TrimSpace(num), 64)
			if err == nil && !math.IsNaN(x) && !math.IsInf(x, 0) {
				in.reading.COppmDry = x
				in.unitOf[combustion.FieldCO] = "ppm"
				return
			}
		} else if q, err := units.ParseAny(text, units.Options{}); err == nil && q.Dim == units.Fraction && q.Unit == "%" {
			in.reading.COppmDry = q.Value * 1e6
			in.unitOf[combustion.FieldCO] = "%"
			return
		}
	}
	a.errorf(nil, "CO = %s: want ppm or a percentage of the dry flue gas, such as \"50 ppm\" or \"0.005 %%\"", in.raw[fgCO])
}
