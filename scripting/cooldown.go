package scripting

import (
	"fmt"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant"
	"steamcase/plant/loads"
	"steamcase/plant/units"
)

// lumpedDensity is the density a lumped tank (mass, cp, UA) is given: any
// value serves, since only the mass m = volume·density enters the model.
const lumpedDensity = 1000.0

// coolTank reads cool_down's and time_to_cool's tank: the handle of a
// ship:tank_heating (or its name), a table of the tank_heating's tank keys,
// or a lumped tank { mass, cp, UA } whose surroundings are the call's
// ambient temperature.
func (r *runner) coolTank(a *args) *plant.TankHeating {
	switch v := a.get("tank").(type) {
	case lua.LString:
		return r.tankByName(a, string(v))
	case *lua.LTable:
		if nm, ok := v.RawGetString("name").(lua.LString); ok && v.RawGetString("kind") == lua.LString("tank_heating") {
			return r.tankByName(a, string(nm))
		}
		r.checkSize(v, "tank")
		ta := r.args(v, a.what+" tank", a.pos, units.Options{})
		defer func() { a.nerr += ta.nerr }()
		if ta.has("mass") || ta.has("UA") {
			mass, _ := ta.quantity("mass", units.Mass, true)
			cp, _ := ta.quantity("cp", units.SpecificHeat, true)
			ua, _ := ta.quantity("UA", units.ThermalConductance, true)
			amb, _ := a.quantity("ambient", units.Temperature, true)
			ta.done()
			return &plant.TankHeating{Tank: loads.TankHeating{Name: a.what, Cargo: loads.Cargo{Density: lumpedDensity, Cp: cp},
				CargoVolume: mass / lumpedDensity,
				Boundaries:  []loads.Boundary{{Name: "all boundaries", Area: 1, U: ua, Beyond: loads.Space, T: amb}}}}
		}
		m := &plant.TankHeating{}
		c := plant.NewModelConsumer(m)
		r.readNamed(ta, c, "fuel", false)
		r.tankGeometry(ta, c)
		for _, k := range []string{"cp", "cargo", "flash_point"} {
			r.readNamed(ta, c, k, false)
		}
		m.Tank.Name = a.what
		ta.done()
		return m
	case *lua.LNilType:
		a.errorf(nil, "tank is required: a tank_heating unit (the table ship:tank_heating returned, or its name), its keys { fuel, volume, boundaries, ... }, or { mass = \"10000 t\", cp = \"2 kJ/kgK\", UA = \"50 kW/K\" } with ambient")
	default:
		a.errorf(nil, "tank must be a tank_heating unit or a table of its keys; got %s", describe(v))
	}
	return nil
}

// tankByName finds a tank_heating unit of the run's plants.
func (r *runner) tankByName(a *args, name string) *plant.TankHeating {
	var found *plant.TankHeating
	var names []string
	for _, ph := range r.plants {
		for n, k := range ph.kinds {
			if k != "tank_heating" {
				continue
			}
			names = append(names, n)
			if n == name && !ph.broken[n] {
				if found != nil {
					a.errorf(nil, "tank %q is a tank_heating of two plants; give the tank's keys instead", name)
					return nil
				}
				if c, ok := ph.p.Component(n).(*plant.Consumer); ok {
					found, _ = c.Model.(*plant.TankHeating)
				}
			}
		}
	}
	if found == nil {
		msg := fmt.Sprintf("no tank_heating unit %q", name)
		if s := suggest(name, names); s != "" {
			msg += fmt.Sprintf("; did you mean %q?", s)
		}
		a.errorf(nil, "%s", msg)
		return nil
	}
	return found
}

// coolArgs reads what cool_down and time_to_cool share: the tank, from,
// and the surroundings.
func (r *runner) coolArgs(fn string) (*args, *loads.TankHeating, float64, loads.Ambient) {
	t := r.checkTable(1, fn)
	pos := r.where()
	r.checkSize(t, fn)
	a := r.args(t, fn, pos, units.Options{})
	m := r.coolTank(a)
	var tank *loads.TankHeating
	if m != nil {
		tank = &m.Tank
	}
	from, _ := a.quantity("from", units.Temperature, true)
	sea, hasSea := a.quantity("sea", units.Temperature, false)
	air, hasAir := a.quantity("air", units.Temperature, false)
	a.get("ambient") // the lumped tank's surroundings, read with it
	if m != nil && a.nerr == 0 {
		if m.UsesSea() && !hasSea {
			a.errorf(nil, "the tank has boundaries to the sea: give sea = \"12 C\"")
		}
		if m.UsesAir() && !hasAir {
			a.errorf(nil, "the tank has boundaries to the air: give air = \"5 C\"")
		}
	}
	return a, tank, from, loads.Ambient{Sea: sea, Air: air}
}

// coolResult returns the cool-down's details as a table.
func (r *runner) coolResult(c loads.CoolDown) *lua.LTable {
	o := r.L.CreateTable(0, 10)
	o.RawSetString("T_C", lua.LNumber(c.T-273.15))
	o.RawSetString("from_C", lua.LNumber(c.T0-273.15))
	o.RawSetString("hours", lua.LNumber(c.Elapsed/3600))
	o.RawSetString("reached", lua.LBool(c.Reached))
	o.RawSetString("tau_h", lua.LNumber(c.Tau/3600))
	o.RawSetString("mass_t", lua.LNumber(c.Mass/1000))
	o.RawSetString("cp_kJ_per_kgK", lua.LNumber(c.Cp/1000))
	o.RawSetString("UA_kW_per_K", lua.LNumber(c.UA/1000))
	o.RawSetString("ambient_C", lua.LNumber(c.AmbientT-273.15))
	w := r.L.CreateTable(len(c.Warnings), 0)
	for _, s := range c.Warnings {
		w.Append(lua.LString(s))
	}
	o.RawSetString("warnings", w)
	return o
}

// luaCoolDown is cool_down{ tank, from, hours, sea, air, ambient }: the
// cargo temperature in °C after the time with the heating off, and a
// table of details.
func (r *runner) luaCoolDown(L *lua.LState) int {
	a, tank, from, amb := r.coolArgs("cool_down")
	var hours float64
	if v := a.get("hours"); v != lua.LNil {
		h, err := parseHours(v, "hours")
		if err != nil {
			a.errorf(err, "%v", err)
		}
		hours = h
	} else {
		a.errorf(nil, "hours is required: the time with the heating off, such as hours = 72 or \"3 d\"")
	}
	a.done()
	if a.nerr > 0 {
		r.raise(stopRun{})
	}
	c, err := tank.CoolDownAfter(from, hours*3600, amb)
	if err != nil {
		a.loadErr(err)
		r.raise(stopRun{})
	}
	L.Push(lua.LNumber(c.T - 273.15))
	L.Push(r.coolResult(c))
	return 2
}

// luaTimeToCool is time_to_cool{ tank, from, to, sea, air, ambient }: the
// hours until the cargo cools to "to" with the heating off (nil when it
// never gets there), and a table of details.
func (r *runner) luaTimeToCool(L *lua.LState) int {
	a, tank, from, amb := r.coolArgs("time_to_cool")
	to, _ := a.quantity("to", units.Temperature, true)
	a.done()
	if a.nerr > 0 {
		r.raise(stopRun{})
	}
	c, err := tank.TimeToCool(from, to, amb)
	if err != nil {
		a.loadErr(err)
		r.raise(stopRun{})
	}
	if c.Reached {
		L.Push(lua.LNumber(c.Elapsed / 3600))
	} else {
		L.Push(lua.LNil)
	}
	L.Push(r.coolResult(c))
	return 2
}
