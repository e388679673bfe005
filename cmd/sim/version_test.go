package main

import (
	"runtime/debug"
	"testing"
)

func TestVersionOf(t *testing.T) {
	t.Parallel()
	info := func(v string, settings ...string) *debug.BuildInfo {
		bi := &debug.BuildInfo{Main: debug.Module{Path: "steamcase", Version: v}}
		for i := 0; i+1 < len(settings); i += 2 {
			bi.Settings = append(bi.Settings, debug.BuildSetting{Key: settings[i], Value: settings[i+1]})
		}
		return bi
	}
	const rev = "35efefdf3bf8c5c0acd0741b17ffffd79350e5fd"
	for _, c := range []struct {
		name string
		set  string
		bi   *debug.BuildInfo
		ok   bool
		want string
	}{
		{"-ldflags first", "1.4.0", info("v1.3.0", "vcs.revision", rev), true, "1.4.0"},
		{"module version", "", info("v1.3.0"), true, "v1.3.0"},
		{"module version and revision", "", info("v1.3.0", "vcs.revision", rev), true, "v1.3.0 (revision 35efefdf3bf8)"},
		{"a build in the tree", "", info("(devel)", "vcs.revision", rev, "vcs.modified", "true"), true, "devel (revision 35efefdf3bf8, modified)"},
		{"a pseudo-version names its revision", "", info("v0.0.0-20260101120000-35efefdf3bf8", "vcs.revision", rev), true,
			"v0.0.0-20260101120000-35efefdf3bf8"},
		{"nothing recorded", "", info("(devel)"), true, "devel"},
		{"no build information", "", nil, false, "devel"},
	} {
		if got := versionOf(c.set, c.bi, c.ok); got != c.want {
			t.Errorf("%s: versionOf = %q, want %q", c.name, got, c.want)
		}
	}
}

func TestVersionFlag(t *testing.T) {
	t.Parallel()
	for _, arg := range []string{"--version", "-version"} {
		code, out, errOut := runSim(t, arg)
		if code != exitOK || out != "sim "+version()+"\n" || errOut != "" {
			t.Errorf("sim %s: exit %d, stdout %q, stderr %q", arg, code, out, errOut)
		}
	}
}
