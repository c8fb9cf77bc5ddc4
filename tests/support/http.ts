// Fetch helpers for tests against a running test server.
export function client(port: number) {
  const base = `http://127.0.0.1:${port}`;
  return {
    base,
    get: (path: string, init?: RequestInit) => fetch(`${base}${path}`, { redirect: 'manual', ...init }),
    async json(path: string): Promise<{ status: number; body: any; headers: Headers }> {
      const res = await fetch(`${base}${path}`);
      return { status: res.status, body: await res.json(), headers: res.headers };
    },
  };
}
