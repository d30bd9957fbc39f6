/**
 * The check URL printed (as a QR code) on every issued card:
 *
 *     https://<operator's Speedwright host>/check/<card code>?c=<compact payload>
 *
 * The payload carries what the card was built from — the revision id, the card's inputs and
 * its digest — so the check page can re-derive the figures with `buildCard` and compare digests
 * without the card log. It is compact (a QR code on a kneeboard card must stay small), URL-safe
 * (only A–Z a–z 0–9 - . _ characters, nothing to escape) and versioned (the first character).
 *
 * Version 3 adds the day's wind (issue 16) after the 16 fields of version 2: for the departure
 * and then the arrival, `runwayHeadingDeg _ directionDeg _ speedKt _ gustKt` (all four empty
 * without a wind), then the operator's approach additive policy the card used,
 * `headwindFraction _ gustFraction _ minimumKt _ maximumKt` (all four empty without one): 28
 * fields. A card without wind or policy is still written in the 16 fields of version 2 (a
 * smaller QR code), and a version-2 payload is re-derived as it always was: a card without
 * wind has the same figures and digest under today's rules.
 *
 * Version 4 adds icing conditions (issue 16): the 28 fields of version 3 and `1` as a 29th,
 * written only for a card with icing ticked; every other card keeps its version-2 or -3 form.
 *
 * Version 2 (cards of CARD_VERSION 2: envelope, ordering rules, rounding by class) has the fields
 * of version 1; the version says which card rules made the digest. A version-1 payload still
 * decodes, marked `earlierCardRules`: its figures were computed under the earlier rules, so they
 * are not re-derived (the check compares its digest with the issued card's instead).
 *
 * Version 1, our own positional form: `1`, the digest as 43 characters of base64url (32 bytes,
 * RFC 4648 §5, no padding), then `_` and the fields below joined by `_`; an absent optional
 * field is empty. Numbers are written as ECMAScript writes them (shortest form that reads back
 * to the same number; an exponent without `+`), so decoding gives the very inputs encoded.
 *
 *     revisionId _ airframeId _ weightKg _ landingWeightKg _ configuration
 *     _ departure: elevationFt _ qnhHpa _ oatC _ dewPointC
 *     _ arrival:   elevationFt _ qnhHpa _ oatC _ dewPointC      (all four empty without arrival)
 *     _ isaDeviationC _ cruise (k<IAS kt> or m<Mach>) _ altitudeStepFt
 *
 * Decoding checks the result against `cardInputsSchema`; a failure is a sentence, never a throw.
 */
import { cardInputsSchema, type AerodromeConditions, type CardInputs } from '../card/card';
import type { ApproachAdditivePolicy } from '../card/approach-policy';
import { formatCardCode, validateCardCode } from './card-code';
import { base64UrlToDigest, DIGEST_B64_LENGTH, digestToBase64Url } from './digest-base64url';

export { base64UrlToDigest, digestToBase64Url } from './digest-base64url';

/**
 * The payload's form; a change of fields, or of the card rules behind the digest, means a new
 * version (decoders keep reading the old).
 */
export const CHECK_PAYLOAD_VERSION = '3';
/** Versions before `CHECK_PAYLOAD_VERSION` that decoders still read: their cards follow earlier card rules. */
const EARLIER_PAYLOAD_VERSIONS = new Set(['1']);
/** The form of a card without wind and approach policy (the 16 fields of version 2), still written for such cards. */
const WITHOUT_WIND_PAYLOAD_VERSION = '2';
/** The form of a card with icing conditions ticked: version 3's fields and the icing flag. */
const ICING_PAYLOAD_VERSION = '4';
const SAME_RULES_PAYLOAD_VERSIONS = new Set([WITHOUT_WIND_PAYLOAD_VERSION, ICING_PAYLOAD_VERSION]);
/** Longest payload a decoder reads (a version-1 payload is about 120 characters). */
export const MAX_CHECK_PAYLOAD_LENGTH = 600;

