package geo

import (
	"bytes"
	"encoding/binary"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
)

// This file writes a single-band float32 GeoTIFF: a baseline TIFF (TIFF
// Revision 6.0, Adobe 1992: one uncompressed strip, little-endian,
// SampleFormat 3 = IEEE float) with the GeoTIFF tags of OGC GeoTIFF 1.1
// (OGC 19-008r4, 2019): ModelPixelScaleTag, ModelTiepointTag and a
// GeoKeyDirectoryTag naming a projected CRS by its EPSG code.

// GeoTIFFNoData is the value written in raster cells without an estimate.
// It is recorded in the GDAL_NODATA tag (42113, an ASCII tag defined by
// GDAL and read by most GIS, `from memory`), since TIFF 6.0 and GeoTIFF 1.1
// have no no-data tag of their own.
const GeoTIFFNoData = -9999

// ErrRaster reports a raster that cannot be written (no cells, bad size or
// spacing).
var ErrRaster = errors.New("geo: invalid raster")

// Raster is a north-up raster in a projected CRS: row 0 is the northern
// row, column 0 the western column. Cell (col, row) covers
// [West+col*PixelW, West+(col+1)*PixelW] x [North-(row+1)*PixelH, North-row*PixelH]
// (metres) and holds Values[row*Cols+col]; Mask false (or a non-finite
// value) means no estimate.
type Raster struct {
	EPSG           int // projected CRS, e.g. 32633
	West, North    float64
	PixelW, PixelH float64
	Cols, Rows     int
	Values         []float64
	Mask           []bool
}

// RasterFromGrid turns a grid whose coordinates are already those of the
// projected CRS epsg (e.g. a grid laid over UTM eastings and northings)
// into a north-up raster, cell for cell.
func RasterFromGrid(g *Grid, epsg int) Raster {
	r := Raster{EPSG: epsg, West: g.X0 - g.DX/2, North: g.Y0 + (float64(g.NY)-0.5)*g.DY,
		PixelW: g.DX, PixelH: g.DY, Cols: g.NX, Rows: g.NY,
		Values: make([]float64, g.NX*g.NY), Mask: make([]bool, g.NX*g.NY)}
	for row := 0; row < g.NY; row++ {
		j := g.NY - 1 - row
		for i := 0; i < g.NX; i++ {
			if v, ok := g.At(i, j); ok && finite(v) {
				r.Values[row*g.NX+i], r.Mask[row*g.NX+i] = v, true
			}
		}
	}
	return r
}

// TIFF field types (TIFF 6.0, section 2).
const (
	tiffASCII  = 2
	tiffShort  = 3
	tiffLong   = 4
	tiffDouble = 12
)

// Tags used (TIFF 6.0 baseline; GeoTIFF 1.1 sec. 7; GDAL).
const (
	tagImageWidth      = 256
	tagImageLength     = 257
	tagBitsPerSample   = 258
	tagCompression     = 259
	tagPhotometric     = 262
	tagStripOffsets    = 273
	tagSamplesPerPixel = 277
	tagRowsPerStrip    = 278
	tagStripByteCounts = 279
	tagPlanarConfig    = 284
	tagSampleFormat    = 339
	tagModelPixelScale = 33550
	tagModelTiepoint   = 33922
	tagGeoKeyDirectory = 34735
	tagGDALNoData      = 42113
)

// GeoKeys (GeoTIFF 1.1, sec. 7.4 and annex requirements classes).
const (
	keyModelType       = 1024 // GTModelTypeGeoKey
	keyRasterType      = 1025 // GTRasterTypeGeoKey
	keyProjectedCRS    = 3072 // ProjectedCRSGeoKey
	keyProjLinearUnits = 3076 // ProjLinearUnitsGeoKey
	modelTypeProjected = 1
	rasterPixelIsArea  = 1
	unitMetre          = 9001 // EPSG unit of measure code for the metre
)

type tiffField struct {
	tag, typ uint16
	count    uint32
	data     []byte // little-endian payload
}

func shorts(v ...uint16) []byte {
	b := make([]byte, 2*len(v))
	for i, x := range v {
		binary.LittleEndian.PutUint16(b[2*i:], x)
	}
	return b
}

func longs(v ...uint32) []byte {
	b := make([]byte, 4*len(v))
	for i, x := range v {
		binary.LittleEndian.PutUint32(b[4*i:], x)
	}
	return b
}

func doubles(v ...float64) []byte {
	b := make([]byte, 8*len(v))
	for i, x := range v {
		binary.LittleEndian.PutUint64(b[8*i:], math.Float64bits(x))
	}
	return b
}

