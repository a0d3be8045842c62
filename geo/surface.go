package geo

import (
	"fmt"

	"github.com/paulmach/orb"
)

// Surface is an interpolated grid with what a reader needs to judge it.
type Surface struct {
	*Grid
	Method    string     // e.g. "IDW (power 2)" or "ordinary kriging, spherical (...)"
	CVRMSE    float64    // leave-one-out cross-validation RMSE, units of the values
	Wells     int        // distinct wells used
	Merged    int        // input wells averaged into another as coincident
	Hull      orb.Ring   // convex hull of the wells, metres
	BufferM   float64    // buffer around the hull, metres
	Variogram *Variogram // kriging only
}

// InterpolateIDW grids planar wells (metres) by inverse-distance weighting
// and reports the leave-one-out RMSE. Cells beyond the hull plus buffer stay
// empty.
func InterpolateIDW(points []orb.Point, vals []float64, g GridOptions, o IDWOptions) (*Surface, error) {
	m, err := NewIDW(points, vals, o)
	if err != nil {
		return nil, err
	}
	lay, err := NewLayout(wellPoints(m.wells), g)
	if err != nil {
		return nil, err
	}
	cv := m.CrossValidate()
	if !finite(cv) {
		return nil, fmt.Errorf("geo: IDW cross-validation failed (RMSE %v)", cv)
	}
	lay.Grid.Fill(m)
	return &Surface{
		Grid: lay.Grid, Method: fmt.Sprintf("IDW (power %g)", m.power),
		CVRMSE: cv, Wells: len(m.wells), Merged: m.Merged,
		Hull: lay.Hull, BufferM: lay.BufferM,
	}, nil
}

// InterpolateKriging grids planar wells (metres) by ordinary kriging with a
// fitted (or given) variogram and reports the leave-one-out RMSE. Cells
// beyond the hull plus buffer stay empty.
func InterpolateKriging(points []orb.Point, vals []float64, g GridOptions, o KrigingOptions) (*Surface, error) {
	k, err := NewKriging(points, vals, o)
	if err != nil {
		return nil, err
	}
	lay, err := NewLayout(wellPoints(k.wells), g)
	if err != nil {
		return nil, err
	}
	cv := k.CrossValidate()
	if !finite(cv) {
		return nil, fmt.Errorf("geo: kriging cross-validation failed (RMSE %v)", cv)
	}
	lay.Grid.Fill(k)
	v := k.Variogram
	return &Surface{
		Grid: lay.Grid, Method: "ordinary kriging, " + v.String(),
		CVRMSE: cv, Wells: len(k.wells), Merged: k.Merged,
		Hull: lay.Hull, BufferM: lay.BufferM, Variogram: &v,
	}, nil
}

func wellPoints(ws []well) []orb.Point {
	p := make([]orb.Point, len(ws))
	for i, w := range ws {
		p[i] = w.p
	}
	return p
}
