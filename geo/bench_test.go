package geo

import (
	"io"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/paulmach/orb"
)

func benchWells() ([]orb.Point, []float64) {
	r := rand.New(rand.NewPCG(99, 100))
	pts := randomWells(r, 100, 2000)
	vals := make([]float64, len(pts))
	for i, p := range pts {
		vals[i] = math.Sin(p[0]/400) + 0.3*math.Cos(p[1]/300) + 0.05*r.NormFloat64()
	}
	return pts, vals
}

// 100 wells onto a 200x200 grid, including mask and LOO cross-validation.
func BenchmarkIDW100Wells200x200(b *testing.B) {
	pts, vals := benchWells()
	for b.Loop() {
		if _, err := InterpolateIDW(pts, vals, GridOptions{NX: 200, NY: 200}, IDWOptions{}); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkIDW100Wells200x200Neighbours12(b *testing.B) {
	pts, vals := benchWells()
	for b.Loop() {
		if _, err := InterpolateIDW(pts, vals, GridOptions{NX: 200, NY: 200}, IDWOptions{Neighbours: 12}); err != nil {
			b.Fatal(err)
		}
	}
}

// Includes the variogram fit (both models), factorisation, mask and LOO.
func BenchmarkKriging100Wells200x200(b *testing.B) {
	pts, vals := benchWells()
	for b.Loop() {
		if _, err := InterpolateKriging(pts, vals, GridOptions{NX: 200, NY: 200}, KrigingOptions{}); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkUTMForward(b *testing.B) {
	tm := CRS{Zone: 14}.Projection()
	for b.Loop() {
		tm.Forward(-99.5, 31.9)
	}
}

func BenchmarkUTMInverse(b *testing.B) {
	tm := CRS{Zone: 14}.Projection()
	for b.Loop() {
		tm.Inverse(452000, 3529000)
	}
}

func BenchmarkDistance(b *testing.B) {
	p, q := orb.Point{-101.15, 31.9}, orb.Point{-101.14, 31.905}
	for b.Loop() {
		Distance(p, q)
	}
}

// A 200 x 200 float32 GeoTIFF and the equilibrium layers of its grid.
func BenchmarkWriteGeoTIFF200x200(b *testing.B) {
	pts, vals := benchWells()
	s, err := InterpolateIDW(pts, vals, GridOptions{NX: 200, NY: 200}, IDWOptions{})
	if err != nil {
		b.Fatal(err)
	}
	r := RasterFromGrid(s.Grid, 32633)
	for b.Loop() {
		if err := WriteGeoTIFF(io.Discard, r); err != nil {
			b.Fatal(err)
		}
		_ = Isolines(s.Grid, 0)
		_ = BandCells(s.Grid, -0.5, 0.5)
	}
}
