package cite

import (
	"fmt"
	"strings"
	"testing"
)

// The cases below are written for this package: the expected citations are
// what the rules of doc.go say, worked out by hand (common practice, no
// source). The sheets named are the project's; the sections need not exist,
// since Extract does not read the sheets.

var known = Options{Sheets: []string{"README.md", "plant-checks.md", "heat-transfer.md", "gas-radiation.md"}}

// brief is the part of a Citation a case checks.
type brief struct {
	Line    int
	Sheet   string
	Section string
	Item    string
	Title   string
	Tag     string
	Form    Form
	Via     Form
}

func (b brief) String() string {
	return fmt.Sprintf("%d %s §%s item=%q title=%q tag=%q %v via %v", b.Line, b.Sheet, b.Section, b.Item, b.Title, b.Tag, b.Form, b.Via)
}

func briefs(cs []Citation) []brief {
	var out []brief
	for _, c := range cs {
		out = append(out, brief{c.Line, c.Sheet, c.Section, c.Item.String(), c.Title, c.Tag, c.Form, c.Via})
	}
	return out
}

func TestExtract(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name, file, src string
		opt             Options
		want            []brief
	}{
		{"name and tag", "a.go", "// plant-checks.md §3.6 [C]\n", known,
			[]brief{{1, "plant-checks.md", "3.6", "", "", "[C]", Name, Name}}},
		{"target", "a.go", "x := 1 // docs/reference/heat-transfer.md §4\n", known,
			[]brief{{1, "heat-transfer.md", "4", "", "", "", Target, Target}}},
		{"relative link to the folder is the target", "a.md", "[x](../../docs/reference/heat-transfer.md)\n", known,
			[]brief{{1, "heat-transfer.md", "", "", "", "", Target, Target}}},
		{"shared path and known name without section", "a.go", "// (shared/reference/heat-transfer.md\n// and gas-radiation.md): tags\n", known,
			[]brief{
				{1, "heat-transfer.md", "", "", "", "", SharedPath, SharedPath},
				{2, "gas-radiation.md", "", "", "", "", Name, Name}}},
		{"over a line break", "a.go", "// the flue gas of heat-transfer.md\n// §1.3: x_N2 0.7808\n", known,
			[]brief{{1, "heat-transfer.md", "1.3", "", "", "", Name, Name}}},
		{"chain after a tag", "a.go", `fgNear(t, "λ (plant-checks.md §2.1 [C], §11 item 4)", x, 1, 0)` + "\n", known,
			[]brief{
				{1, "plant-checks.md", "2.1", "", "", "[C]", Name, Name},
				{1, "plant-checks.md", "11", "item 4", "", "", Chained, Name}}},
		{"chain by slash and by and", "a.go", "// plant-checks.md §3.2/§3.3 and §4 row 1\n", known,
			[]brief{
				{1, "plant-checks.md", "3.2", "", "", "", Name, Name},
				{1, "plant-checks.md", "3.3", "", "", "", Chained, Name},
				{1, "plant-checks.md", "4", "row 1", "", "", Chained, Name}}},
		{"bracket breaks the chain", "a.go", "// (plant-checks.md §3.3 [C]); §4 row 1\n", known,
			[]brief{
				{1, "plant-checks.md", "3.3", "", "", "[C]", Name, Name},
				{1, "plant-checks.md", "4", "row 1", "", "", Implicit, Implicit}}},
		{"sentence end breaks the chain", "a.go", "// plant-checks.md §3.3 [C]. §4 says so.\n", known,
			[]brief{
				{1, "plant-checks.md", "3.3", "", "", "[C]", Name, Name},
				{1, "plant-checks.md", "4", "", "", "", Implicit, Implicit}}},
		{"implicit after a sheet named earlier", "a.go", "// plant-checks.md §1\nfunc f() {}\n\n// later (§5.2 [S]; §11 #8)\n", known,
			[]brief{
				{1, "plant-checks.md", "1", "", "", "", Name, Name},
				{4, "plant-checks.md", "5.2", "", "", "[S]", Implicit, Implicit},
				{4, "plant-checks.md", "11", "item 8", "", "", Chained, Implicit}}},
		{"implicit takes the sheet named last", "a.go", "// plant-checks.md §1, then heat-transfer.md\n// (x) §8\n", known,
			[]brief{
				{1, "plant-checks.md", "1", "", "", "", Name, Name},
				{1, "heat-transfer.md", "", "", "", "", Name, Name},
				{2, "heat-transfer.md", "8", "", "", "", Implicit, Implicit}}},
		{"no sheet named: a book's section", "a.go", "// (Higham, Accuracy and Stability, 2002, §8.2)\n", known, nil},
		{"other source before a bare section", "a.go", "// heat-transfer.md §5.\n// by EN 1993-1-2 (Eurocode 3, fire design),\n// §3.4.1.3 (clause number from memory)\n", known,
			[]brief{{1, "heat-transfer.md", "5", "", "", "", Name, Name}}},
		{"a book's chapter and section", "a.go", "// (heat-transfer.md §1.2 [S, Poling et al.\n// 5th ed. §9-5 and §10-6, from memory])\n", known,
			[]brief{{1, "heat-transfer.md", "1.2", "", "", "", Name, Name}}},
		{"reference README phrase", "a.go", "// as stated in the project's reference README §3.\n", known,
			[]brief{{1, "README.md", "3", "", "", "", Phrase, Phrase}}},
		{"reference README phrase over a line break", "a.go", "// the reference\n// README recalls 10 mK\n", known,
			[]brief{{1, "README.md", "", "", "", "", Phrase, Phrase}}},
		{"reference README.md is the file name", "a.md", "see the reference README.md §7\n", known,
			[]brief{{1, "README.md", "7", "", "", "", Name, Name}}},
		{"README with a path or a section only", "a.md", "Users start with README.md, scenarios/README.md,\nthen reference/README.md and README.md §7.\n", known,
			[]brief{
				{2, "README.md", "", "", "", "", SharedPath, SharedPath},
				{2, "README.md", "7", "", "", "", Name, Name}}},
		{"sheet named in words", "a.go", "// tags as in the project's plant-checks\n// reference sheet: [S✓] seen\n", known,
			[]brief{{1, "plant-checks.md", "", "", "", "", Phrase, Phrase}}},
		{"quoted item words", "a.go", "// TestX checks \"Sign of the weights [C]\" of gas-radiation.md\n// §1.4, every 10 K\n", known,
			[]brief{{1, "gas-radiation.md", "1.4", "", "Sign of the weights [C]", "", Name, Name}}},
		{"check and tag", "a.go", "// plant-checks.md §5.1 check A [S✓/C], §11 item 7: 32 cSt\n", known,
			[]brief{
				{1, "plant-checks.md", "5.1", "check A", "", "[S✓/C]", Name, Name},
				{1, "plant-checks.md", "11", "item 7", "", "", Chained, Name}}},
		{"Checks is not a check", "a.go", "// plant-checks.md §6 Checks [C]\n", known,
			[]brief{{1, "plant-checks.md", "6", "", "", "", Name, Name}}},
		{"Lua comment", "a.lua", "-- within the indicative ranges of plant-checks.md §7's table\n", known,
			[]brief{{1, "plant-checks.md", "7", "", "", "", Name, Name}}},
		{"Lua comment over a line break", "a.lua", "x = 1 -- see plant-checks.md\n-- §9 [C]\n", known,
			[]brief{{1, "plant-checks.md", "9", "", "", "[C]", Name, Name}}},
		{"Markdown quote over a line break", "a.md", "> from `plant-checks.md`\n> §6, as given\n", known,
			[]brief{{1, "plant-checks.md", "6", "", "", "", Name, Name}}},
		{"unknown sheet with a section", "a.go", "// foo-bar.md §2\n", known,
			[]brief{{1, "foo-bar.md", "2", "", "", "", Name, Name}}},
		{"other Markdown files are not sheets", "a.md", "See DEVELOPERS.md and x/plant-checks.md.\n", known, nil},
		{"no implicit in a sheet", "plant-checks.md", "see §5 and heat-transfer.md §8, §4 below\n(then §2)\n", Options{Sheets: known.Sheets, NoImplicit: true},
			[]brief{
				{1, "heat-transfer.md", "8", "", "", "", Name, Name},
				{1, "heat-transfer.md", "4", "", "", "", Chained, Name}}},
		{"nothing", "a.go", "package a\n", known, nil},
		{"empty", "a.go", "", known, nil},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			got := briefs(Extract(c.file, []byte(c.src), c.opt))
			if fmt.Sprint(got) != fmt.Sprint(c.want) {
				t.Errorf("Extract(%q):\n got  %v\n want %v", c.src, got, c.want)
			}
		})
	}
}

