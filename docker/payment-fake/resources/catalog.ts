/**
 * Products and prices. Prices are per-unit, in one currency, either one-off
 * or recurring monthly; recurring prices are `licensed` (quantity, e.g.
 * seats) or `metered` (usage from a billing meter, `recurring[meter]`
 * required). Fractions of a cent go in `unit_amount_decimal`;
 * `transform_quantity` bills per package (e.g. per 1,000 units).
 * `lookup_key` is unique among prices; `transfer_lookup_key=true` moves it.
 */
import { z } from "zod";
import { invalidRequest, noSuch } from "../core/errors";
import type { Fake } from "../core/fake";
import { newId } from "../core/ids";
import type { PriceRec, ProductRec } from "../core/state";
import { newestFirst, paginate } from "../http/list";
import {
  bool,
  decimal,
  emptyable,
  expand,
  int,
  listShape,
  mergeMetadata,
  metadata,
  oneOf,
  parseParams,
  str,
} from "../http/params";
import { renderPrice, renderProduct } from "./render-catalog";
import type { ApiRouter } from "./types";

const productFields = {
  name: str(),
  description: emptyable().optional(),
  metadata: metadata().optional(),
  active: bool().optional(),
  unit_label: emptyable().optional(),
  expand: expand(),
};
const productCreate = z.strictObject({
  ...productFields,
  id: z
    .string()
    .regex(/^[A-Za-z0-9_-]{1,200}$/)
    .optional(),
});
const productUpdate = z.strictObject({
  ...productFields,
  name: str().optional(),
  default_price: emptyable().optional(),
});

const recurring = z.strictObject({
  interval: oneOf(["day", "week", "month", "year"] as const),
  interval_count: int(1, 12).optional(),
  usage_type: oneOf(["licensed", "metered"] as const).optional(),
  meter: z.string().optional(),
});

const priceCreate = z.strictObject({
  currency: z
    .string()
    .regex(/^[a-z]{3}$/i, "must be a three-letter ISO currency code")
    .transform((c) => c.toLowerCase()),
  product: z.string().optional(),
  product_data: z
    .strictObject({
      name: str(),
      metadata: metadata().optional(),
      unit_label: z.string().optional(),
    })
    .optional(),
  unit_amount: int(0, 99_999_999).optional(),
  unit_amount_decimal: decimal().optional(),
  billing_scheme: z.literal("per_unit").optional(),
  recurring: recurring.optional(),
  transform_quantity: z
    .strictObject({ divide_by: int(1, 1_000_000_000), round: oneOf(["up", "down"] as const) })
    .optional(),
  lookup_key: z.string().max(200).optional(),
  transfer_lookup_key: bool().optional(),
  nickname: z.string().optional(),
  metadata: metadata().optional(),
  active: bool().optional(),
  tax_behavior: z.literal("unspecified").optional(),
  expand: expand(),
});

const priceUpdate = z.strictObject({
  active: bool().optional(),
  metadata: metadata().optional(),
  nickname: emptyable().optional(),
  lookup_key: emptyable().optional(),
  transfer_lookup_key: bool().optional(),
  expand: expand(),
});

const priceList = z.strictObject({
  ...listShape,
  product: z.string().optional(),
  active: bool().optional(),
  currency: z.string().optional(),
  type: oneOf(["one_time", "recurring"] as const).optional(),
  lookup_keys: z.array(z.string()).max(10).optional(),
  recurring: z
    .strictObject({
      usage_type: oneOf(["licensed", "metered"] as const).optional(),
      interval: z.string().optional(),
    })
    .optional(),
});

function claimLookupKey(fake: Fake, key: string | null, transfer: boolean, priceId: string): void {
  if (key === null) return;
  const holder = Object.values(fake.state.prices).find(
    (p) => p.lookup_key === key && p.id !== priceId,
  );
  if (!holder) return;
  if (!transfer) {
    throw invalidRequest(
      `A price (\`${holder.id}\`) already uses the lookup key \`${key}\`. Pass transfer_lookup_key=true to move it.`,
      "lookup_key",
    );
  }
  holder.lookup_key = null;
}

