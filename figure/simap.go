package figure

import (
	"fmt"
	"image"
	"image/color"
	"math"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Units of map coordinates.
const (
	UnitsMetres  = "m"   // projected easting/northing in metres
	UnitsDegrees = "deg" // longitude/latitude in decimal degrees
)

// Kinds of site feature.
const (
	FeaturePolygon = "polygon"
	FeatureLine    = "line"
	FeaturePoint   = "point"
)

// DefaultColorLabel labels the colour bar of an SI map.
const DefaultColorLabel = "Saturation index (log IAP/K)"

// Grid is a regular grid of saturation indices. Cell (i, j), i < NX along x
// and j < NY along y, is centred on (X0 + i*DX, Y0 + j*DY) and stored at
// Z[j*NX+i]; row j = 0 is the southern (lowest y) row. Valid marks the cells
// that hold a value (nil: every finite cell); the others are left blank.
type Grid struct {
	X0, Y0, DX, DY float64
	NX, NY         int
	Z              []float64
	Valid          []bool
}

func (g *Grid) check() error {
	if g.NX < 1 || g.NY < 1 || len(g.Z) != g.NX*g.NY {
		return fmt.Errorf("%w: grid %d x %d with %d values", ErrInput, g.NX, g.NY, len(g.Z))
	}
	if g.Valid != nil && len(g.Valid) != len(g.Z) {
		return fmt.Errorf("%w: grid has %d values but %d validity flags", ErrInput, len(g.Z), len(g.Valid))
	}
	if !finite(g.X0, g.Y0, g.DX, g.DY) || g.DX <= 0 || g.DY <= 0 {
		return fmt.Errorf("%w: grid origin (%v, %v) spacing (%v, %v)", ErrInput, g.X0, g.Y0, g.DX, g.DY)
	}
	return nil
}

// ok reports whether cell k holds a finite value.
func (g *Grid) ok(k int) bool {
	return (g.Valid == nil || g.Valid[k]) && finite(g.Z[k])
}

// MarkerKind is the symbol of a well.
type MarkerKind int

// Well symbols.
const (
	MarkerWell       MarkerKind = iota // sampled well: circle
	MarkerInjection                    // injection well: triangle
	MarkerMonitoring                   // monitoring well: square
	MarkerSpring                       // spring or surface sample: diamond
)

var markerNames = map[MarkerKind]string{
	MarkerWell:       "sampled well",
	MarkerInjection:  "injection well",
	MarkerMonitoring: "monitoring well",
	MarkerSpring:     "spring / surface sample",
}

func (k MarkerKind) glyph() glyphShape {
	switch k {
	case MarkerInjection:
		return glyphTriangle
	case MarkerMonitoring:
		return glyphSquare
	case MarkerSpring:
		return glyphDiamond
	}
	return glyphCircle
}

// Well is a sampled point drawn as a symbol filled with the colour of its
// SI (white when SI is not finite, for a well with no value for this
// mineral) and labelled with Label.
type Well struct {
	X, Y, SI float64
	Label    string
	Marker   MarkerKind
}

// Feature is a site feature: Kind FeaturePolygon (a ring, e.g. the site
// boundary), FeatureLine (e.g. a river) or FeaturePoint (labelled with Name).
type Feature struct {
	Kind   string
	Name   string
	Coords [][2]float64
}

// SIMap is a map of one mineral's saturation index: the interpolated
// surface, the SI = 0 equilibrium contour, wells coloured by their SI with
// their ids, site features, a colour bar, a scale bar and a north arrow.
// Coordinates are in Units (UnitsMetres, the default, or UnitsDegrees); the
// map keeps an equal scale on both axes (for degrees, scaled by the cosine
// of the mid latitude). The scale bar and north arrow refer to grid north
// of the projected frame.
type SIMap struct {
	Title, Caption string
	Grid           *Grid // nil: wells only
	Wells          []Well
	Features       []Feature
	Units          string
	// Limit is the |SI| at the ends of the colour scale; 0 chooses it from
	// the data (rounded up to a multiple of 0.5, at least 0.5).
	Limit float64
	// CVRMSE is the surface's leave-one-out cross-validation RMSE (SI
	// units), printed in the caption when HasCV is set.
	CVRMSE     float64
	HasCV      bool
	NorthArrow bool
	ScaleBar   bool
	ColorLabel string // default DefaultColorLabel
}

// Skipped counts the non-finite values left out of the map: grid cells
// marked valid but holding NaN or ±Inf, wells with non-finite coordinates
// and non-finite feature vertices.
func (m SIMap) Skipped() int {
	n := 0
	if m.Grid != nil && m.Grid.check() == nil {
		for k, z := range m.Grid.Z {
			if (m.Grid.Valid == nil || m.Grid.Valid[k]) && !finite(z) {
				if m.Grid.Valid != nil || !math.IsNaN(z) {
					n++
				}
			}
		}
	}
	for _, w := range m.Wells {
		if !finite(w.X, w.Y) {
			n++
		}
	}
	for _, f := range m.Features {
		for _, p := range f.Coords {
			if !finite(p[0], p[1]) {
				n++
			}
		}
	}
	return n
}

func (m SIMap) degrees() bool { return m.Units == UnitsDegrees }

// ColorLimit is the |SI| at the ends of the colour scale that the map uses.
func (m SIMap) ColorLimit() float64 {
	if m.Limit > 0 && finite(m.Limit) {
		return m.Limit
	}
	mx := 0.0
	if m.Grid != nil && m.Grid.check() == nil {
		for k, z := range m.Grid.Z {
			if m.Grid.ok(k) {
				mx = math.Max(mx, math.Abs(z))
			}
		}
	}
	for _, w := range m.Wells {
		if finite(w.X, w.Y, w.SI) {
			mx = math.Max(mx, math.Abs(w.SI))
		}
	}
	return math.Max(0.5, math.Ceil(mx*2-1e-9)/2)
}

type extent struct{ x0, x1, y0, y1 float64 }

func (e *extent) add(x, y float64) {
	e.x0, e.x1 = math.Min(e.x0, x), math.Max(e.x1, x)
	e.y0, e.y1 = math.Min(e.y0, y), math.Max(e.y1, y)
}

// mapState carries what Draw computes once.
type mapState struct {
	m         SIMap
	lim       float64
	scale     Diverging
	grid      *Grid
	hasCells  bool
	wells     []Well
	features  []Feature
	contour   [][][2]float64
	ext       extent
	noSI      bool
	kinds     map[MarkerKind]bool
	mPerUnitX float64 // metres per x unit, for the scale bar
	aspectX   float64 // x units are drawn shorter by this factor (cos lat)
}

func (m SIMap) prepare() (*mapState, error) {
	s := &mapState{m: m, lim: m.ColorLimit(), kinds: map[MarkerKind]bool{}}
	s.scale = Diverging{Limit: s.lim}
	s.ext = extent{math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)}
	if m.Units != "" && m.Units != UnitsMetres && m.Units != UnitsDegrees {
		return nil, fmt.Errorf("%w: units %q (want %q or %q)", ErrInput, m.Units, UnitsMetres, UnitsDegrees)
	}
	if g := m.Grid; g != nil {
		if err := g.check(); err != nil {
			return nil, err
		}
		s.grid = g
		for k := range g.Z {
			if g.ok(k) {
				s.hasCells = true
				i, j := k%g.NX, k/g.NX
				x, y := g.X0+float64(i)*g.DX, g.Y0+float64(j)*g.DY
				s.ext.add(x-g.DX/2, y-g.DY/2)
				s.ext.add(x+g.DX/2, y+g.DY/2)
			}
		}
		if s.hasCells {
			s.contour = zeroContour(g)
		}
	}
	for _, w := range m.Wells {
		if !finite(w.X, w.Y) {
			continue
		}
		if !finite(w.SI) {
			s.noSI = true
		}
		s.kinds[w.Marker] = true
		s.wells = append(s.wells, w)
		s.ext.add(w.X, w.Y)
	}
	if !s.hasCells && len(s.wells) == 0 {
		return nil, fmt.Errorf("%w: SI map %q has no valid grid cell and no well with finite coordinates", ErrNoData, m.Title)
	}
	for _, f := range m.Features {
		var cs [][2]float64
		for _, p := range f.Coords {
			if finite(p[0], p[1]) {
				cs = append(cs, p)
			}
		}
		switch f.Kind {
		case FeaturePolygon, FeatureLine:
			if len(cs) < 2 {
				continue
			}
		case FeaturePoint:
			if len(cs) < 1 {
				continue
			}
		default:
			return nil, fmt.Errorf("%w: feature %q has kind %q (want polygon, line or point)", ErrInput, f.Name, f.Kind)
		}
		for _, p := range cs {
			s.ext.add(p[0], p[1])
		}
		s.features = append(s.features, Feature{Kind: f.Kind, Name: f.Name, Coords: cs})
	}
	s.mPerUnitX, s.aspectX = 1, 1
	if m.degrees() {
		// Spherical approximation with the IUGG mean Earth radius
		// 6 371 008.8 m (Moritz 2000, "Geodetic Reference System 1980").
		const mPerDeg = 6371008.8 * math.Pi / 180
		lat := (s.ext.y0 + s.ext.y1) / 2
		s.aspectX = math.Cos(lat * math.Pi / 180)
		if s.aspectX < 0.05 {
			s.aspectX = 0.05
		}
		s.mPerUnitX = mPerDeg * s.aspectX
	}
	// Pad the extent; a single point gets a nominal 200 m window.
	minSpan := 200.0
	if m.degrees() {
		minSpan = 0.002
	}
	for _, r := range [][2]*float64{{&s.ext.x0, &s.ext.x1}, {&s.ext.y0, &s.ext.y1}} {
		span := *r[1] - *r[0]
		if span < minSpan {
			c := (*r[0] + *r[1]) / 2
			*r[0], *r[1] = c-minSpan/2, c+minSpan/2
			span = minSpan
		}
		*r[0] -= 0.04 * span
		*r[1] += 0.04 * span
	}
	return s, nil
}

