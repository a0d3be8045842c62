package figure

import (
	"bytes"
	"errors"
	"image"
	"image/color"
	"image/png"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
)

const (
	testW = 16 * vg.Centimeter
	testH = 12 * vg.Centimeter
)

func testFigures() map[string]Figure {
	wellsOnly := testMap()
	wellsOnly.Grid = nil
	deg := testMap()
	deg.Grid, deg.Features, deg.Units = nil, nil, UnitsDegrees
	for i := range deg.Wells {
		deg.Wells[i].X = -3 + (deg.Wells[i].X-500000)/80000
		deg.Wells[i].Y = 37.9 + (deg.Wells[i].Y-4200000)/111000
	}
	elev := testProfile()
	elev.Elevation = true
	return map[string]Figure{
		"simap":     testMap(),
		"wellsonly": wellsOnly,
		"degrees":   deg,
		"profile":   testProfile(),
		"elevation": elev,
		"curves":    testCurves(),
		"bars":      testBars(),
		"panels":    Panels([]Figure{testMap(), testCurves()}, 2),
	}
}

// PNG pixels = length in points x dpi / 72 (a point is 1/72 inch, the
// PostScript point used by gonum/plot's vg package).
func TestRenderPNG(t *testing.T) {
	wantW := int(testW.Points()*PNGDPI/72 + 0.5)
	wantH := int(testH.Points()*PNGDPI/72 + 0.5)
	for name, f := range testFigures() {
		t.Run(name, func(t *testing.T) {
			t.Parallel()
			b, err := Render(f, "png", testW, testH)
			if err != nil {
				t.Fatal(err)
			}
			img, err := png.Decode(bytes.NewReader(b))
			if err != nil {
				t.Fatal(err)
			}
			if got := img.Bounds(); got.Dx() != wantW || got.Dy() != wantH {
				t.Errorf("size %dx%d, want %dx%d", got.Dx(), got.Dy(), wantW, wantH)
			}
			if n := distinctColors(img); n < 50 {
				t.Errorf("only %d distinct colours: figure looks empty", n)
			}
			if f := inkFraction(img); f < 0.01 || f > 0.9 {
				t.Errorf("non-white fraction %.3f outside [0.01, 0.9]", f)
			}
		})
	}
}

func distinctColors(img image.Image) int {
	seen := map[color.RGBA]bool{}
	b := img.Bounds()
	for y := b.Min.Y; y < b.Max.Y; y += 3 {
		for x := b.Min.X; x < b.Max.X; x += 3 {
			seen[color.RGBAModel.Convert(img.At(x, y)).(color.RGBA)] = true
		}
	}
	return len(seen)
}

func inkFraction(img image.Image) float64 {
	b := img.Bounds()
	n, ink := 0, 0
	for y := b.Min.Y; y < b.Max.Y; y += 4 {
		for x := b.Min.X; x < b.Max.X; x += 4 {
			r, g, bb, _ := img.At(x, y).RGBA()
			n++
			if r < 0xf000 || g < 0xf000 || bb < 0xf000 {
				ink++
			}
		}
	}
	return float64(ink) / float64(n)
}

func TestRenderSVG(t *testing.T) {
	cases := []struct {
		name  string
		fig   Figure
		texts []string
	}{
		{"simap", testMap(), []string{"calcite SI (invented data)", DefaultColorLabel, "undersaturated", "supersaturated", "Easting (m)", "Northing (m)", "INJ-1", "N"}},
		{"profile", testProfile(), []string{"Depth below ground (m)", "Nest A", "calcite", "baryte"}},
		{"curves", testCurves(), []string{"Fraction of injectate", "gypsum", "SI = 0 (equilibrium)"}},
		{"bars", testBars(), []string{"calcite", "42.3", "together (light, hatched)"}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			b, err := Render(c.fig, "svg", testW, testH)
			if err != nil {
				t.Fatal(err)
			}
			texts := svgTexts(t, b)
			for _, want := range c.texts {
				if !texts[want] {
					t.Errorf("no <text> element %q", want)
				}
			}
			if !bytes.Contains(b, []byte("@font-face")) {
				t.Error("fonts not embedded in SVG")
			}
		})
	}
}

func TestRenderPDF(t *testing.T) {
	for _, name := range []string{"simap", "profile", "curves", "bars"} {
		b, err := Render(testFigures()[name], "pdf", testW, testH)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		if !bytes.HasPrefix(b, []byte("%PDF")) || len(b) < 10000 {
			t.Errorf("%s: not a PDF (%d bytes, starts %q)", name, len(b), b[:min(8, len(b))])
		}
	}
}

