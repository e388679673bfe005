package scripting

import (
	"errors"
	"fmt"
	"math"
	"reflect"
	"sort"
	"strings"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant"
	"steamcase/plant/schema"
	"steamcase/plant/units"
)

// setKey is a key a case may set for a unit kind: the script's key, the
// plant's parameter, and how the value is read.
type setKey struct {
	key, param string
	dim        units.Dimension // zero: see how
	how        int
	// model, when set, is a parameter of a loads model rather than of
	// the plant: it returns a pointer to the field to set for the case.
	model func(u plant.Unit) *float64
}

const (
	setQuantity = iota
	setBool
	setPressureDiff
)

// caseKeys are the keys case{set = {...}} accepts, by unit kind. They are
// the constructor's keys of the same meaning.
var caseKeys = map[string][]setKey{
	"consumer": {
		{key: "duty", param: "duty", dim: units.Power},
		{key: "steam", param: "steam_flow", dim: units.MassFlow},
		{key: "returns", param: "return_fraction", dim: units.Fraction},
		{key: "subcool", param: "subcooling", dim: units.TemperatureDifference},
		{key: "return_T", param: "return_T", dim: units.Temperature},
		{key: "off", param: "off", how: setBool},
		{key: "factor", param: "factor", dim: units.Fraction},
	},
	"turbine":          {{key: "power", param: "power", dim: units.Power}, {key: "off", param: "off", how: setBool}},
	"boiler":           {{key: "mcr", param: "mcr", dim: units.MassFlow}, {key: "drum", param: "drum_p", dim: units.Pressure}, {key: "dryness", param: "dryness", dim: units.Fraction}, {key: "blowdown", param: "blowdown", dim: units.Fraction}, {key: "eta_factor", param: "eta_factor", dim: units.Fraction}},
	"feed_tank":        {{key: "heat_loss", param: "heat_loss", dim: units.Power}, {key: "set_T", param: "set_T", dim: units.Temperature}, {key: "room_T", param: "room_T", dim: units.Temperature}},
	"observation_tank": {{key: "heat_loss", param: "heat_loss", dim: units.Power}, {key: "room_T", param: "room_T", dim: units.Temperature}},
	"feed_pump":        {{key: "eta", param: "eta", dim: units.Fraction}, {key: "margin", param: "margin", how: setPressureDiff}},
	"header":           {{key: "heat_loss", param: "heat_loss", dim: units.Power}},
	"reducing_valve":   {{key: "p", param: "p", dim: units.Pressure}},
	"makeup":           {{key: "T", param: "T", dim: units.Temperature}},
	"condenser":        {{key: "subcool", param: "subcooling", dim: units.TemperatureDifference}},
	"exhaust_gas_economiser": {{key: "off", param: "off", how: setBool}, {key: "ua", param: "ua", dim: units.ThermalConductance},
		{key: "preheat_ua", param: "preheat_ua", dim: units.ThermalConductance}},
	"economiser": {{key: "ua", param: "ua", dim: units.ThermalConductance}},
}

// modelKeys are the case keys of consumers driven by a loads model: they
// may be switched off; their duty comes from the model.
var modelKeys = []setKey{
	{key: "returns", param: "return_fraction", dim: units.Fraction},
	{key: "subcool", param: "subcooling", dim: units.TemperatureDifference},
	{key: "off", param: "off", how: setBool},
	{key: "factor", param: "factor", dim: units.Fraction},
}

// loadsKeys are the case keys of the loads models besides modelKeys.
var loadsKeys = map[string][]setKey{
	"tank_heating": {
		{key: "T", dim: units.Temperature, model: func(u plant.Unit) *float64 { return &tankOf(u).t.To }},
		{key: "to", dim: units.Temperature, model: func(u plant.Unit) *float64 { return &tankOf(u).t.To }},
		{key: "from", dim: units.Temperature, model: func(u plant.Unit) *float64 { return &tankOf(u).t.From }},
		{key: "duration", dim: units.Time, model: func(u plant.Unit) *float64 { return &tankOf(u).t.Duration }},
	},
	"tank_cleaning": {
		{key: "flow", dim: units.MassFlow, model: func(u plant.Unit) *float64 { return &cleaningOf(u).t.Flow }},
		{key: "outlet_T", dim: units.Temperature, model: func(u plant.Unit) *float64 { return &cleaningOf(u).t.OutletT }},
	},
	"accommodation": {
		{key: "inside_T", dim: units.Temperature, model: func(u plant.Unit) *float64 { return &accommodationOf(u).a.InsideT }},
	},
}

