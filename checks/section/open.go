package section

import "math"

// Open sections other than I: tee, angle, channel, lipped channel and zed.
// Their area, second moments and moduli are exact for the outline (fillets
// and rounded edges included); their J and Iw are thin-walled formulas on
// the plate centre lines, which ignore fillets and so come out a few percent
// below handbook values that include the junction bulbs.

// Tee is a T section (IFC TShape): the flange on top at y = +D/2, the stem
// (web) pointing down to y = −D/2, origin at the centre of the bounding box.
//
// J = [B·Tf³ + (D − Tf/2)·Tw³]/3 (thin-walled). Iw is the small secondary
// (through-thickness) warping of plates meeting at one point:
// Iw = [Tf³·B³/4 + Tw³·(D − Tf/2)³]/36; thin-walled theory proper gives 0.
// For tapered plates J and Iw use the nominal Tf and Tw.
type Tee struct {
	Name string // designation, copied to Properties.Profile

	D  float64 // overall depth, along y, mm
	B  float64 // flange width, along x, mm
	Tw float64 // web thickness, mm; for a tapered web at y = 0 (half the depth)
	Tf float64 // flange thickness, mm; for a tapered flange at x = ±B/4
	R  float64 // root fillet radius, mm (0: sharp)

	FlangeEdgeRadius float64 // inner corner radius of the flange tips, mm
	WebEdgeRadius    float64 // corner radius of the web tip, mm
	WebSlope         float64 // taper of each web face, radians (thinner towards the tip)
	FlangeSlope      float64 // slope of the flange underside, radians (thinner towards the tips)
}

// Properties computes the section properties of the tee.
func (s Tee) Properties() (Properties, error) { return properties(s, s) }

// Outline returns the section outline, fillets as chords of at most 5°.
func (s Tee) Outline() (Polygon, error) { return outline(s) }

// Plates returns two flange outstands of width (B − Tw)/2 and the stem
// ("web") of width D − Tf, all supported along one edge only.
func (s Tee) Plates() ([]Plate, error) {
	if _, err := s.build(); err != nil {
		return nil, err
	}
	return []Plate{
		{Part: "flange", Width: (s.B - s.Tw) / 2, Thickness: s.Tf, Fillet: s.R, Support: OneEdge, Count: 2},
		{Part: "web", Width: s.D - s.Tf, Thickness: s.Tw, Fillet: s.R, Support: OneEdge, Count: 1},
	}, nil
}

func (s Tee) build() (def, error) {
	ck := checker{shape: "Tee", name: s.Name}
	ck.positive("D", s.D)
	ck.positive("B", s.B)
	ck.positive("Tw", s.Tw)
	ck.positive("Tf", s.Tf)
	ck.nonNegative("R", s.R)
	ck.nonNegative("FlangeEdgeRadius", s.FlangeEdgeRadius)
	ck.nonNegative("WebEdgeRadius", s.WebEdgeRadius)
	ck.slope("WebSlope", s.WebSlope)
	ck.slope("FlangeSlope", s.FlangeSlope)
	if ck.err != nil {
		return def{}, ck.err
	}
	ck.less("Tw", s.Tw, s.B, "the flange width B")
	ck.less("Tf", s.Tf, s.D, "the depth D")
	ta, tb := math.Tan(s.FlangeSlope), math.Tan(s.WebSlope)
	h := s.D / 2
	tipF := s.Tf - s.B/4*ta // flange thickness at its tips
	xt := s.Tw/2 - h*tb     // half the web thickness at its tip
	if ck.err == nil && !(tipF > 0) {
		ck.failf("FlangeSlope", s.FlangeSlope, "leaves no thickness at the flange tips (%.4g mm)", tipF)
	}
	if ck.err == nil && !(xt > 0) {
		ck.failf("WebSlope", s.WebSlope, "leaves no thickness at the web tip (%.4g mm)", 2*xt)
	}
	// Junction of the right web face x = Tw/2 + y·tanβ with the flange
	// underside y = D/2 − Tf + (x − B/4)·tanα.
	yj := (h - s.Tf + (s.Tw/2-s.B/4)*ta) / (1 - ta*tb)
	xj := s.Tw/2 + yj*tb
	if ck.err == nil && !(yj > -h) {
		ck.failf("Tf", s.Tf, "leaves no web below the flange")
	}
	if ck.err == nil && !(xj < s.B/2) {
		ck.failf("WebSlope", s.WebSlope, "makes the web meet the flange beyond its tips")
	}
	if ck.err != nil {
		return def{}, ck.err
	}
	l := roundedLoop([]corner{
		{x: xt, y: -h, r: s.WebEdgeRadius, field: "WebEdgeRadius"},
		{x: xj, y: yj, r: s.R, field: "R"},
		{x: s.B / 2, y: h - tipF, r: s.FlangeEdgeRadius, field: "FlangeEdgeRadius"},
		{x: s.B / 2, y: h},
		{x: -s.B / 2, y: h},
		{x: -s.B / 2, y: h - tipF, r: s.FlangeEdgeRadius, field: "FlangeEdgeRadius"},
		{x: -xj, y: yj, r: s.R, field: "R"},
		{x: -xt, y: -h, r: s.WebEdgeRadius, field: "WebEdgeRadius"},
	}, false, &ck)
	if ck.err != nil {
		return def{}, ck.err
	}
	hw := s.D - s.Tf/2
	return def{
		shape: "T", name: s.Name, reg: region{loops: []loop{l}},
		j:  (s.B*cube(s.Tf) + hw*cube(s.Tw)) / 3,
		iw: (cube(s.Tf)*cube(s.B)/4 + cube(s.Tw)*cube(hw)) / 36,
	}, nil
}

