-- wrk script for bench/load.py (not meant to be run by hand).
--
--   wrk ... -s bench/load.lua URL -- [JSON_BODY]
--
-- With a body argument every request is a POST of that body as application/json, else a GET.
-- Every response whose status is not 2xx is counted (wrk itself counts only >= 400).
-- At the end one line is written: "RESULT " and a JSON object with the request count, the
-- socket errors, the non-2xx count, the duration [us] and the latency quantiles [us] at
-- 0.1 %, 0.2 %, ... 99.9 % and the maximum (so load.py can pool steps), plus p50 and p99.

local threads = {}

function setup(thread)
  table.insert(threads, thread)
end

function init(args)
  non2xx = 0
  if args[1] ~= nil then
    wrk.method = "POST"
    wrk.body = args[1]
    wrk.headers["Content-Type"] = "application/json"
  end
end

function response(status, headers, body)
  if status < 200 or status > 299 then
    non2xx = non2xx + 1
  end
end

function done(summary, latency, requests)
  local bad = 0
  for _, thread in ipairs(threads) do
    bad = bad + (thread:get("non2xx") or 0)
  end
  local grid = {}
  if summary.requests > 0 then
    for k = 1, 999 do
      grid[k] = string.format("%d", latency:percentile(k / 10))
    end
    grid[1000] = string.format("%d", latency.max)  -- wrk's percentile(100) answers 0
  end
  local e = summary.errors
  io.write(string.format(
    '\nRESULT {"requests": %d, "duration_us": %d, "non2xx": %d, "connect": %d, "read": %d, ' ..
    '"write": %d, "timeout": %d, "p50_us": %d, "p99_us": %d, "max_us": %d, "mean_us": %.1f, ' ..
    '"grid_us": [%s]}\n',
    summary.requests, summary.duration, bad, e.connect, e.read, e.write, e.timeout,
    summary.requests > 0 and latency:percentile(50) or 0,
    summary.requests > 0 and latency:percentile(99) or 0,
    latency.max, summary.requests > 0 and latency.mean or 0, table.concat(grid, ",")))
end
