package plant

import (
	"errors"
	"fmt"
	"sort"
	"strings"

	"steamcase/solver"
)

// Failures said in the terms of the plant: which components and lines,
// and what to change, rather than the solver's equations and unknowns
// (those go to the plant's logger, at debug level, for a user who asks
// for them).

// structureErr turns the solver's structural diagnosis into one fault
// that names the components and lines concerned and, where the plant
// shows it, the likely cause.
func (p *Plant) structureErr(err error) error {
	var se *solver.StructureError
	if !errors.As(err, &se) {
		if errors.Is(err, solver.ErrStructure) {
			msg := strings.TrimPrefix(err.Error(), "solver: ")
			return &GraphError{Faults: []Fault{{Pos: p.Pos, Msg: "degrees of freedom do not balance: " + msg}}}
		}
		return err
	}
	p.Opt.Logger.Debug().Str("plant", p.Name).Str("structure", se.Error()).Msg("the structural diagnosis")
	var b strings.Builder
	fmt.Fprintf(&b, "degrees of freedom do not balance (%d equations for %d unknowns)", se.Equations, se.Unknowns)
	if len(se.OverEquations) > 0 {
		comps, lines := p.namesIn(se.OverEquations, se.OverUnknowns)
		fmt.Fprintf(&b, "; too many conditions %s", around(comps, lines))
	}
	if len(se.UnderUnknowns) > 0 {
		comps, lines := p.namesIn(se.UnderEquations, se.UnderUnknowns)
		fmt.Fprintf(&b, "; too few %s", around(comps, lines))
	}
	b.WriteString(": ")
	b.WriteString(p.structureHint(se))
	return &GraphError{Faults: []Fault{{Pos: p.Pos, Msg: b.String()}}}
}

// around says "around the units A and B (lines x, y)".
func around(comps, lines []string) string {
	var parts []string
	if len(comps) > 0 {
		parts = append(parts, "around "+quotedList(comps))
	}
	if len(lines) > 0 {
		parts = append(parts, "on the lines "+quotedList(lines))
	}
	if len(parts) == 0 {
		return ""
	}
	return strings.Join(parts, ", ")
}

func quotedList(names []string) string {
	q := make([]string, len(names))
	for i, n := range names {
		q[i] = fmt.Sprintf("%q", n)
	}
	if len(q) > 8 {
		q = append(q[:8], fmt.Sprintf("and %d more", len(names)-8))
	}
	return strings.Join(q, ", ")
}

// namesIn finds the components and lines named by equations ("AB1: drum
// pressure") and unknowns ("line steam mass flow", "AB1: fuel flow").
func (p *Plant) namesIn(eqs, vars []string) (comps, lines []string) {
	seenC, seenL := map[string]bool{}, map[string]bool{}
	addComp := func(name string) {
		if _, ok := p.byName[name]; ok && !seenC[name] {
			seenC[name] = true
			comps = append(comps, name)
		}
	}
	for _, e := range eqs {
		if i := strings.Index(e, ": "); i > 0 {
			addComp(e[:i])
		}
	}
	for _, v := range vars {
		if rest, ok := strings.CutPrefix(v, "line "); ok {
			for _, suffix := range []string{" mass flow", " pressure", " enthalpy"} {
				if name, ok := strings.CutSuffix(rest, suffix); ok && !seenL[name] {
					seenL[name] = true
					lines = append(lines, name)
				}
			}
			continue
		}
		if i := strings.Index(v, ": "); i > 0 {
			addComp(v[:i])
		}
	}
	sort.Strings(comps)
	sort.Strings(lines)
	return comps, lines
}

