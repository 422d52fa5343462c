package section

import (
	"math"
	"math/rand/v2"
	"testing"
)

// scalable lists one shape of each kind, with every optional radius and
// slope used, as a function of a scale factor.
var scalable = []struct {
	name string
	make func(k float64) Shape
}{
	{"ISection", func(k float64) Shape {
		return ISection{B: 180 * k, D: 400 * k, Tw: 8.6 * k, Tf: 13.5 * k, R: 21 * k, FlangeSlope: 0.14, FlangeEdgeRadius: 4 * k}
	}},
	{"AsymmetricI", func(k float64) Shape {
		return AsymmetricI{D: 500 * k, Tw: 10 * k, BottomWidth: 300 * k, BottomThickness: 20 * k, BottomFillet: 15 * k,
			TopWidth: 150 * k, TopThickness: 12 * k, TopFillet: 10 * k, TopEdgeRadius: 3 * k, TopSlope: 0.05}
	}},
	{"RHS", func(k float64) Shape { return RHS{B: 150 * k, D: 250 * k, T: 8 * k, Ri: 8 * k, Ro: 16 * k} }},
	{"CHS", func(k float64) Shape { return CHS{D: 168.3 * k, T: 7.1 * k} }},
	{"Rect", func(k float64) Shape { return Rect{B: 30 * k, D: 70 * k} }},
	{"Circle", func(k float64) Shape { return Circle{D: 50 * k} }},
	{"Tee", func(k float64) Shape {
		return Tee{D: 120 * k, B: 120 * k, Tw: 13 * k, Tf: 13 * k, R: 10 * k, FlangeEdgeRadius: 5 * k, WebEdgeRadius: 3 * k,
			FlangeSlope: 0.02, WebSlope: 0.02}
	}},
	{"Angle", func(k float64) Shape { return Angle{D: 150 * k, B: 90 * k, T: 12 * k, R: 11 * k, EdgeRadius: 4.8 * k} }},
	{"Channel", func(k float64) Shape {
		return Channel{D: 300 * k, B: 100 * k, Tw: 10 * k, Tf: 16 * k, R: 16 * k, EdgeRadius: 8 * k, FlangeSlope: 0.14}
	}},
	{"LippedChannel", func(k float64) Shape { return LippedChannel{D: 200 * k, B: 76 * k, T: 2.4 * k, Lip: 20 * k, Ri: 4 * k} }},
	{"Zed", func(k float64) Shape {
		return Zed{D: 200 * k, B: 80 * k, Tw: 10 * k, Tf: 11 * k, R: 11 * k, EdgeRadius: 5.5 * k}
	}},
	{"Polygon", func(k float64) Shape {
		return Polygon{Outer: []Point{{0, 0}, {100 * k, 0}, {120 * k, 60 * k}, {30 * k, 90 * k}},
			Holes: [][]Point{{{40 * k, 20 * k}, {60 * k, 20 * k}, {50 * k, 40 * k}}}}
	}},
	{"Transformed", func(k float64) Shape {
		return Transformed{Parent: Angle{D: 100 * k, B: 75 * k, T: 8 * k, R: 8 * k}, Rotation: 0.4, Mirror: true, X: 30 * k}
	}},
}

func TestScaling(t *testing.T) {
	// source: textbook dimensional analysis: scaling every length by k
	// scales A by k², I and J by k⁴, Z and S by k³, r by k, Iw by k⁶ and
	// leaves Angle unchanged.
	for _, c := range scalable {
		t.Run(c.name, func(t *testing.T) {
			a := mustProps(t, c.make(1))
			for _, k := range []float64{0.01, 0.5, 3, 25.4} {
				b := mustProps(t, c.make(k))
				for _, q := range []struct {
					what     string
					got, ref float64
					pow      float64
				}{
					{"A", b.A, a.A, 2}, {"IMajor", b.IMajor, a.IMajor, 4}, {"IMinor", b.IMinor, a.IMinor, 4},
					{"RMajor", b.RMajor, a.RMajor, 1}, {"RMinor", b.RMinor, a.RMinor, 1},
					{"ZMajor", b.ZMajor, a.ZMajor, 3}, {"ZMinor", b.ZMinor, a.ZMinor, 3},
					{"SMajor", b.SMajor, a.SMajor, 3}, {"SMinor", b.SMinor, a.SMinor, 3},
					{"J", b.J, a.J, 4}, {"Iw", b.Iw, a.Iw, 6},
					{"Cx", b.Cx, a.Cx, 1}, {"Cy", b.Cy, a.Cy, 1},
				} {
					want := q.ref * math.Pow(k, q.pow)
					if math.IsNaN(q.ref) && math.IsNaN(q.got) {
						continue
					}
					if math.Abs(q.got-want) > 1e-8*math.Abs(want)+1e-12*math.Pow(k, q.pow)*math.Abs(a.A) {
						t.Errorf("k = %v: %s = %.10g, want %.10g", k, q.what, q.got, want)
					}
				}
				if math.Abs(b.Angle-a.Angle) > 1e-9 {
					t.Errorf("k = %v: Angle %v, want %v", k, b.Angle, a.Angle)
				}
			}
		})
	}
}

