package geo

import (
	"fmt"
	"math"

	"github.com/paulmach/orb"
	"gonum.org/v1/gonum/spatial/kdtree"
)

// IDWOptions configures inverse-distance weighting.
type IDWOptions struct {
	// Power is the distance exponent p in w = 1/d^p; zero means 2, the
	// usual choice (Shepard 1968, "A two-dimensional interpolation function
	// for irregularly-spaced data", Proc. 23rd ACM National Conference).
	Power float64
	// Neighbours limits each estimate to the nearest wells (found with a
	// k-d tree); zero uses all wells.
	Neighbours int
	// MergeDistanceM: wells closer than this are averaged into one;
	// zero means DefaultMergeDistanceM.
	MergeDistanceM float64
}

// IDW is an inverse-distance-weighted interpolator over planar wells. It
// passes exactly through every (merged) well value and never leaves the
// range of the data.
type IDW struct {
	wells  []well
	power  float64
	k      int
	tree   *kdtree.Tree
	Merged int // input wells merged into another as coincident
}

// NewIDW prepares an IDW interpolator from planar positions (metres) and
// values. Wells closer than the merge distance are averaged.
func NewIDW(points []orb.Point, vals []float64, opt IDWOptions) (*IDW, error) {
	if opt.Power < 0 || !finite(opt.Power) {
		return nil, fmt.Errorf("geo: IDW power %v must be positive", opt.Power)
	}
	ws, merged, err := prepareWells(points, vals, opt.MergeDistanceM)
	if err != nil {
		return nil, err
	}
	m := &IDW{wells: ws, power: opt.Power, k: opt.Neighbours, Merged: merged}
	if m.power == 0 {
		m.power = 2
	}
	if m.k >= len(ws) {
		m.k = 0
	}
	if m.k > 0 {
		pts := make(kdWells, len(ws))
		for i, w := range ws {
			pts[i] = kdWell{x: w.p[0], y: w.p[1], i: i}
		}
		m.tree = kdtree.New(pts, false)
	}
	return m, nil
}

// Predict returns the IDW estimate at p.
func (m *IDW) Predict(p orb.Point) float64 { return m.predict(p, -1) }

// predict skips well skip (for cross-validation; -1 skips none).
func (m *IDW) predict(p orb.Point, skip int) float64 {
	var sw, swz float64
	add := func(i int, d2 float64) bool {
		if d2 == 0 {
			swz, sw = m.wells[i].z, 1
			return true
		}
		var w float64
		if m.power == 2 {
			w = 1 / d2
		} else {
			w = math.Pow(d2, -m.power/2)
		}
		sw += w
		swz += w * m.wells[i].z
		return false
	}
	if m.tree != nil {
		k := m.k
		if skip >= 0 {
			k++
		}
		keep := kdtree.NewNKeeper(k)
		m.tree.NearestSet(keep, kdWell{x: p[0], y: p[1]})
		for _, c := range keep.Heap {
			if c.Comparable == nil {
				continue
			}
			i := c.Comparable.(kdWell).i
			if i == skip {
				continue
			}
			if add(i, c.Dist) { // kdtree distances are squared
				return swz
			}
		}
	} else {
		for i, w := range m.wells {
			if i == skip {
				continue
			}
			dx, dy := p[0]-w.p[0], p[1]-w.p[1]
			if add(i, dx*dx+dy*dy) {
				return swz
			}
		}
	}
	if sw == 0 {
		return math.NaN()
	}
	return swz / sw
}

// CrossValidate returns the leave-one-out cross-validation RMSE: each
// distinct well is predicted from the others, in the units of the values.
func (m *IDW) CrossValidate() float64 {
	var ss float64
	n := 0
	for i, w := range m.wells {
		e := m.predict(w.p, i) - w.z
		if finite(e) {
			ss += e * e
			n++
		}
	}
	if n == 0 {
		return math.NaN()
	}
	return math.Sqrt(ss / float64(n))
}

// kdWell is a well position for gonum's k-d tree, carrying its index.
type kdWell struct {
	x, y float64
	i    int
}

func (p kdWell) coord(d kdtree.Dim) float64 {
	if d == 0 {
		return p.x
	}
	return p.y
}

func (p kdWell) Compare(c kdtree.Comparable, d kdtree.Dim) float64 {
	return p.coord(d) - c.(kdWell).coord(d)
}
func (p kdWell) Dims() int { return 2 }

// Distance is squared, as gonum's kdtree expects.
func (p kdWell) Distance(c kdtree.Comparable) float64 {
	q := c.(kdWell)
	dx, dy := p.x-q.x, p.y-q.y
	return dx*dx + dy*dy
}

type kdWells []kdWell

func (p kdWells) Index(i int) kdtree.Comparable         { return p[i] }
func (p kdWells) Len() int                              { return len(p) }
func (p kdWells) Slice(start, end int) kdtree.Interface { return p[start:end] }
func (p kdWells) Pivot(d kdtree.Dim) int {
	return kdtree.Partition(kdPlane{p, d}, kdtree.MedianOfMedians(kdPlane{p, d}))
}

type kdPlane struct {
	p kdWells
	d kdtree.Dim
}

func (s kdPlane) Len() int { return len(s.p) }
func (s kdPlane) Less(i, j int) bool {
	return s.p[i].coord(s.d) < s.p[j].coord(s.d)
}
func (s kdPlane) Swap(i, j int) { s.p[i], s.p[j] = s.p[j], s.p[i] }
func (s kdPlane) Slice(start, end int) kdtree.SortSlicer {
	return kdPlane{s.p[start:end], s.d}
}
