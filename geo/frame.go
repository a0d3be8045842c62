package geo

import (
	"math"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/project"
)

// LocalFrame is a planar frame in metres chosen from the data: a transverse
// Mercator projection on WGS84 with its central meridian and latitude of
// origin at the centroid of the points and unit scale there, so x is metres
// east and y metres north of the centroid. Over a well field (a few tens of
// kilometres) scale error is below 1e-5 (k = 1 + x^2/(2R^2), Snyder 1987,
// eq. 8-11 for the sphere, `from memory`); distances in the frame are then
// good to 1 cm per km.
type LocalFrame struct {
	Centre orb.Point // [lon, lat] of the origin
	tm     *TransverseMercator
}

// NewLocalFrame builds the frame for a set of WGS84 points. Points failing
// ValidLonLat are ignored when choosing the centre; with no valid point the
// frame is centred on (0, 0). Longitudes are unwrapped around the first valid
// point so a field straddling the antimeridian gets a sensible centre.
func NewLocalFrame(points []orb.Point) LocalFrame {
	var sx, sy float64
	var n int
	var ref float64
	for _, p := range points {
		if ValidLonLat(p) != nil {
			continue
		}
		if n == 0 {
			ref = p[0]
		}
		sx += ref + math.Remainder(p[0]-ref, 360)
		sy += p[1]
		n++
	}
	c := orb.Point{}
	if n > 0 {
		c = orb.Point{math.Remainder(sx/float64(n), 360), sy / float64(n)}
	}
	// Keep the origin off the poles, where the latitude of origin is
	// degenerate for a transverse Mercator.
	c[1] = math.Max(-89.9, math.Min(89.9, c[1]))
	tm, err := NewTransverseMercator(WGS84(), c[0], c[1], 1, 0, 0)
	if err != nil {
		panic(err) // unreachable: centre is finite and in range
	}
	return LocalFrame{Centre: c, tm: tm}
}

// Forward maps [lon, lat] to [x, y] metres in the frame. It has the shape of
// an orb.Projection. Points the projection cannot map (more than 90 degrees
// of longitude away, NaN) map to [NaN, NaN]; check with ValidLonLat first.
func (f LocalFrame) Forward(p orb.Point) orb.Point {
	if f.tm == nil {
		return orb.Point{math.NaN(), math.NaN()}
	}
	x, y, err := f.tm.Forward(p[0], p[1])
	if err != nil {
		return orb.Point{math.NaN(), math.NaN()}
	}
	return orb.Point{x, y}
}

// Inverse maps [x, y] metres in the frame back to [lon, lat]. It has the
// shape of an orb.Projection; failures give [NaN, NaN].
func (f LocalFrame) Inverse(p orb.Point) orb.Point {
	if f.tm == nil {
		return orb.Point{math.NaN(), math.NaN()}
	}
	lon, lat, err := f.tm.Inverse(p[0], p[1])
	if err != nil {
		return orb.Point{math.NaN(), math.NaN()}
	}
	return orb.Point{lon, lat}
}

// Projection returns the frame's transverse Mercator projection.
func (f LocalFrame) Projection() *TransverseMercator { return f.tm }

// ProjectGeometry returns a copy of a [lon, lat] geometry (e.g. a site
// feature) in the frame's metres; g itself is left unchanged.
func (f LocalFrame) ProjectGeometry(g orb.Geometry) orb.Geometry {
	if g == nil {
		return nil
	}
	return project.Geometry(orb.Clone(g), f.Forward)
}

// PlaceInFrame checks sample positions with ValidLonLat, builds a
// LocalFrame from the usable ones and projects them. For each input,
// flags[i] is nil and xy[i] holds metres when the position is usable;
// otherwise flags[i] says why and xy[i] is the zero point, to be left off
// maps and counted in captions.
func PlaceInFrame(points []orb.Point) (frame LocalFrame, xy []orb.Point, flags []error) {
	frame = NewLocalFrame(points)
	xy = make([]orb.Point, len(points))
	flags = make([]error, len(points))
	for i, p := range points {
		if err := ValidLonLat(p); err != nil {
			flags[i] = err
			continue
		}
		q := frame.Forward(p)
		if !finite(q[0]) || !finite(q[1]) {
			flags[i] = ErrProjection
			continue
		}
		xy[i] = q
	}
	return frame, xy, flags
}