func TestRenderErrors(t *testing.T) {
	nan := math.NaN()
	allNaNGrid := &Grid{X0: 0, Y0: 0, DX: 1, DY: 1, NX: 2, NY: 2, Z: []float64{nan, nan, nan, nan}}
	cases := []struct {
		name   string
		fig    Figure
		format string
		w, h   vg.Length
		want   error
	}{
		{"empty map", SIMap{}, "png", testW, testH, ErrNoData},
		{"all-NaN grid, no wells", SIMap{Grid: allNaNGrid}, "png", testW, testH, ErrNoData},
		{"wells with NaN coordinates only", SIMap{Wells: []Well{{X: nan, Y: 1, SI: 1}}}, "png", testW, testH, ErrNoData},
		{"grid shape", SIMap{Grid: &Grid{DX: 1, DY: 1, NX: 3, NY: 2, Z: []float64{1}}}, "png", testW, testH, ErrInput},
		{"bad units", SIMap{Units: "ft", Wells: []Well{{X: 1, Y: 1, SI: 0}}}, "png", testW, testH, ErrInput},
		{"bad feature", SIMap{Wells: []Well{{X: 1, Y: 1}}, Features: []Feature{{Kind: "circle", Coords: [][2]float64{{0, 0}}}}}, "png", testW, testH, ErrInput},
		{"empty profile", DepthProfile{}, "png", testW, testH, ErrNoData},
		{"NaN profile", DepthProfile{Panels: []ProfilePanel{{Lines: []ProfileLine{{Depth: []float64{nan}, SI: []float64{1}}}}}}, "png", testW, testH, ErrNoData},
		{"profile lengths", DepthProfile{Panels: []ProfilePanel{{Lines: []ProfileLine{{Depth: []float64{1, 2}, SI: []float64{1}}}}}}, "png", testW, testH, ErrInput},
		{"empty curves", Curves{}, "svg", testW, testH, ErrNoData},
		{"curve lengths", Curves{Series: []Series{{X: []float64{1}, Y: nil}}}, "svg", testW, testH, ErrInput},
		{"bars all NaN", Bars{Labels: []string{"a"}, Values: []float64{nan}}, "pdf", testW, testH, ErrNoData},
		{"bars lengths", Bars{Labels: []string{"a", "b"}, Values: []float64{1}}, "pdf", testW, testH, ErrInput},
		{"no panels", Panels(nil, 2), "png", testW, testH, ErrNoData},
		{"nil figure", nil, "png", testW, testH, ErrNoData},
		{"format", testBars(), "gif", testW, testH, ErrFormat},
		{"size", testBars(), "png", 0, testH, ErrSize},
		{"NaN size", testBars(), "png", vg.Length(nan), testH, ErrSize},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			if c.w == testW && c.h == testH {
				c.w, c.h = 4*vg.Centimeter, 3*vg.Centimeter // errors come before drawing
			}
			b, err := Render(c.fig, c.format, c.w, c.h)
			if !errors.Is(err, c.want) {
				t.Errorf("error %v, want %v", err, c.want)
			}
			if b != nil {
				t.Errorf("got %d bytes with an error", len(b))
			}
		})
	}
}

func TestRenderRecoversPanic(t *testing.T) {
	f := FigureFunc(func(c draw.Canvas) error { panic("boom") })
	b, err := Render(f, "png", testW, testH)
	if err == nil || !strings.Contains(err.Error(), "boom") || b != nil {
		t.Errorf("Render = %d bytes, %v; want the panic as an error", len(b), err)
	}
}

func TestNonFiniteFiltered(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	m := testMap()
	// 3 valid cells made non-finite, 2 wells with bad coordinates, 1 bad
	// feature vertex: 6 skipped.
	k := (m.Grid.NY/2)*m.Grid.NX + m.Grid.NX/2
	m.Grid.Z[k], m.Grid.Z[k+1], m.Grid.Z[k+2] = nan, inf, nan
	m.Wells = append(m.Wells, Well{X: nan, Y: 4201000, SI: 1, Label: "bad-1"}, Well{X: 501000, Y: inf, SI: 1, Label: "bad-2"})
	m.Features[1].Coords = append(m.Features[1].Coords, [2]float64{nan, 0})
	if got := m.Skipped(); got != 6 {
		t.Errorf("SIMap.Skipped = %d, want 6", got)
	}
	cv := testCurves()
	cv.Series[0].Y[3] = nan
	cv.Series[1].X[5] = inf
	if got := cv.Skipped(); got != 2 {
		t.Errorf("Curves.Skipped = %d, want 2", got)
	}
	pr := testProfile()
	pr.Panels[0].Lines[0].SI[2] = nan
	if got := pr.Skipped(); got != 1 {
		t.Errorf("DepthProfile.Skipped = %d, want 1", got)
	}
	br := testBars()
	br.Values[1] = nan
	if got := br.Skipped(); got != 1 {
		t.Errorf("Bars.Skipped = %d, want 1", got)
	}
	allNaN := testMap()
	for i := range allNaN.Grid.Z {
		allNaN.Grid.Z[i] = nan
	}
	for _, f := range []Figure{m, cv, pr, br, allNaN} {
		if _, err := Render(f, "png", testW, testH); err != nil {
			t.Errorf("%T with non-finite values: %v", f, err)
		}
	}
}

