package geo

import "math"

// Ellipsoid is a reference ellipsoid of revolution given by its semi-major
// axis A (metres) and flattening F.
type Ellipsoid struct {
	Name string
	A    float64 // semi-major axis, metres
	F    float64 // flattening (a-b)/a
}

// Reference ellipsoids. Defining constants: WGS84 from NIMA TR8350.2 (2000);
// GRS80 from Moritz (1980), Bulletin Geodesique 54; Clarke 1866 as listed in
// Snyder (1987), USGS PP 1395, table 1; Bessel 1841 and International 1924
// as used by Vincenty (1975), Survey Review 23(176). All `from memory`, but
// each is also checked indirectly by the projection and geodesic tests.
// They are functions so that no caller can change them for every other.
func WGS84() Ellipsoid { return Ellipsoid{Name: "WGS84", A: 6378137, F: 1 / 298.257223563} }

// GRS80 is the Geodetic Reference System 1980 ellipsoid.
func GRS80() Ellipsoid { return Ellipsoid{Name: "GRS80", A: 6378137, F: 1 / 298.257222101} }

// Clarke1866 is the Clarke 1866 ellipsoid.
func Clarke1866() Ellipsoid {
	return Ellipsoid{Name: "Clarke 1866", A: 6378206.4, F: 1 - 6356583.8/6378206.4}
}

// Bessel1841 is the Bessel 1841 ellipsoid.
func Bessel1841() Ellipsoid {
	return Ellipsoid{Name: "Bessel 1841", A: 6377397.155, F: 1 / 299.1528128}
}

// International is the International 1924 (Hayford) ellipsoid.
func International() Ellipsoid {
	return Ellipsoid{Name: "International 1924", A: 6378388, F: 1 / 297.0}
}

// B returns the semi-minor axis in metres.
func (e Ellipsoid) B() float64 { return e.A * (1 - e.F) }

// E2 returns the square of the first eccentricity.
func (e Ellipsoid) E2() float64 { return e.F * (2 - e.F) }

// N returns the third flattening n = (a-b)/(a+b).
func (e Ellipsoid) N() float64 { return e.F / (2 - e.F) }

func (e Ellipsoid) valid() bool {
	return e.A > 0 && !math.IsInf(e.A, 0) && e.F >= 0 && e.F < 0.1
}
