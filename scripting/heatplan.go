package scripting

import (
	"context"
	"fmt"
	"math"
	"runtime"
	"sort"
	"strings"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant"
	"steamcase/plant/heatplan"
	"steamcase/plant/profile"
	"steamcase/plant/schema"
	"steamcase/plant/units"
)

// HeatingPlanRecord is one heating_plan() of a run.
type HeatingPlanRecord struct {
	Name  string
	Plant string
	Pos   Pos   // where heating_plan() was called
	Rows  []Pos // where each row was given
	// Result is the plan; nil in check mode.
	Result *heatplan.Result
}

// tankSpec is a tank of voyage()'s or heating_plan()'s tanks table.
type tankSpec struct {
	unit          string
	T, neverBelow float64
}

// stateTanks reads tanks = { ["COT 3"] = "45 C", ["COT 4"] = { T = "44 C",
// never_below = "40 C" } }: the tank_heating units carried from row to
// row and their temperatures at the start, in the plant's order.
func (r *runner) stateTanks(ph *plantHandle, a *args, required, floor bool) []tankSpec {
	v := a.get("tanks")
	if v == lua.LNil {
		if required {
			a.errorf(nil, "tanks is required: the tank_heating units to plan with their temperatures at the start, such as tanks = { [\"COT 3\"] = \"45 C\" }")
		}
		return nil
	}
	t, ok := v.(*lua.LTable)
	if !ok {
		a.errorf(nil, "tanks must be a table such as { [\"COT 3\"] = \"45 C\" }; got %s", describe(v))
		return nil
	}
	r.checkSize(t, "tanks")
	var tanks []string
	for n, k := range ph.kinds {
		if k == "tank_heating" {
			tanks = append(tanks, n)
		}
	}
	sort.Strings(tanks)
	var out []tankSpec
	t.ForEach(func(k, val lua.LValue) {
		name, ok := k.(lua.LString)
		if !ok {
			a.errorf(nil, "tanks: keys must be the names of tank_heating units, such as [\"COT 3\"] = \"45 C\"; got %s", describe(k))
			return
		}
		unit := string(name)
		if ph.kinds[unit] != "tank_heating" {
			msg := fmt.Sprintf("tanks: %q is not a tank_heating unit of plant %q", unit, ph.p.Name)
			if _, ok := ph.kinds[unit]; !ok {
				msg = fmt.Sprintf("tanks: %s", r.unknownUnitMsg(ph, unit))
			}
			if s := suggest(unit, tanks); s != "" && ph.kinds[unit] == "" {
				msg = fmt.Sprintf("tanks: plant %q has no tank_heating unit %q; did you mean %q?", ph.p.Name, unit, s)
			}
			a.errorf(nil, "%s (tank_heating units: %s)", msg, strings.Join(tanks, ", "))
			return
		}
		spec := tankSpec{unit: unit}
		switch x := val.(type) {
		case *lua.LTable:
			ta := r.args(x, fmt.Sprintf("%s tanks[%q]", a.what, unit), a.pos, ph.uopt)
			spec.T, _ = ta.quantity("T", units.Temperature, true)
			if floor {
				spec.neverBelow, _ = ta.quantity("never_below", units.Temperature, false)
			}
			ta.done()
			a.nerr += ta.nerr
		default:
			T, err := parseQuantity(val, fmt.Sprintf("tanks[%q]", unit), units.Temperature, ph.uopt)
			if err != nil {
				a.errorf(err, "%v", err)
				return
			}
			spec.T = T
		}
		out = append(out, spec)
	})
	order := map[string]int{}
	for i, c := range ph.p.Components() {
		order[c.Ident().Name] = i
	}
	sort.Slice(out, func(i, j int) bool { return order[out[i].unit] < order[out[j].unit] })
	if len(out) == 0 && required {
		a.errorf(nil, "tanks names no tank: give at least one, such as tanks = { [\"COT 3\"] = \"45 C\" }")
	}
	return out
}

// tankStarts turns the specs into the profile's.
func tankStarts(specs []tankSpec, pos Pos) []profile.TankStart {
	out := make([]profile.TankStart, len(specs))
	for i, s := range specs {
		out[i] = profile.TankStart{Unit: s.unit, T: s.T, Pos: plant.Pos{File: pos.File, Line: pos.Line}}
	}
	return out
}

// reqSpec is a required temperature as read, its time resolved once the
// rows are known.
type reqSpec struct {
	tank  string
	T     float64
	at    lua.LValue
	label string
}

