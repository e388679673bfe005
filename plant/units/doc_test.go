package units

import (
	"flag"
	"os"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite the generated list of spellings in doc.go")

// docList returns the generated list of accepted spellings, as comment lines.
func docList() string {
	var b strings.Builder
	line := func(head string, units []string) {
		b.WriteString("//   - " + head + ": " + strings.Join(units, "; ") + "\n")
	}
	for _, d := range Dimensions() {
		var abs, gau []string
		for _, u := range Units(d) {
			s := strings.Join(u.Spellings, ", ")
			if u.Gauge {
				gau = append(gau, s)
			} else {
				abs = append(abs, s)
			}
		}
		switch d {
		case Fraction:
			line("fraction (SI: 1)", append([]string{"a bare number"}, abs...))
		case Pressure:
			line("pressure, absolute (SI: Pa)", abs)
			line("pressure, gauge", gau)
			line("pressure, rejected as ambiguous", AmbiguousSpellings())
		default:
			line(d.String()+" (SI: "+d.SIUnit()+")", abs)
		}
	}
	return b.String()
}

// TestDocListsEverySpelling keeps the list in doc.go equal to the table.
// Run with -update to rewrite it.
func TestDocListsEverySpelling(t *testing.T) {
	src, err := os.ReadFile("doc.go")
	if err != nil {
		t.Fatal(err)
	}
	const marker = "// spellings of one unit by ','. The list is generated from the package's\n// table by its tests.\n//\n"
	text := string(src)
	i := strings.Index(text, marker)
	j := strings.Index(text, "package units")
	if i < 0 || j < i {
		t.Fatal("doc.go: marker for the generated list not found")
	}
	i += len(marker)
	want := docList()
	if text[i:j] == want {
		return
	}
	if *update {
		if err := os.WriteFile("doc.go", []byte(text[:i]+want+text[j:]), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	t.Errorf("doc.go list of spellings is out of date; run go test -run TestDocListsEverySpelling -update\ngot:\n%s\nwant:\n%s", text[i:j], want)
}
