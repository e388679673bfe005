-- Every input of issue 14 §1-3 on one invented plant: a fuel from its bunker
-- delivery note, a boiler's purges and pressure band, an idle boiler kept
-- warm, a cargo pump by its steam rate into a condenser following the sea,
-- drain coolers to the feed, the hotwell and overboard, a trap loss, header drains, the
-- make-up at the sea temperature and an engine's fuel heater following the
-- engine.
local ship = steam_plant {
  name = "Invented Realism Check",
  boilers = {
    { name = "AB1", mcr = "12 t/h", drum = "16 bar(g)", fuel = "VLSFO", efficiency = "85 %", turndown = 4,
      bdn = { grade = "RMG 380", density = "955 kg/m3", sulphur = "0.48 %", water = "0.2 %", ash = "0.03 %", viscosity = "320 cSt" },
      purge_air = "30 m3", cycle_band = "1 bar", water_content = "8 t" },
    { name = "AB2", mcr = "12 t/h", drum = "16 bar(g)", fuel = "VLSFO", efficiency = "85 %", turndown = 4, standby_loss = "40 kW" },
  },
  hotwell = { heat_loss = "6 kW", set_T = "60 C" },
  headers = { { name = "HP", heat_loss = "15 kW" }, { name = "LP", p = "7 bar(g)", heat_loss = "10 kW", drains = "lost" } },
  consumers = {
    { name = "cargo heating", header = "LP", duty = "1.5 MW", returns = "95 %", return_T = "95 C", drain_cooler = "hotwell", trap_loss = "3 %" },
    { name = "galley", header = "LP", duty = "50 kW", returns = "80 %", return_T = "80 C", drain_cooler = "overboard" },
    { name = "ME heater", kind = "fuel_heater", service = "engine", fuel = "VLSFO", header = "LP",
      sfoc = { { "50 %", "178 g/kWh" }, { "100 %", "172 g/kWh" } }, engine_mcr = "9 MW",
      inlet_T = "90 C", target_viscosity = "12 cSt", returns = "100 %", return_T = "95 C" },
    { name = "AB2 warming", kind = "boiler_warming", boiler = "AB2", header = "HP", returns = "100 %" },
  },
  turbines = {
    { name = "COP1", kind = "cargo_pump", header = "HP", flow = "1500 m3/h", head = "130 m", density = "850 kg/m3",
      efficiency = "78 %", steam_rate = { { "50 %", "10.4 kg/kWh" }, { "100 %", "9.0 kg/kWh" } }, rated_power = "1 MW",
      eta_mech = "95 %", condenser = { approach = "18 K", subcool = "3 K" }, off = true },
  },
}

local sea = case(ship, { name = "at sea", sea = "14 C", air = "8 C", engine = "80 %" })
check(sea.co2_analysis_t_per_day ~= nil and sea.co2_analysis_t_per_day ~= sea.co2_t_per_day, "both CO2 figures, apart")
check(sea.boilers[2].firing == false, "one boiler carries the passage")
local port = case(ship, { name = "discharge", sea = "14 C", air = "8 C", engine = "0 %",
  set = { COP1 = { off = false }, ["cargo heating"] = { duty = "200 kW" } } })
check(port.can_carry, "the boilers carry the discharge")
