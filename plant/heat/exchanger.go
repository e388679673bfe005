package heat

import "math"

// CounterflowEffectiveness returns the effectiveness of a counterflow heat
// exchanger, ε(NTU, Cr) with Cr = C_min/C_max in [0, 1] (the standard ε-NTU
// relation, e.g. Incropera & DeWitt, Table 11.3 [S, textbook, from memory]):
//
//	ε = [1 − exp(−NTU·(1 − Cr))] / [1 − Cr·exp(−NTU·(1 − Cr))]
//	Cr = 1:  ε = NTU/(1 + NTU)           (exact limit)
//	Cr = 0:  ε = 1 − exp(−NTU)           (one side boiling or condensing)
//
// It is evaluated with expm1 so that it stays accurate as Cr → 1.
func CounterflowEffectiveness(NTU, Cr float64) (float64, error) {
	const where = "counterflow effectiveness"
	if !(NTU >= 0) {
		return 0, inputErr(where, "NTU", NTU, "NTU >= 0")
	}
	if !(Cr >= 0 && Cr <= 1) {
		return 0, inputErr(where, "Cr", Cr, "0 <= Cr = C_min/C_max <= 1")
	}
	if math.IsInf(NTU, 1) {
		return 1, nil
	}
	if Cr == 1 {
		return NTU / (1 + NTU), nil
	}
	a := NTU * (1 - Cr)
	em := math.Expm1(-a) // exp(−a) − 1, ≤ 0
	return -em / ((1 - Cr) - Cr*em), nil
}

// CounterflowNTU inverts CounterflowEffectiveness: the NTU that gives
// effectiveness eps at Cr. eps must lie in [0, 1) and below the largest
// effectiveness reachable at that Cr (1 for Cr ≤ 1).
func CounterflowNTU(eps, Cr float64) (float64, error) {
	const where = "counterflow NTU"
	if !(eps >= 0 && eps < 1) {
		return 0, inputErr(where, "ε", eps, "0 <= ε < 1")
	}
	if !(Cr >= 0 && Cr <= 1) {
		return 0, inputErr(where, "Cr", Cr, "0 <= Cr <= 1")
	}
	if Cr == 1 {
		return eps / (1 - eps), nil
	}
	// ln((1 − ε·Cr)/(1 − ε))/(1 − Cr) written with log1p.
	return math.Log1p(eps*(1-Cr)/(1-eps)) / (1 - Cr), nil
}

// ExchangerResult is the outcome of a two-stream exchanger.
type ExchangerResult struct {
	Q             float64 // duty, W
	HotOut        float64 // hot outlet temperature, K
	ColdOut       float64 // cold outlet temperature, K
	NTU, Cr, Eff  float64
	CMin, CMax    float64 // capacity rates, W/K
	HotIsMinFluid bool
}

// Counterflow rates a counterflow exchanger (an economiser: flue gas hot,
// feed water cold) from the capacity rates ṁ·c_p of both streams (W/K), UA
// (W/K) and the inlet temperatures (K), by ε-NTU. The capacity rates are
// constant through the exchanger (constant c_p, a simplification: pass mean
// values, or iterate outside). A capacity rate of +Inf stands for a stream
// that boils or condenses (Cr = 0). The hot inlet must not be colder than
// the cold inlet.
func Counterflow(cHot, cCold, UA, tHotIn, tColdIn float64) (ExchangerResult, error) {
	const where = "counterflow exchanger"
	var r ExchangerResult
	if !(cHot > 0) {
		return r, inputErr(where, "hot capacity rate (W/K)", cHot, "a value > 0 (+Inf for a condensing stream)")
	}
	if !(cCold > 0) {
		return r, inputErr(where, "cold capacity rate (W/K)", cCold, "a value > 0 (+Inf for a boiling stream)")
	}
	if math.IsInf(cHot, 1) && math.IsInf(cCold, 1) {
		return r, inputErr(where, "capacity rates", cHot, "at most one infinite capacity rate")
	}
	if err := nonNegative(where, "UA (W/K)", UA); err != nil {
		return r, err
	}
	if err := positive(where, "hot inlet temperature (K)", tHotIn); err != nil {
		return r, err
	}
	if err := positive(where, "cold inlet temperature (K)", tColdIn); err != nil {
		return r, err
	}
	if tHotIn < tColdIn {
		return r, inputErr(where, "hot inlet temperature (K)", tHotIn, "hot inlet >= cold inlet temperature")
	}
	r.CMin, r.CMax = math.Min(cHot, cCold), math.Max(cHot, cCold)
	r.HotIsMinFluid = cHot <= cCold
	r.Cr = r.CMin / r.CMax // 0 when CMax = +Inf
	r.NTU = UA / r.CMin
	eps, err := CounterflowEffectiveness(r.NTU, r.Cr)
	if err != nil {
		return r, err
	}
	r.Eff = eps
	r.Q = eps * r.CMin * (tHotIn - tColdIn)
	r.HotOut, r.ColdOut = tHotIn, tColdIn
	if !math.IsInf(cHot, 1) {
		r.HotOut = tHotIn - r.Q/cHot
	}
	if !math.IsInf(cCold, 1) {
		r.ColdOut = tColdIn + r.Q/cCold
	}
	return r, nil
}
