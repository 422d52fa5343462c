package frame

// Local element matrices of a 3D Euler–Bernoulli beam-column, 12 degrees of
// freedom in the member's local axes, ordered
//
//	u1 v1 w1 rx1 ry1 rz1  u2 v2 w2 rx2 ry2 rz2
//
// stored row-major in a [144]float64. The elastic stiffness is the standard
// matrix (e.g. McGuire, Gallagher & Ziemian, Matrix Structural Analysis, 2nd
// ed., §5.2). The geometric stiffness is the consistent matrix from the
// cubic Hermite shape functions, per unit axial compression: K_g = −P·G0,
// so that buckling solves K·φ = λ·(Σ P·G0)·φ.

type mat12 [144]float64

// sym sets m[i][j] and m[j][i].
func (m *mat12) sym(i, j int, v float64) {
	m[i*12+j] = v
	m[j*12+i] = v
}

// elasticLocal returns the elastic stiffness of an element of length l.
func elasticLocal(mb *Member, l float64) mat12 {
	var k mat12
	ea := mb.E * mb.A / l
	k.sym(0, 0, ea)
	k.sym(6, 6, ea)
	k.sym(0, 6, -ea)

	gj := mb.G * mb.J / l
	k.sym(3, 3, gj)
	k.sym(9, 9, gj)
	k.sym(3, 9, -gj)

	// Bending about z: v and rz.
	ei := mb.E * mb.Iz
	a, b, c, d := 12*ei/(l*l*l), 6*ei/(l*l), 4*ei/l, 2*ei/l
	k.sym(1, 1, a)
	k.sym(1, 5, b)
	k.sym(1, 7, -a)
	k.sym(1, 11, b)
	k.sym(5, 5, c)
	k.sym(5, 7, -b)
	k.sym(5, 11, d)
	k.sym(7, 7, a)
	k.sym(7, 11, -b)
	k.sym(11, 11, c)

	// Bending about y: w and ry (ry = −dw/dx, hence the signs).
	ei = mb.E * mb.Iy
	a, b, c, d = 12*ei/(l*l*l), 6*ei/(l*l), 4*ei/l, 2*ei/l
	k.sym(2, 2, a)
	k.sym(2, 4, -b)
	k.sym(2, 8, -a)
	k.sym(2, 10, -b)
	k.sym(4, 4, c)
	k.sym(4, 8, b)
	k.sym(4, 10, d)
	k.sym(8, 8, a)
	k.sym(8, 10, b)
	k.sym(10, 10, c)
	return k
}

// geometricLocal returns G0, the geometric stiffness per unit compression of
// an element of length l. With torsion, the Wagner term (Iy+Iz)/A (the
// polar radius of gyration squared about the centroid, taken as the shear
// centre) couples the twists.
func geometricLocal(mb *Member, l float64, torsion bool) mat12 {
	var g mat12
	a, b, c, d := 6/(5*l), 0.1, 2*l/15, l/30

	// v and rz.
	g.sym(1, 1, a)
	g.sym(1, 5, b)
	g.sym(1, 7, -a)
	g.sym(1, 11, b)
	g.sym(5, 5, c)
	g.sym(5, 7, -b)
	g.sym(5, 11, -d)
	g.sym(7, 7, a)
	g.sym(7, 11, -b)
	g.sym(11, 11, c)

	// w and ry.
	g.sym(2, 2, a)
	g.sym(2, 4, -b)
	g.sym(2, 8, -a)
	g.sym(2, 10, -b)
	g.sym(4, 4, c)
	g.sym(4, 8, b)
	g.sym(4, 10, -d)
	g.sym(8, 8, a)
	g.sym(8, 10, b)
	g.sym(10, 10, c)

	if torsion {
		t := (mb.Iy + mb.Iz) / (mb.A * l)
		g.sym(3, 3, t)
		g.sym(9, 9, t)
		g.sym(3, 9, -t)
	}
	return g
}
