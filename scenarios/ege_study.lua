-- The designer's question for the invented container ship (see
-- container_plant.lua and year_profile.csv; every figure is invented for the
-- demo): what does the exhaust-gas economiser save over a year, and how does
-- the saving grow with its size?
local ship = include("container_plant.lua")

local s = study(ship, {
  name = "exhaust-gas economiser, one year",
  csv = "year_profile.csv",
  variants = {
    { name = "without EGE", set = { EGE = { off = true } } },
    { name = "EGE 8 kW/K", set = { EGE = { ua = "8 kW/K" } } },
    { name = "EGE 16 kW/K", set = { EGE = { ua = "16 kW/K" } } },
    { name = "EGE 32 kW/K", set = { EGE = { ua = "32 kW/K" } } },
    { name = "EGE as designed (40 K pinch at 85 % load)" },
  },
  fuel_price = 620, installed_cost = 350000, currency = "USD",
})

check(s.hours == 8760, "the profile is one year")
local saved = {}
for i, v in ipairs(s.variants) do saved[i] = v.fuel_saved_t end
check(saved[2] > 0 and saved[3] > saved[2] and saved[4] >= saved[3],
  "a bigger economiser saves more, up to what the demand can use")
print(string.format("EGE 16 kW/K saves %.0f t/yr of boiler fuel, %.0f t CO2, payback %.1f years",
  s.by_name["EGE 16 kW/K"].fuel_saved_t, s.by_name["EGE 16 kW/K"].co2_avoided_t, s.by_name["EGE 16 kW/K"].payback_years))
