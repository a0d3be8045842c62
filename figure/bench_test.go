package figure

import (
	"testing"

	"gonum.org/v1/plot/vg"
)

func BenchmarkRenderSIMapPNG(b *testing.B) {
	m := testMap()
	for b.Loop() {
		if _, err := Render(m, "png", testW, testH); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkRenderSIMapSVG(b *testing.B) {
	m := testMap()
	for b.Loop() {
		if _, err := Render(m, "svg", testW, testH); err != nil {
			b.Fatal(err)
		}
	}
}

// A three-round map figure at the report's size (16.5 cm wide, height
// fitted), the report's main figure: it should render well under a second.
func BenchmarkRenderSIMapsThreePanelsPNG(b *testing.B) {
	m := testMap()
	ms := SIMaps{Title: "calcite, 40 m depth", Maps: []SIMap{m, m, m}}
	w := 16.5 * vg.Centimeter
	h := ms.FitHeight(w)
	for b.Loop() {
		if _, err := Render(ms, "png", w, h); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkRenderDepthProfilePNG(b *testing.B) {
	p := testProfile()
	for b.Loop() {
		if _, err := Render(p, "png", 16.5*vg.Centimeter, 12*vg.Centimeter); err != nil {
			b.Fatal(err)
		}
	}
}
