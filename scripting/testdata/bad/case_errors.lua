local ship = include("plant_small.lua")
case(ship, { name = "port", sea = 12, set = { galey = { duty = "1 kW" }, galley = { dutty = "2 kW" } },
             fire = { "AB3" } })
