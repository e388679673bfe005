package scripting

import (
	"fmt"
	"strconv"
	"strings"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant"
	"steamcase/plant/units"
)

// Declaring a component. Every kind of component a script can declare is
// a plant.KindSpec of the run (plant.Kinds() unless Options.Kinds says
// otherwise), and every key it takes is one of its plant.Keys: the script
// API reads the keys from that registry, in its order, by their kind
// (quantities with units, flags, numbers, choices, texts, lists of
// names). A kind whose keys go together or are tables (a boiler's
// efficiency, a tank's boundaries) has a decoder here that reads those
// keys and checks them together; every other key it leaves to the
// registry.

// decoder reads the keys of a kind that the registry alone cannot: it
// names them (keys), and read reads them all where the first of them
// stands in the registry's order.
type decoder struct {
	keys []string
	read func(r *runner, a *args, ph *plantHandle, u plant.Component)
}

// decoders are the kinds' decoders, by kind name: a constant table.
var decoders = map[string]decoder{
	"boiler":                 {[]string{"fuel", "lhv", "co2_factor", "bdn", "efficiency", "burner"}, decodeBoiler},
	"consumer":               {[]string{"duty", "steam"}, decodeConsumer},
	"tank_heating":           {[]string{"density", "volume", "dimensions", "boundaries", "mode", "T", "from", "to", "duration"}, decodeTankHeating},
	"fuel_heater":            {[]string{"outlet_T", "target_viscosity", "boiler", "flow", "sfoc", "engine_mcr"}, decodeFuelHeater},
	"accommodation":          {[]string{"table", "UA", "inside_T", "balance_T"}, decodeAccommodation},
	"turbine":                {[]string{"eta_is", "steam_rate", "rated_power", "steam_table"}, decodeTurbine},
	"cargo_pump":             {[]string{"eta_is", "steam_rate", "rated_power", "steam_table"}, decodeTurbine},
	"exhaust_gas_economiser": {[]string{"engine", "ua", "design_gas", "design_load", "pinch", "exhaust_fuel", "exhaust_O2", "gas_cp"}, decodeEGE},
}

// kindOf returns the run's kind called name.
func (r *runner) kindOf(name string) (plant.KindSpec, bool) {
	for _, k := range r.opt.Kinds {
		if k.Name == name {
			return k, true
		}
	}
	return plant.KindSpec{}, false
}

// kindNames lists the run's kinds.
func (r *runner) kindNames() []string {
	out := make([]string, len(r.opt.Kinds))
	for i, k := range r.opt.Kinds {
		out[i] = k.Name
	}
	return out
}

// build makes a component of kind from the keys of a: the registry's keys
// in their order (a decoder's where its first key stands), then the checks
// the component makes of its declaration.
func (r *runner) build(a *args, ph *plantHandle, kind plant.KindSpec) plant.Component {
	u := kind.New()
	dec := decoders[kind.Name]
	keys := u.Keys()
	decoded := false
	for i := range keys {
		k := &keys[i]
		if contains(dec.keys, k.Name) {
			if !decoded {
				dec.read(r, a, ph, u)
				decoded = true
			}
			continue
		}
		r.readKey(a, u, k, k.Required)
	}
	if dec.read != nil && !decoded {
		dec.read(r, a, ph, u)
	}
	if a.nerr == 0 {
		if err := plant.ValidateDeclaration(u); err != nil {
			a.loadErr(err)
		}
	}
	return u
}

// key returns u's key called name: a programmer's mistake if u has none.
func key(u plant.Component, name string) *plant.Key {
	keys := u.Keys()
	for i := range keys {
		if keys[i].Name == name {
			return &keys[i]
		}
	}
	panic(fmt.Sprintf("scripting: %s has no key %q", u.Kind(), name))
}

// readNamed reads u's key called name; required overrides the registry's
// (keys that are required only with others).
func (r *runner) readNamed(a *args, u plant.Component, name string, required bool) bool {
	return r.readKey(a, u, key(u, name), required)
}

