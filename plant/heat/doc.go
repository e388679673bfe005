// Package heat holds the heat-transfer laws of the oil-fired boiler's
// furnace and smoke tubes and of the exhaust-gas economiser: gas transport
// properties, gas radiation, convection, conduction and fouling, nucleate
// boiling, and the furnace, tube-pass and counterflow-exchanger models built
// from them.
//
// Everything inside is SI: W, K, m, Pa, kg/s (J/kg for enthalpy). The
// package depends on no other project package. Gas composition enters as a
// Composition, a fixed array of mole fractions of N2, O2, CO2, H2O and Ar
// (other species must be folded in by the caller); the flue-gas enthalpy
// enters as a GasEnthalpy function, which the combustion package supplies
// (ConstantCp is a stand-in for tests and first estimates). Hot paths
// allocate nothing (see the benchmarks).
//
// The numbers are planning and audit estimates. They are no substitute for
// the makers' manuals, class and flag rules, or licensed engineering
// practice; defer to local codes.
//
// # Sources, validity and simplifications
//
// Tags follow the project's reference sheets (docs/reference/heat-transfer.md
// and docs/reference/gas-radiation.md): [S✓] source seen, [S] source from memory, [CP]
// common practice, [M] from memory, [C] computed from the sheet's formulas.
//
// Gas transport (MixTransport, SpeciesViscosity, SpeciesConductivity): the
// NASA CEA data/trans.inp fits (Svehla 1994 revision; Boushehri et al. 1987,
// Sengers & Watson 1986, Bich et al. 1990) [S✓], embedded in Go source and
// compared digit for digit with testdata/gas-transport.csv. Valid 200-15000 K
// (CO2 to 10000 K, H2O from 373.2 K). Outside: an ErrRange error; with
// TransportOptions.AllowExtrapolation, values down to 200 K carry
// WarnTransportExtrapolated. Mixtures: Wilke's rule for viscosity and the
// Wassiljewa equation with Mason-Saxena A_ij = ε·Φ_ij (ε = 1 by default) for
// conductivity [S, Poling et al. from memory]. Dilute gas: no pressure
// dependence. Air viscosity agrees with Lemmon & Jacobsen (2004) within
// 0.4 %; air conductivity is 0.3-3.4 % low (a property of the N2 and O2
// fits). SutherlandViscosity and SutherlandConductivity (White 2006
// constants [S✓]) are for air below 600 K only, as a cross-check.
//
// Gas radiation (RadiatingGas): the weighted-sum-of-grey-gases model of
// Smith, Shen & Friedman (1982), all five sets [S✓, two independent code
// copies; the paper was not seen]. The set is fixed by the caller
// (WSGGRatio1 for oil firing, WSGGRatio2 for natural gas) or chosen by
// SelectWSGGSet with one public code's switching rule [CP]; sets are never
// interpolated, since the sheet gives no sourced rule for it. Validity
// 600-2400 K and 0.001-10 atm·m is from memory [M]: outside, a Warning;
// above 3000 K, where the weight polynomials turn unphysical, an ErrRange
// error. The sets are for a total pressure of 1 atm. Absorptivity for wall
// radiation: the furnace and tubes take α = ε_g (grey gas); Absorptivity
// offers the weights-at-source-temperature practice [M]. Mean beam length:
// BeamLengthThin (4V/A, exact), BeamLength (3.6·V/A) and BeamLengthShape
// (Hottel's table, McAdams 1954) [S, from memory; tube-bank rows lower
// confidence]. Soot: κ_soot = K·f_v·T with K from the refractive index
// (SootConstant, radlib's form with 3.72 [S✓ form]; 1816.9 for Shaddix's
// index), ε_flame = ε_g + ε_s − ε_g·ε_s [CP], and the luminous/non-luminous
// blend with filling fraction m [M]. The soot loading is the largest single
// uncertainty of the furnace: calibrate it against a measured furnace-exit
// or funnel temperature.
//
// Convection: Gnielinski (1976) with Petukhov's friction factor [S✓], valid
// 3000 ≤ Re ≤ 5e6, 0.5 ≤ Pr ≤ 2000 (ErrRange outside). TubeFlow covers all
// Re: laminar Nu = 3.66 (or 4.36) [S, textbook] below Re = 2300, linear
// interpolation to the turbulent value at Re = 4000 (Gnielinski 2013 [S✓
// abstract]) or at 1e4 with the VDI Heat Atlas form (GnielinskiVDI, Konakov
// ξ, [S, from memory, not verified]); optional entrance factor
// [1 + (d/L)^(2/3)] [S, memory]; no property-ratio correction (flue gas is
// cooled). DittusBoelter (0.023·Re^0.8·Pr^n) [S✓] for cross-checks, valid
// Re ≥ 1e4, 0.6 ≤ Pr ≤ 160, L/d ≥ 10. TubeBank.Nusselt is Zukauskas (1972) for bare
// tube banks, in-line and staggered, textbook or Bejan constant table
// [S✓ for 1e3-2e5], with the row correction C2 from the textbook table
// (linear in N_L) or the digitised series; Re outside the table is an
// ErrRange error, Pr outside 0.7-500 [M] a Warning. Finned economiser tubes
// need another correlation, not provided.
//
// Conduction and fouling: TubeWall gives the series of inside film, inside
// fouling, cylindrical wall ln(d_o/d_i), outside fouling and outside film,
// and U referred to the inside or outside area (exact for steady radial
// conduction). TEMA fouling resistances (RGP-T-2.4 [S✓, secondary copies];
// none seen for heavy-fuel-oil flue gas), LayerResistance for soot and scale
// with the memory conductivities [M]. SteelConductivity is EN 1993-1-2 for
// carbon steel, 20-1200 °C [S✓ form].
//
// Boiling: Cooper (1984) [S✓], in the heat-flux and superheat forms, with
// R_p = 1 μm unless given and its usual range 0.001 < p_r < 0.9 [M] as a
// Warning; Mostinski (1963) [S✓, one copy].
//
// Models. Furnace.Solve is the well-stirred one-zone furnace (Hottel &
// Sarofim 1967 [S, structure from memory]): ṁ_g·[h(T_ad) − h(T_E)] =
// σ·A_w·ε_eff·(T_E⁴ − T_w⁴) + Q_loss with ε_eff = 1/(1/ε_f + 1/ε_w − 1),
// solved for T_E by Brent's method on [T_w, T_ad]. Simplifications: uniform
// gas at the exit temperature, one grey gas zone and one grey wall zone, no
// refractory re-radiation. SmokeTubes.Solve rates a pass of n tubes by ε-NTU
// with the water at T_sat: T_out = T_sat + (T_in − T_sat)·exp(−NTU), U from
// Gnielinski (and tube-gas radiation with L_m = 0.95·d_i, if a wall
// emissivity is given) at the arithmetic mean gas temperature, solved by a
// Brent root find on T_out; U is constant along the tube, the radiating wall
// is at T_sat, the water side is a given h or Cooper at the mean flux.
// CounterflowEffectiveness, CounterflowNTU and Counterflow give the ε-NTU
// counterflow exchanger for economisers, with the Cr = 1 and Cr = 0 limits
// exact and constant capacity rates (a simplification).
//
// # Errors and warnings
//
// Nonsense input (negative sizes, NaN, fractions that do not add up) is an
// *Error wrapping ErrInput; a correlation outside its sourced range is an
// *Error wrapping ErrRange. Each names the function or equation, the
// quantity, the value given and what was expected. Ranges known only from
// memory do not stop a computation: the result carries a Warning, a bit set
// whose String method names each flag. No function returns NaN or panics on
// user input; unknown enum values (programmer mistakes) panic with a
// "heat:" prefix.
package heat
