package plant

// KindSpec is a kind of component as a script declares it: its name, a
// line of documentation and its constructor. The kind's keys are those of
// the component New returns (Component.Keys).
type KindSpec struct {
	Name string // as a script writes it: "boiler"
	Doc  string
	New  func() Component
}

// Keys returns the keys of the kind.
func (k KindSpec) Keys() []Key { return k.New().Keys() }

// Kinds returns the kinds of component of this package, in the order the
// documentation lists them. Adding a kind is a file like pump.go and a
// line here.
func Kinds() []KindSpec { return append([]KindSpec(nil), kinds[:]...) }

// Kind returns the kind called name.
func Kind(name string) (KindSpec, bool) {
	for _, k := range kinds {
		if k.Name == name {
			return k, true
		}
	}
	return KindSpec{}, false
}

// kinds is the registry: a constant table, never written.
var kinds = [...]KindSpec{
	{"makeup", "fresh water that replaces what the plant loses", func() Component { return NewMakeUp() }},
	{"feed_tank", "the hotwell or cascade tank: mixing, heat loss, steam heating, venting", func() Component { return NewFeedTank() }},
	{"observation_tank", "a vented tank the returning condensate passes, to see oil from a leaking coil", func() Component { return NewObservationTank() }},
	{"feed_pump", "raises the feed to the drum pressure plus a margin", func() Component { return NewFeedPump() }},
	{"boiler", "an oil-fired boiler", func() Component { return NewBoiler() }},
	{"economiser", "heats a boiler's feed with its own flue gas", func() Component { return NewEconomiser() }},
	{"exhaust_gas_economiser", "raises steam from the main engine's exhaust", func() Component { return NewExhaustGasEconomiser() }},
	{"header", "a steam header or any junction, with heat loss", func() Component { return NewHeader() }},
	{"reducing_valve", "a pressure-reducing valve (isenthalpic)", func() Component { return NewReducingValve() }},
	{"consumer", "a heat consumer of a set duty or steam flow", func() Component { return NewConsumer() }},
	{"tank_heating", "a cargo, bunker, settling or slop tank held warm or heated up", func() Component { return NewModelConsumer(&TankHeating{}) }},
	{"fuel_heater", "a fuel oil heater to a temperature or a viscosity", func() Component { return NewModelConsumer(&FuelHeater{}) }},
	{"accommodation", "accommodation heating by the outside air temperature", func() Component { return NewModelConsumer(&Accommodation{}) }},
	{"tank_cleaning", "a tank-cleaning water heater", func() Component { return NewModelConsumer(&TankCleaning{}) }},
	{"atomising_steam", "a burner's atomising steam, in proportion to its fuel", func() Component { return NewModelConsumer(&AtomisingSteam{}) }},
	{"soot_blowing", "soot blowing by steam, averaged over its interval", func() Component { return NewModelConsumer(&SootBlowing{}) }},
	{"steam_tracing", "steam tracing of pipes", func() Component { return NewModelConsumer(&SteamTracing{}) }},
	{"fresh_water_generator", "a fresh-water generator heated by steam", func() Component { return NewModelConsumer(&FreshWaterGenerator{}) }},
	{"boiler_warming", "steam that keeps an idle boiler warm while it does not fire", func() Component { return NewModelConsumer(&BoilerWarming{}) }},
	{"turbine", "a steam turbine of a set shaft power", func() Component { return NewTurbine() }},
	{"cargo_pump", "a steam turbine driving a cargo pump", func() Component { return NewCargoPumpTurbine() }},
	{"condenser", "a condenser, or a dump condenser for the economisers' surplus steam", func() Component { return NewCondenser() }},
}
