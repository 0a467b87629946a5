"""Ketwise API v1 client: one file, Python 3.8+ standard library only (urllib).

Download it from your Ketwise server (``/clients/ketwise.py``) next to your
notebook or script, then::

    from ketwise import Client
    kw = Client("https://ketwise.example", "kw_xxxxxxxx_...")   # or KETWISE_URL / KETWISE_API_KEY
    run = kw.submit(QASM3_SOURCE, "Z0 Z1 + 0.5 X0", parameters={"t": 0.3}, shots=2000, seed=7)
    result = kw.result(run)                      # waits with ?wait=30, no polling loop of yours
    value, grad = kw.gradient(QASM3_SOURCE, "Z0 Z1 + 0.5 X0", {"t": 0.3})
    rows = kw.points(QASM3_SOURCE, "Z0 Z1", [{"t": 0.0}, {"t": 0.5}], gradient=True)

What it does for you:

* ``submit`` sends an ``Idempotency-Key`` (a fresh UUID unless you give one), so
  its own retries after a dropped connection, a 429 or a 503 never queue a run twice.
* 429 and 503 answers are retried after their ``Retry-After`` (up to ``max_retries``
  times); the ``RateLimit-*`` fields of every answer are kept in ``client.rate_limit``
  and a spent budget is waited out before the next request.
* ``wait`` holds ``GET /api/v1/runs/{id}?wait=30`` until the run is terminal.
* Every problem answer (RFC 9457) raises a typed ``KetwiseError`` subclass carrying
  ``status``, ``type``, ``title``, ``detail`` and ``errors`` (field path, message,
  line, column).
"""

import json
import os
import time
import urllib.error
import urllib.parse
import urllib.request
import uuid
from dataclasses import dataclass, field
from typing import Any, Dict, List, Mapping, Optional, Sequence, Tuple, Union

__all__ = [
    "Client",
    "FieldError",
    "KetwiseError",
    "BadRequest",
    "Unauthorized",
    "PaymentRequired",
    "Forbidden",
    "NotFound",
    "Conflict",
    "PayloadTooLarge",
    "ValidationFailed",
    "RateLimited",
    "ServiceUnavailable",
    "ServerError",
    "RunFailed",
    "WaitTimeout",
    "ValueAndGradient",
]

__version__ = "1.0.0"

TERMINAL = ("succeeded", "failed", "canceled")
MAX_WAIT_SECONDS = 30
EXPORT_FILES = ("terms.csv", "counts.csv", "points.csv", "circuits.zip")


# --------------------------------------------------------------------------- errors


@dataclass(frozen=True)
class FieldError:
    """One entry of a problem's ``errors``: where the request is wrong and why."""

    path: str
    message: str
    line: Optional[int] = None
    column: Optional[int] = None

    def __str__(self) -> str:
        where = self.path
        if self.line is not None:
            where += " (line %d%s)" % (self.line, ", column %d" % self.column if self.column is not None else "")
        return "%s: %s" % (where, self.message)


class KetwiseError(Exception):
    """A problem answer of the API (RFC 9457), or a failure to reach it (status 0)."""

    def __init__(
        self,
        status: int,
        title: str,
        detail: str,
        type: str = "about:blank",
        errors: Sequence[FieldError] = (),
        headers: Optional[Mapping[str, str]] = None,
    ) -> None:
        self.status = status
        self.title = title
        self.detail = detail
        self.type = type
        self.errors = list(errors)
        self.headers = dict(headers or {})
        text = "%d %s: %s" % (status, title, detail) if status else "%s: %s" % (title, detail)
        if self.errors:
            text += "\n  " + "\n  ".join(str(e) for e in self.errors)
        super().__init__(text)


class BadRequest(KetwiseError):
    """400: malformed JSON or query, or the engine refused the circuit or observable (with line/column)."""


class Unauthorized(KetwiseError):
    """401: no, malformed, unknown or revoked API key."""


class PaymentRequired(KetwiseError):
    """402: over a plan limit (qubits, monthly shots or simulation-seconds)."""


