package geo

import (
	"errors"
	"fmt"
	"math"

	"github.com/paulmach/orb"
)

// ErrUnsupportedCRS reports an EPSG code this package does not handle.
var ErrUnsupportedCRS = errors.New("geo: unsupported EPSG code")

// CRS describes one of the coordinate reference systems the package handles:
// geographic WGS84 (EPSG:4326) or NAD83 (EPSG:4269), and UTM zones on WGS84
// north (EPSG:32601-32660) and south (EPSG:32701-32760) and on NAD83 north
// (EPSG:26901-26923).
//
// NAD83 is treated as WGS84: the datums differ by up to about 1-2 m in North
// America (a plate-motion-dependent offset), which this package ignores. The
// GRS80 and WGS84 ellipsoids differ by 0.1 mm in the semi-minor axis, which
// is also ignored. Good enough for mapping a well field, not for surveying.
type CRS struct {
	EPSG       int
	Geographic bool // true for 4326 and 4269
	Zone       int  // UTM zone 1-60, 0 when Geographic
	South      bool // southern-hemisphere UTM (false northing 10 000 km)
	NAD83      bool // NAD83 code, treated as WGS84
}

// String names the system, e.g. "EPSG:32633 (WGS 84 / UTM zone 33N)".
func (c CRS) String() string {
	datum := "WGS 84"
	if c.NAD83 {
		datum = "NAD83 (as WGS 84)"
	}
	if c.Geographic {
		return fmt.Sprintf("EPSG:%d (%s geographic)", c.EPSG, datum)
	}
	h := "N"
	if c.South {
		h = "S"
	}
	return fmt.Sprintf("EPSG:%d (%s / UTM zone %d%s)", c.EPSG, datum, c.Zone, h)
}

// ParseEPSG returns the CRS for an EPSG code, or an error wrapping
// ErrUnsupportedCRS.
func ParseEPSG(code int) (CRS, error) {
	switch {
	case code == 4326:
		return CRS{EPSG: code, Geographic: true}, nil
	case code == 4269:
		return CRS{EPSG: code, Geographic: true, NAD83: true}, nil
	case code >= 32601 && code <= 32660:
		return CRS{EPSG: code, Zone: code - 32600}, nil
	case code >= 32701 && code <= 32760:
		return CRS{EPSG: code, Zone: code - 32700, South: true}, nil
	case code >= 26901 && code <= 26923:
		return CRS{EPSG: code, Zone: code - 26900, NAD83: true}, nil
	}
	return CRS{}, fmt.Errorf("%w: %d (supported: 4326, 4269, 32601-32660, 32701-32760, 26901-26923)", ErrUnsupportedCRS, code)
}

// utmCache holds one projection per zone and hemisphere; they are immutable.
var utmCache [61][2]*TransverseMercator

func init() {
	for z := 1; z <= 60; z++ {
		for h := 0; h < 2; h++ {
			fn := 0.0
			if h == 1 {
				fn = 10000000
			}
			// UTM definition: central meridian 6z-183, k0 0.9996, false
			// easting 500 km, false northing 0 (north) or 10 000 km (south);
			// NIMA TM8358.2 (1989) `from memory`, standard values.
			t, err := NewTransverseMercator(WGS84(), float64(6*z-183), 0, 0.9996, 500000, fn)
			if err != nil {
				panic(err)
			}
			utmCache[z][h] = t
		}
	}
}

// Projection returns the transverse Mercator projection of a UTM CRS, or
// nil for a geographic one.
func (c CRS) Projection() *TransverseMercator {
	if c.Geographic || c.Zone < 1 || c.Zone > 60 {
		return nil
	}
	h := 0
	if c.South {
		h = 1
	}
	return utmCache[c.Zone][h]
}

// FromLonLat converts a WGS84 point [lon, lat] to coordinates in the CRS
// given by its EPSG code: easting and northing in metres for UTM, or lon
// and lat unchanged for a geographic code. (0, 0) converts like any point;
// flag it with ValidLonLat. Points outside the zone are still projected
// (accurate to well under 1 mm within about 4000 km of the central
// meridian, Karney 2011); beyond 90 degrees of longitude they are an error.
func FromLonLat(p orb.Point, epsg int) (x, y float64, err error) {
	c, err := ParseEPSG(epsg)
	if err != nil {
		return 0, 0, err
	}
	if err := ValidLonLat(p); err != nil && !errors.Is(err, ErrNullIsland) {
		return 0, 0, err
	}
	if c.Geographic {
		return p[0], p[1], nil
	}
	return c.Projection().Forward(p[0], p[1])
}

// ToLonLat converts coordinates in the CRS given by its EPSG code to a WGS84
// point [lon, lat].
func ToLonLat(x, y float64, epsg int) (orb.Point, error) {
	c, err := ParseEPSG(epsg)
	if err != nil {
		return orb.Point{}, err
	}
	if c.Geographic {
		p := orb.Point{x, y}
		if err := ValidLonLat(p); err != nil && !errors.Is(err, ErrNullIsland) {
			return orb.Point{}, err
		}
		return p, nil
	}
	lon, lat, err := c.Projection().Inverse(x, y)
	if err != nil {
		return orb.Point{}, fmt.Errorf("geo: easting %v northing %v in %v: %w", x, y, c, err)
	}
	return orb.Point{lon, lat}, nil
}

// UTMZone returns the UTM zone (1-60) and hemisphere for a WGS84 position,
// including the Norway (32V) and Svalbard (31X-37X) exceptions of the UTM
// grid definition (NIMA TM8358.2, `from memory`).
func UTMZone(lon, lat float64) (zone int, south bool) {
	lon = math.Remainder(lon, 360)
	if lon == 180 {
		lon = -180
	}
	zone = int(math.Floor((lon+180)/6)) + 1
	if zone > 60 {
		zone = 60
	}
	if lat >= 56 && lat < 64 && lon >= 3 && lon < 12 {
		zone = 32
	}
	if lat >= 72 && lat <= 84 && lon >= 0 && lon < 42 {
		switch {
		case lon < 9:
			zone = 31
		case lon < 21:
			zone = 33
		case lon < 33:
			zone = 35
		default:
			zone = 37
		}
	}
	return zone, lat < 0
}

// UTMEPSG returns the WGS84 UTM EPSG code (326zz or 327zz) for a position.
func UTMEPSG(p orb.Point) int {
	z, s := UTMZone(p[0], p[1])
	if s {
		return 32700 + z
	}
	return 32600 + z
}