func TestExtractSpansAndText(t *testing.T) {
	t.Parallel()
	src := "package a\n\n\t// the test fuel of plant-checks.md\n\t// §1.2 [M] and §2.1, then (§3.3)\n"
	cs := Extract("a.go", []byte(src), known)
	if len(cs) != 3 {
		t.Fatalf("got %d citations, want 3: %v", len(cs), briefs(cs))
	}
	if got := src[cs[0].Start:cs[0].End]; got != "plant-checks.md" {
		t.Errorf("span of the first citation %q, want the sheet's name", got)
	}
	if got, want := cs[0].Text, "plant-checks.md §1.2 [M]"; got != want {
		t.Errorf("text %q, want %q", got, want)
	}
	for _, c := range cs[1:] {
		if c.Start != c.End || !strings.HasPrefix(src[c.Start:], "§") {
			t.Errorf("%v: span [%d,%d) should be empty at its section sign", c.Form, c.Start, c.End)
		}
	}
	if cs[0].File != "a.go" || cs[0].Line != 3 || cs[1].Line != 4 || cs[2].Line != 4 {
		t.Errorf("file and lines %s %d %d %d, want a.go 3 4 4", cs[0].File, cs[0].Line, cs[1].Line, cs[2].Line)
	}
}

func TestRewrite(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name, file, src, want string
		n                     int
	}{
		{"name", "a.go", "// plant-checks.md §3.6 [C]\n", "// docs/reference/plant-checks.md §3.6 [C]\n", 1},
		{"target left alone", "a.go", "// docs/reference/plant-checks.md §3.6 [C]\n", "// docs/reference/plant-checks.md §3.6 [C]\n", 0},
		{"chain follows its head", "a.go", `s := "λ (plant-checks.md §2.1 [C], §11 item 4)"` + "\n",
			`s := "λ (docs/reference/plant-checks.md §2.1 [C], §11 item 4)"` + "\n", 1},
		{"shared paths", "a.md", "from ../shared/reference/README.md and shared/reference/heat-transfer.md\n",
			"from docs/reference/README.md and docs/reference/heat-transfer.md\n", 2},
		{"implicit", "a.go", "// plant-checks.md §1\n// x (§3.3 [C]; §11 item 4)\n",
			"// docs/reference/plant-checks.md §1\n// x (docs/reference/plant-checks.md §3.3 [C]; §11 item 4)\n", 2},
		{"README phrase", "a.go", "// as in the project's reference README §3.\n", "// as in the project's docs/reference/README.md §3.\n", 1},
		{"README phrase over a line break", "a.go", "\t// the reference\n\t// README recalls 10 mK\n", "\t// the\n\t// docs/reference/README.md recalls 10 mK\n", 1},
		{"sheet in words over a line break", "a.go", "// tags as in the project's plant-checks\n// reference sheet: [S✓]\n",
			"// tags as in the project's docs/reference/plant-checks.md\n// reference sheet: [S✓]\n", 1},
		{"backticks stay around the name", "a.lua", "-- see `gas-radiation.md` §4\n", "-- see `docs/reference/gas-radiation.md` §4\n", 1},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			cs := Extract(c.file, []byte(c.src), known)
			got, n := Rewrite([]byte(c.src), cs)
			if string(got) != c.want || n != c.n {
				t.Errorf("Rewrite(%q) = %q, %d; want %q, %d", c.src, got, n, c.want, c.n)
			}
		})
	}
}

