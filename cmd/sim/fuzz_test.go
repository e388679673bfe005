package main

import (
	"strings"
	"testing"
)

// FuzzSteam runs 'sim steam' with arbitrary values: it must not panic, must
// exit 0, 1 or 2, must write one line on stderr for a failure, and must
// never print NaN or Inf.
func FuzzSteam(f *testing.F) {
	f.Add("7 bar(g)", "1", uint8(3), false)
	f.Add("1.2 MPa", "250 C", uint8(0), true)
	f.Add("16 bar(g)", "2900 kJ/kg", uint8(1), false)
	f.Add("0.5 bar(a)", "7.5 kJ/kgK", uint8(2), true)
	f.Add("170 C", "0", uint8(4), false)
	f.Add("1e-300 Pa", "1e300 K", uint8(0), false)
	f.Fuzz(func(t *testing.T, first, second string, which uint8, asJSON bool) {
		var args []string
		switch which % 5 {
		case 0:
			args = []string{"steam", "--p", first, "--t", second}
		case 1:
			args = []string{"steam", "--p", first, "--h", second}
		case 2:
			args = []string{"steam", "--p", first, "--s", second}
		case 3:
			args = []string{"steam", "--p", first, "--x", second}
		case 4:
			args = []string{"steam", "--t", first, "--x", second}
		}
		if asJSON {
			args = append(args, "--json")
		}
		code, out, errOut := runSim(t, args...)
		switch code {
		case exitOK:
			if errOut != "" {
				t.Fatalf("sim %q: exit 0 with stderr %q", args, errOut)
			}
			if strings.Contains(out, "NaN") || strings.Contains(out, "Inf") {
				t.Fatalf("sim %q printed a non-finite number:\n%s", args, out)
			}
		case exitFail:
			if strings.Count(errOut, "\n") != 1 || out != "" {
				t.Fatalf("sim %q: failure must be one line on stderr and nothing on stdout; got %q, %q", args, errOut, out)
			}
		case exitUsage:
			if out != "" {
				t.Fatalf("sim %q: usage error wrote to stdout: %q", args, out)
			}
		default:
			t.Fatalf("sim %q: exit %d", args, code)
		}
	})
}
