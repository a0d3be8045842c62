package site

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/project"
	"gonum.org/v1/plot/vg"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/geo"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/report"
)

// Options choose what Build draws.
type Options struct {
	// Minerals to map and profile; nil chooses those whose SI crosses zero
	// somewhere on site (at most MaxAutoMinerals, in data order).
	Minerals []string
	// Method is "kriging" (default; IDW below MinWellsKriging wells or when
	// the variogram cannot be fitted) or "idw".
	Method string
	// Features are drawn on every map.
	Features []geo.SiteFeature
	// BandEdges split sample depths into zones mapped separately (metres
	// below ground, increasing); nil finds zones from gaps in the depths.
	BandEdges []float64
	// ProfileRound keeps one sampling round in the depth profiles; ""
	// draws every round.
	ProfileRound string
	// Model names the activity model for captions.
	Model string
	// ClusterColumn names the input column that groups wells into clusters
	// for depth profiles; "" means "Cluster".
	ClusterColumn string
}

// MaxAutoMinerals caps the minerals chosen automatically.
const MaxAutoMinerals = 6

// SurfaceRow describes one map panel's surface for the surfaces table:
// Drawn tells whether an interpolated surface is shown, and Note says why
// or why not (MinWellsSurface, MinWellsKriging, MaxSurfaceCVRMSE).
type SurfaceRow struct {
	Mineral, Zone, Round, Method string
	Wells                        int
	CVRMSE                       float64
	HasCV                        bool
	Drawn                        bool
	Note                         string
}

// Site is what Build makes: figures, the surfaces table and notes.
type Site struct {
	Minerals []string
	Zones    []Zone
	Figures  []report.Fig
	Surfaces []SurfaceRow
	Placed   int
	Unplaced []string // "ID (reason)" for rows left off the maps
	Notes    []string
	// EPSG is the projected CRS of the maps and GIS layers: the WGS 84 UTM
	// zone of the wells' centroid (326zz north, 327zz south).
	EPSG int

	grids    []*geo.Grid // per Surfaces row: the drawn surface, or nil
	features []geo.SiteFeature
}

// Zone is a depth interval mapped on its own.
type Zone struct {
	Top, Bottom float64
	Label       string
}

type placedRec struct {
	rec   *assess.Record
	ll    orb.Point
	xy    orb.Point
	depth float64
	hasD  bool
}

