import fc from 'fast-check';
import { MULTILEVEL_CARRIERS_BY_TOPOLOGY, MULTILEVEL_LEVEL_BOUNDS } from '@pulsewright/modulation';
import {
  applyMutation,
  mutationsFor,
  sitesOf,
  validArbitrary,
  type Mutation,
  type Schema,
  type SchemaTools,
} from './schemaArbitrary.js';

/** One operation of the OpenAPI document. */
export interface Operation {
  method: string;
  path: string;
  operationId: string;
  role: string;
  operation: Record<string, unknown>;
  pathItem: Record<string, unknown>;
}

/** Identifiers of things that exist in the fuzzed database, by what the path names. */
export type KnownIds = Record<
  'projects' | 'studies' | 'captures' | 'jobs' | 'apiKeys' | 'members' | 'invitations',
  string[]
>;

export type Auth = 'admin' | 'none' | 'garbage';

/** What a request is meant to test; the checks depend on it. */
export type Variant =
  | { kind: 'valid' }
  | { kind: 'invalid-field'; mutation: Mutation['kind']; field: string }
  | { kind: 'invalid-body'; what: string }
  | { kind: 'stray-body'; what: string }
  | { kind: 'invalid-query'; field: string; what: string }
  | { kind: 'invalid-path'; field: string }
  | { kind: 'invalid-upload'; what: string; field: string };

export interface FileSpec {
  field: string;
  fileName: string;
  contentType: string;
  /** Built when sent, so samples stay small in memory. */
  make: () => Buffer;
}

export interface FuzzRequest {
  operationId: string;
  role: string;
  method: string;
  url: string;
  auth: Auth;
  authorization?: string;
  contentType?: string;
  headers?: Record<string, string>;
  body?: string;
  multipart?: { fields: Record<string, string>; files: FileSpec[] };
  variant: Variant;
}

const dotted = (path: (string | number)[]): string => path.join('.');

/** Every operation of the document (method, path, operation and its path item). */
export function operationsOf(document: {
  paths: Record<string, Record<string, unknown>>;
}): Operation[] {
  const result: Operation[] = [];
  for (const [path, item] of Object.entries(document.paths)) {
    for (const method of ['get', 'put', 'post', 'patch', 'delete']) {
      const operation = item[method] as Record<string, unknown> | undefined;
      if (!operation) continue;
      result.push({
        method,
        path,
        operationId: String(operation.operationId),
        role: String(operation['x-pulsewright-role']),
        operation,
        pathItem: item,
      });
    }
  }
  return result;
}

function idPool(path: string, ids: KnownIds): string[] {
  if (path.startsWith('/api/v1/projects')) return ids.projects;
  if (path.startsWith('/api/v1/studies')) return ids.studies;
  if (path.startsWith('/api/v1/captures')) return ids.captures;
  if (path.startsWith('/api/v1/jobs')) return ids.jobs;
  if (path.startsWith('/api/v1/api-keys')) return ids.apiKeys;
  if (path.startsWith('/api/v1/members')) return ids.members;
  if (path.startsWith('/api/v1/invitations')) return ids.invitations;
  return [];
}

interface Parameter {
  name: string;
  in: string;
  required?: boolean;
  schema?: Schema;
}

function parametersOf(tools: SchemaTools, op: Operation): Parameter[] {
  const all = [
    ...((op.pathItem.parameters as Schema[]) ?? []),
    ...((op.operation.parameters as Schema[]) ?? []),
  ];
  return all.map((p) => tools.deref(p) as unknown as Parameter);
}

function jsonBodySchema(op: Operation): Schema | undefined {
  const content = (
    op.operation.requestBody as { content?: Record<string, { schema?: Schema }> } | undefined
  )?.content;
  return content?.['application/json']?.schema;
}

function bodyRequired(op: Operation): boolean {
  return (op.operation.requestBody as { required?: boolean } | undefined)?.required === true;
}

const PATTERN_METHODS = ['selective-harmonic-elimination', 'optimal-pattern'];

/**
 * An InverterDesign the library can analyse, from a schema-valid one: what the schema cannot
 * say (a carrier frequency that is a whole multiple of the fundamental for the carrier methods
 * and none for a stored pattern, ascending pattern angles, one of m and ma) is made so, with a
 * small frequency ratio (1 to 60) to keep the analysis cheap. Without this almost every random
 * design stops at the library's 400 and the analysis itself is never fuzzed.
 */
