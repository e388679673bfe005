package solver

import "math"

// sqrtLimit is max(16, c·√n), the form of COLAMD's limits for dense
// rows and columns (Davis, Gilbert, Larimore and Ng, ACM TOMS 30(3),
// 2004, from memory: 10·√n).
func sqrtLimit(n int, c float64) int { return max(16, int(c*math.Sqrt(float64(n)))) }

// denseRowLimit and denseColumnLimit are the entries above which
// minDegreeOrder leaves a row or a column of a matrix of order n out of
// its graph: 5·√n and 3·√n, where COLAMD's limit is 10·√n. Both were
// found by measurement on the plant-like pattern of star_test.go and on
// plants' Jacobians (see minDegreeOrder). At 10·√n the steam header's
// mass balance (a row of about n/6 entries) and the hub columns (the
// boilers' steam lines and the shedding level, an entry in every
// consumer's row, about n/6 each) are kept up to order 3600: the
// eliminations along such a row cost O(r²) (13 ms for the order of the
// star at order 2000 against 0.5 ms), and kept hubs were ordered early,
// where partial pivoting made the header's mass balance an early pivot.
func denseRowLimit(n int) int    { return sqrtLimit(n, 5) }
func denseColumnLimit(n int) int { return sqrtLimit(n, 3) }

// minDegreeOrder returns a fill-reducing column order for a matrix A of
// order n whose structure is given in compressed columns (column j has
// the rows pr[pp[j]:pp[j+1]], ascending): an approximate minimum degree
// order of the graph of AᵀA, in which two columns are adjacent when some
// row has entries in both. Whatever rows partial pivoting then chooses,
// the factors of A with its columns in this order fit in the structure
// of the Cholesky factor of AᵀA in the same order (George and Ng, SIAM
// J. Sci. Stat. Comput. 8(6), 1987, from memory), which minimum degree
// keeps small.
//
// The graph of AᵀA is never formed. It is held as a quotient graph
// (George and Liu, Computer Solution of Large Sparse Positive Definite
// Systems, 1981; the scheme of AMD and COLAMD: Amestoy, Davis and Duff,
// SIAM J. Matrix Anal. Appl. 17(4), 1996, and Davis, Gilbert, Larimore
// and Ng, ACM TOMS 30(3), 2004; all from memory): the rows of A are its
// first elements, each the clique of the columns it holds; a column is
// adjacent to the columns of the elements it belongs to. Eliminating a
// column p makes a new element Lp of the union of p's elements less p,
// which absorbs them. The storage stays that of A (plus elbow room,
// compacted when it runs out, grown if compaction is not enough) however
// large the cliques grow, and the work of an elimination is that of the
// lists it touches, not the square of its degree. On that graph:
//
//   - Degrees are approximate external degrees in the manner of AMD (the
//     columns adjacent to a supervariable outside it): for a column i of
//     the new element Lp, d(i) ≤ |Lp \ i| + Σ |Le \ Lp| over its other
//     elements e, also ≤ its last degree + |Lp \ i| and ≤ the columns
//     left; the first degrees are Σ (|row| − 1) over its rows. They are
//     upper bounds of the true external degrees.
//   - Aggressive absorption: an element e with Le ⊆ Lp is absorbed into
//     the new element; a new element Lp that lies inside an older one (or
//     holds a single column) adds nothing to the graph and is not kept.
//   - Supervariables: columns with the same elements (at the start, the
//     same rows) are indistinguishable, stay so, and are merged into one
//     node weighted by their number; they are eliminated together (mass
//     elimination), one after the other in the order they were merged.
//     New ones are looked for among the columns of each new element, by
//     a hash of their element lists.
//   - Dense rows and columns, in the manner of COLAMD: a column with more
//     than denseColumnLimit(n) entries, and a row with more than
//     denseRowLimit(n) entries in the other columns, are left out of the
//     graph (a row of r entries is a clique of r columns; a column in r
//     rows is in up to r elements, and each elimination that touches it
//     scans them). The dense columns come last in the order, by
//     ascending index. A dense row still weighs: each of its columns
//     carries the row's length less one as a fixed addition to its
//     degree (its share of the row's clique, which never shrinks while
//     the row is out of the graph), and columns merge into a
//     supervariable only if they are in the same dense rows. Without it
//     the columns of a dense row that hold few other rows come first, and
//     partial pivoting takes the dense row as their pivot and carries it
//     into every later column of the row.
//
// The limits and the addition were chosen by measurement on the
// Jacobians of two plants, the entries of L and U and the share of the
// columns whose reach a factorisation must search again over a sequence
// of cases (the plant's scaledPlant of 2 boilers and 320 consumers,
// order 1946, 40 factorisations of warm cases; the demo tanker, order
// 135, 400 factorisations over a year; dumped for the measurement, not
// kept): with this rule 19,000 entries and 0.01 % re-searched, and
// 1,466 entries and 8 %; with COLAMD's ordering of the columns that lie
// only in dense rows last, 20,000 and 2 % on the first; without the
// degree addition, 334,000; with rows above 3·√n left out, the tanker's
// hotwell and pump rows (52–56 entries) leave 2,655 entries and 22 %
// re-searched; with hub columns up to 10·√n kept, 480,000 entries and
// 96 % re-searched on the first; rows up to 10·√n kept gave the same
// factors as 5·√n on both plants, at the cost above. (The order before
// this one, exact minimum degree on the explicit graph: 757,000 entries
// and 96 %; 2,838 and 8 %.)
//
// With rows of at most denseRowLimit(n) entries kept, an elimination
// costs at most O(denseRowLimit(n)) per column of its element, so the
// worst case is O(√n) per entry of the fill; on the plant-like pattern
// the time is linear in the order (BenchmarkSymbolic).
//
// The next column is the one of least approximate degree (with the dense
// rows' addition), the lowest index among equals, so the order is a
// function of the structure alone.
//
// fill is the number of entries below the diagonal of the Cholesky
// factor of AᵀA in the order, which bounds those of L and of U, and
// exact is true, when no row or column was left out: an eliminated
// supervariable of s columns whose element holds d columns adds
// s·d + s(s−1)/2 entries, and both are exact there. With dense rows or
// columns left out fill is 0 and exact false: the graph was not that of
// AᵀA.
func minDegreeOrder(n int, pp, pr []int) (order []int, fill int, exact bool) {
	g := newQuotientGraph(n, pp, pr, denseRowLimit(n), denseColumnLimit(n))
	order = g.eliminate()
	if g.dense {
		return order, 0, false
	}
	return order, g.fill, true
}

