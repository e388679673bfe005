package scripting

import (
	"errors"
	"fmt"
	"sort"
	"strings"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant"
	"steamcase/plant/fuel"
	"steamcase/plant/units"
)

// plantHandle is a plant as the script sees it.
type plantHandle struct {
	p     *plant.Plant
	pos   Pos
	uopt  units.Options
	kinds map[string]string // unit name -> script kind ("boiler")
	// broken are units whose table had errors: the plant's own checks of
	// them would only repeat those errors.
	broken map[string]bool
	// badLines are lines already reported by the binding; badEnds the
	// ports they named (or likely meant), whose "not connected" faults
	// would repeat the report.
	badLines map[string]bool
	badEnds  map[string]bool // "unit\x00port"; port "*" for any
	pending  []pendingLine
	nLines   int
	checked  bool
	nCases   int
}

type pendingLine struct {
	name     string
	pos      Pos
	from, to string
}

const plantTypeName = "steamcase.plant"

// register installs the script API in the interpreter's globals.
func (r *runner) register() {
	L := r.L
	r.errMT = L.NewTable()
	r.errMT.RawSetString("__tostring", L.NewFunction(errString))

	mt := L.NewTypeMetatable(plantTypeName)
	methods := L.NewTable()
	for _, kind := range r.opt.Kinds {
		methods.RawSetString(kind.Name, L.NewFunction(r.unitMethod(kind)))
	}
	methods.RawSetString("line", L.NewFunction(r.luaLine))
	mt.RawSetString("__index", L.NewFunction(func(L *lua.LState) int {
		ph := r.checkPlant(1)
		key := L.CheckString(2)
		if key == "name" {
			L.Push(lua.LString(ph.p.Name))
			return 1
		}
		if m := methods.RawGetString(key); m != lua.LNil {
			L.Push(m)
			return 1
		}
		r.fail(fmt.Sprintf("plant %q", ph.p.Name), "%s", unknownMethodMsg(key, methods))
		return 0
	}))
	mt.RawSetString("__tostring", L.NewFunction(func(L *lua.LState) int {
		L.Push(lua.LString(fmt.Sprintf("plant %q", r.checkPlant(1).p.Name)))
		return 1
	}))
	mt.RawSetString("__metatable", lua.LString("locked"))

	L.SetGlobal("plant", L.NewFunction(r.luaPlant))
	L.SetGlobal("steam_plant", L.NewFunction(r.luaSteamPlant))
	L.SetGlobal("case", L.NewFunction(r.luaCase))
	L.SetGlobal("check", L.NewFunction(r.luaCheck))
	L.SetGlobal("include", L.NewFunction(r.luaInclude))
	L.SetGlobal("read_csv", L.NewFunction(r.luaReadCSV))
	L.SetGlobal("to_number", L.NewFunction(r.luaToNumber))
	L.SetGlobal("voyage", L.NewFunction(r.luaVoyage))
	L.SetGlobal("study", L.NewFunction(r.luaStudy))
	L.SetGlobal("audit", L.NewFunction(r.luaAudit))
	L.SetGlobal("heating_plan", L.NewFunction(r.luaHeatingPlan))
	L.SetGlobal("cool_down", L.NewFunction(r.luaCoolDown))
	L.SetGlobal("time_to_cool", L.NewFunction(r.luaTimeToCool))
	L.SetGlobal("flue_gas", L.NewFunction(r.luaFlueGas))
}

func unknownMethodMsg(key string, methods *lua.LTable) string {
	var names []string
	methods.ForEach(func(k, _ lua.LValue) { names = append(names, k.String()) })
	sort.Strings(names)
	msg := fmt.Sprintf("no unit kind or method '%s'", key)
	if s := suggest(key, names); s != "" {
		msg += fmt.Sprintf("; did you mean '%s'?", s)
	}
	return msg + " (known: " + strings.Join(names, ", ") + ")"
}

func (r *runner) checkPlant(n int) *plantHandle {
	ud, ok := r.L.Get(n).(*lua.LUserData)
	if ok {
		if ph, ok := ud.Value.(*plantHandle); ok {
			return ph
		}
	}
	r.fail("", "argument %d must be a plant made by plant{...} or steam_plant{...}; got %s", n, describe(r.L.Get(n)))
	return nil
}