func TestStockierNeverSmaller(t *testing.T) {
	// source: textbook: adding material never lowers the area or a principal
	// second moment (the centroidal axis minimises I among parallel axes).
	rng := rand.New(rand.NewPCG(1, 1))
	u := func(lo, hi float64) float64 { return lo + (hi-lo)*rng.Float64() }
	type pair struct{ thin, thick Shape }
	gen := []func() pair{
		func() pair {
			b, d, r := u(80, 400), u(150, 900), u(0, 25)
			tw, tf := u(4, 15), u(5, 30)
			return pair{ISection{B: b, D: d, Tw: tw, Tf: tf, R: r},
				ISection{B: b, D: d, Tw: tw * u(1, 1.5), Tf: tf * u(1, 1.5), R: r}}
		},
		func() pair {
			b, d, tt := u(50, 300), u(50, 300), u(2, 10)
			return pair{RHS{B: b, D: d, T: tt, Ri: tt, Ro: 2 * tt}, RHS{B: b, D: d, T: tt * u(1, 1.4), Ri: tt, Ro: 2 * tt}}
		},
		func() pair {
			d, tt := u(20, 600), u(2, 8)
			return pair{CHS{D: d, T: tt}, CHS{D: d, T: tt * u(1, 2)}}
		},
		func() pair {
			d, b, tt, r := u(50, 200), u(50, 200), u(5, 15), u(0, 12)
			return pair{Angle{D: d, B: b, T: tt, R: r}, Angle{D: d, B: b, T: tt * u(1, 1.4), R: r}}
		},
		func() pair {
			d, b, tw, tf, r := u(100, 400), u(50, 120), u(5, 12), u(6, 18), u(0, 15)
			return pair{Channel{D: d, B: b, Tw: tw, Tf: tf, R: r}, Channel{D: d, B: b, Tw: tw * u(1, 1.3), Tf: tf * u(1, 1.3), R: r}}
		},
		func() pair {
			d, b, tw, tf, r := u(60, 300), u(60, 300), u(5, 15), u(5, 20), u(0, 12)
			return pair{Tee{D: d, B: b, Tw: tw, Tf: tf, R: r}, Tee{D: d, B: b, Tw: tw * u(1, 1.3), Tf: tf * u(1, 1.3), R: r}}
		},
	}
	for i := 0; i < 300; i++ {
		p := gen[i%len(gen)]()
		a, err := p.thin.Properties()
		if err != nil {
			continue // random dimensions that do not fit
		}
		b, err := p.thick.Properties()
		if err != nil {
			continue
		}
		const slop = 1e-12
		if b.A < a.A*(1-slop) || b.IMajor < a.IMajor*(1-slop) || b.IMinor < a.IMinor*(1-slop) {
			t.Errorf("%+v → %+v: A %v → %v, IMajor %v → %v, IMinor %v → %v",
				p.thin, p.thick, a.A, b.A, a.IMajor, b.IMajor, a.IMinor, b.IMinor)
		}
	}
}

