package plant

import (
	"fmt"
	"math"
	"strings"

	"steamcase/plant/combustion"
)

// Inert gas from the boilers (tankers).
//
// A boiler may be declared an inert-gas source (Boiler.InertGas): its
// uptake feeds the inert-gas system. While the case's cargo pumps run
// (turbines driving a cargo pump, not off), the sources must deliver flue
// gas of at most Options.InertGasO2Max of O2 in the dry gas (default 5 %
// by volume) at a volume flow of at least Options.InertGasCapacity times
// the cargo pumps' total rate (default 125 %): the figures of the
// inert-gas rules of SOLAS II-2 reg. 4.5.5 and the FSS Code ch. 15 (from
// memory; the ship's own system and its instructions govern).
//
// The flue gas comes from the boiler's combustion model at the case's
// firing rate: a maker's flue-gas table gives the dry O2 against load, a
// furnace model its air ratio against load; the products of complete
// combustion at that air (plant/combustion.Fire, the stoichiometry of
// docs/reference/plant-checks.md §2) give the O2 in the dry gas and the dry gas's volume
// per kg of fuel. A boiler with a plain efficiency table has no
// combustion model and cannot be a source (an error where it is
// declared).
//
// Simplifications, named: the gas volume is the dry flue gas at normal
// conditions (0 °C, 101.325 kPa) against the cargo's volume, which is
// conservative (the scrubbed gas delivered to the tanks at 25-40 °C and
// saturated with water takes more room); every source may give all its
// gas to the system (no fan limit); with several sources the highest O2
// of them must be within the limit (the analyser reads the mixed main,
// but a source above the limit spoils it). A source whose burner cycles
// below its minimum delivers gas only part of the time: not met.
//
// The minimum firing rate that meets the demand is searched over the
// sources' load (the sources firing in the case, or all of them if none
// fires, at one load fraction of their MCR): at each load the fuel is
// what the boiler's efficiency model gives for its steam with the heat
// per kg of steam and the feed of the case's solution (held; the feed
// temperature hardly moves with one boiler's load). Where a source has to
// fire harder for inert gas than for steam, the steam it raises beyond
// the case's must be dumped (the plant's dump condenser takes it) and the
// fuel that costs is reported; the case's own balance is not changed.
// The line in the report never replaces the O2 analyser.

// InertGasResult is the inert-gas check of a case.
type InertGasResult struct {
	// Sources are the boilers declared as sources; Firing those that fire.
	Sources, Firing []string
	// CargoRateM3S is the running cargo pumps' rate, m³/s, and RequiredM3S
	// Capacity times it.
	CargoRateM3S, RequiredM3S float64
	O2Max, Capacity           float64
	// DeliveredNm3S is the firing sources' dry flue gas at normal
	// conditions, m³/s; O2Dry the highest O2 of them in the dry gas.
	DeliveredNm3S, O2Dry float64
	Met                  bool
	// MinLoad is the lowest load (fraction of MCR, each source alike) at
	// which the sources meet the demand, if MinLoadFound.
	MinLoad      float64
	MinLoadFound bool
	// ExtraSteamKgS is the steam the sources raise beyond the case's when
	// they fire at MinLoad, to be dumped, and ExtraFuelKgS its fuel.
	ExtraSteamKgS, ExtraFuelKgS float64
	// Note says why it is not met, or what the figures do not cover.
	Note string
}

// checkInertGas adds a fault for an inert-gas limit out of range.
func (p *Plant) checkInertGas(fs *faults) {
	if o := p.Opt.InertGasO2Max; !(o > 0 && o < 0.21) {
		fs.add(p.Pos, "", "", "the inert gas's highest O2 must be a fraction between 0 and 21 %%; got %g", o)
	}
	if c := p.Opt.InertGasCapacity; !(c > 0 && c <= 10) {
		fs.add(p.Pos, "", "", "the inert gas's capacity must be a fraction of the cargo pumps' rate between 0 and 1000 %%; got %g", c)
	}
}

// igSource is a source's part at one load.
type igSource struct {
	b   *Boiler
	hpk float64 // heat to water per kg of steam in the case, J/kg
	ev  *eval
}

