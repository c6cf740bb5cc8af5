// The contract check: every answer an API test provokes is validated against the
// OpenAPI document the app serves (JSON Schema 2020-12, the dialect of OpenAPI 3.1,
// checked with ajv from npm), so the document and the behaviour cannot drift apart.
// A mismatch is recorded and fails the test file when its app closes.
import { Ajv2020, type ValidateFunction } from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';
import type { Express, Request } from 'express';

type OpenApiDoc = {
  components: Record<string, unknown>;
  paths: Record<string, Record<string, { responses: Record<string, { content?: Record<string, { schema?: object }> }> }>>;
};

export interface ContractCheck {
  /** One line per answer whose status or body the document does not allow. */
  violations: string[];
  /** How many answers were checked against a schema (a check that checks nothing would be worthless). */
  checked: number;
}

const openApiPath = (path: string) => path.replace(/:(\w+)/g, '{$1}');

/** Wraps the app's res.send (every res.json and problem goes through it) with the check. */
export function installContractCheck(app: Express, doc: OpenApiDoc): ContractCheck {
  const ajv = new Ajv2020({ strict: false, allErrors: true });
  addFormats(ajv);
  const compiled = new Map<string, ValidateFunction>();
  const validator = (key: string, schema: object) => {
    let v = compiled.get(key);
    if (!v) {
      // Local $refs (#/components/...) resolve against the document's components.
      v = ajv.compile({ ...schema, components: doc.components });
      compiled.set(key, v);
    }
    return v;
  };
  const state: ContractCheck = { violations: [], checked: 0 };

  const check = (req: Request, status: number, contentType: string, body: unknown) => {
    const route = (req.route as { path?: string } | undefined)?.path;
    const where = `${req.method} ${route ?? req.originalUrl.split('?')[0]} → ${status}`;
    const isProblem = contentType.startsWith('application/problem+json');
    if (status >= 400 && !isProblem) {
      state.violations.push(`${where}: an error answered as ${contentType || 'no content type'}, not application/problem+json`);
      return;
    }
    let schemaKey: string;
    let schema: object | undefined;
    if (isProblem) {
      schemaKey = 'Problem';
      schema = { $ref: '#/components/schemas/Problem' };
    } else {
      if (!route || !contentType.startsWith('application/json')) return;
      const op = doc.paths[openApiPath(route)]?.[req.method.toLowerCase()];
      if (!op) return;
      const documented = op.responses[String(status)];
      if (!documented) {
        state.violations.push(`${where}: status not in the document (it lists ${Object.keys(op.responses).join(', ')})`);
        return;
      }
      schema = documented.content?.['application/json']?.schema;
      if (!schema) return; // not JSON by its document (tests/api/openapi.test.ts requires every JSON answer to have a schema)
      schemaKey = `${req.method} ${route} ${status}`;
    }
    let parsed = body;
    if (typeof body === 'string' || Buffer.isBuffer(body)) {
      try {
        parsed = JSON.parse(body.toString());
      } catch {
        state.violations.push(`${where}: body is not JSON`);
        return;
      }
    }
    const validate = validator(schemaKey, schema);
    state.checked += 1;
    if (!validate(parsed)) state.violations.push(`${where}: ${ajv.errorsText(validate.errors, { dataVar: 'body' })}`);
  };

  const response = app.response as unknown as { send: (body?: unknown) => unknown; req: Request; statusCode: number; get: (h: string) => string | undefined };
  const send = response.send;
  response.send = function (this: typeof response, body?: unknown) {
    // res.json calls send again with the serialised string: check that second call only.
    if (this.req?.originalUrl?.startsWith('/api/') && (typeof body === 'string' || Buffer.isBuffer(body))) {
      check(this.req, this.statusCode, this.get('Content-Type') ?? '', body);
    }
    return send.call(this, body);
  };
  return state;
}
