"""How stepframe.batch scales on a Dask cluster (not a test): the same study of
N projects (the bundled demo platform, copied N times) on a LocalCluster of 1
worker process and of 2, alternately, `repeats` times; prints the best wall
time of each and the ratio. A perfect scale-out halves the time.
Usage: python3 batch_scaling.py [N] [repeats] [project]   (PYTHONPATH: the build's python/ folder)
A heavier project shows the scale-out better than the small demo, whose runs are short enough for
Dask's per-task costs to count: e.g. the 1,000-member building stepframe_bench_run writes,
/tmp/stepframe_bench_run/1000/building.yaml.
"""
import pathlib
import sys
import time

import stepframe
from dask.distributed import Client, LocalCluster

DEMO = pathlib.Path(__file__).resolve().parent.parent / "data" / "demo" / "platform.yaml"


def timed(workers, projects):
    with LocalCluster(n_workers=workers, threads_per_worker=1, processes=True, dashboard_address=None) as cluster, \
            Client(cluster) as client:
        client.run(lambda: __import__("stepframe").__version__)  # workers up and the module loaded
        start = time.perf_counter()
        outcomes = stepframe.batch(projects, client=client)
        elapsed = time.perf_counter() - start
    assert all(o["exit_status"] in (0, 1) for o in outcomes), [o["message"] for o in outcomes]
    return elapsed


def main():
    n = int(sys.argv[1]) if len(sys.argv) > 1 else 40
    repeats = int(sys.argv[2]) if len(sys.argv) > 2 else 2
    project = pathlib.Path(sys.argv[3]) if len(sys.argv) > 3 else DEMO
    projects = [project] * n
    best = {1: float("inf"), 2: float("inf")}
    for r in range(repeats):
        for workers in ((1, 2) if r % 2 == 0 else (2, 1)):
            best[workers] = min(best[workers], timed(workers, projects))
    print(f"{n} projects ({project.name}): 1 worker {best[1]:.1f} s, 2 workers {best[2]:.1f} s, "
          f"ratio {best[2] / best[1]:.2f} (0.50 is a perfect scale-out)")


if __name__ == "__main__":
    main()