// Node states of the quotient graph.
const (
	qLive   = iota // a principal column not yet eliminated
	qMerged        // merged into another column's supervariable
	qGone          // eliminated
	qDense         // left out as dense
)

// maxGraphOrder is the largest order the quotient graph's 32-bit lists
// can number (3n nodes, marks counting eliminations).
const maxGraphOrder = 1 << 29

// quotientGraph is the state of minDegreeOrder. Nodes 0..n−1 are the
// columns (variables), nodes n..3n−1 the elements: n+r is the element of
// row r, 2n+c the element column c became when eliminated; lists hold
// element numbers (node − n) and columns. Each node's list is
// iw[start:start+size]: a column's elements, an element's columns
// (merged columns are skipped where met and dropped when the storage is
// compacted). The lists and per-node numbers are 32-bit, which halves
// the graph's memory.
type quotientGraph struct {
	n        int
	iw       []int32
	tail     int32   // iw[tail:] is free
	start    []int32 // of each node's list
	size     []int32 // of each node's list
	nv       []int32 // columns in each principal column's supervariable
	esize    []int32 // Σ nv over the columns of each element (by element number)
	state    []int8
	dead     []bool  // elements absorbed or not kept (by element number)
	next     []int32 // the next column of a supervariable, −1 at its end
	last     []int32 // the last column of a principal column's supervariable
	hash     []int32 // of each column's element list, at its last update
	hnext    []int32 // chains of the hash buckets
	head     []int32 // heads of the hash buckets, −1 when empty
	vmark    []int32 // vmark[i] == vtag: column i is in the list being built
	emark    []int32 // emark[e] == etag: w[e] is valid, or e is in the list compared
	w        []int32 // |Le \ Lp| of the elements met
	first    []int32 // work space of the compaction, made when first needed
	touched  []int32 // elements met in this elimination
	vtag     int32
	etag     int32
	left     int // columns left to eliminate (Σ nv of the live columns)
	fill     int
	dense    bool // a row or column was left out
	h        *degreeHeap
	deg      []int // approximate external degree of each principal column
	denseCol []int // the dense columns: the end of the order
	penalty  []int // the lengths less one of the dense rows of each column
	dsig     []int // a signature of the set of dense rows of each column
}