// structureHint says what in the plant most likely makes its equations
// not balance, and what to change.
func (p *Plant) structureHint(se *solver.StructureError) string {
	hasMakeUp := false
	for _, c := range p.comps {
		if _, ok := c.(*MakeUp); ok {
			hasMakeUp = true
		}
	}
	if !hasMakeUp {
		return "the plant has no make-up water, so the water it loses (blowdown, condensate not returned, vented steam) is not replaced and its mass balance cannot close; add a make-up into the hotwell (ship:makeup{...} and a line to the feed tank)"
	}
	if sys := p.steamSystems(); len(sys) > 1 {
		return fmt.Sprintf("the boilers raise steam into separate systems (%s): the firing rule shares one steam system among all the boilers and dump condensers; join the systems at one main header (other headers through reducing valves), or describe each system as a plant of its own",
			strings.Join(sys, "; "))
	}
	if len(se.OverEquations) > 0 {
		return "two set points act on one flow (a consumer of a set steam flow or duty fed only by a turbine of a set power, say), or a closed loop of lines has no component that takes up what it gains or loses; give one of them a free quantity"
	}
	return "a line or a component has a quantity that nothing sets (a pump without a discharge pressure or boilers to feed, a line that ends nowhere); give it one"
}

// steamSystems groups the boilers by the steam system they raise steam
// into: the components reached downstream of each boiler's steam outlet
// through headers and valves. It returns one description per group when
// the boilers do not all reach one.
func (p *Plant) steamSystems() []string {
	var boilers []*Boiler
	for _, c := range p.comps {
		if b, ok := c.(*Boiler); ok {
			boilers = append(boilers, b)
		}
	}
	if len(boilers) < 2 {
		return nil
	}
	out := map[string][]string{} // component -> components its outlets feed
	for _, l := range p.lines {
		out[l.From] = append(out[l.From], l.To)
	}
	reach := func(b *Boiler) map[string]bool {
		seen := map[string]bool{}
		var walk func(name string)
		walk = func(name string) {
			for _, to := range out[name] {
				c := p.byName[to]
				if seen[to] {
					continue
				}
				switch c.(type) {
				case *Header, *ReducingValve:
					seen[to] = true
					walk(to)
				}
			}
		}
		walk(b.Name)
		return seen
	}
	type group struct {
		boilers []string
		seen    map[string]bool
	}
	var groups []group
	for _, b := range boilers {
		r := reach(b)
		joined := false
		for i := range groups {
			for h := range r {
				if groups[i].seen[h] {
					groups[i].boilers = append(groups[i].boilers, b.Name)
					for k := range r {
						groups[i].seen[k] = true
					}
					joined = true
					break
				}
			}
			if joined {
				break
			}
		}
		if !joined {
			groups = append(groups, group{boilers: []string{b.Name}, seen: r})
		}
	}
	if len(groups) < 2 {
		return nil
	}
	var desc []string
	for _, g := range groups {
		var hs []string
		for h := range g.seen {
			hs = append(hs, h)
		}
		sort.Strings(hs)
		desc = append(desc, fmt.Sprintf("%s into %s", strings.Join(g.boilers, ", "), strings.Join(hs, ", ")))
	}
	return desc
}

// failureHint says, for a case the solver could not balance, what in the
// case or the plant most likely stops it, or "" when nothing stands out.
func (p *Plant) failureHint(c Case) string {
	for _, u := range p.comps {
		switch v := u.(type) {
		case *Consumer:
			d := v.caseDuty
			if !v.Off && (d.W > 0 || d.SteamKgS > 0 || d.PerFuelJ > 0 || d.SteamPerFuel > 0) {
				return ""
			}
		case *Turbine:
			if v.power > 0 {
				return ""
			}
		case *Header:
			if v.HeatLoss > 0 {
				return ""
			}
		case *FeedTank:
			if v.steam != nil && v.SetT > 0 {
				return ""
			}
		case *MakeUp, *FeedPump, *Boiler, *ExhaustGasEconomiser, *Economiser, *ReducingValve, *Condenser:
			// raise, pass or return steam; take none of their own
		default:
			return "" // a kind this hint does not know may take steam
		}
	}
	return fmt.Sprintf("nothing takes steam in case %q (every consumer and turbine is off or at zero duty), so the balance has no flow to solve for; switch a consumer on, or leave the case out", c.Name)
}
