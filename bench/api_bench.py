"""Benchmarks of the API and the engine, measured in one run (no assertions: figures only).

    python bench/api_bench.py

1. A `power` request against a `/healthz` request on the same app, median time per request
   and the median of their ratios over 9 alternating rounds (both requests see the same
   machine state; target: at most 1.5x), measured two ways: over HTTP to the production
   server (`webcalc serve`, waitress, in its own process on 127.0.0.1; one keep-alive
   connection from this process writing each request in one send, as a browser does),
   and in-process through Flask's test client (no sockets: the strictest view, where the
   test client's own JSON encoding of the request body counts against `power`).
2. A 10 000-point boost x altitude sweep of expected power, vectorised with numpy against a
   per-point Python loop over the same engine function (target: at least 30x).
"""

import statistics
import sys
import time
from pathlib import Path

import numpy as np

sys.path.insert(0, str(Path(__file__).resolve().parent.parent))

from webcalc import create_app  # noqa: E402
from webcalc.engine import atmosphere, fuel, power  # noqa: E402

POWER_BODY = {"na_power": "300 hp", "boost": "14.5 psi", "site": {"altitude": "1200 m", "temperature": "28 degC"},
              "induction": "centrifugal", "measured_power": "420 hp", "units": "imperial"}


def per_request(call, n, rounds=7):
    """Median over rounds of the mean time of n calls, [s]."""
    samples = []
    for _ in range(rounds):
        start = time.perf_counter()
        for _ in range(n):
            call()
        samples.append((time.perf_counter() - start) / n)
    return statistics.median(samples)


def paired(health_call, calc_call, n, rounds=9):
    """Both requests measured in alternating rounds (so both see the same machine state):
    median time of each [s] and the median of the per-round ratios."""
    health, calc, ratios = [], [], []
    for _ in range(rounds):
        h = per_request(health_call, n, rounds=1)
        c = per_request(calc_call, n, rounds=1)
        health.append(h)
        calc.append(c)
        ratios.append(c / h)
    return statistics.median(health), statistics.median(calc), statistics.median(ratios)


def bench_requests(n=400):
    client = create_app().test_client()
    assert client.post("/api/v1/power", json=POWER_BODY).status_code == 200
    for _ in range(100):  # warm up caches (unit factors, catalogs)
        client.post("/api/v1/power", json=POWER_BODY)
        client.get("/healthz")
    return paired(lambda: client.get("/healthz"), lambda: client.post("/api/v1/power", json=POWER_BODY), n)


class KeepAlive:
    """One keep-alive HTTP/1.1 connection that writes each request in a single send, as
    browsers and wrk do (``http.client`` writes a POST's headers and body in two sends,
    which costs the server a second read and measures the client, not the server)."""

    def __init__(self, port):
        import socket

        self.sock = socket.create_connection(("127.0.0.1", port), timeout=10)
        self.sock.setsockopt(socket.IPPROTO_TCP, socket.TCP_NODELAY, 1)

    @staticmethod
    def message(method, path, body=b""):
        head = f"{method} {path} HTTP/1.1\r\nHost: 127.0.0.1\r\n"
        if body:
            head += f"Content-Type: application/json\r\nContent-Length: {len(body)}\r\n"
        return (head + "\r\n").encode("ascii") + body

    def roundtrip(self, message):
        """Send one request, read its whole response; the status code."""
        self.sock.sendall(message)
        data = b""
        while b"\r\n\r\n" not in data:
            data += self.sock.recv(65536)
        head, _, body = data.partition(b"\r\n\r\n")
        lines = head.split(b"\r\n")
        length = next(int(line.split(b":")[1]) for line in lines if line.lower().startswith(b"content-length:"))
        while len(body) < length:
            body += self.sock.recv(65536)
        return int(lines[0].split()[1])

    def close(self):
        self.sock.close()


def bench_http(n=400):
    """Over HTTP to the production server: ``webcalc serve`` (waitress) in its own process,
    as a phone or a script calls it, one keep-alive connection from this process."""
    import json

    from load import Server  # bench/load.py: starts and stops `webcalc serve` on a free port

    server = Server()
    connection = KeepAlive(server.port)
    health = KeepAlive.message("GET", "/healthz")
    power = KeepAlive.message("POST", "/api/v1/power", json.dumps(POWER_BODY).encode())

    def get():
        connection.roundtrip(health)

    def post():
        assert connection.roundtrip(power) == 200

    try:
        for _ in range(200):
            get()
            post()
        return paired(get, post, n)
    finally:
        connection.close()
        server.close()


def sweep_arguments(points=10_000):
    boosts = np.linspace(0.0, 200e3, 100)
    altitudes = np.linspace(0.0, 3500.0, points // 100)
    B, H = np.meshgrid(boosts, altitudes)
    p, T = atmosphere.isa_pressure(H.ravel()), atmosphere.isa_temperature(H.ravel())
    bsfc, afr = fuel.na_air_defaults(14.7)
    na = dict(na_power=220e3, p_na=101325.0, T_na=288.15, na_air_mass_flow=220e3 * bsfc * afr,
              belt_driven=True, drive_efficiency=0.95, efficiency=0.7, effectiveness=0.75, exhaust_ratio=0.0)
    return B.ravel(), p, T, na


def bench_sweep():
    b, p, T, na = sweep_arguments()
    start = time.perf_counter()
    vector = power.expected_power(b, p_baro=p, T1=T, **na)["expected"]
    t_vector = time.perf_counter() - start
    start = time.perf_counter()
    loop = [power.expected_power(float(b[i]), p_baro=float(p[i]), T1=float(T[i]), **na)["expected"]
            for i in range(len(b))]
    t_loop = time.perf_counter() - start
    assert np.allclose(vector, np.array(loop, dtype=float), rtol=1e-12)
    return len(b), t_vector, t_loop


def main():
    for label, (health, calc, ratio) in (("HTTP (waitress)", bench_http()),
                                         ("in-process test client", bench_requests())):
        print(f"{label}: /healthz {health * 1e6:.1f} us, power {calc * 1e6:.1f} us, "
              f"ratio power / healthz {ratio:.2f} x (median of 9 paired rounds)   (target <= 1.5 x)")
    n, t_vector, t_loop = bench_sweep()
    print(f"sweep of {n} points: vectorised {t_vector * 1e3:.2f} ms, loop {t_loop * 1e3:.1f} ms")
    print(f"ratio loop / vectorised {t_loop / t_vector:8.1f} x   (target >= 30 x)")


if __name__ == "__main__":
    main()
