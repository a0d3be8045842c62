package geo

import (
	"errors"
	"math"
	"math/rand/v2"
	"sort"
	"testing"

	"github.com/paulmach/orb"
	"gonum.org/v1/gonum/mat"
)

func randomWells(r *rand.Rand, n int, size float64) []orb.Point {
	p := make([]orb.Point, n)
	for i := range p {
		p[i] = orb.Point{size * r.Float64(), size * r.Float64()}
	}
	return p
}

func TestConvexHull(t *testing.T) {
	tests := []struct {
		name string
		in   []orb.Point
		want int // distinct hull vertices
		area float64
	}{
		{"square with inside points", []orb.Point{{0, 0}, {10, 0}, {10, 10}, {0, 10}, {5, 5}, {2, 7}, {5, 0}}, 4, 100},
		{"triangle", []orb.Point{{0, 0}, {4, 0}, {0, 3}}, 3, 6},
		{"collinear", []orb.Point{{0, 0}, {1, 1}, {2, 2}}, 2, 0},
		{"duplicates", []orb.Point{{1, 1}, {1, 1}, {3, 1}, {1, 4}, {3, 1}}, 3, 3},
	}
	for _, tc := range tests {
		h := ConvexHull(tc.in)
		if len(h) < 2 || h[0] != h[len(h)-1] {
			t.Errorf("%s: ring %v not closed", tc.name, h)
			continue
		}
		if len(h)-1 != tc.want {
			t.Errorf("%s: %d vertices %v, want %d", tc.name, len(h)-1, h, tc.want)
		}
		// Shoelace area, counter-clockwise positive.
		var a float64
		for i := 0; i+1 < len(h); i++ {
			a += h[i][0]*h[i+1][1] - h[i+1][0]*h[i][1]
		}
		if math.Abs(a/2-tc.area) > 1e-12 {
			t.Errorf("%s: signed area %v, want %v", tc.name, a/2, tc.area)
		}
	}
}

// Cells whose centres lie farther than the buffer from the hull stay empty;
// cells inside stay full. Square of wells 100 m wide, buffer 10 % = 10 m.
func TestMaskHullPlusBuffer(t *testing.T) {
	pts := []orb.Point{{0, 0}, {100, 0}, {100, 100}, {0, 100}, {50, 50}}
	vals := []float64{1, 2, 3, 4, 5}
	for _, method := range []string{"idw", "kriging"} {
		var s *Surface
		var err error
		if method == "idw" {
			s, err = InterpolateIDW(pts, vals, GridOptions{NX: 60, NY: 60}, IDWOptions{})
		} else {
			s, err = InterpolateKriging(pts, vals, GridOptions{NX: 60, NY: 60}, KrigingOptions{Variogram: &Variogram{Model: Spherical, Sill: 1, Range: 150}})
		}
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(s.BufferM-10) > 1e-12 {
			t.Fatalf("buffer %v m, want 10", s.BufferM)
		}
		empty := 0
		for j := 0; j < s.NY; j++ {
			for i := 0; i < s.NX; i++ {
				x, y := s.X(i), s.Y(j)
				dx := math.Max(0, math.Max(-x, x-100))
				dy := math.Max(0, math.Max(-y, y-100))
				d := math.Hypot(dx, dy)
				if d < 9.99 && !s.Valid(i, j) || d > 10.01 && s.Valid(i, j) {
					t.Fatalf("%s: cell (%.2f, %.2f), %.2f m outside: valid=%v", method, x, y, d, s.Valid(i, j))
				}
				if !s.Valid(i, j) {
					empty++
					if !math.IsNaN(s.Z(i, j)) {
						t.Fatalf("%s: empty cell holds %v, want NaN", method, s.Z(i, j))
					}
					if _, ok := s.At(i, j); ok {
						t.Fatalf("%s: At reports a value in an empty cell", method)
					}
				}
			}
		}
		if empty == 0 {
			t.Errorf("%s: no empty corner cells", method)
		}
	}
}

