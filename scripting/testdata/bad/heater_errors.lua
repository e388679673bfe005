-- An engine's fuel heater that follows the engine needs its MCR; sfoc is for
-- an engine's heater only.
local ship = steam_plant {
  name = "Invented Heater Check",
  boilers = { { name = "AB1", mcr = "2 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" } },
  consumers = {
    { name = "ME heater", kind = "fuel_heater", service = "engine", fuel = "VLSFO", sfoc = "172 g/kWh",
      inlet_T = "90 C", target_viscosity = "12 cSt" },
    { name = "purifier heater", kind = "fuel_heater", service = "purifier", fuel = "VLSFO", sfoc = "172 g/kWh",
      engine_mcr = "10 MW", inlet_T = "60 C", outlet_T = "98 C" },
  },
}
