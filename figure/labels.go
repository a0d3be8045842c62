package figure

import (
	"gonum.org/v1/plot/vg"
)

// Greedy label placement with collision avoidance (common practice in
// cartography: try a fixed list of candidate positions around each point in
// order of preference, take the first that overlaps nothing placed so far,
// otherwise drop the label and count it).

// labelItem is one label to place next to a point symbol.
type labelItem struct {
	anchor vg.Point  // the symbol's centre
	r      vg.Length // the symbol's radius
	w, h   vg.Length // the label's size
}

// labelPlacement is where a label went.
type labelPlacement struct {
	rect   vg.Rectangle
	placed bool
	leader bool // placed away from its symbol: draw a leader line
}

// Preference order of the eight directions: right, upper right, lower
// right, left, upper left, lower left, above, below.
var labelDirs = [8][2]int{{1, 0}, {1, 1}, {1, -1}, {-1, 0}, {-1, 1}, {-1, -1}, {0, 1}, {0, -1}}

const labelGap = 1.5 // points between a symbol and its label, and between labels

func overlaps(a, b vg.Rectangle) bool {
	return a.Min.X < b.Max.X && b.Min.X < a.Max.X && a.Min.Y < b.Max.Y && b.Min.Y < a.Max.Y
}

func inside(a, bounds vg.Rectangle) bool {
	return a.Min.X >= bounds.Min.X && a.Max.X <= bounds.Max.X && a.Min.Y >= bounds.Min.Y && a.Max.Y <= bounds.Max.Y
}

func grow(r vg.Rectangle, d vg.Length) vg.Rectangle {
	return vg.Rectangle{Min: vg.Point{X: r.Min.X - d, Y: r.Min.Y - d}, Max: vg.Point{X: r.Max.X + d, Y: r.Max.Y + d}}
}

func candidate(it labelItem, dir [2]int, dist vg.Length) vg.Rectangle {
	var x0, y0 vg.Length
	switch dir[0] {
	case 1:
		x0 = it.anchor.X + dist
	case -1:
		x0 = it.anchor.X - dist - it.w
	default:
		x0 = it.anchor.X - it.w/2
	}
	switch dir[1] {
	case 1:
		y0 = it.anchor.Y + dist*0.7
		if dir[0] == 0 {
			y0 = it.anchor.Y + dist
		}
	case -1:
		y0 = it.anchor.Y - dist*0.7 - it.h
		if dir[0] == 0 {
			y0 = it.anchor.Y - dist - it.h
		}
	default:
		y0 = it.anchor.Y - it.h/2
	}
	return vg.Rectangle{Min: vg.Point{X: x0, Y: y0}, Max: vg.Point{X: x0 + it.w, Y: y0 + it.h}}
}

// placeLabels places labels greedily in the order given. A label must stay
// inside bounds and clear every symbol, every obstacle and every label
// already placed (by labelGap). Candidates next to the symbol come first;
// then two rings further out (about half and one label height beyond),
// which get a leader line. Rings stay close so that a leader never sends a
// label far from its symbol; labels with no free candidate are not placed
// and the caller reports how many.
func placeLabels(items []labelItem, obstacles []vg.Rectangle, bounds vg.Rectangle) []labelPlacement {
	out := make([]labelPlacement, len(items))
	blocked := make([]vg.Rectangle, 0, len(items)*2+len(obstacles))
	for _, it := range items {
		blocked = append(blocked, vg.Rectangle{
			Min: vg.Point{X: it.anchor.X - it.r, Y: it.anchor.Y - it.r},
			Max: vg.Point{X: it.anchor.X + it.r, Y: it.anchor.Y + it.r},
		})
	}
	blocked = append(blocked, obstacles...)
	for i, it := range items {
		base := it.r + labelGap
		for ring, dist := range []vg.Length{base, base + it.r + it.h*0.5, base + 2*it.r + it.h*1.2} {
			found := false
			for _, d := range labelDirs {
				r := candidate(it, d, dist)
				if !inside(r, bounds) {
					continue
				}
				g := grow(r, labelGap/2)
				free := true
				for _, b := range blocked {
					if overlaps(g, b) {
						free = false
						break
					}
				}
				if free {
					out[i] = labelPlacement{rect: r, placed: true, leader: ring > 0}
					blocked = append(blocked, grow(r, labelGap/2))
					found = true
					break
				}
			}
			if found {
				break
			}
		}
	}
	return out
}

// nearestOnRect is the point of r closest to p, for leader lines.
func nearestOnRect(r vg.Rectangle, p vg.Point) vg.Point {
	q := p
	if q.X < r.Min.X {
		q.X = r.Min.X
	}
	if q.X > r.Max.X {
		q.X = r.Max.X
	}
	if q.Y < r.Min.Y {
		q.Y = r.Min.Y
	}
	if q.Y > r.Max.Y {
		q.Y = r.Max.Y
	}
	return q
}
