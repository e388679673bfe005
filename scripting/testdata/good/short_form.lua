-- The same kind of plant in the short form (invented demo plant).
local ship = steam_plant {
  name = "Invented Container Ship 1",
  boilers = {
    { name = "AB1", mcr = "3 t/h", drum = "7 bar(g)", fuel = "VLSFO", turndown = 3, efficiency = "84 %" },
    { name = "AB2", mcr = "3 t/h", drum = "7 bar(g)", fuel = "VLSFO", turndown = 3,
      efficiency = { {"30 %", "80 %"}, {"100 %", "85 %"} } },
  },
  hotwell = { heat_loss = "5 kW" },
  feed_pump = { margin = "3 bar", eta = "40 %" },
  headers = { { name = "main" }, { name = "LP", p = "4 bar(g)" } },
  consumers = {
    { name = "HFO purifier heater", header = "main", duty = "60 kW", subcool = "5 K", returns = "100 %", return_T = "85 C" },
    { name = "accommodation", header = "LP", duty = "150 kW", returns = "90 %", return_T = "80 C" },
    { name = "galley", header = "LP", steam = "40 kg/h" },
  },
}

local r = case(ship, { name = "port stay", sea = "15 C", air = "10 C" })
check(r.converged, "converged")
check(r.boilers_firing == 1, "one boiler in port")
check(#r.boilers == 2, "two boilers reported")
-- the short form named its units as documented
local names = {}
for _, c in ipairs(r.consumers) do names[c.name] = c end
check(names["galley"] ~= nil and names["accommodation"] ~= nil, "consumers present")
check(math.abs(names["galley"].steam_kg_h - 40) < 0.5, "galley takes its 40 kg/h")
return r
