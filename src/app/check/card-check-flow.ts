/**
 * What the check page finds out about a card code, online or from the device's data: one
 * function with its dependencies passed in, so the page stays a template and the flow is
 * tested without a browser.
 */
import type { SessionUser } from '@shared/api/auth';
import { parseCheckUrl, type CheckPayload, type ParsedCheckUrl } from '@shared/card-check/check-url';
import type { FiguresCheck } from '@shared/card-check/figures-check';
import type { VerifyResponse, VerifySource } from '@shared/card-check/verify-api';
import { ApiRequestError } from '../core/api/api-request-error';
import type { OfflineCheck, OfflineCheckReader } from './offline-check-data';
import type { SignatureNote } from './source-signature';

export interface CardCheckDeps {
  verify(code: string): Promise<VerifyResponse>;
  source(code: string): Promise<VerifySource>;
  /** The signed-in person (from the server, or the device's cache offline); null when nobody. */
  session(): Promise<SessionUser | null>;
  offline: OfflineCheckReader;
}

/** What the code carries about the card's figures, besides the code. */
export type FiguresNote =
  /** The figures were re-derived and compared. */
  | { readonly kind: 'checked'; readonly check: FiguresCheck }
  /** No figures to check, and why (a typed code, a damaged payload, an unknown code, no data offline). */
  | { readonly kind: 'none'; readonly sentence: string };

export type CardCheckResult =
  | { readonly kind: 'invalid'; readonly message: string }
  | {
      readonly kind: 'online';
      readonly code: ParsedCheckUrl;
      readonly verify: VerifyResponse;
      readonly figures: FiguresNote;
      /** The revision's signature, checked as a device checks it; null when no source was read (a typed code, no card). */
      readonly signature: SignatureNote | null;
    }
  | {
      readonly kind: 'offline';
      readonly code: ParsedCheckUrl;
      /** Why the server was not asked: its sentence. */
      readonly reason: string;
      readonly signedIn: boolean;
      readonly data: OfflineCheck | null;
      readonly figures: FiguresNote;
    }
  | { readonly kind: 'failed'; readonly code: ParsedCheckUrl; readonly message: string };

/** Statuses that mean the server was not reached (no answer, or a gateway that could not reach it). */
export const unreachable = (error: ApiRequestError) => error.status === 0 || error.status === 502 || error.status === 503 || error.status === 504;

export const UNREACHABLE = 'This device cannot reach the operator’s Speedwright site now, so it cannot ask whether this card is still good.';

/**
 * The card re-derivation (card builder, atmosphere, speed-book rules, digest) loads only when a
 * code's figures are to be checked, after the verdict's request: the check page's first download
 * stays small on a phone.
 */
const loadCheckFigures = () => import('@shared/card-check/figures-check').then((m) => m.checkFigures);

const TYPED = 'A typed code carries no figures: scan the QR code on the card to check its figures too.';

function withoutFigures(code: ParsedCheckUrl): FiguresNote | null {
  if (code.payloadProblem) return { kind: 'none', sentence: code.payloadProblem };
  if (!code.payload) return { kind: 'none', sentence: TYPED };
  return null;
}

/** The whole check of `/check/<code>?c=<payload>`. Never rejects: every failure is a sentence. */
export async function runCardCheck(deps: CardCheckDeps, rawCode: string, payloadText: string | null): Promise<CardCheckResult> {
  const parsed = parseCheckUrl(`/check/${encodeURIComponent(rawCode)}${payloadText !== null ? `?c=${encodeURIComponent(payloadText)}` : ''}`);
  if (!parsed.ok) return { kind: 'invalid', message: parsed.message };
  const code = parsed.value;
  // What the card was built from is asked for beside the verdict (one round trip, not two, on a
  // phone's network); it is read only once the verdict names a card, and its failure is a sentence.
  const source = withoutFigures(code) ? null : settled(deps.source(code.code));
  try {
    const verify = await deps.verify(code.code);
    const [figures, signature] = await Promise.all([onlineFigures(code, verify, source), onlineSignature(verify, source)]);
    return { kind: 'online', code, verify, figures, signature };
  } catch (error) {
    const problem = ApiRequestError.from(error);
    if (!unreachable(problem)) return { kind: 'failed', code, message: problem.message };
    return offlineCheck(deps, code, UNREACHABLE);
  }
}