// Label placement: no two placed labels overlap each other or any symbol,
// and all stay inside the bounds, for random tight clusters.
func TestPlaceLabelsNoOverlap(t *testing.T) {
	r := rand.New(rand.NewPCG(42, 1))
	bounds := vg.Rectangle{Max: vg.Point{X: 400, Y: 300}}
	for trial := 0; trial < 200; trial++ {
		n := 2 + r.IntN(60)
		spread := 5 + 80*r.Float64()
		cx, cy := 50+300*r.Float64(), 50+200*r.Float64()
		items := make([]labelItem, n)
		for i := range items {
			items[i] = labelItem{
				anchor: vg.Point{X: vg.Length(cx + spread*r.NormFloat64()), Y: vg.Length(cy + spread*r.NormFloat64())},
				r:      3.4, w: vg.Length(15 + 20*r.Float64()), h: 9,
			}
		}
		obstacle := vg.Rectangle{Min: vg.Point{X: 8, Y: 8}, Max: vg.Point{X: 80, Y: 25}}
		ps := placeLabels(items, []vg.Rectangle{obstacle}, bounds)
		placed := 0
		for i, p := range ps {
			if !p.placed {
				continue
			}
			placed++
			if !inside(p.rect, bounds) {
				t.Fatalf("trial %d: label %d outside bounds", trial, i)
			}
			if overlaps(p.rect, obstacle) {
				t.Fatalf("trial %d: label %d over the obstacle", trial, i)
			}
			for j, q := range ps {
				if j != i && q.placed && overlaps(p.rect, q.rect) {
					t.Fatalf("trial %d: labels %d and %d overlap", trial, i, j)
				}
			}
			for j, it := range items {
				box := vg.Rectangle{Min: vg.Point{X: it.anchor.X - it.r, Y: it.anchor.Y - it.r}, Max: vg.Point{X: it.anchor.X + it.r, Y: it.anchor.Y + it.r}}
				if overlaps(p.rect, box) {
					t.Fatalf("trial %d: label %d covers symbol %d", trial, i, j)
				}
			}
		}
		if placed == 0 {
			t.Fatalf("trial %d: no label placed out of %d", trial, n)
		}
	}
	// Well-spaced points all get a label next to them, without leaders.
	var items []labelItem
	for i := 0; i < 10; i++ {
		items = append(items, labelItem{anchor: vg.Point{X: vg.Length(20 + 35*i), Y: 150}, r: 3, w: 20, h: 9})
	}
	for i, p := range placeLabels(items, nil, bounds) {
		if !p.placed || p.leader {
			t.Errorf("spaced point %d: placed %v leader %v", i, p.placed, p.leader)
		}
	}
}

// The SI = 0 contour of a linear field z = x - c lies on x = c exactly
// (linear interpolation along cell edges is exact for a linear field), and
// never enters a square with a blank corner.
func TestZeroContour(t *testing.T) {
	g := &Grid{X0: 0, Y0: 0, DX: 10, DY: 5, NX: 12, NY: 9}
	g.Z = make([]float64, g.NX*g.NY)
	g.Valid = make([]bool, len(g.Z))
	const c = 47.5
	for j := 0; j < g.NY; j++ {
		for i := 0; i < g.NX; i++ {
			k := j*g.NX + i
			g.Z[k] = float64(i)*g.DX - c
			g.Valid[k] = j != 4 // a blank row splits the line in two
		}
	}
	lines := zeroContour(g)
	if len(lines) != 2 {
		t.Fatalf("%d lines, want 2 (split by the blank row)", len(lines))
	}
	for _, l := range lines {
		for _, p := range l {
			if math.Abs(p[0]-c) > 1e-9 {
				t.Errorf("contour point x = %v, want %v", p[0], c)
			}
			if p[1] > 3*g.DY && p[1] < 5*g.DY {
				t.Errorf("contour point y = %v inside the blank band", p[1])
			}
		}
	}
	// An all-blank grid gives no contour and no panic.
	g.Valid = make([]bool, len(g.Z))
	if n := len(zeroContour(g)); n != 0 {
		t.Errorf("blank grid: %d lines", n)
	}
}

