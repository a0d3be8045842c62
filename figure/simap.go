package figure

import (
	"fmt"
	"math"

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
// Class (ClassBoundary, ClassRiver, ClassPipeline, ClassInjectionWell or
// any other word) chooses its look, one line style per class.
type Feature struct {
	Kind   string
	Class  string
	Name   string
	Coords [][2]float64
}

// SIMap is a map of one mineral's saturation index: the interpolated
// surface (when given) with its near-equilibrium zone |SI| <= Band hatched
// and edged by thin grey lines, wells coloured by their SI with their ids
// (and values, when PostValues is set), site features, a colour bar, a
// scale bar and a north arrow. No SI = 0 line is drawn: within the band the
// sign of SI is not decided by the data, and the hatched zone says so
// where a single line would claim a precision the data do not have.
// The map frame holds the wells, the surface, site areas and points; site
// lines are cut at the frame. Coordinates are in Units (UnitsMetres, the
// default, or UnitsDegrees); the
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
	// Band is the half-width of the near-equilibrium band in SI units (0:
	// DefaultBand; negative: no band drawn).
	Band float64
	// Note is a short line under the panel title, e.g. how the surface was
	// made or why none is drawn.
	Note string
	// PostValues writes each well's SI after its label (maps without a
	// surface show the measured values themselves).
	PostValues bool
	// XLabel and YLabel title the axes (default "Easting (m)" and
	// "Northing (m)", or longitude and latitude in degrees).
	XLabel, YLabel string
}

func (m SIMap) band() float64 {
	switch {
	case m.Band < 0 || math.IsNaN(m.Band):
		return 0
	case m.Band == 0 || math.IsInf(m.Band, 0):
		return DefaultBand
	}
	return m.Band
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
	band      float64
	bandEdges [][][2]float64
	ext       extent
	noSI      bool
	kinds     map[MarkerKind]bool
	mPerUnitX float64 // metres per x unit, for the scale bar
	aspectX   float64 // x units are drawn shorter by this factor (cos lat)
	sbCorner  int     // scale bar corner: bit 0 right, bit 1 top
}

func (m SIMap) prepare() (*mapState, error) {
	s := &mapState{m: m, lim: m.ColorLimit(), kinds: map[MarkerKind]bool{}, band: m.band()}
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
		if s.hasCells && s.band > 0 {
			s.bandEdges = append(contourAt(g, s.band), contourAt(g, -s.band)...)
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
		// Lines (rivers, pipelines) may run far beyond the wells: they are
		// cut at the map frame instead of widening it.
		for _, p := range cs {
			if f.Kind == FeatureLine {
				break
			}
			s.ext.add(p[0], p[1])
		}
		s.features = append(s.features, Feature{Kind: f.Kind, Class: f.Class, Name: f.Name, Coords: cs})
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

// Draw draws the map on c: a figure of one panel.
func (m SIMap) Draw(c draw.Canvas) error {
	one := m
	one.Title = ""
	return SIMaps{Title: m.Title, Caption: m.Caption, Maps: []SIMap{one}}.Draw(c)
}