func tankOf(u plant.Unit) *tankModel { return u.(*plant.Consumer).Model.(*tankModel) }
func cleaningOf(u plant.Unit) *cleaningModel {
	return u.(*plant.Consumer).Model.(*cleaningModel)
}
func accommodationOf(u plant.Unit) *accommodationModel {
	return u.(*plant.Consumer).Model.(*accommodationModel)
}

// modelSetting is a case's value for a field of a loads model.
type modelSetting struct {
	ptr *float64
	v   float64
}

func (r *runner) keysFor(ph *plantHandle, unit string) []setKey {
	kind := ph.kinds[unit]
	switch kind {
	case "cargo_pump":
		kind = "turbine"
	case "steam_tracing", "fresh_water_generator", "soot_blowing":
		kind = "consumer" // a duty or steam flow fixed when declared
	}
	if k, ok := caseKeys[kind]; ok {
		return k
	}
	if ph.broken[unit] {
		return modelKeys
	}
	return append(modelKeys[:len(modelKeys):len(modelKeys)], loadsKeys[kind]...)
}

// luaCase is case(plant, { name, sea, air, engine, set, fire }).
func (r *runner) luaCase(L *lua.LState) int {
	ph := r.checkPlant(1)
	t := r.checkTable(2, "case")
	pos := r.where()
	if r.nCases >= r.opt.MaxCases {
		r.fail("", "more than %d load cases in one run", r.opt.MaxCases)
	}
	r.nCases++
	ph.nCases++
	r.checkSize(t, "case")
	a := r.args(t, "case", pos, ph.uopt)
	name, ok := a.str("name", false)
	if !ok {
		name = fmt.Sprintf("case %d", ph.nCases)
	}
	a.what = fmt.Sprintf("case %q", name)
	c := plant.Case{Name: name, Pos: plant.Pos{File: pos.File, Line: pos.Line}}
	c.Conditions.SeaT, _ = a.quantity("sea", units.Temperature, false)
	c.Conditions.AirT, _ = a.quantity("air", units.Temperature, false)
	c.Conditions.EngineLoad, _ = a.quantity("engine", units.Fraction, false)
	var models []modelSetting
	if v := a.get("set"); v != lua.LNil {
		c.Set, models = r.caseSettings(ph, a, v, c.Pos)
	}
	if a.has("fire") {
		c.Fire = a.names("fire")
		if c.Fire == nil {
			c.Fire = []string{}
		}
		for _, b := range c.Fire {
			if ph.kinds[b] != "boiler" {
				msg := fmt.Sprintf("fire: %q is not a boiler of the plant", b)
				if s := suggest(b, ph.boilerNames()); s != "" {
					msg += fmt.Sprintf("; did you mean %q?", s)
				}
				a.errorf(nil, "%s", msg)
			}
		}
	}
	a.done()

	r.flushLines(ph)
	if r.opt.CheckOnly {
		r.checkPlantOnce(ph)
		r.out.Cases = append(r.out.Cases, CaseRecord{Plant: ph.p.Name, Pos: pos})
		L.Push(r.resultTable(placeholder(ph, name, pos, c.Conditions)))
		return 1
	}
	if r.emptyPlant(ph) || len(r.errs) > 0 {
		r.raise(stopRun{})
	}
	// The loads models' fields hold for this case only.
	for i := range models {
		m := &models[i]
		*m.ptr, m.v = m.v, *m.ptr
	}
	defer func() {
		for _, m := range models {
			*m.ptr = m.v
		}
	}()
	res, err := ph.p.Solve(L.Context(), c)
	if err != nil {
		if lerr := r.limitErr(pos); lerr != nil {
			r.raise(&Error{Pos: pos, Msg: lerr.Error(), Err: lerr})
		}
		ph.checked = true
		var se *plant.SolveError
		if errors.As(err, &se) {
			r.raise(&Error{Pos: pos, Unit: a.what, Msg: fmt.Sprintf("no balance found (%s): %v", se.Status, se.Err), Err: err})
		}
		r.addPlantErrIn(ph, err, a.what, fmt.Sprintf(" (solving %s at %s)", a.what, pos))
		r.raise(stopRun{})
	}
	ph.checked = true
	r.out.Cases = append(r.out.Cases, CaseRecord{Plant: ph.p.Name, Pos: pos, Result: res})
	L.Push(r.resultTable(schema.NewCase(ph.p.Name, res)))
	return 1
}

