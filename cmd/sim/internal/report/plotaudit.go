package report

import (
	"fmt"
	"image/color"
	"io"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"steamcase/plant/profile"
)

// Colours of the audit charts beyond the job charts'.
var (
	readingColor = color.NRGBA{0x9d, 0xb8, 0xd3, 0xff} // pale blue
	rangeShade   = color.NRGBA{0xe3, 0xec, 0xe0, 0xff} // pale green
)

// auditBand is the days' bands as error bars about the median.
type auditBand struct{ x, y, lo, hi []float64 }

func (b auditBand) Len() int                        { return len(b.x) }
func (b auditBand) XY(i int) (float64, float64)     { return b.x[i], b.y[i] }
func (b auditBand) YError(i int) (float64, float64) { return b.y[i] - b.lo[i], b.hi[i] - b.y[i] }

func (b *auditBand) add(x, y, lo, hi float64) {
	b.x, b.y, b.lo, b.hi = append(b.x, x), append(b.y, y), append(b.lo, min(lo, y)), append(b.hi, max(hi, y))
}

// barThumb draws an error bar with its caps as a legend thumbnail.
type barThumb struct{ draw.LineStyle }

func (b barThumb) Thumbnail(c *draw.Canvas) {
	x := (c.Min.X + c.Max.X) / 2
	cap := (c.Max.X - c.Min.X) / 4
	c.StrokeLine2(b.LineStyle, x, c.Min.Y, x, c.Max.Y)
	c.StrokeLine2(b.LineStyle, x-cap, c.Min.Y, x+cap, c.Min.Y)
	c.StrokeLine2(b.LineStyle, x-cap, c.Max.Y, x+cap, c.Max.Y)
}

// dayLabels are the days' dates, or "day N" where a date is empty.
func dayLabels(days []profile.DayResult) []string {
	out := make([]string, len(days))
	for i, d := range days {
		out[i] = d.Date
		if out[i] == "" {
			out[i] = "day " + fix(float64(i+1), 0)
		}
	}
	return out
}

// dayAxis names the days on p's x axis, slanted when there are many.
func dayAxis(p *plot.Plot, dates []string) {
	p.NominalX(dates...)
	if len(dates) > 6 {
		p.X.Tick.Label.Rotation = math.Pi / 4
		p.X.Tick.Label.XAlign = draw.XRight
		p.X.Tick.Label.YAlign = draw.YTop
	}
	p.X.Min, p.X.Max = -0.5, float64(len(dates))-0.5
}

// slantHeight is the height the slanted day names need below a chart.
func slantHeight(p *plot.Plot, dates []string) vg.Length {
	if p.X.Tick.Label.Rotation == 0 {
		return 0
	}
	l := vg.Length(0)
	for _, d := range dates {
		l = max(l, p.X.Tick.Label.Width(d))
	}
	return l * vg.Length(math.Sin(p.X.Tick.Label.Rotation))
}

// scatter is a scatter of points with a glyph, a colour and a radius.
func scatter(xys plotter.XYs, shape draw.GlyphDrawer, c color.Color, r vg.Length) (*plotter.Scatter, error) {
	sc, err := plotter.NewScatter(xys)
	if err != nil {
		return nil, err
	}
	sc.Shape, sc.Color, sc.Radius = shape, c, r
	return sc, nil
}

