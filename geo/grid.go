package geo

import (
	"errors"
	"fmt"
	"math"
	"runtime"
	"sync"

	"github.com/paulmach/orb"
)

// Grid is a regular grid of cell-centred estimates in a planar frame
// (metres, e.g. a LocalFrame). Cell (i, j), column i from the west and row j
// from the south, is centred on (X0 + i*DX, Y0 + j*DY) and stored at
// Values[j*NX+i].
//
// Cells outside the convex hull of the wells plus the buffer hold no
// estimate: Mask is false there and, by this package's convention, Values
// holds NaN, so a forgotten check shows up instead of drawing a silent zero.
// Use Valid or At before reading a value for output.
//
// Grid implements gonum's plotter.GridXYZ (Dims, Z, X, Y) without importing
// it; Z returns NaN for empty cells.
type Grid struct {
	X0, Y0 float64 // centre of the south-west cell, metres
	DX, DY float64 // cell size, metres (positive)
	NX, NY int     // columns, rows
	Values []float64
	Mask   []bool // true where the cell holds an estimate
}

// Valid reports whether cell (i, j) holds an estimate.
func (g *Grid) Valid(i, j int) bool {
	if i < 0 || j < 0 || i >= g.NX || j >= g.NY {
		return false
	}
	return g.Mask[j*g.NX+i]
}

// At returns the estimate of cell (i, j) and whether there is one.
func (g *Grid) At(i, j int) (float64, bool) {
	if !g.Valid(i, j) {
		return 0, false
	}
	return g.Values[j*g.NX+i], true
}

// Dims returns the number of columns and rows.
func (g *Grid) Dims() (c, r int) { return g.NX, g.NY }

// Z returns the value of column c, row r (NaN for an empty cell).
func (g *Grid) Z(c, r int) float64 { return g.Values[r*g.NX+c] }

// X returns the easting of column c's centre.
func (g *Grid) X(c int) float64 { return g.X0 + float64(c)*g.DX }

// Y returns the northing of row r's centre.
func (g *Grid) Y(r int) float64 { return g.Y0 + float64(r)*g.DY }

// Count returns the number of cells holding an estimate.
func (g *Grid) Count() int {
	n := 0
	for _, m := range g.Mask {
		if m {
			n++
		}
	}
	return n
}

// Range returns the smallest and largest estimate; ok is false for a grid
// with no estimate.
func (g *Grid) Range() (lo, hi float64, ok bool) {
	lo, hi = math.Inf(1), math.Inf(-1)
	for k, m := range g.Mask {
		if m {
			lo = math.Min(lo, g.Values[k])
			hi = math.Max(hi, g.Values[k])
			ok = true
		}
	}
	if !ok {
		return 0, 0, false
	}
	return lo, hi, true
}

// GridOptions chooses the grid laid over the wells.
type GridOptions struct {
	// NX and NY are the numbers of columns and rows. If either is zero the
	// grid has 100 cells along the longer side and square cells.
	NX, NY int
	// BufferFraction is the distance cells may lie outside the wells'
	// convex hull, as a fraction of the hull's extent (the larger side of
	// its bounding box). Zero means the default 0.1 (common practice); a
	// negative value means no buffer.
	BufferFraction float64
}

// Interpolator predicts a value at a planar point.
type Interpolator interface {
	Predict(p orb.Point) float64
}

// ErrTooFewWells is returned when fewer than three distinct wells remain.
var ErrTooFewWells = errors.New("geo: at least 3 distinct wells are needed to interpolate")

// Layout is the geometry of a surface: the empty grid, the wells' hull and
// the buffer distance in metres.
type Layout struct {
	Grid    *Grid
	Hull    orb.Ring
	BufferM float64
}

