package outguard

import (
	"fmt"
	"os"
	"path/filepath"
	"strings"
)

// maxLinks bounds the dangling links followed, as the kernel's ELOOP does.
const maxLinks = 40

// realPath is path made absolute with every symbolic link resolved. When the
// path does not exist, its deepest existing ancestor is resolved and the rest
// appended; a dangling link in the last element is followed to the file that
// writing through it would create.
func realPath(path string) (string, error) {
	abs := path
	if !filepath.IsAbs(path) {
		wd, err := os.Getwd()
		if err != nil {
			return "", fmt.Errorf("outguard: %w", err)
		}
		// Not filepath.Join, which would clean "link/.." lexically.
		abs = wd + string(filepath.Separator) + path
	}
	for range maxLinks {
		if r, err := filepath.EvalSymlinks(abs); err == nil {
			return r, nil
		}
		fi, err := os.Lstat(abs)
		if err != nil || fi.Mode()&os.ModeSymlink == 0 {
			break
		}
		target, err := os.Readlink(abs)
		if err != nil {
			return "", fmt.Errorf("outguard: %w", err)
		}
		if !filepath.IsAbs(target) {
			dir, _ := filepath.Split(abs)
			target = dir + target
		}
		abs = target
	}
	// Not there (yet): resolve the existing part.
	var rest []string
	for dir := abs; ; {
		parent, base := splitLast(dir)
		if parent == dir {
			return filepath.Clean(abs), nil // nothing exists, not even the root
		}
		rest = append([]string{base}, rest...)
		if r, err := filepath.EvalSymlinks(parent); err == nil {
			return filepath.Join(append([]string{r}, rest...)...), nil
		}
		dir = parent
	}
}

// splitLast splits off the last element without cleaning the rest.
func splitLast(path string) (dir, base string) {
	dir, base = filepath.Split(path)
	trimmed := strings.TrimRight(dir, string(filepath.Separator))
	if trimmed == "" || trimmed == filepath.VolumeName(dir) {
		trimmed = dir // the root keeps its separator
	}
	if base == "" { // path was the root
		return path, ""
	}
	return trimmed, base
}
