package figure

import (
	"bytes"
	"errors"
	"image/png"
	"math"
	"testing"

	"gonum.org/v1/plot/vg"
)

// testEhPH is a two-field diagram (invented geometry, no chemistry): an aqueous
// field below the line from (0, 13) to (14, 0) and a solid above it.
func testEhPH() EhPHDiagram {
	return EhPHDiagram{
		Title: "pe-pH test", PHMin: 0, PHMax: 14, PEMin: -10, PEMax: 20, EhPerPE: 0.05916,
		Fields: []EhPHField{
			{Name: "Fe2+", Polygons: [][][2]float64{{{0, -10}, {14, -10}, {14, 0}, {0, 13}}}},
			{Name: "ferrihydrite", Solid: true, Polygons: [][][2]float64{{{0, 13}, {14, 0}, {14, 20}, {0, 20}}}},
		},
		Boundaries: [][4]float64{{0, 13, 14, 0}},
		WaterUpper: [4]float64{0, 20.75, 14, 6.75},
		WaterLower: [4]float64{0, 0, 14, -14},
		Samples:    []EhPHSample{{"a", 7, 5}, {"bad", math.NaN(), 2}},
	}
}

// The diagram renders in every format; the SVG carries the field names, the sample
// label, the axis names and the legend; a NaN sample is counted, not drawn.
func TestEhPHRender(t *testing.T) {
	d := testEhPH()
	if d.Skipped() != 1 {
		t.Errorf("skipped %d", d.Skipped())
	}
	for _, format := range []string{"png", "svg", "pdf"} {
		b, err := Render(d, format, 16*vg.Centimeter, 13*vg.Centimeter)
		if err != nil || len(b) < 1000 {
			t.Fatalf("%s: %d bytes, %v", format, len(b), err)
		}
		if format == "png" {
			img, err := png.Decode(bytes.NewReader(b))
			if err != nil {
				t.Fatal(err)
			}
			// 16 cm at 300 dpi
			if w := img.Bounds().Dx(); w < 1880 || w > 1900 {
				t.Errorf("png width %d", w)
			}
		}
		if format == "svg" {
			txt := svgTexts(t, b)
			for _, want := range []string{"Fe2+", "ferrihydrite", "a", "pH", "pe", "Eh (V)", "sample", "1 value(s) not finite, not drawn"} {
				if !txt[want] {
					t.Errorf("svg lacks %q", want)
				}
			}
		}
	}
}

func TestEhPHRejects(t *testing.T) {
	d := testEhPH()
	d.Fields = nil
	if _, err := Render(d, "png", 10*vg.Centimeter, 8*vg.Centimeter); !errors.Is(err, ErrNoData) {
		t.Errorf("no fields: %v", err)
	}
	d = testEhPH()
	d.PHMax = d.PHMin
	if _, err := Render(d, "png", 10*vg.Centimeter, 8*vg.Centimeter); !errors.Is(err, ErrInput) {
		t.Errorf("empty window: %v", err)
	}
}

// polyCentroid of the unit square is its middle; of a triangle, the mean of the vertices.
func TestPolyCentroid(t *testing.T) {
	for _, tc := range []struct {
		p      [][2]float64
		cx, cy float64
	}{
		{[][2]float64{{0, 0}, {1, 0}, {1, 1}, {0, 1}}, 0.5, 0.5},
		{[][2]float64{{0, 0}, {3, 0}, {0, 3}}, 1, 1},
	} {
		x, y := polyCentroid(tc.p)
		if math.Abs(x-tc.cx) > 1e-12 || math.Abs(y-tc.cy) > 1e-12 {
			t.Errorf("%v: %g %g", tc.p, x, y)
		}
	}
}
