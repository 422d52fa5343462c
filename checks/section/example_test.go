package section_test

import (
	"fmt"
	"math"

	"swaygate/checks/section"
)

// source: sections.md (steelsnakes EU/IPE.json): IPE 200 tabulates
// A = 28.5 cm², Iy = 1940 cm⁴, Wel,y = 194 cm³, Wpl,y = 221 cm³.
func ExampleISection() {
	ipe := section.ISection{Name: "IPE200", B: 100, D: 200, Tw: 5.6, Tf: 8.5, R: 12}
	p, err := ipe.Properties()
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("A = %.0f mm², Ix = %.4g mm⁴, Zx = %.4g mm³, Sx = %.4g mm³\n", p.A, p.IMajor, p.ZMajor, p.SMajor)
	// Output: A = 2848 mm², Ix = 1.943e+07 mm⁴, Zx = 1.943e+05 mm³, Sx = 2.206e+05 mm³
}

// A rectangle with a round hole: the hole is a polyline from ArcPoints.
func ExamplePolygon() {
	hole := section.ArcPoints(0, 0, 20, 0, 2*math.Pi, 360)
	plate := section.Polygon{
		Outer: []section.Point{{X: -100, Y: -50}, {X: 100, Y: -50}, {X: 100, Y: 50}, {X: -100, Y: 50}},
		Holes: [][]section.Point{hole},
	}
	p, err := plate.Properties()
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("A = %.1f mm², Angle = %.4f rad\n", p.A, p.Angle)
	// Output: A = 18743.4 mm², Angle = 1.5708 rad
}

func ExampleTransformed() {
	// An equal angle mirrored (y → −y): its principal values are unchanged,
	// its major axis is mirrored with it.
	l := section.Angle{D: 100, B: 100, T: 10}
	p, _ := section.Transformed{Parent: l, Mirror: true}.Properties()
	q, _ := l.Properties()
	fmt.Printf("%.4f %.4f %v\n", q.Angle, p.Angle, math.Abs(p.IMajor-q.IMajor) < 1e-6*q.IMajor)
	// Output: 0.7854 -0.7854 true
}