function coherentDesign(design: Record<string, unknown>, pick: number): Record<string, unknown> {
  const copy = { ...design };
  // A grid is the load of a grid-connected bridge: the two exclude each other.
  if (copy.grid && copy.load) delete copy[pick % 2 === 0 ? 'grid' : 'load'];
  // Sizes the generator favours at the ends of their ranges (a DC bus or modulation index of
  // 1e−300 gives a zero fundamental, which the library refuses): half get ordinary ones.
  if (pick % 2 === 0 && typeof copy.vdc === 'number' && copy.vdc < 1) copy.vdc = 1 + (pick % 997);
  let modulation = copy.modulation as Record<string, unknown> | undefined;
  if (!modulation || typeof modulation !== 'object') return copy;
  if (pick % 2 === 0) {
    for (const index of ['ma', 'm'])
      if (typeof modulation[index] === 'number' && modulation[index] < 1e-3)
        modulation = { ...modulation, [index]: 0.1 + (pick % 9) / 10 };
    copy.modulation = modulation;
  }
  const method = String(modulation.method);
  if (PATTERN_METHODS.includes(method)) {
    delete copy.carrierFrequency;
    if (Array.isArray(modulation.angles)) {
      const angles = [...new Set(modulation.angles as number[])].sort((a, b) => a - b);
      copy.modulation = { ...modulation, angles };
    }
  } else if (typeof copy.fundamentalFrequency === 'number') {
    const carrier = copy.fundamentalFrequency * (1 + (pick % 60));
    if (carrier <= 1e8) copy.carrierFrequency = carrier;
    if (
      (method === 'space-vector' || method === 'multilevel-space-vector') &&
      'm' in modulation &&
      'ma' in modulation
    ) {
      const { [pick % 2 === 0 ? 'm' : 'ma']: _dropped, ...rest } = modulation;
      copy.modulation = rest;
    }
    if (method === 'multilevel-carrier') copy.modulation = coherentMultilevel(modulation, pick);
  }
  return copy;
}

/**
 * A multilevel carrier modulation whose levels and carriers suit its topology (the library's
 * MULTILEVEL_LEVEL_BOUNDS and MULTILEVEL_CARRIERS_BY_TOPOLOGY), and no zero sequence on a
 * single-phase bridge: what the schema cannot say.
 */
function coherentMultilevel(
  modulation: Record<string, unknown>,
  pick: number,
): Record<string, unknown> {
  const topology = modulation.topology as keyof typeof MULTILEVEL_LEVEL_BOUNDS;
  const bounds = MULTILEVEL_LEVEL_BOUNDS[topology];
  const carriers = MULTILEVEL_CARRIERS_BY_TOPOLOGY[topology];
  if (bounds === undefined || carriers === undefined) return modulation;
  const step = bounds.odd ? 2 : 1;
  const levels = bounds.min + step * (pick % (1 + (bounds.max - bounds.min) / step));
  const coherent: Record<string, unknown> = {
    ...modulation,
    levels,
    carriers: carriers[pick % carriers.length],
  };
  if (coherent.phaseCount === 1) delete coherent.zeroSequence;
  return coherent;
}

const INVALID_IDS = [
  'not-a-uuid',
  '..%2F..%2Fetc%2Fpasswd',
  '%E2%80%AEdi',
  'x'.repeat(3000),
  "1'%20OR%20'1'%3D'1",
  '00000000-0000-0000-0000-00000000000g',
];

const GARBAGE_AUTH = [
  'Bearer pws_AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA',
  'Bearer pwk_deadbeef_AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA',
  'Bearer ',
  'Basic YWRtaW5Aa2VzdHJlbC5leGFtcGxlOnB1bHNld3JpZ2h0LWRlbW8=',
  `Bearer ${'x'.repeat(6000)}`,
  'Bearer \u00fcn\u00efc\u00f8d\u00e9',
  'bearer',
];

