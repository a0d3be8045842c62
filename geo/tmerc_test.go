package geo

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"os/exec"
	"strconv"
	"strings"
	"testing"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/project"
)

// Snyder (1987), Map Projections: A Working Manual, USGS Professional Paper
// 1395, numerical example for the ellipsoidal transverse Mercator (Clarke
// 1866, phi 40.5 N, lambda 73.5 W, lambda0 75 W, k0 0.9996): x = 127 106.5 m,
// y = 4 484 124.4 m. `from memory`; the printed values carry 0.1 m, so the
// tolerance is half of that.
func TestSnyderTransverseMercatorExample(t *testing.T) {
	tm, err := NewTransverseMercator(Clarke1866(), -75, 0, 0.9996, 0, 0)
	if err != nil {
		t.Fatal(err)
	}
	const wantX, wantY, tol = 127106.5, 4484124.4, 0.05
	x, y, err := tm.Forward(-73.5, 40.5)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(x-wantX) > tol || math.Abs(y-wantY) > tol {
		t.Errorf("forward = (%.4f, %.4f), want (%.1f, %.1f) within %g m", x, y, wantX, wantY, tol)
	}
	lon, lat, err := tm.Inverse(wantX, wantY)
	if err != nil {
		t.Fatal(err)
	}
	// 0.05 m is about 4.5e-7 degree of latitude and 6e-7 degree of longitude here.
	if math.Abs(lat-40.5) > 5e-7 || math.Abs(lon+73.5) > 7e-7 {
		t.Errorf("inverse = (%.9f, %.9f), want (-73.5, 40.5)", lon, lat)
	}
}

// Round trip across a zone: forward then inverse returns the point to 1 mm,
// and inverse then forward returns the coordinates to 1 mm.
func TestTransverseMercatorRoundTrip(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	for k := 0; k < 2000; k++ {
		zone := 1 + r.IntN(60)
		south := r.IntN(2) == 1
		c := CRS{Zone: zone, South: south}
		tm := c.Projection()
		lat := -80 + 164*r.Float64()
		if south != (lat < 0) {
			lat = -lat
		}
		if lat > 84 {
			lat = 84
		}
		lon := tm.Lon0 + (2*r.Float64()-1)*3.5
		x, y, err := tm.Forward(lon, lat)
		if err != nil {
			t.Fatal(err)
		}
		lon2, lat2, err := tm.Inverse(x, y)
		if err != nil {
			t.Fatal(err)
		}
		d := Distance(orb.Point{lon, lat}, orb.Point{lon2, lat2})
		if d > 1e-3 {
			t.Fatalf("zone %d: (%v, %v) -> (%v, %v) -> (%v, %v), %g m apart", zone, lon, lat, x, y, lon2, lat2, d)
		}
		x2, y2, _ := tm.Forward(lon2, lat2)
		if math.Hypot(x2-x, y2-y) > 1e-3 {
			t.Fatalf("zone %d: coordinates moved by %g m", zone, math.Hypot(x2-x, y2-y))
		}
	}
}

// Compare with PROJ's cs2cs (Debian proj-bin), which implements Karney's
// (2011) extended transverse Mercator for UTM, on 300 seeded random points
// in 10 zones of both hemispheres, to 1 mm both ways.
func TestUTMAgainstCs2cs(t *testing.T) {
	cs2cs, err := exec.LookPath("cs2cs")
	if err != nil {
		t.Skip("cs2cs not found (install Debian proj-bin); skipping comparison with PROJ")
	}
	r := rand.New(rand.NewPCG(7, 11))
	var worst float64
	defer func() { t.Logf("largest difference from cs2cs: %.3g m", worst) }()
	for _, code := range []int{32601, 32618, 32631, 32633, 32655, 32660, 32705, 32719, 32734, 32756} {
		c, _ := ParseEPSG(code)
		lon0 := float64(6*c.Zone - 183)
		var in bytes.Buffer
		var pts []orb.Point
		for k := 0; k < 30; k++ {
			lat := 80 * r.Float64()
			if c.South {
				lat = -lat
			}
			p := orb.Point{lon0 + (2*r.Float64()-1)*3.5, lat}
			p[0] = math.Remainder(p[0], 360)
			pts = append(pts, p)
			fmt.Fprintf(&in, "%.10f %.10f\n", p[1], p[0]) // EPSG:4326 axis order is lat, lon
		}
		cmd := exec.Command(cs2cs, "-f", "%.6f", "EPSG:4326", fmt.Sprintf("EPSG:%d", code))
		cmd.Stdin = &in
		out, err := cmd.Output()
		if err != nil {
			t.Skipf("cs2cs failed (%v); skipping", err)
		}
		lines := strings.Split(strings.TrimSpace(string(out)), "\n")
		if len(lines) != len(pts) {
			t.Fatalf("cs2cs returned %d lines for %d points", len(lines), len(pts))
		}
		for k, line := range lines {
			f := strings.Fields(line)
			wx, _ := strconv.ParseFloat(f[0], 64)
			wy, _ := strconv.ParseFloat(f[1], 64)
			x, y, err := FromLonLat(pts[k], code)
			if err != nil {
				t.Fatal(err)
			}
			worst = math.Max(worst, math.Max(math.Abs(x-wx), math.Abs(y-wy)))
			if math.Abs(x-wx) > 1e-3 || math.Abs(y-wy) > 1e-3 {
				t.Errorf("EPSG:%d %v: got (%.4f, %.4f), cs2cs (%.4f, %.4f)", code, pts[k], x, y, wx, wy)
			}
			p, err := ToLonLat(wx, wy, code)
			if err != nil {
				t.Fatal(err)
			}
			if d := Distance(p, pts[k]); d > 1e-3 {
				t.Errorf("EPSG:%d inverse of cs2cs output is %g m from %v", code, d, pts[k])
			}
		}
	}
}

