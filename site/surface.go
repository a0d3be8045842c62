package site

import (
	"errors"
	"fmt"

	"github.com/paulmach/orb"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/geo"
)

// When a surface is drawn. A map shows an interpolated surface only when it
// rests on enough wells and predicts the wells it leaves out to better than
// the near-equilibrium band; otherwise it shows the measured values alone.
const (
	// MinWellsSurface is the fewest distinct wells for any surface (common
	// practice: with fewer, the leave-one-out error rests on too few
	// wells to judge the surface, and the surface is mostly the
	// interpolator's shape, not the data's).
	MinWellsSurface = 10
	// MinWellsKriging is the fewest distinct wells for fitting a variogram
	// and kriging (common practice: a variogram needs 30 or more pairs of
	// wells in each distance class, which a field of fewer than 20-30 wells
	// cannot give); with fewer, inverse-distance weighting is used.
	MinWellsKriging = 20
)

// MaxSurfaceCVRMSE is the largest leave-one-out cross-validation RMSE (SI
// units) of a surface that is drawn: the near-equilibrium band used in
// every table and figure (assess.NearEquilibriumBand). A surface that
// misses the wells it leaves out by more than the band cannot tell a
// supersaturated area from a near-equilibrium one.
const MaxSurfaceCVRMSE = assess.NearEquilibriumBand

// distinctPoints counts points at distinct positions (to 1 m).
func distinctPoints(pts []orb.Point) int {
	seen := map[[2]int64]bool{}
	for _, p := range pts {
		seen[[2]int64{int64(p[0] + 0.5), int64(p[1] + 0.5)}] = true
	}
	return len(seen)
}

// surfaceFor decides whether a surface is drawn for the wells and makes it.
// It fills row's Method, CV, Drawn and Note, and returns the surface only
// when it is to be drawn.
func surfaceFor(pts []orb.Point, vals []float64, method string, row *SurfaceRow) *geo.Surface {
	n := distinctPoints(pts)
	if n < MinWellsSurface {
		row.Method = "none"
		row.Note = fmt.Sprintf("no surface: %d wells, fewer than the %d needed (common practice); measured values shown", n, MinWellsSurface)
		return nil
	}
	var s *geo.Surface
	var err error
	note := ""
	if method == "idw" {
		s, err = geo.InterpolateIDW(pts, vals, geo.GridOptions{}, geo.IDWOptions{})
	} else if n < MinWellsKriging {
		note = fmt.Sprintf("IDW, not kriging: %d wells, fewer than the %d a variogram needs (common practice)", n, MinWellsKriging)
		s, err = geo.InterpolateIDW(pts, vals, geo.GridOptions{}, geo.IDWOptions{})
	} else {
		s, err = geo.InterpolateKriging(pts, vals, geo.GridOptions{}, geo.KrigingOptions{})
		if err != nil && !errors.Is(err, geo.ErrTooFewWells) {
			note = fmt.Sprintf("IDW, not kriging: %v", err)
			s, err = geo.InterpolateIDW(pts, vals, geo.GridOptions{}, geo.IDWOptions{})
		}
	}
	if err != nil {
		row.Method = "none"
		row.Note = fmt.Sprintf("no surface: %v; measured values shown", err)
		return nil
	}
	row.Method, row.CVRMSE, row.HasCV = s.Method, s.CVRMSE, true
	if s.CVRMSE >= MaxSurfaceCVRMSE {
		row.Note = fmt.Sprintf("no surface: leave-one-out error %.2f SI is not below the near-equilibrium band %.1f; measured values shown", s.CVRMSE, MaxSurfaceCVRMSE)
		return nil
	}
	row.Drawn = true
	row.Note = fmt.Sprintf("surface drawn: %d wells, leave-one-out error %.2f SI below the band %.1f", n, s.CVRMSE, MaxSurfaceCVRMSE)
	if note != "" {
		row.Note = note + "; " + row.Note
	}
	return s
}
