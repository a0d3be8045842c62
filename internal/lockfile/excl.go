//go:build !(linux || darwin || freebsd || netbsd || openbsd || dragonfly)

package lockfile

import (
	"errors"
	"fmt"
	"os"
)

const hint = "; if no gwsat is running, delete the lock file"

// lock creates path exclusively. Without flock a lock left by a crash cannot
// be told from a live one, so it is never taken over.
func lock(path string) (*os.File, error) {
	f, err := os.OpenFile(path, os.O_RDWR|os.O_CREATE|os.O_EXCL, 0o644)
	if errors.Is(err, os.ErrExist) {
		return nil, ErrLocked
	}
	if err != nil {
		return nil, fmt.Errorf("lockfile: %w", err)
	}
	return f, nil
}

func unlock(f *os.File, path string) error {
	errClose := f.Close()
	if err := os.Remove(path); err != nil {
		return fmt.Errorf("lockfile: %w", err)
	}
	if errClose != nil {
		return fmt.Errorf("lockfile: %w", errClose)
	}
	return nil
}
