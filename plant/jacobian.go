package plant

import (
	"math"

	"gonum.org/v1/gonum/mat"

	"steamcase/plant/water"
)

// The plant's analytic Jacobian. Every unit writes the partial derivatives
// of its own equations (its rows) with respect to the unknowns its pattern
// lists; the dispatch equations add theirs. The solver zeroes the matrix
// before each call, and every entry is added (+=), so a line that a unit
// sees twice (a header feeding itself) comes out right.
//
// What is exact and what is differenced:
//   - Everything linear or bilinear in the line unknowns (m, p, h), the
//     vented and drained flows and the fuel flows is differentiated by hand.
//   - The derivative of a water property (h(p,T), T(p,h), v(p,h), h at
//     saturation, condensate h(p) at a set subcooling) is a forward
//     difference of that scalar property function alone, from the value
//     the unit's memo holds, with a step of propRel relative to the
//     argument (dProp1, dProp2); a backward one where the forward step
//     leaves the property's range. (Central differences cost twice the
//     property calls for no gain a Newton step can use.)
//   - The turbine's isentropic exhaust enthalpy h_s(p_out, s(p_in, h_in))
//     is differentiated by the Gibbs relation dh = T·ds + v·dp, which holds
//     for the IF97 states in and out of the two-phase region: ∂s/∂h|p = 1/T,
//     ∂s/∂p|h = −v/T, ∂h/∂s|p = T, ∂h/∂p|s = v.
//   - A boiler's efficiency from a maker's table (EfficiencyTable) is
//     differentiated along the active segment. Any other efficiency model
//     (flue-gas table, furnace model) and the flue-gas economiser's duty are
//     not cheap to differentiate: their terms are one-sided (forward, else
//     backward) differences of the unit's own function over the columns of
//     its pattern (unitFD), with the step the solver's own differences use.
//     A boiler with a flue-gas economiser has its efficiency differenced by
//     the economiser, in the same evaluations as the duty.
//   - The exhaust-gas economiser's gas side is fixed for the case, so its
//     rows are exact.
//   - At non-smooth points the derivative is that of the active branch, as
//     the residual chose it: the feed tank's mix / heating set point /
//     saturation switch, heating or venting, a boiler cycling below its
//     burner minimum (unitFD keeps the step on the side of the branch). A
//     state exactly on a phase boundary (a venting feed tank delivers
//     saturated water to the pump) takes the side a forward step reaches.
//
// After its first call the Jacobian allocates nothing, apart from what a
// combustion efficiency model allocates in its own evaluations.

// propRel is the relative step of the differences of water properties:
// √ε, the usual step of a forward difference, whose error is then near
// 1e-8 relative. The IF97 refinement reproduces its results far closer
// than the step changes them (checked by TestJacobianAgainstFiniteDifferences
// against central differences).
const propRel = 1.4901161193847656e-08

// fdRel is the relative step of the one-sided differences of a unit's own
// function (unitFD): √ε, as the solver takes for its own differences.
const fdRel = propRel

// jacobian is the solver's Problem.Jacobian.
func (p *Plant) jacobian(j *mat.Dense, x []float64) error {
	ev := &p.ev
	ev.x = x
	for _, u := range p.units {
		if err := u.jacobian(ev, j); err != nil {
			return domainErr{err}
		}
	}
	p.dispatchJacobian(j)
	return nil
}

// jac adds entries to the raw storage of the Jacobian.
type jac struct {
	data   []float64
	stride int
}

func jacOf(j *mat.Dense) jac {
	raw := j.RawMatrix()
	return jac{data: raw.Data, stride: raw.Stride}
}

// add adds v to entry (row, col); a negative row or column (an equation or
// unknown that the unit does not have) is skipped.
func (a jac) add(row, col int, v float64) {
	if row < 0 || col < 0 {
		return
	}
	a.data[row*a.stride+col] += v
}

func propStep(a float64) float64 {
	if h := propRel * math.Abs(a); h > 0 {
		return h
	}
	return propRel
}

// dProp1 is df/da by a forward difference of f alone from its value f0 at
// a (which the unit's memo holds from the residual), or a backward one
// where the forward step leaves the property's range.
func dProp1(f func(float64) (float64, error), a, f0 float64) (float64, error) {
	h := propStep(a)
	ap := a + h
	fp, err := f(ap)
	if err == nil {
		return (fp - f0) / (ap - a), nil
	}
	am := a - h
	fm, err2 := f(am)
	if err2 == nil {
		return (f0 - fm) / (a - am), nil
	}
	return 0, err
}