// TestRewriteRoundTrip: after a rewrite every citation is explicit, and the
// same sheets, sections and sub-items are cited in the same order.
func TestRewriteRoundTrip(t *testing.T) {
	t.Parallel()
	src := "// plant-checks.md §2.1 [C], §11 item 4\n// (§3.3); the reference\n// README §1, the heat-transfer reference sheet and\n// shared/reference/gas-radiation.md §5; Higham §8.2 no\n"
	roundTrip(t, "a.go", src)
}

func roundTrip(t *testing.T, file, src string) {
	t.Helper()
	before := Extract(file, []byte(src), known)
	out, _ := Rewrite([]byte(src), before)
	after := Extract(file, out, known)
	if len(after) != len(before) {
		t.Fatalf("%q: %d citations before the rewrite, %d after (%q)", src, len(before), len(after), out)
	}
	for i := range before {
		b, a := before[i], after[i]
		if a.Sheet != b.Sheet || a.Section != b.Section || a.Item != b.Item {
			t.Errorf("%q: citation %d was %s §%s %v, is %s §%s %v after the rewrite (%q)", src, i, b.Sheet, b.Section, b.Item, a.Sheet, a.Section, a.Item, out)
		}
		if !a.Explicit() {
			t.Errorf("%q: citation %d is %v (via %v) after the rewrite (%q)", src, i, a.Form, a.Via, out)
		}
	}
	again, n := Rewrite(out, after)
	if n != 0 || string(again) != string(out) {
		t.Errorf("%q: a second rewrite changed %d citations", src, n)
	}
}

