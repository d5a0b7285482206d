package idioms

// skipBefore orders strings, not function values, in its loop condition.
// A regression case: the string constant on the right of < once crashed
// the analyzer, which took it for a numeric zero (found linting std).
func skipBefore(names []string) int {
	i := 0
	for i < len(names) && names[i] < "/cache/" {
		i++
	}
	return i
}
