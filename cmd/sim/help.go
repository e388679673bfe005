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
	fmt.Fprintf(w, "\nUse \"sim help <command>\" for more about a command.\n\n%s\n\n%s\n", mainDemo, caution)
}

// writeUsage writes the usage lines of c.
func writeUsage(w io.Writer, c *command) {
	for i, l := range strings.Split(c.UsageLine, "\n") {
		if i == 0 {
			fmt.Fprintf(w, "usage: sim %s %s\n", c.Name, l)
		} else {
			fmt.Fprintf(w, "       sim %s %s\n", c.Name, l)
		}
	}
}

func writeCommandHelp(w io.Writer, c *command) {
	writeUsage(w, c)
	fmt.Fprintf(w, "\n%s\n", strings.TrimSpace(c.Long))
	if c.Flags != nil {
		fmt.Fprintf(w, "\nFlags:\n\n")
		writeFlags(w, c.Flags())
	}
	fmt.Fprintf(w, "\n%s\n", caution)
}

// writeFlags lists a flag set as "--name ARG" and its usage, which may run
// over several lines; the word in back quotes in the usage names the
// argument, as flag.UnquoteUsage reads it.
func writeFlags(w io.Writer, fs *flag.FlagSet) {
	fs.VisitAll(func(f *flag.Flag) {
		arg, usage := flag.UnquoteUsage(f)
		if arg == "value" && isBoolFlag(f) {
			arg = ""
		}
		head := "--" + f.Name
		if arg != "" {
			head += " " + arg
		}
		fmt.Fprintf(w, "  %s\n", head)
		for _, l := range strings.Split(usage, "\n") {
			fmt.Fprintf(w, "\t%s\n", l)
		}
	})
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