// requirements reads required = { ["COT 3"] = { T = "57 C", at =
// "discharge" } } (or a list of such tables for a tank).
func (r *runner) requirements(ph *plantHandle, a *args) []reqSpec {
	v := a.get("required")
	if v == lua.LNil {
		return nil
	}
	t, ok := v.(*lua.LTable)
	if !ok {
		a.errorf(nil, "required must be a table such as { [\"COT 3\"] = { T = \"57 C\", at = \"discharge\" } }; got %s", describe(v))
		return nil
	}
	r.checkSize(t, "required")
	var out []reqSpec
	one := func(unit string, x *lua.LTable, what string) {
		ra := r.args(x, what, a.pos, ph.uopt)
		T, _ := ra.quantity("T", units.Temperature, true)
		at := ra.get("at")
		if at == lua.LNil {
			ra.errorf(nil, "at is required: a phase (\"discharge\"), a time from the voyage's start (\"240 h\") or \"end\"")
		}
		ra.done()
		a.nerr += ra.nerr
		label := ""
		switch x := at.(type) {
		case lua.LString:
			label = string(x)
		case lua.LNumber:
			label = fmt.Sprintf("%g h", float64(x))
		}
		out = append(out, reqSpec{tank: unit, T: T, at: at, label: label})
	}
	t.ForEach(func(k, val lua.LValue) {
		name, ok := k.(lua.LString)
		x, isT := val.(*lua.LTable)
		if !ok || !isT {
			a.errorf(nil, "required: each entry must be [\"tank\"] = { T = \"57 C\", at = \"discharge\" }; got %s = %s", describe(k), describe(val))
			return
		}
		what := fmt.Sprintf("%s required[%q]", a.what, string(name))
		if x.Len() > 0 {
			for i := 1; i <= x.Len(); i++ {
				e, ok := x.RawGetInt(i).(*lua.LTable)
				if !ok {
					a.errorf(nil, "required[%q][%d] must be a table { T = ..., at = ... }", string(name), i)
					continue
				}
				one(string(name), e, fmt.Sprintf("%s[%d]", what, i))
			}
			return
		}
		one(string(name), x, what)
	})
	sort.SliceStable(out, func(i, j int) bool { return out[i].tank < out[j].tank })
	return out
}

// resolve turns the requirements' times into the plan's, for rows of
// the given phases and hours: a phase name, "end", or a time.
func resolve(specs []reqSpec, rows []profile.Row, pos Pos) ([]heatplan.Requirement, error) {
	total := 0.0
	phases := map[string]bool{}
	for _, r := range rows {
		total += r.Hours * 3600
		phases[r.Phase] = true
	}
	pp := plant.Pos{File: pos.File, Line: pos.Line}
	var out []heatplan.Requirement
	for _, s := range specs {
		q := heatplan.Requirement{Tank: s.tank, T: s.T, Label: s.label, Pos: pp}
		switch x := s.at.(type) {
		case lua.LNumber:
			q.At = float64(x) * 3600
		case lua.LString:
			str := strings.TrimSpace(string(x))
			switch {
			case str == "end":
				q.At = total
			case phases[str]:
				q.Phase = str
			default:
				h, err := parseHours(x, "at")
				if err != nil {
					return nil, fmt.Errorf("required[%q]: at %q is not a phase of the voyage, \"end\" or a time such as \"240 h\"", s.tank, str)
				}
				q.At = h * 3600
			}
		default:
			return nil, fmt.Errorf("required[%q]: at must be a phase, \"end\" or a time; got %s", s.tank, describe(s.at))
		}
		if math.IsInf(q.At, 0) {
			return nil, fmt.Errorf("required[%q]: at is not finite", s.tank)
		}
		out = append(out, q)
	}
	return out, nil
}

