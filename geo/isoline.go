package geo

import (
	"math"

	"github.com/paulmach/orb"
)

// Isolines traces the level line of a grid by marching squares over the
// cell centres, using only squares whose four cells hold estimates, and
// chains the pieces into polylines (metres, the grid's frame). A saddle
// square is resolved by the mean of its corners.
func Isolines(g *Grid, level float64) orb.MultiLineString {
	type key [2]int64
	kp := func(p orb.Point) key { return key{int64(math.Round(p[0] * 1e3)), int64(math.Round(p[1] * 1e3))} }
	var segs [][2]orb.Point
	for j := 0; j+1 < g.NY; j++ {
		for i := 0; i+1 < g.NX; i++ {
			cs := [4][2]int{{i, j}, {i + 1, j}, {i + 1, j + 1}, {i, j + 1}}
			var z [4]float64
			ok := true
			for c, ij := range cs {
				v, has := g.At(ij[0], ij[1])
				ok = ok && has && finite(v)
				z[c] = v - level
			}
			if !ok {
				continue
			}
			var ps []orb.Point
			for e := 0; e < 4; e++ {
				a, b := cs[e], cs[(e+1)%4]
				za, zb := z[e], z[(e+1)%4]
				if (za >= 0) != (zb >= 0) {
					t := za / (za - zb)
					ps = append(ps, orb.Point{
						g.X(a[0]) + t*(g.X(b[0])-g.X(a[0])),
						g.Y(a[1]) + t*(g.Y(b[1])-g.Y(a[1])),
					})
				}
			}
			switch len(ps) {
			case 2:
				segs = append(segs, [2]orb.Point{ps[0], ps[1]})
			case 4:
				mean := (z[0] + z[1] + z[2] + z[3]) / 4
				if (mean >= 0) == (z[0] >= 0) {
					segs = append(segs, [2]orb.Point{ps[0], ps[1]}, [2]orb.Point{ps[2], ps[3]})
				} else {
					segs = append(segs, [2]orb.Point{ps[3], ps[0]}, [2]orb.Point{ps[1], ps[2]})
				}
			}
		}
	}
	// Chain segments sharing an end point.
	ends := map[key][]int{}
	for n, s := range segs {
		ends[kp(s[0])] = append(ends[kp(s[0])], n)
		ends[kp(s[1])] = append(ends[kp(s[1])], n)
	}
	used := make([]bool, len(segs))
	extend := func(line orb.LineString) orb.LineString {
		for {
			last := line[len(line)-1]
			found := false
			for _, n := range ends[kp(last)] {
				if used[n] {
					continue
				}
				used[n] = true
				if kp(segs[n][0]) == kp(last) {
					line = append(line, segs[n][1])
				} else {
					line = append(line, segs[n][0])
				}
				found = true
				break
			}
			if !found {
				return line
			}
		}
	}
	var out orb.MultiLineString
	for n, s := range segs {
		if used[n] {
			continue
		}
		used[n] = true
		fwd := extend(orb.LineString{s[0], s[1]})
		// Extend backwards from the first point.
		back := extend(orb.LineString{fwd[0]})
		line := make(orb.LineString, 0, len(back)+len(fwd)-1)
		for k := len(back) - 1; k >= 1; k-- {
			line = append(line, back[k])
		}
		line = append(line, fwd...)
		out = append(out, line)
	}
	return out
}

// BandCells returns the cells whose estimate lies within [lo, hi] as
// polygons (metres, the grid's frame): one rectangle per run of such cells
// along a row, so the zone keeps the grid's resolution and no polygon
// overlaps another.
func BandCells(g *Grid, lo, hi float64) orb.MultiPolygon {
	var out orb.MultiPolygon
	in := func(i, j int) bool {
		v, ok := g.At(i, j)
		return ok && finite(v) && v >= lo && v <= hi
	}
	for j := 0; j < g.NY; j++ {
		for i := 0; i < g.NX; {
			if !in(i, j) {
				i++
				continue
			}
			start := i
			for i < g.NX && in(i, j) {
				i++
			}
			x0, x1 := g.X(start)-g.DX/2, g.X(i-1)+g.DX/2
			y0, y1 := g.Y(j)-g.DY/2, g.Y(j)+g.DY/2
			// Counter-clockwise exterior ring (RFC 7946, sec. 3.1.6).
			out = append(out, orb.Polygon{orb.Ring{{x0, y0}, {x1, y0}, {x1, y1}, {x0, y1}, {x0, y0}}})
		}
	}
	return out
}
