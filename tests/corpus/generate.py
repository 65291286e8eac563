#!/usr/bin/env python3
"""Writes the malformed-input corpus under tests/corpus/cases from the valid files in tests/corpus/base.

Every key of each base file is mutated in turn (a wrong type, negative, zero, NaN, infinity, a huge value,
deleted, given twice, an unknown key beside it); structural cases are added by hand below. Mutations that
leave a file valid (a seed of 0, a negative offset) are listed in STILL_VALID with the reason and left out,
so that every case in the corpus must be refused. The test CorpusTests runs each case's command and checks:
exit 2, a file:line:column or the offending option named, no stack trace, no output left, within a time limit.

Needs PyYAML (python3 -m pip install pyyaml) to read the base files; the corpus itself is checked in, so the
tests do not need Python. Rerun after changing a base file:  python3 tests/corpus/generate.py
"""
import json
import math
import os
import re
import shutil

import yaml

HERE = os.path.dirname(os.path.abspath(__file__))
BASE = os.path.join(HERE, "base")
CASES = os.path.join(HERE, "cases")

# (file kind, dotted path, mutation) -> why the mutated file is still a valid input.
STILL_VALID = {
    ("scenario", "name", "number"): "a name of digits reads as text",
    ("scenario", "description", "empty"): "free text",
    ("scenario", "description", "path"): "free text",
    ("scenario", "environment.irradiance_w_m2", "scalar"): "a constant 5 W/m2",
    ("scenario", "environment.shading", "empty"): "no shading",
    ("scenario", "environment.shading[0].name", "empty"): "an optional label",
    ("scenario", "environment.shading[0].name", "path"): "a label only; it names no file",
    ("scenario", "environment.shading[0].moving_shadow.from_substring", "negative"): "a shadow may start beside the string",
    ("scenario", "environment.shading[0].moving_shadow.to_substring", "negative"): "a shadow may end beside the string",
    ("scenario", "environment.shading[0].moving_shadow.to_substring", "zero"): "a shadow moving back to the first substring",
    ("scenario", "scoring", "empty"): "all scoring settings have defaults",
    ("scenario", "scoring.curve_snapshots_s", "empty"): "no snapshots",
    ("scenario", "scoring.windows", "empty"): "no windows",
    ("scenario", "scoring.windows[0].name", "number"): "a name of digits reads as text",
    ("scenario", "scoring.settling_hold_s", "zero"): "settled on entering the band",
    ("scenario", "simulation", "empty"): "duration from the profiles, plant step chosen",
    ("scenario", "trackers[0].limits", "empty"): "default limits",
    ("scenario", "trackers[0].parameters", "empty"): "default parameters",
    ("scenario", "trackers[1].parameters", "empty"): "default parameters",
    ("scenario", "trackers[1].name", "number"): "a name of digits reads as text",
    ("summary", "trackers[0]", "delete"): "a summary with one tracker is valid (compare then reports the other as new)",
    ("sweep", "name", "number"): "a name of digits reads as text",
    ("sweep", "sampling", "empty"): "grid sampling by default",
    ("sweep", "trackers[0].parameters", "empty"): "nothing swept but the period",
    ("sweep", "trackers[1].parameters", "empty"): "nothing swept",
    ("sweep", "trackers[0].parameters.step_v", "scalar"): "a fixed value",
    ("sweep", "trackers[1].parameters.step_v", "scalar"): "a fixed value",
    ("sweep", "trackers[0].parameters.step_v", "list"): "a list of one value",
    ("sweep", "trackers[1].parameters.step_v", "list"): "a list of one value",
    ("sweep", "trackers[0].parameters.step_v.step", "huge"): "a range of one value",
    ("tolerances", "energy_wh", "empty"): "zero tolerance",
    ("tolerances", "tracking_efficiency", "empty"): "zero tolerance",
    ("tolerances", "window:*", "empty"): "zero tolerance",
    ("tolerances", "energy_wh.absolute", "huge"): "a tolerance that switches the gate of a score off",
    ("tolerances", "energy_wh.relative", "huge"): "a tolerance that switches the gate of a score off",
    ("tolerances", "tracking_efficiency.absolute", "huge"): "a tolerance that switches the gate of a score off",
    ("tolerances", "window:*.absolute", "huge"): "a tolerance that switches the gate of a score off",
    ("scenario", "description", "number"): "a description is free text; 123 reads as text",
    ("scenario", "description", "delete"): "description is optional",
    ("scenario", "converter.inductor_resistance_ohm", "zero"): "an ideal inductor",
    ("scenario", "converter.min_duty", "zero"): "0 is a legal lower duty limit",
    ("scenario", "module.datasheet.voc_temperature_coefficient_v_per_k", "zero"): "a zero coefficient is unusual but physical input",
    ("scenario", "module.datasheet.voc_temperature_coefficient_v_per_k", "negative"): "Voc falls with temperature: negative is the normal sign",
    ("scenario", "module.datasheet.isc_temperature_coefficient_a_per_k", "zero"): "a zero coefficient is unusual but physical input",
    ("scenario", "module.datasheet.isc_temperature_coefficient_a_per_k", "negative"): "-1 A/K is inside the accepted -1..1 A/K",
    ("scenario", "environment.ambient_temperature_c", "zero"): "0 C is a temperature",
    ("scenario", "environment.ambient_temperature_c", "negative"): "-1 C is a temperature",
    ("scenario", "environment.irradiance_w_m2[0].start", "zero"): "night",
    ("scenario", "environment.irradiance_w_m2[1].hold_s", "zero"): "a zero-length hold",
    ("scenario", "environment.irradiance_w_m2[2].ramp.to", "zero"): "a ramp to night",
    ("scenario", "environment.irradiance_w_m2[2].ramp.over_s", "zero"): "a ramp of zero length is a step",
    ("scenario", "environment.irradiance_w_m2[3].repeat.segments[0].step", "zero"): "a step to night",
    ("scenario", "environment.irradiance_w_m2[3].repeat.segments[1].hold_s", "zero"): "a zero-length hold",
    ("scenario", "environment.irradiance_w_m2[4].csv.time_column", "delete"): "defaults to column 1",
    ("scenario", "environment.irradiance_w_m2[4].csv.value_column", "delete"): "defaults to column 2",
    ("scenario", "environment.shading[0].name", "number"): "a name of digits reads as text",
    ("scenario", "environment.shading[0].name", "delete"): "a shading entry's name is optional",
    ("scenario", "environment.shading[0].moving_shadow.from_substring", "zero"): "0 is the base value",
    ("scenario", "environment.shading[0].moving_shadow.start_s", "zero"): "0 is the base value",
    ("scenario", "environment.shading[0].moving_shadow.transmittance", "zero"): "an opaque shadow",
    ("scenario", "simulation.seed", "zero"): "0 is a seed",
    ("scenario", "simulation.seed", "delete"): "defaults to 1",
    ("scenario", "simulation.seeds", "delete"): "one seed by default",
    ("scenario", "simulation.series_interval_ms", "zero"): "0 means every plant step",
    ("scenario", "simulation.series_interval_ms", "delete"): "optional",
    ("scenario", "simulation.duration_s", "delete"): "defaults to the profile's length",
    ("scenario", "simulation.plant_step_us", "delete"): "chosen for the trackers' periods",
    ("scenario", "simulation.environment_step_ms", "delete"): "optional",
    ("scenario", "sensors.voltage.noise_rms_v", "zero"): "a noiseless sensor",
    ("scenario", "sensors.current.noise_rms_a", "zero"): "a noiseless sensor",
    ("scenario", "sensors.voltage.averaging_window_us", "zero"): "no averaging window",
    ("scenario", "sensors.current.averaging_window_us", "zero"): "no averaging window",
    ("scenario", "scoring.curve_snapshots_s[0]", "zero"): "a snapshot at t = 0",
    ("scenario", "scoring.windows[0].start_s", "zero"): "0 is the base value",
    ("scenario", "scoring.static_allowance_s", "zero"): "no allowance",
    ("scenario", "trackers[0].parameters.start_fraction", "zero"): "inside the declared 0..1.2",
    ("scenario", "trackers[0].name", "number"): "a name of digits reads as text",
    ("sweep", "tune.max_evaluations", "delete"): "optional",
    ("sweep", "trackers[0].parameters.start_fraction", "zero"): "inside the declared 0..1.2",
    ("sweep", "trackers[0].name", "number"): "a name of digits reads as text",
    ("sweep", "trackers[1].name", "number"): "a name of digits reads as text",
    ("sweep", "trackers[1].name", "delete"): "defaults to the type",
    ("tolerances", "energy_wh.relative", "zero"): "no relative tolerance",
    ("tolerances", "energy_wh.relative", "delete"): "optional",
    ("tolerances", "energy_wh.absolute", "zero"): "no absolute tolerance",
    ("tolerances", "energy_wh.absolute", "delete"): "optional",
    ("tolerances", "tracking_efficiency.absolute", "zero"): "no tolerance",
    ("tolerances", "tracking_efficiency.absolute", "delete"): "an empty tolerance",
    ("tolerances", "window:*.absolute", "zero"): "no tolerance",
    ("tolerances", "window:*.absolute", "delete"): "an empty tolerance",
    ("tolerances", "tracking_efficiency", "delete"): "keys are optional",
    ("tolerances", "energy_wh", "delete"): "keys are optional",
    ("tolerances", "window:*", "delete"): "keys are optional",
}

