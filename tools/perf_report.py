"""Turn a pytest-benchmark JSON file into ratio tables (Markdown on stdout).

    python -m pytest benchmarks --benchmark-only --benchmark-json=bench.json
    python tools/perf_report.py bench.json

For every group the fastest reference in the group ("empty", "pass", openpyxl load,
...) is the denominator; ratios are of median times measured in the same run.
"""

import json
import sys
from collections import defaultdict


def main(path):
    data = json.load(open(path))
    groups = defaultdict(dict)
    for b in data["benchmarks"]:
        name = b["name"].split("[")[0].replace("test_", "")
        param = b.get("param") or ""
        if "|" in param:  # bench_hx_core: "<group>|<case>"
            name = param.split("|", 1)[1]
        elif param and param != b["group"]:
            name = f"{name}[{param}]"
        groups[b["group"] or name][name] = b["stats"]["median"]
    print(f"Machine: {data['machine_info'].get('cpu', {}).get('brand_raw', '?')}, "
          f"Python {data['machine_info'].get('python_version')}; median times.\n")
    adapters = {g: v for g, v in groups.items() if {"excel", "core", "empty"} <= set(v)}
    if adapters:
        print("| function | Excel-module call [µs] | core call [µs] | empty call [µs] | adapter overhead [µs] | Excel / core | Excel / empty | reference [µs] | core / reference |")
        print("|---|---|---|---|---|---|---|---|---|")
        for g in sorted(adapters):
            v = adapters[g]
            ref = next((v[k] for k in v if k not in ("excel", "core", "empty")), None)
            line = (f"| {g} | {v['excel'] * 1e6:.2f} | {v['core'] * 1e6:.2f} | {v['empty'] * 1e6:.3f} | "
                    f"{(v['excel'] - v['core']) * 1e6:.2f} | {v['excel'] / v['core']:.2f} | "
                    f"{v['excel'] / v['empty']:.1f} | ")
            line += f"{ref * 1e6:.2f} | {v['core'] / ref:.3g} |" if ref else " | |"
            print(line)
        print()
    for g, v in sorted(groups.items()):
        if g in adapters:
            continue
        base = min(v.values())
        print(f"**{g}**\n")
        print("| case | median [µs] | ratio to fastest |")
        print("|---|---|---|")
        for k, t in sorted(v.items(), key=lambda kv: kv[1]):
            print(f"| {k} | {t * 1e6:.2f} | {t / base:.2f} |")
        print()


if __name__ == "__main__":
    main(sys.argv[1])
