local s = "0123456789abcdef"
while true do
  s = s .. s
end
