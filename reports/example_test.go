package reports_test

import (
	"fmt"

	"swaygate/checks"
	"swaygate/reports"
)

func ExampleNewGate() {
	s := checks.Summary{Members: 40, Pass: 31, Fail: 0, NeedsAnalysis: 9}
	for _, policy := range []string{reports.GateFail, reports.GateNeedsAnalysis} {
		g, err := reports.NewGate(policy, s)
		if err != nil {
			fmt.Println(err)
			continue
		}
		fmt.Printf("gate %s: passed %v\n", g.Policy, g.Passed)
	}
	// Output:
	// gate fail: passed true
	// gate needs-analysis: passed false
}
