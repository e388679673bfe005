package solver

import (
	"math"
	"math/rand/v2"

	"gonum.org/v1/gonum/mat"
)

// Large sparse test systems for the sparse Jacobian storage, the
// factorisation on a kept structure and the repeated solves.

// bratu is the solid-fuel ignition (Bratu) problem −Δu = λ·e^u on the
// unit square with u = 0 on the boundary (Averick, Carter, Moré and Xue,
// The MINPACK-2 test problem collection, 1992, from memory), discretised
// on an m×m grid of interior points with the nine-point Laplacian
// (Δu)_ij ≈ (4·(edge neighbours) + (corner neighbours) − 20·u_ij)/(6h²),
// so that each equation has nine unknowns. Equations and unknowns are
// numbered by two seeded random permutations, as the equations and
// unknowns of a plant are unrelated, so that neither the natural order
// nor the diagonal means anything. λ = 6 is below the critical value of
// about 6.8 and Newton's method converges from u = 0.
type bratu struct {
	m, n    int
	lambda  float64
	eq, unk []int // eq[g] is the equation of grid point g, unk[g] its unknown
	at      []int // at[j] is the grid point of unknown j
	pattern [][]int
	x0      []float64
}

func newBratu(m int, seed uint64) *bratu {
	n := m * m
	rng := rand.New(rand.NewPCG(seed, 7))
	b := &bratu{m: m, n: n, lambda: 6, eq: rng.Perm(n), unk: rng.Perm(n), at: make([]int, n), x0: make([]float64, n)}
	for g, j := range b.unk {
		b.at[j] = g
	}
	b.pattern = make([][]int, n)
	for g := 0; g < n; g++ {
		b.stencil(g, func(h int, w float64) {
			b.pattern[b.eq[g]] = append(b.pattern[b.eq[g]], b.unk[h])
		})
	}
	return b
}

// stencil calls f for each grid point of the stencil of g that is inside
// the grid, with its weight in units of 1/(6h²).
func (b *bratu) stencil(g int, f func(h int, w float64)) {
	i, j := g/b.m, g%b.m
	for di := -1; di <= 1; di++ {
		for dj := -1; dj <= 1; dj++ {
			ii, jj := i+di, j+dj
			if ii < 0 || jj < 0 || ii >= b.m || jj >= b.m {
				continue
			}
			w := 1.0
			switch {
			case di == 0 && dj == 0:
				w = -20
			case di == 0 || dj == 0:
				w = 4
			}
			f(ii*b.m+jj, w)
		}
	}
}

func (b *bratu) scale() float64 {
	h := 1 / float64(b.m+1)
	return 1 / (6 * h * h)
}

func (b *bratu) residual(r, x []float64) error {
	c := b.scale()
	for g := 0; g < b.n; g++ {
		sum := 0.0
		b.stencil(g, func(h int, w float64) { sum += w * x[b.unk[h]] })
		r[b.eq[g]] = c*sum + b.lambda*math.Exp(x[b.unk[g]])
	}
	return nil
}

func (b *bratu) sparseJacobian(j *Sparse, x []float64) error {
	c := b.scale()
	for g := 0; g < b.n; g++ {
		b.stencil(g, func(h int, w float64) { j.Add(b.eq[g], b.unk[h], c*w) })
		j.Add(b.eq[g], b.unk[g], b.lambda*math.Exp(x[b.unk[g]]))
	}
	return nil
}

func (b *bratu) denseJacobian(j *mat.Dense, x []float64) error {
	c := b.scale()
	raw := j.RawMatrix()
	for g := 0; g < b.n; g++ {
		i := b.eq[g]
		b.stencil(g, func(h int, w float64) { raw.Data[i*raw.Stride+b.unk[h]] += c * w })
		raw.Data[i*raw.Stride+b.unk[g]] += b.lambda * math.Exp(x[b.unk[g]])
	}
	return nil
}

// problem returns the system with unit scales (so that the benchmarks
// compare the same iterations whatever the scaling).
func (b *bratu) problem(sparse bool) Problem {
	p := Problem{Dim: b.n, Residual: b.residual, Pattern: b.pattern, XScale: filled(b.n, 1), FScale: filled(b.n, 1)}
	if sparse {
		p.SparseJacobian = b.sparseJacobian
	} else {
		p.Jacobian = b.denseJacobian
	}
	return p
}

// network is a plant-like steam distribution network in SI units: the
// nodes of a w×h grid joined by pipes to their right and lower
// neighbours. Unknowns: the pressure of each node (Pa, near 1e6) and the
// mass flow of each pipe (kg/s, near 1, either sign). Equations: for
// each pipe p_from − p_to = k·m·|m| + c·m (a turbulent square law with a
// small laminar part, so that the derivative stays positive through zero
// flow: common practice, no source); for each node but the first, the
// flows in less the flows out equal its demand; the first node's
// pressure is set (a boiler's drum). The demands drift with load(step)
// (see setLoad), each node by its own seeded factor, so that flows move
// and change direction and the pivots of a factorisation change with
// them. Equations and unknowns are numbered at random (seeded).
type network struct {
	w, h, nodes, pipes, n int
	from, to              []int     // nodes of each pipe
	k, c                  []float64 // square-law and laminar coefficients of each pipe
	base, drift, demand   []float64 // of each node, kg/s
	pSet                  float64
	eqOf, unkOf           []int // eqOf[e]: the equation number of internal equation e; unkOf the same for unknowns
	pattern               [][]int
	xScale, fScale        []float64
	x0                    []float64
}

