"""Behaviour of public/clients/ketwise.py against a scripted in-process HTTP server
(standard library http.server on 127.0.0.1, an ephemeral port): 429 + Retry-After is
retried with the SAME Idempotency-Key, RateLimit fields are kept, ?wait is used until
the run is terminal, problem documents become typed errors with their fields, and a
failed run raises RunFailed. Prints "N passed, M failed"; exit status 1 on a failure.
"""

import json
import sys
import threading
from http.server import BaseHTTPRequestHandler, ThreadingHTTPServer

sys.path.insert(0, sys.argv[1])
import ketwise  # noqa: E402

seen = []
script = []  # (status, headers, body) answered in order


class Handler(BaseHTTPRequestHandler):
    def log_message(self, *args):
        pass

    def _answer(self):
        length = int(self.headers.get("content-length") or 0)
        body = self.rfile.read(length) if length else b""
        seen.append({"method": self.command, "path": self.path, "headers": dict(self.headers), "body": body})
        status, headers, payload = script.pop(0)
        data = json.dumps(payload).encode() if payload is not None else b""
        self.send_response(status)
        for k, v in headers.items():
            self.send_header(k, v)
        self.send_header("content-length", str(len(data)))
        self.end_headers()
        self.wfile.write(data)

    do_GET = _answer
    do_POST = _answer


server = ThreadingHTTPServer(("127.0.0.1", 0), Handler)
threading.Thread(target=server.serve_forever, daemon=True).start()
kw = ketwise.Client("http://127.0.0.1:%d" % server.server_address[1], "kw_test_key")

passed, failed = 0, []


def check(label, ok, detail=""):
    global passed
    if ok:
        passed += 1
    else:
        failed.append(label)
        print("FAIL", label, detail)


RL = {"RateLimit-Limit": "300", "RateLimit-Remaining": "297", "RateLimit-Reset": "42", "RateLimit-Policy": "300;w=60"}
PROBLEM = {"content-type": "application/problem+json"}
run_q = {"id": "r1", "status": "queued"}
run_done = {"id": "r1", "status": "succeeded", "result": {"exact": {"value": 0.5}, "gradient": {"t": {"exact": -0.25}}}}

# 1. submit: 429 with Retry-After 0, then 202 — one retry, same key.
script += [
    (429, dict(PROBLEM, **{"Retry-After": "0", "RateLimit-Remaining": "0", "RateLimit-Limit": "60", "RateLimit-Reset": "0"}), {"type": "/problems/rate-limited", "title": "Too many requests", "status": 429, "detail": "slow down"}),
    (202, RL, run_q),
]
run = kw.submit("OPENQASM 3.0;\nqubit[1] q;", "Z0", shots=10)
check("submit answers the run", run == run_q, run)
check("429 retried once", len(seen) == 2, len(seen))
keys = [s["headers"].get("Idempotency-Key") for s in seen]
check("same Idempotency-Key on the retry", keys[0] and keys[0] == keys[1], keys)
body = json.loads(seen[0]["body"])
check("qasm3 told by its header, pauli text wrapped", body["circuit"]["format"] == "qasm3" and body["observable"] == {"format": "pauli", "terms": "Z0"} and body["shots"] == 10, body)
check("bearer key sent", seen[0]["headers"].get("Authorization") == "Bearer kw_test_key")
check("RateLimit fields kept", kw.rate_limit["limit"] == 300 and kw.rate_limit["remaining"] == 297 and kw.rate_limit["reset"] == 42.0, kw.rate_limit)

# 2. result: waits with ?wait until terminal.
seen.clear()
script += [(200, RL, run_q), (200, RL, run_done)]
result = kw.result("r1")
check("result of the succeeded run", result == run_done["result"], result)
check("waited with ?wait=30 twice", [s["path"] for s in seen] == ["/api/v1/runs/r1?wait=30"] * 2, [s["path"] for s in seen])

# 3. gradient helper: parameters + gradient:true, unpacks to (value, grads).
seen.clear()
script += [(202, RL, run_q), (200, RL, run_done)]
value, grads = kw.gradient("OPENQASM 3.0;", "Z0", {"t": 0.3})
sent = json.loads(seen[0]["body"])
check("gradient sends parameters and gradient: true", sent["parameters"] == {"t": 0.3} and sent["gradient"] is True, sent)
check("gradient unpacks", value == 0.5 and grads == {"t": -0.25}, (value, grads))

# 4. typed errors carry the problem fields.
script.append((400, PROBLEM, {"type": "/problems/engine/qasm-syntax", "title": "Bad circuit", "status": 400, "detail": "unknown gate foo", "errors": [{"path": "circuit.source", "message": "unknown gate", "line": 4, "column": 1}]}))
try:
    kw.submit("OPENQASM 2.0;", "Z0")
    check("400 raises", False)
except ketwise.BadRequest as e:
    check("BadRequest fields", e.status == 400 and e.type == "/problems/engine/qasm-syntax" and e.title == "Bad circuit" and e.detail == "unknown gate foo", repr(e))
    check("field error with line and column", e.errors[0] == ketwise.FieldError("circuit.source", "unknown gate", 4, 1), e.errors)

# 5. a failed run raises RunFailed with the run's problem.
failed_run = {"id": "r2", "status": "failed", "error": {"type": "/problems/run-time-limit", "title": "Time limit", "status": 422, "detail": "over 60 s"}}
script.append((200, RL, failed_run))
try:
    kw.result("r2")
    check("failed run raises", False)
except ketwise.RunFailed as e:
    check("RunFailed carries the problem and the run", e.type == "/problems/run-time-limit" and e.detail == "over 60 s" and e.run["id"] == "r2", repr(e))

# 6. 429 beyond max_retries raises RateLimited with retry_after.
strict = ketwise.Client(kw.base_url, "kw_test_key", max_retries=1)
script += [(429, dict(PROBLEM, **{"Retry-After": "0"}), {"type": "/problems/rate-limited", "title": "Too many requests", "status": 429, "detail": "x"})] * 2
try:
    strict.get("r3")
    check("RateLimited raised", False)
except ketwise.RateLimited as e:
    check("RateLimited after the retries", e.status == 429 and e.retry_after == 0.0, repr(e))

server.shutdown()
print("%d passed, %d failed" % (passed, len(failed)))
sys.exit(1 if failed else 0)
