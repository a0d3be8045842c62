//go:build linux || darwin || freebsd || netbsd || openbsd || dragonfly

package lockfile

import (
	"errors"
	"fmt"
	"os"
	"syscall"
)

const hint = ""

// lock opens (creating if needed) and flocks path. A holder that releases
// removes the file after we opened it but before we locked it would leave us
// holding an orphan: so the lock counts only when path still names the file
// we locked, and otherwise we try again.
func lock(path string) (*os.File, error) {
	for range 100 {
		f, err := os.OpenFile(path, os.O_RDWR|os.O_CREATE, 0o644)
		if err != nil {
			return nil, fmt.Errorf("lockfile: %w", err)
		}
		if err := flock(f); err != nil {
			f.Close()
			if errors.Is(err, syscall.EWOULDBLOCK) {
				return nil, ErrLocked
			}
			return nil, fmt.Errorf("lockfile: %s: %w", path, err)
		}
		held, err1 := f.Stat()
		named, err2 := os.Stat(path)
		if err1 == nil && err2 == nil && os.SameFile(held, named) {
			return f, nil
		}
		f.Close()
	}
	return nil, fmt.Errorf("lockfile: %s keeps being replaced", path)
}

func flock(f *os.File) error {
	for {
		err := syscall.Flock(int(f.Fd()), syscall.LOCK_EX|syscall.LOCK_NB)
		if !errors.Is(err, syscall.EINTR) {
			return err
		}
	}
}

// unlock removes the lock file, if it is still ours, and then drops the lock:
// in that order, so that a waiting run never locks a file already unlinked.
func unlock(f *os.File, path string) error {
	var errRemove error
	held, err1 := f.Stat()
	named, err2 := os.Stat(path)
	if err1 == nil && err2 == nil && os.SameFile(held, named) {
		if err := os.Remove(path); err != nil {
			errRemove = fmt.Errorf("lockfile: %w", err)
		}
	}
	if err := f.Close(); err != nil && errRemove == nil {
		return fmt.Errorf("lockfile: %w", err)
	}
	return errRemove
}
