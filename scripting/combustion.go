package scripting

import (
	"errors"
	"fmt"
	"strings"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant"
	"steamcase/plant/fuel"
	"steamcase/plant/heat"
	"steamcase/plant/units"
)

// ---------------------------------------------------------------------------
// Exhaust-gas economiser.

// maxPoints bounds the rows of an engine, flue-gas or excess-air table.
const maxPoints = 200

// decodeEGE reads an exhaust-gas economiser's engine table, its size (ua
// with design_gas, or design_load with pinch) and its exhaust's enthalpy
// (gas_cp, or exhaust_fuel with exhaust_O2).
func decodeEGE(r *runner, a *args, ph *plantHandle, c plant.Component) {
	u, ok := c.(*plant.ExhaustGasEconomiser)
	if !ok {
		return
	}
	if et, ok := a.get("engine").(*lua.LTable); ok {
		u.Engine = r.engineExhaust(a, et)
	} else {
		a.errorf(nil, "engine is required: engine = { mcr = \"12 MW\", { load = \"25 %%\", gas = \"11 kg/kWh\", T = \"250 C\" }, ... }")
	}
	hasUA := r.readNamed(a, u, "ua", false)
	hasDG := r.readNamed(a, u, "design_gas", false)
	hasDL := r.readNamed(a, u, "design_load", false)
	hasPinch := r.readNamed(a, u, "pinch", false)
	switch {
	case hasUA && hasPinch:
		a.errorf(nil, "give its size as ua (at design_gas or at the gas flow of design_load) or as design_load with pinch, not both")
	case hasUA && hasDG && hasDL:
		a.errorf(nil, "ua holds at one reference gas flow: give design_gas or design_load, not both")
	case !hasUA && hasDG:
		a.errorf(nil, "design_gas is the gas flow at which ua holds; it needs ua")
	case !hasUA && hasDL != hasPinch:
		a.errorf(nil, "design_load and pinch go together (the engine load at which the gas leaves pinch kelvin above saturation), such as design_load = \"85 %%\", pinch = \"15 K\"; or give ua, which then holds at the gas flow of design_load")
	case !hasUA && !hasDL && !hasPinch:
		a.errorf(nil, "needs its size: ua = \"60 kW/K\" (at design_gas = \"30 kg/s\" or at the gas flow of design_load = \"85 %%\"), or design_load = \"85 %%\" with pinch = \"15 K\"")
	}
	r.readNamed(a, u, "gas_cp", false)
	if name, ok := a.str("exhaust_fuel", false); ok {
		f, err := fuel.Grade(name)
		if err != nil {
			a.errorf(err, "exhaust_fuel %q is not a built-in grade (grades: %s)", name, strings.Join(fuel.GradeNames(), ", "))
		} else {
			u.ExhaustFuel = &f
		}
		r.readNamed(a, u, "exhaust_O2", true)
	} else if a.has("exhaust_O2") {
		a.errorf(nil, "exhaust_O2 needs exhaust_fuel (the engine's fuel grade, such as \"VLSFO\")")
	}
}

