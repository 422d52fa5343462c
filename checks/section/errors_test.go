package section

import (
	"errors"
	"math"
	"strings"
	"testing"
)

func TestDimensionErrors(t *testing.T) {
	// source: common practice: a shape that cannot exist is rejected with
	// the field at fault; IFC's own rules (e.g. IfcIShapeProfileDef
	// ValidFlangeThickness: the flanges are thinner than the depth) included
	for _, c := range []struct {
		name  string
		shape Shape
		field string
	}{
		{"zero value", ISection{}, "D"},
		{"negative web", ISection{B: 100, D: 200, Tw: -1, Tf: 8}, "Tw"},
		{"NaN flange", ISection{B: 100, D: 200, Tw: 5, Tf: math.NaN()}, "Tf"},
		{"flanges meet", ISection{B: 100, D: 200, Tw: 5, Tf: 100}, "D"},
		{"web wider than flange", ISection{B: 5, D: 200, Tw: 6, Tf: 8}, "B"},
		{"fillet too big", ISection{B: 100, D: 200, Tw: 5.6, Tf: 8.5, R: 60}, "R"},
		{"slope too steep", ISection{B: 100, D: 200, Tw: 5.6, Tf: 8.5, FlangeSlope: 1}, "FlangeSlope"},
		{"slope eats tip", ISection{B: 200, D: 200, Tw: 5.6, Tf: 8.5, FlangeSlope: 0.5}, "FlangeSlope"},
		{"asym top flange", AsymmetricI{D: 300, Tw: 8, BottomWidth: 150, BottomThickness: 10, TopThickness: 10}, "TopWidth"},
		{"wall too thick", RHS{B: 100, D: 50, T: 25}, "T"},
		{"outer radius too big", RHS{B: 100, D: 50, T: 5, Ro: 30}, "Ro"},
		{"inner radius too big", RHS{B: 100, D: 50, T: 5, Ri: 21}, "Ri"},
		{"corner without wall", RHS{B: 100, D: 100, T: 2, Ro: 20}, "Ro"},
		{"tube all wall", CHS{D: 100, T: 50}, "T"},
		{"circle", Circle{D: math.Inf(1)}, "D"},
		{"rect", Rect{B: 10}, "D"},
		{"angle", Angle{D: 50, B: 50, T: 50}, "T"},
		{"angle edge", Angle{D: 50, B: 50, T: 5, EdgeRadius: 6}, "EdgeRadius"},
		{"channel", Channel{D: 100, B: 50, Tw: 60, Tf: 8}, "Tw"},
		{"tee web slope", Tee{D: 100, B: 100, Tw: 4, Tf: 10, WebSlope: 0.2}, "WebSlope"},
		{"lip", LippedChannel{D: 100, B: 50, T: 2, Lip: 60}, "Lip"},
		{"zed", Zed{D: 100, B: 50, Tw: 5, Tf: 50}, "Tf"},
		{"polygon points", Polygon{Outer: []Point{{0, 0}, {1, 0}, {0, 0}}}, "Outer"},
		{"polygon NaN", Polygon{Outer: []Point{{0, 0}, {1, 0}, {math.NaN(), 1}}}, "Outer[2]"},
		{"polygon hole outside", Polygon{Outer: []Point{{0, 0}, {1, 0}, {0, 1}}, Holes: [][]Point{{{2, 2}, {3, 2}, {2, 3}}}}, "Holes[0]"},
		{"transform scale", Transformed{Parent: Rect{B: 1, D: 1}, Scale: -2}, "Scale"},
		{"transform parent", Transformed{}, "Parent"},
	} {
		t.Run(c.name, func(t *testing.T) {
			_, err := c.shape.Properties()
			var de *DimensionError
			if !errors.As(err, &de) || !errors.Is(err, ErrDimension) {
				t.Fatalf("err = %v, want a DimensionError", err)
			}
			if de.Field != c.field {
				t.Errorf("field %q, want %q (%v)", de.Field, c.field, err)
			}
			if !strings.HasPrefix(err.Error(), "section: ") {
				t.Errorf("message %q", err)
			}
		})
	}
}

