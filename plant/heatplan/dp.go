package heatplan

import (
	"math"

	"steamcase/plant/loads"
)

// Kinds of control: what a tank's heating does over a row.
const (
	ctrlOff   = iota // heating off
	ctrlHold         // the losses at the row's start temperature
	ctrlReach        // the constant duty that ends the row on a temperature
	ctrlFull         // the coil at its capacity all the row
)

// ctrl is one control of a tank over a row from a temperature: where it
// ends, the coil's mean duty, and its kind.
type ctrl struct {
	T1, Q float64
	kind  uint8
}

// penaltyPerK is the cost (kg of fuel) of each kelvin a required or
// never-below temperature is missed by: far above any fuel a voyage
// burns, so that the plan first misses as little as it can and then burns
// the least fuel.
const penaltyPerK = 1e9

// tankDP is a planned tank as the dynamic programme sees it.
type tankDP struct {
	name    string
	periods []loads.Period // per row
	heat    []bool         // per row: the coil may heat
	start   float64        // K
	// The grid at boundary b is base[b] + j·dT, j = 0 … n−1: the same
	// steps, shifted so that the tank's frontier (the lowest temperature
	// from which the coil still meets what lies ahead) is a grid point at
	// every boundary (see grid).
	base  []float64
	dT    float64
	n     int
	req   []float64 // per boundary 0 … rows: the temperature required there (0: none)
	floor float64   // never below (0: none)
	// ctrls[r][off[r][j]:off[r][j+1]] are the controls from grid state j
	// in row r.
	ctrls [][]ctrl
	off   [][]int32
}

// T returns the temperature of grid state j at boundary b.
func (t *tankDP) T(b, j int) float64 { return t.base[b] + float64(j)*t.dT }

// penalty is the cost of being at T at boundary b.
func (t *tankDP) penalty(b int, T float64) float64 {
	p := 0.0
	if r := t.req[b]; r > 0 && T < r {
		p += penaltyPerK * (r - T)
	}
	if b > 0 && t.floor > 0 && T < t.floor {
		p += penaltyPerK * (t.floor - T)
	}
	return p
}

// controls appends to dst the controls of the tank in row r from T: off,
// the coil at its capacity, holding T, and the constant duties that end
// the row on each grid temperature between off and full (within the
// coil's capacity at the hotter end). In snap mode only the controls that
// end on a grid temperature (within 1e-9 K) are kept.
func (t *tankDP) controls(dst []ctrl, r int, T float64, snap bool) []ctrl {
	p := &t.periods[r]
	Toff := p.Off(T)
	if math.IsNaN(Toff) {
		return dst
	}
	lo := t.base[r+1]
	onGrid := func(x float64) bool {
		k := math.Round((x - lo) / t.dT)
		return math.Abs(lo+k*t.dT-x) <= 1e-9
	}
	if !snap || onGrid(Toff) {
		dst = append(dst, ctrl{T1: Toff, kind: ctrlOff})
	}
	if !t.heat[r] {
		return dst
	}
	Tfull, qfull := p.Full(T)
	if math.IsNaN(Tfull) || !(Tfull > Toff) {
		return dst
	}
	if !snap || onGrid(Tfull) {
		dst = append(dst, ctrl{T1: Tfull, Q: qfull, kind: ctrlFull})
	}
	ok := func(T1 float64) (float64, bool) {
		q := p.Duty(T, T1)
		return q, q >= 0 && q <= p.Capacity(T, math.Max(T, T1))
	}
	if T > Toff && T < Tfull && (!snap || onGrid(T)) {
		if q, good := ok(T); good {
			dst = append(dst, ctrl{T1: T, Q: q, kind: ctrlHold})
		}
	}
	jlo := int(math.Floor((Toff-lo)/t.dT)) + 1
	jhi := int(math.Ceil((Tfull-lo)/t.dT)) - 1
	for j := max(jlo, 0); j <= min(jhi, t.n-1); j++ {
		T1 := t.T(r+1, j)
		if T1 <= Toff || T1 >= Tfull || math.Abs(T1-T) <= 1e-12 {
			continue
		}
		if q, good := ok(T1); good {
			dst = append(dst, ctrl{T1: T1, Q: q, kind: ctrlReach})
		}
	}
	return dst
}

