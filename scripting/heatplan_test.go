package scripting

import (
	"context"
	"strings"
	"testing"
	"testing/fstest"
	"time"
)

// heatedPlant is a small invented plant with two heated cargo tanks, one
// of them with a coil, and a plain consumer.
const heatedPlant = `return steam_plant { name = "Invented Small Heated Tanker",
  boilers = { { name = "AB1", mcr = "12 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "84 %" } },
  consumers = {
    { name = "sundry", duty = "200 kW", returns = "90 %" },
    { name = "COT 1", kind = "tank_heating", density = "890 kg/m3", T = "50 C", volume = "6000 m3", coil_area = "250 m2",
      returns = "95 %", subcool = "10 K",
      boundaries = { { area = "900 m2", U = "4 W/m2K", beyond = "air" }, { area = "1500 m2", U = "3 W/m2K", beyond = "sea" } } },
    { name = "COT 2", kind = "tank_heating", density = "890 kg/m3", T = "50 C", volume = "6000 m3",
      boundaries = { { area = "900 m2", U = "4 W/m2K", beyond = "air" } } } } }
`

const routeCSV = `phase,hours,sea,air
passage,24,8 C,2 C
passage,24,7 C,0 C
passage,24,6 C,-2 C
discharge,12,6 C,-2 C
`

const instrCSV = `phase,hours,sea,air,COT 1.instruction,COT 1.T,COT 2.instruction
passage,24,8 C,2 C,off,,
passage,24,7 C,0 C,heat_to,52 C,off
`

const ownCSV = `phase,hours,sea,air,COT 1.instruction,COT 1.T,COT 1.by
passage,24,8 C,2 C,off,,
passage,24,7 C,0 C,reach,48 C,72 h
passage,24,6 C,-2 C,reach,48 C,72 h
discharge,12,6 C,-2 C,hold,48 C,
`

func heatedFS(script string) fstest.MapFS {
	return fstest.MapFS{
		"plant.lua": {Data: []byte(heatedPlant)}, "route.csv": {Data: []byte(routeCSV)},
		"instr.csv": {Data: []byte(instrCSV)}, "own.csv": {Data: []byte(ownCSV)}, "plan.lua": {Data: []byte(script)},
	}
}

// TestHeatingPlanErrors checks that bad input to heating_plan and to a
// voyage's stateful tanks stops the run at its file and line, naming the
// tank and what was expected.
func TestHeatingPlanErrors(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		name, script, want string
	}{
		{"instruction on a tank the voyage does not carry", `local ship = include("plant.lua")
voyage(ship, { csv = "instr.csv", tanks = { ["COT 1"] = "45 C" } })`,
			`instr.csv:3: voyage "voyage 1": voyage row 2 sets COT 2.instruction, but "COT 2" is not carried from row to row in this voyage`},
		{"instruction without any stateful tank", `local ship = include("plant.lua")
voyage(ship, { csv = "instr.csv" })`,
			`instr.csv:2: voyage "voyage 1": voyage row 1 sets COT 1.instruction, but "COT 1" is not carried from row to row`},
		{"voyage: unknown tank", `local ship = include("plant.lua")
voyage(ship, { csv = "route.csv", tanks = { ["COT 9"] = "45 C" } })`,
			`plan.lua:2: voyage "voyage 1": tanks: plant "Invented Small Heated Tanker" has no tank_heating unit "COT 9"; did you mean "COT 1"?`},
		{"voyage: not a tank", `local ship = include("plant.lua")
voyage(ship, { csv = "route.csv", tanks = { sundry = "45 C" } })`,
			`plan.lua:2: voyage "voyage 1": tanks: "sundry" is not a tank_heating unit`},
		{"voyage: a tank without a coil", `local ship = include("plant.lua")
voyage(ship, { csv = "route.csv", tanks = { ["COT 2"] = "45 C" } })`,
			`plan.lua:2: voyage "voyage 1": tank "COT 2": a tank carried from row to row needs its heating coil: give coil_area`},
		{"plan: required past the end", `local ship = include("plant.lua")
heating_plan(ship, { csv = "route.csv", tanks = { ["COT 1"] = "45 C" },
  required = { ["COT 1"] = { T = "50 C", at = "100 h" } } })`,
			`plan.lua:2: heating_plan "heating_plan 1": required time 100 h (100 h) is past the end of the voyage at 84 h`},
		{"plan: required of a tank not planned", `local ship = include("plant.lua")
heating_plan(ship, { csv = "route.csv", tanks = { ["COT 1"] = "45 C" },
  required = { ["COT 2"] = { T = "50 C", at = "discharge" } } })`,
			`required temperature for "COT 2", which is not a tank of the plan (tanks: COT 1)`},
		{"plan: unknown phase", `local ship = include("plant.lua")
heating_plan(ship, { csv = "route.csv", tanks = { ["COT 1"] = "45 C" },
  required = { ["COT 1"] = { T = "50 C", at = "lightering" } } })`,
			`required["COT 1"]: at "lightering" is not a phase of the voyage, "end" or a time such as "240 h"`},
		{"plan: instruction in the rows", `local ship = include("plant.lua")
heating_plan(ship, { csv = "instr.csv", tanks = { ["COT 1"] = "45 C" } })`,
			`instr.csv:2: heating_plan "heating_plan 1": row 1 sets COT 1.instruction, but the plan decides "COT 1"'s heating`},
		{"plan: no tanks", `local ship = include("plant.lua")
heating_plan(ship, { csv = "route.csv" })`,
			`plan.lua:2: heating_plan "heating_plan 1": tanks is required`},
		{"plan: required without at", `local ship = include("plant.lua")
heating_plan(ship, { csv = "route.csv", tanks = { ["COT 1"] = "45 C" }, required = { ["COT 1"] = { T = "50 C" } } })`,
			`plan.lua:2: heating_plan "heating_plan 1" required["COT 1"]: at is required`},
	} {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			_, err := RunSource(context.Background(), "plan.lua", []byte(tc.script), heatedFS(tc.script), Options{Timeout: time.Minute})
			if err == nil || !strings.Contains(err.Error(), tc.want) {
				t.Errorf("error:\n%v\nwant:\n%s", err, tc.want)
			}
		})
	}
}

