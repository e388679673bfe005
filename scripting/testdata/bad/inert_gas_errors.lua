-- An inert-gas source without a combustion model, and limits out of range
-- (invented plant).
local ship = steam_plant {
  name = "Invented Inert Gas Ship",
  inert_gas = { O2 = "0 %", capacity = "125 %", fan = "8000 m3/h" },
  boilers = { { name = "AB1", mcr = "2 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "85 %", inert_gas = true } },
  consumers = { { name = "galley", duty = "40 kW" } },
}
case(ship, { name = "port" })
