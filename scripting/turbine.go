package scripting

import (
	"errors"
	"fmt"
	"strings"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant"
	"steamcase/plant/units"
)

// decodeTurbine reads the keys of a turbine's steam, which go together:
// eta_is, or steam_rate with rated_power, or steam_table.
func decodeTurbine(r *runner, a *args, ph *plantHandle, c plant.Component) {
	u, ok := c.(*plant.Turbine)
	if !ok {
		return
	}
	hasEta := r.readNamed(a, u, "eta_is", false)
	hasRated := r.readNamed(a, u, "rated_power", false)
	hasRate := a.has("steam_rate")
	hasTable := a.has("steam_table")
	n := 0
	for _, g := range [...]bool{hasEta, hasRate, hasTable} {
		if g {
			n++
		}
	}
	switch {
	case n == 0 && a.nerr == 0:
		a.errorf(nil, "needs its steam one way: eta_is (such as eta_is = \"65 %%\"), steam_rate with rated_power (such as steam_rate = \"8.5 kg/kWh\", rated_power = \"1.3 MW\"), or steam_table")
		return
	case n > 1:
		a.errorf(nil, "give its steam one way: eta_is, steam_rate (with rated_power) or steam_table, not more")
		return
	}
	if hasRate {
		if !hasRated {
			a.errorf(nil, "steam_rate needs rated_power, the shaft power it is given at, such as rated_power = \"1.3 MW\"")
		}
		switch v := a.get("steam_rate").(type) {
		case lua.LString, lua.LNumber:
			rate, err := parseQuantity(v, "steam_rate", units.SpecificConsumption, a.uopt)
			if err != nil {
				a.errorf(err, "%v", err)
				return
			}
			u.SteamRate = []float64{rate}
		default:
			u.RateLoad, u.SteamRate = a.pairs("steam_rate", v, units.Fraction, units.SpecificConsumption,
				"{load, steam rate}", `{"50 %", "10.2 kg/kWh"}`)
		}
	} else if hasRated {
		a.errorf(nil, "rated_power goes with steam_rate")
	}
	if hasTable {
		u.TablePower, u.TableFlow = a.pairs("steam_table", a.get("steam_table"), units.Power, units.MassFlow,
			"{shaft power, steam flow}", `{"1 MW", "9 t/h"}`)
	}
}

// pairs reads a table of {x, y} pairs of the dimensions dx and dy, at
// most 200 of them.
func (a *args) pairs(key string, v lua.LValue, dx, dy units.Dimension, what, example string) (xs, ys []float64) {
	t, ok := v.(*lua.LTable)
	if !ok {
		a.errorf(nil, "%s must be a table of %s pairs such as { %s }; got %s", key, what, example, describe(v))
		return nil, nil
	}
	n := t.Len()
	if n == 0 || n > 200 {
		a.errorf(nil, "%s needs 1 to 200 %s pairs; got %d", key, what, n)
		return nil, nil
	}
	for i := 1; i <= n; i++ {
		pair, ok := t.RawGetInt(i).(*lua.LTable)
		if !ok || pair.Len() != 2 {
			a.errorf(nil, "%s[%d] must be a pair %s such as %s", key, i, what, example)
			return nil, nil
		}
		x, err1 := parseQuantity(pair.RawGetInt(1), fmt.Sprintf("%s[%d][1]", key, i), dx, a.uopt)
		y, err2 := parseQuantity(pair.RawGetInt(2), fmt.Sprintf("%s[%d][2]", key, i), dy, a.uopt)
		if err := errors.Join(err1, err2); err != nil {
			a.errorf(err, "%v", strings.ReplaceAll(err.Error(), "\n", "; "))
			return nil, nil
		}
		xs, ys = append(xs, x), append(ys, y)
	}
	return xs, ys
}
