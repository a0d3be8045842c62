package geo

import (
	"errors"
	"fmt"
	"math"

	"github.com/paulmach/orb"
	"gonum.org/v1/gonum/mat"
)

// KrigingOptions configures ordinary kriging.
type KrigingOptions struct {
	// Variogram, if not nil, is used as given; otherwise one is fitted to
	// the wells' experimental variogram with Fit.
	Variogram *Variogram
	Fit       FitOptions
	// MergeDistanceM: wells closer than this are averaged into one;
	// zero means DefaultMergeDistanceM.
	MergeDistanceM float64
}

// ErrIllConditioned reports a kriging system too close to singular to
// trust, usually wells nearly on top of each other with no nugget.
var ErrIllConditioned = errors.New("geo: kriging system is ill-conditioned")

// Kriging is an ordinary kriging interpolator over planar wells
// (Matheron 1963; Cressie 1993, Statistics for Spatial Data, sec. 3.2). The
// system [Gamma 1; 1' 0] is factorised once and estimates use the dual form
// z*(x0) = sum_i w_i gamma(x0, x_i) + w_{n+1}, with w = A^-1 [z; 0]
// (Matheron's dual kriging), so each estimate costs O(n). With gamma(0) = 0
// the estimate honours every (merged) well value exactly.
type Kriging struct {
	Variogram Variogram
	Merged    int // input wells merged into another as coincident
	Fitted    bool

	wells []well
	w     []float64  // dual weights, length n+1
	inv   *mat.Dense // A^-1, kept for cross-validation
}

// NewKriging prepares an ordinary kriging interpolator from planar
// positions (metres) and values. If the values are all equal no variogram
// can be fitted; the estimate is then that constant everywhere (any valid
// variogram gives it, since the weights sum to one).
func NewKriging(points []orb.Point, vals []float64, opt KrigingOptions) (*Kriging, error) {
	ws, merged, err := prepareWells(points, vals, opt.MergeDistanceM)
	if err != nil {
		return nil, err
	}
	k := &Kriging{wells: ws, Merged: merged}
	pts := make([]orb.Point, len(ws))
	zs := make([]float64, len(ws))
	for i, w := range ws {
		pts[i], zs[i] = w.p, w.z
	}
	if opt.Variogram != nil {
		v := *opt.Variogram
		if !(v.Range > 0) || !(v.Sill >= 0) || !(v.Nugget >= 0) || !(v.Sill+v.Nugget > 0) || !finite(v.Range+v.Sill+v.Nugget) {
			return nil, fmt.Errorf("geo: invalid variogram %v", v)
		}
		if v.Model == AutoModel {
			v.Model = Spherical
		}
		k.Variogram = v
	} else {
		lags, err := ExperimentalVariogram(pts, zs, opt.Fit.Lags, opt.Fit.MaxLag)
		if err != nil {
			return nil, err
		}
		v, err := FitVariogram(lags, opt.Fit)
		switch {
		case err == nil:
			k.Variogram, k.Fitted = v, true
		case constant(zs):
			k.Variogram = Variogram{Model: Spherical, Sill: 1, Range: lags[len(lags)-1].H}
		default:
			return nil, err
		}
	}
	n := len(ws)
	A := mat.NewDense(n+1, n+1, nil)
	for i := 0; i < n; i++ {
		for j := i + 1; j < n; j++ {
			g := k.Variogram.Gamma(planarDist(ws[i].p, ws[j].p))
			A.Set(i, j, g)
			A.Set(j, i, g)
		}
		A.Set(i, n, 1)
		A.Set(n, i, 1)
	}
	var lu mat.LU
	lu.Factorize(A)
	if c := lu.Cond(); !(c < 1e12) {
		return nil, fmt.Errorf("%w (condition number %.3g); merge near-coincident wells or use a nugget", ErrIllConditioned, c)
	}
	id := mat.NewDiagDense(n+1, nil)
	for i := 0; i <= n; i++ {
		id.SetDiag(i, 1)
	}
	k.inv = mat.NewDense(n+1, n+1, nil)
	if err := lu.SolveTo(k.inv, false, id); err != nil {
		return nil, fmt.Errorf("%w: %w", ErrIllConditioned, err)
	}
	rhs := mat.NewVecDense(n+1, append(zs, 0))
	var w mat.VecDense
	w.MulVec(k.inv, rhs)
	k.w = w.RawVector().Data
	return k, nil
}

func constant(z []float64) bool {
	for _, v := range z[1:] {
		if v != z[0] {
			return false
		}
	}
	return true
}

// Predict returns the ordinary kriging estimate at p. It is safe for
// concurrent use.
func (k *Kriging) Predict(p orb.Point) float64 {
	n := len(k.wells)
	s := k.w[n]
	v := k.Variogram
	// The model is chosen once, outside the loop: this loop is the whole
	// cost of gridding. Same formulas as Variogram.Gamma.
	c0, c, inv := v.Nugget, v.Sill, 1/v.Range
	switch v.Model {
	case Exponential:
		for i, w := range k.wells {
			if h := planarDist(p, w.p); h > 0 {
				s += k.w[i] * (c0 + c*(1-math.Exp(-3*h*inv)))
			}
		}
	default:
		for i, w := range k.wells {
			h := planarDist(p, w.p)
			switch r := h * inv; {
			case h <= 0:
			case r >= 1:
				s += k.w[i] * (c0 + c)
			default:
				s += k.w[i] * (c0 + c*(1.5*r-0.5*r*r*r))
			}
		}
	}
	return s
}

// CrossValidate returns the leave-one-out cross-validation RMSE, in the
// units of the values, with the variogram held fixed. Each residual
// z_i - z*_{-i} = w_i / (A^-1)_ii comes from the single factorisation
// (Dubrule 1983, "Cross validation of kriging in a unique neighborhood",
// Math. Geology 15, 687-699); the tests check it against refitting without
// each well.
func (k *Kriging) CrossValidate() float64 {
	var ss float64
	n := len(k.wells)
	for i := 0; i < n; i++ {
		e := k.w[i] / k.inv.At(i, i)
		ss += e * e
	}
	r := math.Sqrt(ss / float64(n))
	if !finite(r) {
		return math.NaN()
	}
	return r
}

// PredictVariance returns the ordinary kriging estimate at p and its
// kriging variance sigma^2 = sum_i lambda_i gamma(p, x_i) + mu (Cressie
// 1993, eq. 3.2.16), in the values' units squared. It costs O(n^2) per
// point, against O(n) for Predict.
func (k *Kriging) PredictVariance(p orb.Point) (z, variance float64) {
	n := len(k.wells)
	g := make([]float64, n+1)
	for i, w := range k.wells {
		g[i] = k.Variogram.Gamma(planarDist(p, w.p))
	}
	g[n] = 1
	var lam mat.VecDense
	lam.MulVec(k.inv, mat.NewVecDense(n+1, g))
	for i, w := range k.wells {
		z += lam.AtVec(i) * w.z
		variance += lam.AtVec(i) * g[i]
	}
	variance += lam.AtVec(n)
	if variance < 0 { // rounding at a well
		variance = 0
	}
	return z, variance
}
