package figure

import (
	"bytes"
	"errors"
	"fmt"
	"image/png"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"gonum.org/v1/plot/vg"
)

// The construction checked here is Piper (1944, "A graphic procedure in the
// geochemical interpretation of water-analyses", Trans. AGU 25, 914-928),
// from memory [M]: cation triangle with Ca, Mg, Na + K corners, anion
// triangle with HCO3 + CO3, SO4, Cl corners, both equilateral, and a
// diamond above them in which a sample is where the projection of its
// cation point (parallel to the Ca-Mg side, i.e. at constant Na + K) meets
// the projection of its anion point (parallel to the Cl-SO4 side, i.e. at
// constant HCO3 + CO3). Ca-HCO3 water lies at the diamond's left corner,
// Na-Cl at its right, Ca(Mg)-SO4/Cl at the top and Na-HCO3 at the bottom.

const piperTol = 1e-12

func near(a, b [2]float64, tol float64) bool {
	return math.Abs(a[0]-b[0]) <= tol && math.Abs(a[1]-b[1]) <= tol
}

func sub2(a, b [2]float64) [2]float64 { return [2]float64{a[0] - b[0], a[1] - b[1]} }

func dist2(a, b [2]float64) float64 { return math.Hypot(a[0]-b[0], a[1]-b[1]) }

// cross2 is the z component of a x b: zero when a and b are parallel.
func cross2(a, b [2]float64) float64 { return a[0]*b[1] - a[1]*b[0] }

// comp is a composition in percent: ca, mg, nak, cl, so4, hco3.
type comp [6]float64

func (c comp) xy() (cat, an, dia [2]float64) { return piperXY(c[0], c[1], c[2], c[3], c[4], c[5]) }

// Pure waters land at the corners. Expected positions follow from the
// layout: triangles of side 1 on y = 0, the anion triangle shifted by
// 1 + gap, the diamond's lower corner midway between them at height
// gap*sin60 (its lower sides parallel to the facing triangle sides, gap
// apart horizontally).
func TestPiperXYCorners(t *testing.T) {
	g, s := piperGap, math.Sqrt(3)/2
	cases := []struct {
		name         string
		c            comp
		cat, an, dia [2]float64
	}{
		{"Ca-HCO3", comp{100, 0, 0, 0, 0, 100}, [2]float64{0, 0}, [2]float64{1 + g, 0}, [2]float64{0.5 + g/2, (1 + g) * s}},
		{"Na-Cl", comp{0, 0, 100, 100, 0, 0}, [2]float64{1, 0}, [2]float64{2 + g, 0}, [2]float64{1.5 + g/2, (1 + g) * s}},
		{"Mg-SO4", comp{0, 100, 0, 0, 100, 0}, [2]float64{0.5, s}, [2]float64{1.5 + g, s}, [2]float64{1 + g/2, (2 + g) * s}},
		{"Ca-Cl", comp{100, 0, 0, 100, 0, 0}, [2]float64{0, 0}, [2]float64{2 + g, 0}, [2]float64{1 + g/2, (2 + g) * s}},
		{"Na-HCO3", comp{0, 0, 100, 0, 0, 100}, [2]float64{1, 0}, [2]float64{1 + g, 0}, [2]float64{1 + g/2, g * s}},
	}
	for _, tc := range cases {
		cat, an, dia := tc.c.xy()
		if !near(cat, tc.cat, piperTol) || !near(an, tc.an, piperTol) || !near(dia, tc.dia, piperTol) {
			t.Errorf("%s: got %v %v %v, want %v %v %v", tc.name, cat, an, dia, tc.cat, tc.an, tc.dia)
		}
	}
	if g < 0.1 || g > 0.2 {
		t.Errorf("gap %g outside the usual 0.1-0.2 of a side", g)
	}
}

