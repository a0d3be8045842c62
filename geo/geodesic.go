package geo

import (
	"errors"
	"math"

	"github.com/paulmach/orb"
)

// ErrNoConvergence reports that Vincenty's inverse iteration did not
// converge, which happens only for nearly antipodal points.
var ErrNoConvergence = errors.New("geo: geodesic inverse did not converge (nearly antipodal points)")

// Geodesic solves the inverse geodesic problem on an ellipsoid with
// Vincenty's (1975) method, "Direct and inverse solutions of geodesics on
// the ellipsoid with application of nested equations", Survey Review
// 23(176), 88-93, with the tolerance tightened to 1e-12 rad in longitude on
// the auxiliary sphere (about 0.006 mm). Vincenty states the method is
// accurate to 0.5 mm for any line on the Earth's ellipsoid; it fails to
// converge for some nearly antipodal pairs, reported as ErrNoConvergence.
//
// It returns the distance in metres and the forward azimuths at a and b in
// degrees clockwise from north. Points are [lon, lat] in degrees.
func Geodesic(ell Ellipsoid, a, b orb.Point) (s, az1, az2 float64, err error) {
	if err := validGeodesicPoint(a); err != nil {
		return 0, 0, 0, err
	}
	if err := validGeodesicPoint(b); err != nil {
		return 0, 0, 0, err
	}
	f := ell.F
	bAxis := ell.B()
	const rad = math.Pi / 180
	L := math.Remainder(b[0]-a[0], 360) * rad
	U1 := math.Atan((1 - f) * math.Tan(a[1]*rad))
	U2 := math.Atan((1 - f) * math.Tan(b[1]*rad))
	sU1, cU1 := math.Sincos(U1)
	sU2, cU2 := math.Sincos(U2)

	lam := L
	var sSig, cSig, sig, cos2A, c2SM float64
	converged := false
	for i := 0; i < 500; i++ {
		sLam, cLam := math.Sincos(lam)
		t1 := cU2 * sLam
		t2 := cU1*sU2 - sU1*cU2*cLam
		sSig = math.Sqrt(t1*t1 + t2*t2)
		if sSig == 0 {
			return 0, 0, 0, nil // coincident points
		}
		cSig = sU1*sU2 + cU1*cU2*cLam
		sig = math.Atan2(sSig, cSig)
		sA := cU1 * cU2 * sLam / sSig
		cos2A = 1 - sA*sA
		if cos2A != 0 {
			c2SM = cSig - 2*sU1*sU2/cos2A
		} else {
			c2SM = 0 // equatorial line
		}
		C := f / 16 * cos2A * (4 + f*(4-3*cos2A))
		prev := lam
		lam = L + (1-C)*f*sA*(sig+C*sSig*(c2SM+C*cSig*(-1+2*c2SM*c2SM)))
		if math.Abs(lam) > math.Pi {
			break // diverging: antipodal region
		}
		if math.Abs(lam-prev) < 1e-12 {
			converged = true
			break
		}
	}
	if !converged {
		return 0, 0, 0, ErrNoConvergence
	}
	e2p := (ell.A*ell.A - bAxis*bAxis) / (bAxis * bAxis)
	u2 := cos2A * e2p
	A := 1 + u2/16384*(4096+u2*(-768+u2*(320-175*u2)))
	B := u2 / 1024 * (256 + u2*(-128+u2*(74-47*u2)))
	dSig := B * sSig * (c2SM + B/4*(cSig*(-1+2*c2SM*c2SM)-
		B/6*c2SM*(-3+4*sSig*sSig)*(-3+4*c2SM*c2SM)))
	s = bAxis * A * (sig - dSig)
	sLam, cLam := math.Sincos(lam)
	az1 = math.Atan2(cU2*sLam, cU1*sU2-sU1*cU2*cLam) / rad
	az2 = math.Atan2(cU1*sLam, -sU1*cU2+cU1*sU2*cLam) / rad
	return s, az1, az2, nil
}

func validGeodesicPoint(p orb.Point) error {
	err := ValidLonLat(p)
	if errors.Is(err, ErrNullIsland) {
		return nil // (0, 0) is a legal point for a distance
	}
	return err
}

// DistanceOK returns the WGS84 geodesic distance in metres between two
// [lon, lat] points and an error for invalid points or non-convergence.
func DistanceOK(a, b orb.Point) (float64, error) {
	s, _, _, err := Geodesic(WGS84(), a, b)
	return s, err
}

// Distance returns the WGS84 geodesic distance in metres between two
// [lon, lat] points (Vincenty 1975). For the rare nearly antipodal pair where
// the iteration does not converge it falls back to the great-circle distance
// on a sphere of the mean radius (Moritz 1980, R1 = 6 371 008.8 m,
// `from memory`), whose error is up to about 0.5 %; use DistanceOK to detect
// that case. Invalid points (see ValidLonLat; (0, 0) is allowed here) give
// NaN, so validate first.
func Distance(a, b orb.Point) float64 {
	s, err := DistanceOK(a, b)
	if err == nil {
		return s
	}
	if errors.Is(err, ErrNoConvergence) {
		return haversine(a, b, 6371008.8)
	}
	return math.NaN()
}

func haversine(a, b orb.Point, r float64) float64 {
	const rad = math.Pi / 180
	dlat := (b[1] - a[1]) * rad
	dlon := (b[0] - a[0]) * rad
	h := math.Sin(dlat/2)*math.Sin(dlat/2) +
		math.Cos(a[1]*rad)*math.Cos(b[1]*rad)*math.Sin(dlon/2)*math.Sin(dlon/2)
	return 2 * r * math.Asin(math.Min(1, math.Sqrt(h)))
}