// Draw draws the map on c.
func (m SIMap) Draw(c draw.Canvas) error {
	s, err := m.prepare()
	if err != nil {
		return err
	}
	caption := m.Caption
	if m.HasCV && finite(m.CVRMSE) {
		if caption != "" {
			caption += " "
		}
		caption += fmt.Sprintf("Surface cross-validation (leave-one-out) RMSE: %s SI units.", formatNum(m.CVRMSE, 2))
	}
	legend := s.legend()
	note := ""
	var lay mapLayout
	for pass := 0; pass < 2; pass++ {
		pg := newPage(c, m.Title, caption, legend, note)
		body, legTop, capTop := pg.layout(c)
		lay = s.layout(body)
		lay.page, lay.legTop, lay.capTop = pg, legTop, capTop
		var dropped []string
		for i, p := range lay.places {
			if !p.placed {
				dropped = append(dropped, lay.texts[i])
			}
		}
		if len(dropped) == 0 {
			lay.page.legendNote = ""
			break
		}
		msg := fmt.Sprintf("%d labels not shown where symbols crowd.", len(dropped))
		if len(dropped) <= 6 {
			msg = "Not labelled where symbols crowd: " + strings.Join(dropped, ", ") + "."
		}
		if note == "" {
			note = msg
			continue
		}
		lay.page.legendNote = msg
		break
	}
	lay.p.Draw(lay.mapC)
	drawColorBar(c, lay.cbarX, lay.da.Min.Y, lay.da.Max.Y, s.lim, s.colorLabel())
	lay.page.draw(c, lay.legTop, lay.capTop)
	return nil
}

