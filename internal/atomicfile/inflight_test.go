package atomicfile

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"sync"
	"testing"
	"time"
)

// A write blocked in fill loses its temporary file to RemoveInFlight, then fails
// with ErrInterrupted and leaves the destination as it was; later writes fail too.
func TestRemoveInFlight(t *testing.T) {
	t.Cleanup(resume)
	dir := t.TempDir()
	p := filepath.Join(dir, "out.csv")
	if err := WriteFile(p, []byte("previous")); err != nil {
		t.Fatal(err)
	}
	started, release := make(chan struct{}), make(chan struct{})
	done := make(chan error)
	go func() {
		done <- WriteWith(p, func(w io.Writer) error {
			io.WriteString(w, "half")
			close(started)
			<-release
			_, err := io.WriteString(w, " and the rest")
			return err
		})
	}()
	<-started
	entries, _ := os.ReadDir(dir)
	if len(entries) != 2 {
		t.Fatalf("during the write: %v", entries)
	}
	removed := RemoveInFlight()
	if len(removed) != 1 || filepath.Base(removed[0]) == "out.csv" || !tempPattern.MatchString(filepath.Base(removed[0])) {
		t.Fatalf("RemoveInFlight removed %q", removed)
	}
	if _, err := os.Stat(removed[0]); !errors.Is(err, os.ErrNotExist) {
		t.Errorf("temporary file still there: %v", err)
	}
	close(release)
	if err := <-done; !errors.Is(err, ErrInterrupted) {
		t.Errorf("interrupted write returned %v", err)
	}
	if got, _ := os.ReadFile(p); string(got) != "previous" {
		t.Errorf("destination holds %q", got)
	}
	if err := WriteFile(filepath.Join(dir, "later.csv"), []byte("x")); !errors.Is(err, ErrInterrupted) {
		t.Errorf("write after RemoveInFlight: %v", err)
	}
	if entries, _ := os.ReadDir(dir); len(entries) != 1 {
		t.Errorf("left behind: %v", entries)
	}
}

// Many writes racing with RemoveInFlight: each one either completes (the whole
// content) or fails with ErrInterrupted and writes nothing; no temporary file is left.
func TestRemoveInFlightConcurrent(t *testing.T) {
	t.Cleanup(resume)
	dir := t.TempDir()
	const n = 40
	errs := make([]error, n)
	var wg sync.WaitGroup
	for i := range n {
		wg.Add(1)
		go func() {
			defer wg.Done()
			errs[i] = WriteWith(filepath.Join(dir, fmt.Sprintf("f%02d", i)), func(w io.Writer) error {
				for range 50 {
					if _, err := fmt.Fprintf(w, "line %d\n", i); err != nil {
						return err
					}
				}
				time.Sleep(time.Duration(i%5) * time.Millisecond)
				return nil
			})
		}()
	}
	time.Sleep(2 * time.Millisecond)
	RemoveInFlight()
	wg.Wait()
	for i, err := range errs {
		p := filepath.Join(dir, fmt.Sprintf("f%02d", i))
		b, rerr := os.ReadFile(p)
		switch {
		case err == nil && (rerr != nil || len(b) != 50*len(fmt.Sprintf("line %d\n", i))):
			t.Errorf("f%02d: success but %d bytes, %v", i, len(b), rerr)
		case err != nil && !errors.Is(err, ErrInterrupted):
			t.Errorf("f%02d: %v", i, err)
		case err != nil && rerr == nil:
			t.Errorf("f%02d: interrupted but written", i)
		}
	}
	entries, _ := os.ReadDir(dir)
	for _, e := range entries {
		if tempPattern.MatchString(e.Name()) {
			t.Errorf("temporary file left: %s", e.Name())
		}
	}
}
