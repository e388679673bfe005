-- A sweep in a loop: accommodation duty against air temperature, reading
-- results back and deriving a cost.
local ship = include("plant_tanker.lua")
local price = 650 -- currency units per tonne, invented
local last = 0
local firing = {}
for airC = -10, 20, 10 do
  local duty = math.max(0, (20 - airC) * 12) -- kW, an invented linear law
  local r = case(ship, { name = "air " .. airC .. " C", series = "accommodation against air", sea = "10 C", air = airC .. " C",
                         set = { accommodation = { duty = duty .. " kW" } } })
  check(r.converged, "converged at " .. airC .. " C")
  local cost = r.fuel_t_per_day * price
  if airC > -10 then
    check(r.fuel_t_per_day <= last + 1e-9, "less fuel in warmer air")
  end
  last = r.fuel_t_per_day
  firing[#firing + 1] = r.boilers_firing
  print(string.format("air %3d C: %.3f t/day, cost %.0f/day", airC, r.fuel_t_per_day, cost))
end
check(#firing == 4, "four cases")
check(case(ship, { name = "one", series = "accommodation against air", sea = "10 C", air = "0 C" }).series == "accommodation against air", "a case names its series")
