/**
 * The engineers' batch print. `POST /api/airframes/:id/card.pdf` issues a card: the card inputs
 * come as query parameters named as the inputs' fields (nested ones dotted:
 * `departure.qnhHpa`); the card is built with `buildCard` from the current published revision
 * of the airframe type's speed book, recorded in the card log (so its printed code can be
 * checked) and printed with the same document definition the browser uses (shared/card-pdf).
 * `GET /api/airframes/:id/card.pdf?code=…` prints a card already in the card log again and
 * writes nothing (a GET never issues: a link from another site must not make cards).
 */
import { randomUUID } from 'node:crypto';
import { Op } from 'sequelize';
import { checkUrl } from '@shared/card-check/check-url';
import { formatCardCode, validateCardCode } from '@shared/card-check/card-code';
import { CardRefusedError, cardInputsSchema, type CardInputs, type CardRevision, type SpeedCard } from '@shared/card/card';
import { buildCard } from '@shared/card/build-card';
import { utcDate } from '@shared/card/card-presentation';
import { cardPdf } from '@shared/card-pdf/card-document';
import { CARD_PAPER_SIZES, isCardPaperSize, type CardPaperSize } from '@shared/card-pdf/page-sizes';
import { cardChanges, previousCardOf } from '@shared/card-pdf/revision-marks';
import { contentSha256 } from '@shared/speed-book/canonical';
import type { Actor } from '../audit/actor';
import { DomainError, notFound } from '../errors/domain-error';
import { fieldErrors } from '../errors/field-errors';
import { Airframe, CardIssue, Operator, Revision, SpeedBook } from '../models';
import { approachPolicyOf } from '../operator/approach-policy';
import { EVER_PUBLISHED_STATUSES } from '../revisions/revision-access';
import { loadCardSource } from './card-source';
import { renderCardPdf } from './card-pdf-renderer';

/** Query parameters that are not card inputs. */
export const PAPER_PARAMETER = 'paper';

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;
/** Fields that stay text. */
const TEXT_FIELDS = new Set(['configuration']);

/**
 * The query as `CardInputs`-shaped data: dotted names nested, figures read as numbers (anything
 * else is left as text, for the schema to name), and a sentence for each name that cannot be
 * read at all (given twice, nested too deep, the paper unknown).
 */
export function inputsFromQuery(query: Record<string, unknown>, airframeId: number): { inputs: Record<string, unknown>; paper: CardPaperSize; fields: Record<string, string> } {
  const fields: Record<string, string> = {};
  const inputs: Record<string, unknown> = { airframeId };
  let paper: CardPaperSize = 'half-letter';
  for (const [name, raw] of Object.entries(query)) {
    if (Array.isArray(raw)) {
      fields[name] = `Give ${name} once.`;
      continue;
    }
    const text = String(raw).trim();
    if (name === PAPER_PARAMETER) {
      if (isCardPaperSize(text)) paper = text;
      else fields[name] = `The paper is one of ${CARD_PAPER_SIZES.join(', ')}.`;
      continue;
    }
    if (name === 'airframeId') {
      fields[name] = 'The airframe is the one in the path; leave airframeId out of the query.';
      continue;
    }
    const path = name.split('.');
    if (path[0] === 'approachAdditivePolicy') {
      fields[name] = 'The card uses the operator’s approach additive policy (operator settings); leave it out of the query.';
      continue;
    }
    // Three levels only for the wind: departure.wind.speedKt.
    const windPath = path.length === 3 && (path[0] === 'departure' || path[0] === 'arrival') && path[1] === 'wind';
    if ((path.length > 2 && !windPath) || path.some((part) => part === '' || part === '__proto__' || part === 'constructor' || part === 'prototype')) {
      fields[name] = 'This field is not expected here.';
      continue;
    }
    const value = TEXT_FIELDS.has(name) || !NUMBER.test(text) ? text : Number(text);
    if (path.length === 1) {
      if (typeof inputs[name] === 'object') fields[name] = `Give the fields of ${name} as ${name}.<field>.`;
      else inputs[name] = value;
    } else if (windPath) {
      const [group, , field] = path;
      const existing = (inputs[group] ?? {}) as Record<string, unknown>;
      if (typeof existing !== 'object' || existing === null) {
        fields[name] = `${group} is given both alone and as ${name}.`;
        continue;
      }
      inputs[group] = { ...existing, wind: { ...((existing['wind'] as Record<string, unknown>) ?? {}), [field]: value } };
    } else {
      const [group, field] = path;
      const existing = inputs[group];
      if (existing !== undefined && (typeof existing !== 'object' || existing === null)) {
        fields[name] = `${group} is given both alone and as ${name}.`;
        continue;
      }
      inputs[group] = { ...((existing as Record<string, unknown>) ?? {}), [field]: value };
    }
  }
  return { inputs, paper, fields };
}

