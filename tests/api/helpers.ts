// HTTP helpers for API tests: they drive the built server started by scripts/test.mjs.
export const BASE_URL = process.env.RIMECASE_TEST_BASE_URL ?? 'http://127.0.0.1:3000'
/** A second server on the same database (scripts/test.mjs starts it), for checks across processes. */
export const SECOND_BASE_URL = process.env.RIMECASE_TEST_SECOND_BASE_URL
export const DEMO_PASSWORD = 'rimecase-demo'

export interface ApiResponse<T = unknown> {
  status: number
  body: T
  headers: Headers
}

/** A signed-in (or anonymous) client keeping its session cookie. */
export class ApiClient {
  cookie = ''

  constructor(readonly baseUrl = BASE_URL) {}

  async request<T = any>(method: string, path: string, body?: unknown, init: RequestInit = {}): Promise<ApiResponse<T>> {
    const headers: Record<string, string> = { accept: 'application/json', ...(init.headers as Record<string, string>) }
    if (this.cookie) headers.cookie = this.cookie
    let payload: BodyInit | undefined
    if (body instanceof FormData || typeof body === 'string') payload = body
    else if (body !== undefined) {
      headers['content-type'] = 'application/json'
      payload = JSON.stringify(body)
    }
    const res = await fetch(`${this.baseUrl}${path}`, { ...init, method, headers, body: payload, redirect: 'manual' })
    const setCookie = res.headers.getSetCookie().find((c) => c.startsWith('nuxt-session='))
    if (setCookie) this.cookie = setCookie.split(';')[0]!
    const type = res.headers.get('content-type') ?? ''
    const parsed = res.status === 204 ? null : type.includes('json') ? await res.json() : await res.text()
    return { status: res.status, body: parsed as T, headers: res.headers }
  }

  /** The raw response, for files: the caller reads the bytes and headers it needs. */
  raw(path: string): Promise<Response> {
    return fetch(`${this.baseUrl}${path}`, { headers: this.cookie ? { cookie: this.cookie } : {}, redirect: 'manual' })
  }

  get<T = any>(path: string) {
    return this.request<T>('GET', path)
  }
  post<T = any>(path: string, body?: unknown) {
    return this.request<T>('POST', path, body ?? {})
  }
  patch<T = any>(path: string, body?: unknown) {
    return this.request<T>('PATCH', path, body ?? {})
  }
  put<T = any>(path: string, body?: unknown) {
    return this.request<T>('PUT', path, body ?? {})
  }
}

/** A client signed in as `email` (demo password unless given), on the main server unless another is named. */
export async function signedIn(email: string, password = DEMO_PASSWORD, baseUrl = BASE_URL): Promise<ApiClient> {
  const client = new ApiClient(baseUrl)
  const res = await client.post('/api/auth/login', { email, password })
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`)
  return client
}

export const DEMO = {
  tech: 'tech@rimecase.demo',
  engineer: 'engineer@rimecase.demo',
  trainer: 'trainer@rimecase.demo',
  admin: 'admin@rimecase.demo',
  otherTech: 'tech@bluefen.demo',
}