// dPropA is ∂f(a, b)/∂a by a one-sided difference of f alone, as dProp1.
func dPropA(f func(a, b float64) (float64, error), a, b, f0 float64) (float64, error) {
	return dProp1(func(x float64) (float64, error) { return f(x, b) }, a, f0)
}

// dPropB is ∂f(a, b)/∂b by a one-sided difference of f alone, as dProp1.
func dPropB(f func(a, b float64) (float64, error), a, b, f0 float64) (float64, error) {
	return dProp1(func(x float64) (float64, error) { return f(a, x) }, b, f0)
}

// dProp2 returns both partial derivatives of f(a, b), as dProp1.
func dProp2(f func(a, b float64) (float64, error), a, b, f0 float64) (da, db float64, err error) {
	if da, err = dPropA(f, a, b, f0); err != nil {
		return 0, 0, err
	}
	db, err = dPropB(f, a, b, f0)
	return da, db, err
}

// unitFD is the derivative of a unit's own function f (up to two values)
// with respect to the unknown col, by a forward difference (a backward one
// where the forward step leaves the bounds, the domain, or the branch the
// base point is on). f returns its values and a branch key; f0 and
// branch0 are those at the base point. ev.x is changed during the call and
// restored exactly.
func unitFD(ev *eval, col int, f0 [2]float64, branch0 int, f func() ([2]float64, int, error)) ([2]float64, error) {
	a := ev.pl.asm
	x := ev.x
	x0 := x[col]
	h := fdRel * math.Max(math.Abs(x0), a.xScale[col])
	var firstErr error
	for _, s := range [2]float64{h, -h} {
		xt := x0 + s
		if xt < a.lo[col] || xt > a.hi[col] {
			continue
		}
		x[col] = xt
		v, br, err := f()
		x[col] = x0
		if err != nil {
			if firstErr == nil {
				firstErr = err
			}
			continue
		}
		if br != branch0 {
			continue
		}
		d := xt - x0
		return [2]float64{(v[0] - f0[0]) / d, (v[1] - f0[1]) / d}, nil
	}
	if firstErr != nil {
		return [2]float64{}, firstErr
	}
	// Both sides change branch (a point exactly on a switch, or a step
	// across a narrow branch): the active branch is constant there.
	return [2]float64{}, nil
}

// ---------------------------------------------------------------------------

func (u *MakeUp) jacobian(ev *eval, j *mat.Dense) error {
	a := jacOf(j)
	p := ev.p(u.out)
	h0, err := u.mh.get2(p, u.T, hPT)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	dhdp, err := dPropA(hPT, p, u.T, h0)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	a.add(u.eqs[0], u.out.pIdx(), 1)
	a.add(u.eqs[1], u.out.hIdx(), 1)
	a.add(u.eqs[1], u.out.pIdx(), -dhdp)
	return nil
}

func (u *FeedTank) jacobian(ev *eval, j *mat.Dense) error {
	a := jacOf(j)
	t, err := u.evaluate(ev)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	pOut, hOut, mOut := t.pOut, t.hOut, t.mOut
	mSt, hSt, hg := t.mSt, t.hSt, t.hg
	hMix, branch, heating := t.hMix, t.branch, t.heating
	var dqdp, dqdh float64
	if u.UA > 0 {
		t0, err := u.mt.get2(pOut, hOut, tPH)
		if err != nil {
			return wrapUnitErr(u, err)
		}
		dtdp, dtdh, err := dProp2(tPH, pOut, hOut, t0)
		if err != nil {
			return wrapUnitErr(u, err)
		}
		dqdp, dqdh = u.UA*dtdp, u.UA*dtdh
	}
	ref := u.ins[0]
	den := t.mIn + epsFlow

	e := u.eqs
	a.add(e[0], u.out.pIdx(), 1)
	for _, l := range u.ins {
		a.add(e[1], l.mIdx(), 1)
		a.add(e[2], l.mIdx(), ev.h(l))
		a.add(e[2], l.hIdx(), ev.m(l))
	}
	if u.steam != nil {
		a.add(e[1], u.steam.mIdx(), 1)
		a.add(e[2], u.steam.mIdx(), hSt)
		a.add(e[2], u.steam.hIdx(), mSt)
	}
	a.add(e[1], u.out.mIdx(), -1)
	a.add(e[1], u.vent, -1)
	a.add(e[2], u.out.pIdx(), -dqdp)
	a.add(e[2], u.out.hIdx(), -dqdh-mOut)
	a.add(e[2], u.out.mIdx(), -hOut)
	a.add(e[2], u.vent, -hg)

	a.add(e[3], u.out.hIdx(), 1)
	if branch == tankMix {
		for _, l := range u.ins {
			a.add(e[3], l.mIdx(), -(ev.h(l)-hMix)/den)
			a.add(e[3], l.hIdx(), -ev.m(l)/den)
		}
		a.add(e[3], ref.hIdx(), -epsFlow/den)
		a.add(e[3], u.out.pIdx(), dqdp/den)
		a.add(e[3], u.out.hIdx(), dqdh/den)
	}
	if u.steam != nil {
		if heating {
			a.add(e[4], u.vent, 1)
		} else {
			a.add(e[4], u.steam.mIdx(), 1)
		}
	}
	return nil
}

