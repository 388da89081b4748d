#!/usr/bin/env bash
# The hard ceiling on large inputs: every command and basis, one process each, under GNU time,
# on the large XYZ files written by `cargo bench --bench cluster_files -- DIR` (a 92,597-atom
# fcc cube in Oh, the same with noise in C1, 30,000 atoms at random) and on any other XYZ
# files given. Target: each ≤ 2 s and ≤ 1 GB, whether it answers or refuses. Run from the
# repository after `cargo build --release`:
#   bash benches/large_inputs_process.sh DIR [MORE.xyz ...]
# Prints one line per run (wall, max RSS, exit status, first words of the message), marks
# runs over the ceiling with "OVER", then the count of those.
set -u
bin=target/release/salcdesk
[ -x "$bin" ] || { echo "no $bin: run cargo build --release first" >&2; exit 1; }
gnutime=$(type -P time) || { echo "GNU time not found" >&2; exit 1; }
[ $# -ge 1 ] || { echo "usage: $0 DIR [MORE.xyz ...]" >&2; exit 1; }
dir=$1
shift
files=("$dir"/large_*.xyz "$@")
runs=(
    "analyze" "detect" "modes" "combos" "symmetrize"
    "salc --basis cartesian" "salc --basis stretch" "salc --basis bend"
    "salc --basis internal" "salc --basis sigma" "salc --basis pi" "salc --basis pperp"
)
out=$(mktemp)
err=$(mktemp)
trap 'rm -f "$out" "$err"' EXIT
echo "load before: $(cut -d' ' -f1-3 /proc/loadavg)"
over=0 count=0
for f in "${files[@]}"; do
    [ -f "$f" ] || { echo "no file $f" >&2; exit 1; }
    for r in "${runs[@]}"; do
        read -ra words <<<"$r"
        format=(--format json)
        [ "${words[0]}" = symmetrize ] && format=()
        "$gnutime" -o "$out" -f "%e %M %x" "$bin" "${words[0]}" "$f" "${words[@]:1}" \
            "${format[@]}" >/dev/null 2>"$err"
        read -r wall rss status < <(tail -n 1 "$out")
        count=$((count + 1))
        mark=
        if [ "$(echo "$wall > 2.0" | bc)" = 1 ] || [ "$rss" -gt 1048576 ]; then
            mark="  OVER"
            over=$((over + 1))
        fi
        printf '%-22s %-24s %6s s %6s MB exit %s%s  %s\n' "$(basename "$f")" "$r" "$wall" \
            "$((rss / 1024))" "$status" "$mark" "$(head -c 80 "$err" | tr '\n' ' ')"
    done
done
echo "$count runs, $over over 2 s or 1 GB"
echo "load after: $(cut -d' ' -f1-3 /proc/loadavg)"