func (r *runner) checkTable(n int, what string) *lua.LTable {
	t, ok := r.L.Get(n).(*lua.LTable)
	if !ok {
		r.fail("", "%s takes a table, such as %s{ name = \"...\" }; got %s", what, what, describe(r.L.Get(n)))
	}
	return t
}

// plantOptions reads the plant-wide keys shared by plant{} and
// steam_plant{}: name, ambient, usable, sharing, lead_load,
// feed_suction_max_T, ege_saving, n_minus_1, contingencies.
func (r *runner) plantOptions(t *lua.LTable, what string, pos Pos) (*args, string, plant.Options) {
	a := r.args(t, what, pos, units.Options{})
	name, _ := a.str("name", true)
	a.what = fmt.Sprintf("plant %q", name)
	var opt plant.Options
	if p, ok := a.quantity("ambient", units.Pressure, false); ok {
		u := units.Options{AmbientPressure: p}
		if err := u.Validate(); err != nil {
			a.errorf(err, "ambient must lie between 0.5 bar(a) and 1.5 bar(a), an absolute pressure such as \"1.013 bar(a)\"; got %s", asGiven(a.get("ambient")))
		} else {
			opt.AmbientPressure = p
			a.uopt = u
		}
	}
	// usable: 50-100 %; the trade fires the next boiler at 85-90 % of one's
	// MCR (common practice, no source); a boiler is never planned above it.
	opt.UsableFraction, _ = a.fractionIn("usable", 0.5, 1, " of one boiler's MCR")
	if s, ok := a.str("sharing", false); ok {
		switch s {
		case "equal":
			opt.Sharing = plant.EqualLoad
		case "lead":
			opt.Sharing = plant.LeadLag
		case "least_fuel":
			opt.Sharing = plant.LeastFuel
		default:
			a.errorf(nil, "sharing must be \"equal\", \"lead\" or \"least_fuel\"; got %q", s)
		}
	}
	opt.LeadLoad, _ = a.fractionIn("lead_load", 0.1, 1, " of the lead boiler's MCR")
	opt.FeedSuctionMaxT, _ = a.quantity("feed_suction_max_T", units.Temperature, false)
	if a.has("ege_saving") {
		// false skips the second solve of each case without the
		// exhaust-gas economisers that gives the fuel they save
		opt.NoEGESaving = !a.boolean("ege_saving")
	}
	if a.has("n_minus_1") {
		// false skips the N-1 answers of each case, for speed
		opt.NoContingencies = !a.boolean("n_minus_1")
	}
	opt.Contingencies = a.contingencies(r.entryPos(pos, "=contingencies"))
	if ig := r.subTable(a, "inert_gas"); ig != nil {
		b := r.args(ig, a.what+" inert_gas", pos, a.uopt)
		// O2: the highest O2 in the dry gas (default 5 %); capacity: the
		// gas needed as a fraction of the cargo pumps' rate (default
		// 125 %).
		var ok bool
		if opt.InertGasO2Max, ok = b.quantity("O2", units.Fraction, false); ok && !(opt.InertGasO2Max > 0 && opt.InertGasO2Max < 0.21) {
			b.errorf(nil, "O2 must lie between 0 and 21 %%, such as \"5 %%\"; got %g %%", 100*opt.InertGasO2Max)
		}
		if opt.InertGasCapacity, ok = b.quantity("capacity", units.Fraction, false); ok && !(opt.InertGasCapacity > 0 && opt.InertGasCapacity <= 10) {
			b.errorf(nil, "capacity must lie between 0 and 1000 %% of the cargo pumps' rate, such as \"125 %%\"; got %g %%", 100*opt.InertGasCapacity)
		}
		b.done()
		a.nerr += b.nerr
	}
	opt.Logger = r.log
	return a, name, opt
}

