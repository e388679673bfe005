local ship = include("voyage_plant.lua")
voyage(ship, { name = "plan", csv = "missing_column.csv" })
