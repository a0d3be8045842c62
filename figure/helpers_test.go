package figure

import (
	"bytes"
	"encoding/xml"
	"fmt"
	"io"
	"math"
	"math/rand/v2"
	"strings"
	"testing"
)

// Synthetic, invented test data: a made-up well field of 30 wells in three
// clusters over about 2 km, with an SI field that crosses zero around two
// injection wells, and three depth nests with SI from -1.5 to +1.2.

var testInj = [][2]float64{{500800, 4200900}, {501500, 4201400}}

func testField(x, y float64) float64 {
	v := -0.9 + 0.0002*(x-500000)
	for _, p := range testInj {
		d := math.Hypot(x-p[0], y-p[1])
		v += 1.6 * math.Exp(-d*d/(2*300*300))
	}
	return v
}

func testWells(seed uint64) []Well {
	r := rand.New(rand.NewPCG(seed, 7))
	centres := [][2]float64{{500700, 4200800}, {501500, 4201350}, {501900, 4200500}}
	var ws []Well
	n := 0
	for _, c := range centres {
		for k := 0; k < 9; k++ {
			n++
			x, y := c[0]+r.NormFloat64()*180, c[1]+r.NormFloat64()*180
			ws = append(ws, Well{X: x, Y: y, SI: testField(x, y), Label: fmt.Sprintf("MW-%02d", n)})
		}
	}
	for i, p := range testInj {
		ws = append(ws, Well{X: p[0], Y: p[1], SI: testField(p[0], p[1]), Label: fmt.Sprintf("INJ-%d", i+1), Marker: MarkerInjection})
	}
	ws = append(ws, Well{X: 500300, Y: 4201700, SI: math.NaN(), Label: "OB-1", Marker: MarkerMonitoring})
	return ws
}

func testGrid() *Grid {
	g := &Grid{X0: 500000, Y0: 4200000, DX: 25, DY: 25, NX: 100, NY: 84}
	g.Z = make([]float64, g.NX*g.NY)
	g.Valid = make([]bool, g.NX*g.NY)
	for j := 0; j < g.NY; j++ {
		for i := 0; i < g.NX; i++ {
			x, y := g.X0+float64(i)*g.DX, g.Y0+float64(j)*g.DY
			k := j*g.NX + i
			g.Z[k] = testField(x, y)
			dx, dy := (x-501200)/1050, (y-4201000)/850
			g.Valid[k] = dx*dx+dy*dy < 1
		}
	}
	return g
}

func testMap() SIMap {
	return SIMap{
		Title:   "calcite SI (invented data)",
		Caption: "calcite; round 1; 18 °C; Truesdell-Jones. Screening results, not a design.",
		Grid:    testGrid(),
		Wells:   testWells(1),
		Features: []Feature{
			{Kind: FeaturePolygon, Name: "site boundary", Coords: [][2]float64{{500100, 4200150}, {502350, 4200100}, {502400, 4201950}, {500150, 4201900}}},
			{Kind: FeatureLine, Name: "creek", Coords: [][2]float64{{500000, 4201500}, {500600, 4201600}, {501200, 4201900}}},
			{Kind: FeaturePoint, Name: "gauge", Coords: [][2]float64{{502200, 4201800}}},
		},
		Units: UnitsMetres, CVRMSE: 0.14, HasCV: true, NorthArrow: true, ScaleBar: true,
	}
}

func testProfile() DepthProfile {
	mk := func(label string, off, deep float64) ProfileLine {
		var d, s []float64
		for z := 10.0; z <= 150; z += 20 {
			d = append(d, z)
			s = append(s, -1.5+off+deep/(1+math.Exp(-(z-90)/12)))
		}
		return ProfileLine{Label: label, Depth: d, SI: s}
	}
	return DepthProfile{
		Title: "SI with depth (invented data)",
		Panels: []ProfilePanel{
			{Mineral: "calcite", Lines: []ProfileLine{mk("Nest A", 1.2, 0.8), mk("Nest B", 1.0, 0.6), mk("Nest C", 0.7, 0.9)}},
			{Mineral: "baryte", Lines: []ProfileLine{mk("Nest A", 0.2, 2.5), mk("Nest B", 0.4, 2.2), mk("Nest C", 0.1, 2.6)}},
		},
	}
}

func testCurves() Curves {
	var ss []Series
	for _, m := range []struct {
		name    string
		a, b, c float64
	}{{"calcite", 0.3, 1.2, -0.9}, {"gypsum", -1.2, 0.9, -0.2}, {"baryte", -0.5, 3.4, -3.0}} {
		var x, y []float64
		for f := 0.0; f <= 1.0001; f += 0.05 {
			x = append(x, f)
			y = append(y, m.a+m.b*f+m.c*f*f)
		}
		ss = append(ss, Series{Name: m.name, X: x, Y: y})
	}
	return Curves{Title: "Mixing (invented data)", XLabel: "Fraction of injectate", YLabel: "SI", Series: ss, ZeroLine: true, AnnotateMax: true}
}

func testBars() Bars {
	return Bars{
		Title: "Precipitation potential (invented data)", YLabel: "mg/L",
		Labels: []string{"calcite", "gypsum", "baryte"}, Values: []float64{42.3, 0, 3.1},
		Secondary: []float64{35, 0, 2.9}, PrimaryName: "alone", SecondaryName: "together",
	}
}

// svgTexts returns the text elements of an SVG, failing if it is not XML.
func svgTexts(t *testing.T, b []byte) map[string]bool {
	t.Helper()
	texts := map[string]bool{}
	dec := xml.NewDecoder(bytes.NewReader(b))
	inText := false
	for {
		tok, err := dec.Token()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatalf("SVG does not parse: %v", err)
		}
		switch tk := tok.(type) {
		case xml.StartElement:
			inText = tk.Name.Local == "text"
		case xml.CharData:
			if inText {
				texts[strings.TrimSpace(string(tk))] = true
			}
		case xml.EndElement:
			inText = false
		}
	}
	return texts
}
