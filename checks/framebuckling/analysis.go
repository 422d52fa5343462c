package framebuckling

import (
	"errors"
	"math"
	"sort"
	"strconv"

	"swaygate/checks"
	"swaygate/checks/frame"
)

// Input is the analytical frame as a reader found it.
type Input struct {
	// Name names the analysis model in the report.
	Name string
	// Model holds the nodes and members (mm, N, MPa); its Combinations are
	// ignored.
	Model *frame.Model
	// Axial holds per combination name the axial compression of each member
	// of Model from the model's results (N, compression positive); NaN where
	// there is none.
	Axial map[string][]float64
	// Columns maps each member of the checks.Model to the indices of the
	// frame members that idealise it, bottom first (nil: not in the frame).
	Columns [][]int
	// Planes are node groups that a surface member ties rigidly in its
	// plane.
	Planes [][]int
	// Notes are the reader's assumptions, carried to the report.
	Notes []string
}

// Options control the analysis.
type Options struct {
	Frame frame.Options
	// Diaphragms ties the nodes of each level (the same elevation, at least
	// three not in line) in the horizontal plane: rigid floor diaphragms.
	Diaphragms bool
}

// Analysis is the buckling analysis of a model's analytical frame.
type Analysis struct {
	In *Input
	// Model is the analysed model: Input's, with the tie links appended and
	// the combinations filled.
	Model *frame.Model
	// Combinations are the engine's combination names, in the order of
	// Model.Combinations.
	Combinations []string
	// Result is the analysis (nil when Err is set).
	Result *frame.Result
	// Err says why the analysis failed (a mechanism, an invalid model); the
	// frame method then falls back to the storey method for every member.
	Err error
	// Notes record what the analysis assumed.
	Notes []string

	members int // members of In.Model (the rest are ties)
	// dirLambda and dirMode: per combination, lambda_c and the mode index of
	// the lowest sway mode in X [0] and Y [1].
	dirLambda [][2]float64
	dirMode   [][2]int
	column    []int // per frame member of In.Model: the checked member it idealises, -1 for none
}

// Analyze builds the frame's combinations from the members' actions of m
// (the combinations the engine will check, in its order) and the reader's
// axial forces, and runs the buckling analysis. It never fails: Err tells
// why there is no Result.
func Analyze(m *checks.Model, in *Input, opt Options) *Analysis {
	a := &Analysis{In: in, members: len(in.Model.Members)}
	a.Notes = append(a.Notes, in.Notes...)
	a.Combinations = combinations(m)
	a.column = make([]int, a.members)
	for j := range a.column {
		a.column[j] = -1
	}
	for i, list := range in.Columns {
		for _, j := range list {
			if j >= 0 && j < a.members && a.column[j] < 0 {
				a.column[j] = i
			}
		}
	}
	fm := &frame.Model{Plane: in.Model.Plane}
	fm.Nodes = in.Model.Nodes
	fm.Members = append(fm.Members, in.Model.Members...)
	a.Model = fm

	var groups [][]int
	if fm.Plane == nil {
		groups = append(groups, in.Planes...)
		if opt.Diaphragms {
			lv := levels(fm)
			if len(lv) > 0 {
				a.Notes = append(a.Notes, "floors are taken as rigid diaphragms: the nodes of each of the "+itoa(len(lv))+
					" levels with three or more nodes not in line are tied in the horizontal plane (the storey method assumes the same)")
			}
			groups = append(groups, lv...)
		}
	}
	if n := a.tie(groups); n > 0 {
		a.Notes = append(a.Notes, itoa(n)+" stiff pin-ended links tie the nodes of rigid planes (diaphragms, walls, slabs); they carry no axial force")
	}

	var missing []int
	for c, name := range a.Combinations {
		comp := make([]float64, len(fm.Members))
		ax := in.Axial[name]
		nm := 0
		for j := 0; j < a.members; j++ {
			n, ok := a.axial(m, j, c, name, ax)
			if !ok {
				nm++
			}
			comp[j] = n
		}
		missing = append(missing, nm)
		fm.Combinations = append(fm.Combinations, frame.Combination{Name: name, Compression: comp})
	}
	for c, nm := range missing {
		if nm > 0 {
			a.Notes = append(a.Notes, itoa(nm)+" of the frame's "+itoa(a.members)+" members have no axial force for "+
				strconv.Quote(a.Combinations[c])+" (no result, not a checked column): taken as 0")
		}
	}
	if len(a.Combinations) == 0 {
		a.Notes = append(a.Notes, "no combinations: the frame is not analysed")
		return a
	}
	fo := opt.Frame
	if fo.Modes == 0 {
		fo.Modes = swayModes
	}
	for {
		res, err := frame.Analyze(fm, fo)
		if err != nil {
			a.Err = err
			a.Notes = append(a.Notes, "the buckling analysis failed: "+err.Error())
			return a
		}
		a.Result = res
		if a.swayLambdas(fo.Modes, fo.Modes >= moreModes || opt.Frame.Modes != 0) == 0 {
			return a
		}
		fo.Modes = moreModes
	}
}