// Angle is an L section (IFC LShape) with the heel at the bottom left: one
// leg along x (width B) at y = −D/2, the other along y (depth D) at
// x = −B/2; origin at the centre of the bounding box. Its principal axes are
// inclined: Properties reports the principal second moments and the
// inclination Angle of the major axis (π/4 for an equal angle).
//
// J = (B − T/2 + D − T/2)·T³/3 (thin-walled). Iw is the secondary warping of
// two legs meeting at the heel, T³·[(B − T/2)³ + (D − T/2)³]/36; thin-walled
// theory proper gives 0.
type Angle struct {
	Name string // designation, copied to Properties.Profile

	D          float64 // leg length along y, mm
	B          float64 // leg length along x, mm (IFC Width; equal to D for an equal angle)
	T          float64 // thickness, mm
	R          float64 // root fillet radius, mm (0: sharp)
	EdgeRadius float64 // radius of the inner corners of the leg tips, mm (0: sharp)
}

// Properties computes the section properties of the angle.
func (s Angle) Properties() (Properties, error) { return properties(s, s) }

// Outline returns the section outline, fillets as chords of at most 5°.
func (s Angle) Outline() (Polygon, error) { return outline(s) }

// Plates returns the leg along x (clear width B − T) and the leg along y
// (D − T), each supported along one edge.
func (s Angle) Plates() ([]Plate, error) {
	if _, err := s.build(); err != nil {
		return nil, err
	}
	return []Plate{
		{Part: "leg", Width: s.B - s.T, Thickness: s.T, Fillet: s.R, Support: OneEdge, Count: 1},
		{Part: "leg", Width: s.D - s.T, Thickness: s.T, Fillet: s.R, Support: OneEdge, Count: 1},
	}, nil
}

func (s Angle) build() (def, error) {
	ck := checker{shape: "Angle", name: s.Name}
	ck.positive("D", s.D)
	ck.positive("B", s.B)
	ck.positive("T", s.T)
	ck.nonNegative("R", s.R)
	ck.nonNegative("EdgeRadius", s.EdgeRadius)
	if ck.err == nil {
		ck.less("T", s.T, math.Min(s.B, s.D), "the shorter leg")
	}
	if ck.err != nil {
		return def{}, ck.err
	}
	x, y := s.B/2, s.D/2
	l := roundedLoop([]corner{
		{x: -x, y: -y},
		{x: x, y: -y},
		{x: x, y: -y + s.T, r: s.EdgeRadius, field: "EdgeRadius"},
		{x: -x + s.T, y: -y + s.T, r: s.R, field: "R"},
		{x: -x + s.T, y: y, r: s.EdgeRadius, field: "EdgeRadius"},
		{x: -x, y: y},
	}, false, &ck)
	if ck.err != nil {
		return def{}, ck.err
	}
	b, d := s.B-s.T/2, s.D-s.T/2
	return def{
		shape: "L", name: s.Name, reg: region{loops: []loop{l}},
		j:  (b + d) * cube(s.T) / 3,
		iw: cube(s.T) * (cube(b) + cube(d)) / 36,
	}, nil
}

