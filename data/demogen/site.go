package main

import (
	"math"
)

// The invented site. Everything here is made up for the demo: the name, the
// place, the wells, the river and the water.

const (
	siteName  = "Tallowmere Flats pilot ASR site"
	riverName = "Ostrel River"
	// Site origin (local x = east, y = north in metres). An open limestone
	// plain; there is no such site there.
	originLat = 30.9120
	originLon = -100.1370
	// Ground surface: a gentle rise to the north-west.
	groundElevOrigin = 583.0
)

// toLonLat converts local metres to WGS84 degrees with the meridian and
// prime-vertical radii of curvature at the origin (accurate to well under a
// metre over the few kilometres of the site).
func toLonLat(x, y float64) (lon, lat float64) {
	const a, f = 6378137.0, 1 / 298.257223563 // WGS84 (NIMA TR8350.2)
	e2 := f * (2 - f)
	phi := originLat * math.Pi / 180
	s := math.Sin(phi)
	w := 1 - e2*s*s
	M := a * (1 - e2) / math.Pow(w, 1.5)
	N := a / math.Sqrt(w)
	lat = originLat + y/M*180/math.Pi
	lon = originLon + x/(N*math.Cos(phi))*180/math.Pi
	return lon, lat
}

func groundElev(x, y float64) float64 {
	return groundElevOrigin - 0.0042*x + 0.0031*y
}

type point struct{ X, Y float64 }

// Injection wells, screened over the whole aquifer (about 35-125 m bgl).
var injectionWells = []struct {
	Name string
	P    point
}{
	{"IW-1", point{-80, 0}},
	{"IW-2", point{80, 0}},
}

// nest is one monitoring location with a shallow, intermediate and deep well.
type nest struct {
	Name    string // e.g. "A1"
	Cluster string
	P       point
}

var nests = []nest{
	{"A1", "A", point{10, 75}},
	{"A2", "A", point{-150, -55}},
	{"A3", "A", point{145, -75}},
	{"B1", "B", point{-340, 190}},
	{"B2", "B", point{330, 235}},
	{"B3", "B", point{70, -360}},
	{"B4", "B", point{-300, -270}},
	{"C1", "C", point{-880, 330}},
	{"C2", "C", point{910, 120}},
	{"C3", "C", point{180, 880}},
}

// level is one screened depth in a nest.
type level struct {
	Code     string  // S, I, D
	Top, Bot float64 // m below ground level
}

var levels = []level{
	{"S", 37, 43},
	{"I", 67, 73},
	{"D", 105, 111},
}

// Background nest up-gradient of the site, where the native end-members are
// sampled before injection. Its deep well is screened deeper than the
// monitoring wells, in the barium-bearing zone.
var background = struct {
	P      point
	Levels []level
	IDs    []string
}{
	P:      point{-1020, -430},
	Levels: []level{{"S", 37, 43}, {"I", 67, 73}, {"D", 125, 131}},
	IDs:    []string{"NATIVE-S", "NATIVE", "NATIVE-D"},
}

// Site boundary (local metres, counter-clockwise), the river north of the site
// and the pipeline (a trunk and a branch) from the river intake to the injection wells.
var boundary = []point{
	{-1150, -560}, {1120, -600}, {1160, 420}, {560, 1080}, {-620, 1040}, {-1180, 520},
}

var river = []point{
	{-2200, 1650}, {-1500, 1420}, {-900, 1520}, {-300, 1330}, {250, 1440},
	{800, 1290}, {1400, 1380}, {2200, 1180},
}

var pipelines = [][]point{
	{{240, 1425}, {200, 700}, {0, 120}, {-80, 0}},
	{{0, 120}, {80, 0}},
}

func dist(a, b point) float64 { return math.Hypot(a.X-b.X, a.Y-b.Y) }

// distToInjection is the distance from p to the nearer injection well.
func distToInjection(p point) float64 {
	d := math.Inf(1)
	for _, w := range injectionWells {
		d = math.Min(d, dist(p, w.P))
	}
	return d
}
