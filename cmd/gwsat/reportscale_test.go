//go:build unix

package main

import (
	"bytes"
	"context"
	"io"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"syscall"
	"testing"
	"time"

	"gwsat.dev/gwsat/sitereport"
)

// maxReportRSSkB bounds the peak resident memory of `gwsat report` on the
// reportMemoryRows rows of TestReportMemory. The records a report keeps
// are compact (sitereport.Collect), a few kilobytes a row; keeping every
// row whole, as before, took about 600 MB on 10,000 rows.
const maxReportRSSkB = 500 * 1000

// reportMemoryRows is the size of TestReportMemory (GWSAT_SCALE_ROWS
// overrides it; the bound is for this size).
const reportMemoryRows = 20000

// reportScaleRows is the size of BenchmarkReportScale: GWSAT_SCALE_ROWS,
// else def.
func reportScaleRows(tb testing.TB, def int) int {
	if os.Getenv("GWSAT_SCALE_ROWS") == "" {
		return def
	}
	return scaleRows(tb)
}

// The gwsat binary writes the report of a 20,000-row file within
// maxReportRSSkB of peak resident memory, as measured by the kernel for the
// child process: samples.csv has one line per row, while the page shows
// the first sitereport.MaxPageRows and says so.
func TestReportMemory(t *testing.T) {
	if testing.Short() {
		t.Skip("builds gwsat and reports on a large file: a minute of CPU")
	}
	rows := reportScaleRows(t, reportMemoryRows)
	dir := t.TempDir()
	in := writeBig(t, dir, rows)
	out := filepath.Join(dir, "rep")
	rssKB := measureGwsat(t, dir, rows, "report", in, "-q", "-o", out)
	if rssKB > maxReportRSSkB && rows <= reportMemoryRows {
		t.Errorf("peak RSS %d kB, want <= %d kB", rssKB, maxReportRSSkB)
	}
	if n := countLines(t, filepath.Join(out, "samples.csv")); n != rows+1 {
		t.Errorf("samples.csv: %d lines, want %d (header and one per row)", n, rows+1)
	}
	page, err := os.ReadFile(filepath.Join(out, "index.html"))
	if err != nil {
		t.Fatal(err)
	}
	if want := "show the first " + strconv.Itoa(sitereport.MaxPageRows); rows > sitereport.MaxPageRows && !strings.Contains(string(page), want) {
		t.Errorf("index.html does not say %q", want)
	}
}

// BenchmarkReportScale times the report command, in process, on a generated
// file of GWSAT_SCALE_ROWS rows (default 100,000: the target is 60 s and
// 1 GB of peak resident memory on 2 cores), with its figures. It reports
// the wall time per row, the processor time (user + system, every thread)
// and the peak resident memory of the process.
//
//	GWSAT_SCALE_ROWS=100000 go test -run '^$' -bench ReportScale -benchtime 1x -timeout 30m ./cmd/gwsat
func BenchmarkReportScale(b *testing.B) {
	rows := reportScaleRows(b, 100000)
	dir := b.TempDir()
	in := writeBig(b, dir, rows)
	cpu0 := cpuSeconds()
	b.ResetTimer()
	start := time.Now()
	for i := 0; i < b.N; i++ {
		var stderr bytes.Buffer
		out := filepath.Join(dir, "rep"+strconv.Itoa(i))
		if code := run(context.Background(), []string{"report", in, "-q", "-o", out}, nil, io.Discard, &stderr); code != 0 {
			b.Fatalf("report: exit %d\n%s", code, stderr.Bytes())
		}
	}
	b.StopTimer()
	n := float64(b.N)
	b.ReportMetric(time.Since(start).Seconds()/n, "s/report")
	b.ReportMetric(float64(time.Since(start).Nanoseconds())/n/float64(rows), "ns/row")
	if c := cpuSeconds(); c > 0 {
		b.ReportMetric((c-cpu0)/n, "cpu-s/report")
	}
	var ru syscall.Rusage
	if syscall.Getrusage(syscall.RUSAGE_SELF, &ru) == nil {
		b.ReportMetric(float64(ru.Maxrss)/1000, "peak-RSS-MB")
	}
}

// cpuSeconds is the processor time of the process so far (user + system).
func cpuSeconds() float64 {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	return float64(ru.Utime.Sec+ru.Stime.Sec) + float64(ru.Utime.Usec+ru.Stime.Usec)/1e6
}