func (r *runner) newPlant(name string, pos Pos, opt plant.Options, uopt units.Options) (*lua.LUserData, *plantHandle) {
	if len(r.plants) >= r.opt.MaxPlants {
		r.fail("", "more than %d plants in one run", r.opt.MaxPlants)
	}
	p := plant.New(name, opt)
	p.Pos = plant.Pos{File: pos.File, Line: pos.Line}
	ph := &plantHandle{p: p, pos: pos, uopt: uopt, kinds: map[string]string{},
		broken: map[string]bool{}, badLines: map[string]bool{}, badEnds: map[string]bool{}}
	r.plants = append(r.plants, ph)
	r.out.Plants = append(r.out.Plants, p)
	ud := r.L.NewUserData()
	ud.Value = ph
	r.L.SetMetatable(ud, r.L.GetTypeMetatable(plantTypeName))
	return ud, ph
}

// luaPlant is plant{ name = ..., ambient = ..., usable = ..., sharing = ...,
// lead_load = ... }.
func (r *runner) luaPlant(L *lua.LState) int {
	t := r.checkTable(1, "plant")
	pos := r.where()
	a, name, opt := r.plantOptions(t, "plant", pos)
	a.done()
	ud, _ := r.newPlant(name, pos, opt, a.uopt)
	L.Push(ud)
	return 1
}

// unitMethod makes the plant method that declares a component of a kind.
func (r *runner) unitMethod(kind plant.KindSpec) lua.LGFunction {
	return func(L *lua.LState) int {
		ph := r.checkPlant(1)
		t := r.checkTable(2, "ship:"+kind.Name)
		pos := r.where()
		name := r.addUnit(ph, kind.Name, t, pos, nil)
		L.Push(r.unitHandle(name, kind.Name))
		return 1
	}
}

// addUnit reads t as a component of the named kind, adds it to the plant
// and returns its name. extra reads keys the caller accepts besides the
// kind's own.
func (r *runner) addUnit(ph *plantHandle, kindName string, t *lua.LTable, pos Pos, extra func(a *args)) string {
	kind, ok := r.kindOf(kindName)
	if !ok {
		panic(fmt.Sprintf("scripting: addUnit: no kind %q", kindName))
	}
	if len(ph.kinds) >= r.opt.MaxUnits {
		r.fail(fmt.Sprintf("plant %q", ph.p.Name), "more than %d units in one plant", r.opt.MaxUnits)
	}
	r.checkSize(t, kindName)
	a := r.args(t, strings.ReplaceAll(kindName, "_", " "), pos, ph.uopt)
	name, ok := a.str("name", true)
	if ok && strings.TrimSpace(name) == "" {
		a.errorf(nil, "name must not be empty")
		ok = false
	}
	if ok {
		a.what = fmt.Sprintf("%s %q", strings.ReplaceAll(kindName, "_", " "), name)
	}
	if extra != nil {
		extra(a)
	}
	u := r.build(a, ph, kind)
	a.done()
	if !ok {
		return ""
	}
	*u.Ident() = plant.Base{Name: name, Pos: plant.Pos{File: pos.File, Line: pos.Line}}
	if err := ph.p.Add(u); err != nil {
		r.addPlantErr(ph, err, a.what)
		return name
	}
	ph.kinds[name] = kindName
	if a.nerr > 0 {
		ph.broken[name] = true
	}
	return name
}

// checkSize raises an error if t has more entries than the bindings accept.
func (r *runner) checkSize(t *lua.LTable, what string) {
	n := 0
	k, _ := t.Next(lua.LNil)
	for k != lua.LNil {
		n++
		if n > r.opt.MaxTable {
			r.fail("", "%s: table has more than %d entries", what, r.opt.MaxTable)
		}
		k, _ = t.Next(k)
	}
}

// unitHandle is what a unit constructor returns: a table with the unit's
// name and kind, usable in line() as the unit's name.
func (r *runner) unitHandle(name, kind string) lua.LValue {
	t := r.L.NewTable()
	t.RawSetString("name", lua.LString(name))
	t.RawSetString("kind", lua.LString(kind))
	return t
}