// engineExhaust reads engine = { mcr = "12 MW", { load, gas, T }, ... }.
// gas is exhaust per energy ("8.5 kg/kWh") or a mass flow ("35 kg/s").
func (r *runner) engineExhaust(a *args, t *lua.LTable) plant.EngineExhaust {
	r.checkSize(t, "engine")
	e := r.args(t, a.what+" engine", a.pos, a.uopt)
	var out plant.EngineExhaust
	out.MCR, _ = e.quantity("mcr", units.Power, true)
	n := t.Len()
	if n == 0 || n > maxPoints {
		e.errorf(nil, "engine needs 1 to %d points { load = \"75 %%\", gas = \"8.5 kg/kWh\", T = \"235 C\" } besides mcr; got %d", maxPoints, n)
	}
	for i := 1; i <= n && i <= maxPoints; i++ {
		e.asked = append(e.asked, fmt.Sprintf("[%d]", i))
		pt, ok := t.RawGetInt(i).(*lua.LTable)
		if !ok {
			e.errorf(nil, "engine[%d] must be a table { load = \"75 %%\", gas = \"8.5 kg/kWh\", T = \"235 C\" }; got %s", i, describe(t.RawGetInt(i)))
			continue
		}
		p := r.args(pt, a.what, a.pos, a.uopt)
		load, okL := p.quantity("load", units.Fraction, true)
		T, _ := p.quantity("T", units.Temperature, true)
		spec := 0.0
		switch g := p.get("gas").(type) {
		case *lua.LNilType:
			p.errorf(nil, "engine[%d].gas is required, such as gas = \"8.5 kg/kWh\" or \"35 kg/s\"", i)
		case lua.LString:
			s := strings.TrimSpace(string(g))
			if num, ok := strings.CutSuffix(s, "/kWh"); ok {
				m, err := units.Parse(num, units.Mass, a.uopt)
				if err != nil {
					p.errorf(err, "engine[%d].gas: %v (want exhaust per energy such as \"8.5 kg/kWh\")", i, err)
				}
				spec = m / 3.6e6
			} else {
				m, err := units.Parse(s, units.MassFlow, a.uopt)
				switch {
				case err != nil:
					p.errorf(err, "engine[%d].gas: %v (or exhaust per energy such as \"8.5 kg/kWh\")", i, err)
				case !okL || load <= 0 || out.MCR <= 0:
					p.errorf(nil, "engine[%d].gas as a mass flow needs a load above zero and the engine's mcr; give it in kg/kWh instead", i)
				default:
					spec = m / (load * out.MCR)
				}
			}
		default:
			p.errorf(nil, "engine[%d].gas must be a string such as \"8.5 kg/kWh\"; got %s", i, describe(g))
		}
		p.done()
		e.nerr += p.nerr
		out.Load = append(out.Load, load)
		out.Specific = append(out.Specific, spec)
		out.T = append(out.T, T)
	}
	// The points are list entries: report only the keys that are neither
	// mcr nor a point.
	for _, k := range r.unknownKeys(t, nil) {
		if !contains(e.asked, k) {
			e.errorf(nil, "%s", unknownKeyMsg(k, []string{"mcr"}))
		}
	}
	a.nerr += e.nerr
	if e.nerr == 0 {
		if err := out.Validate(); err != nil {
			a.errorf(err, "engine: %v", err)
		}
	}
	return out
}

// ---------------------------------------------------------------------------
// Combustion models of a boiler's efficiency.

// combustionEfficiency reads efficiency = { flue_gas = {...}, ... } or
// efficiency = { furnace = {...}, passes = {...}, excess_air = {...}, ... }.
func (r *runner) combustionEfficiency(a *args, t *lua.LTable) plant.EfficiencyModel {
	r.checkSize(t, "efficiency")
	e := r.args(t, a.what, a.pos, a.uopt)
	defer func() { a.nerr += e.nerr }()
	if e.has("flue_gas") {
		return r.flueGasTable(e, t)
	}
	return r.furnaceTubes(e)
}

// points reads a list of points (tables of width entries) of a table.
func (r *runner) points(e *args, key string, width int, example string) [][]lua.LValue {
	t, ok := e.get(key).(*lua.LTable)
	if !ok {
		e.errorf(nil, "efficiency.%s is required: a list such as %s", key, example)
		return nil
	}
	n := t.Len()
	if n == 0 || n > maxPoints {
		e.errorf(nil, "efficiency.%s needs 1 to %d points such as %s; got %d", key, maxPoints, example, n)
		return nil
	}
	out := make([][]lua.LValue, 0, n)
	for i := 1; i <= n; i++ {
		p, ok := t.RawGetInt(i).(*lua.LTable)
		if !ok || p.Len() != width {
			e.errorf(nil, "efficiency.%s[%d] must have %d entries, as in %s", key, i, width, example)
			return nil
		}
		row := make([]lua.LValue, width)
		for j := range row {
			row[j] = p.RawGetInt(j + 1)
		}
		out = append(out, row)
	}
	return out
}

