package scripting

import (
	"errors"
	"fmt"
	"sort"
	"strings"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant"
	"steamcase/plant/fuel"
	"steamcase/plant/loads"
	"steamcase/plant/units"
)

// The consumer kinds computed by package plant/loads. Each becomes a
// plant.Consumer (a plant.Turbine for a cargo pump) whose duty the loads
// model gives, from the case's sea and air temperatures where it depends
// on them.
var loadsBuilders = map[string]unitBuilder{
	"tank_heating":          buildTankHeating,
	"fuel_heater":           buildFuelHeater,
	"accommodation":         buildAccommodation,
	"tank_cleaning":         buildTankCleaning,
	"cargo_pump":            buildCargoPump,
	"atomising_steam":       buildAtomisingSteam,
	"soot_blowing":          buildSootBlowing,
	"steam_tracing":         buildSteamTracing,
	"fresh_water_generator": buildFreshWaterGenerator,
}

func (r *runner) loadsBuilder(kind string) (unitBuilder, bool) {
	b, ok := loadsBuilders[kind]
	return b, ok
}

func (r *runner) registerLoads(methods *lua.LTable) {
	for kind, b := range loadsBuilders {
		methods.RawSetString(kind, r.L.NewFunction(r.unitMethod(kind, b)))
	}
}

