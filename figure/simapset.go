package figure

import (
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
)

// SIMaps is a figure of several SI map panels (e.g. one per sampling round)
// on one page: one title, one legend, one colour bar and one caption for
// the figure, the panels in Cols columns (0: two columns when there is
// more than one panel), all on the same extent and colour scale (the
// largest of the panels' ColorLimit) so that they compare. Each panel's
// Title and Note are written above it.
type SIMaps struct {
	Title, Caption string
	Maps           []SIMap
	Cols           int
}

// Skipped counts the non-finite values left out of all panels.
func (ms SIMaps) Skipped() int {
	n := 0
	for _, m := range ms.Maps {
		n += m.Skipped()
	}
	return n
}

func (ms SIMaps) cols() int {
	n := len(ms.Maps)
	c := ms.Cols
	if c < 1 {
		c = min(n, 2)
	}
	return min(c, n)
}

// panelBox is a placed panel: its layout and header.
type panelBox struct {
	s      *mapState
	lay    mapLayout
	header draw.Canvas
	note   []string // the panel note, wrapped
}

// mapsLayout is everything Draw computes before drawing.
type mapsLayout struct {
	pg             page
	legTop, capTop vg.Length
	panels         []panelBox
	cbarX          vg.Length
	cbarY0, cbarY1 vg.Length
	lim            float64
	colorLabel     string
	band           float64
}

func (ms SIMaps) prepare() ([]*mapState, error) {
	if len(ms.Maps) == 0 {
		return nil, fmt.Errorf("%w: SI map figure %q has no panel", ErrNoData, ms.Title)
	}
	var states []*mapState
	lim := 0.0
	for i, m := range ms.Maps {
		s, err := m.prepare()
		if err != nil {
			return nil, fmt.Errorf("panel %d: %w", i+1, err)
		}
		states = append(states, s)
		lim = math.Max(lim, s.lim)
	}
	// One extent and one colour scale for all panels.
	ext := states[0].ext
	for _, s := range states[1:] {
		ext.add(s.ext.x0, s.ext.y0)
		ext.add(s.ext.x1, s.ext.y1)
	}
	for _, s := range states {
		s.ext, s.lim, s.scale = ext, lim, Diverging{Limit: lim}
	}
	return states, nil
}

func (ms SIMaps) layout(c draw.Canvas, states []*mapState, note string) mapsLayout {
	var L mapsLayout
	L.lim = states[0].lim
	L.colorLabel = states[0].colorLabel()
	// One legend: the entries of every panel, each once.
	var legend []legendEntry
	seen := map[string]bool{}
	for _, s := range states {
		for _, e := range s.legend() {
			if !seen[e.label] {
				seen[e.label] = true
				legend = append(legend, e)
			}
		}
		if s.hasCells {
			L.band = math.Max(L.band, s.band)
		}
	}
	L.pg = newPage(c, ms.Title, ms.Caption, legend, note)
	body, legTop, capTop := L.pg.layout(c)
	L.legTop, L.capTop = legTop, capTop
	body.Max.X -= colorBarWidth(L.lim)
	cols := ms.cols()
	rows := (len(states) + cols - 1) / cols
	tiles := draw.Tiles{Rows: rows, Cols: cols, PadX: 10, PadY: 8}
	hTitle := lineHeight(textStyle(sizeLabel))
	hNote := lineHeight(textStyle(sizeSmall))
	L.cbarY0, L.cbarY1 = vg.Length(math.Inf(1)), vg.Length(math.Inf(-1))
	for i, s := range states {
		tile := tiles.At(body, i%cols, i/cols)
		header := tile
		top := tile.Max.Y
		if s.m.Title != "" {
			top -= hTitle
		}
		note := wrapText(textStyle(sizeSmall), s.m.Note, tile.Max.X-tile.Min.X)
		top -= vg.Length(len(note)) * hNote
		if top < tile.Max.Y {
			top -= 3
		}
		header.Min.Y = top
		tile.Max.Y = top
		lay := s.layout(tile, i%cols > 0)
		L.panels = append(L.panels, panelBox{s: s, lay: lay, header: header, note: note})
		L.cbarX = max(L.cbarX, lay.da.Max.X+10)
		L.cbarY0 = min(L.cbarY0, lay.da.Min.Y)
		L.cbarY1 = max(L.cbarY1, lay.da.Max.Y)
	}
	if rows > 1 {
		// A bar as tall as the first row reads better than one spanning gaps.
		L.cbarY0 = L.panels[0].lay.da.Min.Y
	}
	return L
}

// droppedLabels lists the labels no panel could place.
func (L mapsLayout) droppedLabels() []string {
	var out []string
	seen := map[string]bool{}
	for _, pb := range L.panels {
		for i, p := range pb.lay.places {
			if !p.placed && !seen[pb.lay.texts[i]] {
				seen[pb.lay.texts[i]] = true
				out = append(out, pb.lay.texts[i])
			}
		}
	}
	return out
}

