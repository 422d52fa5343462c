package section

import "math"

// ISection is a doubly symmetric I or H section (IFC IShape): two equal
// flanges centred on a web, with root fillets and optionally tapered flanges
// with rounded tips. The origin is the centre of the section, depth along y,
// flanges parallel to x: major-axis bending is about x.
//
// J is the formula of El Darwish and Johnston (1965), which includes the
// bulb of material at each web–flange junction (it is what steel handbooks
// tabulate for rolled I sections): J = 2·J1 + J2 + 2·α·D⁴ with
// J1 = B·Tf³·[1/3 − 0.21·(Tf/B)·(1 − Tf⁴/(12·B⁴))], J2 = (D − 2Tf)·Tw³/3,
// α = (Tw/Tf)·(0.15 + 0.1·R/Tf) and the inscribed-circle diameter
// Dj = [(Tf + R)² + Tw·(R + Tw/4)] / (2R + Tf). It was fitted for Tw ≤ Tf.
//
// Iw is the thin-walled value If·h²/4 with If = 2·Tf·B³/12 the flanges' own
// minor-axis second moment and h = D − Tf the distance between flange
// centroids (web and fillets, which add a fraction of a percent, are left
// out). For tapered flanges J and Iw use Tf, the thickness at the quarter
// width.
type ISection struct {
	Name string // designation, copied to Properties.Profile

	B  float64 // overall width of the flanges, along x, mm
	D  float64 // overall depth, along y, mm
	Tw float64 // web thickness, mm
	Tf float64 // flange thickness, mm; for tapered flanges at the quarter-width point x = ±B/4
	R  float64 // root fillet radius between web and flanges, mm (0: sharp)

	// FlangeSlope is the slope of the inner faces of tapered flanges,
	// radians (0: parallel flanges). The flanges are thinner at the tips:
	// thickness Tf − (B/4)·tan(FlangeSlope) there.
	FlangeSlope float64
	// FlangeEdgeRadius rounds the inner corners of the flange tips, mm (0: sharp).
	FlangeEdgeRadius float64
}

// Properties computes the section properties of the I section.
func (s ISection) Properties() (Properties, error) { return properties(s, s) }

// Outline returns the section outline, fillets as chords of at most 5°.
func (s ISection) Outline() (Polygon, error) { return outline(s) }

// Plates returns four flange outstands of width (B − Tw)/2 (one edge
// supported) and the web of clear depth D − 2·Tf (both edges supported).
func (s ISection) Plates() ([]Plate, error) {
	if _, err := s.build(); err != nil {
		return nil, err
	}
	return []Plate{
		{Part: "flange", Width: (s.B - s.Tw) / 2, Thickness: s.Tf, Fillet: s.R, Support: OneEdge, Count: 4},
		{Part: "web", Width: s.D - 2*s.Tf, Thickness: s.Tw, Fillet: s.R, Support: BothEdges, Count: 1},
	}, nil
}

func (s ISection) build() (def, error) {
	ck := checker{shape: "ISection", name: s.Name}
	f := flange{width: s.B, thick: s.Tf, fillet: s.R, edge: s.FlangeEdgeRadius, slope: s.FlangeSlope,
		fW: "B", fT: "Tf", fR: "R", fE: "FlangeEdgeRadius", fS: "FlangeSlope"}
	reg := iRegion(&ck, f, f, s.D, s.Tw)
	if ck.err != nil {
		return def{}, ck.err
	}
	return def{
		shape: "I", name: s.Name, reg: reg,
		j:  jRolledI(f, f, s.D, s.Tw),
		iw: iwI(f, f, s.D),
	}, nil
}

// AsymmetricI is an I section with different top and bottom flanges (IFC
// AsymmetricIShape), both centred on the web. Origin at the centre of the
// bounding box; the bottom flange is at y = −D/2. Flange thicknesses of
// tapered flanges are at the quarter width of that flange.
//
// J sums the El Darwish–Johnston terms of ISection for each flange and
// junction: J = J1(bottom) + J1(top) + (D − Tbottom − Ttop)·Tw³/3 +
// α·Dj⁴(bottom) + α·Dj⁴(top). Iw is the thin-walled mono-symmetric I value
// Iw = h²·I1·I2/(I1 + I2), I1 and I2 the flanges' own minor-axis second
// moments Ti·Bi³/12 and h the distance between flange centroids.
type AsymmetricI struct {
	Name string // designation, copied to Properties.Profile

	D  float64 // overall depth, mm
	Tw float64 // web thickness, mm

	BottomWidth      float64 // mm
	BottomThickness  float64 // mm
	BottomFillet     float64 // root fillet radius, mm (0: sharp)
	BottomEdgeRadius float64 // flange tip inner corner radius, mm (0: sharp)
	BottomSlope      float64 // inner face slope, radians (0: parallel)

	TopWidth      float64 // mm
	TopThickness  float64 // mm
	TopFillet     float64 // mm
	TopEdgeRadius float64 // mm
	TopSlope      float64 // radians
}

// Properties computes the section properties of the asymmetric I section.
func (s AsymmetricI) Properties() (Properties, error) { return properties(s, s) }

// Outline returns the section outline, fillets as chords of at most 5°.
func (s AsymmetricI) Outline() (Polygon, error) { return outline(s) }