/** What a check URL carries about the card besides its code. */
export interface CheckPayload {
  readonly revisionId: number;
  readonly inputs: CardInputs;
  /** SHA-256 of the card, 64 lower-case hex digits (`SpeedCard.digest`). */
  readonly digest: string;
  /** Set when the payload is of a card made under earlier card rules (payload version 1): not re-derivable now. */
  readonly earlierCardRules?: true;
}

export type Decoded<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly message: string };

/** Fields of versions 1 and 2, and of version 3 (the wind and the approach policy added). */
const FIELDS_BEFORE_WIND = 16;
const FIELDS = 28;
const FIELDS_WITH_ICING = 29;
const NUMBER = /^-?(0|[1-9][0-9]*)(\.[0-9]+)?(e-?[0-9]+)?$/;
const PAYLOAD_CHARACTERS = /^[A-Za-z0-9_.-]*$/;

const bad = (message: string): Decoded<never> => ({ ok: false, message });

// ---------------------------------------------------------------------------------------------
// Numbers

function writeNumber(value: number, field: string): string {
  if (!Number.isFinite(value)) throw new Error(`${field} is not a finite number.`);
  return String(value).replace('e+', 'e');
}

function readNumber(text: string): number | undefined {
  if (!NUMBER.test(text)) return undefined;
  const value = Number(text);
  return Number.isFinite(value) ? value : undefined;
}

// ---------------------------------------------------------------------------------------------
// Payload

/**
 * The compact payload of a card. `inputs` must be valid card inputs (the card's own `inputs`,
 * as `buildCard` parsed them); anything else throws, since it is a programming error.
 */
export function encodeCheckPayload({ revisionId, inputs, digest }: CheckPayload): string {
  const parsed = cardInputsSchema.parse(inputs);
  if (!(Number.isInteger(revisionId) && revisionId > 0)) throw new Error('The revision id is a positive whole number.');
  const aerodrome = (conditions: AerodromeConditions | undefined, which: string) =>
    conditions
      ? [
          writeNumber(conditions.elevationFt, `${which}.elevationFt`),
          writeNumber(conditions.qnhHpa, `${which}.qnhHpa`),
          writeNumber(conditions.oatC, `${which}.oatC`),
          conditions.dewPointC === undefined ? '' : writeNumber(conditions.dewPointC, `${which}.dewPointC`),
        ]
      : ['', '', '', ''];
  const cruise = 'mach' in parsed.cruise ? `m${writeNumber(parsed.cruise.mach, 'cruise.mach')}` : `k${writeNumber(parsed.cruise.iasKt, 'cruise.iasKt')}`;
  const fields = [
    String(revisionId),
    String(parsed.airframeId),
    writeNumber(parsed.weightKg, 'weightKg'),
    parsed.landingWeightKg === undefined ? '' : writeNumber(parsed.landingWeightKg, 'landingWeightKg'),
    parsed.configuration,
    ...aerodrome(parsed.departure, 'departure'),
    ...aerodrome(parsed.arrival, 'arrival'),
    writeNumber(parsed.isaDeviationC, 'isaDeviationC'),
    cruise,
    String(parsed.altitudeStepFt),
  ];
  const windAndPolicy = [...windFields(parsed.departure, 'departure'), ...windFields(parsed.arrival, 'arrival'), ...policyFields(parsed.approachAdditivePolicy)];
  if (parsed.icing === true) return `${ICING_PAYLOAD_VERSION}${digestToBase64Url(digest)}_${[...fields, ...windAndPolicy, '1'].join('_')}`;
  // A card without wind or policy keeps the shorter version-2 form: its QR code stays as small as before.
  if (windAndPolicy.every((field) => field === '')) return `${WITHOUT_WIND_PAYLOAD_VERSION}${digestToBase64Url(digest)}_${fields.join('_')}`;
  return `${CHECK_PAYLOAD_VERSION}${digestToBase64Url(digest)}_${[...fields, ...windAndPolicy].join('_')}`;
}

