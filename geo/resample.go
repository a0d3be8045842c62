package geo

import (
	"fmt"
	"math"

	"github.com/paulmach/orb"
)

// ResampleToCRS resamples a grid in a LocalFrame onto a north-up raster in
// the projected CRS epsg (a UTM zone, e.g. UTMEPSG(frame.Centre)), with the
// grid's cell size. Each raster cell takes the value of the grid cell its
// centre falls in (nearest neighbour: no value is invented, and the empty
// cells beyond the wells stay empty).
func ResampleToCRS(g *Grid, frame LocalFrame, epsg int) (Raster, error) {
	c, err := ParseEPSG(epsg)
	if err != nil {
		return Raster{}, err
	}
	if c.Geographic {
		return Raster{}, fmt.Errorf("%w: EPSG:%d is geographic; resampling needs a projected CRS", ErrUnsupportedCRS, epsg)
	}
	if g == nil || g.NX < 1 || g.NY < 1 || g.Count() == 0 {
		return Raster{}, fmt.Errorf("%w: grid has no estimate", ErrRaster)
	}
	tm := c.Projection()
	// Extent in the target CRS of the valid cells' corners.
	w, e, s, n := math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)
	for j := 0; j < g.NY; j++ {
		for i := 0; i < g.NX; i++ {
			if !g.Valid(i, j) {
				continue
			}
			for _, d := range [4][2]float64{{-.5, -.5}, {.5, -.5}, {.5, .5}, {-.5, .5}} {
				ll := frame.Inverse(orb.Point{g.X(i) + d[0]*g.DX, g.Y(j) + d[1]*g.DY})
				x, y, err := tm.Forward(ll[0], ll[1])
				if err != nil {
					return Raster{}, fmt.Errorf("geo: resampling cell (%d, %d): %w", i, j, err)
				}
				w, e, s, n = math.Min(w, x), math.Max(e, x), math.Min(s, y), math.Max(n, y)
			}
		}
	}
	px := math.Min(g.DX, g.DY)
	// Snap the raster to whole pixels of the target CRS.
	w, n = math.Floor(w/px)*px, math.Ceil(n/px)*px
	r := Raster{EPSG: epsg, West: w, North: n, PixelW: px, PixelH: px,
		Cols: int(math.Ceil((e - w) / px)), Rows: int(math.Ceil((n - s) / px))}
	r.Values = make([]float64, r.Cols*r.Rows)
	r.Mask = make([]bool, r.Cols*r.Rows)
	for row := 0; row < r.Rows; row++ {
		for col := 0; col < r.Cols; col++ {
			x := w + (float64(col)+0.5)*px
			y := n - (float64(row)+0.5)*px
			lon, lat, err := tm.Inverse(x, y)
			if err != nil {
				continue
			}
			q := frame.Forward(orb.Point{lon, lat})
			i := int(math.Round((q[0] - g.X0) / g.DX))
			j := int(math.Round((q[1] - g.Y0) / g.DY))
			if v, ok := g.At(i, j); ok && finite(v) {
				k := row*r.Cols + col
				r.Values[k], r.Mask[k] = v, true
			}
		}
	}
	return r, nil
}
