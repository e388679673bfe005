-- An inert-gas source whose efficiency is a plain table: its flue gas's O2
-- and volume are not known (invented plant).
local ship = steam_plant {
  name = "Invented Inert Gas Ship",
  boilers = { { name = "AB1", mcr = "2 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "85 %", inert_gas = true } },
  consumers = { { name = "galley", duty = "40 kW" } },
}
case(ship, { name = "port" })
