package main

import (
	"context"
	"flag"
	"fmt"
	"io"
	"strings"
	"text/tabwriter"
)

// caution is the safety note every report and help text carries.
const caution = `Caution: boilers can kill. steamcase gives planning and audit estimates.
They are not a substitute for the boiler and burner makers' manuals, class
and flag-state rules, or licensed engineering practice; where they differ,
those govern, and local codes come first.`

// cautionLine is the caution on one line, printed after results.
const cautionLine = "Caution: planning and audit estimate only; the makers' manuals, class and flag rules and licensed practice govern, and local codes come first."

const mainIntro = `sim is the command line of steamcase, a steady-state heat and mass balance
engine for a ship's steam plant. Water and steam properties follow
IAPWS-IF97. Quantities are written with their units, such as "7 bar(g)",
"250 C", "18 t/h" or "2768 kJ/kg"; pressures must say gauge or absolute.`

const mainDemo = `With no arguments, sim runs its built-in demo: the load cases of an
invented product tanker, solved and reported. Its scripts are in the
scenarios folder of the source, to read and to run with "sim run".`

func writeMainHelp(w io.Writer) {
	fmt.Fprintf(w, "%s\n\nUsage:\n\n\tsim <command> [flags]\n\nThe commands are:\n\n", mainIntro)
	tw := tabwriter.NewWriter(w, 0, 8, 3, ' ', 0)
	for _, c := range commands() {
		fmt.Fprintf(tw, "\t%s\t%s\n", c.Name, c.Short)
	}
	tw.Flush()
	fmt.Fprintf(w, "\nUse \"sim help <command>\" for more about a command, \"sim --version\" for the\nversion of sim.\n\n%s\n\n%s\n", mainDemo, caution)
}

// helpWidth is the width, in columns, that help text is wrapped to.
const helpWidth = 80

// writeUsage writes the usage lines of c, each wrapped to helpWidth
// between its groups of options (never inside brackets or parentheses),
// the rest indented under the first.
func writeUsage(w io.Writer, c *command) {
	for i, l := range strings.Split(c.UsageLine, "\n") {
		head := "usage: sim " + c.Name + " "
		if i > 0 {
			head = "       sim " + c.Name + " "
		}
		indent := strings.Repeat(" ", len(head))
		for j, part := range wrapWords(l, helpWidth-len(head), usageBreaks) {
			if j == 0 {
				fmt.Fprintf(w, "%s%s\n", head, part)
			} else {
				fmt.Fprintf(w, "%s%s\n", indent, part)
			}
		}
	}
}

func writeCommandHelp(w io.Writer, c *command) {
	writeUsage(w, c)
	fmt.Fprintf(w, "\n%s\n", wrapText(strings.TrimSpace(c.Long)))
	if c.Flags != nil {
		fmt.Fprintf(w, "\nFlags:\n\n")
		writeFlags(w, c.Flags(), c.UsageLine)
	}
	fmt.Fprintf(w, "\n%s\n", caution)
}

// writeFlags lists a flag set as each flag is typed ("--name ARG", or
// "-o FILE" where the usage line writes the flag with one dash) and its
// usage, which may run over several lines and is wrapped to helpWidth;
// the word in back quotes in the usage names the argument, as
// flag.UnquoteUsage reads it.
func writeFlags(w io.Writer, fs *flag.FlagSet, usageLine string) {
	fs.VisitAll(func(f *flag.Flag) {
		arg, usage := flag.UnquoteUsage(f)
		if arg == "value" && isBoolFlag(f) {
			arg = ""
		}
		head := flagSpelling(f.Name, usageLine)
		if arg != "" {
			head += " " + arg
		}
		fmt.Fprintf(w, "  %s\n", head)
		for _, l := range flagLines(usage) {
			fmt.Fprintf(w, "\t%s\n", l)
		}
	})
}

// flagLines are the lines of a flag's usage, shown after a tab: its own
// lines if each fits in helpWidth, else the whole text reflowed.
func flagLines(usage string) []string {
	lines := strings.Split(usage, "\n")
	fits := true
	for _, l := range lines {
		if width("\t"+l) > helpWidth {
			fits = false
		}
	}
	if fits {
		return lines
	}
	return wrapWords(strings.Join(strings.Fields(usage), " "), helpWidth-8, quoteBreaks)
}