class Forbidden(KetwiseError):
    """403: the key's role is too weak for this call."""


class NotFound(KetwiseError):
    """404: no such item in this organisation (or no such export for the run)."""


class Conflict(KetwiseError):
    """409: the item's state does not allow it (e.g. an export of an unfinished run)."""


class PayloadTooLarge(KetwiseError):
    """413: the body is larger than the server accepts."""


class ValidationFailed(KetwiseError):
    """422 (and 415): the body does not match the schema; ``errors`` names each field."""


class RateLimited(KetwiseError):
    """429 after ``max_retries`` retries; ``retry_after`` is the server's last advice in seconds."""

    @property
    def retry_after(self) -> Optional[float]:
        return _seconds(self.headers.get("retry-after"))


class ServiceUnavailable(KetwiseError):
    """503 after retries (e.g. the job queue is down; nothing was created)."""


class ServerError(KetwiseError):
    """Any other 5xx answer, or no answer at all (status 0)."""


class RunFailed(KetwiseError):
    """The run ended ``failed`` or ``canceled``; ``run`` is the run resource, the fields its ``error``."""

    def __init__(self, run: Dict[str, Any]) -> None:
        problem = run.get("error") or {}
        self.run = run
        super().__init__(
            int(problem.get("status") or 0),
            str(problem.get("title") or "Run %s" % run.get("status")),
            str(problem.get("detail") or "The run %s." % run.get("status")),
            str(problem.get("type") or "about:blank"),
            _field_errors(problem.get("errors")),
        )


class WaitTimeout(KetwiseError):
    """``wait(timeout=...)`` ran out before the run was terminal; ``run`` is its last state."""

    def __init__(self, run: Dict[str, Any], timeout: float) -> None:
        self.run = run
        super().__init__(0, "Wait timed out", "run %s is still %s after %g s" % (run.get("id"), run.get("status"), timeout))


_BY_STATUS = {
    400: BadRequest,
    401: Unauthorized,
    402: PaymentRequired,
    403: Forbidden,
    404: NotFound,
    409: Conflict,
    413: PayloadTooLarge,
    415: ValidationFailed,
    422: ValidationFailed,
    429: RateLimited,
    503: ServiceUnavailable,
}


def _field_errors(raw: Any) -> List[FieldError]:
    out = []
    for e in raw or []:
        if isinstance(e, dict):
            out.append(FieldError(str(e.get("path", "")), str(e.get("message", "")), e.get("line"), e.get("column")))
    return out


def _seconds(value: Optional[str]) -> Optional[float]:
    try:
        return max(0.0, float(value)) if value is not None else None
    except ValueError:
        return None


def _problem(status: int, body: bytes, headers: Mapping[str, str]) -> KetwiseError:
    try:
        doc = json.loads(body.decode("utf-8")) if body else {}
    except ValueError:
        doc = {}
    if not isinstance(doc, dict):
        doc = {}
    cls = _BY_STATUS.get(status, ServerError if status >= 500 else KetwiseError)
    return cls(
        status,
        str(doc.get("title") or "HTTP %d" % status),
        str(doc.get("detail") or "The server answered %d." % status),
        str(doc.get("type") or "about:blank"),
        _field_errors(doc.get("errors")),
        headers,
    )


# --------------------------------------------------------------------------- results


@dataclass
class ValueAndGradient:
    """What ``Client.gradient`` returns: the exact value, d(value)/d(input) per input, the full result."""

    value: float
    gradient: Dict[str, float]
    sampled: Optional[Dict[str, Dict[str, float]]] = None
    result: Dict[str, Any] = field(default_factory=dict)

    def __iter__(self):  # value, grad = kw.gradient(...)
        return iter((self.value, self.gradient))


RunRef = Union[str, Mapping[str, Any]]


def _run_id(run: RunRef) -> str:
    if isinstance(run, str):
        return run
    return str(run["id"])


