"""Load test of the production server on loopback, rising concurrency (figures only, no pass/fail).

    python bench/load.py [--duration 30] [--connections 1,4,16,32] [--json]

Starts ``webcalc serve`` (as ``python -m webcalc.cli serve``: waitress with its default 8
threads) as a subprocess on a free 127.0.0.1 port and stops it at the end, also on Ctrl-C,
SIGTERM or an error. After a short warm-up, steps of rising concurrency share ``--duration``
seconds (30 by default, warm-up included). In each step two clients run at the same time
against the same server, each holding that many keep-alive connections: one POSTs the power
body of bench/api_bench.py (a realistic request: boost, site, centrifugal compressor, a
measured power, imperial units) to /api/v1/power, the other GETs /healthz. Both therefore see
the same machine state, and /healthz shows what the server's own overhead costs under the
same load.

Printed per step and overall: requests per second (power, /healthz, together), latency p50 and
p99 of each, the ratios power / healthz of p50 and p99, the error count (any non-2xx status or
socket error or timeout; target 0), and the CPU used by the server and by the clients, in
cores (this machine may have only two, so the client's share matters). With ``--json`` the
last line printed is one JSON object with the same figures.

Client: Debian's ``wrk`` (installed with apt-get, through sudo when not root, if missing),
driven by bench/load.lua, which sets the POST body, counts every non-2xx response (wrk alone
counts only >= 400) and writes wrk's latency quantiles as JSON. Why wrk and not a Python
client: wrk is C on epoll and spends a few microseconds of CPU per request, where a Python
client spends tens to a hundred; on a 2-core machine a Python client would take a large part
of the CPU the server needs (a GIL-bound waitress process) and would put its own parsing time
into every latency, most visibly into /healthz, the denominator of the ratios. The measured
client CPU is printed so the claim can be checked on each run.

How to read it: the load is closed-loop (each connection sends its next request when the
previous answer has arrived), so once the server is saturated throughput stays flat and extra
connections only add time spent waiting in the server's queue, for power and /healthz alike:
the ratios then describe queueing more than the cost of each request. Even with one
connection each, a /healthz request often waits for the power request in progress (one Python
process runs one request's Python code at a time), so these ratios describe the two under
shared load; bench/api_bench.py times each request alone. Requests per second are counted over
wrk's own timing of each client. Per-step percentiles are wrk's exact ones (1 us histogram);
the overall ones are pooled from each step's quantiles at 0.1 % steps of rank (so approximate
to 0.1 % of rank). Figures are noisy when other processes share the machine: the load average
before the run is printed.
"""

import argparse
import json
import os
import resource
import shutil
import signal
import socket
import subprocess
import sys
import tempfile
import time
import urllib.error
import urllib.request
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
LUA = Path(__file__).resolve().with_name("load.lua")
sys.path.insert(0, str(ROOT))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from api_bench import POWER_BODY  # noqa: E402

WARMUP_S = 2
WRK_TIMEOUT = "10s"
_children = []  # every process we started and must stop


def _on_sigterm(signum, frame):
    print("\nterminated: stopping the server", file=sys.stderr)
    raise SystemExit(128 + signum)


def ensure_wrk():
    """Path of wrk, installing Debian's package first if it is missing."""
    found = shutil.which("wrk")
    if found:
        return found
    print("wrk not found: installing it (apt-get install -y wrk)", file=sys.stderr, flush=True)
    root = [] if os.geteuid() == 0 else ["sudo"]
    subprocess.run(root + ["apt-get", "update", "-qq"], check=True)
    subprocess.run(root + ["env", "DEBIAN_FRONTEND=noninteractive", "apt-get", "install", "-y", "-qq", "wrk"],
                   check=True)
    found = shutil.which("wrk")
    if not found:
        sys.exit("wrk is still missing after apt-get install")
    return found


def free_port():
    with socket.socket(socket.AF_INET, socket.SOCK_STREAM) as s:
        s.bind(("127.0.0.1", 0))
        return s.getsockname()[1]