// The fields are equilateral with side 1 and the diamond's lower sides are
// parallel to the triangle sides facing them.
func TestPiperXYEquilateral(t *testing.T) {
	caC, caA, caD := comp{100, 0, 0, 0, 0, 100}.xy()
	naC, clA, naclD := comp{0, 0, 100, 100, 0, 0}.xy()
	mgC, so4A, topD := comp{0, 100, 0, 0, 100, 0}.xy()
	_, _, botD := comp{0, 0, 100, 0, 0, 100}.xy()
	for _, tri := range [][3][2]float64{{caC, naC, mgC}, {caA, clA, so4A}} {
		for i := 0; i < 3; i++ {
			if d := dist2(tri[i], tri[(i+1)%3]); math.Abs(d-1) > piperTol {
				t.Errorf("triangle %v: side %d has length %g, want 1", tri, i, d)
			}
		}
	}
	for i, q := range [][2][2]float64{{botD, naclD}, {naclD, topD}, {topD, caD}, {caD, botD}} {
		if d := dist2(q[0], q[1]); math.Abs(d-1) > piperTol {
			t.Errorf("diamond side %d has length %g, want 1", i, d)
		}
	}
	if c := cross2(sub2(caD, botD), sub2(mgC, naC)); math.Abs(c) > piperTol {
		t.Errorf("diamond's lower-left side not parallel to the cation triangle's Na-Mg side (cross %g)", c)
	}
	if c := cross2(sub2(naclD, botD), sub2(so4A, caA)); math.Abs(c) > piperTol {
		t.Errorf("diamond's lower-right side not parallel to the anion triangle's HCO3-SO4 side (cross %g)", c)
	}
}

// Equal parts of the three cations (or anions) put the point at the
// triangle's centroid, the mean of its corners.
func TestPiperXYCentroid(t *testing.T) {
	third := 100.0 / 3
	cat, an, _ := comp{third, third, third, third, third, third}.xy()
	s := math.Sqrt(3) / 2
	if want := [2]float64{0.5, s / 3}; !near(cat, want, 1e-12) {
		t.Errorf("cation point %v, want centroid %v", cat, want)
	}
	if want := [2]float64{1 + piperGap + 0.5, s / 3}; !near(an, want, 1e-12) {
		t.Errorf("anion point %v, want centroid %v", an, want)
	}
}

func randomComp(r *rand.Rand) comp {
	var c comp
	for k := 0; k < 2; k++ {
		a, b, d := r.Float64(), r.Float64(), r.Float64()
		sum := a + b + d
		c[3*k], c[3*k+1], c[3*k+2] = 100*a/sum, 100*b/sum, 100*d/sum
	}
	return c
}

// The diamond point is the crossing of the two projection lines: from the
// cation point parallel to the Ca-Mg side, from the anion point parallel to
// the Cl-SO4 side (directions taken from the corners themselves), and it
// lies above both points and inside the diamond.
func TestPiperXYProjection(t *testing.T) {
	caC, _, caD := comp{100, 0, 0, 0, 0, 100}.xy()
	mgC, so4A, topD := comp{0, 100, 0, 0, 100, 0}.xy()
	_, clA, naclD := comp{0, 0, 100, 100, 0, 0}.xy()
	_, _, botD := comp{0, 0, 100, 0, 0, 100}.xy()
	catDir, anDir := sub2(mgC, caC), sub2(so4A, clA)
	r := rand.New(rand.NewPCG(1944, 1))
	for i := 0; i < 2000; i++ {
		c := randomComp(r)
		cat, an, dia := c.xy()
		if x := cross2(sub2(dia, cat), catDir); math.Abs(x) > 1e-12 {
			t.Fatalf("%v: diamond point %v not on the cation projection line (cross %g)", c, dia, x)
		}
		if x := cross2(sub2(dia, an), anDir); math.Abs(x) > 1e-12 {
			t.Fatalf("%v: diamond point %v not on the anion projection line (cross %g)", c, dia, x)
		}
		if dia[1] <= cat[1] || dia[1] <= an[1] {
			t.Fatalf("%v: diamond point %v not above %v and %v", c, dia, cat, an)
		}
		// Inside the diamond: on the inner side of all four sides.
		sides := [][2][2]float64{{botD, naclD}, {naclD, topD}, {topD, caD}, {caD, botD}}
		for _, sd := range sides {
			if cross2(sub2(sd[1], sd[0]), sub2(dia, sd[0])) < -1e-12 {
				t.Fatalf("%v: diamond point %v outside side %v", c, dia, sd)
			}
		}
	}
}

