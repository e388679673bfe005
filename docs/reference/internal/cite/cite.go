package cite

import (
	"bytes"
	"path"
	"regexp"
	"sort"
	"strings"
	"unicode/utf8"
)

// Dir is the folder of the sheets as the project cites it, from the root
// of the repository.
const Dir = "docs/reference/"

// Form is how a citation names its sheet.
type Form int

const (
	// Target names the sheet by its path in the repository:
	// docs/reference/plant-checks.md §3.6.
	Target Form = iota
	// Name gives the sheet's file name alone: plant-checks.md §3.6.
	Name
	// SharedPath gives a path into the shared set the copies came from:
	// shared/reference/heat-transfer.md, ../shared/reference/README.md,
	// reference/README.md.
	SharedPath
	// Phrase names a sheet in words: "reference README §3", "the
	// plant-checks reference sheet".
	Phrase
	// Chained is a further section right after another citation:
	// the §11 of "§2.1 [C], §11 item 4". Its sheet is that citation's.
	Chained
	// Implicit is a bare section sign; its sheet is the one named last
	// before it in the same file.
	Implicit
)

var formNames = [...]string{
	Target:     "target",
	Name:       "name",
	SharedPath: "shared-path",
	Phrase:     "phrase",
	Chained:    "chained",
	Implicit:   "implicit",
}

func (f Form) String() string {
	if f < 0 || int(f) >= len(formNames) {
		return "form(?)"
	}
	return formNames[f]
}

// Item is a sub-item named after a section: Kind "item" (also written
// "#N"), "row" or "check", and its Label ("4", "A").
type Item struct {
	Kind, Label string
}

func (it Item) String() string {
	if it.Kind == "" {
		return ""
	}
	return it.Kind + " " + it.Label
}

// Citation is one citation of a sheet: a section of it, or the sheet alone.
type Citation struct {
	File    string // the file name given to Extract
	Line    int    // 1-based: where the sheet is named, or of the section sign for Chained and Implicit
	Sheet   string // the sheet's file name: "plant-checks.md"
	Section string // "3.6"; empty when the sheet is cited without a section
	Item    Item   // the sub-item after the section, if any
	Title   string // the quoted words before the sheet naming an item, if any
	Tag     string // the tag after the section as written ("[C]"), if any
	Form    Form
	Via     Form   // for Chained: the form of the first citation of the chain; else Form
	Text    string // the citation as written, line breaks and comment leaders removed

	// Start and End are the byte offsets in the source of the text that
	// names the sheet (what Rewrite replaces). For Chained and Implicit
	// both are the offset of the section sign.
	Start, End int
}

// Explicit reports whether the citation is in the target form, itself or
// as a further section of a citation in the target form.
func (c Citation) Explicit() bool {
	return c.Form == Target || (c.Form == Chained && c.Via == Target)
}

// Options tell Extract what to look for.
type Options struct {
	// Sheets are the file names of the known sheets ("plant-checks.md").
	// A known sheet's name is a citation even without a section or a
	// path; README.md never is, without one or the other.
	Sheets []string
	// NoImplicit turns off implicit citations (for the sheets themselves,
	// whose bare section signs refer to their own sections).
	NoImplicit bool
}

// OtherSources are sources, other than the sheets, whose sections the
// code cites with a section sign. A bare section sign whose preceding text
// (back to the last sheet named, at most 80 bytes) names one of them is
// not a citation of a sheet. A package-level table, never written.
var OtherSources = [...]string{
	"EN 1993-1-2", // Eurocode 3, fire design, §3.4.1.3
	"Poling",      // The Properties of Gases and Liquids
	"Incropera",   // Fundamentals of Heat and Mass Transfer
	"Modest",      // Radiative Heat Transfer
	"Bejan",       // Convection Heat Transfer
	"Higham",      // Accuracy and Stability of Numerical Algorithms
	"Dennis and Schnabel",
}

