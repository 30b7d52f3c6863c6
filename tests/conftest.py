"""Fixtures shared by the API and browser tests (in the style of the Flask tutorial)."""

import pytest

from webcalc import create_app


@pytest.fixture(scope="session")
def app():
    return create_app({"TESTING": True})


@pytest.fixture()
def client(app):
    return app.test_client()


@pytest.fixture()
def post(client):
    """POST a JSON body to an endpoint; returns the response."""
    def _post(endpoint, body, **kw):
        return client.post(f"/api/v1/{endpoint}", json=body, **kw)
    return _post