// Mixing two charge-balanced waters gives points on a straight line in
// each field: the percentages are ratios of meq, linear in the mixing
// fraction up to a common weight. Invented end members (meq/L).
func TestPiperMixingLines(t *testing.T) {
	fresh := PiperPoint{Ca: 2.5, Mg: 0.8, Na: 0.5, K: 0.05, HCO3: 3.0, SO4: 0.4, Cl: 0.45}
	brack := PiperPoint{Ca: 2, Mg: 2.5, Na: 10, K: 0.3, Cl: 10, SO4: 3.8, HCO3: 1, CO3: 0.0}
	mix := func(f float64) PiperPoint {
		m := func(a, b float64) float64 { return f*a + (1-f)*b }
		return PiperPoint{Ca: m(fresh.Ca, brack.Ca), Mg: m(fresh.Mg, brack.Mg), Na: m(fresh.Na, brack.Na), K: m(fresh.K, brack.K),
			Cl: m(fresh.Cl, brack.Cl), SO4: m(fresh.SO4, brack.SO4), HCO3: m(fresh.HCO3, brack.HCO3), CO3: m(fresh.CO3, brack.CO3)}
	}
	xy := func(p PiperPoint) [3][2]float64 {
		ca, mg, nak, cl, so4, hco3, ok := piperPercent(p)
		if !ok {
			t.Fatalf("%+v rejected", p)
		}
		a, b, c := piperXY(ca, mg, nak, cl, so4, hco3)
		return [3][2]float64{a, b, c}
	}
	e0, e1 := xy(brack), xy(fresh)
	for f := 0.05; f < 1; f += 0.05 {
		q := xy(mix(f))
		for k, field := range []string{"cation", "anion", "diamond"} {
			if x := cross2(sub2(q[k], e0[k]), sub2(e1[k], e0[k])); math.Abs(x) > 1e-12 {
				t.Errorf("f=%.2f: %s point %v off the line %v-%v (cross %g)", f, field, q[k], e0[k], e1[k], x)
			}
		}
	}
}

// Every tick sits on the grid line of its component's value: two different
// compositions with that value map to points collinear with the tick.
func TestPiperTicks(t *testing.T) {
	ticks := piperTicks()
	if len(ticks) != 24 {
		t.Fatalf("%d ticks, want 4 on each of 6 edges", len(ticks))
	}
	for _, tk := range ticks {
		v, w := tk.value, 100-tk.value
		var a, b comp
		field := 0 // 0 cation, 1 anion, 2 diamond
		switch tk.axis {
		case "Ca":
			a, b = comp{v, 0, w, 0, 0, 100}, comp{v, w, 0, 0, 0, 100}
		case "Mg":
			a, b = comp{w, v, 0, 0, 0, 100}, comp{0, v, w, 0, 0, 100}
		case "Cl":
			a, b, field = comp{100, 0, 0, v, 0, w}, comp{100, 0, 0, v, w, 0}, 1
		case "SO4":
			a, b, field = comp{100, 0, 0, 0, v, w}, comp{100, 0, 0, w, v, 0}, 1
		case "SO4 + Cl":
			a, b, field = comp{100, 0, 0, v, 0, w}, comp{0, 0, 100, 0, v, w}, 2
		case "Ca + Mg":
			a, b, field = comp{v, 0, w, 100, 0, 0}, comp{0, v, w, 0, 0, 100}, 2
		default:
			t.Fatalf("unknown axis %q", tk.axis)
		}
		pa, pb := pick(a, field), pick(b, field)
		if x := cross2(sub2(tk.at, pa), sub2(pb, pa)); math.Abs(x) > 1e-12 {
			t.Errorf("%s %g tick at %v not on the line through %v and %v (cross %g)", tk.axis, tk.value, tk.at, pa, pb, x)
		}
		if math.Abs(math.Hypot(tk.out[0], tk.out[1])-1) > 1e-12 {
			t.Errorf("%s tick normal %v not a unit vector", tk.axis, tk.out)
		}
	}
}

func pick(c comp, field int) [2]float64 {
	cat, an, dia := c.xy()
	return [3][2]float64{cat, an, dia}[field]
}

