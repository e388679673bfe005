package solver

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"
)

// star is a linear system with the pattern of a grown steam plant, the
// pattern the plant's compile hands the solver for nb boilers and nc heat
// consumers on one feed header and one steam header (the plant's
// scaledPlant), built here from its description so that the solver's
// tests do not depend on the plant:
//
//   - a line carries three unknowns (mass flow, pressure, enthalpy):
//     make-up, pump suction and discharge, a feed and a steam line per
//     boiler, a supply and a return line per consumer; besides, the
//     hotwell's vented steam, the steam header's drained condensate,
//     each boiler's fuel flow and the level of load shedding;
//   - the hotwell's mass, energy and outlet-temperature rows each hold
//     the three unknowns of every line into and out of it, the drained
//     condensate and the first boiler's drum pressure; the pump's
//     enthalpy rise holds every consumer's supply line: rows of about
//     n/2 entries, which make the graph of AᵀA hold cliques of hundreds
//     of columns;
//   - the steam header's mass balance holds the flow of every line on
//     it (about n/6 entries); for each consumer line the header has a
//     pressure row and a mixing row that holds all the boilers' steam
//     lines, so those few columns have entries in about n/3 rows;
//   - each consumer has four rows of two to four entries (duty, which
//     holds the shedding level too, so that column has an entry in
//     every consumer's row; condensate return, pressure and
//     temperature), each boiler four (drum pressure, dryness, feed and
//     blowdown, fuel from the energy balance), the pump three, the feed
//     header one per boiler and one; dispatch rows share the steam
//     between the boilers and set the shedding.
//
// Unknowns and equations are numbered as the plant numbers them: lines
// first, three unknowns each, and equations component by component. The
// order is n = 12 + 7·nb + 6·nc. For nb = 2 and nc = 3 or 640 the
// pattern was checked, row by row, against the one the plant's compile
// made for its scaledPlant when this was written. The values are seeded and make A column
// diagonally dominant about a perfect matching of its structure (the
// matched entry of each column is in [1, 2), the others sum to at most
// 0.5 in magnitude), so A is nonsingular with a 1-norm condition number
// of a few, whatever the order of elimination and the pivots. The system
// is A·x = b with b = A·x* for x*_j = 1 + (j mod 7): Newton's method
// solves it in one iteration. Those values pivot more kindly than a
// plant's: partial pivoting takes the matched entry of each column, where
// a plant's values make it take long rows too. An order that left the
// plant's own Jacobian of order 1946 334,000 entries in L and U left the
// star of order 2000 18,300; so the star measures the symbolic work and
// shows gross fill, and the order's rule was chosen on plants'
// Jacobians as well (see minDegreeOrder).
type star struct {
	nb, nc, n int
	pattern   [][]int
	val       [][]float64 // val[i][k]: the value of entry pattern[i][k]
	b, root   []float64
}

// newStar returns the plant-like system of nb boilers and nc consumers
// with values from seed.
func newStar(nb, nc int, seed uint64) *star {
	s := &star{nb: nb, nc: nc}
	next := 0
	line := func() [3]int { l := [3]int{next, next + 1, next + 2}; next += 3; return l }
	const m, p, h = 0, 1, 2
	makeup, suction, discharge := line(), line(), line()
	feed := make([][3]int, nb)
	steam := make([][3]int, nb)
	for k := range nb {
		feed[k], steam[k] = line(), line()
	}
	supply := make([][3]int, nc)
	ret := make([][3]int, nc)
	for c := range nc {
		supply[c], ret[c] = line(), line()
	}
	vent, drained := next, next+1
	next += 2
	fuel := make([]int, nb)
	for k := range nb {
		fuel[k] = next
		next++
	}
	shed := next
	next++
	s.n = next
	row := func(cols ...int) { s.pattern = append(s.pattern, cols) }
	// Make-up: supply pressure and temperature.
	row(makeup[p])
	row(makeup[p], makeup[h])
	// Hotwell: tank pressure; mass, energy and outlet temperature over
	// every line into and out of it.
	row(suction[p])
	hot := []int{suction[m], suction[p], suction[h], makeup[m], makeup[p], makeup[h]}
	for c := range nc {
		hot = append(hot, ret[c][m], ret[c][p], ret[c][h])
	}
	hot = append(hot, vent, drained, steam[0][p])
	for range 3 {
		row(hot...)
	}
	// Feed pump: mass balance, discharge pressure, enthalpy rise.
	row(suction[m], discharge[m])
	row(discharge[p])
	rise := []int{suction[m], suction[p], suction[h], discharge[p], discharge[h]}
	for c := range nc {
		rise = append(rise, supply[c][m], supply[c][p], supply[c][h])
	}
	row(rise...)
	// Feed header: mass balance; pressure and mixing into each feed line.
	mass := []int{discharge[m]}
	for k := range nb {
		mass = append(mass, feed[k][m])
	}
	row(mass...)
	for k := range nb {
		row(feed[k][p], discharge[p])
		row(discharge[m], discharge[p], discharge[h], feed[k][h])
	}
	// Steam header: mass balance; pressure and mixing into each consumer
	// line; the heat loss that condenses steam.
	mass = nil
	var steamLines []int
	for k := range nb {
		mass = append(mass, steam[k][m])
		steamLines = append(steamLines, steam[k][m], steam[k][p], steam[k][h])
	}
	for c := range nc {
		mass = append(mass, supply[c][m])
	}
	row(append(mass, drained)...)
	for c := range nc {
		row(supply[c][p], steam[0][p])
		row(append(append([]int(nil), steamLines...), supply[c][h])...)
	}
	row(append(append([]int(nil), steamLines...), drained)...)
	// Boilers: drum pressure, dryness, feed and blowdown, fuel.
	for k := range nb {
		row(steam[k][p])
		row(steam[k][p], steam[k][h])
		row(feed[k][m], steam[k][m])
		row(fuel[k], feed[k][m], feed[k][p], feed[k][h], steam[k][m], steam[k][p], steam[k][h])
	}
	// Consumers: duty, condensate return, pressure and temperature.
	for c := range nc {
		row(supply[c][m], supply[c][p], supply[c][h], shed)
		row(supply[c][m], ret[c][m])
		row(supply[c][p], ret[c][p])
		row(supply[c][p], supply[c][h], ret[c][h])
	}
	// Dispatch: the boilers share the steam; the shedding is nil unless
	// the boilers are at their limit.
	for k := 1; k < nb; k++ {
		row(steam[0][m], steam[k][m])
	}
	limit := []int{shed}
	for k := range nb {
		limit = append(limit, steam[k][m])
	}
	row(limit...)
	if len(s.pattern) != s.n {
		panic(fmt.Sprintf("star: %d equations for %d unknowns", len(s.pattern), s.n))
	}
	s.values(seed)
	return s
}

