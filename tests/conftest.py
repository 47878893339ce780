"""Test configuration: slow property runs only with --run-slow."""

import pytest
from hypothesis import settings

settings.register_profile("ci", deadline=None, print_blob=True, derandomize=True)
settings.load_profile("ci")


def pytest_addoption(parser):
    parser.addoption(
        "--run-slow", action="store_true", default=False, help="run long property tests"
    )


def pytest_collection_modifyitems(config, items):
    if config.getoption("--run-slow"):
        return
    skip = pytest.mark.skip(reason="long run: enable with --run-slow")
    for item in items:
        if "slow" in item.keywords:
            item.add_marker(skip)
