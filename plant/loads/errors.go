package loads

import (
	"fmt"
	"math"
)

// InputError is a consumer's input that is wrong: it names the kind of
// consumer, its Name, what was wrong, what was given and what was expected,
// e.g. `tank heating "COT 3P": fill 105 % is above 100 %; want a fill
// fraction in (0, 1]`. Err, when set, is the underlying error (for example
// one from package fuel) and is returned by Unwrap.
type InputError struct {
	Consumer string // kind of consumer: "tank heating", "fuel heater", ...
	Name     string // the consumer's Name
	Msg      string // what was wrong and what was expected
	Err      error  // underlying error, may be nil
}

// Error returns `<consumer> "<name>": <msg>` (and ": <err>" when Err is set).
func (e *InputError) Error() string {
	if e.Name == "" {
		if e.Err != nil {
			return fmt.Sprintf("%s: %s: %v", e.Consumer, e.Msg, e.Err)
		}
		return fmt.Sprintf("%s: %s", e.Consumer, e.Msg)
	}
	if e.Err != nil {
		return fmt.Sprintf("%s %q: %s: %v", e.Consumer, e.Name, e.Msg, e.Err)
	}
	return fmt.Sprintf("%s %q: %s", e.Consumer, e.Name, e.Msg)
}

// Unwrap returns the underlying error.
func (e *InputError) Unwrap() error { return e.Err }

// Kinds of consumer used in errors and results.
const (
	KindFuelHeater    = "fuel heater"
	KindTankHeating   = "tank heating"
	KindAccommodation = "accommodation heating"
	KindTankCleaning  = "tank-cleaning heater"
	KindCargoPump     = "cargo pump"
	KindFixedPower    = "fixed-power turbine"
	KindAtomising     = "atomising steam"
	KindSootBlowing   = "soot blowing"
	KindTracing       = "steam tracing"
	KindFixedDuty     = "fixed duty"
	KindFreshWater    = "fresh-water generator"
	KindCloudPoint    = "HM 40 cloud point"
)

// Limits on temperatures accepted anywhere in the package (K). A temperature
// below MinTemperature (−100 °C) is refused: it is most likely a value in
// °C given where kelvin is expected. MaxTemperature (700 °C) is far above any
// consumer here. Both are sanity bounds chosen for this package, no source.
const (
	MinTemperature = 173.15
	MaxTemperature = 973.15
)

// checker builds InputErrors for one consumer.
type checker struct{ kind, name string }

func (c checker) errf(format string, args ...any) error {
	return &InputError{Consumer: c.kind, Name: c.name, Msg: fmt.Sprintf(format, args...)}
}

func (c checker) wrap(err error, format string, args ...any) error {
	return &InputError{Consumer: c.kind, Name: c.name, Msg: fmt.Sprintf(format, args...), Err: err}
}

// temp checks a temperature in kelvin.
func (c checker) temp(what string, T float64) error {
	if T == 0 {
		return c.errf("%s is not given (0 K); want a temperature in kelvin", what)
	}
	if !(T >= MinTemperature && T <= MaxTemperature) {
		return c.errf("%s %.6g K (%.6g °C) is not a plausible temperature; want kelvin between %.6g K (%.6g °C) and %.6g K (%.6g °C)",
			what, T, T-273.15, MinTemperature, MinTemperature-273.15, MaxTemperature, MaxTemperature-273.15)
	}
	return nil
}

// positive checks 0 < v < +Inf.
func (c checker) positive(what string, v float64, unit string) error {
	if !(v > 0) || math.IsInf(v, 0) {
		return c.errf("%s %.6g %s must be positive and finite", what, v, unit)
	}
	return nil
}

// nonNegative checks 0 ≤ v < +Inf.
func (c checker) nonNegative(what string, v float64, unit string) error {
	if !(v >= 0) || math.IsInf(v, 0) {
		return c.errf("%s %.6g %s is negative or not finite; want a finite value ≥ 0 %s", what, v, unit, unit)
	}
	return nil
}

// fraction checks lo < v ≤ 1 (open=true) or 0 ≤ v ≤ 1 (open=false).
func (c checker) fraction(what string, v float64, open bool) error {
	switch {
	case v > 1:
		return c.errf("%s %.6g %% is above 100 %%; want a fraction ≤ 1", what, v*100)
	case open && !(v > 0):
		return c.errf("%s %.6g %% must be above 0 %%; want a fraction in (0, 1]", what, v*100)
	case !open && !(v >= 0):
		return c.errf("%s %.6g %% is negative; want a fraction in [0, 1]", what, v*100)
	}
	return nil
}

// finite reports whether every value is finite.
func finite(vs ...float64) bool {
	for _, v := range vs {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}

// overflow is the error for a result that is not finite although every
// input passed its checks (inputs so large that the arithmetic overflows).
func (c checker) overflow(what string) error {
	return c.errf("%s is not finite: the inputs are too large for double precision", what)
}

// celsius converts kelvin to °C for messages.
func celsius(T float64) float64 { return T - 273.15 }
