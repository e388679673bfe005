package main

import (
	"runtime/debug"
	"strings"
)

// buildVersion is the version given at build time:
//
//	go build -ldflags "-X main.buildVersion=1.4.0" ./cmd/sim
//
// The linker sets it; the program never writes it.
var buildVersion string

// version is the version of this program, for "sim --version" and the
// documents it writes: the one set at build time with -ldflags if any;
// else the module's version and the VCS revision that the go command
// records in the binary (runtime/debug.ReadBuildInfo), such as
// "v1.4.0" or "devel (revision 35efefd1a2b3, modified)"; else "devel".
func version() string {
	bi, ok := debug.ReadBuildInfo()
	return versionOf(buildVersion, bi, ok)
}

// versionOf is version with its inputs given: the -ldflags string and
// the build information, if ok.
func versionOf(set string, bi *debug.BuildInfo, ok bool) string {
	if v := strings.TrimSpace(set); v != "" {
		return v
	}
	if !ok || bi == nil {
		return "devel"
	}
	v := bi.Main.Version
	if v == "" || v == "(devel)" {
		v = "devel"
	}
	var rev, modified string
	for _, s := range bi.Settings {
		switch s.Key {
		case "vcs.revision":
			rev = s.Value
		case "vcs.modified":
			modified = s.Value
		}
	}
	if rev == "" {
		return v
	}
	if len(rev) > 12 {
		rev = rev[:12]
	}
	if strings.Contains(v, rev) {
		// a pseudo-version such as v0.0.0-20260101120000-35efefd1a2b3
		// names the revision already
		rev = ""
	}
	var extra []string
	if rev != "" {
		extra = append(extra, "revision "+rev)
	}
	if modified == "true" {
		extra = append(extra, "modified")
	}
	if len(extra) == 0 {
		return v
	}
	return v + " (" + strings.Join(extra, ", ") + ")"
}
