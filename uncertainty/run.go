package uncertainty

import (
	"context"
	"runtime"
	"sync"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/speciation"
)

// Sample is the estimate for one record: Result, or Err saying why there is
// none (ErrNoResult for a record that was not speciated, ErrDraws for solves
// that failed); never both.
type Sample struct {
	Result
	Err error
}

// Run estimates the intervals of every record, in order, on Options.Workers
// goroutines (each with its own Estimator), with the Monte Carlo draws of
// record i seeded (Options.Seed, Options.FirstStream + i); with Options.Linear, the linear
// estimate. The error is for bad options or a cancelled context only: a
// record that cannot be estimated carries its own Err.
//
// With Options.Model nil (the automatic choice of assess), each record's
// draws use the model that record was solved with (Result.Model): Pitzer's
// for the brines assess solved with it, Truesdell-Jones for the rest.
func Run(ctx context.Context, db *speciation.Database, recs []assess.Record, opt Options) ([]Sample, error) {
	auto := opt.Model == nil
	o, err := opt.resolved()
	if err != nil {
		return nil, err
	}
	brineOpt := o
	brineOpt.Model = speciation.NewPitzer()
	out := make([]Sample, len(recs))
	workers := o.Workers
	if workers <= 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	jobs := make(chan int)
	var wg sync.WaitGroup
	var mu sync.Mutex
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			est, _ := NewEstimator(db, o) // o is resolved: no error
			var brine *Estimator
			for i := range jobs {
				e := est
				if auto && recs[i].Result != nil && recs[i].Result.Model == brineOpt.Model.Name() {
					if brine == nil {
						brine, _ = NewEstimator(db, brineOpt)
					}
					e = brine
				}
				out[i] = e.record(&recs[i], o.FirstStream+uint64(i))
				if o.Brief {
					out[i].brief()
				}
				if o.Progress != nil {
					mu.Lock()
					o.Progress()
					mu.Unlock()
				}
			}
		}()
	}
	var cerr error
feed:
	for i := range recs {
		select {
		case jobs <- i:
		case <-ctx.Done():
			cerr = ctx.Err()
			break feed
		}
	}
	close(jobs)
	wg.Wait()
	return out, cerr
}

// record estimates one record.
func (e *Estimator) record(r *assess.Record, stream uint64) Sample {
	c, err := CaseOf(r, e.opt)
	if err != nil {
		return Sample{Err: err}
	}
	var res Result
	if e.opt.Linear {
		res, err = e.Linear(&c)
	} else {
		res, err = e.MonteCarlo(&c, stream)
	}
	if err != nil {
		return Sample{Result: Result{Method: res.Method, Seed: res.Seed, Stream: res.Stream, Draws: res.Draws, Failed: res.Failed}, Err: err}
	}
	return Sample{Result: res}
}

// brief drops the inputs and sensitivities of a result (Options.Brief).
func (s *Sample) brief() {
	s.Inputs = nil
	for k := range s.Intervals {
		s.Intervals[k].Sensitivity = nil
	}
}