func TestOutlineMatchesExact(t *testing.T) {
	// source: ArcPoints doc: chords of 5° lose r²θ³/(12n²) of each arc's
	// area: 0.13 % of a circle (72 chords), less for fillets and corners
	for _, c := range scalable {
		o, ok := c.make(1).(Outliner)
		if !ok {
			t.Fatalf("%s has no Outline", c.name)
		}
		poly, err := o.Outline()
		if err != nil {
			t.Fatal(err)
		}
		a := mustProps(t, o)
		b := mustProps(t, poly)
		within(t, c.name+" A", b.A, a.A, 3e-3)
		within(t, c.name+" IMajor", b.IMajor, a.IMajor, 3e-3)
		within(t, c.name+" IMinor", b.IMinor, a.IMinor, 3e-3)
		within(t, c.name+" SMajor", b.SMajor, a.SMajor, 3e-3)
		within(t, c.name+" SMinor", b.SMinor, a.SMinor, 3e-3)
		within(t, c.name+" ZMajor", b.ZMajor, a.ZMajor, 3e-3)
		if math.Abs(b.Angle-a.Angle) > 1e-3 && math.Abs(a.IMajor-a.IMinor) > 1e-6*a.IMajor {
			t.Errorf("%s Angle %v, exact %v", c.name, b.Angle, a.Angle)
		}
	}
}

func TestArcPoints(t *testing.T) {
	// source: definition: n chords, both ends on the circle
	pts := ArcPoints(1, 2, 3, 0, -math.Pi/2, 4)
	if len(pts) != 5 {
		t.Fatalf("%d points, want 5", len(pts))
	}
	for i, want := range []Point{{4, 2}, {1, -1}} {
		got := pts[i*4]
		if math.Abs(got.X-want.X) > 1e-12 || math.Abs(got.Y-want.Y) > 1e-12 {
			t.Errorf("end %d = %v, want %v", i, got, want)
		}
	}
	if len(ArcPoints(0, 0, 1, 0, 1, 0)) != 2 {
		t.Error("n < 1 must give one chord")
	}
}

func TestTaperedFlange(t *testing.T) {
	// source: textbook: each outstand of a tapered flange is a trapezoid;
	// with thickness Tf at x = B/4 it is Tf − (Tw/4)·tanα at the outstand's
	// middle, x = (B + Tw)/4, so A = D·Tw + 4·((B − Tw)/2)·(Tf − (Tw/4)·tanα).
	s := ISection{B: 100, D: 200, Tw: 6, Tf: 10, FlangeSlope: math.Atan(0.14)}
	p := mustProps(t, s)
	within(t, "A", p.A, s.D*s.Tw+4*(s.B-s.Tw)/2*(s.Tf-s.Tw/4*0.14), exact)
	// Fillets and edge radii: root fillets add, tip radii remove material.
	q := mustProps(t, ISection{B: 100, D: 200, Tw: 6, Tf: 10, FlangeSlope: math.Atan(0.14), R: 9, FlangeEdgeRadius: 3})
	if !(q.A > p.A-4*(1-math.Pi/4)*9 && q.A < p.A+4*(1-math.Pi/4)*81) {
		t.Errorf("A with radii %v, without %v", q.A, p.A)
	}
}

func TestAsymmetricAndLipped(t *testing.T) {
	// source: textbook composite areas (sharp corners)
	a := mustProps(t, AsymmetricI{D: 500, Tw: 10, BottomWidth: 300, BottomThickness: 20, TopWidth: 150, TopThickness: 12})
	ar, _, yc, ix, iy, _ := composite{{-150, -250, 150, -230}, {-5, -230, 5, 238}, {-75, 238, 75, 250}}.props()
	within(t, "A", a.A, ar, exact)
	within(t, "Cy", a.Cy, yc, exact)
	within(t, "Ix", a.IMajor, ix, exact)
	within(t, "Iy", a.IMinor, iy, exact)
	within(t, "Zx", a.ZMajor, ix/(250-yc), exact) // the top fibre is farther from the centroid
	if a.Angle != 0 {
		t.Errorf("Angle %v", a.Angle)
	}

	c := mustProps(t, LippedChannel{D: 200, B: 76, T: 2.4, Lip: 20})
	ar, xc, _, ix, iy, _ := composite{
		{-38, -100, 38, -97.6}, {-38, -97.6, -35.6, 97.6}, {-38, 97.6, 38, 100},
		{35.6, -97.6, 38, -80}, {35.6, 80, 38, 97.6},
	}.props()
	within(t, "C A", c.A, ar, exact)
	within(t, "C Cx", c.Cx, xc, exact)
	within(t, "C Ix", c.IMajor, ix, exact)
	within(t, "C Iy", c.IMinor, iy, exact)
	// J on the centre line: t³·(d' + 2b' + 2l')/3.
	within(t, "C J", c.J, 2.4*2.4*2.4*(197.6+2*73.6+2*18.8)/3, exact)
	if !(c.Iw > 0) {
		t.Errorf("C Iw = %v", c.Iw)
	}
}
