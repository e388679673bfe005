-- A small invented plant for the command's tests: two auxiliary boilers,
-- a heating load that returns its condensate and a galley that does not.
local ship = steam_plant {
  name = "Invented Test Coaster",
  boilers = {
    { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", turndown = 4,
      efficiency = { {"25 %", "80 %"}, {"100 %", "85 %"} } },
    { name = "AB2", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", turndown = 4,
      efficiency = { {"25 %", "80 %"}, {"100 %", "85 %"} } },
  },
  hotwell = { heat_loss = "3 kW" },
  feed_pump = { margin = "3 bar", eta = "40 %" },
  headers = { { name = "main", heat_loss = "5 kW" } },
  consumers = {
    { name = "fuel heating", header = "main", duty = "400 kW", subcool = "5 K", returns = "100 %", return_T = "80 C" },
    { name = "galley", header = "main", steam = "60 kg/h" },
  },
}

local port = case(ship, { name = "port stay", sea = "14 C", air = "9 C", engine = "0 %" })
print("port stay fuel", port.fuel_t_per_day, "t/day")
check(port.boilers_firing == 1, "one boiler carries the port stay")

local cold = case(ship, { name = "cold discharge", sea = "2 C", air = "-8 C", engine = "0 %",
                          set = { ["fuel heating"] = { duty = "3.5 MW" } } })
check(cold.boilers_firing == 2, "both boilers fire for the cold discharge")
