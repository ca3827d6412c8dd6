//go:build !(amd64.v3 || arm64)

package geom

// fma returns x·y + z, rounded twice: on this target math.FMA would be a call or a feature check per
// use (see fma_hw.go).
func fma(x, y, z float64) float64 { return x*y + z }
