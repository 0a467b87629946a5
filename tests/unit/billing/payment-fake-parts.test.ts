/**
 * Unit checks of the payment fake's building blocks against outside
 * references: the SDK's own signature helpers, the Luhn algorithm (ISO/IEC
 * 7812-1 Annex B), calendar arithmetic in UTC, and the provider's documented
 * form-encoding of nested parameters.
 */
import { describe, expect, it } from "vitest";
import Stripe from "stripe";
import { checkCardInput, luhnValid } from "@/docker/payment-fake/billing/cards";
import { formatCents, formatUnitDecimal, lineAmount } from "@/docker/payment-fake/billing/money";
import { addMonths } from "@/docker/payment-fake/core/clock";
import { ApiError } from "@/docker/payment-fake/core/errors";
import { FormError, parseForm } from "@/docker/payment-fake/http/form";
import { int, parseParams } from "@/docker/payment-fake/http/params";
import { buildPdf } from "@/docker/payment-fake/pages/pdf";
import { signPayload } from "@/docker/payment-fake/webhooks/signing";
import { z } from "zod";

const sdk = new Stripe("sk_test_unit_only");

describe("form parser", () => {
  it("builds nested objects and arrays from bracketed keys", () => {
    // Encoding as in the provider's docs: line_items[0][price]=…&line_items[0][quantity]=…
    const body = parseForm(
      "mode=subscription&line_items[0][price]=price_a&line_items[0][quantity]=3&line_items[1][price]=price_b" +
        "&metadata[org]=42&expand[0]=customer&expand[1]=line_items&success_url=http%3A%2F%2Fx.test%2F%3Fs%3D%7BID%7D",
    );
    expect(body).toEqual({
      mode: "subscription",
      line_items: [{ price: "price_a", quantity: "3" }, { price: "price_b" }],
      metadata: { org: "42" },
      expand: ["customer", "line_items"],
      success_url: "http://x.test/?s={ID}",
    });
  });

  it("accepts percent-encoded brackets, `[]` appends and '+' as space", () => {
    expect(parseForm("a%5Bb%5D=1&c[]=x&c[]=y&d=hello+world")).toEqual({
      a: { b: "1" },
      c: ["x", "y"],
      d: "hello world",
    });
  });

  it("keeps array order by index, not by arrival", () => {
    expect(parseForm("x[1]=b&x[0]=a&x[10]=c")).toEqual({ x: ["a", "b", "c"] });
  });

  it("rejects malformed names, value/hash clashes and prototype keys", () => {
    expect(() => parseForm("a[b=1")).toThrow(FormError);
    expect(() => parseForm("a=1&a[b]=2")).toThrow(/both as a value and a hash/);
    expect(() => parseForm("__proto__[x]=1")).toThrow(FormError);
    expect(() => parseForm("a=%E0%A4%A")).toThrow(/percent-encoding/);
    expect(({} as Record<string, unknown>).x).toBeUndefined();
  });

  it("round-trips what URLSearchParams encodes", () => {
    const params = new URLSearchParams({
      "payload[stripe_customer_id]": "cus_1",
      "payload[value]": "12 345&=",
    });
    expect(parseForm(params.toString())).toEqual({
      payload: { stripe_customer_id: "cus_1", value: "12 345&=" },
    });
  });
});

describe("parameter errors", () => {
  const schema = z.strictObject({ items: z.array(z.strictObject({ quantity: int(0) })) });
  const errorOf = (input: unknown) => {
    try {
      parseParams(schema, input);
    } catch (e) {
      return e as ApiError;
    }
    throw new Error("expected an error");
  };

  it("names the parameter in bracket form", () => {
    const e = errorOf({ items: [{ quantity: "x" }] });
    expect(e.status).toBe(400);
    expect(e.extra.param).toBe("items[0][quantity]");
    expect(e.message).toBe("Invalid integer: x");
  });

  it("reports unknown and missing parameters with the provider's codes", () => {
    expect(errorOf({ items: [{ quantity: "1", colour: "red" }] }).toBody().error).toMatchObject({
      code: "parameter_unknown",
      param: "items[0][colour]",
    });
    expect(errorOf({}).toBody().error).toMatchObject({
      code: "parameter_missing",
      message: "Missing required param: items.",
    });
  });
});

describe("webhook signature", () => {
  it("is exactly the header the SDK's own test helper produces", () => {
    const payload = JSON.stringify({ id: "evt_1", object: "event", type: "invoice.paid" }, null, 2);
    const secret = "whsec_unit_secret";
    const timestamp = 1_700_000_000;
    expect(signPayload(payload, secret, timestamp)).toBe(
      sdk.webhooks.generateTestHeaderString({ payload, secret, timestamp }),
    );
  });

  it("verifies with constructEvent and fails for another secret", () => {
    const payload = JSON.stringify({
      id: "evt_2",
      object: "event",
      type: "customer.created",
      data: { object: {} },
    });
    const header = signPayload(payload, "whsec_a", Math.floor(Date.now() / 1000));
    expect(sdk.webhooks.constructEvent(payload, header, "whsec_a").id).toBe("evt_2");
    expect(() => sdk.webhooks.constructEvent(payload, header, "whsec_b")).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
  });
});

