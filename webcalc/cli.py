"""Command line: ``webcalc serve`` runs the app with a production WSGI server (waitress);
``webcalc calc ENDPOINT field=value ...`` runs one calculation and prints a table or JSON."""

import argparse
import json
import sys

from . import __version__


def _value(text):
    try:
        return json.loads(text)
    except ValueError:
        return text


def build_body(pairs):
    """``site.altitude=1200 m`` pairs into a nested JSON body (values parsed as JSON if they are)."""
    body = {}
    for pair in pairs:
        key, sep, value = pair.partition("=")
        if not sep:
            raise SystemExit(f"expected field=value, got {pair!r}")
        target = body
        *parents, leaf = key.split(".")
        for name in parents:
            target = target.setdefault(name, {})
        target[leaf] = _value(value)
    return body


def _number(value, locale):
    """Six significant digits, with the locale's decimal separator (CLDR via Babel)."""
    from . import i18n

    return i18n.format_number(locale, f"{value:.6g}")


def _cell(value, locale="en"):
    if isinstance(value, dict) and set(value) == {"value", "unit"}:
        return f"{_number(value['value'], locale)} {value['unit']}"
    if isinstance(value, float):
        return _number(value, locale)
    if value is None:
        return "-"
    if isinstance(value, dict):
        return "{" + ", ".join(f"{k}={_cell(v, locale)}" for k, v in value.items()) + "}"
    return json.dumps(value) if isinstance(value, (dict, list)) else str(value)


def table(body, locale="en"):
    """A readable text table of a response body (numbers written for ``locale``)."""
    def cell(value):
        return _cell(value, locale)

    lines = []
    if "error" in body:
        lines.append("error: " + body["error"]["message"])
        lines += [f"  {f['field']}: {f['message']}" for f in body["error"]["fields"]]
        return "\n".join(lines)
    skip = {"warnings", "cautions", "assumptions", "computed_on", "altitude_table", "causes"}
    width = max((len(k) for k in body if k not in skip), default=0)
    lines += [f"{k:<{width}}  {cell(v)}" for k, v in body.items() if k not in skip]
    for row in body.get("altitude_table") or []:
        lines.append("  " + "  ".join(f"{k}={cell(v)}" for k, v in row.items()))
    for cause in body.get("causes") or []:
        lines.append(f"cause {cause['code']}: {cell(cause['power'])}  {cause['message']}")
    lines += [f"[{w['severity']}] {w['code']}: {w['message']}" for w in body.get("warnings", [])]
    if body.get("assumptions"):
        lines.append("assumed: " + ", ".join(f"{k}={cell(v)}" for k, v in body["assumptions"].items()))
    lines += [f"caution: {c['message']}" for c in body.get("cautions", [])]
    return "\n".join(lines)


def main(argv=None):
    parser = argparse.ArgumentParser(prog="webcalc", description="Boost and fuel check for boosted engines.")
    parser.add_argument("--version", action="version", version=f"webcalc {__version__}")
    sub = parser.add_subparsers(dest="command", required=True)
    serve = sub.add_parser("serve", help="serve the app with waitress (never in debug mode)")
    serve.add_argument("--host", default="127.0.0.1")
    serve.add_argument("--port", type=int, default=8000)
    serve.add_argument("--threads", type=int, default=8)
    run = sub.add_parser("calc", help="run one calculation: webcalc calc power na_power='300 kW' boost='1 bar'")
    run.add_argument("endpoint")
    run.add_argument("fields", nargs="*", help="field=value; dotted names for nested fields")
    run.add_argument("--input", help="a JSON file with the request body ('-' for standard input)")
    run.add_argument("--json", action="store_true", help="print the JSON response")
    run.add_argument("--lang", help="language of messages and numbers (de, fr, pt-BR...; default English)")
    args = parser.parse_args(argv)

    from . import create_app

    app = create_app()
    if args.command == "serve":
        import logging

        import waitress

        # A busy server would log one "task queue depth" line per queued request.
        logging.getLogger("waitress.queue").setLevel(logging.ERROR)

        app.debug = False  # never, whatever FLASK_DEBUG says
        print(f"webcalc {__version__} on http://{args.host}:{args.port}/", flush=True)
        waitress.serve(app, host=args.host, port=args.port, threads=args.threads)
        return 0
    body = {}
    if args.input:
        body = json.load(sys.stdin if args.input == "-" else open(args.input, encoding="utf-8"))
    body.update(build_body(args.fields))
    from . import i18n

    locale = i18n.negotiate(args.lang)
    query = {"lang": args.lang} if args.lang else None
    response = app.test_client().post(f"/api/v1/{args.endpoint}", json=body, query_string=query)
    print(json.dumps(response.json, indent=2, ensure_ascii=False) if args.json else table(response.json, locale))
    return 0 if response.status_code == 200 else 1


if __name__ == "__main__":
    sys.exit(main())
