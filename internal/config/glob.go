package config

import (
	"errors"
	"path"
	"strings"
)

// checkGlob reports a malformed exclude pattern: a slash-separated path
// relative to the module root whose elements may use path.Match syntax,
// and where an element ** matches any number of directories.
func checkGlob(g string) error {
	if path.IsAbs(g) || strings.Contains(g, `\`) {
		return errors.New("want a slash-separated path relative to the module root")
	}
	for _, elem := range strings.Split(g, "/") {
		if elem == ".." {
			return errors.New("may not leave the module root")
		}
		if _, err := path.Match(elem, ""); err != nil {
			return err
		}
	}
	return nil
}

// matchGlob reports whether the slash-separated relative path rel lies
// under a path that g matches: g matches rel itself or a directory of it.
func matchGlob(g, rel string) bool {
	return matchElems(strings.Split(g, "/"), strings.Split(rel, "/"))
}

func matchElems(g, p []string) bool {
	switch {
	case len(g) == 0:
		return true // g matched a directory that holds the rest of p
	case g[0] == "**":
		for i := 0; i <= len(p); i++ {
			if matchElems(g[1:], p[i:]) {
				return true
			}
		}
		return false
	case len(p) == 0:
		return false
	}
	ok, _ := path.Match(g[0], p[0])
	return ok && matchElems(g[1:], p[1:])
}