// readKey reads key k of u from a, by the key's kind, sets it on u, and
// says whether it was given.
func (r *runner) readKey(a *args, u plant.Component, k *plant.Key, required bool) bool {
	switch k.Kind {
	case plant.KeyQuantity:
		v, ok := a.quantity(k.Name, k.Dim, required)
		if ok && a.inRange(k, k.Name, v, a.t.RawGetString(k.Name)) {
			k.Set(u, v)
		}
		return ok
	case plant.KeyPressureDiff:
		v, ok := a.pressureDiff(k.Name, required)
		if ok && a.inRange(k, k.Name, v, a.t.RawGetString(k.Name)) {
			k.Set(u, v)
		}
		return ok
	case plant.KeyFlag:
		if !a.has(k.Name) {
			return false
		}
		if a.boolean(k.Name) {
			k.Set(u, 1)
		}
		return true
	case plant.KeyNumber:
		v, ok := a.number(k.Name)
		if ok && a.inRange(k, k.Name, v, a.t.RawGetString(k.Name)) {
			k.Set(u, v)
		} else if ok {
			return true
		} else if required && a.get(k.Name) == lua.LNil {
			a.errorf(nil, "%s is required, such as %s = %s", k.Name, k.Name, k.Example)
			a.markMissing(k.Name)
		}
		return ok
	case plant.KeyChoice:
		s, ok := a.str(k.Name, required)
		if !ok {
			return false
		}
		for i, c := range k.Choices {
			if c == s {
				k.Set(u, float64(i))
				return true
			}
		}
		a.errorf(nil, "%s must be %s; got %q", k.Name, choiceList(k.Choices), s)
		return true
	case plant.KeyRank:
		v := a.get(k.Name)
		if v == lua.LNil {
			if required {
				a.errorf(nil, "%s is required, such as %s = %s", k.Name, k.Name, k.Example)
				a.markMissing(k.Name)
			}
			return false
		}
		f, err := parseRank(v, k, k.Name)
		if err != nil {
			a.errorf(err, "%v", err)
			return true
		}
		k.Set(u, f)
		return true
	case plant.KeyText:
		s, ok := a.str(k.Name, required)
		if ok {
			if err := k.SetText(u, []string{s}); err != nil {
				a.errorf(err, "%v", err)
			}
		}
		return ok
	case plant.KeyNameList:
		names := a.names(k.Name)
		if names == nil {
			if required {
				a.errorf(nil, "%s is required, such as %s = %s", k.Name, k.Name, k.Example)
				a.markMissing(k.Name)
			}
			return false
		}
		if err := k.SetText(u, names); err != nil {
			a.errorf(err, "%v", err)
		}
		return true
	}
	panic(fmt.Sprintf("scripting: key %q of %s is a %s: its kind needs a decoder", k.Name, u.Kind(), k.Kind))
}

// inRange reports a given value outside its key's range, with the range
// in the units of the key's example and the value as it was given (a zero
// given is checked like any value: only a key not given takes its
// default).
func (a *args) inRange(k *plant.Key, name string, v float64, given lua.LValue) bool {
	if err := rangeErr(k, name, v, given); err != nil {
		a.errorf(err, "%v", err)
		return false
	}
	return true
}

// rangeErr is the error of a value outside its key's range, or nil.
func rangeErr(k *plant.Key, name string, v float64, given lua.LValue) error {
	if k.InRange(v) {
		return nil
	}
	hint := ""
	if k.Kind == plant.KeyQuantity && k.Dim == units.Fraction {
		hint = percentHint(given, k.Min, k.Max)
	}
	return fmt.Errorf("%s must lie %s; got %s%s", name, k.RangeText(), asGiven(given), hint)
}

// asGiven is a value as the script gave it, for messages: a string as
// written (cut to a few dozen characters), a number as a number.
func asGiven(v lua.LValue) string {
	switch x := v.(type) {
	case lua.LString:
		return cut(string(x))
	case lua.LNumber:
		return strconv.FormatFloat(float64(x), 'g', -1, 64)
	}
	return describe(v)
}

// cut shortens a text a message echoes to a few dozen characters.
func cut(s string) string {
	const max = 40
	if r := []rune(s); len(r) > max {
		return string(r[:max]) + "…"
	}
	return s
}

// choiceList writes `"a", "b" or "c"`.
func choiceList(cs []string) string {
	q := make([]string, len(cs))
	for i, c := range cs {
		q[i] = fmt.Sprintf("%q", c)
	}
	if len(q) == 1 {
		return q[0]
	}
	return strings.Join(q[:len(q)-1], ", ") + " or " + q[len(q)-1]
}