func (u *FeedPump) jacobian(ev *eval, j *mat.Dense) error {
	a := jacOf(j)
	pIn, hIn, pOut := ev.p(u.in), ev.h(u.in), ev.p(u.out)
	v, err := u.mv.get2(pIn, hIn, vPH)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	dvdp, dvdh, err := dProp2(vPH, pIn, hIn, v)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	dp := pOut - pIn
	a.add(u.eqs[0], u.out.mIdx(), 1)
	a.add(u.eqs[0], u.in.mIdx(), -1)
	a.add(u.eqs[1], u.out.pIdx(), 1)
	a.add(u.eqs[2], u.out.hIdx(), 1)
	a.add(u.eqs[2], u.in.hIdx(), -1-dvdh*dp/u.Eta)
	a.add(u.eqs[2], u.in.pIdx(), (v-dvdp*dp)/u.Eta)
	a.add(u.eqs[2], u.out.pIdx(), -v/u.Eta)
	return nil
}

func (u *Header) jacobian(ev *eval, j *mat.Dense) error {
	a := jacOf(j)
	mIn, hMix := u.mix(ev)
	den := mIn + epsFlow
	ref := u.ins[0]
	// addMix adds c·∂hMix/∂x to row.
	addMix := func(row int, c float64) {
		for _, l := range u.ins {
			a.add(row, l.mIdx(), c*(ev.h(l)-hMix)/den)
			a.add(row, l.hIdx(), c*ev.m(l)/den)
		}
		a.add(row, ref.hIdx(), c*epsFlow/den)
	}
	for _, l := range u.ins {
		a.add(u.eqMass, l.mIdx(), 1)
	}
	for _, l := range u.outs {
		a.add(u.eqMass, l.mIdx(), -1)
	}
	a.add(u.eqMass, u.drain, -1)
	for k, l := range u.outs {
		a.add(u.eqP[k], l.pIdx(), 1)
		a.add(u.eqP[k], ref.pIdx(), -1)
		a.add(u.eqH[k], l.hIdx(), 1)
		addMix(u.eqH[k], -1)
	}
	if u.drain >= 0 {
		p0 := ev.p(ref)
		hf, err := u.mf.get1(p0, hLiquidSat)
		if err != nil {
			return wrapUnitErr(u, err)
		}
		dhf, err := dProp1(hLiquidSat, p0, hf)
		if err != nil {
			return wrapUnitErr(u, err)
		}
		md := ev.x[u.drain]
		a.add(u.eqDrain, u.drain, hMix-hf)
		addMix(u.eqDrain, md)
		a.add(u.eqDrain, ref.pIdx(), -md*dhf)
	}
	return nil
}

func (u *ReducingValve) jacobian(ev *eval, j *mat.Dense) error {
	a := jacOf(j)
	a.add(u.eqs[0], u.out.mIdx(), 1)
	a.add(u.eqs[0], u.in.mIdx(), -1)
	a.add(u.eqs[1], u.out.pIdx(), 1)
	a.add(u.eqs[2], u.out.hIdx(), 1)
	a.add(u.eqs[2], u.in.hIdx(), -1)
	return nil
}

