package ifcgen

import "math"

type node struct{ vertex, conn int }

var combos = [2]string{"ULS-gravity", "ULS-wind-X"}

func (g *gen) structural() {
	s := g.s
	S := g.opt.Storeys
	shared := s.begin("IFCLOCALPLACEMENT")
	s.unset().ref(g.world).end()
	fixed := s.begin("IFCBOUNDARYNODECONDITION")
	s.str("Fixed base")
	for range 6 {
		s.typedBool("IFCBOOLEAN", true)
	}
	s.end()
	pinned := s.begin("IFCBOUNDARYNODECONDITION")
	s.str("Pinned base")
	for k := range 6 {
		s.typedBool("IFCBOOLEAN", k < 3)
	}
	s.end()

	g.nodes = make([]map[int]int, S+1)
	nodeIDs := make([][]node, S+1)
	for l := range nodeIDs {
		nodeIDs[l] = make([]node, g.nx*g.ny)
	}
	var groupMembers []int
	getNode := func(c *colRec, level int) node {
		nd := nodeIDs[level][c.pos]
		if nd.vertex != 0 {
			return nd
		}
		pt := s.begin("IFCCARTESIANPOINT")
		s.reals(c.x, c.y, g.elev[level]).end()
		nd.vertex = s.begin("IFCVERTEXPOINT")
		s.ref(pt).end()
		topo := s.begin("IFCTOPOLOGYREPRESENTATION")
		s.ref(g.ctx).str("Reference").str("Vertex").refs(nd.vertex).end()
		pds := s.begin("IFCPRODUCTDEFINITIONSHAPE")
		s.unset().unset().refs(topo).end()
		nd.conn = s.begin("IFCSTRUCTURALPOINTCONNECTION")
		s.str(g.newGID()).unset().str("N" + gridName(c.pos%g.nx, c.pos/g.nx) + "-" + itoa(level)).unset().unset().ref(shared).ref(pds)
		switch {
		case level > 0:
			s.unset()
		case c.frameX || c.frameY:
			s.ref(fixed)
		default:
			s.ref(pinned)
		}
		s.unset().end()
		nodeIDs[level][c.pos] = nd
		groupMembers = append(groupMembers, nd.conn)
		return nd
	}

	members := make([]int, len(g.cols))
	for i := range g.cols {
		c := &g.cols[i]
		n0, n1 := getNode(c, c.storey), getNode(c, c.storey+1)
		edge := s.begin("IFCEDGE")
		s.ref(n0.vertex).ref(n1.vertex).end()
		topo := s.begin("IFCTOPOLOGYREPRESENTATION")
		s.ref(g.ctx).str("Reference").str("Edge").refs(edge).end()
		pds := s.begin("IFCPRODUCTDEFINITIONSHAPE")
		s.unset().unset().refs(topo).end()
		axis := g.yDir // member local z = the profile's y (depth) direction
		if c.rotated {
			axis = g.negX
		}
		m := s.begin("IFCSTRUCTURALCURVEMEMBER")
		s.str(g.newGID()).unset().str("M-" + gridName(c.pos%g.nx, c.pos/g.nx) + "-" + itoa(c.storey)).unset().unset().ref(shared).ref(pds).enum("RIGID_JOINED_MEMBER").ref(axis).end()
		for _, nd := range [2]node{n0, n1} {
			s.begin("IFCRELCONNECTSSTRUCTURALMEMBER")
			s.str(g.newGID()).unset().unset().unset().ref(m).ref(nd.conn).unset().unset().unset().unset().end()
		}
		s.begin("IFCRELASSIGNSTOPRODUCT")
		s.str(g.newGID()).unset().str("Context").unset().refs(m).unset().ref(c.id).end()
		members[i] = m
		groupMembers = append(groupMembers, m)
	}

	var loadGroups, resultGroups [2]int
	for k, name := range combos {
		loadGroups[k] = s.begin("IFCSTRUCTURALLOADGROUP")
		s.str(g.newGID()).unset().str(name).unset().unset().enum("LOAD_COMBINATION").enum("NOTDEFINED").enum("NOTDEFINED").real(1).str("ULS").end()
		resultGroups[k] = s.begin("IFCSTRUCTURALRESULTGROUP")
		s.str(g.newGID()).unset().str("Results " + name).unset().unset().enum("FIRST_ORDER_THEORY").ref(loadGroups[k]).boolean(true).end()
	}
	model := s.begin("IFCSTRUCTURALANALYSISMODEL")
	s.str(g.newGID()).unset().str("Office frame").unset().unset().enum("LOADING_3D").unset().refs(loadGroups[:]...).refs(resultGroups[:]...).ref(shared).end()
	s.begin("IFCRELASSIGNSTOGROUP")
	s.str(g.newGID()).unset().unset().unset().refs(groupMembers...).unset().ref(model).end()

	// Storey sums for the wind combination.
	sumN := make([]float64, S)
	nFrameX := make([]int, S)
	for i := range g.cols {
		c := &g.cols[i]
		sumN[c.storey] += c.nGrav
		if c.frameX {
			nFrameX[c.storey]++
		}
	}
	reactions := make([]int, len(g.cols))
	for k := range combos {
		for i := range g.cols {
			c := &g.cols[i]
			n, maj0, maj1, min0, min1 := g.actions(c, k, sumN[c.storey], nFrameX[c.storey])
			reactions[i] = g.endForces(members[i], c.h, n, maj0, maj1, min0, min1)
		}
		s.begin("IFCRELASSIGNSTOGROUP")
		s.str(g.newGID()).unset().unset().unset().refs(reactions...).unset().ref(resultGroups[k]).end()
	}
}

