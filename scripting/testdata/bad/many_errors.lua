-- Several errors, all reported by one check.
local ship = plant { name = "many" }
ship:makeup    { name = "makeup", T = 15 }
ship:feed_tank { name = "hotwell", heat_los = "5 kW" }
ship:boiler    { name = "AB1", mcr = "5 t/h", drum = "7 bar", fuel = "HSF0", efficiency = "85 %" }
ship:header    { name = "main" }
ship:line("steam", "AB1.steam", "main.in")
ship:line("bad", "AB1.stem", "main.in")
