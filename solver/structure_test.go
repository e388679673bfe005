package solver

import (
	"context"
	"errors"
	"math/rand/v2"
	"reflect"
	"strings"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// TestDiagnose checks the Dulmage–Mendelsohn coarse decomposition on small
// systems whose deficiency is known by construction (worked by hand; no
// published source).
func TestDiagnose(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name              string
		eqs, vars         int
		pattern           [][]int
		eqNames, varNames []string
		rank              int
		overEq, overVar   []int
		underEq, underVar []int
		wantInMessage     []string
		wantErr           bool
	}{
		{
			name: "well posed", eqs: 3, vars: 3,
			pattern: [][]int{{0, 1}, {1, 2}, {2}}, rank: 3,
		},
		{
			// Two set points fix the same drum pressure; the feed line
			// pressure and pump head share one equation.
			name: "plant-like", eqs: 4, vars: 4,
			pattern: [][]int{{0}, {0}, {1, 2}, {0, 3}},
			eqNames: []string{"drum d1 pressure set point", "line l3 pressure set point",
				"pump fp1 head law", "line l3 flow balance"},
			varNames: []string{"drum d1 pressure", "line feed2 pressure", "pump fp1 head", "line l3 flow"},
			rank:     3,
			overEq:   []int{0, 1}, overVar: []int{0},
			underEq: []int{2}, underVar: []int{1, 2},
			wantInMessage: []string{
				"under-determined: unknowns 'line feed2 pressure', 'pump fp1 head'",
				"2 unknowns share only 1 equation ('pump fp1 head law')",
				"over-determined: equations 'drum d1 pressure set point', 'line l3 pressure set point' compete for unknowns 'drum d1 pressure'",
			},
			wantErr: true,
		},
		{
			name: "unknown in no equation", eqs: 2, vars: 2,
			pattern: [][]int{{0}, {0}}, rank: 1,
			overEq: []int{0, 1}, overVar: []int{0},
			underVar:      []int{1},
			wantInMessage: []string{"unknowns 'unknown 1' appear in no equation", "compete for unknowns 'unknown 0'"},
			wantErr:       true,
		},
		{
			name: "more unknowns than equations", eqs: 2, vars: 3,
			pattern: [][]int{{0, 1}, {1, 2}}, rank: 2,
			underEq: []int{0, 1}, underVar: []int{0, 1, 2},
			wantInMessage: []string{"add 1 equation or fix 1 of these unknowns"},
			wantErr:       true,
		},
		{
			name: "equation with no unknown", eqs: 3, vars: 2,
			pattern: [][]int{{0}, {}, {1}}, rank: 2,
			overEq:        []int{1},
			wantInMessage: []string{"equations 'equation 1' contain no unknown"},
			wantErr:       true,
		},
	}
	for _, c := range cases {
		s, err := DiagnoseIncidence(c.eqs, c.vars, c.pattern, c.eqNames, c.varNames)
		if s == nil {
			t.Fatalf("%s: no structure (%v)", c.name, err)
		}
		if (err == nil) != (s.Err() == nil) {
			t.Errorf("%s: returned error %v, Err() %v", c.name, err, s.Err())
		}
		if s.Rank != c.rank {
			t.Errorf("%s: rank %d, want %d", c.name, s.Rank, c.rank)
		}
		for _, cmp := range []struct {
			what      string
			got, want []int
		}{
			{"over equations", s.OverEquations, c.overEq},
			{"over unknowns", s.OverUnknowns, c.overVar},
			{"under equations", s.UnderEquations, c.underEq},
			{"under unknowns", s.UnderUnknowns, c.underVar},
		} {
			if len(cmp.got) != 0 || len(cmp.want) != 0 {
				if !reflect.DeepEqual(cmp.got, cmp.want) {
					t.Errorf("%s: %s %v, want %v", c.name, cmp.what, cmp.got, cmp.want)
				}
			}
		}
		err = s.Err()
		if (err != nil) != c.wantErr {
			t.Fatalf("%s: Err() = %v, want error %v", c.name, err, c.wantErr)
		}
		if err == nil {
			continue
		}
		var se *StructureError
		if !errors.As(err, &se) || !errors.Is(err, ErrStructure) {
			t.Errorf("%s: error %T is not a *StructureError wrapping ErrStructure", c.name, err)
		}
		for _, w := range c.wantInMessage {
			if !strings.Contains(err.Error(), w) {
				t.Errorf("%s: message\n%s\nlacks %q", c.name, err, w)
			}
		}
	}
}

