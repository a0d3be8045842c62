package geo

import (
	"math"
	"sort"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/planar"
)

// ConvexHull returns the convex hull of planar points as a closed,
// counter-clockwise orb.Ring (first point repeated at the end), by Andrew's
// monotone chain (Andrew 1979, "Another efficient algorithm for convex hulls
// in two dimensions", Inf. Process. Lett. 9, 216-219). Collinear points on
// the hull are dropped. For fewer than three non-collinear points the ring
// degenerates to the distinct extreme points (a segment or a single point),
// still closed.
func ConvexHull(points []orb.Point) orb.Ring {
	pts := make([]orb.Point, 0, len(points))
	for _, p := range points {
		if finite(p[0]) && finite(p[1]) {
			pts = append(pts, p)
		}
	}
	if len(pts) == 0 {
		return nil
	}
	sort.Slice(pts, func(i, j int) bool {
		if pts[i][0] != pts[j][0] {
			return pts[i][0] < pts[j][0]
		}
		return pts[i][1] < pts[j][1]
	})
	// Remove exact duplicates.
	u := pts[:1]
	for _, p := range pts[1:] {
		if p != u[len(u)-1] {
			u = append(u, p)
		}
	}
	pts = u
	if len(pts) == 1 {
		return orb.Ring{pts[0], pts[0]}
	}
	cross := func(o, a, b orb.Point) float64 {
		return (a[0]-o[0])*(b[1]-o[1]) - (a[1]-o[1])*(b[0]-o[0])
	}
	h := make([]orb.Point, 0, 2*len(pts))
	for _, p := range pts { // lower hull
		for len(h) >= 2 && cross(h[len(h)-2], h[len(h)-1], p) <= 0 {
			h = h[:len(h)-1]
		}
		h = append(h, p)
	}
	lower := len(h) + 1
	for i := len(pts) - 2; i >= 0; i-- { // upper hull
		p := pts[i]
		for len(h) >= lower && cross(h[len(h)-2], h[len(h)-1], p) <= 0 {
			h = h[:len(h)-1]
		}
		h = append(h, p)
	}
	// h now ends with pts[0], closing the ring.
	return orb.Ring(h)
}

// hullRegion is the convex hull of the wells grown by a buffer distance: a
// point belongs to it if it lies inside the hull or within buffer metres of
// the hull's boundary.
type hullRegion struct {
	ring   orb.Ring
	buffer float64
	area   bool      // ring encloses a positive area
	outer  orb.Bound // ring's bound grown by the buffer
}

func newHullRegion(ring orb.Ring, buffer float64) hullRegion {
	b := ring.Bound()
	b.Min = orb.Point{b.Min[0] - buffer, b.Min[1] - buffer}
	b.Max = orb.Point{b.Max[0] + buffer, b.Max[1] + buffer}
	return hullRegion{ring: ring, buffer: buffer, outer: b,
		area: len(ring) >= 4 && math.Abs(planar.Area(ring)) > 0}
}

func (h hullRegion) contains(p orb.Point) bool {
	if !h.outer.Contains(p) {
		return false
	}
	if h.area && planar.RingContains(h.ring, p) {
		return true
	}
	b2 := h.buffer * h.buffer
	for i := 0; i+1 < len(h.ring); i++ {
		if segDist2(p, h.ring[i], h.ring[i+1]) <= b2 {
			return true
		}
	}
	return false
}

// segDist2 is the squared distance from p to segment ab.
func segDist2(p, a, b orb.Point) float64 {
	dx, dy := b[0]-a[0], b[1]-a[1]
	t := 0.0
	if l2 := dx*dx + dy*dy; l2 > 0 {
		t = ((p[0]-a[0])*dx + (p[1]-a[1])*dy) / l2
		t = math.Max(0, math.Min(1, t))
	}
	ex, ey := p[0]-(a[0]+t*dx), p[1]-(a[1]+t*dy)
	return ex*ex + ey*ey
}
