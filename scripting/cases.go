package scripting

import (
	"errors"
	"fmt"
	"math"
	"reflect"
	"sort"
	"strconv"
	"strings"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant"
	"steamcase/plant/schema"
	"steamcase/plant/units"
)

// caseKeys are the keys a case (and a job's row) may set for a unit: its
// registry keys that a case may change, in the registry's order.
func (r *runner) caseKeys(ph *plantHandle, unit string) []plant.Key {
	u := ph.p.Component(unit)
	if u == nil {
		return nil
	}
	var out []plant.Key
	for _, k := range u.Keys() {
		if k.Case && k.Settable() {
			out = append(out, k)
		}
	}
	return out
}

// parseSetting reads a case's value of key k, in SI (1 or 0 for a flag,
// the index of a choice).
func parseSetting(val lua.LValue, k *plant.Key, name string, uopt units.Options) (float64, error) {
	switch k.Kind {
	case plant.KeyFlag:
		b, isBool := val.(lua.LBool)
		if !isBool {
			return 0, fmt.Errorf("%s must be true or false; got %s", name, describe(val))
		}
		if b {
			return 1, nil
		}
		return 0, nil
	case plant.KeyPressureDiff:
		return parsePressureDiff(val, name)
	case plant.KeyChoice:
		s, ok := val.(lua.LString)
		if ok {
			for i, c := range k.Choices {
				if c == string(s) {
					return float64(i), nil
				}
			}
		}
		return 0, fmt.Errorf("%s must be %s; got %s", name, choiceList(k.Choices), describe(val))
	case plant.KeyNumber:
		n, ok := val.(lua.LNumber)
		if !ok || math.IsNaN(float64(n)) || math.IsInf(float64(n), 0) {
			return 0, fmt.Errorf("%s must be a finite number; got %s", name, describe(val))
		}
		return float64(n), nil
	case plant.KeyRank:
		return parseRank(val, k, name)
	}
	return parseQuantity(val, name, k.Dim, uopt)
}