// TestSolveStructurallySingular checks that Solve diagnoses a Problem with
// a Pattern before iterating, and that SkipDiagnosis skips it.
func TestSolveStructurallySingular(t *testing.T) {
	t.Parallel()
	calls := 0
	p := Problem{Dim: 2, Pattern: [][]int{{0}, {0}}, VarNames: []string{"p", "m"}, EqNames: []string{"a", "b"},
		Residual: func(r, x []float64) error { calls++; r[0], r[1] = x[0]-1, x[0]-1; return nil }}
	res, err := Solve(context.Background(), p, []float64{0, 0}, nil)
	var se *StructureError
	if res.Status != StructurallySingular || !errors.As(err, &se) || calls != 0 {
		t.Fatalf("status %v, error %v, %d residual calls; want StructurallySingular, *StructureError, 0 calls", res.Status, err, calls)
	}
	if !reflect.DeepEqual(se.UnderUnknowns, []string{"m"}) || !reflect.DeepEqual(se.OverEquations, []string{"a", "b"}) {
		t.Errorf("under unknowns %v, over equations %v; want [m], [a b]", se.UnderUnknowns, se.OverEquations)
	}
	// Skipped: the numerically singular Jacobian is caught instead.
	res, err = Solve(context.Background(), p, []float64{0, 0}, &Settings{SkipDiagnosis: true})
	if res.Status != SingularJacobian || !errors.Is(err, ErrSingular) {
		t.Errorf("with SkipDiagnosis: status %v, error %v; want SingularJacobian", res.Status, err)
	}
}

// kuhnRank is a plain augmenting-path maximum matching (Kuhn 1955), used
// to check Hopcroft–Karp.
func kuhnRank(adj [][]int, nr int) int {
	matchR := make([]int, nr)
	for i := range matchR {
		matchR[i] = -1
	}
	var try func(u int, seen []bool) bool
	try = func(u int, seen []bool) bool {
		for _, v := range adj[u] {
			if seen[v] {
				continue
			}
			seen[v] = true
			if matchR[v] < 0 || try(matchR[v], seen) {
				matchR[v] = u
				return true
			}
		}
		return false
	}
	rank := 0
	for u := range adj {
		if try(u, make([]bool, nr)) {
			rank++
		}
	}
	return rank
}

// TestDiagnoseRandom checks, on seeded random incidence patterns, that the
// Hopcroft–Karp rank equals a plain augmenting-path rank, that the
// matching is valid, and that the decomposition is consistent:
// rank = unknowns − (#under unknowns − #under equations)
//
//	= equations − (#over equations − #over unknowns),
//
// the square part is square, and no equation of the over-determined part
// contains an unknown of the under-determined part (Dulmage and Mendelsohn
// 1958, from memory).
func TestDiagnoseRandom(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(7, 11))
	for trial := 0; trial < 500; trial++ {
		eqs, vars := 1+rng.IntN(12), 1+rng.IntN(12)
		pattern := make([][]int, eqs)
		for i := range pattern {
			for j := 0; j < vars; j++ {
				if rng.Float64() < 0.2 {
					pattern[i] = append(pattern[i], j)
				}
			}
		}
		s, _ := DiagnoseIncidence(eqs, vars, pattern, nil, nil)
		if s == nil {
			t.Fatal("no structure")
		}
		if want := kuhnRank(pattern, vars); s.Rank != want {
			t.Fatalf("trial %d: rank %d, want %d; pattern %v", trial, s.Rank, want, pattern)
		}
		for i, j := range s.MatchEq {
			if j >= 0 && (s.MatchVar[j] != i || !contains(pattern[i], j)) {
				t.Fatalf("trial %d: bad match %d-%d", trial, i, j)
			}
		}
		if vars-(len(s.UnderUnknowns)-len(s.UnderEquations)) != s.Rank ||
			eqs-(len(s.OverEquations)-len(s.OverUnknowns)) != s.Rank ||
			len(s.SquareEquations) != len(s.SquareUnknowns) {
			t.Fatalf("trial %d: inconsistent decomposition %+v", trial, s)
		}
		under := map[int]bool{}
		for _, j := range s.UnderUnknowns {
			under[j] = true
		}
		for _, i := range s.OverEquations {
			for _, j := range pattern[i] {
				if under[j] {
					t.Fatalf("trial %d: over-determined equation %d contains under-determined unknown %d", trial, i, j)
				}
			}
		}
		if (s.Err() == nil) != (eqs == vars && s.Rank == vars) {
			t.Fatalf("trial %d: Err %v with rank %d of %d×%d", trial, s.Err(), s.Rank, eqs, vars)
		}
	}
}