func (s *mapState) colorLabel() string {
	if s.m.ColorLabel != "" {
		return s.m.ColorLabel
	}
	return DefaultColorLabel
}

func (s *mapState) legend() []legendEntry {
	var es []legendEntry
	for _, k := range []MarkerKind{MarkerWell, MarkerInjection, MarkerMonitoring, MarkerSpring} {
		if s.kinds[k] {
			es = append(es, legendEntry{label: markerNames[k], kind: legendGlyph, glyph: k.glyph(), fill: color.NRGBA{R: 0xbb, G: 0xbb, B: 0xbb, A: 0xff}})
		}
	}
	if s.noSI {
		es = append(es, legendEntry{label: "no SI value", kind: legendGlyph, glyph: glyphCircle, fill: color.White, cross: true})
	}
	if len(s.contour) > 0 {
		es = append(es, legendEntry{label: "SI = 0 (equilibrium)", kind: legendLine, line: contourStyle, halo: true})
	}
	seen := map[string]bool{}
	for _, f := range s.features {
		if f.Kind == FeaturePoint || seen[f.Kind+"\x00"+f.Name] {
			continue
		}
		seen[f.Kind+"\x00"+f.Name] = true
		name := f.Name
		if name == "" {
			name = map[string]string{FeaturePolygon: "site feature", FeatureLine: "line feature"}[f.Kind]
		}
		e := legendEntry{label: name, kind: legendLine, line: featureStyle(f.Kind)}
		if f.Kind == FeaturePolygon {
			e.kind = legendPatch
			e.fill = color.Transparent
		}
		es = append(es, e)
	}
	return es
}

var contourStyle = draw.LineStyle{Color: color.Black, Width: 1.3}

func featureStyle(kind string) draw.LineStyle {
	if kind == FeatureLine {
		return draw.LineStyle{Color: color.NRGBA{R: 0x2b, G: 0x2b, B: 0x2b, A: 0xff}, Width: 1.1, Dashes: []vg.Length{5, 2, 1.5, 2}}
	}
	return draw.LineStyle{Color: color.NRGBA{R: 0x40, G: 0x40, B: 0x40, A: 0xff}, Width: 1.0, Dashes: []vg.Length{3, 1.5}}
}

