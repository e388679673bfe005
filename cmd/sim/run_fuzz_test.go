package main

import (
	"errors"
	"flag"
	"strings"
	"testing"
	"time"
)

// FuzzRunArgs parses arbitrary command lines of run and check: the parse
// must not panic, must fail only with a usage error or a request for help,
// and on success must give at least one script, a time limit in range and
// not both forms of the report.
func FuzzRunArgs(f *testing.F) {
	f.Add("run", "--json\x00a.lua\x00-o\x00out.json")
	f.Add("run", "a.lua\x00--plot\x00x.svg\x00b.lua\x00--\x00-c.lua")
	f.Add("check", "--timeout\x001m\x00-v\x00a.lua")
	f.Add("run", "--csv\x00--json")
	f.Add("check", "--\x00--\x00")
	f.Fuzz(func(t *testing.T, name, joined string) {
		if name != "run" {
			name = "check"
		}
		args := strings.Split(joined, "\x00")
		var a runArgs
		scripts, err := a.parse(name, args)
		if err != nil {
			var ue *usageError
			if !errors.As(err, &ue) && !errors.Is(err, flag.ErrHelp) {
				t.Fatalf("%s %q: error %T %v is not a usage error", name, args, err, err)
			}
			return
		}
		if len(scripts) == 0 || a.timeout <= 0 || a.timeout > 24*time.Hour || (a.json && a.csv) || (a.verbose && a.quiet) {
			t.Fatalf("%s %q: accepted %q with %+v", name, args, scripts, a)
		}
	})
}
