package figure

import (
	"bytes"
	"errors"
	"fmt"
	"image/png"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/plot/vg"
)

// The layout checked here is Stiff's (1951, "The interpretation of
// chemical water analysis by means of patterns", J. Petroleum Technology
// 3(10), 15-17; from memory): cations to the left of the zero line, Na + K
// on the top row, Ca in the middle, Mg at the bottom; anions to the right,
// Cl on top, HCO3 + CO3 in the middle, SO4 at the bottom; each vertex at
// the ion's meq/L on a common linear scale.
func TestStiffVertices(t *testing.T) {
	// Invented water, meq/L.
	w := StiffWater{Well: "X", Na: 3, K: 0.5, Ca: 2, Mg: 1, Cl: 2.5, HCO3: 3, CO3: 0.2, SO4: 0.8}
	want := [6][2]float64{
		{-3.5, 2}, // Na + K, top left
		{-2, 1},   // Ca, middle left
		{-1, 0},   // Mg, bottom left
		{0.8, 0},  // SO4, bottom right
		{3.2, 1},  // HCO3 + CO3, middle right
		{2.5, 2},  // Cl, top right
	}
	got := stiffVertices(w)
	for i := range want {
		if math.Abs(got[i][0]-want[i][0]) > 1e-12 || got[i][1] != want[i][1] {
			t.Errorf("vertex %d: got %v, want %v", i, got[i], want[i])
		}
	}
	if e := stiffExtent(w); math.Abs(e-3.5) > 1e-12 {
		t.Errorf("extent %v, want 3.5", e)
	}
	// A water with the same meq/L on both sides of each row is symmetric
	// about the zero line.
	s := stiffVertices(StiffWater{Na: 4, Ca: 2, Mg: 1, Cl: 4, HCO3: 2, SO4: 1})
	for i := 0; i < 3; i++ {
		a, b := s[i], s[5-i]
		if a[0] != -b[0] || a[1] != b[1] {
			t.Errorf("row %v: %v and %v are not mirror images", a[1], a, b)
		}
	}
}

func TestNiceCeil(t *testing.T) {
	cases := []struct{ in, want float64 }{
		{0.7, 1}, {1, 1}, {1.2, 2}, {2.1, 2.5}, {3.5, 5}, {5, 5}, {7, 10}, {23, 25}, {260, 500}, {0, 1}, {math.NaN(), 1},
	}
	for _, tc := range cases {
		if got := niceCeil(tc.in); math.Abs(got-tc.want) > 1e-12 {
			t.Errorf("niceCeil(%v) = %v, want %v", tc.in, got, tc.want)
		}
	}
}

// Every panel of a grid shares one scale: the largest ion of all waters,
// rounded up, unless set.
func TestStiffScale(t *testing.T) {
	ws := testStiffWaters()
	m := 0.0
	for _, w := range ws {
		for _, v := range []float64{w.Na + w.K, w.Ca, w.Mg, w.Cl, w.HCO3 + w.CO3, w.SO4} {
			m = math.Max(m, v)
		}
	}
	got := stiffScale(0, ws)
	if got < m || got > 2.5*m {
		t.Errorf("fitted scale %v for a largest ion of %v", got, m)
	}
	if got := stiffScale(5, ws); got != 5 {
		t.Errorf("set scale 5 gives %v", got)
	}
	if n := stiffClipped(ws[0], 1); n == 0 {
		t.Errorf("no ion of %+v beyond a 1 meq/L scale", ws[0])
	}
}

func TestStiffCols(t *testing.T) {
	for _, n := range []int{1, 2, 5, 12, 30} {
		for _, wh := range [][2]float64{{765, 539}, {453, 340}, {300, 800}} {
			c := gridCols(n, wh[0], wh[1])
			if c < 1 || c > n {
				t.Errorf("n=%d page %v: %d columns", n, wh, c)
			}
		}
	}
	// A landscape page takes more columns than a portrait one.
	if a, b := gridCols(30, 765, 539), gridCols(30, 539, 765); a <= b {
		t.Errorf("landscape %d columns, portrait %d", a, b)
	}
}

