"""Parity of the offline API in Chromium: every recorded server answer
(``tests/js/parity_vectors.json``, from ``tools/parity_vectors.py``) is given again by the
in-browser handler, compared by the rules of SPEC section 7 (``tests/js/parity_compare.py``).

Two paths: ``handle()`` imported into a page (all vectors), and a sample through the real
service worker, with only the API unreachable (``context.route``), as a phone sees it.
"""

import importlib.util
import json
from pathlib import Path

import pytest

pytestmark = pytest.mark.browser

ROOT = Path(__file__).resolve().parents[2]
VECTORS = json.loads((ROOT / "tests" / "js" / "parity_vectors.json").read_text(encoding="utf-8"))["vectors"]

_spec = importlib.util.spec_from_file_location("parity_compare", ROOT / "tests" / "js" / "parity_compare.py")
parity = importlib.util.module_from_spec(_spec)
_spec.loader.exec_module(parity)

RUN_ALL = """async (items) => {
  const { handle } = await import('/static/js/offline/handler.js');
  const out = [];
  const start = performance.now();
  for (const [endpoint, text, raw, lang, accept] of items) {
    const answer = await handle(endpoint, raw ? text : JSON.parse(text), lang, accept);
    out.push(JSON.stringify(answer));
  }
  return { answers: out, ms: performance.now() - start };
}"""

POST_ALL = """async (items) => {
  const out = [];
  for (const [endpoint, text] of items) {
    const response = await fetch(`/api/v1/${endpoint}`, {
      method: 'POST', headers: { 'Content-Type': 'application/json' }, body: text });
    out.push(JSON.stringify({ status: response.status, body: await response.json() }));
  }
  return out;
}"""


def request_text(vector):
    if "raw" in vector:
        return vector["raw"], True
    return json.dumps(vector["request"], ensure_ascii=False), False


def check(vectors, answers):
    stats = parity.make_stats()
    failures = []
    for vector, text in zip(vectors, answers):
        answer = json.loads(text)  # JSON text: the key order of the browser's answer survives
        try:
            parity.compare_answer(vector, answer["status"], answer["body"], stats)
        except parity.Mismatch as exc:
            failures.append(str(exc))
    assert not failures, f"{len(failures)} of {len(vectors)} differ:\n" + "\n".join(failures[:8])
    return stats


def test_every_vector_answers_in_chromium_as_on_the_server(phone_no_sw):
    _, page = phone_no_sw
    page.goto("/healthz")  # any page of the origin: the handler needs no DOM
    items = []
    for v in VECTORS:
        text, raw = request_text(v)
        items.append([v["endpoint"], text, raw, v.get("query_lang"), v.get("accept_language")])
    result = page.evaluate(RUN_ALL, items)
    stats = check(VECTORS, result["answers"])
    assert stats["numbers"] > 10000
    print(f"\nChromium: {len(VECTORS)} vectors in {result['ms']:.0f} ms "
          f"({1000 * result['ms'] / len(VECTORS):.0f} us each); {stats['numbers']} numbers, "
          f"{stats['identical']} bit-identical; max relative deviation (SI) {stats['max_rel_si']:.3e} "
          f"at {stats['max_rel_si_at']}; max absolute (SI) {stats['max_abs_si']:.3e}")


def test_service_worker_answers_as_the_server_when_the_api_is_down(phone):
    """The real module service worker (static/sw.js) with the server's API unreachable."""
    context, page = phone
    page.goto("/")
    page.evaluate("() => navigator.serviceWorker.ready")
    page.wait_for_function("() => navigator.serviceWorker.controller !== null")
    context.route("**/api/v1/**", lambda route: route.abort("connectionrefused"))
    # parsed-object requests without a language choice: the worker reads the body as JSON
    # and picks the language itself (raw texts and the 64 KiB limit are the server's job)
    sample = [v for v in VECTORS if "raw" not in v and "query_lang" not in v and "accept_language" not in v
              and v["status"] != 404][::6]
    assert len(sample) > 150
    answers = page.evaluate(POST_ALL, [[v["endpoint"], request_text(v)[0]] for v in sample])
    check(sample, answers)
