// Package plots draws spanbreak's results and lays out the calculation report: the envelope
// chart, the position-versus-cost and utilisation charts, the layout comparison, the
// dimensioned splice drawing and the report (PDF). It renders an optimise.Outcome as it is:
// it never analyses the beam, sizes or checks a splice, or reads the job file (the test
// TestLayers in cmd/spanbreak keeps it so). The CSV and JSON documents and the text of every
// command are written by the sub-package encode, which the report shares its shapes with.
//
// Everything is built in memory and returned: a Figure renders to SVG, PNG or PDF into any
// io.Writer (the format is a parameter), and BuildReport returns the PDF bytes with the text
// it prints, the figures and the sheets. The caller decides file names and writes them. Charts are gonum/plot plots in Liberation Sans with a few plotters of this
// package (labelled vertical lines, shaded x-ranges, support symbols, envelope bands, labelled
// points); the drawing is drawn with vg primitives at a standard scale; the report is laid out
// with codeberg.org/go-pdf/fpdf, and the charts go into it as vector paths through a vg canvas
// on the fpdf page, at the size they are designed for (180 mm wide, an A4 text block).
//
// Units: inputs are spanbreak's internal units (N, mm, N·mm, kg); charts and documents show
// positions in m, forces in kN, moments in kNm, deflections and plate sizes in mm, masses in kg
// and costs in the job's currency units, each axis and column naming its unit. Signs follow
// package beam: bending moment sagging positive (plotted upward, and the axis says so), shear
// V = dM/dx, deflection downward positive (plotted downward, like the deflected beam).
//
// Every chart records what it marks (Chart.Marks: chosen splices, keep-out zones, infeasible
// gaps, supports, best positions, peaks) from the plotters it draws, so tests check the marks
// against the data instead of reading pixels. SVG and PNG output are byte-for-byte
// deterministic; PDFs carry a fixed creation date (the report prints the caller's date in
// its text), so equal inputs give equal bytes.
//
// Errors: data that cannot be drawn (no stations, lengths that disagree, NaN values, a
// splice geometry with missing dimensions) is a returned error naming the item. Panics are
// kept for programmer error. The package never prints and keeps no mutable package state.
package plots