// testStiffWaters are invented waters (meq/L) of three kinds, for the
// rendering tests.
func testStiffWaters() []StiffWater {
	var ws []StiffWater
	for i := 0; i < 12; i++ {
		f := 1 + 0.3*float64(i%4)
		switch i % 3 {
		case 0: // Ca-HCO3
			ws = append(ws, StiffWater{Well: fmt.Sprintf("MW-%02d", i+1), Ca: 3.1 * f, Mg: 1.2 * f, Na: 0.8 * f, K: 0.1, HCO3: 4.2 * f, SO4: 0.5 * f, Cl: 0.6 * f})
		case 1: // Na-Cl
			ws = append(ws, StiffWater{Well: fmt.Sprintf("MW-%02d", i+1), Ca: 1.5 * f, Mg: 1.1 * f, Na: 7.5 * f, K: 0.2, HCO3: 2.1 * f, SO4: 0.9 * f, Cl: 7.2 * f})
		default: // Na-HCO3
			ws = append(ws, StiffWater{Well: fmt.Sprintf("MW-%02d", i+1), Ca: 0.6 * f, Mg: 0.4 * f, Na: 5.2 * f, K: 0.1, HCO3: 4.8 * f, CO3: 0.3, SO4: 0.8 * f, Cl: 0.7 * f})
		}
	}
	return ws
}

func TestStiffRender(t *testing.T) {
	ws := testStiffWaters()
	grid := StiffGrid{Title: "Stiff diagrams (invented data)", Caption: "Twelve invented wells.", Waters: ws}
	one := Stiff{Water: ws[1], Caption: "One invented well."}
	for _, tc := range []struct {
		name string
		fig  Figure
		ids  []string
	}{
		{"grid", grid, []string{"MW-01", "MW-07", "MW-12"}},
		{"one", one, []string{"MW-02"}},
	} {
		w, h := 24*vg.Centimeter, 16*vg.Centimeter
		b, err := Render(tc.fig, "png", w, h)
		if err != nil {
			t.Fatalf("%s png: %v", tc.name, err)
		}
		img, err := png.Decode(bytes.NewReader(b))
		if err != nil {
			t.Fatalf("%s png: %v", tc.name, err)
		}
		if wantW := int(math.Round(float64(w) * PNGDPI / 72)); img.Bounds().Dx() != wantW {
			t.Errorf("%s png: %d px wide, want %d", tc.name, img.Bounds().Dx(), wantW)
		}
		b, err = Render(tc.fig, "svg", w, h)
		if err != nil {
			t.Fatalf("%s svg: %v", tc.name, err)
		}
		texts := svgTexts(t, b)
		for _, id := range tc.ids {
			if !texts[id] {
				t.Errorf("%s svg: well id %q missing", tc.name, id)
			}
		}
		b, err = Render(tc.fig, "pdf", w, h)
		if err != nil {
			t.Fatalf("%s pdf: %v", tc.name, err)
		}
		if !bytes.HasPrefix(b, []byte("%PDF")) {
			t.Errorf("%s pdf: starts with %q", tc.name, b[:8])
		}
	}
}

// The two halves are filled in their own colours: in the PNG of a single
// water with equal cations and anions (3 meq/L each row, scale 5) the
// pixels a little left and right of the zero line at mid-height are the
// cation and anion fills.
func TestStiffFillSides(t *testing.T) {
	fig := Stiff{Water: StiffWater{Well: "EQ", Na: 3, Ca: 3, Mg: 3, Cl: 3, HCO3: 3, SO4: 3}, MaxMeqL: 5}
	b, err := Render(fig, "png", 16*vg.Centimeter, 12*vg.Centimeter)
	if err != nil {
		t.Fatal(err)
	}
	img, err := png.Decode(bytes.NewReader(b))
	if err != nil {
		t.Fatal(err)
	}
	// Find the horizontal span of each fill colour along every row; both
	// must appear, cations left of anions, and at equal widths (a
	// symmetric water).
	minC, maxC, minA, maxA := math.MaxInt, -1, math.MaxInt, -1
	bd := img.Bounds()
	for y := bd.Min.Y; y < bd.Max.Y; y += 4 {
		for x := bd.Min.X; x < bd.Max.X; x++ {
			r, g, bl, _ := img.At(x, y).RGBA()
			switch {
			case near8(r, g, bl, stiffCationFill.R, stiffCationFill.G, stiffCationFill.B):
				minC, maxC = min(minC, x), max(maxC, x)
			case near8(r, g, bl, stiffAnionFill.R, stiffAnionFill.G, stiffAnionFill.B):
				minA, maxA = min(minA, x), max(maxA, x)
			}
		}
	}
	if maxC < 0 || maxA < 0 {
		t.Fatalf("fills not found: cations %d-%d, anions %d-%d", minC, maxC, minA, maxA)
	}
	// The legend swatches share the colours; they lie below the diagram,
	// inside its span, so the diagram sets the extremes: the cation fill
	// ends at the zero line where the anion fill begins.
	if !(minC < minA && maxC <= minA+3) {
		t.Errorf("cation fill (%d-%d) not left of anion fill (%d-%d)", minC, maxC, minA, maxA)
	}
	wc, wa := maxC-minC, maxA-minA
	if math.Abs(float64(wc-wa)) > 0.03*float64(wc+wa) {
		t.Errorf("cation half %d px wide, anion half %d px: not symmetric", wc, wa)
	}
}

