// Package heatplan finds the least-fuel heating plan of a heated-cargo
// voyage: for each tank, an instruction per row (off, hold, heat_to at
// the coil's capacity, or reach a temperature by the row's end) that
// meets every required temperature (at a time, or through a phase such as
// the discharge) and every never-below temperature, within the coils'
// capacities and the boilers' capacity in every row, with the least
// boiler fuel over the voyage. It also plans the two plans an engineer
// would otherwise follow (hold the required temperature from the start;
// heat at the coil's capacity at the last moment that still meets it),
// solves all three as voyages (package plant/profile, the tanks carried
// from row to row by plant/loads' exact lumped model) and reports the
// fuel, CO2 and saving, the latest start of heat-up for each required
// temperature, every row where a limit binds, and, where a requirement
// cannot be met, a verdict with what it would take.
//
// # Method
//
// Dynamic programming over the rows on a grid of each tank's temperature
// (Options.Grid, 0.25 K by default, one grid point on the tank's highest
// required temperature). A tank's controls in a row from a temperature
// are: the heating off, the coil at its capacity, holding the
// temperature, and the constant duties that end the row on each grid
// temperature between those two (within the coil's capacity at the
// hotter end); each is the exact solution of the lumped model over the
// row (loads.Period). Where a control ends between grid points the value
// of the next row is interpolated linearly (a semi-Lagrangian scheme:
// rows of an hour move a cargo less than one grid step, so the state is
// not rounded to the grid); the plan is then followed forward from the
// exact starting temperatures, choosing in each row among the controls
// at the exact temperature. A required temperature missed costs 1e9 kg of
// fuel per kelvin, so the plan first misses as little as it can.
//
// The fuel of a row is the plant's boiler fuel at the planned tanks'
// total duty, from a fuel curve of the row: the plant solved (with its
// firing rule, turndown, efficiency curve and every other consumer as
// the row sets it) at 13 duty levels from zero to the coils' largest
// total, with each start of another boiler and the boilers' capacity
// found by bisection (a jump in the curve), linear between. The total is
// split among the tanks that heat in the row in equal shares, which is
// exact when they draw their steam alike (the same header, subcooling
// and returns). The curve is an approximation; the plan is solved again
// as a voyage row by row, and the report gives both figures (a test
// holds them within 0.5 %).
//
// Tanks that share the boilers interact through the fuel curve (the
// firing rule and the boilers' capacity). With few tanks the programme
// runs over the joint state (the product of the grids), which is exact
// for the discretised problem; where that is too large (Options.
// JointBudget) it runs by coordinate descent: each tank's own programme
// with the others' duties held, in turn, keeping a change only when it
// lowers the total, until a sweep gains nothing. The descent can stop at
// a plan that no single tank can improve but the joint programme would; a
// test compares the two on a two-tank case.
//
// The figures are planning estimates: the charter party's heating
// instructions, the cargo's safety data sheet and the master's judgment
// govern.
package heatplan
