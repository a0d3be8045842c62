package figure

import "testing"

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
