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
];

export default config;
