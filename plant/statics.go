package plant

import "fmt"

// The set pressures of the lines, known before anything is solved: a
// boiler's drum, a reducing valve's set pressure, a feed pump's discharge,
// a turbine's exhaust, a vented tank's ambient, carried on through the
// components that pass their inlet's pressure on (headers, consumers'
// condensate, condensers, economisers). With them a plant that cannot work
// is refused when it is checked, naming the component, before any solve:
// a reducing valve that would raise the pressure, a turbine exhausting at
// or above its inlet, a header joining lines of different pressures. (A
// boiler's feed is not checked against its drum: a plant may leave out its
// feed pump, and the balance then only misses the pump's work.)

// linePressures holds the set pressure of each line whose pressure the
// graph fixes, Pa.
type linePressures struct {
	p map[*Line]float64
}

func (ps *linePressures) of(l *Line) (float64, bool) {
	if l == nil {
		return 0, false
	}
	v, ok := ps.p[l]
	return v, ok
}

// set records the pressure of l and reports whether it was new.
func (ps *linePressures) set(l *Line, v float64) bool {
	if l == nil || !finite(v) || v <= 0 {
		return false
	}
	if _, ok := ps.p[l]; ok {
		return false
	}
	ps.p[l] = v
	return true
}

// pass copies the pressure of in to out, if known.
func (ps *linePressures) pass(in, out *Line) bool {
	if v, ok := ps.of(in); ok {
		return ps.set(out, v)
	}
	return false
}

// The hooks of the set pressures: a component that fixes or passes on
// the pressure of its outlets, and one that checks its lines' pressures.
type (
	pressureSetter interface {
		setPressures(pl *Plant, ps *linePressures) bool
	}
	pressureChecker interface {
		checkPressures(ps *linePressures, fs *faults)
	}
)

// checkPressures works out the set pressures of the lines and lets every
// component check its own.
func (p *Plant) checkPressures(fs *faults) {
	ps := &linePressures{p: map[*Line]float64{}}
	// Each pass fixes at least one line or stops: at most one pass per
	// line.
	for pass := 0; pass <= len(p.lines); pass++ {
		changed := false
		for _, c := range p.comps {
			if s, ok := c.(pressureSetter); ok && s.setPressures(p, ps) {
				changed = true
			}
		}
		if !changed {
			break
		}
	}
	for _, c := range p.comps {
		if k, ok := c.(pressureChecker); ok {
			k.checkPressures(ps, fs)
		}
	}
}

func bara(p float64) string { return fmt.Sprintf("%.3g bar(a)", p/1e5) }

func (u *MakeUp) setPressures(pl *Plant, ps *linePressures) bool {
	if u.P > 0 {
		return ps.set(u.out, u.P)
	}
	return ps.set(u.out, pl.Opt.AmbientPressure)
}

func (u *FeedTank) setPressures(pl *Plant, ps *linePressures) bool {
	if u.P > 0 {
		return ps.set(u.out, u.P)
	}
	return ps.set(u.out, pl.Opt.AmbientPressure)
}

func (u *FeedPump) setPressures(pl *Plant, ps *linePressures) bool {
	if err := u.prepare(pl, Conditions{}); err != nil {
		return false
	}
	return ps.set(u.out, u.discharge)
}

func (u *Boiler) setPressures(_ *Plant, ps *linePressures) bool { return ps.set(u.steam, u.DrumP) }

func (u *ExhaustGasEconomiser) setPressures(_ *Plant, ps *linePressures) bool {
	return ps.set(u.steam, u.DrumP)
}

func (u *ReducingValve) setPressures(_ *Plant, ps *linePressures) bool { return ps.set(u.out, u.P) }

func (u *Turbine) setPressures(_ *Plant, ps *linePressures) bool { return ps.set(u.out, u.ExhaustP) }

func (u *Header) setPressures(_ *Plant, ps *linePressures) bool {
	changed := false
	for _, l := range u.outs {
		if ps.pass(u.ins[0], l) {
			changed = true
		}
	}
	return changed
}

func (u *Consumer) setPressures(_ *Plant, ps *linePressures) bool { return ps.pass(u.in, u.out) }

func (u *Condenser) setPressures(_ *Plant, ps *linePressures) bool { return ps.pass(u.in, u.out) }

func (u *Economiser) setPressures(_ *Plant, ps *linePressures) bool { return ps.pass(u.in, u.out) }

// checkPressures refuses a reducing valve set above its inlet's pressure:
// a reducing valve cannot raise it.
func (u *ReducingValve) checkPressures(ps *linePressures, fs *faults) {
	if pin, ok := ps.of(u.in); ok && u.P > pin*(1+1e-9) {
		fs.add(u.Pos, u.Name, "", "its set pressure %s is above its inlet's %s (line %q): a reducing valve cannot raise the pressure; set it below, or feed it from a higher header",
			bara(u.P), bara(pin), u.in.Name)
	}
}

// checkPressures refuses a turbine whose exhaust is at or above its
// inlet: no steam expands that way.
func (u *Turbine) checkPressures(ps *linePressures, fs *faults) {
	if pin, ok := ps.of(u.in); ok && u.ExhaustP >= pin {
		fs.add(u.Pos, u.Name, "", "its exhaust at %s is not below its inlet's %s (line %q): steam cannot expand through it; give an exhaust below the inlet",
			bara(u.ExhaustP), bara(pin), u.in.Name)
	}
}

// checkPressures refuses a header whose inlets come at different set
// pressures: it takes the first, so the higher would flow into the lower
// unthrottled.
func (u *Header) checkPressures(ps *linePressures, fs *faults) {
	p0, ok := ps.of(u.ins[0])
	if !ok {
		return
	}
	for _, l := range u.ins[1:] {
		if p, ok := ps.of(l); ok && (p > p0*1.01 || p < p0/1.01) {
			fs.add(u.Pos, u.Name, "", "its inlets %q at %s and %q at %s come at different pressures: a header joins lines of one pressure; feed the lower-pressure header through a reducing valve",
				u.ins[0].Name, bara(p0), l.Name, bara(p))
		}
	}
}
