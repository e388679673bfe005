package heat

import (
	"encoding/csv"
	"math"
	"os"
	"strconv"
	"strings"
	"testing"
)

// readCSV returns the header and rows of a testdata CSV file.
func readCSV(t testing.TB, name string) (map[string]int, [][]string) {
	t.Helper()
	f, err := os.Open("testdata/" + name)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	r := csv.NewReader(f)
	r.FieldsPerRecord = -1
	recs, err := r.ReadAll()
	if err != nil {
		t.Fatalf("%s: %v", name, err)
	}
	col := map[string]int{}
	for i, h := range recs[0] {
		col[h] = i
	}
	return col, recs[1:]
}

func parse(t testing.TB, s string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil {
		t.Fatalf("parse %q: %v", s, err)
	}
	return v
}

// printedTol returns half a unit in the last printed digit of s (the
// rounding of a value printed with that many digits), plus a relative 1e-12
// for the arithmetic. "0.259984" → 5e-7; "1.790591e-05" → 5e-12.
func printedTol(s string) float64 {
	s = strings.TrimSpace(s)
	exp := 0
	if i := strings.IndexAny(s, "eE"); i >= 0 {
		exp, _ = strconv.Atoi(s[i+1:])
		s = s[:i]
	}
	dec := 0
	if i := strings.IndexByte(s, '.'); i >= 0 {
		dec = len(s) - i - 1
	}
	v, _ := strconv.ParseFloat(s, 64)
	return 0.5*math.Pow10(exp-dec) + 1e-12*math.Abs(v)*math.Pow10(exp)
}

// within checks |got − want| ≤ tol.
func within(t testing.TB, what string, got, want, tol float64) {
	t.Helper()
	if !(math.Abs(got-want) <= tol) {
		t.Errorf("%s: got %.12g, want %.12g ± %.3g (off by %.3g)", what, got, want, tol, got-want)
	}
}

// withinRel checks |got − want| ≤ rel·|want|.
func withinRel(t testing.TB, what string, got, want, rel float64) {
	t.Helper()
	within(t, what, got, want, rel*math.Abs(want))
}

// printed checks got against a value printed on a reference sheet, to the
// sheet's rounding.
func printed(t testing.TB, what string, got float64, s string) {
	t.Helper()
	within(t, what, got, parse(t, s), printedTol(s))
}

func mustNoErr(t testing.TB, err error) {
	t.Helper()
	if err != nil {
		t.Fatal(err)
	}
}

func TestPrintedTol(t *testing.T) {
	t.Parallel()
	// Self-check of the helper (no external source needed: it is arithmetic).
	for _, c := range []struct {
		s    string
		want float64
	}{{"0.259984", 5e-7}, {"1.790591e-05", 5e-12}, {"51.3706", 5e-5}, {"1529.927", 5e-4}, {"40", 0.5}} {
		within(t, c.s, printedTol(c.s), c.want, 1e-5*c.want)
	}
}