// parseRank reads a number or a named level (a consumer's priority): a
// Lua number, a string holding a number (a CSV cell), or one of the key's
// level names.
func parseRank(val lua.LValue, k *plant.Key, name string) (float64, error) {
	var f float64
	switch v := val.(type) {
	case lua.LNumber:
		f = float64(v)
	case lua.LString:
		if l, ok := k.Level(string(v)); ok {
			return l, nil
		}
		g, err := strconv.ParseFloat(strings.TrimSpace(string(v)), 64)
		if err != nil {
			msg := fmt.Sprintf("%s must be a number from %g to %g or one of %s; got %q", name, k.Min, k.Max, choiceList(k.Choices), string(v))
			if s := suggest(string(v), k.Choices); s != "" {
				msg += fmt.Sprintf("; did you mean %q?", s)
			}
			return 0, errors.New(msg)
		}
		f = g
	default:
		return 0, fmt.Errorf("%s must be a number from %g to %g or one of %s; got %s", name, k.Min, k.Max, choiceList(k.Choices), describe(val))
	}
	if !(f >= k.Min && f <= k.Max) {
		return 0, fmt.Errorf("%s must be a number from %g to %g or one of %s; got %g", name, k.Min, k.Max, choiceList(k.Choices), f)
	}
	return f, nil
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
	c.Series, _ = a.str("series", false)
	c.Conditions.SeaT, _ = a.quantity("sea", units.Temperature, false)
	c.Conditions.AirT, _ = a.quantity("air", units.Temperature, false)
	c.Conditions.EngineLoad = a.engineLoad()
	if v := a.get("set"); v != lua.LNil {
		c.Set = r.caseSettings(ph, a, v, c.Pos)
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
		cr := ph.p.Outline(name, c.Conditions)
		cr.Pos, cr.Series = c.Pos, c.Series
		L.Push(r.resultTable(schema.NewCase(ph.p.Name, cr)))
		return 1
	}
	if r.emptyPlant(ph) || len(r.errs) > 0 {
		r.raise(stopRun{})
	}
	res, err := ph.p.Solve(L.Context(), c)
	if err != nil {
		if lerr := r.limitErr(pos); lerr != nil {
			r.raise(&Error{Pos: pos, Msg: lerr.Error(), Err: lerr})
		}
		ph.checked = true
		var se *plant.SolveError
		if errors.As(err, &se) {
			r.raise(&Error{Pos: pos, Unit: a.what, Msg: se.Reason(), Err: err})
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
	for _, u := range ph.p.Components() {
		if ph.kinds[u.Ident().Name] == "boiler" {
			out = append(out, u.Ident().Name)
		}
	}
	return out
}

// caseSettings reads set = { unit = { key = value, ... }, ... }.
func (r *runner) caseSettings(ph *plantHandle, a *args, v lua.LValue, pos plant.Pos) []plant.Setting {
	t, ok := v.(*lua.LTable)
	if !ok {
		a.errorf(nil, "set must be a table of units, such as set = { galley = { duty = \"60 kW\" } }; got %s", describe(v))
		return nil
	}
	r.checkSize(t, "set")
	var names []string
	t.ForEach(func(k, _ lua.LValue) {
		if s, ok := k.(lua.LString); ok {
			names = append(names, string(s))
		} else {
			a.errorf(nil, "set: keys must be unit names; got %s", describe(k))
		}
	})
	sort.Strings(names)
	var out []plant.Setting
	for _, unit := range names {
		ut, ok := t.RawGetString(unit).(*lua.LTable)
		if !ok {
			a.errorf(nil, "set.%s must be a table of keys, such as { off = true }", unit)
			continue
		}
		if ph.p.Component(unit) == nil {
			a.errorf(nil, "set: %s", r.unknownUnitMsg(ph, unit))
			continue
		}
		r.checkSize(ut, "set."+unit)
		keys := r.caseKeys(ph, unit)
		var accepted []string
		for _, k := range keys {
			accepted = append(accepted, k.Name)
		}
		sub := r.args(ut, a.what, a.pos, ph.uopt)
		for i := range keys {
			k := &keys[i]
			val := sub.get(k.Name)
			if val == lua.LNil {
				continue
			}
			name := fmt.Sprintf("set.%s.%s", unit, k.Name)
			if k.Kind == plant.KeyText {
				s, ok := val.(lua.LString)
				if !ok {
					sub.errorf(nil, "%s must be a string such as %s; got %s", name, k.Example, describe(val))
					continue
				}
				out = append(out, plant.Setting{Unit: unit, Param: k.Name, Text: string(s), Pos: pos})
				continue
			}
			f, err := parseSetting(val, k, name, ph.uopt)
			if err == nil {
				err = rangeErr(k, name, f, val)
			}
			if err != nil {
				sub.errorf(err, "%v", err)
				continue
			}
			out = append(out, plant.Setting{Unit: unit, Param: k.Name, Value: f, Pos: pos})
		}
		for _, k := range r.unknownKeys(ut, accepted) {
			sub.errorf(nil, "set.%s: %s", unit, unknownKeyMsg(k, accepted))
		}
		a.nerr += sub.nerr
	}
	return out
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
	case len(ph.p.Components()) == 0:
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
	for _, f := range r.fieldsOf(v.Type()) {
		fv := v.Field(f.index)
		if f.name == "" {
			if err := r.luaFields(t, fv); err != nil {
				return err
			}
			continue
		}
		if f.omitEmpty && emptyJSON(fv) {
			continue
		}
		e, err := r.luaOf(fv)
		if err != nil {
			return fmt.Errorf("%s: %w", f.name, err)
		}
		if e != lua.LNil {
			t.RawSetString(f.name, e)
		}
	}
	return nil
}

// luaField is how a field of a struct of the schema goes into its Lua
// table: the field's index, its JSON key ("" for an embedded struct whose
// keys are the object's own) and whether it is tagged omitempty.
type luaField struct {
	index     int
	name      string
	omitEmpty bool
}

// fieldsOf returns the fields of the struct type rt as luaFields reads
// them, in order, from the run's cache: a table of many rows reads each
// type's tags once.
func (r *runner) fieldsOf(rt reflect.Type) []luaField {
	if fs, ok := r.fields[rt]; ok {
		return fs
	}
	var fs []luaField
	for i := range rt.NumField() {
		f := rt.Field(i)
		tag := f.Tag.Get("json")
		if f.Anonymous && tag == "" && f.Type.Kind() == reflect.Struct {
			fs = append(fs, luaField{index: i})
			continue
		}
		name, opts, _ := strings.Cut(tag, ",")
		if !f.IsExported() || name == "-" {
			continue
		}
		if name == "" {
			name = f.Name
		}
		fs = append(fs, luaField{index: i, name: name, omitEmpty: opts != "" && omitEmpty(opts)})
	}
	if r.fields == nil {
		r.fields = map[reflect.Type][]luaField{}
	}
	r.fields[rt] = fs
	return fs
}

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
