package solver

import (
	"fmt"
	"strings"
)

// Structure is the structural analysis of an incidence pattern: which
// unknowns each equation depends on, regardless of the values.
//
// A maximum matching pairs equations with unknowns they contain
// (Hopcroft and Karp 1973). The Dulmage–Mendelsohn coarse decomposition
// (Dulmage and Mendelsohn 1958) then splits the system into three parts:
//   - under-determined: the unknowns reachable from an unmatched unknown by
//     alternating paths, with the equations on those paths: more unknowns
//     than equations;
//   - over-determined: the equations reachable from an unmatched equation by
//     alternating paths, with the unknowns on those paths: more equations
//     than unknowns;
//   - square: the rest, which is perfectly matched.
//
// A system can be solved by Newton's method only if both outer parts are
// empty (the structural rank equals the number of unknowns and equations).
type Structure struct {
	Equations, Unknowns int
	// Rank is the structural rank: the size of a maximum matching.
	Rank int
	// MatchEq[i] is the unknown matched to equation i, or -1.
	MatchEq []int
	// MatchVar[j] is the equation matched to unknown j, or -1.
	MatchVar []int

	// The coarse decomposition, as sorted indices.
	OverEquations, OverUnknowns     []int
	SquareEquations, SquareUnknowns []int
	UnderEquations, UnderUnknowns   []int

	// Colors is the number of groups a greedy colouring of the column
	// intersection graph needs: the residual evaluations of one coloured
	// finite-difference Jacobian. Zero if the system is not square.
	Colors int

	eqNames, varNames []string
}

// StructureError reports a structurally singular system by name.
type StructureError struct {
	Equations, Unknowns int // counts of the whole system
	Rank                int // structural rank

	// UnderUnknowns outnumber UnderEquations, the equations they appear in.
	UnderUnknowns, UnderEquations []string
	// OverEquations outnumber OverUnknowns, the unknowns they contain.
	OverEquations, OverUnknowns []string
}

func (e *StructureError) Error() string {
	var b strings.Builder
	fmt.Fprintf(&b, "solver: structurally singular system: %d equations, %d unknowns, structural rank %d",
		e.Equations, e.Unknowns, e.Rank)
	if len(e.UnderUnknowns) > 0 {
		k := len(e.UnderUnknowns) - len(e.UnderEquations)
		if len(e.UnderEquations) == 0 {
			fmt.Fprintf(&b, "; under-determined: unknowns %s appear in no equation",
				quoteList(e.UnderUnknowns))
		} else {
			fmt.Fprintf(&b, "; under-determined: unknowns %s appear in no equation that is not already matched: %d unknowns share only %d %s (%s)",
				quoteList(e.UnderUnknowns), len(e.UnderUnknowns), len(e.UnderEquations),
				plural(len(e.UnderEquations), "equation", "equations"), quoteList(e.UnderEquations))
		}
		fmt.Fprintf(&b, " (add %d %s or fix %d of these unknowns)", k, plural(k, "equation", "equations"), k)
	}
	if len(e.OverEquations) > 0 {
		k := len(e.OverEquations) - len(e.OverUnknowns)
		if len(e.OverUnknowns) == 0 {
			fmt.Fprintf(&b, "; over-determined: equations %s contain no unknown", quoteList(e.OverEquations))
		} else {
			fmt.Fprintf(&b, "; over-determined: equations %s compete for unknowns %s (%d equations for %d %s)",
				quoteList(e.OverEquations), quoteList(e.OverUnknowns), len(e.OverEquations), len(e.OverUnknowns),
				plural(len(e.OverUnknowns), "unknown", "unknowns"))
		}
		fmt.Fprintf(&b, " (remove %d of these equations or free %d more %s)", k, k, plural(k, "unknown", "unknowns"))
	}
	return b.String()
}

// Unwrap lets errors.Is(err, ErrStructure) match.
func (e *StructureError) Unwrap() error { return ErrStructure }

func plural(k int, one, many string) string {
	if k == 1 {
		return one
	}
	return many
}

