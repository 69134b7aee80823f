module github.com/gridwood/gridwood

go 1.26

require (
	github.com/spf13/pflag v1.1.0
	gonum.org/v1/gonum v0.17.0
)
