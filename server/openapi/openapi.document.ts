/**
 * The API description served at `GET /api/openapi.json`, generated from the same zod schemas
 * the routes validate with. A new route: add one `route(...)` line below (the API test checks
 * that every route of the app is listed).
 */
import { OpenAPIRegistry, OpenApiGeneratorV31, type ResponseConfig, type RouteConfig } from '@asteasolutions/zod-to-openapi';
import * as z from 'zod';
import { passwordResetRequestedSchema } from '@shared/api/account-links';
import { acceptInvitationRequestSchema, changePasswordRequestSchema, passwordResetConfirmSchema } from '@shared/api/new-password';
import { auditPageSchema, auditQuerySchema } from '@shared/api/audit';
import {
  apiErrorSchema,
  csrfResponseSchema,
  healthSchema,
  invitePersonRequestSchema,
  loginRequestSchema,
  loginResponseSchema,
  operatorPeopleSchema,
  operatorPersonResponseSchema,
  passwordResetRequestSchema,
  passwordSetResponseSchema,
  sessionUserSchema,
  unlockRequestSchema,
  updatePersonRequestSchema,
} from '@shared/api/auth';
import {
  aircraftTypeListSchema,
  aircraftTypeResponseSchema,
  airframeListSchema,
  airframeResponseSchema,
  createAircraftTypeSchema,
  createAirframeSchema,
  updateAircraftTypeSchema,
  updateAirframeSchema,
} from '@shared/api/fleet';
import { livenessSchema, readinessSchema } from '@shared/api/health';
import { mailboxResponseSchema } from '@shared/api/mailbox';
import { invitationSentSchema } from '@shared/api/people';
import {
  createRevisionSchema,
  contentCoverageRequestSchema,
  createSpeedBookSchema,
  diffQuerySchema,
  reasonSchema,
  revisionDiffSchema,
  revisionResponseSchema,
  signingKeyResponseSchema,
  speedBookListSchema,
  speedBookResponseSchema,
  updateRevisionSchema,
} from '@shared/api/revisions';
import { attachmentListSchema, attachmentResponseSchema } from '@shared/api/attachments';
import { speedTableUploadSchema } from '@shared/api/uploads';
import { revisionContentSchema } from '@shared/speed-book/revision-content';
import {
  cardIssueBatchResponseSchema,
  cardIssueBatchSchema,
  cardIssuePageSchema,
  cardIssueQuerySchema,
  cardIssueResponseSchema,
  cardPreviewRequestSchema,
  cardPreviewResponseSchema,
} from '@shared/card/card-api';
import { cardPdfQuerySchema, cardPdfReprintQuerySchema } from '@shared/card-pdf/card-pdf-api';
import { verifyResponseSchema, verifySourceResponseSchema } from '@shared/card-check/verify-api';
import { verifyCodeParamsSchema } from '@shared/card-check/verify-params';
import { operatorSettingsResponseSchema, operatorSettingsSchema, syncQuerySchema, syncResponseSchema } from '@shared/api/sync';

type Method = RouteConfig['method'];

const idParams = z.object({ id: z.string().regex(/^[1-9]\d*$/).describe('Record id') });
const entryIdParams = z.object({ id: z.uuid().describe('The card log entry’s id, a UUID the device chose') });
/**
 * Whether a schema and every schema inside it are of the full zod build. Walks the kinds of
 * schema the API's bodies use (objects, arrays, unions, optional/nullable/default wrappers,
 * pipes); a recursive schema goes in through `jsonSchemaOf` and is not walked.
 */
function madeOfFullZod(schema: z.core.$ZodType, depth = 0): boolean {
  if (!(schema instanceof z.ZodType)) return false;
  if (depth > 64) return true;
  const def = schema._zod.def as unknown as Record<string, unknown>;
  const inner: unknown[] = [];
  if (def.type === 'object') inner.push(...Object.values(def.shape as Record<string, unknown>));
  if (def.type === 'union') inner.push(...(def.options as unknown[]));
  if (def.type === 'intersection') inner.push(def.left, def.right);
  if (def.type === 'pipe') inner.push(def.in, def.out);
  if (def.type === 'record') inner.push(def.valueType);
  for (const key of ['element', 'innerType']) if (def[key]) inner.push(def[key]);
  return inner.every((child) => madeOfFullZod(child as z.core.$ZodType, depth + 1));
}

