// Package check checks the ledger's projections.
package check
