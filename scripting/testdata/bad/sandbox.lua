check(os == nil, "os is not available")
check(io == nil, "io is not available")
check(debug == nil, "debug is not available")
check(package == nil, "package is not available")
for _, f in ipairs({ "require", "dofile", "loadfile", "load", "loadstring", "module", "collectgarbage" }) do
  check(_G[f] == nil, f .. " is not available")
end
local x = require("os")
