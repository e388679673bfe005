-- An invented coaster whose heating condensate returns through an observation tank.
local ship = steam_plant {
  name = "Invented Coaster 2",
  boilers = { { name = "AB1", mcr = "3 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "84 %" } },
  observation_tank = { heat_loss = "2 kW" },
  consumers = { { name = "heating", duty = "500 kW", returns = "100 %" } },
}
local r = case(ship, { name = "c", sea = "10 C", air = "5 C", set = { ["observation tank"] = { heat_loss = "3 kW" } } })
check(r.vented_kg_h > 0, "condensate flashes in the observation tank")