// luaHeatingPlan is heating_plan(plant, { name, rows or csv, tanks,
// required, grid, method }): the least-fuel heating plan of the voyage.
func (r *runner) luaHeatingPlan(L *lua.LState) int {
	var specs []tankSpec
	var reqs []reqSpec
	var opt heatplan.Options
	ph, a, name, rows := r.jobStart("heating_plan", rowSpec{job: "heating_plan"}, func(a *args) {
		ph := r.checkPlant(1)
		specs = r.stateTanks(ph, a, true, true)
		reqs = r.requirements(ph, a)
		if g, ok := a.quantity("grid", units.TemperatureDifference, false); ok {
			if !(g >= 0.01 && g <= 5) {
				a.errorf(nil, "grid must lie between 0.01 K and 5 K; got %g K", g)
			}
			opt.Grid = g
		}
		if m, ok := a.str("method", false); ok {
			if m != "joint" && m != "descent" {
				a.errorf(nil, "method must be \"joint\" or \"descent\"; got %q", m)
			}
			opt.Method = m
		}
	})
	rec := HeatingPlanRecord{Name: name, Plant: ph.p.Name, Pos: a.pos, Rows: rows.pos}
	job := schema.Job{Name: name, Plant: ph.p.Name, Source: a.pos.String(), RowSources: posStrings(rows.pos)}
	if r.opt.CheckOnly {
		r.out.HeatingPlans = append(r.out.HeatingPlans, rec)
		L.Push(r.schemaTable(fmt.Sprintf("heating plan %q", name), schema.NewHeatingPlan(job, placeholderPlan(specs, reqs, rows.rows))))
		return 1
	}
	q, err := resolve(reqs, rows.rows, a.pos)
	if err != nil {
		r.raise(&Error{Pos: a.pos, Unit: a.what, Msg: err.Error(), Err: err})
	}
	tanks := make([]heatplan.Tank, len(specs))
	for i, s := range specs {
		tanks[i] = heatplan.Tank{Unit: s.unit, StartT: s.T, NeverBelow: s.neverBelow, Pos: plant.Pos{File: a.pos.File, Line: a.pos.Line}}
	}
	opt.Workers = r.opt.Workers
	if opt.Workers <= 0 {
		opt.Workers = runtime.GOMAXPROCS(0)
	}
	var res *heatplan.Result
	// The rows' fuel curves (13 duty levels a distinct row) and the plans
	// solved row by row with each tank's instructions.
	err = r.inJob(a.what, a.pos, len(rows.rows)*(13+10*len(tanks)), func(ctx context.Context) error {
		var err error
		res, err = heatplan.Plan(ctx, ph.p, rows.rows, tanks, q, opt)
		return err
	})
	if err != nil {
		r.jobErr(a.pos, a.what, err)
	}
	rec.Result = res
	r.out.HeatingPlans = append(r.out.HeatingPlans, rec)
	L.Push(r.schemaTable(fmt.Sprintf("heating plan %q", name), schema.NewHeatingPlan(job, res)))
	return 1
}

// placeholderPlan is a heating plan's result in check mode: its tanks,
// their required temperatures and a row per period, zero figures.
func placeholderPlan(specs []tankSpec, reqs []reqSpec, rows []profile.Row) *heatplan.Result {
	res := &heatplan.Result{}
	start := 0.0
	for i, r := range rows {
		res.Rows = append(res.Rows, heatplan.RowPlan{Index: i, Phase: r.Phase, Hours: r.Hours, StartH: start})
		start += r.Hours
	}
	for _, s := range specs {
		tp := heatplan.TankPlan{Unit: s.unit, StartT: s.T, NeverBelow: s.neverBelow}
		for range rows {
			tp.Rows = append(tp.Rows, heatplan.TankRowPlan{Instruction: "off", T0: s.T, T1: s.T})
		}
		for _, q := range reqs {
			if q.tank == s.unit {
				tp.Required = append(tp.Required, heatplan.RequiredResult{
					Requirement: heatplan.Requirement{Tank: q.tank, T: q.T, Label: q.label}, LatestStartRow: -1})
			}
		}
		res.Tanks = append(res.Tanks, tp)
	}
	return res
}

// placeholderTanks gives every row of a voyage's check-mode table its
// stateful tanks, at their starting temperatures with the heating off.
func (r *runner) placeholderTanks(o lua.LValue, specs []tankSpec) {
	t, ok := o.(*lua.LTable)
	if !ok || len(specs) == 0 {
		return
	}
	for _, row := range list(t, "rows") {
		tanks := r.L.CreateTable(len(specs), 0)
		for _, s := range specs {
			e := r.L.CreateTable(0, 8)
			e.RawSetString("name", lua.LString(s.unit))
			e.RawSetString("instruction", lua.LString("off"))
			e.RawSetString("start_T_K", lua.LNumber(s.T))
			e.RawSetString("end_T_K", lua.LNumber(s.T))
			e.RawSetString("duty_kW", lua.LNumber(0))
			e.RawSetString("capacity_kW", lua.LNumber(0))
			e.RawSetString("coil_binds", lua.LFalse)
			e.RawSetString("short", lua.LFalse)
			tanks.Append(e)
		}
		row.RawSetString("tanks", tanks)
	}
}
