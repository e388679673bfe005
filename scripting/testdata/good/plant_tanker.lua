-- Shared plant for the sweep and profile scripts (invented demo plant).
return steam_plant {
  name = "Invented Product Tanker 2",
  boilers = {
    { name = "AB1", mcr = "8 t/h", drum = "8 bar(g)", fuel = "HSFO", turndown = 4, efficiency = "84 %" },
    { name = "AB2", mcr = "8 t/h", drum = "8 bar(g)", fuel = "HSFO", turndown = 4, efficiency = "84 %" },
  },
  consumers = {
    { name = "accommodation", duty = "200 kW", returns = "95 %", return_T = "80 C" },
    { name = "cargo heating", duty = "1 MW", returns = "95 %", return_T = "80 C" },
  },
}