/** The revision published for the airframe's type now; 404 for another operator's airframe, 409 when there is none. */
async function currentRevisionOf(operatorId: number, airframeId: number): Promise<{ airframe: Airframe; revision: Revision }> {
  const airframe = await Airframe.findOne({ where: { id: airframeId, operatorId } });
  if (!airframe) throw notFound('That airframe');
  const book = await SpeedBook.findOne({ where: { aircraftTypeId: airframe.aircraftTypeId, operatorId } });
  if (!book) throw new DomainError('conflict', 'no_speed_book', `There is no speed book for ${airframe.registration}'s type yet, so no card can be printed.`);
  const revision = await Revision.findOne({ where: { speedBookId: book.id, operatorId, status: 'published' } });
  if (!revision) throw new DomainError('conflict', 'no_published_revision', `${book.title} has no published revision, so no card can be printed for ${airframe.registration}.`);
  return { airframe, revision };
}

/** The revision published before `revision` in its book (superseded or withdrawn since), or null for the first. */
async function previousRevisionOf(revision: Revision): Promise<CardRevision | null> {
  const previous = await Revision.findOne({
    where: { speedBookId: revision.speedBookId, operatorId: revision.operatorId, status: { [Op.in]: EVER_PUBLISHED_STATUSES }, number: { [Op.lt]: revision.number } },
    order: [['number', 'DESC']],
  });
  if (!previous) return null;
  const content: unknown = JSON.parse(previous.content);
  return { id: previous.id, number: previous.number, publishedAt: previous.publishedAt?.toISOString() ?? null, contentSha256: previous.contentSha256 ?? contentSha256(content), content };
}

export interface PrintedCard {
  readonly pdf: Buffer;
  readonly fileName: string;
  readonly code: string;
  readonly card: SpeedCard;
}

/** Records the card as issued and gives its code (the check helper's `issueCardCode` by default). */
export type IssueCode = (actor: Actor, entry: { id: string; airframeId: number; revisionId: number; inputs: Record<string, unknown>; digest: string; issuedAt: string }) => Promise<string>;

export interface BatchPrintOptions {
  /** The operator's Speedwright host, where the check URL points. */
  readonly publicUrl: string;
  readonly issueCode: IssueCode;
  readonly now?: () => Date;
}

export async function printAirframeCard(actor: Actor, airframeId: number, query: Record<string, unknown>, options: BatchPrintOptions): Promise<PrintedCard> {
  const { inputs: raw, paper, fields } = inputsFromQuery(query, airframeId);
  // A card with a wind uses the operator's approach additive policy as it stands now (recorded in its inputs).
  if (hasWind(raw)) raw['approachAdditivePolicy'] = approachPolicyOf(await Operator.findByPk(actor.operatorId, { rejectOnEmpty: true }));
  const parsed = cardInputsSchema.safeParse(raw);
  const problems = { ...(parsed.success ? {} : fieldErrors(parsed.error)), ...fields };
  if (!parsed.success || Object.keys(problems).length) throw new DomainError('invalid', 'invalid_request', 'Some card inputs in the query are not right.', problems);
  const inputs: CardInputs = parsed.data;
  const { revision } = await currentRevisionOf(actor.operatorId, airframeId);
  const source = await loadCardSource(actor, revision.id, airframeId, 'preview');
  let card: SpeedCard;
  try {
    card = buildCard(source.revision, inputs, source.context);
  } catch (error) {
    if (!(error instanceof CardRefusedError)) throw error;
    const field = error.field === 'revision' ? 'revision' : error.field;
    throw new DomainError('refused', 'card_refused', error.message, { [field]: error.message });
  }
  const previous = previousCardOf(await previousRevisionOf(revision), inputs, source.context);
  const now = (options.now ?? (() => new Date()))();
  const issuedAt = now.toISOString();
  const code = await options.issueCode(actor, { id: randomUUID(), airframeId, revisionId: revision.id, inputs: { ...inputs }, digest: card.digest, issuedAt });
  return printedCard({ card, code, inputs, issuedAt, previous, paper, publicUrl: options.publicUrl, printing: 'printed there' });
}

