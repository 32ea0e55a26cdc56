module spanbreak

go 1.26.8

require (
	github.com/stretchr/testify v1.12.1
	go.yaml.in/yaml/v3 v3.0.6
	gonum.org/v1/gonum v0.17.0
	pgregory.net/rapid v1.3.0
)
