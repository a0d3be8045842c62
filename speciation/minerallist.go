package speciation

import (
	"errors"
	"fmt"
	"strings"

	"gwsat.dev/gwsat/internal/suggest"
)

// ErrUnknownMineral is returned for a mineral name the data set does not hold.
var ErrUnknownMineral = errors.New("speciation: unknown mineral")

// ParseMinerals reads a comma-separated list of mineral names as a user types it:
// any case, the alternative names of MineralAliases, blanks ignored and a mineral
// named twice kept once, in the order first given. It returns the data set's names.
// An unknown name or a gas is an error wrapping ErrUnknownMineral, with a
// suggestion when a name is close. An empty list gives nil.
func (db *Database) ParseMinerals(list string) ([]string, error) {
	var out []string
	seen := map[int]bool{}
	for _, f := range strings.Split(list, ",") {
		f = strings.TrimSpace(f)
		if f == "" {
			continue
		}
		i := db.MineralIndex(f)
		if i < 0 || db.minerals[i].Gas {
			return nil, fmt.Errorf("%w %q%s; known: %s", ErrUnknownMineral, f, suggest.Hint(f, db.MineralNames()), strings.Join(db.MineralNames(), ", "))
		}
		if !seen[i] {
			seen[i] = true
			out = append(out, db.minerals[i].Name)
		}
	}
	return out, nil
}
