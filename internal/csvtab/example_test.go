package csvtab_test

import (
	"fmt"
	"io"
	"strings"

	"polegap/internal/csvtab"
)

func ExampleReader() {
	data := "# magnet: bench\n" +
		"I (A); B (T)   # the header sets the separator\n" +
		"10; 0.0991\n" +
		"\n" +
		"20; \"0.1944\"\n"
	r := csvtab.NewReader(strings.NewReader(data))
	for {
		rec, err := r.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("line %d: %q, second field at column %d\n", r.Line(), rec, r.Column(1))
	}
	fmt.Printf("separator %q, magnet %q\n", r.Comma(), r.Meta["magnet"])
	// Output:
	// line 2: ["I (A)" "B (T)"], second field at column 8
	// line 3: ["10" "0.0991"], second field at column 5
	// line 5: ["20" "0.1944"], second field at column 5
	// separator ';', magnet "bench"
}
