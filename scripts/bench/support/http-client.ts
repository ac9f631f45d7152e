import http from 'node:http';
import { gunzipSync } from 'node:zlib';

// The benchmarks' HTTP client: node:http on kept-alive connections, reading the whole
// body (gunzipped when the server compressed it) and parsing its JSON, which is what a
// screen waits for. Node's fetch costs the client about 0.6 ms more CPU per request on
// this machine (0.9-1.3 ms against 0.3-0.5 ms for a 4.5 KB POST, client and a bare
// server together), and the client shares the two cores with the server it measures.

const agent = new http.Agent({ keepAlive: true, maxSockets: 64 });

export interface JsonAnswer {
  status: number;
  body: unknown;
}

export function requestJson(
  url: string,
  options: { method?: string; headers?: Record<string, string>; body?: string } = {},
): Promise<JsonAnswer> {
  return new Promise((resolve, reject) => {
    const headers = { ...options.headers };
    if (options.body !== undefined) headers['Content-Length'] = String(Buffer.byteLength(options.body));
    const request = http.request(url, { method: options.method ?? 'GET', headers, agent }, (response) => {
      const chunks: Buffer[] = [];
      response.on('data', (chunk: Buffer) => chunks.push(chunk));
      response.on('error', reject);
      response.on('end', () => {
        try {
          const raw = Buffer.concat(chunks);
          const text = (response.headers['content-encoding'] === 'gzip' ? gunzipSync(raw) : raw).toString('utf8');
          resolve({ status: response.statusCode ?? 0, body: text ? (JSON.parse(text) as unknown) : null });
        } catch (error) {
          reject(error instanceof Error ? error : new Error(String(error)));
        }
      });
    });
    request.on('error', reject);
    request.end(options.body);
  });
}
