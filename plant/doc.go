// Package plant describes a ship's steam plant as units joined by lines,
// assembles its mass and energy balance as one nonlinear system, hands it to
// the Newton solver (package solver), decides which boilers must fire, and
// returns a result whose balances are checked independently of the
// residuals.
//
// Inside the package every quantity is SI: Pa, K, J/kg, kg/s, W. Water and
// steam properties come from IAPWS-IF97 (plant/water).
//
// # The graph
//
// A plant is built with New, Add (one unit at a time) and Connect (an
// outlet port to an inlet port). A water or steam line carries three
// unknowns: mass flow, pressure and specific enthalpy. Each unit sets the
// pressure and enthalpy of its outlet lines and adds one equation for each
// mass flow it determines, and may add unknowns of its own (a boiler's fuel
// flow, a feed tank's vented steam). Check reports every fault at once, by
// unit and line and script position: ports left open or connected twice,
// unknown ports, media that do not match, parameters out of range, and
// degrees of freedom that do not balance (by the solver's structural
// diagnosis, which names the equations and unknowns concerned).
//
// # Units
//
//   - MakeUp: fresh water at a set temperature, by default the case's sea
//     temperature; its flow is what the plant loses.
//   - FeedTank (hotwell, cascade tank): mixing, heat loss, optional steam
//     heating to a set temperature, venting of flash steam when the mix
//     would boil, the header drains and drain-cooler heat it is given,
//     and a warning below the temperature that keeps oxygen out.
//   - FeedPump: discharge at drum pressure plus a margin; enthalpy rise
//     v·Δp/η (water taken as incompressible across the pump).
//   - Boiler (oil-fired): drum pressure, dryness, blowdown (fraction or TDS
//     ratio), fuel from the energy balance with an EfficiencyModel, MCR,
//     burner turndown and cycling, burner and forced-draught fan.
//   - EfficiencyTable (maker's test: efficiency against load),
//     FlueGasTable (exit temperature and O2 against load, heat-loss
//     method) and FurnaceTubes (furnace radiation and smoke-tube convection
//     from geometry, heat-loss method at the computed exit temperature).
//   - Economiser: feed water heated by the boiler's flue gas, counterflow
//     ε-NTU.
//   - ExhaustGasEconomiser: steam from the main engine's exhaust by an
//     evaporator at saturation, sized by UA or a design pinch, with an
//     optional bypass damper holding a minimum gas temperature and a
//     preheating section; the engine's table corrected linearly from its
//     reference conditions to the case's intake air and coolant; gas-side
//     fouling growing between cleanings (a resistance or a UA fraction
//     against running hours, averaged over the interval); the acid dew point
//     of the exhaust (Verhoff–Banchero) against the cold end; cases at
//     soot-risk loads or gas velocities flagged.
//   - Header (steam header or any junction, with heat loss condensing
//     steam), ReducingValve (isenthalpic), Consumer (a duty, a steam flow,
//     a duty model evaluated per case, or a duty per kg of a boiler's fuel;
//     subcooling, return fraction, drain cooler), Turbine (by isentropic
//     and mechanical efficiency, by its steam rate at a rated power with a
//     part-load curve, or by the maker's table of steam against power),
//     Condenser (its vacuum the turbine's, or following the sea by an
//     approach or by its UA and sea-water flow) and dump condenser.
//
// # Solving
//
// The unknowns are scaled (flows ~1 kg/s, pressures and enthalpies ~1e6)
// and bounded (flows not negative, pressures and enthalpies inside the
// range of IF97) and solved by damped Newton with a sparse LU. The plant
// gives the solver an analytic Jacobian: exact for everything linear or
// bilinear in the unknowns, with the derivatives of water properties and
// of combustion efficiency models taken by small differences of those
// functions alone (Options.FiniteDifferences falls back to the solver's
// coloured finite differences of the whole residual). Successive cases
// start from the last solution, so a sequence of nearby cases takes one
// to three iterations each.
//
// # Which boilers fire
//
// Exhaust-gas economisers first: if the plant has a dump condenser and the
// economisers cover the demand, no boiler fires and the surplus is dumped.
// Otherwise the boilers fire in the order they were declared: one while
// the demand is at most Options.UsableFraction of its MCR, more above that,
// sharing by Options.Sharing. A boiler below its burner minimum (MCR /
// turndown) cycles: its burner, on at the minimum, raises the steam, the
// standby loss of the warm boiler over the off time (a given kW, or the
// efficiency model's casing loss, or 1 % of the heat input at MCR) and the
// heat each pre-purge blows out (the purge air heated to the drum's
// saturation temperature, at a given start rate or at the rate the
// burner's pressure band and the boiler's water content give), and its
// fuel is the time average; the fuel per tonne of steam rises as the load
// falls. An idle boiler may be kept warm by steam (BoilerWarming), which
// takes its standby loss while the firing rule leaves it off. Demand beyond every
// boiler's MCR is solved and reported with CanCarry false and the
// shortfall, not as a failure. A case may force which boilers fire.
//
// # Results
//
// CaseResult holds each line's state, each unit's figures, each boiler's
// load, fuel, efficiency and basis, the totals, the margin to the next
// boiler, the warnings, and the mass and energy balance closures computed
// from the solved lines and the units' boundary flows, all in SI. Their
// form for reports and scripts (keys with units such as kg/h, rounding,
// the schema's version) is package plant/schema's.
//
// Results are planning and audit estimates, not a substitute for the
// makers' manuals, class and flag rules, or licensed practice; local codes
// come first.
package plant
