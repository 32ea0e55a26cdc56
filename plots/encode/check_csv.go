package encode

import (
	"fmt"
	"io"
	"strconv"

	"spanbreak/optimise"
)

// checkCSVHeader are the columns of check --format csv: one row per value understood.
var checkCSVHeader = []string{"key", "value", "unit", "default"}

// WriteCheckCSV writes what check understood of a job as CSV rows of key, value, unit and
// default: the values of the JSON summary (JobSummary) under the job file's key paths where
// the value is one the file gives (beam.spans[0], limits.max_piece_length), under the summary's
// own names where it is derived (section.Iy, combinations.count.uls, member.utilisation).
// default is true where the file leaves the key out and the value is its default. A list
// takes one row per item ([0], [1]...); a limit the job does not set has an empty value.
// Costs are in the currency of the job's rates ("currency").
func WriteCheckCSV(w io.Writer, jc *optimise.JobCheck) error {
	sum, err := summarise(jc.Setup, jc.Analysis)
	if err != nil {
		return err
	}
	sum.Member, sum.Deflection = ptr(Member(&jc.Member)), Deflections(&jc.Member)
	return WriteCSV(w, checkCSVHeader, checkRows(sum))
}

// checkTable collects the rows, marking those whose key (or an enclosing key) took a default.
type checkTable struct {
	rows     [][]Cell
	defaults map[string]bool
}

// add appends one row with a text value; the row is a default where key or any of also is in
// the defaults.
func (t *checkTable) add(key, value, unit string, also ...string) {
	t.cell(key, Text(value), unit, also...)
}

// cell appends one row with a typed value.
func (t *checkTable) cell(key string, value Cell, unit string, also ...string) {
	d := t.defaults[key]
	for _, k := range also {
		d = d || t.defaults[k]
	}
	t.rows = append(t.rows, []Cell{Text(key), value, Text(unit), Boolean(d)})
}

// num adds a number, rounded by the one rule of the encoders.
func (t *checkTable) num(key string, v float64, unit string, also ...string) {
	t.cell(key, Decimal(v), unit, also...)
}

// limit adds a limit that may be absent (an empty value).
func (t *checkTable) limit(key string, v *float64, unit string, also ...string) {
	if v == nil {
		t.add(key, "", unit, also...)
		return
	}
	t.num(key, *v, unit, also...)
}

func checkRows(s JobSummary) [][]Cell {
	t := &checkTable{defaults: map[string]bool{}}
	for _, p := range s.Defaults {
		t.defaults[p] = true
	}
	t.add("input", s.Input, "")
	t.add("version", s.Version, "")
	t.add("title", s.Title, "")
	checkBeamRows(t, s)
	checkCaseRows(t, s)
	checkCombinationRows(t, s)
	checkLimitRows(t, s)
	checkSpliceRows(t, s)
	checkCostRows(t, s)
	t.num("scan.step", s.Scan.Step, "m")
	t.add("scan.alternatives", strconv.Itoa(s.Scan.Alternatives), "")
	if m := s.Member; m != nil {
		t.add("member.class", m.Class, "")
		t.num("member.Mc_Rd", float64(m.McRd), "kNm")
		t.num("member.Vc_Rd", float64(m.VcRd), "kN")
		t.num("member.utilisation", float64(m.Utilisation), "")
		t.num("member.x", float64(m.X), "m")
		t.add("member.combination", m.Combination, "")
		t.add("member.pass", strconv.FormatBool(m.Pass), "")
	}
	for i, d := range s.Deflection {
		k := fmt.Sprintf("deflection[%d].", i)
		t.add(k+"region", d.Region, "")
		t.num(k+"w", float64(d.W), "mm")
		t.num(k+"limit", float64(d.Limit), "mm")
		t.num(k+"utilisation", float64(d.Utilisation), "")
		t.add(k+"combination", d.Combination, "")
	}
	for i, n := range s.Notes {
		t.add(fmt.Sprintf("notes[%d]", i), n, "")
	}
	return t.rows
}