// Draw draws the panels on c.
func (ms SIMaps) Draw(c draw.Canvas) error {
	L, err := ms.place(c)
	if err != nil {
		return err
	}
	tsty := textStyle(sizeLabel)
	tsty.XAlign, tsty.YAlign = draw.XCenter, draw.YTop
	nsty := textStyle(sizeSmall)
	nsty.Color = greyColor
	nsty.XAlign, nsty.YAlign = draw.XCenter, draw.YTop
	for _, pb := range L.panels {
		pb.lay.p.Draw(pb.lay.mapC)
		cx := (pb.lay.da.Min.X + pb.lay.da.Max.X) / 2
		y := pb.header.Max.Y
		if pb.s.m.Title != "" {
			c.FillText(tsty, vg.Point{X: cx, Y: y}, pb.s.m.Title)
			y -= lineHeight(tsty)
		}
		for _, l := range pb.note {
			c.FillText(nsty, vg.Point{X: (pb.header.Min.X + pb.header.Max.X) / 2, Y: y}, l)
			y -= lineHeight(nsty)
		}
	}
	drawColorBar(c, L.cbarX, L.cbarY0, L.cbarY1, L.lim, L.band, L.colorLabel)
	L.pg.draw(c, L.legTop, L.capTop)
	return nil
}

// place lays the figure out, with a note under the legend naming labels
// that found no room (two passes: the note takes room from the maps).
func (ms SIMaps) place(c draw.Canvas) (mapsLayout, error) {
	states, err := ms.prepare()
	if err != nil {
		return mapsLayout{}, err
	}
	note := ""
	var L mapsLayout
	for pass := 0; pass < 2; pass++ {
		L = ms.layout(c, states, note)
		dropped := L.droppedLabels()
		if len(dropped) == 0 {
			L.pg.legendNote = ""
			break
		}
		msg := fmt.Sprintf("%d labels not shown where symbols crowd.", len(dropped))
		if len(dropped) <= 6 {
			msg = "Not labelled where symbols crowd: " + strings.Join(dropped, ", ") + "."
		}
		if note == "" {
			note = msg
			continue
		}
		L.pg.legendNote = msg
		break
	}
	return L, nil
}

// LabelBoxes lays the figure out on a page of the given size and returns,
// in page coordinates, the boxes of the placed well and feature labels and
// the boxes of the map furniture (north arrows and scale bars), for
// checking that nothing overlaps.
func (ms SIMaps) LabelBoxes(width, height vg.Length) (labels, furniture []vg.Rectangle, err error) {
	c := draw.New(vgimg.New(width, height))
	L, err := ms.place(c)
	if err != nil {
		return nil, nil, err
	}
	for _, pb := range L.panels {
		for _, p := range pb.lay.places {
			if p.placed {
				labels = append(labels, p.rect)
			}
		}
		if pb.s.m.NorthArrow {
			furniture = append(furniture, northArrowRect(pb.lay.da))
		}
		if pb.s.m.ScaleBar {
			furniture = append(furniture, pb.s.scaleBarRect(pb.lay.p, pb.lay.da))
		}
	}
	return labels, furniture, nil
}

// FitHeight returns a page height for the given width at which the panels'
// data areas take the maps' own shape (equal scale on both axes), so that
// no space is wasted above and below the maps; the result lies between
// 0.4 and 1.6 times the width.
func (ms SIMaps) FitHeight(width vg.Length) vg.Length {
	states, err := ms.prepare()
	if err != nil {
		return width * 0.75
	}
	s := states[0]
	cols := ms.cols()
	rows := (len(states) + cols - 1) / cols
	// Allowances (points): y axis title, ticks and labels; x axis the same;
	// panel header of a title and two note lines.
	big := math.Max(math.Abs(s.ext.y0), math.Abs(s.ext.y1))
	yAxis := textStyle(sizeTick).Width(formatNum(big, 7)) + lineHeight(textStyle(sizeLabel)) + 14
	xAxis := lineHeight(textStyle(sizeTick)) + lineHeight(textStyle(sizeLabel)) + 14
	header := lineHeight(textStyle(sizeLabel)) + 2*lineHeight(textStyle(sizeSmall)) + 3
	panelW := (width-2*pageMargin-colorBarWidth(s.lim)-vg.Length(cols-1)*10)/vg.Length(cols) - yAxis
	aspect := (s.ext.y1 - s.ext.y0) / ((s.ext.x1 - s.ext.x0) * s.aspectX)
	panelH := panelW*vg.Length(aspect) + xAxis + header
	legend := legendHeight(s.legend(), "", width-2*pageMargin) + 2*lineHeight(textStyle(sizeSmall))
	title := lineHeight(textStyle(sizeTitle)) + 3
	h := vg.Length(rows)*panelH + vg.Length(rows-1)*8 + legend + title + 2*pageMargin
	return max(0.4*width, min(1.6*width, h))
}
