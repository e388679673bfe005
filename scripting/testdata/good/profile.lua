-- A voyage profile read from CSV beside the script; fuel summed over it.
local ship = include("plant_tanker.lua")
local rows = read_csv("profile.csv")
check(#rows == 3, "three phases")
local total = 0
for _, row in ipairs(rows) do
  local r = case(ship, { name = row.phase, sea = row.sea, air = row.air,
                         set = { ["cargo heating"] = { duty = row.cargo_heating } } })
  total = total + r.fuel_t_per_day * tonumber(row.hours) / 24
end
check(total > 0, "fuel burnt over the voyage")
check(to_number(rows[3].cargo_heating, "kW") == 6000, "to_number converts units")
print(string.format("voyage fuel %.1f t", total))
