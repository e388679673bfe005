-- The plant of ege_short.lua drawn as a full graph, with a flue-gas
-- economiser on AB1, whose efficiency comes from its furnace and smoke
-- tubes (geometry invented; the boilers fire in every case here).
local ship = plant { name = "Invented EGE Tanker, full graph" }
ship:makeup { name = "makeup", T = "15 C" }
ship:feed_tank { name = "hotwell", heat_loss = "5 kW" }
ship:feed_pump { name = "feed pump", boilers = { "AB1", "AB2" }, margin = "3 bar", eta = "45 %" }
ship:header { name = "feed header" }
ship:boiler { name = "AB1", mcr = "6 t/h", drum = "7 bar(g)", fuel = "HSFO", turndown = 4,
  efficiency = {
    furnace = { wall_area = "10 m2", volume = "2.4 m3", soot = 2e-7 },
    passes = { { tubes = 90, di = "50 mm", length = "3 m", wall = "3.5 mm", fouling_gas = "0.002 m2K/W" },
               { tubes = 90, di = "50 mm", length = "3 m", wall = "3.5 mm", fouling_gas = "0.002 m2K/W" } },
    excess_air = { {"30 %", 1.4}, {"100 %", 1.15} },
    radiation_loss = "15 kW" },
  burner = { fan_rise = "3 kPa", fan_eta = "65 %", motor_eta = "92 %" } }
ship:boiler { name = "AB2", mcr = "6 t/h", drum = "7 bar(g)", fuel = "HSFO", efficiency = "84 %", turndown = 4 }
ship:economiser { name = "ECO1", boiler = "AB1", ua = "3 kW/K", design_gas = "2 kg/s", exponent = 0.65 }
ship:exhaust_gas_economiser { name = "EGE", drum = "7 bar(g)", ua = "40 kW/K", design_gas = "25 kg/s",
  engine = { mcr = "12 MW",
    { load = "25 %", gas = "11 kg/kWh", T = "250 C" },
    { load = "100 %", gas = "27 kg/s", T = "245 C" } },
  exhaust_fuel = "VLSFO", exhaust_O2 = "14 %", min_gas_T = "170 C" }
ship:header { name = "main" }
ship:consumer { name = "cargo heating", duty = "3 MW", returns = "90 %", subcool = "10 K", return_T = "80 C" }
ship:condenser { name = "dump condenser", dump = true, subcool = "80 K" }
ship:line("makeup", "makeup", "hotwell")
ship:line("suction", "hotwell", "feed pump")
ship:line("discharge", "feed pump", "feed header")
ship:line("to ECO1", "feed header", "ECO1")
ship:line("f1", "ECO1", "AB1")
ship:line("f2", "feed header", "AB2")
ship:line("fe", "feed header", "EGE.feed")
ship:line("s1", "AB1", "main")
ship:line("s2", "AB2", "main")
ship:line("se", "EGE.steam", "main")
ship:line("h", "main", "cargo heating")
ship:line("r", "cargo heating", "hotwell")
ship:line("d", "main", "dump condenser")
ship:line("dc", "dump condenser", "hotwell")

local sea = case(ship, { name = "at sea", sea = "15 C", air = "10 C", engine = "85 %", fire = { "AB1" } })
check(sea.ege_steam_kg_h > 0 and sea.ege_fuel_saved_kg_h > 0, "the EGE raises steam and saves fuel")
check((sea.boilers[1].flue_gas_exit_T_K or 0) > 0, "AB1's exit gas comes from its furnace model")
check(sea.boilers[1].fan_electric_kW > 0, "AB1's fan draws power")
local off = case(ship, { name = "EGE off", sea = "15 C", air = "10 C", engine = "85 %", fire = { "AB1" },
                         set = { EGE = { off = true }, ECO1 = { ua = "2 kW/K" } } })
check(off.fuel_kg_h > sea.fuel_kg_h, "more fuel without the EGE")