func TestDegenerateOutline(t *testing.T) {
	// source: common practice: zero-area outlines are rejected, not divided by
	for _, s := range []Shape{
		Polygon{Outer: []Point{{0, 0}, {1, 1}, {2, 2}}},
		Polygon{Outer: []Point{{0, 0}, {4, 0}, {4, 4}, {0, 4}}, Holes: [][]Point{{{1, 1}, {2, 2}, {3, 3}}}},
		Polygon{Outer: []Point{{0, 0}, {4, 0}, {4, 4}, {0, 4}}, Holes: [][]Point{{{0, 0}, {4, 0}, {4, 4}, {0, 4}}}},
	} {
		if _, err := s.Properties(); !errors.Is(err, ErrDimension) {
			t.Errorf("%+v: err = %v, want ErrDimension", s, err)
		}
	}
}

func TestErrorMessage(t *testing.T) {
	_, err := ISection{Name: "IPE200", B: 100, D: 200, Tw: 5.6, Tf: 8.5, R: 60}.Properties()
	// source: common practice (the message names the shape, designation and field)
	want := `section: ISection "IPE200": R = 60: the rounded corner does not fit`
	if err == nil || !strings.HasPrefix(err.Error(), want) {
		t.Errorf("got %v, want prefix %q", err, want)
	}
}

func TestPlates(t *testing.T) {
	// source: AS 4100 Table 5.2 / EN 1993-1-1 Table 5.2 element definitions
	// (from memory): flange outstand (bf − tw)/2, web d − 2tf, RHS wall b − 2t
	for _, c := range []struct {
		shape Plated
		want  []Plate
	}{
		{ipe200, []Plate{
			{Part: "flange", Width: 47.2, Thickness: 8.5, Fillet: 12, Support: OneEdge, Count: 4},
			{Part: "web", Width: 183, Thickness: 5.6, Fillet: 12, Support: BothEdges, Count: 1}}},
		{RHS{B: 200, D: 100, T: 5, Ri: 7.5, Ro: 12.5}, []Plate{
			{Part: "flange", Width: 190, Thickness: 5, Fillet: 7.5, Support: BothEdges, Count: 2},
			{Part: "web", Width: 90, Thickness: 5, Fillet: 7.5, Support: BothEdges, Count: 2}}},
		{CHS{D: 168.3, T: 7.1}, []Plate{{Part: "wall", Width: 168.3, Thickness: 7.1, Support: Ring, Count: 1}}},
		{Channel{D: 300, B: 100, Tw: 10, Tf: 16, R: 16}, []Plate{
			{Part: "flange", Width: 90, Thickness: 16, Fillet: 16, Support: OneEdge, Count: 2},
			{Part: "web", Width: 268, Thickness: 10, Fillet: 16, Support: BothEdges, Count: 1}}},
		{Tee{D: 100, B: 120, Tw: 10, Tf: 12}, []Plate{
			{Part: "flange", Width: 55, Thickness: 12, Support: OneEdge, Count: 2},
			{Part: "web", Width: 88, Thickness: 10, Support: OneEdge, Count: 1}}},
		{Angle{D: 150, B: 90, T: 10, R: 11}, []Plate{
			{Part: "leg", Width: 80, Thickness: 10, Fillet: 11, Support: OneEdge, Count: 1},
			{Part: "leg", Width: 140, Thickness: 10, Fillet: 11, Support: OneEdge, Count: 1}}},
	} {
		got, err := c.shape.Plates()
		if err != nil {
			t.Fatal(err)
		}
		if len(got) != len(c.want) {
			t.Fatalf("%T: %d plates, want %d", c.shape, len(got), len(c.want))
		}
		for i := range got {
			g, w := got[i], c.want[i]
			if g.Part != w.Part || math.Abs(g.Width-w.Width) > 1e-9 || g.Thickness != w.Thickness ||
				g.Fillet != w.Fillet || g.Support != w.Support || g.Count != w.Count {
				t.Errorf("%T plate %d = %+v, want %+v", c.shape, i, g, w)
			}
		}
	}
	if _, err := (ISection{}).Plates(); err == nil {
		t.Error("invalid shape: want an error")
	}
	if OneEdge.String() != "one edge" || BothEdges.String() != "both edges" || Ring.String() != "ring" {
		t.Error("Support names")
	}
}
