"""Security headers on every kind of response, the request body limit, and no debug mode.

Sources: Content Security Policy Level 3 (W3C) for the policy's grammar and keywords;
Referrer Policy (W3C) for the referrer values; RFC 7034 for X-Frame-Options; the
Permissions Policy draft (W3C) with RFC 8941 structured-field syntax for its header; the
Fetch standard for ``nosniff``; SPEC section 3 for the 64 KiB body limit.
"""

import http.client
import json
import os
import re
import socket
import subprocess
import sys
import time
from pathlib import Path

import pytest
import waitress

from webcalc import cli
from webcalc.api import MAX_BODY

ROOT = Path(__file__).resolve().parents[2]
BIG = "x" * (MAX_BODY + 10)

# name -> (method, path, request options, status expected): one of every kind of response.
RESPONSES = {
    "page": ("GET", "/", {}, 200),
    "service-worker": ("GET", "/sw.js", {}, 200),
    "manifest": ("GET", "/manifest.webmanifest", {}, 200),
    "static-file": ("GET", "/static/css/app.css", {}, 200),
    "static-image": ("GET", "/static/icons/icon-192.png", {}, 200),
    "healthz": ("GET", "/healthz", {}, 200),
    "openapi": ("GET", "/api/v1/openapi.json", {}, 200),
    "api-200": ("POST", "/api/v1/site", {"json": {"site": {"altitude": "1000 m"}}}, 200),
    "api-400": ("POST", "/api/v1/site", {"json": {"site": {"altitude": "99 km"}}}, 400),
    "api-404": ("POST", "/api/v1/nothing", {"json": {}}, 404),
    "page-404": ("GET", "/nothing-here", {}, 404),
    "static-404": ("GET", "/static/nothing.js", {}, 404),
    "405": ("GET", "/api/v1/site", {}, 405),
    "413": ("POST", "/api/v1/site", {"data": json.dumps({"pad": BIG}), "content_type": "application/json"}, 413),
    "415": ("POST", "/api/v1/site", {"data": "{}", "content_type": "text/plain"}, 415),
}

# CSP Level 3: keyword sources that weaken a policy against script injection.
UNSAFE_KEYWORDS = {"'unsafe-inline'", "'unsafe-eval'", "'unsafe-hashes'"}
# Sources that name no other origin: keywords, nonces and hashes, and the local data and blob schemes.
LOCAL_SOURCE = re.compile(r"^('self'|'none'|'strict-dynamic'|'report-sample'|'nonce-[^']+'|'sha(256|384|512)-[^']+'"
                          r"|data:|blob:)$")


@pytest.fixture(scope="module", params=sorted(RESPONSES))
def response(request, app):
    method, path, options, status = RESPONSES[request.param]
    r = app.test_client().open(path, method=method, **options)
    assert r.status_code == status, (request.param, r.status_code)
    return r


def csp_directives(response):
    """{directive: [sources]} of the response's one policy (CSP3, section 2.2.1)."""
    values = response.headers.getlist("Content-Security-Policy")
    assert values, "no Content-Security-Policy"
    directives = {}
    for value in values:
        for policy in value.split(","):
            for part in policy.split(";"):
                tokens = part.split()
                if tokens:
                    directives.setdefault(tokens[0].lower(), tokens[1:])
    return directives


def test_content_security_policy_is_strict(response):
    directives = csp_directives(response)
    assert directives.get("default-src") == ["'self'"], directives
    for name, sources in directives.items():
        assert not UNSAFE_KEYWORDS & {s.lower() for s in sources}, (name, sources)
        if name.endswith("-src") or name in ("frame-ancestors", "base-uri", "form-action"):
            for source in sources:
                # No host, scheme (http:, https:, ws:) or wildcard source: no third-party origin.
                assert LOCAL_SOURCE.match(source), (name, source)
                assert "*" not in source and "://" not in source, (name, source)


def test_nosniff(response):
    # Fetch standard, "X-Content-Type-Options" header: the one defined value.
    assert response.headers.get("X-Content-Type-Options") == "nosniff"


