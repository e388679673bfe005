package profile

import (
	"context"
	"math"
	"reflect"
	"strings"
	"testing"

	"steamcase/plant"
)

func TestStudyNPVByHand(t *testing.T) {
	t.Parallel()
	// One variant by hand: the fuel saved and CO2 avoided over 100 h are
	// scaled to a year (× 8760/100), priced at 600 per t of fuel and 80 per
	// t of CO2, and discounted over 15 years at 8 %: by the annuity factor
	// (1 − 1.08^−15)/0.08 = 8.559479 (engineering economics, common
	// practice; summed year by year below as a check of Annuity), less the
	// installed cost over the base's (250 000 − 20 000).
	p := tanker(t)
	rows := voyage(100)
	econ := Economics{FuelPrice: 600, CarbonPrice: 80, LifeYears: 15, DiscountRate: 0.08, Currency: "USD"}
	res, err := Study(context.Background(), p, rows, []Variant{
		{Name: "without EGE", Set: []plant.Setting{{Unit: "EGE", Param: "off", Value: 1}}, InstalledCost: 20000, HasCost: true},
		{Name: "with EGE", InstalledCost: 250000, HasCost: true},
	}, econ, Options{})
	must(t, err)
	v := res.Variants[1]
	var af float64
	for y := 1; y <= 15; y++ {
		af += 1 / math.Pow(1.08, float64(y))
	}
	if math.Abs(af-Annuity(0.08, 15)) > 1e-12 || math.Abs(af-8.559479) > 1e-6 {
		t.Errorf("annuity factor %.9f, Annuity %.9f; want 8.559479", af, Annuity(0.08, 15))
	}
	annual := (v.FuelSavedT*600 + v.CO2AvoidedT*80) * 8760 / 100
	if math.Abs(v.AnnualSaving-annual) > 1e-9*annual {
		t.Errorf("annual saving %g, want %g", v.AnnualSaving, annual)
	}
	npv := -230000 + annual*af
	if !res.HasNPV || math.Abs(v.NPV-npv) > 1e-9*math.Abs(npv) {
		t.Errorf("NPV %g, want %g", v.NPV, npv)
	}
	if pb := 230000 / annual; !v.HasPayback || math.Abs(v.PaybackYears-pb) > 1e-12*pb {
		t.Errorf("payback %g years (has %v), want %g", v.PaybackYears, v.HasPayback, pb)
	}
	if b := res.Variants[0]; b.NPV != 0 || b.HasPayback || b.InstalledCost != 20000 {
		t.Errorf("base: NPV %g, payback %v, cost %g", b.NPV, b.HasPayback, b.InstalledCost)
	}
	// At a zero discount rate the NPV is the life's savings less the cost.
	econ.DiscountRate = 0
	res, err = Study(context.Background(), p, rows, []Variant{
		{Name: "without EGE", Set: []plant.Setting{{Unit: "EGE", Param: "off", Value: 1}}},
		{Name: "with EGE", InstalledCost: 250000, HasCost: true},
	}, econ, Options{})
	must(t, err)
	v = res.Variants[1]
	if want := -250000 + 15*v.AnnualSaving; math.Abs(v.NPV-want) > 1e-9*math.Abs(want) {
		t.Errorf("NPV at 0 %%: %g, want %g", v.NPV, want)
	}
}

func TestStudyEconomicsErrors(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	rows := voyage(4)
	vs := []Variant{{Name: "a"}, {Name: "b"}}
	for _, tc := range []struct {
		econ Economics
		want string
	}{
		{Economics{LifeYears: 10, DiscountRate: -0.05}, "discount rate must lie between 0 and 100 % a year; got -5 %"},
		{Economics{CarbonPrice: -1}, "carbon price must be zero or more"},
		{Economics{LifeYears: 200}, "life must be 1 to 60 years"},
	} {
		_, err := Study(context.Background(), p, rows, vs, tc.econ, Options{})
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%+v: got %v, want %q", tc.econ, err, tc.want)
		}
	}
}

