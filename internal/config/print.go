package config

import (
	"io"
	"strconv"

	"go.yaml.in/yaml/v3"
)

// Write writes c to w in the file's own format, every analyzer listed,
// so that the output can serve as a roundoff.yaml.
func (c *Config) Write(w io.Writer) error {
	doc := mapNode()
	analyzers := mapNode()
	for _, n := range c.names {
		a := c.analyzers[n]
		add(analyzers, n, mapNode(
			scalar("enabled"), scalar(strconv.FormatBool(a.Enabled)),
			scalar("level"), scalar(a.Level)))
	}
	add(doc, "analyzers", analyzers)
	exclude := &yaml.Node{Kind: yaml.SequenceNode}
	for _, g := range c.Exclude {
		exclude.Content = append(exclude.Content, scalar(g))
	}
	add(doc, "exclude", exclude)
	noise := &yaml.Node{Kind: yaml.SequenceNode}
	for _, n := range c.NoiseLevels {
		entry := mapNode(scalar("package"), scalar(n.Package))
		if n.Function != "" {
			add(entry, "function", scalar(n.Function))
		}
		add(entry, "relative", scalar(strconv.FormatFloat(n.Relative, 'g', -1, 64)))
		noise.Content = append(noise.Content, entry)
	}
	add(doc, "noise", noise)
	if len(c.DataSizes) > 0 {
		sizes := &yaml.Node{Kind: yaml.SequenceNode}
		for _, d := range c.DataSizes {
			sizes.Content = append(sizes.Content, mapNode(scalar("package"), scalar(d.Package),
				scalar("size"), scalar(strconv.FormatFloat(d.Size, 'g', -1, 64))))
		}
		add(doc, "datasize", sizes)
	}
	enc := yaml.NewEncoder(w)
	enc.SetIndent(2)
	if err := enc.Encode(doc); err != nil {
		return err
	}
	return enc.Close()
}

func mapNode(kv ...*yaml.Node) *yaml.Node { return &yaml.Node{Kind: yaml.MappingNode, Content: kv} }

func scalar(s string) *yaml.Node { return &yaml.Node{Kind: yaml.ScalarNode, Value: s} }

func add(m *yaml.Node, key string, val *yaml.Node) {
	m.Content = append(m.Content, scalar(key), val)
}
