"""The stepframe Python module: projects as paths or dicts, results as dicts,
progress and cancellation through a Python callable.

Run by ctest with the system interpreter and PYTHONPATH set to the build's
python/ folder; STEPFRAME_TEST_DATA names tests/data.
"""
import os
import pathlib
import tempfile
import unittest

import stepframe

DATA = pathlib.Path(os.environ["STEPFRAME_TEST_DATA"])
# One 6 m edge along X, name "IPE 300", layer BEAMS, in mm: written with
# geometry::write_step_wireframe exactly as the C++ tests write their beam.
BEAM = DATA / "beam_6m_ipe300_mm.stp"

SPAN = 6.0      # m
E = 210e9       # Pa, EN 1993-1-1 3.2.6
W = 10e3        # N/m
# IPE 300, EN 10365 tabulated values (from memory): Iy = 8356 cm4, Wel,y = 557.1 cm3.
IY = 8356e-8    # m4
WY = 557.1e-6   # m3


def beam_project(model=str(BEAM), fix_end=("uy", "uz", "rx")):
    """The simply supported beam under 10 kN/m as a dict with the project file's keys."""
    return {
        "model": model,
        "units": {"length": "m", "force": "kN", "stress": "MPa", "line_load": "kN/m"},
        "rules": [{"where": {}, "material": "S355"}],
        "supports": [{"where": {"x": 0}, "fix": ["ux", "uy", "uz", "rx"]},
                     {"where": {"x": 6}, "fix": list(fix_end)}],
        "cases": [{"name": "W", "member_loads": [{"where": {"layer": "BEAMS"}, "w": [0, 0, -10]}]}],
        "checks": {"stress": {"combinations": ["W"]}},
    }


