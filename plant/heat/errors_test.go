package heat

import (
	"errors"
	"strings"
	"testing"
)

// TestErrorMessages: errors name the equation, the quantity, the value given
// and what was expected (project rule 6).
func TestErrorMessages(t *testing.T) {
	t.Parallel()
	_, err := Gnielinski(2000, 0.7, 0.03)
	var e *Error
	if !errors.As(err, &e) || !errors.Is(err, ErrRange) {
		t.Fatalf("want *Error wrapping ErrRange, got %v", err)
	}
	msg := err.Error()
	for _, want := range []string{"heat:", "Gnielinski", "Re = 2000", "3000 <= Re <= 5e6"} {
		if !strings.Contains(msg, want) {
			t.Errorf("message %q lacks %q", msg, want)
		}
	}
	_, err = SmokeTubes{}.Solve(TubePassInput{})
	if msg := err.Error(); !strings.Contains(msg, "smoke-tube pass") || !strings.Contains(msg, "tube count") {
		t.Errorf("message %q should name the model and the quantity", msg)
	}
}

func TestWarningString(t *testing.T) {
	t.Parallel()
	if Warning(0).String() != "" {
		t.Error("no warning prints empty")
	}
	w := WarnWSGGTemperature | WarnCooperPressure
	s := w.String()
	if !strings.Contains(s, "600-2400 K") || !strings.Contains(s, "Cooper") || strings.Count(s, "; ") != 1 {
		t.Errorf("warning text %q", s)
	}
	if !w.Has(WarnCooperPressure) || w.Has(WarnZukauskasPrandtl) {
		t.Error("Has")
	}
	if len(warningText) != 8 {
		t.Errorf("%d warning texts for 8 flags", len(warningText))
	}
	if WSGGRatio1.String() != "pw/pc=1" || H2O.String() != "H2O" || WSGGSet(99).String() != "WSGGSet(?)" {
		t.Error("enum names")
	}
}