// actions returns the design actions of a column for combination k: axial
// compression n (N) and internal end moments (N·mm) about the major and minor
// axes at the start (bottom) and end (top).
func (g *gen) actions(c *colRec, k int, sumN float64, nFrameX int) (n, maj0, maj1, min0, min1 float64) {
	m0 := c.m0
	if c.frameX || c.frameY {
		m0 *= 1.5
	}
	n = c.nGrav
	maj0, maj1 = -0.5*m0*c.vary[0], m0*c.vary[1]
	min0, min1 = 0, 0.3*m0*c.vary[2]
	if k == 0 {
		return n, maj0, maj1, min0, min1
	}
	n, maj0, maj1, min0, min1 = 0.8*n, 0.8*maj0, 0.8*maj1, 0.8*min0, 0.8*min1
	if c.frameX && nFrameX > 0 {
		gx := c.pos % g.nx
		if g.nx > 1 {
			n += 0.1 * c.nGrav * (2*float64(gx)/float64(g.nx-1) - 1)
		}
		v := 0.025 * sumN / float64(nFrameX) * c.vary[3]
		m := v * c.h / 2
		// The axis that sways in X: major for rotated columns, else minor.
		if c.rotated {
			maj0 -= m
			maj1 += m
		} else {
			min0 -= m
			min1 += m
		}
	}
	return n, maj0, maj1, min0, min1
}

// endForces writes one member's end forces for one combination and returns
// the reaction's id. End forces are the actions on the member at its ends: at
// the start minus the section force, at the end the section force (section
// forces: tension positive, dMy/dx = Vz, dMz/dx = -Vy). Units N and N·mm.
func (g *gen) endForces(member int, length, n, maj0, maj1, min0, min1 float64) int {
	s := g.s
	vz := (maj1 - maj0) / length
	vy := -(min1 - min0) / length
	N := -n // section force, tension positive
	r := func(v float64) float64 { return math.Round(v*1000) / 1000 }
	head := s.begin("IFCSTRUCTURALLOADSINGLEFORCE")
	s.str("Head").real(r(-N)).real(r(-vy)).real(r(-vz)).real(0).real(r(-maj0)).real(r(-min0)).end()
	tail := s.begin("IFCSTRUCTURALLOADSINGLEFORCE")
	s.str("Tail").real(r(N)).real(r(vy)).real(r(vz)).real(0).real(r(maj1)).real(r(min1)).end()
	cfg := s.begin("IFCSTRUCTURALLOADCONFIGURATION")
	s.str("Member end forces").refs(head, tail).open().reals(0).reals(length).close().end()
	re := s.begin("IFCSTRUCTURALCURVEREACTION")
	s.str(g.newGID()).unset().unset().unset().unset().unset().unset().ref(cfg).enum("LOCAL_COORDS").enum("DISCRETE").end()
	s.begin("IFCRELCONNECTSSTRUCTURALACTIVITY")
	s.str(g.newGID()).unset().unset().unset().ref(member).ref(re).end()
	return re
}

func itoa(n int) string {
	var b [20]byte
	i := len(b)
	if n == 0 {
		return "0"
	}
	for n > 0 {
		i--
		b[i] = byte('0' + n%10)
		n /= 10
	}
	return string(b[i:])
}
