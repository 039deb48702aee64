/** The part of autocannon 9's API the API benchmark uses (the package ships no types). */
declare module 'autocannon' {
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    headers?: Record<string, string>;
  }
  interface Result {
    requests: { average: number; total: number };
    latency: { p99: number };
    errors: number;
    non2xx: number;
  }
  export default function autocannon(options: Options): Promise<Result>;
}
