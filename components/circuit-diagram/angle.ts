/**
 * Angle labels for gate parameters: exact small multiples of π print as fractions
 * (π/4, −3π/2, 2π); anything else as a decimal with up to three places.
 * The minus sign is U+2212.
 */
import { formatFixed, MINUS } from "@/lib/format";
const DENOMINATORS = [1, 2, 3, 4, 6, 8, 12, 16];

export function formatAngle(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  if (Math.abs(x) < 1e-12) return "0";
  const sign = x < 0 ? MINUS : "";
  const r = Math.abs(x) / Math.PI;
  for (const d of DENOMINATORS) {
    const n = Math.round(r * d);
    if (n > 0 && n <= 8 * d && Math.abs(r * d - n) < 1e-9) {
      const g = gcd(n, d);
      const num = n / g;
      const den = d / g;
      const top = num === 1 ? "π" : `${num}π`;
      return `${sign}${den === 1 ? top : `${top}/${den}`}`;
    }
  }
  // a value that rounds to zero prints without a sign ("0", never "−0")
  return formatFixed(x, 3).replace(/\.?0+$/, "");
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}