/** Bodies that are wrong as a whole: empty, not JSON, not an object, the wrong media type, too big. */
const WHOLE_BODY_CASES: {
  what: string;
  contentType?: string;
  body?: string;
  headers?: Record<string, string>;
}[] = [
  {
    what: 'unknown content encoding',
    contentType: 'application/json',
    body: '{"name":"x"}',
    headers: { 'Content-Encoding': 'x-unknown' },
  },
  { what: 'empty json body', contentType: 'application/json', body: '' },
  { what: 'json null', contentType: 'application/json', body: 'null' },
  { what: 'json array', contentType: 'application/json', body: '[1,2,3]' },
  { what: 'json string', contentType: 'application/json', body: '"text"' },
  { what: 'json number', contentType: 'application/json', body: '42' },
  { what: 'broken json', contentType: 'application/json', body: '{"modulation": {"ma": 0.8,' },
  { what: 'json with BOM and NUL', contentType: 'application/json', body: '\ufeff{"a":"\u0000"}' },
  { what: 'text/plain body', contentType: 'text/plain', body: '{"name":"x"}' },
  { what: 'xml body', contentType: 'application/xml', body: '<study><name>x</name></study>' },
  { what: 'form body', contentType: 'application/x-www-form-urlencoded', body: 'name=x&ma=0.8' },
  { what: 'no content type', body: '{"name":"x"}' },
  {
    what: 'body over 1 MB',
    contentType: 'application/json',
    body: `{"name":"${'a'.repeat(1_100_000)}"}`,
  },
  {
    what: 'json charset latin1',
    contentType: 'application/json; charset=latin1',
    body: '{"name":"x"}',
  },
];

/** A plausible bench capture CSV (header variants, 16–120 rows, even time step). */
const captureCsv = fc
  .record({
    rows: fc.integer({ min: 16, max: 120 }),
    step: fc.double({ min: 1e-7, max: 1e-2, noNaN: true }),
    header: fc.constantFrom(
      ['time', 'voltage'],
      ['t', 'v'],
      ['time_s', 'voltage_v', 'current_a'],
      ['Time (s)', 'Voltage (V)'],
    ),
    delimiter: fc.constantFrom(',', ';', '\t'),
    amplitude: fc.double({ min: 0.1, max: 1000, noNaN: true }),
  })
  .map(({ rows, step, header, delimiter, amplitude }) => {
    const lines = [header.join(delimiter)];
    for (let k = 0; k < rows; k++) {
      const cells = [(k * step).toPrecision(12), (amplitude * Math.sin(k / 3)).toFixed(3)];
      if (header.length === 3) cells.push((amplitude * 0.01 * Math.cos(k / 3)).toFixed(4));
      lines.push(cells.join(delimiter));
    }
    return `${lines.join('\n')}\n`;
  });

const PNG = Buffer.from(
  '89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d4944415478da6364f8cf00000301010027fd5c8a0000000049454e44ae426082',
  'hex',
);

const FILE_NAMES = [
  'capture.csv',
  '../../../etc/passwd',
  '..\\..\\windows\\system32\\x.csv',
  'a\u0000b.csv',
  '\u202egpj.csv',
  '.htaccess',
  `${'long'.repeat(100)}.csv`,
  'résumé 💥.csv',
  'CON.csv',
  '',
];

type UploadParts = Pick<FuzzRequest, 'contentType' | 'body' | 'multipart' | 'variant'>;

