package site

import (
	"errors"
	"fmt"
	"math"

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
	// MaxWellsKriging is the most distinct wells a surface is kriged from:
	// ordinary kriging with its leave-one-out check grows with the cube of the
	// wells, and beyond a few hundred wells inverse-distance weighting reaches
	// the same detail in a small share of the time (common practice).
	MaxWellsKriging = 200
)

// MaxSurfaceCVRMSE is the largest leave-one-out cross-validation RMSE (SI
// units) of a surface that is drawn: the near-equilibrium band used in
// every table and figure (assess.NearEquilibriumBand). A surface that
// misses the wells it leaves out by more than the band cannot tell a
// supersaturated area from a near-equilibrium one.
const MaxSurfaceCVRMSE = assess.NearEquilibriumBand

// positionKey rounds a projected position to the metre.
func positionKey(p orb.Point) [2]int64 {
	return [2]int64{int64(math.Round(p[0])), int64(math.Round(p[1]))}
}

// meanByPosition merges points at one position (to 1 m) into one, at the mean
// of their values, in the order each position first appears.
func meanByPosition(pts []orb.Point, vals []float64) ([]orb.Point, []float64) {
	idx := make(map[[2]int64]int, len(pts))
	var outP []orb.Point
	var sum []float64
	var cnt []int
	for i, p := range pts {
		k := positionKey(p)
		j, ok := idx[k]
		if !ok {
			j = len(outP)
			idx[k] = j
			outP = append(outP, p)
			sum = append(sum, 0)
			cnt = append(cnt, 0)
		}
		sum[j] += vals[i]
		cnt[j]++
	}
	outV := make([]float64, len(sum))
	for j := range sum {
		outV[j] = sum[j] / float64(cnt[j])
	}
	return outP, outV
}

// surfaceFor decides whether a surface is drawn for the wells and makes it.
// It fills row's Method, CV, Drawn and Note, and returns the surface only
// when it is to be drawn.
func surfaceFor(pts []orb.Point, vals []float64, method string, row *SurfaceRow) *geo.Surface {
	// Samples at one position (a well sampled twice in a round and zone) are
	// one well of the surface, at their mean SI.
	pts, vals = meanByPosition(pts, vals)
	n := len(pts)
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
	} else if n > MaxWellsKriging {
		note = fmt.Sprintf("IDW, not kriging: %d wells, more than the %d kriged (common practice: the cost grows with the cube of the wells)", n, MaxWellsKriging)
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
