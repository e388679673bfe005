package scripting

import (
	"context"
	"errors"
	"sync"
	"time"
)

// The time limits of a run. The script's own limit (Options.Timeout)
// counts the time the script spends outside its jobs: an endless loop
// is stopped there. Each job (voyage, study, audit, heating_plan) has a
// limit of its own while it runs, during which the script's clock stands
// still: Options.JobTimeout if given, else one scaled to the work the
// job announces (jobBase, and jobPerSolve for each plant solve it will
// take), so that the documented jobs fit however long they are and a job
// that hangs is still stopped.

// jobBase and jobPerSolve make a job's default time limit. A solve of the
// demo plants takes 0.1 to 0.5 ms of one core on a 2-core machine; 20 ms
// leaves a margin of forty or more for a larger plant, a loaded machine
// or the race detector.
const (
	jobBase     = 10 * time.Second
	jobPerSolve = 20 * time.Millisecond
)

// scriptClock is the script's time limit, a timer that stands still while
// a job runs.
type scriptClock struct {
	mu     sync.Mutex
	left   time.Duration // time left when paused
	since  time.Time     // when it last started running
	timer  *time.Timer
	paused int
	expire func()
}

func newScriptClock(limit time.Duration, expire func()) *scriptClock {
	c := &scriptClock{left: limit, expire: expire}
	c.since = time.Now()
	c.timer = time.AfterFunc(limit, expire)
	return c
}

// pause stops the clock (nested pauses count); a clock already run out
// stays so.
func (c *scriptClock) pause() {
	c.mu.Lock()
	defer c.mu.Unlock()
	c.paused++
	if c.paused > 1 {
		return
	}
	if c.timer.Stop() {
		c.left -= time.Since(c.since)
	} else {
		c.left = 0
	}
}

// resume starts the clock again with the time that was left.
func (c *scriptClock) resume() {
	c.mu.Lock()
	defer c.mu.Unlock()
	c.paused--
	if c.paused > 0 || c.left <= 0 {
		return
	}
	c.since = time.Now()
	c.timer = time.AfterFunc(c.left, c.expire)
}

func (c *scriptClock) stop() {
	c.mu.Lock()
	defer c.mu.Unlock()
	c.timer.Stop()
}

// jobLimitErr is the cause of a job's context when its own limit ran out.
type jobLimitErr struct{}

func (jobLimitErr) Error() string { return "job time limit" }

// inJob runs f, a job of the given work (the plant solves it announces),
// under the job's own time limit, with the script's clock standing still.
// A job stopped at its limit returns a *TimeoutError naming the job, its
// position and its limit.
func (r *runner) inJob(what string, pos Pos, work int, f func(ctx context.Context) error) error {
	limit, scaled := r.jobLimit(work)
	if r.clock != nil {
		r.clock.pause()
		defer r.clock.resume()
	}
	ctx, cancel := context.WithTimeoutCause(r.ctx, limit, jobLimitErr{})
	defer cancel()
	err := f(ctx)
	if errors.Is(context.Cause(ctx), jobLimitErr{}) && r.ctx.Err() == nil {
		te := &TimeoutError{Pos: pos, Limit: limit, Job: what, JobLimit: true}
		if scaled {
			te.Work = work
		}
		return te
	}
	return err
}

// jobLimit is a job's time limit: Options.JobTimeout, or the default
// scaled to its work (scaled true).
func (r *runner) jobLimit(work int) (time.Duration, bool) {
	if r.opt.JobTimeout > 0 {
		return r.opt.JobTimeout, false
	}
	const most = time.Duration(1<<63 - 1)
	if work < 0 || time.Duration(work) > (most-jobBase)/jobPerSolve {
		return most, true
	}
	return jobBase + time.Duration(work)*jobPerSolve, true
}
