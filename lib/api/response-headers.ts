/**
 * `editHeaders(res, edit)` — the one way to add headers to a Response that may
 * already be built: `edit` changes its headers in place, or, when they are
 * immutable (Response.redirect, an answer from fetch), those of a copy with the
 * same body, status and status text. Used for the request id and the RateLimit-*
 * fields every API answer carries.
 */
export function editHeaders(res: Response, edit: (headers: Headers) => void): Response {
  try {
    edit(res.headers);
    return res;
  } catch {
    const headers = new Headers(res.headers);
    edit(headers);
    return new Response(res.body, { status: res.status, statusText: res.statusText, headers });
  }
}
