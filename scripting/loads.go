package scripting

import (
	"errors"
	"fmt"
	"sort"
	"strings"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant"
	"steamcase/plant/loads"
	"steamcase/plant/units"
)

// consumerKinds are the kinds the short form lists under consumers: the
// plain consumer and the consumers whose demand a plant/loads model
// computes (a cargo pump is a turbine).
var consumerKinds = []string{"consumer", "tank_heating", "fuel_heater", "accommodation", "tank_cleaning",
	"atomising_steam", "soot_blowing", "steam_tracing", "fresh_water_generator", "boiler_warming"}

func unknownKindMsg(k string) string {
	names := append(append([]string(nil), consumerKinds...), "cargo_pump")
	sort.Strings(names)
	msg := fmt.Sprintf("unknown consumer kind %q", k)
	if s := suggest(k, names); s != "" {
		msg += fmt.Sprintf("; did you mean %q?", s)
	}
	return msg + " (kinds: " + strings.Join(names, ", ") + ")"
}

// loadErr records a loads input error against the unit's table.
func (a *args) loadErr(err error) {
	var ie *loads.InputError
	if errors.As(err, &ie) {
		msg := ie.Msg
		if ie.Err != nil {
			msg += ": " + ie.Err.Error()
		}
		a.errorf(err, "%s", msg)
		return
	}
	a.errorf(err, "%v", err)
}

// ---------------------------------------------------------------------------
// Tank heating.

// decodeTankHeating reads a tank heating's tank (tankGeometry) and its
// mode: hold at T, or heat up from "from" to "to" in "duration".
func decodeTankHeating(r *runner, a *args, ph *plantHandle, u plant.Component) {
	c, ok := u.(*plant.Consumer)
	if !ok {
		return
	}
	m, ok := c.Model.(*plant.TankHeating)
	if !ok {
		return
	}
	r.tankGeometry(a, c)
	mode, _ := a.str("mode", false)
	// not lists the keys of the other mode that were given.
	not := func(keys ...string) []string {
		var out []string
		for _, k := range keys {
			if a.has(k) {
				out = append(out, k)
			}
		}
		return out
	}
	switch mode {
	case "", "hold":
		m.Tank.Mode = loads.Hold
		r.readNamed(a, u, "T", true)
		if extra := not("from", "to", "duration"); len(extra) > 0 {
			a.errorf(nil, "%s belong to mode = \"heat_up\"; holding takes T", strings.Join(extra, ", "))
		}
	case "heat_up":
		m.Tank.Mode = loads.HeatUp
		r.readNamed(a, u, "from", true)
		r.readNamed(a, u, "to", true)
		r.readNamed(a, u, "duration", true)
		if extra := not("T"); len(extra) > 0 {
			a.errorf(nil, "T belongs to mode = \"hold\"; a heat-up takes from, to and duration")
		}
	default:
		a.get("T")
		a.get("from")
		a.get("to")
		a.get("duration")
		a.errorf(nil, "mode must be \"hold\" or \"heat_up\"; got %q", mode)
	}
}

// tankGeometry reads the tank of a tank_heating c (or of cool_down's tank
// table): its density (required without a fuel), and its dimensions, or
// its volume with its boundaries. The registry reads fuel, cp, cargo and
// flash_point.
func (r *runner) tankGeometry(a *args, c *plant.Consumer) {
	m, ok := c.Model.(*plant.TankHeating)
	if !ok {
		return
	}
	hasFuel := a.t.RawGetString("fuel") != lua.LNil
	r.readNamed(a, c, "density", !hasFuel)
	dims, hasDims := a.get("dimensions").(*lua.LTable)
	bounds, hasBounds := a.get("boundaries").(*lua.LTable)
	switch {
	case hasDims && hasBounds:
		a.errorf(nil, "give dimensions or boundaries, not both")
		a.get("volume")
	case hasDims:
		if a.has("volume") {
			a.errorf(nil, "the dimensions give the volume (with fill); leave volume out, or give volume with boundaries")
		}
		d := r.tankDimensions(a, dims)
		if a.nerr == 0 {
			t, err := loads.TankFromDimensions("", m.Tank.Cargo, d)
			if err != nil {
				a.loadErr(err)
			}
			m.Tank.CargoVolume, m.Tank.Boundaries = t.CargoVolume, t.Boundaries
		}
	case hasBounds:
		r.readNamed(a, c, "volume", true)
		m.Tank.Boundaries = r.tankBoundaries(a, bounds)
	default:
		a.get("volume")
		a.errorf(nil, "needs the tank's dimensions = {...} or its boundaries = { {area, U, beyond}, ... }")
	}
}

