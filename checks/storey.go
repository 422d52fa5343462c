package checks

import (
	"math"
	"slices"
)

// storeyGeometryTolerance is the share of the storey height by which a
// column's top may differ from its storey's typical column top before it
// gets storey-geometry (design §5.3).
const storeyGeometryTolerance = 0.10

// Messages of the storey method.
const (
	msgStoreyGeometry = "the column's top differs from its storey's other columns by more than 10 % of the storey height: " +
		"the storey method assumes that columns span their storey"
	msgStoreyNoCompression = "no compression in the storey: delta_s = 1"
)

// StoreyProvider is the storey method (--sway-method storey, the default).
// For each storey (Member.StoreyKey), global direction and combination it
// sums the stiffness of the sway columns and the load of every column, and
// the rule set's StoreyLambda turns the sums into lambda_c:
//   - a column flagged sway for an axis gives stiffness (Noms/L) unless it
//     is itself unstable (N* ≥ Nomb); one whose stiffness is unknown (no
//     section or length, invalid ke) makes the sums unknown;
//   - every column gives load (N*, tension counts 0); one without actions
//     for the combination makes the sums unknown (storey-incomplete);
//   - a braced-flagged axis of a storey that sways in its direction is
//     leaning: load, no stiffness, and it takes the storey's delta_s;
//   - a column without restraint data gives load only;
//   - a storey with no sway column in a direction is braced in it.
//
// Columns without a storey are their own storey: lambda_c of a sway axis is
// its own Noms/N*.
type StoreyProvider struct {
	sc *SwayContext
	nc int

	gd    []int32 // per member-axis (2i+a): group-direction index 2g+d, -1 = no storey
	sway  []bool  // per group-direction: some column sways
	base  []int32 // per group-direction: index in Report.Storeys of combination 0, -1 = braced
	geom  []bool  // per member: storey-geometry
	first []int32 // per group-direction: offsets into ents
	ents  []int32 // member-axis entries (2i+a) grouped by group-direction
}

// NewStoreyProvider returns a provider for one run.
func NewStoreyProvider() *StoreyProvider { return &StoreyProvider{} }

// Method implements SwayProvider.
func (p *StoreyProvider) Method() string { return "storey" }

func dirIndex(d Direction) int32 {
	if d == DirY {
		return 1
	}
	return 0
}