function windFields(conditions: AerodromeConditions | undefined, which: string): string[] {
  if (!conditions?.wind || conditions.runwayHeadingDeg === undefined) return ['', '', '', ''];
  const { wind } = conditions;
  return [
    writeNumber(conditions.runwayHeadingDeg, `${which}.runwayHeadingDeg`),
    writeNumber(wind.directionDeg, `${which}.wind.directionDeg`),
    writeNumber(wind.speedKt, `${which}.wind.speedKt`),
    wind.gustKt === undefined ? '' : writeNumber(wind.gustKt, `${which}.wind.gustKt`),
  ];
}

function policyFields(policy: ApproachAdditivePolicy | undefined): string[] {
  if (!policy) return ['', '', '', ''];
  return [
    writeNumber(policy.headwindFraction, 'approachAdditivePolicy.headwindFraction'),
    writeNumber(policy.gustFraction, 'approachAdditivePolicy.gustFraction'),
    writeNumber(policy.minimumKt, 'approachAdditivePolicy.minimumKt'),
    writeNumber(policy.maximumKt, 'approachAdditivePolicy.maximumKt'),
  ];
}

const NOT_A_CARD = 'The figures in this code are damaged or incomplete';

/** Reads a compact payload back; a failure is a sentence for the person holding the card. */
export function decodeCheckPayload(text: string): Decoded<CheckPayload> {
  if (text.length === 0) return bad(`${NOT_A_CARD}: the code carries no figures.`);
  if (text.length > MAX_CHECK_PAYLOAD_LENGTH) return bad(`${NOT_A_CARD}: it is far longer than any card’s.`);
  if (!PAYLOAD_CHARACTERS.test(text)) return bad(`${NOT_A_CARD}: it holds characters no card code uses.`);
  const earlierCardRules = EARLIER_PAYLOAD_VERSIONS.has(text[0]);
  if (text[0] !== CHECK_PAYLOAD_VERSION && !earlierCardRules && !SAME_RULES_PAYLOAD_VERSIONS.has(text[0])) {
    return bad('The figures in this code are in a form this version of Speedwright does not read; open the check page on the operator’s Speedwright site.');
  }
  const digest = base64UrlToDigest(text.slice(1, 1 + DIGEST_B64_LENGTH));
  if (digest === undefined || text[1 + DIGEST_B64_LENGTH] !== '_') return bad(`${NOT_A_CARD}: its digest is not readable.`);
  const fields = text.slice(2 + DIGEST_B64_LENGTH).split('_');
  const expected = text[0] === ICING_PAYLOAD_VERSION ? FIELDS_WITH_ICING : text[0] === CHECK_PAYLOAD_VERSION ? FIELDS : FIELDS_BEFORE_WIND;
  if (fields.length !== expected) return bad(`${NOT_A_CARD}: it has ${fields.length} fields where a card has ${expected}.`);

  const [revisionText, airframeText, weight, landingWeight, configuration, ...rest] = fields;
  const departure = rest.slice(0, 4);
  const arrival = rest.slice(4, 8);
  const [isaDeviation, cruiseText, stepText] = rest.slice(8, 11);
  // Versions 1 and 2 end there: no wind, no policy.
  const windAndPolicy = rest.length > 11 ? rest.slice(11) : new Array<string>(12).fill('');
  const departureWind = windAndPolicy.slice(0, 4);
  const arrivalWind = windAndPolicy.slice(4, 8);
  const policy = windAndPolicy.slice(8, 12);
  const icingText = windAndPolicy[12];

  const problems: string[] = [];
  const numberAt = (field: string, value: string): number => {
    const number = readNumber(value);
    if (number === undefined) problems.push(field);
    return number ?? 0;
  };
  const optionalAt = (field: string, value: string) => (value === '' ? undefined : numberAt(field, value));
  const aerodrome = (name: string, [elevation, qnh, oat, dewPoint]: string[]): AerodromeConditions => {
    const conditions: { elevationFt: number; qnhHpa: number; oatC: number; dewPointC?: number } = {
      elevationFt: numberAt(`${name} elevation`, elevation),
      qnhHpa: numberAt(`${name} QNH`, qnh),
      oatC: numberAt(`${name} temperature`, oat),
    };
    const dew = optionalAt(`${name} dew point`, dewPoint);
    if (dew !== undefined) conditions.dewPointC = dew;
    return conditions;
  };

  const revisionId = numberAt('revision', revisionText);
  const inputs: Record<string, unknown> = {
    airframeId: numberAt('airframe', airframeText),
    weightKg: numberAt('takeoff weight', weight),
    configuration,
    departure: aerodrome('departure', departure),
    isaDeviationC: numberAt('ISA deviation', isaDeviation),
    altitudeStepFt: numberAt('altitude step', stepText),
  };
  const landing = optionalAt('landing weight', landingWeight);
  if (landing !== undefined) inputs['landingWeightKg'] = landing;
  if (arrival.some((field) => field !== '')) inputs['arrival'] = aerodrome('arrival', arrival);
  const addWind = (name: string, conditions: unknown, [heading, direction, speed, gust]: string[]) => {
    if (![heading, direction, speed, gust].some((field) => field !== '')) return;
    // A wind without its aerodrome is left for the schema to name (it has no place to go).
    if (typeof conditions !== 'object' || conditions === null) {
      problems.push(`${name} wind`);
      return;
    }
    const target = conditions as Record<string, unknown>;
    target['runwayHeadingDeg'] = numberAt(`${name} runway heading`, heading);
    const wind: Record<string, unknown> = { directionDeg: numberAt(`${name} wind direction`, direction), speedKt: numberAt(`${name} wind speed`, speed) };
    const gustKt = optionalAt(`${name} gust`, gust);
    if (gustKt !== undefined) wind['gustKt'] = gustKt;
    target['wind'] = wind;
  };
  addWind('departure', inputs['departure'], departureWind);
  addWind('arrival', inputs['arrival'], arrivalWind);
  if (policy.some((field) => field !== '')) {
    const [headwindFraction, gustFraction, minimumKt, maximumKt] = policy;
    inputs['approachAdditivePolicy'] = {
      headwindFraction: numberAt('headwind fraction of the approach policy', headwindFraction),
      gustFraction: numberAt('gust fraction of the approach policy', gustFraction),
      minimumKt: numberAt('minimum additive', minimumKt),
      maximumKt: numberAt('maximum additive', maximumKt),
    };
  }
  if (icingText !== undefined) {
    if (icingText === '1') inputs['icing'] = true;
    else problems.push('icing');
  }
  const cruiseValue = numberAt('cruise', cruiseText.slice(1));
  if (cruiseText[0] === 'm') inputs['cruise'] = { mach: cruiseValue };
  else if (cruiseText[0] === 'k') inputs['cruise'] = { iasKt: cruiseValue };
  else problems.push('cruise');

  if (problems.length > 0) return bad(`${NOT_A_CARD}: the ${problems.join(', ')} ${problems.length === 1 ? 'is' : 'are'} not readable.`);
  if (!(Number.isInteger(revisionId) && revisionId > 0)) return bad(`${NOT_A_CARD}: the revision is not a record number.`);
  const parsed = cardInputsSchema.safeParse(inputs);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    return bad(`${NOT_A_CARD}: ${issue.message[0].toLowerCase()}${issue.message.slice(1).replace(/\.$/, '')} (${issue.path.join('.')}).`);
  }
  return { ok: true, value: { revisionId, inputs: parsed.data, digest, ...(earlierCardRules ? { earlierCardRules: true as const } : {}) } };
}