var (
	leaderGo   = regexp.MustCompile(`^[ \t]*(?://+[ \t]?)?`)
	leaderLua  = regexp.MustCompile(`^[ \t]*(?:--+[ \t]?)?`)
	leaderMD   = regexp.MustCompile(`^[ \t]*(?:>[ \t]?)*`)
	mentionRe  = regexp.MustCompile(`(?:(\.\./)?(shared/|docs/)?reference/)?([A-Za-z0-9][A-Za-z0-9_-]*\.md)\b`)
	readmeRe   = regexp.MustCompile(`\breference\s+README\b`)
	sheetWords = regexp.MustCompile(`\b([a-z][a-z0-9]*(?:-[a-z0-9]+)+)\s+reference\s+sheet\b`)
	sectionRe  = regexp.MustCompile(`§[ \t]?(\d+(?:\.\d+)*)`)
	bookSecRe  = regexp.MustCompile(`^-\d`)
	qualRe     = regexp.MustCompile(`^[ \t]*((?i:item|row|check)|#)[ \t]*([0-9]+|[A-Z])\b`)
	tagRe      = regexp.MustCompile(`^[ \t]*(\[[^\]\n]{1,60}\])`)
	titleRe    = regexp.MustCompile("\"([^\"\n]{2,80})\"\\s+(?:of|in)\\s+`?$")
	leadRe     = regexp.MustCompile("^`?\\s*")
	sentenceRe = regexp.MustCompile(`[.!?]\s`)
)

// text is a source with the comment leaders of its lines removed and the
// lines joined, so that a citation may run over a line break.
type text struct {
	j      string
	jStart []int // start in j of each line
	oStart []int // start in the source of the same content
}

func newText(file string, src []byte) *text {
	leader := leaderMD
	switch path.Ext(file) {
	case ".go":
		leader = leaderGo
	case ".lua":
		leader = leaderLua
	}
	t := &text{}
	var b strings.Builder
	b.Grow(len(src))
	off := 0
	for off <= len(src) {
		end := bytes.IndexByte(src[off:], '\n')
		if end < 0 {
			end = len(src)
		} else {
			end += off
		}
		line := src[off:end]
		n := len(leader.Find(line))
		t.jStart = append(t.jStart, b.Len())
		t.oStart = append(t.oStart, off+n)
		b.Write(line[n:])
		b.WriteByte('\n')
		off = end + 1
	}
	t.j = b.String()
	return t
}

// index returns the line (0-based) of offset off of the joined text.
func (t *text) index(off int) int {
	return sort.Search(len(t.jStart), func(i int) bool { return t.jStart[i] > off }) - 1
}

func (t *text) orig(off int) int {
	i := t.index(off)
	return t.oStart[i] + off - t.jStart[i]
}

func (t *text) line(off int) int { return t.index(off) + 1 }

// mention is a place where a sheet is named.
type mention struct {
	start, end int // of the text naming the sheet, in the joined text
	sheet      string
	form       Form
	title      string
}

// section is a section sign and its number, with the sub-item and tag
// after it.
type section struct {
	start, end int // from the section sign to the end of the number
	tail       int // end of the sub-item and tag
	num        string
	item       Item
	tag        string
	used       bool
}