function hasWind(inputs: Record<string, unknown>): boolean {
  return ['departure', 'arrival'].some((where) => {
    const conditions = inputs[where];
    return typeof conditions === 'object' && conditions !== null && ('wind' in conditions || 'runwayHeadingDeg' in conditions);
  });
}

/** The query of a reprint: the card's code and, optionally, the paper; nothing else. */
function reprintQuery(query: Record<string, unknown>): { code: string; paper: CardPaperSize } {
  const fields: Record<string, string> = {};
  let code: string | undefined;
  let paper: CardPaperSize = 'half-letter';
  for (const [name, raw] of Object.entries(query)) {
    const text = Array.isArray(raw) ? undefined : String(raw).trim();
    if (name === 'code') {
      const checked = text === undefined ? undefined : validateCardCode(text);
      if (checked?.ok) code = checked.code;
      else fields[name] = checked ? checked.message : 'Give the card code once.';
    } else if (name === PAPER_PARAMETER) {
      if (text !== undefined && isCardPaperSize(text)) paper = text;
      else fields[name] = `The paper is one of ${CARD_PAPER_SIZES.join(', ')}.`;
    } else {
      fields[name] = 'A GET prints a card already issued, by its code; issue a new card with POST and the card inputs.';
    }
  }
  if (code === undefined && !fields['code']) fields['code'] = 'Give the code of the issued card to print (code=K7M-4RT-X9X); issue a new card with POST.';
  if (Object.keys(fields).length) throw new DomainError('invalid', 'invalid_request', 'Some parameters of the query are not right.', fields);
  return { code: code!, paper };
}

/**
 * A card from the card log printed again, exactly as issued: the entry's revision (whatever it
 * is now; the check page says so), inputs and issue time, re-derived to the recorded digest.
 * Reads only. 404 when the airframe has no card with that code at this operator.
 */
export async function reprintAirframeCard(actor: Actor, airframeId: number, query: Record<string, unknown>, options: Pick<BatchPrintOptions, 'publicUrl'>): Promise<PrintedCard> {
  const { code, paper } = reprintQuery(query);
  const entry = await CardIssue.findOne({ where: { code, airframeId, operatorId: actor.operatorId } });
  if (!entry) throw new DomainError('not-found', 'not_found', `This airframe has no card with the code ${formatCardCode(code)} in the card log.`);
  const revision = await Revision.findOne({ where: { id: entry.revisionId, operatorId: actor.operatorId }, rejectOnEmpty: true });
  const inputs = JSON.parse(entry.inputs) as CardInputs;
  const source = await loadCardSource(actor, revision.id, airframeId, 'issue');
  const card = buildCard(source.revision, inputs, source.context);
  if (card.digest !== entry.digest) {
    throw new DomainError('conflict', 'card_not_reproducible', `The card ${formatCardCode(code)} cannot be printed again: its figures no longer come out as issued.`);
  }
  const previous = previousCardOf(await previousRevisionOf(revision), inputs, source.context);
  const issuedAt = entry.issuedAt.toISOString();
  return printedCard({ card, code, inputs, issuedAt, previous, paper, publicUrl: options.publicUrl, printing: 'reprinted' });
}

/** What the PDF of a card printed on the server is made of. */
interface CardPrinting {
  readonly card: SpeedCard;
  /** The card code, unformatted, as the card log keeps it. */
  readonly code: string;
  readonly inputs: CardInputs;
  readonly issuedAt: string;
  /** The same inputs on the previous revision, for the card's "changed since" lines. */
  readonly previous: Parameters<typeof cardChanges>[1];
  readonly paper: CardPaperSize;
  /** The operator's Speedwright host, where the check URL points. */
  readonly publicUrl: string;
  /** How this copy came to be, said on the card: issued and "printed there", or "reprinted". */
  readonly printing: 'printed there' | 'reprinted';
}

/** The card as a PDF: its code, its check URL at the operator's host, its data age and its changes. */
async function printedCard({ card, code, inputs, issuedAt, previous, paper, publicUrl, printing }: CardPrinting): Promise<PrintedCard> {
  const { definition, fileName } = cardPdf({
    card,
    code: formatCardCode(code),
    checkUrl: checkUrl(new URL(publicUrl).origin, code, { revisionId: card.revision.id, inputs, digest: card.digest }),
    issuedAt,
    dataAsOf: `Data as of ${utcDate(issuedAt)}: revision ${card.revision.number} as published on the server${printing === 'reprinted' ? '; reprinted' : ', printed there'}.`,
    changes: cardChanges(card, previous),
    paper,
  });
  return { pdf: await renderCardPdf(definition), fileName, code, card };
}