# Keys whose deletion leaves a valid file (optional keys) are found by prefix here, beside STILL_VALID.
OPTIONAL_PREFIXES = {
    "scenario": ["array.bypass_diode", "scoring.curve_snapshots_s", "scoring.settling_band_fraction", "scoring.settling_hold_s",
                 "scoring.static_allowance_s", "scoring.stall_fraction", "scoring.windows", "sensors.current.averaging_samples", "sensors.current.averaging_window_us",
                 "sensors.voltage.averaging_samples", "sensors.voltage.averaging_window_us", "converter.input_capacitance_uf", "converter.inductance_mh", "converter.inductor_resistance_ohm",
                 "converter.min_duty", "converter.max_duty", "converter.voltage_loop_bandwidth_hz", "converter.current_loop_bandwidth_hz",
                 "converter.bus_voltage_v", "sensors.voltage.noise_rms_v", "sensors.current.noise_rms_a", "sensors.voltage.averaging",
                 "sensors.current.averaging", "sensors.voltage.bits", "sensors.current.bits", "environment.shading", "scoring",
                 "trackers[0].parameters", "trackers[0].limits", "trackers[1].parameters", "trackers[0].name", "trackers[1].name",
                 "trackers[0].period_ms", "trackers[1].period_ms", "environment.noct_c@never", "array.strings",
                 "array.substrings_per_module", "environment.irradiance_w_m2[4].csv.skip_header", "environment.shading[0].moving_shadow.width_substrings",
                 "environment.shading[0].moving_shadow.transmittance", "environment.shading[0].moving_shadow.start_s", "environment.shading[0].moving_shadow.end_s",
                 "environment.irradiance_w_m2[1]", "environment.irradiance_w_m2[2]", "environment.irradiance_w_m2[3]",
                 "environment.irradiance_w_m2[4]", "environment.irradiance_w_m2[3].repeat.segments[0]", "environment.irradiance_w_m2[3].repeat.segments[1]",
                 "scoring.windows[0]", "scoring.curve_snapshots_s[0]", "trackers[0].limits.", "trackers[1].parameters.", "trackers[0].parameters.",
                 "environment.shading[0]", "trackers[0]", "trackers[1]"],
    "sweep": ["trackers[0].parameters.step_v", "trackers[1].parameters.step_v", "sampling", "objective", "heatmap", "tune", "trackers[0].parameters", "trackers[1].parameters", "trackers[0].period_ms",
              "trackers[0].parameters.start_fraction", "tune.over", "tune.goal", "tune.score", "trackers[0]", "trackers[1]",
              "trackers[0].period_ms[0]", "trackers[0].period_ms[1]", "sampling.method"],
    "tolerances": [],
}