// Extract returns the citations of sheets in src, the contents of file
// (whose extension chooses the comment leader: .go, .lua, else Markdown),
// in the order they appear.
func Extract(file string, src []byte, opt Options) []Citation {
	t := newText(file, src)
	known := make(map[string]bool, len(opt.Sheets))
	for _, s := range opt.Sheets {
		known[s] = true
	}
	ss := sections(t.j)
	ms := mentions(t.j, known)
	// A name that starts inside a section number ("§0.md") is not a mention.
	kept := ms[:0]
	for _, m := range ms {
		k := sort.Search(len(ss), func(k int) bool { return ss[k].end > m.start })
		if k < len(ss) && ss[k].start <= m.start {
			continue
		}
		kept = append(kept, m)
	}
	ms = kept

	// The section right after each mention is its first section.
	heads := make(map[int]int, len(ms)) // mention index -> section index
	for i, m := range ms {
		after := m.end + len(leadRe.FindString(t.j[m.end:]))
		k := sort.Search(len(ss), func(k int) bool { return ss[k].start >= after })
		if k < len(ss) && ss[k].start == after {
			heads[i] = k
			ss[k].used = true
		}
	}

	var out []Citation
	cite := func(c Citation, from, to int) {
		c.File = file
		c.Text = strings.Join(strings.Fields(t.j[from:to]), " ")
		out = append(out, c)
	}
	var (
		ctx     = -1 // the mention named last
		prev    *Citation
		prevEnd int
		mi, si  int
	)
	for mi < len(ms) || si < len(ss) {
		if mi < len(ms) && (si >= len(ss) || ms[mi].start < ss[si].start) {
			m := ms[mi]
			c := Citation{
				Line: t.line(m.start), Sheet: m.sheet, Title: m.title,
				Form: m.form, Via: m.form,
				Start: t.orig(m.start), End: t.orig(m.end),
			}
			if k, ok := heads[mi]; ok {
				s := ss[k]
				c.Section, c.Item, c.Tag = s.num, s.item, s.tag
				cite(c, m.start, s.tail)
				prev, prevEnd = &out[len(out)-1], s.tail
			} else {
				cite(c, m.start, m.end)
				prev = nil
			}
			ctx = mi
			mi++
			continue
		}
		s := ss[si]
		si++
		if s.used {
			continue
		}
		switch {
		case prev != nil && chainable(t.j[prevEnd:s.start]):
			c := Citation{
				Line: t.line(s.start), Sheet: prev.Sheet,
				Section: s.num, Item: s.item, Tag: s.tag,
				Form: Chained, Via: prev.Via,
				Start: t.orig(s.start), End: t.orig(s.start),
			}
			cite(c, s.start, s.tail)
			prev, prevEnd = &out[len(out)-1], s.tail
		case ctx >= 0 && !opt.NoImplicit && !otherSource(t.j, ms[ctx].end, s.start):
			c := Citation{
				Line: t.line(s.start), Sheet: ms[ctx].sheet,
				Section: s.num, Item: s.item, Tag: s.tag,
				Form: Implicit, Via: Implicit,
				Start: t.orig(s.start), End: t.orig(s.start),
			}
			cite(c, s.start, s.tail)
			prev, prevEnd = &out[len(out)-1], s.tail
		default:
			prev = nil
		}
	}
	return out
}

func mentions(j string, known map[string]bool) []mention {
	var ms []mention
	for _, loc := range mentionRe.FindAllStringSubmatchIndex(j, -1) {
		start, end := loc[0], loc[1]
		name := j[loc[6]:loc[7]]
		prefixed := loc[6] > start
		if !prefixed && start > 0 {
			r, _ := utf8.DecodeLastRuneInString(j[:start])
			if r == '/' || r == '.' || r == '-' || r == '_' || isAlnum(r) {
				continue // part of another path or name
			}
		}
		after := end + len(leadRe.FindString(j[end:]))
		hasSection := strings.HasPrefix(j[after:], "§")
		form := Name
		switch {
		case prefixed && loc[4] >= 0 && j[loc[4]:loc[5]] == "docs/":
			form = Target // also ../docs/reference/, a relative link to the same folder
		case prefixed:
			form = SharedPath
		case hasSection:
		case known[name] && name != "README.md":
		default:
			continue
		}
		ms = append(ms, mention{start: start, end: end, sheet: name, form: form, title: title(j, start)})
	}
	for _, loc := range readmeRe.FindAllStringIndex(j, -1) {
		if strings.HasPrefix(j[loc[1]:], ".md") {
			continue // "reference README.md": the file name is the mention
		}
		ms = append(ms, mention{start: loc[0], end: loc[1], sheet: "README.md", form: Phrase, title: title(j, loc[0])})
	}
	for _, loc := range sheetWords.FindAllStringSubmatchIndex(j, -1) {
		// The span is the name only, so that a rewrite stays on its line.
		ms = append(ms, mention{start: loc[2], end: loc[3], sheet: j[loc[2]:loc[3]] + ".md", form: Phrase, title: title(j, loc[0])})
	}
	sort.Slice(ms, func(a, b int) bool { return ms[a].start < ms[b].start })
	return ms
}

func isAlnum(r rune) bool {
	return r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r >= '0' && r <= '9'
}

// title returns the quoted words right before a mention ("…" of sheet).
func title(j string, start int) string {
	from := max(0, start-120)
	for from > 0 && !utf8.RuneStart(j[from]) {
		from--
	}
	m := titleRe.FindStringSubmatch(j[from:start])
	if m == nil {
		return ""
	}
	return m[1]
}

