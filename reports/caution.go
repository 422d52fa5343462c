package reports

import "strings"

// Caution returns the caution every report carries (design §9), for the
// given standard ("as4100", "nzs3404", "en1993", "aisc360") and scope
// ("stability" or "full"). It is the only place the text is written. The text
// is one line and holds no character that JSON, XML or HTML must escape.
func Caution(standard, scope string) string {
	var b strings.Builder
	b.WriteString("These results are a check of the stability and moment amplification provisions of ")
	b.WriteString(standardName(standard))
	if scope == "full" {
		b.WriteString(", and of member capacity,")
	}
	b.WriteString(" as implemented in swaygate, on the data found in the model; every input assumption is listed. " +
		"They support, and never replace, the judgement of a licensed structural engineer and the requirements of the local building code. ")
	if scope == "full" {
		b.WriteString(`With scope full, a pass means that the stability, amplification and member capacity checks implemented here are met under every design combination found. `)
	} else {
		b.WriteString(`With scope stability, a pass means that amplification of the first-order moments is permitted (or second-order effects are negligible) and gives the amplified moments; it does not mean that the column has enough strength, which is not checked. `)
	}
	b.WriteString("Seismic P-delta provisions (for example NZS 1170.5 clause 6.5) and advanced (plastic or nonlinear) analysis are out of scope. ")
	if standard == "en1993" || standard == "aisc360" {
		b.WriteString("Where the no-sway and sway parts of the moments are not given separately, the total moment is amplified (reason total-moment-amplified): " +
			"this may be unconservative where the two parts have opposite signs. ")
	}
	b.WriteString("Verify critical members independently.")
	return b.String()
}

// standardName returns the display name of a standard's identifier.
func standardName(id string) string {
	switch id {
	case "":
		return "the chosen design standard"
	case "as4100":
		return "AS 4100"
	case "nzs3404":
		return "NZS 3404"
	case "en1993":
		return "EN 1993-1-1"
	case "aisc360":
		return "AISC 360"
	}
	return id
}
