-- Three mistakes, each on its own line (for the command's tests).
local ship = plant { name = "Invented Broken Plant" }
ship:makeup    { name = "makeup", T = 15 }
ship:feed_tank { name = "hotwell", heat_los = "5 kW" }
ship:boiler    { name = "AB1", mcr = "5 t/h", drum = "7 bar", fuel = "VLSFO", efficiency = "85 %" }
