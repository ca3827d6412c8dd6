//go:build js && wasm

package main

import (
	"fmt"
	"sync"
	"time"
)

// slowLog keeps the last pieces of work on the page's one thread that took long enough to delay a
// frame (an edit, an update, a frame's painting, background work between two turns given to the
// page), with when they ended, for the page's measurements (plumb.frames().slow).
type slowLog struct {
	mu      sync.Mutex
	entries []string
}

const (
	slowLogSize = 64
	slowWorkMS  = 100 // work that holds the page this long is noted
)

// note records the work what, begun at start, if it took slowWorkMS or more.
func (l *slowLog) note(what string, start time.Time) {
	ms := float64(time.Since(start).Microseconds()) / 1000
	if ms < slowWorkMS {
		return
	}
	l.mu.Lock()
	defer l.mu.Unlock()
	if len(l.entries) == slowLogSize {
		l.entries = l.entries[1:]
	}
	l.entries = append(l.entries, fmt.Sprintf("%.0f ms %s, ended at %.0f ms", ms, what, nowMS()))
}

// list returns the entries, oldest first.
func (l *slowLog) list() []any {
	l.mu.Lock()
	defer l.mu.Unlock()
	out := make([]any, len(l.entries))
	for i, e := range l.entries {
		out[i] = e
	}
	return out
}
