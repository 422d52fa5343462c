package ifcgen

// Fit-out items used as filler. Names and notes are encoded with the STEP
// string escapes: \X2\ for characters outside ISO 8859-1, \S\ for the upper
// half of ISO 8859-1 (when latin1 is set), doubled apostrophes.
var fitOut = []struct {
	kind       int // 0 desk, 1 cabinet (boxes), 2 chair, 3 plant (triangulated)
	name, note string
	latin1     bool
	w, d, h    float64
}{
	{0, "Schreibtisch Büro", "Höhe verstellbar", false, 1600, 800, 740},
	{0, "Tisch N° 12", "Client's desk – walnut", true, 1400, 700, 740},
	{0, "Desk 'hot' 1400", "Cable tray × 2", true, 1400, 800, 720},
	{1, "Rollcontainer Ø 600", "Schlüssel: «A-17»", true, 430, 600, 600},
	{1, "Cabinet 'B'", "Grundstück Süd — Archiv", false, 1000, 450, 1950},
	{1, "Whiteboard 1200×900", "Raum 3·12", true, 1200, 60, 900},
	{2, "Stuhl Ärmel", "Bezug: Stoff \"Sand\"", false, 620, 600, 1050},
	{2, "Armchair «lounge»", "Designer's choice", true, 800, 780, 820},
	{3, "Pflanze – Ficus", "Gießen: 2× wöchentlich", false, 500, 500, 1600},
	{3, "Plant 'Monstera'", "Topf Ø 40 cm", true, 450, 450, 1200},
}

type fitOutEncoded struct {
	kind       int
	name, note string
	w, d, h    float64
}

func encodedFitOut() []fitOutEncoded {
	out := make([]fitOutEncoded, len(fitOut))
	for i, f := range fitOut {
		out[i] = fitOutEncoded{f.kind, encode(f.name, f.latin1), encode(f.note, f.latin1), f.w, f.d, f.h}
	}
	return out
}

// filler writes fit-out items on storey st until the file reaches its share
// of the target size.
func (g *gen) filler(st int) {
	if g.opt.TargetBytes <= 0 {
		return
	}
	// Everything after the storeys (material associations, the structural
	// model) is about structBytesPerColumn per column.
	rest := int64(g.opt.Columns) * structBytesPerColumn
	goal := (g.opt.TargetBytes - rest) * int64(st+1) / int64(g.opt.Storeys)
	items := encodedFitOut()
	var batch []int
	flush := func() {
		if len(batch) == 0 {
			return
		}
		g.s.begin("IFCRELCONTAINEDINSPATIALSTRUCTURE")
		g.s.str(g.newGID()).unset().str("Fit-out of " + storeyName(st)).unset().refs(batch...).ref(g.storeyIDs[st]).end()
		batch = batch[:0]
	}
	for g.s.n < goal && g.s.err == nil {
		// About five in six items are tessellated (few, long instances), the rest
		// faceted boxes (many short ones): about 88 bytes per instance.
		it := items[g.rng.IntN(len(items))]
		if it.kind <= 1 && g.rng.IntN(4) != 0 {
			it = items[6+g.rng.IntN(4)]
		}
		batch = append(batch, g.proxy(st, it))
		if len(batch) == 200 {
			flush()
		}
	}
	flush()
}

