/** The slice of autocannon's untyped API the benchmark uses. */
declare module "autocannon" {
  type Options = {
    url: string;
    connections: number;
    duration: number;
    method?: string;
    headers?: Record<string, string>;
    body?: string;
    /** Requests per second over all connections (open loop). */
    overallRate?: number;
  };
  type Result = {
    requests: { total: number; average: number };
    non2xx: number;
    errors: number;
    timeouts: number;
    statusCodeStats?: Record<string, { count: number }>;
  };
  type Instance = Promise<Result> & {
    on(
      event: "response",
      listener: (
        client: unknown,
        statusCode: number,
        resBytes: number,
        responseTime: number,
      ) => void,
    ): void;
  };
  function autocannon(options: Options): Instance;
  export default autocannon;
}
