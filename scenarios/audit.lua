-- The auditor's day-by-day check of the invented product tanker's reported
-- boiler fuel over a loaded passage (see tanker_plant.lua and
-- passage_log.csv; every figure is invented for the demo).
--
-- The uncertain inputs are of two kinds. Properties of the ship, drawn once
-- for the whole period: the tank U-values (the cargo heating's duty ±20 %),
-- the boilers' efficiency against their shop test (calibrated here on the two
-- reference days at anchor) and the condensate return (90 to 100 %). Daily
-- noise, drawn afresh each day: the noon readings of sea and air temperature
-- (±1 K and ±2 K) and the galley's and sundry duty. The claim is the boilers'
-- flow meter, ±1 % of its reading.
local ship = include("tanker_plant.lua")

local a = audit(ship, {
  name = "loaded passage, January",
  csv = "passage_log.csv",
  uncertain = {
    { unit = "cargo heating", key = "factor", low = 0.8, high = 1.2 },
    { unit = "AB1", key = "eta_factor", low = "96.5 %", high = "102 %" },
    { unit = "AB2", key = "eta_factor", low = "96.5 %", high = "102 %" },
    { unit = "cargo heating", key = "returns", low = "90 %", high = "100 %" },
    { key = "sea", low = "-1 K", high = "1 K" },
    { key = "air", low = "-2 K", high = "2 K" },
    { unit = "galley and sundry", key = "duty", low = "40 kW", high = "80 kW" },
  },
  claim = { source = "flow meter", accuracy = "1 %" },
  calibrate = { units = { "AB1", "AB2" }, key = "eta_factor", off = { "cargo heating" } },
  implied = {
    { unit = "cargo heating", key = "factor" },
    { units = { "AB1", "AB2" }, key = "eta_factor" },
  },
  split = {
    { name = "cargo heating", units = { "cargo heating" } },
    { name = "cargo pumping", units = { "COP1", "COP2", "COP3" } },
  },
  samples = 1000, seed = 20260103,
})

local p = a.period
print(string.format("claimed %.1f t over %d days, modelled %.1f t (band %.1f to %.1f t); P(model >= claim) %.3f; %d days flagged",
  p.claimed_t, p.days, p.nominal_t, p.low_t, p.high_t, p.p_at_or_above, a.flagged))
check(a.calibration.reference_days == 2, "two reference days calibrate the boilers")
check(a.flagged == 2, "the two days reported high are flagged")
for _, d in ipairs(a.flagged_days) do
  check(d.flag == "above", "flagged day " .. d.date .. " lies above the model")
  check(d.implied[1].value > 1.2, "on " .. d.date .. " the claim implies a heating factor beyond its plausible range")
end
check(#a.fuel_by_grade == 2 and a.fuel_by_grade[2].grade == "MGO", "the ECA days burn MGO")
check(a.causes[2].fuel_t > 10, "the discharge's cargo pumping is split out")
