local ship = plant { name = "Invented EGE Errors" }
ship:exhaust_gas_economiser { name = "EGE", drum = "7 bar(g)", ua = "40 kW/K", pinch = "15 K",
  engine = { mcr = "12 MW", { load = "25 %", gas = "11 kg/kW", T = "250 C" }, speed = 3 } }
ship:exhaust_gas_economiser { name = "EGE2", drum = "7 bar(g)", engine = { { load = "0 %", gas = "20 kg/s", T = "250 C" } } }
ship:boiler { name = "AB1", mcr = "3 t/h", drum = "7 bar(g)", fuel = "own", lhv = "40 MJ/kg", co2_factor = 3.1,
  efficiency = { flue_gas = { {"50 %", "250 C"} } } }
ship:boiler { name = "AB2", mcr = "3 t/h", drum = "7 bar(g)", fuel = "HSFO",
  efficiency = { furnace = { wall_area = "10 m2" }, excess_air = { {"50 %", "3 %"} } },
  burner = { fan_rise = "3 kPa" } }
ship:economiser { name = "ECO", boiler = "AB2" }
