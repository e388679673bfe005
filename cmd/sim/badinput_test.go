package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

// badPlant is a small invented plant (for the command's tests), returned
// by plant.lua for the scripts of TestBadInputs to include.
const badPlant = `return steam_plant {
  name = "Invented Test Coaster",
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" } },
  consumers = { { name = "galley", steam = "60 kg/h" } },
}
`

// badCase solves one load case on badPlant (line 2 of a script).
const badCase = "local ship = include(\"plant.lua\")\n" +
	"local r = case(ship, { name = \"port\", sea = \"14 C\", air = \"9 C\" })\n"

// A file content that TestBadInputs makes into something else.
const (
	asFolder = "\x00folder"
	asFIFO   = "\x00fifo"
)

// TestBadInputs runs sim on bad input, one row each: what the command
// line, the scripts or the files are, the exit status and the whole of
// stderr ({dir} stands for the row's folder). A row may also say what
// stdout must contain and check the files afterwards.
func TestBadInputs(t *testing.T) {
	t.Parallel()
	long := strings.Repeat("1", 100000)
	cut := strings.Repeat("1", 40) + "…" // the first 40 characters
	rows := []struct {
		name   string
		files  map[string]string
		args   []string
		code   int
		stderr string
		stdout string                         // a part of stdout; "" means empty
		after  func(t *testing.T, dir string) // checks of the files afterwards
	}{
		// The script itself.
		{name: "missing script", args: []string{"run", "{dir}/nosuch.lua"}, code: exitFail,
			stderr: "sim: cannot open {dir}/nosuch.lua: no such file\n"},
		{name: "missing second script, found before the first runs",
			files: map[string]string{"plant.lua": badPlant, "s.lua": "print(\"started\")\n" + badCase},
			args:  []string{"run", "{dir}/s.lua", "{dir}/nosuch.lua"}, code: exitFail,
			stderr: "sim: cannot open {dir}/nosuch.lua: no such file\n"},
		{name: "missing script in check", args: []string{"check", "{dir}/nosuch.lua"}, code: exitFail,
			stderr: "sim: cannot open {dir}/nosuch.lua: no such file\n"},
		{name: "script is a folder", files: map[string]string{"sub": asFolder},
			args: []string{"run", "{dir}/sub"}, code: exitFail,
			stderr: "sim: cannot open {dir}/sub: it is a folder, not a file\n"},
		{name: "script is a named pipe", files: map[string]string{"pipe.lua": asFIFO},
			args: []string{"run", "--timeout", "1m", "{dir}/pipe.lua"}, code: exitFail,
			stderr: "sim: cannot open {dir}/pipe.lua: it is a named pipe, not a regular file; save the data to a file first\n"},

		// Outputs that are inputs, or named twice: refused before the run.
		{name: "-o names the script", files: map[string]string{"plant.lua": badPlant, "s.lua": badCase},
			args: []string{"run", "-o", "{dir}/s.lua", "{dir}/s.lua"}, code: exitUsage,
			stderr: "sim run: -o {dir}/s.lua is the script {dir}/s.lua: the report would overwrite it\n" + runUsage,
			after:  unchanged("s.lua", badCase)},
		{name: "-o names the script another way", files: map[string]string{"plant.lua": badPlant, "s.lua": badCase},
			args: []string{"run", "-o", "{dir}/./s.lua", "{dir}/s.lua"}, code: exitUsage,
			stderr: "sim run: -o {dir}/./s.lua is the script {dir}/s.lua: the report would overwrite it\n" + runUsage,
			after:  unchanged("s.lua", badCase)},
		{name: "--plot names the script", files: map[string]string{"plant.lua": badPlant, "s.svg": badCase},
			args: []string{"run", "--plot", "{dir}/s.svg", "{dir}/s.svg"}, code: exitUsage,
			stderr: "sim run: --plot {dir}/s.svg would overwrite the script {dir}/s.svg: give the chart another name\n" + runUsage,
			after:  unchanged("s.svg", badCase)},
		{name: "a chart of --plot would be the script", files: map[string]string{"plant.lua": badPlant, "d-cases.svg": badCase},
			args: []string{"run", "--plot", "{dir}/d.svg", "{dir}/d-cases.svg"}, code: exitUsage,
			stderr: "sim run: --plot {dir}/d.svg would overwrite the script {dir}/d-cases.svg: give the chart another name\n" + runUsage},
		{name: "-o and --plot the same file", files: map[string]string{"plant.lua": badPlant, "s.lua": badCase},
			args: []string{"run", "-o", "{dir}/x.svg", "--plot", "{dir}/x.svg", "{dir}/s.lua"}, code: exitUsage,
			stderr: "sim run: -o and --plot both name {dir}/x.svg: give each its own file\n" + runUsage},
		{name: "-o a name a chart may get", files: map[string]string{"plant.lua": badPlant, "s.lua": badCase},
			args: []string{"run", "-o", "{dir}/x-voyage-2.svg", "--plot", "{dir}/x.svg", "{dir}/s.lua"}, code: exitUsage,
			stderr: "sim run: -o {dir}/x-voyage-2.svg is a name a chart of --plot {dir}/x.svg may get: give the report another name\n" + runUsage},
		// Includes and CSV files: refused at the line that reads them.
		{name: "-o names an include", files: map[string]string{"plant.lua": badPlant, "s.lua": badCase},
			args: []string{"run", "-o", "{dir}/plant.lua", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:1: include(\"plant.lua\"): this is the file -o {dir}/plant.lua writes; a run may not overwrite a file it reads: give -o another name\n",
			after:  unchanged("plant.lua", badPlant)},
		{name: "-o names a CSV", files: map[string]string{"p.csv": "phase\nport\n", "s.lua": "local rows = read_csv(\"p.csv\")\n"},
			args: []string{"run", "-o", "{dir}/p.csv", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:1: read_csv(\"p.csv\"): this is the file -o {dir}/p.csv writes; a run may not overwrite a file it reads: give -o another name\n",
			after:  unchanged("p.csv", "phase\nport\n")},
		{name: "--plot names a voyage's CSV", files: map[string]string{"plant.lua": badPlant, "v.svg": "phase,hours\nport,12\n",
			"s.lua": "local ship = include(\"plant.lua\")\nvoyage(ship, { name = \"v\", csv = \"v.svg\" })\n"},
			args: []string{"run", "--plot", "{dir}/v.svg", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:2: voyage(\"v.svg\"): this is the file --plot {dir}/v.svg writes; a run may not overwrite a file it reads: give --plot another name\n",
			after:  unchanged("v.svg", "phase,hours\nport,12\n")},

		// Outputs that cannot be written: found before the run (the
		// script would print "started").
		{name: "-o in a missing folder", files: map[string]string{"plant.lua": badPlant, "s.lua": "print(\"started\")\n" + badCase},
			args: []string{"run", "-o", "{dir}/no/such/r.txt", "{dir}/s.lua"}, code: exitFail,
			stderr: "sim run: -o {dir}/no/such/r.txt: the folder {dir}/no/such does not exist\n"},
		{name: "-o is a folder", files: map[string]string{"plant.lua": badPlant, "s.lua": "print(\"started\")\n" + badCase, "out": asFolder},
			args: []string{"run", "-o", "{dir}/out", "{dir}/s.lua"}, code: exitFail,
			stderr: "sim run: -o {dir}/out: it is a folder; give the name of a file to write\n"},
		{name: "-o under a file", files: map[string]string{"plant.lua": badPlant, "s.lua": "print(\"started\")\n" + badCase},
			args: []string{"run", "-o", "{dir}/s.lua/r.txt", "{dir}/s.lua"}, code: exitFail,
			stderr: "sim run: -o {dir}/s.lua/r.txt: cannot write there: a part of the path is a file, not a folder\n"},
		{name: "-o is a named pipe", files: map[string]string{"plant.lua": badPlant, "s.lua": "print(\"started\")\n" + badCase, "out": asFIFO},
			args: []string{"run", "-o", "{dir}/out", "{dir}/s.lua"}, code: exitFail,
			stderr: "sim run: -o {dir}/out: it is not a regular file (a device, a pipe or a socket); give the name of a file to write\n"},
		{name: "--plot in a missing folder", files: map[string]string{"plant.lua": badPlant, "s.lua": "print(\"started\")\n" + badCase},
			args: []string{"run", "--plot", "{dir}/no/d.svg", "{dir}/s.lua"}, code: exitFail,
			stderr: "sim run: --plot {dir}/no/d.svg: the folder {dir}/no does not exist\n"},

		// Files a script reads that are not regular files.
		{name: "read_csv of a named pipe", files: map[string]string{"f.csv": asFIFO, "s.lua": "local rows = read_csv(\"f.csv\")\n"},
			args: []string{"run", "--timeout", "1m", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:1: read_csv(\"f.csv\"): it is a named pipe, not a regular file; save the data to a file first\n"},
		{name: "voyage CSV a named pipe", files: map[string]string{"plant.lua": badPlant, "f.csv": asFIFO,
			"s.lua": "local ship = include(\"plant.lua\")\nvoyage(ship, { name = \"v\", csv = \"f.csv\" })\n"},
			args: []string{"run", "--timeout", "1m", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:2: voyage(\"f.csv\"): it is a named pipe, not a regular file; save the data to a file first\n"},
		{name: "include of a folder", files: map[string]string{"p": asFolder, "s.lua": "include(\"p\")\n"},
			args: []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:1: include(\"p\"): it is a folder, not a file\n"},

		// Errors raised by scripts.
		{name: "error with a table", files: map[string]string{"s.lua": "local x = 1\nerror({code = 1})\n"},
			args: []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:2: the script raised an error with a table instead of a message: {code = 1}\n"},
		{name: "error with a nested table, in a function",
			files: map[string]string{"s.lua": "local function f()\n  error({ \"a\", why = { \"b\\r\\n\" } })\nend\nf()\n"},
			args:  []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:2: the script raised an error with a table instead of a message: {\"a\", why = {\"b\\r\\n\"}}\n"},
		{name: "error with nil", files: map[string]string{"s.lua": "\nerror(nil)\n"},
			args: []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:2: the script raised an error with no message (error(nil) or error())\n"},
		{name: "error without a position", files: map[string]string{"s.lua": "\n\nerror(\"no place\", 0)\n"},
			args: []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:3: no place\n"},
		{name: "check message with control characters",
			files: map[string]string{"plant.lua": badPlant, "s.lua": badCase + "check(false, \"msg\\r\\nfake line\\27[2J\")\n"},
			args:  []string{"run", "--quiet", "{dir}/s.lua"}, code: exitFail,
			stderr: `{dir}/s.lua:3: assertion failed: msg\r\nfake line\x1b[2J` + "\n", stdout: "Load case 1 of 1: port"},
		{name: "unit name with control characters in an error",
			files: map[string]string{"s.lua": "local ship = plant { name = \"p\" }\nship:makeup { name = \"m\\r\\nfake\", T = 15 }\n"},
			args:  []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:1: plant \"p\": has no lines; join its units with ship:line(name, \"from.port\", \"to.port\")\n" +
				"{dir}/s.lua:2: makeup \"m\\r\\nfake\": T needs a unit, such as '170 C'; got 15\n"},
		{name: "100 kB quantity",
			files: map[string]string{"plant.lua": badPlant, "s.lua": "local ship = include(\"plant.lua\")\n" +
				"local r = case(ship, { name = \"x\", sea = \"" + long + " C\", air = \"9 C\" })\n"},
			args: []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:2: case \"x\": sea: number in '" + cut + "' (100002 characters) is out of range for a float64\n"},
		{name: "100 kB name",
			files: map[string]string{"plant.lua": badPlant, "s.lua": "local ship = include(\"plant.lua\")\n" +
				"local r = case(ship, { name = \"" + long + "\", sea = \"14\", air = \"9 C\" })\n"},
			args: []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:2: case \"" + cut + "\" (100000 characters): sea: temperature needs a unit, such as '170 C'; got '14'\n"},

		// The time limit: where, what was solved, and the flag.
		{name: "time limit",
			files: map[string]string{"plant.lua": badPlant, "s.lua": badCase + "while true do end\n"},
			args:  []string{"run", "--quiet", "--timeout", "300ms", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:3: script stopped: it ran longer than its time limit of 300ms (an endless loop?); to give it longer, run again with --timeout 5s\n",
			stdout: "Load case 1 of 1: port"},
		{name: "time limit, default", files: map[string]string{"s.lua": "\nwhile true do end\n"},
			args: []string{"check", "--timeout", "200ms", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:2: script stopped: it ran longer than its time limit of 200ms (an endless loop?); to give it longer, run again with --timeout 2s\n"},

		{name: "job time limit", files: map[string]string{"plant.lua": badPlant, "v.csv": "phase,hours\n" + strings.Repeat("sea,1\n", 2000),
			"s.lua": "local ship = include(\"plant.lua\")\nvoyage(ship, { name = \"v\", csv = \"v.csv\" })\n"},
			args: []string{"run", "--quiet", "--job-timeout", "1ms", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:2: voyage \"v\" stopped: it ran longer than its time limit of 1ms (as given); raise the job time limit (sim run --job-timeout; scripting's Options.JobTimeout); to give it longer, run again with --job-timeout 1s\n",
			stdout: "Nothing was solved"},
		{name: "job time limit below zero", args: []string{"run", "--job-timeout", "-1s", "x.lua"}, code: exitUsage,
			stderr: "sim run: --job-timeout -1s: the time limit must be above zero and at most 24h0m0s, such as 10m or 2h\n" + runUsage},
		{name: "rows neither summary nor full", args: []string{"run", "--rows", "all", "x.lua"}, code: exitUsage,
			stderr: "sim run: --rows \"all\": give summary (each row's figures, the default) or full (each row's case result as well)\n" + runUsage},

		// sim steam: out of range is a failure (1), a mistake of usage 2.
		// 700 bar(g) is 70.101325 MPa (700 bar + 1.01325 bar); the
		// critical pressure 22.064 MPa is IAPWS R7-97(2012) Eq. 2's pc.
		{name: "steam above the critical pressure", args: []string{"steam", "--p", "700 bar(g)", "--x", "1"}, code: exitFail,
			stderr: "sim steam: pressure 70.101325 MPa above the critical pressure 22.064 MPa (end of the saturation line, IF97 region 4)\n"},
		{name: "steam above the IF97 temperature", args: []string{"steam", "--p", "7 bar(g)", "--t", "3000 C"}, code: exitFail,
			stderr: "sim steam: temperature 3273.15 K above the IF97 limit of 2273.15 K (2000 °C)\n"},
		// p_sat(100 °C) = 1.01418 bar(a), IAPWS-IF97 Eq. 30 (from memory:
		// the steam tables' 101.418 kPa); the state must lie within 1e-9
		// of it to count as on the line (plant/water's satTol).
		{name: "steam on the saturation line", args: []string{"steam", "--t", "100 C", "--p", "101417.977921 Pa"}, code: exitFail,
			stderr: "sim steam: 1.01418 bar(a) and 100.00 °C lie on the saturation line (the saturation pressure at that temperature is 1.01418 bar(a), IAPWS-IF97 Eq. 30): pressure and temperature do not fix the state there; give the quality with --x instead of --t or --p\n"},
		{name: "steam ambient out of range", args: []string{"steam", "--p", "7 bar(g)", "--x", "1", "--ambient", "2 bar(a)"}, code: exitFail,
			stderr: "sim steam: --ambient \"2 bar(a)\" is 2 bar(a); an ambient pressure must lie between 0.5 and 1.5 bar(a)\n"},
		{name: "steam 100 kB pressure", args: []string{"steam", "--p", long + " bar(g)", "--x", "1"}, code: exitFail,
			stderr: "sim steam: --p: number in '" + cut + "' (100007 characters) is out of range for a float64\n"},
		{name: "steam 100 kB unknown unit", args: []string{"steam", "--p", "7 " + long, "--x", "1"}, code: exitUsage,
			stderr: "sim steam: --p: unknown unit '" + cut + "' (100000 characters) in '7 " + cut[2:] + "' (100002 characters); " +
				"pressure units are: Pa, kPa, MPa, bar(a), mbar(a), psia, kg/cm2a, atm, mmHg, bar(g), mbar(g), kPa(g), MPa(g), psig, kg/cm2g\n" + steamUsage},

		// --version
		{name: "--version with an argument", args: []string{"--version", "x"}, code: exitUsage,
			stderr: "sim: --version takes no arguments; got \"x\"\n"},

		// Values out of their ranges, zero given included (issue 17), and
		// loads that could be misread (issue 16).
		{name: "CSV hours of 1e308", files: map[string]string{"plant.lua": badPlant, "v.csv": "phase,hours\nsea,1e308\n",
			"s.lua": "local ship = include(\"plant.lua\")\nvoyage(ship, { csv = \"v.csv\" })\n"},
			args: []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/v.csv:2: column \"hours\": hours must be at most 8784 h (a leap year) for one row; got 1e+308\n"},
		{name: "rows hours of math.huge", files: map[string]string{"plant.lua": badPlant,
			"s.lua": "local ship = include(\"plant.lua\")\nvoyage(ship, { rows = { { phase = \"sea\", hours = math.huge } } })\n"},
			args: []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:2: voyage \"voyage 1\" rows[1]: hours must be at most 8784 h (a leap year) for one row; got 1.7976931348623157e+308\n"},
		{name: "claimed of 1e308", files: map[string]string{"plant.lua": badPlant,
			"s.lua": "local ship = include(\"plant.lua\")\naudit(ship, { days = { { date = \"1 Jan\", claimed = 1e308 } } })\n"},
			args: []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:2: audit \"audit 1\" days[1]: claimed must be at most 10000 t; got 1e+308\n"},
		{name: "zeros given, usable of 150 %, returns of 95, a reducing valve raising the pressure", files: map[string]string{"s.lua": `local ship = steam_plant { name = "Invented Test Coaster", usable = "150 %",
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %", dryness = "0 %" } },
  consumers = { { name = "heating", duty = "300 kW", returns = 95, return_T = "0 K" } },
  headers = { { name = "main" }, { name = "LP", p = "16 bar(g)" } } }
`},
			args: []string{"check", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:1: plant \"Invented Test Coaster\": usable must lie between 50 % and 100 % of one boiler's MCR; got 150 %\n" +
				"{dir}/s.lua:2: boiler \"AB1\": dryness must lie between 80 % and 100 %; got 0 %\n" +
				"{dir}/s.lua:3: consumer \"heating\": returns must lie between 0 % and 100 %; got 95; write \"95 %\"\n" +
				"{dir}/s.lua:3: consumer \"heating\": return_T must lie between 1 C and 200 C; got 0 K\n" +
				"{dir}/s.lua:4: unit \"PRV LP\": its set pressure 17 bar(a) is above its inlet's 8.01 bar(a) (line \"to PRV LP\"): a reducing valve cannot raise the pressure; set it below, or feed it from a higher header\n"},
		{name: "fuel_price of 1e308", files: map[string]string{"plant.lua": badPlant, "y.csv": "phase,hours\nsea,10\n",
			"s.lua": "local ship = include(\"plant.lua\")\nstudy(ship, { csv = \"y.csv\", fuel_price = 1e308, variants = { { name = \"base\" }, { name = \"more\", set = { galley = { factor = 1.1 } } } } })\n"},
			args: []string{"run", "--quiet", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:2: study \"study 1\": fuel_price must lie between 0 and 1e+09 a tonne (in any currency); got 1e+308\n"},
		{name: "zeros given: usable, a motor's and a turbine's efficiency", files: map[string]string{"s.lua": `local ship = steam_plant { name = "Invented Test Coaster", usable = "0 %",
  feed_pump = { motor_eta = "0 %" },
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" } },
  turbines = { { name = "T1", power = "100 kW", eta_is = "60 %", eta_mech = "0 %", exhaust = "1.5 bar(a)" } },
  consumers = { { name = "b", duty = "300 kW", returns = "90 %" } } }
`},
			args: []string{"check", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:1: plant \"Invented Test Coaster\": usable must lie between 50 % and 100 % of one boiler's MCR; got 0 %\n" +
				"{dir}/s.lua:2: feed pump \"feed pump\": motor_eta must lie between 5 % and 100 %; got 0 %\n" +
				"{dir}/s.lua:4: turbine \"T1\": eta_mech must lie between 5 % and 100 %; got 0 %\n"},
		{name: "a turbine exhausting above its inlet", files: map[string]string{"s.lua": `local ship = steam_plant { name = "Invented Test Coaster",
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" } },
  turbines = { { name = "T1", power = "100 kW", eta_is = "60 %", exhaust = "9 bar(a)" } },
  consumers = { { name = "b", duty = "300 kW", returns = "90 %" } } }
`},
			args: []string{"check", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:3: unit \"T1\": its exhaust at 9 bar(a) is not below its inlet's 8.01 bar(a) (line \"steam to T1\"): steam cannot expand through it; give an exhaust below the inlet\n"},
		{name: "returns without a return line", files: map[string]string{"s.lua": `local ship = plant { name = "no return line" }
ship:makeup { name = "mu" }
ship:feed_tank { name = "hotwell" }
ship:feed_pump { name = "fp", boilers = { "AB1" } }
ship:boiler { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" }
ship:consumer { name = "b", duty = "300 kW", returns = "95 %" }
ship:line("m", "mu", "hotwell")
ship:line("s", "hotwell", "fp")
ship:line("f", "fp", "AB1.feed")
ship:line("st", "AB1.steam", "b")
`},
			args: []string{"check", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:6: unit \"b\": returns 95 % of its condensate, but has no return line (its port \"out\" is not connected): connect it to the hotwell, or give returns = \"0 %\" if all its condensate is lost\n"},
		{name: "lead_load of 150 %", files: map[string]string{"s.lua": `local ship = steam_plant { name = "Invented Test Coaster", sharing = "lead", lead_load = "150 %",
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" },
              { name = "AB2", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" } },
  consumers = { { name = "b", duty = "300 kW", returns = "90 %" } } }
`},
			args: []string{"check", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:1: plant \"Invented Test Coaster\": lead_load must lie between 10 % and 100 % of the lead boiler's MCR; got 150 %\n"},
		{name: "ambient pressure out of range", files: map[string]string{"s.lua": `local ship = steam_plant { name = "Invented Test Coaster", ambient = "2 bar(a)",
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" } },
  consumers = { { name = "b", duty = "300 kW", returns = "90 %" } } }
`},
			args: []string{"check", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:1: plant \"Invented Test Coaster\": ambient must lie between 0.5 bar(a) and 1.5 bar(a), an absolute pressure such as \"1.013 bar(a)\"; got 2 bar(a)\n"},
		{name: "a failed check marked in the JSON", files: map[string]string{"plant.lua": badPlant,
			"s.lua": badCase + "check(r.fuel_t_per_day > 100, \"one boiler burns 100 t a day\")\n"},
			args: []string{"run", "--json", "--quiet", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:3: assertion failed: one boiler burns 100 t a day\n",
			stdout: `"failed": [
      {
        "pos": "{dir}/s.lua:3",
        "message": "one boiler burns 100 t a day"
      }
    ]`},
		{name: "a case without sea or air temperature", files: map[string]string{"plant.lua": badPlant,
			"s.lua": "local ship = include(\"plant.lua\")\ncase(ship, { name = \"no temps\" })\n"},
			args: []string{"run", "--quiet", "{dir}/s.lua"}, code: exitOK,
			stdout: "conditions: sea not given, air not given, main engine load 0.0 %"},
		{name: "a CSV with a byte-order mark", files: map[string]string{"plant.lua": badPlant, "v.csv": "\ufeffphase,hours\nsea,10\n",
			"s.lua": "local ship = include(\"plant.lua\")\nlocal v = voyage(ship, { csv = \"v.csv\" })\ncheck(v.total.hours == 10, \"ten hours\")\n"},
			args: []string{"run", "--quiet", "{dir}/s.lua"}, code: exitOK,
			stdout: "1 periods, 10.0 h"},
		{name: "a negative pinch", files: map[string]string{"plant.lua": badPlant, "s.lua": `local ship = steam_plant { name = "Invented Test Coaster",
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" } },
  exhaust_gas_economiser = { name = "EGE", drum = "7 bar(g)", design_load = "85 %", pinch = "-5 K",
    engine = { mcr = "5000 kW", { load = "50 %", gas = "8 kg/kWh", T = "250 C" }, { load = "100 %", gas = "7.5 kg/kWh", T = "245 C" } } },
  consumers = { { name = "b", duty = "300 kW", returns = "90 %" } } }
`},
			args: []string{"check", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:3: exhaust gas economiser \"EGE\": pinch must lie between 1 K and 200 K; got -5 K\n"},
		{name: "fluegas at the O2 of air", args: []string{"fluegas", "--fuel", "HSFO", "--o2", "20.9 %", "--gas", "230 C", "--air", "25 C"}, code: exitFail,
			stderr: "sim fluegas: --o2 \"20.9 %\": no combustion: an O2 at or near that of air (20.946 % dry, which analysers show as 20.9 %): the burner is not firing, or the probe is not in the flue gas\n"},
		{name: "fluegas below the acid dew point", args: []string{"fluegas", "--fuel", "HSFO", "--o2", "3 %", "--gas", "110 C", "--air", "25 C"}, code: exitOK,
			stdout: "the flue gas at 110.0 °C is 41.1 K below the acid dew point of 151.1 °C"},
		{name: "engine of -10 %", files: map[string]string{"plant.lua": badPlant,
			"s.lua": "local ship = include(\"plant.lua\")\ncase(ship, { name = \"sea\", engine = \"-10 %\" })\n"},
			args: []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:2: case \"sea\": engine must lie between 0 % and 110 % of the engine's MCR (110 % is the overload a marine diesel engine is commonly rated for, from memory); got -10 %\n"},
		{name: "engine of 80", files: map[string]string{"plant.lua": badPlant,
			"s.lua": "local ship = include(\"plant.lua\")\ncase(ship, { name = \"sea\", engine = 80 })\n"},
			args: []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:2: case \"sea\": engine = 80 would be 8000 % of the engine's MCR: a bare number is a fraction of MCR (0 to 1.1); write \"80 %\"\n"},
		// Solver failures said in the plant's terms (issue 17).
		{name: "the only consumer off", files: map[string]string{"s.lua": `local ship = steam_plant { name = "Invented Test Coaster",
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" } },
  consumers = { { name = "b", duty = "300 kW", returns = "90 %" } } }
case(ship, { name = "off", set = { b = { off = true } } })
`},
			args: []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:4: case \"off\": no balance found: nothing takes steam in case \"off\" (every consumer and turbine is off or at zero duty), so the balance has no flow to solve for; switch a consumer on, or leave the case out\n"},
		{name: "a hotwell losing 50 MW", files: map[string]string{"s.lua": `local ship = steam_plant { name = "Invented Test Coaster", hotwell = { heat_loss = "50 MW" },
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" } },
  consumers = { { name = "b", duty = "300 kW", returns = "90 %" } } }
case(ship, { name = "port" })
`},
			args: []string{"check", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:1: feed tank \"hotwell\": heat_loss must lie between 0 kW and 2000 kW; got 50 MW\n"},
		{name: "no make-up", files: map[string]string{"s.lua": `local ship = plant { name = "no makeup" }
ship:feed_tank { name = "hotwell" }
ship:feed_pump { name = "fp", boilers = { "AB1" } }
ship:boiler { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" }
ship:consumer { name = "b", duty = "300 kW", returns = "90 %" }
ship:line("s", "hotwell", "fp")
ship:line("f", "fp", "AB1.feed")
ship:line("st", "AB1.steam", "b")
ship:line("r", "b.out", "hotwell")
case(ship, { name = "port" })
`},
			args: []string{"check", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:1: degrees of freedom do not balance (16 equations for 15 unknowns); too many conditions around \"AB1\", \"b\", \"fp\", \"hotwell\", on the lines \"f\", \"r\", \"s\", \"st\": the plant has no make-up water, so the water it loses (blowdown, condensate not returned, vented steam) is not replaced and its mass balance cannot close; add a make-up into the hotwell (ship:makeup{...} and a line to the feed tank)\n"},
		{name: "two boilers each on its own header", files: map[string]string{"s.lua": `local ship = plant { name = "two headers" }
ship:makeup { name = "makeup" }
ship:feed_tank { name = "hotwell" }
ship:feed_pump { name = "fp", boilers = { "AB1", "AB2" } }
ship:header { name = "feed" }
ship:boiler { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" }
ship:boiler { name = "AB2", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" }
ship:header { name = "H1" }
ship:header { name = "H2" }
ship:consumer { name = "b1", duty = "300 kW", returns = "90 %" }
ship:consumer { name = "b2", duty = "300 kW", returns = "90 %" }
ship:line("mu", "makeup", "hotwell")
ship:line("s", "hotwell", "fp")
ship:line("d", "fp", "feed")
ship:line("f1", "feed.out", "AB1.feed")
ship:line("f2", "feed.out", "AB2.feed")
ship:line("s1", "AB1.steam", "H1")
ship:line("s2", "AB2.steam", "H2")
ship:line("t1", "H1.out", "b1")
ship:line("t2", "H2.out", "b2")
ship:line("r1", "b1.out", "hotwell")
ship:line("r2", "b2.out", "hotwell")
case(ship, { name = "port" })
`},
			args: []string{"check", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:1: degrees of freedom do not balance (38 equations for 37 unknowns); too many conditions around \"AB1\", \"AB2\", \"H1\", \"H2\", \"b1\", \"b2\", on the lines \"s1\", \"s2\", \"t1\", \"t2\": the boilers raise steam into separate systems (AB1 into H1; AB2 into H2): the firing rule shares one steam system among all the boilers and dump condensers; join the systems at one main header (other headers through reducing valves), or describe each system as a plant of its own\n"},
		{name: "boilers forced off, an economiser at engine 0 %", files: map[string]string{"s.lua": `local ship = steam_plant { name = "Invented Test Coaster",
  boilers = { { name = "AB1", mcr = "4 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %" } },
  consumers = { { name = "b", duty = "300 kW", returns = "90 %" } },
  exhaust_gas_economiser = { drum = "7 bar(g)", engine = { mcr = "10 MW", { load = "50 %", gas = "9 kg/kWh", T = "240 C" }, { load = "100 %", gas = "8.5 kg/kWh", T = "250 C" } },
    design_load = "85 %", pinch = "20 K" } }
case(ship, { name = "port", engine = "0 %", fire = {} })
`},
			args: []string{"run", "{dir}/s.lua"}, code: exitFail,
			stderr: "{dir}/s.lua:6: case \"port\" forces every boiler off, but the exhaust-gas economisers raise 0 kg/h against a demand of 528 kg/h with the main engine at 0 % of MCR: fire a boiler, or give an engine load at which the economisers carry the demand (solving case \"port\" at {dir}/s.lua:6)\n"},
	}
	for _, row := range rows {
		t.Run(row.name, func(t *testing.T) {
			t.Parallel()
			dir := t.TempDir()
			for name, content := range row.files {
				p := filepath.Join(dir, name)
				switch content {
				case asFolder:
					if err := os.Mkdir(p, 0o755); err != nil {
						t.Fatal(err)
					}
				case asFIFO:
					makeFIFO(t, p)
				default:
					if err := os.WriteFile(p, []byte(content), 0o644); err != nil {
						t.Fatal(err)
					}
				}
			}
			args := make([]string, len(row.args))
			for i, a := range row.args {
				args[i] = strings.ReplaceAll(a, "{dir}", dir)
			}
			start := time.Now()
			code, out, errOut := runSim(t, args...)
			took := time.Since(start)
			want := strings.ReplaceAll(row.stderr, "{dir}", dir)
			if code != row.code || errOut != want {
				t.Errorf("exit %d, stderr:\n%s\nwant exit %d, stderr:\n%s", code, errOut, row.code, want)
			}
			wantOut := strings.ReplaceAll(row.stdout, "{dir}", dir)
			if (wantOut == "" && out != "") || !strings.Contains(out, wantOut) {
				t.Errorf("stdout %q, want it to contain %q", out, wantOut)
			}
			if strings.Contains(out, "started") {
				t.Errorf("the script ran before its outputs were checked: stdout %q", out)
			}
			if took > 30*time.Second {
				t.Errorf("took %v: a pipe or a time limit held the run", took) // the time limits given are 1m
			}
			if row.after != nil {
				row.after(t, dir)
			}
		})
	}
}

// runUsage and steamUsage are what follows a usage error of run and steam.
const (
	runUsage = "usage: sim run [--json | --csv] [--plot FILE] [--evidence DIR] [-o FILE]\n" +
		"               [--timeout DURATION] [--job-timeout DURATION] [--rows KEEP]\n" +
		"               [-v | --quiet] SCRIPT...\n" +
		"Run 'sim help run' for details.\n"
	steamUsage = "usage: sim steam --p PRESSURE\n" +
		"                 (--t TEMPERATURE | --h ENTHALPY | --s ENTROPY | --x QUALITY)\n" +
		"                 [--ambient PRESSURE] [--json]\n" +
		"       sim steam --t TEMPERATURE --x QUALITY [--ambient PRESSURE] [--json]\n" +
		"Run 'sim help steam' for details.\n"
)

// unchanged checks that the file name of the row's folder still holds
// content.
func unchanged(name, content string) func(t *testing.T, dir string) {
	return func(t *testing.T, dir string) {
		t.Helper()
		b, err := os.ReadFile(filepath.Join(dir, name))
		if err != nil || string(b) != content {
			t.Errorf("%s was changed: %q, %v", name, b, err)
		}
	}
}