func TestStudySweep(t *testing.T) {
	t.Parallel()
	// A sweep of UA: each size's cost by the cost law at its UA (by hand),
	// each size's savings equal to a variant that sets the same UA, the
	// best size the one of highest NPV, and the same result on one worker
	// and on three.
	p := tanker(t)
	rows := voyage(48)
	econ := Economics{FuelPrice: 600, LifeYears: 10, DiscountRate: 0.1}
	law := CostLaw{RefUA: 20e3, RefCost: 200000, Exponent: 0.7, Fixed: 30000}
	spec := StudySpec{
		Variants: []Variant{
			{Name: "without EGE", Set: []plant.Setting{{Unit: "EGE", Param: "off", Value: 1}}},
			{Name: "UA 15 kW/K", Set: []plant.Setting{{Unit: "EGE", Param: "ua", Value: 15e3}}, InstalledCost: law.At(15e3), HasCost: true},
		},
		Economics: econ,
		Sweep:     &Sweep{Unit: "EGE", Param: "ua", Values: []float64{5e3, 10e3, 15e3, 30e3, 60e3}, Cost: law},
	}
	res, err := RunStudy(context.Background(), p, rows, spec, Options{Workers: 3, ChunkRows: 16})
	must(t, err)
	sw := res.Sweep
	if sw == nil || len(sw.Points) != 5 {
		t.Fatalf("sweep %+v", sw)
	}
	for _, pt := range sw.Points {
		if math.Abs(pt.UA-pt.Value) > 1e-9*pt.Value {
			t.Errorf("size %g: UA %g", pt.Value, pt.UA)
		}
		want := 30000 + 200000*math.Pow(pt.Value/20e3, 0.7)
		if math.Abs(pt.InstalledCost-want) > 1e-9*want {
			t.Errorf("size %g: cost %g, want %g", pt.Value, pt.InstalledCost, want)
		}
	}
	v := res.Variants[1]
	pt := sw.Points[2]
	if math.Abs(pt.FuelSavedT-v.FuelSavedT) > 1e-9*v.FuelSavedT || math.Abs(pt.NPV-v.NPV) > 1e-9*math.Abs(v.NPV) {
		t.Errorf("sweep at 15 kW/K: saved %g t, NPV %g; the variant: %g t, %g", pt.FuelSavedT, pt.NPV, v.FuelSavedT, v.NPV)
	}
	for k, q := range sw.Points {
		if q.NPV > sw.Points[sw.Best].NPV {
			t.Errorf("size %d has NPV %g above the best's %g", k, q.NPV, sw.Points[sw.Best].NPV)
		}
	}
	one, err := RunStudy(context.Background(), p, rows, spec, Options{Workers: 1, ChunkRows: 16})
	must(t, err)
	if !reflect.DeepEqual(one, res) {
		t.Errorf("the study differs between one worker and three")
	}
	// A sweep without the NPV's figures, or of a key that is not a size,
	// is refused.
	bad := spec
	bad.Economics.LifeYears = 0
	if _, err := RunStudy(context.Background(), p, rows, bad, Options{}); err == nil || !strings.Contains(err.Error(), "highest NPV") {
		t.Errorf("sweep without a life: %v", err)
	}
	bad = spec
	bad.Sweep = &Sweep{Unit: "EGE", Param: "exponent", Values: []float64{0.6, 0.7}, Cost: law}
	if _, err := RunStudy(context.Background(), p, rows, bad, Options{}); err == nil || !strings.Contains(err.Error(), `"ua" or "pinch"`) {
		t.Errorf("sweep of exponent: %v", err)
	}
}

func TestStudyEGEHours(t *testing.T) {
	t.Parallel()
	// The hours a variant's economiser runs at soot-risk loads are the
	// hours of its rows below 40 % load (common practice, no source),
	// counted only where it is in service.
	p := tanker(t)
	var rows []Row
	for i, load := range []float64{0.2, 0.3, 0.5, 0.8} {
		rows = append(rows, Row{Phase: "sea", Hours: float64(10 * (i + 1)), Case: plant.Case{Name: "r",
			Conditions: plant.Conditions{SeaT: 283.15, AirT: 278.15, EngineLoad: load}}})
	}
	res, err := Study(context.Background(), p, rows, []Variant{
		{Name: "without EGE", Set: []plant.Setting{{Unit: "EGE", Param: "off", Value: 1}}},
		{Name: "with EGE"},
	}, Economics{}, Options{})
	must(t, err)
	if h := res.Variants[1].HoursSootRisk; h != 30 {
		t.Errorf("soot-risk hours %g, want 10 + 20", h)
	}
	if h := res.Variants[0].HoursSootRisk; h != 0 {
		t.Errorf("soot-risk hours without the EGE %g", h)
	}
}