// Build composes the SI maps and depth profiles of a run.
func Build(recs []assess.Record, minerals []string, opt Options) (*Site, error) {
	site := &Site{}
	var placed []placedRec
	for i := range recs {
		r := &recs[i]
		s := r.Sample()
		p, err := assess.Position(s)
		if err != nil {
			site.Unplaced = append(site.Unplaced, fmt.Sprintf("%s line %d (%v)", s.ID, r.Row.Line, err))
			continue
		}
		if r.Result == nil {
			site.Unplaced = append(site.Unplaced, fmt.Sprintf("%s line %d (%s, no saturation indices)", s.ID, r.Row.Line, r.Status))
			continue
		}
		d, ok := assess.DepthM(s)
		placed = append(placed, placedRec{rec: r, ll: p, depth: d, hasD: ok})
	}
	site.Placed = len(placed)
	if len(placed) == 0 {
		return site, errors.New("report: no sample has both a position and saturation indices: no maps drawn")
	}
	var lls []orb.Point
	for _, p := range placed {
		lls = append(lls, p.ll)
	}
	// Maps are drawn in the UTM zone of the wells' centroid, so their axes
	// are real eastings and northings (distances within 0.1 % across a
	// zone: UTM scale factor 0.9996 to about 1.001, NIMA TM8358.2, `from
	// memory`; far below what interpolation can resolve).
	site.EPSG = geo.UTMEPSG(geo.NewLocalFrame(lls).Centre)
	site.features = opt.Features
	toMap := func(p orb.Point) orb.Point {
		x, y, err := geo.FromLonLat(p, site.EPSG)
		if err != nil {
			return orb.Point{math.NaN(), math.NaN()}
		}
		return orb.Point{x, y}
	}
	for i := range placed {
		placed[i].xy = toMap(placed[i].ll)
	}
	feats := projectFeatures(toMap, opt.Features)
	xLabel, yLabel := axisTitles(site.EPSG)

	if opt.Minerals != nil {
		site.Minerals = opt.Minerals
	} else {
		site.Minerals = crossingZero(placed, minerals)
	}
	if len(site.Minerals) == 0 {
		site.Notes = append(site.Notes, "no mineral's saturation index crosses zero on site: no maps drawn (choose minerals with -minerals)")
		return site, nil
	}
	site.Zones = depthZones(placed, opt.BandEdges)
	rounds := roundsOf(placed)

	for _, m := range site.Minerals {
		for _, z := range site.Zones {
			var panels []figure.SIMap
			for _, rd := range rounds {
				var pts []orb.Point
				var vals []float64
				var wells []figure.Well
				for _, p := range placed {
					if p.rec.Sample().Round != rd || !z.contains(p) {
						continue
					}
					si, ok := p.rec.Result.SI(m)
					if !ok {
						continue
					}
					pts = append(pts, p.xy)
					vals = append(vals, si)
					wells = append(wells, figure.Well{X: p.xy[0], Y: p.xy[1], SI: si, Label: wellLabel(p.rec.Sample())})
				}
				wells = mergeWells(wells)
				if len(wells) == 0 {
					continue
				}
				sm := figure.SIMap{Title: panelTitle(m, rd, z), Wells: wells, Features: feats, Units: figure.UnitsMetres,
					NorthArrow: true, ScaleBar: true, Band: assess.NearEquilibriumBand, XLabel: xLabel, YLabel: yLabel}
				row := SurfaceRow{Mineral: m, Zone: z.Label, Round: rd, Wells: len(wells)}
				surf := surfaceFor(pts, vals, opt.Method, &row)
				if surf != nil {
					sm.Grid = toMapGrid(surf.Grid)
					sm.Note = fmt.Sprintf("%s; leave-one-out error %s SI", shortMethod(surf.Method), formatSI(surf.CVRMSE))
					site.grids = append(site.grids, surf.Grid)
				} else {
					sm.PostValues = true
					sm.Note = "measured values only: " + strings.TrimSuffix(strings.TrimPrefix(row.Note, "no surface: "), "; measured values shown")
					site.grids = append(site.grids, nil)
				}
				site.Surfaces = append(site.Surfaces, row)
				panels = append(panels, sm)
			}
			if len(panels) == 0 {
				continue
			}
			// One colour scale for all panels of a figure, so rounds compare.
			lim := colourLimit(panels)
			for i := range panels {
				panels[i].Limit = lim
			}
			cap := fmt.Sprintf("%s saturation index, %s; each panel one sampling round; speciated at each sample's temperature with the %s model. "+
				"Blue: undersaturated (may dissolve); orange: supersaturated (may deposit); hatched: within ±%.1f of equilibrium, where the data do not decide the sign. "+
				"A surface is drawn only from at least %d wells and with a leave-one-out error below %.1f SI; otherwise the measured values are posted. "+
				"Coordinates: WGS 84 / UTM, EPSG:%d.",
				m, z.Label, opt.Model, assess.NearEquilibriumBand, MinWellsSurface, MaxSurfaceCVRMSE, site.EPSG)
			if n := len(site.Unplaced); n > 0 {
				cap += fmt.Sprintf(" %d %s without a usable position or result not shown.", n, plural(n, "row", "rows"))
			}
			if n := noDepthCount(placed); n > 0 && z.Label != noDepthZone {
				cap += fmt.Sprintf(" %d %s without a depth (e.g. end-members) not shown on depth-zone figures.", n, plural(n, "sample", "samples"))
			}
			title := fmt.Sprintf("%s, %s", m, z.Label)
			maps := figure.SIMaps{Title: title, Maps: panels}
			// 16.5 cm wide: a full A4 text width at 100 %, so type prints at
			// its nominal size (8 pt and more).
			w := 16.5 * vg.Centimeter
			site.Figures = append(site.Figures, report.Fig{
				Stem: "map_" + slug(m) + "_" + slug(z.Label), Title: title, Caption: cap,
				Figure: maps, W: w, H: maps.FitHeight(w),
			})
		}
	}
	site.Figures = append(site.Figures, profiles(placed, site.Minerals, rounds, opt)...)
	return site, nil
}

