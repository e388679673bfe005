package units

// Exact conversion factors. Each is exact by definition; the sources are
// NIST Special Publication 811 (2008), Appendix B.8 and B.9, and the
// definitions named beside each constant.
const (
	barPa  = 1e5     // 1 bar = 100 kPa, exact (NIST SP 811 B.8)
	atmPa  = 101325  // standard atmosphere, exact (NIST SP 811 B.8)
	kgfcm2 = 98066.5 // 1 kgf/cm2 = 9.80665 N / 1e-4 m2, exact (NIST SP 811 B.8)
	// pound is the international avoirdupois pound, exact (NIST SP 811 B.8).
	pound = 0.45359237
	// psiPa is 1 lbf/in2 = 0.45359237 kg * 9.80665 m/s2 / (0.0254 m)^2,
	// = 6894.757293168... Pa, exact from the definitions (NIST SP 811 B.8
	// gives 6.894 757 E+03).
	psiPa = pound * 9.80665 / (0.0254 * 0.0254)
	// mmHgPa is the conventional millimetre of mercury,
	// 13595.1 kg/m3 * 9.80665 m/s2 * 0.001 m (NIST SP 811 B.8 gives
	// 1.333 224 E+02 Pa).
	mmHgPa = 13595.1 * 9.80665 * 0.001
	// kcalJ is the international-table kilocalorie, 4186.8 J exact
	// (NIST SP 811 B.8, calorie (IT) = 4.1868 J).
	kcalJ = 4186.8
	// rankine is the size of one degree Fahrenheit in kelvin, 5/9 exact.
	rankine = 5.0 / 9.0
	// celsiusZero is 0 °C in kelvin, exact by the definition of the
	// Celsius scale.
	celsiusZero = 273.15
	// fahrenheitZero is 0 °F in kelvin: (0 + 459.67) * 5/9, exact.
	fahrenheitZero = 459.67 * rankine

	hour = 3600.0
	day  = 86400.0
)

// unitKind says how a unit converts.
type unitKind uint8

const (
	linear    unitKind = iota // SI = v*scale + offset
	gauge                     // SI = v*scale + ambient pressure
	ambiguous                 // rejected: gauge or absolute not said
)

// unitDef is one unit and all the ways it may be written. The first
// spelling is the canonical one, used by Format and in Quantity.Unit.
type unitDef struct {
	dim       Dimension
	kind      unitKind
	scale     float64
	offset    float64
	spellings []string
	// For ambiguous pressure units: the gauge and absolute spellings to
	// suggest.
	gaugeHint, absHint string
}

