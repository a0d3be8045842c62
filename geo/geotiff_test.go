package geo

import (
	"bytes"
	"encoding/binary"
	"encoding/json"
	"errors"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"testing"

	"github.com/paulmach/orb"
)

// tiffEntry is one decoded IFD entry: its type, count and raw value bytes.
type tiffEntry struct {
	typ   uint16
	count uint32
	data  []byte
}

// decodeTIFF reads the first IFD of a little-endian TIFF (TIFF 6.0 sec. 2).
func decodeTIFF(t *testing.T, b []byte) map[uint16]tiffEntry {
	t.Helper()
	if len(b) < 8 || string(b[:2]) != "II" || binary.LittleEndian.Uint16(b[2:]) != 42 {
		t.Fatalf("not a little-endian TIFF: % x", b[:min(8, len(b))])
	}
	off := binary.LittleEndian.Uint32(b[4:])
	n := int(binary.LittleEndian.Uint16(b[off:]))
	size := map[uint16]uint32{tiffASCII: 1, tiffShort: 2, tiffLong: 4, tiffDouble: 8}
	out := map[uint16]tiffEntry{}
	prev := uint16(0)
	for i := 0; i < n; i++ {
		e := b[int(off)+2+12*i:]
		tag, typ, count := binary.LittleEndian.Uint16(e), binary.LittleEndian.Uint16(e[2:]), binary.LittleEndian.Uint32(e[4:])
		if tag <= prev {
			t.Errorf("tag %d after %d: TIFF 6.0 wants ascending tags", tag, prev)
		}
		prev = tag
		nb := size[typ] * count
		data := e[8:12]
		if nb > 4 {
			vo := binary.LittleEndian.Uint32(e[8:])
			if vo%2 != 0 {
				t.Errorf("tag %d: value offset %d not on a word boundary", tag, vo)
			}
			data = b[vo : vo+nb]
		}
		out[tag] = tiffEntry{typ, count, data[:min(int(nb), len(data))]}
	}
	return out
}

func (e tiffEntry) u16(i int) uint16 { return binary.LittleEndian.Uint16(e.data[2*i:]) }
func (e tiffEntry) u32(i int) uint32 {
	if e.typ == tiffShort {
		return uint32(e.u16(i))
	}
	return binary.LittleEndian.Uint32(e.data[4*i:])
}
func (e tiffEntry) f64(i int) float64 {
	return math.Float64frombits(binary.LittleEndian.Uint64(e.data[8*i:]))
}

func testRaster() Raster {
	// 3 x 2 cells of 25 m in UTM 33N; the middle cell of the top row empty.
	return Raster{EPSG: 32633, West: 500000, North: 4200050, PixelW: 25, PixelH: 25, Cols: 3, Rows: 2,
		Values: []float64{0.5, math.NaN(), -1.25, 2, 0, -0.75},
		Mask:   []bool{true, false, true, true, true, true}}
}

func TestGeoTIFFTagsDecode(t *testing.T) {
	r := testRaster()
	var buf bytes.Buffer
	if err := WriteGeoTIFF(&buf, r); err != nil {
		t.Fatal(err)
	}
	b := buf.Bytes()
	tags := decodeTIFF(t, b)
	for _, c := range []struct {
		tag  uint16
		want uint32
	}{
		{tagImageWidth, 3}, {tagImageLength, 2}, {tagBitsPerSample, 32}, {tagCompression, 1},
		{tagSamplesPerPixel, 1}, {tagRowsPerStrip, 2}, {tagStripByteCounts, 24}, {tagSampleFormat, 3},
	} {
		e, ok := tags[c.tag]
		if !ok {
			t.Errorf("tag %d missing", c.tag)
			continue
		}
		if got := e.u32(0); got != c.want {
			t.Errorf("tag %d = %d, want %d", c.tag, got, c.want)
		}
	}
	scale, tie := tags[tagModelPixelScale], tags[tagModelTiepoint]
	if scale.f64(0) != 25 || scale.f64(1) != 25 {
		t.Errorf("pixel scale %v x %v, want 25 x 25", scale.f64(0), scale.f64(1))
	}
	if tie.f64(0) != 0 || tie.f64(1) != 0 || tie.f64(3) != 500000 || tie.f64(4) != 4200050 {
		t.Errorf("tie point raster (%v, %v) model (%v, %v), want (0, 0) -> (500000, 4200050)", tie.f64(0), tie.f64(1), tie.f64(3), tie.f64(4))
	}
	// GeoKeyDirectory: header 1.1.1 and the projected CRS key (OGC 19-008r4).
	gk := tags[tagGeoKeyDirectory]
	if gk.u16(0) != 1 || gk.u16(1) != 1 || gk.u16(2) != 1 {
		t.Errorf("GeoKey header %d.%d.%d, want 1.1.1", gk.u16(0), gk.u16(1), gk.u16(2))
	}
	keys := map[uint16]uint16{}
	for k := 0; k < int(gk.u16(3)); k++ {
		keys[gk.u16(4+4*k)] = gk.u16(4 + 4*k + 3)
	}
	if keys[keyModelType] != modelTypeProjected || keys[keyRasterType] != rasterPixelIsArea || keys[keyProjectedCRS] != 32633 {
		t.Errorf("GeoKeys %v", keys)
	}
	if nd := string(bytes.TrimRight(tags[tagGDALNoData].data, "\x00")); nd != "-9999" {
		t.Errorf("nodata %q", nd)
	}
	// Pixels: float32, row 0 first, the empty cell and no NaN.
	off := tags[tagStripOffsets].u32(0)
	want := []float32{0.5, GeoTIFFNoData, -1.25, 2, 0, -0.75}
	for k, w := range want {
		got := math.Float32frombits(binary.LittleEndian.Uint32(b[int(off)+4*k:]))
		if got != w {
			t.Errorf("pixel %d = %v, want %v", k, got, w)
		}
	}
}

