package scripting

import (
	"fmt"
	"strconv"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant/units"
)

// maxEngineLoad is the highest main-engine load a case may give, as a
// fraction of MCR: the 110 % overload a marine diesel engine is commonly
// rated to carry for a limited time (from memory; the engine's own rating
// governs).
const maxEngineLoad = 1.10

// parseEngineLoad reads a case's main-engine load: a fraction from 0 to
// 1.1 or a percentage with its sign ("80 %"). A bare number above 1.1 is
// taken for a percentage written without its sign and refused with the way
// to write it, so that 80 is never read as 8000 %.
func parseEngineLoad(v lua.LValue, key string, uopt units.Options) (float64, error) {
	f, err := parseQuantity(v, key, units.Fraction, uopt)
	if err != nil {
		return 0, err
	}
	if f >= 0 && f <= maxEngineLoad {
		return f, nil
	}
	if n, ok := v.(lua.LNumber); ok && float64(n) > maxEngineLoad && float64(n) <= 100*maxEngineLoad {
		num := strconv.FormatFloat(float64(n), 'g', -1, 64)
		return 0, fmt.Errorf("%s = %s would be %s %% of the engine's MCR: a bare number is a fraction of MCR (0 to 1.1); write %q", key, num, strconv.FormatFloat(100*float64(n), 'g', 6, 64), num+" %")
	}
	return 0, fmt.Errorf("%s must lie between 0 %% and %g %% of the engine's MCR (%g %% is the overload a marine diesel engine is commonly rated for, from memory); got %s", key, 100*maxEngineLoad, 100*maxEngineLoad, asGiven(v))
}

// engineLoad reads the key engine of a case or a row.
func (a *args) engineLoad() float64 {
	v := a.get("engine")
	if v == lua.LNil {
		return 0
	}
	f, err := parseEngineLoad(v, "engine", a.uopt)
	if err != nil {
		a.errorf(err, "%v", err)
		return 0
	}
	return f
}

// fractionIn reads an optional fraction key of a binding (not of a
// component) that must lie in [lo, hi]: given, it is checked like any
// value, so that a zero given is not taken for "not given".
func (a *args) fractionIn(key string, lo, hi float64, why string) (float64, bool) {
	v := a.get(key)
	if v == lua.LNil {
		return 0, false
	}
	f, err := parseQuantity(v, key, units.Fraction, a.uopt)
	if err == nil && !(f >= lo && f <= hi) {
		err = fmt.Errorf("%s must lie between %g %% and %g %%%s; got %s%s", key, 100*lo, 100*hi, why, asGiven(v), percentHint(v, lo, hi))
	}
	if err != nil {
		a.errorf(err, "%v", err)
		return 0, false
	}
	return f, true
}

// percentHint suggests the percent sign for a bare number that would fit
// the range as a percentage: `; write "95 %"`.
func percentHint(v lua.LValue, lo, hi float64) string {
	n, ok := v.(lua.LNumber)
	if !ok {
		return ""
	}
	if f := float64(n) / 100; f >= lo && f <= hi && float64(n) > hi {
		return fmt.Sprintf("; write %q", strconv.FormatFloat(float64(n), 'g', -1, 64)+" %")
	}
	return ""
}
