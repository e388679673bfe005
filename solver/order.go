package solver

import "math/bits"

// maxOrderN is the largest order for which SetPattern computes a column
// order: minDegreeOrder keeps the elimination graph as dense bit sets,
// n²/8 bytes.
const maxOrderN = 4096

// minDegreeOrder returns a fill-reducing column order for a matrix of
// order n whose structure is given in compressed columns (column j has
// the rows pr[pp[j]:pp[j+1]]): the minimum degree order of the graph of
// AᵀA, in which two columns are adjacent when some row has entries in
// both. Whatever rows partial pivoting then chooses, the factors of A
// with its columns in this order fit in the structure of the Cholesky
// factor of AᵀA in the same order (George and Ng, SIAM J. Sci. Stat.
// Comput. 8(6), 1987, from memory), which minimum degree keeps small.
//
// It is the plain minimum degree algorithm (Tinney and Walker, Proc.
// IEEE 55(11), 1967, scheme 2; from memory) on an explicit elimination
// graph held as bit sets, without the quotient graph, supervariables or
// approximate degrees of AMD and COLAMD: O(n²) to choose the nodes plus
// O(n/64) per edge of the filled graph, fine for the few hundred
// unknowns of a plant. Ties go to the lowest column, so the order is a
// function of the structure alone.
func minDegreeOrder(n int, pp, pr []int) []int {
	w := (n + 63) / 64
	rows := make([]uint64, n*w) // rows[i*w:]: the columns with an entry in row i
	for j := 0; j < n; j++ {
		for p := pp[j]; p < pp[j+1]; p++ {
			i := pr[p]
			rows[i*w+j/64] |= 1 << (j % 64)
		}
	}
	adj := make([]uint64, n*w) // adj[j*w:]: the neighbours of column j, itself included
	for j := 0; j < n; j++ {
		a := adj[j*w : (j+1)*w]
		a[j/64] |= 1 << (j % 64)
		for p := pp[j]; p < pp[j+1]; p++ {
			r := rows[pr[p]*w : (pr[p]+1)*w]
			for t := range a {
				a[t] |= r[t]
			}
		}
	}
	alive := make([]uint64, w)
	for j := 0; j < n; j++ {
		alive[j/64] |= 1 << (j % 64)
	}
	deg := make([]int, n) // neighbours not yet eliminated, itself excluded
	degree := func(j int) int {
		a := adj[j*w : (j+1)*w]
		d := 0
		for t := range a {
			d += bits.OnesCount64(a[t] & alive[t])
		}
		return d - 1
	}
	for j := 0; j < n; j++ {
		deg[j] = degree(j)
	}
	order := make([]int, 0, n)
	done := make([]bool, n)
	for len(order) < n {
		v := -1
		for j := 0; j < n; j++ {
			if !done[j] && (v < 0 || deg[j] < deg[v]) {
				v = j
			}
		}
		order = append(order, v)
		done[v] = true
		alive[v/64] &^= 1 << (v % 64)
		// The remaining neighbours of v become a clique.
		av := adj[v*w : (v+1)*w]
		for t := range av {
			word := av[t] & alive[t]
			for word != 0 {
				u := t*64 + bits.TrailingZeros64(word)
				word &= word - 1
				au := adj[u*w : (u+1)*w]
				for s := range au {
					au[s] |= av[s]
				}
				deg[u] = degree(u)
			}
		}
	}
	return order
}

// permuteColumns returns the compressed columns (pp, pr) with column k
// of the result being column q[k] of the input.
func permuteColumns(q, pp, pr []int) (qp, qr []int) {
	n := len(q)
	qp = make([]int, n+1)
	qr = make([]int, 0, len(pr))
	for k, j := range q {
		qr = append(qr, pr[pp[j]:pp[j+1]]...)
		qp[k+1] = len(qr)
	}
	return qp, qr
}
