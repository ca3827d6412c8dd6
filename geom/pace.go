package geom

// A pacer calls a caller's pace function every paceEvery steps of a long computation, so that a
// program with one thread (a browser page) can let other work run between them, or stop the
// computation: once pace returns an error, every later step reports false and the computation
// returns that error.
type pacer struct {
	pace  func() error
	steps int
	err   error
}

// paceEvery is the number of steps (pieces classified, pairs of boxes met, groups placed) between
// calls of pace: a few milliseconds of work.
const paceEvery = 512

// step counts one step and reports whether the computation may go on.
func (p *pacer) step() bool {
	if p == nil || p.pace == nil {
		return true
	}
	if p.err != nil {
		return false
	}
	if p.steps++; p.steps%paceEvery == 0 {
		p.err = p.pace()
	}
	return p.err == nil
}

// check calls pace now, between phases of the work, and reports whether the computation may go on.
func (p *pacer) check() bool {
	if p == nil || p.pace == nil {
		return true
	}
	if p.err == nil {
		p.err = p.pace()
	}
	return p.err == nil
}
