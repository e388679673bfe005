package cite

import (
	"fmt"
	"strings"
	"testing"
)

// sheetSrc is a small sheet in the layout of the project's sheets, made up
// for these tests.
const sheetSrc = "# A sheet\n" +
	"\n" +
	"| Tag | Meaning |\n" +
	"|---|---|\n" +
	"| **[C]** | computed |\n" +
	"\n" +
	"## 0. Constants [C]\n" +
	"\n" +
	"| Quantity | Value |\n" +
	"|---|---|\n" +
	"| h_fg | 2441.7 |\n" +
	"\n" +
	"## 1. Fuel\n" +
	"\n" +
	"### 1.1 ISO 8217 [S✓]\n" +
	"**Check A** (a worked example): 8.53 cSt.\n" +
	"\n" +
	"| # | Test |\n" +
	"| --- | --- |\n" +
	"| 1 | first |\n" +
	"| **2** | second |\n" +
	"\n" +
	"* **Sign of the weights [C], evaluated every 10 K.**\n" +
	"\n" +
	"```\n" +
	"## 7. not a heading inside a code block\n" +
	"```\n" +
	"\n" +
	"### Doubts\n" +
	"\n" +
	"## 2. Combustion\n" +
	"Stoichiometric air.\n"

func TestParseSheet(t *testing.T) {
	t.Parallel()
	s := ParseSheet("a.md", []byte(sheetSrc))
	if got, want := strings.Join(s.Sections(), " "), "0 1 1.1 2"; got != want {
		t.Errorf("sections %q, want %q", got, want)
	}
	if got, want := s.Title("1.1"), "ISO 8217 [S✓]"; got != want {
		t.Errorf("title of §1.1 %q, want %q", got, want)
	}
	if got := s.Title("7"); got != "" {
		t.Errorf("title of §7 %q, want none", got)
	}
}

func TestCheck(t *testing.T) {
	t.Parallel()
	s := ParseSheet("a.md", []byte(sheetSrc))
	cases := []struct {
		c    Citation
		want string // "" for no error, else a part of the message
	}{
		{Citation{}, ""},
		{Citation{Section: "0"}, ""},
		{Citation{Section: "1"}, ""},
		{Citation{Section: "1.1"}, ""},
		{Citation{Section: "2"}, ""},
		{Citation{Section: "3"}, "a.md has no §3 (its sections: §0, §1, §1.1, §2)"},
		{Citation{Section: "7"}, "no §7"},
		{Citation{Section: "1.2"}, "no §1.2"},
		{Citation{Section: "1.1", Item: Item{"item", "2"}}, ""},
		{Citation{Section: "1", Item: Item{"item", "1"}}, ""}, // §1 holds §1.1
		{Citation{Section: "1.1", Item: Item{"item", "3"}}, "a.md §1.1 has no table row numbered 3"},
		{Citation{Section: "2", Item: Item{"item", "1"}}, "no table row numbered 1"},
		{Citation{Section: "1.1", Item: Item{"row", "2"}}, ""},
		{Citation{Section: "1.1", Item: Item{"row", "3"}}, "a.md §1.1 has 2 table rows; row 3 cited"},
		{Citation{Section: "0", Item: Item{"row", "1"}}, ""},
		{Citation{Section: "0", Item: Item{"row", "0"}}, "row 0 cited"},
		{Citation{Section: "1.1", Item: Item{"check", "A"}}, ""},
		{Citation{Section: "1.1", Item: Item{"check", "B"}}, `a.md §1.1 has no "Check B"`},
		{Citation{Section: "1.1", Title: "Sign of the weights [C]"}, ""},
		{Citation{Section: "1.1", Title: "sign of  the WEIGHTS [c]"}, ""},
		{Citation{Section: "2", Title: "Sign of the weights [C]"}, `a.md §2 has no item "Sign of the weights [C]"`},
		{Citation{Title: "Doubts"}, ""},
		{Citation{Title: "Effect of ε"}, `a.md has no item "Effect of ε"`},
		{Citation{Section: "1.1", Item: Item{"line", "1"}}, `unknown sub-item kind "line"`},
	}
	for _, c := range cases {
		t.Run(fmt.Sprintf("§%s %v %q", c.c.Section, c.c.Item, c.c.Title), func(t *testing.T) {
			t.Parallel()
			err := s.Check(c.c)
			switch {
			case c.want == "" && err != nil:
				t.Errorf("Check: %v, want nil", err)
			case c.want != "" && (err == nil || !strings.Contains(err.Error(), c.want)):
				t.Errorf("Check: %v, want an error with %q", err, c.want)
			}
		})
	}
}