// Err returns nil if the system is square and structurally nonsingular,
// and a *StructureError naming the over- and under-determined parts
// otherwise.
func (s *Structure) Err() error {
	if s.Equations == s.Unknowns && s.Rank == s.Unknowns {
		return nil
	}
	e := &StructureError{Equations: s.Equations, Unknowns: s.Unknowns, Rank: s.Rank}
	e.UnderUnknowns = names(s.UnderUnknowns, s.varNames, "unknown")
	e.UnderEquations = names(s.UnderEquations, s.eqNames, "equation")
	e.OverEquations = names(s.OverEquations, s.eqNames, "equation")
	e.OverUnknowns = names(s.OverUnknowns, s.varNames, "unknown")
	return e
}

func names(idx []int, list []string, kind string) []string {
	if len(idx) == 0 {
		return nil
	}
	out := make([]string, len(idx))
	for k, i := range idx {
		if i < len(list) && list[i] != "" {
			out[k] = list[i]
		} else {
			out[k] = fmt.Sprintf("%s %d", kind, i)
		}
	}
	return out
}

// Diagnose analyses the structure of p from p.Pattern (see Structure).
// If the system is structurally singular it returns the Structure together
// with its *StructureError (the same as (*Structure).Err). If p has no
// Pattern or the pattern is malformed it returns a nil Structure and an
// error wrapping ErrInvalidProblem.
func Diagnose(p Problem) (*Structure, error) {
	if p.Pattern == nil {
		return nil, fmt.Errorf("%w: Diagnose needs Problem.Pattern, which is nil", ErrInvalidProblem)
	}
	if len(p.Pattern) != p.Dim {
		return nil, fmt.Errorf("%w: Problem.Pattern has %d rows, want Dim = %d", ErrInvalidProblem, len(p.Pattern), p.Dim)
	}
	return diagnoseIncidence(p.Dim, p.Dim, p.Pattern, p.EqNames, p.VarNames, nil)
}

// DiagnoseIncidence analyses a system of eqs equations in vars unknowns,
// not necessarily square: pattern[i] lists the unknowns equation i
// contains. eqNames and varNames may be nil. Use it to count and check a
// model before a square Problem exists. Errors are as for Diagnose: a
// system that is not square or not structurally nonsingular returns its
// Structure and a *StructureError.
func DiagnoseIncidence(eqs, vars int, pattern [][]int, eqNames, varNames []string) (*Structure, error) {
	return diagnoseIncidence(eqs, vars, pattern, eqNames, varNames, nil)
}