func TestPiperSkipped(t *testing.T) {
	good := PiperPoint{Ca: 2, Mg: 1, Na: 1, Cl: 1, SO4: 1, HCO3: 2}
	bad := func(f func(*PiperPoint)) PiperPoint { p := good; f(&p); return p }
	cases := []struct {
		name string
		p    PiperPoint
		skip bool
	}{
		{"good", good, false},
		{"no cations", bad(func(p *PiperPoint) { p.Ca, p.Mg, p.Na, p.K = 0, 0, 0, 0 }), true},
		{"no anions", bad(func(p *PiperPoint) { p.Cl, p.SO4, p.HCO3, p.CO3 = 0, 0, 0, 0 }), true},
		{"NaN", bad(func(p *PiperPoint) { p.Mg = math.NaN() }), true},
		{"Inf", bad(func(p *PiperPoint) { p.CO3 = math.Inf(1) }), true},
		{"negative", bad(func(p *PiperPoint) { p.K = -0.1 }), true},
		{"one ion only", PiperPoint{Na: 3, Cl: 3}, false},
	}
	for _, tc := range cases {
		if got := (Piper{Points: []PiperPoint{tc.p}}).Skipped(); got != map[bool]int{false: 0, true: 1}[tc.skip] {
			t.Errorf("%s: Skipped() = %d", tc.name, got)
		}
	}
	var all []PiperPoint
	for _, tc := range cases {
		all = append(all, tc.p)
	}
	if got := (Piper{Points: all}).Skipped(); got != 5 {
		t.Errorf("Skipped() = %d, want 5", got)
	}
	for _, pts := range [][]PiperPoint{nil, all[1:6]} {
		_, err := Render(Piper{Title: "x", Points: pts}, "png", 8*vg.Centimeter, 7*vg.Centimeter)
		if !errors.Is(err, ErrNoData) {
			t.Errorf("%d invalid points: err = %v, want ErrNoData", len(pts), err)
		}
	}
}

// Groups keep their order of first appearance; past ten groups the rest
// and ungrouped points share "other", which comes last; every style
// differs in colour or shape from every other.
func TestPiperGroups(t *testing.T) {
	var pts []PiperPoint
	for i := 0; i < 14; i++ {
		pts = append(pts, PiperPoint{Group: fmt.Sprintf("g%02d", i)})
	}
	pts = append(pts, PiperPoint{Group: "g01"}, PiperPoint{})
	idx, names := piperGroups(pts)
	if len(names) != piperMaxGroups || names[len(names)-1] != "other" || names[0] != "g00" || names[8] != "g08" {
		t.Fatalf("names %v", names)
	}
	if idx[14] != 1 || idx[15] != piperMaxGroups-1 || idx[13] != piperMaxGroups-1 {
		t.Errorf("idx %v", idx)
	}
	seen := map[string]bool{}
	for k := range names {
		st := styleFor(k)
		key := fmt.Sprint(st.color, st.glyph)
		if seen[key] {
			t.Errorf("style %d repeats colour and shape", k)
		}
		seen[key] = true
	}
	idx, names = piperGroups([]PiperPoint{{Group: "native"}, {}, {Group: "injectate"}})
	if strings.Join(names, ",") != "native,injectate,other" || idx[1] != 2 || idx[2] != 1 {
		t.Errorf("names %v idx %v", names, idx)
	}
}

// testPiper is invented: a fresh Ca-HCO3 group, a brackish Na-Cl group and
// mixtures, in meq/L.
func testPiper() Piper {
	r := rand.New(rand.NewPCG(7, 7))
	var pts []PiperPoint
	for i := 0; i < 12; i++ {
		f := r.Float64()
		pts = append(pts, PiperPoint{
			Label: fmt.Sprintf("S-%d", i), Group: []string{"injectate", "native", "monitoring"}[i%3],
			Ca: 2.5*f + 2*(1-f), Mg: 0.8*f + 2.5*(1-f), Na: 0.5*f + 10*(1-f), K: 0.1,
			Cl: 0.45*f + 10*(1-f), SO4: 0.4*f + 3.8*(1-f), HCO3: 3*f + (1 - f), CO3: 0.05,
		})
	}
	pts = append(pts, PiperPoint{Label: "bad", Group: "native"})
	return Piper{Title: "Piper test (invented data)", Caption: "Invented data.", Points: pts}
}