func sections(j string) []section {
	var ss []section
	for _, loc := range sectionRe.FindAllStringSubmatchIndex(j, -1) {
		if bookSecRe.MatchString(j[loc[1]:]) {
			continue // §9-5: a book's chapter and section
		}
		s := section{start: loc[0], end: loc[1], tail: loc[1], num: j[loc[2]:loc[3]]}
		for range 2 {
			rest := j[s.tail:]
			if m := qualRe.FindStringSubmatchIndex(rest); m != nil && s.item.Kind == "" {
				kind := strings.ToLower(rest[m[2]:m[3]])
				if kind == "#" {
					kind = "item"
				}
				s.item = Item{Kind: kind, Label: rest[m[4]:m[5]]}
				s.tail += m[1]
			} else if m := tagRe.FindStringSubmatchIndex(rest); m != nil && s.tag == "" {
				s.tag = rest[m[2]:m[3]]
				s.tail += m[1]
			}
		}
		ss = append(ss, s)
	}
	return ss
}

// chainable reports whether the text between a citation and the next
// section sign joins the two: short, without a bracket or a sentence end.
func chainable(between string) bool {
	return utf8.RuneCountInString(between) <= 40 &&
		!strings.ContainsAny(between, "()") &&
		!sentenceRe.MatchString(between)
}

// otherSource reports whether the text before a bare section sign, back to
// the last sheet named and at most 80 bytes, names one of OtherSources.
func otherSource(j string, ctxEnd, at int) bool {
	from := max(ctxEnd, at-80)
	w := j[from:at]
	for _, s := range OtherSources {
		if strings.Contains(w, s) {
			return true
		}
	}
	return false
}

// Rewrite returns src with every citation of cs that is not in the target
// form rewritten to it, and the number rewritten. cs must come from Extract
// on the same src. The sheet's file name or shared path becomes
// docs/reference/<sheet>; "reference README" becomes
// docs/reference/README.md; in "<name> reference sheet" the name becomes
// docs/reference/<name>.md; an implicit section gets docs/reference/<sheet>
// and a space before its section sign. Chained sections follow their
// first citation and are left alone. Go sources are not reformatted here.
func Rewrite(src []byte, cs []Citation) ([]byte, int) {
	type edit struct {
		start, end int
		with       string
		cite       int // index in cs
	}
	var es []edit
	for ci, c := range cs {
		var with string
		switch c.Form {
		case Name, SharedPath:
			with = Dir + c.Sheet
		case Phrase:
			written := string(src[c.Start:c.End])
			switch {
			case c.Sheet != "README.md":
				with = Dir + c.Sheet // the name of "<name> reference sheet"
			case !strings.Contains(written, "\n"):
				with = Dir + "README.md"
			default:
				// "reference README" runs over a line break: drop
				// "reference" (and the blanks before it) at the end of the
				// first line, keep the line break and its comment leader,
				// and rewrite "README".
				from := c.Start
				for from > 0 && (src[from-1] == ' ' || src[from-1] == '\t') {
					from--
				}
				nl := strings.IndexByte(written, '\n')
				i := strings.LastIndex(written, "README")
				es = append(es,
					edit{from, c.Start + nl, "", ci},
					edit{c.Start + i, c.Start + i + len("README"), Dir + "README.md", ci})
				continue
			}
		case Implicit:
			with = Dir + c.Sheet + " "
		default:
			continue
		}
		es = append(es, edit{c.Start, c.End, with, ci})
	}
	sort.Slice(es, func(a, b int) bool { return es[a].start < es[b].start })
	var b strings.Builder
	b.Grow(len(src) + 32*len(es))
	last := 0
	done := map[int]bool{}
	for _, e := range es {
		if e.start < last || e.end > len(src) || e.start > e.end {
			continue // overlapping or out of range: cs is not from this src
		}
		b.Write(src[last:e.start])
		b.WriteString(e.with)
		last = e.end
		done[e.cite] = true
	}
	b.Write(src[last:])
	return []byte(b.String()), len(done)
}