function uploadRequest(ids: KnownIds, tools: SchemaTools): fc.Arbitrary<UploadParts> {
  const nameSchema = tools.resolve({ $ref: '#/components/schemas/Name' });
  const fields = fc.record(
    {
      name: validArbitrary(tools, nameSchema) as fc.Arbitrary<string>,
      projectId: fc.oneof(
        fc.constantFrom(
          ...(ids.projects.length ? ids.projects : ['00000000-0000-4000-8000-000000000000']),
        ),
        fc.uuid(),
      ),
    },
    { requiredKeys: [] },
  );
  const valid = fc
    .record({ csv: captureCsv, fields, fileName: fc.constantFrom(...FILE_NAMES) })
    .map(({ csv, fields: f, fileName }): UploadParts => ({
      multipart: {
        fields: f,
        files: [
          {
            field: 'file',
            fileName,
            contentType: 'text/csv',
            make: () => Buffer.from(csv, 'utf8'),
          },
        ],
      },
      variant: { kind: 'valid' },
    }));
  const badFile = (
    what: string,
    make: () => Buffer,
    fileName = 'capture.csv',
    contentType = 'text/csv',
  ) =>
    fc.constant<UploadParts>({
      multipart: { fields: {}, files: [{ field: 'file', fileName, contentType, make }] },
      variant: { kind: 'invalid-upload', what, field: 'file' },
    });
  const invalid = fc.oneof(
    badFile('png renamed .csv', () => PNG, 'plot.csv'),
    badFile('random binary', () =>
      Buffer.from(Array.from({ length: 2048 }, (_, i) => (i * 131 + 7) % 256)),
    ),
    badFile('empty file', () => Buffer.alloc(0)),
    badFile('latin-1 text', () => Buffer.from('time,voltage\n0,1\n', 'latin1').fill(0xe9, 5, 6)),
    badFile('too few rows', () => Buffer.from('time,voltage\n0,1\n1,2\n')),
    badFile('uneven time', () =>
      Buffer.from(
        `time,voltage\n${Array.from({ length: 20 }, (_, k) => `${k * k},1`).join('\n')}\n`,
      ),
    ),
    badFile('unknown header', () =>
      Buffer.from(`when,volts2\n${Array.from({ length: 20 }, (_, k) => `${k},1`).join('\n')}\n`),
    ),
    badFile('formula cells', () =>
      Buffer.from(
        `time,voltage\n${Array.from({ length: 20 }, (_, k) => `${k},=1+${k}`).join('\n')}\n`,
      ),
    ),
    badFile('over 5 MB', () => Buffer.alloc(5 * 1024 * 1024 + 10, '0,1\n')),
    badFile(
      'json in a csv',
      () => Buffer.from('{"time":[0,1],"voltage":[1,2]}'),
      'x.csv',
      'application/json',
    ),
    fc.constant<UploadParts>({
      multipart: { fields: { name: 'x' }, files: [] },
      variant: { kind: 'invalid-upload', what: 'no file', field: 'file' },
    }),
    fc.constant<UploadParts>({
      multipart: {
        fields: {},
        files: [
          {
            field: 'upload',
            fileName: 'c.csv',
            contentType: 'text/csv',
            make: () => Buffer.from('time,voltage\n'),
          },
        ],
      },
      variant: { kind: 'invalid-upload', what: 'wrong field name', field: 'file' },
    }),
    captureCsv.map((csv): UploadParts => ({
      multipart: {
        fields: { projectId: 'not-a-uuid' },
        files: [
          {
            field: 'file',
            fileName: 'c.csv',
            contentType: 'text/csv',
            make: () => Buffer.from(csv),
          },
        ],
      },
      variant: { kind: 'invalid-upload', what: 'bad projectId', field: 'projectId' },
    })),
    captureCsv.map((csv): UploadParts => ({
      multipart: {
        fields: { name: 'n'.repeat(121) },
        files: [
          {
            field: 'file',
            fileName: 'c.csv',
            contentType: 'text/csv',
            make: () => Buffer.from(csv),
          },
        ],
      },
      variant: { kind: 'invalid-upload', what: 'name too long', field: 'name' },
    })),
    fc.constant<UploadParts>({
      contentType: 'application/json',
      body: '{"file":"time,voltage"}',
      variant: { kind: 'invalid-body', what: 'json instead of multipart' },
    }),
  );
  return fc.oneof({ weight: 2, arbitrary: valid }, { weight: 3, arbitrary: invalid });
}

/**
 * Requests for one operation: valid ones built from the schemas and invalid ones made by one
 * mutation of a valid one (or a wrong body, query or path as a whole), with the admin's token,
 * no token, or a garbage one.
 */
