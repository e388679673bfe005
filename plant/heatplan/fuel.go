package heatplan

import (
	"context"
	"fmt"
	"math"
	"strings"
	"sync"

	"steamcase/plant"
	"steamcase/plant/profile"
)

// FuelCurve is a row's boiler fuel (kg/s) against the planned tanks'
// total heating duty (W): points in increasing duty, a jump where the
// firing rule starts another boiler (two points at the same duty, the
// lower boiler count first), and the highest duty the boilers available
// in the row can carry (Cap). Between points the fuel is interpolated
// linearly.
type FuelCurve struct {
	Q, F []float64
	// Boilers is the number of boilers firing at each point.
	Boilers []int
	// Cap is the highest total duty the row's boilers carry (W); above it
	// the plant cannot carry the row.
	Cap float64
	// Base is the fuel with the planned tanks' heating off (kg/s).
	Base float64
}

// At returns the fuel at total duty q (kg/s), +Inf above Cap. At a jump
// it takes the higher boiler count.
func (c *FuelCurve) At(q float64) float64 {
	if q > c.Cap*(1+1e-12) || q < -1e-9 || math.IsNaN(q) {
		return math.Inf(1)
	}
	n := len(c.Q)
	if n == 1 || q <= c.Q[0] {
		return c.F[0]
	}
	// First point with Q > q.
	i, hi := 0, n
	for i < hi {
		m := int(uint(i+hi) >> 1)
		if c.Q[m] > q {
			hi = m
		} else {
			i = m + 1
		}
	}
	if i >= n {
		if n >= 2 && c.Q[n-1] > c.Q[n-2] {
			// Extrapolate the last segment up to Cap (never past it).
			a, b := n-2, n-1
			return c.F[a] + (c.F[b]-c.F[a])*(q-c.Q[a])/(c.Q[b]-c.Q[a])
		}
		return c.F[n-1]
	}
	a, b := i-1, i
	if c.Q[b] == c.Q[a] {
		return c.F[b]
	}
	return c.F[a] + (c.F[b]-c.F[a])*(q-c.Q[a])/(c.Q[b]-c.Q[a])
}

// tabulation settings: the duty levels of each row and the bisection
// steps that find a boiler's start or the boilers' capacity.
const (
	tableLevels = 12
	bisectSteps = 10
)

// tableJob is one distinct row to tabulate: its case (the planned tanks'
// settings taken out), which planned tanks heat in it, and the highest
// duty to try.
type tableJob struct {
	c      plant.Case
	active []bool
	qmax   float64
	rows   []int
}

// rowKey identifies rows that give the same fuel curve: the same
// conditions, settings, firing and active tanks.
func rowKey(c plant.Case, active []bool, qmax float64) string {
	var b strings.Builder
	fmt.Fprintf(&b, "%.17g|%.17g|%.17g|%.17g|", c.Conditions.SeaT, c.Conditions.AirT, c.Conditions.EngineLoad, qmax)
	for _, s := range c.Set {
		fmt.Fprintf(&b, "%s\x00%s\x00%.17g\x00%s|", s.Unit, s.Param, s.Value, s.Text)
	}
	fmt.Fprintf(&b, "%v|%v", c.Fire, active)
	return b.String()
}

// tabulate builds each row's fuel curve by solving the plant with the
// planned tanks given as plain duties (their total split in equal shares
// among the tanks that heat in the row): duty levels from zero to qmax,
// each boiler's start and the boilers' capacity found by bisection. Rows
// that differ only in their planned tanks' settings share a curve. The
// distinct rows run on up to workers clones, each from a cold start, so
// the curves do not depend on the number of workers.
func tabulate(ctx context.Context, p *plant.Plant, rows []profile.Row, tanks []string, active [][]bool, qmax []float64, workers int) ([]FuelCurve, int, error) {
	planned := map[string]bool{}
	for _, t := range tanks {
		planned[t] = true
	}
	var jobs []*tableJob
	byKey := map[string]int{}
	for i, r := range rows {
		c := r.Case
		c.Set = nil
		for _, s := range r.Case.Set {
			if !planned[s.Unit] {
				c.Set = append(c.Set, s)
			}
		}
		k := rowKey(c, active[i], qmax[i])
		j, ok := byKey[k]
		if !ok {
			j = len(jobs)
			byKey[k] = j
			jobs = append(jobs, &tableJob{c: c, active: active[i], qmax: qmax[i]})
		}
		jobs[j].rows = append(jobs[j].rows, i)
	}
	curves := make([]FuelCurve, len(jobs))
	solves := make([]int, len(jobs))
	workers = max(1, min(workers, len(jobs)))
	ctx, cancel := context.WithCancel(ctx)
	defer cancel()
	var (
		mu       sync.Mutex
		firstErr error
		errJob   = len(jobs)
		wg       sync.WaitGroup
		next     int
	)
	for w := 0; w < workers; w++ {
		pl := p.Clone()
		cons := make([]*plant.Consumer, len(tanks))
		for k, name := range tanks {
			c, ok := pl.Component(name).(*plant.Consumer)
			if !ok {
				return nil, 0, fmt.Errorf("tank %q is not a consumer of the plant", name)
			}
			c.Model = nil
			c.Label = "tank heating (planned)"
			c.Factor = 0
			cons[k] = c
		}
		wg.Add(1)
		go func() {
			defer wg.Done()
			for {
				mu.Lock()
				j := next
				next++
				mu.Unlock()
				if j >= len(jobs) || ctx.Err() != nil {
					return
				}
				cv, n, err := tableOf(ctx, pl, cons, jobs[j])
				if err != nil {
					mu.Lock()
					if j < errJob {
						errJob, firstErr = j, fmt.Errorf("row %d (%q): %w", jobs[j].rows[0]+1, jobs[j].c.Name, err)
					}
					mu.Unlock()
					cancel()
					return
				}
				curves[j], solves[j] = cv, n
			}
		}()
	}
	wg.Wait()
	if firstErr != nil {
		return nil, 0, firstErr
	}
	if err := ctx.Err(); err != nil {
		return nil, 0, err
	}
	out := make([]FuelCurve, len(rows))
	total := 0
	for j, jb := range jobs {
		total += solves[j]
		for _, i := range jb.rows {
			out[i] = curves[j]
		}
	}
	return out, total, nil
}

