package figure

import (
	"bytes"
	"image"
	"image/color"
	"image/png"
	"math"
	"testing"
)

// Each listed mineral has its own colour-and-marker pair, the ten listed
// first all differ in colour, and a name's style does not depend on case,
// blanks or how often it is asked for.
func TestMineralStyleUnique(t *testing.T) {
	seen := map[[2]string]string{}
	colours := map[color.NRGBA]string{}
	for k, m := range mineralOrder {
		st := MineralStyle(m)
		key := [2]string{fmtColor(st.Color), st.Marker}
		if other, ok := seen[key]; ok {
			t.Errorf("%s and %s share colour and marker %v", m, other, key)
		}
		seen[key] = m
		if k < len(mineralColors) {
			if other, ok := colours[st.Color]; ok {
				t.Errorf("%s and %s share a colour among the first %d", m, other, len(mineralColors))
			}
			colours[st.Color] = m
		}
		if st.Marker == "" || st.Marker == "cross" || st.Marker == "plus" {
			t.Errorf("%s: marker %q has no fill", m, st.Marker)
		}
		if again := MineralStyle("  " + string(bytes.ToUpper([]byte(m))) + " "); fmtColor(again.Color) != fmtColor(st.Color) || again.Marker != st.Marker {
			t.Errorf("%s: style depends on case or blanks", m)
		}
	}
	a, b := MineralStyle("unobtainium"), MineralStyle("unobtainium")
	if a.Color != b.Color || a.Marker != b.Marker {
		t.Error("an unlisted name changes style between calls")
	}
}

func fmtColor(c color.NRGBA) string {
	return string([]byte{c.R, c.G, c.B})
}

// hasColour reports whether some pixel of img is within tol (per channel)
// of c.
func hasColour(img image.Image, c color.NRGBA, tol int) bool {
	b := img.Bounds()
	for y := b.Min.Y; y < b.Max.Y; y++ {
		for x := b.Min.X; x < b.Max.X; x++ {
			p := color.NRGBAModel.Convert(img.At(x, y)).(color.NRGBA)
			if abs(int(p.R)-int(c.R)) <= tol && abs(int(p.G)-int(c.G)) <= tol && abs(int(p.B)-int(c.B)) <= tol {
				return true
			}
		}
	}
	return false
}

func abs(v int) int { return int(math.Abs(float64(v))) }

// One mineral, one colour: calcite drawn alone in a curve figure, a depth
// profile and a bar chart shows calcite's colour, and never the colour of
// another mineral drawn elsewhere (baryte).
func TestMineralColourAcrossFigures(t *testing.T) {
	x := []float64{0, 0.5, 1}
	y := []float64{-0.4, 0.1, 0.6}
	figs := map[string]Figure{
		"curves":  Curves{Title: "t", Series: []Series{{Name: "calcite", X: x, Y: y}}},
		"profile": DepthProfile{Title: "t", Panels: []ProfilePanel{{Mineral: "calcite", Lines: []ProfileLine{{Round: "1", Depth: []float64{10, 40, 80}, SI: y}}}}},
		"bars":    Bars{Title: "t", Labels: []string{"calcite"}, Values: []float64{12}},
	}
	calcite, baryte := MineralStyle("calcite").Color, MineralStyle("baryte").Color
	for name, f := range figs {
		b, err := Render(f, "png", 200, 150)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		img, err := png.Decode(bytes.NewReader(b))
		if err != nil {
			t.Fatal(err)
		}
		if !hasColour(img, calcite, 2) {
			t.Errorf("%s: calcite's colour %v not drawn", name, calcite)
		}
		if hasColour(img, baryte, 2) {
			t.Errorf("%s: baryte's colour %v drawn for calcite", name, baryte)
		}
	}
}

// Bars switch to a log axis when the amounts span more than LogSpan, and
// say so in the axis label; small spans stay linear.
func TestBarsLogAxis(t *testing.T) {
	for _, c := range []struct {
		vals []float64
		log  bool
	}{
		{[]float64{17.4, 0.05}, true},
		{[]float64{17.4, 2}, false},
		{[]float64{17.4, -0.5, 0.01}, false}, // a negative value keeps the axis linear
		{[]float64{300, 0, 1}, true},
	} {
		b := Bars{Title: "t", YLabel: "mg/L", Labels: make([]string, len(c.vals)), Values: c.vals}
		out, err := Render(b, "svg", 300, 200)
		if err != nil {
			t.Fatalf("%v: %v", c.vals, err)
		}
		if got := bytes.Contains(out, []byte("log scale")); got != c.log {
			t.Errorf("%v: log-scale label %v, want %v", c.vals, got, c.log)
		}
	}
}

// Labels on a crowded map never overlap each other, the north arrow or the
// scale bar, in one panel or three.
func TestMapLabelsApart(t *testing.T) {
	m := testMap()
	for _, ms := range []SIMaps{{Title: "one", Maps: []SIMap{m}}, {Title: "three", Maps: []SIMap{m, m, m}}} {
		labels, furniture, err := ms.LabelBoxes(testW, ms.FitHeight(testW))
		if err != nil {
			t.Fatal(err)
		}
		if len(labels) < 10 {
			t.Errorf("%s: only %d labels placed", ms.Title, len(labels))
		}
		for i := range labels {
			for j := i + 1; j < len(labels); j++ {
				if overlaps(labels[i], labels[j]) {
					t.Errorf("%s: labels %d and %d overlap", ms.Title, i, j)
				}
			}
			for _, f := range furniture {
				if overlaps(labels[i], f) {
					t.Errorf("%s: label %d lies on the furniture", ms.Title, i)
				}
			}
		}
	}
}

// The near-equilibrium zone is hatched: a surface within the band shows
// hatch pixels (the surface colour darkened), a surface beyond it none.
func TestMapBandHatched(t *testing.T) {
	for _, c := range []struct {
		si    float64
		hatch bool
	}{{0.2, true}, {-0.3, true}, {1.5, false}, {-1.2, false}} {
		g := &Grid{X0: 0, Y0: 0, DX: 10, DY: 10, NX: 40, NY: 30, Z: make([]float64, 1200)}
		for k := range g.Z {
			g.Z[k] = c.si
		}
		m := SIMap{Grid: g, Limit: 2, Band: 0.5}
		b, err := Render(m, "png", 200, 160)
		if err != nil {
			t.Fatal(err)
		}
		img, err := png.Decode(bytes.NewReader(b))
		if err != nil {
			t.Fatal(err)
		}
		dark := darker(Diverging{Limit: 2}.Color(c.si), 0.45)
		if got := hasColour(img, dark, 3); got != c.hatch {
			t.Errorf("SI %v: hatch pixels %v, want %v", c.si, got, c.hatch)
		}
	}
}

func TestFixedSigned(t *testing.T) {
	for _, c := range []struct {
		v    float64
		want string
	}{{0.071, "+0.07"}, {-0.004, "0.00"}, {0, "0.00"}, {-0.12, "\u22120.12"}, {1.5, "+1.50"}} {
		if got := fixedSigned(c.v); got != c.want {
			t.Errorf("fixedSigned(%v) = %q, want %q", c.v, got, c.want)
		}
	}
}
