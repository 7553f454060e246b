#!/usr/bin/env bash
# Every verb's json validates against schemas/coldcore-report.schema.json (issue 16), by Debian's
# python3-jsonschema (installed here when missing, as scripts/deps.sh does). A doctored copy
# (an "inf" string for a number, a key with a space, a missing envelope key) must fail, so the
# check is shown to be able to fail.
# usage: tests/data/check_json_schema.sh COLDCORE OUT_DIR      Exit: 0 pass, 1 fail, 77 skipped.
set -euo pipefail
root="$(cd "$(dirname "$0")/../.." && pwd)"
cc="$(cd "$(dirname "$1")" && pwd)/$(basename "$1")"
out="$2"
source "$root/scripts/deps.sh"
if ! /usr/bin/python3 -c "import jsonschema" 2>/dev/null; then
  if ! (coldcore_install_missing python3-jsonschema) || ! /usr/bin/python3 -c "import jsonschema" 2>/dev/null; then
    echo "json schema check: SKIPPED: python3-jsonschema is not installed and could not be installed"
    exit 77
  fi
fi
rm -rf "$out"
mkdir -p "$out"
cd "$root"
bash tests/data/make_outputs.sh "$cc" "$out" json
/usr/bin/python3 - "$root/schemas/coldcore-report.schema.json" "$out" <<'PY'
import copy, glob, json, sys
import jsonschema
schema = json.load(open(sys.argv[1], encoding="utf-8"))
jsonschema.Draft202012Validator.check_schema(schema)
validator = jsonschema.Draft202012Validator(schema)
files = sorted(glob.glob(sys.argv[2] + "/*.json"))
verbs = set()
bad = 0
for f in files:
    doc = json.load(open(f, encoding="utf-8"))
    verbs.add(doc.get("verb"))
    errors = list(validator.iter_errors(doc))
    for e in errors[:5]:
        print(f"{f}: {'/'.join(str(p) for p in e.absolute_path)}: {e.message[:200]}")
    bad += bool(errors)
expected = {"run", "probe", "solve", "deviation", "fit", "modes", "props", "organisms", "rules", "media"}
if verbs != expected:
    print("verbs checked:", sorted(v for v in verbs if v), "expected:", sorted(expected))
    bad += 1
# The check can fail: each doctoring of a valid run report must be refused.
run = json.load(open(sys.argv[2] + "/run-corned-beef-can.json", encoding="utf-8"))
doctored = []
d = copy.deepcopy(run); d["summary"]["stages"][0]["biot"] = "inf"; doctored.append(("biot as the string inf", d))
d = copy.deepcopy(run); d["provenance"]["input SHA-256"] = d["provenance"].pop("input_sha256"); doctored.append(("key with a space", d))
d = copy.deepcopy(run); del d["schema_version"]; doctored.append(("no schema_version", d))
d = copy.deepcopy(run); d["assessment"][0]["margin"] = "1.5 min"; doctored.append(("margin as text", d))
d = copy.deepcopy(run); d["assessment"][0]["verdict"] = "passed"; doctored.append(("verdict word", d))
for what, doc in doctored:
    if validator.is_valid(doc):
        print("doctored report accepted:", what)
        bad += 1
print(f"json schema check: {len(files)} reports of {len(verbs)} verbs, {len(doctored)} doctored copies; {'FAIL' if bad else 'pass'}")
sys.exit(1 if bad else 0)
PY
