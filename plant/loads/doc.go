// Package loads models a ship's steam consumers: each computes its heat duty
// (or shaft power, or steam flow) from what the engineer knows (the tank,
// the cargo, the sea and air temperatures, the oil and its target
// viscosity), not from a duty typed in. It is pure computation: SI in, SI
// out (W, K, kg/s, m, m², s, Pa, J/kg). Package plant turns each duty into a
// steam consumer on a header with a return fraction and subcooling.
//
// Every model is a struct with a Name, a method returning a result struct
// (the duty, the inputs that drove it for the report, and Warnings), and
// input checks whose errors (*InputError) name the consumer and what was
// expected, e.g.
//
//	tank heating "COT 3P": fill 105 % is above 100 %; want a fraction ≤ 1
//
// Models and sources (tags as in the project's docs/reference/plant-checks.md reference sheet:
// [S✓] published source seen, [S] published source from memory, [CP] common
// practice, [M] from memory, [C] computed):
//
//   - FuelHeater: engine service, boiler burner, purifier and transfer
//     heaters. Q = ṁ∫c dT with Cragoe's specific heat (docs/reference/plant-checks.md §5.3 [S✓
//     publication, formula from memory]); the outlet either set or found from
//     a target viscosity on the fuel's ASTM D341 line (docs/reference/plant-checks.md §5.1 [S✓]), both
//     through package fuel. DutyPerKg gives J per kg of oil for the burner's
//     own heater. Warnings: outlet above a set limit; a transfer heater
//     within 10 K of the flash point (SOLAS II-2 reg. 4.2, docs/reference/plant-checks.md §5.2 [S]).
//   - TankHeating: a tank by its boundaries (area, U, what lies beyond) or
//     by its dimensions (TankFromDimensions, with U defaults from docs/reference/plant-checks.md §6 [M]);
//     hold a temperature (losses only) or heat up in a given time
//     (m∫c dT/t + losses at the mean temperature), docs/reference/plant-checks.md §6 [CP]. With heating off,
//     the lumped cool-down T(t) = T_amb + (T0 − T_amb)·exp(−t/τ), τ = m·c/ΣUA,
//     with the UA-weighted mean of the boundary temperatures as T_amb
//     (exact for the lumped model; with Cragoe's c, linear in T, the model
//     is integrated in closed form) (CoolDownAfter), and the time to cool to
//     a temperature (TimeToCool).
//     CargoHeating sums many tanks. CloudPointHM40 gives the cloud point
//     from the pour point (Energy Institute HM 40, docs/reference/plant-checks.md §6 [S✓]).
//   - A tank's heating coil (Coil: a steam coil in the tank, or a deck
//     heater the cargo is pumped through) gives at most U·A·LMTD between
//     the steam's saturation temperature and the cargo (CoilCapacity; U
//     by default 60 W/(m²·K) for a coil, within docs/reference/plant-checks.md §6's coil row [M], and
//     250 W/(m²·K) for a deck heater, from memory); Duty caps a duty
//     above it and warns.
//   - A stateful tank over a period (Advance): its temperature carried by
//     m·c(T)·dT/dt = Q_coil − Σ U_i·A_i·(T − T_i) under an instruction
//     (off, hold, heat_to, reach a temperature by a time), each segment
//     in closed form (the cool-down's solution with Cragoe's linear c), so
//     exact for the lumped model whatever the period's length; the coil's
//     capacity limits it; a heat-up faster than 3 K per day (common
//     practice) warns. Period gives planners the same closed forms
//     without checks or allocation (off, full coil, the duty to reach a
//     temperature, DutyToReach).
//   - SpecFlashPoint: a fuel grade's ISO 8217 minimum flash point (60 °C,
//     from memory), which a tank of the grade assumes when none is given,
//     saying so in the SOLAS caution.
//   - Accommodation: UA·(T_in − T_air) below a balance temperature, or a
//     table of duty against air temperature [CP].
//   - TankCleaning: water heated from the sea temperature, Δh by IAPWS-IF97
//     (package water) at a stated pressure, or a constant cp (sea water).
//   - CargoPump: P = ρ·g·Q·H/η (docs/reference/plant-checks.md §9 [C], §8 [M]); FixedPower for a
//     turbo-generator. The plant's turbine unit turns shaft power into steam.
//   - AtomisingSteam (kg steam per kg fuel), SootBlowing (flow while
//     blowing × duration / interval), SteamTracing (W/m × m), FixedDuty
//     (galley, sundry), FreshWaterGenerator (given specific energy, or
//     h_fg plus feed heating by IAPWS-IF97).
//
// Simplifications, each named again where it is made: U values, pump
// efficiency and atomising ratio are fixed inputs; a tank's cargo is well
// mixed and its steel's heat capacity is not counted; heat-up losses are
// taken at the mean temperature; tank geometry is a box; IAPWS-IF97 is pure water. Inputs outside a correlation's range
// are an error, never a silent clamp; where a result is limited (a negative
// tank duty taken as zero, a table extrapolated) a warning says so.
//
// Units are the scripting layer's job: this package cannot tell a U value
// given in kcal/(m²·h·K) from one in W/(m²·K); it only refuses temperatures
// below −100 °C, which are most likely °C given as kelvin.
//
// The hot paths (TankHeating.Duty, FuelHeater.Duty) allocate nothing unless
// they warn or fail.
//
// The results are planning and audit estimates; they are not a substitute
// for the makers' manuals, class and flag rules (SOLAS II-2 among them), or
// licensed practice, and local codes come first.
package loads
