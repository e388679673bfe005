-- Load cases of the invented product tanker (see tanker_plant.lua; every
-- figure is invented for the demo). Which cases does one boiler carry?
local ship = include("tanker_plant.lua")

local port = case(ship, { name = "port stay, cargo held warm", sea = "12 C", air = "5 C", engine = "0 %" })
check(port.boilers_firing == 1, "one boiler carries the port stay")

local discharge = case(ship, { name = "discharge, three cargo pumps", sea = "12 C", air = "5 C", engine = "0 %",
  set = { COP1 = { off = false }, COP2 = { off = false }, COP3 = { off = false } } })
check(discharge.boilers_firing == 2, "the discharge needs both boilers")
check(discharge.can_carry, "the two boilers carry the discharge")
check(discharge.inert_gas ~= nil and discharge.inert_gas.met,
  "the boilers' flue gas is fit to inert the cargo tanks during the discharge")
-- And if a boiler trips during the discharge? The N-1 line says what is
-- shed, lowest priority first (a planning estimate: the boiler makers'
-- manuals and the ship's safety management system govern).
local trip = discharge.contingencies[1]
if trip then print(trip.line) end

local winter = case(ship, { name = "loaded passage, winter, heating to 60 C", sea = "2 C", air = "-10 C", engine = "75 %",
  set = { ["cargo heating"] = { T = "60 C" } } })
check(winter.boilers_firing == 1, "one boiler carries the winter passage")

local ballast = case(ship, { name = "ballast passage, tank cleaning", sea = "15 C", air = "12 C", engine = "75 %",
  set = { ["cargo heating"] = { off = true }, ["tank cleaning heater"] = { off = false, flow = "40 t/h" } } })
check(ballast.boilers_firing == 1, "one boiler carries the ballast passage with tank cleaning")

-- A derived figure: the discharge's fuel per hour of pumping.
print(string.format("discharge burns %.2f t/day of %s", discharge.fuel_t_per_day, discharge.boilers[1].fuel))