// Both methods honour the data at the wells; kriging without a nugget
// exactly (to rounding), IDW by construction.
func TestReproduceWells(t *testing.T) {
	r := rand.New(rand.NewPCG(21, 22))
	pts := randomWells(r, 40, 1000)
	vals := make([]float64, len(pts))
	for i, p := range pts {
		vals[i] = math.Sin(p[0]/200) + 0.5*math.Cos(p[1]/150) + 0.1*r.NormFloat64()
	}
	idw, err := NewIDW(pts, vals, IDWOptions{})
	if err != nil {
		t.Fatal(err)
	}
	idwK, err := NewIDW(pts, vals, IDWOptions{Neighbours: 8})
	if err != nil {
		t.Fatal(err)
	}
	kr, err := NewKriging(pts, vals, KrigingOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if kr.Variogram.Nugget != 0 || !kr.Fitted {
		t.Fatalf("variogram %v: want a fitted model with no nugget", kr.Variogram)
	}
	for i, p := range pts {
		if got := idw.Predict(p); got != vals[i] {
			t.Errorf("IDW at well %d: %v, want %v", i, got, vals[i])
		}
		if got := idwK.Predict(p); got != vals[i] {
			t.Errorf("IDW(8) at well %d: %v, want %v", i, got, vals[i])
		}
		if got := kr.Predict(p); math.Abs(got-vals[i]) > 1e-9 {
			t.Errorf("kriging at well %d: %v, want %v", i, got, vals[i])
		}
	}
	// IDW is a convex combination: never outside the data range.
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, v := range vals {
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	for k := 0; k < 500; k++ {
		z := idw.Predict(orb.Point{1200*r.Float64() - 100, 1200*r.Float64() - 100})
		if z < lo-1e-12 || z > hi+1e-12 {
			t.Fatalf("IDW %v outside data range [%v, %v]", z, lo, hi)
		}
	}
}

// The k-d tree neighbour search gives the same estimate as weighting the k
// nearest wells found by sorting.
func TestIDWNeighboursMatchBruteForce(t *testing.T) {
	r := rand.New(rand.NewPCG(8, 9))
	pts := randomWells(r, 80, 500)
	vals := make([]float64, len(pts))
	for i := range vals {
		vals[i] = r.NormFloat64()
	}
	const k = 6
	m, err := NewIDW(pts, vals, IDWOptions{Neighbours: k, Power: 3})
	if err != nil {
		t.Fatal(err)
	}
	for q := 0; q < 200; q++ {
		p := orb.Point{500 * r.Float64(), 500 * r.Float64()}
		idx := make([]int, len(pts))
		for i := range idx {
			idx[i] = i
		}
		sort.Slice(idx, func(a, b int) bool { return planarDist(p, pts[idx[a]]) < planarDist(p, pts[idx[b]]) })
		var sw, swz float64
		for _, i := range idx[:k] {
			w := math.Pow(planarDist(p, pts[i]), -3)
			sw += w
			swz += w * vals[i]
		}
		if got, want := m.Predict(p), swz/sw; math.Abs(got-want) > 1e-12*math.Max(1, math.Abs(want)) {
			t.Fatalf("at %v: tree %v, brute force %v", p, got, want)
		}
	}
}

// Ordinary kriging of a linear field z = 5 + 0.002 x - 0.001 y: the
// estimate at points inside the hull stays within 2 % of the field's range
// (common practice tolerance; OK only enforces a constant mean, so a trend
// is reproduced approximately, not exactly).
func TestKrigingLinearField(t *testing.T) {
	r := rand.New(rand.NewPCG(31, 32))
	pts := randomWells(r, 60, 1000)
	field := func(p orb.Point) float64 { return 5 + 0.002*p[0] - 0.001*p[1] }
	vals := make([]float64, len(pts))
	for i, p := range pts {
		vals[i] = field(p)
	}
	s, err := InterpolateKriging(pts, vals, GridOptions{NX: 50, NY: 50, BufferFraction: -1}, KrigingOptions{})
	if err != nil {
		t.Fatal(err)
	}
	const tol = 0.02 * 3 // field range over the square is 3
	var worst float64
	for j := 0; j < s.NY; j++ {
		for i := 0; i < s.NX; i++ {
			if z, ok := s.At(i, j); ok {
				worst = math.Max(worst, math.Abs(z-field(orb.Point{s.X(i), s.Y(j)})))
			}
		}
	}
	if worst > tol {
		t.Errorf("worst error %.4f > %.4f (%s)", worst, tol, s.Method)
	}
	if !(s.CVRMSE < tol) {
		t.Errorf("LOO RMSE %v not below %v", s.CVRMSE, tol)
	}
	t.Logf("linear field: worst %.5f, LOO RMSE %.5f, %s", worst, s.CVRMSE, s.Method)
}

// Synthetic Gaussian fields drawn from a known covariance (Cholesky of the
// covariance matrix, seeded); the pooled experimental variogram of 20
// realisations is fitted and must recover range and sill. Tolerances
// (20 % range, 15 % sill) allow for the sampling scatter of variograms of
// correlated data on a domain about three ranges wide (Cressie 1993, sec.
// 2.4, on estimator variance; figures here are common practice).
func TestVariogramRecovery(t *testing.T) {
	tests := []struct {
		model VariogramModel
		sill  float64
		rng   float64
	}{
		{Spherical, 2, 300},
		{Exponential, 0.5, 400},
	}
	for _, tc := range tests {
		truth := Variogram{Model: tc.model, Sill: tc.sill, Range: tc.rng}
		r := rand.New(rand.NewPCG(uint64(tc.model), 77))
		pts := randomWells(r, 300, 1000)
		n := len(pts)
		cov := mat.NewSymDense(n, nil)
		for i := 0; i < n; i++ {
			for j := i; j < n; j++ {
				c := tc.sill - truth.Gamma(planarDist(pts[i], pts[j]))
				if i == j {
					c = tc.sill + 1e-10
				}
				cov.SetSym(i, j, c)
			}
		}
		var ch mat.Cholesky
		if !ch.Factorize(cov) {
			t.Fatal("covariance not positive definite")
		}
		var L mat.TriDense
		ch.LTo(&L)
		nb := 12
		maxLag := 500.0
		sumG := make([]float64, nb)
		sumH := make([]float64, nb)
		cnt := make([]int, nb)
		for rep := 0; rep < 20; rep++ {
			e := mat.NewVecDense(n, nil)
			for i := 0; i < n; i++ {
				e.SetVec(i, r.NormFloat64())
			}
			var z mat.VecDense
			z.MulVec(&L, e)
			lags, err := ExperimentalVariogram(pts, z.RawVector().Data, nb, maxLag)
			if err != nil {
				t.Fatal(err)
			}
			for _, l := range lags {
				b := min(int(l.H/(maxLag/float64(nb))), nb-1)
				sumG[b] += l.Gamma * float64(l.N)
				sumH[b] += l.H * float64(l.N)
				cnt[b] += l.N
			}
		}
		var pooled []Lag
		for b := range cnt {
			if cnt[b] > 0 {
				pooled = append(pooled, Lag{H: sumH[b] / float64(cnt[b]), Gamma: sumG[b] / float64(cnt[b]), N: cnt[b]})
			}
		}
		v, err := FitVariogram(pooled, FitOptions{Model: tc.model})
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(v.Range-tc.rng) > 0.2*tc.rng || math.Abs(v.Sill-tc.sill) > 0.15*tc.sill {
			t.Errorf("%v: fitted %v, want range %v sill %v", tc.model, v, tc.rng, tc.sill)
		}
		t.Logf("%v: truth range %v sill %v; fitted %v", tc.model, tc.rng, tc.sill, v)
		// With a nugget allowed, the fitted nugget stays small (true value 0).
		vn, err := FitVariogram(pooled, FitOptions{Model: tc.model, Nugget: true})
		if err != nil {
			t.Fatal(err)
		}
		if vn.Nugget > 0.1*tc.sill {
			t.Errorf("%v: nugget %v, want near 0", tc.model, vn.Nugget)
		}
	}
}

// Leave-one-out RMSE on cases small enough to check by hand.
func TestCrossValidationByHand(t *testing.T) {
	// IDW, power 2, wells at x = 0, 1, 2 with values 0, 1, 2.
	// Without well 0: (1*1 + 2*(1/4)) / (1 + 1/4) = 1.2, error 1.2.
	// Without well 1: (0*1 + 2*1) / 2 = 1, error 0. Without well 2: 0.8, error -1.2.
	// RMSE = sqrt((1.44 + 0 + 1.44) / 3) = sqrt(0.96).
	idw, err := NewIDW([]orb.Point{{0, 0}, {1, 0}, {2, 0}}, []float64{0, 1, 2}, IDWOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if got, want := idw.CrossValidate(), math.Sqrt(0.96); math.Abs(got-want) > 1e-12 {
		t.Errorf("IDW LOO RMSE = %v, want %v", got, want)
	}
	// Ordinary kriging with a variogram whose range (1 m) is shorter than
	// every well spacing behaves as pure nugget: the weights are equal, so
	// each well is predicted by the mean of the others. Values 1, 2, 3, 6:
	// predictions 11/3, 10/3, 3, 2; errors 8/3, 4/3, 0, -4;
	// RMSE = sqrt((64/9 + 16/9 + 0 + 16) / 4) = sqrt(56/9).
	pts := []orb.Point{{0, 0}, {10, 0}, {10, 10}, {0, 10}}
	kr, err := NewKriging(pts, []float64{1, 2, 3, 6}, KrigingOptions{Variogram: &Variogram{Model: Spherical, Sill: 1, Range: 1}})
	if err != nil {
		t.Fatal(err)
	}
	if got, want := kr.CrossValidate(), math.Sqrt(56.0/9); math.Abs(got-want) > 1e-12 {
		t.Errorf("kriging LOO RMSE = %v, want %v", got, want)
	}
}

// Dubrule's one-factorisation residuals equal refitting without each well.
func TestKrigingCrossValidationMatchesRefit(t *testing.T) {
	r := rand.New(rand.NewPCG(41, 42))
	pts := randomWells(r, 25, 800)
	vals := make([]float64, len(pts))
	for i, p := range pts {
		vals[i] = p[0]/400 + r.NormFloat64()
	}
	v := &Variogram{Model: Exponential, Nugget: 0.2, Sill: 1, Range: 300}
	kr, err := NewKriging(pts, vals, KrigingOptions{Variogram: v})
	if err != nil {
		t.Fatal(err)
	}
	var ss float64
	for i := range pts {
		p2 := append(append([]orb.Point{}, pts[:i]...), pts[i+1:]...)
		v2 := append(append([]float64{}, vals[:i]...), vals[i+1:]...)
		k2, err := NewKriging(p2, v2, KrigingOptions{Variogram: v})
		if err != nil {
			t.Fatal(err)
		}
		e := k2.Predict(pts[i]) - vals[i]
		ss += e * e
	}
	want := math.Sqrt(ss / float64(len(pts)))
	if got := kr.CrossValidate(); math.Abs(got-want) > 1e-9*want {
		t.Errorf("LOO RMSE %v, refit %v", got, want)
	}
}

func TestWellsInputHandling(t *testing.T) {
	// Coincident wells are averaged: two samples of one well (2 and 4)
	// become one well with value 3.
	pts := []orb.Point{{0, 0}, {0, 0.001}, {100, 0}, {0, 100}, {100, 100}}
	vals := []float64{2, 4, 10, 10, 10}
	for _, name := range []string{"idw", "kriging"} {
		var ip Interpolator
		var merged int
		if name == "idw" {
			m, err := NewIDW(pts, vals, IDWOptions{})
			if err != nil {
				t.Fatal(err)
			}
			ip, merged = m, m.Merged
		} else {
			m, err := NewKriging(pts, vals, KrigingOptions{})
			if err != nil {
				t.Fatal(err)
			}
			ip, merged = m, m.Merged
		}
		if merged != 1 {
			t.Errorf("%s: merged %d, want 1", name, merged)
		}
		if got := ip.Predict(orb.Point{0, 0.0005}); math.Abs(got-3) > 1e-9 {
			t.Errorf("%s: value at merged well %v, want 3", name, got)
		}
	}
	errTests := []struct {
		name string
		pts  []orb.Point
		vals []float64
		want error
	}{
		{"two wells", []orb.Point{{0, 0}, {1, 1}}, []float64{1, 2}, ErrTooFewWells},
		{"three with two coincident", []orb.Point{{0, 0}, {0, 0}, {5, 5}}, []float64{1, 2, 3}, ErrTooFewWells},
		{"none", nil, nil, ErrTooFewWells},
	}
	for _, tc := range errTests {
		if _, err := NewIDW(tc.pts, tc.vals, IDWOptions{}); !errors.Is(err, tc.want) {
			t.Errorf("IDW %s: %v", tc.name, err)
		}
		if _, err := InterpolateKriging(tc.pts, tc.vals, GridOptions{}, KrigingOptions{}); !errors.Is(err, tc.want) {
			t.Errorf("kriging %s: %v", tc.name, err)
		}
	}
	if _, err := NewIDW([]orb.Point{{0, 0}, {1, 0}, {0, 1}}, []float64{1, math.NaN(), 2}, IDWOptions{}); err == nil {
		t.Error("NaN value accepted")
	}
	if _, err := NewIDW([]orb.Point{{0, 0}, {1, 0}}, []float64{1, 2, 3}, IDWOptions{}); err == nil {
		t.Error("length mismatch accepted")
	}
	// Constant values: kriging returns the constant, LOO RMSE 0.
	k, err := NewKriging([]orb.Point{{0, 0}, {1, 0}, {0, 1}, {1, 1}}, []float64{7, 7, 7, 7}, KrigingOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if z := k.Predict(orb.Point{0.3, 0.6}); math.Abs(z-7) > 1e-12 || k.CrossValidate() > 1e-12 {
		t.Errorf("constant field: %v, RMSE %v", z, k.CrossValidate())
	}
}

func TestSurfaceReport(t *testing.T) {
	r := rand.New(rand.NewPCG(51, 52))
	pts := randomWells(r, 30, 2000)
	vals := make([]float64, len(pts))
	for i, p := range pts {
		vals[i] = -0.5 + p[0]/2000 + 0.05*r.NormFloat64()
	}
	for _, mk := range []func() (*Surface, error){
		func() (*Surface, error) { return InterpolateIDW(pts, vals, GridOptions{}, IDWOptions{}) },
		func() (*Surface, error) { return InterpolateIDW(pts, vals, GridOptions{}, IDWOptions{Neighbours: 5}) },
		func() (*Surface, error) { return InterpolateKriging(pts, vals, GridOptions{}, KrigingOptions{}) },
	} {
		s, err := mk()
		if err != nil {
			t.Fatal(err)
		}
		c, rws := s.Dims()
		if max(c, rws) != 100 || s.Wells != 30 || !(s.CVRMSE > 0) || math.IsInf(s.CVRMSE, 0) || s.Method == "" {
			t.Errorf("%s: dims %dx%d wells %d RMSE %v", s.Method, c, rws, s.Wells, s.CVRMSE)
		}
		lo, hi, ok := s.Range()
		if !ok || lo < -1 || hi > 1 || s.Count() == 0 {
			t.Errorf("%s: range [%v, %v] ok=%v", s.Method, lo, hi, ok)
		}
	}
}

// Wells a hair apart (not merged, no nugget) make the kriging matrix nearly
// singular; that is an error, not a wild surface.
func TestKrigingIllConditioned(t *testing.T) {
	pts := []orb.Point{{0, 0}, {1e-7, 0}, {100, 0}, {0, 100}}
	_, err := NewKriging(pts, []float64{1, 2, 3, 4}, KrigingOptions{
		Variogram: &Variogram{Model: Spherical, Sill: 1, Range: 1e6}, MergeDistanceM: 1e-9})
	if !errors.Is(err, ErrIllConditioned) {
		t.Errorf("err = %v, want ErrIllConditioned", err)
	}
	// The default merge distance (1 cm) averages the pair instead.
	k, err := NewKriging(pts, []float64{1, 2, 3, 4}, KrigingOptions{Variogram: &Variogram{Model: Spherical, Sill: 1, Range: 1e6}})
	if err != nil || k.Merged != 1 {
		t.Errorf("merged %v, err %v", k, err)
	}
}

// Kriging variance: zero at a well without nugget; for a pure-nugget
// model (range shorter than every spacing, partial sill C) away from the
// wells the weights are 1/n and the variance is C (1 + 1/n), the textbook
// result for estimating a new value from n uncorrelated ones (here n = 4,
// C = 1: 1.25).
func TestKrigingVariance(t *testing.T) {
	pts := []orb.Point{{0, 0}, {10, 0}, {10, 10}, {0, 10}}
	vals := []float64{1, 2, 3, 6}
	k, err := NewKriging(pts, vals, KrigingOptions{Variogram: &Variogram{Model: Spherical, Sill: 1, Range: 1}})
	if err != nil {
		t.Fatal(err)
	}
	z, v := k.PredictVariance(orb.Point{5, 5})
	if math.Abs(z-3) > 1e-12 || math.Abs(v-1.25) > 1e-12 {
		t.Errorf("pure nugget: z %v var %v, want 3 and 1.25", z, v)
	}
	k2, err := NewKriging(pts, vals, KrigingOptions{Variogram: &Variogram{Model: Exponential, Sill: 1, Range: 30}})
	if err != nil {
		t.Fatal(err)
	}
	for i, p := range pts {
		z, v := k2.PredictVariance(p)
		if math.Abs(z-vals[i]) > 1e-9 || v > 1e-9 {
			t.Errorf("at well %d: z %v var %v", i, z, v)
		}
	}
	zIn, vIn := k2.PredictVariance(orb.Point{5, 5})
	_, vOut := k2.PredictVariance(orb.Point{40, 40})
	if !(vIn > 0 && vOut > vIn) {
		t.Errorf("variance inside %v, outside %v: want 0 < inside < outside", vIn, vOut)
	}
	if d := k2.Predict(orb.Point{5, 5}) - zIn; math.Abs(d) > 1e-9 {
		t.Errorf("dual and primal estimates differ by %v", d)
	}
}

func TestPlaceInFrame(t *testing.T) {
	in := []orb.Point{{-101.15, 31.9}, {0, 0}, {-101.14, 31.905}, {math.NaN(), 31.9}, {-101.145, 95}}
	f, xy, flags := PlaceInFrame(in)
	wantErr := []error{nil, ErrNullIsland, nil, ErrCoordNotFinite, ErrLatRange}
	for i, w := range wantErr {
		if w == nil && flags[i] != nil || w != nil && !errors.Is(flags[i], w) {
			t.Errorf("point %d: flag %v, want %v", i, flags[i], w)
		}
	}
	// Projected distance matches the geodesic one (1096.4357 m by PROJ geod).
	if d := planarDist(xy[0], xy[2]); math.Abs(d-1096.4357) > 0.01 {
		t.Errorf("distance in frame %v m", d)
	}
	if math.Abs(f.Centre[0]+101.145) > 1e-9 || math.Abs(f.Centre[1]-31.9025) > 1e-9 {
		t.Errorf("centre %v ignores flagged points wrongly", f.Centre)
	}
}
