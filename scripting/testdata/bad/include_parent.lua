local x = include("../good/plant_tanker.lua")