class Dup:
    """A mapping written with one key twice."""

    def __init__(self, pairs):
        self.pairs = pairs


def scalar(v):
    if v is None:
        return "null"
    if isinstance(v, bool):
        return "true" if v else "false"
    if isinstance(v, float):
        if math.isnan(v):
            return ".nan"
        if math.isinf(v):
            return ".inf" if v > 0 else "-.inf"
        return repr(v)
    if isinstance(v, int):
        return str(v)
    s = str(v)
    if s == "" or re.search(r"[:#\[\]{},&*!|>'\"%@`]|^\s|\s$|^(true|false|null|~|yes|no|[-+.\d])", s):
        return json.dumps(s)
    return s


def emit(v, indent=0):
    """Block-style YAML for nested dicts, lists, scalars and Dup mappings."""
    pad = "  " * indent
    if isinstance(v, (dict, Dup)):
        pairs = v.pairs if isinstance(v, Dup) else list(v.items())
        if not pairs:
            return pad + "{}\n"
        out = ""
        for k, x in pairs:
            key = scalar(k)
            if isinstance(x, (dict, Dup, list)) and (x.pairs if isinstance(x, Dup) else x):
                out += f"{pad}{key}:\n" + emit(x, indent + 1)
            elif isinstance(x, (dict, Dup)):
                out += f"{pad}{key}: {{}}\n"
            elif isinstance(x, list):
                out += f"{pad}{key}: []\n"
            else:
                out += f"{pad}{key}: {scalar(x)}\n"
        return out
    if isinstance(v, list):
        if not v:
            return pad + "[]\n"
        out = ""
        for x in v:
            if isinstance(x, (dict, Dup, list)) and (x.pairs if isinstance(x, Dup) else x):
                body = emit(x, indent + 1)
                out += f"{pad}- " + body[len(pad) + 2:]
            else:
                out += f"{pad}- {scalar(x) if not isinstance(x, (dict, list, Dup)) else ('{}' if isinstance(x, (dict, Dup)) else '[]')}\n"
        return out
    return pad + scalar(v) + "\n"


