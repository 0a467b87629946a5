/**
 * Test cards. Only the provider's published test numbers work (as in its
 * test mode): 4242 4242 4242 4242 and a few other brands succeed;
 * 4000 0000 0000 0002 is always declined ("generic_decline"); other
 * documented numbers decline with a specific reason; 4000 0000 0000 0341 can
 * be saved but every charge on it fails. Anything else is refused, with
 * "incorrect number" for a failed Luhn check.
 */
import type { Decline } from "../core/errors";

export interface TestCard {
  brand: string;
  funding: "credit" | "debit" | "prepaid";
  /** Outcome when the card is entered/saved. */
  attach: Decline | null;
  /** Outcome when it is charged later. */
  charge: Decline | null;
}

const GENERIC: Decline = {
  code: "card_declined",
  decline_code: "generic_decline",
  message: "Your card was declined.",
};

const ok = (brand: string, funding: TestCard["funding"] = "credit"): TestCard => ({
  brand,
  funding,
  attach: null,
  charge: null,
});
const declines = (decline: Decline): TestCard => ({
  brand: "visa",
  funding: "credit",
  attach: decline,
  charge: decline,
});

export const TEST_CARDS: Record<string, TestCard> = {
  "4242424242424242": ok("visa"),
  "4000056655665556": ok("visa", "debit"),
  "5555555555554444": ok("mastercard"),
  "5200828282828210": ok("mastercard", "debit"),
  "378282246310005": ok("amex"),
  "6011111111111117": ok("discover"),
  "4000000000000002": declines(GENERIC),
  "4000000000009995": declines({
    code: "card_declined",
    decline_code: "insufficient_funds",
    message: "Your card has insufficient funds.",
  }),
  "4000000000009987": declines({
    code: "card_declined",
    decline_code: "lost_card",
    message: "Your card was declined.",
  }),
  "4000000000000069": declines({
    code: "expired_card",
    decline_code: "expired_card",
    message: "Your card has expired.",
  }),
  "4000000000000127": declines({
    code: "incorrect_cvc",
    decline_code: "incorrect_cvc",
    message: "Your card's security code is incorrect.",
  }),
  "4000000000000119": declines({
    code: "processing_error",
    decline_code: "processing_error",
    message: "An error occurred while processing your card. Try again in a little bit.",
  }),
  "4000000000000341": { brand: "visa", funding: "credit", attach: null, charge: GENERIC },
};

/** API-side shortcuts for the same cards (`payment_method=pm_card_visa`). */
export const TEST_PAYMENT_METHOD_TOKENS: Record<string, string> = {
  pm_card_visa: "4242424242424242",
  pm_card_visa_debit: "4000056655665556",
  pm_card_mastercard: "5555555555554444",
  pm_card_amex: "378282246310005",
  pm_card_chargeDeclined: "4000000000000002",
  pm_card_chargeDeclinedInsufficientFunds: "4000000000009995",
  pm_card_chargeCustomerFail: "4000000000000341",
};

export function luhnValid(digits: string): boolean {
  let sum = 0;
  for (let i = 0; i < digits.length; i++) {
    let d = Number(digits[digits.length - 1 - i]);
    if (i % 2 === 1) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return digits.length >= 12 && sum % 10 === 0;
}

export interface CardInput {
  number: string;
  expiry: string;
  cvc: string;
}

export interface ValidCard {
  number: string;
  card: TestCard;
  exp_month: number;
  exp_year: number;
}

export type CardCheck =
  | { ok: true; value: ValidCard }
  | { ok: false; decline: Decline; field: "number" | "expiry" | "cvc" };

/**
 * Validates what a person typed into a card form. `nowUnix` is the
 * customer's fake "now", so a card can expire as fake time moves on.
 */
export function checkCardInput(input: CardInput, nowUnix: number): CardCheck {
  const number = input.number.replace(/[\s-]/g, "");
  if (!/^\d{12,19}$/.test(number) || !luhnValid(number)) {
    return {
      ok: false,
      field: "number",
      decline: { code: "incorrect_number", message: "Your card number is incorrect." },
    };
  }
  const card = TEST_CARDS[number];
  if (!card) {
    return {
      ok: false,
      field: "number",
      decline: {
        code: "card_declined",
        decline_code: "test_mode_live_card",
        message:
          "Your card was declined. This is a test payment page: use one of the documented test card numbers.",
      },
    };
  }
  const m = /^\s*(\d{1,2})\s*\/\s*(\d{2}|\d{4})\s*$/.exec(input.expiry);
  if (!m) {
    return {
      ok: false,
      field: "expiry",
      decline: {
        code: "invalid_expiry_month",
        message: "Your card's expiration date is incomplete (use MM / YY).",
      },
    };
  }
  const month = Number(m[1]);
  const year = m[2].length === 2 ? 2000 + Number(m[2]) : Number(m[2]);
  if (month < 1 || month > 12) {
    return {
      ok: false,
      field: "expiry",
      decline: {
        code: "invalid_expiry_month",
        message: "Your card's expiration month is invalid.",
      },
    };
  }
  const now = new Date(nowUnix * 1000);
  if (
    year < now.getUTCFullYear() ||
    (year === now.getUTCFullYear() && month < now.getUTCMonth() + 1)
  ) {
    return {
      ok: false,
      field: "expiry",
      decline: {
        code: "invalid_expiry_year",
        message: "Your card's expiration date is in the past.",
      },
    };
  }
  const cvcLength = card.brand === "amex" ? 4 : 3;
  if (!new RegExp(`^\\d{${cvcLength}}$`).test(input.cvc.trim())) {
    return {
      ok: false,
      field: "cvc",
      decline: { code: "invalid_cvc", message: "Your card's security code is invalid." },
    };
  }
  return { ok: true, value: { number, card, exp_month: month, exp_year: year } };
}
