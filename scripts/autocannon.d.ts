/** The part of autocannon's API the API benchmark uses (the package ships no types). */
declare module 'autocannon' {
  namespace autocannon {
    interface Options {
      url: string;
      connections?: number;
      duration?: number;
      path?: string;
      method?: string;
      headers?: Record<string, string>;
      body?: string;
      requests?: unknown[];
    }
    interface Histogram {
      average: number;
      p50: number;
      p99: number;
    }
    interface Result {
      requests: Histogram;
      latency: Histogram;
      errors: number;
      timeouts: number;
    }
    interface Instance extends PromiseLike<Result> {
      on(event: 'response', listener: (client: unknown, status: number, bytes: number, time: number) => void): void;
    }
  }
  function autocannon(options: autocannon.Options): autocannon.Instance;
  export default autocannon;
}