func (u *Consumer) jacobian(ev *eval, j *mat.Dense) error {
	a := jacOf(j)
	p := ev.p(u.in)
	hc, err := u.mc.get2(p, u.SubCooling, hCondensate)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	dhc, err := dPropA(hCondensate, p, u.SubCooling, hc)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	m := ev.m(u.in)
	f := u.factor()
	e0 := u.eqs[0]
	switch {
	case u.Off != 0:
		a.add(e0, u.in.mIdx(), scaleQ)
	case u.SteamPerFuel > 0 && u.fuel >= 0:
		a.add(e0, u.in.mIdx(), scaleQ)
		a.add(e0, u.fuel, -f*u.SteamPerFuel*scaleQ)
	case u.SteamFlow > 0:
		a.add(e0, u.in.mIdx(), scaleQ)
	default:
		a.add(e0, u.in.mIdx(), ev.h(u.in)-hc)
		a.add(e0, u.in.hIdx(), m)
		a.add(e0, u.in.pIdx(), -m*dhc)
		if u.DutyPerFuel > 0 && u.fuel >= 0 {
			a.add(e0, u.fuel, -f*u.DutyPerFuel)
		}
	}
	if u.out != nil {
		hr, err := u.hReturn(p, hc)
		if err != nil {
			return wrapUnitErr(u, err)
		}
		dhr := dhc
		if u.ReturnT != 0 {
			if dhr, err = dPropA(hPT, p, u.ReturnT, hr); err != nil {
				return wrapUnitErr(u, err)
			}
		}
		a.add(u.eqs[1], u.out.mIdx(), 1)
		a.add(u.eqs[1], u.in.mIdx(), -u.ReturnFraction)
		a.add(u.eqs[2], u.out.pIdx(), 1)
		a.add(u.eqs[2], u.in.pIdx(), -1)
		a.add(u.eqs[3], u.out.hIdx(), 1)
		a.add(u.eqs[3], u.in.pIdx(), -dhr)
	}
	return nil
}

func (u *Turbine) jacobian(ev *eval, j *mat.Dense) error {
	a := jacOf(j)
	pIn, hIn, pOut := ev.p(u.in), ev.h(u.in), ev.p(u.out)
	key := [3]float64{pIn, hIn, pOut}
	if !u.jset || u.jkey != key {
		s, err := u.ms.get2(pIn, hIn, water.SPH)
		if err != nil {
			return wrapUnitErr(u, err)
		}
		in, err := water.PH(pIn, hIn)
		if err != nil {
			return wrapUnitErr(u, err)
		}
		out, err := water.PS(pOut, s)
		if err != nil {
			return wrapUnitErr(u, err)
		}
		// h_s = h(p_out, s(p_in, h_in)) by dh = T·ds + v·dp at both ends.
		u.jval = [3]float64{out.T / in.T, -out.T * in.V / in.T, out.V}
		u.jkey, u.jset = key, true
	}
	dhsdh, dhsdp, dhsdpo := u.jval[0], u.jval[1], u.jval[2]
	em := u.etaMech()
	m := ev.m(u.in)
	a.add(u.eqs[0], u.out.pIdx(), 1)
	a.add(u.eqs[1], u.out.hIdx(), 1)
	a.add(u.eqs[1], u.in.hIdx(), -1+u.EtaIs*(1-dhsdh))
	a.add(u.eqs[1], u.in.pIdx(), -u.EtaIs*dhsdp)
	a.add(u.eqs[1], u.out.pIdx(), -u.EtaIs*dhsdpo)
	a.add(u.eqs[2], u.in.mIdx(), (hIn-ev.h(u.out))*em)
	a.add(u.eqs[2], u.in.hIdx(), m*em)
	a.add(u.eqs[2], u.out.hIdx(), -m*em)
	a.add(u.eqs[3], u.out.mIdx(), 1)
	a.add(u.eqs[3], u.in.mIdx(), -1)
	return nil
}

func (u *Condenser) jacobian(ev *eval, j *mat.Dense) error {
	a := jacOf(j)
	p := ev.p(u.in)
	hc, err := u.mc.get2(p, u.SubCooling, hCondensate)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	dhc, err := dPropA(hCondensate, p, u.SubCooling, hc)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	a.add(u.eqs[0], u.out.mIdx(), 1)
	a.add(u.eqs[0], u.in.mIdx(), -1)
	a.add(u.eqs[1], u.out.pIdx(), 1)
	a.add(u.eqs[1], u.in.pIdx(), -1)
	a.add(u.eqs[2], u.out.hIdx(), 1)
	a.add(u.eqs[2], u.in.pIdx(), -dhc)
	return nil
}