// A closed loop: z = r - R around a centre gives one closed polyline whose
// points are all within a cell's diagonal of radius R.
func TestZeroContourLoop(t *testing.T) {
	g := &Grid{X0: -50, Y0: -50, DX: 2, DY: 2, NX: 51, NY: 51}
	g.Z = make([]float64, g.NX*g.NY)
	const R = 30.0
	for j := 0; j < g.NY; j++ {
		for i := 0; i < g.NX; i++ {
			x, y := g.X0+float64(i)*g.DX, g.Y0+float64(j)*g.DY
			g.Z[j*g.NX+i] = math.Hypot(x, y) - R
		}
	}
	lines := zeroContour(g)
	if len(lines) != 1 {
		t.Fatalf("%d lines, want 1", len(lines))
	}
	l := lines[0]
	if l[0] != l[len(l)-1] {
		t.Errorf("loop not closed: %v .. %v", l[0], l[len(l)-1])
	}
	for _, p := range l {
		if d := math.Abs(math.Hypot(p[0], p[1]) - R); d > g.DX {
			t.Errorf("point %v off the circle by %v", p, d)
		}
	}
}

func TestFlipTicksDepthDownward(t *testing.T) {
	ts := flipTicks{}.Ticks(-150, 0)
	found := false
	for _, tk := range ts {
		if tk.Value > 0 {
			t.Errorf("tick at %v above ground", tk.Value)
		}
		if tk.Label == "100" {
			found = true
			if tk.Value != -100 {
				t.Errorf("label 100 at %v, want -100 (depth drawn downward)", tk.Value)
			}
		}
	}
	if !found {
		t.Errorf("no 100 m label in %v", ts)
	}
}

func TestNiceTicks(t *testing.T) {
	cases := []struct {
		min, max float64
		n        int
		step     float64
	}{
		{500000, 502500, 5, 500},
		{-1.6, 1.1, 6, 0.5},
		{0, 1, 5, 0.2},
		{10, 90, 8, 10},
	}
	for _, c := range cases {
		var labels []float64
		for _, tk := range (niceTicks{n: c.n}).Ticks(c.min, c.max) {
			if tk.Value < c.min-1e-9 || tk.Value > c.max+1e-9 {
				t.Errorf("%v: tick %v outside range", c, tk.Value)
			}
			if tk.Label != "" {
				labels = append(labels, tk.Value)
			}
		}
		for i := 1; i < len(labels); i++ {
			if d := labels[i] - labels[i-1]; math.Abs(d-c.step) > 1e-9*c.step {
				t.Errorf("%v: step %v, want %v", c, d, c.step)
			}
		}
		if len(labels) < 2 {
			t.Errorf("%v: %d labels", c, len(labels))
		}
	}
}

// The map keeps an equal scale: one metre is as long on the x axis as on
// the y axis (and, in degrees, one degree of longitude is cos(latitude)
// times one of latitude).
func TestEqualAspect(t *testing.T) {
	for _, units := range []string{UnitsMetres, UnitsDegrees} {
		m := testMap()
		if units == UnitsDegrees {
			m.Grid, m.Features, m.Units = nil, nil, UnitsDegrees
			for i := range m.Wells {
				m.Wells[i].X = 10 + (m.Wells[i].X-500000)/80000
				m.Wells[i].Y = 60 + (m.Wells[i].Y-4200000)/111000
			}
		}
		s, err := m.prepare()
		if err != nil {
			t.Fatal(err)
		}
		body := newTestCanvas()
		lay := s.layout(body, false)
		da := lay.da
		ux := (lay.p.X.Max - lay.p.X.Min) * s.aspectX / float64(da.Max.X-da.Min.X)
		uy := (lay.p.Y.Max - lay.p.Y.Min) / float64(da.Max.Y-da.Min.Y)
		if math.Abs(ux/uy-1) > 0.005 {
			t.Errorf("%s: x %g, y %g units per point", units, ux, uy)
		}
	}
}

func newTestCanvas() draw.Canvas {
	return draw.New(vgimg.NewWith(vgimg.UseWH(testW, testH), vgimg.UseDPI(72)))
}
