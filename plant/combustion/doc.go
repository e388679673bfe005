// Package combustion burns a fuel (package fuel) completely with air and
// returns the air and flue-gas flows, compositions and enthalpies, the
// adiabatic flame temperature, the boiler efficiency by the heat-loss method
// and the acid dew point. Everything inside is SI: K, Pa, J/kg, J/mol,
// kg/kg fuel, mol/kg fuel; mole and mass fractions as fractions (0.03, not
// 3 %). Loss items and efficiencies are the exception: percent of the fuel
// heat input, as the test codes print them.
//
// What is implemented, with sources (tags as in the project's docs/reference/plant-checks.md
// reference sheet: [S✓] confirmed published source, [S] published source
// from memory, [CP] common practice, [M] from memory, [C] computed):
//
//   - Thermodynamic data: NASA 7-coefficient polynomials of NASA TM-4513
//     (1993), one data set for all species (N2, O2, CO2, H2O, SO2, Ar, CO),
//     embedded in Go source (thermo.go) and checked against the copied CSV
//     rows in testdata. Ideal-gas cp(T) and h(T) − h(298.15 K) per species
//     (Species) and per mixture (Mixture), without allocation. SO2's fit is
//     published from 300 K and is used from 298.15 K (documented 1.85 K
//     extrapolation); below that, only for a reference temperature under
//     25 °C in Efficiency, it is continued with its 298.15 K heat capacity.
//   - Stoichiometry (docs/reference/plant-checks.md §2 [CP]): O2 and air for complete
//     combustion from the ultimate analysis (Stoichiometry), with standard
//     dry air O2 20.946 %, Ar 0.934 %, N2 78.120 % including CO2 and traces
//     (StandardDryAir; the air is replaceable per call).
//   - Excess air: λ from measured dry O2, exact with V_fd0/V_a0 from the fuel
//     (LambdaFromO2), the approximation 21/(21 − O2) (LambdaFromO2Approx),
//     and from dry CO2 (LambdaFromCO2).
//   - Fire: flue gas per kg fuel (CO2, H2O from hydrogen, fuel water, air
//     humidity and atomising steam, SO2, N2, O2, Ar), mass and mole
//     fractions wet and dry, normal volumes, flue-gas and air enthalpy and cp.
//   - Adiabatic flame temperature: complete combustion, NO dissociation, no
//     heat loss (AdiabaticFlameTemperature).
//   - Boiler efficiency by the heat-loss method, itemised in the manner of
//     ASME PTC 4 and EN 12952-15 (structure from memory, docs/reference/plant-checks.md §3.1 [S]): dry flue
//     gas, moisture by origin, CO (Siegert-type form, docs/reference/plant-checks.md §3.1 [S✓]), unburnt
//     solids, radiation and convection (kW constant or % at MCR scaled by
//     1/load), credits for air, steam and fuel sensible heat; on the LHV and
//     the HHV basis, each stating its basis and the energy's source
//     (Efficiency, Losses).
//   - Siegert's flue-gas loss formula, O2 and CO2 forms, 1. BImSchV (docs/reference/plant-checks.md §3.2
//     [S]) as a cross-check (Siegert, SiegertCO2).
//   - Acid dew point: Verhoff and Banchero (1974) and Okkes (1987) (docs/reference/plant-checks.md §4 [S✓]),
//     with the SO3 share of SO2 as an input (default 3 %, [M]/common
//     practice) (VerhoffBanchero, Okkes, AcidDewPoint).
//   - Air humidity from relative humidity with the IAPWS-IF97 saturation
//     pressure (HumidityRatio).
//   - The flue-gas check (CheckFlueGas): a measured reading (FlueGasReading:
//     fuel, dry O2 or CO2, flue-gas and air temperatures, humidity, CO,
//     radiation, solids, atomising steam, SO3 share) validated field by field
//     (*ReadingError), burnt and accounted on both bases with the air as
//     reference, with the acid dew point and its margin (20 K by default,
//     common practice), Siegert's cross-check and the warnings in words
//     (FlueGasCheck), and its JSON form (FlueGasJSON), which `sim fluegas`
//     prints and the scripts' flue_gas{} returns.
//
// Simplifications, each named where it is made: complete combustion (no CO,
// soot or NOx in the products, even when a CO loss is entered); ideal gases;
// ash inert and its heat ignored; atomising steam as ideal-gas vapour; the
// calorific value taken at the reference temperature; the latent heat in the
// HHV account taken at 25 °C. No burner or furnace model lives here: a
// later package builds the burner unit on Fire and Efficiency.
//
// Zero air, air without oxygen, or less air than complete combustion needs
// give an error wrapping ErrCannotFire ("the burner cannot fire"), never a
// NaN.
//
// The results are planning and audit estimates; they are not a substitute
// for the boiler and burner makers' manuals, class and flag rules, or
// licensed practice, and local codes come first.
package combustion