// addPlantErr records an error returned by the plant package, fault by
// fault.
func (r *runner) addPlantErr(ph *plantHandle, err error, unit string) {
	r.addPlantErrIn(ph, err, unit, "")
}

// addPlantErrIn is addPlantErr with a note appended to each message (the
// case whose solve met the error).
func (r *runner) addPlantErrIn(ph *plantHandle, err error, unit, note string) {
	var ge *plant.GraphError
	if errors.As(err, &ge) {
		for _, f := range ge.Faults {
			if ph != nil && (ph.broken[f.Unit] || ph.badLines[f.Line] || ph.badEnd(f)) {
				continue
			}
			pos := Pos{File: f.Pos.File, Line: f.Pos.Line}
			if pos.File == "" && ph != nil {
				pos = ph.pos
			}
			r.errs = append(r.errs, &Error{Pos: pos, Msg: plant.Fault{Unit: f.Unit, Line: f.Line, Msg: f.Msg}.String() + note, Err: err})
		}
		return
	}
	var ue *plant.ComponentError
	if errors.As(err, &ue) {
		pos := Pos{File: ue.Pos.File, Line: ue.Pos.Line}
		r.errs = append(r.errs, &Error{Pos: pos, Unit: fmt.Sprintf("%s %q", ue.Kind, ue.Name), Msg: ue.Err.Error() + note, Err: err})
		return
	}
	pos := r.where()
	if ph != nil && pos.File == "" {
		pos = ph.pos
	}
	r.errs = append(r.errs, &Error{Pos: pos, Unit: unit, Msg: err.Error() + note, Err: err})
}

// contingencies reads contingencies = { "AB1", { "AB2", "EGE" } }: each
// entry a unit's name or a list of units lost together (boilers or
// exhaust-gas economisers; the plant checks the names once its units are
// declared).
func (a *args) contingencies(pos Pos) []plant.Contingency {
	v := a.get("contingencies")
	if v == lua.LNil {
		return nil
	}
	t, ok := v.(*lua.LTable)
	if !ok {
		a.errorf(nil, "contingencies must be a list of failures, each a unit's name or a list of names lost together, such as { \"AB1\", { \"AB2\", \"EGE\" } }; got %s", describe(v))
		return nil
	}
	n := t.Len()
	if n > a.r.opt.MaxTable {
		a.errorf(nil, "contingencies: more than %d entries", a.r.opt.MaxTable)
		return nil
	}
	if extra := a.r.unknownKeys(t, nil); len(extra) > n {
		a.errorf(nil, "contingencies must be a list { \"AB1\", {...} } without named keys")
	}
	var out []plant.Contingency
	at := plant.Pos{File: pos.File, Line: pos.Line}
	for i := 1; i <= n; i++ {
		var units []string
		switch e := t.RawGetInt(i).(type) {
		case lua.LString:
			if strings.TrimSpace(string(e)) != "" {
				units = []string{string(e)}
			}
		case *lua.LTable:
			for j := 1; j <= e.Len() && j <= a.r.opt.MaxTable; j++ {
				s, ok := e.RawGetInt(j).(lua.LString)
				if !ok || strings.TrimSpace(string(s)) == "" {
					a.errorf(nil, "contingencies[%d][%d] must be a unit's name; got %s", i, j, describe(e.RawGetInt(j)))
					continue
				}
				units = append(units, string(s))
			}
		default:
			a.errorf(nil, "contingencies[%d] must be a unit's name or a list of names; got %s", i, describe(e))
			continue
		}
		if len(units) == 0 {
			a.errorf(nil, "contingencies[%d] names no unit: give the boilers or exhaust-gas economisers lost together, such as { \"AB1\" }", i)
			continue
		}
		out = append(out, plant.Contingency{Units: units, Pos: at})
	}
	return out
}

