package encode

import (
	"fmt"
	"io"
	"slices"
	"strings"

	"spanbreak/optimise"
	"spanbreak/splice"
)

// --- bolt assemblies (JSON) ----------------------------------------------------------------

// AssemblyDoc is the bolting assembly of one bolt group: the plies it clamps (head side first),
// the assembly chosen for them and where each shear plane meets the bolt. Sizes mm, mass kg,
// Fv_Rd kN. The length fields are absent, and error says why, when no standard length fits.
type AssemblyDoc struct {
	Group          string     `json:"group"`
	Count          int        `json:"count"`
	Designation    string     `json:"designation,omitempty"`
	System         string     `json:"system,omitempty"`
	BoltStandard   string     `json:"bolt_standard,omitempty"`
	NutStandard    string     `json:"nut_standard,omitempty"`
	WasherStandard string     `json:"washer_standard,omitempty"`
	HeadWashers    int        `json:"washers_under_head"`
	NutWashers     int        `json:"washers_under_nut"`
	Plies          []PlyDoc   `json:"plies"`
	Grip           Num        `json:"grip"`
	Clamp          *Num       `json:"clamp,omitempty"`           // Σt with nominal washers
	RequiredLength *Num       `json:"required_length,omitempty"` // Σt,max + m + P (EN 1090-2 8.2.2)
	Length         *Num       `json:"length,omitempty"`
	ThreadLength   *Num       `json:"thread_length,omitempty"` // b
	PlainShank     *Num       `json:"plain_shank,omitempty"`   // ls,min from the head's bearing face
	Protrusion     *Num       `json:"protrusion,omitempty"`    // beyond the nut, nominal
	MassKg         Num        `json:"mass_kg"`                 // one assembly
	ShearPlanes    string     `json:"shear_planes"`            // the rule: length, thread or shank
	Planes         []PlaneDoc `json:"planes"`
	Source         string     `json:"source,omitempty"`
	Note           string     `json:"note,omitempty"`
	Error          string     `json:"error,omitempty"`
}

// PlyDoc is one clamped ply (mm).
type PlyDoc struct {
	Name      string `json:"name"`
	Thickness Num    `json:"thickness"`
}

// PlaneDoc is one shear plane as the shear check takes it: position from the head's bearing
// face (mm), whether the chosen bolt has its thread there and whether the check takes it so,
// the area (mm²) and αv used, and Fv,Rd (kN).
type PlaneDoc struct {
	Name     string `json:"name"`
	Position Num    `json:"position"`
	OnThread bool   `json:"on_thread"`
	Threaded bool   `json:"threaded"`
	Area     Num    `json:"area"`
	AlphaV   Num    `json:"alpha_v"`
	FvRd     Num    `json:"Fv_Rd"`
}

// Assemblies is the shape of a result's bolt assemblies, flange then web; none for a brief one.
func Assemblies(as []splice.GroupAssembly) []AssemblyDoc {
	out := []AssemblyDoc{}
	for _, a := range as {
		d := AssemblyDoc{Group: a.Group, Count: a.Count, ShearPlanes: a.Rule.String(), MassKg: Num(a.Mass)}
		for _, p := range a.Plies {
			d.Plies = append(d.Plies, PlyDoc{Name: p.Name, Thickness: Num(p.Thickness)})
			d.Grip += Num(p.Thickness)
		}
		if a.Err != nil {
			d.Error = a.Err.Error()
		} else {
			as := a.Assembly
			d.Designation, d.System, d.Source, d.Note = as.Designation, string(as.Data.System), as.Data.Source, as.Note
			d.BoltStandard, d.NutStandard, d.WasherStandard = as.Data.BoltStandard, as.Data.NutStandard, as.Data.WasherStandard
			d.HeadWashers, d.NutWashers = as.HeadWashers, as.NutWashers
			d.Clamp, d.RequiredLength, d.Length = NumPtr(as.Clamp), NumPtr(as.RequiredLength), NumPtr(as.Length)
			d.ThreadLength, d.PlainShank, d.Protrusion = NumPtr(as.ThreadLength), NumPtr(as.ShankMin), NumPtr(as.Protrusion)
		}
		for _, p := range a.Planes {
			d.Planes = append(d.Planes, PlaneDoc{Name: p.Name, Position: Num(p.Position), OnThread: p.OnThread, Threaded: p.Threaded,
				Area: Num(p.Area), AlphaV: Num(p.AlphaV), FvRd: Num(p.FvRd * ToKN)})
		}
		out = append(out, d)
	}
	return out
}

// --- bill of materials (JSON and bom.csv) -------------------------------------------------

// MaterialsDoc is a bill of materials: the items, the holes and the prepared faying area (m²).
type MaterialsDoc struct {
	Items    []MaterialDoc `json:"items"`
	Holes    int           `json:"holes"`
	FayingM2 Num           `json:"faying_area_m2"`
}

// MaterialDoc is one line of a bill: sizes mm, masses kg. Plates have thickness, width and
// length; bolts a length; nuts and washers neither.
type MaterialDoc struct {
	Item         string `json:"item"`
	Part         string `json:"part"`
	Description  string `json:"description"`
	Standard     string `json:"standard,omitempty"`
	Size         string `json:"size"`
	ClassOrGrade string `json:"class_or_grade"`
	Length       *Num   `json:"length_mm,omitempty"`
	Thickness    *Num   `json:"thickness_mm,omitempty"`
	Width        *Num   `json:"width_mm,omitempty"`
	Quantity     int    `json:"quantity"`
	UnitMassKg   Num    `json:"unit_mass_kg"`
	TotalMassKg  Num    `json:"total_mass_kg"`
}

// materialSize is an item's size as the bill prints it: "M20", or a plate's t×b×L in mm.
func materialSize(it splice.MaterialItem) string {
	if it.Item == "plate" {
		return fmt.Sprintf("%s×%s×%s", size(it.Thickness), size(it.Width), size(it.Length))
	}
	return it.Size
}

// Materials is the shape of a bill.
func Materials(m splice.Materials) MaterialsDoc {
	d := MaterialsDoc{Items: []MaterialDoc{}, Holes: m.Holes, FayingM2: Num(m.FayingArea)}
	for _, it := range m.Items {
		l := MaterialDoc{Item: it.Item, Part: it.Part, Description: it.Name, Standard: it.Standard, Size: materialSize(it),
			ClassOrGrade: it.Grade, Quantity: it.Quantity, UnitMassKg: Num(it.UnitMass), TotalMassKg: Num(it.TotalMass())}
		if it.Length > 0 {
			l.Length = NumPtr(it.Length)
		}
		if it.Item == "plate" {
			l.Thickness, l.Width = NumPtr(it.Thickness), NumPtr(it.Width)
		}
		d.Items = append(d.Items, l)
	}
	return d
}

// BOMHeader are the columns of bom.csv.
var BOMHeader = []string{"splice", "item", "part", "description", "standard", "size", "class_or_grade",
	"length_mm", "thickness_mm", "width_mm", "quantity", "unit_mass_kg", "total_mass_kg", "area_m2"}

// WriteBOMCSV writes the bill of materials of the recommended layout as bom.csv: the lines of
// each splice (splice S1, S2, ...), then the layout's (splice "layout"), identical lines added
// up. Each bill ends with its holes (item "hole", a quantity) and, for slip-resistant splices,
// its prepared faying surfaces (item "faying surface", an area in m²). Masses kg, sizes mm.
// No layout: the header alone.
func WriteBOMCSV(w io.Writer, o *optimise.Outcome) error {
	var rows [][]Cell
	if o.Infeasible == nil {
		b := o.Bill()
		for _, s := range b.Splices {
			rows = append(rows, bomRows(s.Name, s.Materials)...)
		}
		if len(b.Splices) > 0 {
			rows = append(rows, bomRows("layout", b.Total)...)
		}
	}
	return WriteCSV(w, BOMHeader, rows)
}

// bomRows are the rows of one bill.
func bomRows(name string, m splice.Materials) [][]Cell {
	blank := Cell{}
	opt := func(v float64) Cell {
		if v == 0 {
			return blank
		}
		return Decimal(v)
	}
	var rows [][]Cell
	for _, it := range m.Items {
		t, b := blank, blank
		if it.Item == "plate" {
			t, b = Decimal(it.Thickness), Decimal(it.Width)
		}
		rows = append(rows, []Cell{Text(name), Text(it.Item), Text(it.Part), Text(it.Name), Text(it.Standard),
			Text(materialSize(it)), Text(it.Grade), opt(it.Length), t, b, Integer(it.Quantity),
			Decimal(it.UnitMass), Decimal(it.TotalMass()), blank})
	}
	rows = append(rows, []Cell{Text(name), Text("hole"), Text("flange and web"), Text("holes drilled, every ply counted"),
		blank, blank, blank, blank, blank, blank, Integer(m.Holes), blank, blank, blank})
	if m.FayingArea > 0 {
		rows = append(rows, []Cell{Text(name), Text("faying surface"), Text("flange and web"),
			Text("prepared faying surfaces, both faces of every slip interface"), blank, blank, blank, blank, blank, blank,
			blank, blank, blank, Decimal(m.FayingArea)})
	}
	return rows
}

// --- text ------------------------------------------------------------------------------------

// assemblyLines describes one group's assembly in lines of text (the calculation sheet's and
// the report's): designation, plies and grip, length, thread and shank, each shear plane with
// the area and αv its check uses, and the note.
func assemblyLines(a splice.GroupAssembly) []string {
	var plies []string
	grip := 0.0
	for _, p := range a.Plies {
		plies = append(plies, fmt.Sprintf("%s %s", p.Name, size(p.Thickness)))
		grip += p.Thickness
	}
	var out []string
	if a.Err != nil {
		out = append(out, fmt.Sprintf("%s: %d assemblies, NO STANDARD LENGTH: %v", a.Group, a.Count, a.Err))
	} else {
		out = append(out, fmt.Sprintf("%s: %d × %s", a.Group, a.Count, a.Assembly.Designation))
	}
	line := fmt.Sprintf("plies (head side first) %s = grip %s mm", strings.Join(plies, " + "), size(grip))
	if a.Err == nil {
		as := a.Assembly
		line += fmt.Sprintf("; clamp Σt = %s mm with washers (%s to %s)", size(as.Clamp), size(as.ClampMin), size(as.ClampMax))
		out = append(out, line,
			fmt.Sprintf("length: needs Σt,max + m + P = %s mm beyond the tolerance; l = %s mm, thread b = %s mm, plain shank ls,min = %s mm from the head, protrusion %s mm; %.3f kg an assembly",
				size(as.RequiredLength), size(as.Length), size(as.ThreadLength), size(as.ShankMin), size(as.Protrusion), as.Mass))
	} else {
		out = append(out, line)
	}
	rule := map[splice.ShearPlaneRule]string{splice.PlanesFromLength: "from the length", splice.PlanesInThread: "thread assumed",
		splice.PlanesOnShank: "shank assumed"}[a.Rule]
	var planes []string
	for _, p := range a.Planes {
		where := "shank, A = πd²/4"
		if p.Threaded {
			where = "thread, A = As"
		}
		planes = append(planes, fmt.Sprintf("%s at z = %s mm: %s = %s mm², αv = %.2f, Fv,Rd = %.1f kN",
			p.Name, size(p.Position), where, size(p.Area), p.AlphaV, p.FvRd*ToKN))
	}
	out = append(out, fmt.Sprintf("shear planes (%s): %s", rule, strings.Join(planes, "; ")))
	if n := a.Assembly.Note; n != "" {
		out = append(out, "note: "+n)
	}
	return out
}

// AssemblySources are the distinct sources of the assemblies' dimensions.
func AssemblySources(as []splice.GroupAssembly) []string {
	var out []string
	for _, a := range as {
		if s := a.Assembly.Data.Source; s != "" && !slices.Contains(out, s) {
			out = append(out, s)
		}
	}
	return out
}

// assemblyHeading introduces the assemblies on the sheets.
const assemblyHeading = "Bolt assemblies (EN 1090-2 8.2.2; heads on the outer flange plate and on one web plate; planes at the beam's faces, z from the head's bearing face)"

func writeAssembliesText(w io.Writer, as []splice.GroupAssembly) error {
	if len(as) == 0 {
		return nil
	}
	fmt.Fprintf(w, "  %s\n", assemblyHeading)
	for _, a := range as {
		for i, l := range assemblyLines(a) {
			indent := "    "
			if i > 0 {
				indent = "      "
			}
			fmt.Fprintf(w, "%s%s\n", indent, l)
		}
	}
	for _, s := range AssemblySources(as) {
		fmt.Fprintf(w, "    source: %s\n", s)
	}
	return nil
}

// materialsHeading introduces a splice's bill.
const materialsHeading = "Bill of materials (both flanges and the web, both sides of the joint; plates at 7850 kg/m³, EN 1991-1-1 Table A.4)"

// writeMaterialsText prints a bill as a table.
func writeMaterialsText(w io.Writer, m splice.Materials) error {
	fmt.Fprintf(w, "%s\n", materialsHeading)
	tw := Table(w)
	fmt.Fprintf(tw, "  item\tpart\tdescription\tsize\tclass or grade\tquantity\tunit kg\ttotal kg\n")
	total := 0.0
	for _, it := range m.Items {
		fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\t%d\t%.3f\t%.2f\n", it.Item, it.Part, Printable(it.Name), materialSize(it), Printable(it.Grade),
			it.Quantity, it.UnitMass, it.TotalMass())
		total += it.TotalMass()
	}
	if err := tw.Flush(); err != nil {
		return err
	}
	fmt.Fprintf(w, "  %d holes", m.Holes)
	if m.FayingArea > 0 {
		fmt.Fprintf(w, ", %.2f m² of prepared faying surface", m.FayingArea)
	}
	fmt.Fprintf(w, "; %.1f kg in all\n", total)
	return nil
}
