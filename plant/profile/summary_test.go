package profile

import (
	"context"
	"reflect"
	"testing"
	"unsafe"

	"steamcase/plant"
)

// sumCases is the totals of solved rows summed from their full case
// results, the way the totals were summed before rows kept summaries: the
// reference the summaries' totals must equal bit for bit.
func sumCases(rows []RowResult) Totals {
	t := newTotals()
	for i, r := range rows {
		cr := r.Result
		hours := r.Hours
		s := hours * 3600 / 1000
		t.Rows++
		t.Hours += hours
		t.FuelT += cr.FuelKgS * s
		t.CO2T += cr.CO2KgS * s
		t.CO2AnalysisT += cr.CO2AnalysisKgS * s
		t.CO2AnalysisUnknown = t.CO2AnalysisUnknown || cr.CO2AnalysisUnknown
		t.SteamT += cr.SteamProductionKgS * s
		t.EGESteamT += cr.EGESteamKgS * s
		t.DumpedT += cr.DumpedKgS * s
		t.MakeUpT += cr.MakeUpKgS * s
		t.FuelSavedT += cr.EGEFuelSavedKgS * s
		for _, e := range cr.EGEs {
			t.EGEFoulingLostT += e.FoulingLostKgS * s
		}
		t.ElectricMWh += cr.ElectricW * hours / 1e6
		for len(t.HoursFiring) <= cr.BoilersFiring {
			t.HoursFiring = append(t.HoursFiring, 0)
		}
		t.HoursFiring[cr.BoilersFiring] += hours
		var fired, capAll float64
		for _, b := range cr.Boilers {
			fired += b.SteamKgS
			capAll += b.MCRKgS
			if b.FuelKgS > 0 {
				t.addGrade(b.FuelName, b.FuelKgS*s, b.CO2KgS*s, b.CO2AnalysisKgS*s, b.HasCO2Analysis)
			}
		}
		t.CapacityKgS = capAll
		if t.PeakRow < 0 || fired > t.PeakBoilerKgS {
			t.PeakBoilerKgS, t.PeakRow = fired, i
		}
		if cr.MarginNextKgS < t.TightestMarginKgS {
			t.TightestMarginKgS, t.TightestRow = cr.MarginNextKgS, i
		}
		if !cr.CanCarry {
			t.ShortRows = append(t.ShortRows, i)
		}
		if cr.InertGas != nil && !cr.InertGas.Met {
			t.InertGasShortHours += hours
		}
		if cr.ContingenciesChecked {
			t.N1CheckedRows++
			for _, c := range cr.Contingencies {
				if !c.CanCarry {
					t.N1ShortHours += hours
					t.N1ShortRows = append(t.N1ShortRows, i)
					break
				}
			}
		}
		if len(cr.Warnings) > 0 {
			t.WarningRows = append(t.WarningRows, i)
		}
	}
	return t
}

