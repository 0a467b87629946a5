/** How a receiver checks a delivery, shown on the webhooks page (Python, standard library). */
export const VERIFY_EXAMPLE = `import hashlib, hmac, time

def verify(secret: str, headers, raw_body: bytes, tolerance=300) -> bool:
    timestamp = headers["Ketwise-Webhook-Timestamp"]
    if abs(time.time() - int(timestamp)) > tolerance:
        return False          # too old: a replay
    mac = hmac.new(secret.encode(), timestamp.encode() + b"." + raw_body, hashlib.sha256)
    expected = "v1=" + mac.hexdigest()
    return hmac.compare_digest(expected, headers["Ketwise-Webhook-Signature"])`;
