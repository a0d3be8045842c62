package geo

import (
	"errors"
	"fmt"
	"math"
)

// TransverseMercator is a transverse Mercator projection on an ellipsoid,
// computed with Krueger's series to sixth order in the third flattening n as
// given by Karney (2011), "Transverse Mercator with an accuracy of a few
// nanometers", J. Geodesy 85, 475-485, eqs. (7)-(11), (35), (36). Within
// about 4000 km of the central meridian the series is accurate to a few
// nanometres (Karney 2011, section 4); UTM zones use |dlon| <= 3 degrees.
//
// Construct it with NewTransverseMercator; the zero value is not usable.
type TransverseMercator struct {
	Ellipsoid Ellipsoid
	Lon0      float64 // central meridian, degrees
	Lat0      float64 // latitude of origin, degrees
	K0        float64 // scale on the central meridian
	FalseE    float64 // false easting, metres
	FalseN    float64 // false northing, metres

	e, e2, a1 float64 // eccentricity, e^2, rectifying radius A
	alp, bet  [7]float64
	y0        float64 // k0*A*xi(lat0): northing of the origin before false northing
}

// ErrProjection reports a point that the projection cannot map.
var ErrProjection = errors.New("geo: point outside the projection's domain")

// NewTransverseMercator prepares a projection. It returns an error for an
// impossible ellipsoid, scale or origin.
func NewTransverseMercator(ell Ellipsoid, lon0, lat0, k0, falseE, falseN float64) (*TransverseMercator, error) {
	if !ell.valid() {
		return nil, fmt.Errorf("geo: invalid ellipsoid %+v", ell)
	}
	if !(k0 > 0) || math.IsInf(k0, 0) {
		return nil, fmt.Errorf("geo: invalid scale factor %v", k0)
	}
	if !(lon0 >= -180 && lon0 <= 180) || !(lat0 > -90 && lat0 < 90) || !finite(falseE) || !finite(falseN) {
		return nil, fmt.Errorf("geo: invalid origin lon0=%v lat0=%v", lon0, lat0)
	}
	t := &TransverseMercator{Ellipsoid: ell, Lon0: lon0, Lat0: lat0, K0: k0, FalseE: falseE, FalseN: falseN}
	n := ell.N()
	n2, n3, n4, n5, n6 := n*n, n*n*n, n*n*n*n, n*n*n*n*n, n*n*n*n*n*n
	t.e2 = ell.E2()
	t.e = math.Sqrt(t.e2)
	// Karney (2011) eq. (14): rectifying radius.
	t.a1 = ell.A / (1 + n) * (1 + n2/4 + n4/64 + n6/256)
	// Karney (2011) eq. (35).
	t.alp[1] = n/2 - 2*n2/3 + 5*n3/16 + 41*n4/180 - 127*n5/288 + 7891*n6/37800
	t.alp[2] = 13*n2/48 - 3*n3/5 + 557*n4/1440 + 281*n5/630 - 1983433*n6/1935360
	t.alp[3] = 61*n3/240 - 103*n4/140 + 15061*n5/26880 + 167603*n6/181440
	t.alp[4] = 49561*n4/161280 - 179*n5/168 + 6601661*n6/7257600
	t.alp[5] = 34729*n5/80640 - 3418889*n6/1995840
	t.alp[6] = 212378941 * n6 / 319334400
	// Karney (2011) eq. (36).
	t.bet[1] = n/2 - 2*n2/3 + 37*n3/96 - n4/360 - 81*n5/512 + 96199*n6/604800
	t.bet[2] = n2/48 + n3/15 - 437*n4/1440 + 46*n5/105 - 1118711*n6/3870720
	t.bet[3] = 17*n3/480 - 37*n4/840 - 209*n5/4480 + 5569*n6/90720
	t.bet[4] = 4397*n4/161280 - 11*n5/504 - 830251*n6/7257600
	t.bet[5] = 4583*n5/161280 - 108847*n6/3991680
	t.bet[6] = 20648693 * n6 / 638668800
	if lat0 != 0 {
		_, y, _ := t.raw(0, lat0)
		t.y0 = y
	}
	return t, nil
}

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// conformalTau returns tan of the conformal latitude for tau = tan(phi),
// Karney (2011) eqs. (7)-(9).
func (t *TransverseMercator) conformalTau(tau float64) float64 {
	sig := math.Sinh(t.e * math.Atanh(t.e*tau/math.Hypot(1, tau)))
	return tau*math.Hypot(1, sig) - sig*math.Hypot(1, tau)
}

