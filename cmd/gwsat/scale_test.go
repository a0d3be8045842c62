//go:build unix

package main

import (
	"bufio"
	"bytes"
	"context"
	"encoding/csv"
	"fmt"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"sync/atomic"
	"syscall"
	"testing"
	"time"

	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/internal/bigfile"
)

// maxCheckRSSkB is the memory target of `gwsat check` on a large file: the
// whole command within 300 MB of peak resident memory, whatever the number
// of rows (the project's target for 10^6 analyses on one machine).
const maxCheckRSSkB = 300 * 1000

// writeBig writes an invented lab file of rows samples (internal/bigfile).
func writeBig(tb testing.TB, dir string, rows int) string {
	tb.Helper()
	path := filepath.Join(dir, "big.csv")
	f, err := os.Create(path)
	if err != nil {
		tb.Fatal(err)
	}
	if err := bigfile.Write(f, rows, 1); err != nil {
		tb.Fatal(err)
	}
	if err := f.Close(); err != nil {
		tb.Fatal(err)
	}
	return path
}

// scaleRows is the size of the memory check and the benchmark:
// GWSAT_SCALE_ROWS, default 200,000.
func scaleRows(tb testing.TB) int {
	if v := os.Getenv("GWSAT_SCALE_ROWS"); v != "" {
		n, err := strconv.Atoi(v)
		if err != nil || n < 1 {
			tb.Fatalf("GWSAT_SCALE_ROWS=%q: want a positive number", v)
		}
		return n
	}
	return 200000
}

// The gwsat binary checks a 200,000-row file (GWSAT_SCALE_ROWS to change
// it) within maxCheckRSSkB of peak resident memory, as measured by the
// kernel for the child process, and writes one table line per row.
func TestCheckMemory(t *testing.T) {
	if testing.Short() {
		t.Skip("builds gwsat and checks a large file: minutes of CPU")
	}
	rows := scaleRows(t)
	dir := t.TempDir()
	in := writeBig(t, dir, rows)
	out := filepath.Join(dir, "out.csv")
	rssKB := measureGwsat(t, dir, rows, "check", in, "-q", "-o", out, "--geojson", filepath.Join(dir, "out.geojson"))
	if rssKB > maxCheckRSSkB {
		t.Errorf("peak RSS %d kB, want <= %d kB", rssKB, maxCheckRSSkB)
	}
	if n := countLines(t, out); n != rows+1 {
		t.Errorf("%d table lines, want %d (header and one per row)", n, rows+1)
	}
}

// runPeakRSS runs cmd and returns its peak resident memory in kB (0 when
// the system does not say). The kernel's figure for a child (rusage
// Maxrss) also counts the peak of this process, whose memory the child
// shares until it runs its program; so on Linux the child's own high-water
// mark (VmHWM in /proc/PID/status) is read while it runs instead, every
// 20 ms (it only grows, so the last reading is the peak but for the last
// few milliseconds).
// measureGwsat builds gwsat into dir, runs it with args, logs its wall time
// and peak resident memory (kB) for a file of rows rows, and returns the
// memory; it skips the test where the system reports no resource usage.
func measureGwsat(t *testing.T, dir string, rows int, args ...string) int64 {
	t.Helper()
	bin := filepath.Join(dir, "gwsat")
	if out, err := exec.Command("go", "build", "-o", bin, ".").CombinedOutput(); err != nil {
		t.Fatalf("go build: %v\n%s", err, out)
	}
	cmd := exec.Command(bin, args...)
	var stderr bytes.Buffer
	cmd.Stderr = &stderr
	start := time.Now()
	rssKB, err := runPeakRSS(cmd)
	if err != nil {
		t.Fatalf("gwsat %s: %v\n%s", args[0], err, stderr.Bytes())
	}
	wall := time.Since(start)
	if rssKB == 0 {
		t.Skip("no resource usage on this system")
	}
	t.Logf("%d rows: wall %v, peak RSS %d kB", rows, wall.Round(time.Millisecond), rssKB)
	return rssKB
}

func runPeakRSS(cmd *exec.Cmd) (int64, error) {
	if err := cmd.Start(); err != nil {
		return 0, err
	}
	status := fmt.Sprintf("/proc/%d/status", cmd.Process.Pid)
	var hwm atomic.Int64
	stop := make(chan struct{})
	polled := make(chan struct{})
	go func() {
		defer close(polled)
		tick := time.NewTicker(20 * time.Millisecond)
		defer tick.Stop()
		for {
			if kb := vmHWM(status); kb > hwm.Load() {
				hwm.Store(kb)
			}
			select {
			case <-stop:
				return
			case <-tick.C:
			}
		}
	}()
	err := cmd.Wait()
	close(stop)
	<-polled
	if kb := hwm.Load(); kb > 0 {
		return kb, err
	}
	if ru, ok := cmd.ProcessState.SysUsage().(*syscall.Rusage); ok {
		return ru.Maxrss, err
	}
	return 0, err
}

