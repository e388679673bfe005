package plant

import (
	"fmt"
	"io"
	"strconv"
	"strings"

	"steamcase/plant/units"
)

// KeyKind says how a key's value is written.
type KeyKind int

// The kinds of key.
const (
	// KeyQuantity is a number with a unit of the key's dimension
	// ("7 bar(g)"); a fraction may also be a plain number (0.85).
	KeyQuantity KeyKind = iota
	// KeyPressureDiff is a difference of pressures ("3 bar"), where gauge
	// or absolute does not matter.
	KeyPressureDiff
	// KeyFlag is true or false (1 or 0 in a Setting).
	KeyFlag
	// KeyNumber is a plain number: a ratio or a count.
	KeyNumber
	// KeyChoice is one of Key.Choices (its index in a Setting).
	KeyChoice
	// KeyText is a text: a name, a fuel grade.
	KeyText
	// KeyNameList is a list of component names.
	KeyNameList
	// KeyTable is a structured value (an efficiency table, an engine's
	// exhaust table, a tank's boundaries) that the script front end
	// decodes for the kind.
	KeyTable
	// KeyRank is a number, or one of Key.Choices standing for the number
	// of the same place in Key.Levels (a consumer's priority: 25, or
	// "cargo" for 30). A Setting holds the number.
	KeyRank
)

var keyKindNames = [...]string{"quantity", "pressure difference", "true or false", "number", "choice", "text", "list of names", "table", "number or level"}

func (k KeyKind) String() string {
	if int(k) < len(keyKindNames) {
		return keyKindNames[k]
	}
	return "KeyKind(" + strconv.Itoa(int(k)) + ")"
}

// Key is one parameter of a kind of component, declared once with the
// component: its name as scripts and load cases write it, what it is, how
// it is written, what holds when it is not given and where that default
// comes from, the range a given value must lie in, whether a load case may
// change it, and the result key that reports it. Scripts' key checks, the
// load cases' settings (Setting.Param is a key's Name), the documentation
// of the keys and the check-mode result are all read from these.
// Sources of defaults that are not figures from a reference: every key
// with a default names one of these or a reference (TestEveryDefaultHasSource).
const (
	// SourceLeftOut marks a default that leaves an effect out of the model
	// unless the description gives it: no loss, no limit, no check, a
	// factor of one, switched on.
	SourceLeftOut = "left out unless given"
	// SourceDerived marks a default taken from elsewhere in the
	// description or the case (the ambient pressure, the sea temperature,
	// another key): not an assumption of its own.
	SourceDerived = "taken from the description or the case"
	// SourceRule marks a default that is the model's own rule, stated in
	// the key's documentation (the first of its choices, the lowest
	// priority reduced first, a figure the description must give).
	SourceRule = "the model's rule, as documented"
)

type Key struct {
	Name  string // as a script writes it: "drum"
	Label string // in messages: "drum pressure"
	Kind  KeyKind
	Dim   units.Dimension // of a KeyQuantity
	Doc   string          // one line
	// Example is a value as a script writes it, for the documentation
	// and for messages ("7 bar(g)").
	Example  string
	Required bool
	// Default is the value (SI) that holds when the key is not given, if
	// HasDefault; the component's field then holds zero. DefaultNote says
	// it in words when it is not one number ("the plant's ambient
	// pressure"). Source says where the default comes from.
	Default     float64
	HasDefault  bool
	DefaultNote string
	Source      string
	// Min and Max bound a given value (SI); both zero: the component's
	// own check decides.
	Min, Max float64
	// Case says a load case (and a profile row) may set the key.
	Case bool
	// JSON is the key of the case result's JSON that reports the value,
	// if any.
	JSON    string
	Choices []string
	// Levels are the numbers the Choices of a KeyRank stand for.
	Levels []float64
	// Clears lists keys that setting this one resets to zero in a case (a
	// duty replaces a set steam flow).
	Clears []string

	get  func(Component) (float64, bool)
	set  func(Component, float64) bool
	text func(Component, []string) error
	// keep saves, for a text key a case may set, what the setter changes,
	// and returns what restores it.
	keep func(Component) (restore func())
}

