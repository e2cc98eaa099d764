-- wrk script for deploy/load-mix.sh: a mix of the three POST endpoints with the demo corner, and every answer's
-- status counted. Mix weights come from the environment: MIX_EVALUATIONS, MIX_RECOMMENDATIONS, MIX_REPORTS
-- (default 7, 2, 1). An API key, if API_KEY is set, goes in the X-Api-Key header.
local function read(path)
  local file = assert(io.open(path, "rb"))
  local body = file:read("*a")
  file:close()
  return body
end

local kinds = {
  { path = "/v1/evaluations", accept = "application/json", body = read("openapi/examples/demo-corner-local.json"), weight = tonumber(os.getenv("MIX_EVALUATIONS") or "7") },
  { path = "/v1/recommendations", accept = "application/json", body = read("openapi/examples/demo-recommendation-local.json"), weight = tonumber(os.getenv("MIX_RECOMMENDATIONS") or "2") },
  { path = "/v1/reports", accept = "text/html", body = read("openapi/examples/demo-report-local.json"), weight = tonumber(os.getenv("MIX_REPORTS") or "1") },
}
local key = os.getenv("API_KEY")

local requests = {}
-- Formatted per thread in init(): only then does wrk know the Host header the requests need.
local function format()
  for _, kind in ipairs(kinds) do
    local headers = { ["Content-Type"] = "application/json", ["Accept"] = kind.accept }
    if key and key ~= "" then headers["X-Api-Key"] = key end
    for _ = 1, kind.weight do
      requests[#requests + 1] = wrk.format("POST", kind.path, headers, kind.body)
    end
  end
end

local threads = {}
function setup(thread) threads[#threads + 1] = thread end

-- Globals, not locals: done() reads each thread's statuses with thread:get.
counter, statuses = 0, {}
function init()
  format()
  counter = math.random(#requests)
end
function request()
  counter = counter % #requests + 1
  return requests[counter]
end
function response(status) statuses[status] = (statuses[status] or 0) + 1 end

function done(summary, latency)
  local totals = {}
  for _, thread in ipairs(threads) do
    local counts = thread:get("statuses")
    for status, count in pairs(counts) do totals[status] = (totals[status] or 0) + count end
  end
  local line = {}
  for status, count in pairs(totals) do line[#line + 1] = status .. "=" .. count end
  table.sort(line)
  local errors = summary.errors
  io.write(string.format("statuses %s\n", table.concat(line, " ")))
  io.write(string.format("socket errors connect=%d read=%d write=%d timeout=%d\n", errors.connect, errors.read, errors.write, errors.timeout))
  io.write(string.format("latency p50 %.1f ms, p99 %.1f ms, max %.1f ms\n", latency:percentile(50) / 1000, latency:percentile(99) / 1000, latency.max / 1000))
  io.write(string.format("requests %d in %.1f s: %.1f per second\n", summary.requests, summary.duration / 1e6, summary.requests / (summary.duration / 1e6)))
end
