#!/usr/bin/env bash
# Whole-process time and peak memory of `salcdesk salc GROUP --sites "Co@origin H@SITE:…"` for
# every site type (but the origin) of every finite group, one process per case and basis, under
# GNU time. The companion of benches/salc_sites.rs (in-process times). Target: each ≤ 200 ms,
# ≤ 200 MB. Run from the repository after `cargo build --release`:
#   bash benches/salc_sites_process.sh [BASIS ...]      (default: cartesian sigma)
# Prints one line per case over 50 ms or 100 MB as it happens, then the maxima and the load.
set -u
bin=target/release/salcdesk
[ -x "$bin" ] || { echo "no $bin: run cargo build --release first" >&2; exit 1; }
gnutime=$(type -P time) || { echo "GNU time not found" >&2; exit 1; }
bases=("$@")
[ ${#bases[@]} -gt 0 ] || bases=(cartesian sigma)
out=$(mktemp)
trap 'rm -f "$out"' EXIT
echo "load before: $(cut -d' ' -f1-3 /proc/loadavg)"
cases=0 max_rss=0 max_wall=0 max_user=0 sum_wall=0 sum_user=0 errors=0
for g in $("$bin" groups --ascii | awk 'NR > 2 && $4 != "linear" { print $1 }'); do
    for site in $("$bin" salc "$g" --sites list | cut -d: -f1); do
        [ "$site" = origin ] && continue
        for b in "${bases[@]}"; do
            ok=
            # the placements of tests/salc_every_site.rs, first one the builder accepts
            for angles in 37,13 8.3,71 53,4.9; do
                if "$gnutime" -o "$out" -f "%e %U %M" "$bin" salc "$g" \
                    --sites "Co@origin H@$site:2.0,$angles" --basis "$b" --format json \
                    >/dev/null 2>&1; then
                    ok=1
                    break
                fi
            done
            read -r wall user rss <"$out"
            if [ -z "$ok" ]; then
                errors=$((errors + 1))
                echo "  error: $g $site $b (exit status; last try ${wall} s)"
                continue
            fi
            cases=$((cases + 1))
            sum_wall=$(echo "$sum_wall + $wall" | bc)
            sum_user=$(echo "$sum_user + $user" | bc)
            [ "$(echo "$wall > $max_wall" | bc)" = 1 ] && max_wall=$wall max_wall_case="$g $site $b"
            [ "$(echo "$user > $max_user" | bc)" = 1 ] && max_user=$user max_user_case="$g $site $b"
            [ "$rss" -gt "$max_rss" ] && max_rss=$rss max_rss_case="$g $site $b"
            if [ "$(echo "$wall > 0.05" | bc)" = 1 ] || [ "$rss" -gt 102400 ]; then
                echo "  $g $site $b: wall $wall s, user $user s, max RSS $((rss / 1024)) MB"
            fi
        done
    done
done
echo "$cases runs, $errors failed; wall total $sum_wall s, CPU user total $sum_user s"
echo "max wall $max_wall s (${max_wall_case:-}); max user $max_user s (${max_user_case:-})"
echo "max RSS $((max_rss / 1024)) MB (${max_rss_case:-})"
echo "load after: $(cut -d' ' -f1-3 /proc/loadavg)"
