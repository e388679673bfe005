-- Never ends (for the command's timeout test).
while true do end
