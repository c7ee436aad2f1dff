// Request generators for the fuzz suite, driven by the API's own OpenAPI document: every write
// route gets bodies shaped like its schema but with malformed values (wrong types, edge numbers,
// NUL and lone surrogates, oversized strings and arrays, unknown keys), malformed ids and raw
// bodies that are not JSON; every upload route gets broken multipart forms. Generation is
// deterministic for a seed (fast-check's `fc.sample`), so a failing request can be replayed.
import fc from 'fast-check';

type JsonSchema = {
  $ref?: string;
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema;
  enum?: unknown[];
  const?: unknown;
  oneOf?: JsonSchema[];
  anyOf?: JsonSchema[];
  allOf?: JsonSchema[];
  minimum?: number;
  maximum?: number;
  maxLength?: number;
  maxItems?: number;
  additionalProperties?: boolean | JsonSchema;
  format?: string;
};

interface OpenApiDoc {
  paths: Record<string, Record<string, { requestBody?: { content: Record<string, { schema: JsonSchema }> }; parameters?: { in: string; name: string; schema?: JsonSchema }[] }>>;
  components?: { schemas?: Record<string, JsonSchema> };
}

export interface FuzzRoute {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** OpenAPI path, e.g. `/api/ingredients/{id}`. */
  path: string;
  body?: JsonSchema;
  multipart?: { fields: string[] };
  query: { name: string; schema: JsonSchema }[];
  hasIdParam: boolean;
}

export interface FuzzRequest {
  method: FuzzRoute['method'];
  /** The concrete URL path, ids and query filled in. */
  url: string;
  /** Which route template it came from. */
  route: string;
  contentType?: string;
  /** The raw body as sent. */
  body?: string | Buffer;
  /** Send without a session (the 401 path). */
  anonymous: boolean;
}

const WRITE_METHODS = new Set(['post', 'put', 'patch', 'delete']);

/** The routes of the document, with `$ref`s resolved; GET routes only when they take a query. */
export function routesFromOpenApi(doc: OpenApiDoc): FuzzRoute[] {
  const resolve = (s: JsonSchema | undefined, depth = 0): JsonSchema | undefined => {
    if (!s || depth > 12) return s;
    if (s.$ref) return resolve(doc.components?.schemas?.[s.$ref.split('/').pop()!], depth + 1);
    const out: JsonSchema = { ...s };
    if (s.properties) out.properties = Object.fromEntries(Object.entries(s.properties).map(([k, v]) => [k, resolve(v, depth + 1)!]));
    if (s.items) out.items = resolve(s.items, depth + 1);
    for (const key of ['oneOf', 'anyOf', 'allOf'] as const) if (s[key]) out[key] = s[key].map((x) => resolve(x, depth + 1)!);
    return out;
  };
  const routes: FuzzRoute[] = [];
  for (const [path, ops] of Object.entries(doc.paths)) {
    for (const [method, op] of Object.entries(ops)) {
      const content = op.requestBody?.content ?? {};
      const query = (op.parameters ?? []).filter((p) => p.in === 'query').map((p) => ({ name: p.name, schema: resolve(p.schema) ?? {} }));
      const multipartSchema = resolve(content['multipart/form-data']?.schema);
      const route: FuzzRoute = {
        method: method as FuzzRoute['method'],
        path,
        body: resolve(content['application/json']?.schema),
        multipart: multipartSchema ? { fields: Object.keys(multipartSchema.properties ?? { file: {} }) } : undefined,
        query,
        hasIdParam: /\{\w+\}/.test(path),
      };
      if (WRITE_METHODS.has(method) || (method === 'get' && query.length > 0)) routes.push(route);
    }
  }
  return routes;
}

// ---------------------------------------------------------------------------------------------
// Values

