package geo_test

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"strings"

	"github.com/paulmach/orb"

	"gwsat.dev/gwsat/geo"
)

// Converting a WGS84 position to UTM and back (PROJ's cs2cs gives
// 627103.087305, 4484335.401661 for this point). Well names, values and
// sites in these examples are invented.
func ExampleFromLonLat() {
	p := orb.Point{-73.5, 40.5} // [lon, lat]
	epsg := geo.UTMEPSG(p)
	x, y, err := geo.FromLonLat(p, epsg)
	if err != nil {
		fmt.Println(err)
		return
	}
	q, _ := geo.ToLonLat(x, y, epsg)
	fmt.Printf("EPSG:%d E %.3f N %.3f\n", epsg, x, y)
	fmt.Printf("back: %.9f %.9f\n", q[0], q[1])
	// Output:
	// EPSG:32618 E 627103.087 N 4484335.402
	// back: -73.500000000 40.500000000
}

func ExampleParseEPSG() {
	for _, code := range []int{32633, 32719, 26915, 3857} {
		c, err := geo.ParseEPSG(code)
		if err != nil {
			fmt.Println(err)
			continue
		}
		fmt.Println(c)
	}
	// Output:
	// EPSG:32633 (WGS 84 / UTM zone 33N)
	// EPSG:32719 (WGS 84 / UTM zone 19S)
	// EPSG:26915 (NAD83 (as WGS 84) / UTM zone 15N)
	// geo: unsupported EPSG code: 3857 (supported: 4326, 4269, 32601-32660, 32701-32760, 26901-26923)
}

// Geodesic distance between two wells on the WGS84 ellipsoid (PROJ's geod
// gives 1096.4357 m for this pair).
func ExampleDistance() {
	a := orb.Point{-101.1500, 31.9000}
	b := orb.Point{-101.1400, 31.9050}
	fmt.Printf("%.3f m\n", geo.Distance(a, b))
	// Output:
	// 1096.436 m
}

// Flagging impossible coordinates before mapping.
func ExampleValidLonLat() {
	for _, p := range []orb.Point{{-101.15, 31.9}, {0, 0}, {-101.15, 131.9}} {
		fmt.Println(p, geo.ValidLonLat(p))
	}
	// Output:
	// [-101.15 31.9] <nil>
	// [0 0] geo: coordinate (0, 0) is almost certainly a missing value
	// [-101.15 131.9] geo: latitude outside [-90, 90]: lat 131.9
}

// A local frame in metres centred on the wells, then an IDW surface of
// saturation indices with its leave-one-out error.
func ExampleInterpolateIDW() {
	wells := []orb.Point{{-101.150, 31.900}, {-101.140, 31.905}, {-101.145, 31.895}, {-101.135, 31.898}}
	si := []float64{0.42, -0.10, 0.15, -0.31}
	frame := geo.NewLocalFrame(wells)
	xy := make([]orb.Point, len(wells))
	for i, w := range wells {
		xy[i] = frame.Forward(w)
	}
	s, err := geo.InterpolateIDW(xy, si, geo.GridOptions{NX: 40, NY: 30}, geo.IDWOptions{})
	if err != nil {
		fmt.Println(err)
		return
	}
	lo, hi, _ := s.Range()
	fmt.Println(s.Method)
	fmt.Printf("cells %dx%d, %d with estimates, SI %.2f..%.2f\n", s.NX, s.NY, s.Count(), lo, hi)
	fmt.Printf("LOO RMSE %.3f\n", s.CVRMSE)
	// Output:
	// IDW (power 2)
	// cells 40x30, 724 with estimates, SI -0.31..0.42
	// LOO RMSE 0.291
}

// Ordinary kriging with a given variogram.
func ExampleInterpolateKriging() {
	xy := []orb.Point{{0, 0}, {400, 0}, {0, 400}, {400, 400}, {200, 200}}
	si := []float64{0.1, 0.3, -0.2, 0.0, 0.6}
	v := geo.Variogram{Model: geo.Spherical, Sill: 0.08, Range: 500}
	s, err := geo.InterpolateKriging(xy, si, geo.GridOptions{NX: 20, NY: 20}, geo.KrigingOptions{Variogram: &v})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(s.Method)
	fmt.Printf("LOO RMSE %.3f\n", s.CVRMSE)
	// Output:
	// ordinary kriging, spherical (nugget 0, sill 0.08, range 500 m)
	// LOO RMSE 0.358
}

// Samples as GeoJSON points for a GIS, properties in the order given.
func ExampleWriteSamples() {
	err := geo.WriteSamples(os.Stdout, []geo.PointFeature{
		{ID: "MW-1", Point: orb.Point{-101.15012345, 31.9000049}, Props: []geo.Prop{
			{Key: "qa", Value: "ok"}, {Key: "calcite_si", Value: 0.42}, {Key: "depth_m", Value: 12.5}}},
	})
	if err != nil {
		fmt.Println(err)
	}
	// Output:
	// {"type":"FeatureCollection","features":[
	// {"type":"Feature","id":"MW-1","geometry":{"type":"Point","coordinates":[-101.150123,31.900005]},"properties":{"qa":"ok","calcite_si":0.42,"depth_m":12.5}}
	// ]}
}

func ExampleReadSiteFeatures() {
	site := `{"type":"FeatureCollection","features":[
	 {"type":"Feature","properties":{"kind":"boundary","name":"Invented site"},
	  "geometry":{"type":"Polygon","coordinates":[[[-101.16,31.89],[-101.13,31.89],[-101.13,31.91],[-101.16,31.91],[-101.16,31.89]]]}},
	 {"type":"Feature","properties":{"kind":"injection_well","name":"IW-1"},
	  "geometry":{"type":"Point","coordinates":[-101.145,31.9]}}]}`
	fs, err := geo.ReadSiteFeatures(strings.NewReader(site))
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, f := range fs {
		fmt.Println(f.Index, f.Kind, f.Name, f.Geometry.GeoJSONType())
	}
	// Output:
	// 0 boundary Invented site Polygon
	// 1 injection_well IW-1 Point
}

// A 2 x 2 grid in UTM zone 33N (EPSG:32633) written as a float32 GeoTIFF;
// the empty cell holds the no-data value.
func ExampleWriteGeoTIFF() {
	g := &geo.Grid{X0: 500050, Y0: 4200050, DX: 100, DY: 100, NX: 2, NY: 2,
		Values: []float64{0.4, -0.2, math.NaN(), 0.1}, Mask: []bool{true, true, false, true}}
	r := geo.RasterFromGrid(g, 32633)
	fmt.Printf("west %.0f north %.0f, %d x %d cells of %.0f m\n", r.West, r.North, r.Cols, r.Rows, r.PixelW)
	var buf bytes.Buffer
	if err := geo.WriteGeoTIFF(&buf, r); err != nil {
		fmt.Println(err)
		return
	}
	// 8-byte header, 15 tags, their values, then 4 cells of 4 bytes.
	fmt.Println(buf.Len() > 8+2+15*12+4+16, string(buf.Bytes()[:2]))
	// Output:
	// west 500000 north 4200200, 2 x 2 cells of 100 m
	// true II
}
