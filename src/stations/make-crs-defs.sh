#!/usr/bin/env bash
# Regenerates src/stations/crs-defs.json, the offline table of CRS definitions that
# resolveCrs() reads. Needs PROJ's `projinfo` (Debian package proj-bin) and `jq`.
# Run from anywhere:  bash src/stations/make-crs-defs.sh
#
# For every code: `projinfo -q -o PROJ --boundcrs-to-wgs84 EPSG:n` gives the proj4 string.
# When that string carries no datum shift to WGS84 (no +towgs84, no +nadgrids, and a datum
# other than WGS84/NAD83), the shift is taken from the first operation PROJ itself lists from
# EPSG:n to EPSG:4326 over the CRS's area of use (the one cs2cs applies there when no grid is
# installed), and its name is recorded in "shift":
#   - one Helmert step  -> +towgs84 with those parameters (coordinate-frame rotations are
#     negated into the position-vector convention that +towgs84 uses; time rates are dropped,
#     which is what PROJ does for coordinates without an epoch);
#   - no datum step at all (a null transformation, e.g. ETRS89 or GDA94 to WGS 84) -> +towgs84=0,0,0;
#   - a named datum other than WGS84/NAD83 (e.g. +datum=NAD27) -> "status": "no_shift";
#   - anything else (grid shifts, Molodensky...) -> "status": "no_shift" and resolveCrs refuses.
# Entries whose own string needs a grid (+nadgrids other than @null) get "status": "grid".
#
# Datums for which PROJ applies different Helmert shifts in different parts of the CRS's
# area (it picks per point), so one +towgs84 cannot stand for the whole CRS, are refused
# ("status": "no_shift"). Measured against cs2cs when this table was made: ED50 in southern
# Germany 0.47 m off, S-JTSK in Czechia 4.5 m, DHDN in Bavaria 0.11 m (see REGIONAL below).
#
# PROJ runs without grid files and without network access (PROJ_DATA holds only proj.db), as
# talus does: the operations considered are the ones talus can reproduce offline.
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
out="$here/crs-defs.json"
projdir="$(mktemp -d)"
ln -s "$(dirname "$(find /usr/share/proj /usr/local/share/proj -name proj.db 2>/dev/null | sed -n 1p)")/proj.db" "$projdir/proj.db"
export PROJ_DATA="$projdir" PROJ_LIB="$projdir" PROJ_NETWORK=OFF

# datum -> the codes of this table that use it; PROJ's shift for these depends on the region
declare -A REGIONAL=(
  [ED50]="4230 23028 23029 23030 23031 23032 23033 23034 23035 23036 23037 23038"
  [S-JTSK]="5514"
  [DHDN]="4314 31466 31467 31468 31469"
)
regional_datum() {
  local d
  for d in "${!REGIONAL[@]}"; do
    [[ " ${REGIONAL[$d]} " == *" $1 "* ]] && { echo "$d"; return; }
  done
  return 0
}

codes=()
add() { for c in "$@"; do codes+=("$c"); done; }
addrange() { local c; for ((c = $1; c <= $2; c++)); do codes+=("$c"); done; }

add 4326 4269 4258 4283 7844 4167 4617 6318 4230 4277 4289 4314 4149 4150 4121 4171 4203 4202
addrange 32601 32660          # WGS 84 / UTM north
addrange 32701 32760          # WGS 84 / UTM south
addrange 26901 26923          # NAD83 / UTM
addrange 6328 6348            # NAD83(2011) / UTM
add 2955 2956 2957 2958 2959 2960 2961 2962 3154 3155 3156 3157 3158 3159 3160 3761   # NAD83(CSRS) / UTM
addrange 25828 25838          # ETRS89 / UTM
addrange 23028 23038          # ED50 / UTM
addrange 28348 28358          # GDA94 / MGA
addrange 7846 7859            # GDA2020 / MGA
add 27700 2154 3034 3035 31466 31467 31468 31469 28992 2056 21781 3067 3006 2193 3857 3395 \
    2180 5514 3413 3031 3976 2100 3763 31370 3577 9473 5070 6350 3005 3347
# US State Plane, NAD83, US survey feet (and one international-feet zone, 2223)
add 2225 2226 2227 2228 2229 2230 2236 2249 2263 2272 2275 2276 2277 2278 2279 2283 2223
# the same kind of zone in metres
add 26943 32118
# NAD27 (refused: its shift needs grids) and NZGD49 (its grid-free Helmert is used)
add 4267 26710 26711 26712 26713 26714 26715 26716 26717 26718 4272 27200

proj_version="$(projinfo 2>&1 | sed -n 's/^Rel\. \([0-9.]*\),.*/\1/p' || true)"
[ -n "$proj_version" ] || proj_version="$(dpkg-query -W -f '${Version}' proj-bin 2>/dev/null || echo unknown)"

