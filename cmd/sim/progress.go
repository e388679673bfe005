package main

import (
	"fmt"
	"io"
	"math"
	"os"
	"strings"
	"sync"
	"time"
	"unicode/utf8"

	"golang.org/x/term"
)

// progressEvery is the shortest time between two redraws of the progress
// line: a few a second are enough for the eye and cost nothing.
const progressEvery = 200 * time.Millisecond

// terminalFd returns the file descriptor of w and true when w is a
// terminal; false for a pipe, a file or anything that is not an *os.File.
func terminalFd(w io.Writer) (int, bool) {
	f, ok := w.(*os.File)
	if !ok {
		return 0, false
	}
	fd := int(f.Fd())
	return fd, term.IsTerminal(fd)
}

// progressMeter shows the progress of the run's voyages, studies and
// audits on one line of a terminal, redrawn with a carriage return at most
// every progressEvery, and ended with a newline when a job is done. Its
// Write lets a logger share the terminal: the line is cleared before a
// record and redrawn at the next update.
type progressMeter struct {
	mu    sync.Mutex
	w     io.Writer
	now   func() time.Time
	width func() int // the terminal's columns; 0 if unknown

	job     string
	start   time.Time
	drawn   time.Time // of the last redraw
	shown   int       // the width of the line on screen; 0 if none
	pending string    // the last line formatted, not yet drawn
}

// newProgressMeter returns a meter writing to w, which must be a terminal
// whose descriptor is fd.
func newProgressMeter(w io.Writer, fd int) *progressMeter {
	return &progressMeter{w: w, now: time.Now, width: func() int {
		cols, _, err := term.GetSize(fd)
		if err != nil {
			return 0
		}
		return cols
	}}
}

// update is the scripting.Options.Progress callback.
func (m *progressMeter) update(job string, done, total int) {
	m.mu.Lock()
	defer m.mu.Unlock()
	now := m.now()
	if job != m.job || m.start.IsZero() {
		if m.shown > 0 {
			io.WriteString(m.w, "\n") // a job left unfinished keeps its last line
			m.shown = 0
		}
		m.job, m.start, m.drawn = job, now, time.Time{}
	}
	finished := total > 0 && done >= total
	m.pending = formatProgress(escapeText(job), done, total, now.Sub(m.start), m.width())
	if !finished && !m.drawn.IsZero() && now.Sub(m.drawn) < progressEvery {
		return
	}
	m.draw(now)
	if finished {
		io.WriteString(m.w, "\n")
		m.shown, m.job, m.start, m.pending = 0, "", time.Time{}, ""
	}
}

// draw writes the pending line over the one shown.
func (m *progressMeter) draw(now time.Time) {
	n := utf8.RuneCountInString(m.pending)
	pad := ""
	if m.shown > n {
		pad = strings.Repeat(" ", m.shown-n)
	}
	io.WriteString(m.w, "\r"+m.pending+pad)
	m.shown = n
	m.drawn = now
}

// finish ends a line left open (a job stopped by an error).
func (m *progressMeter) finish() {
	m.mu.Lock()
	defer m.mu.Unlock()
	if m.shown > 0 {
		io.WriteString(m.w, "\n")
		m.shown = 0
	}
	m.job, m.start, m.pending = "", time.Time{}, ""
}

// Write clears the progress line, writes p (a log record) and redraws the
// line after it.
func (m *progressMeter) Write(p []byte) (int, error) {
	m.mu.Lock()
	defer m.mu.Unlock()
	if m.shown > 0 {
		io.WriteString(m.w, "\r"+strings.Repeat(" ", m.shown)+"\r")
		m.shown = 0
	}
	n, err := m.w.Write(p)
	if m.pending != "" && err == nil {
		m.draw(m.now())
	}
	return n, err
}

// writeAbove writes p to w (another stream, such as standard output on
// the same terminal) with the progress line cleared first and redrawn
// after, so that the two do not overwrite each other.
func (m *progressMeter) writeAbove(w io.Writer, p []byte) {
	m.mu.Lock()
	defer m.mu.Unlock()
	if m.shown > 0 {
		io.WriteString(m.w, "\r"+strings.Repeat(" ", m.shown)+"\r")
		m.shown = 0
	}
	w.Write(p)
	if m.pending != "" {
		m.draw(m.now())
	}
}

// formatProgress is the progress line of a job: what is done of how much,
// the share, the rate and the time left at that rate, such as
//
//	voyage "ballast leg": 120 of 500 rows (24 %), 35.2 rows/s, about 11 s left
//
// An audit counts days, the others rows (a study: rows times variants).
// Before anything is done, or with no time gone, the rate and time left are
// left out; when all is done, the time taken replaces the time left. A
// line longer than width (when above zero) is cut to width-1 characters,
// ending in "…".
func formatProgress(job string, done, total int, elapsed time.Duration, width int) string {
	unit := "rows"
	if strings.HasPrefix(job, "audit") {
		unit = "days"
	}
	done = max(0, done)
	var b strings.Builder
	fmt.Fprintf(&b, "%s: %d of %d %s", job, done, total, unit)
	if total > 0 {
		fmt.Fprintf(&b, " (%d %%)", min(100, done*100/total))
	}
	secs := elapsed.Seconds()
	if done > 0 && secs > 0 {
		rate := float64(done) / secs
		fmt.Fprintf(&b, ", %s %s/s", rateText(rate), unit)
		if total > 0 && done >= total {
			fmt.Fprintf(&b, ", done in %s", durationText(secs))
		} else if total > done {
			fmt.Fprintf(&b, ", about %s left", durationText(float64(total-done)/rate))
		}
	}
	s := b.String()
	if width > 1 && utf8.RuneCountInString(s) > width-1 {
		r := []rune(s)
		s = string(r[:width-2]) + "…"
	}
	return s
}

// rateText writes a rate with three significant figures or so.
func rateText(r float64) string {
	switch {
	case r >= 100:
		return fmt.Sprintf("%.0f", r)
	case r >= 10:
		return fmt.Sprintf("%.1f", r)
	}
	return fmt.Sprintf("%.2f", r)
}

// durationText writes seconds as "0.4 s", "12 s", "3 min 05 s" or
// "2 h 07 min".
func durationText(s float64) string {
	if s < 9.95 {
		return fmt.Sprintf("%.1f s", s)
	}
	t := int(math.Round(s))
	switch {
	case t < 60:
		return fmt.Sprintf("%d s", t)
	case t < 3600:
		return fmt.Sprintf("%d min %02d s", t/60, t%60)
	}
	m := int(math.Round(s / 60))
	return fmt.Sprintf("%d h %02d min", m/60, m%60)
}