type mapLayout struct {
	p      *plot.Plot
	mapC   draw.Canvas
	da     draw.Canvas
	cbarX  vg.Length
	places []labelPlacement
	items  []labelItem
	texts  []string
	page   page
	legTop vg.Length
	capTop vg.Length
}

// colorBarWidth is the width reserved right of the map for the colour bar.
func colorBarWidth(lim float64) vg.Length {
	tw := textStyle(sizeTick).Width(formatTick(-lim, niceFloor(lim/2)))
	return 10 + 9 + 3 + tw + 6 + lineHeight(textStyle(sizeSmall)) + 4 + lineHeight(textStyle(sizeLabel))
}

func (s *mapState) layout(body draw.Canvas) mapLayout {
	var lay mapLayout
	mapC := body

	mapC.Max.X -= colorBarWidth(s.lim)
	p := newPlot()
	if s.m.degrees() {
		p.X.Label.Text, p.Y.Label.Text = "Longitude (°)", "Latitude (°)"
	} else {
		p.X.Label.Text, p.Y.Label.Text = "Easting (m)", "Northing (m)"
	}
	// As many x labels as fit side by side, about 1.6 label widths apart.
	big := math.Max(math.Abs(s.ext.x0), math.Abs(s.ext.x1))
	lw := float64(textStyle(sizeTick).Width(formatNum(big, 7)))
	nx := int(float64(mapC.Max.X-mapC.Min.X-60) / (1.6 * lw))
	ny := int(float64(mapC.Max.Y-mapC.Min.Y-30) / (3.5 * float64(lineHeight(textStyle(sizeTick)))))
	p.X.Tick.Marker = niceTicks{n: min(max(nx, 2), 6)}
	p.Y.Tick.Marker = niceTicks{n: min(max(ny, 2), 6)}
	if s.hasCells {
		p.Add(gridImage(s.grid, s.scale))
	}
	if len(s.features) > 0 {
		p.Add(&featurePlotter{s.features})
	}
	if len(s.contour) > 0 {
		p.Add(&contourPlotter{s.contour})
	}
	ov := &overlay{s: s, lay: &lay}
	p.Add(ov)
	x0, x1, y0, y1 := s.ext.x0, s.ext.x1, s.ext.y0, s.ext.y1
	// Equal scale: expand the shorter range until one unit (scaled by
	// aspectX along x) takes the same length on both axes. Two passes, as
	// tick labels change the data area a little.
	for pass := 0; pass < 3; pass++ {
		p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = x0, x1, y0, y1
		da := p.DataCanvas(mapC)
		w, h := float64(da.Max.X-da.Min.X), float64(da.Max.Y-da.Min.Y)
		if w <= 1 || h <= 1 {
			break
		}
		ux := (s.ext.x1 - s.ext.x0) * s.aspectX / w
		uy := (s.ext.y1 - s.ext.y0) / h
		u := math.Max(ux, uy)
		cx, cy := (s.ext.x0+s.ext.x1)/2, (s.ext.y0+s.ext.y1)/2
		x0, x1 = cx-u*w/s.aspectX/2, cx+u*w/s.aspectX/2
		y0, y1 = cy-u*h/2, cy+u*h/2
	}
	p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = x0, x1, y0, y1
	lay.p, lay.mapC = p, mapC
	lay.da = p.DataCanvas(mapC)
	lay.cbarX = lay.da.Max.X + 10
	lay.items, lay.texts, lay.places = s.placeLabels(p, lay.da)
	return lay
}

var wellLabelStyle = textStyle(7.5)

const wellRadius = 3.4