const NASTY_STRINGS = [
  '',
  ' ',
  'a\u0000b',
  '\u0000',
  'cold \uD83D pack',
  '\uDE00',
  '\uD800\uD800',
  'x'.repeat(5000),
  'é'.repeat(300),
  '\uD83D\uDE00'.repeat(40),
  '\u202Eabc',
  "'; DROP TABLE users; --",
  '%00',
  '../../etc/passwd',
  'NaN',
  '1e309',
  '-0',
  '12.5',
  'null',
  '{"a":1}',
  '\r\n\t',
  '<script>alert(1)</script>',
];

const NASTY_NUMBERS = [0, -0, -1, 1, 0.5, 1.5, -1e-9, 1e-320, 1e308, -1e308, 2147483647, 2147483648, -2147483649, 2 ** 53 + 2, 1e21, 99999999999];

const wrongType: fc.Arbitrary<unknown> = fc.oneof(
  fc.constant(null),
  fc.boolean(),
  fc.constantFrom(...NASTY_NUMBERS),
  fc.constantFrom(...NASTY_STRINGS),
  fc.constant([]),
  fc.constant({}),
  fc.jsonValue({ maxDepth: 2 }),
);

const nastyString: fc.Arbitrary<string> = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(...NASTY_STRINGS) },
  { weight: 1, arbitrary: fc.string({ unit: 'binary', maxLength: 40 }) },
  { weight: 1, arbitrary: fc.string({ maxLength: 20 }).map((s) => `${s}\u0000${s}`) },
  { weight: 1, arbitrary: fc.string({ maxLength: 20 }).map((s) => `${s}\uD83D`) },
);

function typesOf(s: JsonSchema): string[] {
  if (Array.isArray(s.type)) return s.type;
  if (s.type) return [s.type];
  if (s.properties) return ['object'];
  if (s.items) return ['array'];
  return [];
}

/** Values shaped like the schema, mostly wrong in some detail. */
export function valueFor(schema: JsonSchema | undefined, depth = 0): fc.Arbitrary<unknown> {
  if (!schema || depth > 6) return wrongType;
  const members = schema.oneOf ?? schema.anyOf;
  if (members?.length) return fc.oneof(...members.map((m) => valueFor(m, depth + 1)), wrongType);
  if (schema.allOf?.length) {
    const merged: JsonSchema = { type: 'object', properties: Object.assign({}, ...schema.allOf.map((m) => m.properties ?? {})) };
    return valueFor(merged, depth + 1);
  }
  const shaped: fc.Arbitrary<unknown>[] = [];
  if (schema.enum?.length) shaped.push(fc.constantFrom(...schema.enum));
  if (schema.const !== undefined) shaped.push(fc.constant(schema.const));
  for (const type of typesOf(schema)) {
    switch (type) {
      case 'string':
        shaped.push(nastyString);
        break;
      case 'number':
      case 'integer': {
        const bounds = [schema.minimum, schema.maximum].filter((b): b is number => typeof b === 'number').flatMap((b) => [b, b - 1, b + 1, b + 0.5]);
        shaped.push(fc.oneof(fc.constantFrom(...NASTY_NUMBERS, ...bounds), fc.double({ noNaN: true, noDefaultInfinity: true })));
        break;
      }
      case 'boolean':
        shaped.push(fc.boolean());
        break;
      case 'null':
        shaped.push(fc.constant(null));
        break;
      case 'array': {
        const item = valueFor(schema.items, depth + 1);
        shaped.push(fc.array(item, { maxLength: 4 }));
        if (schema.maxItems !== undefined && schema.maxItems < 600) shaped.push(item.map((v) => Array.from({ length: schema.maxItems! + 1 }, () => v)));
        break;
      }
      case 'object': {
        const props = Object.entries(schema.properties ?? {});
        const record = fc.record(Object.fromEntries(props.map(([k, v]) => [k, valueFor(v, depth + 1)])), { requiredKeys: [] });
        shaped.push(record);
        // Unknown keys beside the known ones, some of them not plain text.
        shaped.push(fc.tuple(record, fc.dictionary(nastyString, wrongType, { maxKeys: 2 })).map(([a, b]) => ({ ...b, ...(a as object) })));
        break;
      }
    }
  }
  if (shaped.length === 0) return wrongType;
  return fc.oneof({ weight: 5, arbitrary: fc.oneof(...shaped) }, { weight: 1, arbitrary: wrongType });
}