// at returns the source's fuel (kg/s), dry O2 and dry flue gas (Nm³/s)
// when it raises load·MCR of steam (see the comment at the top).
func (g igSource) at(load float64) (fuel, o2, vol float64, err error) {
	u := g.b
	op, _, err := u.operation(g.ev)
	if err != nil {
		return 0, 0, 0, err
	}
	op.Load = load
	q := load * u.MCR * g.hpk
	fuel = q / (0.85 * u.Fuel.LHV)
	var pt EfficiencyPoint
	for range 3 {
		op.FuelFlow = fuel
		if pt, err = u.Efficiency.Efficiency(op); err != nil {
			return 0, 0, 0, err
		}
		eta := pt.Eta
		if u.EtaFactor != 0 {
			eta *= u.EtaFactor
		}
		if !(eta > 0 && eta <= 1) {
			return 0, 0, 0, fmt.Errorf("efficiency %g at load %.0f %%", eta, 100*load)
		}
		fuel = q / (eta * u.Fuel.LHV)
		if lo, ok := u.Efficiency.(interface{ loadOnly() bool }); ok && lo.loadOnly() {
			break // the model does not read the fuel flow
		}
	}
	if pt.Products == nil {
		return 0, 0, 0, fmt.Errorf("its efficiency model gives no flue gas")
	}
	return fuel, pt.Products.MoleFractions(false)[combustion.O2], fuel * pt.Products.NormalVolume(false), nil
}

// heatPerKg is the heat the boiler puts into water per kg of steam at the
// unknowns of ev: (h_steam − h_feed) + b/(1 − b)·(h_f,drum − h_feed) with
// b the blowdown fraction of the feed.
func (u *Boiler) heatPerKg(ev *eval) (float64, error) {
	hs, err := u.mh.get2(u.DrumP, u.dryness(), hPX)
	if err != nil {
		return 0, err
	}
	hf, err := u.mf.get1(u.DrumP, hLiquidSat)
	if err != nil {
		return 0, err
	}
	hfw := ev.h(u.feed)
	b := u.blowdown()
	return hs - hfw + b/(1-b)*(hf-hfw), nil
}

// igMinLoad is the lowest load (fraction of MCR, the sources alike) at
// which the sources deliver at least required Nm³/s of dry gas with at
// most o2Max of O2, searched from their burner minimum (at least 5 %) to
// their limit in 40 steps and refined by bisection; found is false when
// even their limit does not.
func igMinLoad(src []igSource, required, o2Max float64) (load float64, found bool, err error) {
	if len(src) == 0 {
		return 0, false, nil
	}
	meets := func(load float64) (bool, error) {
		var vol, o2 float64
		for _, g := range src {
			_, o, v, err := g.at(load)
			if err != nil {
				return false, wrapErr(g.b, err)
			}
			vol += v
			o2 = math.Max(o2, o)
		}
		return o2 <= o2Max*(1+1e-9) && vol >= required, nil
	}
	lo, hi := 1.0, 0.0
	for _, g := range src {
		lo = math.Min(lo, math.Max(g.b.MinLoad(), 0.05))
		hi = math.Max(hi, g.b.maxLoad())
	}
	const steps = 40
	prev := lo
	for k := 0; k <= steps; k++ {
		l := lo + (hi-lo)*float64(k)/steps
		ok, err := meets(l)
		if err != nil {
			return 0, false, err
		}
		if !ok {
			prev = l
			continue
		}
		if k > 0 {
			a, b := prev, l
			for range 30 {
				m := 0.5 * (a + b)
				ok, err := meets(m)
				if err != nil {
					return 0, false, err
				}
				if ok {
					b = m
				} else {
					a = m
				}
			}
			l = b
		}
		return l, true, nil
	}
	return 0, false, nil
}

