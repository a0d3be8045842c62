package reaction
import "testing"
func TestZZDrops(t *testing.T){ t.Logf("drops %d", debugDrops) }
