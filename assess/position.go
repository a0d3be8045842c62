package assess

import (
	"errors"

	"github.com/paulmach/orb"

	"gwsat.dev/gwsat/geo"
	"gwsat.dev/gwsat/hydro"
)

// Position returns a sample's position in WGS84 longitude and latitude:
// latitude/longitude as reported, or easting/northing converted from their
// EPSG code. The error says why a sample cannot be placed.
func Position(s *hydro.Sample) (orb.Point, error) {
	switch {
	case s.Lat.OK && s.Lon.OK:
		p := orb.Point{s.Lon.V, s.Lat.V}
		if err := geo.ValidLonLat(p); err != nil {
			return p, err
		}
		return p, nil
	case s.Easting.OK && s.Northing.OK:
		if s.EPSG == 0 {
			return orb.Point{}, errors.New("easting/northing without an EPSG code (give --epsg)")
		}
		p, err := geo.ToLonLat(s.Easting.V, s.Northing.V, s.EPSG)
		if err != nil {
			return p, err
		}
		return p, geo.ValidLonLat(p)
	}
	return orb.Point{}, errors.New("no coordinates")
}

// DepthM returns the sample depth below ground: the reported sample depth,
// else the middle of the screen, and false when neither is known.
func DepthM(s *hydro.Sample) (float64, bool) {
	if s.DepthM.OK {
		return s.DepthM.V, true
	}
	if s.ScreenTopM.OK && s.ScreenBottomM.OK {
		return (s.ScreenTopM.V + s.ScreenBottomM.V) / 2, true
	}
	if s.ScreenTopM.OK {
		return s.ScreenTopM.V, true
	}
	return 0, false
}

// checkPosition warns when coordinates were reported but cannot be placed
// (out of range, the (0, 0) of blank cells, easting/northing without an EPSG
// code): such rows stay in every table and are left off maps. Rows with no
// coordinates at all are not flagged, nor a half pair (the reader already
// warned about the other coordinate).
func checkPosition(r *Record) {
	s := r.Sample()
	if !(s.Lat.OK && s.Lon.OK || s.Easting.OK && s.Northing.OK) {
		return
	}
	if _, err := Position(s); err != nil {
		r.Note(hydro.Warning, CodePosition, "position not usable (%v): left off maps", err)
	}
}