// Settable reports whether the key has a value a Setting can change: a
// number (Setting.Value) or, for a text key, a text (Setting.Text).
func (k *Key) Settable() bool { return k.set != nil || (k.text != nil && k.keep != nil) }

// Get returns the key's value on c (SI; 1 or 0 for a flag, the index for
// a choice) and whether c has it.
func (k *Key) Get(c Component) (float64, bool) {
	if k.get == nil {
		return 0, false
	}
	return k.get(c)
}

// Set sets the key's value on c and reports whether c has it.
func (k *Key) Set(c Component, v float64) bool {
	if k.set == nil {
		return false
	}
	return k.set(c, v)
}

// TakesText reports whether a text or a list of names can be set with
// SetText.
func (k *Key) TakesText() bool { return k.text != nil }

// SetText sets a text key (KeyText: one value; KeyNameList: a list) on c.
func (k *Key) SetText(c Component, v []string) error {
	if k.text == nil {
		return fmt.Errorf("plant: key %q takes no text", k.Name)
	}
	return k.text(c, v)
}

// InRange reports whether v is a valid given value of the key: inside
// [Min, Max] when the key has a range, one of the choices for a choice,
// 0 or 1 for a flag.
func (k *Key) InRange(v float64) bool {
	if !finite(v) {
		return false
	}
	switch k.Kind {
	case KeyFlag:
		return v == 0 || v == 1
	case KeyChoice:
		return v == float64(int(v)) && int(v) >= 0 && int(v) < len(k.Choices)
	case KeyRank:
		for _, l := range k.Levels {
			if v == l {
				return true
			}
		}
	}
	if k.Min == 0 && k.Max == 0 {
		return true
	}
	return v >= k.Min && v <= k.Max
}

// rangeMsg is the fault of a value outside the key's range, as every
// component's check words it: in the unit of the key's example, without
// the noise of the conversion.
func (k *Key) rangeMsg(v float64) string {
	return fmt.Sprintf("%s must lie between %s and %s; got %s", k.Label, k.Show(k.Min), k.Show(k.Max), k.Show(v))
}

// Show writes v (SI) as a script would give it: a quantity in the unit of
// the key's example with at most six significant digits (a fraction in
// percent), a flag as true or false, a choice by its name.
func (k *Key) Show(v float64) string {
	switch k.Kind {
	case KeyFlag:
		if v != 0 {
			return "true"
		}
		return "false"
	case KeyChoice:
		if i := int(v); float64(i) == v && i >= 0 && i < len(k.Choices) {
			return strconv.Quote(k.Choices[i])
		}
	case KeyQuantity:
		return showLike(v, k.Dim, k.Example)
	case KeyPressureDiff:
		return strconv.FormatFloat(v/1e5, 'g', 6, 64) + " bar"
	}
	return strconv.FormatFloat(v, 'g', 6, 64)
}

// RangeText says the range of a given value, "between 5 % and 100 %", or
// "" when the key has none.
func (k *Key) RangeText() string {
	if k.Min == 0 && k.Max == 0 {
		return ""
	}
	return "between " + k.Show(k.Min) + " and " + k.Show(k.Max)
}

// showLike writes an SI value in the unit of an example, with at most six
// significant digits; a fraction written as a plain number (an example
// such as "0.98") as a number, else in percent.
func showLike(v float64, dim units.Dimension, example string) string {
	unit := ""
	if f := strings.Fields(example); len(f) >= 2 {
		unit = strings.Join(f[1:], " ")
	}
	if dim == units.Fraction {
		if unit == "" && example != "" {
			return strconv.FormatFloat(v, 'g', 6, 64)
		}
		return strconv.FormatFloat(100*v, 'g', 6, 64) + " %"
	}
	if unit != "" {
		if x, err := units.FromSI(v, unit); err == nil {
			return strconv.FormatFloat(x, 'g', 6, 64) + " " + unit
		}
	}
	return strconv.FormatFloat(v, 'g', 6, 64) + " " + dim.SIUnit()
}

