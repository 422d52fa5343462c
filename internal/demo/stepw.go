package demo

import (
	"bufio"
	"io"
	"sort"
	"strconv"
	"strings"
)

// stepWriter writes ISO 10303-21 instances with increasing ids.
type stepWriter struct {
	w    *bufio.Writer
	next int
	err  error
}

func newStepWriter(w io.Writer) *stepWriter {
	return &stepWriter{w: bufio.NewWriter(w), next: 1}
}

// add writes #N=TYPE(args); and returns N.
func (s *stepWriter) add(typ string, args ...string) int {
	id := s.next
	s.next++
	s.raw("#" + strconv.Itoa(id) + "=" + typ + "(" + strings.Join(args, ",") + ");\n")
	return id
}

func (s *stepWriter) raw(text string) {
	if s.err == nil {
		_, s.err = s.w.WriteString(text)
	}
}

func (s *stepWriter) flush() error {
	if s.err != nil {
		return s.err
	}
	return s.w.Flush()
}

// Argument helpers.

func ref(id int) string { return "#" + strconv.Itoa(id) }

func refs(ids ...int) string {
	parts := make([]string, len(ids))
	for i, id := range ids {
		parts[i] = ref(id)
	}
	return "(" + strings.Join(parts, ",") + ")"
}

// str quotes a string for STEP, doubling apostrophes.
func str(s string) string { return "'" + strings.ReplaceAll(s, "'", "''") + "'" }

// real writes a STEP real: always with a decimal point.
func realv(f float64) string {
	t := strconv.FormatFloat(f, 'G', 12, 64)
	if !strings.ContainsAny(t, ".E") {
		t += "."
	} else if strings.Contains(t, "E") && !strings.Contains(t, ".") {
		i := strings.Index(t, "E")
		t = t[:i] + "." + t[i:]
	}
	return t
}

func reals(fs ...float64) string {
	parts := make([]string, len(fs))
	for i, f := range fs {
		parts[i] = realv(f)
	}
	return "(" + strings.Join(parts, ",") + ")"
}

const unset = "$"

func sortedKeys[V any](m map[string]V) []string {
	keys := make([]string, 0, len(m))
	for k := range m {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	return keys
}