// table lists every unit. It is never modified. Spellings are compared after
// compaction (see compact): spaces, parentheses, '·', '*', '.', '^' are
// dropped and '²' '³' read as 2 and 3, so "kJ/(kg K)" and "kJ/kgK" are the
// same key. The order matters only for ParseAny, where "K" is found as a
// Temperature before it is found as a TemperatureDifference.
var table = [...]unitDef{
	// Fraction
	{dim: Fraction, scale: 0.01, spellings: []string{"%"}},

	// Pressure, absolute by definition.
	{dim: Pressure, scale: 1, spellings: []string{"Pa", "Pa(a)"}},
	{dim: Pressure, scale: 1e3, spellings: []string{"kPa", "kPa(a)", "kPa abs"}},
	{dim: Pressure, scale: 1e6, spellings: []string{"MPa", "MPa(a)", "MPa abs"}},
	{dim: Pressure, scale: barPa, spellings: []string{"bar(a)", "bara", "bar abs"}},
	{dim: Pressure, scale: 100, spellings: []string{"mbar(a)", "mbara", "mbar abs"}},
	{dim: Pressure, scale: psiPa, spellings: []string{"psia", "psi(a)"}},
	{dim: Pressure, scale: kgfcm2, spellings: []string{"kg/cm2a", "kg/cm2(a)", "kgf/cm2a", "kgf/cm2(a)", "kg/cm2 abs", "kgf/cm2 abs"}},
	{dim: Pressure, scale: atmPa, spellings: []string{"atm"}},
	{dim: Pressure, scale: mmHgPa, spellings: []string{"mmHg", "mmHg(a)", "mmHg abs"}},
	// Pressure, gauge: relative to the ambient pressure of Options.
	{dim: Pressure, kind: gauge, scale: barPa, spellings: []string{"bar(g)", "barg"}},
	{dim: Pressure, kind: gauge, scale: 100, spellings: []string{"mbar(g)", "mbarg"}},
	{dim: Pressure, kind: gauge, scale: 1e3, spellings: []string{"kPa(g)", "kPag"}},
	{dim: Pressure, kind: gauge, scale: 1e6, spellings: []string{"MPa(g)", "MPag"}},
	{dim: Pressure, kind: gauge, scale: psiPa, spellings: []string{"psig", "psi(g)"}},
	{dim: Pressure, kind: gauge, scale: kgfcm2, spellings: []string{"kg/cm2g", "kg/cm2(g)", "kgf/cm2g", "kgf/cm2(g)"}},
	// Pressure, rejected as ambiguous.
	{dim: Pressure, kind: ambiguous, spellings: []string{"bar"}, gaugeHint: "bar(g)", absHint: "bar(a)"},
	{dim: Pressure, kind: ambiguous, spellings: []string{"mbar"}, gaugeHint: "mbar(g)", absHint: "mbar(a)"},
	{dim: Pressure, kind: ambiguous, spellings: []string{"psi"}, gaugeHint: "psig", absHint: "psia"},
	{dim: Pressure, kind: ambiguous, spellings: []string{"kg/cm2", "kgf/cm2"}, gaugeHint: "kg/cm2g", absHint: "kg/cm2a"},

	// Temperature
	{dim: Temperature, scale: 1, spellings: []string{"K"}},
	{dim: Temperature, scale: 1, offset: celsiusZero, spellings: []string{"°C", "C", "degC", "deg C", "ºC", "℃"}},
	{dim: Temperature, scale: rankine, offset: fahrenheitZero, spellings: []string{"°F", "F", "degF", "deg F", "ºF", "℉"}},

	// TemperatureDifference: kelvin, or an explicit Δ before °C or °F.
	{dim: TemperatureDifference, scale: 1, spellings: []string{"K", "ΔK"}},
	{dim: TemperatureDifference, scale: 1, spellings: []string{"Δ°C", "ΔC", "delta C", "delta °C"}},
	{dim: TemperatureDifference, scale: rankine, spellings: []string{"Δ°F", "ΔF", "delta F", "delta °F"}},

	// MassFlow
	{dim: MassFlow, scale: 1, spellings: []string{"kg/s"}},
	{dim: MassFlow, scale: 1.0 / 60, spellings: []string{"kg/min"}},
	{dim: MassFlow, scale: 1 / hour, spellings: []string{"kg/h", "kg/hr"}},
	{dim: MassFlow, scale: 1000 / hour, spellings: []string{"t/h", "t/hr"}},
	{dim: MassFlow, scale: 1000 / day, spellings: []string{"t/d", "t/day"}},
	{dim: MassFlow, scale: pound / hour, spellings: []string{"lb/h", "lb/hr"}},

	// Power
	{dim: Power, scale: 1, spellings: []string{"W"}},
	{dim: Power, scale: 1e3, spellings: []string{"kW"}},
	{dim: Power, scale: 1e6, spellings: []string{"MW"}},
	{dim: Power, scale: kcalJ / hour, spellings: []string{"kcal/h", "kcal/hr"}},

	// Energy
	{dim: Energy, scale: 1, spellings: []string{"J"}},
	{dim: Energy, scale: 1e3, spellings: []string{"kJ"}},
	{dim: Energy, scale: 1e6, spellings: []string{"MJ"}},
	{dim: Energy, scale: 1e9, spellings: []string{"GJ"}},
	{dim: Energy, scale: 3.6e6, spellings: []string{"kWh"}},
	{dim: Energy, scale: 3.6e9, spellings: []string{"MWh"}},
	{dim: Energy, scale: kcalJ, spellings: []string{"kcal"}},

	// SpecificEnergy
	{dim: SpecificEnergy, scale: 1, spellings: []string{"J/kg"}},
	{dim: SpecificEnergy, scale: 1e3, spellings: []string{"kJ/kg"}},
	{dim: SpecificEnergy, scale: 1e6, spellings: []string{"MJ/kg"}},
	{dim: SpecificEnergy, scale: kcalJ, spellings: []string{"kcal/kg"}},

	// SpecificHeat (also specific entropy). Per °C means per kelvin of
	// difference, so "kJ/kg°C" is not ambiguous.
	{dim: SpecificHeat, scale: 1, spellings: []string{"J/kgK", "J/(kg K)", "J/kg/K", "J/kg-K", "J/kg°C"}},
	{dim: SpecificHeat, scale: 1e3, spellings: []string{"kJ/kgK", "kJ/(kg K)", "kJ/kg/K", "kJ/kg-K", "kJ/kg°C", "kJ/kgC"}},
	{dim: SpecificHeat, scale: kcalJ, spellings: []string{"kcal/kgK", "kcal/(kg K)", "kcal/kg°C", "kcal/kgC"}},

	// SpecificVolume
	{dim: SpecificVolume, scale: 1, spellings: []string{"m3/kg", "m³/kg"}},
	{dim: SpecificVolume, scale: 1e-3, spellings: []string{"l/kg", "L/kg", "dm3/kg"}},

	// KinematicViscosity
	{dim: KinematicViscosity, scale: 1, spellings: []string{"m2/s", "m²/s"}},
	{dim: KinematicViscosity, scale: 1e-6, spellings: []string{"cSt", "mm2/s", "mm²/s"}},

	// Density
	{dim: Density, scale: 1, spellings: []string{"kg/m3", "kg/m³"}},
	{dim: Density, scale: 1e3, spellings: []string{"t/m3", "t/m³", "kg/l", "kg/L", "kg/dm3", "g/cm3", "g/cm³"}},

	// Length
	{dim: Length, scale: 1, spellings: []string{"m"}},
	{dim: Length, scale: 1e-3, spellings: []string{"mm"}},
	{dim: Length, scale: 1e-2, spellings: []string{"cm"}},
	{dim: Length, scale: 1e3, spellings: []string{"km"}},

	// Area
	{dim: Area, scale: 1, spellings: []string{"m2", "m²"}},
	{dim: Area, scale: 1e-4, spellings: []string{"cm2", "cm²"}},
	{dim: Area, scale: 1e-6, spellings: []string{"mm2", "mm²"}},

	// Volume
	{dim: Volume, scale: 1, spellings: []string{"m3", "m³"}},
	{dim: Volume, scale: 1e-3, spellings: []string{"l", "L", "dm3"}},

	// VolumeFlow
	{dim: VolumeFlow, scale: 1, spellings: []string{"m3/s", "m³/s"}},
	{dim: VolumeFlow, scale: 1 / hour, spellings: []string{"m3/h", "m³/h"}},
	{dim: VolumeFlow, scale: 1 / day, spellings: []string{"m3/d", "m³/d"}},
	{dim: VolumeFlow, scale: 1e-3, spellings: []string{"l/s", "L/s"}},
	{dim: VolumeFlow, scale: 1e-3 / 60, spellings: []string{"l/min", "L/min"}},
	{dim: VolumeFlow, scale: 1e-3 / hour, spellings: []string{"l/h", "L/h"}},

	// Mass
	{dim: Mass, scale: 1, spellings: []string{"kg"}},
	{dim: Mass, scale: 1e3, spellings: []string{"t"}},
	{dim: Mass, scale: 1e-3, spellings: []string{"g"}},

	// Time
	{dim: Time, scale: 1, spellings: []string{"s"}},
	{dim: Time, scale: 60, spellings: []string{"min"}},
	{dim: Time, scale: hour, spellings: []string{"h", "hr"}},
	{dim: Time, scale: day, spellings: []string{"d", "day", "days"}},

	// Velocity
	{dim: Velocity, scale: 1, spellings: []string{"m/s"}},

	// HeatTransferCoefficient
	{dim: HeatTransferCoefficient, scale: 1, spellings: []string{"W/m2K", "W/(m2 K)", "W/m2/K", "W/m2°C", "W/m²K"}},
	{dim: HeatTransferCoefficient, scale: 1e3, spellings: []string{"kW/m2K", "kW/(m2 K)", "kW/m2/K", "kW/m2°C", "kW/m²K"}},
	{dim: HeatTransferCoefficient, scale: kcalJ / hour, spellings: []string{"kcal/m2h°C", "kcal/(m2 h °C)", "kcal/m2hK"}},

	// FoulingResistance
	{dim: FoulingResistance, scale: 1, spellings: []string{"m2K/W", "m2 K/W", "m2°C/W", "m²K/W"}},
	{dim: FoulingResistance, scale: 1e-3, spellings: []string{"m2K/kW", "m2 K/kW", "m2°C/kW", "m²K/kW"}},

	// ThermalConductance (UA)
	{dim: ThermalConductance, scale: 1, spellings: []string{"W/K"}},
	{dim: ThermalConductance, scale: 1e3, spellings: []string{"kW/K"}},
	{dim: ThermalConductance, scale: 1e6, spellings: []string{"MW/K"}},

	// ThermalConductivity
	{dim: ThermalConductivity, scale: 1, spellings: []string{"W/mK", "W/(m K)", "W/m/K", "W/m°C"}},

	// SpecificConsumption (steam rate, specific fuel consumption): 1 kWh
	// = 3.6e6 J, exact (NIST SP 811 B.8).
	{dim: SpecificConsumption, scale: 1, spellings: []string{"kg/J"}},
	{dim: SpecificConsumption, scale: 1 / 3.6e6, spellings: []string{"kg/kWh"}},
	{dim: SpecificConsumption, scale: 1e-3 / 3.6e6, spellings: []string{"g/kWh"}},
	{dim: SpecificConsumption, scale: 1 / 3.6e9, spellings: []string{"kg/MWh"}},
}

// index maps each compacted spelling to the positions in table that accept
// it, in table order. It is built once and never modified.
var index = buildIndex()

func buildIndex() map[string][]uint8 {
	m := make(map[string][]uint8, 4*len(table))
	for i := range table {
		for _, sp := range table[i].spellings {
			var buf [maxUnitLen]byte
			n, ok := compact(sp, &buf)
			if !ok {
				panic("units: table spelling " + sp + " does not compact")
			}
			k := string(buf[:n])
			for _, j := range m[k] {
				if table[j].dim == table[i].dim && int(j) != i {
					panic("units: spelling " + sp + " listed twice for " + table[i].dim.String())
				}
			}
			if len(m[k]) > 0 && int(m[k][len(m[k])-1]) == i {
				continue // two spellings of one unit compact to one key
			}
			m[k] = append(m[k], uint8(i))
		}
	}
	return m
}
