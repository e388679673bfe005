-- A voyage from rows and from a CSV file of the same rows; the same rows
-- are also solved one by one with case() for the test to compare.
local ship = include("jobs_plant.lua")

local rows = {
  { phase = "loading", hours = 12, sea = "18 C", air = "12 C", engine = "0 %", set = { ["cargo heating"] = { off = true } } },
  { phase = "loaded passage", hours = 72, sea = "15 C", air = "10 C", engine = "85 %" },
  { phase = "loaded passage", hours = "2 d", sea = "8 C", air = "2 C", engine = 0.85, set = { ["cargo heating"] = { duty = "3 MW" } } },
  { phase = "discharging", hours = 30, sea = "10 C", air = "5 C", engine = "0 %", set = { ["cargo heating"] = { duty = "1.5 MW" } }, fire = { "AB1", "AB2" } },
  { phase = "ballast passage", hours = 96, sea = "12 C", air = "8 C", engine = "75 %", set = { ["cargo heating"] = { off = true }, EGE = { off = true } } },
}
local v = voyage(ship, { name = "tables", rows = rows })
check(v.total.hours == 12 + 72 + 48 + 30 + 96, "hours add up")
check(#v.phases == 4 and v.by_phase["loaded passage"].hours == 120, "phases in order of appearance")
check(v.total.fuel_t > 0 and v.total.co2_t > v.total.fuel_t, "fuel and CO2 counted")
check(v.rows[4].boilers_firing == 2, "the fire list holds for its row")
check(v.total.hours_one_boiler + v.total.hours_two_boilers + v.total.hours_no_boiler == v.total.hours, "firing hours add up")

for i, r in ipairs(rows) do
  case(ship, { name = "row " .. i, sea = r.sea, air = r.air, engine = r.engine, set = r.set, fire = r.fire })
end

local w = voyage(ship, { name = "csv", csv = "voyage_rows.csv" })
check(w.total.rows == 5 and w.total.hours == v.total.hours, "the CSV has the same rows")