func unknownKindMsg(k string) string {
	names := []string{"consumer"}
	for n := range loadsBuilders {
		names = append(names, n)
	}
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

// needAmbient returns the loads ambient of a case, or an error if the case
// did not give the temperatures the model needs.
func needAmbient(c plant.Conditions, sea, air bool) (loads.Ambient, error) {
	var miss []string
	if sea && c.SeaT <= 0 {
		miss = append(miss, "sea")
	}
	if air && c.AirT <= 0 {
		miss = append(miss, "air")
	}
	if len(miss) > 0 {
		ex := make([]string, len(miss))
		for i, k := range miss {
			ex[i] = k + ` = "12 C"`
		}
		return loads.Ambient{}, fmt.Errorf("needs the case's %s temperature: give %s in the case", strings.Join(miss, " and "), strings.Join(ex, " and "))
	}
	return loads.Ambient{Sea: c.SeaT, Air: c.AirT}, nil
}

// validationAmbient is the ambient at which a model is tried when it is
// declared, so that input errors point at the script line: 15 °C sea and
// air (any plausible value serves; the case's own are used when solving).
var validationAmbient = loads.Ambient{Sea: 288.15, Air: 288.15}

// ---------------------------------------------------------------------------
// Tank heating.

// tankModel adapts loads.TankHeating to plant.DutyModel.
type tankModel struct{ t loads.TankHeating }

func (m *tankModel) Duty(c plant.Conditions) (plant.Duty, error) {
	amb, err := needAmbient(c, m.usesSea(), m.usesAir())
	if err != nil {
		return plant.Duty{}, err
	}
	res, err := m.t.Duty(amb)
	if err != nil {
		return plant.Duty{}, err
	}
	in := map[string]float64{
		"mass_kg": res.Mass, "UA_W_per_K": res.UA, "loss_W": res.Loss, "sensible_W": res.Sensible,
		"oil_T_K": res.LossT, "ambient_T_K": res.AmbientT, "to_T_K": res.To,
	}
	if res.Mode == loads.HeatUp {
		in["from_T_K"], in["duration_s"] = res.From, res.Duration
	}
	return plant.Duty{W: res.Duty, Inputs: in, Warnings: res.Warnings}, nil
}

func (m *tankModel) usesSea() bool {
	for _, b := range m.t.Boundaries {
		if b.Beyond == loads.Sea && b.Area*b.U > 0 {
			return true
		}
	}
	return false
}

func (m *tankModel) usesAir() bool {
	for _, b := range m.t.Boundaries {
		if b.Beyond == loads.Air && b.Area*b.U > 0 {
			return true
		}
	}
	return false
}

// cargo reads the oil of a tank: fuel = "HSFO" (its density and Cragoe
// specific heat), or density with an optional cp.
func (a *args) cargo() loads.Cargo {
	var c loads.Cargo
	name, hasFuel := a.str("fuel", false)
	if hasFuel {
		f, err := fuel.Grade(name)
		if err != nil {
			a.errorf(err, "fuel %q is not a built-in grade (grades: %s)", name, strings.Join(fuel.GradeNames(), ", "))
		} else if c, err = loads.CargoFromFuel(f); err != nil {
			a.loadErr(err)
		}
	}
	if d, ok := a.quantity("density", units.Density, !hasFuel); ok {
		c.Density, c.SG = d, 0
	}
	c.Cp, _ = a.quantity("cp", units.SpecificHeat, false)
	if n, ok := a.str("cargo", false); ok {
		c.Name = n
	} else if hasFuel {
		c.Name = name
	}
	return c
}

// tankGeometry reads the tank of a tank_heating (or of cool_down's tank
// table): the cargo (fuel or density, cp, cargo), flash_point, and
// dimensions or volume with boundaries.
func (r *runner) tankGeometry(a *args) loads.TankHeating {
	var m struct{ t loads.TankHeating } // the fields as buildTankHeating names them
	cargo := a.cargo()
	m.t.FlashPoint, _ = a.quantity("flash_point", units.Temperature, false)
	dims, hasDims := a.get("dimensions").(*lua.LTable)
	bounds, hasBounds := a.get("boundaries").(*lua.LTable)
	switch {
	case hasDims && hasBounds:
		a.errorf(nil, "give dimensions or boundaries, not both")
	case hasDims:
		d := r.tankDimensions(a, dims)
		if a.nerr == 0 {
			t, err := loads.TankFromDimensions("", cargo, d)
			if err != nil {
				a.loadErr(err)
			}
			m.t.CargoVolume, m.t.Boundaries = t.CargoVolume, t.Boundaries
		}
	case hasBounds:
		m.t.CargoVolume, _ = a.quantity("volume", units.Volume, true)
		m.t.Boundaries = r.tankBoundaries(a, bounds)
	default:
		a.errorf(nil, "needs the tank's dimensions = {...} or its boundaries = { {area, U, beyond}, ... }")
	}
	m.t.Cargo = cargo
	return m.t
}

func buildTankHeating(r *runner, a *args, ph *plantHandle) plant.Unit {
	u := &plant.Consumer{Label: "tank heating"}
	m := &tankModel{t: r.tankGeometry(a)}
	mode, _ := a.str("mode", false)
	switch mode {
	case "", "hold":
		m.t.Mode = loads.Hold
		m.t.To, _ = a.quantity("T", units.Temperature, true)
	case "heat_up":
		m.t.Mode = loads.HeatUp
		m.t.From, _ = a.quantity("from", units.Temperature, true)
		m.t.To, _ = a.quantity("to", units.Temperature, true)
		m.t.Duration, _ = a.quantity("duration", units.Time, true)
	default:
		a.errorf(nil, "mode must be \"hold\" or \"heat_up\"; got %q", mode)
	}
	consumerCommon(a, u)
	if a.nerr == 0 {
		if _, err := m.t.Duty(validationAmbient); err != nil {
			a.loadErr(err)
		}
	}
	u.Model = m
	return u
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

// fixedModel is a consumer whose duty does not depend on the case: the
// result was computed when the unit was declared.
type fixedModel struct{ d plant.Duty }

func (m *fixedModel) Duty(plant.Conditions) (plant.Duty, error) { return m.d, nil }

func buildFuelHeater(r *runner, a *args, ph *plantHandle) plant.Unit {
	u := &plant.Consumer{Label: "fuel heater"}
	var h loads.FuelHeater
	svc, _ := a.str("service", true)
	switch svc {
	case "engine":
		h.Service = loads.EngineService
	case "burner":
		h.Service = loads.BoilerBurner
	case "purifier":
		h.Service = loads.Purifier
	case "transfer":
		h.Service = loads.Transfer
	case "":
	default:
		a.errorf(nil, "service must be \"engine\", \"burner\", \"purifier\" or \"transfer\"; got %q", svc)
	}
	name, _ := a.str("fuel", true)
	f, err := fuel.Grade(name)
	if name != "" && err != nil {
		a.errorf(err, "fuel %q is not a built-in grade (grades: %s)", name, strings.Join(fuel.GradeNames(), ", "))
	}
	if d, ok := a.quantity("density15", units.Density, false); ok {
		f.ISO.Density15 = d
	}
	if v, ok := a.quantity("viscosity", units.KinematicViscosity, false); ok {
		f.ISO.Viscosity = v
	}
	h.Fuel = f
	h.InletT, _ = a.quantity("inlet_T", units.Temperature, true)
	outT, hasOut := a.quantity("outlet_T", units.Temperature, false)
	visc, hasVisc := a.quantity("target_viscosity", units.KinematicViscosity, false)
	if hasOut == hasVisc && a.nerr == 0 {
		a.errorf(nil, "give outlet_T or target_viscosity (one of them)")
	}
	h.OutletT, h.TargetViscosity = outT, visc
	h.OutletLimit, _ = a.quantity("outlet_limit", units.Temperature, false)
	h.FlashPoint, _ = a.quantity("flash_point", units.Temperature, false)
	if h.Service == loads.BoilerBurner {
		boiler, _ := a.str("boiler", true)
		u.FuelOf = boiler
	} else {
		h.MassFlow, _ = a.quantity("flow", units.MassFlow, true)
	}
	consumerCommon(a, u)
	if a.nerr > 0 {
		return u
	}
	h.Name = a.what
	if h.Service == loads.BoilerBurner {
		res, err := h.DutyPerKg()
		if err != nil {
			a.loadErr(err)
			return u
		}
		u.DutyPerFuel = res.PerKg
		r.warnAll(a, res.Warnings)
		return u
	}
	res, err := h.Duty()
	if err != nil {
		a.loadErr(err)
		return u
	}
	u.Model = &fixedModel{plant.Duty{W: res.Duty, Warnings: res.Warnings, Inputs: map[string]float64{
		"oil_kg_s": res.MassFlow, "inlet_T_K": res.InletT, "outlet_T_K": res.OutletT, "per_kg_J_per_kg": res.PerKg,
	}}}
	return u
}

// warnAll logs warnings found when a unit is declared.
func (r *runner) warnAll(a *args, ws []string) {
	for _, w := range ws {
		r.log.Warn().Str("pos", a.pos.String()).Str("unit", a.what).Msg(w)
	}
}

// ---------------------------------------------------------------------------
// Accommodation heating.

type accommodationModel struct{ a loads.Accommodation }

func (m *accommodationModel) Duty(c plant.Conditions) (plant.Duty, error) {
	amb, err := needAmbient(c, false, true)
	if err != nil {
		return plant.Duty{}, err
	}
	res, err := m.a.Duty(amb.Air)
	if err != nil {
		return plant.Duty{}, err
	}
	return plant.Duty{W: res.Duty, Warnings: res.Warnings, Inputs: map[string]float64{"air_T_K": res.AirT}}, nil
}

func buildAccommodation(r *runner, a *args, ph *plantHandle) plant.Unit {
	u := &plant.Consumer{Label: "accommodation heating"}
	m := &accommodationModel{}
	if tv := a.get("table"); tv != lua.LNil {
		t, ok := tv.(*lua.LTable)
		if !ok || t.Len() < 2 || t.Len() > 200 {
			a.errorf(nil, "table must list 2 to 200 {air temperature, duty} pairs such as { {\"-10 C\", \"300 kW\"}, {\"15 C\", \"0 kW\"} }")
		} else {
			for i := 1; i <= t.Len(); i++ {
				p, ok := t.RawGetInt(i).(*lua.LTable)
				if !ok || p.Len() != 2 {
					a.errorf(nil, "table[%d] must be a pair {air temperature, duty}", i)
					break
				}
				airT, err1 := parseQuantity(p.RawGetInt(1), fmt.Sprintf("table[%d] air temperature", i), units.Temperature, a.uopt)
				duty, err2 := parseQuantity(p.RawGetInt(2), fmt.Sprintf("table[%d] duty", i), units.Power, a.uopt)
				if err := errors.Join(err1, err2); err != nil {
					a.errorf(err, "%s", strings.ReplaceAll(err.Error(), "\n", "; "))
					break
				}
				m.a.Table = append(m.a.Table, loads.DutyPoint{AirT: airT, Duty: duty})
			}
		}
	} else {
		m.a.UA, _ = a.quantity("UA", units.ThermalConductance, true)
		m.a.InsideT, _ = a.quantity("inside_T", units.Temperature, true)
		m.a.BalanceT, _ = a.quantity("balance_T", units.Temperature, false)
	}
	consumerCommon(a, u)
	if a.nerr == 0 {
		if _, err := m.a.Duty(validationAmbient.Air); err != nil {
			a.loadErr(err)
		}
	}
	u.Model = m
	return u
}

// ---------------------------------------------------------------------------
// Tank cleaning.

type cleaningModel struct {
	t       loads.TankCleaning
	fromSea bool // the inlet is the case's sea temperature
}

func (m *cleaningModel) Duty(c plant.Conditions) (plant.Duty, error) {
	t := m.t
	if m.fromSea {
		amb, err := needAmbient(c, true, false)
		if err != nil {
			return plant.Duty{}, err
		}
		t.InletT = amb.Sea
	}
	res, err := t.Duty()
	if err != nil {
		return plant.Duty{}, err
	}
	return plant.Duty{W: res.Duty, Inputs: map[string]float64{
		"water_kg_s": res.Flow, "inlet_T_K": res.InletT, "outlet_T_K": res.OutletT, "p_Pa": res.Pressure,
	}}, nil
}

func buildTankCleaning(r *runner, a *args, ph *plantHandle) plant.Unit {
	u := &plant.Consumer{Label: "tank cleaning"}
	m := &cleaningModel{}
	m.t.Flow, _ = a.quantity("flow", units.MassFlow, true)
	var ok bool
	m.t.InletT, ok = a.quantity("inlet_T", units.Temperature, false)
	m.fromSea = !ok
	m.t.OutletT, _ = a.quantity("outlet_T", units.Temperature, true)
	m.t.Pressure, _ = a.quantity("p", units.Pressure, false)
	m.t.Cp, _ = a.quantity("cp", units.SpecificHeat, false)
	consumerCommon(a, u)
	if a.nerr == 0 {
		if _, err := m.Duty(plant.Conditions{SeaT: validationAmbient.Sea, AirT: validationAmbient.Air}); err != nil {
			a.loadErr(err)
		}
	}
	u.Model = m
	return u
}

// ---------------------------------------------------------------------------
// Cargo pump turbines.

func buildCargoPump(r *runner, a *args, ph *plantHandle) plant.Unit {
	u := &plant.Turbine{}
	var p loads.CargoPump
	p.Flow, _ = a.quantity("flow", units.VolumeFlow, true)
	p.Head, _ = a.quantity("head", units.Length, true)
	p.Density, _ = a.quantity("density", units.Density, true)
	p.Efficiency, _ = a.quantity("efficiency", units.Fraction, true)
	u.ExhaustP, _ = a.quantity("exhaust", units.Pressure, true)
	u.EtaIs, _ = a.quantity("eta_is", units.Fraction, true)
	u.EtaMech, _ = a.quantity("eta_mech", units.Fraction, false)
	if a.boolean("off") {
		u.Off = 1
	}
	if a.nerr == 0 {
		p.Name = a.what
		res, err := p.Power()
		if err != nil {
			a.loadErr(err)
		}
		u.Power = res.Shaft
	}
	return u
}

// ---------------------------------------------------------------------------
// Steam taken in proportion to a boiler's fuel, and small consumers.

func buildAtomisingSteam(r *runner, a *args, ph *plantHandle) plant.Unit {
	u := &plant.Consumer{Label: "atomising steam"}
	u.FuelOf, _ = a.str("boiler", true)
	ratio, _ := a.quantity("ratio", units.Fraction, true)
	if a.nerr == 0 {
		res, err := loads.AtomisingSteam{Name: a.what, SteamPerFuel: ratio}.PerKgFuel()
		if err != nil {
			a.loadErr(err)
		}
		u.SteamPerFuel = res.PerKgFuel
	}
	// Atomising steam is lost to the furnace: nothing returns.
	return u
}

func buildSootBlowing(r *runner, a *args, ph *plantHandle) plant.Unit {
	u := &plant.Consumer{Label: "soot blowing"}
	var s loads.SootBlowing
	s.WhileBlowing, _ = a.quantity("flow", units.MassFlow, true)
	s.Duration, _ = a.quantity("duration", units.Time, true)
	s.Interval, _ = a.quantity("interval", units.Time, true)
	if a.boolean("off") {
		u.Off = 1
	}
	if a.nerr == 0 {
		s.Name = a.what
		res, err := s.Flow()
		if err != nil {
			a.loadErr(err)
		}
		u.SteamFlow = res.SteamFlow
	}
	return u
}

func buildSteamTracing(r *runner, a *args, ph *plantHandle) plant.Unit {
	u := &plant.Consumer{Label: "steam tracing"}
	var s loads.SteamTracing
	if v := a.get("per_metre"); v != lua.LNil {
		str, ok := v.(lua.LString)
		text := strings.TrimSpace(string(str))
		if !ok || !strings.HasSuffix(text, "/m") {
			a.errorf(nil, "per_metre must be a power per metre such as \"30 W/m\"; got %s", describe(v))
		} else if w, err := units.Parse(strings.TrimSuffix(text, "/m"), units.Power, a.uopt); err != nil {
			a.errorf(err, "per_metre: %v", err)
		} else {
			s.PerMetre = w
		}
	} else {
		a.errorf(nil, "per_metre is required, such as per_metre = \"30 W/m\"")
	}
	s.Length, _ = a.quantity("length", units.Length, true)
	consumerCommon(a, u)
	if a.nerr == 0 {
		s.Name = a.what
		res, err := s.Duty()
		if err != nil {
			a.loadErr(err)
		}
		u.Duty = res.Duty
	}
	return u
}

func buildFreshWaterGenerator(r *runner, a *args, ph *plantHandle) plant.Unit {
	u := &plant.Consumer{Label: "fresh water generator"}
	var g loads.FreshWaterGenerator
	g.Production, _ = a.quantity("production", units.MassFlow, true)
	g.SpecificEnergy, _ = a.quantity("specific_energy", units.SpecificEnergy, false)
	g.EvaporationT, _ = a.quantity("evaporation_T", units.Temperature, false)
	g.FeedRatio, _ = a.number("feed_ratio")
	g.FeedT, _ = a.quantity("feed_T", units.Temperature, false)
	consumerCommon(a, u)
	if a.nerr == 0 {
		g.Name = a.what
		res, err := g.Duty()
		if err != nil {
			a.loadErr(err)
		}
		u.Duty = res.Duty
	}
	return u
}
