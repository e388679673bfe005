package main

import (
	"flag"
	"strings"
	"testing"
)

// TestHelpLayout checks every help text: no line wider than 80 columns
// (tabs to 8), except the examples of a command written to be pasted
// whole; and each flag listed as the usage line types it ("-o FILE" for
// run, "--p PRESSURE" for steam).
func TestHelpLayout(t *testing.T) {
	t.Parallel()
	topics := [][]string{{"help"}}
	for _, c := range commands() {
		topics = append(topics, []string{"help", c.Name})
	}
	for _, args := range topics {
		_, out, _ := runSim(t, args...)
		for i, l := range strings.Split(out, "\n") {
			if width(l) <= helpWidth {
				continue
			}
			example := strings.HasPrefix(l, "\tsim ")
			if !example || len(args) == 1 || args[1] == "run" || args[1] == "check" || args[1] == "steam" {
				t.Errorf("sim %s, line %d is %d columns: %q", strings.Join(args, " "), i+1, width(l), l)
			}
		}
	}
	for _, c := range commands() {
		if c.Flags == nil {
			continue
		}
		_, out, _ := runSim(t, "help", c.Name)
		c.Flags().VisitAll(func(f *flag.Flag) {
			spelled := flagSpelling(f.Name, c.UsageLine)
			if !strings.Contains(out, "\n  "+spelled+"\n") && !strings.Contains(out, "\n  "+spelled+" ") {
				t.Errorf("sim help %s does not list %s", c.Name, spelled)
			}
			other := "-" + spelled
			if strings.HasPrefix(spelled, "--") {
				other = spelled[1:]
			}
			if strings.Contains(out, "\n  "+other+"\n") || strings.Contains(out, "\n  "+other+" ") {
				t.Errorf("sim help %s lists %s as %s", c.Name, spelled, other)
			}
		})
	}
	for _, c := range []struct{ name, usage, want string }{
		{"o", "[-o FILE] [--timeout D]", "-o"},
		{"v", "[-v | --quiet]", "-v"},
		{"o2", "(--o2 PERCENT | --co2 PERCENT)", "--o2"},
		{"p", "--p PRESSURE (--t T)", "--p"},
		{"json", "[--json]", "--json"},
		{"x", "--p P", "--x"}, // not in the usage line
	} {
		if got := flagSpelling(c.name, c.usage); got != c.want {
			t.Errorf("flagSpelling(%q, %q) = %q, want %q", c.name, c.usage, got, c.want)
		}
	}
}

func TestWrapWords(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		s     string
		max   int
		usage bool
		want  []string
	}{
		{"short", 10, false, []string{"short"}},
		{"one two three four", 9, false, []string{"one two", "three", "four"}},
		{`such as "7 bar(g)" or "8 bar(a)"`, 12, false, []string{"such as", `"7 bar(g)"`, "or", `"8 bar(a)"`}},
		{"--p P (--t T | --h H) [--json]", 14, true, []string{"--p P", "(--t T | --h H)", "[--json]"}},
		{"--gas TEMPERATURE --air TEMPERATURE", 20, true, []string{"--gas TEMPERATURE", "--air TEMPERATURE"}},
		{"unbreakable-word-longer-than-max", 5, false, []string{"unbreakable-word-longer-than-max"}},
	} {
		breaks := quoteBreaks
		if c.usage {
			breaks = usageBreaks
		}
		got := wrapWords(c.s, c.max, breaks)
		if strings.Join(got, "|") != strings.Join(c.want, "|") {
			t.Errorf("wrapWords(%q, %d) = %q, want %q", c.s, c.max, got, c.want)
		}
	}
}