// Prepare implements SwayProvider.
func (p *StoreyProvider) Prepare(sc *SwayContext) error {
	p.sc = sc
	n := sc.Members()
	p.nc = len(sc.Combinations)
	ms := sc.Model.Members
	rep := sc.Report

	// Groups: one per storey instance, in order of first appearance.
	groupOf := make(map[string]int32)
	var gFirst []int32 // first member of each group
	memberGroup := make([]int32, n)
	for i := range ms {
		key := ms[i].StoreyKey
		if key == "" {
			memberGroup[i] = -1
			continue
		}
		g, ok := groupOf[key]
		if !ok {
			g = int32(len(gFirst))
			groupOf[key] = g
			gFirst = append(gFirst, int32(i))
		}
		memberGroup[i] = g
	}
	ng := len(gFirst)

	// Group-directions: entries, sway flags.
	p.gd = make([]int32, 2*n)
	p.sway = make([]bool, 2*ng)
	p.first = make([]int32, 2*ng+1)
	hasAxes := make([]bool, 2*ng)
	noStorey := 0
	for i := range n {
		g := memberGroup[i]
		for a := range Axes {
			if g < 0 {
				p.gd[2*i+a] = -1
				continue
			}
			ax := sc.Axis(i, Axis(a))
			gd := 2*g + dirIndex(ax.Direction)
			p.gd[2*i+a] = gd
			p.first[gd+1]++
			hasAxes[gd] = true
			if ax.Restraint == Sway {
				p.sway[gd] = true
			}
		}
		if g < 0 {
			noStorey++
		}
	}
	for k := 1; k < len(p.first); k++ {
		p.first[k] += p.first[k-1]
	}
	p.ents = make([]int32, p.first[len(p.first)-1])
	fill := slices.Clone(p.first[:len(p.first)-1])
	for e := range p.gd {
		if gd := p.gd[e]; gd >= 0 {
			p.ents[fill[gd]] = int32(e)
			fill[gd]++
		}
	}

	// Storey rows: every swaying storey-direction and combination.
	nsw := 0
	for _, s := range p.sway {
		if s {
			nsw++
		}
	}
	rep.Storeys = slices.Grow(rep.Storeys, nsw*p.nc)
	drift := p.driftIndex()
	p.base = make([]int32, 2*ng)
	for g := range ng {
		m0 := &ms[gFirst[g]]
		for d := range int32(2) {
			gd := 2*int32(g) + d
			p.base[gd] = -1
			if !p.sway[gd] {
				continue
			}
			p.base[gd] = int32(len(rep.Storeys))
			dir := DirX
			if d == 1 {
				dir = DirY
			}
			for c := range p.nc {
				rep.Storeys = append(rep.Storeys, StoreyResult{
					StoreyKey:   m0.StoreyKey,
					Name:        m0.Storey,
					Elevation:   m0.StoreyElevation,
					Direction:   dir,
					Combination: sc.Combinations[c],
				})
				p.sums(gd, c, &rep.Storeys[len(rep.Storeys)-1], drift)
			}
		}
	}

	p.geometry(memberGroup, ng)

	// Assumptions.
	if nsw > 0 || noStorey > 0 {
		rep.Assumptions = append(rep.Assumptions,
			"storey method: each storey (building storey instance) is one structure with a rigid diaphragm, "+
				"its columns span the storey, and there is no plan torsion; lambda_c of a storey, direction and "+
				"combination takes the stiffness of its sway columns and the load of all its columns "+
				"(tension counts 0, leaning columns included)")
	}
	for g := range ng {
		for d := range int32(2) {
			gd := 2*int32(g) + d
			if hasAxes[gd] && !p.sway[gd] {
				dir := "X"
				if d == 1 {
					dir = "Y"
				}
				rep.Assumptions = append(rep.Assumptions,
					"storey "+storeyLabel(&ms[gFirst[g]])+" braced in "+dir+": no column of it is flagged sway in "+dir)
			}
		}
	}
	if noStorey > 0 {
		rep.Assumptions = append(rep.Assumptions, itoa(noStorey)+
			" column(s) have no storey: the lambda_c of a sway axis is the column's own Noms/N*, "+
			"and braced-flagged axes are braced")
	}
	return nil
}

// driftIndex maps storey data rows by storey, direction and combination.
func (p *StoreyProvider) driftIndex() map[string]int {
	rows := p.sc.Model.StoreyData
	if len(rows) == 0 {
		return nil
	}
	idx := make(map[string]int, len(rows))
	for k := range rows {
		r := &rows[k]
		if r.Direction == DirUnknown || !finitePos(r.ShearN) || !(r.DriftMM >= 0) || !finitePos(r.HeightMM) {
			p.sc.Report.Warnings = append(p.sc.Report.Warnings, Reason{
				Code:    CodeStoreyDataIgnored,
				Message: "storey data row ignored: it needs a direction, a positive shear and height and a drift ≥ 0",
				Ref:     r.Ref,
			})
			continue
		}
		key := "n:" + r.Storey
		if r.StoreyKey != "" {
			key = "k:" + r.StoreyKey
		}
		key += "\x00" + r.Direction.String() + "\x00" + r.Combination
		if _, dup := idx[key]; !dup {
			idx[key] = k
		}
	}
	return idx
}

func (p *StoreyProvider) lookupDrift(idx map[string]int, sr *StoreyResult) (*StoreyData, bool) {
	if idx == nil {
		return nil, false
	}
	tail := "\x00" + sr.Direction.String() + "\x00" + sr.Combination
	if k, ok := idx["k:"+sr.StoreyKey+tail]; ok {
		return &p.sc.Model.StoreyData[k], true
	}
	if k, ok := idx["n:"+sr.Name+tail]; ok {
		return &p.sc.Model.StoreyData[k], true
	}
	return nil, false
}

