/** The part of autocannon 9's programmatic API that scripts/bench-api.ts uses (the package ships no types). */
declare module 'autocannon' {
  interface AutocannonOptions {
    url: string;
    connections?: number;
    duration?: number;
    amount?: number;
    timeout?: number;
    headers?: Record<string, string>;
  }
  interface AutocannonResult {
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
    requests: { average: number; total: number };
  }
  interface AutocannonInstance extends PromiseLike<AutocannonResult> {
    on(event: 'response', listener: (client: unknown, statusCode: number, resBytes: number, responseTimeMs: number) => void): this;
    stop(): void;
  }
  function autocannon(options: AutocannonOptions): AutocannonInstance;
  export default autocannon;
}