func b2i(b bool) int {
	if b {
		return 1
	}
	return 0
}

func (u *Boiler) jacobian(ev *eval, j *mat.Dense) error {
	a := jacOf(j)
	hf, err := u.mf.get1(u.DrumP, hLiquidSat)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	pt, cycling, err := u.eta(ev)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	eta := pt.Eta
	fuel := ev.x[u.fuel]
	mf, ms := ev.m(u.feed), ev.m(u.steam)
	hfw, hs := ev.h(u.feed), ev.h(u.steam)
	e := u.eqs
	a.add(e[0], u.steam.pIdx(), 1)
	a.add(e[1], u.steam.hIdx(), 1)
	a.add(e[2], u.feed.mIdx(), 1-u.blowdown())
	a.add(e[2], u.steam.mIdx(), -1)

	// r = fuel·LHV·η − q, q = ms·(hs − hfw) + (mf − ms)·(hf − hfw).
	lhv := u.Fuel.LHV
	a.add(e[3], u.fuel, lhv*eta)
	a.add(e[3], u.steam.mIdx(), -(hs - hf))
	a.add(e[3], u.steam.hIdx(), -ms)
	a.add(e[3], u.feed.hIdx(), mf)
	a.add(e[3], u.feed.mIdx(), -(hf - hfw))

	// The efficiency's own dependence on the unknowns.
	if t, ok := u.Efficiency.(*EfficiencyTable); ok {
		// A maker's table depends on the load alone, held at the burner
		// minimum while the boiler cycles.
		if !cycling {
			k := 1.0
			if u.EtaFactor != 0 {
				k = u.EtaFactor
			}
			slope := tableSlope(t.Load, t.Eta, ms/u.MCR)
			a.add(e[3], u.steam.mIdx(), fuel*lhv*k*slope/u.MCR)
		}
		return nil
	}
	if u.economiser(ev) != nil {
		// The economiser on this boiler's gas differences the efficiency
		// together with its own duty (one model evaluation per unknown).
		return nil
	}
	etaOf := func() ([2]float64, int, error) {
		pt, c, err := u.eta(ev)
		return [2]float64{pt.Eta}, b2i(c), err
	}
	for _, col := range [4]int{u.steam.mIdx(), u.feed.pIdx(), u.feed.hIdx(), u.fuel} {
		d, err := unitFD(ev, col, [2]float64{eta}, b2i(cycling), etaOf)
		if err != nil {
			return wrapUnitErr(u, err)
		}
		a.add(e[3], col, fuel*lhv*d[0])
	}
	return nil
}

// economiser returns the flue-gas economiser on the boiler's gas, or nil.
func (u *Boiler) economiser(ev *eval) *Economiser {
	for _, x := range ev.pl.units {
		if e, ok := x.(*Economiser); ok && e.b == u {
			return e
		}
	}
	return nil
}

// tableSlope is the derivative of interpolate(loads, vals, x) with respect
// to x on the segment that interpolate takes: zero where it holds an end
// value.
func tableSlope(loads, vals []float64, x float64) float64 {
	n := len(loads)
	if x <= loads[0] || x >= loads[n-1] {
		return 0
	}
	i := 1
	for loads[i] < x {
		i++
	}
	return (vals[i] - vals[i-1]) / (loads[i] - loads[i-1])
}

func (u *ExhaustGasEconomiser) jacobian(ev *eval, j *mat.Dense) error {
	// The gas side is fixed for the case (prepare); only the water side
	// depends on the unknowns.
	a := jacOf(j)
	ms := ev.m(u.steam)
	a.add(u.eqs[0], u.steam.pIdx(), 1)
	a.add(u.eqs[1], u.steam.hIdx(), 1)
	a.add(u.eqs[2], u.feed.mIdx(), 1)
	a.add(u.eqs[2], u.steam.mIdx(), -1)
	a.add(u.eqs[3], u.steam.mIdx(), ev.h(u.steam)-ev.h(u.feed))
	a.add(u.eqs[3], u.steam.hIdx(), ms)
	a.add(u.eqs[3], u.feed.hIdx(), -ms)
	if u.PreheatUA <= 0 {
		return nil
	}
	// The preheating section's duty depends on the feed's flow and state:
	// its derivatives by differences of that duty alone.
	pre, err := u.preheat(ev)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	f0 := [2]float64{pre.Q}
	q := func() ([2]float64, int, error) {
		r, err := u.preheat(ev)
		return [2]float64{r.Q}, 0, err
	}
	for _, col := range [3]int{u.feed.mIdx(), u.feed.pIdx(), u.feed.hIdx()} {
		d, err := unitFD(ev, col, f0, 0, q)
		if err != nil {
			return wrapUnitErr(u, err)
		}
		a.add(u.eqs[3], col, -d[0])
	}
	return nil
}

