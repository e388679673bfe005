package main

import (
	"bytes"
	"errors"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"syscall"

	"steamcase/cmd/sim/internal/report"
)

// The files sim run writes (the report of -o and the charts of --plot)
// are checked before the run and written after it, all together:
//
//   - Before the run, each folder is tried by creating a temporary file in
//     it, and a file already there must be a regular file that may be
//     written, so that an unwritable -o stops sim before a long run.
//   - No output may be a file the run reads. The scripts are known before
//     the run and are compared then; the files the scripts read (include,
//     read_csv, the CSV of a voyage, study or audit) are compared at the
//     moment they are read, through scripting.Options.CheckRead, so that
//     the script stops at the line that reads the file, before it has
//     solved anything more. A chart's name is known only after the run (it
//     gets a suffix when there are several), so every name a chart could
//     get ("demand-cases.svg", "demand-voyage-2.svg", ...) counts.
//   - The same file may not be named twice (-o and --plot, or -o and a
//     chart's name).
//   - After the run every file is written to a temporary file beside it,
//     and only when all are written are they renamed into place. A file
//     that was there is linked aside first and put back if a later rename
//     fails, so the files are replaced together or not at all; an
//     interrupted or failed run leaves them as they were.

// outputs are the files of one sim run.
type outputs struct {
	out  string // -o, or "" for standard output
	plot string // --plot, or ""
	ops  fileOps
}

// fileOps are the file operations of a commit, replaceable by tests.
type fileOps struct {
	write  func(f *os.File, b []byte) error
	rename func(from, to string) error
}

func realFileOps() fileOps {
	return fileOps{
		write: func(f *os.File, b []byte) error {
			if _, err := f.Write(b); err != nil {
				return err
			}
			return f.Sync()
		},
		rename: os.Rename,
	}
}

// outputError is an output that cannot be written: sim exits with
// status 1 before the run. A *usageError is returned instead for a
// command line that names a file twice or names an input.
type outputError struct{ flag, file, msg string }

func (e *outputError) Error() string { return e.flag + " " + e.file + ": " + e.msg }

// prepare checks the outputs before the run: each folder writable, each
// file there a regular file that may be written, no file named twice and
// none of the scripts named.
func (o *outputs) prepare(scripts []string) error {
	if o.out != "" {
		if err := checkTarget("-o", o.out); err != nil {
			return err
		}
	}
	if o.plot != "" {
		if err := checkTarget("--plot", o.plot); err != nil {
			return err
		}
	}
	if o.out != "" && o.plot != "" {
		if sameFile(o.out, o.plot) {
			return usagef("-o and --plot both name %s: give each its own file", o.out)
		}
		if o.isChart(o.out) {
			return usagef("-o %s is a name a chart of --plot %s may get: give the report another name", o.out, o.plot)
		}
	}
	for _, s := range scripts {
		if o.out != "" && sameFile(s, o.out) {
			return usagef("-o %s is the script %s: the report would overwrite it", o.out, s)
		}
		if o.plot != "" && (sameFile(s, o.plot) || o.isChart(s)) {
			return usagef("--plot %s would overwrite the script %s: give the chart another name", o.plot, s)
		}
	}
	return nil
}

// checkRead is the scripting.Options.CheckRead of the run: it refuses a
// file that the run would write.
func (o *outputs) checkRead(info fs.FileInfo) error {
	if o.out != "" {
		if st, err := os.Stat(o.out); err == nil && os.SameFile(st, info) {
			return fmt.Errorf("this is the file -o %s writes; a run may not overwrite a file it reads: give -o another name", o.out)
		}
	}
	if o.plot == "" {
		return nil
	}
	if st, err := os.Stat(o.plot); err == nil && os.SameFile(st, info) {
		return fmt.Errorf("this is the file --plot %s writes; a run may not overwrite a file it reads: give --plot another name", o.plot)
	}
	dir := filepath.Dir(o.plot)
	entries, err := os.ReadDir(dir)
	if err != nil {
		return nil // the folder was checked before the run; a read cannot be one of its files then
	}
	for _, e := range entries {
		name := filepath.Join(dir, e.Name())
		if !o.isChart(name) {
			continue
		}
		if st, err := os.Stat(name); err == nil && os.SameFile(st, info) {
			return fmt.Errorf("%s is a name a chart of --plot %s may get; a run may not overwrite a file it reads: give --plot another name", name, o.plot)
		}
	}
	return nil
}