def paths(node, prefix=""):
    """Every (path, parent, key) in the tree, parents before children."""
    if isinstance(node, dict):
        for k, v in node.items():
            p = f"{prefix}.{k}" if prefix else str(k)
            yield p, node, k
            yield from paths(v, p)
    elif isinstance(node, list):
        for i, v in enumerate(node):
            p = f"{prefix}[{i}]"
            yield p, node, i
            yield from paths(v, p)


def mutations(value):
    if isinstance(value, bool):
        return {"text": "maybe", "number": 7, "list": [1, 2]}
    if isinstance(value, (int, float)):
        return {"text": "abc", "negative": -1.0 if value != -1 else -1000.0, "zero": 0, "nan": float("nan"), "inf": float("inf"), "huge": 1e300}
    if isinstance(value, str):
        return {"number": 123, "empty": "", "list": ["a"], "map": {"x": 1}, "path": "../escape/" + value}
    if isinstance(value, dict):
        return {"scalar": 5, "list": [1], "empty": {}}
    if isinstance(value, list):
        return {"scalar": 5, "map": {"x": 1}, "empty": []}
    return {}


def parts_of(path):
    return re.findall(r"[^.\[\]]+|\[\d+\]", path)


def key_of(part):
    return int(part[1:-1]) if part.startswith("[") else part


def slug_of(path):
    return re.sub(r"[^A-Za-z0-9_.-]+", "_", path)[:80]


def mutated(base, path, mutation, replacement):
    """A copy of base with the value at path deleted or replaced."""
    doc = deep_copy(base)
    target = doc
    for part in parts_of(path)[:-1]:
        target = target[key_of(part)]
    k = key_of(parts_of(path)[-1])
    if mutation == "delete":
        del target[k]
    else:
        target[k] = replacement
    return doc


def is_still_valid(kind, path, mutation):
    if (kind, path, mutation) in STILL_VALID:
        return True
    if mutation == "delete":
        return any(path == p or (p.endswith(".") and path.startswith(p)) for p in OPTIONAL_PREFIXES[kind])
    return False


def deep_copy(x):
    return json.loads(json.dumps(x, allow_nan=True))


def write_case(name, files, command, expect_file):
    folder = os.path.join(CASES, name)
    os.makedirs(folder)
    for fname, text in files.items():
        mode = "wb" if isinstance(text, bytes) else "w"
        with open(os.path.join(folder, fname), mode) as f:
            f.write(text)
    with open(os.path.join(folder, "case.txt"), "w") as f:
        f.write(f"command: {command}\nexpect: {expect_file}\n")


