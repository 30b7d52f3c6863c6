"""webcalc: boost and fuel calculations for turbocharged and supercharged engines."""

__version__ = "0.1.0"


def create_app(config=None):
    """Application factory: the API blueprint, the front end and the security headers."""
    from flask import Flask

    from . import web
    from .api import MAX_BODY, bp

    app = Flask(__name__, static_folder=None)
    app.config.update(MAX_CONTENT_LENGTH=MAX_BODY, JSON_SORT_KEYS=False)
    if config:
        app.config.update(config)
    app.json.sort_keys = False
    app.register_blueprint(bp)
    app.register_blueprint(web.bp)
    web.install_handlers(app)
    return app