func (u *Economiser) jacobian(ev *eval, j *mat.Dense) error {
	a := jacOf(j)
	m := ev.m(u.in) + ecoFlowFloor
	a.add(u.eqs[0], u.out.mIdx(), 1)
	a.add(u.eqs[0], u.in.mIdx(), -1)
	a.add(u.eqs[1], u.out.pIdx(), 1)
	a.add(u.eqs[1], u.in.pIdx(), -1)
	e := u.eqs[2]
	a.add(e, u.in.mIdx(), ev.h(u.out)-ev.h(u.in))
	a.add(e, u.out.hIdx(), m)
	a.add(e, u.in.hIdx(), -m)
	// The duty: a rating of the exchanger on the boiler's flue gas, by
	// differences of the economiser's own duty. The boiler's efficiency
	// (its row) is differenced in the same evaluations: the duty evaluates
	// it at the same point.
	res, g, err := u.duty(ev)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	b := u.b
	f0 := [2]float64{res.Q, g.pt.Eta}
	// The branch is whether the boiler cycles below its burner minimum;
	// eta answers from its cache, just filled by duty.
	_, cycling, err := b.eta(ev)
	if err != nil {
		return wrapUnitErr(u, err)
	}
	q := func() ([2]float64, int, error) {
		r, g, err := u.duty(ev)
		if err != nil {
			return [2]float64{}, 0, err
		}
		_, c, err := b.eta(ev)
		return [2]float64{r.Q, g.pt.Eta}, b2i(c), err
	}
	// The water inlet first: it leaves the boiler's operating point, and
	// so its cached efficiency, as it is.
	cols := [7]int{u.in.mIdx(), u.in.pIdx(), u.in.hIdx(), b.fuel, b.steam.mIdx(), b.feed.pIdx(), b.feed.hIdx()}
	fuelLHV := ev.x[b.fuel] * b.Fuel.LHV
	for i, col := range cols {
		if seen(cols[:i], col) {
			continue // the same unknown reached twice
		}
		d, err := unitFD(ev, col, f0, b2i(cycling), q)
		if err != nil {
			return wrapUnitErr(u, err)
		}
		a.add(e, col, -d[0])
		if i >= 3 {
			a.add(b.eqs[3], col, fuelLHV*d[1])
		}
	}
	return nil
}

func seen(cols []int, c int) bool {
	for _, x := range cols {
		if x == c {
			return true
		}
	}
	return false
}

// dispatchJacobian writes the derivatives of the dispatch equations (see
// dispatchResidual), all linear in the steam flows.
func (p *Plant) dispatchJacobian(j *mat.Dense) {
	if len(p.dispEqs) == 0 {
		return
	}
	a := jacOf(j)
	k := 0
	next := func() int { k++; return p.dispEqs[k-1] }
	firing := p.disp.buf[:0]
	for i, b := range p.boilers {
		if p.disp.fire[i] {
			firing = append(firing, b)
		} else {
			a.add(next(), b.steam.mIdx(), 1)
		}
	}
	if len(firing) == 0 {
		for _, d := range p.dumps[1:] {
			a.add(next(), d.in.mIdx(), 1)
		}
		return
	}
	for _, d := range p.dumps {
		a.add(next(), d.in.mIdx(), 1)
	}
	// (load(b) − load(ref))·ref.MCR
	share := func(b, ref *Boiler) {
		row := next()
		a.add(row, b.steam.mIdx(), ref.MCR/b.MCR)
		a.add(row, ref.steam.mIdx(), -1)
	}
	switch {
	case p.Opt.Sharing == LeadLag && len(firing) >= 2:
		a.add(next(), firing[0].steam.mIdx(), 1)
		for _, b := range firing[2:] {
			share(b, firing[1])
		}
	default:
		for _, b := range firing[1:] {
			share(b, firing[0])
		}
	}
}
