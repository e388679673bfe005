package main

import (
	"bytes"
	"context"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

// TestFormatProgress checks the progress line as a pure function: the
// share, the rate and the time left at that rate (120 rows in 3.4 s is
// 35.3 rows/s; 380 rows left at that rate take 10.8 s), the time taken
// once done, a line cut to the terminal's width.
func TestFormatProgress(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		job         string
		done, total int
		elapsed     time.Duration
		width       int
		want        string
	}{
		{`voyage "ballast leg"`, 0, 500, 0, 0, `voyage "ballast leg": 0 of 500 rows (0 %)`},
		{`voyage "ballast leg"`, 120, 500, 3400 * time.Millisecond, 0,
			`voyage "ballast leg": 120 of 500 rows (24 %), 35.3 rows/s, about 11 s left`},
		{`study "EGE"`, 3, 50, 2 * time.Second, 0, `study "EGE": 3 of 50 rows (6 %), 1.50 rows/s, about 31 s left`},
		{`audit "March"`, 31, 31, 62 * time.Second, 0, `audit "March": 31 of 31 days (100 %), 0.50 days/s, done in 1 min 02 s`},
		{`audit "March"`, 1, 31, 200 * time.Second, 0, `audit "March": 1 of 31 days (3 %), 0.01 days/s, about 1 h 40 min left`},
		{`voyage "v"`, 5, 10, 0, 0, `voyage "v": 5 of 10 rows (50 %)`},
		{`voyage "v"`, 5, 10, time.Second, 20, `voyage "v": 5 of 1…`},
		{`voyage "v"`, 100000, 100000, 4 * time.Second, 0, `voyage "v": 100000 of 100000 rows (100 %), 25000 rows/s, done in 4.0 s`},
	} {
		got := formatProgress(c.job, c.done, c.total, c.elapsed, c.width)
		if got != c.want {
			t.Errorf("formatProgress(%q, %d, %d, %v, %d)\n got %q\nwant %q", c.job, c.done, c.total, c.elapsed, c.width, got, c.want)
		}
		if c.width > 0 && len([]rune(got)) > c.width-1 {
			t.Errorf("%q is wider than %d-1", got, c.width)
		}
	}
}

func TestDurationText(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		s    float64
		want string
	}{{0.42, "0.4 s"}, {9.96, "10 s"}, {59.6, "1 min 00 s"}, {185, "3 min 05 s"}, {3599.6, "1 h 00 min"}, {7620, "2 h 07 min"}} {
		if got := durationText(c.s); got != c.want {
			t.Errorf("durationText(%g) = %q, want %q", c.s, got, c.want)
		}
	}
}

// TestProgressMeter drives the meter with a clock of its own: it redraws
// in place with \r no more often than progressEvery, pads over a longer
// line, ends a finished job with a newline, and clears its line around a
// log record.
func TestProgressMeter(t *testing.T) {
	t.Parallel()
	var out bytes.Buffer
	now := time.Date(2026, 1, 1, 0, 0, 0, 0, time.UTC)
	m := &progressMeter{w: &out, now: func() time.Time { return now }, width: func() int { return 0 }}
	job := `voyage "v"`
	m.update(job, 0, 100)
	for i := 1; i <= 100; i++ {
		now = now.Add(10 * time.Millisecond) // 1 s in all
		m.update(job, i, 100)
	}
	s := out.String()
	// One draw at the start, then one every 200 ms (5), the last at 100.
	if n := strings.Count(s, "\r"); n < 5 || n > 7 {
		t.Errorf("%d redraws of 100 updates over 1 s; want about 1 s / %v", n, progressEvery)
	}
	// The last line is padded with spaces over the longer one before it.
	last := "\r" + `voyage "v": 100 of 100 rows (100 %), 100 rows/s, done in 1.0 s`
	if !strings.HasSuffix(strings.TrimRight(strings.TrimSuffix(s, "\n"), " "), last) ||
		!strings.HasSuffix(s, last+" \n") {
		t.Errorf("the last line: %q", s[max(0, len(s)-120):])
	}
	if strings.Count(s, "\n") != 1 {
		t.Errorf("%d newlines, want one at the end", strings.Count(s, "\n"))
	}

	// A log record in the middle of a job: the line is wiped, the record
	// written, the line drawn again.
	out.Reset()
	m.update(`audit "a"`, 1, 10)
	m.Write([]byte("a log record\n"))
	want := "\r" + `audit "a": 1 of 10 days (10 %)`
	wipe := "\r" + strings.Repeat(" ", len(`audit "a": 1 of 10 days (10 %)`)) + "\r"
	if got := out.String(); got != want+wipe+"a log record\n"+want {
		t.Errorf("around a log record: %q", got)
	}
	// A script's print on the other stream: the line is wiped first and
	// drawn again after.
	out.Reset()
	var stdout bytes.Buffer
	(&printWriter{w: &stdout, meter: m}).Write([]byte("printed\x1b[2J\n"))
	if got := out.String(); got != wipe+want || stdout.String() != "printed\\x1b[2J\n" {
		t.Errorf("around a print: stderr %q, stdout %q", got, stdout.String())
	}
	// A job's name with control characters is shown escaped.
	out.Reset()
	m.update("audit \"a\r\nb\"", 2, 10)
	if got := out.String(); !strings.Contains(got, `audit "a\r\nb": 2 of 10 days`) {
		t.Errorf("a name with control characters: %q", got)
	}
	// A job cut short: finish ends its line.
	m.finish()
	if !strings.HasSuffix(out.String(), "\n") {
		t.Errorf("finish did not end the line: %q", out.String())
	}
	m.finish()
	if strings.HasSuffix(out.String(), "\n\n") {
		t.Error("a second finish wrote another newline")
	}
}

// TestNoProgressWhenNotATerminal runs a voyage with stderr a buffer and a
// regular file: neither is a terminal, so no progress is drawn (and with
// --quiet nothing at all is written).
func TestNoProgressWhenNotATerminal(t *testing.T) {
	t.Parallel()
	if _, tty := terminalFd(&bytes.Buffer{}); tty {
		t.Fatal("a buffer taken for a terminal")
	}
	f, err := os.Create(filepath.Join(t.TempDir(), "stderr.txt"))
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	if _, tty := terminalFd(f); tty {
		t.Fatal("a regular file taken for a terminal")
	}
	var out bytes.Buffer
	if code := run(context.Background(), []string{"run", "--quiet", "testdata/run/voyage.lua"}, &out, f); code != exitOK {
		t.Fatalf("exit %d", code)
	}
	if b, _ := os.ReadFile(f.Name()); len(b) != 0 {
		t.Errorf("stderr, a file, got %q", b)
	}
	// Without --quiet the log records come, but no progress line.
	var errw bytes.Buffer
	if code := run(context.Background(), []string{"run", "testdata/run/voyage.lua"}, &out, &errw); code != exitOK {
		t.Fatalf("exit %d", code)
	}
	if s := errw.String(); strings.Contains(s, "\r") || strings.Contains(s, "rows (") {
		t.Errorf("progress drawn on a buffer: %q", s)
	}
}

func BenchmarkFormatProgress(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		_ = formatProgress(`voyage "ballast leg"`, 120, 500, 3400*time.Millisecond, 120)
	}
}