func (g *gen) proxy(st int, it fitOutEncoded) int {
	s := g.s
	spanX := float64(max(1, g.nx-1)) * bay
	spanY := float64(max(1, g.ny-1)) * bay
	x := round1(g.rng.Float64() * spanX)
	y := round1(g.rng.Float64() * spanY)
	pt := s.begin("IFCCARTESIANPOINT")
	s.reals(x, y, 0).end()
	ax := s.begin("IFCAXIS2PLACEMENT3D")
	s.ref(pt).unset().unset().end()
	pl := s.begin("IFCLOCALPLACEMENT")
	s.ref(g.storeyPl[st]).ref(ax).end()
	var item, repType = 0, "Brep"
	if it.kind <= 1 {
		item = g.box(it.w, it.d, it.h)
	} else {
		item = g.tessellated(it.w, it.d, it.h, it.kind == 3)
		repType = "Tessellation"
	}
	rep := s.begin("IFCSHAPEREPRESENTATION")
	s.ref(g.body).str("Body").str(repType).refs(item).end()
	pds := s.begin("IFCPRODUCTDEFINITIONSHAPE")
	s.unset().unset().refs(rep).end()
	g.proxies++
	tag := "FO-" + itoa(st) + "-" + itoa(g.proxies)
	px := s.begin("IFCBUILDINGELEMENTPROXY")
	s.str(g.newGID()).unset().str(it.name).str(it.note).unset().ref(pl).ref(pds).str(tag).enum("ELEMENT").end()
	v1 := s.begin("IFCPROPERTYSINGLEVALUE")
	s.str("Item").unset().typedStr("IFCLABEL", it.name).unset().end()
	v2 := s.begin("IFCPROPERTYSINGLEVALUE")
	s.str("Note").unset().typedStr("IFCTEXT", it.note).unset().end()
	v3 := s.begin("IFCPROPERTYSINGLEVALUE")
	s.str("Width").unset().typedReal("IFCPOSITIVELENGTHMEASURE", it.w).unset().end()
	ps := s.begin("IFCPROPERTYSET")
	s.str(g.newGID()).unset().str("Fit-out schedule").unset().refs(v1, v2, v3).end()
	s.begin("IFCRELDEFINESBYPROPERTIES")
	s.str(g.newGID()).unset().unset().unset().refs(px).ref(ps).end()
	return px
}

func round1(v float64) float64 { return float64(int64(v*10)) / 10 }

// box writes an IfcFacetedBrep of a w × d × h box and returns its id.
func (g *gen) box(w, d, h float64) int {
	s := g.s
	var p [8]int
	for i := range p {
		x, y, z := 0.0, 0.0, 0.0
		if i&1 != 0 {
			x = w
		}
		if i&2 != 0 {
			y = d
		}
		if i&4 != 0 {
			z = h
		}
		p[i] = s.begin("IFCCARTESIANPOINT")
		s.reals(x, y, z).end()
	}
	quads := [6][4]int{{0, 2, 3, 1}, {4, 5, 7, 6}, {0, 1, 5, 4}, {1, 3, 7, 5}, {3, 2, 6, 7}, {2, 0, 4, 6}}
	var faces [6]int
	for k, q := range quads {
		loop := s.begin("IFCPOLYLOOP")
		s.refs(p[q[0]], p[q[1]], p[q[2]], p[q[3]]).end()
		bound := s.begin("IFCFACEOUTERBOUND")
		s.ref(loop).boolean(true).end()
		faces[k] = s.begin("IFCFACE")
		s.refs(bound).end()
	}
	shell := s.begin("IFCCLOSEDSHELL")
	s.refs(faces[:]...).end()
	brep := s.begin("IFCFACETEDBREP")
	s.ref(shell).end()
	return brep
}

// tessellated writes an IfcTriangulatedFaceSet of a faceted prism (a chair's
// or a pot's silhouette) and returns its id.
func (g *gen) tessellated(w, d, h float64, round bool) int {
	s := g.s
	sides := 6
	if round {
		sides = 10
	}
	pl := s.begin("IFCCARTESIANPOINTLIST3D")
	s.open()
	for ring := 0; ring < 2; ring++ {
		z := 0.0
		if ring == 1 {
			z = h
		}
		for k := 0; k < sides; k++ {
			a := 2 * 3.141592653589793 * float64(k) / float64(sides)
			s.reals(round1(w/2*(1+cos(a))), round1(d/2*(1+sin(a))), z)
		}
	}
	s.close().end()
	fs := s.begin("IFCTRIANGULATEDFACESET")
	s.ref(pl).unset().boolean(true).open()
	for k := 0; k < sides; k++ {
		a, b := k+1, (k+1)%sides+1
		s.open().integer(a).integer(b).integer(b + sides).close()
		s.open().integer(a).integer(b + sides).integer(a + sides).close()
	}
	for k := 1; k < sides-1; k++ { // bottom and top fans
		s.open().integer(1).integer(k + 2).integer(k + 1).close()
		s.open().integer(1 + sides).integer(k + 1 + sides).integer(k + 2 + sides).close()
	}
	s.close().unset().end()
	return fs
}
