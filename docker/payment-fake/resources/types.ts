/** What every `/v1` handler receives; handlers return the JSON to send (before `expand`). */
import type { Fake } from "../core/fake";
import type { FormObject } from "../http/form";
import type { Router } from "../http/router";

export interface ApiRequest {
  fake: Fake;
  params: Record<string, string>;
  /** Form body (POST) or query (GET/DELETE), already parsed into nested values. */
  body: FormObject;
  path: string;
}

export type ApiHandler = (req: ApiRequest) => unknown;

export type ApiRouter = Router<ApiHandler>;
