local ship = steam_plant {
  name = "Invented Tanker 5",
  boilers = { { name = "AB1", mcr = "5 t/h", drum = "7 bar(g)", fuel = "HSFO", efficiency = "84 %" } },
  consumers = {
    { name = "COT 1", kind = "tank_heating", fuel = "HSFO", T = "60 C", volume = "100 m3",
      boundaries = { { area = "50 m2", U = "4 W/m2K", beyond = "sea" } } },
  },
}
case(ship, { name = "no sea", air = "10 C" })