// swayModes is the number of modes computed per combination, among which
// the lowest sway mode of each direction is found; moreModes the number
// computed again when some direction has no sway mode among them.
const (
	swayModes = 6
	moreModes = 24
)

// swayShare is the least nodal translation (of a mode normalised to a
// largest translation of 1) in a direction for the mode to sway in it.
const swayShare = 0.1

// swayLambdas finds, per combination and global direction (X, Y), the
// lowest mode in which the nodes translate in that direction (by at least
// swayShare): the sway mode that lambda_c of the axes swaying that way
// takes. A lower mode without such sway buckles members between their
// nodes (their own braced checks find it). Where no computed mode sways in a
// direction, the lowest mode is taken (conservative).
//
// It returns the number of combination-directions without a sway mode, and
// records its notes only when final.
func (a *Analysis) swayLambdas(modes int, final bool) int {
	res := a.Result
	a.dirLambda = make([][2]float64, len(res.Combinations))
	a.dirMode = make([][2]int, len(res.Combinations))
	var fallback int
	for c := range res.Combinations {
		b := &res.Combinations[c]
		for d := 0; d < 2; d++ {
			a.dirLambda[c][d], a.dirMode[c][d] = b.Lambda, 0
			if len(b.Modes) == 0 {
				continue
			}
			found := false
			for k := range b.Modes {
				md := &b.Modes[k]
				top := 0.0
				for n := range md.Nodes {
					top = math.Max(top, math.Abs(md.Nodes[n][d]))
				}
				if top >= swayShare {
					a.dirLambda[c][d], a.dirMode[c][d] = md.Lambda, k
					found = true
					break
				}
			}
			if !found {
				fallback++
			}
		}
	}
	if !final && fallback > 0 {
		return fallback
	}
	a.Notes = append(a.Notes, "lambda_c of an axis swaying in X (Y) is the lowest buckling load factor among the "+itoa(modes)+
		" lowest modes whose nodes translate in X (Y) by at least "+ftoa(swayShare, 2)+" of the mode's largest translation: a lower mode "+
		"without sway buckles members between their nodes, which their own braced checks find")
	if fallback > 0 {
		a.Notes = append(a.Notes, itoa(fallback)+" combination-direction(s) have no sway mode among the modes computed: the lowest mode is taken")
	}
	return 0
}

// axial returns the compression of frame member j under combination c: the
// checked column's design compression when its actions do not come from
// the model's results (a side-car, a property set), else the member's own
// result, else the column's compression; ok false when none is known (0).
func (a *Analysis) axial(m *checks.Model, j, c int, name string, ax []float64) (float64, bool) {
	var act *checks.Actions
	if i := a.column[j]; i >= 0 && i < len(m.Members) {
		act = actionsFor(&m.Members[i], name)
	}
	if act != nil && act.Source != "ifc-results" {
		return act.NStar, true
	}
	if j < len(ax) && !math.IsNaN(ax[j]) && !math.IsInf(ax[j], 0) {
		return ax[j], true
	}
	if act != nil {
		return act.NStar, true
	}
	return 0, false
}

// actionsFor returns the member's first finite actions for a combination.
func actionsFor(mem *checks.Member, name string) *checks.Actions {
	for k := range mem.Actions {
		a := &mem.Actions[k]
		if a.Combination == name && !math.IsNaN(a.NStar) && !math.IsInf(a.NStar, 0) {
			return a
		}
	}
	return nil
}

// combinations returns the combinations the engine checks: the model's list,
// else the union of the members' action names in order of appearance.
func combinations(m *checks.Model) []string {
	if len(m.Combinations) > 0 {
		return m.Combinations
	}
	var names []string
	seen := map[string]bool{}
	for i := range m.Members {
		for k := range m.Members[i].Actions {
			c := m.Members[i].Actions[k].Combination
			if !seen[c] {
				seen[c] = true
				names = append(names, c)
			}
		}
	}
	return names
}

// levels groups the nodes by elevation: the levels with three or more
// nodes not in line.
func levels(m *frame.Model) [][]int {
	if len(m.Nodes) == 0 {
		return nil
	}
	tol := 1.0
	idx := make([]int, len(m.Nodes))
	for i := range idx {
		idx[i] = i
	}
	sort.SliceStable(idx, func(a, b int) bool { return m.Nodes[idx[a]].Pos[2] < m.Nodes[idx[b]].Pos[2] })
	var out [][]int
	for s := 0; s < len(idx); {
		e := s + 1
		for e < len(idx) && m.Nodes[idx[e]].Pos[2]-m.Nodes[idx[s]].Pos[2] <= tol {
			e++
		}
		g := append([]int(nil), idx[s:e]...)
		if len(g) >= 3 {
			if _, _, _, ok := anchors(m, g); ok {
				out = append(out, g)
			}
		}
		s = e
	}
	return out
}

