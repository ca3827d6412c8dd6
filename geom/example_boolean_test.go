package geom_test

import (
	"fmt"
	"math"

	"plumb/geom"
)

// A garden-gate panel, 600 × 400, with a drilled hole and a notch cut into its top edge: the
// notch's circle crosses the outline, and only its part on the panel is removed.
func ExampleDifference() {
	panel := geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(0, 0), geom.Pt(600, 400))}}
	hole := geom.Disk(geom.Pt(150, 200), 20)
	notch := geom.Disk(geom.Pt(300, 400), 50) // half of it lies above the panel
	b := geom.Difference(panel, hole, notch)
	m := b.IntegratePoly(geom.ConstPoly(1))

	// Composite by hand: the half-disk's centroid lies 4r/(3π) below its diameter ("List of centroids").
	aPanel, aHole, aNotch := 600.0*400, math.Pi*20*20, math.Pi*50*50/2
	area := aPanel - aHole - aNotch
	x := (aPanel*300 - aHole*150 - aNotch*300) / area
	y := (aPanel*200 - aHole*200 - aNotch*(400-4*50/(3*math.Pi))) / area
	fmt.Printf("area %.4f (by hand %.4f)\n", m.M, area)
	fmt.Printf("centroid (%.4f, %.4f) (by hand (%.4f, %.4f))\n", m.Centroid().X, m.Centroid().Y, x, y)
	fmt.Println("hole centre in the material:", b.Contains(geom.Pt(150, 200)))
	fmt.Printf("distance from the panel centre to the nearest edge (the hole): %.1f\n", b.Distance(geom.Pt(300, 200)))
	// Output:
	// area 234816.3721 (by hand 234816.3721)
	// centroid (300.8027, 197.0102) (by hand (300.8027, 197.0102))
	// hole centre in the material: false
	// distance from the panel centre to the nearest edge (the hole): 130.0
}

// The even-odd rule leaves the centre of a pentagram empty; nonzero fills it.
func ExampleRegion_Contains() {
	pts := make([]geom.Point, 5)
	for k := range pts {
		pts[k] = geom.Pt(0, 1).Rotate(float64(2*k) * 2 * math.Pi / 5)
	}
	star := geom.Polygon(pts...)
	for _, rule := range []geom.FillRule{geom.NonZero, geom.EvenOdd} {
		r := geom.Region{Loops: []geom.Loop{star}, Rule: rule}
		fmt.Printf("%s: winding %d, contains centre %v\n", rule, r.Winding(geom.Pt(0, 0)), r.Contains(geom.Pt(0, 0)))
	}
	// Output:
	// nonzero: winding 2, contains centre true
	// evenodd: winding 2, contains centre false
}