/**
 * A card printed before the card rules of issue 11 (envelope, ordering rules, rounding by class):
 * its figures cannot be re-derived by today's rules, so only its digest is compared with the
 * issued card's (online).
 */
const EARLIER_RULES_ISSUED =
  'The digest in this code is the digest of the card issued under it. The card was made under an earlier version of Speedwright’s card rules, so its figures are not re-derived here.';
const EARLIER_RULES_OFFLINE =
  'This card was made under an earlier version of Speedwright’s card rules: its figures can only be compared with the card log, online.';

type Settled<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly error: unknown };

/** A request started early whose answer may never be read: its failure is kept, never left unhandled. */
function settled<T>(promise: Promise<T>): Promise<Settled<T>> {
  return promise.then(
    (value) => ({ ok: true as const, value }),
    (error: unknown) => ({ ok: false as const, error }),
  );
}

async function onlineFigures(code: ParsedCheckUrl, verify: VerifyResponse, sourceAnswer: Promise<Settled<VerifySource>> | null): Promise<FiguresNote> {
  const none = withoutFigures(code);
  if (none || !sourceAnswer) return none ?? { kind: 'none', sentence: TYPED };
  if (verify.status === 'unknown') return { kind: 'none', sentence: 'With no card behind the code, the figures in it cannot be checked.' };
  try {
    const [answer, checkFigures] = await Promise.all([sourceAnswer, loadCheckFigures()]);
    if (!answer.ok) throw answer.error;
    const source = answer.value;
    const payload = code.payload as CheckPayload;
    if (payload.earlierCardRules && payload.digest === source.digest) return { kind: 'none', sentence: EARLIER_RULES_ISSUED };
    return { kind: 'checked', check: checkFigures(payload, { revision: source.revision, context: source.context, issuedDigest: source.digest }) };
  } catch (error) {
    return { kind: 'none', sentence: `The figures could not be checked: ${ApiRequestError.from(error).message}` };
  }
}

/** The signature of the card's revision, once its source is in; null without one (its failure is said by the figures). */
async function onlineSignature(verify: VerifyResponse, sourceAnswer: Promise<Settled<VerifySource>> | null): Promise<SignatureNote | null> {
  if (!sourceAnswer || verify.status === 'unknown') return null;
  const answer = await sourceAnswer;
  if (!answer.ok) return null;
  const { checkSourceSignature } = await import('./source-signature');
  return checkSourceSignature(answer.value);
}

async function offlineCheck(deps: CardCheckDeps, code: ParsedCheckUrl, reason: string): Promise<CardCheckResult> {
  const user = await deps.session().catch(() => null);
  const base = { kind: 'offline' as const, code, reason, signedIn: user !== null };
  const none = withoutFigures(code);
  if (none || !user || !code.payload) return { ...base, data: null, figures: none ?? { kind: 'none', sentence: 'Without the network, this device can check the figures only for a person signed in here, from their operator’s synced data.' } };
  const data = await deps.offline.read(user.operatorId, code.payload.revisionId, code.payload.inputs.airframeId);
  if (!data) return { ...base, data: null, figures: { kind: 'none', sentence: 'This device holds no synced copy of the revision this card was built from, so its figures cannot be checked here.' } };
  if (!data.source) return { ...base, data, figures: { kind: 'none', sentence: 'This device holds the revision but not the airframe of this card, so its figures cannot be re-derived here.' } };
  if (code.payload.earlierCardRules) return { ...base, data, figures: { kind: 'none', sentence: EARLIER_RULES_OFFLINE } };
  const checkFigures = await loadCheckFigures();
  return { ...base, data, figures: { kind: 'checked', check: checkFigures(code.payload, { ...data.source, issuedDigest: null }) } };
}
