-- The invented container ship at sea and in port, with and without its
-- exhaust-gas economiser (see container_plant.lua; every figure is invented).
local ship = include("container_plant.lua")

local sea = case(ship, { name = "at sea, 80 % load, winter", sea = "8 C", air = "2 C", engine = "80 %" })
check(sea.boilers_firing == 0, "the exhaust-gas economiser carries the winter passage at 80 % load")

local sea_off = case(ship, { name = "at sea, 80 % load, winter, EGE out of service", sea = "8 C", air = "2 C",
  engine = "80 %", set = { EGE = { off = true } } })
check(sea_off.boilers_firing == 1, "without the EGE the boiler must fire at sea")

local slow = case(ship, { name = "at sea, 30 % load, winter", sea = "8 C", air = "2 C", engine = "30 %" })

local port = case(ship, { name = "in port, winter", sea = "8 C", air = "2 C", engine = "0 %",
  set = { ["ME fuel heater"] = { off = true } } })
check(port.boilers_firing == 1, "one boiler carries the port stay")

print(string.format("EGE saves %.2f t/day at 80 %% load; at 30 %% load the boiler fires %s",
  sea_off.fuel_t_per_day - sea.fuel_t_per_day, slow.boilers_firing > 0 and "too" or "not"))