func (z Zone) contains(p placedRec) bool {
	if !p.hasD {
		return z.Label == noDepthZone
	}
	return p.depth >= z.Top && p.depth < z.Bottom
}

const noDepthZone = "depth not reported"

func toMapGrid(g *geo.Grid) *figure.Grid {
	mg := &figure.Grid{X0: g.X0, Y0: g.Y0, DX: g.DX, DY: g.DY, NX: g.NX, NY: g.NY,
		Z: make([]float64, len(g.Values)), Valid: make([]bool, len(g.Values))}
	for j := 0; j < g.NY; j++ {
		for i := 0; i < g.NX; i++ {
			if v, ok := g.At(i, j); ok {
				mg.Z[j*g.NX+i], mg.Valid[j*g.NX+i] = v, true
			}
		}
	}
	return mg
}

func projectFeatures(proj orb.Projection, fs []geo.SiteFeature) []figure.Feature {
	var out []figure.Feature
	for _, f := range fs {
		if f.Geometry == nil {
			continue
		}
		g := project.Geometry(orb.Clone(f.Geometry), proj)
		add := func(kind string, pts []orb.Point) {
			mf := figure.Feature{Kind: kind, Class: f.Kind, Name: f.Name}
			for _, p := range pts {
				mf.Coords = append(mf.Coords, [2]float64{p[0], p[1]})
			}
			out = append(out, mf)
		}
		switch g := g.(type) {
		case orb.Point:
			add(figure.FeaturePoint, []orb.Point{g})
		case orb.MultiPoint:
			for _, p := range g {
				add(figure.FeaturePoint, []orb.Point{p})
			}
		case orb.LineString:
			add(figure.FeatureLine, g)
		case orb.MultiLineString:
			for _, l := range g {
				add(figure.FeatureLine, l)
			}
		case orb.Polygon:
			if len(g) > 0 {
				add(figure.FeaturePolygon, g[0])
			}
		case orb.MultiPolygon:
			for _, pg := range g {
				if len(pg) > 0 {
					add(figure.FeaturePolygon, pg[0])
				}
			}
		}
	}
	return out
}

// crossingZero returns the minerals whose SI is below zero at one placed
// sample and above zero at another.
func crossingZero(placed []placedRec, minerals []string) []string {
	var out []string
	for _, m := range minerals {
		lo, hi := math.Inf(1), math.Inf(-1)
		for _, p := range placed {
			if si, ok := p.rec.Result.SI(m); ok {
				lo, hi = math.Min(lo, si), math.Max(hi, si)
			}
		}
		if lo < 0 && hi > 0 {
			out = append(out, m)
			if len(out) == MaxAutoMinerals {
				break
			}
		}
	}
	return out
}

