package plots

import (
	"fmt"
	"strings"
	"sync"
	"unicode/utf8"

	"codeberg.org/go-fonts/liberation/liberationmonobold"
	"codeberg.org/go-fonts/liberation/liberationmonoregular"
	"codeberg.org/go-fonts/liberation/liberationsansbold"
	"codeberg.org/go-fonts/liberation/liberationsansbolditalic"
	"codeberg.org/go-fonts/liberation/liberationsansitalic"
	"codeberg.org/go-fonts/liberation/liberationsansregular"
	"codeberg.org/go-fonts/liberation/liberationserifbold"
	"codeberg.org/go-fonts/liberation/liberationserifregular"
	"golang.org/x/image/font/sfnt"

	"spanbreak/beam"
	"spanbreak/optimise"
)

// The PDF embeds the Liberation fonts, which cover Latin, Greek and Cyrillic text and the
// symbols of the calculation, but no emoji and nothing beyond U+FFFF; fpdf refuses to lay out
// a character past the font's table ("character outside the supported range") and draws an
// empty box for one the font lacks. So every string is fitted to the fonts before it reaches
// the PDF: a character they cannot show prints as "?", visibly, and the user's text that
// holds one is reported (Report.Warnings).

// missingMark stands in for a character the report fonts cannot show.
const missingMark = "?"

// fontCoverage says, for every character of the Basic Multilingual Plane, whether each of the
// embedded Liberation faces has a glyph for it (parsed once from the fonts).
var fontCoverage = sync.OnceValue(func() []bool {
	faces := [][]byte{liberationsansregular.TTF, liberationsansbold.TTF, liberationsansitalic.TTF,
		liberationsansbolditalic.TTF, liberationserifregular.TTF, liberationserifbold.TTF,
		liberationmonoregular.TTF, liberationmonobold.TTF}
	covered := make([]bool, 0x10000)
	for r := range covered {
		covered[r] = true
	}
	var buf sfnt.Buffer
	for _, data := range faces {
		f, err := sfnt.Parse(data)
		if err != nil {
			panic(fmt.Sprintf("plots: an embedded font does not parse: %v", err))
		}
		for r := range covered {
			if !covered[r] {
				continue
			}
			if g, err := f.GlyphIndex(&buf, rune(r)); err != nil || g == 0 {
				covered[r] = false
			}
		}
	}
	return covered
})

// inFont reports whether the report fonts show r. Line feeds are layout, not glyphs.
func inFont(r rune) bool {
	cov := fontCoverage()
	return r == '\n' || r >= 0 && int(r) < len(cov) && cov[r]
}

// fitFont returns s with every character the report fonts cannot show replaced by "?", and
// how many were replaced.
func fitFont(s string) (string, int) {
	n := 0
	for _, r := range s {
		if !inFont(r) {
			n++
		}
	}
	if n == 0 && utf8.ValidString(s) {
		return s, 0
	}
	var b strings.Builder
	for _, r := range s {
		if inFont(r) {
			b.WriteRune(r)
		} else {
			b.WriteString(missingMark)
		}
	}
	return b.String(), n
}

// fitted is s with the characters the report fonts cannot show replaced by "?".
func fitted(s string) string {
	out, _ := fitFont(s)
	return out
}

// fontWarnings lists the user's text in a job that the report fonts cannot show, each at its
// key in the job file: "job.yaml:1:8: title: 2 characters are not in the report font and
// print as ?". The file name, given on the command line, has no line.
func fontWarnings(s *optimise.Setup) []string {
	var out []string
	// sayAt reports text at a location (a jobfile.Loc: file, line, column, key path)
	sayAt := func(file string, line, column int, path, text string) {
		_, n := fitFont(text)
		if n == 0 {
			return
		}
		what := fmt.Sprintf("%d characters are", n)
		if n == 1 {
			what = "1 character is"
		}
		msg := what + " not in the report font and print as " + missingMark
		pos := ""
		if line > 0 {
			pos = fmt.Sprintf(":%d:%d", line, column)
		}
		out = append(out, fmt.Sprintf("%s%s: %s: %s", file, pos, path, msg))
	}
	say := func(key, text string) {
		at := s.Where(key)
		sayAt(at.File, at.Line, at.Column, at.Path, text)
	}
	sayAt(s.File, 0, 0, "the file name", s.File)
	say("title", s.Title)
	for _, c := range s.Cases {
		if c.Name != optimise.SelfWeightCase || s.SelfWeight == 0 {
			at := s.WhereCase(c.Name)
			sayAt(at.File, at.Line, at.Column, at.Path, c.Name)
		}
	}
	extra := 0
	for _, c := range s.Combinations {
		if c.Rule == beam.RuleUser {
			say(fmt.Sprintf("combinations.extra[%d].name", extra), c.Name)
			extra++
		}
	}
	for i, v := range s.Vehicles {
		say(fmt.Sprintf("vehicles[%d].name", i), v.Name)
	}
	return out
}
