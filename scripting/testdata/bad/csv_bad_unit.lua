local ship = include("voyage_plant.lua")
voyage(ship, { name = "plan", csv = "bad_unit.csv" })
