// One autocannon run with a short warm-up, reduced to the figures the bench tables print.
import autocannon from 'autocannon';

export interface LoadFigures {
  requestsPerSecond: number;
  p50: number;
  p99: number;
  errors: number;
  non2xx: number;
}

export async function measure(
  url: string,
  options: { connections: number; seconds: number; headers?: Record<string, string> },
): Promise<LoadFigures> {
  await autocannon({ url, connections: options.connections, duration: 2, headers: options.headers });
  const result = await autocannon({ url, connections: options.connections, duration: options.seconds, headers: options.headers });
  return {
    requestsPerSecond: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    errors: result.errors + result.timeouts,
    non2xx: result.non2xx,
  };
}