func (r *runner) tankDimensions(a *args, t *lua.LTable) loads.Dimensions {
	r.checkSize(t, "dimensions")
	d := r.args(t, a.what, a.pos, a.uopt)
	var out loads.Dimensions
	out.Length, _ = d.quantity("length", units.Length, true)
	out.Breadth, _ = d.quantity("breadth", units.Length, true)
	out.Depth, _ = d.quantity("depth", units.Length, true)
	out.Fill, _ = d.quantity("fill", units.Fraction, true)
	out.DoubleBottom, _ = d.quantity("double_bottom", units.Length, false)
	out.DoubleSide, _ = d.quantity("double_side", units.Length, false)
	if s, ok := d.str("layout", false); ok {
		switch s {
		case "full_breadth":
			out.Layout = loads.FullBreadth
		case "wing":
			out.Layout = loads.Wing
		case "centre":
			out.Layout = loads.Centre
		default:
			d.errorf(nil, "dimensions.layout must be \"full_breadth\", \"wing\" or \"centre\"; got %q", s)
		}
	}
	out.WeatherDeck = d.boolean("weather_deck")
	out.DeckSpaceT, _ = d.quantity("deck_space_T", units.Temperature, false)
	out.SideAboveWater, _ = d.quantity("side_above_water", units.Fraction, false)
	out.AdjacentT, _ = d.quantity("adjacent_T", units.Temperature, false)
	out.AdjacentHeated = d.boolean("adjacent_heated")
	// The temperatures beyond the tank that its layout needs, asked for
	// by key and with an example (plant/loads would say only that a
	// temperature is missing).
	if !out.AdjacentHeated && !d.has("adjacent_T") {
		d.errorf(nil, "dimensions.adjacent_T is not given: the tank's bulkheads to its neighbours need their temperature; give adjacent_T = \"15 C\" (or adjacent_heated = true when they are heated like this one)")
	}
	if !out.WeatherDeck && !d.has("deck_space_T") {
		d.errorf(nil, "dimensions.deck_space_T is not given: a tank under a deck that is not the weather deck needs the temperature above it; give deck_space_T = \"20 C\" (or weather_deck = true)")
	}
	if ut, ok := d.get("U").(*lua.LTable); ok {
		uv := r.args(ut, a.what, a.pos, a.uopt)
		hc := units.HeatTransferCoefficient
		out.U.DeckUllage, _ = uv.quantity("deck_ullage", hc, false)
		out.U.DeckWetted, _ = uv.quantity("deck_wetted", hc, false)
		out.U.Shell, _ = uv.quantity("shell", hc, false)
		out.U.DoubleHull, _ = uv.quantity("double_hull", hc, false)
		out.U.Bulkhead, _ = uv.quantity("bulkhead", hc, false)
		out.U.Dry, _ = uv.quantity("dry", hc, false)
		uv.done()
		d.nerr += uv.nerr
	}
	d.done()
	a.nerr += d.nerr
	return out
}

func (r *runner) tankBoundaries(a *args, t *lua.LTable) []loads.Boundary {
	r.checkSize(t, "boundaries")
	n := t.Len()
	out := make([]loads.Boundary, 0, n)
	for i := 1; i <= n; i++ {
		bt, ok := t.RawGetInt(i).(*lua.LTable)
		if !ok {
			a.errorf(nil, "boundaries[%d] must be a table such as { area = \"120 m2\", U = \"4.5 W/m2K\", beyond = \"air\" }", i)
			continue
		}
		b := r.args(bt, a.what, a.pos, a.uopt)
		var bd loads.Boundary
		bd.Name, _ = b.str("name", false)
		bd.Area, _ = b.quantity("area", units.Area, true)
		bd.U, _ = b.quantity("U", units.HeatTransferCoefficient, true)
		beyond, _ := b.str("beyond", true)
		switch beyond {
		case "sea":
			bd.Beyond = loads.Sea
		case "air":
			bd.Beyond = loads.Air
		case "space":
			bd.Beyond = loads.Space
			bd.T, _ = b.quantity("T", units.Temperature, true)
		case "":
		default:
			b.errorf(nil, "boundaries[%d].beyond must be \"sea\", \"air\" or \"space\"; got %q", i, beyond)
		}
		if beyond != "space" {
			b.get("T") // accepted, but only meaningful beyond a space
		}
		b.done()
		a.nerr += b.nerr
		out = append(out, bd)
	}
	return out
}