func (s *mapState) placeLabels(p *plot.Plot, da draw.Canvas) ([]labelItem, []string, []labelPlacement) {
	tx, ty := p.Transforms(&da)
	var items []labelItem
	var texts []string
	// Injection wells first: they matter most to the reader.
	order := make([]int, 0, len(s.wells))
	for i, w := range s.wells {
		if w.Marker == MarkerInjection {
			order = append(order, i)
		}
	}
	for i, w := range s.wells {
		if w.Marker != MarkerInjection {
			order = append(order, i)
		}
	}
	// Every symbol blocks labels, labelled or not.
	var obstacles []vg.Rectangle
	for _, i := range order {
		w := s.wells[i]
		pt := vg.Point{X: tx(w.X), Y: ty(w.Y)}
		if w.Label == "" {
			obstacles = append(obstacles, vg.Rectangle{Min: vg.Point{X: pt.X - wellRadius, Y: pt.Y - wellRadius}, Max: vg.Point{X: pt.X + wellRadius, Y: pt.Y + wellRadius}})
			continue
		}
		items = append(items, labelItem{anchor: pt, r: wellRadius, w: wellLabelStyle.Width(w.Label) + 2, h: wellLabelStyle.Height(w.Label) + 1})
		texts = append(texts, w.Label)
	}
	for _, f := range s.features {
		if f.Kind != FeaturePoint {
			continue
		}
		for _, c := range f.Coords {
			pt := vg.Point{X: tx(c[0]), Y: ty(c[1])}
			if f.Name == "" {
				continue
			}
			items = append(items, labelItem{anchor: pt, r: 3, w: wellLabelStyle.Width(f.Name) + 2, h: wellLabelStyle.Height(f.Name) + 1})
			texts = append(texts, f.Name)
		}
	}
	if s.m.ScaleBar {
		obstacles = append(obstacles, s.scaleBarRect(p, da))
	}
	if s.m.NorthArrow {
		obstacles = append(obstacles, northArrowRect(da))
	}
	bounds := da.Rectangle
	return items, texts, placeLabels(items, obstacles, bounds)
}

// gridImage is the SI surface as a crisp nearest-neighbour image: each cell
// is repeated into a block of pixels so that no renderer smooths between
// cells; blank cells are transparent.
func gridImage(g *Grid, sc Diverging) *plotter.Image {
	f := 1
	if n := max(g.NX, g.NY); n < 1000 {
		f = min(16, (1000+n-1)/n)
	}
	img := image.NewNRGBA(image.Rect(0, 0, g.NX*f, g.NY*f))
	for j := 0; j < g.NY; j++ {
		for i := 0; i < g.NX; i++ {
			k := j*g.NX + i
			if !g.ok(k) {
				continue
			}
			col := sc.Color(g.Z[k])
			row := g.NY - 1 - j
			for dy := 0; dy < f; dy++ {
				for dx := 0; dx < f; dx++ {
					img.SetNRGBA(i*f+dx, row*f+dy, col)
				}
			}
		}
	}
	return plotter.NewImage(img, g.X0-g.DX/2, g.Y0-g.DY/2, g.X0+(float64(g.NX)-0.5)*g.DX, g.Y0+(float64(g.NY)-0.5)*g.DY)
}

// zeroContour traces SI = 0 by marching squares over the cell centres,
// using only squares whose four corners hold finite values, and chains the
// pieces into polylines.
func zeroContour(g *Grid) [][][2]float64 {
	type seg struct {
		e [2]int
		p [2][2]float64
	}
	var segs []seg
	z := func(i, j int) float64 { return g.Z[j*g.NX+i] }
	pos := func(i, j int) [2]float64 { return [2]float64{g.X0 + float64(i)*g.DX, g.Y0 + float64(j)*g.DY} }
	// Edge ids: horizontal edge from (i,j) to (i+1,j) is 2k, vertical edge
	// from (i,j) to (i,j+1) is 2k+1, k = j*NX+i.
	cross := func(i0, j0, i1, j1 int) (float64, [2]float64) {
		a, b := z(i0, j0), z(i1, j1)
		t := a / (a - b)
		p0, p1 := pos(i0, j0), pos(i1, j1)
		return t, [2]float64{p0[0] + t*(p1[0]-p0[0]), p0[1] + t*(p1[1]-p0[1])}
	}
	for j := 0; j+1 < g.NY; j++ {
		for i := 0; i+1 < g.NX; i++ {
			k := j*g.NX + i
			if !g.ok(k) || !g.ok(k+1) || !g.ok(k+g.NX) || !g.ok(k+g.NX+1) {
				continue
			}
			// corners counter-clockwise: bl, br, tr, tl; edges bottom, right, top, left
			cs := [4][2]int{{i, j}, {i + 1, j}, {i + 1, j + 1}, {i, j + 1}}
			eid := [4]int{2 * k, 2*(k+1) + 1, 2 * (k + g.NX), 2*k + 1}
			var es []int
			var ps [][2]float64
			for e := 0; e < 4; e++ {
				a, b := cs[e], cs[(e+1)%4]
				za, zb := z(a[0], a[1]), z(b[0], b[1])
				if (za >= 0) != (zb >= 0) {
					_, p := cross(a[0], a[1], b[0], b[1])
					es = append(es, eid[e])
					ps = append(ps, p)
				}
			}
			switch len(es) {
			case 2:
				segs = append(segs, seg{[2]int{es[0], es[1]}, [2][2]float64{ps[0], ps[1]}})
			case 4:
				// Saddle: decide by the mean of the corners. Crossings are
				// on edges bottom, right, top, left in that order.
				mean := (z(i, j) + z(i+1, j) + z(i+1, j+1) + z(i, j+1)) / 4
				if (mean >= 0) == (z(i, j) >= 0) {
					segs = append(segs, seg{[2]int{es[0], es[1]}, [2][2]float64{ps[0], ps[1]}})
					segs = append(segs, seg{[2]int{es[2], es[3]}, [2][2]float64{ps[2], ps[3]}})
				} else {
					segs = append(segs, seg{[2]int{es[3], es[0]}, [2][2]float64{ps[3], ps[0]}})
					segs = append(segs, seg{[2]int{es[1], es[2]}, [2][2]float64{ps[1], ps[2]}})
				}
			}
		}
	}
	// Chain segments sharing an edge crossing.
	byEdge := map[int][]int{}
	for n, s := range segs {
		byEdge[s.e[0]] = append(byEdge[s.e[0]], n)
		byEdge[s.e[1]] = append(byEdge[s.e[1]], n)
	}
	used := make([]bool, len(segs))
	next := func(edge, from int) int {
		for _, n := range byEdge[edge] {
			if n != from && !used[n] {
				return n
			}
		}
		return -1
	}
	// walk follows the chain from segment cur through its crossing on edge,
	// collecting the far point of each segment it joins.
	walk := func(edge, cur int) [][2]float64 {
		var pts [][2]float64
		for {
			m := next(edge, cur)
			if m < 0 {
				return pts
			}
			used[m] = true
			if segs[m].e[0] == edge {
				pts = append(pts, segs[m].p[1])
				edge = segs[m].e[1]
			} else {
				pts = append(pts, segs[m].p[0])
				edge = segs[m].e[0]
			}
			cur = m
		}
	}
	var lines [][][2]float64
	for n := range segs {
		if used[n] {
			continue
		}
		used[n] = true
		forward := walk(segs[n].e[1], n)
		back := walk(segs[n].e[0], n)
		for a, b := 0, len(back)-1; a < b; a, b = a+1, b-1 {
			back[a], back[b] = back[b], back[a]
		}
		line := append(back, segs[n].p[0], segs[n].p[1])
		lines = append(lines, append(line, forward...))
	}
	return lines
}