// Channel is a U (channel) section (IFC UShape): web along y at x = −B/2,
// flanges pointing to +x; origin at the centre of the bounding box.
//
// J = [2·(B − Tw/2)·Tf³ + (D − Tf)·Tw³]/3 and Iw about the shear centre are
// thin-walled values on the centre lines (for the channel Iw this equals the
// textbook Tf·b³·h²/12 · (3·b·Tf + 2·h·Tw)/(6·b·Tf + h·Tw) with
// b = B − Tw/2, h = D − Tf).
type Channel struct {
	Name string // designation, copied to Properties.Profile

	D          float64 // overall depth, along y, mm
	B          float64 // flange width including the web, along x, mm
	Tw         float64 // web thickness, mm
	Tf         float64 // flange thickness, mm; for tapered flanges at half the flange width (x = 0)
	R          float64 // root fillet radius, mm (0: sharp)
	EdgeRadius float64 // inner corner radius of the flange tips, mm (0: sharp)

	// FlangeSlope is the slope of the flanges' inner faces, radians (0:
	// parallel flanges); the flanges are thinner at the tips.
	FlangeSlope float64
}

// Properties computes the section properties of the channel.
func (s Channel) Properties() (Properties, error) { return properties(s, s) }

// Outline returns the section outline, fillets as chords of at most 5°.
func (s Channel) Outline() (Polygon, error) { return outline(s) }

// Plates returns the two flanges (outstands of width B − Tw, one edge
// supported) and the web (clear depth D − 2·Tf, both edges supported).
func (s Channel) Plates() ([]Plate, error) {
	if _, err := s.build(); err != nil {
		return nil, err
	}
	return flangesAndWeb(s.B, s.D, s.Tw, s.Tf, s.R), nil
}

func (s Channel) build() (def, error) {
	ck := checker{shape: "Channel", name: s.Name}
	ck.positive("D", s.D)
	ck.positive("B", s.B)
	ck.positive("Tw", s.Tw)
	ck.positive("Tf", s.Tf)
	ck.nonNegative("R", s.R)
	ck.nonNegative("EdgeRadius", s.EdgeRadius)
	ck.slope("FlangeSlope", s.FlangeSlope)
	if ck.err != nil {
		return def{}, ck.err
	}
	ck.less("Tw", s.Tw, s.B, "the flange width B")
	ta := math.Tan(s.FlangeSlope)
	x, y := s.B/2, s.D/2
	tip := s.Tf - x*ta         // flange thickness at the tips
	root := s.Tf + (x-s.Tw)*ta // at the web face
	if ck.err == nil && !(tip > 0) {
		ck.failf("FlangeSlope", s.FlangeSlope, "leaves no thickness at the flange tips (%.4g mm)", tip)
	}
	if ck.err == nil && !(2*root < s.D) {
		ck.failf("Tf", s.Tf, "leaves no web between the flanges (flanges %.4g mm thick at the web)", root)
	}
	if ck.err != nil {
		return def{}, ck.err
	}
	l := roundedLoop([]corner{
		{x: -x, y: -y},
		{x: x, y: -y},
		{x: x, y: -y + tip, r: s.EdgeRadius, field: "EdgeRadius"},
		{x: -x + s.Tw, y: -y + root, r: s.R, field: "R"},
		{x: -x + s.Tw, y: y - root, r: s.R, field: "R"},
		{x: x, y: y - tip, r: s.EdgeRadius, field: "EdgeRadius"},
		{x: x, y: y},
		{x: -x, y: y},
	}, false, &ck)
	if ck.err != nil {
		return def{}, ck.err
	}
	yf, xw := y-s.Tf/2, -x+s.Tw/2
	j, iw := thinWalled(
		[]Point{{x, yf}, {xw, yf}, {xw, -yf}, {x, -yf}},
		[]twPlate{{0, 1, s.Tf}, {1, 2, s.Tw}, {2, 3, s.Tf}})
	return def{shape: "U", name: s.Name, reg: region{loops: []loop{l}}, j: j, iw: iw}, nil
}