// ---------------------------------------------------------------------------
// Fuel oil heaters.

// decodeFuelHeater reads the heater's outlet (outlet_T or
// target_viscosity) and what sets its oil flow: the boiler whose burner it
// serves, or a flow.
func decodeFuelHeater(r *runner, a *args, ph *plantHandle, u plant.Component) {
	c, ok := u.(*plant.Consumer)
	if !ok {
		return
	}
	m, ok := c.Model.(*plant.FuelHeater)
	if !ok {
		return
	}
	hasOut := r.readNamed(a, u, "outlet_T", false)
	hasVisc := r.readNamed(a, u, "target_viscosity", false)
	if hasOut == hasVisc && a.nerr == 0 {
		a.errorf(nil, "give outlet_T or target_viscosity (one of them)")
	}
	if m.Heater.Service == loads.BoilerBurner {
		r.readNamed(a, u, "boiler", true)
		if a.has("flow") {
			a.errorf(nil, "a burner's heater heats its boiler's fuel flow: give boiler, not flow")
		}
	} else {
		bySFOC := a.has("sfoc")
		if bySFOC {
			if m.Heater.Service != loads.EngineService {
				a.errorf(nil, "sfoc is for a main engine's heater (service = \"engine\"); this heater takes flow")
			}
			if a.has("flow") {
				a.errorf(nil, "give flow or sfoc with engine_mcr, not both")
			}
			switch v := a.get("sfoc").(type) {
			case lua.LString:
				f, err := parseQuantity(v, "sfoc", units.SpecificConsumption, a.uopt)
				if err != nil {
					a.errorf(err, "%v", err)
				} else {
					m.SFOC = []float64{f}
				}
			default:
				m.SFOCLoad, m.SFOC = a.pairs("sfoc", v, units.Fraction, units.SpecificConsumption, "{load, sfoc}", `{"75 %", "174 g/kWh"}`)
			}
			if !r.readNamed(a, u, "engine_mcr", false) && a.nerr == 0 {
				a.errorf(nil, "sfoc needs engine_mcr, the engine's MCR, such as engine_mcr = \"11 MW\"")
			}
		} else {
			r.readNamed(a, u, "flow", true)
			if a.has("engine_mcr") {
				a.errorf(nil, "engine_mcr goes with sfoc")
			}
		}
		if a.has("boiler") {
			a.errorf(nil, "boiler is for a burner's heater (service = \"burner\"), whose oil flow is the boiler's fuel; this heater takes flow")
		}
	}
}

// ---------------------------------------------------------------------------
// Accommodation heating.

// decodeAccommodation reads a table of {air temperature, duty}, or UA and
// inside_T (with balance_T).
func decodeAccommodation(r *runner, a *args, ph *plantHandle, u plant.Component) {
	c, ok := u.(*plant.Consumer)
	if !ok {
		return
	}
	m, ok := c.Model.(*plant.Accommodation)
	if !ok {
		return
	}
	tv := a.get("table")
	if tv == lua.LNil {
		r.readNamed(a, u, "UA", true)
		r.readNamed(a, u, "inside_T", true)
		r.readNamed(a, u, "balance_T", false)
		return
	}
	given := false
	for _, k := range []string{"UA", "inside_T", "balance_T"} {
		given = a.has(k) || given
	}
	if given {
		a.errorf(nil, "give table or UA with inside_T (and balance_T), not both")
	}
	t, ok := tv.(*lua.LTable)
	if !ok || t.Len() < 2 || t.Len() > 200 {
		a.errorf(nil, "table must list 2 to 200 {air temperature, duty} pairs such as { {\"-10 C\", \"300 kW\"}, {\"15 C\", \"0 kW\"} }")
		return
	}
	for i := 1; i <= t.Len(); i++ {
		p, ok := t.RawGetInt(i).(*lua.LTable)
		if !ok || p.Len() != 2 {
			a.errorf(nil, "table[%d] must be a pair {air temperature, duty}", i)
			return
		}
		airT, err1 := parseQuantity(p.RawGetInt(1), fmt.Sprintf("table[%d] air temperature", i), units.Temperature, a.uopt)
		duty, err2 := parseQuantity(p.RawGetInt(2), fmt.Sprintf("table[%d] duty", i), units.Power, a.uopt)
		if err := errors.Join(err1, err2); err != nil {
			a.errorf(err, "%s", strings.ReplaceAll(err.Error(), "\n", "; "))
			return
		}
		m.Heating.Table = append(m.Heating.Table, loads.DutyPoint{AirT: airT, Duty: duty})
	}
}
