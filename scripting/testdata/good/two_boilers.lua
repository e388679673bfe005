-- Two auxiliary boilers, full graph form (invented demo plant).
local ship = plant { name = "Invented Product Tanker 1", ambient = "1.013 bar(a)", usable = "85 %" }

ship:makeup    { name = "makeup", T = "15 C" }
ship:feed_tank { name = "hotwell", heat_loss = "5 kW" }
ship:feed_pump { name = "fp", boilers = {"AB1", "AB2"}, margin = "3 bar", eta = "45 %" }
ship:header    { name = "feed header" }
ship:boiler    { name = "AB1", mcr = "10 t/h", drum = "7 bar(g)", dryness = "98 %", blowdown = "1 %",
                 turndown = 4, fuel = "HSFO",
                 efficiency = { {"25 %", "80 %"}, {"50 %", "84 %"}, {"75 %", "85 %"}, {"100 %", "84.5 %"} } }
ship:boiler    { name = "AB2", mcr = "10 t/h", drum = "7 bar(g)", dryness = "98 %", blowdown = "1 %",
                 turndown = 4, lhv = "40.2 MJ/kg", co2_factor = 3.114,
                 efficiency = { {"25 %", "80 %"}, {"50 %", "84 %"}, {"75 %", "85 %"}, {"100 %", "84.5 %"} } }
ship:header    { name = "main", heat_loss = "10 kW" }
ship:consumer  { name = "heating", duty = "2 MW", subcool = "10 K", returns = "95 %", return_T = "80 C" }
ship:consumer  { name = "sundry", steam = "0.36 t/h" }

ship:line("makeup", "makeup.out", "hotwell.in")
ship:line("suction", "hotwell", "fp")
ship:line("discharge", "fp.out", "feed header.in")
ship:line("feed1", "feed header.out", "AB1.feed")
ship:line("feed2", "feed header.out", "AB2.feed")
ship:line("steam1", "AB1.steam", "main.in")
ship:line("steam2", "AB2.steam", "main.in")
ship:line("to heating", "main.out", "heating.in")
ship:line("to sundry", "main.out", "sundry.in")
ship:line("heating return", "heating.out", "hotwell.in")

local port = case(ship, { name = "port stay", sea = "12 C", air = "5 C", engine = "0 %" })
print("port stay fuel", port.fuel_t_per_day, "t/day")
check(port.converged, "port stay converged")
check(port.boilers_firing == 1, "one boiler carries port stay")

local heavy = case(ship, { name = "cargo heating", sea = "12 C", air = "5 C",
                           set = { heating = { duty = "7.5 MW" } } })
check(heavy.boilers_firing == 2, "both boilers fire for cargo heating")
check(heavy.fuel_kg_h > port.fuel_kg_h, "more fuel with more heating")
check(heavy.boilers[1].load_fraction > 0.3, "AB1 loaded")
