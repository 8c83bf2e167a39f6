/** Small wrappers over Fastify inject for JSON requests. */
import type { FastifyInstance } from 'fastify';

export async function postJson(app: FastifyInstance, url: string, body: unknown) {
  const response = await app.inject({ method: 'POST', url, headers: { 'content-type': 'application/json' }, payload: JSON.stringify(body) });
  return { status: response.statusCode, headers: response.headers, text: response.body, json: () => JSON.parse(response.body) as Record<string, unknown> };
}

/** The `error` object of an error body. */
export interface ErrorBody {
  code: string;
  message: string;
  fix: string;
  issues?: Array<{ path: string; message: string }>;
}
