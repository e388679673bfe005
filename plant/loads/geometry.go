package loads

import (
	"fmt"
	"math"
)

// Layout says where a tank lies across the ship.
type Layout int

const (
	// FullBreadth: the tank spans the ship; both sides face the sea
	// (through the double side when DoubleSide > 0).
	FullBreadth Layout = iota
	// Wing: one side faces the sea, the other is a longitudinal bulkhead to
	// an adjacent (centre) tank.
	Wing
	// Centre: both sides are longitudinal bulkheads to adjacent (wing) tanks.
	Centre
)

// String returns "full breadth", "wing" or "centre".
func (l Layout) String() string {
	switch l {
	case FullBreadth:
		return "full breadth"
	case Wing:
		return "wing"
	case Centre:
		return "centre"
	}
	return fmt.Sprintf("Layout(%d)", int(l))
}

// UValues are the overall heat-transfer coefficients (W/(m²·K)) used by
// TankFromDimensions. A zero field takes its DefaultU value.
type UValues struct {
	// DeckUllage: deck over the ullage space (tank not full).
	DeckUllage float64
	// DeckWetted: deck wetted by cargo (tank full), and a single side
	// wetted by cargo above the waterline (oil film to air, both 10–20).
	DeckWetted float64
	// Shell: single side or bottom shell wetted by cargo, sea outside.
	Shell float64
	// DoubleHull: double side or bottom with an empty ballast tank or void,
	// whether the outer shell is in sea or air (the gap dominates).
	DoubleHull float64
	// Bulkhead: bulkhead wetted by cargo to an unheated adjacent tank.
	Bulkhead float64
	// Dry: the dry (ullage) part of a single side or of a bulkhead above
	// the cargo level.
	Dry float64
}

// DefaultU returns the suggested U values: the middle of the ranges of
// docs/reference/plant-checks.md §6, which are [M] (from memory, no published table
// confirmed) built from film-coefficient ranges [CP]. Use the ship's own
// figures where known.
//
//	DeckUllage  4.5  (3–6,   weather deck over ullage space)
//	DeckWetted 15    (10–20, weather deck wetted by cargo)
//	Shell      40    (20–60, single shell wetted, sea outside)
//	DoubleHull  3.5  (2–5,   double hull/bottom, empty ballast or void;
//	                         15–35 with a full ballast tank: set it)
//	Bulkhead   15    (8–25,  bulkhead to an unheated tank)
//	Dry         4.5  (taken equal to DeckUllage: the vapour/air film of
//	                  4–8 W/(m²·K) [CP] dominates; an assumption of this package)
func DefaultU() UValues {
	return UValues{DeckUllage: 4.5, DeckWetted: 15, Shell: 40, DoubleHull: 3.5, Bulkhead: 15, Dry: 4.5}
}

func (u UValues) withDefaults() UValues {
	d := DefaultU()
	set := func(v *float64, def float64) {
		if *v == 0 {
			*v = def
		}
	}
	set(&u.DeckUllage, d.DeckUllage)
	set(&u.DeckWetted, d.DeckWetted)
	set(&u.Shell, d.Shell)
	set(&u.DoubleHull, d.DoubleHull)
	set(&u.Bulkhead, d.Bulkhead)
	set(&u.Dry, d.Dry)
	return u
}

