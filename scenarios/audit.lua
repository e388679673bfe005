-- The auditor's day-by-day check of the invented product tanker's reported
-- boiler fuel over a loaded passage (see tanker_plant.lua and
-- passage_log.csv; every figure is invented for the demo). The uncertain
-- inputs: the tank U-values (the cargo heating duty +-20 %), the boilers'
-- efficiency (-3 to +2 points of the maker's figure) and the condensate
-- return (90 to 100 %).
local ship = include("tanker_plant.lua")

local a = audit(ship, {
  name = "loaded passage, January",
  csv = "passage_log.csv",
  uncertain = {
    { unit = "cargo heating", key = "factor", low = 0.8, high = 1.2 },
    { unit = "AB1", key = "eta_factor", low = "96.5 %", high = "102 %" },
    { unit = "AB2", key = "eta_factor", low = "96.5 %", high = "102 %" },
    { unit = "cargo heating", key = "returns", low = "90 %", high = "100 %" },
  },
  samples = 200, seed = 20260103, band = { "5 %", "95 %" },
})

print(string.format("claimed %.1f t, modelled %.1f t (band %.1f to %.1f t); %d days flagged, %.1f t above the band",
  a.claimed_t, a.nominal_t, a.low_t, a.high_t, a.flagged, a.excess_t))
check(a.flagged == 2, "the two days reported high are flagged")
for _, d in ipairs(a.flagged_days) do
  check(d.flag == "above", "flagged day " .. d.date .. " lies above the band")
end