tmp="$(mktemp)"
trap 'rm -rf "$tmp" "$projdir"' EXIT
for c in "${codes[@]}"; do
  def="$(projinfo -q -o PROJ --boundcrs-to-wgs84 "EPSG:$c" | tr -d '\n' | sed 's/ +type=crs//; s/ *$//')"
  name="$(projinfo -q -o WKT1_GDAL "EPSG:$c" | sed -n 1p | sed 's/^[A-Z_]*\["\([^"]*\)".*/\1/')"
  case "$def" in +proj=longlat*) kind=geographic ;; *) kind=projected ;; esac
  status=ok
  shift_note="in the projinfo definition"
  rd="$(regional_datum "$c")"
  if [ -n "$rd" ]; then
    status=no_shift
    shift_note="PROJ uses different $rd shifts in different parts of this CRS's area; no single +towgs84 fits"
  elif [[ "$def" == *"+nadgrids="* && "$def" != *"+nadgrids=@null"* ]]; then
    status=grid
    shift_note="needs a datum grid"
  elif [[ "$def" == *"+datum="* && "$def" != *"+datum=WGS84"* && "$def" != *"+datum=NAD83"* ]]; then
    # proj4's own table maps such datums (NAD27, ...) to grid files that are not shipped.
    status=no_shift
    shift_note="datum shift needs grids or depends on the region"
  elif [[ "$def" != *"+towgs84="* && "$def" != *"+datum=WGS84"* && "$def" != *"+datum=NAD83"* \
          && "$def" != *"+nadgrids=@null"* ]]; then
    op="$(projinfo -s "EPSG:$c" -t EPSG:4326 --spatial-test intersects -o PROJ -q --single-line | sed -n 1p)"
    opname="$(projinfo -s "EPSG:$c" -t EPSG:4326 --spatial-test intersects --summary | sed -n 2p \
              | sed 's/^[^,]*, //; s/, [^,]* m,.*$//; s/, unknown accuracy.*$//')"
    nhelmert="$( { grep -o '+proj=helmert' <<<"$op" || true; } | wc -l)"
    if grep -Eq 'gridshift|molodensky|deformation|\+proj=affine' <<<"$op" || [ "$nhelmert" -gt 1 ]; then
      status=no_shift
      shift_note="PROJ's first operation ($opname) is not a plain Helmert shift"
    elif [ "$nhelmert" -eq 0 ]; then
      def="${def/ +units=/ +towgs84=0,0,0 +units=}"
      [[ "$def" == *"+towgs84="* ]] || def="${def/ +no_defs/ +towgs84=0,0,0 +no_defs}"
      shift_note="added: null transformation, as in PROJ's first operation ($opname)"
    else
      h="$(awk 'BEGIN { RS = "[+]step " } /[+]proj=helmert/ { print " " $0 }' <<<"$op")"
      p() { sed -n "s/.*+$1=\([^ ]*\).*/\1/p" <<<"$h"; }
      neg() { case "$1" in -*) echo "${1#-}" ;; 0 | "") echo 0 ;; *) echo "-$1" ;; esac; }
      x="$(p x)"; y="$(p y)"; z="$(p z)"; rx="$(p rx)"; ry="$(p ry)"; rz="$(p rz)"; s="$(p s)"
      conv="$(p convention)"
      if [[ "$h" == *" +inv "* ]]; then status=no_shift; shift_note="inverse Helmert not handled"; fi
      if [ "$conv" = coordinate_frame ]; then rx="$(neg "$rx")"; ry="$(neg "$ry")"; rz="$(neg "$rz")"; fi
      if [ -z "$rx$ry$rz$s" ]; then tw="$x,$y,$z"; else tw="$x,$y,$z,${rx:-0},${ry:-0},${rz:-0},${s:-0}"; fi
      def="${def/ +units=/ +towgs84=$tw +units=}"
      [[ "$def" == *"+towgs84="* ]] || def="${def/ +no_defs/ +towgs84=$tw +no_defs}"
      shift_note="added: $opname ($conv${conv:+ }Helmert)"
    fi
  fi
  jq -n --arg c "$c" --arg n "$name" --arg k "$kind" --arg d "$def" --arg st "$status" --arg sh "$shift_note" \
    '{key: $c, value: {name: $n, kind: $k, proj4: $d, status: $st, shift: $sh}}' >>"$tmp"
done
jq -s --arg v "$proj_version" \
  '{about: "Generated by src/stations/make-crs-defs.sh from PROJ projinfo; do not edit by hand.", proj: $v, defs: from_entries}' \
  "$tmp" >"$out"
echo "wrote $out: $(jq '.defs | length' "$out") codes; not usable offline:" >&2
jq -r '.defs | to_entries[] | select(.value.status != "ok") | "  EPSG:\(.key) \(.value.status): \(.value.shift)"' "$out" >&2
jq -r '.defs | to_entries[] | select(.value.shift | startswith("added")) | "  EPSG:\(.key) \(.value.shift)"' "$out" >&2
