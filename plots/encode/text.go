package encode

import (
	"fmt"
	"io"
	"strings"
	"unicode/utf8"
)

// Text from the user — the title, file names, case, vehicle and combination names — reaches
// every text output, and a terminal obeys the control characters in it: ESC starts a
// sequence that recolours, moves the cursor or rewrites the window title, NUL and CR hide what
// precedes them. So every text output is written through TextWriter, terminal or not, and
// the values printed on one line (title, file names) through Printable as well.

// Printable returns s fit to print as one value on one line: each C0 control character (tab,
// line feed and carriage return included), DEL and each C1 control character is written as
// an escape, \x1b for ESC, \u009b for a C1 character; so is each Unicode bidirectional
// control (U+200E, U+200F, U+202A to U+202E, U+2066 to U+2069), which reorders what a
// terminal shows, and each byte that is not UTF-8 (\xe9). Everything else is kept.
func Printable(s string) string { return escape(s, false) }

// TextWriter returns a writer that passes text output to w with the control characters
// escaped as Printable does, except the line feeds that end its lines. Each Write must hold
// whole characters (as fmt and tabwriter write them); a byte that is not UTF-8 is escaped.
func TextWriter(w io.Writer) io.Writer {
	if t, ok := w.(*textWriter); ok {
		return t
	}
	return &textWriter{w: w}
}

type textWriter struct{ w io.Writer }

func (t *textWriter) Write(p []byte) (int, error) {
	s := string(p)
	if !needsEscape(s, true) {
		return t.w.Write(p)
	}
	if _, err := io.WriteString(t.w, escape(s, true)); err != nil {
		return 0, err
	}
	return len(p), nil
}

// WriteError writes an error for the terminal: "spanbreak: " and the message, one line per
// problem, with the control characters of the file names and values it quotes escaped.
func WriteError(w io.Writer, err error) {
	fmt.Fprintf(TextWriter(w), "spanbreak: %v\n", err)
}

// escape writes the control characters of s as escapes; keepNewline leaves line feeds.
func escape(s string, keepNewline bool) string {
	if !needsEscape(s, keepNewline) {
		return s
	}
	var b strings.Builder
	for i := 0; i < len(s); {
		r, size := utf8.DecodeRuneInString(s[i:])
		switch {
		case r == utf8.RuneError && size <= 1:
			fmt.Fprintf(&b, `\x%02x`, s[i])
		case r == '\n' && keepNewline:
			b.WriteByte('\n')
		case r < 0x80 && control(r):
			fmt.Fprintf(&b, `\x%02x`, r)
		case control(r):
			fmt.Fprintf(&b, `\u%04x`, r)
		default:
			b.WriteString(s[i : i+size])
		}
		i += size
	}
	return b.String()
}

// needsEscape reports whether s holds anything escape changes.
func needsEscape(s string, keepNewline bool) bool {
	for i := 0; i < len(s); {
		r, size := utf8.DecodeRuneInString(s[i:])
		if r == utf8.RuneError && size <= 1 || control(r) && !(r == '\n' && keepNewline) {
			return true
		}
		i += size
	}
	return false
}

// control reports whether a terminal may act on r rather than show it: C0, DEL, C1 and the
// bidirectional controls.
func control(r rune) bool {
	switch {
	case r < 0x20, r >= 0x7f && r <= 0x9f:
		return true
	case r == 0x200e, r == 0x200f, r >= 0x202a && r <= 0x202e, r >= 0x2066 && r <= 0x2069:
		return true
	}
	return false
}

// WriteWarnings writes warnings for the terminal, one "spanbreak: warning: " line each.
func WriteWarnings(w io.Writer, warnings []string) {
	for _, s := range warnings {
		fmt.Fprintf(TextWriter(w), "spanbreak: warning: %s\n", s)
	}
}
