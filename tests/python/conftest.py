"""A temporary copy of examples/demo for each test (the demo folder is never written)."""
import os
import pathlib
import shutil

import pytest


@pytest.fixture
def demo(tmp_path):
    source = pathlib.Path(os.environ.get("WETFRONT_DEMO", pathlib.Path(__file__).parents[2] / "examples" / "demo"))
    target = tmp_path / "demo"
    shutil.copytree(source, target)
    return target / "site.toml"
