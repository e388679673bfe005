package plant

import (
	"context"
	"fmt"
	"math"
	"sort"
	"strings"
)

// Priorities and the allocation of a shortfall.
//
// A boiler never raises more than its limit (its MCR times its max_load).
// When the boilers that fire cannot carry the demand, the case is solved
// with them at their limit and the demand is reduced by priority: every
// consumer and turbine that may be reduced carries a priority (a number,
// higher kept longer, or a named level), and the lowest priority is
// reduced first, every consumer of one priority by the same fraction of
// its demand, before the next priority is touched.
//
// How it is solved. The plant has one more unknown, the shed level L
// (0..1), and one more equation. The consumers that may be reduced are
// ranked by their distinct priorities from the lowest (rank 0) up; rank r
// is given the slice [B_r, B_r + w_r) of 0..1, its width w_r the rank's
// share of the steam the reduced consumers would take (estimated at the
// last solution), and a consumer of rank r delivers the fraction
//
//	φ_r(L) = 1 − clamp((L − B_r)/w_r, 0, 1)
//
// of its demand (its duty, steam flow or shaft power): as L goes from 0 to
// w_0 the lowest priority is reduced from all to nothing, then the next,
// and so on; the steam delivered falls nearly in proportion to L, so that
// Newton's steps do not jump between the kinks. The widths only place the
// kinks: any positive widths give the same solution. The equation is
//
//	min(L, (Σ limit − Σ steam) / Σ limit) = 0     (over the boilers firing)
//
// a complementarity condition solved by the same Newton iteration
// (semi-smooth: each iteration takes the derivative of the smaller side):
// while the boilers are below their limit the slack is positive and L is
// zero; beyond it the steam is held at the limit and L takes up the
// difference. One solve therefore gives the balance whether or not the
// case is short, which is what lets a contingency cost one solve. With no
// boiler firing the slack is the first dump condenser's flow (the
// economisers' surplus). The φ_r are piecewise linear; at a kink the
// derivative is the one on the side of increasing L, so that the
// iteration can move from a priority fully delivered into shedding it;
// the lowest rank continues linearly below 0 and the highest above 1,
// where the bounds never let L go, so that no state has a derivative of
// zero.
//
// What may be reduced: a consumer whose demand is a duty or a steam flow
// (given, or from its model) and a turbine's shaft power. Not reduced:
// what follows a boiler's fuel (burner heaters, atomising steam), the feed
// tank's heating, header drains and losses, blowdown. If even with every
// consumer that may be reduced taken to nothing the boilers are short (or
// nothing may be reduced), the case is solved with the boilers above
// their limit and says so in its warnings.

// The named priority levels, lowest first, and the numbers they stand for.
// A number between them ranks between them.
var priorityLevels = [...]struct {
	name  string
	value float64
	doc   string
}{
	{"deferrable", 10, "can wait hours without harm (tank cleaning, fresh-water generation)"},
	{"hotel", 20, "comfort and services of the crew (accommodation heating, galley)"},
	{"cargo", 30, "the cargo's own care and pumping (cargo heating, cargo pumps)"},
	{"essential", 40, "the ship's own running (fuel heating for the engines and boilers)"},
}

// PriorityEssential is the priority of a consumer that gives none: it is
// reduced last, with the essential ones.
const PriorityEssential = 40

// PriorityLevelName returns the name of a named priority level v, or "".
func PriorityLevelName(v float64) string {
	for _, l := range priorityLevels {
		if l.value == v {
			return l.name
		}
	}
	return ""
}

// PriorityLevels lists the named levels, lowest first.
func PriorityLevels() []string {
	out := make([]string, len(priorityLevels))
	for i, l := range priorityLevels {
		out[i] = l.name
	}
	return out
}

// priorityKey binds a priority field of a consumer or a turbine.
func priorityKey[T any](owner func(Component) (T, bool), f func(T) *float64) Key {
	names := make([]string, len(priorityLevels))
	vals := make([]float64, len(priorityLevels))
	var docs []string
	for i, l := range priorityLevels {
		names[i], vals[i] = l.name, l.value
		docs = append(docs, fmt.Sprintf("%s: %s", l.name, l.doc))
	}
	k := num(Key{Name: "priority", Label: "priority", Kind: KeyRank, Example: `"cargo"`,
		Doc: "when the boilers at their limit cannot carry the demand, the lowest priority is reduced first (" +
			strings.Join(docs, "; ") + ")",
		DefaultNote: `"essential" (reduced last); with no priority given anywhere, every consumer is reduced in proportion`,
		Min:         1, Max: 100, Case: true, JSON: "priority", Source: SourceRule}, owner, f)
	k.Choices, k.Levels = names, vals
	return k
}

