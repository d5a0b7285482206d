package config

import (
	"errors"
	"fmt"
	"io/fs"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"slices"
	"strconv"
	"strings"

	"go.yaml.in/yaml/v3"

	"roundoff/internal/numeric"
)

// Load returns the configuration of the module rooted at root: the one in
// root/roundoff.yaml, or the defaults when there is no such file.
func Load(root string, names []string) (*Config, error) {
	c, err := Read(filepath.Join(root, FileName), names)
	if errors.Is(err, fs.ErrNotExist) {
		return Default(names, root), nil
	}
	return c, err
}

// Read reads the configuration file at path; excluded paths are taken
// relative to its directory.
func Read(path string, names []string) (*Config, error) {
	data, err := os.ReadFile(path)
	if err != nil {
		return nil, err
	}
	return Parse(path, data, names)
}

// Parse parses data, the contents of the configuration file at path.
func Parse(path string, data []byte, names []string) (*Config, error) {
	abs, err := filepath.Abs(path)
	if err != nil {
		return nil, err
	}
	c := Default(names, filepath.Dir(abs))
	c.File = path
	var doc yaml.Node
	if err := yaml.Unmarshal(data, &doc); err != nil {
		return nil, syntaxError(path, err)
	}
	if len(doc.Content) == 0 {
		return c, nil // an empty file: the defaults
	}
	p := parser{file: path, c: c}
	p.mapping(doc.Content[0], "the top level", map[string]func(*yaml.Node){
		"analyzers": p.analyzers,
		"exclude":   p.exclude,
		"noise":     p.noise,
		"datasize":  p.datasize,
	})
	if p.err != nil {
		return nil, p.err
	}
	return c, nil
}

// yamlLine finds the line number in the YAML library's error messages.
var yamlLine = regexp.MustCompile(`^yaml: line (\d+): (.*)$`)

// syntaxError turns a YAML syntax error into an Error with its line.
func syntaxError(path string, err error) error {
	msg := strings.TrimSpace(strings.SplitN(err.Error(), "\n", 2)[0])
	if m := yamlLine.FindStringSubmatch(msg); m != nil {
		line, _ := strconv.Atoi(m[1])
		return &Error{path, line, "not valid YAML: " + m[2]}
	}
	return &Error{path, 0, "not valid YAML: " + strings.TrimPrefix(msg, "yaml: ")}
}

// parser walks the YAML tree, keeping the first error.
type parser struct {
	file string
	c    *Config
	err  error
}

func (p *parser) fail(n *yaml.Node, format string, args ...any) {
	if p.err == nil {
		p.err = &Error{p.file, n.Line, fmt.Sprintf(format, args...)}
	}
}

// mapping calls the handler of each key of mapping n, which must be one of
// the handlers' keys, each at most once; where names n for messages.
func (p *parser) mapping(n *yaml.Node, where string, handlers map[string]func(*yaml.Node)) {
	if n.Kind != yaml.MappingNode {
		p.fail(n, "%s must be a mapping of keys to values", where)
		return
	}
	seen := map[string]bool{}
	for i := 0; i+1 < len(n.Content) && p.err == nil; i += 2 {
		key, val := n.Content[i], n.Content[i+1]
		h, ok := handlers[key.Value]
		switch {
		case !ok:
			p.fail(key, "unknown key %q in %s (want %s)", key.Value, where, keyList(handlers))
		case seen[key.Value]:
			p.fail(key, "key %q appears twice in %s", key.Value, where)
		default:
			seen[key.Value] = true
			h(val)
		}
	}
}

// keyList returns the keys of handlers, sorted, for an error message.
func keyList(handlers map[string]func(*yaml.Node)) string {
	var keys []string
	for k := range handlers {
		keys = append(keys, k)
	}
	slices.Sort(keys)
	return strings.Join(keys, ", ")
}

// analyzers reads the analyzers section: a mapping from analyzer name to
// its settings.
func (p *parser) analyzers(n *yaml.Node) {
	if n.Kind != yaml.MappingNode {
		p.fail(n, "analyzers must map analyzer names to settings")
		return
	}
	seen := map[string]bool{}
	for i := 0; i+1 < len(n.Content) && p.err == nil; i += 2 {
		key, val := n.Content[i], n.Content[i+1]
		a, ok := p.c.analyzers[key.Value]
		switch {
		case !ok:
			p.fail(key, "unknown analyzer %q (the suite has %s)", key.Value, strings.Join(p.c.names, ", "))
			continue
		case seen[key.Value]:
			p.fail(key, "analyzer %q appears twice", key.Value)
			continue
		}
		seen[key.Value] = true
		p.mapping(val, "analyzer "+key.Value, map[string]func(*yaml.Node){
			"enabled": func(v *yaml.Node) { a.Enabled = p.boolean(v, "enabled") },
			"level":   func(v *yaml.Node) { a.Level = p.level(v) },
		})
	}
}

