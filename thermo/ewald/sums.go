package ewald

import (
	"runtime"
	"sync"
)

// coincident is the distance in Å below which two sites count as one
// position, for which the Coulomb energy is infinite.
const coincident = 1e-6

// Work on a large cell is split into parallelChunks chunks, each with its
// own accumulators, reduced in chunk order: the result is bit-for-bit the
// same whatever the number of processors. A small cell is one chunk.
const parallelChunks = 8

// parallelSites is the smallest cell that is split into chunks.
const parallelSites = 48

// chunksFor returns the number of chunks for a cell of n sites; it depends
// on n only.
func chunksFor(n int) int {
	if n < parallelSites {
		return 1
	}
	return parallelChunks
}

// forChunks runs f(c) for c = 0 … chunksFor(n)−1, on several goroutines
// when there are several chunks and processors.
func forChunks(n int, f func(c int)) {
	chunks := chunksFor(n)
	workers := min(runtime.GOMAXPROCS(0), chunks)
	if workers < 2 {
		for c := 0; c < chunks; c++ {
			f(c)
		}
		return
	}
	next := make(chan int, chunks)
	for c := 0; c < chunks; c++ {
		next <- c
	}
	close(next)
	var wg sync.WaitGroup
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for c := range next {
				f(c)
			}
		}()
	}
	wg.Wait()
}
