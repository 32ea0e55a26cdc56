package optimise

import (
	"runtime"
	"sync"

	"spanbreak/splice"
)

// BatchInput is one job file of a batch: its name and bytes, or the error reading it.
type BatchInput struct {
	File string
	Data []byte
	Err  error
}

// BatchOutcome is the result of one job of a batch: a result, or the error that stopped it
// (a jobfile.Problems for a bad file, an *InfeasibleError when no layout meets the limits).
type BatchOutcome struct {
	File    string
	Title   string
	Outcome *Outcome
	Err     error
}

// Batch optimises several jobs, at most workers at a time (0: GOMAXPROCS); each job runs its
// scan on one goroutine, so the pool bounds the work in flight. A job that fails does not stop
// the others. progress, when not nil, is called once per finished job with the number done
// and the total, never from two goroutines at once. Outcomes are in the order of the inputs.
func Batch(inputs []BatchInput, set Settings, workers int, progress func(done, total int)) []BatchOutcome {
	if workers <= 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	workers = max(1, min(workers, len(inputs)))
	set.Workers = 1
	shelf := splice.NewShelf(batchShelf)
	out := make([]BatchOutcome, len(inputs))
	var mu sync.Mutex
	done := 0
	next := make(chan int)
	var wg sync.WaitGroup
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range next {
				out[i] = runOne(inputs[i], set, shelf)
				if progress != nil {
					mu.Lock()
					done++
					progress(done, len(inputs))
					mu.Unlock()
				}
			}
		}()
	}
	for i := range inputs {
		next <- i
	}
	close(next)
	wg.Wait()
	return out
}

// batchShelf is the number of splice problems (member, steels, design space) whose sizers a
// batch keeps for its later jobs.
const batchShelf = 16

func runOne(in BatchInput, set Settings, shelf *splice.Shelf) BatchOutcome {
	o := BatchOutcome{File: in.File}
	if in.Err != nil {
		o.Err = in.Err
		return o
	}
	s, err := Prepare(in.File, in.Data)
	if err != nil {
		o.Err = err
		return o
	}
	o.Title = s.Title
	s.shelf = shelf
	o.Outcome, o.Err = Run(s, set)
	return o
}
