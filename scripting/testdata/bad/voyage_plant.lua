-- A small invented plant for the bad voyage scripts (included).
return steam_plant { name = "Invented Small Tanker",
  boilers = { { name = "AB1", mcr = "3 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "84 %" } },
  consumers = { { name = "cargo heating", duty = "1 MW", returns = "90 %" },
                { name = "COT 1", kind = "tank_heating", fuel = "HSFO", T = "50 C", volume = "5000 m3",
                  boundaries = { { area = "1000 m2", U = "5 W/m2K", beyond = "sea" } } } } }
