local ship = plant { name = "lines" }
ship:makeup    { name = "makeup", T = "15 C" }
ship:feed_tank { name = "hotwell" }
ship:feed_pump { name = "fp", boilers = {"AB1"}, margin = "3 bar", eta = "45 %" }
ship:boiler    { name = "AB1", mcr = "5 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "85 %" }
ship:header    { name = "main" }
ship:consumer  { name = "galley", duty = "40 kW", returns = "100 %", return_T = "80 C" }
ship:line("makeup", "makeup.out", "hotwell.in")
ship:line("suction", "hotwell.out", "fp.in")
ship:line("feed", "fp.out", "AB1.feed")
ship:line("steam", "AB1.steam", "mian.in")
ship:line("to galley", "main.out", "galley.inn")
ship:line("return", "galley.out", "hotwell.in")
case(ship, { name = "port", sea = "12 C", air = "5 C" })
