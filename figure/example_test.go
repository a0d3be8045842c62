package figure_test

import (
	"bytes"
	"fmt"
	"image/png"
	"math"

	"gwsat.dev/gwsat/figure"

	"gonum.org/v1/plot/vg"
)

// Render a mixing curve (invented numbers) to a 300 dpi PNG and report its
// size in pixels: 16 cm x 12 cm at 300 dpi.
func ExampleRender() {
	fig := figure.Curves{
		Title:  "calcite on mixing (invented data)",
		XLabel: "Fraction of injectate", YLabel: "Saturation index",
		Series:   []figure.Series{{Name: "calcite", X: []float64{0, 0.5, 1}, Y: []float64{-0.4, 0.3, 0.1}}},
		ZeroLine: true, AnnotateMax: true,
	}
	b, err := figure.Render(fig, "png", 16*vg.Centimeter, 12*vg.Centimeter)
	if err != nil {
		fmt.Println(err)
		return
	}
	img, err := png.Decode(bytes.NewReader(b))
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(img.Bounds().Dx(), "x", img.Bounds().Dy())
	// Output: 1890 x 1417
}

// A map of wells only (no interpolated surface); the well with a missing
// coordinate is left out and counted.
func ExampleSIMap() {
	m := figure.SIMap{
		Title: "gypsum SI at wells (invented data)",
		Wells: []figure.Well{
			{X: 1000, Y: 2000, SI: -0.8, Label: "W-1"},
			{X: 1400, Y: 2300, SI: 0.4, Label: "W-2", Marker: figure.MarkerInjection},
			{X: math.NaN(), Y: 2100, SI: 0.1, Label: "W-3"},
		},
		Units: figure.UnitsMetres, ScaleBar: true, NorthArrow: true,
	}
	b, err := figure.Render(m, "svg", 16*vg.Centimeter, 12*vg.Centimeter)
	fmt.Println(err == nil, bytes.Contains(b, []byte("W-2")), m.Skipped(), m.ColorLimit())
	// Output: true true 1 1
}

// A depth profile with the default near-equilibrium band of ±0.5.
func ExampleDepthProfile() {
	p := figure.DepthProfile{
		Title: "baryte with depth (invented data)",
		Panels: []figure.ProfilePanel{{Mineral: "baryte", Lines: []figure.ProfileLine{
			{Label: "Nest A", Depth: []float64{10, 40, 80}, SI: []float64{-1.2, -0.1, 0.9}},
		}}},
	}
	b, err := figure.Render(p, "pdf", 16*vg.Centimeter, 12*vg.Centimeter)
	fmt.Println(err == nil, string(b[:4]))
	// Output: true %PDF
}

// A figure with nothing to draw is an error, not a blank image.
func ExampleBars() {
	_, err := figure.Render(figure.Bars{Labels: []string{"calcite"}, Values: []float64{math.NaN()}}, "png", 10*vg.Centimeter, 8*vg.Centimeter)
	fmt.Println(err)
	// Output: figure: no data to draw: bar chart "" has no finite value
}

// The colour of SI = 0 is the near-white neutral of the scale.
func ExampleDiverging() {
	d := figure.Diverging{Limit: 1.5}
	fmt.Println(d.Color(0) == d.Neutral(), d.Color(-1.5) != d.Color(1.5))
	// Output: true true
}

// Several maps on one page, two to a row.
func ExamplePanels() {
	a := figure.SIMap{Title: "Round 1", Wells: []figure.Well{{X: 0, Y: 0, SI: -0.3, Label: "W-1"}}}
	b := figure.SIMap{Title: "Round 2", Wells: []figure.Well{{X: 0, Y: 0, SI: 0.6, Label: "W-1"}}}
	out, err := figure.Render(figure.Panels([]figure.Figure{a, b}, 2), "png", 24*vg.Centimeter, 10*vg.Centimeter)
	fmt.Println(err == nil, len(out) > 0)
	// Output: true true
}

// A mineral is drawn alike in every figure: its colour (hex), marker and
// dash pattern come from one registry.
func ExampleMineralStyle() {
	for _, m := range []string{"calcite", "Baryte", "gypsum"} {
		st := figure.MineralStyle(m)
		fmt.Printf("%s: #%02X%02X%02X %s dashes %v\n", m, st.Color.R, st.Color.G, st.Color.B, st.Marker, st.Dashes)
	}
	// Output:
	// calcite: #0072B2 circle dashes []
	// Baryte: #CC79A7 diamond dashes [7 2.5 1.5 2.5]
	// gypsum: #009E73 square dashes [1.5 2.5]
}

// Three sampling rounds of one mineral on one page, with one legend and
// colour bar; the page height is fitted to the maps' shape at A4 text width.
func ExampleSIMaps() {
	wells := []figure.Well{
		{X: 500100, Y: 4200100, SI: -0.6, Label: "MW-1"},
		{X: 500900, Y: 4200300, SI: 0.2, Label: "MW-2"},
		{X: 500500, Y: 4200800, SI: 0.7, Label: "MW-3", Marker: figure.MarkerInjection},
	}
	var maps []figure.SIMap
	for _, r := range []string{"1", "2", "3"} {
		maps = append(maps, figure.SIMap{Title: "round " + r, Note: "measured values only: 3 wells",
			Wells: wells, PostValues: true, NorthArrow: true, ScaleBar: true})
	}
	fig := figure.SIMaps{Title: "calcite (invented data)", Maps: maps}
	w := 16.5 * vg.Centimeter
	h := fig.FitHeight(w)
	b, err := figure.Render(fig, "png", w, h)
	fmt.Println(err == nil && len(b) > 0, h > 0.4*w && h < 1.6*w)
	// Output: true true
}
