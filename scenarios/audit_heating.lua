-- An auditor's check of a claimed cargo-heating consumption for one loaded
-- passage of the invented product tanker (every figure is invented for the
-- demo). The operator's heating log claims 62 t of boiler fuel for cargo
-- heating over a seven-day winter passage holding the cargo at 55 C. The
-- audit splits each day's boiler fuel into what the cargo heating caused
-- (the day's fuel less its fuel with the heating off, solved both ways for
-- every sample) and compares the claims with that share. The uncertain
-- inputs: the tank U-values (the heating's duty ±20 %, a property of the
-- ship, fixed for the passage), the boilers' efficiency (-3.5 to +2 points of
-- the shop test, fixed), and the noon readings of sea and air (±1 K and
-- ±2 K, drawn each day). The heating log's figures are taken as read off a
-- flow meter on the heating's share of the fuel, ±2 % (invented). The claim
-- turns out to lie within what the physics allows; the implied heating factor
-- says what it would take.
local ship = include("tanker_plant.lua")

local days = {}
local noon = {
  -- date, sea, air, heating fuel claimed (the operator's log, invented)
  { "day 1", "6 C", "-2 C", "8.6 t" }, { "day 2", "5 C", "-4 C", "8.8 t" }, { "day 3", "4 C", "-6 C", "9.0 t" },
  { "day 4", "4 C", "-8 C", "9.1 t" }, { "day 5", "3 C", "-8 C", "9.1 t" }, { "day 6", "3 C", "-6 C", "8.9 t" },
  { "day 7", "4 C", "-3 C", "8.5 t" },
}
for _, d in ipairs(noon) do
  days[#days + 1] = { date = d[1], phase = "loaded passage", sea = d[2], air = d[3], engine = "75 %", claimed = d[4] }
end

local a = audit(ship, {
  name = "cargo heating, winter passage",
  days = days,
  split = { { name = "cargo heating", units = { "cargo heating" } } },
  claims = "cargo heating",
  uncertain = {
    { unit = "cargo heating", key = "factor", low = 0.8, high = 1.2 },
    { unit = "AB1", key = "eta_factor", low = "96.5 %", high = "102 %" },
    { unit = "AB2", key = "eta_factor", low = "96.5 %", high = "102 %" },
    { key = "sea", low = "-1 K", high = "1 K" },
    { key = "air", low = "-2 K", high = "2 K" },
  },
  implied = { { unit = "cargo heating", key = "factor" } },
  claim = { source = "flow meter", accuracy = "2 %" },
  samples = 500, seed = 7,
})

local p = a.period
print(string.format("cargo heating fuel: claimed %.1f t, modelled %.1f t (band %.1f to %.1f t); P(model >= claim) %.4f",
  p.claimed_t, p.nominal_t, p.low_t, p.high_t, p.p_at_or_above))
check(p.low_t < p.nominal_t and p.nominal_t < p.high_t, "the band brackets the modelled figure")
check(p.flag == "" and a.flagged == 0, string.format("claimed %.1f t lies within what the physics allows, %.1f to %.1f t as measured",
  p.claimed_t, p.reading_low_t, p.reading_high_t))
-- The claim implies tank U-values about a tenth above design on every day,
-- steadily: a systematic difference (the tanks' insulation, or a heating
-- log that adds a fixed allowance), not day-to-day misreporting.
local f = a.implied[1]
check(f.days_found == 7 and f.days_outside == 0 and f.mean > 1.05 and f.sd < 0.05,
  string.format("the implied heating factor is steady: mean %.3f, sd %.3f", f.mean, f.sd))