// TestHeatingPlanScript runs a plan and a stateful voyage from a script:
// the plan meets a reachable temperature, gives the verdict of one it
// cannot reach, and the voyage's rows carry each tank's temperature
// (reach 48 °C by 72 h, then hold it).
func TestHeatingPlanScript(t *testing.T) {
	t.Parallel()
	script := `local ship = include("plant.lua")
local p = heating_plan(ship, { name = "small", csv = "route.csv", tanks = { ["COT 1"] = { T = "45 C", never_below = "38 C" } },
  required = { ["COT 1"] = { T = "48 C", at = "discharge" } } })
local q = p.tanks[1].required[1]
check(q.met, "48 C is met")
check(p.saving_vs_hold_t >= 0, "the plan burns no more than holding")
check(#p.tanks[1].rows == 4 and p.tanks[1].rows[1].instruction ~= nil, "a row per period")
local far = heating_plan(ship, { name = "too hot", csv = "route.csv", tanks = { ["COT 1"] = "45 C" },
  required = { ["COT 1"] = { T = "80 C", at = "end" } } })
local v = far.tanks[1].required[1]
check(not v.met, "80 C is not met")
check(string.find(v.verdict, "^COT 1 reaches [%d.]+ °C at end; 80.0 °C needs ") ~= nil, v.verdict)
check(#far.plan.missed == 1, "the miss is listed")
local own = voyage(ship, { csv = "own.csv", tanks = { ["COT 1"] = "45 C" } })
local t3 = own.rows[3].tanks[1]
check(t3.instruction == "reach" and math.abs(t3.end_T_K - 321.15) < 1e-3, "reached 48 C by 72 h: " .. t3.end_T_K)
local t4 = own.rows[4].tanks[1]
check(t4.instruction == "hold" and math.abs(t4.end_T_K - 321.15) < 1e-3 and t4.short == false, "held at 48 C")
check(own.rows[1].tanks[1].instruction == "off" and own.rows[1].tanks[1].end_T_K < 318.15, "cools with the heating off")
`
	run, err := RunSource(context.Background(), "plan.lua", []byte(script), heatedFS(script), Options{Timeout: time.Minute})
	if err != nil {
		t.Fatal(err)
	}
	if len(run.HeatingPlans) != 2 || run.HeatingPlans[0].Result == nil || run.HeatingPlans[0].Pos.Line != 2 {
		t.Errorf("heating plans %+v", run.HeatingPlans)
	}
	// Check mode: the same script, nothing solved, no error.
	if _, err := RunSource(context.Background(), "plan.lua", []byte(script), heatedFS(script), Options{Timeout: time.Minute, CheckOnly: true}); err != nil {
		t.Errorf("check mode: %v", err)
	}
}
