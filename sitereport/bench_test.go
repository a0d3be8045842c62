package sitereport

import (
	"context"
	"math"
	"os"
	"path/filepath"
	"testing"

	"gwsat.dev/gwsat/inject"
)

// maxIndexBytes is the weight target of the demo's index.html (3 MB: a page
// a reviewer can mail and open at once; the project's target).
const maxIndexBytes = 3 << 20

// BenchmarkDemoReport times the demo report as the report command makes it
// by default (PNG figures): reading the lab file, assessing every row, the
// site figures and the injection section, and writing the folder. The target
// is 4 s on 2 cores. It reports the index.html size and the CPU seconds used
// per report (user + system, all threads), and fails when index.html is
// heavier than maxIndexBytes.
func BenchmarkDemoReport(b *testing.B) { benchDemo(b, []string{"png"}) }

// BenchmarkDemoReportAllFormats adds the SVG and PDF figure files.
func BenchmarkDemoReportAllFormats(b *testing.B) { benchDemo(b, []string{"png", "svg", "pdf"}) }

func benchDemo(b *testing.B, formats []string) {
	var size int64
	cpu0 := cpuSeconds()
	n := 0
	for b.Loop() {
		dir := b.TempDir()
		opt := demoOptions(b, dir)
		opt.Formats = formats
		opt.Inject.AquiferTempC = math.NaN()
		opt.Inject.Well = inject.DefaultWell()
		if _, err := Write(context.Background(), opt); err != nil {
			b.Fatal(err)
		}
		fi, err := os.Stat(filepath.Join(dir, "index.html"))
		if err != nil {
			b.Fatal(err)
		}
		size = fi.Size()
		n++
	}
	if size > maxIndexBytes {
		b.Fatalf("index.html is %d bytes, over the %d-byte target", size, maxIndexBytes)
	}
	b.ReportMetric(float64(size), "index-bytes")
	if c := cpuSeconds(); c > 0 && n > 0 {
		b.ReportMetric((c-cpu0)/float64(n), "cpu-s/op")
	}
}
