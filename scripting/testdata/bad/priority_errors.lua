-- Priorities that are neither a number from 1 to 100 nor a named level
-- (invented plant).
local ship = steam_plant {
  name = "Invented Priority Ship",
  boilers = { { name = "AB1", mcr = "2 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "85 %" } },
  consumers = {
    { name = "galley", duty = "40 kW", priority = "hotle" },
    { name = "laundry", duty = "20 kW", priority = 0 },
    { name = "tracing", duty = "10 kW", priority = true },
  },
}
case(ship, { name = "port", set = { galley = { priority = "urgent" } } })