// chartSuffix matches what plotFile puts before the extension.
var chartSuffix = regexp.MustCompile(`^-(cases|(voyage|study|audit)-[0-9]+)$`)

// isChart reports whether name is a file a chart of --plot could be
// written to when the run draws several (see plotFile).
func (o *outputs) isChart(name string) bool {
	if o.plot == "" {
		return false
	}
	if !sameFile(filepath.Dir(name), filepath.Dir(o.plot)) {
		return false
	}
	base, pbase := filepath.Base(name), filepath.Base(o.plot)
	stem, ext := pbase, ""
	if dot := strings.LastIndexByte(pbase, '.'); dot >= 0 {
		stem, ext = pbase[:dot], pbase[dot:]
	}
	if !strings.HasPrefix(base, stem) || !strings.HasSuffix(base, ext) || len(base) < len(stem)+len(ext) {
		return false
	}
	return chartSuffix.MatchString(base[len(stem) : len(base)-len(ext)])
}

// sameFile reports whether a and b name the same file: the same file on
// disk when both exist, else the same absolute path.
func sameFile(a, b string) bool {
	sa, ea := os.Stat(a)
	sb, eb := os.Stat(b)
	if ea == nil && eb == nil {
		return os.SameFile(sa, sb)
	}
	aa, err1 := filepath.Abs(a)
	ab, err2 := filepath.Abs(b)
	return err1 == nil && err2 == nil && aa == ab
}

// checkTarget checks that file may be written: a file already there is a
// regular file that may be opened for writing, and its folder takes a new
// file (a temporary one, removed at once).
func checkTarget(flag, file string) error {
	if file == "" || strings.HasSuffix(file, string(filepath.Separator)) || strings.HasSuffix(file, "/") {
		return &outputError{flag, file, "a file name is needed, not a folder"}
	}
	if st, err := os.Stat(file); err == nil {
		if st.IsDir() {
			return &outputError{flag, file, "it is a folder; give the name of a file to write"}
		}
		if !st.Mode().IsRegular() {
			return &outputError{flag, file, "it is not a regular file (a device, a pipe or a socket); give the name of a file to write"}
		}
		f, err := os.OpenFile(file, os.O_WRONLY, 0)
		if err != nil {
			return &outputError{flag, file, "the file may not be written: " + reasonOf(err)}
		}
		f.Close()
	} else if !errors.Is(err, fs.ErrNotExist) {
		return &outputError{flag, file, "cannot write there: " + reasonOf(err)}
	}
	dir := filepath.Dir(file)
	f, err := os.CreateTemp(dir, tempPattern(file))
	if err != nil {
		if errors.Is(err, fs.ErrNotExist) {
			return &outputError{flag, file, "the folder " + dir + " does not exist"}
		}
		return &outputError{flag, file, "cannot write in the folder " + dir + ": " + reasonOf(err)}
	}
	name := f.Name()
	f.Close()
	os.Remove(name)
	return nil
}

// reasonOf says why a file operation failed, without the system call and
// path an *fs.PathError puts first.
func reasonOf(err error) string {
	switch {
	case errors.Is(err, fs.ErrNotExist):
		return "no such file or folder"
	case errors.Is(err, fs.ErrPermission):
		return "permission denied"
	case errors.Is(err, syscall.ENOTDIR):
		return "a part of the path is a file, not a folder"
	case errors.Is(err, syscall.ENOSPC):
		return "the disk is full"
	}
	var pe *fs.PathError
	if errors.As(err, &pe) {
		return pe.Err.Error()
	}
	var le *os.LinkError
	if errors.As(err, &le) {
		return le.Err.Error()
	}
	return err.Error()
}

// tempPattern is the name of the temporary file of file: hidden, beside
// it, and named after it.
func tempPattern(file string) string {
	return "." + filepath.Base(file) + ".sim-*.tmp"
}

// pending is a file to write: its name, the flag that named it and its
// content.
type pending struct {
	flag, file string
	data       []byte
}

