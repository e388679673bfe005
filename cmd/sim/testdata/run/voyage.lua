-- A short invented voyage plan on the test coaster (for the command's
-- tests): two phases given as rows in the script.
local ship = include("coaster_plant.lua")
local v = voyage(ship, { name = "short trip", rows = {
  { phase = "port", hours = 12, sea = "14 C", air = "9 C", engine = "0 %" },
  { phase = "passage", hours = "1 d", sea = "10 C", air = "4 C", engine = "80 %",
    set = { ["fuel heating"] = { duty = "3.5 MW" } } },
} })
check(v.total.hours == 36, "the plan covers 36 h")