// depthZones splits the sampled depths into zones: given edges, or breaks
// at gaps wider than a quarter of the depth range and at least 10 m
// (common practice for nested monitoring wells; one zone when depths are
// continuous). Samples without depth form their own zone.
func depthZones(placed []placedRec, edges []float64) []Zone {
	var ds []float64
	noDepth := false
	for _, p := range placed {
		if p.hasD {
			ds = append(ds, p.depth)
		} else {
			noDepth = true
		}
	}
	var zones []Zone
	if len(edges) >= 2 {
		for i := 0; i+1 < len(edges); i++ {
			zones = append(zones, Zone{Top: edges[i], Bottom: edges[i+1], Label: fmt.Sprintf("%g-%g m depth", edges[i], edges[i+1])})
		}
	} else if len(ds) > 0 {
		sort.Float64s(ds)
		gap := math.Max(10, (ds[len(ds)-1]-ds[0])/4)
		start := 0
		for i := 1; i <= len(ds); i++ {
			if i == len(ds) || ds[i]-ds[i-1] > gap {
				top, bot := ds[start], ds[i-1]
				lbl := fmt.Sprintf("%.0f-%.0f m depth", top, bot)
				if top == bot {
					lbl = fmt.Sprintf("%.0f m depth", top)
				}
				zones = append(zones, Zone{Top: top, Bottom: math.Nextafter(bot, math.Inf(1)), Label: lbl})
				start = i
			}
		}
	}
	if noDepth && len(ds) == 0 {
		// Only when no sample reports a depth: one zone for the whole site.
		zones = append(zones, Zone{Label: noDepthZone})
	}
	return zones
}

func roundsOf(placed []placedRec) []string {
	seen := map[string]bool{}
	var out []string
	for _, p := range placed {
		r := p.rec.Sample().Round
		if !seen[r] {
			seen[r] = true
			out = append(out, r)
		}
	}
	sort.SliceStable(out, func(i, j int) bool { return naturalLess(out[i], out[j]) })
	return out
}

// naturalLess orders "2" before "10" and text alphabetically.
func naturalLess(a, b string) bool {
	var x, y float64
	_, ea := fmt.Sscanf(a, "%g", &x)
	_, eb := fmt.Sscanf(b, "%g", &y)
	if ea == nil && eb == nil {
		return x < y
	}
	return a < b
}

func panelTitle(m, round string, z Zone) string {
	if round == "" {
		return m
	}
	return fmt.Sprintf("%s, round %s", m, round)
}

func wellLabel(s *hydro.Sample) string {
	if s.WellID != "" {
		return s.WellID
	}
	return s.ID
}

func slug(s string) string {
	return strings.TrimSuffix(report.ColumnName(s), "_si")
}

func noDepthCount(placed []placedRec) int {
	n := 0
	for _, p := range placed {
		if !p.hasD {
			n++
		}
	}
	return n
}

// colourLimit is the largest |SI| of the wells in the panels, rounded up to
// a multiple of 0.5 and at least 0.5, so every panel shares one scale.
func colourLimit(panels []figure.SIMap) float64 {
	m := 0.0
	for _, f := range panels {
		for _, w := range f.Wells {
			if !math.IsNaN(w.SI) && !math.IsInf(w.SI, 0) {
				m = math.Max(m, math.Abs(w.SI))
			}
		}
	}
	return math.Max(0.5, math.Ceil(m/0.5)*0.5)
}

// axisTitles names the map axes with their UTM zone.
func axisTitles(epsg int) (string, string) {
	c, err := geo.ParseEPSG(epsg)
	if err != nil || c.Geographic {
		return "Easting (m)", "Northing (m)"
	}
	h := "N"
	if c.South {
		h = "S"
	}
	return fmt.Sprintf("Easting (m), UTM %d%s", c.Zone, h), "Northing (m)"
}

// shortMethod is the interpolation method without its fitted parameters.
func shortMethod(m string) string {
	if i := strings.IndexAny(m, "(,"); i > 0 {
		return strings.TrimSpace(m[:i])
	}
	return m
}

func formatSI(v float64) string { return fmt.Sprintf("%.2f", v) }

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}

// mergeWells draws samples at one position (a well sampled more than once in a
// round and zone) as one symbol at their mean SI, labelled as the first.
func mergeWells(ws []figure.Well) []figure.Well {
	idx := map[[2]int64]int{}
	n := map[int]int{}
	var out []figure.Well
	for _, w := range ws {
		k := positionKey(orb.Point{w.X, w.Y})
		if j, ok := idx[k]; ok {
			n[j]++
			out[j].SI += (w.SI - out[j].SI) / float64(n[j])
			continue
		}
		idx[k] = len(out)
		n[len(out)] = 1
		out = append(out, w)
	}
	return out
}
