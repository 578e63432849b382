// Load from outside with autocannon: a fixed number of connections for a few seconds, each connection
// with its own session (a scanner or a counter clerk) and its own rows. Only 2xx answers count.
import autocannon from 'autocannon'
import { randomUUID } from 'node:crypto'

export interface LoadSpec {
  connections: number
  seconds: number
  /** Cookie per connection (Lumenyard); none for the floor. */
  cookies?: string[]
  /** The request connection `conn` sends as its n-th. */
  request(conn: number, n: number): { method: 'GET' | 'POST'; path: string; body?: unknown }
}

export interface LoadResult {
  rps: number
  p50: number
  p99: number
  ok: number
  failed: number
}

export async function runLoad(url: string, spec: LoadSpec): Promise<LoadResult> {
  let nextConn = 0
  const result = await autocannon({
    url,
    connections: spec.connections,
    duration: spec.seconds,
    requests: [
      {
        setupRequest: (req, context: { conn?: number; n?: number }) => {
          context.conn ??= nextConn++ % spec.connections
          context.n = (context.n ?? 0) + 1
          const r = spec.request(context.conn, context.n)
          const headers: Record<string, string> = { 'x-lumenyard-request': '1', 'accept-encoding': 'gzip, br' }
          if (spec.cookies) headers.cookie = spec.cookies[context.conn % spec.cookies.length]
          if (r.method === 'POST') {
            headers['content-type'] = 'application/json'
            headers['idempotency-key'] = randomUUID()
          }
          return { ...req, method: r.method, path: r.path, headers, body: r.body === undefined ? undefined : JSON.stringify(r.body) }
        },
      },
    ],
  })
  const ok = result['2xx']
  return {
    rps: ok / result.duration,
    p50: result.latency.p50,
    p99: result.latency.p99,
    ok,
    failed: result.non2xx + result.errors + result.timeouts,
  }
}

/** Signs people in through the API and returns their session cookies. */
export async function signIn(url: string, usernames: string[], password: string): Promise<string[]> {
  const cookies: string[] = []
  for (const username of usernames) {
    const res = await fetch(`${url}/api/session`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-lumenyard-request': '1' },
      body: JSON.stringify({ username, password }),
    })
    if (res.status !== 200) throw new Error(`bench sign-in of ${username} failed: ${res.status} ${await res.text()}`)
    cookies.push(res.headers.getSetCookie().find((c) => c.startsWith('lumenyard.sid='))!.split(';')[0])
  }
  return cookies
}
