import { notFound } from '../errors/domain-error';

/** A route's numeric record id; anything else answers 404, like an id that does not exist. */
export function recordId(value: string | string[] | undefined, what: string): number {
  const text = Array.isArray(value) ? value[0] : value;
  if (!text || !/^[1-9]\d{0,9}$/.test(text) || Number(text) > 4_294_967_295) throw notFound(what);
  return Number(text);
}
