package profile

import (
	"context"
	"sync"

	"steamcase/plant"
)

// forEach runs job(ctx, pl, k) for k = 0 … n−1 on up to workers
// goroutines, each with its own plant: p itself and clones of it. After
// each job that succeeds, progress(k) is called, one call at a time. The
// first failure cancels the rest; the error returned is that of the
// lowest k that failed, or the context's.
func forEach(ctx context.Context, p *plant.Plant, n, workers int,
	job func(ctx context.Context, pl *plant.Plant, k int) error, progress func(k int)) error {
	workers = max(1, min(workers, n))
	ctx, cancel := context.WithCancel(ctx)
	defer cancel()
	jobs := make(chan int)
	var (
		mu       sync.Mutex
		firstErr error
		errK     = n
		wg       sync.WaitGroup
	)
	for w := 0; w < workers; w++ {
		pl := p
		if w > 0 {
			pl = p.Clone()
		}
		wg.Add(1)
		go func(pl *plant.Plant) {
			defer wg.Done()
			for k := range jobs {
				if err := job(ctx, pl, k); err != nil {
					mu.Lock()
					if k < errK {
						errK, firstErr = k, err
					}
					mu.Unlock()
					cancel()
					return
				}
				if progress != nil {
					mu.Lock()
					progress(k)
					mu.Unlock()
				}
			}
		}(pl)
	}
feed:
	for k := 0; k < n; k++ {
		select {
		case jobs <- k:
		case <-ctx.Done():
			break feed
		}
	}
	close(jobs)
	wg.Wait()
	if firstErr != nil {
		return firstErr
	}
	return ctx.Err()
}
