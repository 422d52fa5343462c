package framebuckling

import (
	"math"

	"swaygate/checks"
	"swaygate/checks/frame"
)

// drivers is the number of members listed as driving each mode.
const drivers = 5

// Report returns the report's frame section: per combination lambda_c, the
// normalised nodal translations of its lowest mode, the members and storeys
// that drive it; the frame's size, notes and limitations. Tie links are
// left out of the members.
func (a *Analysis) Report(m *checks.Model) *checks.FrameResult {
	fm := a.Model
	fr := &checks.FrameResult{Name: a.In.Name, Nodes: len(fm.Nodes)}
	if fm.Plane != nil {
		fr.Plane = true
		fr.PlaneNormal = planeNormal(fm.Plane)
	}
	fr.Members = make([]checks.FrameMember, a.members)
	for j := 0; j < a.members; j++ {
		mb := &fm.Members[j]
		fr.Members[j] = checks.FrameMember{ID: mb.ID, Start: mb.Nodes[0], End: mb.Nodes[1]}
	}
	fr.Notes = append(fr.Notes, a.Notes...)
	res := a.Result
	if res == nil {
		for _, name := range a.Combinations {
			fr.Combinations = append(fr.Combinations, checks.FrameCombination{Name: name, LambdaC: checks.Null, LambdaX: checks.Null, LambdaY: checks.Null, Status: "not-analysed"})
		}
		return fr
	}
	fr.Elements, fr.DOF = res.Stats.Elements, res.Stats.DOF
	fr.Notes = append(fr.Notes, res.Notes...)
	fr.Limitations = append(fr.Limitations, res.Limitations...)
	if res.Governing >= 0 {
		fr.Governing = a.Combinations[res.Governing]
	}
	for c := range res.Combinations {
		b := &res.Combinations[c]
		fc := checks.FrameCombination{Name: a.Combinations[c], LambdaC: checks.Num(b.Lambda), Status: b.Status.String(),
			LambdaX: checks.Num(a.swayLambda(c, checks.DirX)), LambdaY: checks.Num(a.swayLambda(c, checks.DirY))}
		if len(b.Modes) > 0 {
			md := &b.Modes[0]
			fc.Mode = make([]checks.ModeNode, len(fm.Nodes))
			for n := range fm.Nodes {
				p, u := fm.Nodes[n].Pos, md.Nodes[n]
				fc.Mode[n] = checks.ModeNode{Node: fm.Nodes[n].ID, X: p[0], Y: p[1], Z: p[2], UX: clean(u[0]), UY: clean(u[1]), UZ: clean(u[2])}
			}
			for _, j := range md.TopMembers(drivers + 8) {
				if j >= a.members || len(fc.Drivers) == drivers {
					continue
				}
				if md.Share[j] <= 0 {
					break
				}
				fc.Drivers = append(fc.Drivers, checks.ModeShare{Member: fm.Members[j].ID, Share: md.Share[j]})
			}
			for _, s := range frame.Storeys(fm, md, 1) {
				fc.Storeys = append(fc.Storeys, checks.ModeStorey{BottomZ: s.Bottom, TopZ: s.Top, Share: s.Share, Drift: s.Drift})
			}
			fc.Interior = make([][][3]float64, a.members)
			for j := 0; j < a.members && j < len(md.Interior); j++ {
				for _, v := range md.Interior[j] {
					fc.Interior[j] = append(fc.Interior[j], [3]float64{clean(v[0]), clean(v[1]), clean(v[2])})
				}
			}
		}
		fr.Combinations = append(fr.Combinations, fc)
	}
	return fr
}

// clean rounds translations below 1e-9 of the largest (1) to zero, so
// that numerical noise does not show as movement.
func clean(x float64) float64 {
	if math.Abs(x) < 1e-9 {
		return 0
	}
	return x
}

// planeNormal returns the unit normal of a plane model's plane.
func planeNormal(pl *frame.Axes) [3]float64 {
	z := vec(pl.Z)
	if u, ok := z.unit(); ok {
		return u
	}
	return vec{0, 0, 1}
}
