import { OpenAPIRegistry, OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';
import { apiErrorSchema } from '../../../shared/schemas/errors';
import { idParamSchema, slugSchema } from '../../../shared/schemas/params';
import { chassisGraphSchema, partGraphSchema, whereElseQuerySchema, whereElseSchema } from '../../../shared/schemas/graph';
import { exportedSwapSchema, OPEN_DATA_LICENCE, swapExportSchema } from '../../../shared/schemas/export';
import { swapDataSchema } from '../../../shared/schemas/swap-data';

// The public API's machine-readable description (OpenAPI 3.1), generated from the same zod schemas the
// server parses requests with and the client types its answers with, so it cannot drift from them.

const json = (schema: z.ZodType, description: string) => ({ description, content: { 'application/json': { schema } } });

export function buildOpenApiDocument(siteUrl: string) {
  const registry = new OpenAPIRegistry();
  // named schemas become components that answers refer to
  const error = apiErrorSchema.meta({ id: 'Error' });
  const swapData = swapDataSchema.meta({ id: 'SwapData', description: 'A swap record, version 2' });
  const exportedSwap = exportedSwapSchema.extend({ record: swapData }).meta({ id: 'ExportedSwap' });
  const swapExport = swapExportSchema.extend({ swaps: z.array(exportedSwap) }).meta({ id: 'SwapExport' });
  const badRequest = json(error, 'A parameter is not valid; `error.fields` names it');
  const notFound = json(error, 'Not found');

  registry.registerPath({
    method: 'get',
    path: '/api/export/swaps.json',
    tags: ['Open data'],
    summary: 'Every approved swap at its current revision, as one JSON file',
    description: `Streamed; the licence (${OPEN_DATA_LICENCE.spdx}) is stated first in the file and the count last.`,
    responses: { 200: json(swapExport, 'The open data') },
  });
  registry.registerPath({
    method: 'get',
    path: '/api/export/swaps.csv',
    tags: ['Open data'],
    summary: 'Every approved swap at its current revision, one row each',
    description:
      'Streamed. The first line is a comment (`#`) naming the licence; then a header row. Text cells that begin with =, +, -, @, a tab or a carriage return get a leading apostrophe so spreadsheets show them as text. `record_json` and `chassis_json` hold the full record and chassis.',
    responses: { 200: { description: 'The open data as CSV', content: { 'text/csv': { schema: z.string() } } } },
  });
  registry.registerPath({
    method: 'get',
    path: '/api/graph/parts/{id}',
    tags: ['Interchange graph'],
    summary: 'Where a catalogue part fits: the vehicles it came on, and the chassis approved swaps fit it to',
    request: { params: z.object({ id: idParamSchema }) },
    responses: { 200: json(partGraphSchema.meta({ id: 'PartGraph' }), 'The part and its reach'), 400: badRequest, 404: notFound },
  });
  registry.registerPath({
    method: 'get',
    path: '/api/graph/chassis/{slug}',
    tags: ['Interchange graph'],
    summary: 'The donor parts that fit a chassis through approved swaps, by kind, each with the swaps',
    request: { params: z.object({ slug: slugSchema }) },
    responses: { 200: json(chassisGraphSchema.meta({ id: 'ChassisGraph' }), 'The donor parts'), 400: badRequest, 404: notFound },
  });
  registry.registerPath({
    method: 'get',
    path: '/api/graph/where-else',
    tags: ['Interchange graph'],
    summary: 'Every chassis a part number reaches, and the other numbers of the same part',
    description: 'Case and separators are ignored: `ov 355 104 l` finds `OV-355-104-L`.',
    request: { query: whereElseQuerySchema },
    responses: { 200: json(whereElseSchema.meta({ id: 'WhereElse' }), "The part number's reach"), 400: badRequest },
  });
  registry.registerPath({
    method: 'get',
    path: '/api/openapi.json',
    tags: ['About the API'],
    summary: 'This description',
    responses: { 200: { description: 'OpenAPI 3.1', content: { 'application/json': { schema: z.object({}).passthrough() } } } },
  });
  registry.registerPath({
    method: 'get',
    path: '/api/health',
    tags: ['About the API'],
    summary: 'Whether the service is up',
    responses: { 200: json(z.object({ ok: z.boolean() }), 'Up') },
  });

  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Swapyard public API',
      version: '1.0.0',
      description:
        'Read-only: the open data exports and the interchange graph. No sign-in needed. The data is published under ' +
        `${OPEN_DATA_LICENCE.name} (${OPEN_DATA_LICENCE.spdx}).`,
      license: { name: OPEN_DATA_LICENCE.name, identifier: OPEN_DATA_LICENCE.spdx },
    },
    servers: [{ url: siteUrl }],
  });
}