def cpu_seconds(pid):
    """User + system CPU time of a running process, [s] (Linux /proc)."""
    with open(f"/proc/{pid}/stat", encoding="ascii") as f:
        fields = f.read().rsplit(")", 1)[1].split()
    return (int(fields[11]) + int(fields[12])) / os.sysconf("SC_CLK_TCK")


def children_cpu_seconds():
    usage = resource.getrusage(resource.RUSAGE_CHILDREN)
    return usage.ru_utime + usage.ru_stime


def stop(process):
    if process.poll() is None:
        process.terminate()
        try:
            process.wait(5)
        except subprocess.TimeoutExpired:
            process.kill()
            process.wait()


class Server:
    """``webcalc serve`` on a free loopback port, its output kept in a temporary file."""

    def __init__(self):
        self.log = tempfile.TemporaryFile()
        self.read_upto = 0
        env = dict(os.environ, PYTHONPATH=os.pathsep.join(filter(None, [str(ROOT), os.environ.get("PYTHONPATH")])))
        for _ in range(3):  # the port could be taken between free_port() and the bind
            self.port = free_port()
            self.base = f"http://127.0.0.1:{self.port}"
            self.process = subprocess.Popen(
                [sys.executable, "-m", "webcalc.cli", "serve", "--host", "127.0.0.1", "--port", str(self.port)],
                stdout=self.log, stderr=subprocess.STDOUT, stdin=subprocess.DEVNULL, cwd=ROOT, env=env,
                start_new_session=True)  # Ctrl-C reaches us only; we stop it ourselves
            _children.append(self.process)
            if self._wait_ready(30):
                return
            stop(self.process)
        raise RuntimeError("webcalc serve did not start:\n" + self.new_output())

    def _wait_ready(self, seconds):
        deadline = time.monotonic() + seconds
        while time.monotonic() < deadline:
            if self.process.poll() is not None:
                return False
            try:
                with urllib.request.urlopen(self.base + "/healthz", timeout=1) as response:
                    if response.status == 200:
                        return True
            except (OSError, urllib.error.URLError):
                time.sleep(0.1)
        return False

    def new_output(self):
        """What the server printed since the last call."""
        self.log.seek(self.read_upto)
        text = self.log.read().decode("utf-8", "replace")
        self.read_upto = self.log.tell()
        return text

    def close(self):
        stop(self.process)
        self.log.close()


def check_power(base, body):
    request = urllib.request.Request(base + "/api/v1/power", data=body.encode(), method="POST",
                                     headers={"Content-Type": "application/json"})
    try:
        with urllib.request.urlopen(request, timeout=10) as response:
            answer = json.loads(response.read())
    except urllib.error.HTTPError as error:
        raise RuntimeError(f"POST /api/v1/power answered {error.code}: {error.read()[:500]!r}") from None
    if "expected" not in json.dumps(answer):
        raise RuntimeError(f"POST /api/v1/power answered without an expected power: {answer!r:.500}")


def run_wrk(wrk, url, connections, seconds, body=None):
    command = [wrk, "-t1", f"-c{connections}", f"-d{seconds}s", "--timeout", WRK_TIMEOUT, "-s", str(LUA), url]
    if body is not None:
        command += ["--", body]
    process = subprocess.Popen(command, stdout=subprocess.PIPE, stderr=subprocess.PIPE, stdin=subprocess.DEVNULL,
                               text=True, start_new_session=True)
    _children.append(process)
    return process


def wrk_result(process, seconds):
    out, err = process.communicate(timeout=seconds + 60)
    for line in out.splitlines():
        if line.startswith("RESULT "):
            return json.loads(line[len("RESULT "):])
    raise RuntimeError(f"wrk gave no result (exit {process.returncode}):\n{out}\n{err}")


