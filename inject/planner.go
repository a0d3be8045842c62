package inject

import (
	"errors"
	"fmt"
	"strings"
	"sync"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/internal/suggest"
	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/speciation/reaction"
)

// ErrSample is wrapped by every error about choosing a sample (unknown id, an id
// used twice, a rejected or unspeciated row).
var ErrSample = errors.New("inject: sample cannot be used")

// Planner holds the assessed records of a lab file and the reactor that
// re-solves changed waters.
type Planner struct {
	db      *speciation.Database
	reactor *reaction.Reactor
	recs    []assess.Record

	// byID indexes the records by sample id (built on first use), so that
	// looking waters up stays fast on a file of many rows.
	byIDOnce sync.Once
	byID     map[string][]int
}

// NewPlanner returns a planner for the records, solving with model (nil:
// Truesdell-Jones; a brine needs Pitzer, named explicitly).
func NewPlanner(db *speciation.Database, model speciation.ActivityModel, recs []assess.Record) *Planner {
	if model == nil {
		model = speciation.TruesdellJones{}
	}
	return &Planner{db: db, reactor: reaction.New(db, model), recs: recs}
}

// Reactor returns the planner's reactor.
func (p *Planner) Reactor() *reaction.Reactor { return p.reactor }

// Database returns the planner's thermodynamic data.
func (p *Planner) Database() *speciation.Database { return p.db }

// rowsOf returns the indices of the records with the sample id (at most
// two: enough to refuse an id used twice).
func (p *Planner) rowsOf(id string) []int {
	p.byIDOnce.Do(func() {
		p.byID = make(map[string][]int)
		for i := range p.recs {
			id := p.recs[i].Sample().ID
			if at := p.byID[id]; len(at) < 2 {
				p.byID[id] = append(at, i)
			}
		}
	})
	return p.byID[id]
}

// Water finds the sample with the given id and prepares it (speciated as
// measured). role names the water in messages ("native water", "injectate").
func (p *Planner) Water(role, id string) (reaction.Solution, *assess.Record, error) {
	if id == "" {
		return reaction.Solution{}, nil, fmt.Errorf("%w: no sample id given for the %s", ErrSample, role)
	}
	var hit *assess.Record
	if at := p.rowsOf(id); len(at) > 1 {
		return reaction.Solution{}, nil, fmt.Errorf("%w: %s %s occurs on lines %d and %d; make the id unique", ErrSample, role, id, p.recs[at[0]].Row.Line, p.recs[at[1]].Row.Line)
	} else if len(at) == 1 {
		hit = &p.recs[at[0]]
	}
	if hit == nil {
		ids := make([]string, len(p.recs))
		for i := range p.recs {
			ids[i] = p.recs[i].Sample().ID
		}
		return reaction.Solution{}, nil, fmt.Errorf("%w: %s %s: no sample with that id in the input%s", ErrSample, role, id, suggest.Hint(id, ids))
	}
	if hit.Status == hydro.StatusRejected || hit.Result == nil {
		return reaction.Solution{}, nil, fmt.Errorf("%w: %s %s (line %d): %s", ErrSample, role, id, hit.Row.Line, hit.FirstProblem())
	}
	var sw speciation.Water
	assess.SpeciationWater(&sw, &hit.Water, hit.TempC())
	sw.PressureBar = hit.PressureBar
	sol, _, err := p.reactor.Prepare(&sw)
	if err != nil {
		return reaction.Solution{}, nil, fmt.Errorf("%s %s: %w", role, id, err)
	}
	return sol, hit, nil
}

// ByType returns the id of the first speciated row whose sample-type column
// ("Sample type", "type", "role") says kind (e.g. "injectate", "native"), or "".
func ByType(recs []assess.Record, kind string) string {
	for i := range recs {
		r := &recs[i]
		if r.Result == nil {
			continue
		}
		if strings.EqualFold(r.Sample().Type(), kind) {
			return r.Sample().ID
		}
	}
	return ""
}

// checkTemp refuses a temperature outside the data's range.
func checkTemp(what string, t float64) error {
	if !(t >= speciation.MinTempC && t <= speciation.MaxTempC) {
		return fmt.Errorf("%s %g C outside the supported %g-%g C", what, t, speciation.MinTempC, speciation.MaxTempC)
	}
	return nil
}
