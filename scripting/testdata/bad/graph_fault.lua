local ship = plant { name = "open" }
ship:makeup    { name = "makeup", T = "15 C" }
ship:feed_tank { name = "hotwell" }
ship:line("makeup", "makeup.out", "hotwell.in")