// flagSpelling is the flag name as the usage line types it: "-o" where
// it writes "-o", "--" otherwise (the flag package takes either).
func flagSpelling(name, usageLine string) string {
	for i := 0; ; {
		j := strings.Index(usageLine[i:], "-"+name)
		if j < 0 {
			return "--" + name
		}
		j += i
		end := j + 1 + len(name)
		endOK := end == len(usageLine) || !isNameByte(usageLine[end])
		if endOK && (j == 0 || strings.ContainsRune(" [(|", rune(usageLine[j-1]))) {
			return "-" + name
		}
		if endOK && j > 0 && usageLine[j-1] == '-' {
			return "--" + name
		}
		i = end
	}
}

func isNameByte(c byte) bool {
	return c == '-' || c == '_' || c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || c >= '0' && c <= '9'
}

// wrapText wraps the lines of prose in a help text that are wider than
// helpWidth, at a space, under their own indent. An example (a line that
// starts with a tab) is left whole, to be pasted as it is.
func wrapText(text string) string {
	lines := strings.Split(text, "\n")
	var out []string
	for _, l := range lines {
		if width(l) <= helpWidth || strings.HasPrefix(l, "\t") {
			out = append(out, l)
			continue
		}
		indent := l[:len(l)-len(strings.TrimLeft(l, " "))]
		for _, p := range wrapWords(l[len(indent):], helpWidth-width(indent), quoteBreaks) {
			out = append(out, indent+p)
		}
	}
	return strings.Join(out, "\n")
}

// width is the columns of a line, with tabs to the next multiple of 8.
func width(s string) int {
	n := 0
	for _, r := range s {
		if r == '\t' {
			n += 8 - n%8
		} else {
			n++
		}
	}
	return n
}

// usageBreaks reports, for each byte of s, whether the line may break at
// that space: outside brackets, parentheses and quotes.
func usageBreaks(s string) []bool { return breaks(s, true) }

// quoteBreaks allows a break at any space outside double quotes.
func quoteBreaks(s string) []bool { return breaks(s, false) }

// A flag is kept with its value: no break between "--gas" and "250 C"
// or between "--air" and TEMPERATURE.
func breaks(s string, brackets bool) []bool {
	ok := make([]bool, len(s))
	depth, quoted := 0, false
	word := 0 // start of the current word
	for i := 0; i < len(s); i++ {
		switch c := s[i]; {
		case c == '"':
			quoted = !quoted
		case quoted:
		case brackets && (c == '[' || c == '('):
			depth++
		case brackets && (c == ']' || c == ')'):
			depth--
		case c == ' ':
			flagBefore := s[word] == '-' || (word+1 < len(s) && strings.ContainsRune("[(", rune(s[word])) && s[word+1] == '-')
			valueAfter := i+1 < len(s) && (s[i+1] == '"' || s[i+1] >= 'A' && s[i+1] <= 'Z')
			ok[i] = depth <= 0 && !(flagBefore && valueAfter)
			word = i + 1
		}
	}
	return ok
}

// wrapWords cuts s into parts of at most max columns at the spaces that
// breakable allows; a part with no such space is left long.
func wrapWords(s string, max int, breakable func(string) []bool) []string {
	if width(s) <= max {
		return []string{s}
	}
	var parts []string
	for width(s) > max {
		ok := breakable(s)
		cut := -1
		for i := range ok {
			if ok[i] && width(s[:i]) <= max {
				cut = i
			}
		}
		if cut <= 0 {
			for i := range ok { // nothing fits: break at the first space allowed
				if ok[i] && i > 0 {
					cut = i
					break
				}
			}
		}
		if cut <= 0 {
			break
		}
		parts = append(parts, strings.TrimRight(s[:cut], " "))
		s = strings.TrimLeft(s[cut:], " ")
	}
	return append(parts, s)
}

func isBoolFlag(f *flag.Flag) bool {
	b, ok := f.Value.(interface{ IsBoolFlag() bool })
	return ok && b.IsBoolFlag()
}

func helpCommand() *command {
	return &command{
		Name:      "help",
		UsageLine: "[command]",
		Short:     "show help for a command",
		Long: `Help prints the help of the command named, or, with no command, the list
of commands. "sim --help" and "sim <command> --help" print the same texts.`,
		Run: runHelp,
	}
}

func runHelp(_ context.Context, e env, args []string) error {
	switch len(args) {
	case 0:
		writeMainHelp(e.stdout)
		return nil
	case 1:
		c := findCommand(args[0])
		if c == nil {
			return usagef("unknown help topic %q; the commands are: %s", args[0], commandNames())
		}
		writeCommandHelp(e.stdout, c)
		return nil
	}
	return usagef("help takes one command name; got %d arguments", len(args))
}

func commandNames() string {
	var names []string
	for _, c := range commands() {
		names = append(names, c.Name)
	}
	return strings.Join(names, ", ")
}