/** Raw bodies that are not the JSON object a route expects. */
const rawBody: fc.Arbitrary<{ contentType: string; body: string }> = fc.oneof(
  fc.constantFrom(
    { contentType: 'application/json', body: '{' },
    { contentType: 'application/json', body: '{"name": "unterminated' },
    { contentType: 'application/json', body: 'null' },
    { contentType: 'application/json', body: '[]' },
    { contentType: 'application/json', body: '"text"' },
    { contentType: 'application/json', body: '12' },
    { contentType: 'application/json', body: '{"__proto__": {"admin": true}}' },
    { contentType: 'application/json', body: '{"constructor": {"prototype": {"x": 1}}}' },
    { contentType: 'application/json', body: '{"a\\u0000": "\\ud800"}' },
    { contentType: 'application/json', body: `${'['.repeat(3000)}${']'.repeat(3000)}` },
    { contentType: 'application/json', body: `{"notes": "${'x'.repeat(600_000)}"}` },
    { contentType: 'text/plain', body: 'name=x' },
    { contentType: 'application/x-www-form-urlencoded', body: 'name=x&name=y&version[]=1' },
    { contentType: 'application/json; charset=utf-16', body: '{}' },
    { contentType: 'application/json; charset=latin1', body: '{"name":"\u00e9"}' },
    { contentType: 'multipart/form-data; boundary=XX', body: '--XX\r\n\r\n' },
  ),
  fc.jsonValue({ maxDepth: 3 }).map((v) => ({ contentType: 'application/json', body: JSON.stringify(v) ?? 'null' })),
);

// ---------------------------------------------------------------------------------------------
// Ids and query strings

/** Path ids a client might send by mistake or on purpose. */
const MALFORMED_IDS = ['abc', '-1', '0', '1.5', '1e3', '1e400', '99999999999', '2147483648', '2147480000', '%00', '%ED%A0%80', '%F0%9F%98%80', "1'%20OR%20'1'='1", '%20', '0x10', '007', '9'.repeat(400), 'null', 'undefined', '[1]'];

function idArb(realIds: number[]): fc.Arbitrary<string> {
  const pool = realIds.length ? [fc.constantFrom(...realIds.map(String))] : [];
  return fc.oneof(fc.constantFrom(...MALFORMED_IDS), fc.integer({ min: 1, max: 2_147_483_647 }).map(String), ...pool);
}

/**
 * Percent-encodes like encodeURIComponent, but a lone surrogate (which encodeURIComponent
 * refuses) becomes its three CESU-8 bytes, which are not valid UTF-8: what a broken client sends.
 */
function encode(v: unknown): string {
  const text = typeof v === 'string' ? v : (JSON.stringify(v) ?? '');
  return text.replace(/[\uD800-\uDFFF]|[^\uD800-\uDFFF]+/gu, (chunk) => {
    if (chunk.length === 1 && /[\uD800-\uDFFF]/.test(chunk)) {
      const c = chunk.charCodeAt(0);
      return [0xe0 | (c >> 12), 0x80 | ((c >> 6) & 0x3f), 0x80 | (c & 0x3f)].map((b) => `%${b.toString(16).toUpperCase()}`).join('');
    }
    return encodeURIComponent(chunk);
  });
}

