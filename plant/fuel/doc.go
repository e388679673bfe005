// Package fuel describes marine fuels and their properties: specific energy,
// viscosity against temperature, density against temperature, specific heat
// and CO2 factor. Everything inside is SI: J/kg, K, kg/m³, m²/s, and mass
// fractions in kg/kg.
//
// A Fuel is given by its ISO 8217 properties (density at 15 °C, kinematic
// viscosity at 50 °C for residual or 40 °C for distillate grades, sulfur,
// water, ash), by its ultimate analysis (C, H, S, N, O, water, ash), or both;
// it may also carry a set net specific energy (e.g. the IMO LCV) and a set
// CO2 factor. Built-in grades MGO, VLSFO, HSFO (RMG 380) and LNG (as
// methane) are returned by Grade; a user's own fuel is an ordinary Fuel
// literal beside them. Validate names the fuel and the field of any problem.
//
// What is implemented, with sources (tags as in the project's plant-checks
// reference sheet: [S✓] confirmed published source, [S] published source
// from memory, [CP] common practice, [M] from memory, [C] computed):
//
//   - Specific energy, net and gross: the ISO 8217 informative annex formula
//     from density, water, ash and sulfur [S✓] (ISO8217Energy); from the
//     ultimate analysis, the Channiwala-Parikh (Fuel 81, 2002) HHV
//     correlation (coefficients from memory) with LHV = HHV − h_fg(25 °C)·
//     (8.937·H + water) (AnalysisEnergy). A set LHV takes precedence. Every
//     figure carries its Source (Fuel.Energy).
//   - Viscosity against temperature: ASTM D341, Walther form with the
//     low-viscosity term [S✓]; ν(T) and T(ν) with errors outside the valid
//     range (Walther, Fuel.Viscosity, Fuel.TemperatureForViscosity).
//   - Density against temperature: ASTM D1250-80 Table 54B volume correction
//     (from memory) (VCF54B, Fuel.Density), and the linear rule of thumb
//     α = 0.00064 /K for residual fuels [CP] (DensityLinear).
//   - Specific heat: Cragoe (1929) [S], and its closed-form integral
//     (CragoeCp, CragoeHeat, Fuel.Cp, Fuel.SensibleHeat).
//   - CO2 per kg fuel: the set C_F (IMO MEPC.364(79) for the built-in
//     grades [S]) or 44.0095/12.0107 times the analysis carbon (Fuel.CO2).
//   - CCAI (ISO 8217 annex, from memory) [S].
//
// Simplifications: the analysis is used as given, not normalised (its sum
// must be within SumTolerance of 1); the specific gravity 60/60 °F of the
// Cragoe formula is taken as ρ15/999.016; liquid LNG properties are not
// modelled (Class Gas fuels support energy, CO2 and the analysis only). The
// ranges of validity chosen for each correlation are stated beside it and
// enforced with errors, never by clamping.
//
// The results are planning and audit estimates; they are not a substitute
// for fuel analyses by an accredited laboratory, the makers' manuals, class
// and flag rules, or licensed practice, and local codes come first.
package fuel