def test_referrer_policy(response):
    # W3C Referrer Policy: the values that never send a full URL to another origin.
    safe = {"no-referrer", "same-origin", "strict-origin", "strict-origin-when-cross-origin"}
    value = response.headers.get("Referrer-Policy", "")
    tokens = [t.strip() for t in value.split(",") if t.strip()]
    assert tokens and tokens[-1] in safe, value  # the last recognised value applies


def test_framing_is_denied(response):
    # CSP3 frame-ancestors 'none', or RFC 7034 X-Frame-Options: DENY.
    ancestors = csp_directives(response).get("frame-ancestors")
    assert ancestors == ["'none'"] or response.headers.get("X-Frame-Options", "").upper() == "DENY"


def test_permissions_policy(response):
    # Permissions Policy: a structured-field dictionary (RFC 8941) of feature=allowlist.
    value = response.headers.get("Permissions-Policy", "")
    members = [m.strip() for m in value.split(",") if m.strip()]
    assert members, "no Permissions-Policy"
    features = {}
    for member in members:
        match = re.fullmatch(r"([a-z][a-z0-9-]*)=\(([^)]*)\)", member)
        assert match, member
        features[match.group(1)] = match.group(2).split()
    for name, allow in features.items():
        assert "*" not in allow, (name, allow)
    # The app needs no camera or microphone (SPEC sections 1 and 2).
    assert features.get("camera") == [] and features.get("microphone") == [], features


def test_api_answers_are_not_html(response):
    # Errors are JSON everywhere (SPEC section 3), and every response says what it is.
    assert response.mimetype
    if response.status_code >= 400:
        assert response.mimetype == "application/json"
        assert set(response.get_json()["error"]) == {"message", "fields"}


# ---------------------------------------------------------------- the body limit


def padded(size):
    """A valid site request of exactly ``size`` bytes (JSON allows any run of whitespace)."""
    head, tail = b'{"site": {"altitude": "100 m"}', b"}"
    body = head + b" " * (size - len(head) - len(tail)) + tail
    assert len(body) == size
    return body


def test_configured_limit_is_64_kib(app):
    # SPEC section 3: 413 for a body over 64 KiB.
    assert MAX_BODY == 64 * 1024
    assert app.config["MAX_CONTENT_LENGTH"] == MAX_BODY


def test_body_at_the_limit_is_read_and_one_byte_more_is_413(client):
    at = client.post("/api/v1/site", data=padded(MAX_BODY), content_type="application/json")
    assert at.status_code == 200, at.data[:300]
    assert at.json["station_pressure"]["unit"] == "kPa"
    over = client.post("/api/v1/site", data=padded(MAX_BODY + 1), content_type="application/json")
    assert over.status_code == 413
    assert over.json["error"]["fields"] == []


def test_just_below_the_limit_with_a_bad_field_is_400_not_413(client):
    head = b'{"site": {"altitude": "100 furlongs"}'
    body = head + b" " * (MAX_BODY - 1 - len(head) - 1) + b"}"
    r = client.post("/api/v1/site", data=body, content_type="application/json")
    assert r.status_code == 400 and [f["field"] for f in r.json["error"]["fields"]] == ["site.altitude"]


# ---------------------------------------------------------------- `webcalc serve`


@pytest.fixture()
def served(monkeypatch):
    """Run `webcalc serve` with waitress.serve replaced by a recorder (no server is left running)."""
    calls = []
    monkeypatch.setattr(waitress, "serve", lambda app, **kw: calls.append((app, kw)))
    return calls


def test_serve_uses_waitress_and_not_debug(served, capsys):
    assert cli.main(["serve", "--port", "8765"]) == 0
    assert len(served) == 1
    app, kw = served[0]
    assert kw["host"] == "127.0.0.1" and kw["port"] == 8765  # DEVELOPERS.md: 127.0.0.1 by default
    assert app.debug is False and app.config["DEBUG"] is False
    assert app.testing is False and not app.config.get("PROPAGATE_EXCEPTIONS")
    assert "127.0.0.1:8765" in capsys.readouterr().out


