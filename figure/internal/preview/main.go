// Command preview renders every figure kind of package figure from invented
// demo data (a made-up well field, not a real site) to PNG files in a
// folder, for looking at: go run ./maps/internal/preview [-out dir].
package main

import (
	"bytes"
	"flag"
	"fmt"
	"image"
	"image/color"
	"image/png"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"

	"gwsat.dev/gwsat/figure"

	"gonum.org/v1/plot/vg"
)

func main() {
	out := flag.String("out", "/tmp/maps-preview", "output folder")
	flag.Parse()
	if err := os.MkdirAll(*out, 0o755); err != nil {
		fmt.Fprintln(os.Stderr, err)
		os.Exit(1)
	}
	w, h := 16*vg.Centimeter, 12*vg.Centimeter
	figs := map[string]figure.Figure{
		"simap":        DemoMap(),
		"simap-deg":    DemoMapDegrees(),
		"wellsonly":    DemoWellsOnly(),
		"profile":      DemoProfile(),
		"profile-elev": DemoProfileElevation(),
		"mixing":       DemoMixing(),
		"temperature":  DemoTemperature(),
		"bars":         DemoBars(),
		"panels":       figure.Panels([]figure.Figure{DemoMap(), DemoWellsOnly()}, 2),
		"piper":        DemoPiper(),
	}
	for name, f := range figs {
		for _, format := range []string{"png", "svg", "pdf"} {
			w, h := w, h
			if name == "piper" {
				h = 14 * vg.Centimeter // the diagram is nearly as tall as wide
			}
			b, err := figure.Render(f, format, w, h)
			if err != nil {
				fmt.Fprintf(os.Stderr, "%s.%s: %v\n", name, format, err)
				os.Exit(1)
			}
			if err := os.WriteFile(filepath.Join(*out, name+"."+format), b, 0o644); err != nil {
				fmt.Fprintln(os.Stderr, err)
				os.Exit(1)
			}
			if format == "png" && name == "simap" {
				g, err := grey(b)
				if err == nil {
					_ = os.WriteFile(filepath.Join(*out, name+"-grey.png"), g, 0o644)
				}
			}
		}
	}
}

func grey(b []byte) ([]byte, error) {
	img, err := png.Decode(bytes.NewReader(b))
	if err != nil {
		return nil, err
	}
	g := image.NewGray(img.Bounds())
	for y := img.Bounds().Min.Y; y < img.Bounds().Max.Y; y++ {
		for x := img.Bounds().Min.X; x < img.Bounds().Max.X; x++ {
			g.Set(x, y, color.GrayModel.Convert(img.At(x, y)))
		}
	}
	var buf bytes.Buffer
	err = png.Encode(&buf, g)
	return buf.Bytes(), err
}

// Invented demo site: 30 wells in three clusters over about 2 km, two
// injection wells raising SI around them.
var inj = [][2]float64{{500800, 4200900}, {501500, 4201400}}

func field(x, y float64) float64 {
	v := -0.9 + 0.0002*(x-500000)
	for _, p := range inj {
		d := math.Hypot(x-p[0], y-p[1])
		v += 1.6 * math.Exp(-d*d/(2*300*300))
	}
	return v
}

func demoWells() []figure.Well {
	r := rand.New(rand.NewPCG(1, 2))
	centres := [][2]float64{{500700, 4200800}, {501500, 4201350}, {501900, 4200500}}
	var ws []figure.Well
	n := 0
	for ci, c := range centres {
		for k := 0; k < 9; k++ {
			n++
			x := c[0] + r.NormFloat64()*180
			y := c[1] + r.NormFloat64()*180
			ws = append(ws, figure.Well{X: x, Y: y, SI: field(x, y) + r.NormFloat64()*0.05, Label: fmt.Sprintf("MW-%02d", n), Marker: figure.MarkerWell})
			_ = ci
		}
	}
	ws = append(ws, figure.Well{X: inj[0][0], Y: inj[0][1], SI: field(inj[0][0], inj[0][1]), Label: "INJ-1", Marker: figure.MarkerInjection})
	ws = append(ws, figure.Well{X: inj[1][0], Y: inj[1][1], SI: field(inj[1][0], inj[1][1]), Label: "INJ-2", Marker: figure.MarkerInjection})
	ws = append(ws, figure.Well{X: 500300, Y: 4201700, SI: math.NaN(), Label: "OB-1", Marker: figure.MarkerMonitoring})
	return ws
}

