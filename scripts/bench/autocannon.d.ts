// The part of autocannon's API that bench:load uses (the package ships no types).
declare module "autocannon" {
  interface Histogram {
    average: number;
    total: number;
    p50: number;
    p99: number;
  }
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    timeout?: number;
    headers?: Record<string, string>;
  }
  interface Result {
    errors: number;
    timeouts: number;
    non2xx: number;
    requests: Histogram;
    latency: Histogram;
  }
  function autocannon(opts: Options): Promise<Result>;
  export default autocannon;
}
