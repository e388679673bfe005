package scripting

import (
	"bytes"
	"context"
	"errors"
	"io/fs"
	"strings"
	"testing"
	"testing/fstest"

	lua "github.com/yuin/gopher-lua"
)

// TestRaisedValues checks the message and position of errors raised with
// a value that is not a string, or without a position.
func TestRaisedValues(t *testing.T) {
	t.Parallel()
	for _, c := range []struct{ src, want string }{
		{"local x = 1\nerror({code = 1})", "e.lua:2: the script raised an error with a table instead of a message: {code = 1}"},
		{"local function f()\n  error({1, \"two\", [10] = true, x = {y = {z = {}}}})\nend\nf()",
			`e.lua:2: the script raised an error with a table instead of a message: {1, "two", [10] = true, x = {y = {z = {…}}}}`},
		{"error(setmetatable({}, { __tostring = function() return \"custom\" end }))",
			`e.lua:1: the script raised an error with a table instead of a message: "custom"`},
		{"\nerror(42)", "e.lua:2: the script raised an error with a number instead of a message: 42"},
		{"error(nil)", "e.lua:1: the script raised an error with no message (error(nil) or error())"},
		{"\n\nerror(\"plain\", 0)", "e.lua:3: plain"},
		{"error(print)", "e.lua:1: the script raised an error with a function instead of a message"},
	} {
		_, err := RunSource(context.Background(), "e.lua", []byte(c.src), nil, Options{})
		if err == nil || err.Error() != c.want {
			t.Errorf("%q: %v\nwant %s", c.src, err, c.want)
		}
	}
}

func TestValueText(t *testing.T) {
	t.Parallel()
	L := lua.NewState(lua.Options{SkipOpenLibs: true})
	defer L.Close()
	big := L.NewTable()
	for i := 1; i <= 40; i++ {
		big.Append(lua.LNumber(i))
	}
	named := L.NewTable()
	named.RawSetString("b", lua.LString("x\r\n"))
	named.RawSetString("a b", lua.LTrue)
	named.RawSetString("a", lua.LNumber(1.5))
	for _, c := range []struct {
		v    lua.LValue
		want string
	}{
		{lua.LString("s"), `"s"`},
		{lua.LNumber(2), "2"},
		{lua.LNil, "nil"},
		{named, `{a = 1.5, ["a b"] = true, b = "x\r\n"}`},
		{big, "{1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16, …}"},
		{lua.LString(strings.Repeat("z", 300)), `"` + strings.Repeat("z", maxValueText-1) + "…"},
	} {
		if got := valueText(c.v); got != c.want {
			t.Errorf("valueText = %q, want %q", got, c.want)
		}
	}
}

// TestReadChecks checks what readFile refuses and skips: a file that
// CheckRead refuses, a folder, and a byte-order mark.
func TestReadChecks(t *testing.T) {
	t.Parallel()
	fsys := fstest.MapFS{
		"plan.csv": {Data: []byte("\xEF\xBB\xBFphase,hours\nport,12\n")},
		"out.csv":  {Data: []byte("phase\n")},
		"sub":      {Mode: fs.ModeDir},
	}
	refuse := func(info fs.FileInfo) error {
		if info.Name() == "out.csv" {
			return errors.New("it is the report's file")
		}
		return nil
	}
	var printed bytes.Buffer
	opt := Options{CheckRead: refuse, Print: &printed}
	for _, c := range []struct{ src, want string }{
		{`local r = read_csv("plan.csv"); print(r[1].phase, r[1].hours)`, ""},
		{`local r = read_csv("out.csv")`, `m.lua:1: read_csv("out.csv"): it is the report's file`},
		{`local r = read_csv("sub")`, `m.lua:1: read_csv("sub"): it is a folder, not a file`},
	} {
		_, err := RunSource(context.Background(), "m.lua", []byte(c.src), fsys, opt)
		got := ""
		if err != nil {
			got = err.Error()
		}
		if got != c.want {
			t.Errorf("%s: %q, want %q", c.src, got, c.want)
		}
	}
	if printed.String() != "port\t12\n" {
		t.Errorf("printed %q; the byte-order mark is not skipped, or print does not reach Options.Print", printed.String())
	}
}

func TestFileError(t *testing.T) {
	t.Parallel()
	_, err := RunFile(context.Background(), "testdata/nosuch.lua", Options{})
	var fe *FileError
	if !errors.As(err, &fe) || err.Error() != "cannot open testdata/nosuch.lua: no such file" || !errors.Is(err, fs.ErrNotExist) {
		t.Errorf("%v", err)
	}
	_, err = RunFile(context.Background(), "testdata", Options{})
	if err == nil || err.Error() != "cannot open testdata: it is a folder, not a file" {
		t.Errorf("%v", err)
	}
	if err := StatScript("testdata/nosuch.lua"); err == nil || err.Error() != "cannot open testdata/nosuch.lua: no such file" {
		t.Errorf("StatScript: %v", err)
	}
}