func (r *runner) flueGasTable(e *args, t *lua.LTable) plant.EfficiencyModel {
	const ex = `{ {"50 %", "250 C", "4 %"}, {"100 %", "290 C", "3 %"} }`
	m := &plant.FlueGasTable{}
	for i, p := range r.points(e, "flue_gas", 3, ex) {
		load, err1 := parseQuantity(p[0], fmt.Sprintf("efficiency.flue_gas[%d] load", i+1), units.Fraction, e.uopt)
		T, err2 := parseQuantity(p[1], fmt.Sprintf("efficiency.flue_gas[%d] T", i+1), units.Temperature, e.uopt)
		o2, err3 := parseQuantity(p[2], fmt.Sprintf("efficiency.flue_gas[%d] O2", i+1), units.Fraction, e.uopt)
		if err := errors.Join(err1, err2, err3); err != nil {
			e.errorf(err, "%s", strings.ReplaceAll(err.Error(), "\n", "; "))
			return nil
		}
		m.Load, m.FlueT, m.O2Dry = append(m.Load, load), append(m.FlueT, T), append(m.O2Dry, o2)
	}
	m.RadiationAtMCR, _ = e.quantity("radiation", units.Fraction, false)
	m.RelativeHumidity, _ = e.quantity("humidity", units.Fraction, false)
	m.AtomisingSteam, _ = e.quantity("atomising", units.Fraction, false)
	e.done()
	if e.nerr > 0 {
		return nil
	}
	if err := m.Validate(); err != nil {
		e.errorf(err, "efficiency: %v", err)
		return nil
	}
	return m
}

func (r *runner) furnaceTubes(e *args) plant.EfficiencyModel {
	m := &plant.FurnaceTubes{}
	if ft, ok := e.get("furnace").(*lua.LTable); ok {
		m.Furnace = r.furnace(e, ft)
	} else {
		e.errorf(nil, "efficiency as a table needs flue_gas = { {load, T, O2}, ... }, or furnace = {...} with passes and excess_air (or give one figure or {load, efficiency} pairs)")
		e.done()
		return nil
	}
	if pt, ok := e.get("passes").(*lua.LTable); ok {
		m.Passes = r.passes(e, pt)
	} else {
		e.errorf(nil, "efficiency.passes is required: a list of smoke-tube passes { { tubes = 45, di = \"50 mm\", length = \"3 m\", wall = \"3.5 mm\" }, ... }")
	}
	const ex = `{ {"30 %", 1.4}, {"100 %", 1.15} }`
	for i, p := range r.points(e, "excess_air", 2, ex) {
		load, err := parseQuantity(p[0], fmt.Sprintf("efficiency.excess_air[%d] load", i+1), units.Fraction, e.uopt)
		lam, ok := p[1].(lua.LNumber)
		if err == nil && !ok {
			err = fmt.Errorf("efficiency.excess_air[%d] lambda must be a number (the air ratio, such as 1.2); got %s", i+1, describe(p[1]))
		}
		if err != nil {
			e.errorf(err, "%v", err)
			break
		}
		m.ExcessAir.Load = append(m.ExcessAir.Load, load)
		m.ExcessAir.Lambda = append(m.ExcessAir.Lambda, float64(lam))
	}
	m.RadiationLoss, _ = e.quantity("radiation_loss", units.Power, false)
	m.RelativeHumidity, _ = e.quantity("humidity", units.Fraction, false)
	m.AtomisingSteam, _ = e.quantity("atomising", units.Fraction, false)
	e.done()
	if e.nerr > 0 {
		return nil
	}
	if err := m.Validate(); err != nil {
		e.errorf(err, "efficiency: %v", err)
		return nil
	}
	return m
}

// furnace reads furnace = { wall_area, volume or beam_length, wall_T,
// wall_emissivity, soot }.
func (r *runner) furnace(e *args, t *lua.LTable) heat.Furnace {
	r.checkSize(t, "furnace")
	f := r.args(t, e.what+" furnace", e.pos, e.uopt)
	var out heat.Furnace
	out.WallArea, _ = f.quantity("wall_area", units.Area, true)
	vol, hasVol := f.quantity("volume", units.Volume, false)
	lm, hasLm := f.quantity("beam_length", units.Length, false)
	switch {
	case hasVol && hasLm:
		f.errorf(nil, "give volume or beam_length, not both")
	case hasLm:
		out.BeamLength = lm
	case hasVol && out.WallArea > 0:
		b, err := heat.BeamLength(vol, out.WallArea)
		if err != nil {
			f.errorf(err, "%v", err)
		}
		out.BeamLength = b
	case !hasVol:
		f.errorf(nil, "needs its volume (such as volume = \"2.4 m3\") or beam_length")
	}
	out.WallTemperature, _ = f.quantity("wall_T", units.Temperature, false)
	out.WallEmissivity = 0.8 // oxidised or sooted steel, plant/heat [M]
	if v, ok := f.quantity("wall_emissivity", units.Fraction, false); ok {
		out.WallEmissivity = v
	}
	if v, ok := f.number("soot"); ok {
		out.SootVolumeFraction = v
	}
	f.done()
	e.nerr += f.nerr
	return out
}

