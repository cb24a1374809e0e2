// A stand-in for the network: answers fetch calls from a table of routes and records each request.
import { vi } from 'vitest';

export interface RecordedRequest {
  method: string;
  url: string;
  body: unknown;
  authorization: string | null;
}

type Handler = (req: RecordedRequest) => { status: number; body?: unknown };

export function mockFetch(routes: Record<string, Handler>): RecordedRequest[] {
  const requests: RecordedRequest[] = [];
  const fetchMock = vi.fn(async (input: string | URL | Request, init?: RequestInit) => {
    const url = String(input);
    const method = init?.method ?? 'GET';
    const headers = new Headers(init?.headers);
    const req: RecordedRequest = {
      method,
      url,
      body: typeof init?.body === 'string' ? JSON.parse(init.body) : undefined,
      authorization: headers.get('Authorization'),
    };
    requests.push(req);
    const handler = routes[`${method} ${url}`];
    const res = handler
      ? handler(req)
      : { status: 404, body: { error: { code: 'not_found', message: `No route ${method} ${url}` } } };
    return new Response(res.body === undefined ? null : JSON.stringify(res.body), {
      status: res.status,
      headers: { 'Content-Type': 'application/json' },
    });
  });
  vi.stubGlobal('fetch', fetchMock);
  return requests;
}