// newQuotientGraph builds the quotient graph of the matrix of order n in
// compressed columns pp, pr, leaving out the rows of more than rowLimit
// entries (in the other columns) and the columns of more than colLimit.
func newQuotientGraph(n int, pp, pr []int, rowLimit, colLimit int) *quotientGraph {
	if n >= maxGraphOrder {
		panic("solver: minimum degree order of a matrix of order " + itoa(n) + ", above the limit " + itoa(maxGraphOrder))
	}
	g := &quotientGraph{n: n}
	g.state = make([]int8, n)
	rowCount := make([]int32, n) // entries of each row in the columns not dense
	for j := 0; j < n; j++ {
		if pp[j+1]-pp[j] > colLimit {
			g.state[j] = qDense
			g.denseCol = append(g.denseCol, j)
			g.dense = true
			continue
		}
		for p := pp[j]; p < pp[j+1]; p++ {
			rowCount[pr[p]]++
		}
	}
	entries := 0
	for _, c := range rowCount {
		if int(c) > rowLimit {
			g.dense = true
		} else {
			entries += int(c)
		}
	}
	nodes := 3 * n
	g.iw = make([]int32, 2*entries+2*n)
	g.start = make([]int32, nodes)
	g.size = make([]int32, nodes)
	// The columns' lists: their rows that are not dense (as elements);
	// a dense row adds its length less one to the degree of each.
	g.penalty = make([]int, n)
	g.dsig = make([]int, n)
	for j := 0; j < n; j++ {
		g.start[j] = g.tail
		if g.state[j] == qDense {
			continue
		}
		for p := pp[j]; p < pp[j+1]; p++ {
			r := pr[p]
			if c := int(rowCount[r]); c <= rowLimit {
				g.iw[g.tail] = int32(r)
				g.tail++
			} else {
				g.penalty[j] += c - 1
				g.dsig[j] += int(uint64(r+1) * 0x9e3779b97f4a7c15 >> 4)
			}
		}
		g.size[j] = g.tail - g.start[j]
	}
	// The rows' lists: their columns that are not dense.
	g.dead = make([]bool, 2*n)
	for i, c := range rowCount {
		e := n + i
		g.start[e] = g.tail
		if c == 0 || int(c) > rowLimit {
			g.dead[i] = true // an empty row or a dense one: no element
			continue
		}
		g.tail += c
	}
	for j := 0; j < n; j++ {
		for _, r := range g.list(j) {
			e := n + int(r)
			g.iw[g.start[e]+g.size[e]] = int32(j)
			g.size[e]++
		}
	}
	g.nv = make([]int32, n)
	g.esize = make([]int32, 2*n)
	g.deg = make([]int, n)
	g.next = make([]int32, n)
	g.last = make([]int32, n)
	g.hash = make([]int32, n)
	g.hnext = make([]int32, n)
	g.head = make([]int32, n)
	g.vmark = make([]int32, n)
	g.emark = make([]int32, 2*n)
	g.w = make([]int32, 2*n)
	live := rowCount[:0] // reused: the live columns
	for j := 0; j < n; j++ {
		g.next[j], g.last[j], g.head[j] = -1, int32(j), -1
		if g.state[j] == qLive {
			g.nv[j] = 1
			g.left++
			live = append(live, int32(j))
		}
	}
	// Columns with the same rows are indistinguishable from the start.
	for _, j := range live {
		g.hash[j] = g.listHash(int(j))
	}
	g.mergeIndistinguishable(live)
	for i := 0; i < n; i++ {
		if g.dead[i] {
			continue
		}
		var s int32
		for _, j := range g.list(n + i) {
			s += g.nv[j]
		}
		g.esize[i] = s
	}
	g.h = newDegreeHeap(n)
	for _, j := range live {
		if g.state[j] != qLive {
			continue
		}
		d := 0
		for _, e := range g.list(int(j)) {
			d += int(g.esize[e] - g.nv[j])
		}
		g.deg[j] = min(d, g.left-int(g.nv[j]))
		g.h.push(int(j), g.deg[j]+g.penalty[j])
	}
	return g
}

// list returns the list of a node (a column's elements, as element
// numbers 0..2n−1; an element's columns).
func (g *quotientGraph) list(node int) []int32 {
	return g.iw[g.start[node] : g.start[node]+g.size[node]]
}

// listHash hashes the elements of column j (order-independent).
func (g *quotientGraph) listHash(j int) int32 {
	h := int(g.size[j])
	for _, e := range g.list(j) {
		h += int(e)
	}
	return int32(h % g.n)
}

