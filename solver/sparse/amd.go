package sparse

// amdOrder is a placeholder until approximate minimum degree lands.
func amdOrder(g *graph) []int32 { return nestedDissection(g) }