func TestParseEPSG(t *testing.T) {
	tests := []struct {
		code       int
		zone       int
		south, geo bool
		nad        bool
		ok         bool
	}{
		{4326, 0, false, true, false, true},
		{4269, 0, false, true, true, true},
		{32601, 1, false, false, false, true},
		{32660, 60, false, false, false, true},
		{32733, 33, true, false, false, true},
		{26915, 15, false, false, true, true},
		{32661, 0, false, false, false, false}, // UPS north, not handled
		{3857, 0, false, false, false, false},
		{26960, 0, false, false, false, false},
	}
	for _, tc := range tests {
		c, err := ParseEPSG(tc.code)
		if (err == nil) != tc.ok {
			t.Errorf("ParseEPSG(%d) err = %v, want ok=%v", tc.code, err, tc.ok)
			continue
		}
		if !tc.ok {
			if !errors.Is(err, ErrUnsupportedCRS) {
				t.Errorf("ParseEPSG(%d): error %v does not wrap ErrUnsupportedCRS", tc.code, err)
			}
			continue
		}
		if c.Zone != tc.zone || c.South != tc.south || c.Geographic != tc.geo || c.NAD83 != tc.nad {
			t.Errorf("ParseEPSG(%d) = %+v", tc.code, c)
		}
	}
}

// Zone numbers from the UTM definition: zone = floor((lon+180)/6)+1, with
// the Norway (32V) and Svalbard exceptions (NIMA TM8358.2, `from memory`).
func TestUTMZone(t *testing.T) {
	tests := []struct {
		lon, lat float64
		zone     int
		south    bool
	}{
		{-74.0, 40.7, 18, false}, // New York
		{151.2, -33.9, 56, true}, // Sydney
		{-180, 10, 1, false},     // west edge of zone 1
		{180, 10, 1, false},      // 180 is the same meridian as -180
		{179.99, -10, 60, true},  // east edge of zone 60
		{5.3, 60.4, 32, false},   // Bergen: Norway exception (would be 31)
		{2.0, 60.4, 31, false},   // west of 3 E stays 31
		{15.6, 78.2, 33, false},  // Svalbard
		{10.0, 78.2, 33, false},  // 9-21 E is zone 33 at these latitudes
		{0.0, -0.0001, 31, true}, // just south of the equator
		{-0.0001, 0.0001, 30, false},
	}
	for _, tc := range tests {
		z, s := UTMZone(tc.lon, tc.lat)
		if z != tc.zone || s != tc.south {
			t.Errorf("UTMZone(%v, %v) = %d, %v; want %d, %v", tc.lon, tc.lat, z, s, tc.zone, tc.south)
		}
	}
}