class RunTest(unittest.TestCase):
    def test_dict_project_matches_the_handbook_beam(self):
        # Simply supported beam under uniform load: midspan deflection 5 w L^4 / (384 E I) and
        # moment w L^2 / 8 (Roark's Formulas for Stress and Strain, Table 8.1 case 2e).
        run = stepframe.run(beam_project())
        self.assertEqual(run["exit_status"], stepframe.PASS, run["message"])
        self.assertEqual(run["message"], "")
        results = run["results"]
        self.assertEqual(results["schema"], "stepframe-results/1")
        self.assertEqual(results["members"][0]["section"], "IPE300")
        member = results["results"][0]["members"][0]
        self.assertAlmostEqual(member["max_local_deflection"] / (5 * W * SPAN**4 / (384 * E * IY)), 1.0, delta=0.01)
        self.assertAlmostEqual(member["max_abs_stress"] / (W * SPAN**2 / 8 / WY), 1.0, delta=0.01)
        vertical = sum(r["force"][2] for r in results["results"][0]["reactions"])
        self.assertAlmostEqual(vertical, W * SPAN, delta=1e-6 * W * SPAN)  # equilibrium
        self.assertEqual(run["files"], [])

    def test_path_project_writes_files_and_reports_progress(self):
        with tempfile.TemporaryDirectory() as tmp:
            project = pathlib.Path(tmp) / "beam.yaml"
            project.write_text(
                f"model: {BEAM}\n"
                "units: {length: m, force: kN, stress: MPa, line_load: kN/m}\n"
                "rules: [{where: {}, material: S355}]\n"
                "supports:\n  - {where: {x: 0}, fix: [ux, uy, uz, rx]}\n  - {where: {x: 6}, fix: [uy, uz, rx]}\n"
                "cases:\n  - name: W\n    member_loads: [{where: {layer: BEAMS}, w: [0, 0, -10]}]\n")
            seen = []
            run = stepframe.run(project, out_dir=pathlib.Path(tmp) / "out",
                                progress=lambda stage, f: seen.append((stage, f)))
            self.assertEqual(run["exit_status"], stepframe.PASS, run["message"])
            self.assertTrue((pathlib.Path(tmp) / "out" / "results.json").exists())
            names = {pathlib.Path(f).name for f in run["files"]}
            self.assertTrue({"results.json", "W.vtu"} <= names, names)
            stages = []
            for stage, fraction in seen:
                self.assertTrue(0.0 <= fraction <= 1.0)
                if not stages or stages[-1] != stage:
                    stages.append(stage)
            self.assertEqual(stages, ["project", "geometry", "wireframe", "model", "assembly", "factorisation", "recovery",
                                      "checks", "buckling", "checks", "vtk", "tables", "results.json", "report"])
            self.assertIn("PASS", run["summary"])

    def test_progress_returning_false_cancels(self):
        with tempfile.TemporaryDirectory() as tmp:
            run = stepframe.run(beam_project(), out_dir=tmp + "/out",
                                progress=lambda stage, f: stage != "factorisation")
            self.assertEqual(run["exit_status"], stepframe.CANCELLED)
            self.assertIn("cancelled", run["message"])
            self.assertFalse(os.path.exists(tmp + "/out/results.json"))

    def test_an_exception_in_progress_cancels_and_is_raised(self):
        def failing(stage, fraction):
            if stage == "model":
                raise ZeroDivisionError("from the callback")
        with self.assertRaises(ZeroDivisionError):
            stepframe.run(beam_project(), progress=failing)

    def test_bad_input_and_unstable_frames_have_their_statuses(self):
        project = beam_project()
        project["colour_scheme"] = "blue"
        run = stepframe.run(project)
        self.assertEqual(run["exit_status"], stepframe.BAD_INPUT)
        self.assertIn("unknown key 'colour_scheme'", run["message"])
        self.assertEqual(run["results"]["status"], "error")

        project = beam_project(fix_end=("uy", "uz"))
        project["supports"][0]["fix"] = ["ux", "uy", "uz"]  # twist free at both ends
        run = stepframe.run(project)
        self.assertEqual(run["exit_status"], stepframe.UNSTABLE)
        self.assertIn("rx", run["message"])

    def test_log_goes_to_the_callable(self):
        lines = []
        run = stepframe.run(beam_project(), log=lambda level, message: lines.append((level, message)))
        self.assertEqual(run["exit_status"], stepframe.PASS, run["message"])
        self.assertTrue(any(level == "info" and "1 members, 2 nodes" in message for level, message in lines), lines)

    def test_relative_model_is_found_in_base_dir(self):
        run = stepframe.run(beam_project(model=BEAM.name), base_dir=str(DATA))
        self.assertEqual(run["exit_status"], stepframe.PASS, run["message"])


    def test_step_text_held_in_memory(self):
        from_file = stepframe.run(beam_project())
        run = stepframe.run(beam_project(model="not-on-disk.stp"), step_text=BEAM.read_text())
        self.assertEqual(run["exit_status"], stepframe.PASS, run["message"])
        self.assertEqual(run["results"]["results"], from_file["results"]["results"])


class InspectTest(unittest.TestCase):
    def test_inspect(self):
        info = stepframe.inspect(BEAM)
        self.assertEqual(info["member_count"], 1)
        self.assertEqual(info["node_count"], 2)
        self.assertEqual(info["length_unit"], "mm")
        self.assertEqual(info["attributes"]["layer"], {"BEAMS": 1})
        self.assertAlmostEqual(info["bounding_box"]["max"][0], SPAN)
        with self.assertRaises(ValueError):
            stepframe.inspect(DATA / "no-such-file.stp")

    def test_inspect_project(self):
        # The rules give the beam a section but no material: inspect lists the member as unassigned.
        with tempfile.TemporaryDirectory() as scratch:
            project = pathlib.Path(scratch) / "beam.yaml"
            project.write_text(
                f"model: {BEAM}\n"
                "rules:\n  - where: {layer: BEAMS}\n    section: IPE 300\n"
                "cases: [{name: G, self_weight: true}]\n")
            info = stepframe.inspect(project)
            self.assertEqual(info["member_count"], 1)
            self.assertEqual(len(info["unassigned_members"]), 1)
            self.assertEqual(info["unassigned_members"][0]["missing"], ["material"])
            project.write_text("model: nowhere.stp\ncases: [{name: G, self_weight: true}]\n")
            with self.assertRaises(ValueError):
                stepframe.inspect(project)

    def test_version(self):
        self.assertRegex(stepframe.__version__, r"^\d+\.\d+\.\d+$")


if __name__ == "__main__":
    unittest.main(verbosity=2)
