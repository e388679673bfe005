// Package units reads quantities as ship engineers write them ("7 bar(g)",
// "18 t/h", "170 C", "2768 kJ/kg") into SI values, and writes SI values back
// in the units reports use.
//
// Inside steamcase every quantity is SI: Pa, K, J/kg, kg/s, W. This package
// is the edge where units appear: load-case scripts, command flags, reports.
//
// # Reading
//
// [Parse] takes the text and the [Dimension] the caller needs and returns
// the value in that dimension's SI unit; [ParseAny] finds the dimension from
// the unit. A quantity is an optional sign ('+', '-' or '−'), a decimal
// number with '.' as the decimal point and an optional exponent ("1.2e3"),
// optional white space, and a unit. A bare number is accepted only for a
// [Fraction]; everywhere else it is an error that names a unit to use.
//
// # Gauge and absolute pressure
//
// Pressures are returned absolute. Gauge readings are relative to
// [Options.AmbientPressure], which defaults to the standard atmosphere
// (101325 Pa). The spellings that mean gauge are bar(g), barg, mbar(g),
// mbarg, kPa(g), kPag, MPa(g), MPag, psig, psi(g), kg/cm2g, kg/cm2(g),
// kgf/cm2g and kgf/cm2(g). Units that are absolute by definition (Pa, kPa,
// MPa, atm, mmHg) and spellings marked absolute (bar(a), bara, bar abs,
// mbar(a), psia, kg/cm2a, ...) are absolute. "bar", "mbar", "psi", "kg/cm2"
// and "kgf/cm2" alone are rejected: the reader cannot tell gauge from
// absolute, and a wrong guess is an error of one atmosphere. ("mbar" is
// treated like "bar": a barometric reading and a furnace draught are both
// written in mbar.) mmHg is absolute; a vacuum-gauge reading in mmHg must be
// converted by the caller. An absolute pressure at or below zero (such as
// "-2 bar(g)") is rejected.
//
// # Temperature and temperature difference
//
// A [Temperature] is absolute: K, °C (also written C, degC) or °F. A value
// below 0 K is rejected. A [TemperatureDifference] is written in K, or with
// an explicit Δ: "5 ΔC", "5 Δ°C", "5 delta C", "9 ΔF". "5 C" or "5 °C" given
// where a difference is expected is rejected as ambiguous, because the same
// text read as a temperature means 278.15 K; a difference of 1 °C is 1 K.
// Units per degree (kJ/kg°C, W/m2°C) are differences and are accepted.
// [ParseAny] reads "K" alone as a temperature.
//
// # Checks
//
// Errors are of type [*Error] and say what was given and what was expected.
// Non-finite numbers and SI values, absolute temperatures below 0 K and
// absolute pressures at or below zero are rejected. Other range checks (a
// negative area, a fraction above 1) belong to the caller, who knows what
// the quantity means.
//
// # Writing
//
// [FromSI], [ToSI], [Format] and [FormatPrec] convert numbers (not text)
// between SI and a named unit; the [Options] methods of the same names use a
// given ambient pressure for gauge units.
//
// # Accepted spellings
//
// White space, parentheses, '·', '*', '.' and '^' inside a unit are ignored,
// and '²', '³' read as 2 and 3, so "kJ/(kg K)", "kJ/kg·K" and "kJ/kgK" are
// one unit. Letter case matters ("MPa", not "mpa"); a unit that differs only
// in case is reported with a suggestion. The first spelling of each unit is
// the one Format writes. In the list below units are separated by ';' and
// spellings of one unit by ','. The list is generated from the package's
// table by its tests.
//
//   - fraction (SI: 1): a bare number; %
//   - pressure, absolute (SI: Pa): Pa, Pa(a); kPa, kPa(a), kPa abs; MPa, MPa(a), MPa abs; bar(a), bara, bar abs; mbar(a), mbara, mbar abs; psia, psi(a); kg/cm2a, kg/cm2(a), kgf/cm2a, kgf/cm2(a), kg/cm2 abs, kgf/cm2 abs; atm; mmHg, mmHg(a), mmHg abs
//   - pressure, gauge: bar(g), barg; mbar(g), mbarg; kPa(g), kPag; MPa(g), MPag; psig, psi(g); kg/cm2g, kg/cm2(g), kgf/cm2g, kgf/cm2(g)
//   - pressure, rejected as ambiguous: bar; mbar; psi; kg/cm2; kgf/cm2
//   - temperature (SI: K): K; °C, C, degC, deg C, ºC, ℃; °F, F, degF, deg F, ºF, ℉
//   - temperature difference (SI: K): K, ΔK; Δ°C, ΔC, delta C, delta °C; Δ°F, ΔF, delta F, delta °F
//   - mass flow (SI: kg/s): kg/s; kg/min; kg/h, kg/hr; t/h, t/hr; t/d, t/day; lb/h, lb/hr
//   - power (SI: W): W; kW; MW; kcal/h, kcal/hr
//   - energy (SI: J): J; kJ; MJ; GJ; kWh; MWh; kcal
//   - specific energy (SI: J/kg): J/kg; kJ/kg; MJ/kg; kcal/kg
//   - specific heat or entropy (SI: J/kgK): J/kgK, J/(kg K), J/kg/K, J/kg-K, J/kg°C; kJ/kgK, kJ/(kg K), kJ/kg/K, kJ/kg-K, kJ/kg°C, kJ/kgC; kcal/kgK, kcal/(kg K), kcal/kg°C, kcal/kgC
//   - specific volume (SI: m3/kg): m3/kg, m³/kg; l/kg, L/kg, dm3/kg
//   - kinematic viscosity (SI: m2/s): m2/s, m²/s; cSt, mm2/s, mm²/s
//   - density (SI: kg/m3): kg/m3, kg/m³; t/m3, t/m³, kg/l, kg/L, kg/dm3, g/cm3, g/cm³
//   - length (SI: m): m; mm; cm; km
//   - area (SI: m2): m2, m²; cm2, cm²; mm2, mm²
//   - volume (SI: m3): m3, m³; l, L, dm3
//   - volume flow (SI: m3/s): m3/s, m³/s; m3/h, m³/h; m3/d, m³/d; l/s, L/s; l/min, L/min; l/h, L/h
//   - mass (SI: kg): kg; t; g
//   - time (SI: s): s; min; h, hr; d, day, days
//   - velocity (SI: m/s): m/s
//   - heat transfer coefficient (SI: W/m2K): W/m2K, W/(m2 K), W/m2/K, W/m2°C, W/m²K; kW/m2K, kW/(m2 K), kW/m2/K, kW/m2°C, kW/m²K; kcal/m2h°C, kcal/(m2 h °C), kcal/m2hK
//   - fouling resistance (SI: m2K/W): m2K/W, m2 K/W, m2°C/W, m²K/W; m2K/kW, m2 K/kW, m2°C/kW, m²K/kW
//   - thermal conductance (SI: W/K): W/K; kW/K; MW/K
//   - thermal conductivity (SI: W/mK): W/mK, W/(m K), W/m/K, W/m°C
//   - specific consumption (SI: kg/J): kg/J; kg/kWh; g/kWh; kg/MWh
package units