type contourPlotter struct{ lines [][][2]float64 }

func (cp *contourPlotter) Plot(c draw.Canvas, p *plot.Plot) {
	tx, ty := p.Transforms(&c)
	var vls [][]vg.Point
	for _, l := range cp.lines {
		pts := make([]vg.Point, len(l))
		for i, q := range l {
			pts[i] = vg.Point{X: tx(q[0]), Y: ty(q[1])}
		}
		vls = append(vls, pts)
	}
	halo := contourStyle
	halo.Width += 2
	halo.Color = color.NRGBA{R: 255, G: 255, B: 255, A: 0xe0}
	c.StrokeLines(halo, vls...)
	c.StrokeLines(contourStyle, vls...)
}

type featurePlotter struct{ fs []Feature }

func (fp *featurePlotter) Plot(c draw.Canvas, p *plot.Plot) {
	tx, ty := p.Transforms(&c)
	for _, f := range fp.fs {
		pts := make([]vg.Point, 0, len(f.Coords)+1)
		for _, q := range f.Coords {
			pts = append(pts, vg.Point{X: tx(q[0]), Y: ty(q[1])})
		}
		switch f.Kind {
		case FeaturePolygon:
			if pts[0] != pts[len(pts)-1] {
				pts = append(pts, pts[0])
			}
			c.StrokeLines(featureStyle(f.Kind), pts)
		case FeatureLine:
			c.StrokeLines(featureStyle(f.Kind), pts)
		case FeaturePoint:
			for _, pt := range pts {
				if c.Contains(pt) {
					drawGlyph(c, glyphPlus, pt, 3.5, nil, color.Black, 0.7)
				}
			}
		}
	}
}

// overlay draws the wells, their labels, the scale bar and the north arrow
// in the data area.
type overlay struct {
	s   *mapState
	lay *mapLayout
}