// commit writes the files together: each to a temporary file beside it,
// then, when all are written, each renamed into place; see the top of
// this file. On an error nothing is replaced, unless a file replaced
// could not be put back, which the error says.
func (o *outputs) commit(files []pending) error {
	ops := o.ops
	if ops.write == nil {
		ops = realFileOps()
	}
	for i, p := range files {
		for _, q := range files[:i] {
			if sameFile(p.file, q.file) {
				return fmt.Errorf("%s %s and %s %s name the same file: nothing written", q.flag, q.file, p.flag, p.file)
			}
		}
		if st, err := os.Stat(p.file); err == nil && !st.Mode().IsRegular() {
			return &outputError{p.flag, p.file, "it is not a regular file; nothing written"}
		}
	}
	temps := make([]string, len(files))
	cleanup := func() {
		for _, t := range temps {
			if t != "" {
				os.Remove(t)
			}
		}
	}
	for i, p := range files {
		f, err := os.CreateTemp(filepath.Dir(p.file), tempPattern(p.file))
		if err != nil {
			cleanup()
			return &outputError{p.flag, p.file, "cannot write: " + reasonOf(err) + "; nothing written"}
		}
		temps[i] = f.Name()
		mode := fs.FileMode(0o644)
		if st, err := os.Stat(p.file); err == nil {
			mode = st.Mode().Perm()
		}
		err = ops.write(f, p.data)
		if cerr := f.Close(); err == nil {
			err = cerr
		}
		if err == nil {
			err = os.Chmod(f.Name(), mode)
		}
		if err != nil {
			cleanup()
			return &outputError{p.flag, p.file, "cannot write: " + reasonOf(err) + "; nothing written, the file is as it was"}
		}
	}
	// Keep the files that are there, to put them back if a rename fails.
	backups := make([]string, len(files))
	existed := make([]bool, len(files))
	for i, p := range files {
		if _, err := os.Stat(p.file); err != nil {
			continue
		}
		existed[i] = true
		b, err := os.CreateTemp(filepath.Dir(p.file), "."+filepath.Base(p.file)+".sim-*.old")
		if err != nil {
			continue
		}
		name := b.Name()
		b.Close()
		os.Remove(name)
		if os.Link(p.file, name) == nil {
			backups[i] = name
		}
	}
	removeBackups := func() {
		for _, b := range backups {
			if b != "" {
				os.Remove(b)
			}
		}
	}
	for i, p := range files {
		if err := ops.rename(temps[i], p.file); err != nil {
			lost := o.rollback(files[:i], backups, existed)
			cleanup()
			removeBackups()
			msg := "cannot write: " + reasonOf(err) + "; nothing written"
			if len(lost) > 0 {
				msg = "cannot write: " + reasonOf(err) + "; " + strings.Join(lost, ", ") +
					" could not be put back as they were and hold this run's output"
			}
			return &outputError{p.flag, p.file, msg}
		}
		temps[i] = ""
	}
	removeBackups()
	return nil
}

// rollback puts back the files already renamed into place: the kept file
// where there was one, none where there was none. It returns the files
// that could not be put back.
func (o *outputs) rollback(done []pending, backups []string, existed []bool) []string {
	var lost []string
	for i, p := range done {
		switch {
		case backups[i] != "":
			if os.Rename(backups[i], p.file) != nil {
				lost = append(lost, p.file)
			} else {
				backups[i] = ""
			}
		case !existed[i]:
			if os.Remove(p.file) != nil {
				lost = append(lost, p.file)
			}
		default:
			lost = append(lost, p.file)
		}
	}
	return lost
}

// chartFiles draws the charts of a run into memory, each with the file
// it goes to (see plotFile).
func chartFiles(a *runArgs, all report.Run) ([]pending, error) {
	charts := report.Charts(all)
	if len(charts) == 0 {
		return nil, fmt.Errorf("--plot %s: %w", a.plot, errNothingToDraw)
	}
	format, err := report.FormatOf(a.plot)
	if err != nil {
		return nil, err
	}
	files := make([]pending, len(charts))
	for i, c := range charts {
		files[i].flag, files[i].file = "--plot", plotFile(a.plot, c, len(charts) > 1)
		var b bytes.Buffer
		if err := c.Draw(&b, format); err != nil {
			return nil, fmt.Errorf("--plot %s: %w", files[i].file, err)
		}
		files[i].data = b.Bytes()
	}
	return files, nil
}
