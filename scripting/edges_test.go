package scripting

import (
	"context"
	"fmt"
	"strings"
	"testing"
)

// TestGivenValuesChecked: a value a script gives is checked against its
// key's range whatever it is, zero included (only a key not given takes
// its default), and a message shows the range in the units of the key's
// example and the value as it was given (issue 17; the ranges are the
// registry's, common practice or the components' own validity).
func TestGivenValuesChecked(t *testing.T) {
	t.Parallel()
	const head = `local ship = steam_plant { name = "Invented Coaster 1"%s,
  boilers = { { name = "AB1", mcr = "3 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "84 %%"%s } },
  consumers = { { name = "heating", duty = "300 kW", returns = "90 %%"%s } },
  turbines = { { name = "TG", power = "100 kW", exhaust = "0.2 bar(a)", eta_is = "60 %%"%s } } }
`
	tests := []struct {
		name                   string
		plant, boiler, con, tg string
		after                  string
		want                   string
	}{
		{"return_T of 0 K", "", "", `, return_T = "0 K"`, "", "", `return_T must lie between 1 C and 200 C; got 0 K`},
		{"dryness of 0 %", "", `, dryness = "0 %"`, "", "", "", `dryness must lie between 80 % and 100 %; got 0 %`},
		{"eta_mech of 0 %", "", "", "", `, eta_mech = "0 %"`, "", `eta_mech must lie between 5 % and 100 %; got 0 %`},
		{"usable of 0 %", `, usable = "0 %"`, "", "", "", "", `usable must lie between 50 % and 100 % of one boiler's MCR; got 0 %`},
		{"usable of 150 %", `, usable = "150 %"`, "", "", "", "", `usable must lie between 50 % and 100 % of one boiler's MCR; got 150 %`},
		{"returns of 95", "", "", `, returns = 95`, "", "", `returns must lie between 0 % and 100 %; got 95; write "95 %"`},
		{"engine of 80", "", "", "", "", `case(ship, { name = "sea", sea = "10 C", air = "5 C", engine = 80 })`,
			`engine = 80 would be 8000 % of the engine's MCR: a bare number is a fraction of MCR (0 to 1.1); write "80 %"`},
		{"engine of 150 %", "", "", "", "", `case(ship, { name = "sea", engine = "150 %" })`, `engine must lie between 0 % and 110 % of the engine's MCR`},
		{"engine of -10 %", "", "", "", "", `case(ship, { name = "sea", engine = "-10 %" })`, `engine must lie between 0 % and 110 %`},
		{"a case's factor of 0", "", "", "", "", `case(ship, { name = "x", set = { heating = { factor = 0 } } })`, `set.heating.factor must lie between 0.01 and 10; got 0`},
		{"a long quantity", "", "", `, return_T = "` + strings.Repeat("9", 100000) + ` K"`, "", "", `number in '9999999999999999999999999999999999999999…' (100002 characters) is out of range`},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			src := []byte(strings.ReplaceAll(fmtSprintf(head, tc.plant, tc.boiler, tc.con, tc.tg), "%%", "%") + tc.after + "\n")
			_, err := RunSource(context.Background(), "edges.lua", src, nil, Options{})
			if err == nil || !strings.Contains(err.Error(), tc.want) {
				t.Errorf("got %v\nwant an error containing %q", err, tc.want)
			}
			if err != nil && len(err.Error()) > 2000 {
				t.Errorf("the message is %d bytes long: a long input is echoed whole", len(err.Error()))
			}
		})
	}
}

func fmtSprintf(format string, a ...any) string { return fmt.Sprintf(format, a...) }

// TestTankLayoutAsksByKey: a tank by its dimensions whose neighbours'
// temperature is not given is told the key and an example (issue 16).
func TestTankLayoutAsksByKey(t *testing.T) {
	t.Parallel()
	src := `local ship = steam_plant { name = "Invented Coaster 2",
  boilers = { { name = "AB1", mcr = "3 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "84 %" } },
  consumers = { { name = "COT 1", kind = "tank_heating", fuel = "HSFO", T = "50 C",
    dimensions = { length = "20 m", breadth = "30 m", depth = "18 m", fill = "95 %", layout = "full_breadth", weather_deck = true } } } }
`
	_, err := RunSource(context.Background(), "tank.lua", []byte(src), nil, Options{CheckOnly: true})
	want := `dimensions.adjacent_T is not given: the tank's bulkheads to its neighbours need their temperature; give adjacent_T = "15 C" (or adjacent_heated = true when they are heated like this one)`
	if err == nil || !strings.Contains(err.Error(), want) {
		t.Errorf("got %v\nwant %q", err, want)
	}
}
