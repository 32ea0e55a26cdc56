package jobfile

// Hole types for SpliceFile.Holes (EN 1090-2 clearances).
const (
	HolesNormal   = "normal"   // the default
	HolesOversize = "oversize" //
)

// SpliceFile is a fixed splice for `design --splice` (DESIGN.md section 8, second block).
// Every size is in mm.
type SpliceFile struct {
	Meta
	Bolt          BoltSpec    `yaml:"bolt,required"`
	Category      string      `yaml:"category,required"` // SpliceCategories
	FrictionClass string      `yaml:"friction_class"`    // FrictionClasses; required for B and C
	Holes         string      `yaml:"holes"`             // HolesNormal (default when "") or HolesOversize
	Gap           Millimetres `yaml:"gap,required"`      // between the beam ends
	Flange        FlangeSpec  `yaml:"flange,required"`
	Web           WebSpec     `yaml:"web,required"`
}

// BoltSpec is the one bolt size and class of a splice.
type BoltSpec struct {
	Meta
	Size                string `yaml:"size,required"`          // "M20"
	Class               string `yaml:"class,required"`         // BoltClasses
	ThreadsInShearPlane *bool  `yaml:"threads_in_shear_plane"` // nil: from the bolt length; see ShearPlanes
	System              string `yaml:"system"`                 // AssemblySystems; "" the default of the category and class
}

// ShearPlanes is where the shear checks take the bolts' shear planes: with the key absent,
// from the length of each bolt group's assembly (PlanesLength); true assumes the thread in every
// plane (stress area As, and the lower αv for classes 4.8, 5.8, 6.8 and 10.9, EN 1993-1-8
// Table 3.4), false the plain shank.
func (b BoltSpec) ShearPlanes() string {
	switch {
	case b.ThreadsInShearPlane == nil:
		return PlanesLength
	case *b.ThreadsInShearPlane:
		return PlanesThread
	}
	return PlanesShank
}

// PlateSpec is the size of one cover plate [mm].
type PlateSpec struct {
	Meta
	Thickness Millimetres `yaml:"thickness,required"`
	Width     Millimetres `yaml:"width,required"`
}

// FlangeSpec is the bolted cover-plate arrangement of each flange [mm].
type FlangeSpec struct {
	Meta
	Outer   PlateSpec    `yaml:"outer,required"`
	Inner   *PlateSpec   `yaml:"inner"`            // optional: one each side of the web
	Columns int          `yaml:"columns,required"` // bolt lines across the flange: 2 or 4
	Rows    int          `yaml:"rows,required"`    // bolt rows on each side of the joint
	Gauge   Millimetres  `yaml:"gauge,required"`   // between the two lines nearest the web
	Pitch   *Millimetres `yaml:"pitch"`            // along the beam; required when rows > 1
	End     Millimetres  `yaml:"end,required"`     // to the plate end and to the beam end
	Edge    Millimetres  `yaml:"edge,required"`    // to the plate's long edge
}

// WebSpec is the pair of web cover plates and their bolt group [mm].
type WebSpec struct {
	Meta
	Thickness Millimetres  `yaml:"thickness,required"` // each of the two plates
	Depth     Millimetres  `yaml:"depth,required"`
	Columns   int          `yaml:"columns,required"` // bolt columns on each side of the joint
	Rows      int          `yaml:"rows,required"`
	Pitch     *Millimetres `yaml:"pitch"`   // vertical; required when rows > 1
	Spacing   *Millimetres `yaml:"spacing"` // horizontal, between columns; required when columns > 1
	End       Millimetres  `yaml:"end,required"`
	Edge      Millimetres  `yaml:"edge,required"`
}
