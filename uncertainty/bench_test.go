//go:build unix

package uncertainty

import (
	"bytes"
	"context"
	"syscall"
	"testing"
	"time"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// demoRecords assesses the embedded demo samples (invented).
func demoRecords(b testing.TB) (*speciation.Database, []assess.Record) {
	raw, err := data.Demo().ReadFile("demo/samples.csv")
	if err != nil {
		b.Fatal(err)
	}
	batch, err := hydro.Read(bytes.NewReader(raw), "demo/samples.csv", hydro.Options{})
	if err != nil {
		b.Fatal(err)
	}
	db, err := speciation.Default()
	if err != nil {
		b.Fatal(err)
	}
	recs, err := assess.Run(context.Background(), db, []*hydro.Batch{batch}, assess.Options{})
	if err != nil {
		b.Fatal(err)
	}
	return db, recs
}

// BenchmarkMonteCarloDemo runs 1000 draws for each of the demo's 96 samples
// on two workers. The target is 1000 draws for each of 1000 samples in at
// most 10 s on 2 cores: the metric s/1000samples extrapolates linearly.
// Run with -benchtime 1x (one op is about a second). On a machine shared
// with other work the wall time overstates the cost: cpu-s/1000samples is
// the processor time of the process (user + system), which divided by the 2
// cores is the wall time on an otherwise idle machine.
func BenchmarkMonteCarloDemo(b *testing.B) {
	db, recs := demoRecords(b)
	b.ResetTimer()
	start, cpu0 := time.Now(), cpuSeconds()
	for i := 0; i < b.N; i++ {
		if _, err := Run(context.Background(), db, recs, Options{Draws: 1000, Seed: 1, Workers: 2}); err != nil {
			b.Fatal(err)
		}
	}
	reportPer1000(b, start, cpu0, len(recs))
}

// BenchmarkLinearDemo is the linear estimate for the demo's samples.
func BenchmarkLinearDemo(b *testing.B) {
	db, recs := demoRecords(b)
	b.ResetTimer()
	start, cpu0 := time.Now(), cpuSeconds()
	for i := 0; i < b.N; i++ {
		if _, err := Run(context.Background(), db, recs, Options{Linear: true, Workers: 2}); err != nil {
			b.Fatal(err)
		}
	}
	reportPer1000(b, start, cpu0, len(recs))
}

// cpuSeconds is the processor time of the process so far.
func cpuSeconds() float64 {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	return float64(ru.Utime.Nano()+ru.Stime.Nano()) / 1e9
}

// reportPer1000 gives the wall and processor time per 1000 samples.
func reportPer1000(b *testing.B, start time.Time, cpu0 float64, n int) {
	per := 1000 / float64(n) / float64(b.N)
	b.ReportMetric(time.Since(start).Seconds()*per, "s/1000samples")
	b.ReportMetric((cpuSeconds()-cpu0)*per, "cpu-s/1000samples")
}

// BenchmarkMonteCarloOneSample is 1000 draws for one demo sample (the deep
// native water) on one goroutine, with its allocations: a few per sample
// (the copy of the water, the intervals), none per draw.
func BenchmarkMonteCarloOneSample(b *testing.B) {
	db, recs := demoRecords(b)
	var rec *assess.Record
	for i := range recs {
		if recs[i].Sample().ID == "NATIVE-D-R1" {
			rec = &recs[i]
		}
	}
	c, err := CaseOf(rec, Options{})
	if err != nil {
		b.Fatal(err)
	}
	e, err := NewEstimator(db, Options{Draws: 1000, Seed: 1})
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := e.MonteCarlo(&c, uint64(i)); err != nil {
			b.Fatal(err)
		}
	}
}