def _circuit(circuit: Union[str, Mapping[str, Any]]) -> Dict[str, Any]:
    if isinstance(circuit, str):
        fmt = "qasm3" if circuit.lstrip().upper().startswith("OPENQASM 3") else "qasm2"
        return {"format": fmt, "source": circuit}
    return dict(circuit)


def _observable(observable: Union[str, Mapping[str, Any]]) -> Dict[str, Any]:
    if isinstance(observable, str):
        return {"format": "pauli", "terms": observable}
    return dict(observable)


# --------------------------------------------------------------------------- client


class Client:
    """A Ketwise API v1 client for one organisation (the API key's).

    ``base_url`` and ``api_key`` default to the ``KETWISE_URL`` and ``KETWISE_API_KEY``
    environment variables. ``timeout`` is the socket timeout of ordinary calls in
    seconds (waiting calls add their wait); ``max_retries`` bounds the retries of 429,
    503 and dropped connections per call.
    """

    def __init__(
        self,
        base_url: Optional[str] = None,
        api_key: Optional[str] = None,
        *,
        timeout: float = 60.0,
        max_retries: int = 6,
        user_agent: str = "ketwise-python/" + __version__,
    ) -> None:
        base = base_url or os.environ.get("KETWISE_URL") or "http://localhost:3000"
        self.base_url = base.rstrip("/")
        self.api_key = api_key or os.environ.get("KETWISE_API_KEY")
        if not self.api_key:
            raise ValueError("an API key is needed: pass api_key= or set KETWISE_API_KEY (keys look like kw_xxxxxxxx_...)")
        self.timeout = timeout
        self.max_retries = max_retries
        self.user_agent = user_agent
        #: The last RateLimit-* fields seen: {"limit", "remaining", "reset", "policy", "at"} (None before any call).
        self.rate_limit: Optional[Dict[str, Any]] = None

    # ------------------------------------------------------------------ HTTP

    def _pace(self) -> None:
        """Waits out a spent budget instead of spending a request on a 429."""
        rl = self.rate_limit
        if rl and rl.get("remaining") == 0 and rl.get("reset") is not None:
            left = rl["at"] + rl["reset"] - time.monotonic()
            if left > 0:
                time.sleep(min(left, 60.0))

    def _remember(self, headers: Mapping[str, str]) -> None:
        if headers.get("ratelimit-limit") is None:
            return
        self.rate_limit = {
            "limit": int(headers.get("ratelimit-limit", "0") or 0),
            "remaining": int(headers.get("ratelimit-remaining", "0") or 0),
            "reset": _seconds(headers.get("ratelimit-reset")),
            "policy": headers.get("ratelimit-policy"),
            "at": time.monotonic(),
        }

    def request(
        self,
        method: str,
        path: str,
        body: Any = None,
        *,
        query: Optional[Mapping[str, Any]] = None,
        headers: Optional[Mapping[str, str]] = None,
        timeout: Optional[float] = None,
        raw: bool = False,
    ) -> Any:
        """One API call with retries; returns parsed JSON (or bytes with ``raw=True``)."""
        url = self.base_url + path
        if query:
            url += "?" + urllib.parse.urlencode({k: v for k, v in query.items() if v is not None})
        data = json.dumps(body).encode("utf-8") if body is not None else None
        send = {"Authorization": "Bearer " + str(self.api_key), "Accept": "application/json", "User-Agent": self.user_agent}
        if data is not None:
            send["Content-Type"] = "application/json"
        send.update(headers or {})
        # Only calls that are safe to repeat are retried after a dropped connection.
        repeatable = method in ("GET", "HEAD", "DELETE") or "Idempotency-Key" in send
        attempt = 0
        while True:
            self._pace()
            req = urllib.request.Request(url, data=data, method=method, headers=send)
            try:
                with urllib.request.urlopen(req, timeout=timeout or self.timeout) as res:
                    answer_headers = {k.lower(): v for k, v in res.headers.items()}
                    payload = res.read()
                    self._remember(answer_headers)
                    if raw:
                        return payload
                    return json.loads(payload.decode("utf-8")) if payload else None
            except urllib.error.HTTPError as error:
                answer_headers = {k.lower(): v for k, v in (error.headers or {}).items()}
                payload = error.read()
                self._remember(answer_headers)
                problem = _problem(error.code, payload, answer_headers)
                if error.code in (429, 503) and attempt < self.max_retries:
                    delay = _seconds(answer_headers.get("retry-after"))
                    time.sleep(min(delay if delay is not None else 2.0 ** attempt, 120.0))
                    attempt += 1
                    continue
                raise problem from None
            except (urllib.error.URLError, ConnectionError, TimeoutError) as error:
                if repeatable and attempt < self.max_retries:
                    time.sleep(min(2.0 ** attempt * 0.5, 30.0))
                    attempt += 1
                    continue
                reason = getattr(error, "reason", error)
                raise ServerError(0, "Network error", "could not reach %s: %s" % (self.base_url, reason)) from None

    # ------------------------------------------------------------------ runs

    def submit(
        self,
        circuit: Union[str, Mapping[str, Any]],
        observable: Union[str, Mapping[str, Any]],
        *,
        name: Optional[str] = None,
        idempotency_key: Optional[str] = None,
        **options: Any,
    ) -> Dict[str, Any]:
        """Queues a run and returns it (status ``queued``).

        ``circuit`` is OpenQASM text (2.0 or 3, told apart by its header) or a
        ``{"format", "source"}`` dict; ``observable`` is Pauli-sum text or an observable
        dict. ``options`` are the other request fields as the API names them:
        ``shots``, ``seed``, ``method``, ``parameters``, ``sweep``, ``points``,
        ``gradient``, ``noise``, ``targetPrecision``, ``mitigateReadout``.
        """
        body: Dict[str, Any] = {"circuit": _circuit(circuit), "observable": _observable(observable)}
        body.update({k: v for k, v in options.items() if v is not None})
        if name is not None:
            body["name"] = name
        key = idempotency_key or str(uuid.uuid4())
        return self.request("POST", "/api/v1/runs", body, headers={"Idempotency-Key": key})

    def get(self, run: RunRef, *, wait: Optional[float] = None) -> Dict[str, Any]:
        """The run now, or — with ``wait`` (0–30 s) — as soon as it is terminal, at most ``wait`` seconds later."""
        if wait is None:
            return self.request("GET", "/api/v1/runs/" + _run_id(run))
        wait = max(0.0, min(float(wait), MAX_WAIT_SECONDS))
        return self.request(
            "GET", "/api/v1/runs/" + _run_id(run), query={"wait": "%g" % wait}, timeout=self.timeout + wait
        )

    def wait(self, run: RunRef, *, timeout: Optional[float] = None) -> Dict[str, Any]:
        """Blocks until the run is succeeded, failed or canceled and returns it (server-side waits, no polling).

        Raises ``WaitTimeout`` when ``timeout`` seconds pass first (no limit by default).
        """
        started = time.monotonic()
        current = dict(run) if not isinstance(run, str) else None
        while True:
            if current is not None and current.get("status") in TERMINAL:
                return current
            left = MAX_WAIT_SECONDS if timeout is None else timeout - (time.monotonic() - started)
            if left <= 0:
                raise WaitTimeout(current or {"id": _run_id(run), "status": "unknown"}, timeout or 0)
            current = self.get(run, wait=min(MAX_WAIT_SECONDS, left))

    def result(self, run: RunRef, *, timeout: Optional[float] = None) -> Dict[str, Any]:
        """Waits for the run and returns its ``result``; raises ``RunFailed`` if it failed or was canceled."""
        done = self.wait(run, timeout=timeout)
        if done.get("status") != "succeeded":
            raise RunFailed(done)
        return done["result"]

    def run(
        self, circuit: Union[str, Mapping[str, Any]], observable: Union[str, Mapping[str, Any]], **options: Any
    ) -> Dict[str, Any]:
        """``submit`` then ``result``: one call from request to result."""
        timeout = options.pop("timeout", None)
        return self.result(self.submit(circuit, observable, **options), timeout=timeout)

    def points(
        self,
        circuit: Union[str, Mapping[str, Any]],
        observable: Union[str, Mapping[str, Any]],
        points: Sequence[Mapping[str, float]],
        *,
        gradient: bool = False,
        **options: Any,
    ) -> List[Dict[str, Any]]:
        """Evaluates many input bindings in ONE run; returns ``result.sweep.points`` in request order.

        Each entry has ``params``, ``ideal``, ``exact``, ``sampled`` and, with
        ``gradient=True``, ``gradient`` (``{input: {"exact", "sampled"?}}``).
        """
        body_points = [dict(p) for p in points]
        if gradient:
            options["gradient"] = True
        result = self.run(circuit, observable, points=body_points, **options)
        return list(result["sweep"]["points"])

    def gradient(
        self,
        circuit: Union[str, Mapping[str, Any]],
        observable: Union[str, Mapping[str, Any]],
        parameters: Mapping[str, float],
        **options: Any,
    ) -> ValueAndGradient:
        """The exact value and its gradient with respect to every declared input, at ``parameters``.

        ``value, grad = kw.gradient(...)`` unpacks to the value and ``{input: d/d(input)}``;
        ``.sampled`` holds the shot-based estimates (``{input: {"mean", "stdErr"}}``) when
        ``shots`` were asked for.
        """
        result = self.run(circuit, observable, parameters=dict(parameters), gradient=True, **options)
        grads = result.get("gradient") or {}
        sampled = {k: g["sampled"] for k, g in grads.items() if g.get("sampled")}
        return ValueAndGradient(
            value=float(result["exact"]["value"]),
            gradient={k: float(g["exact"]) for k, g in grads.items()},
            sampled=sampled or None,
            result=result,
        )

    def cancel(self, run: RunRef) -> Dict[str, Any]:
        """Cancels a queued or running run (a finished one raises ``Conflict``)."""
        return self.request("POST", "/api/v1/runs/%s/cancel" % _run_id(run))

    def list_runs(self, *, status: Optional[str] = None, limit: int = 20, cursor: Optional[str] = None) -> Dict[str, Any]:
        """One page of runs, newest first: ``{"data": [...], "nextCursor": ...}``."""
        return self.request("GET", "/api/v1/runs", query={"status": status, "limit": limit, "cursor": cursor})

    def preview(
        self, circuit: Union[str, Mapping[str, Any]], observable: Union[str, Mapping[str, Any]], **options: Any
    ) -> Dict[str, Any]:
        """Parses and plans a run without simulating it (qubits, settings, shot plan, quota verdict)."""
        body: Dict[str, Any] = {"circuit": _circuit(circuit), "observable": _observable(observable)}
        body.update({k: v for k, v in options.items() if v is not None})
        return self.request("POST", "/api/v1/runs/preview", body)

    def download(self, run: RunRef, file: str) -> bytes:
        """An export of a succeeded run: ``terms.csv``, ``counts.csv``, ``points.csv`` or ``circuits.zip``."""
        if file not in EXPORT_FILES:
            raise ValueError("file must be one of %s" % ", ".join(EXPORT_FILES))
        return self.request("GET", "/api/v1/runs/%s/%s" % (_run_id(run), file), raw=True)

    def usage(self) -> Dict[str, Any]:
        """This period's usage against the plan's quotas."""
        return self.request("GET", "/api/v1/usage")


def value_and_gradient_fn(
    client: Client, circuit: Union[str, Mapping[str, Any]], observable: Union[str, Mapping[str, Any]], **options: Any
):
    """``f(params) -> (value, {input: gradient})`` for an optimiser: one API run per call."""

    def f(params: Mapping[str, float]) -> Tuple[float, Dict[str, float]]:
        out = client.gradient(circuit, observable, params, **options)
        return out.value, out.gradient

    return f
