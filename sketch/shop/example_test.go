package shop_test

import (
	"fmt"

	"plumb/geom"
	"plumb/sketch/shop"
)

func ExamplePaperSize() {
	p, _ := shop.PaperSize("letter")
	fmt.Printf("%s: %.1f × %.1f mm\n", p.Name, p.W, p.H)
	// Output: letter: 215.9 × 279.4 mm
}

func ExamplePlan() {
	// A 1 × 1.2 m gate panel on A3 with 15 mm of overlap.
	a3, _ := shop.PaperSize("A3")
	l := shop.Plan(geom.Rect{Max: geom.Pt(1000, 1200)}, a3, shop.DefaultOverlap)
	fmt.Printf("%d across × %d down, landscape %v, %d pages with the map\n", l.Cols, l.Rows, l.Landscape, l.Pages())
	// Output: 4 across × 4 down, landscape false, 17 pages with the map
}