// PlotAudit draws an audit in format (SVG or PNG) to w: for each day, in
// the order of the log, the band of the readings the claim's measurement
// would give if the model were right (a pale bar), the model's own band
// (a dark bar, from the low to the high quantile), the median of the
// model's samples (a line across the days) and its nominal figure (every
// uncertain input nominal; a dashed line), in tonnes, with the claim as a
// dot, red and ringed on a flagged day, and a reference day's claim as a
// square (it calibrates and is not sampled). The legend stands to the
// right.
func PlotAudit(w io.Writer, format string, a Audit) error {
	r := a.Result
	if r == nil || len(r.Days) == 0 {
		return fmt.Errorf("plot: audit %q has no days to draw", a.Name)
	}
	n := len(r.Days)
	var model, reading auditBand
	var median, claimed, flagged, refs plotter.XYs
	nominal := make(plotter.XYs, n)
	top := 0.0
	for i, d := range r.Days {
		x := float64(i)
		nominal[i] = plotter.XY{X: x, Y: d.NominalT}
		top = max(top, d.ClaimedT, d.NominalT)
		switch {
		case d.Reference:
			refs = append(refs, plotter.XY{X: x, Y: d.ClaimedT})
			continue
		case d.Flag != "":
			flagged = append(flagged, plotter.XY{X: x, Y: d.ClaimedT})
		default:
			claimed = append(claimed, plotter.XY{X: x, Y: d.ClaimedT})
		}
		model.add(x, d.MedianT, d.LowT, d.HighT)
		reading.add(x, d.MedianT, d.ReadingLowT, d.ReadingHighT)
		median = append(median, plotter.XY{X: x, Y: d.MedianT})
		top = max(top, d.HighT, d.ReadingHighT)
	}
	if !(top > 0) {
		top = 1
	}
	p := plot.New()
	p.Title.Text = "Audit: " + a.Name
	if a.Plant != "" {
		p.Title.Text += " (" + a.Plant + ")"
	}
	p.Y.Label.Text = "boiler fuel of the day, t"
	if r.ClaimsOf != "" {
		p.Y.Label.Text = "fuel of " + r.ClaimsOf + " on the day, t"
	}
	dates := dayLabels(r.Days)
	dayAxis(p, dates)
	p.Add(plotter.NewGrid())
	var entries []legendEntry
	q := fmt.Sprintf("%s %% to %s %%", fix(r.LowQ*100, 0), fix(r.HighQ*100, 0))

	if model.Len() > 0 {
		if len(r.Claim) > 0 {
			rb, err := plotter.NewYErrorBars(reading)
			if err != nil {
				return fmt.Errorf("plot: the readings' band: %w", err)
			}
			rb.LineStyle.Color = readingColor
			rb.LineStyle.Width = vg.Points(6)
			rb.CapWidth = vg.Points(14)
			p.Add(rb)
			entries = append(entries, legendEntry{"band of the readings, " + q, []plot.Thumbnailer{barThumb{rb.LineStyle}}})
		}
		eb, err := plotter.NewYErrorBars(model)
		if err != nil {
			return fmt.Errorf("plot: the band: %w", err)
		}
		eb.LineStyle.Color = bandColor
		eb.LineStyle.Width = vg.Points(2)
		eb.CapWidth = vg.Points(10)
		p.Add(eb)
		entries = append(entries, legendEntry{"modelled band, " + q, []plot.Thumbnailer{barThumb{eb.LineStyle}}})
		ml, err := plotter.NewLine(median)
		if err != nil {
			return fmt.Errorf("plot: the median: %w", err)
		}
		ml.Color = medianColor
		ml.Width = vg.Points(1.5)
		p.Add(ml)
		entries = append(entries, legendEntry{"median of the samples", []plot.Thumbnailer{ml}})
	}
	nl, err := plotter.NewLine(nominal)
	if err != nil {
		return fmt.Errorf("plot: the nominal: %w", err)
	}
	nl.Color = ink
	nl.Width = vg.Points(0.8)
	nl.Dashes = []vg.Length{vg.Points(4), vg.Points(3)}
	p.Add(nl)
	entries = append(entries, legendEntry{"nominal (inputs nominal)", []plot.Thumbnailer{nl}})

	if len(claimed) > 0 {
		sc, err := scatter(claimed, draw.CircleGlyph{}, ink, vg.Points(3.5))
		if err != nil {
			return fmt.Errorf("plot: the claims: %w", err)
		}
		p.Add(sc)
		entries = append(entries, legendEntry{"fuel claimed", []plot.Thumbnailer{sc}})
	}
	if len(flagged) > 0 {
		dot, err := scatter(flagged, draw.CircleGlyph{}, flaggedColor, vg.Points(3.5))
		if err != nil {
			return fmt.Errorf("plot: the flagged days: %w", err)
		}
		ring, err := scatter(flagged, draw.RingGlyph{}, flaggedColor, vg.Points(7))
		if err != nil {
			return fmt.Errorf("plot: the flagged days: %w", err)
		}
		p.Add(dot, ring)
		entries = append(entries, legendEntry{"fuel claimed, day flagged", []plot.Thumbnailer{ring, dot}})
	}
	if len(refs) > 0 {
		sq, err := scatter(refs, draw.BoxGlyph{}, savedColor, vg.Points(3.5))
		if err != nil {
			return fmt.Errorf("plot: the reference days: %w", err)
		}
		p.Add(sq)
		entries = append(entries, legendEntry{"fuel metered, reference day", []plot.Thumbnailer{sq}})
	}
	p.Y.Min = 0
	p.Y.Max = top * 1.1
	p.Y.Tick.Marker = decimalTicks{}
	styleAxes(p)
	return drawWithLegend(w, format, p, entries, dates)
}

