package heat

import (
	"errors"
	"fmt"
	"strings"
)

// ErrInput marks an input that makes no physical sense (a negative diameter,
// a NaN temperature, mole fractions that do not add up to one).
var ErrInput = errors.New("invalid input")

// ErrRange marks an input that is physically possible but lies outside the
// validity range of the correlation or fit that was asked for.
var ErrRange = errors.New("outside the validity range")

// Error reports what was wrong with an input: where (the function or
// equation), which quantity, the value given and what was expected. It wraps
// ErrInput or ErrRange, so callers can test with errors.Is.
type Error struct {
	Where    string  // function or equation, e.g. "Gnielinski"
	Quantity string  // e.g. "Re"
	Got      float64 // value given
	Want     string  // what was expected, e.g. "3000 <= Re <= 5e6"
	Kind     error   // ErrInput or ErrRange
}

func (e *Error) Error() string {
	return fmt.Sprintf("heat: %s: %s = %g is %v; expected %s", e.Where, e.Quantity, e.Got, e.Kind, e.Want)
}

// Unwrap returns ErrInput or ErrRange.
func (e *Error) Unwrap() error { return e.Kind }

func inputErr(where, quantity string, got float64, want string) error {
	return &Error{Where: where, Quantity: quantity, Got: got, Want: want, Kind: ErrInput}
}

func rangeErr(where, quantity string, got float64, want string) error {
	return &Error{Where: where, Quantity: quantity, Got: got, Want: want, Kind: ErrRange}
}

// Warning is a set of flags that a result carries when a correlation was
// used outside a validity range that is only known from memory, or where a
// documented extrapolation was asked for. A zero Warning means none. Warnings
// never change the number computed; they say how far to trust it.
type Warning uint32

// The warning flags.
const (
	// WarnTransportExtrapolated: a NASA transport fit was evaluated outside
	// its temperature range because TransportOptions.AllowExtrapolation was set.
	WarnTransportExtrapolated Warning = 1 << iota
	// WarnWSGGTemperature: a WSGG weight polynomial was evaluated outside
	// 600-2400 K (a range known from memory only, docs/reference/gas-radiation.md §1.1 [M]).
	WarnWSGGTemperature
	// WarnWSGGPathLength: pa·L outside 0.001-10 atm·m (from memory, docs/reference/gas-radiation.md §1.1 [M]).
	WarnWSGGPathLength
	// WarnVDIBelowRange: the VDI form of Gnielinski (valid for Re >= 1e4) was
	// evaluated below Re = 1e4 as the end point of the transition interpolation.
	WarnVDIBelowRange
	// WarnZukauskasPrandtl: Pr outside 0.7-500 (Zukauskas; range from memory).
	WarnZukauskasPrandtl
	// WarnInlinePitchRatio: in-line bank with S_T/S_L < 0.7, which the textbook
	// advises against (docs/reference/heat-transfer.md §4 [M]).
	WarnInlinePitchRatio
	// WarnRowCorrectionLowRe: in-line bank with fewer than 20 rows at
	// Re_D,max < 1e3, where no row correction is tabulated; the Re > 1e3 value was used.
	WarnRowCorrectionLowRe
	// WarnCooperPressure: reduced pressure outside 0.001-0.9 (Cooper's usual range, from memory).
	WarnCooperPressure
)

var warningText = [...]string{
	"NASA transport fit extrapolated outside its temperature range",
	"WSGG weights evaluated outside 600-2400 K (range from memory)",
	"WSGG pa·L outside 0.001-10 atm·m (range from memory)",
	"VDI Gnielinski form used below Re = 1e4 as transition end point",
	"Zukauskas used with Pr outside 0.7-500 (range from memory)",
	"in-line tube bank with S_T/S_L < 0.7 (poor heat transfer, textbook advises against)",
	"in-line row correction for Re_D,max < 1e3 not tabulated; Re > 1e3 value used",
	"Cooper used with reduced pressure outside 0.001-0.9 (range from memory)",
}

// String lists the warnings, separated by "; ". It allocates; call it only
// when reporting.
func (w Warning) String() string {
	if w == 0 {
		return ""
	}
	var parts []string
	for i, s := range warningText {
		if w&(1<<uint(i)) != 0 && s != "" {
			parts = append(parts, s)
		}
	}
	return strings.Join(parts, "; ")
}

// Has reports whether all flags of f are set in w.
func (w Warning) Has(f Warning) bool { return w&f == f }
