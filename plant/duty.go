package plant

import (
	"fmt"
	"math"
	"strings"

	"steamcase/plant/fuel"
	"steamcase/plant/loads"
	"steamcase/plant/units"
)

// DutyModel computes a consumer's demand for each case from the case's
// conditions and the model's own parameters: tank heating from the sea and
// air temperatures, a fuel heater from its oil flow and temperatures. The
// models of this file wrap the laws of package plant/loads; each is owned
// by one consumer and copied with it (Clone), so that the parallel clones
// of a plant can give a model's parameters other values in each profile
// row.
type DutyModel interface {
	Duty(c Conditions) (Duty, error)
	// Clone returns an independent copy.
	Clone() DutyModel
}

// Duty is a consumer's demand in one case, as its model computes it: a
// heat duty W, or a steam flow SteamKgS (when positive, W is not used), or
// a heat or a steam flow per kg of fuel of the boiler the consumer follows
// (Consumer.FuelOf). Inputs are the figures that drove it (keys carry
// their SI unit, such as "cargo_T_K"), Warnings its cautions.
type Duty struct {
	W            float64
	SteamKgS     float64
	PerFuelJ     float64 // J per kg of the boiler's fuel
	SteamPerFuel float64 // kg of steam per kg of the boiler's fuel
	Inputs       map[string]float64
	Warnings     []string
}

// The optional hooks of a duty model.
type (
	// keyedModel lists the keys of the consumer that holds the model: the
	// model's own (bound through modelOf) and the consumer keys it takes.
	keyedModel interface {
		keys() []Key
	}
	// validated checks a model's inputs when it is declared, at a
	// plausible case (see ValidateDeclaration).
	validated interface {
		validate() error
	}
	// labelled names the consumer's kind in reports.
	labelled interface {
		label() string
	}
)

// modelOf is the owner function of a duty model's fields: the model of
// type M that a consumer holds.
func modelOf[M DutyModel](c Component) (M, bool) {
	var zero M
	cons, ok := c.(*Consumer)
	if !ok {
		return zero, false
	}
	m, ok := cons.Model.(M)
	return m, ok
}

// ValidateDeclaration checks, when a component is declared, what its
// models can check before any case: a duty model is evaluated at 15 °C
// sea and air (any plausible value serves; each case's own are used when
// solving), so that a bad input is reported against the declaration.
func ValidateDeclaration(c Component) error {
	if v, ok := c.(validated); ok {
		return v.validate()
	}
	return nil
}

// validationAmbient is the case at which a model is tried when it is
// declared.
var validationAmbient = Conditions{SeaT: 288.15, AirT: 288.15}