// priorityOf is the priority a field holds: zero means not given, which
// ranks as essential.
func priorityOf(v float64) float64 {
	if v == 0 {
		return PriorityEssential
	}
	return v
}

// shedRole is a consumer's (or turbine's) part in the shedding: the index
// of the shed level L among the unknowns (−1: the plant has none), and for
// the case whether the consumer is reduced (on), the start lo and width w
// of its rank's slice of L, and whether the rank is the lowest or the
// highest.
type shedRole struct {
	idx         int
	on          bool
	lo, w       float64
	first, last bool
}

func offRole() shedRole { return shedRole{idx: -1} }

// frac returns the fraction φ of its demand the consumer delivers at the
// unknowns x, and dφ/dL (see the comment at the top of this file).
func (s shedRole) frac(x []float64) (phi, dphi float64) {
	if s.idx < 0 || !s.on || !(s.w > 0) {
		return 1, 0
	}
	t := (x[s.idx] - s.lo) / s.w
	switch {
	case t < 0 && !s.first:
		return 1, 0
	case t >= 1 && !s.last:
		return 0, 0
	}
	return 1 - t, -1 / s.w
}

// shedder is a component whose demand the shedding may reduce.
type shedder interface {
	Component
	// shedLink ties the component's demand equation to the shed level
	// (unknown idx).
	shedLink(a *assembly, idx int)
	// shedPriority returns the component's priority for the case,
	// whether one was given, whether it may be reduced in the case
	// (running, with a demand that is a duty, a steam flow or a power),
	// and an estimate of the steam it takes at x (the last solution, or
	// nil), kg/s.
	shedPriority(x []float64) (pr float64, given, ok bool, steam float64)
	// setShed sets its part for the case.
	setShed(r shedRole)
}

// Rough heats per kg of steam for the widths of the ranks before any
// solution is known (only the kinks' places depend on them): a heating
// consumer's latent heat, J/kg, and a cargo-pump turbine's shaft work,
// J/kg (common practice, no source).
const (
	roughHeatPerKg = 2.0e6
	roughWorkPerKg = 4.0e5
)

// rankShedding ranks the case's consumers that may be reduced by their
// priorities, lowest first, after the case's settings are applied and
// every component prepared, and gives each rank its slice of the shed
// level. It returns whether any priority was given.
func (p *Plant) rankShedding() (given bool) {
	s := p.s
	type entry struct {
		c     shedder
		pr    float64
		steam float64
	}
	var es []entry
	for _, c := range s.shedders {
		pr, g, ok, steam := c.shedPriority(s.last)
		c.setShed(shedRole{idx: s.shedIdx})
		if !ok {
			continue
		}
		given = given || g
		es = append(es, entry{c, pr, math.Max(steam, 1e-6)})
	}
	sort.SliceStable(es, func(i, j int) bool { return es[i].pr < es[j].pr })
	var total float64
	for _, e := range es {
		total += e.steam
	}
	s.nRanks = 0
	lo := 0.0
	for i := 0; i < len(es); {
		j := i
		var w float64
		for j < len(es) && es[j].pr == es[i].pr {
			w += es[j].steam / total
			j++
		}
		for _, e := range es[i:j] {
			e.c.setShed(shedRole{idx: s.shedIdx, on: true, lo: lo, w: w, first: i == 0, last: j == len(es)})
		}
		s.nRanks++
		lo += w
		i = j
	}
	return given
}

// shedLevel is the solved shed level L, zero when the plant has none.
func (p *Plant) shedLevel() float64 {
	s := p.s
	if s.shedIdx < 0 || s.last == nil {
		return 0
	}
	return s.last[s.shedIdx]
}

// shedding says whether the last solution reduces any demand.
func (p *Plant) shedding() bool {
	return !p.s.noShed && p.s.nRanks > 0 && p.shedLevel() > 1e-9
}

// overLimit says whether the firing boilers of the last solution raise
// more than their limits together.
func (p *Plant) overLimit() bool {
	s := p.s
	var lim, steam float64
	for i, b := range s.asm.roles.boilers {
		if s.fire[i] {
			lim += b.Limit()
			steam += s.last[b.steam.mIdx()]
		}
	}
	return steam > lim*(1+1e-9)
}