// ---------------------------------------------------------------------------------------------
// The URL

const ORIGIN = /^https?:\/\/[A-Za-z0-9.-]+(:[0-9]{1,5})?$|^https?:\/\/\[[0-9A-Fa-f:.]+\](:[0-9]{1,5})?$/;

/** `origin` without a trailing slash, checked to be `http(s)://host[:port]`. */
export function checkOrigin(origin: string): string {
  const trimmed = origin.replace(/\/+$/, '');
  if (!ORIGIN.test(trimmed)) throw new Error(`${origin} is not an http(s) origin such as https://speedwright.example.`);
  return trimmed;
}

/**
 * The check URL of a card: `origin` is the operator's Speedwright host (`https://host[:port]`),
 * `code` the card code (stored or printed form).
 * @example checkUrl('https://cards.example', 'K7M4RTX9X', card) // 'https://cards.example/check/K7M4RTX9X?c=1…'
 */
export function checkUrl(origin: string, code: string, payload: CheckPayload): string {
  const validated = validateCardCode(code);
  if (!validated.ok) throw new Error(validated.message);
  return `${checkOrigin(origin)}/check/${validated.code}?c=${encodeCheckPayload(payload)}`;
}

/** What a check URL (or a `/check/…` path, or a bare typed code) says. */
export interface ParsedCheckUrl {
  /** `https://host[:port]`, or null for a path or a bare code. */
  readonly origin: string | null;
  /** The card code, stored form, check character verified. */
  readonly code: string;
  /** The printed form, `K7M-4RT-X9X`. */
  readonly printedCode: string;
  /** The payload, or null when the URL carries none (a typed code). */
  readonly payload: CheckPayload | null;
  /** Why the payload could not be read, when it was there but damaged. */
  readonly payloadProblem: string | null;
  /** The payload as it stood in the URL (percent-decoded), to pass on; null without one. */
  readonly payloadText: string | null;
}

