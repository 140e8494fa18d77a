# stepframe.batch: many projects, on this machine or on a Dask cluster.
# Compiled into the stepframe module (plugin/CMakeLists.txt embeds this file
# and runs it in the module's namespace at import), so `run` below is the
# module's own run function: a batch has no second code path for results.


def _ship(project):
    """What a worker needs of a project file: its text and its model's bytes (workers share no files)."""
    import pathlib

    import yaml  # PyYAML, a dependency of Dask

    path = pathlib.Path(project)
    text = path.read_text(encoding="utf-8")
    model = pathlib.Path(yaml.safe_load(text)["model"])
    if not model.is_absolute():
        model = path.parent / model
    return {"name": path.stem, "project_text": text, "model_name": model.name, "model_bytes": model.read_bytes()}


def _run_shipped(shipped):
    """Runs a shipped project in a scratch folder of the worker's; the run's dict with the project's name."""
    import pathlib
    import tempfile

    import yaml

    with tempfile.TemporaryDirectory(prefix="stepframe-batch-") as scratch:
        folder = pathlib.Path(scratch)
        (folder / shipped["model_name"]).write_bytes(shipped["model_bytes"])
        keys = yaml.safe_load(shipped["project_text"])
        keys["model"] = shipped["model_name"]  # the model now sits beside the project
        outcome = run(keys, base_dir=str(folder))
    outcome["name"] = shipped["name"]
    return outcome


def batch(projects, client=None):
    """Run many project files and return what each came to, in the order given.

    projects  project file paths (str or os.PathLike)
    client    a dask.distributed Client: the runs are mapped onto its cluster, each project
              shipped as its text and its model's bytes and run there by stepframe.run;
              a worker lost in the middle has its projects run again elsewhere (Dask's
              scheduler does that). None: the projects run here, one after the other.

    Returns a list of dicts as stepframe.run returns them (exit_status, message, results,
    files, summary) plus 'name' (the project file's name without extension).
    """
    shipped = [_ship(p) for p in projects]
    if client is None:
        return [_run_shipped(s) for s in shipped]
    futures = client.map(_run_shipped, shipped, pure=False)
    return client.gather(futures)