func (p *parser) boolean(n *yaml.Node, key string) bool {
	if n.Kind != yaml.ScalarNode || n.ShortTag() != "!!bool" {
		p.fail(n, "%s must be true or false, not %q", key, n.Value)
		return false
	}
	b, _ := strconv.ParseBool(strings.ToLower(n.Value))
	return b
}

func (p *parser) level(n *yaml.Node) string {
	if n.Kind != yaml.ScalarNode || !slices.Contains(Levels, n.Value) {
		p.fail(n, "level must be one of %s, not %q", strings.Join(Levels, ", "), n.Value)
		return DefaultLevel
	}
	return n.Value
}

// exclude reads the list of excluded path globs.
func (p *parser) exclude(n *yaml.Node) {
	if n.Kind != yaml.SequenceNode {
		p.fail(n, "exclude must be a list of path patterns")
		return
	}
	for _, v := range n.Content {
		if p.err != nil {
			return
		}
		if v.Kind != yaml.ScalarNode || v.Value == "" {
			p.fail(v, "an exclude entry must be a path pattern")
			continue
		}
		if err := checkGlob(v.Value); err != nil {
			p.fail(v, "exclude pattern %q: %v", v.Value, err)
			continue
		}
		p.c.Exclude = append(p.c.Exclude, strings.TrimSuffix(v.Value, "/"))
	}
}

// noise reads the list of noise levels.
func (p *parser) noise(n *yaml.Node) {
	if n.Kind != yaml.SequenceNode {
		p.fail(n, "noise must be a list of entries with package, function and relative")
		return
	}
	for _, v := range n.Content {
		if p.err != nil {
			return
		}
		nl := NoiseLevel{Line: v.Line, Relative: math.NaN()}
		p.mapping(v, "a noise entry", map[string]func(*yaml.Node){
			"package":  func(s *yaml.Node) { nl.Package = p.text(s, "package") },
			"function": func(s *yaml.Node) { nl.Function = p.text(s, "function") },
			"relative": func(s *yaml.Node) { nl.Relative = p.relative(s) },
		})
		switch {
		case p.err != nil:
		case nl.Package == "":
			p.fail(v, "a noise entry needs a package")
		case math.IsNaN(nl.Relative):
			p.fail(v, "a noise entry needs relative, the relative accuracy of the results (such as 1e-6)")
		default:
			p.c.NoiseLevels = append(p.c.NoiseLevels, nl)
		}
	}
}

// datasize reads the list of data sizes.
func (p *parser) datasize(n *yaml.Node) {
	if n.Kind != yaml.SequenceNode {
		p.fail(n, "datasize must be a list of entries with package and size")
		return
	}
	for _, v := range n.Content {
		if p.err != nil {
			return
		}
		ds := DataSize{Line: v.Line}
		p.mapping(v, "a datasize entry", map[string]func(*yaml.Node){
			"package": func(s *yaml.Node) { ds.Package = p.text(s, "package") },
			"size":    func(s *yaml.Node) { ds.Size = p.size(s) },
		})
		switch {
		case p.err != nil:
		case ds.Package == "":
			p.fail(v, "a datasize entry needs a package")
		case ds.Size == 0:
			p.fail(v, "a datasize entry needs size, the largest magnitude of the data (such as 1e6)")
		default:
			p.c.DataSizes = append(p.c.DataSizes, ds)
		}
	}
}

// size reads a data size: a positive finite number.
func (p *parser) size(n *yaml.Node) float64 {
	v, err := strconv.ParseFloat(n.Value, 64)
	if n.Kind != yaml.ScalarNode || err != nil || !(v > 0) || math.IsInf(v, 0) {
		p.fail(n, "size must be a positive number such as 1e6, not %q", n.Value)
		return 0
	}
	return v
}

func (p *parser) text(n *yaml.Node, key string) string {
	if n.Kind != yaml.ScalarNode || n.Value == "" || strings.ContainsAny(n.Value, " \t") {
		p.fail(n, "%s must be a name without spaces", key)
		return ""
	}
	return n.Value
}

// relative reads a relative accuracy (see ParseNoise).
func (p *parser) relative(n *yaml.Node) float64 {
	if n.Kind != yaml.ScalarNode {
		p.fail(n, "relative must be a number such as 1e-6")
		return 0
	}
	x, err := ParseNoise(n.Value, numeric.Float64)
	if err != nil {
		p.fail(n, "relative %s: %v", n.Value, err)
	}
	return x
}
