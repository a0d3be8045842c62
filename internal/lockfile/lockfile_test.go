package lockfile

import (
	"errors"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"sync"
	"sync/atomic"
	"testing"
	"time"
)

func TestAcquireRelease(t *testing.T) {
	dir := t.TempDir()
	release, err := Acquire(dir)
	if err != nil {
		t.Fatal(err)
	}
	b, err := os.ReadFile(filepath.Join(dir, Name))
	if err != nil || !strings.HasPrefix(string(b), strconv.Itoa(os.Getpid())+"\n") {
		t.Fatalf("lock file holds %q, %v; want our pid first", b, err)
	}
	_, err = Acquire(dir)
	var le *LockedError
	if !errors.Is(err, ErrLocked) || !errors.As(err, &le) || le.PID != os.Getpid() {
		t.Fatalf("second Acquire: %v, want ErrLocked naming pid %d", err, os.Getpid())
	}
	if !strings.Contains(err.Error(), strconv.Itoa(os.Getpid())) || !strings.Contains(err.Error(), dir) {
		t.Errorf("message %q names neither the process nor the folder", err)
	}
	if err := release(); err != nil {
		t.Fatal(err)
	}
	if err := release(); err != nil {
		t.Errorf("second release: %v", err)
	}
	if _, err := os.Stat(filepath.Join(dir, Name)); !errors.Is(err, os.ErrNotExist) {
		t.Errorf("lock file left after release: %v", err)
	}
	again, err := Acquire(dir)
	if err != nil {
		t.Fatalf("Acquire after release: %v", err)
	}
	again()
}

func TestAcquireBadFolder(t *testing.T) {
	dir := t.TempDir()
	file := filepath.Join(dir, "file")
	os.WriteFile(file, nil, 0o644)
	for _, d := range []string{filepath.Join(dir, "absent"), file} {
		if _, err := Acquire(d); err == nil || errors.Is(err, ErrLocked) {
			t.Errorf("Acquire(%s): %v, want a plain error", d, err)
		}
	}
}

// Goroutines competing for one folder: never two holders at once, every refusal
// is ErrLocked, and the folder is free and clean at the end.
func TestAcquireConcurrent(t *testing.T) {
	dir := t.TempDir()
	var holders, wins, refusals atomic.Int32
	var wg sync.WaitGroup
	for range 8 {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for range 25 {
				release, err := Acquire(dir)
				if err != nil {
					if !errors.Is(err, ErrLocked) {
						t.Error(err)
					}
					refusals.Add(1)
					continue
				}
				if n := holders.Add(1); n != 1 {
					t.Errorf("%d holders at once", n)
				}
				wins.Add(1)
				time.Sleep(100 * time.Microsecond)
				holders.Add(-1)
				if err := release(); err != nil {
					t.Error(err)
				}
			}
		}()
	}
	wg.Wait()
	if wins.Load() == 0 || wins.Load()+refusals.Load() != 200 {
		t.Errorf("%d wins, %d refusals of 200 tries", wins.Load(), refusals.Load())
	}
	if entries, _ := os.ReadDir(dir); len(entries) != 0 {
		t.Errorf("left in the folder: %v", entries)
	}
}
