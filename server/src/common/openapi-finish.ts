/**
 * The last pass over the generated OpenAPI document. nestjs-zod emits JSON Schema 2020-12 shapes
 * (type lists, numeric exclusive bounds) with a 3.0 `nullable` here and there; the document
 * therefore declares OpenAPI 3.1.0 and `nullable` is rewritten to its 3.1 form. Every operation
 * gets a summary and the error answers the global filter can give, all of them the ErrorBody shape
 * `{ code, message, details? }`, and a known security scheme.
 */
type Json = Record<string, unknown>;
type Doc = { openapi: string; servers?: unknown[]; paths?: Record<string, Record<string, Json>>; components?: Json & { schemas?: Json; securitySchemes?: Json } };

const ERROR_SCHEMA = {
  type: 'object',
  required: ['code', 'message'],
  properties: {
    code: { type: 'string', description: 'A stable code, e.g. VALIDATION_FAILED or NOT_FOUND' },
    message: { type: 'string' },
    details: { type: 'array', items: { type: 'object' } },
  },
};

const ERROR_ANSWERS: Record<string, string> = {
  '400': 'The request is not valid (details name each field)',
  '401': 'Not signed in, or the session ended',
  '403': 'The role does not allow this',
  '404': 'No such record in the organisation',
  '409': 'Changed or used since (conflict)',
  '413': 'Too large',
  '429': 'Too many attempts; wait and retry',
};
const METHODS = new Set(['get', 'put', 'post', 'delete', 'patch', 'options', 'head']);

/** `nullable: true` (3.0) to a 3.1 null type, anywhere in the document. */
function rewriteNullable(node: unknown): unknown {
  if (Array.isArray(node)) return node.map(rewriteNullable);
  if (!node || typeof node !== 'object') return node;
  const out: Json = {};
  for (const [key, value] of Object.entries(node)) out[key] = rewriteNullable(value);
  // 3.0's boolean exclusive bounds to 3.1's numeric ones.
  for (const [flag, bound] of [['exclusiveMinimum', 'minimum'], ['exclusiveMaximum', 'maximum']] as const) {
    if (typeof out[flag] !== 'boolean') continue;
    if (out[flag] === true && typeof out[bound] === 'number') {
      out[flag] = out[bound];
      delete out[bound];
    } else delete out[flag];
  }
  if (!('nullable' in out)) return out;
  const nullable = out.nullable === true;
  delete out.nullable;
  if (!nullable) return out;
  if (typeof out.type === 'string') return { ...out, type: [out.type, 'null'] };
  if (Array.isArray(out.type)) return out.type.includes('null') ? out : { ...out, type: [...out.type, 'null'] };
  return { anyOf: [out, { type: 'null' }] };
}

/** "ScaffoldsController_changeStatus" → "Scaffolds: change status". */
function summaryOf(operationId: unknown, method: string, path: string): string {
  const match = typeof operationId === 'string' ? /^(.*?)Controller_(.*)$/.exec(operationId) : null;
  if (!match) return `${method.toUpperCase()} ${path}`;
  const words = (s: string) => s.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();
  const area = words(match[1]);
  return `${area.charAt(0).toUpperCase()}${area.slice(1)}: ${words(match[2])}`;
}

export function finishOpenApiDoc<T extends object>(input: T): T {
  const doc = rewriteNullable(input) as Doc;
  doc.openapi = '3.1.0';
  if (!doc.servers?.length) doc.servers = [{ url: '/', description: 'The server that answers this document' }];
  doc.components ??= {};
  doc.components.schemas = { ...(doc.components.schemas ?? {}), ErrorBody: ERROR_SCHEMA };
  doc.components.securitySchemes = { bearer: { type: 'http', scheme: 'bearer', bearerFormat: 'JWT' }, ...(doc.components.securitySchemes ?? {}) };
  const known = new Set(Object.keys(doc.components.securitySchemes));
  for (const [path, item] of Object.entries(doc.paths ?? {})) {
    for (const [method, op] of Object.entries(item)) {
      if (!METHODS.has(method)) continue;
      op.summary ??= summaryOf(op.operationId, method, path);
      // Routes without a declared scheme are the public ones (sign-in, links, health): say so.
      op.security ??= [];
      if (Array.isArray(op.security)) {
        op.security = (op.security as Json[]).map((req) => Object.fromEntries(Object.entries(req).map(([name, scopes]) => [known.has(name) ? name : 'bearer', scopes])));
      }
      const responses = (op.responses ??= {}) as Json;
      for (const [status, description] of Object.entries(ERROR_ANSWERS)) {
        responses[status] ??= { description, content: { 'application/json': { schema: { $ref: '#/components/schemas/ErrorBody' } } } };
      }
    }
  }
  return doc as T;
}