func contains(s []int, v int) bool {
	for _, x := range s {
		if x == v {
			return true
		}
	}
	return false
}

func TestDiagnoseBadPattern(t *testing.T) {
	t.Parallel()
	_, err := DiagnoseIncidence(1, 2, [][]int{{0, 5}}, []string{"drum level"}, nil)
	if err == nil || !errors.Is(err, ErrInvalidProblem) || !strings.Contains(err.Error(), "'drum level'") || !strings.Contains(err.Error(), "5") {
		t.Errorf("error %v, want one naming 'drum level' and index 5", err)
	}
	if _, err := Diagnose(Problem{Dim: 1}); err == nil {
		t.Error("Diagnose without a pattern: no error")
	}
}

// TestPatternCheck: a pattern that leaves out a dependency is caught with
// an analytic Jacobian during the solve when Settings.VerifyPattern is
// set, by Solver.Jacobian with analytic true in any case, and by
// CheckPattern for finite differences (constructed case, no source).
// Without VerifyPattern the entry outside the pattern is ignored, as
// documented.
func TestPatternCheck(t *testing.T) {
	t.Parallel()
	m := broydenTridiagonal(6)
	p := m.problem(true)
	p.EqNames = []string{"e0", "e1", "e2", "e3", "e4", "e5"}
	p.VarNames = []string{"x0", "x1", "x2", "x3", "x4", "x5"}
	p.Pattern = band(6, 1, 1)
	p.Pattern[2] = []int{1, 2} // drops x3 from e2
	for _, fact := range []Factorizer{nil, &SparseLU{}} {
		res, err := Solve(context.Background(), p, m.x0, &Settings{VerifyPattern: true, Factorizer: fact})
		var pe *PatternError
		if res.Status != InvalidProblem || !errors.As(err, &pe) || len(pe.Entries) != 1 || pe.Entries[0] != [2]string{"e2", "x3"} {
			t.Fatalf("analytic, %T: status %v, error %v; want InvalidProblem naming e2 and x3", fact, res.Status, err)
		}
	}
	sv, err := New(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	var pe *PatternError
	err = sv.Jacobian(mat.NewDense(6, 6, nil), m.x0, true)
	if !errors.As(err, &pe) || len(pe.Entries) != 1 || pe.Entries[0] != [2]string{"e2", "x3"} {
		t.Errorf("Solver.Jacobian: %v; want e2 depends on x3", err)
	}
	// Unverified, the solve uses the Jacobian without d e2/d x3 (a
	// quasi-Newton step) and still converges.
	if res, err := sv.Solve(context.Background(), m.x0); err != nil || res.Status != Converged {
		t.Errorf("unverified: status %v, error %v; want Converged", res.Status, err)
	}
	p.Jacobian = nil
	sv, err = New(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	err = sv.CheckPattern(m.x0)
	if !errors.As(err, &pe) || len(pe.Entries) != 1 || pe.Entries[0] != [2]string{"e2", "x3"} {
		t.Errorf("CheckPattern: %v; want e2 depends on x3", err)
	}
	p.Pattern = band(6, 1, 1)
	sv, err = New(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	if err := sv.CheckPattern(m.x0); err != nil {
		t.Errorf("complete pattern: %v", err)
	}
}
