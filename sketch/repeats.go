package sketch

import (
	"encoding/binary"
	"fmt"
	"math"
	"slices"
	"strings"

	"plumb/geom"
)

// withoutRepeats returns a shallow copy of d whose regions have lost the loops and segments that
// cannot change which points they hold, with a note for each region that lost any. Combine cuts
// every segment at every other, so a drawing that repeats one square two thousand times, or retraces
// one line back and forth, would otherwise cost time and memory growing with the square of the
// repeats for nothing.
func (d *Document) withoutRepeats() (*Document, []string) {
	c := *d
	var notes []string
	note := func(path string, r geom.Region) geom.Region {
		out, dropped := WithoutRepeats(r)
		if dropped > 0 {
			notes = append(notes, fmt.Sprintf("%s: %d repeated or retraced loops and segments are left out (they do not change the part)", path, dropped))
		}
		return out
	}
	c.Outline = note("outline", d.Outline)
	c.Cutouts = make([]geom.Region, len(d.Cutouts))
	for i, r := range d.Cutouts {
		c.Cutouts[i] = note(fmt.Sprintf("cutouts[%d]", i), r)
	}
	c.Overlays = slices.Clone(d.Overlays)
	for i := range c.Overlays {
		c.Overlays[i].Region = note(fmt.Sprintf("overlays[%d].region", i), d.Overlays[i].Region)
	}
	return &c, notes
}

// WithoutRepeats returns r without what cannot change which points it holds, exactly under its fill
// rule, and how many loops and segments it left out:
//   - a segment followed at once by its own reverse (a spur, or a contour drawn there and back), as the
//     two add nothing to any winding number;
//   - under even-odd, pairs of loops with the same oriented segments in either direction, as a
//     point's crossing parity is the same with or without them;
//   - under nonzero, pairs of a loop and its reverse, whose winding numbers cancel; and copies of a
//     loop beyond the first when every loop left turns the same way and none crosses itself, so that
//     each adds 0 or the same ±1 and one copy decides as many do.
//
// Loops are compared by their multisets of oriented segments, which fix their winding numbers.
func WithoutRepeats(r geom.Region) (geom.Region, int) {
	if len(r.Loops) == 1 || !mayRepeat(r.Loops) {
		return withoutSpursOnly(r)
	}
	dropped := 0
	type group struct {
		loop  geom.Loop
		count int // copies in the loop's own direction less copies reversed
	}
	var groups []*group
	byKey := map[string]*group{}
	loops := 0 // loops left after their spurs are trimmed
	for _, l := range r.Loops {
		trimmed := withoutSpurs(l)
		dropped += len(l) - len(trimmed)
		if len(trimmed) == 0 {
			continue
		}
		loops++
		key, rev := loopKey(trimmed, false), loopKey(trimmed, true)
		switch {
		case byKey[key] != nil:
			byKey[key].count++
		case byKey[rev] != nil:
			byKey[rev].count--
		default:
			g := &group{loop: trimmed, count: 1}
			byKey[key] = g
			groups = append(groups, g)
		}
	}
	out := geom.Region{Rule: r.Rule}
	for _, g := range groups {
		copies := abs(g.count)
		if r.Rule == geom.EvenOdd {
			copies %= 2
		}
		l := g.loop
		if g.count < 0 {
			l = l.Reverse()
		}
		for range copies {
			out.Loops = append(out.Loops, l)
		}
	}
	if r.Rule == geom.NonZero && len(out.Loops) > len(groups) && sameTurnNoCrossing(out.Loops) {
		out.Loops = slices.CompactFunc(out.Loops, func(a, b geom.Loop) bool { return loopKey(a, false) == loopKey(b, false) })
	}
	return out, dropped + loops - len(out.Loops)
}

// withoutSpursOnly removes the spurs of r's loops (withoutSpurs), for a region none of whose loops
// repeats another.
func withoutSpursOnly(r geom.Region) (geom.Region, int) {
	out, dropped := r, 0
	for i, l := range r.Loops {
		trimmed := withoutSpurs(l)
		if len(trimmed) == len(l) {
			continue
		}
		if dropped == 0 {
			out.Loops = slices.Clone(r.Loops)
		}
		out.Loops[i], dropped = trimmed, dropped+len(l)-len(trimmed)
	}
	if dropped > 0 {
		out.Loops = slices.DeleteFunc(out.Loops, func(l geom.Loop) bool { return len(l) == 0 })
	}
	return out, dropped
}

// mayRepeat reports whether two loops might hold the same oriented segments, in the same or the
// opposite direction, by a hash of each loop's multiset of segments (a sum, so the order does not
// matter); only loops whose hashes agree need the exact comparison.
func mayRepeat(loops []geom.Loop) bool {
	seen := make(map[uint64]bool, 2*len(loops))
	for _, l := range loops {
		var fwd, rev uint64
		for _, s := range l {
			fwd += segmentHash(s)
			rev += segmentHash(reversed(s))
		}
		if seen[fwd] || seen[rev] {
			return true
		}
		seen[fwd] = true
	}
	return false
}

