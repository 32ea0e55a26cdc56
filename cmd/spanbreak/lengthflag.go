package main

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/spf13/pflag"

	"spanbreak/optimise"
)

// lengthKind is what a length flag holds, which decides the unit of a bare number and the
// values it accepts.
type lengthKind int

const (
	position lengthKind = iota // a position along the beam: a bare number in m, 0 or more
	spacing                    // a step between stations or positions: a bare number in m, more than 0
	size                       // a size across the joint (the gap): a bare number in mm, 0 or more
)

// unit is the unit of a bare number and of the flag's messages.
func (k lengthKind) unit() string {
	if k == size {
		return "mm"
	}
	return "m"
}

// parse reads one value as the job file reads a length of this kind and checks it; the
// value is returned in mm and the messages are in the flag's own unit.
func (k lengthKind) parse(s string) (float64, error) {
	parse := optimise.ParseLength
	if k == size {
		parse = optimise.ParseSize
	}
	mm, err := parse(s)
	if err != nil {
		return 0, err
	}
	return mm, k.check(mm)
}

// check refuses a value [mm] the kind does not take, in the flag's unit.
func (k lengthKind) check(mm float64) error {
	shown := mm / 1e3
	if k == size {
		shown = mm
	}
	switch {
	case math.IsNaN(mm) || math.IsInf(mm, 0):
		return fmt.Errorf("want a finite length in %s, got %s", k.unit(), short(shown))
	case k == position && mm < 0:
		return fmt.Errorf("a position is measured from the left end of the beam: want 0 m or more, got %s m", short(shown))
	case k == spacing && !(mm > 0):
		return fmt.Errorf("want a spacing of more than 0 m, got %s m", short(shown))
	case k == size && mm < 0:
		return fmt.Errorf("want 0 mm or more, got %s mm", short(shown))
	}
	return nil
}

// checkStepOption checks a --step option [mm] set by a caller rather than by the flag (0
// takes the job's step) and reports it as a command-line mistake.
func checkStepOption(mm float64) error {
	if mm == 0 {
		return nil
	}
	if err := spacing.check(mm); err != nil {
		return usageError(fmt.Errorf("--step: %w", err))
	}
	return nil
}

// short prints a flag value for messages and help: "0.25", "1e-07".
func short(v float64) string { return strconv.FormatFloat(v, 'g', 6, 64) }

// lengthValue is a flag holding one length in mm (pflag.Value). A bare number is in the
// kind's unit; a number may carry any length unit of the job file: "9 m", "9000 mm", "50 mm".
type lengthValue struct {
	mm   *float64
	kind lengthKind
}

// lengthVar defines a length flag; def is the default [mm].
func lengthVar(f *pflag.FlagSet, p *float64, name string, kind lengthKind, def float64, usage string) {
	*p = def
	f.Var(&lengthValue{mm: p, kind: kind}, name, usage)
}

func (v *lengthValue) Set(s string) error {
	mm, err := v.kind.parse(s)
	if err != nil {
		return err
	}
	*v.mm = mm
	return nil
}

// String prints the value in the kind's unit without the unit, as help shows defaults.
func (v *lengthValue) String() string {
	if v.mm == nil {
		return ""
	}
	if v.kind == size {
		return short(*v.mm)
	}
	return short(*v.mm / 1e3)
}

func (v *lengthValue) Type() string { return "length" }

// lengthsValue is a flag holding a list of positions in mm, given as "1.5,3" or as the flag
// repeated; each value is read like a lengthValue.
type lengthsValue struct {
	mm      *[]float64
	kind    lengthKind
	changed bool
}

// lengthsVar defines a list-of-lengths flag with no default.
func lengthsVar(f *pflag.FlagSet, p *[]float64, name string, kind lengthKind, usage string) {
	f.Var(&lengthsValue{mm: p, kind: kind}, name, usage)
}

func (v *lengthsValue) Set(s string) error {
	items := strings.Split(s, ",")
	var got []float64
	for _, item := range items {
		if strings.TrimSpace(item) == "" {
			return errors.New("an empty position in the list; separate positions with commas, e.g. 1.5,3")
		}
		mm, err := v.kind.parse(item)
		if err != nil && len(items) > 1 {
			return fmt.Errorf("%q: %w", strings.TrimSpace(item), err)
		}
		if err != nil {
			return err
		}
		got = append(got, mm)
	}
	if !v.changed {
		*v.mm = nil // the first use replaces the default; repeating the flag adds to it
	}
	*v.mm = append(*v.mm, got...)
	v.changed = true
	return nil
}

func (v *lengthsValue) String() string {
	if v.mm == nil || len(*v.mm) == 0 {
		return ""
	}
	parts := make([]string, len(*v.mm))
	for i, mm := range *v.mm {
		parts[i] = short(mm / 1e3)
	}
	return strings.Join(parts, ",")
}

func (v *lengthsValue) Type() string { return "lengths" }
