package solver

import "math/bits"

// bitsOrderMax is the largest order for which minDegreeOrder keeps the
// elimination graph as dense bit sets (n²/4 bytes: 1 MB at order 2025,
// 4 MB at 4096), which is faster there than adjacency lists: a degree
// update costs n/64 words instead of the length of two lists.
const bitsOrderMax = 4096

// minDegreeOrder returns a fill-reducing column order for a matrix of
// order n whose structure is given in compressed columns (column j has
// the rows pr[pp[j]:pp[j+1]]): the minimum degree order of the graph of
// AᵀA, in which two columns are adjacent when some row has entries in
// both. Whatever rows partial pivoting then chooses, the factors of A
// with its columns in this order fit in the structure of the Cholesky
// factor of AᵀA in the same order (George and Ng, SIAM J. Sci. Stat.
// Comput. 8(6), 1987, from memory), which minimum degree keeps small.
// fill is the number of entries below the diagonal of that Cholesky
// factor (the sum of the degrees at elimination), which bounds those of
// L and of U.
//
// It is the plain minimum degree algorithm (Tinney and Walker, Proc.
// IEEE 55(11), 1967, scheme 2; from memory) on an explicit elimination
// graph, without the quotient graph, supervariables or approximate
// degrees of AMD and COLAMD; ties go to the lowest column, so the order
// is a function of the structure alone. Up to order bitsOrderMax the
// graph is held as bit sets (minDegreeBits), above as adjacency lists
// (minDegreeLists); both give the same order.
func minDegreeOrder(n int, pp, pr []int) (order []int, fill int) {
	if n <= bitsOrderMax {
		return minDegreeBits(n, pp, pr)
	}
	return minDegreeLists(n, pp, pr)
}

// minDegreeBits is minDegreeOrder on an elimination graph of bit sets:
// O(n²) to choose the nodes plus O(n/64) per edge of the filled graph,
// n²/4 bytes.
func minDegreeBits(n int, pp, pr []int) (order []int, fill int) {
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
	order = make([]int, 0, n)
	done := make([]bool, n)
	for len(order) < n {
		v := -1
		for j := 0; j < n; j++ {
			if !done[j] && (v < 0 || deg[j] < deg[v]) {
				v = j
			}
		}
		order = append(order, v)
		fill += deg[v]
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
	return order, fill
}

// minDegreeLists is minDegreeOrder on adjacency lists: each node keeps
// the list of its neighbours not yet eliminated; eliminating a node joins
// its neighbours into a clique and removes it from their lists, and an
// indexed heap keyed by (degree, column) gives the next node. Storage is
// O(n + edges of the filled graph); time is O(Σ over eliminated nodes of
// degree² + fill·log n).
func minDegreeLists(n int, pp, pr []int) (order []int, fill int) {
	// Rows of the pattern in compressed form, for AᵀA.
	rptr := make([]int, n+1)
	for _, i := range pr {
		rptr[i+1]++
	}
	for i := 0; i < n; i++ {
		rptr[i+1] += rptr[i]
	}
	rcol := make([]int, len(pr))
	next := make([]int, n)
	copy(next, rptr[:n])
	for j := 0; j < n; j++ {
		for p := pp[j]; p < pp[j+1]; p++ {
			i := pr[p]
			rcol[next[i]] = j
			next[i]++
		}
	}
	// adj[j]: the neighbours of column j not yet eliminated (itself
	// excluded).
	adj := make([][]int, n)
	mark := make([]int, n) // mark[u] == stamp: u is in the list being built
	for i := range mark {
		mark[i] = -1
	}
	for j := 0; j < n; j++ {
		mark[j] = j
		for p := pp[j]; p < pp[j+1]; p++ {
			i := pr[p]
			for _, k := range rcol[rptr[i]:rptr[i+1]] {
				if mark[k] != j {
					mark[k] = j
					adj[j] = append(adj[j], k)
				}
			}
		}
	}
	h := newDegreeHeap(n)
	for j := 0; j < n; j++ {
		h.push(j, len(adj[j]))
	}
	order = make([]int, 0, n)
	stamp := n
	for len(order) < n {
		v := h.pop()
		order = append(order, v)
		fill += len(adj[v])
		// The remaining neighbours of v become a clique, and v leaves
		// their lists.
		nv := adj[v]
		for _, u := range nv {
			stamp++
			mark[u] = stamp
			mark[v] = stamp
			list := adj[u][:0]
			for _, w := range adj[u] {
				if w != v {
					list = append(list, w)
					mark[w] = stamp
				}
			}
			extra := 0
			for _, w := range nv {
				if mark[w] != stamp {
					extra++
				}
			}
			if len(list)+extra > cap(list) {
				// Grow by doubling: the lists' garbage stays below their size.
				grown := make([]int, len(list), 2*(len(list)+extra))
				copy(grown, list)
				list = grown
			}
			for _, w := range nv {
				if mark[w] != stamp {
					mark[w] = stamp
					list = append(list, w)
				}
			}
			adj[u] = list
			h.update(u, len(list))
		}
		adj[v] = nil
	}
	return order, fill
}

// degreeHeap is a binary min-heap of columns keyed by (degree, column),
// each column in it once, with its place kept so that a key can change.
type degreeHeap struct {
	col []int // the heap
	deg []int // deg[j]: the key of column j
	at  []int // at[j]: the place of column j in col, -1 once popped
}

func newDegreeHeap(n int) *degreeHeap {
	return &degreeHeap{col: make([]int, 0, n), deg: make([]int, n), at: make([]int, n)}
}

func (h *degreeHeap) less(a, b int) bool {
	ca, cb := h.col[a], h.col[b]
	if h.deg[ca] != h.deg[cb] {
		return h.deg[ca] < h.deg[cb]
	}
	return ca < cb
}

func (h *degreeHeap) swap(a, b int) {
	h.col[a], h.col[b] = h.col[b], h.col[a]
	h.at[h.col[a]] = a
	h.at[h.col[b]] = b
}

func (h *degreeHeap) up(i int) {
	for i > 0 {
		p := (i - 1) / 2
		if !h.less(i, p) {
			break
		}
		h.swap(i, p)
		i = p
	}
}

func (h *degreeHeap) down(i int) {
	n := len(h.col)
	for {
		l := 2*i + 1
		if l >= n {
			return
		}
		m := l
		if r := l + 1; r < n && h.less(r, l) {
			m = r
		}
		if !h.less(m, i) {
			return
		}
		h.swap(i, m)
		i = m
	}
}

func (h *degreeHeap) push(j, deg int) {
	h.deg[j] = deg
	h.col = append(h.col, j)
	h.at[j] = len(h.col) - 1
	h.up(len(h.col) - 1)
}

// pop removes and returns the column of least (degree, column).
func (h *degreeHeap) pop() int {
	j := h.col[0]
	last := len(h.col) - 1
	h.swap(0, last)
	h.col = h.col[:last]
	h.at[j] = -1
	if last > 0 {
		h.down(0)
	}
	return j
}

// update sets the degree of column j, which is in the heap.
func (h *degreeHeap) update(j, deg int) {
	old := h.deg[j]
	h.deg[j] = deg
	if deg < old {
		h.up(h.at[j])
	} else if deg > old {
		h.down(h.at[j])
	}
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
