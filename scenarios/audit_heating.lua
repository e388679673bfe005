-- An auditor's check of a claimed cargo-heating consumption for one loaded
-- passage of the invented product tanker (every figure is invented for the
-- demo). The operator claims 62 t of boiler fuel for cargo heating over a
-- seven-day winter passage holding the cargo at 55 C. The script models each
-- day twice, with and without the heating, and attributes the difference to
-- the heating; it allows the uncertainty of the tank U-values (+-20 %) by
-- solving the heating at 0.8 and 1.2 times its modelled duty.
local ship = include("tanker_plant.lua")

local claimed_t = 62.0
local days = {
  -- day, sea, air: the noon reports of the passage (invented)
  { "day 1", "6 C", "-2 C" }, { "day 2", "5 C", "-4 C" }, { "day 3", "4 C", "-6 C" },
  { "day 4", "4 C", "-8 C" }, { "day 5", "3 C", "-8 C" }, { "day 6", "3 C", "-6 C" },
  { "day 7", "4 C", "-3 C" },
}

local function fuel_t_per_day(sea, air, heating_factor)
  local set = { ["cargo heating"] = { factor = heating_factor } }
  if heating_factor == 0 then set = { ["cargo heating"] = { off = true } } end
  local r = case(ship, { name = "audit", sea = sea, air = air, engine = "75 %", set = set })
  return r.fuel_t_per_day
end

local low, mid, high = 0, 0, 0
for _, d in ipairs(days) do
  local base = fuel_t_per_day(d[2], d[3], 0)
  low = low + fuel_t_per_day(d[2], d[3], 0.8) - base
  mid = mid + fuel_t_per_day(d[2], d[3], 1.0) - base
  high = high + fuel_t_per_day(d[2], d[3], 1.2) - base
end

print(string.format("cargo heating fuel: modelled %.1f t (band %.1f to %.1f t), claimed %.1f t", mid, low, high, claimed_t))
check(low < mid and mid < high, "the band brackets the modelled figure")
check(claimed_t <= high, string.format("claimed %.1f t exceeds the physically plausible %.1f t by %.1f t", claimed_t, high, claimed_t - high))
check(claimed_t >= low, string.format("claimed %.1f t is below the plausible %.1f t: check the heating log", claimed_t, low))
