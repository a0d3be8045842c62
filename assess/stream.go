package assess

import (
	"context"
	"runtime"
	"sync"

	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// Item is one input row for Stream, with the file it came from.
type Item struct {
	File string
	Row  hydro.Row
}

// Stream assesses rows as next yields them and hands each record to emit in
// input order, speciating in parallel on Options.Workers goroutines with a
// bounded number of rows in flight (a few per worker), so that memory does not
// grow with the file. next returns false when the input is done; an error from
// next or emit stops the stream and is returned (emit is never called again).
// Records handed to emit are valid only during the call.
func Stream(ctx context.Context, db *speciation.Database, next func() (Item, bool, error), opt Options, emit func(*Record) error) error {
	return StreamPrepared(ctx, db, next, opt, nil, func(r *Record, _ *struct{}) error { return emit(r) })
}

// StreamPrepared is Stream with a second step of work per row that runs on
// the workers too: prepare (when not nil) is called on the worker that
// assessed the record, right after it, with a value of type T that belongs
// to the record's slot; emit then gets the record and that value, in input
// order. A slot's value is kept from one row to the next (a few slots per
// worker), so that buffers in it are reused; prepare must not keep the
// record. This lets the formatting of each row's output run in parallel
// while the output itself is written in order.
func StreamPrepared[T any](ctx context.Context, db *speciation.Database, next func() (Item, bool, error), opt Options, prepare func(*Record, *T), emit func(*Record, *T) error) error {
	auto := opt.Model == nil
	if auto {
		opt.Model = speciation.TruesdellJones{}
	}
	workers := opt.Workers
	if workers <= 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	// Slots carry records through the workers and back in input order: the
	// reader fills a slot, a worker assesses it, and the writer waits for the
	// slots in the order they were handed out.
	type slot struct {
		rec  Record
		val  T
		done chan struct{}
	}
	inFlight := 8 * workers
	free := make(chan *slot, inFlight)
	for i := 0; i < inFlight; i++ {
		free <- &slot{done: make(chan struct{}, 1)}
	}
	work := make(chan *slot, inFlight)
	order := make(chan *slot, inFlight)
	ctx, cancel := context.WithCancel(ctx)
	defer cancel()

	var wg sync.WaitGroup
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			solver := speciation.NewSolver(db, opt.Model)
			// Every row is solved from a cold start, so that its digits never
			// depend on the rows a worker happened to solve before it: the same
			// file gives the same bytes with any number of workers or shards.
			solver.WarmStart = false
			var brine *speciation.Solver
			if auto {
				brine = speciation.NewSolver(db, speciation.NewPitzer())
				brine.WarmStart = false
			}
			var sw speciation.Water
			for s := range work {
				assessOne(&s.rec, solver, brine, &sw, opt)
				if prepare != nil {
					prepare(&s.rec, &s.val)
				}
				s.done <- struct{}{}
			}
		}()
	}
	var readErr error
	go func() {
		defer close(order)
		defer close(work)
		for {
			var s *slot
			select {
			case s = <-free:
			case <-ctx.Done():
				readErr = ctx.Err()
				return
			}
			it, ok, err := next()
			if err != nil {
				readErr = err
				return
			}
			if !ok {
				return
			}
			s.rec = Record{File: it.File, Row: it.Row}
			order <- s
			work <- s
		}
	}()
	var emitErr error
	for s := range order {
		<-s.done
		if emitErr == nil {
			if opt.Progress != nil {
				opt.Progress()
			}
			if emitErr = emit(&s.rec, &s.val); emitErr != nil {
				cancel()
			}
		}
		s.rec = Record{}
		free <- s
	}
	wg.Wait()
	if emitErr != nil {
		return emitErr
	}
	return readErr
}

// BatchItems returns a next function for Stream over the rows of batches.
func BatchItems(batches []*hydro.Batch) func() (Item, bool, error) {
	b, i := 0, 0
	return func() (Item, bool, error) {
		for b < len(batches) && i >= len(batches[b].Rows) {
			b, i = b+1, 0
		}
		if b >= len(batches) {
			return Item{}, false, nil
		}
		it := Item{File: batches[b].File, Row: batches[b].Rows[i]}
		i++
		return it, true, nil
	}
}
