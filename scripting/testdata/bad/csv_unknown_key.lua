local ship = include("voyage_plant.lua")
study(ship, { name = "plan", csv = "unknown_key.csv", variants = { { name = "a" }, { name = "b" } } })
