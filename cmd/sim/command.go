package main

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"io"
	"strconv"
	"strings"

	"steamcase/scripting"
)

// Exit statuses.
const (
	exitOK    = 0
	exitFail  = 1 // the command ran and failed
	exitUsage = 2 // the command line was wrong
)

// env is what a command may touch: its output streams.
type env struct {
	stdout, stderr io.Writer
}

// command is one entry of the command table.
type command struct {
	// Name is the word that selects the command: "steam".
	Name string
	// UsageLine lists the arguments after the name, one form per line.
	UsageLine string
	// Short is the one-line summary shown in the command list.
	Short string
	// Long is the help text in full sentences, shown by "sim help NAME".
	// It ends with examples; the flags are listed after it from Flags.
	Long string
	// Flags returns a fresh flag set of the command, for help; nil if it
	// takes none. Run builds its own set the same way.
	Flags func() *flag.FlagSet
	// Run runs the command with the arguments after its name. A
	// *usageError means the command line was wrong (exit 2); any other
	// error is a failure (exit 1).
	Run func(ctx context.Context, e env, args []string) error
}

// commands returns the command table, in the order help lists it.
func commands() []*command {
	return []*command{
		runCommand(),
		checkCommand(),
		steamCommand(),
		fluegasCommand(),
		helpCommand(),
	}
}

func findCommand(name string) *command {
	for _, c := range commands() {
		if c.Name == name {
			return c
		}
	}
	return nil
}

// usageError is a mistake on the command line. Values the user gave that
// the message repeats may be listed in echoes, to be cut when long.
type usageError struct {
	msg    string
	echoes []string
}

func (e *usageError) Error() string { return e.msg }

func usagef(format string, args ...any) error {
	return &usageError{msg: fmt.Sprintf(format, args...)}
}

// run is main without the process: it reads args (without the program
// name), writes to stdout and stderr, and returns the exit status.
func run(ctx context.Context, args []string, stdout, stderr io.Writer) int {
	e := env{stdout: stdout, stderr: stderr}
	if len(args) == 0 {
		return runDefault(ctx, e) // the built-in demo, or the help
	}
	name := args[0]
	switch name {
	case "-h", "-help", "--help":
		writeMainHelp(stdout)
		return exitOK
	case "-version", "--version":
		if len(args) > 1 {
			fmt.Fprintf(stderr, "sim: %s takes no arguments; got %s\n", name, escapeText(strconv.Quote(args[1])))
			return exitUsage
		}
		fmt.Fprintf(stdout, "sim %s\n", version())
		return exitOK
	}
	c := findCommand(name)
	if c == nil {
		if strings.HasPrefix(name, "-") {
			fmt.Fprintf(stderr, "sim: flag %s given before a command; the flags belong to a command, such as: sim steam %s ...\n", name, name)
		} else {
			fmt.Fprintf(stderr, "sim: unknown command %q\n", name)
		}
		fmt.Fprintln(stderr, "Run 'sim help' for the list of commands.")
		return exitUsage
	}
	err := c.Run(ctx, e, args[1:])
	var ue *usageError
	var re *reportedError
	var fe *scripting.FileError
	switch {
	case err == nil:
		return exitOK
	case errors.As(err, &re):
		return exitFail // the command wrote its errors
	case errors.Is(err, flag.ErrHelp):
		writeCommandHelp(stdout, c)
		return exitOK
	case errors.As(err, &ue):
		fmt.Fprintf(stderr, "sim %s: %s\n", c.Name, escapeText(shortenEchoes(ue.msg, nil, ue.echoes...)))
		writeUsage(stderr, c)
		fmt.Fprintf(stderr, "Run 'sim help %s' for details.\n", c.Name)
		return exitUsage
	case errors.As(err, &fe):
		fmt.Fprintf(stderr, "sim: %s\n", message(fe)) // sim: cannot open nosuch.lua: no such file
		return exitFail
	case errors.Is(err, context.Canceled) && c.Name == "run":
		fmt.Fprintf(stderr, "sim run: interrupted before the end; no report or chart was written\n")
		return exitFail
	case errors.Is(err, context.Canceled) && c.Name == "check":
		fmt.Fprintf(stderr, "sim check: interrupted before the end\n")
		return exitFail
	default:
		fmt.Fprintf(stderr, "sim %s: %s\n", c.Name, message(err))
		return exitFail
	}
}

// oneLine keeps an error message on one line.
func oneLine(s string) string {
	return strings.Join(strings.Fields(s), " ")
}

// parseFlags parses args with fs, which must have ContinueOnError set.
// Flag errors become usage errors; -h and --help return flag.ErrHelp.
// Arguments left over are an error: no command takes positional ones yet.
func parseFlags(fs *flag.FlagSet, args []string) error {
	fs.SetOutput(io.Discard)
	fs.Usage = func() {}
	if err := fs.Parse(args); err != nil {
		if errors.Is(err, flag.ErrHelp) {
			return err
		}
		return &usageError{msg: err.Error()}
	}
	if fs.NArg() > 0 {
		return usagef("unexpected argument %q (values go after flags, such as --p \"7 bar(g)\"; quote values that contain spaces)", fs.Arg(0))
	}
	return nil
}
