-- Priorities, N-1, inert gas and least-fuel sharing from a script
-- (invented demo plant).
local eff = { flue_gas = { { "25 %", "250 C", "6 %" }, { "50 %", "280 C", "4.5 %" }, { "100 %", "330 C", "3 %" } },
              radiation = "1 %" }
local ship = steam_plant {
  name = "Invented Shuttle Tanker", sharing = "least_fuel",
  contingencies = { { "AB1", "AB2" } },
  inert_gas = { O2 = "5 %", capacity = "125 %" },
  boilers = {
    { name = "AB1", mcr = "12 t/h", drum = "16 bar(g)", fuel = "HSFO", turndown = 4, efficiency = eff, inert_gas = true },
    { name = "AB2", mcr = "12 t/h", drum = "16 bar(g)", fuel = "HSFO", turndown = 4, efficiency = eff, inert_gas = true },
  },
  headers = { { name = "HP" }, { name = "LP", p = "7 bar(g)" } },
  consumers = {
    { name = "cargo heating", kind = "tank_heating", header = "LP", fuel = "HSFO", T = "50 C", min_T = "40 C",
      volume = "20000 m3", priority = 25, returns = "98 %",
      boundaries = { { area = "6000 m2", U = "4 W/m2K", beyond = "air" }, { area = "6000 m2", U = "3 W/m2K", beyond = "sea" } } },
    { name = "accommodation", header = "LP", duty = "250 kW", priority = "hotel", returns = "100 %" },
  },
  turbines = {
    { name = "COP1", kind = "cargo_pump", header = "HP", flow = "2500 m3/h", head = "130 m", density = "850 kg/m3",
      efficiency = "80 %", exhaust = "0.2 bar(a)", eta_is = "65 %", priority = "cargo" },
    { name = "COP2", kind = "cargo_pump", header = "HP", flow = "2500 m3/h", head = "130 m", density = "850 kg/m3",
      efficiency = "80 %", exhaust = "0.2 bar(a)", eta_is = "65 %", priority = "cargo" },
  },
}

local d = case(ship, { name = "discharge", sea = "10 C", air = "5 C" })
check(d.can_carry, "both boilers carry the discharge")
check(d.least_fuel ~= nil and d.least_fuel.saved_kg_h >= 0, "least fuel burns no more than equal sharing")
check(d.inert_gas ~= nil and d.inert_gas.met, "the flue gas is fit to inert the tanks")
local trip = d.contingencies[1]
check(trip ~= nil and trip.name == "AB2 trips" and not trip.can_carry, "one boiler alone is short")
check(#d.contingencies == 2 and d.contingencies[2].note ~= "", "losing both leaves nothing")

-- Forced to one boiler: the accommodation (hotel) goes first, then the
-- cargo heating (25), then the pumps.
local one = case(ship, { name = "AB1 alone", sea = "10 C", air = "5 C", fire = { "AB1" } })
local shed = {}
for _, c in ipairs(one.consumers) do shed[c.name] = c.shed_kW end
check(not one.can_carry and shed["accommodation"] == 250, "the hotel load is shed first, all of it")
check(one.priorities_given, "priorities were given")