func (ph *plantHandle) boilerNames() []string {
	var out []string
	for _, u := range ph.p.Units() {
		if ph.kinds[u.UnitName()] == "boiler" {
			out = append(out, u.UnitName())
		}
	}
	return out
}

// caseSettings reads set = { unit = { key = value, ... }, ... }.
func (r *runner) caseSettings(ph *plantHandle, a *args, v lua.LValue, pos plant.Pos) ([]plant.Setting, []modelSetting) {
	t, ok := v.(*lua.LTable)
	if !ok {
		a.errorf(nil, "set must be a table of units, such as set = { galley = { duty = \"60 kW\" } }; got %s", describe(v))
		return nil, nil
	}
	var models []modelSetting
	r.checkSize(t, "set")
	var units_ []string
	t.ForEach(func(k, _ lua.LValue) {
		if s, ok := k.(lua.LString); ok {
			units_ = append(units_, string(s))
		} else {
			a.errorf(nil, "set: keys must be unit names; got %s", describe(k))
		}
	})
	sort.Strings(units_)
	var out []plant.Setting
	for _, unit := range units_ {
		ut, ok := t.RawGetString(unit).(*lua.LTable)
		if !ok {
			a.errorf(nil, "set.%s must be a table of keys, such as { off = true }", unit)
			continue
		}
		if ph.p.Unit(unit) == nil {
			a.errorf(nil, "set: %s", r.unknownUnitMsg(ph, unit))
			continue
		}
		r.checkSize(ut, "set."+unit)
		keys := r.keysFor(ph, unit)
		var accepted []string
		for _, k := range keys {
			accepted = append(accepted, k.key)
		}
		sub := r.args(ut, a.what, a.pos, ph.uopt)
		for _, k := range keys {
			val := sub.get(k.key)
			if val == lua.LNil {
				continue
			}
			key := fmt.Sprintf("set.%s.%s", unit, k.key)
			var f float64
			var err error
			switch k.how {
			case setBool:
				b, isBool := val.(lua.LBool)
				if !isBool {
					err = fmt.Errorf("%s must be true or false; got %s", key, describe(val))
				} else if b {
					f = 1
				}
			case setPressureDiff:
				f, err = parsePressureDiff(val, key)
			default:
				f, err = parseQuantity(val, key, k.dim, ph.uopt)
			}
			if err != nil {
				sub.errorf(err, "%v", err)
				continue
			}
			if k.model != nil {
				models = append(models, modelSetting{ptr: k.model(ph.p.Unit(unit)), v: f})
				continue
			}
			out = append(out, plant.Setting{Unit: unit, Param: k.param, Value: f, Pos: pos})
			if k.param == "duty" {
				// a duty replaces a set steam flow
				out = append(out, plant.Setting{Unit: unit, Param: "steam_flow", Value: 0, Pos: pos})
			}
		}
		for _, k := range r.unknownKeys(ut, accepted) {
			sub.errorf(nil, "set.%s: %s", unit, unknownKeyMsg(k, accepted))
		}
		a.nerr += sub.nerr
	}
	return out, models
}

// checkPlantOnce runs the plant's own checks (graph, parameters, degrees
// of freedom) once and collects its faults.
func (r *runner) checkPlantOnce(ph *plantHandle) {
	if ph.checked {
		return
	}
	ph.checked = true
	r.flushLines(ph)
	if r.emptyPlant(ph) {
		return
	}
	if err := ph.p.Check(); err != nil {
		r.addPlantErr(ph, err, fmt.Sprintf("plant %q", ph.p.Name))
	}
}

// emptyPlant reports a plant without units or lines as an error. The
// plant package cannot check such a plant (its system has no unknowns).
func (r *runner) emptyPlant(ph *plantHandle) bool {
	what := fmt.Sprintf("plant %q", ph.p.Name)
	switch {
	case len(ph.p.Units()) == 0:
		r.errs = append(r.errs, &Error{Pos: ph.pos, Unit: what, Msg: "has no units; declare them with ship:boiler{...} and the like"})
	case len(ph.p.Lines()) == 0:
		r.errs = append(r.errs, &Error{Pos: ph.pos, Unit: what, Msg: "has no lines; join its units with ship:line(name, \"from.port\", \"to.port\")"})
	default:
		return false
	}
	return true
}

