#!/usr/bin/python3
"""Run a stepframe project from Python and report the governing check.

    PYTHONPATH=<prefix>/lib/python3/dist-packages python3 run_project.py PROJECT.yaml [OUT_DIR]
"""
import sys

import stepframe


def show_progress(stage, fraction):
    if fraction == 0.0:
        print(f"[python] {stage}", file=sys.stderr)


def main():
    if len(sys.argv) < 2:
        print(__doc__, file=sys.stderr)
        return 2
    out_dir = sys.argv[2] if len(sys.argv) > 2 else None
    run = stepframe.run(sys.argv[1], out_dir=out_dir, progress=show_progress)
    if run["message"]:
        print(f"[python] {run['message']}", file=sys.stderr)
        return run["exit_status"]
    results = run["results"]
    worst = max(results["checks"], key=lambda c: c["utilisation"], default=None)
    print(f"stepframe {stepframe.__version__}: {results['status']}, {len(results['members'])} members, "
          f"{len(results['results'])} results")
    if worst:
        print(f"governing: member {worst['member']} {worst['check']} under {worst['combination']}, "
              f"utilisation {worst['utilisation']:.3f}")
    return run["exit_status"]


if __name__ == "__main__":
    sys.exit(main())