func checkBeamRows(t *checkTable, s JobSummary) {
	sec := s.Section
	t.add("beam.section", sec.Name, "")
	t.add("section.source", sec.Source, "")
	for _, d := range []struct {
		key string
		v   float64
	}{{"h", sec.H}, {"b", sec.B}, {"tw", sec.Tw}, {"tf", sec.Tf}, {"r", sec.R}} {
		t.num("section."+d.key, d.v, "mm")
	}
	if !sec.Catalogue {
		t.limit("beam.section.welded.weld_throat", sec.WeldThroat, "mm")
		t.limit("section.weld_leg", sec.WeldLeg, "mm", "beam.section.welded.weld_throat")
	}
	t.num("section.A", sec.A, "cm2")
	t.num("section.Iy", sec.Iy, "cm4")
	t.num("section.mass", sec.MassPerM, "kg/m")
	g := s.Grade
	t.add("beam.grade", g.Name, "")
	t.add("beam.grade_table", g.Table, "")
	t.num("grade.fy_flange", g.FyFlange, "N/mm2")
	t.num("grade.fu_flange", g.FuFlange, "N/mm2")
	t.num("grade.fy_web", g.FyWeb, "N/mm2")
	t.num("grade.fu_web", g.FuWeb, "N/mm2")
	t.num("beam.length", s.Length, "m")
	for i, sp := range s.Spans {
		t.num(fmt.Sprintf("beam.spans[%d]", i), sp, "m")
	}
	t.num("beam.overhang.left", s.Overhang[0], "m")
	t.num("beam.overhang.right", s.Overhang[1], "m")
	for i, sp := range s.Supports {
		k := fmt.Sprintf("beam.supports[%d]", i)
		t.add(k, sp.Type, "")
		t.num(k+".x", sp.X, "m")
		if sp.K != nil {
			t.num(k+".k", *sp.K, "kN/m")
		}
	}
	if len(s.Hinges) == 0 {
		t.add("beam.hinges", "", "m")
	}
	for i, h := range s.Hinges {
		t.num(fmt.Sprintf("beam.hinges[%d]", i), h, "m")
	}
	t.num("beam.self_weight", s.SelfWeight, "kN/m")
}

func checkCaseRows(t *checkTable, s JobSummary) {
	for _, c := range s.Cases {
		k := "cases." + c.Name + "."
		t.add(k+"kind", c.Kind, "")
		t.add(k+"category", c.Category, "")
		if c.Psi != nil {
			for i, name := range []string{"psi0", "psi1", "psi2"} {
				t.num(k+name, c.Psi[i], "")
			}
			t.add(k+"psi_source", c.PsiSource, "")
		}
		t.add(k+"pattern", strconv.FormatBool(c.Pattern), "")
		t.add(k+"loads", strconv.Itoa(c.Loads), "")
		t.num(k+"total_down", c.TotalDown, "kN")
	}
}

func checkCombinationRows(t *checkTable, s JobSummary) {
	c := s.Combinations
	t.add("combinations.rules", c.Rules, "")
	t.add("combinations.uls", c.ULS, "")
	t.add("combinations.sls", c.SLS, "")
	t.num("combinations.overrides.gamma_G_sup", c.GammaGSup, "")
	t.num("combinations.overrides.gamma_G_inf", c.GammaGInf, "")
	t.num("combinations.overrides.gamma_Q", c.GammaQ, "")
	t.num("combinations.overrides.xi", c.Xi, "")
	t.add("combinations.roof_imposed_separate", strconv.FormatBool(c.RoofImposedSeparate), "")
	t.add("combinations.count.uls", strconv.Itoa(c.ULSCount), "")
	t.add("combinations.count.sls", strconv.Itoa(c.SLSCount), "")
	t.add("combinations.count.extra", strconv.Itoa(c.UserCount), "")
	for i, r := range s.Regions {
		t.add(fmt.Sprintf("pattern_regions[%d]", i), r, "")
	}
}