// finish checks every plant that no case has checked yet.
func (r *runner) finish() error {
	for _, ph := range r.plants {
		r.flushLines(ph)
		if !ph.checked {
			r.checkPlantOnce(ph)
		}
	}
	return nil
}

// placeholder is the result of a case in check mode: the right shape,
// zero figures (the conditions as given).
func placeholder(ph *plantHandle, name string, pos Pos, c plant.Conditions) schema.Case {
	cr := &plant.CaseResult{Name: name, Pos: plant.Pos{File: pos.File, Line: pos.Line}, Conditions: c}
	for _, u := range ph.p.Units() {
		switch v := u.(type) {
		case *plant.Boiler:
			cr.Boilers = append(cr.Boilers, plant.BoilerResult{Name: v.Name, FuelName: v.Fuel.Name})
		case *plant.Consumer:
			cr.Consumers = append(cr.Consumers, plant.ConsumerResult{Name: u.UnitName(), Kind: u.Kind()})
		case *plant.Turbine: // a consumer of steam with its own figures, as solved
			cr.Consumers = append(cr.Consumers, plant.ConsumerResult{Name: u.UnitName(), Kind: u.Kind()})
			cr.Units = append(cr.Units, plant.UnitResult{Name: u.UnitName(), Kind: u.Kind()})
		case *plant.ExhaustGasEconomiser:
			cr.EGEs = append(cr.EGEs, plant.EGEResult{Name: v.Name})
		default:
			cr.Units = append(cr.Units, plant.UnitResult{Name: u.UnitName(), Kind: u.Kind()})
		}
	}
	for _, l := range ph.p.Lines() {
		cr.Lines = append(cr.Lines, plant.LineResult{Name: l.Name})
	}
	return schema.NewCase(ph.p.Name, cr)
}

// resultTable is what case() returns: the case's schema object (package
// plant/schema) as a Lua table, with exactly its JSON keys.
func (r *runner) resultTable(c schema.Case) *lua.LTable {
	return r.schemaTable(fmt.Sprintf("case %q", c.Name), c)
}

// schemaTable turns v, an object of package plant/schema, into a Lua table
// with the keys and values of its JSON form: a walk of its fields by their
// JSON tags, as encoding/json reads them. A nil pointer or slice (null in
// the JSON) is nil, so the key is absent; a field tagged omitempty is left
// out when empty; an embedded struct's keys are the object's own; a list
// is a sequence from 1; a map's keys are set in sorted order (so that
// pairs() goes the same way every run). A test (TestLuaKeysAreJSONKeys)
// compares the keys with the JSON's. The walk costs a fraction of going
// through the JSON text and back (see BenchmarkVoyageTable).
func (r *runner) schemaTable(what string, v any) *lua.LTable {
	lv, err := r.luaOf(reflect.ValueOf(v))
	if err != nil {
		r.fail("", "%s: result not representable: %v", what, err)
	}
	t, ok := lv.(*lua.LTable)
	if !ok {
		r.fail("", "%s: result not representable: a %T, not a table", what, v)
	}
	return t
}

// luaOf is the Lua form of a value of the schema.
func (r *runner) luaOf(v reflect.Value) (lua.LValue, error) {
	switch v.Kind() {
	case reflect.Pointer, reflect.Interface:
		if v.IsNil() {
			return lua.LNil, nil
		}
		return r.luaOf(v.Elem())
	case reflect.Bool:
		return lua.LBool(v.Bool()), nil
	case reflect.String:
		return lua.LString(v.String()), nil
	case reflect.Int, reflect.Int8, reflect.Int16, reflect.Int32, reflect.Int64:
		return lua.LNumber(v.Int()), nil
	case reflect.Uint, reflect.Uint8, reflect.Uint16, reflect.Uint32, reflect.Uint64:
		return lua.LNumber(v.Uint()), nil
	case reflect.Float32, reflect.Float64:
		f := v.Float()
		if math.IsNaN(f) || math.IsInf(f, 0) {
			return nil, fmt.Errorf("a figure is %g", f)
		}
		return lua.LNumber(f), nil
	case reflect.Slice, reflect.Array:
		if v.Kind() == reflect.Slice && v.IsNil() {
			return lua.LNil, nil
		}
		t := r.L.CreateTable(v.Len(), 0)
		for i := range v.Len() {
			e, err := r.luaOf(v.Index(i))
			if err != nil {
				return nil, err
			}
			t.Append(e)
		}
		return t, nil
	case reflect.Map:
		if v.IsNil() {
			return lua.LNil, nil
		}
		if v.Type().Key().Kind() != reflect.String {
			return nil, fmt.Errorf("a map keyed by %s", v.Type().Key())
		}
		keys := make([]string, 0, v.Len())
		for _, k := range v.MapKeys() {
			keys = append(keys, k.String())
		}
		sort.Strings(keys)
		t := r.L.CreateTable(0, len(keys))
		for _, k := range keys {
			e, err := r.luaOf(v.MapIndex(reflect.ValueOf(k).Convert(v.Type().Key())))
			if err != nil {
				return nil, err
			}
			t.RawSetString(k, e)
		}
		return t, nil
	case reflect.Struct:
		t := r.L.CreateTable(0, v.NumField())
		if err := r.luaFields(t, v); err != nil {
			return nil, err
		}
		return t, nil
	}
	return nil, fmt.Errorf("a %s has no Lua form", v.Type())
}

