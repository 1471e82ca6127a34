package report

import (
	"encoding/json"
	"fmt"
	"io"
)

// SchemaVersion is the version of polegap's JSON contract, the JSON
// Schema in schema/output.schema.json at the repository's root. It
// changes when a key is renamed or removed or changes its meaning or
// unit; new keys do not change it.
const SchemaVersion = 1

// Outputs are the names WriteJSON accepts: the command whose output the
// document is ("demo" for the demo's report.json).
var Outputs = []string{"solve", "check", "size", "compare", "mesh", "demo", "shim", "length"}

// WriteJSON writes v, which must encode as a JSON object, indented by two
// spaces, with "schema_version" and "output" (one of Outputs) as its first
// keys. The contract: keys are snake_case with the unit in the key
// (field_T, current_A) or stated in the schema's description, enums are
// words, numbers are SI unless the key says otherwise (mm).
func WriteJSON(w io.Writer, output string, v any) error {
	known := false
	for _, o := range Outputs {
		known = known || o == output
	}
	if !known {
		panic("report: WriteJSON of unknown output " + output)
	}
	data, err := json.MarshalIndent(v, "", "  ")
	if err != nil {
		return err
	}
	if len(data) < 2 || data[0] != '{' {
		panic("report: WriteJSON of a value that is not a JSON object")
	}
	head := fmt.Sprintf("{\n  \"schema_version\": %d,\n  \"output\": %q", SchemaVersion, output)
	body := data[1:]
	if string(body) == "}" {
		_, err = fmt.Fprintf(w, "%s\n}\n", head)
		return err
	}
	_, err = fmt.Fprintf(w, "%s,%s\n", head, body)
	return err
}