func (o *overlay) Plot(c draw.Canvas, p *plot.Plot) {
	s, lay := o.s, o.lay
	tx, ty := p.Transforms(&c)
	// Leader lines first, then label boxes, then symbols on top.
	leader := draw.LineStyle{Color: greyColor, Width: 0.5}
	for i, pl := range lay.places {
		if pl.placed && pl.leader {
			a := lay.items[i].anchor
			c.StrokeLine2(leader, a.X, a.Y, nearestOnRect(pl.rect, a).X, nearestOnRect(pl.rect, a).Y)
		}
	}
	for _, w := range s.wells {
		pt := vg.Point{X: tx(w.X), Y: ty(w.Y)}
		fill := color.Color(color.White)
		if finite(w.SI) {
			fill = s.scale.Color(w.SI)
		}
		r := vg.Length(wellRadius)
		if w.Marker == MarkerInjection {
			r = wellRadius * 1.1
		}
		drawGlyph(c, w.Marker.glyph(), pt, r, fill, inkColor, 0.7)
		if !finite(w.SI) {
			drawGlyph(c, glyphCross, pt, r*0.55, nil, inkColor, 0.35)
		}
	}
	for i, pl := range lay.places {
		if !pl.placed {
			continue
		}
		r := pl.rect
		c.FillPolygon(haloColor, []vg.Point{r.Min, {X: r.Max.X, Y: r.Min.Y}, r.Max, {X: r.Min.X, Y: r.Max.Y}})
		sty := wellLabelStyle
		sty.XAlign, sty.YAlign = draw.XCenter, draw.YCenter
		c.FillText(sty, vg.Point{X: (r.Min.X + r.Max.X) / 2, Y: (r.Min.Y + r.Max.Y) / 2}, lay.texts[i])
	}
	if s.m.ScaleBar {
		s.drawScaleBar(c, p)
	}
	if s.m.NorthArrow {
		drawNorthArrow(c)
	}
}

// scaleBarGeom returns the bar length in map units and in metres and the
// bar's box in canvas coordinates (lower left of the data area).
func (s *mapState) scaleBarGeom(p *plot.Plot, da draw.Canvas) (units, metres float64, bar vg.Rectangle) {
	span := (p.X.Max - p.X.Min) * s.mPerUnitX
	metres = niceFloor(span / 4)
	units = metres / s.mPerUnitX
	w := vg.Length(units/(p.X.Max-p.X.Min)) * (da.Max.X - da.Min.X)
	x0, y0 := da.Min.X+8, da.Min.Y+8
	return units, metres, vg.Rectangle{Min: vg.Point{X: x0, Y: y0}, Max: vg.Point{X: x0 + w, Y: y0 + 4}}
}

func (s *mapState) scaleBarRect(p *plot.Plot, da draw.Canvas) vg.Rectangle {
	_, m, bar := s.scaleBarGeom(p, da)
	lh := lineHeight(textStyle(sizeSmall))
	r := bar
	r.Min.X -= 4
	r.Min.Y -= 4
	r.Max.Y += lh + 3
	if tw := textStyle(sizeSmall).Width(scaleLabel(m, s.m.degrees())); r.Max.X-r.Min.X < tw+8 {
		r.Max.X = r.Min.X + tw + 8
	}
	r.Max.X += 4
	return r
}

func scaleLabel(m float64, approx bool) string {
	s := formatNum(m, 3) + " m"
	if m >= 1000 {
		s = formatNum(m/1000, 3) + " km"
	}
	if approx {
		s = "≈ " + s
	}
	return s
}

func (s *mapState) drawScaleBar(c draw.Canvas, p *plot.Plot) {
	_, m, bar := s.scaleBarGeom(p, c)
	box := s.scaleBarRect(p, c)
	c.FillPolygon(haloColor, []vg.Point{box.Min, {X: box.Max.X, Y: box.Min.Y}, box.Max, {X: box.Min.X, Y: box.Max.Y}})
	// Two halves, black then white, outlined.
	mid := (bar.Min.X + bar.Max.X) / 2
	c.FillPolygon(color.Black, []vg.Point{bar.Min, {X: mid, Y: bar.Min.Y}, {X: mid, Y: bar.Max.Y}, {X: bar.Min.X, Y: bar.Max.Y}})
	c.FillPolygon(color.White, []vg.Point{{X: mid, Y: bar.Min.Y}, {X: bar.Max.X, Y: bar.Min.Y}, bar.Max, {X: mid, Y: bar.Max.Y}})
	out := draw.LineStyle{Color: color.Black, Width: 0.6}
	c.StrokeLines(out, []vg.Point{bar.Min, {X: bar.Max.X, Y: bar.Min.Y}, bar.Max, {X: bar.Min.X, Y: bar.Max.Y}, bar.Min})
	sty := textStyle(sizeSmall)
	sty.XAlign, sty.YAlign = draw.XLeft, draw.YBottom
	c.FillText(sty, vg.Point{X: bar.Min.X, Y: bar.Max.Y + 2}, scaleLabel(m, s.m.degrees()))
}

const northSize = 18

