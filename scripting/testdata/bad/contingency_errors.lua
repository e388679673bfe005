-- Contingencies that name no unit, or a unit that cannot fail as one
-- (invented plant).
local ship = steam_plant {
  name = "Invented Contingency Ship",
  contingencies = { "", { "AB1", "galley" }, { "AB9" }, {} },
  boilers = { { name = "AB1", mcr = "2 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "85 %" } },
  consumers = { { name = "galley", duty = "40 kW" } },
}
case(ship, { name = "port" })
