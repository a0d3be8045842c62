package atomicfile

import (
	"fmt"
	"os"
	"path/filepath"
)

// maxLinks bounds the symbolic links followed, as the kernel's ELOOP does.
const maxLinks = 40

// resolve follows symbolic links in path's last element, so that the link is
// kept and its target replaced; a dangling link's target is created, as
// os.Create would. Directories on the way need no resolving: the temporary
// file goes into the same directory as the target, and rename works through
// them. A relative link target is joined to the link's directory without
// lexical cleaning, so "sub/../x" means what the kernel means by it.
func resolve(path string) (string, error) {
	for range maxLinks {
		fi, err := os.Lstat(path)
		if err != nil || fi.Mode()&os.ModeSymlink == 0 {
			return path, nil
		}
		target, err := os.Readlink(path)
		if err != nil {
			return "", fmt.Errorf("atomicfile: %w", err)
		}
		if !filepath.IsAbs(target) {
			dir, _ := filepath.Split(path)
			target = dir + target
		}
		path = target
	}
	return "", fmt.Errorf("atomicfile: %s: too many levels of symbolic links", path)
}