// point is one solve of a row at a total planned duty.
type point struct {
	q, f    float64
	boilers int
	carry   bool
}

// tableOf solves one distinct row at its duty levels.
func tableOf(ctx context.Context, pl *plant.Plant, cons []*plant.Consumer, jb *tableJob) (FuelCurve, int, error) {
	pl.ColdStart()
	nActive := 0
	for _, a := range jb.active {
		if a {
			nActive++
		}
	}
	solves := 0
	at := func(q float64) (point, error) {
		share := 0.0
		if nActive > 0 {
			share = q / float64(nActive)
		}
		for k, c := range cons {
			c.Duty, c.SteamFlow = 0, 0
			if jb.active[k] {
				c.Duty = share
			}
		}
		solves++
		cr, err := pl.Solve(ctx, jb.c)
		if err != nil {
			return point{}, err
		}
		return point{q: q, f: cr.FuelKgS, boilers: cr.BoilersFiring, carry: cr.CanCarry}, nil
	}
	p0, err := at(0)
	if err != nil {
		return FuelCurve{}, solves, err
	}
	cv := FuelCurve{Base: p0.f}
	if !p0.carry {
		cv.Q, cv.F, cv.Boilers, cv.Cap = []float64{0}, []float64{p0.f}, []int{p0.boilers}, -1
		return cv, solves, nil
	}
	pts := []point{p0}
	cv.Cap = jb.qmax
	if nActive == 0 || jb.qmax <= 0 {
		cv.Q, cv.F, cv.Boilers, cv.Cap = []float64{0}, []float64{p0.f}, []int{p0.boilers}, 0
		return cv, solves, nil
	}
	last := p0
	for k := 1; k <= tableLevels; k++ {
		q := jb.qmax * float64(k) / tableLevels
		pt, err := at(q)
		if err != nil {
			return FuelCurve{}, solves, err
		}
		if !pt.carry {
			// The boilers' capacity lies between last and pt.
			lo, hi := last, pt
			for range bisectSteps {
				mid, err := at(0.5 * (lo.q + hi.q))
				if err != nil {
					return FuelCurve{}, solves, err
				}
				if mid.carry {
					lo = mid
				} else {
					hi = mid
				}
			}
			pts = appendSwitch(pts, last, lo, at)
			if lo.q > last.q {
				pts = append(pts, lo)
			}
			cv.Cap = lo.q
			break
		}
		pts = appendSwitch(pts, last, pt, at)
		pts = append(pts, pt)
		last = pt
	}
	for _, pt := range pts {
		cv.Q = append(cv.Q, pt.q)
		cv.F = append(cv.F, pt.f)
		cv.Boilers = append(cv.Boilers, pt.boilers)
	}
	return cv, solves, nil
}

// appendSwitch adds, where the boiler count changes between a and b,
// the two sides of the change found by bisection.
func appendSwitch(pts []point, a, b point, at func(float64) (point, error)) []point {
	if a.boilers == b.boilers {
		return pts
	}
	lo, hi := a, b
	for range bisectSteps {
		mid, err := at(0.5 * (lo.q + hi.q))
		if err != nil || !mid.carry {
			break
		}
		if mid.boilers == a.boilers {
			lo = mid
		} else {
			hi = mid
		}
	}
	if lo.q > a.q {
		pts = append(pts, lo)
	}
	if hi.q < b.q {
		// The jump: the right side at the left side's duty.
		// (The gap between the sides is qmax/12/2^10: hi's fuel serves.)
		pts = append(pts, point{q: lo.q, f: hi.f, boilers: hi.boilers, carry: true})
		pts = append(pts, hi)
	}
	return pts
}
