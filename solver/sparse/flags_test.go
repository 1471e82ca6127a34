package sparse_test

import "flag"

var timing = flag.Bool("timing", false, "print the solver timing table")