func TestConversionErrors(t *testing.T) {
	if _, _, err := FromLonLat(orb.Point{math.NaN(), 1}, 32633); !errors.Is(err, ErrCoordNotFinite) {
		t.Errorf("NaN lon: err = %v", err)
	}
	if _, _, err := FromLonLat(orb.Point{10, 95}, 32633); !errors.Is(err, ErrLatRange) {
		t.Errorf("lat 95: err = %v", err)
	}
	if _, _, err := FromLonLat(orb.Point{10, 45}, 3857); !errors.Is(err, ErrUnsupportedCRS) {
		t.Errorf("EPSG:3857: err = %v", err)
	}
	if _, err := ToLonLat(math.Inf(1), 0, 32633); err == nil {
		t.Error("ToLonLat(+Inf) gave no error")
	}
	if _, err := ToLonLat(500000, 1e8, 32633); err == nil {
		t.Error("ToLonLat(northing 1e8 m) gave no error")
	}
	// A NAD83 code gives the WGS84 numbers (the stated simplification).
	x1, y1, _ := FromLonLat(orb.Point{-93.5, 45}, 26915)
	x2, y2, _ := FromLonLat(orb.Point{-93.5, 45}, 32615)
	if x1 != x2 || y1 != y2 {
		t.Errorf("EPSG:26915 and 32615 differ: (%v,%v) vs (%v,%v)", x1, y1, x2, y2)
	}
}

func TestValidLonLat(t *testing.T) {
	tests := []struct {
		p    orb.Point
		want error
	}{
		{orb.Point{10, 45}, nil},
		{orb.Point{-180, -90}, nil},
		{orb.Point{0, 0}, ErrNullIsland},
		{orb.Point{math.NaN(), 10}, ErrCoordNotFinite},
		{orb.Point{10, math.Inf(-1)}, ErrCoordNotFinite},
		{orb.Point{10, 90.5}, ErrLatRange},
		{orb.Point{180.1, 10}, ErrLonRange},
	}
	for _, tc := range tests {
		err := ValidLonLat(tc.p)
		if tc.want == nil && err != nil || tc.want != nil && !errors.Is(err, tc.want) {
			t.Errorf("ValidLonLat(%v) = %v, want %v", tc.p, err, tc.want)
		}
	}
}

// The local frame is centred on the data, measures metres, and its planar
// distances agree with ellipsoidal geodesic distances over a well field to
// within the scale error of a transverse Mercator (< 1e-5 relative within
// 20 km of the centre; Snyder 1987, eq. 8-11 sphere, `from memory`).
func TestLocalFrame(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 4))
	pts := make([]orb.Point, 50)
	for i := range pts {
		pts[i] = orb.Point{-101.9 + 0.2*r.Float64(), 31.8 + 0.15*r.Float64()}
	}
	pts = append(pts, orb.Point{0, 0}, orb.Point{math.NaN(), 1}) // ignored
	f := NewLocalFrame(pts)
	if math.Abs(f.Centre[0]+101.8) > 0.05 || math.Abs(f.Centre[1]-31.875) > 0.05 {
		t.Errorf("centre %v is not near the data", f.Centre)
	}
	c := f.Forward(f.Centre)
	if math.Abs(c[0]) > 1e-9 || math.Abs(c[1]) > 1e-9 {
		t.Errorf("centre maps to %v, want origin", c)
	}
	for i := 0; i+1 < 50; i++ {
		a, b := f.Forward(pts[i]), f.Forward(pts[i+1])
		planar := math.Hypot(a[0]-b[0], a[1]-b[1])
		geod := Distance(pts[i], pts[i+1])
		if math.Abs(planar-geod) > 1e-5*geod+1e-6 {
			t.Errorf("pair %d: planar %.4f m vs geodesic %.4f m", i, planar, geod)
		}
		back := f.Inverse(a)
		if d := Distance(back, pts[i]); d > 1e-6 {
			t.Errorf("round trip moved %v by %g m", pts[i], d)
		}
	}
	// Forward has the shape of an orb.Projection: orb's helpers accept it.
	ls := orb.LineString{pts[0], pts[1]}
	got := project.LineString(append(orb.LineString{}, ls...), f.Forward)
	if got[1] != f.Forward(pts[1]) {
		t.Errorf("orb project helper gave %v", got)
	}
	pg := f.ProjectGeometry(ls).(orb.LineString)
	if pg[0] != f.Forward(pts[0]) || ls[0] != pts[0] {
		t.Errorf("ProjectGeometry gave %v and changed its input to %v", pg, ls)
	}
	// Antimeridian: centre stays near 180, not near 0.
	g := NewLocalFrame([]orb.Point{{179.9, -17}, {-179.9, -17.1}, {179.95, -17.2}})
	if math.Abs(math.Abs(g.Centre[0])-180) > 0.1 {
		t.Errorf("antimeridian centre %v", g.Centre)
	}
}