describe("money", () => {
  it("multiplies exactly and rounds half up to whole cents", () => {
    expect(lineAmount(3, "0.2")).toBe(1); // 0.6 → 1
    expect(lineAmount(123, "0.2")).toBe(25); // 24.6 → 25
    expect(lineAmount(5, "0.1")).toBe(1); // 0.5 → 1 (half up)
    expect(lineAmount(4, "0.1")).toBe(0); // 0.4 → 0
    expect(lineAmount(1_000_000_000, "0.000000000001")).toBe(0); // 0.001 → 0, no float drift
    expect(lineAmount(53, "5")).toBe(265);
    expect(() => lineAmount(1.5, "1")).toThrow(RangeError);
  });

  it("formats cents and fractional unit prices in dollars", () => {
    expect(formatCents(2900)).toBe("$29.00");
    expect(formatCents(-450)).toBe("-$4.50");
    expect(formatUnitDecimal("0.2")).toBe("$0.002");
    expect(formatUnitDecimal("5")).toBe("$0.05");
  });
});

describe("calendar months", () => {
  const at = (iso: string) => Date.parse(iso) / 1000;
  it("adds months in UTC, clamping to the end of shorter months", () => {
    expect(addMonths(at("2026-01-31T10:00:00Z"), 1)).toBe(at("2026-02-28T10:00:00Z"));
    expect(addMonths(at("2028-01-31T10:00:00Z"), 1)).toBe(at("2028-02-29T10:00:00Z")); // 2028 is a leap year
    expect(addMonths(at("2026-01-31T10:00:00Z"), 2)).toBe(at("2026-03-31T10:00:00Z")); // from the anchor, no drift
    expect(addMonths(at("2026-12-15T23:59:59Z"), 1)).toBe(at("2027-01-15T23:59:59Z"));
  });
});

describe("test cards", () => {
  it("applies the Luhn check", () => {
    // Luhn (ISO/IEC 7812-1): 4242 4242 4242 4242 and 3782 822463 10005 are valid; changing a digit breaks it.
    expect(luhnValid("4242424242424242")).toBe(true);
    expect(luhnValid("378282246310005")).toBe(true);
    expect(luhnValid("4242424242424241")).toBe(false);
  });

  it("accepts only documented test numbers with a future expiry and a CVC of the right length", () => {
    const now = Date.parse("2026-06-15T00:00:00Z") / 1000;
    expect(
      checkCardInput({ number: "4242 4242 4242 4242", expiry: "06 / 26", cvc: "123" }, now).ok,
    ).toBe(true);
    const past = checkCardInput({ number: "4242424242424242", expiry: "05/26", cvc: "123" }, now);
    expect(past.ok || past.field).toBe("expiry");
    const amex = checkCardInput({ number: "378282246310005", expiry: "12/30", cvc: "123" }, now);
    expect(amex.ok || amex.field).toBe("cvc");
    const real = checkCardInput(
      { number: "4111 1111 1111 1111", expiry: "12/30", cvc: "123" },
      now,
    );
    expect(real.ok || real.decline.message).toMatch(/test payment page/);
    const declined = checkCardInput(
      { number: "4000000000000002", expiry: "12/30", cvc: "123" },
      now,
    );
    expect(declined.ok && declined.value.card.attach?.decline_code).toBe("generic_decline");
  });
});

describe("hand-written PDF", () => {
  it("has a header, objects at the offsets the xref table lists, and a trailer", () => {
    const pdf = buildPdf("Test (1)", [
      { x: 50, y: 800, text: "Amount × 2 (net) \\ total", bold: true },
    ]).toString("latin1");
    expect(pdf.startsWith("%PDF-1.4\n")).toBe(true);
    const xrefAt = Number(/startxref\n(\d+)\n%%EOF\n$/.exec(pdf)![1]);
    expect(pdf.slice(xrefAt, xrefAt + 5)).toBe("xref\n");
    const offsets = [...pdf.slice(xrefAt).matchAll(/^(\d{10}) 00000 n \n/gm)].map((m) =>
      Number(m[1]),
    );
    expect(offsets).toHaveLength(7);
    offsets.forEach((o, i) => expect(pdf.startsWith(`${i + 1} 0 obj\n`, o)).toBe(true));
    // Parentheses and backslashes are escaped inside PDF strings (ISO 32000-1 §7.3.4.2).
    expect(pdf).toContain("(Amount \xd7 2 \\(net\\) \\\\ total) Tj");
    const length = Number(/<< \/Length (\d+) >>\nstream\n/.exec(pdf)![1]);
    const streamStart = pdf.indexOf("stream\n") + "stream\n".length;
    expect(pdf.slice(streamStart + length, streamStart + length + 10)).toBe("\nendstream");
  });
});
