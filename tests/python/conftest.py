"""Shared fixtures of the Python module's tests (run by ctest as `python_module`; see
tests/CMakeLists.txt). The module comes from build/python (PYTHONPATH), the command line from
ELLIPSA_EXE, the bundled examples from ELLIPSA_SOURCE_DIR/examples."""
import json
import os
import subprocess
from pathlib import Path

import pytest

SOURCE = Path(os.environ.get("ELLIPSA_SOURCE_DIR", Path(__file__).resolve().parents[2]))
EXAMPLES = SOURCE / "examples"


def _viewer_built():
    """A build with the viewer lists `render` in `ellipsa --help`; one with ELLIPSA_VIEWER=OFF does
    not (its module's write_view raises, its reports have no 3D views). Without ELLIPSA_EXE: the
    default build, with the viewer."""
    path = os.environ.get("ELLIPSA_EXE")
    if not path:
        return True
    out = subprocess.run([path, "--help"], capture_output=True, text=True, check=True).stdout
    return any(line.startswith("  render ") for line in out.splitlines())


VIEWER = _viewer_built()
# Why a build without the viewer has no 3D views: cli/report_3d.hpp, no_viewer_reason.
NO_VIEWER_REASON = "this build has no viewer (ELLIPSA_VIEWER=OFF)"
NO_3D_VIEWS_NOTE = f"3D views are not included: {NO_VIEWER_REASON}."


@pytest.fixture(scope="session")
def exe():
    path = os.environ.get("ELLIPSA_EXE")
    if not path:
        pytest.skip("ELLIPSA_EXE not set (run through ctest)")
    return path


@pytest.fixture(scope="session")
def cli(exe):
    """Run the command line; returns (exit code, stdout, stderr)."""

    def run(*args):
        r = subprocess.run([exe, *map(str, args)], capture_output=True, text=True, check=False)
        return r.returncode, r.stdout, r.stderr

    return run


@pytest.fixture(scope="session")
def cli_json(cli):
    def run(*args):
        code, out, err = cli(*args, "--json")
        assert code == 0, err
        return json.loads(out)

    return run