// precompute fills the controls of every grid state of every row.
func (t *tankDP) precompute(rows int, snap bool) {
	t.ctrls = make([][]ctrl, rows)
	t.off = make([][]int32, rows)
	for r := 0; r < rows; r++ {
		var cs []ctrl
		off := make([]int32, t.n+1)
		for j := 0; j < t.n; j++ {
			off[j] = int32(len(cs))
			cs = t.controls(cs, r, t.T(r, j), snap)
		}
		off[t.n] = int32(len(cs))
		t.ctrls[r], t.off[r] = cs, off
	}
}

// problem is the coupled plan: the tanks, the rows' lengths and fuel
// curves, and the duty of tanks held fixed (coordinate descent).
type problem struct {
	rows  int
	dt    []float64 // s
	fuel  []FuelCurve
	tanks []*tankDP
	snap  bool
}

// interp1 interpolates V at T on t's grid at boundary b: +Inf outside
// the grid or next to an infinite value.
func interp1(t *tankDP, V []float64, b int, T float64) float64 {
	x := (T - t.base[b]) / t.dT
	if x < -1e-9 || x > float64(t.n-1)+1e-9 {
		return math.Inf(1)
	}
	j := int(math.Floor(x))
	if j < 0 {
		j = 0
	}
	if j > t.n-2 {
		j = t.n - 2
	}
	if j < 0 { // one state
		return V[0]
	}
	w := x - float64(j)
	switch {
	case w <= 1e-9:
		return V[j]
	case w >= 1-1e-9:
		return V[j+1]
	}
	v0, v1 := V[j], V[j+1]
	if math.IsInf(v0, 1) || math.IsInf(v1, 1) {
		return math.Inf(1)
	}
	return v0 + w*(v1-v0)
}

// single solves the plan of tank i alone, the others' total duty in each
// row given (others[r], W): the value function V[b][j], the least cost
// from grid state j at boundary b to the end.
func (pb *problem) single(i int, others []float64) [][]float64 {
	t := pb.tanks[i]
	V := make([][]float64, pb.rows+1)
	V[pb.rows] = make([]float64, t.n)
	for j := range t.n {
		V[pb.rows][j] = t.penalty(pb.rows, t.T(pb.rows, j))
	}
	for r := pb.rows - 1; r >= 0; r-- {
		next := V[r+1]
		cur := make([]float64, t.n)
		cs, off := t.ctrls[r], t.off[r]
		curve := &pb.fuel[r]
		dt := pb.dt[r]
		for j := range t.n {
			best := math.Inf(1)
			for _, c := range cs[off[j]:off[j+1]] {
				f := curve.At(c.Q + others[r])
				if math.IsInf(f, 1) {
					continue
				}
				v := dt*f + interp1(t, next, r+1, c.T1)
				if v < best {
					best = v
				}
			}
			cur[j] = best + t.penalty(r, t.T(r, j))
		}
		V[r] = cur
	}
	return V
}

// plan is one tank's controls over the rows, from its start.
type plan struct {
	c []ctrl    // per row
	T []float64 // per boundary
}