// names reads a list of unit names.
func (a *args) names(key string) []string {
	switch v := a.get(key).(type) {
	case *lua.LNilType:
		return nil
	case lua.LString:
		return []string{string(v)}
	case *lua.LTable:
		n := v.Len()
		if n > a.r.opt.MaxTable {
			a.errorf(nil, "%s: more than %d names", key, a.r.opt.MaxTable)
			return nil
		}
		out := make([]string, 0, n)
		for i := 1; i <= n; i++ {
			switch s := v.RawGetInt(i).(type) {
			case lua.LString:
				out = append(out, string(s))
			case *lua.LTable:
				if nm, ok := s.RawGetString("name").(lua.LString); ok {
					out = append(out, string(nm))
					continue
				}
				a.errorf(nil, "%s[%d] must be a unit name; got a table", key, i)
			default:
				a.errorf(nil, "%s[%d] must be a unit name; got %s", key, i, describe(s))
			}
		}
		return out
	default:
		a.errorf(nil, "%s must be a list of unit names; got %s", key, describe(v))
		return nil
	}
}

// decodeBoiler reads a boiler's fuel (fuel, lhv, co2_factor), its
// efficiency and its burner.
func decodeBoiler(r *runner, a *args, ph *plantHandle, c plant.Component) {
	u, ok := c.(*plant.Boiler)
	if !ok {
		return
	}
	u.Fuel = a.fuelSpec()
	if eta := a.efficiency(); eta != nil {
		u.Efficiency = eta
		if _, plain := eta.(*plant.EfficiencyTable); !plain {
			if u.Fuel.Fuel == nil && u.Fuel.Name != "" {
				a.errorf(nil, "a combustion model of the efficiency (flue_gas or furnace) needs a fuel grade (%s) for the fuel's analysis; got %q", strings.Join(fuel.GradeNames(), ", "), u.Fuel.Name)
			}
			wsggFor(eta, u.Fuel.Fuel)
		}
	}
	u.Burner = r.burner(a)
}

// fuelSpec reads fuel (a grade name, or the name of the user's fuel),
// lhv and co2_factor.
func (a *args) fuelSpec() plant.FuelSpec {
	name, hasName := a.str("fuel", false)
	lhv, hasLHV := a.quantity("lhv", units.SpecificEnergy, false)
	co2, hasCO2 := a.number("co2_factor")
	var spec plant.FuelSpec
	if hasName {
		spec.Name = name
		if f, err := fuel.Grade(name); err == nil {
			// The full fuel goes with the spec: the combustion models
			// need its analysis.
			s, err := plant.SpecFromFuel(f)
			if err != nil {
				a.errorf(err, "fuel %q: %v", name, err)
			}
			spec = s
			spec.Name = f.Name
		} else if !(hasLHV && hasCO2) {
			grades := fuel.GradeNames()
			msg := fmt.Sprintf("fuel %q is not a built-in grade", name)
			if s := suggest(name, grades); s != "" {
				msg += fmt.Sprintf("; did you mean %q?", s)
			}
			a.errorf(err, "%s (grades: %s; or give lhv and co2_factor for your own fuel)", msg, strings.Join(grades, ", "))
		}
	}
	if hasLHV {
		spec.LHV = lhv
		if !hasName {
			spec.Name = "fuel (set LHV)"
		}
	}
	if bdn := a.get("bdn"); bdn != lua.LNil {
		switch {
		case !isGrade(name):
			a.errorf(nil, "bdn gives a delivered fuel's figures on top of a built-in grade: give fuel as one (%s)", strings.Join(fuel.GradeNames(), ", "))
		case hasLHV:
			a.errorf(nil, "with bdn, give the note's stated LHV inside it (bdn = { lhv = \"41.2 MJ/kg\", ... }), not as lhv")
		default:
			if s, ok := a.bdnSpec(bdn, name); ok {
				spec = s
			}
		}
	}
	if hasCO2 {
		if co2 <= 0 || co2 > 5 {
			a.errorf(nil, "co2_factor is kg CO2 per kg fuel, between 0 and 5; got %g", co2)
		}
		spec.CO2Factor = co2
		spec.CO2Basis = "given co2_factor"
	}
	switch {
	case !hasName && !hasLHV:
		a.errorf(nil, "needs a fuel: fuel = \"HSFO\" (grades: %s), or lhv = \"40.2 MJ/kg\" with co2_factor = 3.114", strings.Join(fuel.GradeNames(), ", "))
	case hasLHV && !hasCO2 && !isGrade(name):
		a.errorf(nil, "a fuel given by its lhv needs co2_factor too (kg CO2 per kg fuel, such as 3.114)")
	}
	return spec
}

