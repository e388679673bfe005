-- A case may change a boiler's fuel to a built-in grade only.
local ship = include("plant_small.lua")
case(ship, { name = "port, low sulphur", set = { AB1 = { fuel = "ULSFO" } } })