// Dimensions describe a box-shaped tank compartment, from which
// TankFromDimensions derives the boundaries.
//
// Geometry. Length, Breadth and Depth are the compartment's: between the
// transverse bulkheads, from the side shell (or, for a centre tank, between
// the longitudinal bulkheads), and from the bottom shell to the deck. The
// tank inside is
//
//	l = Length
//	b = Breadth − n_sea·DoubleSide       (n_sea = 2 full breadth, 1 wing, 0 centre)
//	d = Depth − DoubleBottom
//	volume = l·b·d,  cargo volume = Fill·l·b·d,  cargo height h = Fill·d
//
// Faces, with what lies beyond and the U used:
//
//	top        l·b                  weather deck → air, or DeckSpaceT;
//	                                U DeckWetted when Fill = 1, else DeckUllage
//	bottom     l·b                  sea; U Shell, or DoubleHull when DoubleBottom > 0
//	sea sides  n_sea·l·d, split at the cargo level h and the waterline
//	           z_w = d·(1 − SideAboveWater):
//	             wetted below z_w → sea, U Shell (DoubleHull if DoubleSide > 0)
//	             wetted above z_w → air, U DeckWetted (DoubleHull)
//	             dry below z_w    → sea, U Dry (DoubleHull)
//	             dry above z_w    → air, U Dry (DoubleHull)
//	longitudinal bulkheads (2 − n_sea)·l·d  and
//	transverse bulkheads   2·b·d:
//	             wetted part (h) → AdjacentT, U Bulkhead; dry part → AdjacentT, U Dry;
//	             left out when AdjacentHeated (neighbours held at the same temperature).
//
// Simplifications: a box (no bilge radius, flare or hopper), the double
// bottom and double sides taken as empty (ballast or void) unless U says
// otherwise, one temperature for all adjacent tanks, cofferdams and
// structure not counted. For anything else, list the boundaries directly.
type Dimensions struct {
	Length, Breadth, Depth float64 // m
	// Fill is the cargo volume as a fraction of the tank volume, (0, 1].
	Fill float64
	// DoubleBottom is the double-bottom height (m); zero: single bottom.
	DoubleBottom float64
	// DoubleSide is the double-side width (m); zero: single side.
	DoubleSide float64
	// Layout: FullBreadth (zero value), Wing or Centre.
	Layout Layout
	// WeatherDeck: the tank top is the weather deck (air beyond).
	// Otherwise a space at DeckSpaceT lies above.
	WeatherDeck bool
	// DeckSpaceT is the temperature above the tank top when it is not the
	// weather deck (K).
	DeckSpaceT float64
	// SideAboveWater is the fraction of the tank's depth d above the
	// waterline, [0, 1]; zero: the sides are all in the sea.
	SideAboveWater float64
	// AdjacentT is the temperature of the adjacent tanks or spaces beyond
	// the bulkheads (K), unless AdjacentHeated.
	AdjacentT float64
	// AdjacentHeated: the neighbours are held at the cargo's temperature,
	// so the bulkheads carry no loss and are left out.
	AdjacentHeated bool
	// U are the overall coefficients; zero fields take DefaultU.
	U UValues
}

