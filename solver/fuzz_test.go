package solver

import (
	"testing"
)

// FuzzDiagnose builds an incidence pattern from arbitrary bytes and checks
// that DiagnoseIncidence never panics and that its decomposition is
// consistent (the same invariants as TestDiagnoseRandom).
func FuzzDiagnose(f *testing.F) {
	f.Add([]byte{3, 3, 0, 1, 1, 2, 2})
	f.Add([]byte{2, 2, 0, 0, 0})
	f.Add([]byte{4, 2, 1, 5, 200, 3})
	f.Fuzz(func(t *testing.T, data []byte) {
		if len(data) < 2 {
			return
		}
		eqs, vars := int(data[0]%16), int(data[1]%16)
		pattern := make([][]int, eqs)
		if eqs > 0 && vars > 0 {
			for k, b := range data[2:] {
				pattern[k%eqs] = append(pattern[k%eqs], int(b)%vars)
			}
		}
		s, err := DiagnoseIncidence(eqs, vars, pattern, nil, nil)
		if s == nil {
			t.Fatal(err)
		}
		if (err == nil) != (s.Err() == nil) {
			t.Fatalf("returned error %v, Err() %v", err, s.Err())
		}
		if vars-(len(s.UnderUnknowns)-len(s.UnderEquations)) != s.Rank ||
			eqs-(len(s.OverEquations)-len(s.OverUnknowns)) != s.Rank ||
			len(s.SquareEquations) != len(s.SquareUnknowns) {
			t.Fatalf("inconsistent decomposition %+v for %v", s, pattern)
		}
		if err := s.Err(); (err == nil) != (eqs == vars && s.Rank == vars) {
			t.Fatalf("Err %v with rank %d of %d×%d", err, s.Rank, eqs, vars)
		}
		if s.Err() != nil {
			_ = s.Err().Error()
		}
	})
}