def step(wrk, server, body, connections, seconds):
    """Power and /healthz at the same time, `connections` each; raw wrk results and CPU used."""
    server_cpu, client_cpu, start = cpu_seconds(server.process.pid), children_cpu_seconds(), time.monotonic()
    power = run_wrk(wrk, server.base + "/api/v1/power", connections, seconds, body)
    health = run_wrk(wrk, server.base + "/healthz", connections, seconds)
    results = {"power": wrk_result(power, seconds), "healthz": wrk_result(health, seconds)}
    wall = time.monotonic() - start
    output = server.new_output()
    return {
        "connections_per_endpoint": connections,
        "seconds": seconds,
        "raw": results,
        "server_cpu_cores": (cpu_seconds(server.process.pid) - server_cpu) / wall,
        "client_cpu_cores": (children_cpu_seconds() - client_cpu) / wall,
        "server_queue_warnings": output.count("Task queue depth"),
    }


def finite(value):
    """JSON has no NaN: figures that could not be measured become null."""
    if isinstance(value, float) and value != value:
        return None
    if isinstance(value, dict):
        return {k: finite(v) for k, v in value.items()}
    if isinstance(value, (list, tuple)):
        return [finite(v) for v in value]
    return value


def errors_of(raw):
    return raw["non2xx"] + raw["connect"] + raw["read"] + raw["write"] + raw["timeout"]


def merged_percentile(raws, p):
    """Percentile [us] of several wrk runs pooled, from their 0.1 %-rank quantile grids."""
    points = sorted((value, raw["requests"] / len(raw["grid_us"])) for raw in raws if raw["requests"]
                    for value in raw["grid_us"])
    if not points:
        return float("nan")
    rank, total = p / 100 * sum(w for _, w in points), 0.0
    for value, weight in points:
        total += weight
        if total >= rank - 1e-9:
            return value
    return points[-1][0]


def figures(raws_by_endpoint, exact=True):
    """Throughput, latency and errors of each endpoint and together, from raw wrk results."""
    out = {}
    for name, raws in raws_by_endpoint.items():
        requests = sum(r["requests"] for r in raws)
        seconds = sum(r["duration_us"] for r in raws) / 1e6  # as wrk timed it
        if exact and len(raws) == 1:
            p50, p99 = raws[0]["p50_us"], raws[0]["p99_us"]
        else:
            p50, p99 = merged_percentile(raws, 50), merged_percentile(raws, 99)
        out[name] = {"requests": requests, "rps": requests / seconds, "p50_ms": p50 / 1e3, "p99_ms": p99 / 1e3,
                     "max_ms": max(r["max_us"] for r in raws) / 1e3,
                     "non2xx": sum(r["non2xx"] for r in raws),
                     "socket_errors": sum(errors_of(r) - r["non2xx"] for r in raws),
                     "errors": sum(errors_of(r) for r in raws)}
    p, h = out["power"], out["healthz"]
    out["all"] = {"requests": p["requests"] + h["requests"], "rps": p["rps"] + h["rps"],
                  "errors": p["errors"] + h["errors"]}
    out["ratio_p50"] = p["p50_ms"] / h["p50_ms"] if h["p50_ms"] else float("nan")
    out["ratio_p99"] = p["p99_ms"] / h["p99_ms"] if h["p99_ms"] else float("nan")
    return out


HEADER = (f"{'conns':>5} {'power':>8} {'healthz':>8} {'all':>8} | {'power p50':>9} {'p99':>7} | "
          f"{'healthz p50':>11} {'p99':>7} | {'ratio p50':>9} {'p99':>5} | {'errors':>6} | "
          f"{'cpu server':>10} {'client':>6}")
UNITS = (f"{'each':>5} {'req/s':>8} {'req/s':>8} {'req/s':>8} | {'ms':>9} {'ms':>7} | {'ms':>11} {'ms':>7} | "
         f"{'x':>9} {'x':>5} | {'':>6} | {'cores':>10} {'cores':>6}")


def row(label, f, server_cores, client_cores):
    p, h = f["power"], f["healthz"]
    return (f"{label:>5} {p['rps']:8.0f} {h['rps']:8.0f} {f['all']['rps']:8.0f} | "
            f"{p['p50_ms']:9.2f} {p['p99_ms']:7.2f} | {h['p50_ms']:11.2f} {h['p99_ms']:7.2f} | "
            f"{f['ratio_p50']:9.2f} {f['ratio_p99']:5.2f} | "
            f"{f['all']['errors']:6d} | {server_cores:10.2f} {client_cores:6.2f}")