// bdnSpec reads a boiler's bdn table, the figures of a bunker delivery
// note, and makes the delivered fuel on top of the grade called base
// (fuel.FromBDN). Every figure is checked there; its errors name the
// field, the value and the range.
func (a *args) bdnSpec(v lua.LValue, base string) (plant.FuelSpec, bool) {
	t, ok := v.(*lua.LTable)
	if !ok {
		a.errorf(nil, "bdn must be a table such as { density = \"991 kg/m3\", sulphur = \"2.8 %%\", water = \"0.3 %%\", ash = \"0.05 %%\", viscosity = \"380 cSt\" }; got %s", describe(v))
		return plant.FuelSpec{}, false
	}
	a.r.checkSize(t, "bdn")
	p := a.r.args(t, a.what+" bdn", a.pos, a.uopt)
	var b fuel.BDN
	b.Name, _ = p.str("name", false)
	b.Grade, _ = p.str("grade", false)
	b.Density15, _ = p.quantity("density", units.Density, true)
	sul, hasSul := p.quantity("sulphur", units.Fraction, false)
	if alt, hasAlt := p.quantity("sulfur", units.Fraction, false); hasAlt {
		if hasSul {
			p.errorf(nil, "give sulphur or sulfur, not both")
		}
		sul = alt
	}
	b.Sulfur = sul
	b.Water, _ = p.quantity("water", units.Fraction, false)
	b.Ash, _ = p.quantity("ash", units.Fraction, false)
	b.Viscosity, _ = p.quantity("viscosity", units.KinematicViscosity, false)
	b.LHV, _ = p.quantity("lhv", units.SpecificEnergy, false)
	p.done()
	a.nerr += p.nerr
	if p.nerr > 0 {
		return plant.FuelSpec{}, false
	}
	g, err := fuel.Grade(base)
	if err != nil {
		a.errorf(err, "bdn: %v", err)
		return plant.FuelSpec{}, false
	}
	f, err := fuel.FromBDN(g, b)
	if err != nil {
		a.errorf(err, "bdn: %v", err)
		return plant.FuelSpec{}, false
	}
	spec, err := plant.SpecFromBDN(f)
	if err != nil {
		a.errorf(err, "bdn: %v", err)
		return plant.FuelSpec{}, false
	}
	return spec, true
}

func isGrade(name string) bool {
	_, err := fuel.Grade(name)
	return name != "" && err == nil
}

// efficiency reads efficiency: a table of {load, efficiency} pairs, a
// single efficiency for every load, or a combustion model (a table with
// the key flue_gas or furnace).
func (a *args) efficiency() plant.EfficiencyModel {
	v := a.get("efficiency")
	switch x := v.(type) {
	case *lua.LNilType:
		a.errorf(nil, "efficiency is required: a table of {load, efficiency} pairs such as { {\"25 %%\", \"80 %%\"}, {\"100 %%\", \"85 %%\"} }, or one figure such as \"85 %%\"")
		return nil
	case lua.LString, lua.LNumber:
		eta, err := parseQuantity(x, "efficiency", units.Fraction, a.uopt)
		if err != nil {
			a.errorf(err, "%v", err)
			return nil
		}
		// One figure holds at every load: a table flat from no load to
		// 150 % of MCR.
		t := &plant.EfficiencyTable{Load: []float64{0, 1.5}, Eta: []float64{eta, eta}}
		if err := t.Validate(); err != nil {
			a.errorf(err, "efficiency: %v", err)
			return nil
		}
		return t
	case *lua.LTable:
		if x.RawGetString("flue_gas") != lua.LNil || x.RawGetString("furnace") != lua.LNil {
			if m := a.r.combustionEfficiency(a, x); m != nil {
				return m
			}
			return nil
		}
		n := x.Len()
		if n == 0 || n > 200 {
			a.errorf(nil, "efficiency table needs 1 to 200 {load, efficiency} pairs; got %d", n)
			return nil
		}
		t := &plant.EfficiencyTable{Load: make([]float64, 0, n), Eta: make([]float64, 0, n)}
		for i := 1; i <= n; i++ {
			pair, ok := x.RawGetInt(i).(*lua.LTable)
			if !ok || pair.Len() != 2 {
				a.errorf(nil, "efficiency[%d] must be a pair {load, efficiency} such as {\"50 %%\", \"84 %%\"}", i)
				return nil
			}
			load, err1 := parseQuantity(pair.RawGetInt(1), fmt.Sprintf("efficiency[%d] load", i), units.Fraction, a.uopt)
			eta, err2 := parseQuantity(pair.RawGetInt(2), fmt.Sprintf("efficiency[%d] efficiency", i), units.Fraction, a.uopt)
			if err := errors.Join(err1, err2); err != nil {
				a.errorf(err, "%v", strings.ReplaceAll(err.Error(), "\n", "; "))
				return nil
			}
			t.Load = append(t.Load, load)
			t.Eta = append(t.Eta, eta)
		}
		if err := t.Validate(); err != nil {
			a.errorf(err, "%v", err)
			return nil
		}
		return t
	}
	a.errorf(nil, "efficiency must be a table of {load, efficiency} pairs or one figure; got %s", describe(v))
	return nil
}