// forward1 follows tank i's value function from its exact start: in each
// row the control, among those at the exact temperature, of least fuel
// plus the interpolated value of where it ends.
func (pb *problem) forward1(i int, V [][]float64, others []float64) plan {
	t := pb.tanks[i]
	pl := plan{c: make([]ctrl, pb.rows), T: make([]float64, pb.rows+1)}
	T := t.start
	pl.T[0] = T
	var cs []ctrl
	for r := 0; r < pb.rows; r++ {
		cs = t.controls(cs[:0], r, T, pb.snap)
		best, bc := math.Inf(1), ctrl{T1: math.NaN()}
		for _, c := range cs {
			f := pb.fuel[r].At(c.Q + others[r])
			if math.IsInf(f, 1) {
				continue
			}
			v := pb.dt[r]*f + interp1(t, V[r+1], r+1, c.T1)
			if v < best {
				best, bc = v, c
			}
		}
		if math.IsNaN(bc.T1) {
			// Nothing the plant can carry: the heating off (the plan then
			// reports the row).
			bc = ctrl{T1: t.periods[r].Off(T), kind: ctrlOff}
		}
		pl.c[r] = bc
		T = bc.T1
		pl.T[r+1] = T
	}
	return pl
}

// cost returns the fuel (kg) of the tanks' plans by the rows' fuel
// curves and their penalties, and the rows whose total duty the boilers
// cannot carry.
func (pb *problem) cost(plans []plan) (fuel, penalty float64, short []int) {
	for r := 0; r < pb.rows; r++ {
		q := 0.0
		for _, p := range plans {
			q += p.c[r].Q
		}
		f := pb.fuel[r].At(q)
		if math.IsInf(f, 1) {
			short = append(short, r)
			f = pb.fuel[r].At(math.Min(q, math.Max(pb.fuel[r].Cap, 0)))
			if math.IsInf(f, 1) {
				f = pb.fuel[r].F[len(pb.fuel[r].F)-1]
			}
		}
		fuel += pb.dt[r] * f
	}
	for i, t := range pb.tanks {
		for b := 0; b <= pb.rows; b++ {
			penalty += t.penalty(b, plans[i].T[b])
		}
	}
	return fuel, penalty, short
}

// duties returns, per row, the total duty of every tank but i.
func duties(plans []plan, i, rows int) []float64 {
	out := make([]float64, rows)
	for k, p := range plans {
		if k == i || p.c == nil {
			continue
		}
		for r := range rows {
			out[r] += p.c[r].Q
		}
	}
	return out
}

// descend solves the coupled plan by coordinate descent: each tank's plan
// by its own dynamic programme with the others' duties held, in turn,
// until a sweep lowers the total (fuel and penalties, by the fuel
// curves) by less than 1e-9 relative or after maxSweeps. Every accepted
// change lowers the total, so the result is at least as good as the
// first sweep's. It returns the plans and the sweeps made.
func (pb *problem) descend(maxSweeps int) ([]plan, int) {
	plans := make([]plan, len(pb.tanks))
	best := math.Inf(1)
	sweeps := 0
	for s := 0; s < maxSweeps; s++ {
		sweeps++
		improved := false
		for i := range pb.tanks {
			others := duties(plans, i, pb.rows)
			V := pb.single(i, others)
			cand := pb.forward1(i, V, others)
			old := plans[i]
			plans[i] = cand
			if old.c == nil {
				continue
			}
			f, pen, _ := pb.cost(plans)
			if tot := f + pen; tot < best*(1-1e-12) {
				best = tot
				improved = true
			} else {
				plans[i] = old
			}
		}
		if s == 0 {
			f, pen, _ := pb.cost(plans)
			best = f + pen
			improved = true
		}
		if !improved {
			break
		}
	}
	return plans, sweeps
}

