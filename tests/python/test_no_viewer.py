"""A build without the viewer (ELLIPSA_VIEWER=OFF): write_view raises ellipsa.Error saying why and
writes nothing, whatever the file name and keywords, as `ellipsa render` is refused with the same
reason (cli/report_3d.hpp holds the words). The reports' side: test_figures.py."""
import pytest

import ellipsa
from conftest import EXAMPLES, NO_VIEWER_REASON, VIEWER

pytestmark = pytest.mark.skipif(VIEWER, reason="built with the viewer: test_view.py checks write_view")


@pytest.mark.parametrize("name,kwargs", [("v.png", {}), ("v.glb", {"force": True}),
                                         ("v.ply", {"size_px": (200, 160), "color_by": "axial-ratio"})])
def test_write_view_raises_the_reason(tmp_path, name, kwargs):
    p = ellipsa.read(str(EXAMPLES / "turnstile.csv"))
    with pytest.raises(ellipsa.Error) as e:
        p.write_view(str(tmp_path / name), **kwargs)
    assert str(e.value) == f"3D views are not available: {NO_VIEWER_REASON}"
    assert e.value.message == str(e.value) and e.value.file is None
    assert not list(tmp_path.iterdir())


def test_render_is_refused_with_the_same_reason(tmp_path, cli):
    code, out, err = cli("render", EXAMPLES / "turnstile.csv", "--out", tmp_path / "v.png")
    assert code == 2 and out == ""
    assert err.strip() == f"ellipsa: 'render' is not available: {NO_VIEWER_REASON}; the other commands work without it"
    assert not list(tmp_path.iterdir())
