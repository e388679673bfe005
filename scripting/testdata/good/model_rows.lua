-- An invented small tanker whose cargo tank changes its mode and
-- temperature from row to row of a voyage: held at 45 C, heated up from
-- 45 C to 55 C over 48 h, then held at 55 C.
local ship = steam_plant { name = "Invented Small Tanker",
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "84 %" } },
  consumers = {
    { name = "COT 1", kind = "tank_heating", fuel = "HSFO", T = "45 C", volume = "5000 m3", returns = "95 %",
      boundaries = { { area = "1000 m2", U = "5 W/m2K", beyond = "sea" }, { area = "600 m2", U = "4 W/m2K", beyond = "air" } } } } }

local v = voyage(ship, { name = "heat-up", keep = "full", rows = {
  { phase = "passage", hours = 24, sea = "10 C", air = "5 C" },
  { phase = "heat-up", hours = 48, sea = "10 C", air = "5 C",
    set = { ["COT 1"] = { mode = "heat_up", from = "45 C", to = "55 C", duration = "48 h" } } },
  { phase = "held", hours = 24, sea = "10 C", air = "5 C", set = { ["COT 1"] = { T = "55 C" } } } } })
return v