func checkLimitRows(t *checkTable, s JobSummary) {
	l := s.Limits
	t.limit("limits.max_piece_length", l.MaxPieceLength, "m")
	t.num("limits.min_piece_length", l.MinPieceLength, "m")
	t.limit("limits.max_piece_mass", l.MaxPieceMass, "kg")
	t.num("limits.keep_out.supports", l.KeepSupports, "m")
	t.num("limits.keep_out.point_loads", l.KeepPointLoads, "m")
	for i, r := range l.KeepRanges {
		t.num(fmt.Sprintf("limits.keep_out.ranges[%d].from", i), r[0], "m")
		t.num(fmt.Sprintf("limits.keep_out.ranges[%d].to", i), r[1], "m")
	}
	t.add("limits.splices.min", strconv.Itoa(l.MinSplices), "")
	if l.MaxSplices == nil {
		t.add("limits.splices.max", "", "")
	} else {
		t.add("limits.splices.max", strconv.Itoa(*l.MaxSplices), "")
	}
	t.num("limits.deflection.span", l.DeflectionSpan, "")
	t.num("limits.deflection.overhang", l.DeflectionOver, "")
	for i, v := range s.Vehicles {
		k := fmt.Sprintf("vehicles[%d].", i)
		t.add(k+"name", v.Name, "")
		t.num(k+"max_length", v.MaxLength, "m")
		t.num(k+"payload", v.Payload, "kg")
		t.num(k+"cost", v.Cost, "currency")
	}
}

func checkSpliceRows(t *checkTable, s JobSummary) {
	sp := s.Splice
	t.add("splice.category", sp.Category, "")
	t.add("splice.friction_class", sp.FrictionClass, "")
	for i, v := range sp.BoltSizes {
		t.add(fmt.Sprintf("splice.bolts.sizes[%d]", i), v, "", "splice.bolts.sizes")
	}
	for i, v := range sp.BoltClasses {
		t.add(fmt.Sprintf("splice.bolts.classes[%d]", i), v, "", "splice.bolts.classes")
	}
	t.add("splice.plates.grade", sp.PlateGrade, "")
	for i, v := range sp.Thicknesses {
		t.num(fmt.Sprintf("splice.plates.thicknesses[%d]", i), v, "mm", "splice.plates.thicknesses")
	}
	for i, v := range sp.FlangePlates {
		t.add(fmt.Sprintf("splice.flange_plates[%d]", i), v, "", "splice.flange_plates")
	}
	t.add("splice.distribution", sp.Distribution, "")
	t.num("splice.gap", sp.Gap, "mm")
	t.add("splice.bolts.min_size", sp.BoltMinSize, "")
	t.add("splice.bolts.max_size", sp.BoltMaxSize, "")
	for i, v := range sp.BoltSizesTried {
		t.add(fmt.Sprintf("splice.bolts.tried[%d]", i), v, "", "splice.bolts.sizes")
	}
	d := sp.Detailing
	t.limit("splice.detailing.gauge", d.Gauge, "mm")
	t.add("splice.detailing.gauge_from", d.GaugeFrom, "", "splice.detailing.gauge")
	t.limit("splice.detailing.min_plate_to_flange", d.MinPlateToFlange, "")
	t.limit("splice.detailing.min_plate_thickness", d.MinPlate, "mm", "splice.detailing.min_plate_to_flange")
}

func checkCostRows(t *checkTable, s JobSummary) {
	c := s.Costs
	t.add("costs.indicative", strconv.FormatBool(c.Indicative), "", "costs")
	for _, k := range sortedRateKeys(c.Bolt) {
		t.num("costs.bolt."+k, c.Bolt[k], "currency", "costs")
	}
	for _, k := range sortedRateKeys(c.BoltClassFactor) {
		t.num("costs.bolt_class_factor."+k, c.BoltClassFactor[k], "", "costs")
	}
	t.num("costs.plate_per_kg", c.PlatePerKg, "currency/kg", "costs")
	t.num("costs.hole", c.Hole, "currency", "costs")
	t.num("costs.faying_per_m2", c.FayingPerM2, "currency/m2", "costs")
	t.num("costs.splice", c.Splice, "currency", "costs")
	t.num("costs.lift", c.Lift, "currency", "costs")
}
