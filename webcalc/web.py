"""The front end's routes, /healthz, JSON error pages and the security headers."""

import functools
import json

from flask import Blueprint, current_app, jsonify, render_template, request, send_from_directory
from werkzeug.exceptions import HTTPException

from . import i18n
from .api.respond import error_body
from .resources import resource_dir

bp = Blueprint("web", __name__, template_folder="templates")

#: Strict policy: nothing inline, nothing from another origin.
CSP = ("default-src 'self'; base-uri 'self'; form-action 'self'; frame-ancestors 'none'; "
       "object-src 'none'")
HEADERS = {
    "Content-Security-Policy": CSP,
    "X-Content-Type-Options": "nosniff",
    "Referrer-Policy": "no-referrer",
    "X-Frame-Options": "DENY",
    "Permissions-Policy": "camera=(), microphone=(), geolocation=(), payment=(), usb=()",
    "Cross-Origin-Opener-Policy": "same-origin",
}
ERROR_CODES = {404: "not_found", 405: "method_not_allowed", 413: "too_large", 415: "unsupported_media_type",
               400: "malformed_json"}


def static_dir():
    return resource_dir("static")


@bp.get("/healthz")
def healthz():
    return jsonify(status="ok")


@functools.lru_cache(maxsize=1)
def _languages():
    """The language picker's entries, in the page itself (one request fewer): code -> own name."""
    return json.dumps({loc: i18n.locale_name(loc) for loc in i18n.LOCALES}, ensure_ascii=False,
                      separators=(",", ":"))


@bp.get("/")
def index():
    """The page, in the language of `lang` or Accept-Language (the app may switch it later)."""
    locale = i18n.negotiate(request.args.get("lang"), request.headers.get("Accept-Language"))
    html = render_template("index.html", lang_tag=locale.replace("_", "-"), languages=_languages(),
                           _=lambda message: i18n.gettext(locale, message))
    response = current_app.response_class(html, mimetype="text/html")
    response.headers["Cache-Control"] = "no-cache"
    response.headers["Content-Language"] = locale.replace("_", "-")
    response.vary.add("Accept-Language")
    return response


@bp.get("/sw.js")
def service_worker():
    response = send_from_directory(static_dir(), "sw.js", mimetype="text/javascript")
    response.headers["Cache-Control"] = "no-cache"
    response.headers["Service-Worker-Allowed"] = "/"
    return response


@bp.get("/manifest.webmanifest")
def manifest():
    return send_from_directory(static_dir(), "manifest.webmanifest", mimetype="application/manifest+json")


@bp.get("/static/<path:path>")
def static_file(path):
    response = send_from_directory(static_dir(), path)
    response.headers["Cache-Control"] = "no-cache"
    return response


def install_handlers(app):
    """JSON for every HTTP error, and the security headers on every response."""

    @app.errorhandler(HTTPException)
    def http_error(exc):
        locale = i18n.negotiate(request.args.get("lang"), request.headers.get("Accept-Language"))
        code = ERROR_CODES.get(exc.code, "not_found")
        response = jsonify(error_body(locale, code))
        response.status_code = exc.code
        return response

    @app.after_request
    def security_headers(response):
        for name, value in HEADERS.items():
            response.headers.setdefault(name, value)
        return response
