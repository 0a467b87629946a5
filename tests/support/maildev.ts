/**
 * Reads mail caught by the local maildev sink through its REST API
 * (GET /api/email lists every message with to/subject/text/html).
 */
type MailAddress = { address: string; name?: string };
export type CaughtMail = {
  id: string;
  subject: string;
  text?: string;
  html?: string;
  to: MailAddress[];
  time: string;
};

const base = () => `http://127.0.0.1:${process.env.MAIL_WEB_PORT ?? 1080}`;

export async function listMail(): Promise<CaughtMail[]> {
  const res = await fetch(`${base()}/api/email`);
  if (!res.ok)
    throw new Error(`maildev answered ${res.status}; is it running (scripts/services.sh start)?`);
  return (await res.json()) as CaughtMail[];
}

/**
 * Waits for the newest message to `address`, received at or after `since`.
 * maildev stamps messages with whole seconds, so `since` is rounded down to
 * its second first (else a mail in the same second as `since` is missed).
 * `subject` narrows the wait to one kind of message, so another mail sent in
 * the same second (e.g. an invoice notice beside a payment failure) is skipped.
 */
export async function waitForMail(
  address: string,
  since: Date,
  timeoutMs = 20_000,
  subject?: RegExp,
): Promise<CaughtMail> {
  const deadline = Date.now() + timeoutMs;
  const wanted = address.toLowerCase();
  const sinceMs = Math.floor(since.getTime() / 1000) * 1000;
  while (Date.now() < deadline) {
    const found = (await listMail())
      .filter(
        (m) =>
          m.to.some((t) => t.address.toLowerCase() === wanted) &&
          Date.parse(m.time) >= sinceMs &&
          (!subject || subject.test(m.subject)),
      )
      .sort((a, b) => Date.parse(b.time) - Date.parse(a.time))[0];
    if (found) return found;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(
    `no e-mail to ${address}${subject ? ` matching ${subject}` : ""} arrived within ${timeoutMs} ms`,
  );
}

/** The first link in the message's text that starts with `prefix`. */
export function linkIn(mail: CaughtMail, prefix: string): string {
  const escaped = prefix.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
  const match = new RegExp(`${escaped}\\S+`).exec(mail.text ?? "");
  if (!match) throw new Error(`no ${prefix}… link in the e-mail "${mail.subject}"`);
  return match[0];
}