/**
 * zod-to-openapi reads schemas of the full zod build; those of the small build (`zod/mini`:
 * shared/api/session.ts, the card inputs, the public card check), or holding one, go in as zod's
 * own JSON Schema of their input or output.
 */
const json = (schema: z.core.$ZodType, io: 'input' | 'output' = 'output') => ({
  content: { 'application/json': { schema: madeOfFullZod(schema) ? schema : (z.toJSONSchema(schema, { unrepresentable: 'any', io }) as Record<string, unknown>) } },
});
/** A recursive schema (z.lazy) as zod's own JSON Schema; zod-to-openapi recurses on those without end. */
const jsonSchemaOf = (schema: z.core.$ZodType) => z.toJSONSchema(schema, { unrepresentable: 'any', io: 'output' }) as Record<string, unknown>;

const ERRORS: Record<number, string> = {
  400: 'The request is not valid; `fields` names each field at fault.',
  401: 'Not signed in.',
  403: 'The role may not do this, or the CSRF token is missing.',
  404: 'No such record for this operator.',
  409: 'The record is not in a state that allows this.',
  422: 'The content is not complete or consistent; `fields` names each problem.',
};

interface RouteSpec {
  summary: string;
  tags: string[];
  /** Capability needed, for the description; `public` for no sign-in. */
  who: string;
  /** `true`: a numeric record id `:id`; or the schema of the path parameters. */
  params?: boolean | z.ZodObject;
  query?: z.ZodObject;
  body?: z.core.$ZodType;
  /** A multipart upload of one file in the field `file`, instead of a JSON body. */
  upload?: string;
  ok: { status: number; schema?: z.core.$ZodType; description?: string; recursive?: boolean };
  errors?: number[];
}