func near8(r, g, b uint32, R, G, B uint8) bool {
	d := func(a uint32, c uint8) bool { return math.Abs(float64(a>>8)-float64(c)) <= 2 }
	return d(r, R) && d(g, G) && d(b, B)
}

func TestStiffSkippedAndClipped(t *testing.T) {
	ws := append(testStiffWaters()[:3],
		StiffWater{Well: "BAD-1", Na: math.NaN(), Cl: 1},
		StiffWater{Well: "BAD-2", Na: -1, Cl: 1},
		StiffWater{Well: "ZERO"},
	)
	g := StiffGrid{Waters: ws, MaxMeqL: 2}
	if n := g.Skipped(); n != 3 {
		t.Errorf("Skipped = %d, want 3", n)
	}
	b, err := Render(g, "svg", 20*vg.Centimeter, 12*vg.Centimeter)
	if err != nil {
		t.Fatal(err)
	}
	texts := svgTexts(t, b)
	var note string
	for s := range texts {
		if strings.HasPrefix(s, "meq/L on one scale.") {
			note = s
		}
	}
	if !strings.Contains(note, "3 water(s) left out") || !strings.Contains(note, "beyond the scale") {
		t.Errorf("note %q does not report the skipped waters and clipped values", note)
	}
	for _, bad := range []string{"BAD-1", "BAD-2", "ZERO"} {
		if texts[bad] {
			t.Errorf("skipped water %s drawn", bad)
		}
	}
	_, err = Render(StiffGrid{Waters: ws[3:]}, "png", 10*vg.Centimeter, 8*vg.Centimeter)
	if !errors.Is(err, ErrNoData) {
		t.Errorf("grid of invalid waters: error %v, want ErrNoData", err)
	}
	_, err = Render(Stiff{Water: ws[3]}, "png", 10*vg.Centimeter, 8*vg.Centimeter)
	if !errors.Is(err, ErrNoData) {
		t.Errorf("invalid single water: error %v, want ErrNoData", err)
	}
}

// Stiff diagrams of three invented wells on one page, on a fixed scale of
// 10 meq/L so that other pages can share it. The Na + K (12 meq/L) and Cl
// (12.5 meq/L) of W-3 lie beyond the scale and are drawn at its edge.
func ExampleStiffGrid() {
	g := StiffGrid{
		Title: "Stiff diagrams (invented data)",
		Waters: []StiffWater{
			{Well: "W-1", Ca: 3.2, Mg: 1.1, Na: 0.9, K: 0.1, HCO3: 4.1, SO4: 0.6, Cl: 0.5},
			{Well: "W-2", Ca: 1.0, Mg: 0.6, Na: 5.5, K: 0.2, HCO3: 5.2, CO3: 0.3, SO4: 0.9, Cl: 0.9},
			{Well: "W-3", Ca: 2.0, Mg: 1.8, Na: 11.6, K: 0.4, HCO3: 2.2, SO4: 1.1, Cl: 12.5},
		},
		MaxMeqL: 10,
	}
	b, err := Render(g, "svg", 18*vg.Centimeter, 8*vg.Centimeter)
	fmt.Println(err == nil, bytes.Contains(b, []byte("W-3")), g.Skipped())
	// Output: true true 0
}

// Pages split the waters in order, keep every water once, and give all
// pages the scale fitted to all waters.
func TestStiffPages(t *testing.T) {
	ws := testStiffWaters() // 12 waters
	ws[5].Na = 40           // one large value sets the common scale
	g := StiffGrid{Title: "Stiff", Waters: ws}
	pages := g.Pages(5)
	if len(pages) != 3 {
		t.Fatalf("%d pages, want 3", len(pages))
	}
	want := stiffScale(0, ws)
	var got []string
	for i, p := range pages {
		if p.MaxMeqL != want {
			t.Errorf("page %d: scale %v, want %v", i+1, p.MaxMeqL, want)
		}
		if wt := fmt.Sprintf("Stiff (page %d of 3)", i+1); p.Title != wt {
			t.Errorf("page %d: title %q, want %q", i+1, p.Title, wt)
		}
		for _, w := range p.Waters {
			got = append(got, w.Well)
		}
	}
	if len(got) != len(ws) || got[0] != "MW-01" || got[11] != "MW-12" || len(pages[2].Waters) != 2 {
		t.Errorf("pages hold %v", got)
	}
	if one := g.Pages(0); len(one) != 1 || one[0].Title != "Stiff" || len(one[0].Waters) != 12 {
		t.Errorf("default page size: %d pages", len(one))
	}
	if empty := (StiffGrid{}).Pages(5); len(empty) != 1 {
		t.Errorf("empty grid: %d pages, want 1", len(empty))
	}
}
