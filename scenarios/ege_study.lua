-- The designer's question for the invented container ship (see
-- container_plant.lua and year_profile.csv; every figure, price and cost
-- here is invented for the demo): is an exhaust-gas economiser worth its
-- installed cost, and of what size? Each variant carries its own installed
-- cost; the money figures take a fuel price and a price of CO2 over a life
-- of 15 years at 8 % a year; a sweep of the economiser's UA finds the size
-- of highest net present value.
local ship = include("container_plant.lua")

-- An invented cost law of the economiser against its UA, in the form of
-- the six-tenths rule: 60 000 USD fixed (ducting, bypass damper, piping)
-- plus 240 000 USD at 20 kW/K, scaled by (UA/20 kW/K)^0.6.
local function installed(ua_W_K) return 60000 + 240000 * (ua_W_K / 20e3) ^ 0.6 end

-- The unit as designed (40 K pinch at 85 % load) is quoted at 420 000 USD,
-- and with a preheating section at 500 000 USD (invented quotes).
local designed, with_preheater = 420000, 500000

local s = study(ship, {
  name = "exhaust-gas economiser, one year",
  csv = "year_profile.csv",
  variants = {
    { name = "without EGE", set = { EGE = { off = true } }, installed_cost = 0 },
    { name = "EGE 10 kW/K", set = { EGE = { ua = "10 kW/K" } }, installed_cost = installed(10e3) },
    { name = "EGE 20 kW/K", set = { EGE = { ua = "20 kW/K" } }, installed_cost = installed(20e3) },
    { name = "EGE 40 kW/K", set = { EGE = { ua = "40 kW/K" } }, installed_cost = installed(40e3) },
    { name = "EGE as designed (40 K pinch at 85 % load)", installed_cost = designed },
    -- A preheating section heats the 60 C feed: more steam, but its cold
    -- end runs below the exhaust's acid dew point.
    { name = "as designed, with a preheating section", set = { EGE = { preheat_ua = "8 kW/K" } },
      installed_cost = with_preheater },
    -- Water-washed twice as often (the washing's own cost is not counted).
    { name = "as designed, washed every 1000 h", set = { EGE = { clean_interval = "1000 h" } },
      installed_cost = designed },
  },
  fuel_price = 620, carbon_price = 80, currency = "USD", life = 15, discount_rate = "8 %",
  sweep = { unit = "EGE", key = "ua", from = "5 kW/K", to = "80 kW/K", steps = 16,
    cost = { at = "20 kW/K", cost = 240000, exponent = 0.6, fixed = 60000 } },
})

check(s.hours == 8760, "the profile is one year")
local saved = {}
for i, v in ipairs(s.variants) do saved[i] = v.fuel_saved_t end
check(saved[2] > 0 and saved[3] > saved[2] and saved[4] >= saved[3],
  "a bigger economiser saves more, up to what the demand can use")

-- The NPV of the 20 kW/K unit by hand: the fuel and CO2 it saves in the
-- year, priced, over 15 years at 8 % (the annuity factor
-- (1 - 1.08^-15)/0.08), less its installed cost.
local v = s.by_name["EGE 20 kW/K"]
local annual = v.fuel_saved_t * 620 + v.co2_avoided_t * 80
local npv = -installed(20e3) + annual * (1 - 1.08 ^ -15) / 0.08
check(math.abs(v.npv - npv) <= 1e-5 * math.abs(npv), "the NPV by hand")
check(math.abs(v.payback_years - installed(20e3) / annual) <= 1e-5 * v.payback_years, "the payback by hand")

-- The best size is not the biggest: past it, the steam the demand cannot
-- use is dumped and the extra cost earns nothing.
local best = s.sweep.points[s.sweep.best]
local last = s.sweep.points[#s.sweep.points]
check(s.sweep.best < #s.sweep.points and last.npv < best.npv and last.dumped_t > best.dumped_t,
  "the sweep's best size lies inside the range swept")
check(s.by_name["as designed, with a preheating section"].hours_below_acid_dew_margin > 0,
  "the preheating section's feed enters below the exhaust's acid dew point")
check(s.by_name["EGE as designed (40 K pinch at 85 % load)"].hours_soot_risk == 1460,
  "slow steaming and manoeuvring (1100 + 360 h below 40 % load) count as soot-risk hours")
print(string.format("best size %.1f kW/K: NPV %.0f USD, payback %.1f years; EGE 20 kW/K: NPV %.0f USD, payback %.1f years",
  best.ua_W_K / 1e3, best.npv, best.payback_years, v.npv, v.payback_years))
