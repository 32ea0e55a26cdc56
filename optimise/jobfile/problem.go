package jobfile

import (
	"cmp"
	"fmt"
	"slices"
	"strings"
)

// Pos is a 1-based line and column in a source file. The zero Pos means "no position" (a
// problem with the file as a whole, such as its size).
type Pos struct {
	Line, Column int
}

// Loc says where a value sits: the file, the position of the value (or of its key when the
// value starts on a later line) and the key path, e.g. "cases.G.loads[1].at".
type Loc struct {
	File string
	Pos
	Path string
}

// Problem is one thing wrong with an input file.
type Problem struct {
	File         string
	Line, Column int
	Path         string // key path, e.g. "beam.spans[2]"; "" for the file or its top level
	Message      string
}

// String formats the problem as "file:line:col: path: message", leaving out what is unknown.
func (p Problem) String() string {
	var b strings.Builder
	b.WriteString(p.File)
	if p.Line > 0 {
		fmt.Fprintf(&b, ":%d", p.Line)
		if p.Column > 0 {
			fmt.Fprintf(&b, ":%d", p.Column)
		}
	}
	b.WriteString(": ")
	if p.Path != "" {
		b.WriteString(p.Path)
		b.WriteString(": ")
	}
	b.WriteString(p.Message)
	return b.String()
}

// maxProblems bounds the list: a garbled file must not yield megabytes of messages.
const maxProblems = 100

// Problems is every problem found in one file. It implements error; Decode, LoadJob and
// LoadSpliceFile return a non-empty Problems or a nil error.
type Problems []Problem

// Add records a problem at a location. Past 100 problems it records one final "too many
// problems" note and drops the rest.
func (p *Problems) Add(at Loc, format string, args ...any) {
	p.add(Problem{File: at.File, Line: at.Line, Column: at.Column, Path: at.Path,
		Message: fmt.Sprintf(format, args...)})
}

func (p *Problems) add(pr Problem) {
	switch {
	case len(*p) < maxProblems:
		*p = append(*p, pr)
	case len(*p) == maxProblems:
		*p = append(*p, Problem{File: pr.File, Message: fmt.Sprintf(
			"too many problems; only the first %d are listed", maxProblems)})
	}
}

// Sort orders the problems by file, line and column, keeping the order of those at one place.
func (p Problems) Sort() {
	slices.SortStableFunc(p, func(a, b Problem) int {
		return cmp.Or(strings.Compare(a.File, b.File), cmp.Compare(a.Line, b.Line), cmp.Compare(a.Column, b.Column))
	})
}

// Error returns one line per problem, sorted by position.
func (p Problems) Error() string {
	sorted := append(Problems(nil), p...)
	sorted.Sort()
	lines := make([]string, len(sorted))
	for i, pr := range sorted {
		lines[i] = pr.String()
	}
	return strings.Join(lines, "\n")
}

// Err returns p sorted as an error, or nil when there is no problem (never a typed nil).
func (p Problems) Err() error {
	if len(p) == 0 {
		return nil
	}
	p.Sort()
	return p
}

// ancestorOrSelf reports whether key path a is b or contains it ("beam" contains
// "beam.spans[1]"; "" is the whole file).
func ancestorOrSelf(a, b string) bool {
	if a == "" {
		return true
	}
	if !strings.HasPrefix(b, a) {
		return false
	}
	return len(b) == len(a) || b[len(a)] == '.' || b[len(a)] == '['
}

// About reports whether a problem is at a key path, inside it ("beam.section" holds
// "beam.section.welded.tw") or around it (a problem with "beam" is about "beam.section"; one
// with the file as a whole, path "", is not), so that a caller's later checks can leave a
// value that failed alone.
func (p Problems) About(path string) bool {
	for _, pr := range p {
		if ancestorOrSelf(path, pr.Path) || pr.Path != "" && ancestorOrSelf(pr.Path, path) {
			return true
		}
	}
	return false
}