// raw projects (dlon, lat) in degrees, dlon relative to the central
// meridian, to (x, y) in metres with scale k0 and no false origin.
func (t *TransverseMercator) raw(dlon, lat float64) (x, y float64, err error) {
	if math.Abs(dlon) > 90 {
		return 0, 0, ErrProjection
	}
	phi := lat * math.Pi / 180
	lam := dlon * math.Pi / 180
	var xip, etap float64
	if math.Abs(lat) == 90 {
		xip, etap = math.Copysign(math.Pi/2, lat), 0
	} else {
		taup := t.conformalTau(math.Tan(phi))
		cl := math.Cos(lam)
		xip = math.Atan2(taup, cl)
		etap = math.Asinh(math.Sin(lam) / math.Hypot(taup, cl))
	}
	xi, eta := xip, etap
	for j := 1; j <= 6; j++ {
		f := float64(2 * j)
		xi += t.alp[j] * math.Sin(f*xip) * math.Cosh(f*etap)
		eta += t.alp[j] * math.Cos(f*xip) * math.Sinh(f*etap)
	}
	x = t.K0 * t.a1 * eta
	y = t.K0 * t.a1 * xi
	if !finite(x) || !finite(y) {
		return 0, 0, ErrProjection
	}
	return x, y, nil
}

// Forward projects longitude and latitude (degrees) to easting and northing
// (metres). Points more than 90 degrees of longitude from the central
// meridian return ErrProjection.
func (t *TransverseMercator) Forward(lon, lat float64) (x, y float64, err error) {
	if !finite(lon) || !finite(lat) || lat < -90 || lat > 90 {
		return 0, 0, ErrProjection
	}
	dlon := math.Remainder(lon-t.Lon0, 360)
	x, y, err = t.raw(dlon, lat)
	if err != nil {
		return 0, 0, err
	}
	return x + t.FalseE, y - t.y0 + t.FalseN, nil
}

// Inverse maps easting and northing (metres) back to longitude and latitude
// (degrees). Longitude is normalised to [-180, 180].
func (t *TransverseMercator) Inverse(x, y float64) (lon, lat float64, err error) {
	if !finite(x) || !finite(y) {
		return 0, 0, ErrProjection
	}
	xi := (y - t.FalseN + t.y0) / (t.K0 * t.a1)
	eta := (x - t.FalseE) / (t.K0 * t.a1)
	if math.Abs(xi) > math.Pi/2+1e-9 || math.Abs(eta) > 10 {
		return 0, 0, ErrProjection
	}
	xip, etap := xi, eta
	for j := 1; j <= 6; j++ {
		f := float64(2 * j)
		xip -= t.bet[j] * math.Sin(f*xi) * math.Cosh(f*eta)
		etap -= t.bet[j] * math.Cos(f*xi) * math.Sinh(f*eta)
	}
	sh := math.Sinh(etap)
	cx := math.Cos(xip)
	taup := math.Sin(xip) / math.Hypot(sh, cx)
	lam := math.Atan2(sh, cx)
	tau, ok := t.tauFromConformal(taup)
	if !ok {
		return 0, 0, ErrProjection
	}
	lat = math.Atan(tau) * 180 / math.Pi
	lon = math.Remainder(t.Lon0+lam*180/math.Pi, 360)
	if lon == -180 && t.Lon0+lam*180/math.Pi > 0 {
		lon = 180
	}
	return lon, lat, nil
}

// tauFromConformal inverts conformalTau by Newton's method, Karney (2011)
// eqs. (19)-(21).
func (t *TransverseMercator) tauFromConformal(taup float64) (float64, bool) {
	if math.IsInf(taup, 0) {
		return taup, true
	}
	tau := taup / (1 - t.e2)
	for i := 0; i < 20; i++ {
		tp := t.conformalTau(tau)
		d := (taup - tp) * (1 + (1-t.e2)*tau*tau) /
			((1 - t.e2) * math.Hypot(1, tau) * math.Hypot(1, tp))
		tau += d
		if math.Abs(d) <= 1e-15*math.Max(1, math.Abs(tau)) {
			return tau, true
		}
	}
	return tau, finite(tau)
}