// LippedChannel is a cold-formed lipped channel (IFC CShape): uniform wall
// T, web along y at x = −B/2, flanges to +x ending in lips that turn
// inwards; origin at the centre of the bounding box. With Ri > 0 the inner
// corners have radius Ri and the outer corners Ri + T; the lip ends are
// square.
//
// J = T³·(D − T + 2·(B − T) + 2·(Lip − T/2))/3 and Iw about the shear
// centre are thin-walled values on the centre line with sharp corners.
type LippedChannel struct {
	Name string // designation, copied to Properties.Profile

	D   float64 // overall depth, along y, mm
	B   float64 // overall width, along x, mm
	T   float64 // wall thickness, mm
	Lip float64 // overall length of each lip, along y (IFC Girth), mm
	Ri  float64 // internal corner radius, mm (0: sharp)
}

// Properties computes the section properties of the lipped channel.
func (s LippedChannel) Properties() (Properties, error) { return properties(s, s) }

// Outline returns the section outline, corners as chords of at most 5°.
func (s LippedChannel) Outline() (Polygon, error) { return outline(s) }

// Plates returns the web (clear depth D − 2T) and the two flanges (clear
// width B − 2T), supported along both edges (the flanges by web and lip),
// and the two lips (Lip − T, one edge supported). Fillet is Ri.
func (s LippedChannel) Plates() ([]Plate, error) {
	if _, err := s.build(); err != nil {
		return nil, err
	}
	return []Plate{
		{Part: "web", Width: s.D - 2*s.T, Thickness: s.T, Fillet: s.Ri, Support: BothEdges, Count: 1},
		{Part: "flange", Width: s.B - 2*s.T, Thickness: s.T, Fillet: s.Ri, Support: BothEdges, Count: 2},
		{Part: "lip", Width: s.Lip - s.T, Thickness: s.T, Fillet: s.Ri, Support: OneEdge, Count: 2},
	}, nil
}

func (s LippedChannel) build() (def, error) {
	ck := checker{shape: "LippedChannel", name: s.Name}
	ck.positive("D", s.D)
	ck.positive("B", s.B)
	ck.positive("T", s.T)
	ck.positive("Lip", s.Lip)
	ck.nonNegative("Ri", s.Ri)
	if ck.err != nil {
		return def{}, ck.err
	}
	ck.less("T", s.T, s.B/2, "half the width B")
	ck.less("T", s.T, s.Lip, "the lip length")
	ck.less("Lip", s.Lip, s.D/2, "half the depth D")
	if ck.err != nil {
		return def{}, ck.err
	}
	t, ri := s.T, s.Ri
	ro := 0.0
	if ri > 0 {
		ro = ri + t
	}
	x, y, l := s.B/2, s.D/2, s.Lip
	lp := roundedLoop([]corner{
		{x: -x, y: -y, r: ro, field: "Ri"},
		{x: x, y: -y, r: ro, field: "Ri"},
		{x: x, y: -y + l},
		{x: x - t, y: -y + l},
		{x: x - t, y: -y + t, r: ri, field: "Ri"},
		{x: -x + t, y: -y + t, r: ri, field: "Ri"},
		{x: -x + t, y: y - t, r: ri, field: "Ri"},
		{x: x - t, y: y - t, r: ri, field: "Ri"},
		{x: x - t, y: y - l},
		{x: x, y: y - l},
		{x: x, y: y, r: ro, field: "Ri"},
		{x: -x, y: y, r: ro, field: "Ri"},
	}, false, &ck)
	if ck.err != nil {
		return def{}, ck.err
	}
	xc, yc := x-t/2, y-t/2
	j, iw := thinWalled(
		[]Point{{xc, y - l}, {xc, yc}, {-xc, yc}, {-xc, -yc}, {xc, -yc}, {xc, -y + l}},
		[]twPlate{{0, 1, t}, {1, 2, t}, {2, 3, t}, {3, 4, t}, {4, 5, t}})
	return def{shape: "C", name: s.Name, reg: region{loops: []loop{lp}}, j: j, iw: iw}, nil
}

