package sitereport

import (
	"context"
	"math"
	"testing"

	"gwsat.dev/gwsat/inject"
)

func BenchmarkDemoReport(b *testing.B) { benchDemo(b, []string{"png", "svg", "pdf"}) }

func BenchmarkDemoReportPNG(b *testing.B) { benchDemo(b, []string{"png"}) }

func benchDemo(b *testing.B, formats []string) {
	for b.Loop() {
		opt := demoOptions(b, b.TempDir())
		opt.Formats = formats
		opt.Inject.AquiferTempC = math.NaN()
		opt.Inject.Well = inject.DefaultWell()
		if _, err := Write(context.Background(), opt); err != nil {
			b.Fatal(err)
		}
	}
}
