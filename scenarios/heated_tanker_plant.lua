-- The steam plant of an invented crude tanker with heated cargo,
-- "Invented Heated Tanker 2". Every name and figure here is invented for
-- the demo; none describes a real ship, maker or product. The sizes follow
-- the typical ranges of the trade (common practice, no source): two
-- oil-fired boilers at 16 bar(g) for the turbine-driven cargo pumps, the
-- cargo heating at 7 bar(g) through a reducing valve, three groups of
-- cargo tanks of heavy crude, each with steam coils in the tanks.

local efficiency = {
  -- A maker's shop test (invented): load against efficiency, LHV basis.
  { "25 %", "80.5 %" }, { "50 %", "84.0 %" }, { "75 %", "85.0 %" }, { "100 %", "84.5 %" },
}

-- One group of cargo tanks: about 40 000 m3 of heavy crude (890 kg/m3 at
-- 15 C), its faces to the air, the double bottom and the ballast tanks
-- (U values within docs/reference/plant-checks.md §6 [M]), a steam coil of 450 m2 at the
-- default U (plant/loads' DefaultCoilU, 60 W/m2K).
local function group(name, volume, extra)
  local t = { name = name, kind = "tank_heating", use = "cargo", header = "LP", density = "890 kg/m3", cargo = "heavy crude",
    mode = "hold", T = "55 C", returns = "98 %", subcool = "10 K", return_T = "85 C",
    volume = volume, coil_area = "450 m2",
    boundaries = {
      { name = "deck", area = "3500 m2", U = "4 W/m2K", beyond = "air" },
      { name = "bottom over double bottom", area = "3500 m2", U = "3 W/m2K", beyond = "sea" },
      { name = "sides over ballast tanks", area = "4000 m2", U = "3 W/m2K", beyond = "sea" },
    } }
  if extra then table.insert(t.boundaries, extra) end
  return t
end

local turbine = function(name)
  return { name = name, kind = "cargo_pump", header = "HP", flow = "2500 m3/h", head = "130 m",
    density = "890 kg/m3", efficiency = "78 %", exhaust = "0.2 bar(a)", eta_is = "65 %", eta_mech = "95 %",
    condenser = { subcool = "5 K" }, off = true }
end

return steam_plant {
  name = "Invented Heated Tanker 2",
  usable = "85 %",
  sharing = "equal",
  boilers = {
    { name = "AB1", mcr = "25 t/h", drum = "16 bar(g)", dryness = "99 %", blowdown = "1 %",
      turndown = 4, fuel = "HSFO", efficiency = efficiency },
    { name = "AB2", mcr = "25 t/h", drum = "16 bar(g)", dryness = "99 %", blowdown = "1 %",
      turndown = 4, fuel = "HSFO", efficiency = efficiency },
  },
  makeup = { T = "10 C" },
  hotwell = { heat_loss = "10 kW", set_T = "60 C" },
  feed_pump = { margin = "3 bar", eta = "45 %" },
  headers = { { name = "HP", heat_loss = "25 kW" }, { name = "LP", p = "7 bar(g)", heat_loss = "20 kW" } },
  consumers = {
    group("COT 1-2", "40000 m3"),
    group("COT 3-4", "42000 m3"),
    group("COT 5-6", "38000 m3",
      { name = "bulkhead to pump room", area = "900 m2", U = "6 W/m2K", beyond = "space", T = "25 C" }),
    { name = "HFO purifier heater", kind = "fuel_heater", service = "purifier", header = "LP",
      fuel = "HSFO", flow = "2.5 t/h", inlet_T = "60 C", outlet_T = "98 C", returns = "100 %", return_T = "85 C" },
    { name = "accommodation", kind = "accommodation", header = "LP", UA = "20 kW/K",
      inside_T = "21 C", balance_T = "16 C", returns = "100 %", return_T = "80 C" },
    { name = "galley and sundry", header = "LP", duty = "80 kW", returns = "80 %", return_T = "80 C" },
  },
  turbines = { turbine("COP1"), turbine("COP2"), turbine("COP3") },
}