// inertGas checks the inert-gas demand of the case (see above) and
// records it in cr.
func (p *Plant) inertGas(cr *CaseResult) error {
	s := p.s
	var rate float64
	for _, c := range cr.Consumers {
		rate += c.CargoRate
	}
	var sources []*Boiler
	for _, b := range s.asm.roles.boilers {
		if b.InertGas {
			sources = append(sources, b)
		}
	}
	if rate <= 0 || len(sources) == 0 {
		return nil
	}
	ig := &InertGasResult{CargoRateM3S: rate, O2Max: p.Opt.InertGasO2Max, Capacity: p.Opt.InertGasCapacity}
	ig.RequiredM3S = ig.Capacity * rate
	cr.InertGas = ig
	ev := &eval{x: s.last, cond: s.ev.cond, pl: p}
	var firing []igSource
	cycling := false
	for _, b := range sources {
		ig.Sources = append(ig.Sources, b.Name)
		for _, br := range cr.Boilers {
			if br.Name != b.Name || !br.Firing || br.SteamKgS <= 0 {
				continue
			}
			ig.Firing = append(ig.Firing, b.Name)
			ig.DeliveredNm3S += br.DryFlueNm3S
			ig.O2Dry = math.Max(ig.O2Dry, br.O2Dry)
			cycling = cycling || br.Cycling
		}
	}
	for _, b := range sources {
		if len(ig.Firing) > 0 && !p.firing(b) {
			continue
		}
		hpk, err := b.heatPerKg(ev)
		if err != nil {
			return wrapErr(b, err)
		}
		firing = append(firing, igSource{b: b, hpk: hpk, ev: ev})
	}
	ig.Met = len(ig.Firing) > 0 && !cycling && ig.O2Dry <= ig.O2Max*(1+1e-9) && ig.DeliveredNm3S >= ig.RequiredM3S*(1-1e-9)

	// The lowest load at which the sources meet it.
	var err error
	if ig.MinLoad, ig.MinLoadFound, err = igMinLoad(firing, ig.RequiredM3S, ig.O2Max); err != nil {
		return err
	}

	// What firing harder for inert gas costs.
	switch {
	case ig.Met:
	case !ig.MinLoadFound:
		ig.Note = fmt.Sprintf("the inert-gas sources cannot meet it even at their limit (O2 at most %.1f %% dry and %.0f m³/h)", 100*ig.O2Max, ig.RequiredM3S*3600)
	case len(ig.Firing) == 0:
		ig.Note = "no inert-gas source fires: one must fire for the discharge"
	case cycling:
		ig.Note = "a source's burner cycles below its minimum: its gas comes only part of the time"
	}
	if !ig.Met && !ig.MinLoadFound {
		cr.warn("%s", InertGasLine(ig))
	}
	if ig.Met || !ig.MinLoadFound {
		return nil
	}
	for _, g := range firing {
		var load float64
		for _, br := range cr.Boilers {
			if br.Name == g.b.Name && br.Firing {
				load = br.LoadFraction
			}
		}
		if load >= ig.MinLoad {
			continue
		}
		f1, _, _, err := g.at(ig.MinLoad)
		if err != nil {
			return wrapErr(g.b, err)
		}
		f0 := 0.0
		if load > 0 {
			if f0, _, _, err = g.at(load); err != nil {
				return wrapErr(g.b, err)
			}
		}
		ig.ExtraSteamKgS += (ig.MinLoad - load) * g.b.MCR
		ig.ExtraFuelKgS += f1 - f0
	}
	defer func() {
		if !ig.Met {
			cr.warn("%s", InertGasLine(ig))
		}
	}()
	if ig.ExtraSteamKgS > 0 && len(s.asm.roles.dumps) == 0 {
		if ig.Note != "" {
			ig.Note += "; "
		}
		ig.Note += "the plant has no dump condenser to take the steam raised for inert gas"
	}
	return nil
}

// InertGasLine words the inert-gas check as the report's line.
func InertGasLine(g *InertGasResult) string {
	var b strings.Builder
	src := strings.Join(g.Firing, ", ")
	if src == "" {
		src = "no source firing"
	}
	fmt.Fprintf(&b, "inert gas (%s): O2 %.1f %% dry (at most %.0f %%), %.0f Nm³/h dry against %.0f m³/h (%.0f %% of the cargo pumps' %.0f m³/h): ",
		src, 100*g.O2Dry, 100*g.O2Max, g.DeliveredNm3S*3600, g.RequiredM3S*3600, 100*g.Capacity, g.CargoRateM3S*3600)
	if g.Met {
		b.WriteString("met")
	} else {
		b.WriteString("NOT MET")
	}
	if g.MinLoadFound {
		fmt.Fprintf(&b, "; the sources meet it from %.0f %% of their MCR", 100*g.MinLoad)
	}
	if g.ExtraSteamKgS > 0 {
		fmt.Fprintf(&b, "; firing there for inert gas raises %.0f kg/h of steam to dump and burns %.1f kg/h more fuel", g.ExtraSteamKgS*3600, g.ExtraFuelKgS*3600)
	}
	if g.Note != "" {
		b.WriteString("; " + g.Note)
	}
	return b.String()
}
