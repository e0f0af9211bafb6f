"""Every write function of the module against bad destinations, as tests/scripts/writers_cli.sh
does for the command line: a missing folder, a folder at the path, a device, a failing write
(file-size limit), a read-only folder, an existing file without and with force=True, a FIFO and a
dangling link. Each raises ellipsa.Error naming the path and the reason, and leaves what was on
disk as it was, with no temporary file (docs/exports.md, "Writing files safely"; common practice
for tools that write files)."""
import os
import shutil
import signal
import stat
import subprocess
import sys
import tempfile
from pathlib import Path

import pytest

import ellipsa
from conftest import VIEWER

# name -> (file ending, a call that writes `path`)
WRITERS = {
    "write": (".csv", lambda p, path, **k: p.write(path, **k)),
    "write_cut": (".svg", lambda p, path, **k: p.write_cut(path, phi_deg=0, **k)),
    "write_map": (".png", lambda p, path, **k: p.write_map(path, size_px=(200, 120), **k)),
    "write_coverage": (".csv", lambda p, path, **k: ellipsa.write_coverage(path, [p], **k)),
    "write_band": (".json", lambda p, path, **k: ellipsa.write_band(path, [p], **k)),
    "write_report": ("", lambda p, path, **k: ellipsa.write_report(path, [p], size_px=(300, 200), **k)),
    "write_view": (".glb", lambda p, path, **k: p.write_view(path, size_px=(128, 96), **k)),
    "write_view_png": (".png", lambda p, path, **k: p.write_view(path, size_px=(128, 96), **k)),
}
# The same calls as source text, for a child process (another user, a file-size limit).
CHILD_CALLS = {
    "write": "p.write(path, force=True)",
    "write_cut": "p.write_cut(path, phi_deg=0, force=True)",
    "write_map": "p.write_map(path, size_px=(200, 120), force=True)",
    "write_coverage": "ellipsa.write_coverage(path, [p], force=True)",
    "write_band": "ellipsa.write_band(path, [p], force=True)",
    "write_report": "ellipsa.write_report(path, [p], size_px=(300, 200), force=True)",
    "write_view": "p.write_view(path, size_px=(128, 96), force=True)",
    "write_view_png": "p.write_view(path, size_px=(128, 96), force=True)",
}
if not VIEWER:  # no write_view to put to the test (test_no_viewer.py checks that it writes nothing)
    for name in ("write_view", "write_view_png"):
        del WRITERS[name], CHILD_CALLS[name]


@pytest.fixture(scope="module")
def dipole():
    return ellipsa.synth("dipole", length_wl=0.5, step_deg=10)


@pytest.fixture()
def folder():
    """A folder every user may enter (pytest's own tmp_path is private to its user)."""
    d = Path(tempfile.mkdtemp(prefix="ellipsa-writes-"))
    d.chmod(0o755)
    yield d
    for sub in d.rglob("*"):
        if sub.is_dir() and not sub.is_symlink():
            sub.chmod(0o755)
    shutil.rmtree(d)


def no_temporary(d):
    return not [n for n in os.listdir(d) if ".tmp-" in n]


def snapshot(d):
    """Names, kinds, sizes and contents of what is in `d` (to compare before and after)."""
    out = {}
    for n in sorted(os.listdir(d)):
        q = Path(d) / n
        st = os.lstat(q)
        body = q.read_bytes() if stat.S_ISREG(st.st_mode) else None
        out[n] = (stat.S_IFMT(st.st_mode), st.st_size, body, os.readlink(q) if q.is_symlink() else None)
    return out


def run_child(name, path, *, unprivileged=False, fsize=None):
    """Run one write in a child Python (as user nobody, or under a file-size limit)."""
    code = (f"import ellipsa\np = ellipsa.synth('dipole', length_wl=0.5, step_deg=10)\npath = {str(path)!r}\n"
            f"try:\n    {CHILD_CALLS[name]}\nexcept ellipsa.Error as e:\n    print(e)\n    raise SystemExit(1)\n")
    prefix = ["setpriv", "--reuid=65534", "--regid=65534", "--clear-groups"] if unprivileged and os.geteuid() == 0 else []

    def limit():
        if fsize is not None:
            import resource
            signal.signal(signal.SIGXFSZ, signal.SIG_IGN)  # the write then fails with EFBIG
            resource.setrlimit(resource.RLIMIT_FSIZE, (fsize, fsize))

    env = dict(os.environ)
    with tempfile.TemporaryDirectory(prefix="ellipsa-module-") as shared:
        if prefix:
            # User nobody may not enter the build folder (a checkout under a private home or a
            # 0700 temporary folder): the child imports a copy of the module from a folder every
            # user may read, and starts in "/".
            os.chmod(shared, 0o755)
            shutil.copy2(ellipsa.__file__, shared)
            os.chmod(os.path.join(shared, os.path.basename(ellipsa.__file__)), 0o755)
            env["PYTHONPATH"] = shared
        r = subprocess.run([*prefix, sys.executable, "-c", code], capture_output=True, text=True, cwd="/",
                           env=env, preexec_fn=limit, timeout=120, check=False)
    return r.returncode, r.stdout + r.stderr


