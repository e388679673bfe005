-- An auditor's check of claimed boiler fuel: day 3 claims far more than
-- the plant can burn on such a day.
local ship = include("jobs_plant.lua")
local a = audit(ship, {
  name = "March log",
  csv = "audit_log.csv",
  uncertain = {
    { unit = "cargo heating", key = "factor", low = 0.85, high = 1.15 },
    { unit = "AB1", key = "eta_factor", low = 0.97, high = 1.03 },
    { unit = "AB2", key = "eta_factor", low = "97 %", high = "103 %" },
  },
  claim = { source = "flow meter", accuracy = "1 %" },
  samples = 200, seed = 1, band = { "5 %", "95 %" },
})
check(a.days[3].flag == "above", "day 3 claims too much")
check(#a.flagged_days >= 1 and a.flagged_days[1].date ~= nil, "flagged days listed")
local p = a.period
check(p.claimed_t > 0 and p.low_t <= p.nominal_t and p.nominal_t <= p.high_t, "band around the nominal")
check(p.p_at_or_below > 0.5, "the high day puts the period's claim above the model's median")
local d = audit(ship, { name = "from tables", samples = 10, days = {
  { date = "2026-03-05", phase = "at anchor", hours = 24, sea = "12 C", air = "8 C", engine = "0 %", claimed = 0.6,
    set = { ["cargo heating"] = { off = true } } } },
  uncertain = { { unit = "galley", key = "duty", low = "20 kW", high = "60 kW" } } })
check(#d.days == 1, "one day")