// joint solves the coupled plan of every tank at once by one dynamic
// programme over the joint state (the grids' product), the rows' fuel at
// the tanks' total duty: exact for the discretised problem, and the test
// of descend. Its work grows as the product of the grids and of the
// controls.
func (pb *problem) joint() []plan {
	k := len(pb.tanks)
	dims := make([]int, k)
	size := 1
	for i, t := range pb.tanks {
		dims[i] = t.n
		size *= t.n
	}
	V := make([][]float64, pb.rows+1)
	idx := make([]int, k)
	Ts := make([]float64, k)
	fill := func(b int, f func(s int, idx []int) float64) []float64 {
		out := make([]float64, size)
		for s := range size {
			rem := s
			for i := k - 1; i >= 0; i-- {
				idx[i] = rem % dims[i]
				rem /= dims[i]
			}
			out[s] = f(s, idx)
		}
		return out
	}
	pen := func(b int, idx []int) float64 {
		p := 0.0
		for i, t := range pb.tanks {
			p += t.penalty(b, t.T(b, idx[i]))
		}
		return p
	}
	V[pb.rows] = fill(pb.rows, func(_ int, idx []int) float64 { return pen(pb.rows, idx) })
	lists := make([][]ctrl, k)
	for r := pb.rows - 1; r >= 0; r-- {
		next := V[r+1]
		if k == 2 {
			V[r] = pb.joint2Row(r, next)
			continue
		}
		V[r] = fill(r, func(_ int, idx []int) float64 {
			for i, t := range pb.tanks {
				lists[i] = t.ctrls[r][t.off[r][idx[i]]:t.off[r][idx[i]+1]]
			}
			best := pb.bestJoint(r, lists, next, Ts, nil)
			return best + pen(r, idx)
		})
	}
	// Forward from the exact starts.
	plans := make([]plan, k)
	T := make([]float64, k)
	for i, t := range pb.tanks {
		plans[i] = plan{c: make([]ctrl, pb.rows), T: make([]float64, pb.rows+1)}
		T[i] = t.start
		plans[i].T[0] = T[i]
	}
	for r := 0; r < pb.rows; r++ {
		lists := make([][]ctrl, k)
		for i, t := range pb.tanks {
			lists[i] = t.controls(nil, r, T[i], pb.snap)
		}
		choice := make([]ctrl, k)
		if v := pb.bestJoint(r, lists, V[r+1], Ts, choice); math.IsInf(v, 1) {
			for i, t := range pb.tanks {
				choice[i] = ctrl{T1: t.periods[r].Off(T[i]), kind: ctrlOff}
			}
		}
		for i := range pb.tanks {
			plans[i].c[r] = choice[i]
			T[i] = choice[i].T1
			plans[i].T[r+1] = T[i]
		}
	}
	return plans
}

// bestJoint returns the least cost over every combination of the tanks'
// controls in row r (the fuel at their total duty plus the interpolated
// value of where they end), filling choice with the best when it is not
// nil.
func (pb *problem) bestJoint(r int, lists [][]ctrl, next []float64, Ts []float64, choice []ctrl) float64 {
	k := len(lists)
	for _, l := range lists {
		if len(l) == 0 {
			return math.Inf(1)
		}
	}
	pick := make([]int, k)
	best := math.Inf(1)
	for {
		q := 0.0
		for i := range k {
			c := lists[i][pick[i]]
			q += c.Q
			Ts[i] = c.T1
		}
		if f := pb.fuel[r].At(q); !math.IsInf(f, 1) {
			v := pb.dt[r]*f + pb.interpK(next, r+1, Ts)
			if v < best {
				best = v
				if choice != nil {
					for i := range k {
						choice[i] = lists[i][pick[i]]
					}
				}
			}
		}
		i := k - 1
		for ; i >= 0; i-- {
			pick[i]++
			if pick[i] < len(lists[i]) {
				break
			}
			pick[i] = 0
		}
		if i < 0 {
			return best
		}
	}
}