func DemoMap() figure.SIMap {
	g := &figure.Grid{X0: 500000, Y0: 4200000, DX: 25, DY: 25, NX: 100, NY: 84}
	g.Z = make([]float64, g.NX*g.NY)
	g.Valid = make([]bool, g.NX*g.NY)
	for j := 0; j < g.NY; j++ {
		for i := 0; i < g.NX; i++ {
			x, y := g.X0+float64(i)*g.DX, g.Y0+float64(j)*g.DY
			k := j*g.NX + i
			g.Z[k] = field(x, y)
			// blank outside an ellipse standing in for hull + buffer
			dx, dy := (x-501200)/1050, (y-4201000)/850
			g.Valid[k] = dx*dx+dy*dy < 1
		}
	}
	return figure.SIMap{
		Title:   "calcite saturation index, demo site (invented data)",
		Caption: "calcite; sampling round 2026-Q3; SI at the aquifer temperature 18 °C; Truesdell-Jones activities; ordinary kriging. Screening results, not a design.",
		Grid:    g, Wells: demoWells(),
		Features: []figure.Feature{
			{Kind: figure.FeaturePolygon, Name: "site boundary", Coords: [][2]float64{{500100, 4200150}, {502350, 4200100}, {502400, 4201950}, {500150, 4201900}, {500100, 4200150}}},
			{Kind: figure.FeatureLine, Name: "creek", Coords: [][2]float64{{500000, 4201500}, {500600, 4201600}, {501200, 4201900}, {501800, 4202050}}},
		},
		Units: figure.UnitsMetres, CVRMSE: 0.137, HasCV: true, NorthArrow: true, ScaleBar: true,
	}
}

func DemoMapDegrees() figure.SIMap {
	m := DemoMap()
	m.Title = "baryte saturation index (degrees, invented data)"
	m.Grid = nil
	m.Features = nil
	m.Units = figure.UnitsDegrees
	for i := range m.Wells {
		m.Wells[i].X = -3.0 + (m.Wells[i].X-500000)/80000
		m.Wells[i].Y = 37.9 + (m.Wells[i].Y-4200000)/111000
	}
	return m
}

func DemoWellsOnly() figure.SIMap {
	m := DemoMap()
	m.Title = "gypsum SI at wells (no surface)"
	m.Grid = nil
	m.HasCV = false
	for i := range m.Wells {
		m.Wells[i].SI -= 0.6
	}
	return m
}

func DemoProfile() figure.DepthProfile {
	mk := func(label string, off float64, deep float64) figure.ProfileLine {
		var d, s []float64
		for z := 10.0; z <= 150; z += 20 {
			d = append(d, z)
			s = append(s, -1.5+off+deep*(1/(1+math.Exp(-(z-90)/12))))
		}
		return figure.ProfileLine{Label: label, Depth: d, SI: s}
	}
	return figure.DepthProfile{
		Title:   "Saturation index with depth, three well nests (invented data)",
		Caption: "Round 2026-Q3; in-situ temperature; Truesdell-Jones activities. Grey band: near equilibrium (±0.5, common practice). Screening results, not a design.",
		Panels: []figure.ProfilePanel{
			{Mineral: "calcite", Lines: []figure.ProfileLine{mk("Nest A", 1.2, 0.8), mk("Nest B", 1.0, 0.6), mk("Nest C", 0.7, 0.9)}},
			{Mineral: "gypsum", Lines: []figure.ProfileLine{mk("Nest A", 0.1, 0.5), mk("Nest B", 0.0, 0.7), mk("Nest C", 0.3, 0.4)}},
			{Mineral: "baryte", Lines: []figure.ProfileLine{mk("Nest A", 0.2, 2.5), mk("Nest B", 0.4, 2.2), mk("Nest C", 0.1, 2.6)}},
		},
	}
}

func DemoMixing() figure.Curves {
	var ss []figure.Series
	for i, m := range []struct {
		name    string
		a, b, c float64
	}{{"calcite", 0.3, 1.2, -0.9}, {"gypsum", -1.2, 0.9, -0.2}, {"baryte", -0.5, 3.4, -3.0}, {"celestine", -1.4, 1.0, -0.3}} {
		var x, y []float64
		for f := 0.0; f <= 1.0001; f += 0.05 {
			x = append(x, f)
			y = append(y, m.a+m.b*f+m.c*f*f+0.0*float64(i))
		}
		ss = append(ss, figure.Series{Name: m.name, X: x, Y: y})
	}
	return figure.Curves{
		Title: "Mixing injectate with native water at 18 °C (invented data)", XLabel: "Fraction of injectate (by mass of water)", YLabel: "Saturation index (log IAP/K)",
		Caption: "Each curve's maximum marked. Screening results, not a design; defer to local codes and licensed professionals.",
		Series:  ss, ZeroLine: true, AnnotateMax: true,
	}
}