export function registerCatalog(router: ApiRouter): void {
  router.add("POST", "/v1/products", ({ fake, body }) => {
    const p = parseParams(productCreate, body);
    const id = p.id ?? newId("prod");
    if (fake.state.products[id])
      throw invalidRequest(`Product already exists: ${id}`, "id", "resource_already_exists");
    const now = fake.now();
    const product: ProductRec = {
      id,
      created: now,
      updated: now,
      name: p.name,
      description: p.description ?? null,
      active: p.active ?? true,
      metadata: mergeMetadata({}, p.metadata),
      default_price: null,
      unit_label: p.unit_label ?? null,
    };
    fake.state.products[id] = product;
    fake.emit("product.created", renderProduct(product));
    return renderProduct(product);
  });

  router.add("GET", "/v1/products/:id", ({ fake, params, body }) => {
    parseParams(z.strictObject({ expand: expand() }), body);
    const product = fake.state.products[params.id];
    if (!product) throw noSuch("product", params.id);
    return renderProduct(product);
  });

  router.add("POST", "/v1/products/:id", ({ fake, params, body }) => {
    const p = parseParams(productUpdate, body);
    const product = fake.state.products[params.id];
    if (!product) throw noSuch("product", params.id);
    if (p.default_price) {
      const price = fake.state.prices[p.default_price];
      if (!price || price.product !== product.id)
        throw noSuch("price", p.default_price, "default_price");
    }
    const before = renderProduct(product);
    if (p.name !== undefined) product.name = p.name;
    if (p.description !== undefined) product.description = p.description;
    if (p.active !== undefined) product.active = p.active;
    if (p.unit_label !== undefined) product.unit_label = p.unit_label;
    if (p.default_price !== undefined) product.default_price = p.default_price;
    product.metadata = mergeMetadata(product.metadata, p.metadata);
    product.updated = fake.now();
    fake.emit("product.updated", renderProduct(product), before);
    return renderProduct(product);
  });

  router.add("GET", "/v1/products", ({ fake, body }) => {
    const p = parseParams(
      z.strictObject({
        ...listShape,
        active: bool().optional(),
        ids: z.array(z.string()).optional(),
      }),
      body,
    );
    const rows = newestFirst(fake.state.products).filter(
      (x) => (p.active === undefined || x.active === p.active) && (!p.ids || p.ids.includes(x.id)),
    );
    return paginate(rows, p, "/v1/products", renderProduct);
  });

  router.add("POST", "/v1/prices", ({ fake, body }) => {
    const p = parseParams(priceCreate, body);
    if (!p.product === !p.product_data)
      throw invalidRequest(
        "Give exactly one of product or product_data.",
        p.product ? "product_data" : "product",
      );
    if (p.product && !fake.state.products[p.product]) throw noSuch("product", p.product, "product");
    if ((p.unit_amount === undefined) === (p.unit_amount_decimal === undefined)) {
      throw invalidRequest(
        "Give exactly one of unit_amount or unit_amount_decimal.",
        "unit_amount",
      );
    }
    const r = p.recurring;
    if (r && (r.interval !== "month" || (r.interval_count ?? 1) !== 1)) {
      throw invalidRequest(
        "This local fake bills monthly only: use recurring[interval]=month with interval_count 1.",
        "recurring[interval]",
      );
    }
    const usage = r?.usage_type ?? "licensed";
    if (r && usage === "metered") {
      if (!r.meter)
        throw invalidRequest(
          "Metered prices need a billing meter: set recurring[meter].",
          "recurring[meter]",
        );
      if (!fake.state.meters[r.meter]) throw noSuch("billing meter", r.meter, "recurring[meter]");
    } else if (r?.meter) {
      throw invalidRequest(
        "recurring[meter] is only allowed when recurring[usage_type] is metered.",
        "recurring[meter]",
      );
    }
    if (p.transform_quantity && usage !== "metered") {
      throw invalidRequest(
        "This local fake supports transform_quantity on metered prices only.",
        "transform_quantity",
      );
    }
    const id = newId("price");
    claimLookupKey(fake, p.lookup_key ?? null, p.transfer_lookup_key ?? false, id);
    let productId = p.product;
    if (!productId) {
      const now = fake.now();
      productId = newId("prod");
      fake.state.products[productId] = {
        id: productId,
        created: now,
        updated: now,
        name: p.product_data!.name,
        description: null,
        active: true,
        metadata: mergeMetadata({}, p.product_data!.metadata),
        default_price: null,
        unit_label: p.product_data!.unit_label ?? null,
      };
    }
    const decimalAmount = (p.unit_amount_decimal ?? String(p.unit_amount))
      .replace(/(\.\d*?)0+$/, "$1")
      .replace(/\.$/, "");
    const price: PriceRec = {
      id,
      created: fake.now(),
      product: productId,
      active: p.active ?? true,
      currency: p.currency,
      unit_amount: /^\d+$/.test(decimalAmount) ? Number(decimalAmount) : null,
      unit_amount_decimal: decimalAmount,
      recurring: r
        ? { interval: "month", interval_count: 1, usage_type: usage, meter: r.meter ?? null }
        : null,
      lookup_key: p.lookup_key ?? null,
      nickname: p.nickname ?? null,
      metadata: mergeMetadata({}, p.metadata),
      transform_quantity: p.transform_quantity ?? null,
    };
    fake.state.prices[id] = price;
    fake.emit("price.created", renderPrice(price));
    return renderPrice(price);
  });

  router.add("GET", "/v1/prices/:id", ({ fake, params, body }) => {
    parseParams(z.strictObject({ expand: expand() }), body);
    const price = fake.state.prices[params.id];
    if (!price) throw noSuch("price", params.id);
    return renderPrice(price);
  });

  router.add("POST", "/v1/prices/:id", ({ fake, params, body }) => {
    const p = parseParams(priceUpdate, body);
    const price = fake.state.prices[params.id];
    if (!price) throw noSuch("price", params.id);
    if (p.lookup_key !== undefined)
      claimLookupKey(fake, p.lookup_key, p.transfer_lookup_key ?? false, price.id);
    const before = renderPrice(price);
    if (p.active !== undefined) price.active = p.active;
    if (p.nickname !== undefined) price.nickname = p.nickname;
    if (p.lookup_key !== undefined) price.lookup_key = p.lookup_key;
    price.metadata = mergeMetadata(price.metadata, p.metadata);
    fake.emit("price.updated", renderPrice(price), before);
    return renderPrice(price);
  });

  router.add("GET", "/v1/prices", ({ fake, body }) => {
    const p = parseParams(priceList, body);
    const rows = newestFirst(fake.state.prices).filter(
      (x) =>
        (p.product === undefined || x.product === p.product) &&
        (p.active === undefined || x.active === p.active) &&
        (p.currency === undefined || x.currency === p.currency.toLowerCase()) &&
        (p.type === undefined || (p.type === "recurring") === (x.recurring !== null)) &&
        (!p.lookup_keys || (x.lookup_key !== null && p.lookup_keys.includes(x.lookup_key))) &&
        (p.recurring?.usage_type === undefined ||
          x.recurring?.usage_type === p.recurring.usage_type),
    );
    return paginate(rows, p, "/v1/prices", renderPrice);
  });
}
