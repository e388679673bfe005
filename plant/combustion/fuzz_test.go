package combustion

import (
	"errors"
	"math"
	"testing"
)

// FuzzFire: no input makes Fire or Efficiency panic or return a NaN; a
// successful Fire closes its mass balance.
func FuzzFire(f *testing.F) {
	f.Add(1.15, 0.0, 298.15, 0.0, 0.0, 523.15)
	f.Add(0.0, 0.03, 308.15, 0.01, 0.02, 473.15)
	f.Add(0.0, 0.25, 100.0, -1.0, 5.0, 0.0)
	f.Add(math.NaN(), 0.0, math.Inf(1), 0.0, 0.0, 500.0)
	fu := testFuel()
	f.Fuzz(func(t *testing.T, lambda, o2, airT, hum, steam, flueT float64) {
		p, err := Fire(fu, Conditions{Lambda: lambda, O2Dry: o2, AirT: airT, Humidity: hum, AtomisingSteam: steam})
		if err != nil {
			if lambda == 0 && o2 == 0 && !errors.Is(err, ErrCannotFire) {
				t.Fatalf("no air but not ErrCannotFire: %v", err)
			}
			return
		}
		if d := 1 + p.Air + p.AtomisingSteam - p.FlueGas - p.Ash; math.Abs(d) > 1e-9 {
			t.Fatalf("mass balance off by %g", d)
		}
		for _, v := range p.Moles {
			if math.IsNaN(v) || v < 0 {
				t.Fatalf("moles %v", p.Moles)
			}
		}
		l, err := Efficiency(p, flueT, TRef, LossOptions{})
		if err != nil {
			return
		}
		if math.IsNaN(l.LHV.Efficiency) || math.IsNaN(l.HHV.Efficiency) {
			t.Fatalf("NaN efficiency %+v", l)
		}
	})
}
