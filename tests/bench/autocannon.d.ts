// The part of autocannon's result the bench scripts read (autocannon ships no types).
declare module 'autocannon' {
  type Result = {
    requests: { average: number };
    latency: { p50: number; p99: number; average: number };
    non2xx: number;
    errors: number;
    timeouts: number;
  };
  export default function autocannon(opts: {
    url: string;
    connections: number;
    duration: number;
    headers?: Record<string, string>;
  }): Promise<Result>;
}
