package encode

import (
	"fmt"
	"io"
	"math"
	"strconv"

	"spanbreak/optimise"
	"spanbreak/splice"
)

// SpliceWords describes a splice's bolts and plates in one line.
func SpliceWords(g splice.Geometry) string {
	f := g.Flange
	out := fmt.Sprintf("%s %s cat. %s; flange plates %s×%s", g.Bolt.Size, g.Bolt.Class, g.Category, size(f.Outer.Thickness), size(f.Outer.Width))
	if f.HasInner() {
		out += fmt.Sprintf(" + 2×%s×%s", size(f.Inner.Thickness), size(f.Inner.Width))
	}
	out += fmt.Sprintf(", %d×%d bolts each side; web plates 2×%s×%s, %d×%d bolts each side",
		f.Columns, f.Rows, size(g.Web.Thickness), size(g.Web.Depth), g.Web.Columns, g.Web.Rows)
	return out
}

// size prints a plate or bolt dimension [mm] to 0.1 mm, whole millimetres without a point.
func size(v float64) string { return strconv.FormatFloat(Round(math.Round(v*10)/10), 'f', -1, 64) }

// ChosenSpliceDoc is one splice of the recommended layout with its full checks. Units:
// position m, the splice in the keys and units of the splice file (mm), each check in its
// own unit, plate mass kg, cost in the job's currency.
type ChosenSpliceDoc struct {
	Name        string     `json:"name"`
	Position    Num        `json:"position"`
	Summary     string     `json:"summary"`
	Splice      SpliceDoc  `json:"splice"`
	Forces      ForcesDoc  `json:"forces"`
	Beam        sectionDoc `json:"beam"`
	Checks      []CheckDoc `json:"checks"`
	Utilisation Num        `json:"utilisation"`
	Governing   string     `json:"governing"`
	Cost        Num        `json:"cost"`
	Bolts       int        `json:"bolts"`
	PlateMass   Num        `json:"plate_mass_kg"`
	BoltMass    Num        `json:"bolt_mass_kg"`
	// Assemblies are the splice's bolt assemblies, Materials its bill of materials.
	Assemblies []AssemblyDoc `json:"assemblies"`
	Materials  MaterialsDoc  `json:"materials"`
}

// ChosenSplices is the shape of the sheets of a layout, left to right, with each splice's bill
// (bills, one a sheet); no sheet is an empty list.
func ChosenSplices(sheets []optimise.SpliceSheet, bills []optimise.SpliceBill) []ChosenSpliceDoc {
	out := []ChosenSpliceDoc{}
	for i, sh := range sheets {
		r := sh.Result
		out = append(out, ChosenSpliceDoc{Name: sh.Name, Position: Num(sh.Position * ToM), Summary: SpliceWords(r.Geometry),
			Splice: Splice(r.Geometry), Forces: forcesDoc(r, &sh.Origins), Beam: beamDoc(sh.Section), Checks: Checks(r.Checks),
			Utilisation: Num(r.Utilisation), Governing: r.Governing.ID,
			Cost: Num(r.Cost.Total), Bolts: r.Quantities.Bolts, PlateMass: Num(r.Quantities.PlateMass), BoltMass: Num(r.Quantities.BoltMass),
			Assemblies: Assemblies(r.Assemblies), Materials: Materials(bills[i].Materials)})
	}
	return out
}

// ReportResultDoc is result.json of the report folder: the optimise document with the
// recommended layout's splices, their full checks and bills, and the layout's bill of
// materials (the lines of bom.csv).
type ReportResultDoc struct {
	OptimiseDoc
	ChosenSplices []ChosenSpliceDoc `json:"chosen_splices"`
	Bill          *MaterialsDoc     `json:"bill_of_materials"` // null when no layout fits
}

// ReportResult is the document of result.json.
func ReportResult(o *optimise.Outcome) ReportResultDoc {
	b := o.Bill()
	d := ReportResultDoc{OptimiseDoc: Optimise(o), ChosenSplices: ChosenSplices(o.Chosen, b.Splices)}
	if o.Infeasible == nil {
		d.Bill = ptr(Materials(b.Total))
	}
	return d
}

// WriteReportSummary writes what `report` prints once the folder is written: the job, the
// recommended layout, the number of files and the folder, and the caution.
func WriteReportSummary(w io.Writer, r *optimise.Outcome, files int, folder, caution string) {
	w = TextWriter(w)
	fmt.Fprintf(w, "spanbreak %s: report on %s\n", Version(), Printable(r.Setup.File))
	if r.Infeasible != nil {
		fmt.Fprintf(w, "No layout fits the limits:\n")
		for _, l := range r.Diagnosis.Lines() {
			fmt.Fprintf(w, "- %s\n", l)
		}
	} else {
		rec := r.Recommended()
		fmt.Fprintf(w, "Recommended: %d splice(s)", len(rec.Splices))
		for i, x := range rec.Splices {
			sep := ","
			if i == 0 {
				sep = ":"
			}
			fmt.Fprintf(w, "%s S%d at %.3f m", sep, i+1, x*ToM)
		}
		fmt.Fprintf(w, "; total cost %.0f\n", rec.Cost.Total)
	}
	fmt.Fprintf(w, "Wrote %d files to %s\n", files, Printable(folder))
	fmt.Fprintf(w, "\n%s\n", caution)
}