// nextETag returns a fresh tag for emark, clearing the marks when the
// tags run out.
func (g *quotientGraph) nextETag() int32 {
	if g.etag == 1<<31-1 {
		clear(g.emark)
		g.etag = 0
	}
	g.etag++
	return g.etag
}

// mergeIndistinguishable merges, among the live columns cols (whose
// hashes are set), those whose element lists are the same set and that
// are in the same dense rows: the later ones in cols into the first.
// Columns with no element at all merge too: they are not adjacent to
// each other, but they stay alone until eliminated, where their
// supervariable adds no fill (see pivot), so the order is the same as
// for single columns of degree 0, in fewer steps.
func (g *quotientGraph) mergeIndistinguishable(cols []int32) {
	for k := len(cols) - 1; k >= 0; k-- { // chains in the order of cols
		j := cols[k]
		if g.state[j] != qLive {
			continue
		}
		b := g.hash[j]
		g.hnext[j] = g.head[b]
		g.head[b] = j
	}
	for _, j := range cols {
		if g.state[j] != qLive {
			continue
		}
		b := g.hash[j]
		if g.head[b] < 0 {
			continue // this bucket is done
		}
		for a := g.head[b]; a >= 0; a = g.hnext[a] {
			if g.state[a] != qLive {
				continue
			}
			tag := g.nextETag()
			la := g.list(int(a))
			for _, e := range la {
				g.emark[e] = tag
			}
			for c := g.hnext[a]; c >= 0; c = g.hnext[c] {
				if g.state[c] != qLive || int(g.size[c]) != len(la) || g.hash[c] != g.hash[a] ||
					g.penalty[c] != g.penalty[a] || g.dsig[c] != g.dsig[a] {
					continue
				}
				same := true
				for _, e := range g.list(int(c)) {
					if g.emark[e] != tag {
						same = false
						break
					}
				}
				if same {
					g.merge(int(c), int(a))
				}
			}
		}
		g.head[b] = -1
	}
}

// merge makes column c part of the supervariable of a.
func (g *quotientGraph) merge(c, a int) {
	g.nv[a] += g.nv[c]
	g.nv[c] = 0
	g.state[c] = qMerged
	g.next[g.last[a]] = int32(c)
	g.last[a] = g.last[c]
	g.size[c] = 0
	if g.h != nil {
		g.h.remove(c)
	}
}

// eliminate runs the elimination and returns the order.
func (g *quotientGraph) eliminate() []int {
	n := g.n
	order := make([]int, 0, n)
	for g.h.len() > 0 {
		p := g.h.pop()
		g.ensureFree(g.h.len())
		for k := int32(p); k >= 0; k = g.next[k] {
			order = append(order, int(k))
		}
		g.pivot(p)
	}
	order = append(order, g.denseCol...)
	return order
}