// segmentHash mixes the values segmentKey encodes into 64 bits (the finalizer of MurmurHash3).
func segmentHash(s geom.Segment) uint64 {
	h := uint64(s.Kind) + 0x9e3779b97f4a7c15
	mix := func(v float64) {
		h ^= math.Float64bits(v)
		h ^= h >> 33
		h *= 0xff51afd7ed558ccd
		h ^= h >> 33
		h *= 0xc4ceb9fe1a85ec53
		h ^= h >> 33
	}
	if s.Kind == geom.KindArc {
		for _, v := range [...]float64{s.C.X, s.C.Y, s.RX, s.RY, s.Rot, s.P[0].X, s.P[0].Y, s.P[1].X, s.P[1].Y, s.Sweep} {
			mix(v)
		}
		return h
	}
	for k := 0; k <= s.Degree(); k++ {
		mix(s.P[k].X)
		mix(s.P[k].Y)
	}
	return h
}

func abs(n int) int {
	if n < 0 {
		return -n
	}
	return n
}

// sameTurnNoCrossing reports whether every loop encloses area turning the same way (all
// counter-clockwise or all clockwise) and none crosses itself.
func sameTurnNoCrossing(loops []geom.Loop) bool {
	sign := 0.0
	for _, l := range loops {
		area := geom.Boundary{Pieces: l}.IntegratePoly(geom.ConstPoly(1)).M
		if area == 0 || sign != 0 && math.Signbit(area) != math.Signbit(sign) {
			return false
		}
		sign = area
		if w, err := (geom.Region{Loops: []geom.Loop{l}}).Check(); err != nil || len(w) > 0 {
			return false
		}
	}
	return true
}

// withoutSpurs removes every segment that is followed at once by its own reverse, around the loop
// (the last segment is followed by the first), until none is: what is left is still a closed loop.
func withoutSpurs(l geom.Loop) geom.Loop {
	if !hasSpur(l) {
		return l
	}
	var kept geom.Loop
	for _, s := range l {
		if n := len(kept); n > 0 && isReverse(kept[n-1], s) {
			kept = kept[:n-1]
			continue
		}
		kept = append(kept, s)
	}
	for len(kept) >= 2 && isReverse(kept[len(kept)-1], kept[0]) {
		kept = kept[1 : len(kept)-1]
	}
	if len(kept) == len(l) {
		return l
	}
	return kept
}

// hasSpur reports whether some segment of l is followed at once by its own reverse.
func hasSpur(l geom.Loop) bool {
	for i, s := range l {
		if isReverse(s, l[(i+1)%len(l)]) {
			return true
		}
	}
	return false
}

// isReverse reports whether b is exactly a traversed backwards.
func isReverse(a, b geom.Segment) bool {
	if a.Kind != b.Kind {
		return false
	}
	if a.Kind == geom.KindArc {
		return a.C == b.C && a.RX == b.RX && a.RY == b.RY && a.Rot == b.Rot &&
			a.P[0] == b.P[1] && a.P[1] == b.P[0] && a.Sweep == -b.Sweep
	}
	n := a.Degree()
	for k := 0; k <= n; k++ {
		if a.P[k] != b.P[n-k] {
			return false
		}
	}
	return true
}

// loopKey encodes the multiset of the loop's oriented segments (reversed when reverse is set), exactly.
func loopKey(l geom.Loop, reverse bool) string {
	keys := make([]string, len(l))
	for i, s := range l {
		if reverse {
			s = reversed(s)
		}
		keys[i] = segmentKey(s)
	}
	slices.Sort(keys)
	return strings.Join(keys, "|")
}

// reversed is s backwards, with an arc given by its centre, radii, rotation, end points and sweep
// (the start angle, which rounding could change, is left as it was: segmentKey does not use it).
func reversed(s geom.Segment) geom.Segment {
	if s.Kind != geom.KindArc {
		return s.Reverse()
	}
	r := s
	r.P[0], r.P[1], r.Sweep = s.P[1], s.P[0], -s.Sweep
	return r
}

// segmentKey encodes the values that fix the oriented segment s, as exact bits.
func segmentKey(s geom.Segment) string {
	var vals []float64
	if s.Kind == geom.KindArc {
		vals = []float64{s.C.X, s.C.Y, s.RX, s.RY, s.Rot, s.P[0].X, s.P[0].Y, s.P[1].X, s.P[1].Y, s.Sweep}
	} else {
		for k := 0; k <= s.Degree(); k++ {
			vals = append(vals, s.P[k].X, s.P[k].Y)
		}
	}
	b := make([]byte, 1, 1+8*len(vals))
	b[0] = byte(s.Kind)
	for _, v := range vals {
		b = binary.LittleEndian.AppendUint64(b, math.Float64bits(v))
	}
	return string(b)
}
