package sparse

import (
	"runtime"
	"sync"
)

// pool is a fixed set of goroutines that run the func values sent to them.
// Factor hands its parallel work to a pool made in Analyze, because a go
// statement may make the runtime allocate a goroutine descriptor on every
// call while a send of a prebuilt func value allocates nothing.
type pool struct {
	jobs chan func()
	n    int
	once sync.Once
}

func newPool(n int) *pool {
	p := &pool{jobs: make(chan func()), n: n}
	for i := 0; i < n; i++ {
		go func(jobs chan func()) {
			for f := range jobs {
				f()
			}
		}(p.jobs)
	}
	return p
}

// run hands f to an idle goroutine of the pool; it blocks until one takes
// it. The caller must not run more jobs at once than the pool has
// goroutines.
func (p *pool) run(f func()) { p.jobs <- f }

// close stops the goroutines once they finish their jobs.
func (p *pool) close() { p.once.Do(func() { close(p.jobs) }) }

// poolFor returns a pool of at least n goroutines owned by owner, reusing
// old when it is big enough. A new pool is closed when owner becomes
// unreachable, so an abandoned solver leaks no goroutines.
func poolFor[T any](owner *T, old *pool, n int) *pool {
	if old != nil && old.n >= n {
		return old
	}
	if old != nil {
		old.close()
	}
	p := newPool(n)
	runtime.AddCleanup(owner, func(p *pool) { p.close() }, p)
	return p
}
