"""Drives the shipped Python client (public/clients/ketwise.py, as served by the app)
against a live Ketwise server and checks its answers against the engine's own numbers.

Usage: python3 client_check.py CASES.json
Env:   KETWISE_URL, KETWISE_API_KEY; PYTHONPATH holds the downloaded ketwise.py.

CASES.json: {"cases": [{"label", "kind": "single"|"sweep"|"points", "request": {...},
"expected": <the engine's result for the request>}]}. Exact values must agree to
1e-9 (the same engine on both sides); sampled figures exactly (same seed, same
stream). Prints one "ok <label>" line per check and a final "N passed, M failed".
"""

import json
import math
import sys

import ketwise

failures = []
passed = 0


def check(label, condition, detail=""):
    global passed
    if condition:
        passed += 1
        print("ok " + label)
    else:
        failures.append(label)
        print("FAIL %s %s" % (label, detail))


def close(a, b, tol=1e-9):
    return a is not None and b is not None and math.isclose(a, b, rel_tol=tol, abs_tol=tol)


def split(request):
    request = dict(request)
    return request.pop("circuit"), request.pop("observable"), request


def main(path):
    with open(path, encoding="utf-8") as f:
        cases = json.load(f)["cases"]
    kw = ketwise.Client()

    for case in cases:
        label, kind, expected = case["label"], case["kind"], case["expected"]
        circuit, observable, options = split(case["request"])
        if kind == "single":
            run = kw.submit(circuit, observable, name=label, **options)
            check(label + ": submitted queued or running", run["status"] in ("queued", "running", "succeeded"), run["status"])
            result = kw.result(run)
            check(label + ": exact", close(result["exact"]["value"], expected["exact"]["value"]), result["exact"])
            check(label + ": ideal", close(result["ideal"]["value"], expected["ideal"]["value"]), result["ideal"])
            if expected.get("sampled"):
                check(
                    label + ": sampled mean and stdErr (same seed)",
                    close(result["sampled"]["mean"], expected["sampled"]["mean"], 1e-12)
                    and close(result["sampled"]["stdErr"], expected["sampled"]["stdErr"], 1e-12),
                    result["sampled"],
                )
            terms = kw.download(run, "terms.csv").decode("utf-8").strip().split("\r\n")
            check(label + ": terms.csv has one row per term", len(terms) == 1 + len(expected["terms"]), len(terms))
        elif kind == "sweep":
            result = kw.run(circuit, observable, name=label, **options)
            got = result["sweep"]["points"]
            want = expected["sweep"]["points"]
            check(label + ": point count", len(got) == len(want), "%d != %d" % (len(got), len(want)))
            check(
                label + ": every exact value",
                all(close(g["exact"], w["exact"]) for g, w in zip(got, want)),
                [g["exact"] for g in got],
            )
        elif kind == "points":
            points = options.pop("points")
            gradient = bool(options.pop("gradient", False))
            got = kw.points(circuit, observable, points, gradient=gradient, name=label, **options)
            want = expected["sweep"]["points"]
            check(label + ": one answer per point, in request order", [g["params"] for g in got] == [w["params"] for w in want])
            check(label + ": exact values", all(close(g["exact"], w["exact"]) for g, w in zip(got, want)))
            if gradient:
                ok = all(
                    close(g["gradient"][name]["exact"], w["gradient"][name]["exact"])
                    for g, w in zip(got, want)
                    for name in w["gradient"]
                )
                check(label + ": exact gradients at every point", ok)
                fd = case.get("fd")
                if fd:
                    central = (got[fd["plus"]]["exact"] - got[fd["minus"]]["exact"]) / (2 * fd["h"])
                    analytic = got[fd["at"]]["gradient"][fd["input"]]["exact"]
                    check(label + ": gradient agrees with the central difference", close(central, analytic, 1e-6), (central, analytic))
                if any(w["gradient"][n].get("sampled") for w in want for n in w["gradient"]):
                    ok = all(
                        close(g["gradient"][n]["sampled"]["mean"], w["gradient"][n]["sampled"]["mean"], 1e-12)
                        for g, w in zip(got, want)
                        for n in w["gradient"]
                    )
                    check(label + ": sampled gradients (same seed)", ok)
        elif kind == "gradient":
            parameters = options.pop("parameters")
            options.pop("gradient", None)
            value, grad = kw.gradient(circuit, observable, parameters, name=label, **options)
            check(label + ": value", close(value, expected["exact"]["value"]), value)
            check(
                label + ": gradient of every input",
                set(grad) == set(expected["gradient"]) and all(close(grad[n], expected["gradient"][n]["exact"]) for n in grad),
                grad,
            )
        else:
            check(label + ": known case kind", False, kind)

    # Idempotency: the same key returns the same run, and the client's own key makes retries safe.
    circuit, observable, options = split(cases[0]["request"])
    first = kw.submit(circuit, observable, idempotency_key="py-client-check-1", **options)
    again = kw.submit(circuit, observable, idempotency_key="py-client-check-1", **options)
    check("idempotency key returns the original run", first["id"] == again["id"])
    kw.wait(first)

    # Typed errors carry the problem fields.
    try:
        kw.submit("OPENQASM 2.0;\ninclude \"qelib1.inc\";\nqreg q[1];\nfoo q[0];\n", "Z0")
        check("bad QASM raises BadRequest", False, "no error")
    except ketwise.BadRequest as error:
        first_error = error.errors[0] if error.errors else None
        check(
            "bad QASM raises BadRequest with type, detail and the line",
            error.status == 400
            and error.type.startswith("/problems/")
            and bool(error.detail)
            and first_error is not None
            and first_error.path == "circuit.source"
            and first_error.line == 4,
            repr(error),
        )
    try:
        kw.submit(circuit, observable, shots=-1)
        check("bad field raises ValidationFailed", False, "no error")
    except ketwise.ValidationFailed as error:
        check("bad field raises ValidationFailed naming the field", error.status == 422 and any(e.path == "shots" for e in error.errors), repr(error))
    try:
        kw.get("00000000-0000-4000-8000-000000000000")
        check("unknown run raises NotFound", False, "no error")
    except ketwise.NotFound as error:
        check("unknown run raises NotFound", error.status == 404 and error.type == "/problems/not-found")

    # The RateLimit-* fields are read from every answer.
    rl = kw.rate_limit or {}
    check("RateLimit fields are kept", rl.get("limit", 0) > 0 and 0 <= rl.get("remaining", -1) < rl["limit"] and rl.get("policy"), rl)

    print("%d passed, %d failed" % (passed, len(failures)))
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1]))
