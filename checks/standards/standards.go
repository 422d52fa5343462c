// Package standards names the design standards' rule sets for the command
// line and the service: Lookup turns a name into its checks.RuleSet, Names
// lists them. Adding a standard is a package under checks/ and one case
// here.
package standards

import (
	"fmt"
	"strings"

	"swaygate/checks"
	"swaygate/checks/aisc360"
	"swaygate/checks/as4100"
	"swaygate/checks/en1993"
	"swaygate/checks/nzs3404"
)

// Default is the standard used when none is named.
const Default = "as4100"

// Names returns the known standards' names, sorted.
func Names() []string { return []string{"aisc360", "as4100", "en1993", "nzs3404"} }

// Lookup returns the rule set of the named standard ("" is Default). Names
// are case-insensitive.
func Lookup(name string) (checks.RuleSet, error) {
	switch strings.ToLower(strings.TrimSpace(name)) {
	case "", "as4100":
		return as4100.New(), nil
	case "nzs3404":
		return nzs3404.New(), nil
	case "en1993":
		return en1993.New(), nil
	case "aisc360":
		return aisc360.New(), nil
	}
	return nil, fmt.Errorf("standards: unknown standard %q (known: %s)", name, strings.Join(Names(), ", "))
}