// decodeConsumer reads a plain consumer's demand: a duty or a steam flow.
func decodeConsumer(r *runner, a *args, ph *plantHandle, u plant.Component) {
	hasDuty := r.readNamed(a, u, "duty", false)
	hasSteam := r.readNamed(a, u, "steam", false)
	switch {
	case hasDuty && hasSteam:
		a.errorf(nil, "give duty or steam, not both")
	case !hasDuty && !hasSteam && a.nerr == 0:
		a.errorf(nil, "needs a duty (such as duty = \"450 kW\") or a steam flow (such as steam = \"0.2 t/h\")")
	}
}

// ---------------------------------------------------------------------------
// Lines.

// luaLine is ship:line("name", "from.port", "to.port"). A port may be left
// out when the unit has one outlet (from) or one required inlet (to).
func (r *runner) luaLine(L *lua.LState) int {
	ph := r.checkPlant(1)
	pos := r.where()
	var parts [3]string
	for i := range parts {
		switch v := L.Get(i + 2).(type) {
		case lua.LString:
			parts[i] = string(v)
		case *lua.LTable:
			if nm, ok := v.RawGetString("name").(lua.LString); ok && i > 0 {
				parts[i] = string(nm)
				continue
			}
			r.fail("", "line: argument %d must be a string; got a table", i+1)
		default:
			r.fail("", "line(name, \"from.port\", \"to.port\"): argument %d must be a string; got %s", i+1, describe(v))
		}
	}
	if ph.nLines >= r.opt.MaxUnits*4 {
		r.fail(fmt.Sprintf("plant %q", ph.p.Name), "more than %d lines in one plant", r.opt.MaxUnits*4)
	}
	ph.nLines++
	ph.pending = append(ph.pending, pendingLine{name: parts[0], pos: pos, from: parts[1], to: parts[2]})
	return 0
}

// flushLines connects the lines declared so far, now that every unit they
// name may be known, reporting unknown units and ports with suggestions.
func (r *runner) flushLines(ph *plantHandle) {
	for _, pl := range ph.pending {
		what := fmt.Sprintf("line %q", pl.name)
		fu, fp, err1 := r.endpoint(ph, pl.from, plant.Out)
		tu, tp, err2 := r.endpoint(ph, pl.to, plant.In)
		if err1 != "" || err2 != "" {
			for _, e := range []string{err1, err2} {
				if e != "" {
					r.errs = append(r.errs, &Error{Pos: pl.pos, Unit: what, Msg: e})
				}
			}
			ph.badLines[pl.name] = true
			ph.markEnd(fu, fp, err1 == "")
			ph.markEnd(tu, tp, err2 == "")
			// Connect anyway so that the plant does not also report the
			// units' ports as unconnected.
		}
		ph.p.Connect(pl.name, plant.Pos{File: pl.pos.File, Line: pl.pos.Line}, fu, fp, tu, tp)
	}
	ph.pending = ph.pending[:0]
}

