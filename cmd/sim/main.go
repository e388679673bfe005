// Command sim is the command line of steamcase: a steady-state heat and mass
// balance engine for a ship's steam plant.
//
// Run "sim help" for the commands, "sim --version" for the version (see
// version.go). Results go to standard output; errors go to standard error
// as one line naming what was wrong. The exit status is 0
// on success, 2 for a usage error (unknown command or flag, a missing or
// malformed value) and 1 for any other failure (a state outside the range of
// the property formulation, say).
package main

import (
	"context"
	"os"
	"os/signal"
)

func main() {
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt)
	code := run(ctx, os.Args[1:], os.Stdout, os.Stderr)
	stop()
	os.Exit(code)
}
