package assess

import (
	"fmt"
	"strings"

	"gwsat.dev/gwsat/speciation"
)

// BalanceComponent maps a user's ion name for closing the charge balance ("Cl",
// "Cl-", "SO4", "Ca2+", or the same with the sign first) to a charged component of the database; "" gives "".
func BalanceComponent(db *speciation.Database, name string) (string, error) {
	if strings.TrimSpace(name) == "" {
		return "", nil
	}
	if i := db.ComponentIndex(name); i >= 0 && db.Component(i).Charge != 0 {
		return db.Component(i).Name, nil
	}
	short := strings.ToLower(strings.TrimRight(strings.TrimSpace(name), " +-0123456789^"))
	for _, c := range db.Components() {
		if c.Charge != 0 && strings.ToLower(strings.TrimRight(c.Name, " +-0123456789")) == short {
			return c.Name, nil
		}
	}
	return "", fmt.Errorf("%q is not an ion of the data (try Cl, Na, SO4, Ca)", name)
}
