-- The steam plant of an invented product tanker, "Invented Product Tanker 1".
-- Every name and figure here is invented for the demo; none describes a real
-- ship, maker or product. The sizes follow the typical ranges of the trade
-- (common practice, no source): two oil-fired boilers at 16 bar(g) for the
-- turbine-driven cargo pumps, heating at 7 bar(g) through a reducing valve,
-- a hotwell held at 60 C by steam.

local heavy_fuel_efficiency = {
  -- A maker's shop test (invented): flue-gas exit temperature and dry O2
  -- against load, turned into an efficiency by the heat-loss method (about
  -- 83-85 % LHV, within the 82-88 % of docs/reference/plant-checks.md §3.5 [M/CP] for
  -- boilers without an economiser); radiation 1 % at MCR (0.5-1.5 %,
  -- docs/reference/plant-checks.md §3.4 [CP]). The O2 also tells the inert gas's quality.
  flue_gas = { { "25 %", "260 C", "6.5 %" }, { "50 %", "295 C", "4.5 %" },
               { "75 %", "325 C", "3.5 %" }, { "100 %", "350 C", "3.0 %" } },
  radiation = "1 %",
}

local ship = steam_plant {
  name = "Invented Product Tanker 1",
  usable = "85 %",
  sharing = "equal",
  boilers = {
    -- Both boilers' uptakes feed the inert-gas system during discharge.
    { name = "AB1", mcr = "20 t/h", drum = "16 bar(g)", dryness = "99 %", blowdown = "1 %",
      turndown = 4, fuel = "HSFO", efficiency = heavy_fuel_efficiency, inert_gas = true },
    { name = "AB2", mcr = "20 t/h", drum = "16 bar(g)", dryness = "99 %", blowdown = "1 %",
      turndown = 4, fuel = "HSFO", efficiency = heavy_fuel_efficiency, inert_gas = true },
  },
  -- make-up distilled water at the sea temperature (its tanks stand against the shell)
  hotwell = { heat_loss = "8 kW", set_T = "60 C" },
  feed_pump = { margin = "3 bar", eta = "45 %" },
  headers = { { name = "HP", heat_loss = "20 kW" }, { name = "LP", p = "7 bar(g)", heat_loss = "15 kW" } },
  -- An exhaust-gas economiser on the 11 MW main engine raising steam into the
  -- 16 bar(g) system: with saturation at 204 C it recovers little (invented
  -- engine data, within the indicative ranges of docs/reference/plant-checks.md §7).
  exhaust_gas_economiser = {
    name = "EGE", drum = "16 bar(g)",
    engine = { mcr = "11 MW",
      { load = "25 %", gas = "11.0 kg/kWh", T = "255 C" },
      { load = "50 %", gas = "9.2 kg/kWh", T = "240 C" },
      { load = "75 %", gas = "8.5 kg/kWh", T = "242 C" },
      { load = "100 %", gas = "8.2 kg/kWh", T = "258 C" } },
    design_load = "85 %", pinch = "20 K", min_gas_T = "170 C",
    -- The table holds at the engine maker's reference (25 C intake air); the
    -- engine draws engine-room air, taken 10 K above the outside air
    -- (invented, common practice, no source).
    intake_rise = "10 K",
  },
  dump_condenser = { subcool = "80 K" },
  -- Drain coolers give their heat to the boiler feed after the feed pump by
  -- default. The hotwell runs near the returns' temperature, so a cooler can
  -- only cool against the feed to above it: the 85 C returns heat the feed, the
  -- 80 C ones (accommodation, galley) are cooled by sea water ("overboard").
  -- Priorities say what is shed first when the boilers at their limit are
  -- short (a boiler trips during the discharge, say): the hotel loads, then
  -- the cargo heating (its cargo cools slowly, and min_T says how far it
  -- may), then the cargo pumps; the fuel heating last.
  consumers = {
    -- The cargo's flash point from its (invented) certificate of quality.
    { name = "cargo heating", kind = "tank_heating", header = "LP", fuel = "HSFO", use = "cargo",
      flash_point = "85 C", mode = "hold", T = "55 C", returns = "98 %", subcool = "10 K", return_T = "85 C",
      priority = 25, min_T = "45 C",
      volume = "30000 m3",
      boundaries = {
        { name = "deck", area = "4800 m2", U = "4.5 W/m2K", beyond = "air" },
        { name = "bottom over double bottom", area = "4800 m2", U = "3.5 W/m2K", beyond = "sea" },
        { name = "sides over ballast tanks", area = "5200 m2", U = "3.5 W/m2K", beyond = "sea" },
        { name = "bulkhead to engine room", area = "600 m2", U = "6 W/m2K", beyond = "space", T = "40 C" },
      } },
    -- The heavy-fuel settling and service tanks in the engine room (invented
    -- sizes; U within docs/reference/plant-checks.md §6's ranges: bulkhead to the engine
    -- room 5-8 W/m2K at 35-45 C, double hull over an empty ballast tank 2-5
    -- W/m2K). The settling tank is held at 60 C, the purifier heater's inlet
    -- (the yard list's 60 -> 98 C, docs/reference/plant-checks.md §5.2), and its coils also
    -- warm the oil let in from the bunker tanks, 45 C (storage 40-50 C,
    -- docs/reference/plant-checks.md §5.2), at the purifier's 2.2 t/h. The service tank is held at 75 C for
    -- the burner heaters (inlet 70 C); the heat the purified oil brings in
    -- from the purifier heater is not credited against its coils (they are
    -- counted for the tank's losses, as when the purifier stops: a
    -- conservative simplification). The bunkers' flash point is 78 C, from
    -- the (invented) delivery note: the service tank at 75 C is within 10 K
    -- of it, which SOLAS II-2 reg. 4.2 allows a tank of the supply system
    -- under its own arrangements (from memory), and the report says so.
    { name = "HFO settling tank heating", kind = "tank_heating", header = "LP", fuel = "HSFO", use = "settling",
      flash_point = "78 C", mode = "hold", T = "60 C", volume = "60 m3", returns = "98 %", subcool = "10 K", return_T = "85 C",
      boundaries = {
        { name = "bulkheads and top to the engine room", area = "85 m2", U = "6 W/m2K", beyond = "space", T = "40 C" },
        { name = "side over a ballast tank", area = "20 m2", U = "3.5 W/m2K", beyond = "sea" },
      } },
    { name = "HFO settling tank, oil let in", kind = "fuel_heater", service = "transfer", header = "LP",
      fuel = "HSFO", flow = "2.2 t/h", inlet_T = "45 C", outlet_T = "60 C", returns = "98 %", return_T = "85 C" },
    { name = "HFO service tank heating", kind = "tank_heating", header = "LP", fuel = "HSFO", use = "service",
      flash_point = "78 C", mode = "hold", T = "75 C", volume = "40 m3", returns = "98 %", subcool = "10 K", return_T = "85 C",
      boundaries = {
        { name = "bulkheads and top to the engine room", area = "70 m2", U = "6 W/m2K", beyond = "space", T = "40 C" },
      } },
    { name = "HFO purifier heater", kind = "fuel_heater", service = "purifier", header = "LP",
      fuel = "HSFO", flow = "2.2 t/h", inlet_T = "60 C", outlet_T = "98 C",
      returns = "100 %", return_T = "85 C", priority = "essential" },
    { name = "AB1 burner heater", kind = "fuel_heater", service = "burner", boiler = "AB1", header = "LP",
      fuel = "HSFO", inlet_T = "70 C", target_viscosity = "15 cSt", returns = "100 %", return_T = "85 C" },
    { name = "AB2 burner heater", kind = "fuel_heater", service = "burner", boiler = "AB2", header = "LP",
      fuel = "HSFO", inlet_T = "70 C", target_viscosity = "15 cSt", returns = "100 %", return_T = "85 C" },
    { name = "accommodation", kind = "accommodation", header = "LP", UA = "18 kW/K",
      inside_T = "21 C", balance_T = "16 C", returns = "100 %", return_T = "80 C", drain_cooler = "overboard",
      priority = "hotel" },
    { name = "galley and sundry", header = "LP", duty = "60 kW", returns = "80 %", return_T = "80 C", drain_cooler = "overboard",
      priority = "hotel" },
    { name = "tank cleaning heater", kind = "tank_cleaning", header = "LP", flow = "40 t/h",
      outlet_T = "75 C", returns = "95 %", return_T = "85 C", off = true, priority = "deferrable" },
  },
  turbines = {
    { name = "COP1", kind = "cargo_pump", header = "HP", flow = "2000 m3/h", head = "140 m",
      density = "800 kg/m3", efficiency = "78 %", exhaust = "0.2 bar(a)", eta_is = "65 %", eta_mech = "95 %",
      condenser = { subcool = "5 K" }, off = true, priority = "cargo" },
    { name = "COP2", kind = "cargo_pump", header = "HP", flow = "2000 m3/h", head = "140 m",
      density = "800 kg/m3", efficiency = "78 %", exhaust = "0.2 bar(a)", eta_is = "65 %", eta_mech = "95 %",
      condenser = { subcool = "5 K" }, off = true, priority = "cargo" },
    { name = "COP3", kind = "cargo_pump", header = "HP", flow = "2000 m3/h", head = "140 m",
      density = "800 kg/m3", efficiency = "78 %", exhaust = "0.2 bar(a)", eta_is = "65 %", eta_mech = "95 %",
      condenser = { subcool = "5 K" }, off = true, priority = "cargo" },
  },
}

return ship
