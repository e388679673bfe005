package units

// ErrorKind says what was wrong with a quantity.
type ErrorKind uint8

// The kinds of Error.
const (
	ErrSyntax         ErrorKind = iota + 1 // no number, or a malformed one
	ErrUnknownUnit                         // the unit is not known
	ErrWrongDimension                      // the unit is known but of another dimension
	ErrMissingUnit                         // a bare number where a unit is needed
	ErrAmbiguous                           // "7 bar": gauge or absolute not said; "5 C" as a difference
	ErrRange                               // the number or its SI value is not finite
	ErrPhysical                            // below absolute zero, or at or below vacuum
	ErrOptions                             // Options hold an implausible value
)

var kindNames = [...]string{
	ErrSyntax:         "syntax",
	ErrUnknownUnit:    "unknown unit",
	ErrWrongDimension: "wrong dimension",
	ErrMissingUnit:    "missing unit",
	ErrAmbiguous:      "ambiguous",
	ErrRange:          "out of range",
	ErrPhysical:       "not physical",
	ErrOptions:        "bad options",
}

// String returns a short name of the kind, such as "unknown unit".
func (k ErrorKind) String() string {
	if int(k) < len(kindNames) && kindNames[k] != "" {
		return kindNames[k]
	}
	return "unknown error kind"
}

// Error is the error returned by every function of the package. Its message
// is a full sentence naming what was given and what was expected.
type Error struct {
	Kind  ErrorKind
	Input string    // the text as given ("" for errors about Options or a value)
	Want  Dimension // the dimension asked for; zero for ParseAny and unit look-ups
	Got   Dimension // the dimension of the unit found, when one was found
	Unit  string    // the unit as written, when there was one
	msg   string
}

func (e *Error) Error() string { return e.msg }

func newError(kind ErrorKind, input string, want, got Dimension, unit, msg string) *Error {
	return &Error{Kind: kind, Input: input, Want: want, Got: got, Unit: unit, msg: msg}
}
