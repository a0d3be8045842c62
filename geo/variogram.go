package geo

import (
	"errors"
	"fmt"
	"math"

	"github.com/paulmach/orb"
	"gonum.org/v1/gonum/optimize"
)

// VariogramModel names a variogram model family.
type VariogramModel int

const (
	// AutoModel asks FitVariogram to fit every model and keep the best.
	AutoModel VariogramModel = iota
	// Spherical: gamma(h) = c0 + c (1.5 h/a - 0.5 (h/a)^3) for h < a, c0 + c beyond.
	Spherical
	// Exponential: gamma(h) = c0 + c (1 - exp(-3h/a)), with a the practical
	// range where 95 % of the sill is reached.
	Exponential
)

func (m VariogramModel) String() string {
	switch m {
	case Spherical:
		return "spherical"
	case Exponential:
		return "exponential"
	}
	return "auto"
}

// Variogram is a fitted semivariogram model (Journel & Huijbregts 1978,
// Mining Geostatistics, ch. II; Cressie 1993, Statistics for Spatial Data,
// sec. 2.3.1). Range is the distance at which the sill is reached
// (spherical) or 95 % of it (exponential, practical range).
type Variogram struct {
	Model  VariogramModel
	Nugget float64 // c0, units of value squared
	Sill   float64 // partial sill c (total sill is Nugget + Sill)
	Range  float64 // a, metres
}

// Gamma returns the semivariance at lag h; Gamma(0) = 0, so kriging honours
// the data even with a nugget.
func (v Variogram) Gamma(h float64) float64 {
	if h <= 0 {
		return 0
	}
	r := h / v.Range
	switch v.Model {
	case Exponential:
		return v.Nugget + v.Sill*(1-math.Exp(-3*r))
	default:
		if r >= 1 {
			return v.Nugget + v.Sill
		}
		return v.Nugget + v.Sill*(1.5*r-0.5*r*r*r)
	}
}

// String describes the model, e.g. "spherical (nugget 0.01, sill 0.25, range 420 m)".
func (v Variogram) String() string {
	return fmt.Sprintf("%s (nugget %.3g, sill %.3g, range %.4g m)", v.Model, v.Nugget, v.Sill, v.Range)
}

// Lag is one bin of an experimental semivariogram.
type Lag struct {
	H     float64 // mean pair distance in the bin, metres
	Gamma float64 // Matheron estimate: mean of (z_i - z_j)^2 / 2
	N     int     // number of pairs
}

// ExperimentalVariogram computes the classical (Matheron 1962) estimator in
// nLags equal bins from 0 to maxLag. Zero nLags means 12; zero maxLag means
// half the largest pair distance (common practice), or the largest distance
// when half leaves fewer than two bins (few wells). Empty bins are dropped.
func ExperimentalVariogram(points []orb.Point, vals []float64, nLags int, maxLag float64) ([]Lag, error) {
	if len(points) != len(vals) {
		return nil, fmt.Errorf("geo: %d points but %d values", len(points), len(vals))
	}
	if nLags <= 0 {
		nLags = 12
	}
	auto := maxLag <= 0
	var dmax float64
	for i := range points {
		for j := i + 1; j < len(points); j++ {
			dmax = math.Max(dmax, planarDist(points[i], points[j]))
		}
	}
	if auto {
		maxLag = dmax / 2
	}
	if !(dmax > 0) || !finite(dmax) || !(maxLag > 0) || !finite(maxLag) {
		return nil, fmt.Errorf("%w: no distinct pair of wells", ErrTooFewWells)
	}
	lags := binLags(points, vals, nLags, maxLag)
	if auto && len(lags) < 2 {
		// Few wells: half the largest distance leaves too few pairs; use all.
		lags = binLags(points, vals, nLags, dmax)
	}
	if len(lags) == 0 {
		return nil, fmt.Errorf("geo: no pair of wells within %g m", maxLag)
	}
	return lags, nil
}

// FitOptions configures the variogram fit.
type FitOptions struct {
	Model  VariogramModel // AutoModel fits spherical and exponential, keeps the better
	Nugget bool           // fit a nugget; otherwise the nugget is zero
	Lags   int            // bins of the experimental variogram; zero means 12
	MaxLag float64        // metres; zero means half the largest pair distance
}

