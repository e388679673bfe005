package scripting

import (
	"encoding/json"
	"errors"
	"fmt"
	"math"
	"sort"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant"
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
	}
	return parseQuantity(val, name, k.Dim, uopt)
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
		L.Push(r.resultTable(ph.p.Outline(name, c.Conditions).JSON()))
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
			r.raise(&Error{Pos: pos, Unit: a.what, Msg: fmt.Sprintf("no balance found (%s): %v", se.Status, se.Err), Err: err})
		}
		r.addPlantErrIn(ph, err, a.what, fmt.Sprintf(" (solving %s at %s)", a.what, pos))
		r.raise(stopRun{})
	}
	ph.checked = true
	r.out.Cases = append(r.out.Cases, CaseRecord{Plant: ph.p.Name, Pos: pos, Result: res})
	L.Push(r.resultTable(res.JSON()))
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
			f, err := parseSetting(val, k, fmt.Sprintf("set.%s.%s", unit, k.Name), ph.uopt)
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

// resultTable turns a case result into a Lua table mirroring its JSON.
func (r *runner) resultTable(j plant.CaseJSON) lua.LValue {
	b, err := json.Marshal(j)
	if err != nil {
		r.fail("", "case %q: result not representable: %v", j.Name, err)
	}
	var v any
	if err := json.Unmarshal(b, &v); err != nil {
		r.fail("", "case %q: result not representable: %v", j.Name, err)
	}
	return r.toLua(v)
}

func (r *runner) toLua(v any) lua.LValue {
	switch x := v.(type) {
	case nil:
		return lua.LNil
	case bool:
		return lua.LBool(x)
	case float64:
		return lua.LNumber(x)
	case string:
		return lua.LString(x)
	case []any:
		t := r.L.CreateTable(len(x), 0)
		for _, e := range x {
			t.Append(r.toLua(e))
		}
		return t
	case map[string]any:
		t := r.L.CreateTable(0, len(x))
		keys := make([]string, 0, len(x))
		for k := range x {
			keys = append(keys, k)
		}
		sort.Strings(keys)
		for _, k := range keys {
			t.RawSetString(k, r.toLua(x[k]))
		}
		return t
	}
	return lua.LString(fmt.Sprint(v))
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