function queryArb(route: FuzzRoute): fc.Arbitrary<string> {
  if (route.query.length === 0) return fc.constant('');
  const params = route.query.map(({ name, schema }) =>
    fc.option(
      fc.oneof(
        valueFor(schema).map((v) => `${encodeURIComponent(name)}=${encode(v)}`),
        fc.constantFrom(...MALFORMED_IDS, '', '%00', '%ED%A0%80').map((v) => `${encodeURIComponent(name)}=${v}`),
        fc.constant(`${encodeURIComponent(name)}=1&${encodeURIComponent(name)}=2`),
        fc.constant(`${encodeURIComponent(name)}[a]=1`),
      ),
      { nil: undefined },
    ),
  );
  return fc.tuple(...params).map((parts) => {
    const present = parts.filter((p): p is string => p !== undefined);
    return present.length ? `?${present.join('&')}` : '';
  });
}

// ---------------------------------------------------------------------------------------------
// Multipart

const CRLF = '\r\n';

/** Multipart bodies that are broken in one way or another (and a few well-formed ones). */
function brokenMultipart(fields: string[]): fc.Arbitrary<{ contentType: string; body: Buffer }> {
  const boundary = 'fuzzBoundary7MA4YWxk';
  const partHeader = (name: string, filename?: string, type = 'text/csv') =>
    `Content-Disposition: form-data; name="${name}"${filename !== undefined ? `; filename="${filename}"` : ''}${CRLF}Content-Type: ${type}`;
  const csv = 't_min,temp_C\n0,25\n1,20\n2,15\n';
  const good = (content: string, filename = 'log.csv', type = 'text/csv') =>
    `--${boundary}${CRLF}${partHeader('file', filename, type)}${CRLF}${CRLF}${content}${CRLF}` +
    (fields.includes('meta') ? `--${boundary}${CRLF}Content-Disposition: form-data; name="meta"${CRLF}${CRLF}{"name":"x"}${CRLF}` : '') +
    `--${boundary}--${CRLF}`;
  const ct = `multipart/form-data; boundary=${boundary}`;
  const variants: fc.Arbitrary<{ contentType: string; body: string | Buffer }>[] = [
    // Cut short at a random point.
    fc.nat({ max: 400 }).map((n) => ({ contentType: ct, body: good(csv).slice(0, Math.min(n, good(csv).length - 4)) })),
    // Malformed part headers.
    fc.constantFrom(
      `--${boundary}${CRLF}Content-Disposition form-data${CRLF}${CRLF}abc${CRLF}--${boundary}--${CRLF}`,
      `--${boundary}${CRLF}${'X'.repeat(20_000)}: y${CRLF}${CRLF}abc${CRLF}--${boundary}--${CRLF}`,
      `--${boundary}${CRLF}Content-Disposition: form-data; name=${CRLF}${CRLF}abc${CRLF}--${boundary}--${CRLF}`,
      `--${boundary}${CRLF}: nothing${CRLF}${CRLF}abc${CRLF}--${boundary}--${CRLF}`,
      `--${boundary}${CRLF}Content-Disposition: form-data; name="file"; filename*=UTF-8''a%00b.csv${CRLF}Content-Type: text/csv${CRLF}${CRLF}${csv}${CRLF}--${boundary}--${CRLF}`,
      `--${boundary}${CRLF}Content-Disposition: form-data; name="file"; filename*=UTF-8''%ED%A0%80.csv${CRLF}Content-Type: text/csv${CRLF}${CRLF}${csv}${CRLF}--${boundary}--${CRLF}`,
    ).map((body) => ({ contentType: ct, body })),
    // No boundary, another multipart type, a wrong boundary, an empty body.
    fc.constantFrom(
      { contentType: 'multipart/form-data', body: good(csv) },
      { contentType: 'multipart/form-data; boundary=', body: good(csv) },
      { contentType: `multipart/mixed; boundary=${boundary}`, body: good(csv) },
      { contentType: `multipart/related; boundary=${boundary}`, body: good(csv) },
      { contentType: 'multipart/form-data; boundary=other', body: good(csv) },
      { contentType: ct, body: '' },
      { contentType: ct, body: `--${boundary}--${CRLF}` },
      { contentType: ct, body: 'no boundary here at all' },
    ),
    // Random bytes in the file, the field name or the file name.
    fc.tuple(fc.uint8Array({ maxLength: 300 }), fc.constantFrom('file', 'files', '', 'file[]', 'meta'), nastyString).map(([bytes, name, filename]) => ({
      contentType: ct,
      body: Buffer.concat([
        Buffer.from(`--${boundary}${CRLF}Content-Disposition: form-data; name="${name}"; filename="${filename.replace(/["\r\n]/g, '')}"${CRLF}Content-Type: text/csv${CRLF}${CRLF}`),
        Buffer.from(bytes),
        Buffer.from(`${CRLF}--${boundary}--${CRLF}`),
      ]),
    })),
    // Two files, a PDF where a CSV is expected, a CSV where a PDF is expected.
    fc.constantFrom(
      good(`${csv}${CRLF}--${boundary}${CRLF}${partHeader('file', 'second.csv')}${CRLF}${CRLF}${csv}`),
      good('%PDF-1.4\n%%EOF\n', 'sheet.pdf', 'application/pdf'),
      good(csv),
      good('\u0000\u0001\u0002binary', 'log.csv'),
    ).map((body) => ({ contentType: ct, body })),
    // Random meta JSON beside a good file.
    fc.jsonValue({ maxDepth: 3 }).map((meta) => ({
      contentType: ct,
      body: `--${boundary}${CRLF}Content-Disposition: form-data; name="meta"${CRLF}${CRLF}${JSON.stringify(meta)}${CRLF}--${boundary}${CRLF}${partHeader('file', 'log.csv')}${CRLF}${CRLF}${csv}${CRLF}--${boundary}--${CRLF}`,
    })),
  ];
  return fc.oneof(...variants).map(({ contentType, body }) => ({ contentType, body: typeof body === 'string' ? Buffer.from(body) : body }));
}