def yaml_cases(kind, base_name, command_of, extra_files, adapt=lambda d: d):
    with open(os.path.join(BASE, base_name)) as f:
        base = adapt(yaml.safe_load(f))
    count = 0
    for path, parent, key in list(paths(base)):
        original = parent[key]
        cases = dict(mutations(original))
        cases["delete"] = None
        for m, replacement in cases.items():
            if is_still_valid(kind, path, m):
                continue
            doc = mutated(base, path, m, replacement)
            name = f"{kind}-{slug_of(path)}-{m}"
            write_case(name, {base_name: emit(doc), **extra_files}, command_of(base_name), base_name)
            count += 1
        if isinstance(parent, dict) and isinstance(original, (int, float, str)) and not isinstance(original, bool):
            # The same key twice, and an unknown key beside it.
            doc = deep_copy(base)
            target = doc
            for part in re.findall(r"[^.\[\]]+|\[\d+\]", path)[:-1]:
                target = target[int(part[1:-1])] if part.startswith("[") else target[part]
            pairs = list(target.items()) + [(key, original)]
            if len(re.findall(r"[^.\[\]]+|\[\d+\]", path)) == 1:
                doc = Dup(pairs)
            else:
                replace_in(doc, path, Dup(pairs))
            slug = re.sub(r"[^A-Za-z0-9_.-]+", "_", path)[:80]
            write_case(f"{kind}-{slug}-twice", {base_name: emit(doc), **extra_files}, command_of(base_name), base_name)
            doc = deep_copy(base)
            target = doc
            for part in re.findall(r"[^.\[\]]+|\[\d+\]", path)[:-1]:
                target = target[int(part[1:-1])] if part.startswith("[") else target[part]
            target[str(key) + "_typo"] = original
            write_case(f"{kind}-{slug}-unknown-beside", {base_name: emit(doc), **extra_files}, command_of(base_name), base_name)
            count += 2
    return count


def replace_in(doc, path, new_parent):
    parts = re.findall(r"[^.\[\]]+|\[\d+\]", path)[:-1]
    target = doc
    for part in parts[:-1]:
        target = target[int(part[1:-1])] if part.startswith("[") else target[part]
    last = parts[-1]
    target[int(last[1:-1]) if last.startswith("[") else last] = new_parent


