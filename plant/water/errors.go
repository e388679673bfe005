package water

import (
	"fmt"
	"math"
	"strconv"
)

// RangeError reports an input outside the range of validity of IAPWS-IF97,
// or outside the range of the function called. It names the bound crossed.
type RangeError struct {
	Func     string  // function called, e.g. "PT"
	Quantity string  // "pressure", "temperature", "specific enthalpy", "specific entropy", "vapour mass fraction"
	Value    float64 // the value given, SI units
	Bound    string  // "above" or "below"
	Limit    string  // the limit in words, e.g. "the IF97 limit of 100 MPa"
	LimitSI  float64 // the limit value in SI units (Pa, K, J/kg, J/(kg K), 1)
}

func (e *RangeError) Error() string {
	return fmt.Sprintf("water.%s: %s %s %s %s", e.Func, e.Quantity, fmtQuantity(e.Quantity, e.Value), e.Bound, e.Limit)
}

// InputError reports an input that is not a finite number.
type InputError struct {
	Func     string
	Quantity string
	Value    float64
}

func (e *InputError) Error() string {
	return fmt.Sprintf("water.%s: %s is %v; a finite number in %s is expected", e.Func, e.Quantity, e.Value, siUnit(e.Quantity))
}

// SaturationError reports a (p,T) pair on the saturation line, where
// pressure and temperature do not fix the state.
type SaturationError struct {
	Func string
	P, T float64 // Pa, K as given
	PSat float64 // p_sat(T) by IF97 Eq. 30, Pa
}

func (e *SaturationError) Error() string {
	return fmt.Sprintf("water.%s: pressure %s and temperature %s lie on the saturation line (p_sat(T) = %s, IF97 Eq. 30); "+
		"pressure and temperature do not fix a state there: a vapour mass fraction is needed (use PX or TX)",
		e.Func, fmtPressure(e.P), fmtTemperature(e.T), fmtPressure(e.PSat))
}

// ConvergenceError reports an iteration that did not converge. It is not
// expected inside the range of validity; it is returned rather than a
// doubtful number.
type ConvergenceError struct {
	Func string
	What string // what was being solved, e.g. "region 3 density from (p,T)"
	P    float64
	Arg  float64 // the second input (T, h or s), SI units
}

func (e *ConvergenceError) Error() string {
	return fmt.Sprintf("water.%s: %s did not converge at p = %s, second input %g", e.Func, e.What, fmtPressure(e.P), e.Arg)
}

func siUnit(q string) string {
	switch q {
	case "pressure":
		return "Pa"
	case "temperature":
		return "K"
	case "specific enthalpy":
		return "J/kg"
	case "specific entropy":
		return "J/(kg K)"
	}
	return "the unit of the quantity (SI)"
}

func fmtQuantity(q string, v float64) string {
	switch q {
	case "pressure":
		return fmtPressure(v)
	case "temperature":
		return fmtTemperature(v)
	case "specific enthalpy":
		return fmtNum(v/1e3) + " kJ/kg"
	case "specific entropy":
		return fmtNum(v/1e3) + " kJ/(kg K)"
	}
	return fmtNum(v)
}

// fmtNum prints 9 significant figures, without trailing zeros.
func fmtNum(v float64) string { return strconv.FormatFloat(v, 'g', 9, 64) }

func fmtPressure(p float64) string {
	a := math.Abs(p)
	switch {
	case a >= 1e6*(1-1e-9): // 999999.9999 Pa prints as 1 MPa
		return fmtNum(p/1e6) + " MPa"
	case a >= 1e3:
		return fmtNum(p/1e3) + " kPa"
	}
	return fmtNum(p) + " Pa"
}

func fmtTemperature(t float64) string { return fmtNum(t) + " K" }

// finite returns an InputError for a NaN or infinite input.
func finite(fn, q string, v float64) error {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return &InputError{Func: fn, Quantity: q, Value: v}
	}
	return nil
}

