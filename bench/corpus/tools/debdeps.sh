#!/bin/bash
# debdeps.sh PACKAGE: print, as a DOT digraph, the recursive Depends closure
# of a Debian package as this machine's apt database describes it (the
# candidate version of each package). An edge runs from a package to a
# package it depends on.
#
# Rule, per dependency group of a package's Depends field (Pre-Depends,
# Recommends, Suggests, Conflicts, Breaks, Replaces and Enhances are not
# followed):
#   - only the first alternative of an "a | b" group is used;
#   - a first alternative that apt shows as virtual (<name>) is skipped,
#     except a multi-arch qualified name <name:any> whose provider list
#     holds the real package "name" itself, which is taken as "name";
#   - repeated edges are merged; nodes and edges are printed sorted
#     (LC_ALL=C), so the same apt database gives the same bytes.
set -euo pipefail
export LC_ALL=C

if [ $# -ne 1 ]; then
	echo "usage: debdeps.sh PACKAGE" >&2
	exit 2
fi
root=$1
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT

opts=(--no-recommends --no-suggests --no-conflicts --no-breaks
	--no-replaces --no-enhances --no-pre-depends)

# Fail early, with apt's message, on a name that is not a real package.
apt-cache depends "${opts[@]}" "$root" >/dev/null

printf '%s\n' "$root" >"$work/seen"
printf '%s\n' "$root" >"$work/frontier"
: >"$work/edges"

# Breadth-first: one apt-cache call per wave of newly reached packages.
while [ -s "$work/frontier" ]; do
	xargs -a "$work/frontier" apt-cache depends "${opts[@]}" |
		awk '
		# A header line (no indent) names the package being listed.
		/^[^ ]/ { pkg = $0; ingroup = 0; next }
		# Dependency lines: two spaces, an optional "|" (meaning "or the
		# next line"), then the relation.
		/^ [ |]Depends: / {
			alt = (substr($0, 2, 1) == "|")
			name = $0; sub(/^ [ |]Depends: /, "", name)
			first = !ingroup
			ingroup = alt
			pending = ""
			if (!first) next
			if (name ~ /^<.*>$/) {
				name = substr(name, 2, length(name) - 2)
				if (name ~ /:any$/) {
					# Take it only if the providers listed next hold
					# the bare name itself.
					want = name; sub(/:any$/, "", want)
					pending = want
				}
				next
			}
			print pkg "\t" name
			next
		}
		# Provider lines under a virtual name: four spaces.
		/^    [^ ]/ {
			p = $0; sub(/^ +/, "", p)
			if (pending != "" && p == pending) { print pkg "\t" p; pending = "" }
			next
		}
		{ pending = "" }
		' >"$work/wave"
	cat "$work/wave" >>"$work/edges"
	cut -f2 "$work/wave" | sort -u >"$work/reached"
	sort -u "$work/seen" -o "$work/seen"
	comm -23 "$work/reached" "$work/seen" >"$work/frontier"
	cat "$work/frontier" >>"$work/seen"
done

sort -u "$work/edges" -o "$work/edges"
sort -u "$work/seen" -o "$work/seen"

printf 'digraph "deb-deps-%s" {\n' "$root"
while read -r n; do
	printf '\t"%s";\n' "$n"
done <"$work/seen"
while IFS=$'\t' read -r a b; do
	printf '\t"%s" -> "%s";\n' "$a" "$b"
done <"$work/edges"
printf '}\n'