// anchors returns three nodes of g not in line: the first, the farthest
// from it, and the farthest from the line through both.
func anchors(m *frame.Model, g []int) (int, int, int, bool) {
	pos := func(n int) vec { return vec(m.Nodes[n].Pos) }
	a := g[0]
	b, bd := -1, 0.0
	for _, n := range g[1:] {
		if d := pos(n).sub(pos(a)).norm(); d > bd {
			b, bd = n, d
		}
	}
	if b < 0 || bd < 1 {
		return 0, 0, 0, false
	}
	u := pos(b).sub(pos(a))
	c, cd := -1, 0.0
	for _, n := range g {
		if d := u.cross(pos(n).sub(pos(a))).norm() / bd; d > cd {
			c, cd = n, d
		}
	}
	if c < 0 || cd < 1 {
		return 0, 0, 0, false
	}
	return a, b, c, true
}

// tie appends stiff pin-ended links that make each node group rigid in its
// plane: the three anchors of the group tied to each other and every other
// node tied to the three anchors. It returns the number of links.
func (a *Analysis) tie(groups [][]int) int {
	m := a.Model
	if len(groups) == 0 {
		return 0
	}
	// Stiffness: 1000 times the largest axial stiffness EA/L of a member.
	kmax, imax := 0.0, 0.0
	for i := 0; i < a.members; i++ {
		mb := &m.Members[i]
		l := vec(m.Nodes[mb.Nodes[1]].Pos).sub(vec(m.Nodes[mb.Nodes[0]].Pos)).norm()
		if l > 0 {
			kmax = math.Max(kmax, mb.E*mb.A/l)
		}
		imax = math.Max(imax, math.Max(mb.Iy, mb.Iz))
	}
	if !(kmax > 0) {
		return 0
	}
	const e = 200e3
	small := 1e-6 * imax
	n := 0
	type pair struct{ p, q int }
	seen := map[pair]bool{}
	link := func(p, q int) {
		if p == q {
			return
		}
		if p > q {
			p, q = q, p
		}
		if seen[pair{p, q}] {
			return
		}
		seen[pair{p, q}] = true
		l := vec(m.Nodes[q].Pos).sub(vec(m.Nodes[p].Pos)).norm()
		if !(l > 1) {
			return
		}
		mb := frame.Member{ID: "tie " + m.Nodes[p].ID + "–" + m.Nodes[q].ID, Nodes: [2]int{p, q},
			E: e, G: e / 2.6, A: 1e3 * kmax * l / e, Iy: small, Iz: small, J: small, Elements: 1}
		m.Members = append(m.Members, mb)
		n++
	}
	for _, g := range groups {
		x, y, z, ok := anchors(m, g)
		if !ok {
			continue
		}
		link(x, y)
		link(y, z)
		link(x, z)
		for _, k := range g {
			link(k, x)
			link(k, y)
			link(k, z)
		}
	}
	return n
}

// lambda returns the frame's lowest buckling load factor of combination c:
// +Inf when it does not buckle, NaN when there is no result.
func (a *Analysis) lambda(c int) float64 {
	if a.Result == nil || c < 0 || c >= len(a.Result.Combinations) {
		return math.NaN()
	}
	return a.Result.Combinations[c].Lambda
}

// swayLambda returns lambda_c of combination c for axes swaying in
// direction d (the lowest sway mode in d).
func (a *Analysis) swayLambda(c int, d checks.Direction) float64 {
	if a.Result == nil || c < 0 || c >= len(a.dirLambda) {
		return math.NaN()
	}
	if d == checks.DirY {
		return a.dirLambda[c][1]
	}
	return a.dirLambda[c][0]
}

// Covered reports whether checked member i is idealised in an analysed
// frame.
func (a *Analysis) Covered(i int) bool {
	return a.Result != nil && i < len(a.In.Columns) && len(a.In.Columns[i]) > 0
}

type vec [3]float64

func (p vec) sub(q vec) vec       { return vec{p[0] - q[0], p[1] - q[1], p[2] - q[2]} }
func (p vec) add(q vec) vec       { return vec{p[0] + q[0], p[1] + q[1], p[2] + q[2]} }
func (p vec) scale(k float64) vec { return vec{p[0] * k, p[1] * k, p[2] * k} }
func (p vec) dot(q vec) float64   { return p[0]*q[0] + p[1]*q[1] + p[2]*q[2] }
func (p vec) norm() float64       { return math.Sqrt(p.dot(p)) }
func (p vec) cross(q vec) vec {
	return vec{p[1]*q[2] - p[2]*q[1], p[2]*q[0] - p[0]*q[2], p[0]*q[1] - p[1]*q[0]}
}
func (p vec) unit() (vec, bool) {
	n := p.norm()
	if !(n > 1e-12) || math.IsInf(n, 0) {
		return vec{}, false
	}
	return p.scale(1 / n), true
}

func itoa(n int) string { return strconv.Itoa(n) }

func ftoa(x float64, digits int) string { return strconv.FormatFloat(x, 'g', digits, 64) }

// Unavailable returns the analysis of a model without an analytical frame:
// the frame method then takes the storey method for every member
// (frame-fallback), and why is reported.
func Unavailable(m *checks.Model, why string) *Analysis {
	in := &Input{Name: "no analytical frame", Model: &frame.Model{}}
	return &Analysis{In: in, Model: in.Model, Combinations: combinations(m), Err: errors.New(why),
		Notes: []string{why + ": every member takes the storey method"}}
}
