package main

import (
	"context"
	"errors"
	"fmt"
	"io/fs"
	"time"

	"steamcase/scenarios"
	"steamcase/scripting"
)

// demoFirstLine heads the report of the built-in demo (two lines).
const demoFirstLine = `Built-in demo of an invented ship (no real vessel): its load cases, solved.
Run "sim help" for the commands, "sim run SCRIPT" for your own load cases.`

// demoScript returns the file system and the path in it of the built-in
// demo's script, or nil if there is none.
func demoScript() (fs.FS, string) {
	return scenarios.FS, scenarios.Demo
}

// runDefault is sim without arguments: the built-in demo when there is
// one, the help otherwise. It returns the exit status.
func runDefault(ctx context.Context, e env) int {
	fsys, name := demoScript()
	if fsys == nil {
		writeMainHelp(e.stdout)
		return exitOK
	}
	err := runDemo(ctx, e, fsys, name)
	var re *reportedError
	switch {
	case err == nil:
		return exitOK
	case errors.As(err, &re):
	default:
		fmt.Fprintf(e.stderr, "sim: built-in demo: %s\n", message(err))
	}
	return exitFail
}

// runDemo runs the script name of fsys like "sim run --quiet" and prints
// its report after demoFirstLine.
func runDemo(ctx context.Context, e env, fsys fs.FS, name string) error {
	src, err := fs.ReadFile(fsys, name)
	if err != nil {
		return err
	}
	a := runArgs{timeout: 10 * time.Second, quiet: true}
	runner := func(ctx context.Context, opt scripting.Options) (*scripting.Run, error) {
		return scripting.RunSource(ctx, name, src, fsys, opt)
	}
	return runScripts(ctx, e, &a, &outputs{}, []scriptRunner{runner}, demoFirstLine)
}
