import { notFound } from '../errors/domain-error';

/** A route's numeric id; anything else answers 404 like an id that does not exist. */
export function idParam(value: string | string[] | undefined, what: string): number {
  const text = Array.isArray(value) ? value[0] : value;
  if (!text || !/^[1-9]\d{0,9}$/.test(text)) throw notFound(what);
  const id = Number(text);
  if (id > 4_294_967_295) throw notFound(what);
  return id;
}
