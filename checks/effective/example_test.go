package effective_test

import (
	"fmt"

	"swaygate/checks/effective"
)

// A sway column on a pinned footing, in AS 4100 practice. Its top joint
// joins the column above and two beams: one whose far end is rigidly
// connected to a column, one whose far end is pinned (invented sizes):
// γ = 2·(143/4) / (296/8·1.0 + 296/6·0.5) = 1.159 (AS 4100 4.6.3.3).
func Example() {
	// source: standards-notes §1.2 [M] βe (Table 4.6.3.4) and [L] footing γ = 10 (SDH p.53);
	// standards-notes §1.2 [M] Figure 4.6.3.2 sway fixed–pinned ke = 2.2.
	const e = 200000.0 // MPa
	column := effective.Column{E: e, I: 143e6, L: 4000}
	beams := []effective.Beam{
		{E: e, I: 296e6, L: 8000, Far: effective.FarColumn},
		{E: e, I: 296e6, L: 6000, Far: effective.FarPinned},
	}
	top, err := effective.Ratio(effective.AS4100, []effective.Column{column, column}, beams, true)
	if err != nil {
		fmt.Println(err)
		return
	}
	bottom, _ := effective.Footing(effective.AS4100, effective.Pinned)
	ke, err := effective.Sway(top, bottom)
	if err != nil {
		fmt.Println(err)
		return
	}
	idealised, ok := effective.Idealised(effective.AS4100, effective.Fixed, effective.Pinned, true)
	fmt.Printf("γ top = %.3f, γ bottom = %g, ke = %.3f\n", top, bottom, ke)
	fmt.Printf("idealised fixed–pinned sway ke = %g (%v)\n", idealised, ok)
	// Output:
	// γ top = 1.159, γ bottom = 10, ke = 1.937
	// idealised fixed–pinned sway ke = 2.2 (true)
}
