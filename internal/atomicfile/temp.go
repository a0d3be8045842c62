package atomicfile

import (
	"errors"
	"fmt"
	"math/rand/v2"
	"os"
	"path/filepath"
	"regexp"
	"slices"
	"time"
	"unicode/utf8"
)

const (
	// tempMarker sits between the destination's name and the random digits.
	tempMarker = ".gwsat-tmp-"
	// maxBase keeps ".NAME.gwsat-tmp-XXXXXXXXXXXX" within the 255 bytes most
	// file systems allow for a name.
	maxBase = 200
)

// tempPattern matches our temporary files and nothing a user would name.
var tempPattern = regexp.MustCompile(`^\..+\.gwsat-tmp-[0-9a-f]{12}$`)

// createTemp creates and registers ".NAME.gwsat-tmp-XXXXXXXXXXXX" next to
// path with perm (less the umask). It fails with ErrInterrupted once
// RemoveInFlight has been called.
func createTemp(path string, perm os.FileMode) (*os.File, error) {
	dir, base := filepath.Split(path)
	for len(base) > maxBase {
		_, size := utf8.DecodeLastRuneInString(base)
		base = base[:len(base)-size]
	}
	for range 100 {
		name := fmt.Sprintf("%s.%s%s%012x", dir, base, tempMarker, rand.Uint64()>>16)
		f, err := openRegistered(name, perm)
		if errors.Is(err, os.ErrExist) {
			continue
		}
		if err != nil {
			return nil, err
		}
		return f, nil
	}
	return nil, fmt.Errorf("atomicfile: no free temporary name next to %s", path)
}

// CleanStale removes the temporary files that an interrupted write left in
// dir: only regular files whose names match ".NAME.gwsat-tmp-" and twelve hex
// digits, last modified more than olderThan ago, and not held by a write in
// progress in this process. Other files, links and folders are never touched.
// It returns the paths removed; files that could not be removed are reported
// in err (the others are still removed).
func CleanStale(dir string, olderThan time.Duration) (removed []string, err error) {
	if olderThan < 0 {
		return nil, fmt.Errorf("atomicfile: cleaning %s: negative age %v", dir, olderThan)
	}
	entries, err := os.ReadDir(dir)
	if err != nil {
		return nil, fmt.Errorf("atomicfile: cleaning: %w", err)
	}
	cutoff := time.Now().Add(-olderThan)
	var errs []error
	for _, e := range entries {
		// ReadDir reports the type without following links: a link named
		// like ours is not a regular file and is left alone.
		if !e.Type().IsRegular() || !tempPattern.MatchString(e.Name()) {
			continue
		}
		p := filepath.Join(dir, e.Name())
		info, err := e.Info()
		if err != nil || info.ModTime().After(cutoff) || isInFlight(p) {
			continue
		}
		if err := os.Remove(p); err != nil && !errors.Is(err, os.ErrNotExist) {
			errs = append(errs, err)
			continue
		}
		removed = append(removed, p)
	}
	slices.Sort(removed)
	if len(errs) > 0 {
		return removed, fmt.Errorf("atomicfile: cleaning %s: %w", dir, errors.Join(errs...))
	}
	return removed, nil
}
