-- A syntax error on line 3.
local ship = plant { name = "x" }
local mcr = = "3 t/h"
