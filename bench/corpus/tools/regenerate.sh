#!/bin/bash
# regenerate.sh SCRATCH: rebuild every DOT file of bench/corpus.
#
# The npm packages are installed into SCRATCH, a directory outside the
# repository; the Debian graphs come from this machine's apt database
# (run "apt-get update" first). Run from the repository root.
set -euo pipefail
export LC_ALL=C

if [ $# -ne 1 ]; then
	echo "usage: bench/corpus/tools/regenerate.sh SCRATCH" >&2
	exit 2
fi
scratch=$1
corpus=bench/corpus
mkdir -p "$scratch"
(cd "$scratch" && { [ -f package.json ] || npm init -y >/dev/null; } &&
	npm install --no-audit --no-fund us-atlas@3.0.1 world-atlas@2.0.2 >/dev/null)
mods=$scratch/node_modules

bin=$(mktemp -d)
trap 'rm -rf "$bin"' EXIT
go build -o "$bin/topoadj" ./bench/corpus/tools/topoadj

# Alaska, Hawaii and the territories (state FIPS prefixes).
outside=02,15,60,66,69,72,78
"$bin/topoadj" -object counties -exclude "$outside" -node id -label county \
	-graph us-counties -o "$corpus/us-counties.dot" "$mods/us-atlas/counties-10m.json"
"$bin/topoadj" -object states -exclude "$outside" -node usps -label name \
	-graph us-states -o "$corpus/us-states.dot" "$mods/us-atlas/counties-10m.json"
"$bin/topoadj" -object countries -node id -label name -drop-isolated \
	-graph world-countries -o "$corpus/world-countries.dot" \
	"$mods/world-atlas/countries-110m.json"

for pair in curl:curl python3:python3 blender:mid; do
	pkg=${pair%%:*}
	out=$corpus/deb-deps-${pair#*:}.dot
	bash "$corpus/tools/debdeps.sh" "$pkg" >"$out.tmp"
	mv "$out.tmp" "$out"
done
