"""stepframe.batch locally and on a Dask LocalCluster of worker processes:
the same results as stepframe.run of each project, in the order given, and
nothing lost when a worker is killed in the middle of a batch.

Run by ctest with the system interpreter (Debian's python3-distributed, which
setup.sh installs) and PYTHONPATH set to the build's python/ folder.
"""
import os
import pathlib
import signal
import tempfile
import time
import unittest

import stepframe
from dask.distributed import Client, LocalCluster, as_completed

DATA = pathlib.Path(os.environ["STEPFRAME_TEST_DATA"])
BEAM = DATA / "beam_6m_ipe300_mm.stp"


def write_projects(folder, loads):
    """One simply supported 6 m IPE 300 beam project per line load (kN/m), invented test data."""
    (folder / BEAM.name).write_bytes(BEAM.read_bytes())
    paths = []
    for i, w in enumerate(loads):
        path = folder / f"beam{i}.yaml"
        path.write_text(
            f"model: {BEAM.name}\n"
            "units: {length: m, force: kN, stress: MPa, line_load: kN/m}\n"
            "rules: [{where: {}, material: S355}]\n"
            "supports:\n  - {where: {x: 0}, fix: [ux, uy, uz, rx]}\n  - {where: {x: 6}, fix: [uy, uz, rx]}\n"
            f"cases:\n  - name: W\n    member_loads: [{{where: {{layer: BEAMS}}, w: [0, 0, -{w}]}}]\n"
            "checks: {stress: {combinations: [W]}}\n")
        paths.append(path)
    return paths


class BatchTest(unittest.TestCase):
    @classmethod
    def setUpClass(cls):
        cls.tmp = tempfile.TemporaryDirectory()
        cls.folder = pathlib.Path(cls.tmp.name)
        cls.loads = [5, 10, 20, 40, 80, 160, 15, 30, 60, 120]
        cls.projects = write_projects(cls.folder, cls.loads)
        cls.single = [stepframe.run(p) for p in cls.projects]

    @classmethod
    def tearDownClass(cls):
        cls.tmp.cleanup()

    def assert_same(self, outcomes):
        self.assertEqual([o["name"] for o in outcomes], [p.stem for p in self.projects])
        for outcome, single in zip(outcomes, self.single):
            self.assertEqual(outcome["exit_status"], single["exit_status"], outcome["message"])
            self.assertEqual(outcome["results"]["checks"], single["results"]["checks"])

    def test_local_batch_equals_single_runs(self):
        outcomes = stepframe.batch(self.projects)
        self.assert_same(outcomes)
        # The heavier beams fail their stress check: 160 kN/m gives about 1.3 times fy (w L^2 / 8 / Wel).
        self.assertEqual(outcomes[5]["exit_status"], stepframe.CHECK_FAILED)

    def test_dask_cluster_equals_single_runs_and_survives_a_killed_worker(self):
        with LocalCluster(n_workers=2, threads_per_worker=1, processes=True, dashboard_address=None) as cluster, \
                Client(cluster) as client:
            self.assert_same(stepframe.batch(self.projects, client=client))

            # Kill one worker once the first project of a new batch is done; every project still comes back.
            shipped = [stepframe._ship(p) for p in self.projects] * 4
            futures = client.map(stepframe._run_shipped, shipped, pure=False)
            first = next(as_completed(futures))
            first.result()
            pids = client.run(os.getpid)
            pending = sum(not f.done() for f in futures)
            os.kill(next(iter(pids.values())), signal.SIGKILL)
            self.assertGreater(pending, 10)  # the kill lands in the middle of the batch
            outcomes = client.gather(futures)
            for k in range(4):
                self.assert_same(outcomes[k * len(self.projects):(k + 1) * len(self.projects)])


if __name__ == "__main__":
    unittest.main()
