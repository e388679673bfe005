// Package fuel describes marine fuels and their properties: specific energy,
// ultimate analysis, CO2 per kg, viscosity against temperature, density
// against temperature and specific heat. Everything inside is SI: J/kg, K,
// kg/m³, m²/s, and mass fractions in kg/kg.
//
// A Fuel is given by its ISO 8217 properties (density at 15 °C, kinematic
// viscosity at 50 °C for residual or 40 °C for distillate grades, sulfur,
// water, ash), by its ultimate analysis (C, H, S, N, O, water, ash), or both;
// it may also carry a stated net specific energy (SetLHV) and the IMO fuel
// type it reports CO2 under (IMO). Built-in grades MGO, VLSFO, HSFO (RMG 380)
// and LNG (as methane) are returned by Grade; a delivered fuel is built from
// its bunker delivery note on top of a grade by FromBDN; a user's own fuel
// is an ordinary Fuel literal. Validate names the fuel and the field of any
// problem.
//
// Two kinds of figure are kept apart. The fuel's own figures (Energy.Net,
// the analysis, CO2Factor.Analysis) drive the energy balance and the
// combustion models. The IMO figures (Energy.IMOLCV, CO2Factor.IMO:
// MEPC.364(79) defaults per fuel type) are for regulatory CO2 reporting
// only and are never used in their place.
//
// What is implemented, with sources (tags as in the project's docs/reference/plant-checks.md
// reference sheet: [S✓] confirmed published source, [S] published source
// from memory, [CP] common practice, [M] from memory, [C] computed):
//
//   - Specific energy, net and gross: the ISO 8217 informative annex
//     formula from density, water, ash and sulfur, the residual-fuel pair
//     [S✓] (ISO8217Energy) for Class Residual and the distillate pair
//     (ISO8217DistillateEnergy, FROM MEMORY, not on the sheet) for Class
//     Distillate; from the ultimate analysis, the Channiwala-Parikh (Fuel
//     81, 2002) HHV correlation (coefficients from memory) with LHV = HHV −
//     h_fg(25 °C)·(8.937·H + water) (AnalysisEnergy). A stated LHV takes
//     precedence. Every figure carries its Source (Fuel.Energy).
//   - Ultimate analysis from the ISO 8217 properties (AnalysisFromISO):
//     hydrogen from the annex formula's gross (constant volume) − net
//     (constant pressure) difference through HydrogenGrossNet (computed from
//     the latent heat and ½RT per mol H2; ASTM D240's 0.2122 MJ/kg per %,
//     from memory, agrees), carbon by difference [CP], nitrogen and oxygen
//     assumed typical values [M]. The built-in liquid grades take their
//     analysis this way, so the water their hydrogen forms is the one the
//     ISO formula allows for; Channiwala-Parikh on the analysis is within 1 %
//     of the ISO gross value for each of them.
//   - CO2 per kg fuel (Fuel.CO2): from the analysis carbon, C·44.0095/12.0107
//     (complete combustion), and the IMO C_F of the fuel's IMO fuel type
//     (MEPC.364(79), docs/reference/plant-checks.md §1.3 [S]); both are returned, labelled.
//   - Bunker delivery notes (FromBDN): density, sulfur, water (% V/V),
//     ash, viscosity and an optional stated LHV on top of a grade, checked
//     against the envelope of the ISO 8217 grades of the class (errors) and
//     the declared grade's own limits (warnings), ISO 8217:2017 Tables 1
//     and 2 from memory; the declared grade chooses the IMO fuel type.
//   - Viscosity against temperature: ASTM D341, Walther form with the
//     low-viscosity term [S✓]; ν(T) and T(ν) with errors outside the valid
//     range (Walther, Fuel.Viscosity, Fuel.TemperatureForViscosity).
//   - Density against temperature: ASTM D1250-80 Table 54B volume correction
//     (from memory) (VCF54B, Fuel.Density), and the linear rule of thumb
//     α = 0.00064 /K for residual fuels [CP] (DensityLinear).
//   - Specific heat: Cragoe (1929) [S], and its closed-form integral
//     (CragoeCp, CragoeHeat, Fuel.Cp, Fuel.SensibleHeat).
//   - CCAI (ISO 8217 annex, from memory) [S].
//
// Simplifications: a given analysis is used as given, not normalised (its
// sum must be within SumTolerance of 1); a derived analysis assumes the
// nitrogen and oxygen, and neglects the oxygen and nitrogen terms of the
// constant-volume to constant-pressure correction (below 0.01 MJ/kg); the
// ISO 8217 gross value is at constant volume while the loss method's HHV
// basis treats gross − net as the latent heat of the product water, which
// differs by 0.6 MJ per kg of hydrogen (about 0.15 % of the gross value);
// one BDN viscosity keeps the base grade's ASTM D341 slope; the specific
// gravity 60/60 °F of the Cragoe formula is taken as ρ15/999.016; liquid
// LNG properties are not modelled (Class Gas fuels support energy, CO2 and
// the analysis only). The ranges of validity chosen for each correlation
// are stated beside it and enforced with errors, never by clamping.
//
// The results are planning and audit estimates; they are not a substitute
// for fuel analyses by an accredited laboratory, the makers' manuals, class
// and flag rules, or licensed practice, and local codes come first.
package fuel
