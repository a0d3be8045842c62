package geo

import (
	"errors"
	"fmt"
	"math"

	"github.com/paulmach/orb"
)

// Sentinel errors for impossible coordinates, returned wrapped by ValidLonLat.
var (
	ErrCoordNotFinite = errors.New("geo: coordinate is NaN or infinite")
	ErrLatRange       = errors.New("geo: latitude outside [-90, 90]")
	ErrLonRange       = errors.New("geo: longitude outside [-180, 180]")
	// ErrNullIsland flags (0, 0): a blank cell read as zero far more often
	// than a real sample in the Gulf of Guinea (common practice).
	ErrNullIsland = errors.New("geo: coordinate (0, 0) is almost certainly a missing value")
)

// ValidLonLat checks that p = [lon, lat] is a usable WGS84 position. A nil
// error means usable. Callers keep a failing row in their tables, flag it
// with the error and leave it off maps.
func ValidLonLat(p orb.Point) error {
	if validLonLat(p) {
		return nil
	}
	lon, lat := p[0], p[1]
	switch {
	case !finite(lon) || !finite(lat):
		return fmt.Errorf("%w: lon %v, lat %v", ErrCoordNotFinite, lon, lat)
	case lat < -90 || lat > 90:
		return fmt.Errorf("%w: lat %v", ErrLatRange, lat)
	case lon < -180 || lon > 180:
		return fmt.Errorf("%w: lon %v", ErrLonRange, lon)
	case lon == 0 && lat == 0:
		return ErrNullIsland
	}
	return nil
}

// validLonLat reports whether ValidLonLat accepts p, without building the
// error.
func validLonLat(p orb.Point) bool {
	lon, lat := p[0], p[1]
	return finite(lon) && finite(lat) && lat >= -90 && lat <= 90 && lon >= -180 && lon <= 180 && !(lon == 0 && lat == 0)
}

// Round returns p rounded to 1e-6 degree (about 0.1 m), the precision used
// for GeoJSON output.
func Round(p orb.Point) orb.Point {
	return orb.Point{roundTo(p[0], 1e6), roundTo(p[1], 1e6)}
}

func roundTo(x, f float64) float64 { return math.Round(x*f) / f }
