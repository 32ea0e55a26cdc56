package encode

import (
	"io"

	"spanbreak/optimise"
)

// designCSVHeader are the columns of design --format csv: one row per check of the splice,
// in the sheet's order, with the keys and units of the JSON checks (CheckDoc).
var designCSVHeader = []string{"id", "clause", "state", "demand", "resistance", "unit", "utilisation", "pass"}

// WriteDesignCSV writes a sized or checked splice's checks as CSV, one row per check: its id,
// clause, limit state, demand and resistance in its unit, the utilisation and whether it
// passes. The rest of the sheet (forces, geometry, cost) is in the JSON and text outputs.
func WriteDesignCSV(w io.Writer, o *optimise.DesignOutcome) error {
	checks := o.Result.Checks
	rows := make([][]Cell, len(checks))
	for i, c := range checks {
		rows[i] = []Cell{Text(c.ID), Text(c.Clause), Text(c.State), Decimal(c.Demand), Decimal(c.Resistance), Text(c.Unit),
			Decimal(c.Utilisation), Boolean(c.Pass)}
	}
	return WriteCSV(w, designCSVHeader, rows)
}