// drawWithLegend draws one plot with its legend to the right.
func drawWithLegend(w io.Writer, format string, p *plot.Plot, entries []legendEntry, dates []string) error {
	legend, legW := sideLegend(entries)
	n := float64(len(dates))
	plotW := vg.Length(math.Max(14, math.Min(36, 1.3*n+6))) * vg.Centimeter
	return drawBeside(w, format, p, legend, legW, plotW, 11*vg.Centimeter+slantHeight(p, dates))
}

// PlotAuditImplied draws an audit's implied factors in format (SVG or
// PNG) to w, one panel each, against the days of the log: the factor's
// plausible range shaded, its middle dashed, and each day's value (the
// value that makes the model give the claim) as a dot joined to the
// next, red where it leaves the plausible range; a ring where the model
// steps across the claim, and a cross at the panel's edge where no value
// in the range searched gives it. A steady offset points to a systematic
// difference, a jumpy factor to misreporting.
func PlotAuditImplied(w io.Writer, format string, a Audit) error {
	r := a.Result
	if r == nil || len(r.Implied) == 0 || len(r.Days) == 0 {
		return fmt.Errorf("plot: audit %q has no implied factor to draw", a.Name)
	}
	dates := dayLabels(r.Days)
	n := float64(len(dates))
	var panels [][]*plot.Plot
	var entries []legendEntry
	for k, s := range r.Implied {
		p := plot.New()
		if k == 0 {
			p.Title.Text = "Implied factors: " + a.Name
		}
		p.Y.Label.Text = s.Name
		dayAxis(p, dates)
		if k < len(r.Implied)-1 {
			// The days are named under the lowest panel only.
			ticks := make(plot.ConstantTicks, len(dates))
			for i := range ticks {
				ticks[i] = plot.Tick{Value: float64(i)}
			}
			p.X.Tick.Marker = ticks
			p.X.Tick.Label.Rotation = 0
		}
		lo, hi := s.Low, s.High
		for _, d := range r.Days {
			if v := d.Implied[k]; v.Status == profile.ImpliedFound || v.Status == profile.ImpliedStep {
				lo, hi = min(lo, v.Value), max(hi, v.Value)
			}
		}
		pad := (hi - lo) * 0.1
		if pad == 0 {
			pad = 0.05 * max(math.Abs(hi), 1e-3)
		}
		p.Y.Min, p.Y.Max = lo-pad, hi+pad
		shade, err := plotter.NewPolygon(plotter.XYs{{X: -0.5, Y: s.Low}, {X: n - 0.5, Y: s.Low}, {X: n - 0.5, Y: s.High}, {X: -0.5, Y: s.High}})
		if err != nil {
			return fmt.Errorf("plot: %s: %w", s.Name, err)
		}
		shade.Color = rangeShade
		shade.LineStyle.Width = 0
		p.Add(shade)
		p.Add(plotter.NewGrid())
		mid, err := plotter.NewLine(plotter.XYs{{X: -0.5, Y: (s.Low + s.High) / 2}, {X: n - 0.5, Y: (s.Low + s.High) / 2}})
		if err != nil {
			return fmt.Errorf("plot: %s: %w", s.Name, err)
		}
		mid.Color, mid.Width, mid.Dashes = ink, vg.Points(0.8), []vg.Length{vg.Points(4), vg.Points(3)}
		p.Add(mid)
		var line, inside, outside, steps, none plotter.XYs
		for i, d := range r.Days {
			v, x := d.Implied[k], float64(i)
			switch v.Status {
			case profile.ImpliedFound:
				line = append(line, plotter.XY{X: x, Y: v.Value})
				if v.Value < s.Low || v.Value > s.High {
					outside = append(outside, plotter.XY{X: x, Y: v.Value})
				} else {
					inside = append(inside, plotter.XY{X: x, Y: v.Value})
				}
			case profile.ImpliedStep:
				steps = append(steps, plotter.XY{X: x, Y: v.Value})
			case profile.ImpliedNoEffect:
				// Nothing to show: the factor does nothing that day.
			default:
				none = append(none, plotter.XY{X: x, Y: math.Max(p.Y.Min, math.Min(p.Y.Max, v.Value))})
			}
		}
		if len(line) > 1 {
			l, err := plotter.NewLine(line)
			if err != nil {
				return fmt.Errorf("plot: %s: %w", s.Name, err)
			}
			l.Color, l.Width = demandColor, vg.Points(1.2)
			p.Add(l)
		}
		add := func(xys plotter.XYs, shape draw.GlyphDrawer, c color.Color, rad vg.Length, label string) error {
			if len(xys) == 0 {
				return nil
			}
			sc, err := scatter(xys, shape, c, rad)
			if err != nil {
				return fmt.Errorf("plot: %s: %w", s.Name, err)
			}
			p.Add(sc)
			if !hasEntry(entries, label) {
				entries = append(entries, legendEntry{label, []plot.Thumbnailer{sc}})
			}
			return nil
		}
		for _, e := range []struct {
			xys   plotter.XYs
			shape draw.GlyphDrawer
			c     color.Color
			label string
		}{
			{inside, draw.CircleGlyph{}, demandColor, "implied factor, within its plausible range"},
			{outside, draw.CircleGlyph{}, flaggedColor, "implied factor, outside it"},
			{steps, draw.RingGlyph{}, fuelColor, "the model steps across the claim here"},
			{none, draw.CrossGlyph{}, flaggedColor, "no value in the range searched"},
		} {
			if err := add(e.xys, e.shape, e.c, vg.Points(3.5), e.label); err != nil {
				return err
			}
		}
		p.Y.Tick.Marker = decimalTicks{}
		styleAxes(p)
		panels = append(panels, []*plot.Plot{p})
	}
	entries = append(entries, legendEntry{"plausible range (shaded), its middle (dashed)", nil})
	legend, legW := sideLegend(entries)
	plotW := vg.Length(math.Max(14, math.Min(36, 1.3*n+6))) * vg.Centimeter
	panelH := 7 * vg.Centimeter
	width := plotW + legW
	height := panelH*vg.Length(len(panels)) + 2*vg.Centimeter + slantHeight(panels[len(panels)-1][0], dates)
	canvas, err := newCanvas(format, width, height)
	if err != nil {
		return err
	}
	dc := draw.New(canvas)
	opaque(dc)
	area := draw.Crop(dc, 0, -legW, 0, 0)
	cs := plot.Align(panels, draw.Tiles{Rows: len(panels), Cols: 1, PadY: vg.Millimeter * 3}, area)
	for i := range panels {
		panels[i][0].Draw(cs[i][0])
	}
	legend.Draw(draw.Crop(dc, plotW+vg.Millimeter*3, 0, 0, 0))
	_, err = canvas.WriteTo(w)
	return err
}

