import next from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...next,
  ...nextTs,
  {
    ignores: [
      ".next/**",
      ".next-*/**",
      ".data/**",
      "drizzle/**",
      "node_modules/**",
      "next-env.d.ts",
      "lib/quantum/wasm/assembly/**",
    ],
  },
  {
    // All user-visible formatting goes through lib/format (one locale, UTC, U+2212, plurals).
    files: ["app/**/*.{ts,tsx}", "components/**/*.{ts,tsx}", "lib/**/*.{ts,tsx}", "worker/**/*.ts"],
    ignores: ["lib/format/**"],
    rules: {
      "no-restricted-syntax": [
        "error",
        {
          selector: "NewExpression[callee.object.name='Intl']",
          message: "Format through lib/format (formatCount, formatMoney, formatDate, …).",
        },
        {
          selector:
            "CallExpression[callee.property.name=/^toLocale(String|DateString|TimeString)$/]",
          message: "Format through lib/format (formatCount, formatDate, formatDateTime, …).",
        },
      ],
    },
  },
];

export default config;