// endpoint splits "unit.port" into unit and port, taking the unit's only
// port of the direction when the port is left out. It returns a message if
// the unit or port is not known.
func (r *runner) endpoint(ph *plantHandle, s string, dir plant.Direction) (unit, port, msg string) {
	side := "from"
	if dir == plant.In {
		side = "to"
	}
	if u := ph.p.Component(s); u != nil {
		// No port given: the unit's single port of the direction.
		var all, required []string
		for _, ps := range u.Ports() {
			if ps.Dir == dir {
				all = append(all, ps.Name)
				if !ps.Optional {
					required = append(required, ps.Name)
				}
			}
		}
		cands := required
		if len(all) == 1 {
			cands = all
		}
		if len(cands) == 1 {
			return s, cands[0], ""
		}
		return s, "", fmt.Sprintf("%s %q: say which port of the %s, such as %q (ports: %s)", side, s, u.Kind(), s+"."+firstOr(cands, "in"), portList(u))
	}
	i := strings.LastIndexByte(s, '.')
	if i < 0 {
		return s, "", fmt.Sprintf("%s: %s", side, r.unknownUnitMsg(ph, s))
	}
	unit, port = s[:i], s[i+1:]
	u := ph.p.Component(unit)
	if u == nil {
		return unit, port, fmt.Sprintf("%s %q: %s", side, s, r.unknownUnitMsg(ph, unit))
	}
	var names []string
	for _, ps := range u.Ports() {
		names = append(names, ps.Name)
		if ps.Name == port {
			return unit, port, ""
		}
	}
	msg = fmt.Sprintf("%s %q: the %s %q has no port %q", side, s, u.Kind(), unit, port)
	if sg := suggest(port, names); sg != "" {
		msg += fmt.Sprintf("; did you mean %q?", unit+"."+sg)
	}
	return unit, port, msg + " (ports: " + portList(u) + ")"
}

func firstOr(list []string, def string) string {
	if len(list) > 0 {
		return list[0]
	}
	return def
}

func portList(u plant.Component) string {
	var b []string
	for _, ps := range u.Ports() {
		dir := "in"
		if ps.Dir == plant.Out {
			dir = "out"
		}
		s := ps.Name + " (" + dir
		if ps.Optional {
			s += ", optional"
		}
		b = append(b, s+")")
	}
	return strings.Join(b, ", ")
}

// unknownUnitMsg says a unit is not in the plant, with a suggestion.
func (r *runner) unknownUnitMsg(ph *plantHandle, name string) string {
	var names []string
	for _, u := range ph.p.Components() {
		names = append(names, u.Ident().Name)
	}
	msg := fmt.Sprintf("plant %q has no unit %q", ph.p.Name, name)
	if s := suggest(name, names); s != "" {
		msg += fmt.Sprintf("; did you mean %q?", s)
	}
	return msg
}

// markEnd remembers an end of a reported line: the unit and port as given
// when valid, else the unit the name most likely meant.
func (ph *plantHandle) markEnd(unit, port string, valid bool) {
	if !valid {
		if ph.p.Component(unit) == nil {
			var names []string
			for _, u := range ph.p.Components() {
				names = append(names, u.Ident().Name)
			}
			unit = suggest(unit, names)
		}
		port = "*"
	}
	if unit != "" {
		ph.badEnds[unit+"\x00"+port] = true
	}
}

// badEnd reports whether f is a "not connected" fault of a port that a
// reported line named.
func (ph *plantHandle) badEnd(f plant.Fault) bool {
	if !strings.Contains(f.Msg, "is not connected") {
		return false
	}
	if ph.badEnds[f.Unit+"\x00*"] {
		return true
	}
	for k := range ph.badEnds {
		unit, port, _ := strings.Cut(k, "\x00")
		if unit == f.Unit && strings.Contains(f.Msg, fmt.Sprintf("%q", port)) {
			return true
		}
	}
	return false
}