// checkP checks a pressure against 0 < p <= 100 MPa.
func checkP(fn string, p float64) error {
	if err := finite(fn, "pressure", p); err != nil {
		return err
	}
	if p <= 0 {
		return &RangeError{Func: fn, Quantity: "pressure", Value: p, Bound: "below",
			Limit: "the IF97 limit of 0 Pa (an absolute pressure above zero is expected)", LimitSI: 0}
	}
	if p < pTiny {
		return &RangeError{Func: fn, Quantity: "pressure", Value: p, Bound: "below",
			Limit: "1e-30 Pa, the smallest pressure this package handles (IF97's range is p > 0; far smaller values overflow the specific volume)", LimitSI: pTiny}
	}
	if p > pMax {
		return &RangeError{Func: fn, Quantity: "pressure", Value: p, Bound: "above",
			Limit: "the IF97 limit of 100 MPa", LimitSI: pMax}
	}
	return nil
}

// checkT checks a temperature against 273.15 K <= T <= 2273.15 K.
func checkT(fn string, t float64) error {
	if err := finite(fn, "temperature", t); err != nil {
		return err
	}
	if t < tMin {
		return &RangeError{Func: fn, Quantity: "temperature", Value: t, Bound: "below",
			Limit: "the IF97 limit of 273.15 K (0 °C)", LimitSI: tMin}
	}
	if t > tMax {
		return &RangeError{Func: fn, Quantity: "temperature", Value: t, Bound: "above",
			Limit: "the IF97 limit of 2273.15 K (2000 °C)", LimitSI: tMax}
	}
	return nil
}

// checkPT checks a (p,T) pair against the whole IF97 range.
func checkPT(fn string, p, t float64) error {
	if err := checkP(fn, p); err != nil {
		return err
	}
	if err := checkT(fn, t); err != nil {
		return err
	}
	if t > tMid && p > pMax5 {
		return &RangeError{Func: fn, Quantity: "temperature", Value: t, Bound: "above",
			Limit: "1073.15 K is valid only up to 50 MPa (region 5); the pressure given is " + fmtPressure(p), LimitSI: tMid}
	}
	return nil
}

// checkSatP checks a pressure against the saturation line's range.
func checkSatP(fn string, p float64) error {
	if err := finite(fn, "pressure", p); err != nil {
		return err
	}
	if p < pSatMinT {
		return &RangeError{Func: fn, Quantity: "pressure", Value: p, Bound: "below",
			Limit: "the saturation-line limit of 611.213 Pa (p_sat at 273.15 K, IF97 region 4)", LimitSI: pSatMinT}
	}
	if p > pCrit {
		return &RangeError{Func: fn, Quantity: "pressure", Value: p, Bound: "above",
			Limit: "the critical pressure 22.064 MPa (end of the saturation line, IF97 region 4)", LimitSI: pCrit}
	}
	return nil
}

// checkSatT checks a temperature against the saturation line's range.
func checkSatT(fn string, t float64) error {
	if err := finite(fn, "temperature", t); err != nil {
		return err
	}
	if t < tMin {
		return &RangeError{Func: fn, Quantity: "temperature", Value: t, Bound: "below",
			Limit: "the IF97 limit of 273.15 K (0 °C)", LimitSI: tMin}
	}
	if t > tCrit {
		return &RangeError{Func: fn, Quantity: "temperature", Value: t, Bound: "above",
			Limit: "the critical temperature 647.096 K (end of the saturation line, IF97 region 4)", LimitSI: tCrit}
	}
	return nil
}

// checkX checks a vapour mass fraction against 0 <= x <= 1.
func checkX(fn string, x float64) error {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return &InputError{Func: fn, Quantity: "vapour mass fraction", Value: x}
	}
	if x < 0 {
		return &RangeError{Func: fn, Quantity: "vapour mass fraction", Value: x, Bound: "below",
			Limit: "0 (saturated liquid)", LimitSI: 0}
	}
	if x > 1 {
		return &RangeError{Func: fn, Quantity: "vapour mass fraction", Value: x, Bound: "above",
			Limit: "1 (saturated vapour)", LimitSI: 1}
	}
	return nil
}