// ErrVariogramFit reports that no variogram could be fitted.
var ErrVariogramFit = errors.New("geo: variogram fit failed")

// FitVariogram fits a model to an experimental variogram by weighted least
// squares with the weights of Cressie (1985), "Fitting variogram models by
// weighted least squares", Math. Geology 17, 563-586: it minimises
// sum_j N_j (gammaHat_j / gamma(h_j) - 1)^2 with gonum's Nelder-Mead from
// several starting ranges. The range is kept within (0, 3 x the largest
// lag), the sill and nugget positive.
func FitVariogram(lags []Lag, opt FitOptions) (Variogram, error) {
	if len(lags) < 2 {
		return Variogram{}, fmt.Errorf("%w: %d lag bins, need at least 2", ErrVariogramFit, len(lags))
	}
	var hmax, gmax, gmin float64
	gmin = math.Inf(1)
	for _, l := range lags {
		hmax = math.Max(hmax, l.H)
		gmax = math.Max(gmax, l.Gamma)
		gmin = math.Min(gmin, l.Gamma)
	}
	if !(gmax > 0) {
		return Variogram{}, fmt.Errorf("%w: all semivariances are zero (constant values)", ErrVariogramFit)
	}
	models := []VariogramModel{opt.Model}
	if opt.Model == AutoModel {
		models = []VariogramModel{Spherical, Exponential}
	}
	rmax := 3 * hmax
	decode := func(m VariogramModel, x []float64) Variogram {
		v := Variogram{Model: m, Sill: math.Exp(x[0]), Range: rmax / (1 + math.Exp(-x[1]))}
		if opt.Nugget {
			v.Nugget = math.Exp(x[2])
		}
		return v
	}
	best, bestF := Variogram{}, math.Inf(1)
	for _, m := range models {
		obj := func(x []float64) float64 {
			v := decode(m, x)
			var s float64
			for _, l := range lags {
				g := v.Gamma(l.H)
				if !(g > 0) {
					return math.Inf(1)
				}
				r := l.Gamma/g - 1
				s += float64(l.N) * r * r
			}
			return s
		}
		for _, fr := range []float64{0.2, 0.5, 0.9} {
			r0 := fr * hmax
			x0 := []float64{math.Log(gmax), -math.Log(rmax/r0 - 1)}
			if opt.Nugget {
				x0[0] = math.Log(math.Max(gmax-gmin/2, gmax/2))
				x0 = append(x0, math.Log(math.Max(gmin/2, gmax*1e-3)))
			}
			res, err := optimize.Minimize(optimize.Problem{Func: obj}, x0,
				&optimize.Settings{MajorIterations: 2000}, &optimize.NelderMead{})
			if res == nil || (err != nil && res.F >= bestF) {
				continue
			}
			if res.F < bestF && finite(res.F) {
				bestF = res.F
				best = decode(m, res.X)
			}
		}
	}
	if math.IsInf(bestF, 1) || !(best.Sill > 0) || !(best.Range > 0) {
		return Variogram{}, ErrVariogramFit
	}
	return best, nil
}

// planarDist is the Euclidean distance; coordinates are metres in a local
// frame, far from overflow, so the plain formula is used (math.Hypot is
// several times slower and dominated gridding time).
func planarDist(a, b orb.Point) float64 {
	dx, dy := a[0]-b[0], a[1]-b[1]
	return math.Sqrt(dx*dx + dy*dy)
}

func binLags(points []orb.Point, vals []float64, nLags int, maxLag float64) []Lag {
	sumH := make([]float64, nLags)
	sumG := make([]float64, nLags)
	cnt := make([]int, nLags)
	w := maxLag / float64(nLags)
	for i := range points {
		for j := i + 1; j < len(points); j++ {
			h := planarDist(points[i], points[j])
			if h <= 0 || h > maxLag {
				continue
			}
			b := min(int(h/w), nLags-1)
			d := vals[i] - vals[j]
			sumH[b] += h
			sumG[b] += d * d / 2
			cnt[b]++
		}
	}
	var lags []Lag
	for b := range cnt {
		if cnt[b] > 0 {
			n := float64(cnt[b])
			lags = append(lags, Lag{H: sumH[b] / n, Gamma: sumG[b] / n, N: cnt[b]})
		}
	}
	return lags
}