func TestPiperRender(t *testing.T) {
	w, h := 16*vg.Centimeter, 14*vg.Centimeter
	fig := testPiper()
	if fig.Skipped() != 1 {
		t.Errorf("Skipped() = %d, want 1", fig.Skipped())
	}
	b, err := Render(fig, "png", w, h)
	if err != nil {
		t.Fatal(err)
	}
	img, err := png.Decode(bytes.NewReader(b))
	if err != nil {
		t.Fatal(err)
	}
	// PNG pixels = length in points x dpi / 72.
	wantW, wantH := int(w.Points()*PNGDPI/72+0.5), int(h.Points()*PNGDPI/72+0.5)
	if got := img.Bounds(); got.Dx() != wantW || got.Dy() != wantH {
		t.Errorf("size %dx%d, want %dx%d", got.Dx(), got.Dy(), wantW, wantH)
	}
	if n := distinctColors(img); n < 50 {
		t.Errorf("only %d distinct colours", n)
	}
	if f := inkFraction(img); f < 0.01 || f > 0.5 {
		t.Errorf("non-white fraction %.3f", f)
	}

	b, err = Render(fig, "svg", w, h)
	if err != nil {
		t.Fatal(err)
	}
	texts := svgTexts(t, b)
	for _, want := range []string{"Ca2+", "Mg2+", "Na+ + K+", "Cl-", "SO4 2-", "HCO3- + CO3 2-", "SO4 2- + Cl-", "Ca2+ + Mg2+",
		"injectate", "native", "monitoring", "Piper test (invented data)", "80"} {
		if !texts[want] {
			t.Errorf("SVG has no <text> %q", want)
		}
	}
	if !strings.Contains(strings.Join(keys(texts), "|"), "1 sample(s) left out") {
		t.Error("SVG does not report the skipped sample")
	}

	b, err = Render(fig, "pdf", w, h)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.HasPrefix(b, []byte("%PDF")) {
		t.Errorf("PDF starts %q", b[:min(8, len(b))])
	}
}

// The labels use only characters the PDF fonts encode (ASCII here).
func TestPiperLabelsASCII(t *testing.T) {
	b, err := Render(testPiper(), "svg", 16*vg.Centimeter, 14*vg.Centimeter)
	if err != nil {
		t.Fatal(err)
	}
	for s := range svgTexts(t, b) {
		if pdfText(s) != s {
			t.Errorf("label %q does not survive the PDF encoding", s)
		}
	}
}

func keys(m map[string]bool) []string {
	var ks []string
	for k := range m {
		ks = append(ks, k)
	}
	return ks
}

// A Piper diagram of two invented waters and their 1:1 mixture, in meq/L;
// the sample without anions is left out and counted.
func ExamplePiper() {
	fig := Piper{
		Title: "Piper diagram (invented data)",
		Points: []PiperPoint{
			{Label: "INJ-1", Group: "injectate", Ca: 2.5, Mg: 0.8, Na: 0.5, K: 0.05, HCO3: 3.0, SO4: 0.4, Cl: 0.45},
			{Label: "NW-1", Group: "native", Ca: 2, Mg: 2.5, Na: 10, K: 0.3, Cl: 10, SO4: 3.8, HCO3: 1},
			{Label: "MW-1", Group: "monitoring", Ca: 2.25, Mg: 1.65, Na: 5.25, K: 0.175, Cl: 5.225, SO4: 2.1, HCO3: 2},
			{Label: "MW-2", Group: "monitoring", Ca: 1.2, Na: 0.4},
		},
	}
	b, err := Render(fig, "png", 16*vg.Centimeter, 14*vg.Centimeter)
	if err != nil {
		fmt.Println(err)
		return
	}
	img, err := png.Decode(bytes.NewReader(b))
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(img.Bounds().Dx(), "x", img.Bounds().Dy(), "pixels;", fig.Skipped(), "skipped")
	// Output: 1890 x 1654 pixels; 1 skipped
}
