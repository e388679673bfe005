-- A study with bad economics and a bad sweep (an invented plant).
local ship = steam_plant { name = "Invented Study Ship",
  boilers = { { name = "AB1", mcr = "3 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "84 %" } },
  exhaust_gas_economiser = { name = "EGE", drum = "7 bar(g)", design_load = "85 %", pinch = "20 K",
    engine = { mcr = "9 MW", { load = "25 %", gas = "11 kg/kWh", T = "250 C" }, { load = "100 %", gas = "8.1 kg/kWh", T = "245 C" } } },
  consumers = { { name = "heating", duty = "1 MW", returns = "90 %" } } }
study(ship, { name = "money", rows = { { phase = "sea", hours = 24, sea = "15 C", air = "10 C", engine = "85 %" } },
  variants = { { name = "without EGE", set = { EGE = { off = true } } }, { name = "with EGE", installed_cost = -5 } },
  fuel_price = 600, life = 15, discount_rate = "-5 %",
  sweep = { unit = "EGE", key = "exponent", from = 0.6, to = 0.8, steps = 3, cost = { at = "20 kW/K", cost = 300000 } } })
