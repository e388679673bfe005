-- The plant of small.lua, returned for voyage.lua to include (an invented
-- plant for the command's tests).
return steam_plant {
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