// interpK interpolates the joint value function at the tanks'
// temperatures, multilinear over the 2^k corners of the cell.
func (pb *problem) interpK(V []float64, b int, Ts []float64) float64 {
	k := len(pb.tanks)
	base := make([]int, k)
	w := make([]float64, k)
	for i, t := range pb.tanks {
		x := (Ts[i] - t.base[b]) / t.dT
		if x < -1e-9 || x > float64(t.n-1)+1e-9 {
			return math.Inf(1)
		}
		j := min(max(int(math.Floor(x)), 0), max(t.n-2, 0))
		base[i] = j
		w[i] = x - float64(j)
		if w[i] < 1e-9 {
			w[i] = 0
		}
		if w[i] > 1-1e-9 {
			w[i] = 1
		}
		if t.n == 1 {
			w[i] = 0
		}
	}
	v := 0.0
	for corner := 0; corner < 1<<k; corner++ {
		wt := 1.0
		s := 0
		for i, t := range pb.tanks {
			j := base[i]
			if corner>>i&1 == 1 {
				wt *= w[i]
				j++
			} else {
				wt *= 1 - w[i]
			}
			if wt == 0 {
				break
			}
			s = s*t.n + j
		}
		if wt == 0 {
			continue
		}
		x := V[s]
		if math.IsInf(x, 1) {
			return math.Inf(1)
		}
		v += wt * x
	}
	return v
}

// joint2Row is one row of the joint programme of two tanks, without
// allocation in its loops: for every pair of grid states, the least fuel
// at the pair's total duty plus the bilinear value of where they end.
func (pb *problem) joint2Row(r int, next []float64) []float64 {
	a, b := pb.tanks[0], pb.tanks[1]
	na, nb := a.n, b.n
	out := make([]float64, na*nb)
	curve := &pb.fuel[r]
	dt := pb.dt[r]
	// Where each control ends, as a cell and a weight on each grid.
	type end struct {
		j int
		w float64
		q float64
	}
	ends := func(t *tankDP) []end {
		cs := t.ctrls[r]
		out := make([]end, len(cs))
		for i, c := range cs {
			x := (c.T1 - t.base[r+1]) / t.dT
			e := end{j: -1, q: c.Q}
			if x >= -1e-9 && x <= float64(t.n-1)+1e-9 {
				j := min(max(int(math.Floor(x)), 0), max(t.n-2, 0))
				w := x - float64(j)
				if w < 1e-9 {
					w = 0
				}
				if w > 1-1e-9 {
					w = 1
				}
				e.j, e.w = j, w
			}
			out[i] = e
		}
		return out
	}
	ea, eb := ends(a), ends(b)
	val := func(x, y end) float64 {
		i0 := x.j * nb
		v00 := next[i0+y.j]
		if x.w == 0 && y.w == 0 {
			return v00
		}
		v01, v10, v11 := 0.0, 0.0, 0.0
		if y.w > 0 {
			v01 = next[i0+y.j+1]
		}
		if x.w > 0 {
			v10 = next[i0+nb+y.j]
			if y.w > 0 {
				v11 = next[i0+nb+y.j+1]
			}
		}
		v := (1-x.w)*(1-y.w)*v00 + (1-x.w)*y.w*v01 + x.w*(1-y.w)*v10 + x.w*y.w*v11
		if math.IsInf(v00, 1) || y.w > 0 && math.IsInf(v01, 1) || x.w > 0 && math.IsInf(v10, 1) || x.w > 0 && y.w > 0 && math.IsInf(v11, 1) {
			return math.Inf(1)
		}
		return v
	}
	for ja := 0; ja < na; ja++ {
		ca := ea[a.off[r][ja]:a.off[r][ja+1]]
		pa := a.penalty(r, a.T(r, ja))
		for jb := 0; jb < nb; jb++ {
			cb := eb[b.off[r][jb]:b.off[r][jb+1]]
			best := math.Inf(1)
			for _, x := range ca {
				if x.j < 0 {
					continue
				}
				for _, y := range cb {
					if y.j < 0 {
						continue
					}
					f := curve.At(x.q + y.q)
					if math.IsInf(f, 1) {
						continue
					}
					if v := dt*f + val(x, y); v < best {
						best = v
					}
				}
			}
			out[ja*nb+jb] = best + pa + b.penalty(r, b.T(r, jb))
		}
	}
	return out
}
