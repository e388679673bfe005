local ship = include("plant_small.lua")
local r = case(ship, { name = "port stay", sea = "12 C", air = "5 C",
                       set = { galley = { duty = "2 MW" } } })
check(r.boilers_firing == 1, "one boiler must carry port stay")