def main():
    if os.path.isdir(CASES):
        shutil.rmtree(CASES)
    os.makedirs(CASES)
    read = lambda n: open(os.path.join(BASE, n)).read()
    csv = read("profile.csv")
    scenario_text = read("scenario.yaml")
    total = 0
    run = lambda f: f"run {f} --out {{out}} --no-plots --quiet"
    # Mutated files name the shared base files as {base}/...; the test puts the base folder's path there.
    def csv_from_base(d):
        d["environment"]["irradiance_w_m2"][4]["csv"]["file"] = "{base}/profile.csv"
        return d

    def scenario_from_base(d):
        d["scenarios"] = ["{base}/scenario.yaml"]
        return d

    total += yaml_cases("scenario", "scenario.yaml", run, {}, csv_from_base)
    total += yaml_cases("sweep", "sweep.yaml", lambda f: f"sweep {f} --out {{out}} --no-plots --quiet", {}, scenario_from_base)
    total += yaml_cases("tolerances", "tolerances.yaml", lambda f: f"compare {{base}}/summary.json {{base}}/summary.json --tolerances {f}", {})

    # Structural YAML cases.
    structural = {
        "second-document": scenario_text + "---\nname: another\n",
        "unknown-tag": scenario_text.replace("seed: 7", "seed: !secret 7"),
        "undefined-alias": scenario_text.replace("seed: 7", "seed: *the_seed"),
        "deep-nesting": scenario_text.replace("description: every section of a scenario, briefly", "description: " + "[" * 100000),
        "deep-mapping": scenario_text.replace("description: every section of a scenario, briefly", "description: " + "{a: " * 200 + "1" + "}" * 200),
        "repeat-bomb": scenario_text.replace("repeat: { times: 2, segments: [ { step: 700 }, { hold_s: 0.02 } ] }",
                                             "repeat: { times: 100000, segments: [ { repeat: { times: 100000, segments: [ { repeat: { times: 100000, segments: [ { step: 700 }, { step: 600 } ] } } ] } } ] }"),
        "repeat-too-deep": scenario_text.replace("repeat: { times: 2, segments: [ { step: 700 }, { hold_s: 0.02 } ] }",
                                                 "repeat: { times: 1, segments: [ " * 12 + "{ step: 700 }" + " ] } }" * 12),
        "empty-file": "",
        "only-a-comment": "# nothing here\n",
        "a-list": "- 1\n- 2\n",
        "a-scalar": "hello\n",
        "tab-indent": scenario_text.replace("  type: boost", "\ttype: boost"),
        "unclosed-quote": scenario_text.replace("name: corpus-base", "name: \"corpus-base"),
        "unclosed-flow": scenario_text.replace("bypass_diode: { forward_voltage_v: 0.45, at_current_a: 10 }", "bypass_diode: { forward_voltage_v: 0.45, at_current_a: 10"),
        "binary-garbage": None,
        "name-is-a-path": scenario_text.replace("name: corpus-base", "name: ../corpus-base"),
        "name-too-long": scenario_text.replace("name: corpus-base", "name: " + "n" * 300),
        "tracker-name-is-a-path": scenario_text.replace("{ name: po,", "{ name: ../cv,"),
        "tracker-name-too-long": scenario_text.replace("{ name: po,", "{ name: " + "t" * 300 + ","),
        "duplicate-top-key": scenario_text + "name: again\n",
        "duty-tracker-on-ideal-source": scenario_text.replace("type: boost", "type: ideal_source").replace("type: perturb_observe,", "type: perturb_observe_duty,"),
        "period-not-whole-steps": scenario_text.replace("period_ms: 10, parameters: { step_v: 3", "period_ms: 10.05, parameters: { step_v: 3"),
        "bus-below-mpp": scenario_text.replace("bus_voltage_v: 700", "bus_voltage_v: 250"),
        "bus-absurd": scenario_text.replace("bus_voltage_v: 700", "bus_voltage_v: 1e300"),
        "adc-below-voc": scenario_text.replace("full_scale_v: 500", "full_scale_v: 300"),
        "adc-below-isc": scenario_text.replace("full_scale_a: 12", "full_scale_a: 5"),
        "buck-battery-above-mpp": scenario_text.replace("type: boost", "type: buck\n  battery_voltage_v: 400"),
        "csv-missing": scenario_text.replace("file: profile.csv", "file: nowhere.csv"),
        "csv-is-a-folder": scenario_text.replace("file: profile.csv", "file: ."),
        "csv-same-columns": scenario_text.replace("value_column: 2", "value_column: 1"),
        "csv-ends-before-run": scenario_text.replace(", hold_last: true", ""),
        "window-after-run": scenario_text.replace("{ name: early, start_s: 0, end_s: 0.1 }", "{ name: early, start_s: 0.2, end_s: 5 }"),
        "window-backwards": scenario_text.replace("{ name: early, start_s: 0, end_s: 0.1 }", "{ name: early, start_s: 0.1, end_s: 0.05 }"),
        "plugin-missing": scenario_text + "plugins: [nowhere.dll]\n",
        "native-library-missing": scenario_text.replace("type: periodic_scan, period_ms: 10, parameters: { scan_interval_s: 1, scan_points: 20 }", "type: native, library: nowhere.so, period_ms: 10"),
        "native-not-a-library": scenario_text.replace("type: periodic_scan, period_ms: 10, parameters: { scan_interval_s: 1, scan_points: 20 }", "type: native, library: profile.csv, period_ms: 10"),
        "command-empty": scenario_text.replace("type: periodic_scan, period_ms: 10, parameters: { scan_interval_s: 1, scan_points: 20 }", "type: process, command: [], period_ms: 10"),
        "isolation-on-built-in": scenario_text.replace("type: periodic_scan,", "type: periodic_scan, isolation: process,"),
    }
    for name, text in structural.items():
        files = {"scenario.yaml": text if text is not None else bytes(range(256)) * 4, "profile.csv": csv}
        write_case(f"structure-{name}", files, run("scenario.yaml"), "scenario.yaml")
        total += 1

    # Structural sweep cases.
    sweep_text = read("sweep.yaml").replace("scenarios: [scenario.yaml]", "scenarios: [{base}/scenario.yaml]")
    sweep_structural = {
        "too-many-cases": sweep_text.replace("step_v: { from: 1, to: 3, step: 1 }", "step_v: { from: 1, to: 10000, step: 0.1 }\n      start_fraction: { from: 0, to: 1.2, step: 0.001 }").replace("      start_fraction: 0.8\n", ""),
        "heatmap-axis-unknown": sweep_text.replace("heatmap: { x: period_ms, y: step_v }", "heatmap: { x: period_ms, y: stepsize }"),
        "objective-unknown": sweep_text.replace("objective: tracking_efficiency", "objective: speed"),
        "objective-window-unknown": sweep_text.replace("objective: tracking_efficiency", "objective: window:late"),
        "tune-score-unknown": sweep_text.replace("score: tracking_efficiency, goal", "score: speed, goal"),
        "tune-tracker-unknown": sweep_text.replace("tune: { tracker: po,", "tune: { tracker: nope,"),
        "period-not-whole-steps": sweep_text.replace("period_ms: [10, 20]", "period_ms: [10, 20.05]"),
        "duty-tracker-on-ideal-source-scenario": sweep_text.replace("type: incremental_conductance", "type: perturb_observe_duty").replace(
            "step_v: { log_from: 0.5, log_to: 4, count: 3 }", "step_duty: 0.01").replace("scenarios: [{base}/scenario.yaml]", "scenarios: [ideal.yaml]"),
        "scenario-missing": sweep_text.replace("scenarios: [{base}/scenario.yaml]", "scenarios: [nowhere.yaml]"),
        "same-case-twice": sweep_text.replace("  - name: inc\n    type: incremental_conductance", "  - name: po\n    type: incremental_conductance"),
    }
    ideal = scenario_text.replace("type: boost", "type: ideal_source").replace("file: profile.csv", "file: {base}/profile.csv")
    for name, text in sweep_structural.items():
        files = {"sweep.yaml": text}
        if "ideal.yaml" in text:
            files["ideal.yaml"] = ideal
        write_case(f"sweep-structure-{name}", files, "sweep sweep.yaml --out {out} --no-plots --quiet", "sweep.yaml")
        total += 1

    # CSV profiles.
    csv_cases = {
        "text-value": "time_s,g\n0,650\n0.05,bright\n1,700\n",
        "text-time": "time_s,g\n0,650\nnoon,700\n1,700\n",
        "nan-value": "time_s,g\n0,650\n0.05,NaN\n1,700\n",
        "inf-time": "time_s,g\n0,650\nInfinity,700\n",
        "negative-value": "time_s,g\n0,650\n0.05,-5\n1,700\n",
        "huge-value": "time_s,g\n0,650\n0.05,1e300\n1,700\n",
        "time-backwards": "time_s,g\n0,650\n0.5,700\n0.2,700\n1,700\n",
        "negative-first-time": "time_s,g\n-1,650\n1,700\n",
        "one-column": "time_s\n0\n1\n",
        "short-row": "time_s,g\n0,650\n0.05\n1,700\n",
        "header-only": "time_s,g\n",
        "empty": "",
        "unbalanced-quote": "time_s,g\n0,\"650\n1,700\n",
        "binary": None,
    }
    for name, text in csv_cases.items():
        files = {"scenario.yaml": scenario_text, "profile.csv": text if text is not None else bytes(range(256)) * 4}
        write_case(f"csv-{name}", files, run("scenario.yaml"), "profile.csv|scenario.yaml")
        total += 1

    # Summaries given to compare.
    with open(os.path.join(BASE, "summary.json")) as f:
        summary = json.load(f)
    summary_text = json.dumps(summary, indent=2)
    compare = "compare summary.json {base}/summary.json"
    for path, parent, key in list(paths(summary)):
        value = parent[key]
        if path.startswith("trackers[1]") or ".settling[" in path or ".parameters." in path:
            continue
        muts = {}
        if isinstance(value, bool):
            muts = {"text": "yes"}
        elif isinstance(value, (int, float)):
            muts = {"text": "high", "list": [1]}
        elif isinstance(value, str):
            muts = {"number": 5, "list": ["x"]}
        elif isinstance(value, dict):
            muts = {"scalar": 5}
        elif isinstance(value, list):
            muts = {"scalar": 5}
        if ("summary", path, "delete") in STILL_VALID:
            required = None
        else:
            required = re.fullmatch(r"(schema|tool_version|scenario|trackers|scenario\.(name|seed|plant_digest|duration_s|plant_step_s)|trackers\[0\](\.(name|kind|failed|scores))?)", path)
        if required:
            muts["delete"] = None
        for m, replacement in muts.items():
            doc = mutated(summary, path, m, replacement)
            write_case(f"summary-{slug_of(path)}-{m}", {"summary.json": json.dumps(doc, indent=2)}, compare, "summary.json")
            total += 1
    twice = deep_copy(summary)
    twice["trackers"].append(twice["trackers"][0])
    summary_structural = {
        "truncated": summary_text[: len(summary_text) // 2],
        "not-json": "schema = mppt-arena\n",
        "a-list": "[1, 2]\n",
        "empty": "",
        "duplicate-trackers": json.dumps(twice, indent=2),
        "other-schema": summary_text.replace("mppt-arena/summary/1", "mppt-arena/summary/9"),
        "nan-score": summary_text.replace('"tracking_efficiency": 0.', '"tracking_efficiency": NaN, "x": 0.', 1),
    }
    for name, text in summary_structural.items():
        write_case(f"summary-structure-{name}", {"summary.json": text}, compare, "summary.json")
        total += 1

    # Options: each names the offending argument.
    options = {
        "out-empty": ("run {base}/scenario.yaml --out \"\" --no-plots", "--out"),
        "junit-folder": ("run {base}/scenario.yaml --out {out} --junit {base} --no-plots", "--junit"),
        "seed-negative": ("run {base}/scenario.yaml --out {out} --seed -1", "--seed"),
        "seed-text": ("run {base}/scenario.yaml --out {out} --seed abc", "--seed"),
        "gate-nan": ("run {base}/scenario.yaml --out {out} --fail-below tracking_efficiency=nan", "--fail-below"),
        "gate-unknown-tracker": ("run {base}/scenario.yaml --out {out} --fail-below nope:tracking_efficiency=0.9", "--fail-below"),
        "gate-unknown-window": ("run {base}/scenario.yaml --out {out} --fail-below window:nope=0.9", "--fail-below"),
        "gate-unknown-score": ("run {base}/scenario.yaml --out {out} --fail-above speed=1", "--fail-above"),
        "gate-no-value": ("run {base}/scenario.yaml --out {out} --fail-below tracking_efficiency", "--fail-below"),
        "tracker-not-in-scenario": ("run {base}/scenario.yaml --out {out} --tracker nope", "--tracker"),
        "call-limit-zero": ("run {base}/scenario.yaml --out {out} --call-limit-ms 0", "--call-limit-ms"),
        "memory-limit-text": ("run {base}/scenario.yaml --out {out} --memory-limit-mib lots", "--memory-limit-mib"),
        "curve-points-huge": ("curve {base}/scenario.yaml --out {out} --points 1e12", "--points"),
        "curve-points-nan": ("curve {base}/scenario.yaml --out {out} --points nan", "--points"),
        "curve-at-negative": ("curve {base}/scenario.yaml --out {out} --at -1", "--at"),
        "threads-zero": ("sweep {base}/sweep.yaml --out {out} --threads 0", "--threads"),
        "shard-bad": ("sweep {base}/sweep.yaml --out {out} --shard 3/2", "--shard"),
        "tolerance-negative": ("compare {base}/summary.json {base}/summary.json --tolerance tracking_efficiency=-1", "--tolerance"),
        "tolerance-inf": ("compare {base}/summary.json {base}/summary.json --tolerance tracking_efficiency=inf", "--tolerance"),
        "unknown-option": ("run {base}/scenario.yaml --out {out} --colour red", "--colour"),
        "missing-value": ("run {base}/scenario.yaml --out", "--out"),
        "scenario-missing": ("run {base}/nowhere.yaml --out {out}", "nowhere.yaml"),
        "scenario-is-a-folder": ("run {base} --out {out}", "is a folder"),
        "merge-onto-input": ("merge {base} --out {base}", "--out"),
    }
    for name, (command, named) in options.items():
        write_case(f"option-{name}", {}, command, "arg:" + named)
        total += 1
    print(f"{total} cases in {CASES}")


if __name__ == "__main__":
    main()
