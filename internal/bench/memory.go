package bench

import (
	"bytes"
	"os"
	"runtime"
	"runtime/debug"
	"runtime/metrics"
	"strconv"
	"sync"
	"time"
)

// heapMetric is the Go heap memory occupied by objects, live or not yet
// swept: an upper bound on the live heap at each instant.
const heapMetric = "/memory/classes/heap/objects:bytes"

// sampleEvery is the period of the heap sampler.
const sampleEvery = 2 * time.Millisecond

// memSampler records the largest heap in use between start and stop.
type memSampler struct {
	mu   sync.Mutex
	peak uint64
	stop chan struct{}
	done chan struct{}
	s    []metrics.Sample
}

func heapNow(s []metrics.Sample) uint64 {
	metrics.Read(s)
	if s[0].Value.Kind() != metrics.KindUint64 {
		return 0
	}
	return s[0].Value.Uint64()
}

// startSampler collects garbage, then samples the heap until stop.
func startSampler() *memSampler {
	runtime.GC()
	m := &memSampler{stop: make(chan struct{}), done: make(chan struct{}),
		s: []metrics.Sample{{Name: heapMetric}}}
	m.peak = heapNow(m.s)
	go func() {
		defer close(m.done)
		t := time.NewTicker(sampleEvery)
		defer t.Stop()
		s := []metrics.Sample{{Name: heapMetric}}
		for {
			select {
			case <-m.stop:
				return
			case <-t.C:
				m.observe(heapNow(s))
			}
		}
	}()
	return m
}

func (m *memSampler) observe(v uint64) {
	m.mu.Lock()
	if v > m.peak {
		m.peak = v
	}
	m.mu.Unlock()
}

// mark samples now (at the end of a stage, where the heap may be at its
// largest before the next collection).
func (m *memSampler) mark() { m.observe(heapNow(m.s)) }

// finish stops the sampler and returns the peak heap (bytes).
func (m *memSampler) finish() uint64 {
	m.mark()
	close(m.stop)
	<-m.done
	m.mu.Lock()
	defer m.mu.Unlock()
	return m.peak
}

// resetPeakRSS returns the freed heap to the system and asks Linux to
// reset the process's VmHWM to the current resident set (writing 5 to
// /proc/self/clear_refs, see proc(5)); it reports whether that worked.
// Without the first step the pages a larger earlier case left behind
// would count as this case's peak.
func resetPeakRSS() bool {
	debug.FreeOSMemory()
	return os.WriteFile("/proc/self/clear_refs", []byte("5"), 0) == nil
}

// peakRSS returns VmHWM of the process in bytes, or 0 where unknown.
func peakRSS() uint64 {
	data, err := os.ReadFile("/proc/self/status")
	if err != nil {
		return 0
	}
	for _, line := range bytes.Split(data, []byte("\n")) {
		rest, ok := bytes.CutPrefix(line, []byte("VmHWM:"))
		if !ok {
			continue
		}
		f := bytes.Fields(rest)
		if len(f) < 1 {
			return 0
		}
		kb, err := strconv.ParseUint(string(f[0]), 10, 64)
		if err != nil {
			return 0
		}
		return kb * 1024 // the kernel writes "kB" meaning KiB
	}
	return 0
}

// loadAverage returns the 1, 5 and 15 minute load averages from
// /proc/loadavg, or zeros where unknown.
func loadAverage() [3]float64 {
	var la [3]float64
	data, err := os.ReadFile("/proc/loadavg")
	if err != nil {
		return la
	}
	f := bytes.Fields(data)
	for i := 0; i < 3 && i < len(f); i++ {
		la[i], _ = strconv.ParseFloat(string(f[i]), 64)
	}
	return la
}
