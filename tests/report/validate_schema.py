"""Validates plotproof findings JSON against docs/findings.schema.json with the python3
jsonschema package (Debian python3-jsonschema), an implementation of JSON Schema draft
2020-12 that is independent of plotproof.

usage: validate_schema.py SCHEMA EMITTER     (runs EMITTER, validates its stdout)
Also checks that the schema rejects a broken copy, so the check itself can fail."""
import copy
import json
import subprocess
import sys

try:
    import jsonschema
except ImportError:  # a visible skip (meson's exit code 77), never a silent pass
    print("SKIP: python3-jsonschema not installed")
    sys.exit(77)


def main():
    schema_path, emitter = sys.argv[1], sys.argv[2]
    with open(schema_path, encoding="utf-8") as f:
        schema = json.load(f)
    jsonschema.Draft202012Validator.check_schema(schema)
    validator = jsonschema.Draft202012Validator(schema)
    out = subprocess.run([emitter], check=True, capture_output=True).stdout
    def no_constants(name):  # json.loads accepts NaN/Infinity, RFC 8259 does not
        raise ValueError("non-finite literal in output: " + name)

    doc = json.loads(out.decode("utf-8"), parse_constant=no_constants)
    errors = list(validator.iter_errors(doc))
    for e in errors:
        print("schema error:", "/".join(map(str, e.absolute_path)), e.message)
    assert not errors
    # The schema must not accept anything: drop a required field, break a type.
    broken = copy.deepcopy(doc)
    del broken["findings"][0]["measures"]["gdi"]
    assert list(validator.iter_errors(broken)), "schema accepted a finding without gdi"
    broken = copy.deepcopy(doc)
    broken["pages"][0]["figures"][0]["bbox"] = [1, 2, 3]
    assert list(validator.iter_errors(broken)), "schema accepted a 3-number bbox"
    print("ok: sample findings file validates against", schema_path)


if __name__ == "__main__":
    main()