@pytest.mark.parametrize("flag", ["--debug", "--reload", "--dev", "-d", "--debugger", "--use-debugger"])
def test_no_flag_enables_debug(served, flag, capsys):
    with pytest.raises(SystemExit) as exc:
        cli.main(["serve", flag])
    assert exc.value.code == 2  # argparse: unknown option
    assert served == []


def test_serve_help_offers_no_debug_option(served, capsys):
    with pytest.raises(SystemExit) as exc:
        cli.main(["serve", "--help"])
    assert exc.value.code == 0
    options = set(re.findall(r"--[a-z][a-z-]*", capsys.readouterr().out))
    assert {"--host", "--port"} <= options
    assert not [o for o in options if "debug" in o or "reload" in o], options


def test_flask_debug_environment_does_not_enable_debug(served, monkeypatch, capsys):
    monkeypatch.setenv("FLASK_DEBUG", "1")
    assert cli.main(["serve"]) == 0
    app, _ = served[0]
    assert app.debug is False


# ---------------------------------------------------------------- a real server


def free_port():
    with socket.socket() as s:
        s.bind(("127.0.0.1", 0))
        return s.getsockname()[1]


@pytest.fixture(scope="module")
def server():
    """`python -m webcalc serve` on 127.0.0.1 and a free port, stopped after the tests."""
    port = free_port()
    env = dict(os.environ, PYTHONPATH=str(ROOT))
    env.pop("FLASK_DEBUG", None)
    proc = subprocess.Popen([sys.executable, "-m", "webcalc", "serve", "--host", "127.0.0.1", "--port", str(port)],
                            cwd=ROOT, env=env, stdout=subprocess.DEVNULL, stderr=subprocess.PIPE)
    try:
        deadline = time.monotonic() + 30
        while True:
            try:
                conn = http.client.HTTPConnection("127.0.0.1", port, timeout=5)
                conn.request("GET", "/healthz")
                if conn.getresponse().status == 200:
                    conn.close()
                    break
            except OSError:
                pass
            if proc.poll() is not None or time.monotonic() > deadline:
                raise RuntimeError(f"server did not start: {proc.stderr.read().decode(errors='replace')[-2000:]}")
            time.sleep(0.2)
        yield port
    finally:
        proc.terminate()
        try:
            proc.wait(timeout=10)
        except subprocess.TimeoutExpired:
            proc.kill()
            proc.wait()


def real_post(port, body, headers, chunked=False):
    conn = http.client.HTTPConnection("127.0.0.1", port, timeout=30)
    try:
        conn.request("POST", "/api/v1/site", body=body, headers=headers, encode_chunked=chunked)
        r = conn.getresponse()
        return r.status, r.getheaders(), r.read()
    finally:
        conn.close()


def test_real_server_limits_a_chunked_body(server):
    # A chunked body has no Content-Length: the limit must hold on the bytes read (RFC 9112, 7.1).
    def chunks():
        for _ in range(20):
            yield b" " * 8192
        yield b"{}"
    status, headers, data = real_post(server, chunks(), {"Content-Type": "application/json",
                                                        "Transfer-Encoding": "chunked"}, chunked=True)
    assert status == 413, (status, data[:300])
    assert json.loads(data)["error"]["fields"] == []
    assert dict(headers).get("X-Content-Type-Options") == "nosniff"


def test_real_server_errors_are_json_without_a_traceback(server):
    status, headers, data = real_post(server, b'{"site": {"altitude": "1 m"}', {"Content-Type": "application/json"})
    assert status == 400
    assert b"Traceback" not in data and json.loads(data)["error"]["fields"] == []
    status, headers, data = real_post(server, padded(MAX_BODY), {"Content-Type": "application/json"})
    assert status == 200 and "station_pressure" in json.loads(data)
