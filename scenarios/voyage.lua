-- The ship's engineer's voyage plan for the invented product tanker (see
-- tanker_plant.lua and voyage.csv; every figure is invented for the demo):
-- steam, boiler fuel and CO2 by phase, hours with one and both boilers
-- firing, the tightest margin, and the cargo's temperature at the discharge
-- berth if the heating were switched off for the anchorage.
local ship = include("tanker_plant.lua")

local v = voyage(ship, { name = "loaded voyage with discharge", csv = "voyage.csv" })

print(string.format("voyage: %.1f t of boiler fuel, %.1f t CO2 over %.0f h; both boilers fire %.1f h",
  v.total.fuel_t, v.total.co2_t, v.total.hours, v.total.hours_two_boilers))
check(v.total.hours == 336, "the plan covers 14 days")
check(v.by_phase["discharge"].hours_two_boilers == 4.5, "both boilers fire while the three cargo pumps run")

-- The cargo pumps move the cargo the tanks hold, 30 000 m3 (the cargo
-- heating's volume in tanker_plant.lua): three pumps at their 2000 m3/h in
-- bulk and one at 1000 m3/h stripping (voyage.csv).
local pumped = 0
for _, r in ipairs(v.rows) do
  if r.case == "discharge, three pumps" then pumped = pumped + 3 * 2000 * r.hours end
  if r.case == "stripping, one pump" then pumped = pumped + 1000 * r.hours end
end
check(math.abs(pumped - 30000) < 1e-6, "the cargo pumps discharge the 30 000 m3 the tanks hold")
check(v.by_phase["loaded passage"].hours_two_boilers == 0, "one boiler carries the loaded passage")
check(#v.total.short_rows == 0, "the plant carries every period of the plan")

-- If the heating were off at the anchorage (18 h, sea 7 C, air 0 C), how
-- warm would the cargo (held at 55 C) reach the berth?
local T = cool_down { tank = "cargo heating", from = "55 C", hours = 18, sea = "7 C", air = "0 C" }
print(string.format("cargo after 18 h unheated at anchor: %.1f C", T))
check(T > 50, "the cargo stays above 50 C through an unheated anchorage")
