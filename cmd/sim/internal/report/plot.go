package report

import (
	"fmt"
	"image/color"
	"io"
	"math"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Plot formats.
const (
	SVG = "svg"
	PNG = "png"
)

// FormatOf returns the plot format a file name asks for by its extension
// (".svg" or ".png", any case), or an error naming what is accepted.
func FormatOf(name string) (string, error) {
	i := strings.LastIndexByte(name, '.')
	ext := ""
	if i >= 0 {
		ext = strings.ToLower(name[i+1:])
	}
	switch ext {
	case SVG, PNG:
		return ext, nil
	}
	return "", fmt.Errorf("plot file %q: the name must end in .svg or .png, which sets the format", name)
}

// palette holds the fill colours of the consumers' bars, in order; a run
// with more consumers starts over.
var palette = [...]color.NRGBA{
	{0x2f, 0x5d, 0x8a, 0xff}, // deep blue
	{0xe0, 0x9a, 0x3e, 0xff}, // amber
	{0x5b, 0x9e, 0x6b, 0xff}, // green
	{0xb8, 0x4f, 0x46, 0xff}, // brick
	{0x86, 0x6f, 0xb0, 0xff}, // violet
	{0x4c, 0xaa, 0xb0, 0xff}, // teal
	{0xc7, 0xb2, 0x44, 0xff}, // mustard
	{0x8a, 0x6a, 0x4c, 0xff}, // brown
	{0xd3, 0x84, 0xa6, 0xff}, // rose
	{0x7f, 0x8c, 0x99, 0xff}, // slate
}

var (
	ink         = color.NRGBA{0x22, 0x22, 0x22, 0xff}
	firingColor = color.NRGBA{0xc0, 0x1c, 0x1c, 0xff}
	allColor    = color.NRGBA{0x22, 0x22, 0x22, 0xff}
	egeColor    = color.NRGBA{0x1b, 0x7f, 0x3a, 0xff}
)

// fill is the colour of the i-th consumer's bars: the palette, then the
// palette darkened, then lightened, so that neighbours differ.
func fill(i int) color.NRGBA {
	c := palette[i%len(palette)]
	scale := func(v uint8, f float64) uint8 { return uint8(math.Min(255, math.Round(float64(v)*f))) }
	lift := func(v uint8, f float64) uint8 { return uint8(math.Round(float64(v) + (255-float64(v))*f)) }
	switch (i / len(palette)) % 3 {
	case 1:
		return color.NRGBA{scale(c.R, 0.6), scale(c.G, 0.6), scale(c.B, 0.6), 0xff}
	case 2:
		return color.NRGBA{lift(c.R, 0.45), lift(c.G, 0.45), lift(c.B, 0.45), 0xff}
	}
	return c
}

// Series of the chart other than the consumers.
const (
	seriesTank   = "feed tank heating"
	seriesDrains = "header drains"
	seriesOther  = "other (balance of demand)"
	seriesEGE    = "steam from exhaust-gas economisers"
	// The capacity.
	seriesFiringMCR = "MCR of the boilers firing"
	seriesUsable    = "the next boiler fires above (usable fraction)"
	seriesAllMCR    = "MCR of all boilers"
)

// Plot draws the run as a chart in format (SVG or PNG) to w: for each
// case a bar of the steam demand stacked by consumer (with the feed tank's
// heating steam and the header drains, and any rest of the demand not
// taken by a listed consumer), a short red bar at the MCR of the boilers
// firing, a dashed line with squares at the MCR of all boilers and, where
// there are exhaust-gas economisers, a green triangle at the steam they
// raise, all in kg/h. The legend stands to the right of the chart.
func Plot(w io.Writer, format string, cases []Case) error {
	if len(cases) == 0 {
		return fmt.Errorf("plot: no load case to draw")
	}
	p, names, plotW, slanted := caseChart(cases)
	legend := plot.NewLegend()
	legend.Top, legend.Left = true, true
	order, err := addDemandBars(p, &legend, cases)
	if err != nil {
		return err
	}
	usable, err := addCapacity(p, &legend, cases)
	if err != nil {
		return err
	}
	extra := []string{seriesFiringMCR, seriesAllMCR}
	if usable {
		extra = append(extra, seriesUsable)
	}
	ege, err := addEGESteam(p, &legend, cases)
	if err != nil {
		return err
	}
	if ege {
		extra = append(extra, seriesEGE)
	}
	p.Y.Min = 0
	if p.Y.Max > 0 {
		p.Y.Max *= 1.08
	}
	p.Y.Tick.Marker = flowTicks{}
	styleAxes(p)
	legend.TextStyle.Font.Size = vg.Points(10)
	legend.YOffs = -vg.Millimeter * 8

	// Size: wider with more cases; the legend takes a strip on the right.
	legW := vg.Length(0)
	for _, n := range append(order, extra...) {
		if wd := legend.TextStyle.Width(n); wd > legW {
			legW = wd
		}
	}
	legW += legend.ThumbnailWidth + vg.Centimeter
	height := 11 * vg.Centimeter
	if slanted {
		// Slanted case names take height from the chart: give it back.
		longest := vg.Length(0)
		for _, n := range names {
			longest = max(longest, p.X.Tick.Label.Width(n))
		}
		height += longest / 2
	}
	return drawBeside(w, format, p, legend, legW, plotW, height)
}

// drawBeside writes one plot plotW wide with its legend, legW wide, to
// its right, height high on an opaque background.
func drawBeside(w io.Writer, format string, p *plot.Plot, legend plot.Legend, legW, plotW, height vg.Length) error {
	canvas, err := newCanvas(format, plotW+legW, height)
	if err != nil {
		return err
	}
	dc := draw.New(canvas)
	opaque(dc)
	p.Draw(draw.Crop(dc, 0, -legW, 0, 0))
	legend.Draw(draw.Crop(dc, plotW+vg.Millimeter*3, 0, 0, 0))
	_, err = canvas.WriteTo(w)
	return err
}

// caseChart returns the case chart without its series: the title (with
// the plant's name when every case is of one plant), the axes' labels,
// the cases' names along x (slanted where they would overlap), the grid,
// and the width of the chart (wider with more cases, 12 to 40 cm).
func caseChart(cases []Case) (p *plot.Plot, names []string, plotW vg.Length, slanted bool) {
	p = plot.New()
	title := "Steam demand and boiler capacity"
	if pl := cases[0].Plant; pl != "" && samePlant(cases) {
		title += ": " + pl
	}
	p.Title.Text = title
	p.X.Label.Text = "load case"
	p.Y.Label.Text = "steam, kg/h"
	names = caseLabels(cases)
	p.NominalX(names...)
	plotW = vg.Length(math.Max(12, math.Min(40, 2.2*float64(len(cases))+6))) * vg.Centimeter
	slanted = labelsOverlap(p, names, plotW)
	if slanted {
		p.X.Tick.Label.Rotation = math.Pi / 6
		p.X.Tick.Label.XAlign = draw.XRight
		p.X.Tick.Label.YAlign = draw.YCenter
	}
	p.Add(plotter.NewGrid())
	return p, names, plotW, slanted
}

// addDemandBars adds the steam demand of each case as a bar stacked by
// consumer, in the order consumers first appear, and the bars to the
// legend from the top of the stack down, as drawn; it returns the
// consumers in that order.
func addDemandBars(p *plot.Plot, legend *plot.Legend, cases []Case) ([]string, error) {
	series, order, colour := demandSeries(cases)
	barW := vg.Points(math.Max(12, math.Min(48, 360/float64(len(cases)))))
	var below *plotter.BarChart
	bars := make([]*plotter.BarChart, len(order))
	for i, name := range order {
		bc, err := plotter.NewBarChart(series[name], barW)
		if err != nil {
			return nil, fmt.Errorf("plot: %s: %w", name, err)
		}
		bc.Color = fill(colour[name])
		bc.LineStyle.Width = vg.Points(0.5)
		bc.LineStyle.Color = color.White
		if below != nil {
			bc.StackOn(below)
		}
		below = bc
		bars[i] = bc
		p.Add(bc)
	}
	for i := len(order) - 1; i >= 0; i-- {
		legend.Add(order[i], bars[i])
	}
	return order, nil
}

// addCapacity adds the capacity: the firing boilers' MCR as a short bar
// over each case, where another boiler could still fire the steam at
// which the firing rule fires it, and all boilers' MCR as a dashed line
// with squares; and their legend entries. It says whether any case shows
// the next boiler's threshold.
func addCapacity(p *plot.Plot, legend *plot.Legend, cases []Case) (bool, error) {
	const half, gap = 0.42, 0.09
	var firing, usable *plotter.Line
	allPts := make(plotter.XYs, len(cases))
	for i, c := range cases {
		var capF, capA float64
		for _, b := range c.Result.Boilers {
			capA += b.MCRKgS * kgh
			if b.Firing {
				capF += b.MCRKgS * kgh
			}
		}
		allPts[i] = plotter.XY{X: float64(i), Y: capA}
		// Two halves with a gap at the middle, where the square of all
		// boilers' MCR stands when every boiler fires: the bar never
		// hides it.
		x := float64(i)
		for _, seg := range [2][2]float64{{x - half, x - gap}, {x + gap, x + half}} {
			l, err := plotter.NewLine(plotter.XYs{{X: seg[0], Y: capF}, {X: seg[1], Y: capF}})
			if err != nil {
				return false, fmt.Errorf("plot: MCR of the boilers firing in %q: %w", c.Result.Name, err)
			}
			l.Color = firingColor
			l.Width = vg.Points(2.5)
			p.Add(l)
			firing = l
		}
		// Where another boiler could still fire: the steam at which the
		// firing rule fires it (the usable fraction of the firing
		// boilers' MCR), dotted.
		if r := c.Result; r.BoilersFiring > 0 && r.BoilersFiring < len(r.Boilers) && !r.Forced {
			var fired float64
			for _, b := range r.Boilers {
				fired += b.SteamKgS
			}
			y := (fired + r.MarginNextKgS) * kgh
			l, err := plotter.NewLine(plotter.XYs{{X: x - half, Y: y}, {X: x + half, Y: y}})
			if err != nil {
				return false, fmt.Errorf("plot: the next boiler's threshold in %q: %w", r.Name, err)
			}
			l.Color = firingColor
			l.Width = vg.Points(1.2)
			l.Dashes = []vg.Length{vg.Points(1.5), vg.Points(2)}
			p.Add(l)
			usable = l
		}
	}
	all, pts, err := plotter.NewLinePoints(allPts)
	if err != nil {
		return false, fmt.Errorf("plot: MCR of all boilers: %w", err)
	}
	all.Color = allColor
	all.Width = vg.Points(1)
	all.Dashes = []vg.Length{vg.Points(5), vg.Points(3)}
	pts.Shape = draw.BoxGlyph{}
	pts.Color = allColor
	pts.Radius = vg.Points(3)
	p.Add(all, pts)
	legend.Add(seriesFiringMCR, firing)
	if usable != nil {
		legend.Add(seriesUsable, usable)
	}
	legend.Add(seriesAllMCR, all, pts)
	return usable != nil, nil
}

// addEGESteam adds, where there is any, the steam of the exhaust-gas
// economisers, which takes its share of the demand off the boilers, and
// its legend entry; it says whether there was any.
func addEGESteam(p *plot.Plot, legend *plot.Legend, cases []Case) (bool, error) {
	egePts := make(plotter.XYs, 0, len(cases))
	for i, c := range cases {
		if m := c.Result.EGESteamKgS * kgh; m > 0.5 {
			egePts = append(egePts, plotter.XY{X: float64(i), Y: m})
		}
	}
	if len(egePts) == 0 {
		return false, nil
	}
	sc, err := plotter.NewScatter(egePts)
	if err != nil {
		return false, fmt.Errorf("plot: exhaust-gas economiser steam: %w", err)
	}
	sc.Shape = draw.PyramidGlyph{}
	sc.Color = egeColor
	sc.Radius = vg.Points(4.5)
	p.Add(sc)
	legend.Add(seriesEGE, sc)
	return true, nil
}

// caseLabels are the cases' names on the chart's axis, each made unique
// by its number where names repeat (a series of cases of one name).
func caseLabels(cases []Case) []string {
	count := map[string]int{}
	for _, c := range cases {
		count[c.Result.Name]++
	}
	names := make([]string, len(cases))
	seen := map[string]int{}
	for i, c := range cases {
		n := c.Result.Name
		if count[n] > 1 {
			seen[n]++
			n = fmt.Sprintf("%s %d", n, seen[n])
		}
		names[i] = n
	}
	return names
}

// labelsOverlap reports whether the names, written level, would run into
// each other in their slots across a plot of width w.
func labelsOverlap(p *plot.Plot, names []string, w vg.Length) bool {
	slot := w * 0.85 / vg.Length(len(names))
	for _, n := range names {
		if p.X.Tick.Label.Width(n) > slot*0.95 {
			return true
		}
	}
	return false
}

// opaque paints a canvas white, so that the chart and its legend have a
// background of their own on any page.
func opaque(c draw.Canvas) {
	var path vg.Path
	r := c.Rectangle
	path.Move(r.Min)
	path.Line(vg.Point{X: r.Max.X, Y: r.Min.Y})
	path.Line(r.Max)
	path.Line(vg.Point{X: r.Min.X, Y: r.Max.Y})
	path.Close()
	c.SetColor(color.White)
	c.Fill(path)
}

// flowTicks marks a flow axis at a round step (1, 2 or 5 times a power of
// ten) giving five to ten marks, labelled without decimals.
type flowTicks struct{}

func (flowTicks) Ticks(lo, hi float64) []plot.Tick {
	if !(hi > lo) {
		return []plot.Tick{{Value: lo, Label: fix(lo, 0)}}
	}
	step := roundStep(lo, hi)
	var ticks []plot.Tick
	for v := math.Ceil(lo/step) * step; v <= hi+step*1e-9; v += step {
		ticks = append(ticks, plot.Tick{Value: v, Label: fix(v, 0)})
		for k := 1; k < 5; k++ {
			if m := v + float64(k)*step/5; m <= hi {
				ticks = append(ticks, plot.Tick{Value: m})
			}
		}
	}
	return ticks
}

// roundStep is the step, 1, 2 or 5 times a power of ten, that cuts
// lo..hi (hi > lo) into five to ten parts.
func roundStep(lo, hi float64) float64 {
	step := math.Pow(10, math.Floor(math.Log10((hi-lo)/5)))
	for _, m := range []float64{1, 2, 5, 10} {
		if (hi-lo)/(step*m) <= 10 {
			return step * m
		}
	}
	return step * 10
}

func samePlant(cases []Case) bool {
	for _, c := range cases {
		if c.Plant != cases[0].Plant {
			return false
		}
	}
	return true
}

// demandSeries returns the steam flows, kg/h, of every consumer across the
// cases (zero where a case lacks it), and the series names in order.
func demandSeries(cases []Case) (map[string]plotter.Values, []string, map[string]int) {
	series := map[string]plotter.Values{}
	var order []string
	add := func(name string, i int, v float64) {
		s, ok := series[name]
		if !ok {
			s = make(plotter.Values, len(cases))
			order = append(order, name)
		}
		s[i] += v
		series[name] = s
	}
	for i, c := range cases {
		r := c.Result
		var listed float64
		for _, cs := range r.Consumers {
			add(cs.Name, i, math.Max(0, cs.SteamKgS*kgh))
			listed += cs.SteamKgS
		}
		for _, u := range r.Units {
			if m, ok := u.Figures.Get(keyTankSteam); ok && u.Kind == kindFeedTank {
				add(seriesTank, i, math.Max(0, m*kgh))
				listed += m
			}
		}
		d := headerDrained(r)
		add(seriesDrains, i, math.Max(0, d*kgh))
		listed += d
		// Steam the listed takers do not account for (a reducing valve's
		// other outlet, say) is drawn so that the bar reaches the demand.
		if rest := (r.SteamDemandKgS - listed) * kgh; rest > 0.5 {
			add(seriesOther, i, rest)
		}
	}
	// Each series keeps the colour of its place among all the plant's
	// takers, whether it is drawn or not, so that a consumer has the same
	// colour in every chart of the plant.
	colour := make(map[string]int, len(order))
	for i, name := range order {
		colour[name] = i
	}
	// A series that is zero in every case is left out.
	kept := order[:0]
	for _, name := range order {
		nonzero := false
		for _, v := range series[name] {
			if v > 0 {
				nonzero = true
			}
		}
		if nonzero {
			kept = append(kept, name)
		} else {
			delete(series, name)
		}
	}
	return series, kept, colour
}