// ---------------------------------------------------------------------------------------------
// Requests

export interface FuzzPlanOptions {
  seed: number;
  /** About how many requests in all. */
  total: number;
  /** Real ids per route prefix (e.g. `/api/ingredients/` → the fuzz workspace's ingredient ids). */
  realIds: (route: FuzzRoute) => number[];
}

/** A deterministic list of requests over every route, upload routes weighted up. */
export function planRequests(routes: FuzzRoute[], options: FuzzPlanOptions): FuzzRequest[] {
  const weight = (r: FuzzRoute) => (r.multipart ? 4 : r.method === 'get' ? 0.5 : 1);
  const totalWeight = routes.reduce((sum, r) => sum + weight(r), 0);
  const requests: FuzzRequest[] = [];
  routes.forEach((route, k) => {
    const count = Math.max(4, Math.round((options.total * weight(route)) / totalWeight));
    const url = fc.tuple(idArb(options.realIds(route)), queryArb(route)).map(([id, query]) => route.path.replace(/\{\w+\}/g, id) + query);
    const payload: fc.Arbitrary<{ contentType?: string; body?: string | Buffer }> = route.multipart
      ? brokenMultipart(route.multipart.fields)
      : route.body
        ? fc.oneof(
            { weight: 4, arbitrary: valueFor(route.body).map((v) => ({ contentType: 'application/json', body: JSON.stringify(v) ?? 'null' })) },
            { weight: 1, arbitrary: rawBody },
          )
        : fc.oneof({ weight: 3, arbitrary: fc.constant({}) }, { weight: 1, arbitrary: rawBody });
    const request = fc.record({ url, payload });
    fc.sample(request, { seed: options.seed + k, numRuns: count }).forEach((r, n) => {
      // One request in 25 goes without a session (the 401 path comes before validation).
      requests.push({ method: route.method, route: `${route.method.toUpperCase()} ${route.path}`, url: r.url, anonymous: n % 25 === 24, ...r.payload });
    });
  });
  return requests;
}
