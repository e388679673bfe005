-- A designer's study: the invented tanker's voyage with and without its
-- exhaust-gas economiser, and with a larger one; and the same voyage run
-- twice by hand, with the economiser out in every row and as planned.
local ship = include("jobs_plant.lua")
local rows = {
  { phase = "loaded passage", hours = 72, sea = "15 C", air = "10 C", engine = "85 %" },
  { phase = "loaded passage", hours = 48, sea = "8 C", air = "2 C", engine = "85 %", set = { ["cargo heating"] = { duty = "3 MW" } } },
  { phase = "discharging", hours = 30, sea = "10 C", air = "5 C", engine = "0 %", set = { ["cargo heating"] = { duty = "1.5 MW" } } },
  { phase = "ballast passage", hours = 96, sea = "12 C", air = "8 C", engine = "75 %", set = { ["cargo heating"] = { off = true } } },
}
local s = study(ship, {
  name = "EGE",
  rows = rows,
  variants = {
    { name = "without EGE", set = { EGE = { off = true } } },
    { name = "with EGE" },
    { name = "larger EGE", set = { EGE = { ua = "120 kW/K" } } },
  },
  fuel_price = 650, installed_cost = 250000, currency = "USD",
})
local base, with = s.variants[1], s.by_name["with EGE"]
check(base.fuel_saved_t == 0, "the base saves nothing against itself")
check(with.fuel_saved_t > 0, "the economiser saves fuel")
-- Both figures carry six significant digits: they agree to 1e-5.
check(math.abs(with.cost_saved - 650 * with.fuel_saved_t) <= 1e-5 * with.cost_saved, "money at the fuel price")
check((with.payback_years or 0) > 0, "a payback is given")
check(s.currency == "USD" and s.hours == 246, "economics and hours carried")

local off = {}
for i, r in ipairs(rows) do
  local set = { EGE = { off = true } }
  for unit, keys in pairs(r.set or {}) do set[unit] = keys end
  off[i] = { phase = r.phase, hours = r.hours, sea = r.sea, air = r.air, engine = r.engine, set = set }
end
local without = voyage(ship, { name = "without EGE", rows = off })
local planned = voyage(ship, { name = "with EGE", rows = rows })
-- Each figure carries six significant digits: the difference agrees to
-- their rounding, 2e-5 of the larger.
check(math.abs((without.total.fuel_t - planned.total.fuel_t) - with.fuel_saved_t) <= 2e-5 * without.total.fuel_t,
      "the study's saving is the difference of the two voyages")