// diagnoseIncidence is DiagnoseIncidence with the colouring of the
// columns, if the caller has made it (nil: made here when the system is
// square).
func diagnoseIncidence(eqs, vars int, pattern [][]int, eqNames, varNames []string, col *coloring) (*Structure, error) {
	if eqs < 0 || vars < 0 || len(pattern) != eqs {
		return nil, fmt.Errorf("%w: incidence of %d equations and %d unknowns has %d pattern rows, want %d", ErrInvalidProblem, eqs, vars, len(pattern), eqs)
	}
	for i, row := range pattern {
		for _, j := range row {
			if j < 0 || j >= vars {
				name := fmt.Sprintf("equation %d", i)
				if i < len(eqNames) && eqNames[i] != "" {
					name = eqNames[i]
				}
				return nil, fmt.Errorf("%w: pattern of equation '%s' lists unknown index %d, want 0 ≤ index < %d", ErrInvalidProblem, name, j, vars)
			}
		}
	}
	matchEq, matchVar, rank := hopcroftKarp(pattern, eqs, vars)
	s := &Structure{Equations: eqs, Unknowns: vars, Rank: rank, MatchEq: matchEq, MatchVar: matchVar,
		eqNames: eqNames, varNames: varNames}

	// The equations of each unknown, in one array (each list is walked
	// once, so duplicates in a row do no harm).
	cptr := make([]int, vars+1)
	for _, row := range pattern {
		for _, j := range row {
			cptr[j+1]++
		}
	}
	for j := 0; j < vars; j++ {
		cptr[j+1] += cptr[j]
	}
	crow := make([]int, cptr[vars])
	fill := make([]int, vars)
	copy(fill, cptr[:vars])
	for i, row := range pattern {
		for _, j := range row {
			crow[fill[j]] = i
			fill[j]++
		}
	}
	// Under-determined part: alternating paths from unmatched unknowns
	// (unknown → any equation containing it → that equation's matched
	// unknown). Each unknown enters the queue once.
	underEq := make([]bool, eqs)
	underVar := make([]bool, vars)
	queue := fill[:0] // reused
	for j := 0; j < vars; j++ {
		if matchVar[j] < 0 {
			underVar[j] = true
			queue = append(queue, j)
		}
	}
	for q := 0; q < len(queue); q++ {
		j := queue[q]
		for _, i := range crow[cptr[j]:cptr[j+1]] {
			if underEq[i] {
				continue
			}
			underEq[i] = true
			if k := matchEq[i]; k >= 0 && !underVar[k] {
				underVar[k] = true
				queue = append(queue, k)
			}
		}
	}
	// Over-determined part: alternating paths from unmatched equations
	// (equation → any unknown in it → that unknown's matched equation).
	// Each equation enters the queue once.
	overEq := make([]bool, eqs)
	overVar := make([]bool, vars)
	queue = make([]int, 0, eqs)
	for i := 0; i < eqs; i++ {
		if matchEq[i] < 0 {
			overEq[i] = true
			queue = append(queue, i)
		}
	}
	for q := 0; q < len(queue); q++ {
		i := queue[q]
		for _, j := range pattern[i] {
			if overVar[j] {
				continue
			}
			overVar[j] = true
			if k := matchVar[j]; k >= 0 && !overEq[k] {
				overEq[k] = true
				queue = append(queue, k)
			}
		}
	}
	s.SquareEquations = make([]int, 0, eqs)
	s.SquareUnknowns = make([]int, 0, vars)
	for i := 0; i < eqs; i++ {
		switch {
		case underEq[i]:
			s.UnderEquations = append(s.UnderEquations, i)
		case overEq[i]:
			s.OverEquations = append(s.OverEquations, i)
		default:
			s.SquareEquations = append(s.SquareEquations, i)
		}
	}
	for j := 0; j < vars; j++ {
		switch {
		case underVar[j]:
			s.UnderUnknowns = append(s.UnderUnknowns, j)
		case overVar[j]:
			s.OverUnknowns = append(s.OverUnknowns, j)
		default:
			s.SquareUnknowns = append(s.SquareUnknowns, j)
		}
	}
	if eqs == vars && vars > 0 {
		if col == nil {
			col = colorColumns(pattern, vars)
		}
		s.Colors = len(col.groups)
	}
	return s, s.Err()
}

// hopcroftKarp returns a maximum matching of the bipartite graph with left
// vertices 0..nl-1 (equations), right vertices 0..nr-1 (unknowns) and
// edges adj (Hopcroft and Karp, SIAM J. Comput. 2(4), 1973).
func hopcroftKarp(adj [][]int, nl, nr int) (matchL, matchR []int, size int) {
	const inf = int(^uint(0) >> 1)
	matchL = make([]int, nl)
	matchR = make([]int, nr)
	for i := range matchL {
		matchL[i] = -1
	}
	for j := range matchR {
		matchR[j] = -1
	}
	dist := make([]int, nl)
	next := make([]int, nl) // next edge to try in the DFS from each left vertex
	queue := make([]int, 0, nl)

	bfs := func() bool {
		queue = queue[:0]
		for u := 0; u < nl; u++ {
			if matchL[u] < 0 {
				dist[u] = 0
				queue = append(queue, u)
			} else {
				dist[u] = inf
			}
		}
		found := false
		for q := 0; q < len(queue); q++ {
			u := queue[q]
			for _, v := range adj[u] {
				w := matchR[v]
				if w < 0 {
					found = true
				} else if dist[w] == inf {
					dist[w] = dist[u] + 1
					queue = append(queue, w)
				}
			}
		}
		return found
	}
	var dfs func(u int) bool
	dfs = func(u int) bool {
		for ; next[u] < len(adj[u]); next[u]++ {
			v := adj[u][next[u]]
			w := matchR[v]
			if w < 0 || (dist[w] == dist[u]+1 && dfs(w)) {
				matchL[u] = v
				matchR[v] = u
				next[u]++
				return true
			}
		}
		dist[u] = inf
		return false
	}
	for bfs() {
		for u := range next {
			next[u] = 0
		}
		for u := 0; u < nl; u++ {
			if matchL[u] < 0 && dfs(u) {
				size++
			}
		}
	}
	return matchL, matchR, size
}
