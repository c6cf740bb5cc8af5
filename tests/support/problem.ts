import type request from 'supertest';
import { expect } from 'vitest';

// RFC 7807 (Problem Details for HTTP APIs): media type application/problem+json,
// members type, title, status, detail.
export function expectProblem(res: request.Response, status: number) {
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  expect(res.body).toMatchObject({ status, title: expect.any(String), detail: expect.any(String), type: expect.any(String) });
}

/** The `errors[].path` of a 400 problem, e.g. ['body.email']. */
export function fieldPaths(res: request.Response): string[] {
  return (res.body.errors ?? []).map((e: { path: string }) => e.path);
}
