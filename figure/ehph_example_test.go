package figure_test

import (
	"fmt"

	"gonum.org/v1/plot/vg"

	"gwsat.dev/gwsat/figure"
)

// A pe-pH diagram from plain values (here two invented fields); the geometry of a
// real one comes from speciation.IronPEPH.
func ExampleEhPHDiagram() {
	d := figure.EhPHDiagram{
		Title: "Iron, 25 C", PHMin: 0, PHMax: 14, PEMin: -10, PEMax: 20, EhPerPE: 0.05916,
		Fields: []figure.EhPHField{
			{Name: "Fe2+", Polygons: [][][2]float64{{{0, -10}, {14, -10}, {14, 0}, {0, 13}}}},
			{Name: "ferrihydrite", Solid: true, Polygons: [][][2]float64{{{0, 13}, {14, 0}, {14, 20}, {0, 20}}}},
		},
		Boundaries: [][4]float64{{0, 13, 14, 0}},
		WaterUpper: [4]float64{0, 20.75, 14, 6.75},
		WaterLower: [4]float64{0, 0, 14, -14},
		Samples:    []figure.EhPHSample{{Label: "well 3", PH: 7.1, PE: 4}},
	}
	b, err := figure.Render(d, "png", 16*vg.Centimeter, 13*vg.Centimeter)
	fmt.Println(err == nil && len(b) > 0)
	// Output: true
}