// DefaultText is the default as the documentation shows it: in words, or
// the number in the key's example unit.
func (k *Key) DefaultText() string {
	switch {
	case k.DefaultNote != "":
		return k.DefaultNote
	case !k.HasDefault:
		return ""
	case k.Kind == KeyFlag:
		if k.Default != 0 {
			return "true"
		}
		return "false"
	case k.Kind == KeyChoice:
		if i := int(k.Default); i >= 0 && i < len(k.Choices) {
			return strconv.Quote(k.Choices[i])
		}
	}
	return k.Show(k.Default)
}

// Key binders. Each ties a key to a field of its owner: the component, or
// a model the component holds. The owner functions check the type, so a
// key never reaches into the wrong component.

// self is the owner function of a component's own fields.
func self[T Component](c Component) (T, bool) {
	t, ok := c.(T)
	return t, ok
}

// num binds a float64 field.
func num[T any](k Key, owner func(Component) (T, bool), f func(T) *float64) Key {
	k.get = func(c Component) (float64, bool) {
		t, ok := owner(c)
		if !ok {
			return 0, false
		}
		return *f(t), true
	}
	k.set = func(c Component, v float64) bool {
		t, ok := owner(c)
		if ok {
			*f(t) = v
		}
		return ok
	}
	return k
}

// flag binds a bool field (a Setting gives 1 for true and 0 for false).
func flag[T any](k Key, owner func(Component) (T, bool), f func(T) *bool) Key {
	k.Kind = KeyFlag
	k.get = func(c Component) (float64, bool) {
		t, ok := owner(c)
		if !ok {
			return 0, false
		}
		if *f(t) {
			return 1, true
		}
		return 0, true
	}
	k.set = func(c Component, v float64) bool {
		t, ok := owner(c)
		if ok {
			*f(t) = v != 0
		}
		return ok
	}
	return k
}

// choice binds a field of an integer type whose values index k.Choices.
func choice[T any, E ~int](k Key, owner func(Component) (T, bool), f func(T) *E) Key {
	k.Kind = KeyChoice
	k.get = func(c Component) (float64, bool) {
		t, ok := owner(c)
		if !ok {
			return 0, false
		}
		return float64(*f(t)), true
	}
	k.set = func(c Component, v float64) bool {
		t, ok := owner(c)
		if ok {
			*f(t) = E(int(v))
		}
		return ok
	}
	return k
}

// findKey returns the key called name among keys.
func findKey(keys []Key, name string) (*Key, bool) {
	for i := range keys {
		if keys[i].Name == name {
			return &keys[i], true
		}
	}
	return nil, false
}

// keyNames lists the names of keys, those a case may set when caseOnly.
func keyNames(keys []Key, caseOnly bool) []string {
	var out []string
	for _, k := range keys {
		if !caseOnly || k.Case {
			out = append(out, k.Name)
		}
	}
	return out
}

// checkKey adds a fault when c's value of the key called name lies
// outside the key's range. A key with a default is not checked at zero
// (zero means the default); a required key is.
func checkKey(fs *faults, c Component, name string) {
	k, ok := findKey(c.Keys(), name)
	if !ok {
		panic(fmt.Sprintf("plant: checkKey: %s has no key %q", c.Kind(), name))
	}
	v, _ := k.Get(c)
	if v == 0 && (k.HasDefault || k.DefaultNote != "") {
		return
	}
	if !finite(v) || v < k.Min || v > k.Max {
		b := c.Ident()
		fs.add(b.Pos, b.Name, "", "%s", k.rangeMsg(v))
	}
}