/** The OpenAPI 3.1 document of the whole API. */
export function buildOpenApiDocument(): ReturnType<OpenApiGeneratorV31['generateDocument']> {
  const registry = new OpenAPIRegistry();
  // Named components come from zod's own JSON Schema output: `registry.register` needs schemas
  // made after `extendZodWithOpenApi`, and the shared ones are made at import, before it.
  const component = (name: string, schema: z.core.$ZodType) =>
    registry.registerComponent('schemas', name, z.toJSONSchema(schema, { unrepresentable: 'any', io: 'input' }) as Record<string, unknown>);
  component('ApiError', apiErrorSchema);
  component('RevisionContent', revisionContentSchema);
  component('SessionUser', sessionUserSchema);

  const route = (method: Method, path: string, spec: RouteSpec) => {
    const responses: Record<number, ResponseConfig> = {
      [spec.ok.status]: {
        description: spec.ok.description ?? 'OK',
        ...(spec.ok.schema && spec.ok.recursive ? { content: { 'application/json': { schema: jsonSchemaOf(spec.ok.schema) } } } : {}),
        ...(spec.ok.schema && !spec.ok.recursive ? json(spec.ok.schema) : {}),
      },
    };
    const errors = new Set([...(spec.who === 'public' ? [] : [401]), ...(spec.params ? [404] : []), ...(spec.body || spec.query ? [400] : []), ...(spec.errors ?? [])]);
    if (spec.who !== 'public' && spec.who !== 'signed-in') errors.add(403);
    for (const status of [...errors].sort()) responses[status] = { description: ERRORS[status] ?? 'Error', ...json(apiErrorSchema) };
    registry.registerPath({
      method,
      path: path.replace(/:(\w+)/g, '{$1}'),
      summary: spec.summary,
      description: spec.who === 'public' ? 'No sign-in needed.' : `Needs: ${spec.who}. Writes need the x-csrf-token header.`,
      tags: spec.tags,
      request: {
        ...(spec.params ? { params: spec.params === true ? idParams : spec.params } : {}),
        ...(spec.query ? { query: spec.query } : {}),
        ...(spec.body ? { body: { required: true, ...json(spec.body, 'input') } } : {}),
        ...(spec.upload
          ? {
              body: {
                required: true,
                description: spec.upload,
                content: { 'multipart/form-data': { schema: { type: 'object' as const, properties: { file: { type: 'string' as const, format: 'binary' } }, required: ['file'] } } },
              },
            }
          : {}),
      },
      responses,
    });
  };

  route('get', '/api/health', { summary: 'Whether the server and its database answer', tags: ['health'], who: 'public', ok: { status: 200, schema: healthSchema }, errors: [503] });
  route('get', '/api/health/live', { summary: 'Liveness: the process answers', tags: ['health'], who: 'public', ok: { status: 200, schema: livenessSchema } });
  route('get', '/api/health/ready', {
    summary: 'Readiness: the database answers, every migration of this build has run, and the instance is not shutting down (503 with the reason otherwise)',
    tags: ['health'],
    who: 'public',
    ok: { status: 200, schema: readinessSchema },
    errors: [503],
  });
  route('get', '/api/openapi.json', { summary: 'This document', tags: ['meta'], who: 'public', ok: { status: 200, description: 'OpenAPI 3.1' } });

  route('get', '/api/auth/csrf', { summary: 'A CSRF token for this session', tags: ['auth'], who: 'public', ok: { status: 200, schema: csrfResponseSchema } });
  route('post', '/api/auth/login', { summary: 'Sign in', tags: ['auth'], who: 'public', body: loginRequestSchema, ok: { status: 200, schema: loginResponseSchema }, errors: [400, 401, 423, 429] });
  route('post', '/api/auth/logout', { summary: 'Sign out', tags: ['auth'], who: 'public', ok: { status: 204, description: 'Signed out' } });
  route('post', '/api/auth/password', { summary: 'Change one’s own password (other sessions end)', tags: ['auth'], who: 'signed-in', body: changePasswordRequestSchema, ok: { status: 204, description: 'Changed' } });
  route('get', '/api/auth/me', { summary: 'Who is signed in', tags: ['auth'], who: 'signed-in', ok: { status: 200, schema: loginResponseSchema } });
  route('get', '/api/users', { summary: 'The operator’s people', tags: ['people'], who: 'manage-people', ok: { status: 200, schema: operatorPeopleSchema } });
  route('post', '/api/users', { summary: 'Invite a person by e-mail', tags: ['people'], who: 'manage-people', body: invitePersonRequestSchema, ok: { status: 201, schema: invitationSentSchema }, errors: [409] });
  route('patch', '/api/users/:id', { summary: 'Change a person’s name or role, lock or unlock', tags: ['people'], who: 'manage-people', params: true, body: updatePersonRequestSchema, ok: { status: 200, schema: operatorPersonResponseSchema }, errors: [409] });
  route('post', '/api/users/:id/invitation', { summary: 'Send the invitation again', tags: ['people'], who: 'manage-people', params: true, ok: { status: 201, schema: invitationSentSchema }, errors: [409] });
  route('post', '/api/auth/invitations/accept', { summary: 'Accept an invitation: choose a password', tags: ['auth'], who: 'public', body: acceptInvitationRequestSchema, ok: { status: 200, schema: passwordSetResponseSchema }, errors: [400, 410, 429] });
  route('post', '/api/auth/password-reset', { summary: 'Ask for a password-reset link by e-mail', tags: ['auth'], who: 'public', body: passwordResetRequestSchema, ok: { status: 202, schema: passwordResetRequestedSchema }, errors: [400, 429] });
  route('post', '/api/auth/unlock', { summary: 'Lift the sign-in wait with the link from the mail', tags: ['auth'], who: 'public', body: unlockRequestSchema, ok: { status: 200, schema: passwordSetResponseSchema }, errors: [400, 410, 429] });
  route('post', '/api/auth/password-reset/confirm', { summary: 'Choose a new password with a reset link', tags: ['auth'], who: 'public', body: passwordResetConfirmSchema, ok: { status: 200, schema: passwordSetResponseSchema }, errors: [400, 410, 429] });
  route('get', '/api/dev/mailbox', { summary: 'The local fake mailbox (only when MAILBOX_DIR is set)', tags: ['people'], who: 'manage-people', ok: { status: 200, schema: mailboxResponseSchema } });
  route('post', '/api/uploads/speed-table', {
    summary: 'Parse a CSV speed or position-error table for a preview (nothing is stored)',
    tags: ['revisions'], who: 'edit-speed-books', upload: 'One CSV file, at most 256 kB.', ok: { status: 200, schema: speedTableUploadSchema, recursive: true }, errors: [400, 413, 415, 422],
  });

  route('get', '/api/aircraft-types', { summary: 'The operator’s aircraft types', tags: ['fleet'], who: 'read-published', ok: { status: 200, schema: aircraftTypeListSchema } });
  route('post', '/api/aircraft-types', { summary: 'Add an aircraft type', tags: ['fleet'], who: 'manage-fleet', body: createAircraftTypeSchema, ok: { status: 201, schema: aircraftTypeResponseSchema }, errors: [409] });
  route('get', '/api/aircraft-types/:id', { summary: 'One aircraft type', tags: ['fleet'], who: 'read-published', params: true, ok: { status: 200, schema: aircraftTypeResponseSchema } });
  route('patch', '/api/aircraft-types/:id', { summary: 'Change an aircraft type', tags: ['fleet'], who: 'manage-fleet', params: true, body: updateAircraftTypeSchema, ok: { status: 200, schema: aircraftTypeResponseSchema }, errors: [409] });
  route('get', '/api/airframes', { summary: 'The operator’s airframes', tags: ['fleet'], who: 'read-published', ok: { status: 200, schema: airframeListSchema } });
  route('post', '/api/airframes', { summary: 'Add an airframe', tags: ['fleet'], who: 'manage-fleet', body: createAirframeSchema, ok: { status: 201, schema: airframeResponseSchema }, errors: [409, 422] });
  route('get', '/api/airframes/:id', { summary: 'One airframe', tags: ['fleet'], who: 'read-published', params: true, ok: { status: 200, schema: airframeResponseSchema } });
  route('post', '/api/airframes/:id/card.pdf', {
    summary: 'Issue a speed card from the current published revision, recorded in the card log, and print it (PDF); inputs as query parameters',
    tags: ['cards'], who: 'print-card-batches', params: true, query: cardPdfQuerySchema,
    ok: { status: 201, description: 'application/pdf, with Content-Disposition naming <registration>-rev<N>-<yyyy-mm-dd>.pdf, X-Card-Code the card code and Location the address that prints it again' }, errors: [409, 422],
  });
  route('get', '/api/airframes/:id/card.pdf', {
    summary: 'Print again a card already in the card log, by its code (writes nothing)',
    tags: ['cards'], who: 'print-card-batches', params: true, query: cardPdfReprintQuerySchema,
    ok: { status: 200, description: 'application/pdf, as the card was issued' }, errors: [409],
  });
  route('patch', '/api/airframes/:id', { summary: 'Change an airframe', tags: ['fleet'], who: 'manage-fleet', params: true, body: updateAirframeSchema, ok: { status: 200, schema: airframeResponseSchema }, errors: [409, 422] });

  route('get', '/api/speed-books', { summary: 'Speed books with their published revision', tags: ['speed books'], who: 'read-published', ok: { status: 200, schema: speedBookListSchema } });
  route('post', '/api/speed-books', { summary: 'Start the speed book of a type', tags: ['speed books'], who: 'edit-speed-books', body: createSpeedBookSchema, ok: { status: 201, schema: speedBookResponseSchema }, errors: [409, 422] });
  route('get', '/api/speed-books/:id', { summary: 'A speed book and its revisions', tags: ['speed books'], who: 'read-published', params: true, ok: { status: 200, schema: speedBookResponseSchema } });
  route('post', '/api/speed-books/:id/revisions', {
    summary: 'A new draft revision (a copy of the latest published content when none is given)',
    tags: ['revisions'], who: 'edit-speed-books', params: true, body: createRevisionSchema, ok: { status: 201, schema: revisionResponseSchema }, errors: [409, 422],
  });

  route('get', '/api/revisions/:id', { summary: 'A revision with its content', tags: ['revisions'], who: 'read-published (drafts: edit-speed-books)', params: true, ok: { status: 200, schema: revisionResponseSchema } });
  route('patch', '/api/revisions/:id', { summary: 'Change a draft', tags: ['revisions'], who: 'edit-speed-books', params: true, body: updateRevisionSchema, ok: { status: 200, schema: revisionResponseSchema }, errors: [409] });
  route('delete', '/api/revisions/:id', { summary: 'Discard a draft and its source pages (audited)', tags: ['revisions'], who: 'edit-speed-books', params: true, ok: { status: 204, description: 'Discarded' }, errors: [409] });
  route('post', '/api/revisions/:id/submit', { summary: 'Draft → in review (content valid, envelope declared and swept: 422 coverage_failed carries error.report)', tags: ['revisions'], who: 'edit-speed-books', params: true, ok: { status: 200, schema: revisionResponseSchema }, errors: [409, 422] });
  route('get', '/api/revisions/:id/coverage', { summary: 'The envelope sweep of a revision: { report } (CoverageReport)', tags: ['revisions'], who: 'read-published (drafts: edit-speed-books)', params: true, ok: { status: 200, description: '{ report }: the coverage report (shared/card/coverage-report.ts)' }, errors: [422] });
  route('post', '/api/revisions/coverage', { summary: 'The envelope sweep of unsaved content: { report } (CoverageReport)', tags: ['revisions'], who: 'edit-speed-books', body: contentCoverageRequestSchema, ok: { status: 200, description: '{ report }: the coverage report (shared/card/coverage-report.ts)' }, errors: [422] });
  route('post', '/api/revisions/:id/approve', { summary: 'In review → published, signed; supersedes the previous (re-checks the envelope sweep: 422 coverage_failed)', tags: ['revisions'], who: 'publish-revisions (not the author)', params: true, ok: { status: 200, schema: revisionResponseSchema }, errors: [409, 422] });
  route('post', '/api/revisions/:id/return', { summary: 'In review → draft, with a reason', tags: ['revisions'], who: 'publish-revisions (not the author)', params: true, body: reasonSchema, ok: { status: 200, schema: revisionResponseSchema }, errors: [409] });
  route('post', '/api/revisions/:id/withdraw', { summary: 'Published → withdrawn, with a reason', tags: ['revisions'], who: 'publish-revisions', params: true, body: reasonSchema, ok: { status: 200, schema: revisionResponseSchema }, errors: [409] });
  route('get', '/api/revisions/:id/diff', { summary: 'Field-by-field changes from ?against to this revision', tags: ['revisions'], who: 'read-published', params: true, query: diffQuerySchema, ok: { status: 200, schema: revisionDiffSchema } });
  route('get', '/api/revisions/:id/attachments', { summary: 'The source pages of a revision', tags: ['revisions'], who: 'read-published (drafts: edit-speed-books)', params: true, ok: { status: 200, schema: attachmentListSchema } });
  route('post', '/api/revisions/:id/attachments', {
    summary: 'Attach a source page (PDF, PNG or JPEG, recognised by content) while draft or in review',
    tags: ['revisions'], who: 'edit-speed-books', params: true, upload: 'One PDF, PNG or JPEG file, at most 10 MB.', ok: { status: 201, schema: attachmentResponseSchema }, errors: [400, 409, 413, 415],
  });
  route('get', '/api/attachments/:id', { summary: 'The file of a source page, inline, with its content type', tags: ['revisions'], who: 'read-published (drafts: edit-speed-books)', params: true, ok: { status: 200, description: 'The file (application/pdf, image/png or image/jpeg)' }, errors: [410] });
  route('delete', '/api/attachments/:id', { summary: 'Remove a source page while the revision is a draft', tags: ['revisions'], who: 'edit-speed-books', params: true, ok: { status: 204, description: 'Removed' }, errors: [409] });

  route('get', '/api/operator/signing-key', {
    summary: 'The operator’s Ed25519 public keys: `signingKey` the active one (new publications), `signingKeys` every key it ever published with, retired ones with `retiredAt`, newest first',
    tags: ['operator'], who: 'read-published', ok: { status: 200, schema: signingKeyResponseSchema },
  });
  route('post', '/api/operator/signing-key/rotate', {
    summary: 'Rotate the signing key: a new active key for new publications; the old one retired, kept and still served so what it signed stays verifiable (audited `signing-key.rotated`)',
    tags: ['operator'], who: 'manage-people', ok: { status: 201, schema: signingKeyResponseSchema },
  });
  route('get', '/api/operator/settings', { summary: 'The operator’s settings (the currency limit in days)', tags: ['operator'], who: 'manage-people', ok: { status: 200, schema: operatorSettingsResponseSchema } });
  route('patch', '/api/operator/settings', { summary: 'Change the operator’s settings (the currency limit in days, the approach additive policy)', tags: ['operator'], who: 'manage-people', body: operatorSettingsSchema, ok: { status: 200, schema: operatorSettingsResponseSchema } });
  route('get', '/api/sync', { summary: 'Published data changed since a cursor (everything without one), for offline devices', tags: ['sync'], who: 'read-published', query: syncQuerySchema, ok: { status: 200, schema: syncResponseSchema } });
  route('get', '/api/audit', { summary: 'The audit trail, newest first, filtered and paginated', tags: ['audit'], who: 'read-audit', query: auditQuerySchema, ok: { status: 200, schema: auditPageSchema } });

  route('post', '/api/cards/preview', {
    summary: 'A speed card computed from a revision and inputs (422 `card_refused` with the input at fault)',
    tags: ['cards'], who: 'prepare-cards (drafts: edit-speed-books)', body: cardPreviewRequestSchema, ok: { status: 200, schema: cardPreviewResponseSchema }, errors: [404, 409, 422],
  });
  route('post', '/api/card-issues', {
    summary: 'Report issued cards (idempotent by entry id; each card re-derived; one result per entry)',
    tags: ['cards'], who: 'prepare-cards', body: cardIssueBatchSchema, ok: { status: 200, schema: cardIssueBatchResponseSchema },
  });
  route('get', '/api/card-issues', { summary: 'The card log, newest first (pilots: their own cards)', tags: ['cards'], who: 'read-card-log or prepare-cards', query: cardIssueQuerySchema, ok: { status: 200, schema: cardIssuePageSchema } });
  route('get', '/api/verify/:code', {
    summary: 'Whether the revision of the card with this code is current, superseded or withdrawn (or the code unknown); only what the card prints',
    tags: ['card check'], who: 'public', params: verifyCodeParamsSchema, ok: { status: 200, schema: verifyResponseSchema }, errors: [400, 429],
  });
  route('get', '/api/verify/:code/source', {
    summary: 'The one revision, header and issued digest the card with this code was built from, to re-derive its figures',
    tags: ['card check'], who: 'public', params: verifyCodeParamsSchema, ok: { status: 200, schema: verifySourceResponseSchema, recursive: true }, errors: [400, 404, 429],
  });
  route('get', '/api/card-issues/:id', { summary: 'One card log entry', tags: ['cards'], who: 'read-card-log or prepare-cards', params: entryIdParams, ok: { status: 200, schema: cardIssueResponseSchema } });

  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Speedwright API',
      version: '1',
      description: 'Speed books, signed revisions, fleet and audit of one operator. Every request is scoped to the signed-in person’s operator.',
    },
    servers: [{ url: '/' }],
  });
}
