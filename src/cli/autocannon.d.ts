// The few autocannon types bench-load.ts uses (the package ships no types of its own).
declare module 'autocannon' {
  namespace autocannon {
    type Options = {
      url: string;
      method?: string;
      headers?: Record<string, string>;
      body?: string;
      /** Requests sent in turn; setupRequest may change each one (a new body per request). */
      requests?: { method?: string; setupRequest?: (request: Request) => Request }[];
      connections?: number;
      duration?: number;
    };
    type Request = { method?: string; path?: string; headers?: Record<string, string>; body?: string };
    type Result = {
      requests: { average: number };
      latency: { p50: number; p97_5: number };
      non2xx: number;
      errors: number;
    };
  }
  function autocannon(options: autocannon.Options): Promise<autocannon.Result>;
  export default autocannon;
}