// checkRange adds a fault when v lies outside [lo, hi]: the check of a
// parameter that is not a key of its own.
func checkRange(fs *faults, c Component, what string, v, lo, hi float64, unit string) {
	if !finite(v) || v < lo || v > hi {
		b := c.Ident()
		fs.add(b.Pos, b.Name, "", "%s must lie between %g and %g %s; got %g", what, lo, hi, unit, v)
	}
}

// paramErr is the error of a Setting naming a key the component does not
// take in a case.
func paramErr(c Component, name string) error {
	return compErr(c, "%s", paramMsg(c, name))
}

func paramMsg(c Component, name string) string {
	return fmt.Sprintf("has no parameter %q; its parameters are %q", name, keyNames(c.Keys(), true))
}

// WriteKeyReference writes the reference of the given kinds and their
// keys, as the documentation shows it: for each kind its name and line of
// documentation, and for each key how it is written (its dimension and an
// example), whether it is required or its default and the default's
// source, whether a load case may set it, the result key that reports it,
// and its line of documentation.
func WriteKeyReference(w io.Writer, kinds []KindSpec) error {
	var b strings.Builder
	for i, kind := range kinds {
		if i > 0 {
			b.WriteString("\n")
		}
		fmt.Fprintf(&b, "%s: %s\n", kind.Name, kind.Doc)
		for _, k := range kind.Keys() {
			var how []string
			what := k.Kind.String()
			if k.Kind == KeyQuantity {
				what = k.Dim.String()
			}
			if k.Kind == KeyChoice {
				what = "one of " + choices(k.Choices)
			} else if k.Kind == KeyRank {
				what = fmt.Sprintf("a number from %g to %g or one of %s", k.Min, k.Max, levels(k.Choices, k.Levels))
			} else if k.Example != "" {
				ex := k.Example
				if (k.Kind == KeyQuantity || k.Kind == KeyPressureDiff) && strings.Contains(ex, " ") {
					ex = strconv.Quote(ex)
				}
				what += ", such as " + ex
			}
			how = append(how, what)
			switch {
			case k.Required:
				how = append(how, "required")
			case k.DefaultText() != "":
				d := "default " + k.DefaultText()
				if k.Source != "" {
					d += " (" + k.Source + ")"
				}
				how = append(how, d)
			}
			if k.Case {
				how = append(how, "a case may set it")
			}
			if k.JSON != "" {
				how = append(how, "reported as "+k.JSON)
			}
			fmt.Fprintf(&b, "  %s: %s\n      %s\n", k.Name, strings.Join(how, "; "), k.Doc)
		}
	}
	_, err := io.WriteString(w, b.String())
	return err
}

// choices writes `"a", "b" or "c"`.
func choices(cs []string) string {
	q := make([]string, len(cs))
	for i, c := range cs {
		q[i] = strconv.Quote(c)
	}
	if len(q) == 1 {
		return q[0]
	}
	return strings.Join(q[:len(q)-1], ", ") + " or " + q[len(q)-1]
}

// levels writes `"a" (10), "b" (20) or "c" (30)`.
func levels(names []string, values []float64) string {
	q := make([]string, len(names))
	for i, c := range names {
		q[i] = strconv.Quote(c)
		if i < len(values) {
			q[i] += " (" + strconv.FormatFloat(values[i], 'g', 6, 64) + ")"
		}
	}
	if len(q) == 1 {
		return q[0]
	}
	return strings.Join(q[:len(q)-1], ", ") + " or " + q[len(q)-1]
}

// Level returns the number a KeyRank's named level stands for.
func (k *Key) Level(name string) (float64, bool) {
	for i, c := range k.Choices {
		if c == name && i < len(k.Levels) {
			return k.Levels[i], true
		}
	}
	return 0, false
}

// LevelName returns the name of a KeyRank's level v, or "".
func (k *Key) LevelName(v float64) string {
	for i, l := range k.Levels {
		if l == v && i < len(k.Choices) {
			return k.Choices[i]
		}
	}
	return ""
}

// KeyNames lists the names of keys, in their order.
func KeyNames(keys []Key) []string { return keyNames(keys, false) }
