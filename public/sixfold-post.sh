#!/bin/sh
# sixfold-post.sh LAYOUT_ID FILE — posts FILE to Sixfold as a new revision of layout LAYOUT_ID.
# Exit 0: accepted, no error findings; 1: error findings; 2: file refused (located errors printed); 3: other answer.
# Needs SIXFOLD_TOKEN (Settings → API tokens) and SIXFOLD_URL (default http://localhost:3000). CSV: set SIXFOLD_UNITS="length=mm&force=N".
set -eu
: "${SIXFOLD_TOKEN:?set SIXFOLD_TOKEN to your Sixfold API token}"
URL="${SIXFOLD_URL:-http://localhost:3000}"
[ $# -eq 2 ] || { echo "usage: $0 LAYOUT_ID FILE" >&2; exit 3; }
case "$2" in
  *.json) TYPE=application/json; QUERY="" ;;
  *.xml) TYPE=application/xml; QUERY="" ;;
  *) TYPE=text/csv; QUERY="?${SIXFOLD_UNITS:-length=mm&force=N}" ;;
esac
OUT=$(mktemp)
trap 'rm -f "$OUT"' EXIT
CODE=$(curl -sS -o "$OUT" -w '%{http_code}' -X POST \
  -H "Authorization: Bearer $SIXFOLD_TOKEN" -H "Content-Type: $TYPE" -H "X-File-Name: $(basename "$2")" \
  --data-binary @"$2" "$URL/api/v1/layouts/$1/revisions$QUERY")
case "$CODE" in
  201)
    if grep -q '"severity":"error"' "$OUT"; then echo "Sixfold: error findings in $(basename "$2")" >&2; cat "$OUT"; exit 1; fi
    echo "Sixfold: $(basename "$2") accepted, no error findings"; cat "$OUT"; exit 0 ;;
  422|413) echo "Sixfold refused $(basename "$2"):" >&2; cat "$OUT" >&2; exit 2 ;;
  *) echo "Sixfold answered HTTP $CODE" >&2; cat "$OUT" >&2; exit 3 ;;
esac
