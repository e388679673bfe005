package scripting

import (
	"context"
	"errors"
	"path/filepath"
	"strings"
	"sync/atomic"
	"testing"
	"time"
)

// TestScriptClockPauses: the script's clock does not count the time a
// job runs, and counts again after it.
func TestScriptClockPauses(t *testing.T) {
	t.Parallel()
	var fired atomic.Bool
	c := newScriptClock(100*time.Millisecond, func() { fired.Store(true) })
	defer c.stop()
	c.pause()
	time.Sleep(200 * time.Millisecond)
	if fired.Load() {
		t.Fatal("the clock ran out while paused")
	}
	c.resume()
	time.Sleep(300 * time.Millisecond)
	if !fired.Load() {
		t.Fatal("the clock did not run out after it resumed")
	}
}

// TestJobLimitScaled: a job's default limit is 10 s and 20 ms a solve;
// Options.JobTimeout replaces it; a huge announced work does not overflow.
func TestJobLimitScaled(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		opt    time.Duration
		work   int
		want   time.Duration
		scaled bool
	}{
		{0, 0, 10 * time.Second, true},
		{0, 8760 * 3 * 2, 10*time.Second + 52560*20*time.Millisecond, true},
		{0, 1 << 62, time.Duration(1<<63 - 1), true},
		{time.Minute, 1000, time.Minute, false},
	} {
		r := &runner{opt: Options{JobTimeout: tc.opt}}
		got, scaled := r.jobLimit(tc.work)
		if got != tc.want || scaled != tc.scaled {
			t.Errorf("JobTimeout %v, work %d: limit %v (scaled %v), want %v (%v)", tc.opt, tc.work, got, scaled, tc.want, tc.scaled)
		}
	}
}

// TestJobStopsScriptClock: while a job runs, the script's own limit
// stands still; the job is bounded by its own.
func TestJobStopsScriptClock(t *testing.T) {
	t.Parallel()
	ctx, cancel := context.WithCancelCause(context.Background())
	defer cancel(nil)
	r := &runner{ctx: ctx, opt: Options{JobTimeout: time.Minute}}
	r.clock = newScriptClock(100*time.Millisecond, func() { cancel(errTimeLimit) })
	defer r.clock.stop()
	err := r.inJob(`voyage "v"`, Pos{}, 1, func(ctx context.Context) error {
		time.Sleep(300 * time.Millisecond)
		return ctx.Err()
	})
	if err != nil || r.ctx.Err() != nil {
		t.Fatalf("a job of 300 ms under a script limit of 100 ms: job error %v, script %v", err, context.Cause(r.ctx))
	}
	r.opt.JobTimeout = 50 * time.Millisecond
	err = r.inJob(`voyage "v"`, Pos{File: "v.lua", Line: 2}, 1, func(ctx context.Context) error {
		<-ctx.Done()
		return ctx.Err()
	})
	var te *TimeoutError
	if !errors.As(err, &te) || !te.JobLimit || te.Limit != 50*time.Millisecond {
		t.Errorf("a job past its own limit: error %v, want its TimeoutError", err)
	}
}

// TestJobTimeLimits: a voyage stopped at its own limit names itself, its
// line and the option to raise.
func TestJobTimeLimits(t *testing.T) {
	t.Parallel()
	var rows strings.Builder
	for i := range 2000 {
		if i > 0 {
			rows.WriteString(", ")
		}
		rows.WriteString(`{ phase = "sea", hours = 1, sea = "12 C", air = "8 C", engine = "` + []string{"80 %", "40 %", "0 %"}[i%3] + `" }`)
	}
	script := "local ship = include(\"jobs_plant.lua\")\nlocal v = voyage(ship, { name = \"long\", rows = { " + rows.String() + " } })\n"
	dir := auditDir(t, map[string]string{"v.lua": script})
	_, err := RunFile(context.Background(), filepath.Join(dir, "v.lua"), Options{Timeout: time.Minute, JobTimeout: time.Millisecond, Workers: 1})
	var te *TimeoutError
	if !errors.As(err, &te) || !te.JobLimit {
		t.Fatalf("error %v, want the job's time limit", err)
	}
	for _, want := range []string{"v.lua:2:", `voyage "long" stopped`, "1ms", "--job-timeout"} {
		if !strings.Contains(err.Error(), want) {
			t.Errorf("error %q does not say %q", err, want)
		}
	}
}
