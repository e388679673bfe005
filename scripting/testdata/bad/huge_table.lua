local ship = plant { name = "huge" }
local eta = {}
for i = 1, 100000 do eta[i] = { i / 100000 .. "", "85 %" } end
local t = { name = "AB1", mcr = "5 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = eta }
for i = 1, 5000 do t["k" .. i] = i end
ship:boiler(t)
