package reports

import (
	"math"
	"strconv"

	"swaygate/checks"
)

// htmlFrame is the frame section of the HTML page: the lambda_c table and
// a drawing of the governing combination's lowest mode, as inline SVG
// elements that html/template writes (numbers only, no markup from data).
type htmlFrame struct {
	Name, Governing, Kind string
	Nodes, Members, DOF   int
	Rows                  []htmlFrameRow
	Notes, Limitations    []string
	// The drawing: a plane frame in elevation, a 3D frame as the plan of
	// the level that drifts most.
	View          string // "elevation" or "plan"
	ViewBox       string
	Width, Height int
	Stroke        string // line width in drawing units
	Before, After []htmlLine
	Caption       string
}

type htmlFrameRow struct {
	Name, LambdaC, LambdaX, LambdaY, Status, Drivers string
}

type htmlLine struct{ X1, Y1, X2, Y2 string }

// newHTMLFrame builds the frame section; nil without a frame analysis.
func newHTMLFrame(f *checks.FrameResult) *htmlFrame {
	if f == nil {
		return nil
	}
	h := &htmlFrame{Name: f.Name, Governing: orDash(f.Governing), Nodes: f.Nodes, Members: len(f.Members), DOF: f.DOF,
		Notes: f.Notes, Limitations: f.Limitations, Kind: "3D"}
	if f.Plane {
		h.Kind = "plane"
	}
	for i := range f.Combinations {
		c := &f.Combinations[i]
		var d []byte
		for k, s := range c.Drivers {
			if k > 0 {
				d = append(d, ", "...)
			}
			d = append(d, s.Member...)
			d = append(d, ' ')
			d = strconv.AppendFloat(d, 100*s.Share, 'f', 0, 64)
			d = append(d, '%')
		}
		h.Rows = append(h.Rows, htmlFrameRow{Name: c.Name, LambdaC: fmtFixed(c.LambdaC.F(), 2), LambdaX: fmtFixed(c.LambdaX.F(), 2),
			LambdaY: fmtFixed(c.LambdaY.F(), 2), Status: orDash(c.Status), Drivers: orDash(string(d))})
	}
	gov := -1
	for i := range f.Combinations {
		if f.Combinations[i].Name == f.Governing && len(f.Combinations[i].Mode) == f.Nodes {
			gov = i
		}
	}
	if gov < 0 || f.Nodes == 0 {
		return h
	}
	c := &f.Combinations[gov]
	if f.Plane {
		h.elevation(f, c)
	} else {
		h.plan(f, c)
	}
	return h
}

// elevation draws a plane frame in its plane: horizontal axis along the
// plane, vertical axis Z; members through their interior points.
func (h *htmlFrame) elevation(f *checks.FrameResult, c *checks.FrameCombination) {
	n := f.PlaneNormal
	// u: horizontal and in the plane (Z × n), else X.
	u := [3]float64{-n[1], n[0], 0}
	if l := math.Hypot(u[0], u[1]); l > 1e-9 {
		u[0], u[1] = u[0]/l, u[1]/l
	} else {
		u = [3]float64{1, 0, 0}
	}
	v := [3]float64{0, 0, 1}
	if math.Abs(n[2]) > 0.9 { // a horizontal plane: draw X–Y
		v = [3]float64{0, 1, 0}
	}
	proj := func(p [3]float64) (float64, float64) { return dot3(p, u), dot3(p, v) }
	h.View = "elevation"
	h.draw(f, c, proj, func(int) bool { return true }, "elevation of the lowest mode of "+c.Name)
}

// plan draws the level whose storey has the largest share of the mode: the
// members lying in it, before and after the mode's translations.
func (h *htmlFrame) plan(f *checks.FrameResult, c *checks.FrameCombination) {
	level := math.NaN()
	best := -1.0
	for _, s := range c.Storeys {
		if s.Share > best {
			best, level = s.Share, s.TopZ
		}
	}
	if math.IsNaN(level) {
		return
	}
	at := func(k int) bool { return math.Abs(c.Mode[k].Z-level) <= 1 }
	proj := func(p [3]float64) (float64, float64) { return p[0], p[1] }
	h.View = "plan"
	h.draw(f, c, proj, at, "plan at elevation "+fmtSig(level, 5)+" mm of the lowest mode of "+c.Name+" (the level of the storey with the largest share)")
}

// draw fills the lines of the drawing: members whose two ends pass keep,
// before and after the normalised translations scaled to a tenth of the
// drawing's size. SVG's y axis points down, so the vertical coordinate is
// negated.
func (h *htmlFrame) draw(f *checks.FrameResult, c *checks.FrameCombination, proj func([3]float64) (float64, float64), keep func(int) bool, caption string) {
	pos := func(k int) [3]float64 { m := &c.Mode[k]; return [3]float64{m.X, m.Y, m.Z} }
	disp := func(k int) [3]float64 { m := &c.Mode[k]; return [3]float64{m.UX, m.UY, m.UZ} }
	minX, minY, maxX, maxY := math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1)
	var members []int
	for j := range f.Members {
		m := &f.Members[j]
		if m.Start >= len(c.Mode) || m.End >= len(c.Mode) || !keep(m.Start) || !keep(m.End) {
			continue
		}
		members = append(members, j)
		for _, k := range [2]int{m.Start, m.End} {
			x, y := proj(pos(k))
			minX, maxX, minY, maxY = math.Min(minX, x), math.Max(maxX, x), math.Min(minY, y), math.Max(maxY, y)
		}
	}
	if len(members) == 0 {
		return
	}
	size := math.Max(maxX-minX, maxY-minY)
	if !(size > 0) {
		size = 1
	}
	s := 0.1 * size
	pad := 0.15 * size
	num := func(v float64) string { return strconv.FormatFloat(v, 'f', 1, 64) }
	line := func(a, b [3]float64) htmlLine {
		x1, y1 := proj(a)
		x2, y2 := proj(b)
		return htmlLine{num(x1), num(-y1), num(x2), num(-y2)}
	}
	add := func(p, d [3]float64) [3]float64 { return [3]float64{p[0] + s*d[0], p[1] + s*d[1], p[2] + s*d[2]} }
	for _, j := range members {
		m := &f.Members[j]
		a, b := pos(m.Start), pos(m.End)
		h.Before = append(h.Before, line(a, b))
		// After: through the interior points, equally spaced.
		pts := [][3]float64{add(a, disp(m.Start))}
		var in [][3]float64
		if j < len(c.Interior) {
			in = c.Interior[j]
		}
		for k, d := range in {
			t := float64(k+1) / float64(len(in)+1)
			p := [3]float64{a[0] + t*(b[0]-a[0]), a[1] + t*(b[1]-a[1]), a[2] + t*(b[2]-a[2])}
			pts = append(pts, add(p, d))
		}
		pts = append(pts, add(b, disp(m.End)))
		for k := 0; k+1 < len(pts); k++ {
			h.After = append(h.After, line(pts[k], pts[k+1]))
		}
	}
	h.ViewBox = num(minX-pad) + " " + num(-maxY-pad) + " " + num(maxX-minX+2*pad) + " " + num(maxY-minY+2*pad)
	w := maxX - minX + 2*pad
	ht := maxY - minY + 2*pad
	h.Width = 640
	h.Height = int(math.Max(160, math.Min(640, 640*ht/w)))
	h.Stroke = num(math.Max(size/300, 0.1))
	h.Caption = caption + "; grey: the frame, blue: the buckled shape (translations scaled to a tenth of the drawing)"
}

func dot3(a, b [3]float64) float64 { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }
