package splice

// MaterialItem is one line of a bill of materials: a kind of bolt, nut, washer or plate, how
// many and what each weighs.
type MaterialItem struct {
	Item     string // "bolt", "nut", "washer" or "plate"
	Part     string // "flange" or "web": where the item goes ("flange and web" in a sum)
	Name     string // "M20×75 HV 10.9 (EN 14399-4)", "M20 nut EN 14399-4", "M20 washer EN 14399-6", "outer flange plate", "inner flange plate", "web plate"
	Standard string // the product standard of a fastener; "" for plates
	Size     string // "M20" for fasteners; "" for plates (see Thickness, Width, Length)
	Grade    string // a bolt's property class, its nuts' (partGrade) and washers' hardness, or a plate's steel grade
	// Length is a bolt's nominal length or a plate's length along the beam [mm]; 0 for nuts and
	// washers, and for a bolt no standard length fits (Name then says so).
	Length           float64
	Thickness, Width float64 // a plate's [mm]
	Quantity         int
	UnitMass         float64 // [kg]
}

// TotalMass is Quantity × UnitMass [kg].
func (m MaterialItem) TotalMass() float64 { return float64(m.Quantity) * m.UnitMass }

// Materials is a bill of materials: the items, and the holes and prepared faying surfaces
// they need.
type Materials struct {
	Items      []MaterialItem
	Holes      int     // holes drilled, every ply counted (beam and plates)
	FayingArea float64 // prepared faying surfaces (categories B and C), both faces of every slip interface [m²]
}

// Materials lists what the splice takes to make, both flange splices and the web splice on
// both sides of the joint: the bolts of each group by size, class and length, their nuts and
// washers (one line for the two groups where they are alike), and the cover plates with thickness × width × length (plateGrade is
// the plates' steel grade, Problem.PlateSteel.Name), count and mass at 7850 kg/m³ (EN 1991-1-1
// Table A.4). Packing plates are not listed: a splice gives their thickness, not their size.
// The result must be a full one (not Problem.Brief), which carries the assemblies; a brief one
// is a programming error and panics.
func (r Result) Materials(plateGrade string) Materials {
	if len(r.Assemblies) == 0 {
		panic("splice: Materials of a brief result, which has no bolt assemblies")
	}
	g, q := r.Geometry, r.Quantities
	m := Materials{Holes: q.Holes}
	if g.Category.Preloaded() {
		m.FayingArea = q.FayingArea
	}
	for _, a := range r.Assemblies {
		m.Items = append(m.Items, assemblyItems(a, g.Bolt)...)
	}
	plate := func(part, name string, t, b, l float64, n int) {
		m.Items = append(m.Items, MaterialItem{Item: "plate", Part: part, Name: name, Grade: plateGrade,
			Length: l, Thickness: t, Width: b, Quantity: n, UnitMass: t * b * l * steelDensity})
	}
	f := g.Flange
	plate("flange", "outer flange plate", f.Outer.Thickness, f.Outer.Width, q.FlangePlateLength, 2)
	if f.HasInner() {
		plate("flange", "inner flange plate", f.Inner.Thickness, f.Inner.Width, q.FlangePlateLength, 4)
	}
	plate("web", "web plate", g.Web.Thickness, g.Web.Depth, q.WebPlateLength, 2)
	return SumMaterials(m)
}

// assemblyItems are the bolts, nuts and washers of one bolt group.
func assemblyItems(a GroupAssembly, b Bolt) []MaterialItem {
	class := b.Class
	if a.Err != nil {
		return []MaterialItem{{Item: "bolt", Part: a.Group, Name: "no standard length: " + a.Err.Error(),
			Size: b.Size, Grade: class, Quantity: a.Count, UnitMass: a.Mass}}
	}
	as := a.Assembly
	out := make([]MaterialItem, 0, len(as.Parts))
	for _, p := range as.Parts {
		it := MaterialItem{Item: p.Item, Part: a.Group, Name: as.Data.Size + " " + p.Item + " " + p.Standard, Standard: p.Standard,
			Size: as.Data.Size, Grade: partGrade(p, class), Quantity: a.Count * p.Count, UnitMass: p.Mass}
		if p.Item == "bolt" {
			it.Name, it.Length = boltDesignation(as), as.Length
		}
		out = append(out, it)
	}
	return out
}

// SumMaterials adds bills up: identical items (same item, name, standard, size, grade and
// dimensions) become one line with their quantities added ("flange and web" where they go in
// both); the lines keep the order of their first appearance. The holes and faying areas are added.
func SumMaterials(ms ...Materials) Materials {
	var out Materials
	type key struct {
		item, name, standard, size, grade string
		length, thickness, width          float64
	}
	at := map[key]int{}
	for _, m := range ms {
		out.Holes += m.Holes
		out.FayingArea += m.FayingArea
		for _, it := range m.Items {
			k := key{it.Item, it.Name, it.Standard, it.Size, it.Grade, it.Length, it.Thickness, it.Width}
			i, seen := at[k]
			if !seen {
				at[k] = len(out.Items)
				out.Items = append(out.Items, it)
				continue
			}
			o := &out.Items[i]
			o.Quantity += it.Quantity
			if o.Part != it.Part {
				o.Part = "flange and web"
			}
		}
	}
	return out
}

// partGrade is the grade a bill gives a fastener of an assembly with bolts of a class (from
// memory): the bolt its class; the nut the property class that mates with it (ISO 898-2:
// 5 for 4.6 to 5.8, 6 for 6.8, 8 for 8.8, 10 for 10.9; EN 14399-3/-4 nuts 8 or 10 and 10);
// the washer its hardness (EN 14399-6 through-hardened 300–370 HV; ISO 7089 200 HV, or 300 HV
// with 10.9 bolts).
func partGrade(p AssemblyPart, class string) string {
	switch p.Item {
	case "nut":
		switch class {
		case "10.9":
			return "10"
		case "8.8":
			return "8"
		case "6.8":
			return "6"
		}
		return "5"
	case "washer":
		switch {
		case p.Standard == "EN 14399-6":
			return "300–370 HV"
		case class == "10.9":
			return "300 HV"
		}
		return "200 HV"
	}
	return class
}