func TestGeoTIFFRejects(t *testing.T) {
	for name, r := range map[string]Raster{
		"no cells":   {EPSG: 32633, PixelW: 1, PixelH: 1},
		"bad pixel":  {EPSG: 32633, Cols: 1, Rows: 1, Values: []float64{1}},
		"geographic": {EPSG: 4326, Cols: 1, Rows: 1, PixelW: 1, PixelH: 1, Values: []float64{1}},
		"short mask": {EPSG: 32633, Cols: 1, Rows: 1, PixelW: 1, PixelH: 1, Values: []float64{1}, Mask: []bool{}},
	} {
		if err := WriteGeoTIFF(&bytes.Buffer{}, r); err == nil {
			t.Errorf("%s: no error", name)
		} else if !errors.Is(err, ErrRaster) && !errors.Is(err, ErrUnsupportedCRS) {
			t.Errorf("%s: %v", name, err)
		}
	}
}

// gdalinfo (GDAL's own reader) sees the coordinate system, size and extent
// we wrote. Skipped where GDAL is not installed.
func TestGeoTIFFGdalinfo(t *testing.T) {
	bin, err := exec.LookPath("gdalinfo")
	if err != nil {
		t.Skip("gdalinfo not installed")
	}
	var buf bytes.Buffer
	if err := WriteGeoTIFF(&buf, testRaster()); err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(t.TempDir(), "r.tif")
	if err := os.WriteFile(path, buf.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	out, err := exec.Command(bin, "-json", path).Output()
	if err != nil {
		t.Fatalf("gdalinfo: %v", err)
	}
	var info struct {
		Size             []int `json:"size"`
		CoordinateSystem struct {
			WKT string `json:"wkt"`
		} `json:"coordinateSystem"`
		CornerCoordinates struct {
			UpperLeft  []float64 `json:"upperLeft"`
			LowerRight []float64 `json:"lowerRight"`
		} `json:"cornerCoordinates"`
		Bands []struct {
			Type         string   `json:"type"`
			NoDataValue  *float64 `json:"noDataValue"`
			ColorInterpr string   `json:"colorInterpretation"`
		} `json:"bands"`
	}
	if err := json.Unmarshal(out, &info); err != nil {
		t.Fatalf("gdalinfo output: %v", err)
	}
	if len(info.Size) != 2 || info.Size[0] != 3 || info.Size[1] != 2 {
		t.Errorf("size %v, want [3 2]", info.Size)
	}
	if !bytes.Contains([]byte(info.CoordinateSystem.WKT), []byte("UTM zone 33N")) || !bytes.Contains([]byte(info.CoordinateSystem.WKT), []byte(`"EPSG",32633`)) {
		t.Errorf("coordinate system %q", info.CoordinateSystem.WKT)
	}
	ul, lr := info.CornerCoordinates.UpperLeft, info.CornerCoordinates.LowerRight
	if len(ul) != 2 || len(lr) != 2 || ul[0] != 500000 || ul[1] != 4200050 || lr[0] != 500075 || lr[1] != 4200000 {
		t.Errorf("corners %v %v, want [500000 4200050] [500075 4200000]", ul, lr)
	}
	if len(info.Bands) != 1 || info.Bands[0].Type != "Float32" || info.Bands[0].NoDataValue == nil || *info.Bands[0].NoDataValue != GeoTIFFNoData {
		t.Errorf("bands %+v", info.Bands)
	}
}

// Resampling a local-frame grid into UTM keeps the values: each raster
// cell holds the value of the grid cell its centre falls in.
func TestResampleToCRS(t *testing.T) {
	frame := NewLocalFrame([]orb.Point{{15.2, 47.1}})
	g := &Grid{X0: -500, Y0: -500, DX: 50, DY: 50, NX: 21, NY: 21}
	g.Values = make([]float64, g.NX*g.NY)
	g.Mask = make([]bool, g.NX*g.NY)
	for j := 0; j < g.NY; j++ {
		for i := 0; i < g.NX; i++ {
			k := j*g.NX + i
			g.Values[k] = float64(i) + 100*float64(j) // cell id
			g.Mask[k] = i > 0                         // first column empty
		}
	}
	epsg := UTMEPSG(frame.Centre)
	r, err := ResampleToCRS(g, frame, epsg)
	if err != nil {
		t.Fatal(err)
	}
	tm := utmCache[33][0]
	n := 0
	for row := 0; row < r.Rows; row++ {
		for col := 0; col < r.Cols; col++ {
			k := row*r.Cols + col
			if !r.Mask[k] {
				continue
			}
			n++
			lon, lat, _ := tm.Inverse(r.West+(float64(col)+0.5)*r.PixelW, r.North-(float64(row)+0.5)*r.PixelH)
			q := frame.Forward(orb.Point{lon, lat})
			i, j := int(math.Round((q[0]-g.X0)/g.DX)), int(math.Round((q[1]-g.Y0)/g.DY))
			if want := float64(i) + 100*float64(j); r.Values[k] != want || i == 0 {
				t.Fatalf("cell (%d, %d) = %v, want grid cell (%d, %d) = %v", col, row, r.Values[k], i, j, want)
			}
		}
	}
	// About as many filled cells as the grid holds (20 x 21), give or take
	// the rotation of the frames against each other.
	if n < 380 || n > 460 {
		t.Errorf("%d filled cells, want about 420", n)
	}
}

// The zero line of z = x - c lies on x = c; the band |z| <= 1 covers the
// columns within 1 of c, one rectangle per row.
func TestIsolinesAndBand(t *testing.T) {
	g := &Grid{X0: 0, Y0: 0, DX: 1, DY: 1, NX: 10, NY: 5}
	g.Values = make([]float64, 50)
	g.Mask = make([]bool, 50)
	for j := 0; j < 5; j++ {
		for i := 0; i < 10; i++ {
			g.Values[j*10+i], g.Mask[j*10+i] = float64(i)-4.5, true
		}
	}
	lines := Isolines(g, 0)
	if len(lines) != 1 || len(lines[0]) != 5 {
		t.Fatalf("lines %v, want one of 5 points", lines)
	}
	for _, p := range lines[0] {
		if math.Abs(p[0]-4.5) > 1e-12 {
			t.Errorf("zero line point %v off x = 4.5", p)
		}
	}
	band := BandCells(g, -1, 1)
	if len(band) != 5 {
		t.Fatalf("%d band polygons, want 5 (one per row)", len(band))
	}
	if b := band[0].Bound(); b.Min[0] != 3.5 || b.Max[0] != 5.5 {
		t.Errorf("band row 0 spans x %v-%v, want 3.5-5.5 (cells 4 and 5)", b.Min[0], b.Max[0])
	}
	if band[0][0].Orientation() != orb.CCW {
		t.Error("band ring not counter-clockwise")
	}
}

// WriteShapes refuses a NaN coordinate (nothing half-written reaches a
// file through atomic writers) and turns rings counter-clockwise.
func TestWriteShapes(t *testing.T) {
	var buf bytes.Buffer
	bad := []ShapeFeature{{Geometry: orb.LineString{{1, 2}, {math.NaN(), 3}}}}
	if err := WriteShapes(&buf, bad); !errors.Is(err, ErrProjection) {
		t.Errorf("NaN coordinate: error %v, want ErrProjection", err)
	}
	cw := orb.Polygon{orb.Ring{{0, 0}, {0, 1}, {1, 1}, {1, 0}, {0, 0}}} // clockwise
	buf.Reset()
	if err := WriteShapes(&buf, []ShapeFeature{{Geometry: cw, Props: []Prop{{Key: "layer", Value: "zone"}, {Key: "v", Value: math.Inf(1)}}}}); err != nil {
		t.Fatal(err)
	}
	var fc struct {
		Features []struct {
			Geometry struct {
				Coordinates [][][2]float64 `json:"coordinates"`
			} `json:"geometry"`
			Properties map[string]any `json:"properties"`
		} `json:"features"`
	}
	if err := json.Unmarshal(buf.Bytes(), &fc); err != nil {
		t.Fatalf("output is not JSON: %v\n%s", err, buf.Bytes())
	}
	ring := orb.Ring{}
	for _, p := range fc.Features[0].Geometry.Coordinates[0] {
		ring = append(ring, orb.Point(p))
	}
	if ring.Orientation() != orb.CCW {
		t.Errorf("ring %v not counter-clockwise", ring)
	}
	if v, ok := fc.Features[0].Properties["v"]; !ok || v != nil {
		t.Errorf("infinite property written as %v, want null", v)
	}
}
