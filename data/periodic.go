package data

// romanCN reads a coordination number as Shannon writes it.
func romanCN(cn string) (int, bool) {
	switch cn {
	case "I":
		return 1, true
	case "II":
		return 2, true
	case "III":
		return 3, true
	case "IV", "IVSQ", "IVPY":
		return 4, true
	case "V":
		return 5, true
	case "VI":
		return 6, true
	case "VII":
		return 7, true
	case "VIII":
		return 8, true
	case "IX":
		return 9, true
	case "X":
		return 10, true
	case "XI":
		return 11, true
	case "XII":
		return 12, true
	case "XIV":
		return 14, true
	}
	return 0, false
}