// vmHWM reads the VmHWM line of a /proc status file, in kB (0 when it
// cannot).
func vmHWM(path string) int64 {
	b, err := os.ReadFile(path)
	if err != nil {
		return 0
	}
	for _, l := range strings.Split(string(b), "\n") {
		if v, ok := strings.CutPrefix(l, "VmHWM:"); ok {
			n, _ := strconv.ParseInt(strings.TrimSuffix(strings.TrimSpace(v), " kB"), 10, 64)
			return n
		}
	}
	return 0
}

func countLines(t *testing.T, path string) int {
	t.Helper()
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	// Cells hold no line breaks in this table, so lines are records.
	n := 0
	sc := bufio.NewScanner(f)
	sc.Buffer(make([]byte, 1<<20), 1<<20)
	for sc.Scan() {
		n++
	}
	if err := sc.Err(); err != nil {
		t.Fatal(err)
	}
	return n
}

// parseCSV reads every record of a file with encoding/csv: the floor the
// pipeline is measured against.
func parseCSV(b *testing.B, path string) int {
	f, err := os.Open(path)
	if err != nil {
		b.Fatal(err)
	}
	defer f.Close()
	cr := csv.NewReader(bufio.NewReaderSize(f, 1<<16))
	cr.ReuseRecord = true
	cr.FieldsPerRecord = -1
	n := 0
	for {
		_, err := cr.Read()
		if err == io.EOF {
			return n
		}
		if err != nil {
			b.Fatal(err)
		}
		n++
	}
}

// scanRows reads every row with the hydro scanner (both passes).
func scanRows(b *testing.B, path string) int {
	s, err := hydro.ScanFile(path, hydro.Options{})
	if err != nil {
		b.Fatal(err)
	}
	defer s.Close()
	n := 0
	for {
		_, ok, err := s.Next()
		if err != nil {
			b.Fatal(err)
		}
		if !ok {
			return n
		}
		n++
	}
}

// BenchmarkCheckScale times, in the same run and on the same generated file
// (GWSAT_SCALE_ROWS rows, default 200,000), parsing it with encoding/csv,
// reading it with the hydro scanner, and the whole check pipeline (read,
// speciate, write the table and GeoJSON), and reports the ratios to the
// encoding/csv parse.
//
//	GWSAT_SCALE_ROWS=1000000 go test -run '^$' -bench CheckScale -benchtime 1x ./cmd/gwsat
func BenchmarkCheckScale(b *testing.B) {
	rows := scaleRows(b)
	dir := b.TempDir()
	in := writeBig(b, dir, rows)
	var tCSV, tScan, tCheck time.Duration
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		start := time.Now()
		if n := parseCSV(b, in); n != rows+2 {
			b.Fatalf("encoding/csv: %d records, want %d", n, rows+2)
		}
		tCSV += time.Since(start)

		start = time.Now()
		if n := scanRows(b, in); n != rows {
			b.Fatalf("scanner: %d rows, want %d", n, rows)
		}
		tScan += time.Since(start)

		start = time.Now()
		var stderr bytes.Buffer
		args := []string{"check", in, "-q", "-o", filepath.Join(dir, "out.csv"), "--geojson", filepath.Join(dir, "out.geojson")}
		if code := run(context.Background(), args, nil, io.Discard, &stderr); code != 0 {
			b.Fatalf("check: exit %d\n%s", code, stderr.Bytes())
		}
		tCheck += time.Since(start)
	}
	b.StopTimer()
	n := float64(b.N)
	b.ReportMetric(float64(tCSV.Nanoseconds())/n, "csv-ns/op")
	b.ReportMetric(float64(tScan.Nanoseconds())/n, "scan-ns/op")
	b.ReportMetric(float64(tCheck.Nanoseconds())/n, "check-ns/op")
	b.ReportMetric(float64(tScan)/float64(tCSV), "scan/csv")
	b.ReportMetric(float64(tCheck)/float64(tCSV), "check/csv")
	b.ReportMetric(float64(tCheck.Nanoseconds())/n/float64(rows), "check-ns/row")
}