// Zed is a Z section (IFC ZShape): web along y centred on x = 0, the top
// flange pointing to −x and the bottom flange to +x; origin at the centre
// of the web. Its principal axes are inclined (Angle ≠ 0).
//
// B is measured, as steel tables give it, from the outer face of the web to
// the flange tip, so the overall width is 2·B − Tw.
//
// J = [2·(B − Tw/2)·Tf³ + (D − Tf)·Tw³]/3 and Iw about the shear centre (the
// centroid) are thin-walled values on the centre lines; for equal plates Iw
// is the textbook t·b³·h²·(b + 2h)/(12·(2b + h)).
type Zed struct {
	Name string // designation, copied to Properties.Profile

	D          float64 // overall depth, along y, mm
	B          float64 // flange width from the web's outer face to the tip, mm
	Tw         float64 // web thickness, mm
	Tf         float64 // flange thickness, mm
	R          float64 // root fillet radius, mm (0: sharp)
	EdgeRadius float64 // inner corner radius of the flange tips, mm (0: sharp)
}

// Properties computes the section properties of the zed.
func (s Zed) Properties() (Properties, error) { return properties(s, s) }

// Outline returns the section outline, fillets as chords of at most 5°.
func (s Zed) Outline() (Polygon, error) { return outline(s) }

// Plates returns the two flanges (outstands of width B − Tw) and the web
// (clear depth D − 2·Tf, both edges supported).
func (s Zed) Plates() ([]Plate, error) {
	if _, err := s.build(); err != nil {
		return nil, err
	}
	return flangesAndWeb(s.B, s.D, s.Tw, s.Tf, s.R), nil
}

func (s Zed) build() (def, error) {
	ck := checker{shape: "Zed", name: s.Name}
	ck.positive("D", s.D)
	ck.positive("B", s.B)
	ck.positive("Tw", s.Tw)
	ck.positive("Tf", s.Tf)
	ck.nonNegative("R", s.R)
	ck.nonNegative("EdgeRadius", s.EdgeRadius)
	if ck.err != nil {
		return def{}, ck.err
	}
	ck.less("Tw", s.Tw, s.B, "the flange width B")
	ck.less("Tf", s.Tf, s.D/2, "half the depth D")
	if ck.err != nil {
		return def{}, ck.err
	}
	w, y := s.Tw/2, s.D/2
	l := roundedLoop([]corner{
		{x: -w, y: -y},
		{x: -w + s.B, y: -y},
		{x: -w + s.B, y: -y + s.Tf, r: s.EdgeRadius, field: "EdgeRadius"},
		{x: w, y: -y + s.Tf, r: s.R, field: "R"},
		{x: w, y: y},
		{x: w - s.B, y: y},
		{x: w - s.B, y: y - s.Tf, r: s.EdgeRadius, field: "EdgeRadius"},
		{x: -w, y: y - s.Tf, r: s.R, field: "R"},
	}, false, &ck)
	if ck.err != nil {
		return def{}, ck.err
	}
	yf, b := y-s.Tf/2, s.B-w
	j, iw := thinWalled(
		[]Point{{-b, yf}, {0, yf}, {0, -yf}, {b, -yf}},
		[]twPlate{{0, 1, s.Tf}, {1, 2, s.Tw}, {2, 3, s.Tf}})
	return def{shape: "Z", name: s.Name, reg: region{loops: []loop{l}}, j: j, iw: iw}, nil
}

func cube(v float64) float64 { return v * v * v }

// flangesAndWeb are the plates of a channel or zed: two flange outstands of
// width B − Tw (one edge supported) and the web of clear depth D − 2·Tf (both
// edges supported).
func flangesAndWeb(b, d, tw, tf, r float64) []Plate {
	return []Plate{
		{Part: "flange", Width: b - tw, Thickness: tf, Fillet: r, Support: OneEdge, Count: 2},
		{Part: "web", Width: d - 2*tf, Thickness: tw, Fillet: r, Support: BothEdges, Count: 1},
	}
}
