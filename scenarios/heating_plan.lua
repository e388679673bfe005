-- The cargo heating plan of the invented heated tanker (see
-- heated_tanker_plant.lua, heating_route.csv and heating_voyage.csv; every
-- figure is invented for the demo). Three groups of tanks of heavy crude
-- leave the loading port at 44 to 46 C on a winter route of 12 days; the
-- charterer wants 57 C through the discharge, and the cargo must never fall
-- below 35 C (above its cloud point, for its pumping). What is the least
-- boiler fuel that gets it there, and when must the heating start?
local ship = include("heated_tanker_plant.lua")

local plan = heating_plan(ship, {
  name = "winter crossing to discharge",
  csv = "heating_route.csv",
  tanks = {
    ["COT 1-2"] = { T = "46 C", never_below = "35 C" },
    ["COT 3-4"] = { T = "45 C", never_below = "35 C" },
    ["COT 5-6"] = { T = "44 C", never_below = "35 C" },
  },
  required = {
    ["COT 1-2"] = { T = "57 C", at = "discharge" },
    ["COT 3-4"] = { T = "57 C", at = "discharge" },
    ["COT 5-6"] = { T = "57 C", at = "discharge" },
  },
})

print(string.format("heating plan: %.1f t of boiler fuel; holding 57 C from the start %.1f t (saves %.1f t), heating at the last moment %.1f t (saves %.1f t)",
  plan.plan.fuel_t, plan.hold.fuel_t, plan.saving_vs_hold_t, plan.last_moment.fuel_t, plan.saving_vs_last_moment_t))
for _, t in ipairs(plan.tanks) do
  local r = t.required[1]
  print(string.format("  %s: %.1f C through the discharge; latest start of heat-up %.0f h", t.name, r.reached_T_K - 273.15, r.latest_start_h))
  check(r.met, t.name .. " is at 57 C through the discharge")
end
check(#plan.plan.missed == 0, "the plan meets every required temperature")
check(#plan.plan.short_rows == 0, "the plan never needs more than the boilers carry")
check(plan.saving_vs_hold_t > 0, "the plan burns less than holding 57 C all the way")
check(plan.saving_vs_last_moment_t >= 0, "the plan burns no more than heating at the last moment")

-- The engineer's own plan, as a voyage whose tanks carry their temperature
-- from row to row: off for the first day, then heat to 57 C and hold it.
local own = voyage(ship, {
  name = "engineer's plan: heat from day 2",
  csv = "heating_voyage.csv",
  tanks = { ["COT 1-2"] = "46 C", ["COT 3-4"] = "45 C", ["COT 5-6"] = "44 C" },
})
local last = own.rows[#own.rows]
for _, t in ipairs(last.tanks) do
  print(string.format("  own plan: %s ends the discharge at %.1f C", t.name, t.end_T_K - 273.15))
  check(t.end_T_K >= 273.15 + 57 - 0.01, t.name .. " is at 57 C at the end of the discharge on the engineer's plan")
end
print(string.format("own plan: %.1f t of boiler fuel, %.1f t more than the least-fuel plan", own.total.fuel_t, own.total.fuel_t - plan.plan.fuel_t))
check(own.total.fuel_t >= plan.plan.fuel_t, "no plan of the engineer's burns less than the least-fuel plan")