func DemoTemperature() figure.Curves {
	var ss []figure.Series
	for _, m := range []struct {
		name string
		a, b float64
	}{{"calcite", 0.1, 0.012}, {"anhydrite", -1.0, 0.015}, {"gypsum", -0.5, -0.002}, {"baryte", 0.4, -0.004}} {
		var x, y []float64
		for t := 10.0; t <= 90; t += 5 {
			x = append(x, t)
			y = append(y, m.a+m.b*(t-10))
		}
		ss = append(ss, figure.Series{Name: m.name, X: x, Y: y})
	}
	return figure.Curves{Title: "Heating the injectate (invented data)", XLabel: "Temperature (°C)", YLabel: "Saturation index (log IAP/K)", Series: ss, ZeroLine: true}
}

func DemoBars() figure.Bars {
	return figure.Bars{
		Title: "Precipitation potential per mineral (invented data)", YLabel: "Precipitate (mg/L)",
		Caption:     "Upper bound: no kinetics, all supersaturation removed. Screening results, not a design.",
		Labels:      []string{"calcite", "gypsum", "baryte", "celestine", "siderite"},
		Values:      []float64{42.3, 0, 3.1, 0.8, 12.5},
		Secondary:   []float64{35.0, 0, 3.0, 0.2, 9.8},
		PrimaryName: "alone", SecondaryName: "together",
	}
}

func DemoProfileElevation() figure.DepthProfile {
	d := DemoProfile()
	d.Elevation = true
	for _, p := range d.Panels {
		for _, l := range p.Lines {
			for i := range l.Depth {
				l.Depth[i] = 212 - l.Depth[i] // ground at 212 m above datum
			}
		}
	}
	return d
}

// DemoPiper is an invented injection scenario: a fresh Ca-HCO3 injectate,
// a brackish Na-Cl-SO4 native water (both end members charge balanced, in
// meq/L) with scatter around each, and monitoring samples that are exact
// mixtures of the two mean waters, so that they fall on straight lines in
// all three fields of the diagram.
func DemoPiper() figure.Piper {
	fresh := figure.PiperPoint{Ca: 2.5, Mg: 0.8, Na: 0.5, K: 0.05, HCO3: 3.0, SO4: 0.4, Cl: 0.45}
	brack := figure.PiperPoint{Ca: 2, Mg: 2.5, Na: 10, K: 0.3, Cl: 10, SO4: 3.8, HCO3: 1}
	r := rand.New(rand.NewPCG(3, 4))
	jitter := func(p figure.PiperPoint, rel float64) figure.PiperPoint {
		for _, v := range []*float64{&p.Ca, &p.Mg, &p.Na, &p.K, &p.Cl, &p.SO4, &p.HCO3} {
			*v *= math.Exp(r.NormFloat64() * rel)
		}
		return p
	}
	var pts []figure.PiperPoint
	for i := 0; i < 10; i++ {
		p := jitter(fresh, 0.12)
		p.Label, p.Group = fmt.Sprintf("INJ-%02d", i+1), "injectate"
		pts = append(pts, p)
	}
	for i := 0; i < 10; i++ {
		p := jitter(brack, 0.12)
		p.Label, p.Group = fmt.Sprintf("NW-%02d", i+1), "native"
		pts = append(pts, p)
	}
	for i := 1; i <= 19; i++ {
		f := float64(i) / 20 // fraction of injectate
		mix := func(a, b float64) float64 { return f*a + (1-f)*b }
		pts = append(pts, figure.PiperPoint{
			Label: fmt.Sprintf("MW-%02d", i), Group: "monitoring (mixture)",
			Ca: mix(fresh.Ca, brack.Ca), Mg: mix(fresh.Mg, brack.Mg), Na: mix(fresh.Na, brack.Na), K: mix(fresh.K, brack.K),
			Cl: mix(fresh.Cl, brack.Cl), SO4: mix(fresh.SO4, brack.SO4), HCO3: mix(fresh.HCO3, brack.HCO3),
		})
	}
	return figure.Piper{
		Title:   "Piper diagram, injectate, native water and monitoring wells (invented data)",
		Caption: "Invented demo data: monitoring samples are mixtures of the two end members in steps of 5 %. Screening results, not a design; defer to local codes and licensed professionals.",
		Points:  pts,
	}
}
