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
		L.Push(r.resultTable(placeholder(ph, name, c.Conditions)))
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
	L.Push(r.resultTable(res.JSON()))
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

// placeholder is the result of a case in check mode: the right shape, zero
// figures.
func placeholder(ph *plantHandle, name string, c plant.Conditions) plant.CaseJSON {
	j := plant.CaseJSON{Name: name, SeaTK: c.SeaT, AirTK: c.AirT, EngineLoad: c.EngineLoad,
		Boilers: []plant.BoilerJSON{}, Consumers: []plant.ConsumerJSON{}, Units: []plant.UnitJSON{}, Lines: []plant.LineJSON{}, Warnings: []string{}}
	for _, u := range ph.p.Units() {
		switch v := u.(type) {
		case *plant.Boiler:
			j.Boilers = append(j.Boilers, plant.BoilerJSON{Name: v.Name, Fuel: v.Fuel.Name})
		case *plant.Consumer, *plant.Turbine:
			j.Consumers = append(j.Consumers, plant.ConsumerJSON{Name: u.UnitName(), Kind: u.Kind()})
		default:
			j.Units = append(j.Units, plant.UnitJSON{Name: u.UnitName(), Kind: u.Kind(), Figures: []plant.FigureJSON{}})
		}
	}
	for _, l := range ph.p.Lines() {
		j.Lines = append(j.Lines, plant.LineJSON{Name: l.Name})
	}
	return j
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