const URL_SHAPE = /^(?:(https?:\/\/[^/?#\s]+))?\/check\/([^/?#\s]*)\/?(?:\?([^#\s]*))?(?:#\S*)?$/i;

/**
 * Reads a scanned or pasted check URL, a `/check/<code>?c=…` path, or a typed code. A code
 * that is not valid fails with its sentence; a payload that is damaged still gives the code
 * (the card's status can be asked), with `payloadProblem` saying what is wrong.
 */
export function parseCheckUrl(text: string): Decoded<ParsedCheckUrl> {
  const trimmed = text.trim();
  const match = URL_SHAPE.exec(trimmed);
  if (!match) {
    if (/^[a-z][a-z0-9+.-]*:/i.test(trimmed) || trimmed.includes('/')) {
      return bad('This is not a Speedwright card check address: it should end in /check/ and the card code.');
    }
    const typed = validateCardCode(trimmed);
    if (!typed.ok) return bad(typed.message);
    return { ok: true, value: { origin: null, code: typed.code, printedCode: formatCardCode(typed.code), payload: null, payloadProblem: null, payloadText: null } };
  }
  const [, origin, rawCode, query] = match;
  let codeText: string;
  try {
    codeText = decodeURIComponent(rawCode);
  } catch {
    return bad('The card code in this address is damaged.');
  }
  const code = validateCardCode(codeText);
  if (!code.ok) return bad(code.message);
  let payload: CheckPayload | null = null;
  let payloadProblem: string | null = null;
  let payloadText: string | null = null;
  const raw = (query ?? '')
    .split('&')
    .map((pair) => pair.split('='))
    .find(([key]) => key === 'c')?.[1];
  if (raw !== undefined) {
    let text: string | undefined;
    try {
      text = decodeURIComponent(raw);
    } catch {
      text = undefined;
    }
    payloadText = text ?? raw;
    const decoded = text === undefined ? bad(`${NOT_A_CARD}: it holds characters no card code uses.`) : decodeCheckPayload(text);
    if (decoded.ok) payload = decoded.value;
    else payloadProblem = decoded.message;
  }
  return {
    ok: true,
    value: { origin: origin ? origin.toLowerCase() : null, code: code.code, printedCode: formatCardCode(code.code), payload, payloadProblem, payloadText },
  };
}