export function requestArbitrary(
  tools: SchemaTools,
  op: Operation,
  ids: KnownIds,
): fc.Arbitrary<FuzzRequest> {
  const parameters = parametersOf(tools, op);
  const pathParams = parameters.filter((p) => p.in === 'path');
  const queryParams = parameters.filter((p) => p.in === 'query');
  const bodySchema = jsonBodySchema(op);
  const isUpload = op.operationId === 'uploadCapture';

  const pathValues = fc.record(
    Object.fromEntries(
      pathParams.map((p) => {
        const pool = p.name === 'id' ? idPool(op.path, ids) : [];
        const valid = validArbitrary(tools, p.schema).map(String);
        return [
          p.name,
          pool.length
            ? fc.oneof(
                { weight: 4, arbitrary: fc.constantFrom(...pool) },
                { weight: 1, arbitrary: valid },
              )
            : valid,
        ];
      }),
    ),
  );
  const queryValues = fc.record(
    Object.fromEntries(
      queryParams.map((p) => [p.name, validArbitrary(tools, p.schema).map(String)]),
    ),
    { requiredKeys: queryParams.filter((p) => p.required).map((p) => p.name) },
  );
  // Ids in bodies (projectId, studyId) mostly name things that exist, so creates get past their 404.
  const known: Record<string, string[]> = { projectId: ids.projects, studyId: ids.studies };
  const validBody: fc.Arbitrary<unknown> = bodySchema
    ? fc
        .tuple(validArbitrary(tools, bodySchema), fc.nat(), fc.integer({ min: 0, max: 4 }))
        .map(([body, pick, odds]) => {
          if (!body || typeof body !== 'object' || Array.isArray(body) || odds === 0) return body;
          const copy = { ...(body as Record<string, unknown>) };
          for (const [field, pool] of Object.entries(known)) {
            if (typeof copy[field] === 'string' && pool.length)
              copy[field] = pool[pick % pool.length];
          }
          if (copy.design && typeof copy.design === 'object')
            copy.design = coherentDesign(copy.design as Record<string, unknown>, pick);
          return copy;
        })
    : fc.constant(undefined);

  type Parts = Pick<FuzzRequest, 'contentType' | 'headers' | 'body' | 'multipart' | 'variant'> & {
    path?: Record<string, string>;
    query?: Record<string, string>;
  };

  const variants: fc.WeightedArbitrary<Parts>[] = [];
  if (isUpload) {
    variants.push({ weight: 8, arbitrary: uploadRequest(ids, tools) });
  } else {
    variants.push({
      weight: 4,
      arbitrary: validBody.map((body) => ({
        variant: { kind: 'valid' },
        ...(body !== undefined
          ? { contentType: 'application/json', body: JSON.stringify(body) }
          : {}),
      })),
    });
  }
  if (bodySchema) {
    const mutated = validBody.chain((body) => {
      const sites = sitesOf(tools, bodySchema, body);
      const options: Mutation[] = [];
      for (const site of sites) {
        const parent = site.path.length
          ? sites.find(
              (s) =>
                s.path.length === site.path.length - 1 &&
                dotted(s.path) === dotted(site.path.slice(0, -1)),
            )
          : undefined;
        const required = (parent?.schema.required as string[] | undefined) ?? [];
        options.push(...mutationsFor(tools, site, required));
      }
      if (!options.length) return fc.constant(undefined);
      return fc
        .constantFrom(...options)
        .map((mutation) => ({ mutation, text: applyMutation(body, mutation) }));
    });
    variants.push({
      weight: 5,
      arbitrary: mutated.map((m): Parts => {
        if (!m) return { variant: { kind: 'valid' }, contentType: 'application/json', body: '{}' };
        const named = [...m.mutation.path].reverse().find((s) => typeof s === 'string');
        const index = m.mutation.path.findLastIndex((s) => typeof s === 'string');
        const field = named === undefined ? 'body' : dotted(m.mutation.path.slice(0, index + 1));
        return {
          variant: { kind: 'invalid-field', mutation: m.mutation.kind, field },
          contentType: 'application/json',
          body: m.text,
        };
      }),
    });
  }
  if (bodySchema || ['post', 'put', 'patch'].includes(op.method)) {
    variants.push({
      weight: 2,
      arbitrary: fc.constantFrom(...WHOLE_BODY_CASES).map((c) => ({
        // An empty body is a valid request when the body is optional (requestBody.required false).
        variant: !bodySchema
          ? { kind: 'stray-body', what: c.what }
          : c.body === '' && !bodyRequired(op)
            ? { kind: 'valid' }
            : { kind: 'invalid-body', what: c.what },
        ...(c.contentType ? { contentType: c.contentType } : {}),
        ...(c.body !== undefined ? { body: c.body } : {}),
        ...(c.headers ? { headers: c.headers } : {}),
      })),
    });
  }
  // Query parameters: wrong type, out of range, repeated, or one the operation does not know.
  const queryCases: fc.Arbitrary<Parts>[] = [
    fc.constant({
      variant: {
        kind: 'invalid-query',
        field: 'unexpectedParam',
        what: 'unknown parameter',
      },
      query: { unexpectedParam: '1' },
    }),
  ];
  for (const p of queryParams) {
    const s = tools.resolve(p.schema);
    const bad: string[] = [];
    if (s.type === 'integer' || s.type === 'number') {
      bad.push('abc', '1e999', '', '0x10');
      if (typeof s.maximum === 'number') bad.push(String(s.maximum + 1));
      if (typeof s.minimum === 'number') bad.push(String(s.minimum - 1));
      if (s.type === 'integer') bad.push('1.5');
    }
    if (Array.isArray(s.enum)) bad.push('no-such-choice');
    if (s.format === 'uuid') bad.push('../../etc/passwd');
    if (typeof s.maxLength === 'number') bad.push('q'.repeat(s.maxLength + 1));
    if (typeof s.minLength === 'number' && s.minLength > 0) bad.push('');
    for (const value of bad) {
      queryCases.push(
        fc.constant({
          variant: {
            kind: 'invalid-query',
            field: p.name,
            what: `${p.name}=${value.slice(0, 20)}`,
          },
          query: { [p.name]: value },
        }),
      );
    }
  }
  variants.push({ weight: 1, arbitrary: fc.oneof(...queryCases) });
  if (pathParams.length) {
    const p = pathParams[Math.floor(pathParams.length / 2)] as Parameter;
    const s = tools.resolve(p.schema);
    const bad = s.type === 'integer' ? ['abc', '0', '1.5', '99999999999'] : INVALID_IDS;
    variants.push({
      weight: 1,
      arbitrary: fc.constantFrom(...bad).map((value) => ({
        variant: { kind: 'invalid-path', field: p.name },
        path: { [p.name]: value },
      })),
    });
  }

  const authArbitrary =
    op.role === 'public'
      ? fc.constant<Auth>('none')
      : fc.oneof(
          { weight: 8, arbitrary: fc.constant<Auth>('admin') },
          { weight: 1, arbitrary: fc.constant<Auth>('none') },
          { weight: 1, arbitrary: fc.constant<Auth>('garbage') },
        );

  return fc
    .record({
      parts: fc.oneof(...variants),
      pathValues,
      queryValues,
      auth: authArbitrary,
      garbage: fc.constantFrom(...GARBAGE_AUTH),
    })
    .map(({ parts, pathValues: pv, queryValues: qv, auth, garbage }) => {
      const pathValuesFinal = { ...pv, ...(parts.path ?? {}) };
      let url = op.path.replace(/\{(\w+)\}/g, (_, name: string) => {
        const value = pathValuesFinal[name] ?? '';
        return parts.path?.[name] !== undefined ? value : encodeURIComponent(value);
      });
      const query = {
        ...(parts.variant.kind === 'invalid-query' ? {} : qv),
        ...(parts.query ?? {}),
      };
      const search = new URLSearchParams(query).toString();
      if (search) url += `?${search}`;
      if (
        op.operationId === 'computeTimerTable' &&
        parts.variant.kind !== 'invalid-query' &&
        !query.format
      )
        url += `${search ? '&' : '?'}format=csv`;
      const request: FuzzRequest = {
        operationId: op.operationId,
        role: op.role,
        method: op.method,
        url,
        auth,
        ...(auth === 'garbage' ? { authorization: garbage } : {}),
        variant: parts.variant,
        ...(parts.contentType !== undefined ? { contentType: parts.contentType } : {}),
        ...(parts.body !== undefined ? { body: parts.body } : {}),
        ...(parts.headers ? { headers: parts.headers } : {}),
        ...(parts.multipart ? { multipart: parts.multipart } : {}),
      };
      // A body the operation requires but the valid variant did not produce stays absent: that
      // is itself an invalid request.
      if (
        parts.variant.kind === 'valid' &&
        bodyRequired(op) &&
        request.body === undefined &&
        !request.multipart
      ) {
        request.variant = { kind: 'invalid-body', what: 'missing body' };
      }
      return request;
    });
}