func newNetwork(w, h int, seed uint64) *network {
	rng := rand.New(rand.NewPCG(seed, 11))
	nt := &network{w: w, h: h, nodes: w * h, pSet: 16e5}
	for i := 0; i < h; i++ {
		for j := 0; j < w; j++ {
			v := i*w + j
			if j+1 < w {
				nt.from, nt.to = append(nt.from, v), append(nt.to, v+1)
			}
			if i+1 < h {
				nt.from, nt.to = append(nt.from, v), append(nt.to, v+w)
			}
		}
	}
	nt.pipes = len(nt.from)
	nt.n = nt.nodes + nt.pipes
	for range nt.pipes {
		nt.k = append(nt.k, 1e3*(1+rng.Float64()))
		nt.c = append(nt.c, 10)
	}
	nt.base = make([]float64, nt.nodes)
	nt.drift = make([]float64, nt.nodes)
	nt.demand = make([]float64, nt.nodes)
	for v := 1; v < nt.nodes; v++ {
		nt.base[v] = 0.2 + 0.3*rng.Float64()
		nt.drift[v] = 2 * rng.NormFloat64()
	}
	nt.eqOf, nt.unkOf = rng.Perm(nt.n), rng.Perm(nt.n)
	// Internal numbering: unknowns 0..nodes-1 pressures, then flows;
	// equations 0..pipes-1 pipes, then node balances (node 0: set point).
	nt.pattern = make([][]int, nt.n)
	add := func(e, u int) { nt.pattern[nt.eqOf[e]] = append(nt.pattern[nt.eqOf[e]], nt.unkOf[u]) }
	for e := 0; e < nt.pipes; e++ {
		add(e, nt.from[e])
		add(e, nt.to[e])
		add(e, nt.nodes+e)
	}
	add(nt.pipes, 0)
	for e := 0; e < nt.pipes; e++ {
		if nt.to[e] != 0 {
			add(nt.pipes+nt.to[e], nt.nodes+e)
		}
		if nt.from[e] != 0 {
			add(nt.pipes+nt.from[e], nt.nodes+e)
		}
	}
	nt.xScale = make([]float64, nt.n)
	nt.fScale = make([]float64, nt.n)
	nt.x0 = make([]float64, nt.n)
	for v := 0; v < nt.nodes; v++ {
		nt.xScale[nt.unkOf[v]] = 1e6
		nt.x0[nt.unkOf[v]] = nt.pSet
	}
	for e := 0; e < nt.pipes; e++ {
		nt.xScale[nt.unkOf[nt.nodes+e]] = 1
		nt.x0[nt.unkOf[nt.nodes+e]] = 1
		nt.fScale[nt.eqOf[e]] = 1e5
	}
	for v := 0; v < nt.nodes; v++ {
		nt.fScale[nt.eqOf[nt.pipes+v]] = 1
	}
	nt.fScale[nt.eqOf[nt.pipes]] = 1e6
	nt.setLoad(0)
	return nt
}

// setLoad sets the demands of step k of a sequence: base·(1 + 0.3·sin(k/10 + drift)).
func (nt *network) setLoad(k int) {
	for v := 1; v < nt.nodes; v++ {
		nt.demand[v] = nt.base[v] * (1 + 0.3*math.Sin(float64(k)/10+nt.drift[v]))
	}
}

func (nt *network) residual(r, x []float64) error {
	p := func(v int) float64 { return x[nt.unkOf[v]] }
	m := func(e int) float64 { return x[nt.unkOf[nt.nodes+e]] }
	for e := 0; e < nt.pipes; e++ {
		me := m(e)
		r[nt.eqOf[e]] = p(nt.from[e]) - p(nt.to[e]) - nt.k[e]*me*math.Abs(me) - nt.c[e]*me
	}
	r[nt.eqOf[nt.pipes]] = p(0) - nt.pSet
	for v := 1; v < nt.nodes; v++ {
		r[nt.eqOf[nt.pipes+v]] = -nt.demand[v]
	}
	for e := 0; e < nt.pipes; e++ {
		if nt.to[e] != 0 {
			r[nt.eqOf[nt.pipes+nt.to[e]]] += m(e)
		}
		if nt.from[e] != 0 {
			r[nt.eqOf[nt.pipes+nt.from[e]]] -= m(e)
		}
	}
	return nil
}

// jacobian writes the Jacobian through set(equation, unknown, value),
// each entry once.
func (nt *network) jacobian(x []float64, set func(i, j int, v float64)) {
	for e := 0; e < nt.pipes; e++ {
		me := x[nt.unkOf[nt.nodes+e]]
		i := nt.eqOf[e]
		set(i, nt.unkOf[nt.from[e]], 1)
		set(i, nt.unkOf[nt.to[e]], -1)
		set(i, nt.unkOf[nt.nodes+e], -2*nt.k[e]*math.Abs(me)-nt.c[e])
	}
	set(nt.eqOf[nt.pipes], nt.unkOf[0], 1)
	for e := 0; e < nt.pipes; e++ {
		if nt.to[e] != 0 {
			set(nt.eqOf[nt.pipes+nt.to[e]], nt.unkOf[nt.nodes+e], 1)
		}
		if nt.from[e] != 0 {
			set(nt.eqOf[nt.pipes+nt.from[e]], nt.unkOf[nt.nodes+e], -1)
		}
	}
}

// problem returns the network as a Problem: with the scales of a plant
// (scaled true) or without any, with a sparse or a dense analytic
// Jacobian.
func (nt *network) problem(scaled, sparse bool) Problem {
	p := Problem{Dim: nt.n, Residual: nt.residual, Pattern: nt.pattern}
	if scaled {
		p.XScale, p.FScale = nt.xScale, nt.fScale
	}
	if sparse {
		p.SparseJacobian = func(j *Sparse, x []float64) error { nt.jacobian(x, j.Set); return nil }
	} else {
		p.Jacobian = func(j *mat.Dense, x []float64) error { nt.jacobian(x, j.Set); return nil }
	}
	return p
}
