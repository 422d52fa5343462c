package frame

import (
	"math"
	"sort"
)

// Storey is the part of a buckling mode between two consecutive levels: the
// distinct elevations (global Z) of the ends of members that rise.
type Storey struct {
	Bottom, Top float64 // elevations, mm
	// Share is the part of the mode's second-order work in the storey: the
	// Share of every rising member spanning it, split by height.
	Share float64
	// Drift is the largest inter-storey drift ratio of the mode in the
	// storey: the horizontal translation of a rising member's top relative
	// to its bottom, divided by its height (mode units per mm).
	Drift float64
	// Members are the rising members spanning the storey.
	Members []int
}

// Storeys splits mode md of model m into storeys, bottom first, to show
// which storey governs (the largest Share). Levels closer than tol (mm)
// are merged; members rising less than tol are horizontal and not counted.
func Storeys(m *Model, md *Mode, tol float64) []Storey {
	var levels []float64
	for i := range m.Members {
		za, zb := m.Nodes[m.Members[i].Nodes[0]].Pos[2], m.Nodes[m.Members[i].Nodes[1]].Pos[2]
		if math.Abs(zb-za) > tol {
			levels = append(levels, za, zb)
		}
	}
	sort.Float64s(levels)
	k := 0
	for _, z := range levels {
		if k == 0 || z-levels[k-1] > tol {
			levels[k] = z
			k++
		}
	}
	levels = levels[:k]
	if len(levels) < 2 {
		return nil
	}
	st := make([]Storey, len(levels)-1)
	for i := range st {
		st[i].Bottom, st[i].Top = levels[i], levels[i+1]
	}
	for i := range m.Members {
		a, b := m.Members[i].Nodes[0], m.Members[i].Nodes[1]
		za, zb := m.Nodes[a].Pos[2], m.Nodes[b].Pos[2]
		if math.Abs(zb-za) <= tol {
			continue
		}
		lo, hi := a, b
		if za > zb {
			lo, hi = b, a
			za, zb = zb, za
		}
		var drift float64
		if md != nil && len(md.Nodes) == len(m.Nodes) {
			du := md.Nodes[hi].sub(md.Nodes[lo])
			drift = math.Hypot(du[0], du[1]) / (zb - za)
		}
		var share float64
		if md != nil && len(md.Share) == len(m.Members) {
			share = md.Share[i]
		}
		for s := range st {
			over := math.Min(zb, st[s].Top) - math.Max(za, st[s].Bottom)
			if over <= tol {
				continue
			}
			st[s].Share += share * over / (zb - za)
			st[s].Drift = math.Max(st[s].Drift, drift)
			st[s].Members = append(st[s].Members, i)
		}
	}
	return st
}

// TopMembers returns the indices of the n members with the largest Share
// in the mode, largest first.
func (md *Mode) TopMembers(n int) []int {
	idx := make([]int, len(md.Share))
	for i := range idx {
		idx[i] = i
	}
	sort.SliceStable(idx, func(a, b int) bool { return md.Share[idx[a]] > md.Share[idx[b]] })
	if n < len(idx) {
		idx = idx[:n]
	}
	return idx
}