// passes reads the smoke-tube passes.
func (r *runner) passes(e *args, t *lua.LTable) []heat.SmokeTubes {
	n := t.Len()
	if n == 0 || n > 8 {
		e.errorf(nil, "efficiency.passes needs 1 to 8 passes; got %d", n)
		return nil
	}
	out := make([]heat.SmokeTubes, 0, n)
	for i := 1; i <= n; i++ {
		pt, ok := t.RawGetInt(i).(*lua.LTable)
		if !ok {
			e.errorf(nil, "efficiency.passes[%d] must be a table { tubes = 45, di = \"50 mm\", length = \"3 m\", wall = \"3.5 mm\" }", i)
			continue
		}
		r.checkSize(pt, "passes")
		p := r.args(pt, fmt.Sprintf("%s passes[%d]", e.what, i), e.pos, e.uopt)
		var s heat.SmokeTubes
		if c, ok := p.number("tubes"); !ok || c < 1 || c > 1e5 || c != float64(int(c)) {
			p.errorf(nil, "tubes must be a whole number of tubes from 1, such as tubes = 45")
		} else {
			s.Count = int(c)
		}
		s.Di, _ = p.quantity("di", units.Length, true)
		s.Length, _ = p.quantity("length", units.Length, true)
		s.WallThickness, _ = p.quantity("wall", units.Length, true)
		s.FoulingGas, _ = p.quantity("fouling_gas", units.FoulingResistance, false)
		s.FoulingWater, _ = p.quantity("fouling_water", units.FoulingResistance, false)
		s.WallEmissivity, _ = p.quantity("wall_emissivity", units.Fraction, false)
		p.done()
		e.nerr += p.nerr
		out = append(out, s)
	}
	return out
}

// wsggFor fixes the grey-gas set of a furnace by the fuel, as plant/heat
// advises (a fixed set keeps the residuals smooth): natural gas burns to
// pw/pc about 2, oil to about 1.
func wsggFor(m plant.EfficiencyModel, f *fuel.Fuel) {
	ft, ok := m.(*plant.FurnaceTubes)
	if !ok || f == nil {
		return
	}
	set := heat.WSGGRatio1
	if f.Class == fuel.Gas {
		set = heat.WSGGRatio2
	}
	ft.Furnace.Set = set
	for i := range ft.Passes {
		ft.Passes[i].Set = set
	}
}

// burner reads burner = { air_T, fan_rise, fan_eta, motor_eta }.
func (r *runner) burner(a *args) plant.Burner {
	var b plant.Burner
	v := a.get("burner")
	if v == lua.LNil {
		return b
	}
	t, ok := v.(*lua.LTable)
	if !ok {
		a.errorf(nil, "burner must be a table { fan_rise = \"3 kPa\", fan_eta = \"70 %%\" }; got %s", describe(v))
		return b
	}
	r.checkSize(t, "burner")
	p := r.args(t, a.what+" burner", a.pos, a.uopt)
	b.AirT, _ = p.quantity("air_T", units.Temperature, false)
	b.FanRise, _ = p.pressureDiff("fan_rise", false)
	b.FanEta, _ = p.quantity("fan_eta", units.Fraction, b.FanRise > 0)
	b.MotorEta, _ = p.quantity("motor_eta", units.Fraction, false)
	b.ExcessAir, _ = p.quantity("excess_air", units.Fraction, false)
	p.done()
	a.nerr += p.nerr
	return b
}
