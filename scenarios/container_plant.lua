-- The steam plant of an invented container ship, "Invented Container Ship 1".
-- Every name and figure here is invented for the demo; none describes a real
-- ship, engine, maker or product. Sizes follow the typical ranges of the
-- trade (common practice, no source): one oil-fired boiler at 7 bar(g), an
-- exhaust-gas economiser on a 36 MW two-stroke main engine, heavy fuel
-- heating, accommodation and sundry consumers.

return steam_plant {
  name = "Invented Container Ship 1",
  usable = "85 %",
  boilers = {
    { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", dryness = "98 %", blowdown = "1 %",
      turndown = 3, fuel = "VLSFO",
      -- A maker's test of exit temperature and O2 against load (invented); the
      -- heat-loss method gives the efficiency at each load.
      efficiency = { flue_gas = { { "33 %", "255 C", "6 %" }, { "66 %", "280 C", "4 %" }, { "100 %", "300 C", "3 %" } },
                     radiation = "1 %" },
      burner = { fan_rise = "3.5 kPa", fan_eta = "60 %", motor_eta = "90 %" } },
  },
  -- make-up distilled water at the sea temperature (its tanks stand against the shell)
  hotwell = { heat_loss = "5 kW", set_T = "60 C" },
  feed_pump = { margin = "3 bar", eta = "40 %" },
  headers = { { name = "main", heat_loss = "12 kW" } },
  exhaust_gas_economiser = {
    name = "EGE", drum = "7 bar(g)",
    -- Exhaust after the turbocharger against engine load (invented, within the
    -- indicative ranges of docs/reference/plant-checks.md §7; a real engine's come from its maker).
    engine = { mcr = "36 MW",
      { load = "25 %", gas = "11.0 kg/kWh", T = "250 C" },
      { load = "50 %", gas = "9.0 kg/kWh", T = "230 C" },
      { load = "75 %", gas = "8.4 kg/kWh", T = "232 C" },
      { load = "100 %", gas = "8.1 kg/kWh", T = "248 C" } },
    design_load = "85 %", pinch = "40 K", min_gas_T = "165 C", bypass = true,
    -- The table holds at the engine maker's reference (25 C intake air); the
    -- engine draws engine-room air, taken 10 K above the outside air
    -- (invented, common practice, no source).
    intake_rise = "10 K",
    -- The engine burns VLSFO with 13 % O2 in its dry exhaust (invented): the
    -- exhaust's enthalpy by the NASA polynomials and its acid dew point.
    exhaust_fuel = "VLSFO", exhaust_O2 = "13 %",
    -- Soot on the gas side grows by 0.001 m2K/W per 1000 h of running on a
    -- clean surface of U 40 W/m2K, and water washing every 2000 h removes it
    -- (invented, within docs/reference/heat-transfer.md §5: soot allowances 0.001-0.005
    -- m2K/W [CP/M], U about 40 W/m2K in its worked example [C]).
    fouling_rate = "0.001 m2K/W", clean_U = "40 W/m2K", clean_interval = "2000 h",
  },
  dump_condenser = { subcool = "80 K" },
  -- The dump condenser's condensate and the returns keep the hotwell above 85 C
  -- at sea, so the drain coolers cannot cool against the feed: they are cooled
  -- by sea water ("overboard"; the default is the feed).
  consumers = {
    { name = "ME fuel heater", kind = "fuel_heater", service = "engine", fuel = "VLSFO",
      -- its oil flow follows the engine: SFOC x MCR x load (invented SFOC)
      sfoc = "172 g/kWh", engine_mcr = "36 MW", inlet_T = "90 C", target_viscosity = "12 cSt", outlet_limit = "150 C",
      returns = "100 %", return_T = "85 C", drain_cooler = "overboard" },
    { name = "purifier heaters", kind = "fuel_heater", service = "purifier", fuel = "VLSFO",
      flow = "6 t/h", inlet_T = "55 C", outlet_T = "98 C", returns = "100 %", return_T = "85 C", drain_cooler = "overboard" },
    { name = "bunker tank heating", kind = "tank_heating", fuel = "VLSFO", mode = "hold", T = "45 C",
      returns = "98 %", return_T = "85 C", drain_cooler = "overboard", volume = "3000 m3",
      boundaries = {
        { name = "bottom", area = "600 m2", U = "3.5 W/m2K", beyond = "sea" },
        { name = "sides", area = "500 m2", U = "3.5 W/m2K", beyond = "sea" },
        { name = "bulkheads to holds", area = "900 m2", U = "6 W/m2K", beyond = "air" } } },
    { name = "accommodation", kind = "accommodation", UA = "12 kW/K", inside_T = "21 C",
      balance_T = "16 C", returns = "100 %", return_T = "80 C", drain_cooler = "overboard" },
    { name = "galley and sundry", duty = "45 kW", returns = "80 %", return_T = "80 C", drain_cooler = "overboard" },
    { name = "AB1 atomising steam", kind = "atomising_steam", boiler = "AB1", ratio = "2 %" },
  },
}