// needAmbient returns the loads ambient of a case, or an error if the case
// did not give the temperatures the model needs.
func needAmbient(c Conditions, sea, air bool) (loads.Ambient, error) {
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

// gradeText reads a fuel grade's name for a text key.
func gradeText(vals []string) (fuel.Fuel, string, error) {
	if len(vals) != 1 {
		return fuel.Fuel{}, "", fmt.Errorf("fuel must be one grade name")
	}
	name := vals[0]
	f, err := fuel.Grade(name)
	if err != nil {
		return f, name, fmt.Errorf("fuel %q is not a built-in grade (grades: %s)", name, strings.Join(fuel.GradeNames(), ", "))
	}
	return f, name, nil
}

// text binds a text key: set receives the value as written.
func text(k Key, set func(Component, []string) error) Key {
	if k.Kind != KeyNameList && k.Kind != KeyTable {
		k.Kind = KeyText
	}
	k.text = set
	return k
}

// ---------------------------------------------------------------------------
// Tank heating.

// TankHeating is the duty of a cargo, bunker, settling or slop tank held
// at a temperature or heated up (loads.TankHeating): its losses through
// each boundary to the case's sea and air, or to a space at its own
// temperature.
//
// In a voyage the tank may be stateful (Plant.StartTank): its cargo
// temperature is then carried from row to row, and each row's duty
// follows from the temperature and the row's instruction (see
// tankstate.go).
type TankHeating struct {
	Tank loads.TankHeating
	// MinT is the lowest temperature the cargo may cool to when its
	// heating is reduced (its pumpability), K; zero means not given.
	MinT float64
	// Instr is the instruction of a stateful tank for the row (key
	// "instruction"); its temperature is Tank.To (key "T") and, for
	// loads.ReachBy, By the time from the voyage's start by which it is
	// wanted (s).
	Instr loads.Instruction
	By    float64
	// CoilP is the steam pressure at the coil (Pa); zero means the set
	// pressure of what feeds the tank's header (SupplyPressure).
	CoilP float64

	state tankState
}

// Clone copies the model; the boundaries are copied too.
func (m *TankHeating) Clone() DutyModel {
	c := *m
	c.Tank.Boundaries = append([]loads.Boundary(nil), m.Tank.Boundaries...)
	return &c
}

func (m *TankHeating) label() string { return "tank heating" }

// UsesSea reports whether the tank loses heat to the sea.
func (m *TankHeating) UsesSea() bool { return m.uses(loads.Sea) }

// UsesAir reports whether the tank loses heat to the outside air.
func (m *TankHeating) UsesAir() bool { return m.uses(loads.Air) }

func (m *TankHeating) uses(b loads.Beyond) bool {
	for _, bd := range m.Tank.Boundaries {
		if bd.Beyond == b && bd.Area*bd.U > 0 {
			return true
		}
	}
	return false
}

// Duty computes the tank's duty at the case's sea and air temperatures;
// for a stateful tank, the row's mean duty from its state and
// instruction (stateDuty).
func (m *TankHeating) Duty(c Conditions) (Duty, error) {
	if m.state.on {
		return m.stateDuty(c)
	}
	if m.Instr != loads.HoldTemp || m.By != 0 {
		return Duty{}, fmt.Errorf("instruction %q and by belong to a tank that a voyage carries from row to row (voyage(ship, { tanks = { [\"name\"] = \"40 C\" }, ... })); a load case holds or heats up by mode", m.Instr)
	}
	amb, err := needAmbient(c, m.uses(loads.Sea), m.uses(loads.Air))
	if err != nil {
		return Duty{}, err
	}
	tank := m.Tank
	if tank.Coil.Given() {
		if p := m.CoilP; p > 0 || m.state.steamP > 0 {
			if p == 0 {
				p = m.state.steamP
			}
			if ts, err := waterTsat(p); err == nil {
				tank.SteamT = ts
			}
		}
	}
	res, err := tank.Duty(amb)
	if err != nil {
		return Duty{}, err
	}
	in := map[string]float64{
		"mass_kg": res.Mass, "UA_W_per_K": res.UA, "loss_W": res.Loss, "sensible_W": res.Sensible,
		"oil_T_K": res.LossT, "ambient_T_K": res.AmbientT, "to_T_K": res.To,
	}
	if res.Mode == loads.HeatUp {
		in["from_T_K"], in["duration_s"] = res.From, res.Duration
	}
	if res.Capacity > 0 {
		in["capacity_W"] = res.Capacity
	}
	return Duty{W: res.Duty, Inputs: in, Warnings: res.Warnings}, nil
}

func (m *TankHeating) validate() error {
	_, err := m.Tank.Duty(loads.Ambient{Sea: validationAmbient.SeaT, Air: validationAmbient.AirT})
	return err
}

// shedCooling is what a shortfall does to the cargo when the heating
// delivers only delivered W: the cargo's temperature change at the start
// (the lumped model of loads.TankHeating.CoolDownAfter, docs/reference/plant-checks.md
// §6 [CP]),
//
//	dT/dt = (delivered − Σ U·A·(T0 − T_amb)) / (m·c(T0)),
//
// from the temperature held (or, heating up, from the start of the
// heat-up), and, holding with MinT given, the time until the cargo cools
// to MinT with the heating left on at delivered: with nothing delivered
// (at most a part in 1e9 of the loss) the exact time of loads' TimeToCool (Cragoe's c linear in T), else
//
//	t = (m·c/ΣUA)·ln((T0 − T_eq)/(MinT − T_eq)),  T_eq = T_amb + delivered/ΣUA,
//
// with c constant at the mean of T0 and MinT (a simplification: Cragoe's
// c changes by about 0.2 % per kelvin, so over a few kelvin the time
// moves by well under 1 %). The cargo never gets to MinT when T_eq is
// not below it.
func (m *TankHeating) shedCooling(c Conditions, delivered float64) (*TankCooling, error) {
	amb, err := needAmbient(c, m.uses(loads.Sea), m.uses(loads.Air))
	if err != nil {
		return nil, err
	}
	T0 := m.Tank.To
	if m.Tank.Mode == loads.HeatUp {
		T0 = m.Tank.From
	}
	cd, err := m.Tank.CoolDownAfter(T0, 1, amb)
	if err != nil {
		return nil, err
	}
	loss := cd.UA * (T0 - cd.AmbientT)
	out := &TankCooling{RateKS: (delivered - loss) / (cd.Mass * cd.Cp), MinT: m.MinT}
	if m.MinT <= 0 || m.Tank.Mode != loads.Hold || out.RateKS >= 0 {
		return out, nil
	}
	if m.MinT >= T0 {
		out.Reaches = true
		return out, nil
	}
	teq := cd.AmbientT + delivered/cd.UA
	if teq >= m.MinT {
		return out, nil
	}
	tc, err := m.Tank.TimeToCool(T0, m.MinT, amb)
	if err != nil {
		return nil, err
	}
	out.Reaches = true
	if delivered <= 1e-9*loss {
		// Nothing delivered, or the solver's noise of a heating shed to
		// nothing (1e-25 W): the exact time, which a part in 1e9 of the
		// loss would move by about as much, where the formula below would
		// move it by its simplification.
		out.SecondsToMinT = tc.Elapsed
		return out, nil
	}
	out.SecondsToMinT = tc.Mass * tc.Cp / tc.UA * math.Log((T0-teq)/(m.MinT-teq))
	return out, nil
}

func tankKey(k Key, f func(*TankHeating) *float64) Key {
	return num(k, modelOf[*TankHeating], f)
}

var tankHeatingKeys = append([]Key{
	text(Key{Name: "fuel", Label: "fuel", Example: `"HSFO"`,
		Doc: "the oil as a fuel grade: its density at 15 C and its Cragoe specific heat"},
		func(c Component, v []string) error {
			m, ok := modelOf[*TankHeating](c)
			if !ok {
				return nil
			}
			f, name, err := gradeText(v)
			if err != nil {
				return err
			}
			cg, err := loads.CargoFromFuel(f)
			if err != nil {
				return err
			}
			if m.Tank.Cargo.Name != "" {
				cg.Name = m.Tank.Cargo.Name
			} else {
				cg.Name = name
			}
			m.Tank.Cargo = cg
			if fp, ok := loads.SpecFlashPoint(f); ok && (m.Tank.FlashPoint == 0 || m.Tank.FlashPointAssumed) {
				m.Tank.FlashPoint, m.Tank.FlashPointAssumed = fp, true
			}
			return nil
		}),
	{Name: "density", Label: "cargo density", Kind: KeyQuantity, Dim: units.Density, Example: "950 kg/m3",
		Doc: "the oil's density (required without fuel); replaces the grade's, and Cragoe's specific gravity follows it",
		Min: 300, Max: 2000,
		get: func(c Component) (float64, bool) {
			m, ok := modelOf[*TankHeating](c)
			if !ok {
				return 0, false
			}
			return m.Tank.Cargo.Density, true
		},
		set: func(c Component, v float64) bool {
			m, ok := modelOf[*TankHeating](c)
			if ok {
				m.Tank.Cargo.Density, m.Tank.Cargo.SG = v, 0
			}
			return ok
		}},
	tankKey(Key{Name: "cp", Label: "cargo specific heat", Dim: units.SpecificHeat, Example: "1.9 kJ/kgK",
		Doc: "a constant specific heat instead of Cragoe's", DefaultNote: "Cragoe (1929) at the oil's specific gravity", Min: 500, Max: 5000, Source: "docs/reference/plant-checks.md §5.3 [S]"},
		func(m *TankHeating) *float64 { return &m.Tank.Cargo.Cp }),
	text(Key{Name: "cargo", Label: "cargo name", Example: `"heavy crude"`, Doc: "the cargo's name, for reports"},
		func(c Component, v []string) error {
			if m, ok := modelOf[*TankHeating](c); ok && len(v) == 1 {
				m.Tank.Cargo.Name = v[0]
			}
			return nil
		}),
	tankKey(Key{Name: "min_T", Label: "lowest cargo temperature", Dim: units.Temperature, Example: "45 C",
		Doc:         "the lowest temperature the cargo may cool to when its heating is reduced (a margin above its pour or cloud point): a shortfall and the N-1 lines give the time until it gets there",
		DefaultNote: "not given: the cooling rate alone", Min: loads.MinTemperature, Max: loads.MaxTemperature, Case: true, Source: SourceLeftOut},
		func(m *TankHeating) *float64 { return &m.MinT }),
	{Name: "flash_point", Label: "flash point", Kind: KeyQuantity, Dim: units.Temperature, Example: "60 C",
		Doc:         "the oil's flash point: heating near it gives the SOLAS caution",
		DefaultNote: "with fuel, the grade's ISO 8217 minimum (60 C), said to be assumed in the caution; else not checked",
		Source:      "ISO 8217 minimum flash point of the residual grades, from memory",
		Min:         loads.MinTemperature, Max: loads.MaxTemperature,
		get: func(c Component) (float64, bool) {
			m, ok := modelOf[*TankHeating](c)
			if !ok {
				return 0, false
			}
			return m.Tank.FlashPoint, true
		},
		set: func(c Component, v float64) bool {
			m, ok := modelOf[*TankHeating](c)
			if ok {
				m.Tank.FlashPoint, m.Tank.FlashPointAssumed = v, false
			}
			return ok
		}},
	{Name: "dimensions", Label: "dimensions", Kind: KeyTable,
		Example: `{ length = "30 m", breadth = "20 m", depth = "20 m", fill = "98 %" }`,
		Doc:     "the tank's dimensions, from which its boundaries follow (instead of volume and boundaries)"},
	{Name: "boundaries", Label: "boundaries", Kind: KeyTable,
		Example: `{ { area = "800 m2", U = "4.5 W/m2K", beyond = "air" } }`,
		Doc:     `the tank's faces: area, U, beyond ("sea", "air" or "space" with T), optional name`},
	tankKey(Key{Name: "volume", Label: "cargo volume", Dim: units.Volume, Example: "30000 m3",
		Doc: "volume of oil in the tank (with boundaries)", Min: 0, Max: 1e7},
		func(m *TankHeating) *float64 { return &m.Tank.CargoVolume }),
	choice(Key{Name: "mode", Label: "mode", Choices: []string{"hold", "heat_up"}, Example: `"hold"`,
		Doc:     `"hold" keeps the cargo at T; "heat_up" raises it from "from" to "to" in "duration"`,
		Default: 0, HasDefault: true, Case: true, Source: SourceRule},
		modelOf[*TankHeating], func(m *TankHeating) *loads.TankMode { return &m.Tank.Mode }),
	tankKey(Key{Name: "T", Label: "temperature held", Dim: units.Temperature, Example: "55 C",
		Doc: "temperature held (mode hold; required there); for a tank a voyage carries from row to row, the instruction's temperature", Min: loads.MinTemperature, Max: loads.MaxTemperature, Case: true},
		func(m *TankHeating) *float64 { return &m.Tank.To }),
	tankKey(Key{Name: "from", Label: "heat-up start temperature", Dim: units.Temperature, Example: "30 C",
		Doc: "temperature at the start of a heat-up (mode heat_up; required there)", Min: loads.MinTemperature, Max: loads.MaxTemperature, Case: true},
		func(m *TankHeating) *float64 { return &m.Tank.From }),
	tankKey(Key{Name: "to", Label: "heat-up end temperature", Dim: units.Temperature, Example: "50 C",
		Doc: "temperature reached by a heat-up (mode heat_up; required there)", Min: loads.MinTemperature, Max: loads.MaxTemperature, Case: true},
		func(m *TankHeating) *float64 { return &m.Tank.To }),
	tankKey(Key{Name: "duration", Label: "heat-up time", Dim: units.Time, Example: "96 h",
		Doc: "time of a heat-up (mode heat_up; required there)", Min: 1, Max: 1e8, Case: true},
		func(m *TankHeating) *float64 { return &m.Tank.Duration }),
	choice(Key{Name: "use", Label: "what the tank holds", Choices: []string{"storage", "settling", "service", "cargo"}, Example: `"cargo"`,
		Doc:     `"storage" (fuel in a storage tank), "settling" or "service" (fuel in a tank of the supply system) or "cargo": the basis of the flash-point caution (SOLAS II-2 reg. 4.2 for fuel, the cargo's own rules for cargo)`,
		Default: 0, HasDefault: true, Source: SourceRule},
		modelOf[*TankHeating], func(m *TankHeating) *loads.TankUse { return &m.Tank.Use }),
	choice(Key{Name: "coil", Label: "coil kind", Choices: []string{"coil", "deck_heater"}, Example: `"coil"`,
		Doc:     `the heating coil: "coil", steam coils in the tank, or "deck_heater", a heater the cargo is pumped through (give circulation)`,
		Default: 0, HasDefault: true, Source: SourceRule},
		modelOf[*TankHeating], func(m *TankHeating) *loads.CoilKind { return &m.Tank.Coil.Kind }),
	tankKey(Key{Name: "coil_area", Label: "coil area", Dim: units.Area, Example: "900 m2",
		Doc:         "heating surface of the coil; its capacity U·A·LMTD limits a tank carried from row to row (required there)",
		DefaultNote: "no coil: the duty is not limited", Min: 0, Max: 1e6, Source: SourceLeftOut},
		func(m *TankHeating) *float64 { return &m.Tank.Coil.Area }),
	tankKey(Key{Name: "coil_U", Label: "coil U", Dim: units.HeatTransferCoefficient, Example: "60 W/m2K",
		Doc:         "overall heat-transfer coefficient of the coil, steam to cargo",
		DefaultNote: "60 W/m2K for a coil in the tank, 250 W/m2K for a deck heater (plant/loads' DefaultCoilU, DefaultDeckHeaterU)",
		Source:      "docs/reference/plant-checks.md §6 coil row [M] (a coil); from memory (a deck heater)", Min: 1, Max: 5000},
		func(m *TankHeating) *float64 { return &m.Tank.Coil.U }),
	tankKey(Key{Name: "circulation", Label: "cargo circulation", Dim: units.VolumeFlow, Example: "200 m3/h",
		Doc: "cargo pumped through a deck heater (coil = \"deck_heater\"; required there)", Min: 0, Max: 100},
		func(m *TankHeating) *float64 { return &m.Tank.Coil.Circulation }),
	tankKey(Key{Name: "coil_p", Label: "steam pressure at the coil", Dim: units.Pressure, Example: "7 bar(g)",
		Doc:         "pressure of the steam in the coil, for its saturation temperature",
		DefaultNote: "the set pressure of the reducing valve or boiler that feeds the tank's header", Min: 1.1e5, Max: 5e6, Source: SourceDerived},
		func(m *TankHeating) *float64 { return &m.CoilP }),
	{Name: "max_rate", Label: "heat-up rate caution", Kind: KeyQuantity, Dim: units.TemperatureDifference, Example: "2 K",
		Doc:     "heat-up per day above which a tank carried from row to row warns (a caution, not a cap)",
		Default: loads.DefaultMaxHeatUpRate * 86400, HasDefault: true, Source: "common practice, no source: 1 to 3 K per day for large heated cargoes",
		Min: 0.01, Max: 500,
		get: func(c Component) (float64, bool) {
			m, ok := modelOf[*TankHeating](c)
			if !ok {
				return 0, false
			}
			return m.Tank.MaxRate * 86400, true
		},
		set: func(c Component, v float64) bool {
			m, ok := modelOf[*TankHeating](c)
			if ok {
				m.Tank.MaxRate = v / 86400
			}
			return ok
		}},
	choice(Key{Name: "instruction", Label: "instruction", Choices: []string{"hold", "off", "heat_to", "reach"}, Example: `"heat_to"`,
		Doc: `for a tank a voyage carries from row to row: "hold" (at T, or where it is), "off", "heat_to" T at the coil's capacity, ` +
			`or "reach" T by a time (by)`,
		Default: 0, HasDefault: true, Case: true, Source: SourceRule},
		modelOf[*TankHeating], func(m *TankHeating) *loads.Instruction { return &m.Instr }),
	tankKey(Key{Name: "by", Label: "time wanted by", Dim: units.Time, Example: "240 h",
		Doc: `with instruction "reach": the time from the voyage's start by which T is wanted`, Min: 0, Max: 1e9, Case: true},
		func(m *TankHeating) *float64 { return &m.By }),
}, consumerModelKeys...)

func (m *TankHeating) keys() []Key { return tankHeatingKeys }

// ---------------------------------------------------------------------------
// Fuel oil heaters.

// FuelHeater is the duty of a fuel oil heater (loads.FuelHeater): to a set
// outlet temperature or to the temperature of a target viscosity. A
// burner's heater (Service loads.BoilerBurner) heats the fuel its boiler
// burns: its duty is per kg of that fuel (Consumer.FuelOf). A main
// engine's heater may follow the engine: with SFOC and EngineMCR its oil
// flow is the engine's fuel, SFOC × MCR × the case's engine load (SFOC
// one figure, or interpolated in SFOCLoad; outside the given loads the end
// figure holds, with a warning). Simplification: the heater heats the fuel
// the engine burns, from the inlet temperature; the circulating flow
// above it returns hot and is not counted; with the engine stopped the
// duty is zero.
type FuelHeater struct {
	Heater loads.FuelHeater
	// SFOC is the engine's specific fuel oil consumption, kg/J, at the
	// loads SFOCLoad (fractions of MCR, increasing; nil for one figure);
	// EngineMCR its MCR, W.
	SFOC, SFOCLoad []float64
	EngineMCR      float64
}

// Clone copies the model.
func (m *FuelHeater) Clone() DutyModel {
	c := *m
	c.SFOC = append([]float64(nil), m.SFOC...)
	c.SFOCLoad = append([]float64(nil), m.SFOCLoad...)
	return &c
}

// engineFlow is the oil flow of a heater that follows the engine, kg/s,
// at engine load (a fraction of MCR), with a warning outside the SFOC
// table's loads.
func (m *FuelHeater) engineFlow(load float64) (float64, string) {
	if len(m.SFOCLoad) == 0 {
		return m.SFOC[0] * m.EngineMCR * load, ""
	}
	sfoc, warn := interpolate(m.SFOCLoad, m.SFOC, load, "SFOC table")
	return sfoc * m.EngineMCR * load, warn
}

func (m *FuelHeater) label() string { return "fuel heater" }

// Duty computes the heater's duty, or its heat per kg of fuel for a
// burner's heater.
func (m *FuelHeater) Duty(c Conditions) (Duty, error) {
	if m.Heater.Service == loads.BoilerBurner {
		res, err := m.Heater.DutyPerKg()
		if err != nil {
			return Duty{}, err
		}
		return Duty{PerFuelJ: res.PerKg, Warnings: res.Warnings}, nil
	}
	h := m.Heater
	var warns []string
	if len(m.SFOC) > 0 {
		if !(c.EngineLoad >= 0) || c.EngineLoad > 1.5 {
			return Duty{}, fmt.Errorf("engine load %g is not a fraction of the engine's MCR between 0 and 1.5", c.EngineLoad)
		}
		if c.EngineLoad == 0 {
			return Duty{Inputs: map[string]float64{"oil_kg_s": 0, "engine_load": 0}}, nil
		}
		flow, warn := m.engineFlow(c.EngineLoad)
		h.MassFlow = flow
		if warn != "" {
			warns = append(warns, warn)
		}
	}
	res, err := h.Duty()
	if err != nil {
		return Duty{}, err
	}
	in := map[string]float64{
		"oil_kg_s": res.MassFlow, "inlet_T_K": res.InletT, "outlet_T_K": res.OutletT, "per_kg_J_per_kg": res.PerKg,
	}
	if len(m.SFOC) > 0 {
		in["engine_load"] = c.EngineLoad
	}
	return Duty{W: res.Duty, Warnings: append(warns, res.Warnings...), Inputs: in}, nil
}

func (m *FuelHeater) validate() error {
	if len(m.SFOC) > 0 {
		if !(m.EngineMCR > 0) {
			return fmt.Errorf("sfoc needs the engine's MCR it refers to: give engine_mcr, such as engine_mcr = \"11 MW\"")
		}
		if m.Heater.Service != loads.EngineService {
			return fmt.Errorf("sfoc is for a main engine's heater (service = \"engine\")")
		}
		if m.Heater.MassFlow != 0 {
			return fmt.Errorf("give flow or sfoc with engine_mcr, not both")
		}
		if len(m.SFOCLoad) != 0 && len(m.SFOCLoad) != len(m.SFOC) {
			return fmt.Errorf("SFOC table has %d loads and %d figures", len(m.SFOCLoad), len(m.SFOC))
		}
		for i, v := range m.SFOC {
			// 100-400 g/kWh, about the 150-250 of marine diesel engines
			// either way (common practice, no source).
			if !(v >= 100e-3/3.6e6 && v <= 400e-3/3.6e6) {
				return fmt.Errorf("sfoc %.1f g/kWh is outside 100-400 g/kWh", v*3.6e9)
			}
			if i < len(m.SFOCLoad) && (!(m.SFOCLoad[i] > 0 && m.SFOCLoad[i] <= 1.5) || (i > 0 && m.SFOCLoad[i] <= m.SFOCLoad[i-1])) {
				return fmt.Errorf("SFOC table loads must increase within 0-150 %% of MCR; got %g", m.SFOCLoad)
			}
		}
		_, err := m.Duty(Conditions{SeaT: validationAmbient.SeaT, AirT: validationAmbient.AirT, EngineLoad: 1})
		return err
	}
	_, err := m.Duty(validationAmbient)
	return err
}

func heaterKey(k Key, f func(*FuelHeater) *float64) Key {
	return num(k, modelOf[*FuelHeater], f)
}

var fuelHeaterKeys = append([]Key{
	choice(Key{Name: "service", Label: "service", Choices: []string{"engine", "burner", "purifier", "transfer"},
		Example: `"purifier"`, Required: true,
		Doc: `what the heater serves: "engine", "burner" (a boiler's burner: give boiler), "purifier" or "transfer"`},
		modelOf[*FuelHeater], func(m *FuelHeater) *loads.HeaterService { return &m.Heater.Service }),
	text(Key{Name: "fuel", Label: "fuel", Example: `"HSFO"`, Required: true, Doc: "the oil heated, as a fuel grade"},
		func(c Component, v []string) error {
			m, ok := modelOf[*FuelHeater](c)
			if !ok {
				return nil
			}
			f, _, err := gradeText(v)
			if err != nil {
				return err
			}
			m.Heater.Fuel = f
			return nil
		}),
	heaterKey(Key{Name: "density15", Label: "density at 15 C", Dim: units.Density, Example: "991 kg/m3",
		Doc: "the oil's density at 15 C, from its delivery note; replaces the grade's", Min: 600, Max: 1100},
		func(m *FuelHeater) *float64 { return &m.Heater.Fuel.ISO.Density15 }),
	heaterKey(Key{Name: "viscosity", Label: "viscosity at 50 C", Dim: units.KinematicViscosity, Example: "380 cSt",
		Doc: "the oil's viscosity at 50 C, from its delivery note; replaces the grade's", Min: 1e-7, Max: 1e-1},
		func(m *FuelHeater) *float64 { return &m.Heater.Fuel.ISO.Viscosity }),
	heaterKey(Key{Name: "flow", Label: "oil flow", Dim: units.MassFlow, Example: "2.2 t/h",
		Doc: "the oil flow (required but for a burner's heater, whose flow is its boiler's fuel, and an engine's heater given sfoc)", Min: 0, Max: 1e3, Case: true},
		func(m *FuelHeater) *float64 { return &m.Heater.MassFlow }),
	{Name: "sfoc", Label: "SFOC", Kind: KeyTable, Example: `{ {"50 %", "178 g/kWh"}, {"100 %", "172 g/kWh"} }`,
		Doc: "an engine's heater: the engine's specific fuel consumption, one figure (\"175 g/kWh\") or {load, sfoc} pairs, with engine_mcr: the oil flow follows the case's engine load"},
	heaterKey(Key{Name: "engine_mcr", Label: "engine MCR", Dim: units.Power, Example: "11 MW",
		Doc: "the main engine's MCR (with sfoc)", Min: 1e3, Max: 2e8},
		func(m *FuelHeater) *float64 { return &m.EngineMCR }),
	heaterKey(Key{Name: "inlet_T", Label: "oil inlet temperature", Dim: units.Temperature, Example: "60 C",
		Doc: "oil temperature at the inlet", Required: true, Min: loads.MinTemperature, Max: loads.MaxTemperature, Case: true},
		func(m *FuelHeater) *float64 { return &m.Heater.InletT }),
	heaterKey(Key{Name: "outlet_T", Label: "oil outlet temperature", Dim: units.Temperature, Example: "98 C",
		Doc: "a set outlet temperature (or target_viscosity)", Min: loads.MinTemperature, Max: loads.MaxTemperature, Case: true},
		func(m *FuelHeater) *float64 { return &m.Heater.OutletT }),
	heaterKey(Key{Name: "target_viscosity", Label: "target viscosity", Dim: units.KinematicViscosity, Example: "15 cSt",
		Doc: "the viscosity wanted at the outlet (or outlet_T)", Min: 1e-7, Max: 1e-2, Case: true},
		func(m *FuelHeater) *float64 { return &m.Heater.TargetViscosity }),
	heaterKey(Key{Name: "outlet_limit", Label: "outlet limit", Dim: units.Temperature, Example: "150 C",
		Doc: "highest outlet temperature the heater may reach; above it a warning", DefaultNote: "no limit",
		Min: loads.MinTemperature, Max: loads.MaxTemperature, Source: SourceLeftOut},
		func(m *FuelHeater) *float64 { return &m.Heater.OutletLimit }),
	heaterKey(Key{Name: "flash_point", Label: "flash point", Dim: units.Temperature, Example: "60 C",
		Doc: "the oil's flash point, from its delivery note", DefaultNote: "not checked",
		Min: loads.MinTemperature, Max: loads.MaxTemperature, Source: SourceRule},
		func(m *FuelHeater) *float64 { return &m.Heater.FlashPoint }),
	boilerOfKey,
}, consumerModelKeys...)

func (m *FuelHeater) keys() []Key { return fuelHeaterKeys }

// boilerOfKey is the boiler whose fuel flow drives a consumer.
var boilerOfKey = text(Key{Name: "boiler", Label: "boiler", Example: `"AB1"`,
	Doc: "the boiler whose fuel flow drives the consumer (a burner's heater, atomising steam)"},
	func(c Component, v []string) error {
		if cons, ok := self[*Consumer](c); ok && len(v) == 1 {
			cons.FuelOf = v[0]
		}
		return nil
	})

// ---------------------------------------------------------------------------
// Accommodation heating.

// Accommodation is the heating of the accommodation (loads.Accommodation)
// at the case's air temperature.
type Accommodation struct {
	Heating loads.Accommodation
}

// Clone copies the model and its table.
func (m *Accommodation) Clone() DutyModel {
	c := *m
	c.Heating.Table = append([]loads.DutyPoint(nil), m.Heating.Table...)
	return &c
}

func (m *Accommodation) label() string { return "accommodation heating" }

// Duty computes the heating duty at the case's air temperature.
func (m *Accommodation) Duty(c Conditions) (Duty, error) {
	amb, err := needAmbient(c, false, true)
	if err != nil {
		return Duty{}, err
	}
	res, err := m.Heating.Duty(amb.Air)
	if err != nil {
		return Duty{}, err
	}
	return Duty{W: res.Duty, Warnings: res.Warnings, Inputs: map[string]float64{"air_T_K": res.AirT}}, nil
}

func (m *Accommodation) validate() error {
	_, err := m.Heating.Duty(validationAmbient.AirT)
	return err
}

func accommodationKey(k Key, f func(*Accommodation) *float64) Key {
	return num(k, modelOf[*Accommodation], f)
}

var accommodationKeys = append([]Key{
	accommodationKey(Key{Name: "UA", Label: "UA", Dim: units.ThermalConductance, Example: "18 kW/K",
		Doc: "heat-loss conductance of the spaces (without table; required there)", Min: 0, Max: 1e8},
		func(m *Accommodation) *float64 { return &m.Heating.UA }),
	accommodationKey(Key{Name: "inside_T", Label: "inside temperature", Dim: units.Temperature, Example: "21 C",
		Doc: "temperature held inside (without table; required there)", Min: loads.MinTemperature, Max: loads.MaxTemperature, Case: true},
		func(m *Accommodation) *float64 { return &m.Heating.InsideT }),
	accommodationKey(Key{Name: "balance_T", Label: "balance temperature", Dim: units.Temperature, Example: "16 C",
		Doc: "outside temperature at and above which no heating is needed", DefaultNote: "inside_T",
		Min: loads.MinTemperature, Max: loads.MaxTemperature, Source: SourceDerived},
		func(m *Accommodation) *float64 { return &m.Heating.BalanceT }),
	{Name: "table", Label: "table", Kind: KeyTable, Example: `{ {"-10 C", "300 kW"}, {"15 C", "0 kW"} }`,
		Doc: "{air temperature, duty} pairs, air increasing, instead of UA and inside_T"},
}, consumerModelKeys...)

func (m *Accommodation) keys() []Key { return accommodationKeys }

// ---------------------------------------------------------------------------
// Tank cleaning.

// TankCleaning is the duty of a tank-cleaning water heater
// (loads.TankCleaning). With Cleaning.InletT zero the water comes in at the
// case's sea temperature.
type TankCleaning struct {
	Cleaning loads.TankCleaning
}

// Clone copies the model.
func (m *TankCleaning) Clone() DutyModel { c := *m; return &c }

func (m *TankCleaning) label() string { return "tank cleaning" }

// Duty computes the heater's duty.
func (m *TankCleaning) Duty(c Conditions) (Duty, error) {
	t := m.Cleaning
	if t.InletT == 0 {
		amb, err := needAmbient(c, true, false)
		if err != nil {
			return Duty{}, err
		}
		t.InletT = amb.Sea
	}
	res, err := t.Duty()
	if err != nil {
		return Duty{}, err
	}
	return Duty{W: res.Duty, Inputs: map[string]float64{
		"water_kg_s": res.Flow, "inlet_T_K": res.InletT, "outlet_T_K": res.OutletT, "p_Pa": res.Pressure,
	}}, nil
}

func (m *TankCleaning) validate() error {
	_, err := m.Duty(validationAmbient)
	return err
}

func cleaningKey(k Key, f func(*TankCleaning) *float64) Key {
	return num(k, modelOf[*TankCleaning], f)
}

var tankCleaningKeys = append([]Key{
	cleaningKey(Key{Name: "flow", Label: "water flow", Dim: units.MassFlow, Example: "40 t/h",
		Doc: "cleaning water flow", Required: true, Min: 0, Max: 1e3, Case: true},
		func(m *TankCleaning) *float64 { return &m.Cleaning.Flow }),
	cleaningKey(Key{Name: "inlet_T", Label: "water inlet temperature", Dim: units.Temperature, Example: "15 C",
		Doc: "water temperature at the inlet", DefaultNote: "the case's sea temperature",
		Min: loads.MinTemperature, Max: loads.MaxTemperature, Case: true, Source: SourceDerived},
		func(m *TankCleaning) *float64 { return &m.Cleaning.InletT }),
	cleaningKey(Key{Name: "outlet_T", Label: "water outlet temperature", Dim: units.Temperature, Example: "75 C",
		Doc: "water temperature wanted at the outlet", Required: true, Min: loads.MinTemperature, Max: loads.MaxTemperature, Case: true},
		func(m *TankCleaning) *float64 { return &m.Cleaning.OutletT }),
	cleaningKey(Key{Name: "p", Label: "water pressure", Dim: units.Pressure, Example: "10 bar(g)",
		Doc: "water pressure in the heater", DefaultNote: "plant/loads' DefaultCleaningPressure", Min: 1e3, Max: 5e7, Source: SourceDerived},
		func(m *TankCleaning) *float64 { return &m.Cleaning.Pressure }),
	cleaningKey(Key{Name: "cp", Label: "water specific heat", Dim: units.SpecificHeat, Example: "3.99 kJ/kgK",
		Doc: "a constant specific heat (sea water) instead of IAPWS-IF97", Min: 1000, Max: 5000},
		func(m *TankCleaning) *float64 { return &m.Cleaning.Cp }),
}, consumerModelKeys...)

func (m *TankCleaning) keys() []Key { return tankCleaningKeys }

// ---------------------------------------------------------------------------
// Atomising steam, soot blowing, steam tracing, fresh-water generator.

// AtomisingSteam is the burner's atomising steam, in proportion to its
// boiler's fuel (loads.AtomisingSteam); it is lost to the furnace.
type AtomisingSteam struct {
	Steam loads.AtomisingSteam
}

// Clone copies the model.
func (m *AtomisingSteam) Clone() DutyModel { c := *m; return &c }

func (m *AtomisingSteam) label() string { return "atomising steam" }

// Duty gives the steam per kg of the boiler's fuel.
func (m *AtomisingSteam) Duty(Conditions) (Duty, error) {
	res, err := m.Steam.PerKgFuel()
	if err != nil {
		return Duty{}, err
	}
	return Duty{SteamPerFuel: res.PerKgFuel}, nil
}

func (m *AtomisingSteam) validate() error { _, err := m.Duty(validationAmbient); return err }

var atomisingKeys = []Key{
	num(Key{Name: "ratio", Label: "steam per fuel", Dim: units.Fraction, Example: "2 %",
		Doc: "kg of atomising steam per kg of fuel, the burner maker's figure", Required: true, Min: 0, Max: 0.5, Case: true},
		modelOf[*AtomisingSteam], func(m *AtomisingSteam) *float64 { return &m.Steam.SteamPerFuel }),
	func() Key { k := boilerOfKey; k.Required = true; return k }(),
	offKey, factorKey,
}

func (m *AtomisingSteam) keys() []Key { return atomisingKeys }

// SootBlowing is a boiler's or economiser's soot blowing by steam, as the
// mean over its interval (loads.SootBlowing).
type SootBlowing struct {
	Blowing loads.SootBlowing
}

// Clone copies the model.
func (m *SootBlowing) Clone() DutyModel { c := *m; return &c }

func (m *SootBlowing) label() string { return "soot blowing" }

// Duty gives the mean steam flow.
func (m *SootBlowing) Duty(Conditions) (Duty, error) {
	res, err := m.Blowing.Flow()
	if err != nil {
		return Duty{}, err
	}
	return Duty{SteamKgS: res.SteamFlow}, nil
}

func (m *SootBlowing) validate() error { _, err := m.Duty(validationAmbient); return err }

func sootKey(k Key, f func(*SootBlowing) *float64) Key { return num(k, modelOf[*SootBlowing], f) }

var sootBlowingKeys = []Key{
	sootKey(Key{Name: "flow", Label: "steam while blowing", Dim: units.MassFlow, Example: "1.5 t/h",
		Doc: "steam flow while blowing", Required: true, Min: 0, Max: 1e3, Case: true},
		func(m *SootBlowing) *float64 { return &m.Blowing.WhileBlowing }),
	sootKey(Key{Name: "duration", Label: "blowing duration", Dim: units.Time, Example: "10 min",
		Doc: "duration of one blow", Required: true, Min: 1e-3, Max: 1e8, Case: true},
		func(m *SootBlowing) *float64 { return &m.Blowing.Duration }),
	sootKey(Key{Name: "interval", Label: "interval", Dim: units.Time, Example: "8 h",
		Doc: "time between the starts of two blows", Required: true, Min: 1e-3, Max: 1e8, Case: true},
		func(m *SootBlowing) *float64 { return &m.Blowing.Interval }),
	offKey, consumerPriorityKey,
}

func (m *SootBlowing) keys() []Key { return sootBlowingKeys }

// SteamTracing is the steam tracing of pipes: a heat per metre times the
// traced length (loads.SteamTracing).
type SteamTracing struct {
	Tracing loads.SteamTracing
}

// Clone copies the model.
func (m *SteamTracing) Clone() DutyModel { c := *m; return &c }

func (m *SteamTracing) label() string { return "steam tracing" }

// Duty gives the tracing's heat.
func (m *SteamTracing) Duty(Conditions) (Duty, error) {
	res, err := m.Tracing.Duty()
	if err != nil {
		return Duty{}, err
	}
	return Duty{W: res.Duty}, nil
}

func (m *SteamTracing) validate() error { _, err := m.Duty(validationAmbient); return err }

var steamTracingKeys = append([]Key{
	text(Key{Name: "per_metre", Label: "heat per metre", Example: `"30 W/m"`, Required: true,
		Doc: "heat given per metre of traced pipe, as a power per metre"},
		func(c Component, v []string) error {
			m, ok := modelOf[*SteamTracing](c)
			if !ok || len(v) != 1 {
				return nil
			}
			s := strings.TrimSpace(v[0])
			if !strings.HasSuffix(s, "/m") {
				return fmt.Errorf("per_metre must be a power per metre such as \"30 W/m\"; got %q", v[0])
			}
			w, err := units.Parse(strings.TrimSuffix(s, "/m"), units.Power, units.Options{})
			if err != nil {
				return fmt.Errorf("per_metre: %w", err)
			}
			m.Tracing.PerMetre = w
			return nil
		}),
	num(Key{Name: "length", Label: "traced length", Dim: units.Length, Example: "400 m",
		Doc: "length of traced pipe", Required: true, Min: 0, Max: 1e6, Case: true},
		modelOf[*SteamTracing], func(m *SteamTracing) *float64 { return &m.Tracing.Length }),
}, consumerModelKeys...)

func (m *SteamTracing) keys() []Key { return steamTracingKeys }

// FreshWaterGenerator is the heat a fresh-water generator takes from
// steam for its distillate (loads.FreshWaterGenerator).
type FreshWaterGenerator struct {
	Generator loads.FreshWaterGenerator
}

// Clone copies the model.
func (m *FreshWaterGenerator) Clone() DutyModel { c := *m; return &c }

func (m *FreshWaterGenerator) label() string { return "fresh water generator" }

// Duty gives the generator's heat.
func (m *FreshWaterGenerator) Duty(Conditions) (Duty, error) {
	res, err := m.Generator.Duty()
	if err != nil {
		return Duty{}, err
	}
	return Duty{W: res.Duty}, nil
}

func (m *FreshWaterGenerator) validate() error { _, err := m.Duty(validationAmbient); return err }

func fwgKey(k Key, f func(*FreshWaterGenerator) *float64) Key {
	return num(k, modelOf[*FreshWaterGenerator], f)
}

var freshWaterKeys = append([]Key{
	fwgKey(Key{Name: "production", Label: "distillate production", Dim: units.MassFlow, Example: "1 t/h",
		Doc: "distillate produced", Required: true, Min: 0, Max: 1e3, Case: true},
		func(m *FreshWaterGenerator) *float64 { return &m.Generator.Production }),
	fwgKey(Key{Name: "specific_energy", Label: "heat per kg of distillate", Dim: units.SpecificEnergy, Example: "2400 kJ/kg",
		Doc: "a given heat per kg of distillate", DefaultNote: "computed from evaporation_T, feed_ratio and feed_T", Min: 1, Max: 1e8, Source: SourceDerived},
		func(m *FreshWaterGenerator) *float64 { return &m.Generator.SpecificEnergy }),
	fwgKey(Key{Name: "evaporation_T", Label: "evaporation temperature", Dim: units.Temperature, Example: "45 C",
		Doc: "boiling temperature in the evaporator", Min: loads.MinTemperature, Max: loads.MaxTemperature},
		func(m *FreshWaterGenerator) *float64 { return &m.Generator.EvaporationT }),
	fwgKey(Key{Name: "feed_ratio", Label: "feed ratio", Kind: KeyNumber, Example: "3",
		Doc: "kg of sea-water feed per kg of distillate", DefaultNote: "the feed's sensible heat is not counted", Source: SourceLeftOut},
		func(m *FreshWaterGenerator) *float64 { return &m.Generator.FeedRatio }),
	fwgKey(Key{Name: "feed_T", Label: "feed temperature", Dim: units.Temperature, Example: "30 C",
		Doc: "feed temperature entering the evaporator (with feed_ratio)", Min: loads.MinTemperature, Max: loads.MaxTemperature},
		func(m *FreshWaterGenerator) *float64 { return &m.Generator.FeedT }),
}, consumerModelKeys...)

func (m *FreshWaterGenerator) keys() []Key { return freshWaterKeys }

// ---------------------------------------------------------------------------
// Warming steam.

// BoilerWarming is the steam that keeps an idle boiler warm, at its
// pressure and ready to fire, while the firing rule leaves it off: steam
// from the plant's header (raised by the exhaust-gas economiser or the
// other boiler) makes up the boiler's standby loss (Boiler.StandbyLoss or
// its efficiency model's casing loss) and condenses in it. While the boiler
// fires it takes nothing. The consumer evaluates it against the firing
// state of the configuration being solved, so its Duty is zero.
type BoilerWarming struct {
	// Boiler names the boiler kept warm.
	Boiler string
}

// Clone copies the model.
func (m *BoilerWarming) Clone() DutyModel { c := *m; return &c }

func (m *BoilerWarming) label() string { return "boiler warming" }

// Duty is zero: the consumer takes the boiler's standby loss in each
// configuration the boiler does not fire in.
func (m *BoilerWarming) Duty(Conditions) (Duty, error) { return Duty{}, nil }

var boilerWarmingKeys = append([]Key{
	text(Key{Name: "boiler", Label: "boiler", Example: `"AB2"`, Required: true,
		Doc: "the boiler kept warm while it does not fire"},
		func(c Component, v []string) error {
			if m, ok := modelOf[*BoilerWarming](c); ok && len(v) == 1 {
				m.Boiler = v[0]
			}
			return nil
		}),
}, returnKeys[0], returnKeys[1], offKey)

func (m *BoilerWarming) keys() []Key { return boilerWarmingKeys }
