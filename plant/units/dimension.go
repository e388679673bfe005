package units

// Dimension is the physical kind of a quantity. The zero value is not a
// valid dimension; passing it to Parse is a programmer mistake and panics.
type Dimension uint8

// The dimensions the package knows. Each converts to one SI unit, named in
// the comment.
const (
	invalidDimension Dimension = iota

	Fraction                // dimensionless, 1 (a bare number or %)
	Pressure                // absolute pressure, Pa
	Temperature             // absolute (thermodynamic) temperature, K
	TemperatureDifference   // temperature difference, K
	MassFlow                // kg/s
	Power                   // heat flow or power, W
	Energy                  // J
	SpecificEnergy          // specific enthalpy or energy, J/kg
	SpecificHeat            // specific heat or specific entropy, J/(kg K)
	SpecificVolume          // m3/kg
	KinematicViscosity      // m2/s
	Density                 // kg/m3
	Length                  // m
	Area                    // m2
	Volume                  // m3
	VolumeFlow              // m3/s
	Mass                    // kg
	Time                    // s
	Velocity                // m/s
	HeatTransferCoefficient // W/(m2 K)
	FoulingResistance       // m2 K/W
	ThermalConductance      // W/K (a UA value)
	ThermalConductivity     // W/(m K)
	// SpecificConsumption is mass per energy, kg/J: a turbine's steam
	// rate ("8.5 kg/kWh") or an engine's specific fuel oil consumption
	// ("175 g/kWh").
	SpecificConsumption

	numDimensions
)

// dimInfo describes a dimension for messages.
type dimInfo struct {
	name    string // "pressure"
	article string // "a" or "an"
	example string // "7 bar(g)"
	si      string // SI unit spelling
}

var dimInfos = [numDimensions]dimInfo{
	invalidDimension:        {"invalid dimension", "an", "", ""},
	Fraction:                {"fraction", "a", "85 %", "1"},
	Pressure:                {"pressure", "a", "7 bar(g)", "Pa"},
	Temperature:             {"temperature", "a", "170 C", "K"},
	TemperatureDifference:   {"temperature difference", "a", "10 K", "K"},
	MassFlow:                {"mass flow", "a", "18 t/h", "kg/s"},
	Power:                   {"power", "a", "450 kW", "W"},
	Energy:                  {"energy", "an", "12 GJ", "J"},
	SpecificEnergy:          {"specific energy", "a", "2768 kJ/kg", "J/kg"},
	SpecificHeat:            {"specific heat or entropy", "a", "6.6 kJ/kgK", "J/kgK"},
	SpecificVolume:          {"specific volume", "a", "0.24 m3/kg", "m3/kg"},
	KinematicViscosity:      {"kinematic viscosity", "a", "380 cSt", "m2/s"},
	Density:                 {"density", "a", "991 kg/m3", "kg/m3"},
	Length:                  {"length", "a", "4.5 m", "m"},
	Area:                    {"area", "an", "12 m2", "m2"},
	Volume:                  {"volume", "a", "2.5 m3", "m3"},
	VolumeFlow:              {"volume flow", "a", "12 m3/h", "m3/s"},
	Mass:                    {"mass", "a", "850 t", "kg"},
	Time:                    {"time", "a", "24 h", "s"},
	Velocity:                {"velocity", "a", "15 m/s", "m/s"},
	HeatTransferCoefficient: {"heat transfer coefficient", "a", "5 W/m2K", "W/m2K"},
	FoulingResistance:       {"fouling resistance", "a", "0.0009 m2K/W", "m2K/W"},
	ThermalConductance:      {"thermal conductance", "a", "12 kW/K", "W/K"},
	ThermalConductivity:     {"thermal conductivity", "a", "45 W/mK", "W/mK"},
	SpecificConsumption:     {"specific consumption", "a", "8.5 kg/kWh", "kg/J"},
}

// Dimensions returns every valid dimension, in a fixed order.
func Dimensions() []Dimension {
	out := make([]Dimension, 0, numDimensions-1)
	for d := Fraction; d < numDimensions; d++ {
		out = append(out, d)
	}
	return out
}

func (d Dimension) valid() bool { return d > invalidDimension && d < numDimensions }

func (d Dimension) info() dimInfo {
	if !d.valid() {
		return dimInfos[invalidDimension]
	}
	return dimInfos[d]
}

// String returns the dimension's name in lower case, such as "mass flow".
func (d Dimension) String() string { return d.info().name }

// Example returns an example quantity of the dimension, as used in error
// messages, such as "7 bar(g)".
func (d Dimension) Example() string { return d.info().example }

// SIUnit returns the spelling of the dimension's SI unit, such as "Pa".
func (d Dimension) SIUnit() string { return d.info().si }

// withArticle returns "a mass flow", "an area".
func (d Dimension) withArticle() string {
	i := d.info()
	return i.article + " " + i.name
}
