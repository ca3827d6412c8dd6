//go:build amd64.v3 || arm64

package geom

import "math"

// fma returns x·y + z with one rounding. On these targets math.FMA is one instruction; elsewhere
// (see fma_sw.go) it would be a call or a feature check that costs more than it saves.
func fma(x, y, z float64) float64 { return math.FMA(x, y, z) }
