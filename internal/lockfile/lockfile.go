package lockfile

import (
	"bufio"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"sync"
)

// Name is the lock file's name inside the locked folder.
const Name = ".gwsat.lock"

// ErrLocked: the folder is locked by another run.
var ErrLocked = errors.New("lockfile: folder in use")

// LockedError says which process holds the folder. PID is 0 when the lock
// file could not be read (its holder was still writing it).
type LockedError struct {
	Dir  string
	Path string // the lock file
	PID  int
	Host string // empty when it is this host
}

func (e *LockedError) Error() string {
	who := "another process"
	if e.PID > 0 {
		who = "process " + strconv.Itoa(e.PID)
		if e.PID == os.Getpid() && e.Host == "" {
			who += " (this one)"
		}
	}
	if e.Host != "" {
		who += " on host " + strconv.Quote(e.Host)
	}
	return fmt.Sprintf("lockfile: folder %q is in use by %s (lock file %s)%s", e.Dir, who, e.Path, hint)
}

func (e *LockedError) Unwrap() error { return ErrLocked }

// Acquire locks dir, which must exist. The returned release unlocks it and
// removes the lock file; calling it again returns the first call's result.
// See the package documentation for locks left by a process that died.
func Acquire(dir string) (release func() error, err error) {
	fi, err := os.Stat(dir)
	if err != nil {
		return nil, fmt.Errorf("lockfile: %w", err)
	}
	if !fi.IsDir() {
		return nil, fmt.Errorf("lockfile: %s is not a folder", dir)
	}
	path := filepath.Join(dir, Name)
	f, err := lock(path)
	if errors.Is(err, ErrLocked) {
		return nil, lockedError(dir, path)
	}
	if err != nil {
		return nil, err
	}
	if err := writeOwner(f); err != nil {
		unlock(f, path)
		return nil, err
	}
	var once sync.Once
	var relErr error
	return func() error {
		once.Do(func() { relErr = unlock(f, path) })
		return relErr
	}, nil
}

// writeOwner puts "PID\nHOST\n" at the start of the file, then cuts what a
// previous holder left after it: a reader sees the new process id first.
func writeOwner(f *os.File) error {
	host, _ := os.Hostname()
	s := fmt.Sprintf("%d\n%s\n", os.Getpid(), host)
	if _, err := f.WriteAt([]byte(s), 0); err != nil {
		return fmt.Errorf("lockfile: %w", err)
	}
	if err := f.Truncate(int64(len(s))); err != nil {
		return fmt.Errorf("lockfile: %w", err)
	}
	return nil
}

// lockedError reads who holds the lock.
func lockedError(dir, path string) error {
	e := &LockedError{Dir: dir, Path: path}
	f, err := os.Open(path)
	if err != nil {
		return e
	}
	defer f.Close()
	sc := bufio.NewScanner(f)
	if sc.Scan() {
		if pid, err := strconv.Atoi(strings.TrimSpace(sc.Text())); err == nil && pid > 0 {
			e.PID = pid
		}
	}
	if sc.Scan() {
		if host, _ := os.Hostname(); sc.Text() != host {
			e.Host = sc.Text()
		}
	}
	return e
}
