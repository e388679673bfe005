local ship = include("voyage_plant.lua")
voyage(ship, { name = "plan", rows = {
  { phase = "sea passage", hours = -3, sea = "15 C" },
  { phase = "port", hours = 12, set = { ["COT 1"] = { T = "40 C", mode = "heat" } } },
  { hours = 6, fire = { "AB2" } } } })
