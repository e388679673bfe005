package water

import (
	"math"
	"math/rand/v2"
	"testing"
)

// TestIdentities checks cp, cv and w of every region against finite
// differences of the basic equations, through thermodynamic identities:
//
//	cp = (∂h/∂T)_p,  α = (∂v/∂T)_p / v,  κ_T = -(∂v/∂p)_T / v,
//	cp - cv = T·v·α²/κ_T,  w² = (cp/cv)/(ρ·κ_T).
//
// Source: common practice (textbook thermodynamic identities); the
// verification tables check cp and w but not cv. Central differences with
// a relative step of 1e-5 in T and p; tolerance 1e-5 relative (2e-4 in
// region 3, whose derivatives are steeper).
func TestIdentities(t *testing.T) {
	t.Parallel()
	r := rand.New(rand.NewPCG(2, 1997))
	counts := map[Region]int{}
	for counts[Region1] < 300 || counts[Region2] < 300 || counts[Region3] < 300 || counts[Region5] < 300 {
		p, tk := randPT(r)
		if r.IntN(3) == 0 { // more draws in region 3
			p, tk = 16.6e6+r.Float64()*83e6, 623.2+r.Float64()*240
		}
		st, err := PT(p, tk)
		if err != nil {
			continue
		}
		if nearBoundary(p, tk, 0.1) || math.Abs(tk-tCrit) < 3 && math.Abs(p-pCrit) < 2e6 {
			continue // skip the critical point's singular derivatives
		}
		dT, dp := tk*1e-5, p*1e-5
		at := func(p, tk float64) State {
			s, err := PT(p, tk)
			if err != nil || s.Region != st.Region {
				return State{}
			}
			return s
		}
		tp, tm := at(p, tk+dT), at(p, tk-dT)
		pp, pm := at(p+dp, tk), at(p-dp, tk)
		if tp.Region == 0 || tm.Region == 0 || pp.Region == 0 || pm.Region == 0 {
			continue
		}
		counts[st.Region]++
		cp := (tp.H - tm.H) / (2 * dT)
		alpha := (tp.V - tm.V) / (2 * dT) / st.V
		kappa := -(pp.V - pm.V) / (2 * dp) / st.V
		cv := cp - tk*st.V*alpha*alpha/kappa
		w := math.Sqrt(cp / cv / (st.Rho * kappa))
		tol := 1e-5
		if st.Region == Region3 {
			tol = 2e-4
		}
		for _, c := range []struct {
			name      string
			got, want float64
		}{{"cp", st.Cp, cp}, {"cv", st.Cv, cv}, {"w", st.W, w}} {
			if d := math.Abs(c.got-c.want) / c.want; !(d <= tol) {
				t.Errorf("%v p=%g T=%g: %s = %.9g, finite differences give %.9g (rel. %.2g)", st.Region, p, tk, c.name, c.got, c.want, d)
			}
		}
		if t.Failed() {
			return
		}
	}
}