// WriteGeoTIFF writes r as a float32 GeoTIFF to w. Empty cells hold
// GeoTIFFNoData; no NaN or Inf is written.
func WriteGeoTIFF(w io.Writer, r Raster) error {
	if r.Cols < 1 || r.Rows < 1 || len(r.Values) != r.Cols*r.Rows || (r.Mask != nil && len(r.Mask) != len(r.Values)) {
		return fmt.Errorf("%w: %d x %d cells with %d values", ErrRaster, r.Cols, r.Rows, len(r.Values))
	}
	if !(r.PixelW > 0) || !(r.PixelH > 0) || !finite(r.PixelW) || !finite(r.PixelH) || !finite(r.West) || !finite(r.North) {
		return fmt.Errorf("%w: origin (%v, %v), pixel %v x %v m", ErrRaster, r.West, r.North, r.PixelW, r.PixelH)
	}
	c, err := ParseEPSG(r.EPSG)
	if err != nil {
		return err
	}
	if c.Geographic {
		return fmt.Errorf("%w: EPSG:%d is geographic; a raster in metres needs a projected CRS", ErrUnsupportedCRS, r.EPSG)
	}
	pix := make([]byte, 4*len(r.Values))
	for k, v := range r.Values {
		if (r.Mask != nil && !r.Mask[k]) || !finite(v) {
			v = GeoTIFFNoData
		}
		binary.LittleEndian.PutUint32(pix[4*k:], math.Float32bits(float32(v)))
	}
	geoKeys := shorts(
		1, 1, 1, 4, // KeyDirectoryVersion, KeyRevision, MinorRevision (1.1), NumberOfKeys
		keyModelType, 0, 1, modelTypeProjected,
		keyRasterType, 0, 1, rasterPixelIsArea,
		keyProjectedCRS, 0, 1, uint16(r.EPSG),
		keyProjLinearUnits, 0, 1, unitMetre,
	)
	nodata := append([]byte(strconv.Itoa(GeoTIFFNoData)), 0)
	fields := []tiffField{
		{tagImageWidth, tiffLong, 1, longs(uint32(r.Cols))},
		{tagImageLength, tiffLong, 1, longs(uint32(r.Rows))},
		{tagBitsPerSample, tiffShort, 1, shorts(32)},
		{tagCompression, tiffShort, 1, shorts(1)},
		{tagPhotometric, tiffShort, 1, shorts(1)}, // BlackIsZero
		{tagStripOffsets, tiffLong, 1, nil},       // filled below
		{tagSamplesPerPixel, tiffShort, 1, shorts(1)},
		{tagRowsPerStrip, tiffLong, 1, longs(uint32(r.Rows))},
		{tagStripByteCounts, tiffLong, 1, longs(uint32(len(pix)))},
		{tagPlanarConfig, tiffShort, 1, shorts(1)},
		{tagSampleFormat, tiffShort, 1, shorts(3)}, // IEEE floating point
		{tagModelPixelScale, tiffDouble, 3, doubles(r.PixelW, r.PixelH, 0)},
		{tagModelTiepoint, tiffDouble, 6, doubles(0, 0, 0, r.West, r.North, 0)},
		{tagGeoKeyDirectory, tiffShort, uint32(len(geoKeys) / 2), geoKeys},
		{tagGDALNoData, tiffASCII, uint32(len(nodata)), nodata},
	}
	// Layout: header (8), IFD, out-of-line values, pixel strip.
	ifdSize := 2 + 12*len(fields) + 4
	off := 8 + ifdSize
	var extra bytes.Buffer
	offsets := make([]uint32, len(fields))
	for i, f := range fields {
		if len(f.data) > 4 {
			if (off+extra.Len())%2 == 1 {
				extra.WriteByte(0) // values begin on a word boundary (TIFF 6.0 sec. 2)
			}
			offsets[i] = uint32(off + extra.Len())
			extra.Write(f.data)
		}
	}
	stripOff := off + extra.Len()
	if stripOff%2 == 1 {
		extra.WriteByte(0)
		stripOff++
	}
	fields[5].data = longs(uint32(stripOff))

	var b bytes.Buffer
	b.Grow(stripOff + len(pix))
	b.WriteString("II")
	b.Write(shorts(42))
	b.Write(longs(8))
	b.Write(shorts(uint16(len(fields))))
	for i, f := range fields {
		b.Write(shorts(f.tag, f.typ))
		b.Write(longs(f.count))
		if len(f.data) > 4 {
			b.Write(longs(offsets[i]))
		} else {
			v := make([]byte, 4)
			copy(v, f.data)
			b.Write(v)
		}
	}
	b.Write(longs(0)) // no next IFD
	b.Write(extra.Bytes())
	b.Write(pix)
	_, err = w.Write(b.Bytes())
	return err
}