// TankFromDimensions returns a TankHeating (mode Hold with To zero: set the
// mode before Duty) whose CargoVolume and Boundaries are derived from d as
// described on Dimensions.
func TankFromDimensions(name string, cargo Cargo, d Dimensions) (TankHeating, error) {
	c := checker{KindTankHeating, name}
	t := TankHeating{Name: name, Cargo: cargo}
	for _, v := range [...]struct {
		what string
		v    float64
	}{{"length", d.Length}, {"breadth", d.Breadth}, {"depth", d.Depth}} {
		if err := c.positive(v.what, v.v, "m"); err != nil {
			return t, err
		}
	}
	if err := c.fraction("fill", d.Fill, true); err != nil {
		return t, err
	}
	if err := c.fraction("side above water", d.SideAboveWater, false); err != nil {
		return t, err
	}
	if err := c.nonNegative("double-bottom height", d.DoubleBottom, "m"); err != nil {
		return t, err
	}
	if err := c.nonNegative("double-side width", d.DoubleSide, "m"); err != nil {
		return t, err
	}
	var nSea float64
	switch d.Layout {
	case FullBreadth:
		nSea = 2
	case Wing:
		nSea = 1
	case Centre:
		nSea = 0
	default:
		return t, c.errf("layout %d is unknown; want FullBreadth, Wing or Centre", int(d.Layout))
	}
	u := d.U.withDefaults()
	for _, v := range [...]struct {
		what string
		v    float64
	}{{"U deck ullage", u.DeckUllage}, {"U deck wetted", u.DeckWetted}, {"U shell", u.Shell},
		{"U double hull", u.DoubleHull}, {"U bulkhead", u.Bulkhead}, {"U dry", u.Dry}} {
		if err := c.positive(v.what, v.v, "W/(m²·K)"); err != nil {
			return t, err
		}
	}
	l := d.Length
	b := d.Breadth - nSea*d.DoubleSide
	h := d.Depth - d.DoubleBottom
	if !(b > 0) {
		return t, c.errf("breadth %.6g m less %g × double side %.6g m leaves no tank; want a breadth above %.6g m",
			d.Breadth, nSea, d.DoubleSide, nSea*d.DoubleSide)
	}
	if !(h > 0) {
		return t, c.errf("depth %.6g m less double bottom %.6g m leaves no tank; want a depth above the double bottom",
			d.Depth, d.DoubleBottom)
	}
	if !d.WeatherDeck {
		if err := c.temp("temperature above the tank top", d.DeckSpaceT); err != nil {
			return t, err
		}
	}
	if !d.AdjacentHeated {
		if err := c.temp("temperature of the adjacent tanks", d.AdjacentT); err != nil {
			return t, err
		}
	}
	t.CargoVolume = d.Fill * l * b * h
	if !finite(t.CargoVolume) {
		return t, c.overflow("tank volume")
	}

	var bs []Boundary
	add := func(name string, area, U float64, beyond Beyond, T float64) {
		if area > 0 {
			bs = append(bs, Boundary{Name: name, Area: area, U: U, Beyond: beyond, T: T})
		}
	}
	// Top.
	uTop := u.DeckUllage
	if d.Fill == 1 {
		uTop = u.DeckWetted
	}
	if d.WeatherDeck {
		add("weather deck", l*b, uTop, Air, 0)
	} else {
		add("tank top", l*b, uTop, Space, d.DeckSpaceT)
	}
	// Bottom.
	if d.DoubleBottom > 0 {
		add("bottom, double bottom", l*b, u.DoubleHull, Sea, 0)
	} else {
		add("bottom shell", l*b, u.Shell, Sea, 0)
	}
	// Sea sides.
	hc := d.Fill * h
	zw := h * (1 - d.SideAboveWater)
	wetSea := math.Min(hc, zw)
	wetAir := math.Max(0, hc-zw)
	drySea := math.Max(0, zw-hc)
	dryAir := h - math.Max(hc, zw)
	if d.DoubleSide > 0 {
		add("sides wetted, double side, sea", nSea*l*wetSea, u.DoubleHull, Sea, 0)
		add("sides wetted, double side, air", nSea*l*wetAir, u.DoubleHull, Air, 0)
		add("sides dry, double side, sea", nSea*l*drySea, u.DoubleHull, Sea, 0)
		add("sides dry, double side, air", nSea*l*dryAir, u.DoubleHull, Air, 0)
	} else {
		add("side shell wetted, sea", nSea*l*wetSea, u.Shell, Sea, 0)
		add("side shell wetted, air", nSea*l*wetAir, u.DeckWetted, Air, 0)
		add("side shell dry, sea", nSea*l*drySea, u.Dry, Sea, 0)
		add("side shell dry, air", nSea*l*dryAir, u.Dry, Air, 0)
	}
	// Bulkheads.
	if !d.AdjacentHeated {
		nLong := 2 - nSea
		add("longitudinal bulkheads wetted", nLong*l*hc, u.Bulkhead, Space, d.AdjacentT)
		add("longitudinal bulkheads dry", nLong*l*(h-hc), u.Dry, Space, d.AdjacentT)
		add("transverse bulkheads wetted", 2*b*hc, u.Bulkhead, Space, d.AdjacentT)
		add("transverse bulkheads dry", 2*b*(h-hc), u.Dry, Space, d.AdjacentT)
	}
	t.Boundaries = bs
	return t, nil
}
