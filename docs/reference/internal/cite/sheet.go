package cite

import (
	"fmt"
	"regexp"
	"strings"
)

// Sheet is a reference sheet split into its numbered sections.
type Sheet struct {
	Name  string
	text  string
	secs  map[string]*sheetSection
	order []string
}

type sheetSection struct {
	level int
	title string
	body  []string // the heading's own line and every line up to the next heading of the same or a higher level
}

var (
	headingRe   = regexp.MustCompile(`^(#{1,6})[ \t]+(\d+(?:\.\d+)*)?\.?[ \t]*(.*)$`)
	separatorRe = regexp.MustCompile(`^\|[ \t:|-]*-[ \t:|-]*$`)
	fenceRe     = regexp.MustCompile("^[ \t]*(```|~~~)")
)

// ParseSheet splits a Markdown sheet into sections: a heading whose text
// starts with a number ("## 3. Boiler efficiency", "### 3.6 Fuel per day")
// opens the section of that number, which runs to the next heading of the
// same or a higher level. Headings inside fenced code blocks are ignored.
func ParseSheet(name string, src []byte) *Sheet {
	s := &Sheet{Name: name, text: string(src), secs: map[string]*sheetSection{}}
	var open []*sheetSection
	fenced := false
	for _, line := range strings.Split(string(src), "\n") {
		if fenceRe.MatchString(line) {
			fenced = !fenced
		}
		if m := headingRe.FindStringSubmatch(line); m != nil && !fenced {
			level := len(m[1])
			for len(open) > 0 && open[len(open)-1].level >= level {
				open = open[:len(open)-1]
			}
			if num := m[2]; num != "" {
				if _, dup := s.secs[num]; !dup {
					sec := &sheetSection{level: level, title: m[3]}
					s.secs[num] = sec
					s.order = append(s.order, num)
					open = append(open, sec)
				}
			}
		}
		for _, sec := range open {
			sec.body = append(sec.body, line)
		}
	}
	return s
}

// Sections returns the section numbers in the order of the sheet.
func (s *Sheet) Sections() []string { return append([]string(nil), s.order...) }

// Title returns the heading text of a section, "" if there is none.
func (s *Sheet) Title(num string) string {
	if sec := s.secs[num]; sec != nil {
		return sec.title
	}
	return ""
}

// Check returns nil if the citation's section, sub-item and quoted words
// exist in the sheet, and otherwise an error saying what is missing. It
// does not look at the sheet's name: the caller picks the sheet.
func (s *Sheet) Check(c Citation) error {
	body := s.text
	where := s.Name
	if c.Section != "" {
		sec := s.secs[c.Section]
		if sec == nil {
			return fmt.Errorf("%s has no §%s (its sections: §%s)", s.Name, c.Section, strings.Join(s.order, ", §"))
		}
		body = strings.Join(sec.body, "\n")
		where = fmt.Sprintf("%s §%s", s.Name, c.Section)
	}
	switch c.Item.Kind {
	case "":
	case "item":
		re := regexp.MustCompile(`(?m)^\|[ \t]*(?:\*\*)?` + regexp.QuoteMeta(c.Item.Label) + `(?:\*\*)?[ \t]*\|`)
		if !re.MatchString(body) {
			return fmt.Errorf("%s has no table row numbered %s (cited as %q)", where, c.Item.Label, c.Item)
		}
	case "row":
		n := len(dataRows(body))
		if want := atoi(c.Item.Label); want < 1 || want > n {
			return fmt.Errorf("%s has %d table rows; row %s cited", where, n, c.Item.Label)
		}
	case "check":
		re := regexp.MustCompile(`(?i)\bcheck[ \t]+` + regexp.QuoteMeta(c.Item.Label) + `\b`)
		if !re.MatchString(plain(body)) {
			return fmt.Errorf("%s has no \"Check %s\"", where, c.Item.Label)
		}
	default:
		return fmt.Errorf("cite: unknown sub-item kind %q", c.Item.Kind)
	}
	if c.Title != "" && !strings.Contains(strings.ToLower(plain(body)), strings.ToLower(plain(c.Title))) {
		return fmt.Errorf("%s has no item %q", where, c.Title)
	}
	return nil
}

// dataRows returns the data rows of the Markdown tables in body: table
// lines other than a header (the line before a separator) and separators.
func dataRows(body string) []string {
	lines := strings.Split(body, "\n")
	var rows []string
	for i, l := range lines {
		t := strings.TrimSpace(l)
		if !strings.HasPrefix(t, "|") || separatorRe.MatchString(t) {
			continue
		}
		if i+1 < len(lines) && separatorRe.MatchString(strings.TrimSpace(lines[i+1])) {
			continue
		}
		rows = append(rows, t)
	}
	return rows
}

// plain removes Markdown emphasis and code marks and collapses white space.
func plain(s string) string {
	s = strings.NewReplacer("**", "", "`", "").Replace(s)
	return strings.Join(strings.Fields(s), " ")
}

func atoi(s string) int {
	n := 0
	for _, r := range s {
		if r < '0' || r > '9' || n > 1e6 {
			return -1
		}
		n = 10*n + int(r-'0')
	}
	return n
}
