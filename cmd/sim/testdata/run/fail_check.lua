-- An invented plant whose second check fails (for the command's tests).
local ship = steam_plant {
  name = "Invented Test Coaster",
  boilers = { { name = "AB1", mcr = "2 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "84 %" } },
  consumers = { { name = "galley", header = "main", steam = "60 kg/h" } },
}
local r = case(ship, { name = "harbour", sea = "14 C", air = "9 C" })
check(r.converged, "the harbour case converges")
check(r.fuel_kg_h > 1000, "harbour fuel above 1 t/h")