@pytest.mark.parametrize("name", WRITERS)
def test_missing_folder_and_folder_at_the_path(name, dipole, folder):
    ext, call = WRITERS[name]
    target = folder / "missing" / ("out" + ext)
    with pytest.raises(ellipsa.Error, match=f"{target}.*does not exist"):
        call(dipole, str(target), force=True)
    assert not (folder / "missing").exists()
    (folder / ("dir" + ext)).mkdir()
    (folder / ("dir" + ext) / "mine.txt").write_text("mine")
    reason = "not made by ellipsa" if name == "write_report" else "is a folder"
    with pytest.raises(ellipsa.Error, match=f"dir{ext}.*{reason}"):
        call(dipole, str(folder / ("dir" + ext)), force=True)
    assert os.listdir(folder / ("dir" + ext)) == ["mine.txt"]
    assert no_temporary(folder)


@pytest.mark.parametrize("name", WRITERS)
def test_device_and_fifo_are_refused_up_front(name, dipole, folder):
    # Refused before anything is opened: a FIFO opened for writing would wait for a reader.
    ext, call = WRITERS[name]
    # A writer that picks the format by the name's ending refuses /dev/full for its name.
    reason = "character device" if ext in ("", ".csv") and name != "write_coverage" else "expected a file name ending"
    reason = "expected a file name ending" if name.startswith("write_view") else reason
    # write_view, like the command's usage errors, says so with ValueError.
    refusal = ValueError if name.startswith("write_view") else ellipsa.Error
    with pytest.raises(refusal, match=reason) as e:
        call(dipole, "/dev/full", force=True)
    assert "/dev/full" in str(e.value)
    assert stat.S_ISCHR(os.stat("/dev/full").st_mode)
    if os.geteuid() == 0:  # the same device under a name with the ending (mknod: root only)
        dev = folder / ("dev" + ext)
        try:
            os.mknod(dev, 0o666 | stat.S_IFCHR, os.makedev(1, 7))
        except PermissionError:  # a container without CAP_MKNOD
            return
        with pytest.raises(ellipsa.Error, match=f"dev{ext}.*character device"):
            call(dipole, str(dev), force=True)
        assert stat.S_ISCHR(os.lstat(dev).st_mode)
    fifo = folder / ("pipe" + ext)
    os.mkfifo(fifo)
    with pytest.raises(ellipsa.Error, match=f"pipe{ext}.*FIFO"):
        call(dipole, str(fifo), force=True)
    assert stat.S_ISFIFO(os.lstat(fifo).st_mode) and no_temporary(folder)


@pytest.mark.parametrize("name", WRITERS)
def test_existing_output_and_dangling_link(name, dipole, folder):
    ext, call = WRITERS[name]
    out = folder / ("out" + ext)
    call(dipole, str(out))
    first = snapshot(folder)
    with pytest.raises(ellipsa.Error, match=f"out{ext}.*already exists; use force=True"):
        call(dipole, str(out))
    assert snapshot(folder) == first
    call(dipole, str(out), force=True)  # replaced (the report: a folder ellipsa made)
    assert out.exists() and no_temporary(folder)
    link = folder / ("link" + ext)
    link.symlink_to(folder / "nowhere")
    with pytest.raises(ellipsa.Error, match=f"link{ext}"):
        call(dipole, str(link))
    assert link.is_symlink() and not (folder / "nowhere").exists()
    if name != "write_report":  # with force a file replaces the link itself, never its target
        call(dipole, str(link), force=True)
        assert link.is_file() and not link.is_symlink() and not (folder / "nowhere").exists()


@pytest.mark.parametrize("name", WRITERS)
def test_failed_write_and_read_only_folder_keep_the_old_output(name, dipole, folder):
    ext, call = WRITERS[name]
    out = folder / ("out" + ext)
    call(dipole, str(out))
    before = snapshot(folder)
    rc, msg = run_child(name, out, fsize=0)  # every write fails: EFBIG
    assert rc == 1 and str(out) in msg and "File too large" in msg, msg
    assert snapshot(folder) == before
    if os.geteuid() == 0 and shutil.which("setpriv") is None:
        pytest.fail("cannot test a read-only folder: running as root without setpriv")
    for p in [folder, *folder.rglob("*")]:
        if not p.is_symlink():
            p.chmod(p.stat().st_mode | 0o555)
    folder.chmod(0o555)
    rc, msg = run_child(name, out, unprivileged=True)
    folder.chmod(0o755)
    assert rc == 1 and str(out) in msg and "Permission denied" in msg, msg
    assert snapshot(folder) == before
