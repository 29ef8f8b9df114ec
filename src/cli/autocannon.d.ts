// The few autocannon types bench-load.ts uses (the package ships no types of its own).
declare module 'autocannon' {
  namespace autocannon {
    type Options = {
      url: string;
      method?: string;
      headers?: Record<string, string>;
      body?: string;
      /** Replace `[<id>]` in the body with a fresh id on every request. */
      idReplacement?: boolean;
      connections?: number;
      duration?: number;
    };
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
