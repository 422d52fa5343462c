package frame

import (
	"testing"
)

// building generates a regular 3D moment frame of the given storeys and
// bays in each plan direction (invented benchmark data): 3.6 m storeys,
// 6 m bays, fixed bases, a column section of about 310UC137 and beams of
// about 460UB67 (approximate handbook properties, for sizing only), and one
// combination of uniform gravity: each column carries 250 kN per floor
// above it. Beams carry no axial force, so they stay single elements.
func building(storeys, bays int) *Model {
	const (
		h, b = 3600.0, 6000.0
		e, g = 200000.0, 80000.0
		load = 250e3
	)
	nx := bays + 1
	m := &Model{}
	id := func(k, i, j int) int { return k*nx*nx + i*nx + j }
	for k := 0; k <= storeys; k++ {
		for i := 0; i < nx; i++ {
			for j := 0; j < nx; j++ {
				nd := Node{Pos: Vec3{float64(i) * b, float64(j) * b, float64(k) * h}}
				if k == 0 {
					nd.Support = &Support{Fixed: [6]bool{true, true, true, true, true, true}}
				}
				m.Nodes = append(m.Nodes, nd)
			}
		}
	}
	var comp []float64
	column := Member{E: e, G: g, A: 17500, Iy: 329e6, Iz: 107e6, J: 2.6e6}
	beam := Member{E: e, G: g, A: 8540, Iy: 296e6, Iz: 8.9e6, J: 0.5e6}
	for k := 1; k <= storeys; k++ {
		for i := 0; i < nx; i++ {
			for j := 0; j < nx; j++ {
				c := column
				c.Nodes = [2]int{id(k-1, i, j), id(k, i, j)}
				m.Members = append(m.Members, c)
				comp = append(comp, load*float64(storeys-k+1))
				if i+1 < nx {
					bm := beam
					bm.Nodes = [2]int{id(k, i, j), id(k, i+1, j)}
					m.Members = append(m.Members, bm)
					comp = append(comp, 0)
				}
				if j+1 < nx {
					bm := beam
					bm.Nodes = [2]int{id(k, i, j), id(k, i, j+1)}
					m.Members = append(m.Members, bm)
					comp = append(comp, 0)
				}
			}
		}
	}
	m.Combinations = []Combination{{Name: "gravity", Compression: comp}}
	return m
}

// BenchmarkBuilding measures assembly, ordering, factorisation and the
// lowest buckling mode (Options.Modes = 1) of the 20-storey, 10 × 10 bay
// frame: 2,541 nodes (2,420 free), 7,040 members; columns divided into 4
// elements (the default), beams one element each.
func BenchmarkBuilding(b *testing.B) {
	m := building(20, 10)
	b.ReportAllocs()
	var r *Result
	for b.Loop() {
		var err error
		r, err = Analyze(m, Options{Modes: 1})
		if err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(r.Lambda, "lambda")
	b.ReportMetric(float64(r.Stats.DOF), "dof")
	b.ReportMetric(float64(r.Combinations[0].Steps), "steps")
	b.Logf("%+v", r.Stats)
}
