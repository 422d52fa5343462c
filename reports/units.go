package reports

// Conversion factors from the engine's units (N, mm, MPa, N·mm).
const (
	nPerKip     = 4448.2216152605               // 1 kip = 1000 lbf, 1 lbf = 4.4482216152605 N (exact)
	mmPerIn     = 25.4                          // exact
	mmPerFt     = 304.8                         // exact
	nmmPerKipFt = nPerKip * mmPerFt             // 1 kip-ft in N·mm
	mpaPerKsi   = nPerKip / (mmPerIn * mmPerIn) // 1 ksi in MPa
)

// unitSystem is how the text and HTML reports show forces, moments and
// lengths, and how they convert hand-calculation steps.
type unitSystem struct {
	name string // "si" or "us"

	force      string  // unit label of a force
	perForce   float64 // N per display unit
	moment     string
	perMoment  float64 // N·mm per display unit
	length     string  // member lengths and elevations
	perLength  float64 // mm per display unit
	traceUnits map[string]unitConv
}

// unitConv converts a trace value given in one unit into another: value ×
// factor, shown with label.
type unitConv struct {
	label  string
	factor float64
}

var siUnits = unitSystem{
	name:  UnitsSI,
	force: "kN", perForce: 1e3,
	moment: "kNm", perMoment: 1e6,
	length: "mm", perLength: 1,
}

// usUnits converts the SI spellings a trace step may use. Units not listed
// are shown as given.
var usUnits = unitSystem{
	name:  UnitsUS,
	force: "kip", perForce: nPerKip,
	moment: "kip-ft", perMoment: nmmPerKipFt,
	length: "ft", perLength: mmPerFt,
	traceUnits: map[string]unitConv{
		"N":     {"kip", 1 / nPerKip},
		"kN":    {"kip", 1e3 / nPerKip},
		"MN":    {"kip", 1e6 / nPerKip},
		"N·mm":  {"kip-ft", 1 / nmmPerKipFt},
		"N.mm":  {"kip-ft", 1 / nmmPerKipFt},
		"Nmm":   {"kip-ft", 1 / nmmPerKipFt},
		"kNm":   {"kip-ft", 1e6 / nmmPerKipFt},
		"kN·m":  {"kip-ft", 1e6 / nmmPerKipFt},
		"kN.m":  {"kip-ft", 1e6 / nmmPerKipFt},
		"kN m":  {"kip-ft", 1e6 / nmmPerKipFt},
		"mm":    {"in", 1 / mmPerIn},
		"m":     {"ft", 1e3 / mmPerFt},
		"mm2":   {"in²", 1 / (mmPerIn * mmPerIn)},
		"mm²":   {"in²", 1 / (mmPerIn * mmPerIn)},
		"mm^2":  {"in²", 1 / (mmPerIn * mmPerIn)},
		"mm3":   {"in³", 1 / (mmPerIn * mmPerIn * mmPerIn)},
		"mm³":   {"in³", 1 / (mmPerIn * mmPerIn * mmPerIn)},
		"mm^3":  {"in³", 1 / (mmPerIn * mmPerIn * mmPerIn)},
		"mm4":   {"in⁴", 1 / (mmPerIn * mmPerIn * mmPerIn * mmPerIn)},
		"mm⁴":   {"in⁴", 1 / (mmPerIn * mmPerIn * mmPerIn * mmPerIn)},
		"mm^4":  {"in⁴", 1 / (mmPerIn * mmPerIn * mmPerIn * mmPerIn)},
		"mm6":   {"in⁶", 1 / (mmPerIn * mmPerIn * mmPerIn * mmPerIn * mmPerIn * mmPerIn)},
		"mm⁶":   {"in⁶", 1 / (mmPerIn * mmPerIn * mmPerIn * mmPerIn * mmPerIn * mmPerIn)},
		"mm^6":  {"in⁶", 1 / (mmPerIn * mmPerIn * mmPerIn * mmPerIn * mmPerIn * mmPerIn)},
		"MPa":   {"ksi", 1 / mpaPerKsi},
		"N/mm2": {"ksi", 1 / mpaPerKsi},
		"N/mm²": {"ksi", 1 / mpaPerKsi},
	},
}

// traceValue converts a trace value and its unit for display.
func (u *unitSystem) traceValue(v float64, unit string) (float64, string) {
	if c, ok := u.traceUnits[unit]; ok {
		return v * c.factor, c.label
	}
	return v, unit
}

// JSON units: the engine's values divided by these give the JSON's.
const (
	nPerKN    = 1e3 // N → kN
	nmmPerKNm = 1e6 // N·mm → kNm
)