// TestSummaryTotalsAreBitForBit: the totals summed from the rows'
// summaries equal, bit for bit, those summed from their full case results
// (the definition of the totals; no outside source), over a voyage with
// an economiser, rows that cannot be carried and rows that warn, and for
// a study's variants; and each summary's figures are its case result's.
func TestSummaryTotalsAreBitForBit(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	rows := voyage(120)
	// Some rows beyond the boilers' MCR, so that short rows and warnings
	// are summed too.
	for i := 40; i < 50; i++ {
		rows[i].Case.Set = []plant.Setting{{Unit: "cargo heating", Param: "duty", Value: 18e6}}
	}
	res, err := Run(context.Background(), p, rows, Options{Workers: 2, ChunkRows: 16, KeepResults: true})
	must(t, err)
	if !reflect.DeepEqual(res.Total, sumCases(res.Rows)) {
		t.Errorf("totals from the summaries %+v\nfrom the case results %+v", res.Total, sumCases(res.Rows))
	}
	if len(res.Total.ShortRows) == 0 || len(res.Total.WarningRows) == 0 || res.Total.EGESteamT == 0 {
		t.Errorf("the voyage should have short rows, warnings and economiser steam: %+v", res.Total)
	}
	for _, ph := range res.Phases {
		var in []RowResult
		for _, r := range res.Rows {
			if r.Phase == ph.Phase {
				in = append(in, r)
			}
		}
		want := sumCases(in)
		// The phase's row numbers are the voyage's, the reference's are
		// the phase's own; the sums compare as they are.
		want.ShortRows, want.WarningRows, want.N1ShortRows = ph.ShortRows, ph.WarningRows, ph.N1ShortRows
		want.PeakRow, want.TightestRow = ph.PeakRow, ph.TightestRow
		if !reflect.DeepEqual(ph.Totals, want) {
			t.Errorf("phase %q: %+v\nfrom the case results %+v", ph.Phase, ph.Totals, want)
		}
	}
	for i, r := range res.Rows {
		s, c := r.Summary, r.Result
		var steam float64
		for _, b := range c.Boilers {
			steam += b.SteamKgS
		}
		if !s.Solved || s.Case != c.Name || s.FuelKgS != c.FuelKgS || s.SteamDemandKgS != c.SteamDemandKgS ||
			s.BoilerSteamKgS != steam || s.SeaT != c.Conditions.SeaT || !reflect.DeepEqual(s.Warnings, c.Warnings) && len(c.Warnings) > 0 {
			t.Fatalf("row %d: summary %+v of case %q", i+1, s, c.Name)
		}
	}

	st, err := Study(context.Background(), p, rows, []Variant{
		{Name: "without EGE", Set: []plant.Setting{{Unit: "EGE", Param: "off", Value: 1}}}, {Name: "with EGE"},
	}, Economics{FuelPrice: 600, InstalledCost: 250000}, Options{Workers: 2, KeepResults: true})
	must(t, err)
	lean, err := Study(context.Background(), p, rows, []Variant{
		{Name: "without EGE", Set: []plant.Setting{{Unit: "EGE", Param: "off", Value: 1}}}, {Name: "with EGE"},
	}, Economics{FuelPrice: 600, InstalledCost: 250000}, Options{Workers: 2})
	must(t, err)
	for k, v := range st.Variants {
		if len(v.Rows) != len(rows) || lean.Variants[k].Rows != nil {
			t.Fatalf("variant %q keeps %d rows with KeepResults and %d without; want %d and none", v.Name, len(v.Rows), len(lean.Variants[k].Rows), len(rows))
		}
		if !reflect.DeepEqual(v.Totals, sumCases(v.Rows)) || !reflect.DeepEqual(v.Totals, lean.Variants[k].Totals) {
			t.Errorf("variant %q: totals %+v, from the case results %+v, without them kept %+v", v.Name, v.Totals, sumCases(v.Rows), lean.Variants[k].Totals)
		}
		if !reflect.DeepEqual(v.RowWarnings, lean.Variants[k].RowWarnings) || !reflect.DeepEqual(v.EGEHours, lean.Variants[k].EGEHours) {
			t.Errorf("variant %q: warnings or flagged hours differ with the results kept", v.Name)
		}
	}
}

// TestWarningTextsShared: rows that warn alike keep one copy of the text;
// a nil *Texts keeps each as given.
func TestWarningTextsShared(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	rows := voyage(60)
	for i := range rows {
		rows[i].Case.Set = []plant.Setting{{Unit: "cargo heating", Param: "duty", Value: 18e6}}
	}
	res, err := Run(context.Background(), p, rows, Options{Workers: 2, ChunkRows: 8})
	must(t, err)
	first := map[string]*byte{}
	shared := 0
	for _, r := range res.Rows {
		for _, w := range r.Summary.Warnings {
			if at, ok := first[w]; ok {
				if at != unsafe.StringData(w) {
					t.Fatalf("the text %q is kept twice", w)
				}
				shared++
				continue
			}
			first[w] = unsafe.StringData(w)
		}
	}
	if shared == 0 {
		t.Errorf("no warning text repeats over %d rows beyond the MCR; the test shows nothing", len(rows))
	}
	var none *Texts
	if s := "text"; none.Intern(s) != s {
		t.Errorf("a nil Texts changes the text")
	}
	var some Texts
	a := some.Intern(string([]byte("same")))
	b := some.Intern(string([]byte("same")))
	if unsafe.StringData(a) != unsafe.StringData(b) {
		t.Errorf("two equal texts are kept apart")
	}
}