// NewLayout lays a grid over planar well positions (metres): the grid
// covers the hull's bounding box grown by the buffer, and Mask is true for
// cells whose centres lie inside the hull or within the buffer of it.
// Values start as NaN.
func NewLayout(points []orb.Point, opt GridOptions) (Layout, error) {
	hull := ConvexHull(points)
	if len(hull) < 2 {
		return Layout{}, ErrTooFewWells
	}
	b := hull.Bound()
	w, h := b.Max[0]-b.Min[0], b.Max[1]-b.Min[1]
	extent := math.Max(w, h)
	if !(extent > 0) || !finite(extent) {
		return Layout{}, fmt.Errorf("%w: the wells coincide", ErrTooFewWells)
	}
	frac := opt.BufferFraction
	switch {
	case frac == 0:
		frac = 0.1
	case frac < 0:
		frac = 0
	}
	buf := frac * extent
	minX, minY := b.Min[0]-buf, b.Min[1]-buf
	W, H := w+2*buf, h+2*buf
	nx, ny := opt.NX, opt.NY
	if nx <= 0 || ny <= 0 {
		cell := math.Max(W, H) / 100
		nx = max(1, int(math.Ceil(W/cell)))
		ny = max(1, int(math.Ceil(H/cell)))
	}
	if nx*ny > 50_000_000 {
		return Layout{}, fmt.Errorf("geo: grid %dx%d is too large", nx, ny)
	}
	g := &Grid{NX: nx, NY: ny, DX: W / float64(nx), DY: H / float64(ny)}
	if g.DX == 0 { // wells on a north-south line with no buffer
		g.DX = g.DY
	}
	if g.DY == 0 {
		g.DY = g.DX
	}
	g.X0, g.Y0 = minX+g.DX/2, minY+g.DY/2
	g.Values = make([]float64, nx*ny)
	g.Mask = make([]bool, nx*ny)
	region := newHullRegion(hull, buf)
	for j := 0; j < ny; j++ {
		for i := 0; i < nx; i++ {
			k := j*nx + i
			g.Values[k] = math.NaN()
			g.Mask[k] = region.contains(orb.Point{g.X(i), g.Y(j)})
		}
	}
	return Layout{Grid: g, Hull: hull, BufferM: buf}, nil
}

// Fill writes ip's prediction into every cell of g whose Mask is true.
// A prediction that is not finite leaves the cell empty. Rows are shared
// among GOMAXPROCS goroutines, so ip.Predict must be safe for concurrent
// use (the package's interpolators are).
func (g *Grid) Fill(ip Interpolator) {
	workers := min(runtime.GOMAXPROCS(0), g.NY)
	var wg sync.WaitGroup
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func(w int) {
			defer wg.Done()
			for j := w; j < g.NY; j += workers {
				g.fillRow(ip, j)
			}
		}(w)
	}
	wg.Wait()
}

func (g *Grid) fillRow(ip Interpolator, j int) {
	for i := 0; i < g.NX; i++ {
		k := j*g.NX + i
		if !g.Mask[k] {
			continue
		}
		z := ip.Predict(orb.Point{g.X(i), g.Y(j)})
		if !finite(z) {
			g.Mask[k] = false
			z = math.NaN()
		}
		g.Values[k] = z
	}
}

// well is one distinct well in the planar frame with its value.
type well struct {
	p orb.Point
	z float64
}

// DefaultMergeDistanceM is the distance below which two wells are treated
// as one (values averaged, positions averaged): 1 cm, common practice for
// repeat samples from the same well.
const DefaultMergeDistanceM = 0.01

// prepareWells validates the input and merges coincident wells by averaging
// (positions and values). It returns the distinct wells and how many input
// points were merged into another.
func prepareWells(points []orb.Point, vals []float64, mergeM float64) ([]well, int, error) {
	if len(points) != len(vals) {
		return nil, 0, fmt.Errorf("geo: %d points but %d values", len(points), len(vals))
	}
	for i := range points {
		if !finite(points[i][0]) || !finite(points[i][1]) {
			return nil, 0, fmt.Errorf("geo: well %d: position %v is not finite", i, points[i])
		}
		if !finite(vals[i]) {
			return nil, 0, fmt.Errorf("geo: well %d: value %v is not finite", i, vals[i])
		}
	}
	if mergeM <= 0 {
		mergeM = DefaultMergeDistanceM
	}
	m2 := mergeM * mergeM
	type acc struct {
		sx, sy, sz float64
		n          int
	}
	groups := make([]acc, 0, len(points))
	for i, p := range points {
		found := -1
		for g := range groups {
			c := orb.Point{groups[g].sx / float64(groups[g].n), groups[g].sy / float64(groups[g].n)}
			if dx, dy := p[0]-c[0], p[1]-c[1]; dx*dx+dy*dy <= m2 {
				found = g
				break
			}
		}
		if found < 0 {
			groups = append(groups, acc{})
			found = len(groups) - 1
		}
		a := &groups[found]
		a.sx += p[0]
		a.sy += p[1]
		a.sz += vals[i]
		a.n++
	}
	ws := make([]well, len(groups))
	for g, a := range groups {
		n := float64(a.n)
		ws[g] = well{p: orb.Point{a.sx / n, a.sy / n}, z: a.sz / n}
	}
	if len(ws) < 3 {
		return nil, 0, fmt.Errorf("%w (got %d)", ErrTooFewWells, len(ws))
	}
	return ws, len(points) - len(ws), nil
}