// sums fills one storey row.
func (p *StoreyProvider) sums(gd int32, c int, sr *StoreyResult, drift map[string]int) {
	sc := p.sc
	s := StoreySums{Storey: sr}
	var missing, unknown, noLength int
	firstMissing, firstUnknown, firstNoLength := -1, -1, -1
	for _, e := range p.ents[p.first[gd]:p.first[gd+1]] {
		i, a := int(e>>1), Axis(e&1)
		ax := sc.Axis(i, a)
		switch ax.Restraint {
		case Sway:
			sr.SwayMembers++
		case Braced:
			sr.LeaningMembers++
		}
		nst := sc.NStar(i, c)
		if math.IsNaN(nst) {
			if missing == 0 {
				firstMissing = i
			}
			missing++
			continue
		}
		l := ax.MemberLength
		if !finitePos(l) {
			if noLength == 0 {
				firstNoLength = i
			}
			noLength++
			continue
		}
		pos := math.Max(nst, 0)
		// A member whose two axes sway the same way loads the storey once.
		if a == Major || p.gd[2*i] != gd {
			s.SumN += pos
			s.SumNOverL += pos / l
			s.SumN2OverL += pos * pos / l
			if ax.Restraint == Sway {
				s.SumNSway += pos
			}
		}
		if ax.Restraint != Sway {
			continue
		}
		if ax.Invalid || math.IsNaN(ax.Nom) || math.IsNaN(ax.Nomb) {
			if unknown == 0 {
				firstUnknown = i
			}
			unknown++
			continue
		}
		if nst >= ax.Nomb {
			continue // unstable itself: load, no stiffness
		}
		s.SumNomsOverL += ax.Nom / l
		s.SumNomsNOverL += ax.Nom * pos / l
	}
	sr.SumNStar = Num(s.SumN)
	sr.SumNStarSway = Num(s.SumNSway)
	sr.LambdaC, sr.FormA, sr.FormB, sr.FormDrift = Null, Null, Null, Null
	sr.Shear, sr.Drift, sr.Height, sr.Vertical = Null, Null, Null, Null
	if missing+unknown+noLength > 0 {
		ms := sc.Model.Members
		var msg string
		switch {
		case missing > 0:
			msg = "column " + memberLabel(&ms[firstMissing]) + " has no actions for this combination" + andMore(missing)
		case unknown > 0:
			msg = "the stiffness of sway column " + memberLabel(&ms[firstUnknown]) +
				" is unknown (no section, length or valid ke)" + andMore(unknown)
		default:
			msg = "column " + memberLabel(&ms[firstNoLength]) + " has no length" + andMore(noLength)
		}
		sr.Reasons = append(sr.Reasons, Reason{Code: CodeStoreyIncomplete, Message: "storey sums unknown: " + msg, Combination: sr.Combination})
		return
	}
	sr.Complete = true
	if s.SumN > 0 {
		s.FormA = s.SumNomsOverL / s.SumNOverL
		s.FormB = s.SumNomsNOverL / s.SumN2OverL
	} else {
		s.FormA, s.FormB = math.Inf(1), math.Inf(1)
		sr.Reasons = append(sr.Reasons, Reason{Code: CodeNotInCompression, Message: msgStoreyNoCompression, Combination: sr.Combination})
	}
	if row, ok := p.lookupDrift(drift, sr); ok {
		s.HasDrift = true
		s.Shear, s.Drift, s.Height = row.ShearN, row.DriftMM, row.HeightMM
		s.Vertical = s.SumN
		if finitePos(row.VerticalN) {
			s.Vertical = row.VerticalN
		}
		sr.Shear, sr.Drift, sr.Height, sr.Vertical = Num(s.Shear), Num(s.Drift), Num(s.Height), Num(s.Vertical)
	}
	lambda, form, fd := sc.Rules.StoreyLambda(&s)
	sr.FormA, sr.FormB = Num(s.FormA), Num(s.FormB)
	sr.LambdaC, sr.Form, sr.FormDrift = Num(lambda), form, Num(fd)
}