func hasEntry(entries []legendEntry, name string) bool {
	for _, e := range entries {
		if e.name == name {
			return true
		}
	}
	return false
}

// periodBins is the number of bins of the period's histogram.
const periodBins = 40

// PlotAuditPeriod draws the distribution of an audit's period total in
// format (SVG or PNG) to w: a histogram of the samples' totals as the
// claim's measurement would read them (the model's own when the claim is
// exact), in tonnes, with the claim marked (red when the period is
// flagged), the median and the band's ends, and the shares of the
// samples at or below and at or above the claim in the legend.
func PlotAuditPeriod(w io.Writer, format string, a Audit) error {
	r := a.Result
	if r == nil || len(r.Period.ReadingT) == 0 {
		return fmt.Errorf("plot: audit %q has no period total to draw", a.Name)
	}
	per := r.Period
	vals := make(plotter.Values, len(per.ReadingT))
	copy(vals, per.ReadingT)
	lo, hi := per.ReadingT[0], per.ReadingT[0]
	for _, v := range per.ReadingT {
		lo, hi = min(lo, v), max(hi, v)
	}
	p := plot.New()
	p.Title.Text = fmt.Sprintf("Period total: %s, %d days, %d samples", a.Name, per.Days, r.Samples)
	p.X.Label.Text = "fuel over the period, t"
	if r.ClaimsOf != "" {
		p.X.Label.Text = "fuel of " + r.ClaimsOf + " over the period, t"
	}
	p.Y.Label.Text = "samples per bin"
	p.Add(plotter.NewGrid())
	var entries []legendEntry
	top := 1.0
	if hi > lo {
		h, err := plotter.NewHist(vals, periodBins)
		if err != nil {
			return fmt.Errorf("plot: the period's histogram: %w", err)
		}
		h.FillColor = readingColor
		h.LineStyle.Color = bandColor
		h.LineStyle.Width = vg.Points(0.5)
		for _, b := range h.Bins {
			top = max(top, b.Weight)
		}
		p.Add(h)
		what := "samples of the modelled total"
		if len(r.Claim) > 0 {
			what = "samples of the total as measured, if the model is right"
		}
		entries = append(entries, legendEntry{what, []plot.Thumbnailer{h}})
	}
	ymax := top * 1.15
	vline := func(x float64, c color.Color, width vg.Length, label string, dashes ...vg.Length) error {
		l, err := plotter.NewLine(plotter.XYs{{X: x, Y: 0}, {X: x, Y: ymax}})
		if err != nil {
			return err
		}
		l.Color, l.Width, l.Dashes = c, width, dashes
		p.Add(l)
		entries = append(entries, legendEntry{label, []plot.Thumbnailer{l}})
		return nil
	}
	q := fmt.Sprintf("%s %% and %s %%", fix(r.LowQ*100, 0), fix(r.HighQ*100, 0))
	if err := vline(per.ReadingLowT, bandColor, vg.Points(1.2), "band: "+q, vg.Points(4), vg.Points(3)); err != nil {
		return fmt.Errorf("plot: the band: %w", err)
	}
	l, err := plotter.NewLine(plotter.XYs{{X: per.ReadingHighT, Y: 0}, {X: per.ReadingHighT, Y: ymax}})
	if err != nil {
		return fmt.Errorf("plot: the band: %w", err)
	}
	l.Color, l.Width, l.Dashes = bandColor, vg.Points(1.2), []vg.Length{vg.Points(4), vg.Points(3)}
	p.Add(l)
	if err := vline(per.MedianT, medianColor, vg.Points(1.5), "median of the modelled total"); err != nil {
		return fmt.Errorf("plot: the median: %w", err)
	}
	claimC := ink
	if per.Flag != "" {
		claimC = flaggedColor
	}
	if err := vline(per.ClaimedT, claimC, vg.Points(2.5), fmt.Sprintf("claimed, %s t", fix(per.ClaimedT, 3))); err != nil {
		return fmt.Errorf("plot: the claim: %w", err)
	}
	entries = append(entries,
		legendEntry{fmt.Sprintf("P(model ≤ claim) = %s", fix(per.PAtOrBelow, 4)), nil},
		legendEntry{fmt.Sprintf("P(model ≥ claim) = %s", fix(per.PAtOrAbove, 4)), nil},
		legendEntry{fmt.Sprintf("Monte Carlo standard error %s", fix(per.StdErr, 4)), nil})
	if per.Flag != "" {
		entries = append(entries, legendEntry{"the period is flagged " + per.Flag, nil})
	}
	lo, hi = min(lo, per.ClaimedT, per.MedianT), max(hi, per.ClaimedT, per.MedianT)
	pad := (hi - lo) * 0.06
	if pad == 0 {
		pad = 0.05 * max(math.Abs(hi), 1)
	}
	p.X.Min, p.X.Max = lo-pad, hi+pad
	p.Y.Min, p.Y.Max = 0, ymax
	p.X.Tick.Marker = decimalTicks{}
	p.Y.Tick.Marker = decimalTicks{}
	styleAxes(p)
	legend, legW := sideLegend(entries)
	return drawBeside(w, format, p, legend, legW, 18*vg.Centimeter, 11*vg.Centimeter)
}
