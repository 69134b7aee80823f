// Package order renumbers graphs for memory locality.
package order
