import { CliError } from './args'

/** A minimal client of the Tauline API: keeps the session cookie and sends the CSRF token on writes. */
export class TaulineServer {
  private cookie = ''
  private csrf = ''

  constructor(private readonly baseUrl: string) {}

  private async call<T>(method: string, path: string, body?: unknown): Promise<T> {
    const headers: Record<string, string> = { Accept: 'application/json' }
    if (this.cookie) headers.Cookie = this.cookie
    if (body !== undefined) headers['Content-Type'] = 'application/json'
    if (method !== 'GET' && this.csrf) headers['x-csrf-token'] = this.csrf
    let res: Response
    try {
      res = await fetch(new URL(`/api${path}`, this.baseUrl), { method, headers, body: body === undefined ? undefined : JSON.stringify(body) })
    } catch (err) {
      throw new CliError(`cannot reach ${this.baseUrl}: ${(err as Error).message}`)
    }
    const setCookie = res.headers.get('set-cookie')
    if (setCookie) this.cookie = setCookie.split(';')[0]
    const text = await res.text()
    const data = text ? JSON.parse(text) : undefined
    if (!res.ok) throw new CliError(`${method} ${path}: ${data?.error?.message ?? res.statusText} (${res.status})`)
    return data as T
  }

  async signIn(email: string, password: string): Promise<void> {
    this.csrf = (await this.call<{ csrfToken: string }>('GET', '/auth/csrf')).csrfToken
    const res = await this.call<{ csrfToken: string }>('POST', '/auth/sign-in', { email, password })
    this.csrf = res.csrfToken
  }

  get<T>(path: string) {
    return this.call<T>('GET', path)
  }

  post<T>(path: string, body: unknown) {
    return this.call<T>('POST', path, body)
  }
}