func FuzzRewrite(f *testing.F) {
	for _, s := range []string{
		"// plant-checks.md §2.1 [C], §11 item 4\n",
		"-- (§3.3) reference README §1\n",
		"> the reference\n> README and the heat-transfer reference sheet §2\n",
		"\"x\" of shared/reference/gas-radiation.md §5; EN 1993-1-2 §3.4.1.3, §9-5",
		"§1 plant-checks.md (x) §2 §3",
		"abc§3 plant-checks.md§4. §5",
	} {
		for _, ext := range []string{".go", ".lua", ".md"} {
			f.Add(s, ext)
		}
	}
	f.Fuzz(func(t *testing.T, src, ext string) {
		file := "a" + ext
		cs := Extract(file, []byte(src), known)
		for _, c := range cs {
			if c.Start < 0 || c.Start > c.End || c.End > len(src) || c.Line < 1 {
				t.Fatalf("%q: bad span or line %d [%d,%d)", src, c.Line, c.Start, c.End)
			}
		}
		roundTrip(t, file, src)
	})
}

func ExampleExtract() {
	src := []byte(`// Stoichiometric air 13.770 kg/kg (plant-checks.md §2.1 [C], §11 item 2).
// Siegert 9.627 % (§3.2 [S]).
`)
	cs := Extract("x_test.go", src, Options{Sheets: []string{"plant-checks.md"}})
	for _, c := range cs {
		fmt.Printf("line %d: %s §%s %v (%v)\n", c.Line, c.Sheet, c.Section, c.Item, c.Form)
	}
	out, n := Rewrite(src, cs)
	fmt.Printf("%d rewritten:\n%s", n, out)
	// Output:
	// line 1: plant-checks.md §2.1  (name)
	// line 1: plant-checks.md §11 item 2 (chained)
	// line 2: plant-checks.md §3.2  (implicit)
	// 2 rewritten:
	// // Stoichiometric air 13.770 kg/kg (docs/reference/plant-checks.md §2.1 [C], §11 item 2).
	// // Siegert 9.627 % (docs/reference/plant-checks.md §3.2 [S]).
}