// pivot eliminates the supervariable p: forms its element Lp, absorbs
// p's elements, and updates the columns of Lp (lists, supervariables,
// degrees).
func (g *quotientGraph) pivot(p int) {
	n := g.n
	np := int(g.nv[p])
	g.state[p] = qGone
	g.left -= np
	// Lp: the columns of p's elements, which it absorbs.
	if g.vtag == 1<<31-1 {
		clear(g.vmark)
		g.vtag = 0
	}
	g.vtag++
	g.vmark[p] = g.vtag
	lp0 := g.tail
	lpSize := 0
	alone := true // p has no element: its columns are adjacent to nothing (see mergeIndistinguishable)
	for _, e := range g.list(p) {
		if g.dead[e] {
			continue
		}
		for _, i := range g.list(n + int(e)) {
			if g.state[i] == qLive && g.vmark[i] != g.vtag {
				g.vmark[i] = g.vtag
				g.iw[g.tail] = i
				g.tail++
				lpSize += int(g.nv[i])
			}
		}
		g.dead[e] = true
		g.size[n+int(e)] = 0
		alone = false
	}
	g.size[p] = 0
	lp := g.iw[lp0:g.tail]
	if !alone {
		// The columns of p are each other's neighbours through its
		// elements, and neighbours of Lp.
		g.fill += np*lpSize + np*(np-1)/2
	}
	if len(lp) == 0 {
		g.tail = lp0
		return
	}
	// w[e] = |Le \ Lp| for the elements of the columns of Lp.
	tag := g.nextETag()
	g.touched = g.touched[:0]
	for _, i := range lp {
		for _, e := range g.list(int(i)) {
			if g.dead[e] {
				continue
			}
			if g.emark[e] != tag {
				g.emark[e] = tag
				g.w[e] = g.esize[e]
				g.touched = append(g.touched, e)
			}
			g.w[e] -= g.nv[i]
		}
	}
	// Lp inside an older element, or of one column, adds nothing. (Of
	// one supervariable of several columns it is kept: its columns stay
	// each other's neighbours, and a supervariable with no element is
	// one whose columns are adjacent to nothing; see pivot's fill.)
	keep := len(lp) > 1 || g.nv[lp[0]] > 1
	for _, e := range g.touched {
		if keep && g.w[e] > 0 && int(g.esize[e]-g.w[e]) == lpSize {
			keep = false
		}
	}
	for _, e := range g.touched {
		if g.w[e] == 0 { // Le ⊆ Lp: absorbed
			g.dead[e] = true
			g.size[n+int(e)] = 0
		}
	}
	ep := int32(n + p) // the new element's number
	if keep {
		g.start[n+int(ep)] = lp0
		g.size[n+int(ep)] = int32(len(lp))
		g.esize[ep] = int32(lpSize)
		g.dead[ep] = false
	} else {
		g.dead[ep] = true
	}
	// The lists of Lp's columns, in place: each loses at least one of
	// p's elements, so the new element fits.
	for _, i := range lp {
		s := g.start[i]
		k := s
		h := 0
		for _, e := range g.list(int(i)) {
			if !g.dead[e] {
				g.iw[k] = e
				k++
				h += int(e)
			}
		}
		if keep {
			g.iw[k] = ep
			k++
			h += int(ep)
		}
		g.size[i] = k - s
		g.hash[i] = int32((h + int(g.size[i])) % n)
	}
	g.mergeIndistinguishable(lp)
	for _, i := range lp {
		if g.state[i] != qLive {
			continue
		}
		ext := lpSize - int(g.nv[i])
		d := ext
		for _, e := range g.list(int(i)) {
			if e != ep {
				d += int(g.w[e])
			}
		}
		d = min(d, g.deg[i]+ext, g.left-int(g.nv[i]))
		g.deg[i] = d
		g.h.update(int(i), d+g.penalty[i])
	}
	if !keep {
		g.tail = lp0
	}
}

// ensureFree makes room for k more entries at the tail of iw, compacting
// the lists (and dropping their dead entries) or growing iw.
func (g *quotientGraph) ensureFree(k int) {
	if len(g.iw)-int(g.tail) >= k {
		return
	}
	g.compact()
	if len(g.iw)-int(g.tail) < k {
		grown := make([]int32, 2*len(g.iw)+k)
		copy(grown, g.iw[:g.tail])
		g.iw = grown
	}
}

// compact moves the live lists to the front of iw, in their order, and
// drops merged columns from the elements' lists and dead elements from
// the columns' lists. The first entry of each list is replaced by a
// negative mark of its node while iw is scanned.
func (g *quotientGraph) compact() {
	n := g.n
	if g.first == nil {
		g.first = make([]int32, len(g.start))
	}
	for node := range g.start {
		if g.size[node] > 0 {
			s := g.start[node]
			g.first[node] = g.iw[s]
			g.iw[s] = int32(-(node + 1))
		}
	}
	var dst int32
	for k := int32(0); k < g.tail; {
		v := g.iw[k]
		if v >= 0 {
			k++
			continue
		}
		node := int(-v - 1)
		end := k + g.size[node]
		g.start[node] = dst
		column := node < n
		keep := func(x int32) bool {
			if column {
				return !g.dead[x]
			}
			return g.state[x] == qLive
		}
		if x := g.first[node]; keep(x) {
			g.iw[dst] = x
			dst++
		}
		for t := k + 1; t < end; t++ {
			if x := g.iw[t]; keep(x) {
				g.iw[dst] = x
				dst++
			}
		}
		g.size[node] = dst - g.start[node]
		k = end
	}
	g.tail = dst
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

func (h *degreeHeap) len() int { return len(h.col) }

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
	h.remove(j)
	return j
}

// remove takes column j, which is in the heap, out of it.
func (h *degreeHeap) remove(j int) {
	i := h.at[j]
	last := len(h.col) - 1
	h.swap(i, last)
	h.col = h.col[:last]
	h.at[j] = -1
	if i < last {
		h.down(i)
		h.up(i)
	}
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