// values sets the entries: column diagonally dominant about a maximum
// matching of the structure, then b = A·x*.
func (s *star) values(seed uint64) {
	rng := rand.New(rand.NewPCG(seed, 3))
	matchEq, _, rank := hopcroftKarp(s.pattern, s.n, s.n)
	if rank != s.n {
		panic(fmt.Sprintf("star: structural rank %d, want %d", rank, s.n))
	}
	count := make([]int, s.n) // off-matching entries of each column
	for i, row := range s.pattern {
		for _, j := range row {
			if j != matchEq[i] {
				count[j]++
			}
		}
	}
	s.val = make([][]float64, s.n)
	for i, row := range s.pattern {
		s.val[i] = make([]float64, len(row))
		for k, j := range row {
			sign := 1.0
			if rng.IntN(2) == 0 {
				sign = -1
			}
			if j == matchEq[i] {
				s.val[i][k] = sign * (1 + rng.Float64())
			} else {
				s.val[i][k] = sign * 0.5 * (0.1 + 0.9*rng.Float64()) / float64(count[j])
			}
		}
	}
	s.root = make([]float64, s.n)
	for j := range s.root {
		s.root[j] = 1 + float64(j%7)
	}
	s.b = make([]float64, s.n)
	for i, row := range s.pattern {
		for k, j := range row {
			s.b[i] += s.val[i][k] * s.root[j]
		}
	}
}

// starOfOrder returns the plant-like system of two boilers whose order
// is the nearest to n from below.
func starOfOrder(n int) *star { return newStar(2, (n-26)/6, 1) }

func (s *star) residual(r, x []float64) error {
	for i, row := range s.pattern {
		sum := -s.b[i]
		for k, j := range row {
			sum += s.val[i][k] * x[j]
		}
		r[i] = sum
	}
	return nil
}

func (s *star) sparseJacobian(j *Sparse, _ []float64) error {
	for i, row := range s.pattern {
		for k, c := range row {
			j.Set(i, c, s.val[i][k])
		}
	}
	return nil
}

// problem returns the system with a SparseJacobian and derived scales.
func (s *star) problem() Problem {
	return Problem{Dim: s.n, Residual: s.residual, SparseJacobian: s.sparseJacobian, Pattern: s.pattern}
}

// maxRel returns max_j |x_j − x*_j|/|x*_j|.
func (s *star) maxRel(x []float64) float64 {
	e := 0.0
	for j, v := range x {
		e = math.Max(e, math.Abs(v-s.root[j])/math.Abs(s.root[j]))
	}
	return e
}

// TestStar: the plant-like system is structurally nonsingular and one
// Newton iteration from zero solves it to its root x* (a linear system
// built with A·x* = b; constructed check, no source), at the orders of
// BenchmarkCompileStar below 8000.
func TestStar(t *testing.T) {
	t.Parallel()
	for _, n := range []int{44, 500, 2000} {
		st := starOfOrder(n)
		if n == 44 && st.n != 44 {
			t.Fatalf("two boilers, three consumers: order %d, want 44", st.n)
		}
		res, err := Solve(t.Context(), st.problem(), make([]float64, st.n), nil)
		if err != nil {
			t.Fatalf("order %d: %v", st.n, err)
		}
		// Column diagonal dominance with margin 1/2 bounds the condition
		// number by a few, so the root is found to about 1e-14.
		if e := st.maxRel(res.X); res.Stats.Iterations != 1 || e > 1e-12 {
			t.Errorf("order %d: %d iterations, largest relative error %.3g; want 1 and ≤ 1e-12", st.n, res.Stats.Iterations, e)
		}
	}
}