def parse_connections(text):
    try:
        values = [int(v) for v in text.split(",") if v.strip()]
    except ValueError:
        raise argparse.ArgumentTypeError(f"--connections: expected numbers separated by commas, got {text!r}") from None
    if not values or min(values) < 1 or max(values) > 256:
        raise argparse.ArgumentTypeError(f"--connections: each value must be from 1 to 256, got {text!r}")
    return values


def main():
    parser = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    parser.add_argument("--duration", type=int, default=30, help="total seconds of load, warm-up included (default 30)")
    parser.add_argument("--connections", type=parse_connections, default=[1, 4, 16, 32],
                        help="connections per endpoint in each step, comma-separated (default 1,4,16,32)")
    parser.add_argument("--json", action="store_true", help="also print the figures as one JSON object (last line)")
    args = parser.parse_args()
    steps = args.connections
    warmup = WARMUP_S if args.duration >= WARMUP_S + 2 * len(steps) else 1
    if args.duration < warmup + len(steps):
        parser.error(f"--duration: at least {warmup + len(steps)} s for {len(steps)} steps (1 s warm-up, 1 s a step)")
    if args.duration > 3600:
        parser.error("--duration: at most 3600 s")
    per_step = (args.duration - warmup) // len(steps)

    signal.signal(signal.SIGTERM, _on_sigterm)
    wrk = ensure_wrk()
    body = json.dumps(POWER_BODY)
    load_before = os.getloadavg()
    server = None
    try:
        server = Server()
        check_power(server.base, body)
        print(f"server: webcalc serve (waitress, 8 threads) on 127.0.0.1:{server.port}; "
              f"{os.cpu_count()} cores, load average {load_before[0]:.2f} {load_before[1]:.2f} "
              f"{load_before[2]:.2f} before the run")
        print(f"{warmup} s warm-up, then {len(steps)} steps of {per_step} s; in each step two wrk clients at once, "
              f"'conns' connections each: POST /api/v1/power and GET /healthz")
        step(wrk, server, body, 1, warmup)
        print(HEADER)
        print(UNITS)
        results = []
        for connections in steps:
            s = step(wrk, server, body, connections, per_step)
            s["figures"] = figures({k: [v] for k, v in s["raw"].items()})
            results.append(s)
            print(row(connections, s["figures"], s["server_cpu_cores"], s["client_cpu_cores"]), flush=True)
        overall = figures({name: [s["raw"][name] for s in results] for name in ("power", "healthz")})
        server_cores = sum(s["server_cpu_cores"] for s in results) / len(results)
        client_cores = sum(s["client_cpu_cores"] for s in results) / len(results)
        print(row("all", overall, server_cores, client_cores))
        print(f"errors (non-2xx, socket errors, timeouts over {WRK_TIMEOUT}): {overall['all']['errors']}   (target 0);"
              f" server 'task queue depth' warnings: {sum(s['server_queue_warnings'] for s in results)}")
        print("overall percentiles pooled over all steps (0.1 % rank resolution); "
              "ratios are power / healthz latency")
        if args.json:
            for s in results:
                for raw in s["raw"].values():
                    raw.pop("grid_us")
            print(json.dumps(finite({
                "cores": os.cpu_count(), "load_average_before": load_before, "warmup_s": warmup,
                "step_s": per_step, "server": "webcalc serve (waitress, 8 threads)",
                "steps": [{k: s[k] for k in ("connections_per_endpoint", "seconds", "server_cpu_cores",
                                             "client_cpu_cores", "server_queue_warnings", "figures")} | {
                    "wrk": s["raw"]} for s in results],
                "overall": overall | {"server_cpu_cores": server_cores, "client_cpu_cores": client_cores},
            }), allow_nan=False))
    except KeyboardInterrupt:
        print("\ninterrupted: stopping the server", file=sys.stderr)
        return 130
    finally:
        for process in _children:
            stop(process)
        if server is not None:
            server.close()
    return 0


if __name__ == "__main__":
    sys.exit(main())
