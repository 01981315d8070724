import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser } from './support/auth-helpers';
import { addChassis, addPart, swapRecord } from './support/swap-fixtures';
import { addSwap, catalogueLine, swapData } from './support/swap-rows';

// The public API's description, generated from the shared zod schemas, checked against what the API answers:
// real answers over rows arranged here are validated by a JSON Schema validator against the generated schemas.

let t: TestApp;
let partId = 0;

beforeAll(async () => {
  t = await makeTestApp({ APP_URL: 'https://swapyard.example' });
  const rosa = addUser(t.db, 'rivet_rosa').id;
  const h31 = addChassis(t.db, 'halden-h31').id;
  partId = addPart(t.db, 'vela-caliper-l').id;
  const full = swapData('Vela calipers on the H31', {
    ...swapRecord(),
    parts: [catalogueLine(partId, 'caliper', 'Vela caliper', ['OV-355-104-L'])],
  });
  addSwap(t.db, {
    slug: 'h31-vela-front',
    chassisId: h31,
    authorId: rosa,
    revisions: [{ status: 'approved', data: full, body: 'Notes.' }],
  });
  addSwap(t.db, { slug: 'h31-plain', chassisId: h31, authorId: rosa, revisions: [{ status: 'approved' }] });
});
afterAll(() => t.close());

async function documentAndValidator() {
  const res = await request(t.app).get('/api/openapi.json');
  expect(res.status).toBe(200);
  const doc = res.body;
  const ajv = new Ajv2020({ strict: false, allErrors: true });
  ajv.addSchema({ ...doc, $id: 'https://swapyard.example/api/openapi.json' });
  const validate = (name: string, value: unknown) => {
    const check = ajv.getSchema(`https://swapyard.example/api/openapi.json#/components/schemas/${name}`);
    if (!check) throw new Error(`no schema ${name}`);
    const ok = check(value);
    return ok ? [] : (check.errors ?? []).map((e) => `${e.instancePath} ${e.message}`);
  };
  return { doc, validate };
}

describe('GET /api/openapi.json', () => {
  it('when fetched, then it is OpenAPI 3.1 naming the licence and listing the exports and the graph', async () => {
    const { doc } = await documentAndValidator();
    expect(doc.openapi).toBe('3.1.0');
    expect(doc.info.license).toEqual({
      name: 'Creative Commons Attribution-ShareAlike 4.0 International',
      identifier: 'CC-BY-SA-4.0',
    });
    expect(Object.keys(doc.paths)).toEqual(
      expect.arrayContaining([
        '/api/export/swaps.json',
        '/api/export/swaps.csv',
        '/api/graph/parts/{id}',
        '/api/graph/chassis/{slug}',
        '/api/graph/where-else',
        '/api/openapi.json',
      ]),
    );
    expect(doc.paths['/api/graph/where-else'].get.parameters).toEqual(
      expect.arrayContaining([expect.objectContaining({ name: 'number', in: 'query', required: true })]),
    );
  });

  it('when the JSON export is validated against the generated schema, then it passes, and a broken copy does not', async () => {
    const { validate } = await documentAndValidator();
    const file = (await request(t.app).get('/api/export/swaps.json')).body;
    expect(file.count).toBe(2);
    expect(validate('SwapExport', file)).toEqual([]);
    // the validator does look: a swap without its record, or with an unknown axle, is refused
    const broken = structuredClone(file);
    delete broken.swaps[0].record;
    broken.swaps[1].axle = 'middle';
    expect(validate('SwapExport', broken).length).toBeGreaterThanOrEqual(2);
  });

  it('when the graph answers are validated against their generated schemas, then they pass, and so does an error', async () => {
    const { validate } = await documentAndValidator();
    expect(validate('PartGraph', (await request(t.app).get(`/api/graph/parts/${partId}`)).body)).toEqual([]);
    expect(validate('ChassisGraph', (await request(t.app).get('/api/graph/chassis/halden-h31')).body)).toEqual([]);
    const found = (await request(t.app).get('/api/graph/where-else').query({ number: 'ov355104l' })).body;
    expect(found.reaches).toHaveLength(1);
    expect(validate('WhereElse', found)).toEqual([]);
    const bad = await request(t.app).get('/api/graph/where-else');
    expect(bad.status).toBe(400);
    expect(validate('Error', bad.body)).toEqual([]);
  });
});
