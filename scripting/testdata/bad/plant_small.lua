return steam_plant {
  name = "Invented Small Ship",
  boilers = {
    { name = "AB1", mcr = "2 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "85 %" },
    { name = "AB2", mcr = "2 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "85 %" },
  },
  consumers = { { name = "galley", duty = "40 kW" } },
}
