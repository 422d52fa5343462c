package frame_test

import (
	"fmt"
	"math"

	"swaygate/checks/frame"
)

// A portal frame in the X–Z plane with fixed bases, columns and beam of the
// same section and the span equal to the height (R = 1), each column
// carrying 500 kN: the sway mode governs with K = 1.1565 (Timoshenko &
// Gere; standards-notes §5): λ = 7.3792·EI/(h²·P) = 18.448.
func ExampleAnalyze() {
	// source: standards-notes §5 [D]: portal with R = 1, fixed bases, Pcr = 7.3792·EI/h², K = 1.1565.
	const h, i = 4000.0, 1e8 // mm, mm⁴
	fixed := &frame.Support{Fixed: [6]bool{true, true, true, true, true, true}}
	member := func(id string, a, b int) frame.Member {
		return frame.Member{ID: id, Nodes: [2]int{a, b}, E: 200000, A: 1e7, Iy: i}
	}
	m := &frame.Model{
		Plane: &frame.Axes{Z: frame.Vec3{0, -1, 0}, X: frame.Vec3{1, 0, 0}},
		Nodes: []frame.Node{
			{ID: "A", Pos: frame.Vec3{0, 0, 0}, Support: fixed},
			{ID: "B", Pos: frame.Vec3{0, 0, h}},
			{ID: "C", Pos: frame.Vec3{h, 0, h}},
			{ID: "D", Pos: frame.Vec3{h, 0, 0}, Support: fixed},
		},
		Members: []frame.Member{member("left", 0, 1), member("beam", 1, 2), member("right", 3, 2)},
		Combinations: []frame.Combination{
			{Name: "1.2G+1.5Q", Compression: []float64{500e3, 0, 500e3}},
		},
	}
	r, err := frame.Analyze(m, frame.Options{Elements: 8})
	if err != nil {
		fmt.Println(err)
		return
	}
	b := r.Combinations[0]
	md := b.Modes[0]
	fmt.Printf("lambda_c = %.3f (%s)\n", b.Lambda, b.Status)
	fmt.Printf("ke of the left column = %.4f\n", b.Ke[0][0])
	fmt.Printf("sway of B = %.3f, shares of the mode: %.2f\n", md.Nodes[1][0], md.Share)
	fmt.Println("ke of the beam known:", !math.IsNaN(b.Ke[1][0]))
	// Output:
	// lambda_c = 18.448 (buckles)
	// ke of the left column = 1.1565
	// sway of B = 1.000, shares of the mode: [0.50 0.00 0.50]
	// ke of the beam known: false
}