// luaFields sets in t the fields of the struct v under their JSON keys.
func (r *runner) luaFields(t *lua.LTable, v reflect.Value) error {
	rt := v.Type()
	for i := range rt.NumField() {
		f := rt.Field(i)
		tag := f.Tag.Get("json")
		if f.Anonymous && tag == "" && f.Type.Kind() == reflect.Struct {
			if err := r.luaFields(t, v.Field(i)); err != nil {
				return err
			}
			continue
		}
		name, opts, _ := strings.Cut(tag, ",")
		if !f.IsExported() || name == "-" {
			continue
		}
		if name == "" {
			name = f.Name
		}
		fv := v.Field(i)
		if opts != "" && omitEmpty(opts) && emptyJSON(fv) {
			continue
		}
		e, err := r.luaOf(fv)
		if err != nil {
			return fmt.Errorf("%s: %w", name, err)
		}
		if e != lua.LNil {
			t.RawSetString(name, e)
		}
	}
	return nil
}

// omitEmpty reports whether the options of a JSON tag ("omitempty,string")
// hold omitempty.
func omitEmpty(opts string) bool {
	for o := range strings.SplitSeq(opts, ",") {
		if o == "omitempty" {
			return true
		}
	}
	return false
}

// emptyJSON reports whether encoding/json's omitempty leaves v out.
func emptyJSON(v reflect.Value) bool {
	switch v.Kind() {
	case reflect.Array, reflect.Map, reflect.Slice, reflect.String:
		return v.Len() == 0
	case reflect.Pointer, reflect.Interface:
		return v.IsNil()
	}
	return v.IsZero()
}

// luaCheck is check(cond, "message"): in a run, a false or nil cond stops
// it with an *AssertionError; in check mode it only counts.
func (r *runner) luaCheck(L *lua.LState) int {
	if L.GetTop() < 1 {
		r.fail("", "check(cond, \"message\") needs a condition")
	}
	cond := lua.LVAsBool(L.Get(1))
	msg := "condition is false"
	if L.GetTop() >= 2 {
		msg = L.ToStringMeta(L.Get(2)).String()
		if len(msg) > 4096 {
			msg = msg[:4096] + "…"
		}
	}
	if !cond && !r.opt.CheckOnly {
		r.raise(&AssertionError{Pos: r.where(), Msg: msg})
	}
	r.out.Checks++
	return 0
}

// luaToNumber is to_number("18 t/h", "kg/h"): the quantity in the unit
// asked for, as a number.
func (r *runner) luaToNumber(L *lua.LState) int {
	q := L.Get(1)
	unit := L.CheckString(2)
	u, err := units.Lookup(unit)
	if err != nil {
		r.failErr("", err, "to_number: %v", err)
	}
	var si float64
	if n, ok := q.(lua.LNumber); ok && u.Dim == units.Fraction {
		si = float64(n)
	} else {
		si, err = parseQuantity(q, "to_number", u.Dim, units.Options{})
		if err != nil {
			r.failErr("", err, "%v", err)
		}
	}
	v, err := units.FromSI(si, unit)
	if err != nil || math.IsNaN(v) {
		r.failErr("", err, "to_number: %v", err)
	}
	L.Push(lua.LNumber(v))
	return 1
}
