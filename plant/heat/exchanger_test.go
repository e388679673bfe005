package heat

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"steamcase/plant/internal/root"
)

// TestCounterflowLimits: the exact limits of the counterflow relation
// (Incropera & DeWitt Table 11.3, from memory): Cr = 0 → 1 − e^−NTU,
// Cr = 1 → NTU/(1 + NTU); continuity as Cr → 1 and Cr → 0.
func TestCounterflowLimits(t *testing.T) {
	t.Parallel()
	for _, ntu := range []float64{0, 1e-9, 0.1, 1, 3, 10, 50} {
		e0, err := CounterflowEffectiveness(ntu, 0)
		mustNoErr(t, err)
		withinRel(t, fmt.Sprintf("Cr=0 NTU=%g", ntu), e0, -math.Expm1(-ntu), 1e-15)
		e1, _ := CounterflowEffectiveness(ntu, 1)
		withinRel(t, fmt.Sprintf("Cr=1 NTU=%g", ntu), e1, ntu/(1+ntu), 1e-15)
		near, _ := CounterflowEffectiveness(ntu, 1-1e-9)
		within(t, fmt.Sprintf("Cr→1 NTU=%g", ntu), near, e1, 1e-8)
		small, _ := CounterflowEffectiveness(ntu, 1e-12)
		within(t, fmt.Sprintf("Cr→0 NTU=%g", ntu), small, e0, 1e-11)
	}
	// A textbook point: NTU = 1, Cr = 0.5 → ε = (1 − e^−0.5)/(1 − 0.5·e^−0.5) = 0.5647 [C].
	e, _ := CounterflowEffectiveness(1, 0.5)
	printed(t, "NTU=1 Cr=0.5", e, "0.5647")
	if e, _ := CounterflowEffectiveness(math.Inf(1), 0.7); e != 1 {
		t.Errorf("NTU=+Inf: %g, want 1", e)
	}
	for _, c := range []struct{ ntu, cr float64 }{{-1, 0.5}, {1, 1.1}, {1, -0.1}, {math.NaN(), 0.5}, {1, math.NaN()}} {
		if _, err := CounterflowEffectiveness(c.ntu, c.cr); !errors.Is(err, ErrInput) {
			t.Errorf("NTU=%g Cr=%g: want ErrInput, got %v", c.ntu, c.cr, err)
		}
	}
}

// TestCounterflowInverse: NTU(ε(NTU, Cr), Cr) = NTU on seeded random states
// (a round trip, no external source).
func TestCounterflowInverse(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(1, 2))
	for range 2000 {
		ntu := 10 * rng.Float64()
		cr := rng.Float64()
		if rng.IntN(10) == 0 {
			cr = float64(rng.IntN(2))
		}
		e, err := CounterflowEffectiveness(ntu, cr)
		mustNoErr(t, err)
		if e >= 1 {
			continue
		}
		back, err := CounterflowNTU(e, cr)
		mustNoErr(t, err)
		within(t, fmt.Sprintf("round trip NTU=%g Cr=%g", ntu, cr), back, ntu, 1e-8*(1+ntu))
	}
}

// TestCounterflowExchanger: energy balance and the second law.
func TestCounterflowExchanger(t *testing.T) {
	t.Parallel()
	r, err := Counterflow(1.4*1100, 2.0*4200, 3000, 520, 333)
	mustNoErr(t, err)
	withinRel(t, "hot side duty", 1.4*1100*(520-r.HotOut), r.Q, 1e-12)
	withinRel(t, "cold side duty", 2.0*4200*(r.ColdOut-333), r.Q, 1e-12)
	if !(r.HotOut > 333 && r.ColdOut < 520 && r.HotIsMinFluid) {
		t.Errorf("second law or min fluid: %+v", r)
	}
	// Boiling cold side (+Inf): Cr = 0, cold outlet = inlet.
	b, err := Counterflow(1500, math.Inf(1), 3000, 600, 450)
	mustNoErr(t, err)
	if b.Cr != 0 || b.ColdOut != 450 {
		t.Errorf("boiling side: %+v", b)
	}
	within(t, "evaporator T_out", b.HotOut, 450+150*math.Exp(-2), 1e-9)
	for _, c := range [][5]float64{
		{0, 1, 1, 500, 300}, {1, 1, -1, 500, 300}, {1, 1, 1, 300, 500}, {math.Inf(1), math.Inf(1), 1, 500, 300}, {1, 1, math.NaN(), 500, 300},
	} {
		if _, err := Counterflow(c[0], c[1], c[2], c[3], c[4]); !errors.Is(err, ErrInput) {
			t.Errorf("%v: want ErrInput, got %v", c, err)
		}
	}
}

// TestBrent: the furnace's and tube pass's root finder is Brent's method
// of plant/internal/root (tested there), to the bracket's width: Wallis'
// cubic x³ − 2x − 5 (the classical test of root finders; its root
// 2.0945514815423265 from memory); a bracket that does not change sign and
// a NaN residual are errors.
func TestBrent(t *testing.T) {
	t.Parallel()
	f := func(x float64) float64 { return x*x*x - 2*x - 5 }
	x, _, err := brent(f, 2, 3, f(2), f(3), 1e-14, 100)
	mustNoErr(t, err)
	within(t, "Wallis' cubic", x, 2.0945514815423265, 1e-13)
	if _, _, err := brent(f, 3, 4, f(3), f(4), 1e-12, 100); !errors.Is(err, root.ErrNoBracket) {
		t.Errorf("no sign change: %v", err)
	}
	g := func(x float64) float64 {
		if x > 2.5 {
			return math.NaN()
		}
		return x - 2.7
	}
	if _, _, err := brent(g, 2, 3, g(2), 1, 1e-12, 100); !errors.Is(err, root.ErrNotFinite) {
		t.Errorf("NaN residual: %v", err)
	}
}
