package section

import (
	"math"
	"testing"
)

// source: bench inputs are the handbook IPE 400 of handbook_test.go

func BenchmarkISectionProperties(b *testing.B) {
	s := ISection{Name: "IPE400", B: 180, D: 400, Tw: 8.6, Tf: 13.5, R: 21}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := s.Properties(); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkAngleProperties is an unsymmetric shape: both plastic neutral
// axes are found by iteration.
func BenchmarkAngleProperties(b *testing.B) {
	s := Angle{D: 150, B: 90, T: 12, R: 11, EdgeRadius: 4.8}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := s.Properties(); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkPolygonProperties(b *testing.B) {
	ipe, err := ISection{B: 180, D: 400, Tw: 8.6, Tf: 13.5, R: 21}.Outline()
	if err != nil {
		b.Fatal(err)
	}
	// A plate with a bolt hole pattern: unsymmetric, many vertices.
	plate := Polygon{Outer: []Point{{0, 0}, {400, 0}, {400, 300}, {0, 250}}}
	for i := 0; i < 6; i++ {
		h := ArcPoints(60+float64(i)*55, 80+float64(i%3)*50, 11, 0, -2*math.Pi, 64)
		plate.Holes = append(plate.Holes, h[:64])
	}
	for _, c := range []struct {
		name string
		p    Polygon
	}{{"IPE400-outline", ipe}, {"plate-6-holes", plate}} {
		n := len(c.p.Outer)
		for _, h := range c.p.Holes {
			n += len(h)
		}
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if _, err := c.p.Properties(); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(float64(n), "vertices")
		})
	}
}