// geometry flags the columns of swaying storeys whose top is off the
// storey's typical column top.
func (p *StoreyProvider) geometry(memberGroup []int32, ng int) {
	ms := p.sc.Model.Members
	p.geom = make([]bool, len(ms))
	swaying := make([]bool, ng)
	for g := range ng {
		swaying[g] = p.sway[2*g] || p.sway[2*g+1]
	}
	// Members of each swaying group.
	start := make([]int32, ng+1)
	for _, g := range memberGroup {
		if g >= 0 && swaying[g] {
			start[g+1]++
		}
	}
	for k := 1; k <= ng; k++ {
		start[k] += start[k-1]
	}
	list := make([]int32, start[ng])
	fill := slices.Clone(start[:ng])
	for i, g := range memberGroup {
		if g >= 0 && swaying[g] {
			list[fill[g]] = int32(i)
			fill[g]++
		}
	}
	var tops, lens []float64
	for g := range ng {
		mem := list[start[g]:start[g+1]]
		if len(mem) < 2 {
			continue
		}
		tops, lens = tops[:0], lens[:0]
		for _, i := range mem {
			if t := columnTop(&ms[i]); known(t) {
				tops = append(tops, t)
			}
			if l := columnHeight(&ms[i]); finitePos(l) {
				lens = append(lens, l)
			}
		}
		if len(tops) < 2 || len(lens) == 0 {
			continue
		}
		refTop, h := median(tops), median(lens)
		for _, i := range mem {
			if t := columnTop(&ms[i]); known(t) && math.Abs(t-refTop) > storeyGeometryTolerance*h {
				p.geom[i] = true
			}
		}
	}
}

// columnTop is the elevation of a column's top (mm): TopZ, else BaseZ +
// length, else the storey elevation + length; NaN when unknown.
func columnTop(m *Member) float64 {
	switch {
	case m.TopZ.Known():
		return m.TopZ.F()
	case m.BaseZ.Known() && finitePos(m.Length):
		return m.BaseZ.F() + m.Length
	case m.StoreyElevation.Known() && finitePos(m.Length):
		return m.StoreyElevation.F() + m.Length
	}
	return math.NaN()
}

// columnHeight is TopZ − BaseZ when both are known, else the length.
func columnHeight(m *Member) float64 {
	if m.TopZ.Known() && m.BaseZ.Known() {
		return m.TopZ.F() - m.BaseZ.F()
	}
	return m.Length
}

func median(x []float64) float64 {
	slices.Sort(x)
	n := len(x)
	if n%2 == 1 {
		return x[n/2]
	}
	return (x[n/2-1] + x[n/2]) / 2
}

// Sway implements SwayProvider.
func (p *StoreyProvider) Sway(i int, a Axis, c int) SwayValue {
	ax := p.sc.Axis(i, a)
	if ax.Restraint == RestraintUnknown {
		return SwayValue{Role: RoleUnknown, Lambda: math.NaN()}
	}
	gd := p.gd[2*i+int(a)]
	if gd < 0 {
		if ax.Restraint == Sway {
			return SwayValue{Role: RoleSway, Lambda: ownLambda(ax.Nom, p.sc.NStar(i, c)), Method: "storey", Form: "member"}
		}
		return SwayValue{Role: RoleBraced, Lambda: math.NaN()}
	}
	if !p.sway[gd] {
		return SwayValue{Role: RoleBraced, Lambda: math.NaN()}
	}
	sr := &p.sc.Report.Storeys[int(p.base[gd])+c]
	v := SwayValue{Role: RoleSway, Lambda: sr.LambdaC.F(), Method: "storey", Form: sr.Form, Storey: sr}
	if ax.Restraint == Braced {
		v.Role = RoleLeaning
	}
	if !sr.Complete {
		v.Lambda = math.NaN()
		v.Code = CodeStoreyIncomplete
		v.Message = sr.Reasons[0].Message
	}
	return v
}

// MemberNotes implements SwayProvider.
func (p *StoreyProvider) MemberNotes(i int, dst []Reason) []Reason {
	if p.geom != nil && p.geom[i] {
		dst = append(dst, Reason{Code: CodeStoreyGeometry, Message: msgStoreyGeometry})
	}
	return dst
}

// memberLabel names a member in a message: its GlobalId, else its source
// reference, else its name.
func memberLabel(m *Member) string {
	switch {
	case m.GlobalID != "":
		return m.GlobalID
	case m.Ref != "":
		return m.Ref
	}
	return m.Name
}

func storeyLabel(m *Member) string {
	if m.Storey != "" {
		return m.Storey
	}
	return m.StoreyKey
}

func andMore(n int) string {
	if n <= 1 {
		return ""
	}
	return " (and " + itoa(n-1) + " more)"
}