func northArrowRect(da draw.Canvas) vg.Rectangle {
	lh := lineHeight(textStyle(sizeLabel))
	x1, y1 := da.Max.X-6, da.Max.Y-6
	return vg.Rectangle{Min: vg.Point{X: x1 - northSize*0.7, Y: y1 - northSize - lh - 2}, Max: vg.Point{X: x1, Y: y1}}
}

func drawNorthArrow(c draw.Canvas) {
	r := northArrowRect(c)
	c.FillPolygon(haloColor, []vg.Point{r.Min, {X: r.Max.X, Y: r.Min.Y}, r.Max, {X: r.Min.X, Y: r.Max.Y}})
	cx := (r.Min.X + r.Max.X) / 2
	lh := lineHeight(textStyle(sizeLabel))
	tip := vg.Point{X: cx, Y: r.Max.Y - lh - 1}
	base := r.Min.Y + 2
	hw := vg.Length(northSize * 0.25)
	notch := vg.Point{X: cx, Y: base + northSize*0.28}
	// Half-filled arrowhead: left half black, right half white, outlined.
	left := []vg.Point{tip, {X: cx - hw, Y: base}, notch}
	right := []vg.Point{tip, notch, {X: cx + hw, Y: base}}
	c.FillPolygon(color.Black, left)
	c.FillPolygon(color.White, right)
	c.StrokeLines(draw.LineStyle{Color: color.Black, Width: 0.7}, []vg.Point{tip, {X: cx - hw, Y: base}, notch, {X: cx + hw, Y: base}, tip})
	sty := boldStyle(sizeLabel)
	sty.XAlign, sty.YAlign = draw.XCenter, draw.YTop
	c.FillText(sty, vg.Point{X: cx, Y: r.Max.Y}, "N")
}

// drawColorBar draws a vertical colour bar for Diverging{lim} from y0 to y1
// with its left edge at x.
func drawColorBar(c draw.Canvas, x, y0, y1 vg.Length, lim float64, label string) {
	const barW = 9
	if y1-y0 < 20 {
		return
	}
	sc := Diverging{Limit: lim}
	n := 256
	img := image.NewNRGBA(image.Rect(0, 0, 4, n))
	for r := 0; r < n; r++ {
		v := lim - (float64(r)+0.5)/float64(n)*2*lim
		col := sc.Color(v)
		for k := 0; k < 4; k++ {
			img.SetNRGBA(k, r, col)
		}
	}
	c.DrawImage(vg.Rectangle{Min: vg.Point{X: x, Y: y0}, Max: vg.Point{X: x + barW, Y: y1}}, img)
	out := draw.LineStyle{Color: inkColor, Width: 0.6}
	c.StrokeLines(out, []vg.Point{{X: x, Y: y0}, {X: x + barW, Y: y0}, {X: x + barW, Y: y1}, {X: x, Y: y1}, {X: x, Y: y0}})
	yOf := func(v float64) vg.Length { return y0 + vg.Length((v+lim)/(2*lim))*(y1-y0) }
	// Equilibrium mark across the bar.
	c.StrokeLine2(draw.LineStyle{Color: color.Black, Width: 1.2}, x, yOf(0), x+barW, yOf(0))
	step := niceFloor(lim / 2)
	tsty := textStyle(sizeTick)
	tsty.XAlign, tsty.YAlign = draw.XLeft, draw.YCenter
	var tw vg.Length
	for v := math.Ceil(-lim/step-1e-9) * step; v <= lim+step*1e-9; v += step {
		y := yOf(v)
		c.StrokeLine2(out, x+barW, y, x+barW+3, y)
		l := formatTick(v, step)
		if v > step*1e-9 {
			l = "+" + l
		}
		c.FillText(tsty, vg.Point{X: x + barW + 5, Y: y}, l)
		tw = max(tw, tsty.Width(l))
	}
	// End labels along the bar, then the main label.
	xe := x + barW + 5 + tw + 4
	es := textStyle(sizeSmall)
	es.Rotation = math.Pi / 2
	es.YAlign = draw.YTop
	half := (y1 - y0) / 2
	if es.Width("undersaturated") < half-6 {
		es.XAlign = draw.XRight
		c.FillText(es, vg.Point{X: xe, Y: y1}, "supersaturated")
		es.XAlign = draw.XLeft
		c.FillText(es, vg.Point{X: xe, Y: y0}, "undersaturated")
	}
	ls := textStyle(sizeLabel)
	ls.Rotation = math.Pi / 2
	ls.XAlign, ls.YAlign = draw.XCenter, draw.YTop
	c.FillText(ls, vg.Point{X: xe + lineHeight(es) + 3, Y: (y0 + y1) / 2}, label)
}
