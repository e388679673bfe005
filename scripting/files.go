package scripting

import (
	"bytes"
	"crypto/sha256"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"path"
	"strings"

	lua "github.com/yuin/gopher-lua"
)

// resolve checks a file name given to include or read_csv and returns its
// path in the file system and its name for positions. Only plain relative
// names inside the calling script's folder (subfolders allowed) are
// accepted.
func (r *runner) resolve(fn, name string) (fsPath, show string) {
	if r.fsys == nil {
		r.fail("", "%s(%q): no files are available to this script", fn, name)
	}
	bad := ""
	switch {
	case name == "":
		bad = "the name is empty"
	case strings.HasPrefix(name, "/") || strings.HasPrefix(name, `\`) || (len(name) > 1 && name[1] == ':'):
		bad = "absolute paths are not allowed"
	case strings.Contains(name, `\`):
		bad = "use '/' between folder names"
	case strings.Contains(name, "\x00"):
		bad = "the name contains a NUL byte"
	}
	if bad == "" {
		for _, el := range strings.Split(name, "/") {
			if el == ".." {
				bad = "'..' is not allowed: scripts may read only files in their own folder and its subfolders"
				break
			}
		}
	}
	if bad == "" && !fs.ValidPath(name) {
		bad = "not a plain relative file name such as \"profile.csv\""
	}
	if bad != "" {
		r.fail("", "%s(%q): %s", fn, name, bad)
	}
	caller := r.where().File
	ch, ok := r.chunks[caller]
	if !ok {
		r.fail("", "%s(%q): cannot tell which script is calling", fn, name)
	}
	return path.Join(ch.fsDir, name), path.Join(ch.showDir, name)
}

// readFile reads a file through the run's file system with a size bound,
// and records it in the run's files read under show, its name in
// positions, with the SHA-256 of its bytes as they are on disk.
// Only regular files are read: a folder is refused, and so are a named
// pipe (which would block the run until its time limit) and a device.
// Options.CheckRead may refuse the file. A UTF-8 byte-order mark at the
// start is skipped (spreadsheets write one before a CSV's header).
func (r *runner) readFile(fn, name, fsPath, show string, limit int64) []byte {
	st, err := fs.Stat(r.fsys, fsPath)
	if err != nil {
		msg := reasonOf(err)
		if errors.Is(err, fs.ErrNotExist) {
			msg = "no such file beside the script"
		}
		r.failErr("", err, "%s(%q): %s", fn, name, msg)
	}
	if reason := notRegular(st); reason != "" {
		r.fail("", "%s(%q): %s", fn, name, reason)
	}
	if r.opt.CheckRead != nil {
		if err := r.opt.CheckRead(st); err != nil {
			r.failErr("", err, "%s(%q): %v", fn, name, err)
		}
	}
	f, err := r.fsys.Open(fsPath)
	if err != nil {
		r.failErr("", err, "%s(%q): %s", fn, name, reasonOf(err))
	}
	defer f.Close()
	if st, err := f.Stat(); err == nil && notRegular(st) != "" {
		// replaced between the two looks
		r.fail("", "%s(%q): %s", fn, name, notRegular(st))
	}
	b, err := readBounded(f, limit)
	if err != nil {
		r.failErr("", err, "%s(%q): %s", fn, name, reasonOf(err))
	}
	r.recordFile(show, b)
	return skipBOM(b)
}

// FileRead is a file a run read: its name as positions give it, its size
// and the SHA-256 of its bytes.
type FileRead struct {
	Name   string
	Bytes  int
	SHA256 [sha256.Size]byte
}

// recordFile adds a file read to the run's record, once for each name and
// content.
func (r *runner) recordFile(show string, b []byte) {
	sum := sha256.Sum256(b)
	for _, f := range r.out.Files {
		if f.Name == show && f.SHA256 == sum {
			return
		}
	}
	r.out.Files = append(r.out.Files, FileRead{Name: show, Bytes: len(b), SHA256: sum})
}

// luaInclude is include("file.lua"): runs another script from the same
// folder and returns what it returns.
func (r *runner) luaInclude(L *lua.LState) int {
	name := L.CheckString(1)
	fsPath, show := r.resolve("include", name)
	if len(r.including) >= r.opt.MaxIncludeDepth {
		r.fail("", "include(%q): includes nested more than %d deep", name, r.opt.MaxIncludeDepth)
	}
	for _, c := range r.including {
		if c == show {
			r.fail("", "include(%q): %s is already being included (a cycle)", name, show)
		}
	}
	if show == r.main {
		r.fail("", "include(%q): a script cannot include itself", name)
	}
	src := r.readFile("include", name, fsPath, show, r.opt.MaxScriptBytes)
	r.chunks[show] = chunk{fsDir: path.Dir(fsPath), showDir: path.Dir(show)}
	r.sources[show] = src
	fn, err := L.Load(bytes.NewReader(src), show)
	if err != nil {
		r.raise(syntaxError(err, show))
	}
	r.including = append(r.including, show)
	depth := len(r.including) - 1
	// Lua errors unwind as Go panics: the deferred pop runs for them too,
	// so a pcall around include leaves the include stack right.
	defer func() { r.including = r.including[:depth] }()
	top := L.GetTop()
	L.Push(fn)
	L.Call(0, lua.MultRet)
	return L.GetTop() - top
}

// luaReadCSV is read_csv("file.csv"): a list of rows, each a table of
// strings keyed by the header's names.
func (r *runner) luaReadCSV(L *lua.LState) int {
	name := L.CheckString(1)
	fsPath, show := r.resolve("read_csv", name)
	b := r.readFile("read_csv", name, fsPath, show, r.opt.MaxCSVBytes)
	cr := csv.NewReader(bytes.NewReader(b))
	cr.Comment = '#'
	cr.TrimLeadingSpace = true
	cr.ReuseRecord = false
	header, err := cr.Read()
	if err == io.EOF {
		r.fail("", "read_csv(%q): the file is empty; it needs a header row", name)
	}
	if err != nil {
		r.csvErrIn("read_csv", show, name, err)
	}
	const maxCols = 256
	if len(header) > maxCols {
		r.fail("", "read_csv(%q): %d columns; at most %d are accepted", name, len(header), maxCols)
	}
	seen := map[string]bool{}
	for i, h := range header {
		h = strings.TrimSpace(h)
		header[i] = h
		if h == "" {
			r.raise(&Error{Pos: Pos{File: show, Line: 1}, Msg: fmt.Sprintf("column %d of the header is empty", i+1)})
		}
		if seen[h] {
			r.raise(&Error{Pos: Pos{File: show, Line: 1}, Msg: fmt.Sprintf("column %q appears twice in the header", h)})
		}
		seen[h] = true
	}
	rows := L.NewTable()
	for n := 0; ; n++ {
		rec, err := cr.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			r.csvErrIn("read_csv", show, name, err)
		}
		if n >= r.opt.MaxRows {
			r.fail("", "read_csv(%q): more than %d rows", name, r.opt.MaxRows)
		}
		row := L.CreateTable(0, len(header))
		for i, h := range header {
			row.RawSetString(h, lua.LString(strings.TrimSpace(rec[i])))
		}
		rows.Append(row)
	}
	L.Push(rows)
	return 1
}

// csvErrIn raises a CSV parse error of function fn at the file's line.
func (r *runner) csvErrIn(fn, show, name string, err error) {
	var pe *csv.ParseError
	if errors.As(err, &pe) {
		msg := pe.Err.Error()
		if errors.Is(pe.Err, csv.ErrFieldCount) {
			msg = "this row has a different number of fields from the header"
		}
		r.raise(&Error{Pos: Pos{File: show, Line: pe.Line, Col: pe.Column}, Msg: fn + ": " + msg, Err: err})
	}
	r.failErr("", err, "%s(%q): %v", fn, name, err)
}