// Plates returns the outstands of each flange (width (Bi − Tw)/2, one edge
// supported; bottom flange first) and the web of clear depth
// D − Tbottom − Ttop.
func (s AsymmetricI) Plates() ([]Plate, error) {
	if _, err := s.build(); err != nil {
		return nil, err
	}
	r := math.Max(s.BottomFillet, s.TopFillet)
	return []Plate{
		{Part: "flange", Width: (s.BottomWidth - s.Tw) / 2, Thickness: s.BottomThickness, Fillet: s.BottomFillet, Support: OneEdge, Count: 2},
		{Part: "flange", Width: (s.TopWidth - s.Tw) / 2, Thickness: s.TopThickness, Fillet: s.TopFillet, Support: OneEdge, Count: 2},
		{Part: "web", Width: s.D - s.BottomThickness - s.TopThickness, Thickness: s.Tw, Fillet: r, Support: BothEdges, Count: 1},
	}, nil
}

func (s AsymmetricI) build() (def, error) {
	ck := checker{shape: "AsymmetricI", name: s.Name}
	bot := flange{width: s.BottomWidth, thick: s.BottomThickness, fillet: s.BottomFillet, edge: s.BottomEdgeRadius, slope: s.BottomSlope,
		fW: "BottomWidth", fT: "BottomThickness", fR: "BottomFillet", fE: "BottomEdgeRadius", fS: "BottomSlope"}
	top := flange{width: s.TopWidth, thick: s.TopThickness, fillet: s.TopFillet, edge: s.TopEdgeRadius, slope: s.TopSlope,
		fW: "TopWidth", fT: "TopThickness", fR: "TopFillet", fE: "TopEdgeRadius", fS: "TopSlope"}
	reg := iRegion(&ck, bot, top, s.D, s.Tw)
	if ck.err != nil {
		return def{}, ck.err
	}
	return def{
		shape: "I", name: s.Name, reg: reg,
		j:  jRolledI(bot, top, s.D, s.Tw),
		iw: iwI(bot, top, s.D),
	}, nil
}

// flange describes one flange of an I section and the field names that set
// it, for messages.
type flange struct {
	width, thick, fillet, edge, slope float64
	fW, fT, fR, fE, fS                string
}

// tip and root are the flange thicknesses at the tip and at the web face of
// a flange whose thickness at x = width/4 is thick.
func (f flange) tip() float64 { return f.thick - f.width/4*math.Tan(f.slope) }
func (f flange) root(tw float64) float64 {
	return f.thick + (f.width/4-tw/2)*math.Tan(f.slope)
}

func (f flange) check(ck *checker, tw float64) {
	ck.positive(f.fW, f.width)
	ck.positive(f.fT, f.thick)
	ck.nonNegative(f.fR, f.fillet)
	ck.nonNegative(f.fE, f.edge)
	ck.slope(f.fS, f.slope)
	if ck.err == nil && !(f.width > tw) {
		ck.failf(f.fW, f.width, "must be greater than the web thickness Tw (%.4g mm)", tw)
	}
	if ck.err == nil && !(f.tip() > 0) {
		ck.failf(f.fS, f.slope, "leaves no thickness at the flange tips (%.4g mm)", f.tip())
	}
}

// iRegion builds the outline of an I section: bottom flange at y = −d/2.
func iRegion(ck *checker, bot, top flange, d, tw float64) region {
	ck.positive("D", d)
	ck.positive("Tw", tw)
	if ck.err != nil {
		return region{}
	}
	bot.check(ck, tw)
	top.check(ck, tw)
	if ck.err != nil {
		return region{}
	}
	h := d / 2
	b1, b2, w := bot.width/2, top.width/2, tw/2
	t1tip, t1root := bot.tip(), bot.root(tw)
	t2tip, t2root := top.tip(), top.root(tw)
	if !(t1root+t2root < d) {
		ck.failf("D", d, "must exceed the flange thicknesses at the web (%.4g mm)", t1root+t2root)
		return region{}
	}
	cs := []corner{
		{x: -b1, y: -h},
		{x: b1, y: -h},
		{x: b1, y: -h + t1tip, r: bot.edge, field: bot.fE},
		{x: w, y: -h + t1root, r: bot.fillet, field: bot.fR},
		{x: w, y: h - t2root, r: top.fillet, field: top.fR},
		{x: b2, y: h - t2tip, r: top.edge, field: top.fE},
		{x: b2, y: h},
		{x: -b2, y: h},
		{x: -b2, y: h - t2tip, r: top.edge, field: top.fE},
		{x: -w, y: h - t2root, r: top.fillet, field: top.fR},
		{x: -w, y: -h + t1root, r: bot.fillet, field: bot.fR},
		{x: -b1, y: -h + t1tip, r: bot.edge, field: bot.fE},
	}
	l := roundedLoop(cs, false, ck)
	return region{loops: []loop{l}}
}

// jRolledI is the El Darwish–Johnston torsion constant of an I section with
// root fillets (see ISection).
func jRolledI(bot, top flange, d, tw float64) float64 {
	j1 := func(b, t float64) float64 {
		return b * t * t * t * (1.0/3 - 0.21*(t/b)*(1-t*t*t*t/(12*b*b*b*b)))
	}
	junction := func(t, r float64) float64 {
		alpha := tw / t * (0.15 + 0.1*r/t)
		dj := ((t+r)*(t+r) + tw*(r+tw/4)) / (2*r + t)
		return alpha * dj * dj * dj * dj
	}
	return j1(bot.width, bot.thick) + j1(top.width, top.thick) +
		(d-bot.thick-top.thick)*tw*tw*tw/3 +
		junction(bot.thick, bot.fillet) + junction(top.thick, top.fillet)
}

// iwI is the thin-walled warping constant of an I section with flanges of
// any size: h²·I1·I2/(I1 + I2).
func iwI(bot, top flange, d float64) float64 {
	h := d - bot.thick/2 - top.thick/2
	i1 := bot.thick * bot.width * bot.width * bot.width / 12
	i2 := top.thick * top.width * top.width * top.width / 12
	return h * h * i1 * i2 / (i1 + i2)
}