// solveShedding solves the firing configuration fire as a case's answer:
// where the boilers at their limit are short, with the demand reduced by
// priority. Directly (one solve with the shedding on) when direct, from
// a warm start close to the answer; else, and when that fails, in two
// steps: with nothing shed (the smooth problem of a case that is not
// short), then, if the boilers go above their limit, with the shedding on
// from there. If shedding everything that may be reduced is not enough
// (or nothing may be), the solution with nothing shed stands and
// shedFailed says so.
func (p *Plant) solveShedding(ctx context.Context, fire []bool, direct bool) error {
	s := p.s
	s.shedFailed = false
	if direct && s.nRanks > 0 {
		s.noShed = false
		err := p.solveConfig(ctx, fire)
		if err == nil || ctx.Err() != nil {
			return err
		}
	}
	s.noShed = true
	if err := p.solveConfig(ctx, fire); err != nil {
		if ctx.Err() != nil || s.nRanks == 0 || direct {
			return err
		}
		// With nothing shed the boilers firing may be taken beyond their
		// models' range (a flue-gas table ends at 120 % of MCR), and
		// without a boiler firing a short economiser cannot be solved (the
		// dump condenser cannot take less than nothing). Start from the
		// plant with every boiler firing, which can carry more, and solve
		// the configuration with the shedding on from there.
		all := make([]bool, len(fire))
		for i := range all {
			all[i] = true
		}
		if err := p.solveConfig(ctx, all); err != nil && ctx.Err() != nil {
			return err
		} else if err == nil {
			var need, limit float64
			for i, b := range s.asm.roles.boilers {
				need += s.last[b.steam.mIdx()]
				if fire[i] {
					limit += b.Limit()
				}
			}
			p.contingencyStart(fire, need, limit)
		}
		s.noShed = false
		return p.solveConfig(ctx, fire)
	}
	return p.shedIfOver(ctx, fire)
}

// shedIfOver solves the configuration in hand again with the shedding on
// when its boilers are above their limit (see solveShedding).
func (p *Plant) shedIfOver(ctx context.Context, fire []bool) error {
	s := p.s
	s.shedFailed = false
	if !p.overLimit() {
		return nil
	}
	if s.nRanks == 0 {
		s.shedFailed = true
		return nil
	}
	keepX := append([]float64(nil), s.last...)
	keepRes, keepSolves := s.slvRes, s.solves
	s.noShed = false
	err := p.solveConfig(ctx, fire)
	if err == nil || ctx.Err() != nil {
		return err
	}
	copy(s.last, keepX)
	s.slvRes, s.solves = keepRes, keepSolves+1
	s.noShed, s.shedFailed = true, true
	return nil
}

// shedSummary words what a short case sheds, for its warning: the
// consumers reduced, lowest priority first, or that every one is reduced
// in proportion.
func shedSummary(cr *CaseResult) string {
	var shed []ConsumerResult
	for _, c := range cr.Consumers {
		if c.ShedW > 0 || c.ShedKgS > 0 {
			shed = append(shed, c)
		}
	}
	if len(shed) == 0 {
		return ""
	}
	if cr.ShedRanks <= 1 {
		frac := 0.0
		for _, c := range shed {
			if c.RequestedW > 0 {
				frac = 1 - c.ShedW/c.RequestedW
				break
			}
		}
		why := "no priorities given"
		if cr.PrioritiesGiven {
			why = "every consumer has the same priority"
		}
		return fmt.Sprintf("%s: every consumer that may be reduced is reduced in proportion, to %.0f %% of its demand", why, 100*frac)
	}
	sort.SliceStable(shed, func(i, j int) bool { return shed[i].Priority < shed[j].Priority })
	var parts []string
	for _, c := range shed {
		parts = append(parts, fmt.Sprintf("%s %s of %s (%s)", c.Name, kwText(c.ShedW), kwText(c.RequestedW), priorityText(c.Priority)))
	}
	return "shed by priority, lowest first: " + strings.Join(parts, ", ")
}

// priorityText names a priority: its level's name, or the number.
func priorityText(v float64) string {
	if n := PriorityLevelName(v); n != "" {
		return n
	}
	return fmt.Sprintf("priority %g", v)
}

// kwText writes a power in kW or MW.
func kwText(w float64) string {
	if math.Abs(w) >= 1e6 {
		return fmt.Sprintf("%.2f MW", w/1e6)
	}
	return fmt.Sprintf("%.0f kW", w/1e3)
}
